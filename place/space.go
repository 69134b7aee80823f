package place

import (
	"errors"
	"math"
	"slices"

	"github.com/gridwood/gridwood/place/internal/spacing"
)

// Boxes gives each vertex's node box in points, as half width and half
// height around its position, and the clear space wanted between two boxes
// and between a box and an edge that does not end at it. Negative sizes
// count as 0; Space refuses sizes and gaps over 65,536 points.
type Boxes struct {
	HalfW, HalfH []int64
	Gap          int64
}

// SpaceOptions tune Space. The zero value is the default.
type SpaceOptions struct {
	// Unit fixes the points per grid step and keeps every component on its
	// grid (no smoothing, no extra spacing). 0 chooses it from the boxes.
	Unit int64
	// GridOnly keeps every component's grid drawing, with the unit chosen
	// from the boxes and stretched to clear them, but neither refined nor
	// replaced by the Tutte drawing.
	GridOnly bool
}

// Placed is a drawing in points, ready for DOT: X, Y are node centres and
// every node box lies inside [0, Width] x [0, Height].
type Placed struct {
	X, Y          []int64
	Width, Height int64
	// Unit is the base points per grid step, from the boxes or as given.
	Unit int64
	// Tutte counts the components spaced from Tutte's drawing
	// rather than the grid.
	Tutte int
	// Unchecked counts components too big for the box-clearance check
	// (more than spacing.ReadableLimit vertices, or past its work bound),
	// spaced by Unit alone: their node boxes never overlap, but an edge may
	// pass through a box.
	Unchecked int
	// Crowded counts checked components that would need a stretch beyond
	// 2^29 points across (spacing's maxExtent) to clear every box:
	// stretched to that extent, some edge may still pass through a box.
	Crowded int
	// Convex counts the components of the Schnyder method drawn from their
	// convex drawing instead, which needed less area (Method Convex's own
	// are marked in Drawing.Components); FaceCounts those drawn from
	// Felsner's face-count drawing of their triangulation (not
	// 3-connected, so their own faces need not be convex).
	Convex, FaceCounts int
	// Trees counts the components of three or more vertices that are
	// trees, drawn in layers (see spacing.Tree) rather than on the grid.
	Trees int
	// Readable counts the components drawn by the readable stage
	// (Result.Readable), and Unrefined, by reason, those it left with
	// their spaced drawing.
	Readable  int
	Unrefined Unrefinement
	// Relaxed counts the components whose drawing was then relaxed,
	// nodes moved one at a time to where they have more room (see spacing.Relax),
	// which needed less area; they are counted here only.
	Relaxed int
}

// Unrefinement counts by reason the components the readable stage left
// with their spaced drawing, so that the command can say which bound a
// component met.
type Unrefinement struct {
	// TooLarge: more vertices than the stage takes (20,000).
	TooLarge int
	// Crowded: every plane drawing the stage found was too crowded to
	// part its boxes (readable.Output.Crowded).
	Crowded int
	// Area: the readable drawing cleared its boxes only in more area than
	// the spaced drawing allows it (or in more area for hardly less
	// stress).
	Area int
	// Stress: the readable drawing had more stress than the spaced one.
	Stress int
}

// Total is the number of components counted, for every reason.
func (u Unrefinement) Total() int { return u.TooLarge + u.Crowded + u.Area + u.Stress }

// relaxLimit is the largest component Space relaxes (spacing.RelaxLimit);
// a variable so that tests can compare spacing without relaxation.
var relaxLimit = spacing.RelaxLimit

// tutteAreaAllowance: the Tutte drawing is preferred to the grid one
// unless it needs more than this times the area; its even spread reads
// better (see doc.go, The spacing rule).
const tutteAreaAllowance = 2.0

var errBoxes = errors.New("place: box sizes do not match the vertices")

// maxBoxHalf is the largest half box side and gap Space takes, in points
// (about 910 inches): with it a component of spacing.ReadableLimit vertices
// at the base unit stays below 2^30 points across, where the orientation
// tests of the spacing checks are exact.
const maxBoxHalf = 1 << 16

var errBoxSize = errors.New("place: a box half size or the gap is over 65,536 points")

func tooBig(half int64) bool { return half > maxBoxHalf }

