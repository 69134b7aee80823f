package place

import (
	"errors"
	"math"

	"github.com/gridwood/gridwood/place/internal/spacing"
	"github.com/gridwood/gridwood/place/mesh"
	"github.com/gridwood/gridwood/place/readable"
)

// maxRoundings bounds the scalings tried when rounding a readable drawing
// to integer points, and maxReadableGrowth the sides of the result, as a
// multiple of the spaced drawing's (its area by the square): past either,
// the drawing is too crowded somewhere to keep (errArea).
const (
	maxRoundings      = 40
	maxReadableGrowth = 2
	// maxFlowGrowth is maxReadableGrowth for a digraph's drawing that
	// points more pairs along the flow than the spaced drawing mirrored
	// (see flowStressShare): turned to run left to right, a drawing of
	// boxes wider than tall needs more room.
	maxFlowGrowth = 3
)

// Why readableComponent kept the spaced drawing (Unrefinement).
var (
	errCrowded = errors.New("place: the readable drawing is crowded")
	errArea    = errors.New("place: the readable drawing clears its boxes only in too much area")
	errStress  = errors.New("place: the readable drawing has more stress than the spaced one")
)

// ReadableOptions tune Readable. The zero value is the default.
type ReadableOptions struct {
	// Work bounds the readable stage of each component (see
	// readable.Options.Work); 0 is the default.
	Work int64
	// EdgeExtra, if not nil, adds to the ideal length of the edge between
	// two vertices (the caller's numbering, lower first), for example the
	// room its label needs beside it (readable.Input.EdgeExtra).
	EdgeExtra map[[2]int32]float64
	// Flow, if not nil, lists pairs of vertices (the caller's numbering)
	// joined by an edge, where the second should come after the first
	// along FlowDir (readable.Input.Flow); pairs that are not kept edges
	// are ignored.
	Flow    [][2]int32
	FlowDir [2]float64
	// Groups, if not nil, lists per vertex (the caller's numbering) the clusters
	// it lies in, outermost first; the readable stage gathers them
	// (readable.Input.Groups).
	Groups [][]int32
}

