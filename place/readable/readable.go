package readable

import (
	"errors"
	"math"
	"slices"
	"time"

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
	// Gap is the clear space wanted between two boxes, and EdgeGap that
	// between a box and an edge passing by, in points.
	Gap, EdgeGap float64
	// Embedding, if not nil, is a plane embedding of the graph (vertices
	// 0..n-1, the same edges in any order), the one the start drawing
	// has; else Draw embeds the graph itself.
	Embedding *planarize.Embedding
	// KeepOuter keeps the start drawing's outer face outer: only the
	// start is refined, and no vertex jumps.
	KeepOuter bool
	// EdgeExtra, if not nil, adds to each edge's ideal length (indexed as
	// Edges), for example the room its label needs beside it.
	EdgeExtra []float64
	// Flow, if not nil, lists pairs (u, v) where v should come after u
	// along FlowDir (a digraph's edges, read along its rank direction);
	// see stress.Options.Flow.
	Flow    [][2]int32
	FlowDir [2]float64
	// Groups, if not nil, lists per vertex the clusters it lies in,
	// outermost first: members of one cluster are drawn nearer each other
	// and others farther (stress.Options.Groups).
	Groups [][]int32
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
	// Chosen names the candidate kept: "follow" (near the reference, with
	// an embedding that follows it), "near" (near the reference, with the
	// start's embedding), "unfolded" (near a stress layout grown from the
	// start), "radial" (a tree, from its radial drawing), "convex" (from a
	// drawing with its outer face on a circle), "untangled" (near the
	// reference with its folds repaired), "start", or "start as given".
	Chosen string
	// Phases lists what each phase did, for benchmarks and tests.
	Phases []Phase
	// Crowded says that every candidate was too crowded to part its boxes
	// (the margins phase was not run): the caller should keep its start.
	Crowded bool
	// Stress is the model's stress of the result (over the model's pairs),
	// and StartStress that of the rescaled start.
	Stress, StartStress float64
	// Alternatives are other drawings of the same run, plane too, for the
	// caller to weigh by its own exact clearance (none if the margins phase
	// did not run): the drawing as it was before the margins phase, and
	// where boxes were much pressed, the margins phase run on it with
	// loosened boxes (see loosenAbove).
	Alternatives []Alternative
	// Gain is the model's stress of the result over that of the start,
	// each at its best scale: below 1 where the result reads better by the
	// model's own ideal distances (edge extras and groups included).
	Gain float64
}

// Alternative is a drawing Draw returns beside its result.
type Alternative struct {
	Name string // "before margins" or "loose margins"
	X, Y []float64
	Gain float64 // as Output.Gain
}

// Phase is one phase of Draw: the sweeps it made, the model's stress
// after it, and its time (which is never used to decide anything).
type Phase struct {
	Name        string
	Sweeps      int
	Stress      float64
	Seconds     float64
	LeastHeight float64 // of the Delaunay triangulation of the result
	Stretch     float64 // the uniform stretch that would clear its boxes
}