// Space turns the grid drawing into positions in points that respect the
// node boxes (doc.go, The spacing rule). Per connected
// component:
//
//   - the base unit is the largest box side plus the gap, so two boxes on
//     distinct grid points never overlap;
//   - each candidate drawing (the grid drawing at the base unit; with
//     Options.Smooth, Tutte's barycentric drawing and Felsner's face-count
//     drawing; for trees, the layered drawing) is refined (spacing.Refine) and
//     stretched by the least factor that keeps every edge off the boxes of
//     the nodes it does not end at, computed per vertex-edge pair near
//     each other; the one needing the least area wins (the Tutte
//     drawing unless it needs more than twice the grid's area);
//   - the winner is stretched, shrunk while it stays clear (to no less
//     than a quarter), then relaxed (spacing.Relax) and kept relaxed when that
//     needs less area;
//   - stretching stops at 2^29 points across (Placed.Crowded counts
//     the components that needed more); a rounded stretch is checked
//     exactly to stay plane, else an integer one, which keeps every
//     orientation, is used, so no crossing can appear;
//   - components of more than spacing.ReadableLimit (5000) vertices keep
//     the base unit, unchecked.
//
// Components are then packed in rows, one base unit apart.
func (r *Result) Space(b Boxes, opt SpaceOptions) (*Placed, error) {
	n := len(r.X)
	hw, hh, gap, unit, err := r.localBoxes(b)
	if err != nil {
		return nil, err
	}
	if opt.Unit > 0 {
		unit = opt.Unit
	}
	d := r.local
	out := &Placed{X: make([]int64, n), Y: make([]int64, n), Unit: unit}
	members := r.tri.members
	edgesOf := r.edgesByComponent()
	w := &scratch{
		px: make([]int64, n), py: make([]int64, n),
		tx: make([]int64, n), ty: make([]int64, n),
		stamp: make([]int32, n),
	}
	px, py := w.px, w.py // local numbering
	for _, vs := range members {
		if opt.Unit <= 0 && len(vs) >= 3 && len(vs) <= spacing.ReadableLimit {
			w.lx, w.ly = make([]int64, n), make([]int64, n)
			w.push = make([][2]float64, n)
			break
		}
	}
	boxes := make([]Component, len(members))
	if r.tri.aug != nil {
		w.seen = make([]bool, 2*r.tri.aug.M())
	}
	for c, vs := range members {
		box := d.Components[c]
		grid := func(scale int64) {
			for _, v := range vs {
				px[v], py[v] = (d.X[v]-box.X0)*scale, (d.Y[v]-box.Y0)*scale
			}
		}
		grid(unit)
		if opt.Unit <= 0 {
			r.spaceComponent(c, vs, edgesOf[c], unit, hw, hh, gap, opt.GridOnly, w, out)
		}
		boxes[c] = shiftToOrigin(vs, px, py, hw, hh)
	}
	r.packInto(out, members, boxes, unit, px, py)
	return out, nil
}

// packInto packs the components' boxes in rows (packSpaced), moves each
// component's points px, py (Draw's numbering) into its box, and writes
// them in the caller's numbering into out, with its width and height.
func (r *Result) packInto(out *Placed, members [][]int32, boxes []Component, unit int64, px, py []int64) {
	packSpaced(boxes, unit)
	for c, vs := range members {
		for _, v := range vs {
			px[v] += boxes[c].X0
			py[v] += boxes[c].Y0
		}
		out.Width = max(out.Width, boxes[c].X0+boxes[c].W)
		out.Height = max(out.Height, boxes[c].Y0+boxes[c].H)
	}
	for v, w := range r.newID {
		out.X[v], out.Y[v] = px[w], py[w]
	}
}

// localBoxes checks the boxes and returns them in Draw's numbering, with
// the gap and the base unit: the largest box side plus the gap, so that
// boxes on distinct grid points never overlap.
func (r *Result) localBoxes(b Boxes) (hw, hh []int64, gap, unit int64, err error) {
	n := len(r.X)
	if len(b.HalfW) != n || len(b.HalfH) != n {
		return nil, nil, 0, 0, errBoxes
	}
	if b.Gap > maxBoxHalf || slices.ContainsFunc(b.HalfW, tooBig) || slices.ContainsFunc(b.HalfH, tooBig) {
		return nil, nil, 0, 0, errBoxSize
	}
	hw, hh = make([]int64, n), make([]int64, n)
	for v, w := range r.newID {
		hw[w], hh[w] = max(0, b.HalfW[v]), max(0, b.HalfH[v])
	}
	gap = max(0, b.Gap)
	for v := range n {
		unit = max(unit, 2*max(hw[v], hh[v]))
	}
	return hw, hh, gap, max(1, unit+gap), nil
}