// Readable turns the grid drawing into a readable one in points: Space
// first spaces it as usual, and then each connected component of three or
// more vertices is drawn by the readable stage (package place/readable:
// stress majorization kept plane by a triangulation, started from the
// spaced drawing or from a plane drawing near the component's stress
// layout), with ideal edge lengths from the node boxes. Its result is
// rounded to integer points, checked exactly to be plane, and stretched by
// the least factor that clears every box (as Space does) where the stage
// left a box too near; a component whose drawing would then take more
// than maxReadableGrowth^2 times the area of its spaced drawing keeps the
// spaced drawing (counted by reason in Placed.Unrefined), as do one whose
// drawing
// has more stress than the spaced one (by the stage's own ideal distances,
// readable.Output.Gain) and one of more than readableMaxVertices vertices;
// a digraph's drawing that points more pairs along the flow than the
// spaced one mirrored gets more room (flowStressShare, maxFlowGrowth).
// Components are then packed in rows. Draw must have been run with
// DrawOptions.Readable.
func (r *Result) Readable(b Boxes, opt ReadableOptions) (*Placed, error) {
	sp, err := r.Space(b, SpaceOptions{})
	if err != nil {
		return nil, err
	}
	n := len(r.X)
	hw, hh, gap, unit, err := r.localBoxes(b)
	if err != nil {
		return nil, err
	}
	out := &Placed{X: make([]int64, n), Y: make([]int64, n), Unit: unit, Unchecked: sp.Unchecked}
	px, py := make([]int64, n), make([]int64, n)
	sx, sy := make([]int64, n), make([]int64, n) // the spaced drawing, local
	for v, w := range r.newID {
		sx[w], sy[w] = sp.X[v], sp.Y[v]
	}
	if opt.EdgeExtra != nil {
		local := make(map[[2]int32]float64, len(opt.EdgeExtra))
		for e, extra := range opt.EdgeExtra {
			if int(e[0]) >= n || int(e[1]) >= n || e[0] < 0 || e[1] < 0 {
				return nil, errors.New("place: ReadableOptions.EdgeExtra names a vertex out of range")
			}
			a, b := r.newID[e[0]], r.newID[e[1]]
			local[[2]int32{min(a, b), max(a, b)}] = max(local[[2]int32{min(a, b), max(a, b)}], extra)
		}
		opt.EdgeExtra = local
	}
	if opt.Flow != nil {
		local := make([][2]int32, 0, len(opt.Flow))
		for _, e := range opt.Flow {
			if int(e[0]) >= n || int(e[1]) >= n || e[0] < 0 || e[1] < 0 {
				return nil, errors.New("place: ReadableOptions.Flow names a vertex out of range")
			}
			local = append(local, [2]int32{r.newID[e[0]], r.newID[e[1]]})
		}
		opt.Flow = local
	}
	if opt.Groups != nil {
		if len(opt.Groups) != n {
			return nil, errors.New("place: ReadableOptions.Groups needs one entry per vertex")
		}
		local := make([][]int32, n)
		for v, w := range r.newID {
			local[w] = opt.Groups[v]
		}
		opt.Groups = local
	}
	edgesOf := r.edgesByComponent()
	boxes := make([]Component, len(r.tri.members))
	stamp := make([]int32, n)
	for c, vs := range r.tri.members {
		for _, v := range vs {
			px[v], py[v] = sx[v], sy[v]
		}
		switch {
		case len(vs) > readableMaxVertices:
			out.Unrefined.TooLarge++
		case len(vs) >= 3:
			err := r.readableComponent(vs, edgesOf[c], sx, sy, hw, hh, gap, opt, px, py, stamp, out)
			if why := unrefinedCount(&out.Unrefined, err); why != nil {
				for _, v := range vs {
					px[v], py[v] = sx[v], sy[v]
				}
				*why++
				err = nil
			}
			if err != nil {
				return nil, err
			}
		}
		boxes[c] = shiftToOrigin(vs, px, py, hw, hh)
	}
	r.packInto(out, r.tri.members, boxes, unit, px, py)
	return out, nil
}

// unrefinedCount returns the count in u of the reason err gives for
// keeping the spaced drawing, or nil if err gives none.
func unrefinedCount(u *Unrefinement, err error) *int {
	switch {
	case errors.Is(err, errCrowded):
		return &u.Crowded
	case errors.Is(err, errArea):
		return &u.Area
	case errors.Is(err, errStress):
		return &u.Stress
	}
	return nil
}

// readableMaxVertices bounds the components the readable stage draws:
// larger ones keep their spaced grid drawing (Placed.Unrefined), since
// the stage's cost per vertex would take them past a minute.
const readableMaxVertices = 20000