var errInput = errors.New("readable: bad input")

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
	lengths := IdealLengths(in.Edges, hw, hh, in.Gap)
	if in.EdgeExtra != nil {
		if len(in.EdgeExtra) != len(in.Edges) {
			return nil, errInput
		}
		for i, extra := range in.EdgeExtra {
			lengths[i] += max(0, extra)
		}
	}
	so := opt.Stress
	so.Groups = in.Groups
	so.Flow, so.FlowDir = in.Flow, in.FlowDir
	model, err := stress.NewModel(n, in.Edges, lengths, so)
	if err != nil {
		return nil, err
	}
	work := opt.Work
	if work <= 0 {
		work = DefaultWork
	}
	perSweep := max(1, int64(n)*int64(termsPerVertex(model)))
	sweepsFor := func(share float64) int {
		return int(min(maxSweeps, max(minSweeps, float64(float64(work)*share)/float64(perSweep))))
	}
	out := &Output{}
	minHeight := minHeights(n, in.Edges, lengths)
	var reach float64 // set once the reference is known
	newGuard := func(m *mesh.Mesh, x, y []float64) *guard {
		return &guard{mesh: m, model: model, x: x, y: y, hw: hw, hh: hh, gap: in.Gap, edgeGap: in.EdgeGap, edges: in.Edges, minHeight: minHeight, jumps: !in.KeepOuter, lengths: lengths, reach: reach}
	}
	phase := func(name string, sweeps int, x, y []float64, t time.Time) {
		least := math.Inf(1)
		if m, err := mesh.New(x, y, in.Edges, 0); err == nil {
			least, _ = m.LeastHeight()
		}
		out.Phases = append(out.Phases, Phase{Name: name, Sweeps: sweeps, Stress: model.Stress(x, y), Seconds: time.Since(t).Seconds(), LeastHeight: least})
		out.Sweeps += sweeps
	}

	// The unconstrained reference.
	t := time.Now()
	rx, ry := model.Start()
	k := model.Layout(rx, ry, sweepsFor(referenceShare), 1e-4)
	phase("reference", k, rx, ry, t)
	reach = 2 * (extent(in.X, in.Y)*model.BestScale(in.X, in.Y) + 2*extent(rx, ry))

	// Candidates near the reference: a plane drawing with an embedding that
	// follows the reference (or, failing that, the start's), refined.
	var best *guard
	bestStress := math.Inf(1)
	bestCrowded, bestStretch := true, math.Inf(1)
	// With a flow, candidates are weighed by their stress times
	// 1 + flowWeight times the share of pairs pointing against it: the
	// projection onto the flow (stress.Model.Project) keeps pairs along
	// that a start has along, but does not turn a folded start round.
	flowPenalty := func(x, y []float64) float64 {
		if len(in.Flow) == 0 {
			return 1
		}
		against := len(in.Flow) - Along(in.Flow, in.FlowDir, x, y)
		return 1 + flowWeight*float64(against)/float64(len(in.Flow))
	}
	consider := func(name string, g *guard, sweeps int, t time.Time) {
		k := g.run(sweeps, runTolerance)
		phase(name, k, g.x, g.y, t)
		// A drawing whose boxes would need much stretching to clear, at
		// the scale where its edges have their ideal lengths (some spot
		// pressed tight: the starts can be crowded, and descent need not
		// undo all of it), is kept only if every other is too.
		f := model.BestScale(g.x, g.y)
		for v := range g.x {
			g.x[v] *= f
			g.y[v] *= f
		}
		g.mesh.Scale(f)
		stretch := g.boxCrowding()
		out.Phases[len(out.Phases)-1].Stretch = stretch
		crowded := stretch > maxStretch
		st := model.Stress(g.x, g.y) // at the best scale: comparable
		out.Phases[len(out.Phases)-1].Stress = st
		st *= flowPenalty(g.x, g.y)
		better := best == nil || (bestCrowded && !crowded) ||
			(!crowded && !bestCrowded && st < bestStress) ||
			(crowded && bestCrowded && stretch < bestStretch)
		if better {
			best, bestStress, bestCrowded, bestStretch = g, st, crowded, stretch
			out.Chosen = name
		}
	}
	// considerNear considers the plane drawing with embedding emb made
	// near the drawing tx, ty (nearPlane), where there is one.
	considerNear := func(name string, tx, ty []float64, emb *planarize.Embedding, t time.Time) {
		if px, py, ok := nearPlane(tx, ty, in.Edges, emb, reach); ok {
			if m, err := mesh.New(px, py, in.Edges, reach); err == nil {
				consider(name, newGuard(m, px, py), sweepsFor(candidateShare), t)
			}
		}
	}
	if !in.KeepOuter {
		t = time.Now()
		emb, _, ok := Follow(rx, ry, in.Edges)
		name := "follow"
		if !ok {
			emb, name = in.Embedding, "near"
			if emb == nil {
				emb, _ = planarize.Embed(n, in.Edges)
			}
		}
		considerNear(name, rx, ry, emb, t)
		if name != "follow" {
			// The reference folds where no plane drawing can follow it.
			// A second one, grown from the plane start instead of from
			// pivots, keeps the start's unfolded shape where stress allows.
			t = time.Now()
			ux := append([]float64(nil), in.X...)
			uy := append([]float64(nil), in.Y...)
			s := model.BestScale(ux, uy)
			for v := range ux {
				ux[v] *= s
				uy[v] *= s
			}
			model.Layout(ux, uy, sweepsFor(referenceShare), 1e-4)
			if e2, _, ok := Follow(ux, uy, in.Edges); ok {
				considerNear("unfolded", ux, uy, e2, t)
			}
		}
		if len(in.Edges) == n-1 {
			// A tree: its radial drawing, with the reference's order of
			// children, parts the subtrees that the reference lets cross
			// and nearPlane then folds into knots.
			t = time.Now()
			px, py := radialStart(n, in.Edges, lengths, rx, ry)
			if m, err := mesh.New(px, py, in.Edges, reach); err == nil {
				consider("radial", newGuard(m, px, py), sweepsFor(candidateShare), t)
			}
		}
		if best == nil || name != "follow" || n <= tryAllLimit {
			t = time.Now()
			length := make(map[[2]int32]float64, len(in.Edges))
			for i, e := range in.Edges {
				length[[2]int32{min(e[0], e[1]), max(e[0], e[1])}] = lengths[i]
			}
			// Of the solves (weights from the reference or equal; the outer
			// face the reference's or a longest), the one of lower stress
			// at its best scale.
			var cx, cy []float64
			cs := math.Inf(1)
			for _, variant := range [4][2]bool{{false, false}, {true, false}, {false, true}, {true, true}} {
				px, py, ok := convexStart(emb, rx, ry, length, variant[0], variant[1])
				if !ok {
					continue
				}
				s := model.BestScale(px, py)
				for v := range px {
					px[v] *= s
					py[v] *= s
				}
				if _, err := mesh.New(px, py, in.Edges, 0); err != nil {
					continue
				}
				if st := model.Stress(px, py); st < cs {
					cx, cy, cs = px, py, st
				}
			}
			if cx != nil {
				if m, err := mesh.New(cx, cy, in.Edges, 2*reach); err == nil {
					consider("convex", newGuard(m, cx, cy), sweepsFor(candidateShare), t)
				}
			}
		}
	}

	if !in.KeepOuter && (best == nil || bestCrowded || bestStretch > untangleAbove) {
		// Nothing near the reference, or only drawings pressed tight
		// somewhere: a reference that folds in a few places (a map's
		// coast) may follow an embedding of its own once the vertices at
		// its crossings are moved (untangle), and then be made plane near
		// that.
		t = time.Now()
		if ux, uy := untangle(rx, ry, in.Edges); ux != nil {
			if e2, _, ok := Follow(ux, uy, in.Edges); ok {
				considerNear("untangled", ux, uy, e2, t)
			}
		}
	}

	// The plane start, at the model's best scale: tried when nothing else
	// worked, or only crowded drawings, and always with a flow (the caller
	// turns it to flow the most).
	x := append([]float64(nil), in.X...)
	y := append([]float64(nil), in.Y...)
	// Never shrunk: the start's own clearances are what keep it clear of
	// crowding, and stress shrinks what can be shrunk.
	s := max(1, model.BestScale(x, y))
	for v := range n {
		x[v] *= s
		y[v] *= s
	}
	out.StartStress = model.Stress(x, y)
	if best == nil || bestCrowded || len(in.Flow) > 0 {
		t = time.Now()
		m, err := mesh.New(x, y, in.Edges, reach)
		if err != nil {
			return nil, err
		}
		consider("start", newGuard(m, x, y), sweepsFor(candidateShare), t)
	}
	if bestStress > out.StartStress*flowPenalty(x, y) && !bestCrowded {
		// Never worse than the start itself (unless that is crowded).
		m, err := mesh.New(x, y, in.Edges, reach)
		if err != nil {
			return nil, err
		}
		best, bestStress, out.Chosen = newGuard(m, x, y), out.StartStress, "start as given"
	}

	// Then the boxes: the same descent with the barrier keeping boxes, not
	// points, off each other and off the edges; not tried on a drawing so
	// crowded that parting its boxes would wreck it (and cost most of the
	// stage's time).
	if bestStretch > hopelessStretch {
		out.X, out.Y, out.Crowded = best.x, best.y, true
		out.Stress = model.Stress(best.x, best.y)
		out.Gain = gain(model, best.x, best.y, in.X, in.Y)
		return out, nil
	}
	t = time.Now()
	// The margins phase can press a knot tighter while parting boxes
	// elsewhere: the drawing before it is returned too, for the caller to
	// weigh by its own exact clearance.
	bx, by := slices.Clone(best.x), slices.Clone(best.y)
	out.Alternatives = append(out.Alternatives, Alternative{Name: "before margins", X: bx, Y: by, Gain: gain(model, bx, by, in.X, in.Y)})
	marginSweeps := min(maxMarginSweeps, sweepsFor(marginShare))
	if bestStretch > loosenAbove && bestStretch <= loosenBelow {
		// Two runs share the phase's budget: measured on meshes, half
		// the sweeps each leaves every drawing as it was with the whole.
		marginSweeps = max(minSweeps, marginSweeps/2)
		// Boxes pressed all over: parting them in full can wreck the
		// drawing's shape. The same phase with boxes loosened by the
		// square root of that pressure parts them half way and keeps the
		// shape; rounding stretches the rest evenly.
		t = time.Now()
		lx, ly := slices.Clone(bx), slices.Clone(by)
		if m, err := mesh.New(lx, ly, in.Edges, reach); err == nil {
			c := 1 / math.Sqrt(bestStretch)
			loose := newGuard(m, lx, ly)
			loose.hw, loose.hh = scaled(hw, c), scaled(hh, c)
			loose.gap, loose.edgeGap = c*in.Gap, c*in.EdgeGap
			loose.margins = true
			k = loose.run(marginSweeps, runTolerance)
			phase("loose margins", k, lx, ly, t)
			out.Phases[len(out.Phases)-1].Stretch = loose.stretchNeeded()
			out.Alternatives = append(out.Alternatives, Alternative{Name: "loose margins", X: lx, Y: ly, Gain: gain(model, lx, ly, in.X, in.Y)})
		}
		t = time.Now()
	}
	best.margins = true
	k = best.run(marginSweeps, runTolerance)
	phase("margins", k, best.x, best.y, t)
	out.Phases[len(out.Phases)-1].Stretch = best.stretchNeeded()
	out.X, out.Y = best.x, best.y
	out.Stress = model.Stress(best.x, best.y)
	out.Gain = gain(model, best.x, best.y, in.X, in.Y)
	return out, nil
}