// edgesByComponent returns the kept edges grouped by component, in their
// order, by a counting sort into one array: growing a slice per component
// copies a million edges over and over.
func (r *Result) edgesByComponent() [][][2]int32 {
	members := r.tri.members
	edgesOf := make([][][2]int32, len(members))
	if len(members) == 1 {
		edgesOf[0] = r.keptLocal
		return edgesOf
	}
	compOf := make([]int32, len(r.X))
	for c, vs := range members {
		for _, v := range vs {
			compOf[v] = int32(c)
		}
	}
	end := make([]int, len(members)+1)
	for _, e := range r.keptLocal {
		end[compOf[e[0]]+1]++
	}
	for c := range members {
		end[c+1] += end[c]
	}
	grouped := make([][2]int32, len(r.keptLocal))
	fill := append([]int(nil), end[:len(members)]...)
	for _, e := range r.keptLocal {
		c := compOf[e[0]]
		grouped[fill[c]] = e
		fill[c]++
	}
	for c := range members {
		edgesOf[c] = grouped[end[c]:end[c+1]:end[c+1]]
	}
	return edgesOf
}

// shiftToOrigin moves the component's points so that its box, node boxes
// included, has its lower left corner at the origin, and returns that box.
func shiftToOrigin(vs []int32, px, py, hw, hh []int64) Component {
	minX, minY, maxX, maxY := int64(math.MaxInt64), int64(math.MaxInt64), int64(math.MinInt64), int64(math.MinInt64)
	for _, v := range vs {
		minX, minY = min(minX, px[v]-hw[v]), min(minY, py[v]-hh[v])
		maxX, maxY = max(maxX, px[v]+hw[v]), max(maxY, py[v]+hh[v])
	}
	for _, v := range vs {
		px[v] -= minX
		py[v] -= minY
	}
	return Component{Vertices: len(vs), W: maxX - minX, H: maxY - minY}
}

// scratch is the working space of Space, of one entry per vertex of the
// whole graph (seen: per dart of the triangulation), so that no component
// allocates its own. px, py hold the component being spaced; tx, ty a
// second candidate; lx, ly a tree's layered drawing and more scratch, and
// push refine's pushes (both only when some component is readable).
type scratch struct {
	px, py, tx, ty, lx, ly []int64
	seen                   []bool
	stamp                  []int32
	push                   [][2]float64
}

// spaceComponent chooses and spaces one component's drawing. w.px, w.py
// hold its grid drawing at the base unit on entry and the result on
// return.
func (r *Result) spaceComponent(c int, vs []int32, edges [][2]int32, unit int64, hw, hh []int64, gap int64, gridOnly bool, w *scratch, out *Placed) {
	if gridOnly || len(vs) < 3 || len(edges) != len(vs)-1 || len(vs) > spacing.ReadableLimit {
		r.spaceGrid(c, vs, edges, unit, hw, hh, gap, gridOnly, w, out)
		return
	}
	// A tree: its layered drawing, unless the grid's needs less area.
	var counts Placed
	r.spaceGrid(c, vs, edges, unit, hw, hh, gap, false, w, &counts)
	px, py, lx, ly := w.px, w.py, w.lx, w.ly
	crowded, unchecked := spacing.Tree(vs, edges, hw, hh, gap, lx, ly, w.stamp) // after: spaceGrid uses lx, ly
	if spacing.ClearedArea(vs, lx, ly, 1, hw, hh) <= spacing.ClearedArea(vs, px, py, 1, hw, hh) {
		for _, v := range vs {
			px[v], py[v] = lx[v], ly[v]
		}
		out.Trees++
		if crowded {
			out.Crowded++
		}
		if unchecked {
			out.Unchecked++
		}
		return
	}
	out.Tutte += counts.Tutte
	out.Unchecked += counts.Unchecked
	out.Crowded += counts.Crowded
	out.Convex += counts.Convex
	out.FaceCounts += counts.FaceCounts
	out.Relaxed += counts.Relaxed
}