// readableComponent draws the component with vertices vs and kept edges
// (Draw's numbering), spaced at sx, sy, by the readable stage, and writes
// its integer points into px, py.
func (r *Result) readableComponent(vs []int32, edges [][2]int32, sx, sy, hw, hh []int64, gap int64, opt ReadableOptions, px, py []int64, stamp []int32, out *Placed) error {
	emb, _ := r.keptEmb.Restrict(vs)
	k := len(vs)
	index := make(map[int32]int32, k)
	for i, v := range vs {
		index[v] = int32(i)
	}
	local := emb.Edges()
	// An edge may pass a box at three quarters of the distance two boxes
	// keep (and no nearer than the spacing rule's spacing.EdgeGap): room
	// enough to read, and less stretching than the full gap asks where
	// boxes crowd (half the gap stretched less still, but bent digraphs'
	// flow).
	in := readable.Input{Edges: local, X: make([]float64, k), Y: make([]float64, k), HalfW: make([]float64, k), HalfH: make([]float64, k), Gap: float64(gap), EdgeGap: max(float64(spacing.EdgeGap), float64(gap)*3/4), Embedding: emb, KeepOuter: r.outerAsked}
	for i, v := range vs {
		in.X[i], in.Y[i] = float64(sx[v]), float64(sy[v])
		in.HalfW[i], in.HalfH[i] = float64(hw[v]), float64(hh[v])
	}
	if opt.EdgeExtra != nil {
		in.EdgeExtra = make([]float64, len(local))
		for i, e := range local {
			a, b := vs[e[0]], vs[e[1]]
			in.EdgeExtra[i] = opt.EdgeExtra[[2]int32{min(a, b), max(a, b)}]
		}
	}
	if opt.Flow != nil {
		kept := make(map[[2]int32]bool, len(local))
		for _, e := range local {
			kept[[2]int32{min(e[0], e[1]), max(e[0], e[1])}] = true
		}
		for _, e := range opt.Flow {
			a, okA := index[e[0]]
			b, okB := index[e[1]]
			if okA && okB && kept[[2]int32{min(a, b), max(a, b)}] {
				in.Flow = append(in.Flow, [2]int32{a, b})
			}
		}
		in.FlowDir = opt.FlowDir
	}
	// A digraph's start is turned or mirrored to point the most pairs
	// along the flow, so that the stage refines a drawing that already
	// flows. The spaced drawing, where it is kept, is only mirrored (the
	// command turns it only where its boxes still clear), so a readable
	// drawing that flows better than its mirrors may cost more (flowWins).
	spacedAlong := 0
	if len(in.Flow) > 0 {
		best, bestAlong := 0, -1
		tx, ty := make([]float64, k), make([]float64, k)
		for sym := range 8 {
			for i := range in.X {
				tx[i], ty[i] = symmetric(sym, in.X[i], in.Y[i])
			}
			a := readable.Along(in.Flow, in.FlowDir, tx, ty)
			if sym < 4 {
				spacedAlong = max(spacedAlong, a)
			}
			if a > bestAlong {
				best, bestAlong = sym, a
			}
		}
		for i := range in.X {
			in.X[i], in.Y[i] = symmetric(best, in.X[i], in.Y[i])
		}
	}
	if opt.Groups != nil {
		in.Groups = make([][]int32, k)
		for i, v := range vs {
			in.Groups[i] = opt.Groups[v]
		}
	}
	res, err := readable.Draw(in, readable.Options{Work: opt.Work})
	if err != nil {
		return err
	}
	if res.Crowded {
		return errCrowded
	}
	out.Readable++
	// To integer points: round, check plane exactly, stretch to clear the
	// boxes; each scaling of the float drawing keeps it plane, and a
	// rounding that is not is tried again at twice the scale.
	// The readable drawing may take up to maxReadableGrowth^2 times the
	// area of the spaced drawing it replaces (boxes included), and no
	// more: a drawing that clears its boxes only at poster size is not
	// readable.
	spacedArea := boxedArea(vs, sx, sy, hw, hh)
	limit := maxReadableGrowth * maxReadableGrowth * spacedArea
	round := func(rx, ry []float64, limit float64) (x, y []int64, area float64, unchecked, ok bool) {
		scale := 1.0
		for range maxRoundings + 1 {
			fx, fy := make([]float64, k), make([]float64, k)
			for i, v := range vs {
				px[v] = int64(math.Round(float64(rx[i] * scale)))
				py[v] = int64(math.Round(float64(ry[i] * scale)))
				fx[i], fy[i] = float64(px[v]), float64(py[v])
			}
			if area = boxedArea(vs, px, py, hw, hh); area > limit {
				return nil, nil, 0, false, false
			}
			if _, err := mesh.New(fx, fy, local, 0); err != nil {
				scale *= 2
				continue
			}
			s, checked := spacing.ClearingStretch(vs, edges, px, py, hw, hh, gap, stamp, spacing.NewMeter(len(edges)), true)
			if s <= 1 {
				x, y = make([]int64, k), make([]int64, k)
				for i, v := range vs {
					x[i], y[i] = px[v], py[v]
				}
				return x, y, area, !checked, true
			}
			scale *= s * 1.0001
		}
		// Some spot of the drawing is crowded past what rounding and
		// stretching can clear in reasonable size.
		return nil, nil, 0, false, false
	}
	// Of the drawing after the margins phase and its alternatives, those
	// that read no worse than the spaced drawing by the stress model's own
	// measure (at the best scale of each: stretching does not change it)
	// compete, and the one that clears its boxes in the least area wins;
	// if none does, the component is spaced from its grid drawing instead.
	var x, y []int64
	var area float64
	var unchecked, ok bool
	lessStress := false // some drawing passed the stress test
	try := func(rx, ry []float64, gain float64) {
		flowWins := len(in.Flow) > 0 && readable.Along(in.Flow, in.FlowDir, rx, ry) > spacedAlong
		if gain > maxReadableStressShare && !(flowWins && gain <= flowStressShare) {
			return
		}
		lessStress = true
		lim := limit
		if flowWins {
			lim = maxFlowGrowth * maxFlowGrowth * spacedArea
		}
		x2, y2, area2, unchecked2, ok2 := round(rx, ry, lim)
		if ok2 && area2 > spacedArea && gain > largerReadableShare && !flowWins {
			return // larger than the spaced drawing, and hardly better
		}
		if ok2 && (!ok || area2 < area) {
			x, y, area, unchecked, ok = x2, y2, area2, unchecked2, true
		}
	}
	try(res.X, res.Y, res.Gain)
	for _, a := range res.Alternatives {
		try(a.X, a.Y, a.Gain)
	}
	if !ok {
		out.Readable--
		if lessStress {
			return errArea
		}
		return errStress
	}
	for i, v := range vs {
		px[v], py[v] = x[i], y[i]
	}
	if unchecked {
		out.Unchecked++
	}
	return nil
}

