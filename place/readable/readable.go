package readable

import (
	"errors"
	"math"

	"github.com/gridwood/gridwood/place/mesh"
	"github.com/gridwood/gridwood/place/stress"
	"github.com/gridwood/gridwood/planarize"
)

// Input is one connected graph with a plane straight-line drawing of it.
type Input struct {
	// Edges joins vertices 0..n-1: no loops, no repeated pairs, connected.
	Edges [][2]int32
	// X, Y is the plane start drawing (any scale; it is rescaled).
	X, Y []float64
	// HalfW, HalfH are the node boxes' half sizes, in points (nil: 0).
	HalfW, HalfH []float64
	// Gap is the clear space wanted between two boxes and between a box
	// and an edge passing by, in points.
	Gap float64
	// Embedding, if not nil, is a plane embedding of the graph (vertices
	// 0..n-1, the same edges in any order), the one the start drawing
	// has; else Draw embeds the graph itself.
	Embedding *planarize.Embedding
}

// Options tune Draw. The zero value is the default.
type Options struct {
	// Work bounds the stage: the number of stress terms it may evaluate
	// (about n times the terms per vertex per sweep). 0 is the default,
	// DefaultWork.
	Work int64
	// Stress tunes the stress model.
	Stress stress.Options
}

// DefaultWork is the default work bound, in stress terms: about 0.3 s
// on the machines this was tuned on.
const DefaultWork = 150_000_000

// Output is the readable drawing, in points.
type Output struct {
	X, Y []float64
	// Sweeps is the number of guarded sweeps made.
	Sweeps int
	// Reference is true when the unconstrained stress layout was itself
	// plane and was kept.
	Reference bool
	// Stress is the model's stress of the result (over the model's pairs),
	// and StartStress that of the rescaled start.
	Stress, StartStress float64
}

var errInput = errors.New("readable: bad input")

// maxInflate caps the factor a cramped start is blown up by.
const maxInflate = 1 << 20

// Draw makes the drawing readable (see the package documentation). The
// start must be plane; Draw returns an error otherwise.
func Draw(in Input, opt Options) (*Output, error) {
	n := len(in.X)
	if len(in.Y) != n || (in.HalfW != nil && len(in.HalfW) != n) || (in.HalfH != nil && len(in.HalfH) != n) {
		return nil, errInput
	}
	hw, hh := in.HalfW, in.HalfH
	if hw == nil {
		hw = make([]float64, n)
	}
	if hh == nil {
		hh = make([]float64, n)
	}
	if n <= 2 {
		return small(in, hw, hh), nil
	}
	lengths := idealLengths(in.Edges, hw, hh, in.Gap)
	model, err := stress.NewModel(n, in.Edges, lengths, opt.Stress)
	if err != nil {
		return nil, err
	}
	work := opt.Work
	if work <= 0 {
		work = DefaultWork
	}
	perSweep := int64(n) * int64(termsPerVertex(model))
	out := &Output{}

	minHeight := minHeights(n, in.Edges, lengths)
	newGuard := func(m *mesh.Mesh, x, y []float64) *guard {
		return &guard{mesh: m, model: model, x: x, y: y, hw: hw, hh: hh, gap: in.Gap, edges: in.Edges, minHeight: minHeight, jumps: true}
	}

	// The unconstrained reference.
	rx, ry := model.Start()
	refSweeps := int(min(200, max(10, work/4/max(1, perSweep))))
	model.Layout(rx, ry, refSweeps, 1e-4)
	work -= int64(refSweeps) * perSweep
	sweeps := int(max(1, work/2/max(1, perSweep)))
	reach := 2 * (extent(in.X, in.Y)*model.BestScale(in.X, in.Y) + 2*extent(rx, ry))

	// Candidate 1: grown from the reference. Its edges go in shortest
	// first as long as they cross nothing; the rest wait until moves have
	// cleared their way.
	var best *guard
	bestStress := math.Inf(1)
	var embs []*planarize.Embedding
	if e, _, ok := Follow(rx, ry, in.Edges); ok {
		embs = append(embs, e)
	}
	if in.Embedding != nil {
		embs = append(embs, in.Embedding)
	} else if e, ok := planarize.Embed(n, in.Edges); ok {
		embs = append(embs, e)
	}
	for _, emb := range embs {
		px, py, ok := nearPlane(rx, ry, in.Edges, emb, reach)
		if !ok {
			continue
		}
		m, err := mesh.New(px, py, in.Edges, reach)
		if err != nil {
			continue
		}
		g := newGuard(m, px, py)
		out.Sweeps += g.run(sweeps, 1e-4)
		if st := model.Stress(g.x, g.y); st < bestStress {
			best, bestStress = g, st
			out.Reference = true
		}
	}

	// Candidate 2: the plane start, at the model's best scale, blown up
	// until no vertex is nearer a side of its triangles than its least
	// height (grid drawings are cramped): the guard then never has to let
	// a vertex nearer, and stress shrinks the rest.
	x := append([]float64(nil), in.X...)
	y := append([]float64(nil), in.Y...)
	s := model.BestScale(x, y)
	for v := range n {
		x[v] *= s
		y[v] *= s
	}
	out.StartStress = model.Stress(x, y)
	startMesh, err := mesh.New(x, y, in.Edges, reach)
	if err != nil {
		return nil, err
	}
	inflate := 1.0
	for v := range int32(n) {
		if h := startMesh.Height(v); h > 0 {
			inflate = max(inflate, minHeight[v]/h)
		}
	}
	if inflate > 1 && false {
		inflate = min(inflate*1.01, maxInflate)
		for v := range n {
			x[v] *= inflate
			y[v] *= inflate
		}
		if startMesh, err = mesh.New(x, y, in.Edges, reach*inflate); err != nil {
			return nil, err
		}
	}
	g := newGuard(startMesh, x, y)
	out.Sweeps += g.run(sweeps, 1e-4)
	if st := model.Stress(g.x, g.y); st < bestStress {
		best, bestStress = g, st
		out.Reference = false
	}
	// Then the boxes: the same descent with the barrier keeping boxes, not
	// points, off each other and off the edges.
	best.margins = true
	k := best.run(marginSweeps, 1e-4)
	out.Sweeps += k
	out.X, out.Y = best.x, best.y
	out.Stress = model.Stress(best.x, best.y)
	return out, nil
}