// spaceGrid spaces one component from its grid drawing, or from its
// Tutte drawing where that reads better (see Space).
func (r *Result) spaceGrid(c int, vs []int32, edges [][2]int32, unit int64, hw, hh []int64, gap int64, gridOnly bool, w *scratch, out *Placed) {
	px, py, tx, ty, seen, stamp := w.px, w.py, w.tx, w.ty, w.seen, w.stamp
	var gridRegion *spacing.Outer
	if r.tri.aug != nil && r.tri.triOuter != nil && r.tri.triOuter[c] >= 0 {
		f0 := r.tri.triOuter[c]
		f1 := r.tri.aug.FaceNext(f0)
		gridRegion = &spacing.Outer{Face: []int32{f0, f1, r.tri.aug.FaceNext(f1)}}
	}
	if len(vs) > spacing.ReadableLimit {
		// Too big to read as a picture anyway: base unit only, which keeps
		// boxes apart; the clearance of edges is not checked.
		out.Unchecked++
		return
	}
	tutte := !gridOnly && r.tri.tutteX != nil && r.tri.outer[c] != nil && r.tuttePoints(c, vs, edges, unit, tx, ty, seen)
	// Past a few thousand vertices a grid drawing's long edges make its
	// refinement costly and it hardly ever wins: take the Tutte
	// drawing without comparing when there is one.
	compare := len(vs) <= spacing.GridCompareLimit
	gridStretch, gridChecked := 1.0, false
	if compare || !tutte {
		if compare && gridRegion != nil && !gridOnly {
			spacing.Refine(r.tri.aug, vs, gridRegion, edges, px, py, hw, hh, gap, stamp, seen, w.push, spacing.NewMeter(len(edges)))
		}
		gridStretch, gridChecked = spacing.ClearingStretch(vs, edges, px, py, hw, hh, gap, stamp, spacing.NewMeter(len(edges)), true)
	}
	stretch, checked, region := gridStretch, gridChecked, gridRegion
	smoothed := false
	if tutte {
		spacing.Refine(r.tri.aug, vs, r.tri.outer[c], edges, tx, ty, hw, hh, gap, stamp, seen, w.push, spacing.NewMeter(len(edges)))
		s2, ok := spacing.ClearingStretch(vs, edges, tx, ty, hw, hh, gap, stamp, spacing.NewMeter(len(edges)), true)
		take := ok && !compare
		if ok && compare {
			g := spacing.StretchLimit(vs, px, py, hw, hh) // unknown: assume the grid as crowded as it may be
			if gridChecked {
				g = min(gridStretch, g)
			}
			take = spacing.ClearedArea(vs, tx, ty, min(s2, spacing.StretchLimit(vs, tx, ty, hw, hh)), hw, hh) <= tutteAreaAllowance*spacing.ClearedArea(vs, px, py, g, hw, hh)
		}
		if take {
			for _, v := range vs {
				px[v], py[v] = tx[v], ty[v]
			}
			stretch, checked, region = s2, true, r.tri.outer[c]
			smoothed = true
		}
	}
	// Which candidate the component is counted under, last winner first.
	counted := &out.Tutte
	if !smoothed {
		counted = nil
	}
	if !gridOnly && r.tri.convexAlt != nil && r.tri.convexAlt[c][0] != nil {
		if s, reg, ok := r.convexWins(c, vs, edges, unit, hw, hh, gap, gridRegion, w, stretch, checked); ok {
			stretch, checked, region = s, true, reg
			counted = &out.FaceCounts
			if r.tri.convexOwn[c] {
				counted = &out.Convex
			}
		}
	}
	if !checked {
		if counted != nil {
			*counted++
		}
		out.Unchecked++
		return
	}
	crowded := false
	if limit := spacing.StretchLimit(vs, px, py, hw, hh); stretch > limit {
		stretch, crowded = limit, true
	}
	spacing.Stretch(r.tri.aug, vs, region, px, py, stretch, tx, ty, seen)
	if !crowded && !gridOnly {
		spacing.Shrink(r.tri.aug, vs, region, edges, px, py, hw, hh, gap, tx, ty, seen, stamp)
	}
	// Trees are left out: their layered drawing (spaceComponent) won
	// over the relaxed grid drawing on every random tree measured (30 to
	// 1,000 nodes), and relaxing costs as much again.
	if !gridOnly && !crowded && region != nil && len(edges) != len(vs)-1 && len(vs) <= relaxLimit {
		for _, reach := range spacing.Reaches(vs, hw, hh, gap) {
			if spacing.RelaxWins(r.tri.aug, vs, region, edges, px, py, tx, ty, w.lx, w.ly, hw, hh, gap, reach, seen, stamp) {
				counted = &out.Relaxed
			}
		}
	}
	if counted != nil {
		*counted++
	}
	if crowded {
		out.Crowded++
	}
}