// Along counts the pairs (u, v) of flow for which v lies strictly beyond
// u along dir in the drawing x, y (Input.Flow, Input.FlowDir).
func Along(flow [][2]int32, dir [2]float64, x, y []float64) int {
	n := 0
	for _, p := range flow {
		if float64((x[p[1]]-x[p[0]])*dir[0])+float64((y[p[1]]-y[p[0]])*dir[1]) > 0 {
			n++
		}
	}
	return n
}

// gain is the model's stress of drawing x, y over that of drawing sx, sy,
// each at its best scale (1 when both are 0).
func gain(model *stress.Model, x, y, sx, sy []float64) float64 {
	at := func(x, y []float64) float64 {
		f := model.BestScale(x, y)
		fx, fy := make([]float64, len(x)), make([]float64, len(y))
		for v := range x {
			fx[v], fy[v] = f*x[v], f*y[v]
		}
		return model.Stress(fx, fy)
	}
	a, b := at(x, y), at(sx, sy)
	if b == 0 {
		if a == 0 {
			return 1
		}
		return math.Inf(1)
	}
	return a / b
}

// Shares of the work bound (Options.Work): the reference layout, each
// candidate's descent and the margins. minSweeps is the least any gets;
// graphs of up to tryAllLimit vertices try the start as a candidate even
// when a drawing near the reference was found.
const (
	referenceShare = 0.25
	candidateShare = 0.3
	marginShare    = 0.15
	minSweeps      = 10
	maxSweeps      = 500
	// maxMarginSweeps bounds the margins phase, whose sweeps cost the
	// most where boxes crowd.
	maxMarginSweeps = 300
	tryAllLimit     = 300
	// runTolerance: a descent stops once a sweep moves its vertices less
	// than this share of an ideal edge length on average.
	runTolerance = 1e-3
	// maxStretch: a candidate whose boxes would need a greater uniform
	// stretch to clear (at its best scale) counts as crowded. Of the
	// candidates that are not, the least stress wins; if all are, the
	// least stretch.
	maxStretch = 30
	// untangleAbove: where the best candidate's boxes would need more
	// stretching than this (or it is crowded), the reference with its
	// folds repaired is tried too (untangle).
	untangleAbove = 4
	// hopelessStretch: a best candidate whose boxes would need more
	// stretching than this is returned as crowded, without the margins
	// phase.
	hopelessStretch = 1000
	// flowWeight: see flowPenalty in Draw.
	flowWeight = 2
	// crowdedShare: see guard.boxCrowding.
	crowdedShare = 0.02
	// loosenAbove, loosenBelow: a best candidate whose boxes need more
	// stretching than loosenAbove, and at most loosenBelow, also gets a
	// margins phase with loosened boxes (see Output.Alternatives). Above
	// loosenBelow the loosened phase was measured to lose to the full one
	// (a 1,000-node tree, nested triangles, a county map) or both to the
	// start, and it costs as much again.
	loosenAbove = 2
	loosenBelow = 6
)

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

// IdealLengths gives each edge the length at which its two boxes sit a
// comfortable distance apart: the sum of their half diagonals' mean with
// their larger half sides, plus the gap (so that default DOT boxes, 0.75 x
// 0.5 in, sit about one and a third box widths apart centre to centre).
func IdealLengths(edges [][2]int32, hw, hh []float64, gap float64) []float64 {
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

// scaled returns a copy of v with every element times c.
func scaled(v []float64, c float64) []float64 {
	out := make([]float64, len(v))
	for i, x := range v {
		out[i] = float64(c * x)
	}
	return out
}