// maxReadableStressShare is the most stress a readable drawing may have
// as a share of the spaced drawing's it replaces (readable.Output.Gain),
// and largerReadableShare the most where it takes more area than that.
// A digraph's readable drawing that points more pairs along the flow than
// the spaced drawing mirrored may have up to flowStressShare, and up to
// maxFlowGrowth^2 times the spaced drawing's area: measured on the release
// pipeline and the cottages example, both then point every pair along the
// flow (94% and 62% before), and so do all 10 generated st-planar
// triangulations under rankdir=LR (1 before; 7 with the usual area
// bound).
const (
	maxReadableStressShare = 1.0
	largerReadableShare    = 0.9
	flowStressShare        = 1.5
)

// symmetric applies the sym-th of the square's eight symmetries: bit 0
// mirrors x, bit 1 mirrors y, bit 2 then swaps the axes.
func symmetric(sym int, x, y float64) (float64, float64) {
	if sym&1 != 0 {
		x = -x
	}
	if sym&2 != 0 {
		y = -y
	}
	if sym&4 != 0 {
		x, y = y, x
	}
	return x, y
}

// boxedArea is the area of the bounding box of the vertices vs at x, y
// with their boxes of half sizes hw, hh.
func boxedArea(vs []int32, x, y, hw, hh []int64) float64 {
	minX, maxX := math.Inf(1), math.Inf(-1)
	minY, maxY := minX, maxX
	for _, v := range vs {
		minX, maxX = min(minX, float64(x[v]-hw[v])), max(maxX, float64(x[v]+hw[v]))
		minY, maxY = min(minY, float64(y[v]-hh[v])), max(maxY, float64(y[v]+hh[v]))
	}
	return (maxX - minX) * (maxY - minY)
}