// convexWins weighs component c's convex drawing (Drawing.convexAlt, at
// the base unit) against the drawing in w.px, w.py, which needs the given
// stretch (checked false: unknown). The convex drawing is refined as the
// grid one is when it is a plane drawing of the whole triangulation with
// the grid's outer triangle (Felsner's drawing of the triangulation; region
// is then that triangle), else (region nil) it is to be stretched by the
// least whole factor that clears the boxes, which keeps every orientation.
// If it then needs less area, it is written to w.px, w.py and convexWins
// reports true with the stretch it needs.
func (r *Result) convexWins(c int, vs []int32, edges [][2]int32, unit int64, hw, hh []int64, gap int64, region *spacing.Outer, w *scratch, stretch float64, checked bool) (float64, *spacing.Outer, bool) {
	px, py, tx, ty, seen, stamp := w.px, w.py, w.tx, w.ty, w.seen, w.stamp
	alt := r.tri.convexAlt[c]
	for i, v := range vs {
		tx[v], ty[v] = alt[0][i]*unit, alt[1][i]*unit
	}
	if region != nil && !spacing.Plane(r.tri.aug, vs, region, tx, ty, seen) {
		region = nil
	}
	if region != nil {
		spacing.Refine(r.tri.aug, vs, region, edges, tx, ty, hw, hh, gap, stamp, seen, w.push, spacing.NewMeter(len(edges)))
	}
	s, ok := spacing.ClearingStretch(vs, edges, tx, ty, hw, hh, gap, stamp, spacing.NewMeter(len(edges)), true)
	if !ok || s > spacing.StretchLimit(vs, tx, ty, hw, hh) {
		return 0, nil, false // unknown, or crowded: not a clear win
	}
	if region == nil {
		s = math.Ceil(s)
	}
	if checked && spacing.ClearedArea(vs, tx, ty, s, hw, hh) >= spacing.ClearedArea(vs, px, py, min(stretch, spacing.StretchLimit(vs, px, py, hw, hh)), hw, hh) {
		return 0, nil, false
	}
	for _, v := range vs {
		px[v], py[v] = tx[v], ty[v]
	}
	return s, region, true
}

// tuttePoints writes component c's Tutte drawing in points
// into x, y, scaled so that its median edge is one unit, and reports
// whether it rounds to a plane drawing (doubling the scale up to 7 times
// until it does).
func (r *Result) tuttePoints(c int, vs []int32, edges [][2]int32, unit int64, x, y []int64, seen []bool) bool {
	fx, fy := r.tri.tutteX, r.tri.tutteY
	lengths := make([]float64, 0, len(edges))
	for _, e := range edges {
		dx, dy := float64(fx[e[0]]-fx[e[1]]), float64(fy[e[0]]-fy[e[1]])
		lengths = append(lengths, math.Sqrt(float64(dx*dx)+float64(dy*dy)))
	}
	if len(lengths) == 0 {
		return false
	}
	slices.Sort(lengths)
	median := lengths[len(lengths)/2]
	if median <= 0 {
		return false
	}
	scale := float64(unit) / median
	for attempt := 0; attempt < 8; attempt, scale = attempt+1, scale*2 {
		for _, v := range vs {
			x[v] = int64(math.Round(float64(fx[v]) * scale))
			y[v] = int64(math.Round(float64(fy[v]) * scale))
		}
		if spacing.Plane(r.tri.aug, vs, r.tri.outer[c], x, y, seen) {
			return true
		}
	}
	return false
}

// packSpaced places component boxes (sizes in points) in rows, gap apart,
// like pack does for grid boxes.
func packSpaced(boxes []Component, gap int64) { packRows(boxes, 0, gap, gap) }