// marginSweeps bounds the sweeps that clear the boxes.
const marginSweeps = 100

// small places one vertex at the origin, or two side by side at their
// ideal distance.
func small(in Input, hw, hh []float64) *Output {
	n := len(in.X)
	out := &Output{X: make([]float64, n), Y: make([]float64, n)}
	if n == 2 {
		out.X[1] = hw[0] + hw[1] + max(in.Gap, 1)
	}
	return out
}

// idealLengths gives each edge the length at which its two boxes sit a
// comfortable distance apart: the sum of their half diagonals' mean with
// their larger half sides, plus the gap (so that default DOT boxes, 0.75 x
// 0.5 in, sit about one and a third box widths apart centre to centre).
func idealLengths(edges [][2]int32, hw, hh []float64, gap float64) []float64 {
	lengths := make([]float64, len(edges))
	reach := func(v int32) float64 {
		diag := math.Sqrt(float64(hw[v]*hw[v]) + float64(hh[v]*hh[v]))
		return (diag + max(hw[v], hh[v])) / 2
	}
	for i, e := range edges {
		lengths[i] = max(1, reach(e[0])+reach(e[1])+gap)
	}
	return lengths
}

func termsPerVertex(m *stress.Model) int {
	if m.Full() {
		return m.N()
	}
	return 110 // pivots plus a few neighbours
}

// extent is the diagonal of the points' bounding box.
func extent(x, y []float64) float64 {
	minX, minY, maxX, maxY := math.Inf(1), math.Inf(1), math.Inf(-1), math.Inf(-1)
	for v := range x {
		minX, maxX = min(minX, x[v]), max(maxX, x[v])
		minY, maxY = min(minY, y[v]), max(maxY, y[v])
	}
	w, h := maxX-minX, maxY-minY
	return math.Sqrt(float64(w*w) + float64(h*h))
}

// minHeights gives each vertex its least height (see guard): a share of
// the mean ideal length of its edges.
func minHeights(n int, edges [][2]int32, lengths []float64) []float64 {
	sum := make([]float64, n)
	count := make([]float64, n)
	for i, e := range edges {
		for _, v := range e {
			sum[v] += lengths[i]
			count[v]++
		}
	}
	h := make([]float64, n)
	for v := range h {
		if count[v] > 0 {
			h[v] = minHeightShare * sum[v] / count[v]
		}
	}
	return h
}
