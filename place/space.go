package place

import (
	"cmp"
	"errors"
	"math"
	"slices"

	"github.com/gridwood/gridwood/planarize"
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
	// (more than readableLimit vertices, or past its work bound), spaced by Unit
	// alone: their node boxes never overlap, but an edge may pass through
	// a box.
	Unchecked int
	// Crowded counts checked components that would need a stretch beyond
	// maxExtent to clear every box: stretched to that extent, some edge
	// may still pass through a box.
	Crowded int
	// Convex counts the components of the Schnyder method drawn from their
	// convex drawing instead, which needed less area (Method Convex's own
	// are marked in Drawing.Components); FaceCounts those drawn from
	// Felsner's face-count drawing of their triangulation (not
	// 3-connected, so their own faces need not be convex).
	Convex, FaceCounts int
	// Trees counts the components of three or more vertices that are
	// trees, drawn in layers (see layeredTree) rather than on the grid.
	Trees int
	// Readable counts the components drawn by the readable stage
	// (Result.Readable), and Unrefined those it left with their spaced
	// drawing: larger than it takes, or crowded past what rounding and
	// stretching clear in reasonable size.
	Readable, Unrefined int
	// Relaxed counts the components whose drawing was then relaxed,
	// nodes moved one at a time to where they have more room (see relax),
	// which needed less area; they are counted here only.
	Relaxed int
}

// Limits of the spacing rule.
const (
	// maxExtent caps a component's extent in points, and so its stretch:
	// with coordinate differences below 2^30 the orientation tests on them
	// are exact in int64. A drawing that would need more stays crowded
	// and is counted (Placed.Crowded).
	maxExtent = 1 << 29
	// tutteAreaAllowance: the Tutte drawing is preferred to
	// the grid one unless it needs more than this times the area; its
	// even spread reads better (see doc.go, The spacing rule).
	tutteAreaAllowance = 2.0
	// gridCompareLimit is the largest component whose grid drawing is
	// compared with its Tutte drawing.
	gridCompareLimit = 2000
	// edgeGap is the clear space, in points, between a node box and an
	// edge passing by: enough that the edge visibly misses the box.
	edgeGap = 4
	// A component's spacing may visit at most spacePerEdge cells per edge
	// (plus spaceFloor, at most spaceWork) for each of its two candidate
	// drawings, refinement and clearance checks together: the spacing stays
	// linear in the size of the graph, and crowded drawings whose long
	// edges would need more are checked or refined less.
	spacePerEdge = 512
	spaceFloor   = 2_000_000
	spaceWork    = 20_000_000
)

var errBoxes = errors.New("place: box sizes do not match the vertices")

// maxBoxHalf is the largest half box side and gap Space takes, in points
// (about 910 inches): with it a component of readableLimit vertices at the
// base unit stays below 2^30 points across, where the orientation tests
// of the spacing checks are exact.
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
//     drawing; for trees, the layered drawing) is refined (refine) and
//     stretched by the least factor that keeps every edge off the boxes of
//     the nodes it does not end at, computed per vertex-edge pair near
//     each other; the one needing the least area wins (the Tutte
//     drawing unless it needs more than twice the grid's area);
//   - the winner is stretched, shrunk while it stays clear (to no less
//     than a quarter), then relaxed (relax) and kept relaxed when that
//     needs less area;
//   - stretching stops at maxExtent points across (Placed.Crowded counts
//     the components that needed more); a rounded stretch is checked
//     exactly to stay plane, else an integer one, which keeps every
//     orientation, is used, so no crossing can appear;
//   - components of more than readableLimit (5000) vertices keep the base
//     unit, unchecked.
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
		if opt.Unit <= 0 && len(vs) >= 3 && len(vs) <= readableLimit {
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
	if gridOnly || len(vs) < 3 || len(edges) != len(vs)-1 || len(vs) > readableLimit {
		r.spaceGrid(c, vs, edges, unit, hw, hh, gap, gridOnly, w, out)
		return
	}
	// A tree: its layered drawing, unless the grid's needs less area.
	var counts Placed
	r.spaceGrid(c, vs, edges, unit, hw, hh, gap, false, w, &counts)
	px, py, lx, ly := w.px, w.py, w.lx, w.ly
	crowded, unchecked := spaceTree(vs, edges, hw, hh, gap, lx, ly, w.stamp) // after: spaceGrid uses lx, ly
	if clearedArea(vs, lx, ly, 1, hw, hh) <= clearedArea(vs, px, py, 1, hw, hh) {
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
	var gridRegion *outerRegion
	if r.tri.aug != nil && r.tri.triOuter != nil && r.tri.triOuter[c] >= 0 {
		f0 := r.tri.triOuter[c]
		f1 := r.tri.aug.FaceNext(f0)
		gridRegion = &outerRegion{face: []int32{f0, f1, r.tri.aug.FaceNext(f1)}}
	}
	if len(vs) > readableLimit {
		// Too big to read as a picture anyway: base unit only, which keeps
		// boxes apart; the clearance of edges is not checked.
		out.Unchecked++
		return
	}
	tutte := !gridOnly && r.tri.tutteX != nil && r.tri.outer[c] != nil && r.tuttePoints(c, vs, edges, unit, tx, ty, seen)
	// Past a few thousand vertices a grid drawing's long edges make its
	// refinement costly and it hardly ever wins: take the Tutte
	// drawing without comparing when there is one.
	compare := len(vs) <= gridCompareLimit
	gridStretch, gridChecked := 1.0, false
	if compare || !tutte {
		if compare && gridRegion != nil && !gridOnly {
			refine(r.tri.aug, vs, gridRegion, edges, px, py, hw, hh, gap, stamp, seen, w.push, newWorkMeter(len(edges)))
		}
		gridStretch, gridChecked = clearingStretch(vs, edges, px, py, hw, hh, gap, stamp, newWorkMeter(len(edges)), true)
	}
	stretch, checked, region := gridStretch, gridChecked, gridRegion
	smoothed := false
	if tutte {
		refine(r.tri.aug, vs, r.tri.outer[c], edges, tx, ty, hw, hh, gap, stamp, seen, w.push, newWorkMeter(len(edges)))
		s2, ok := clearingStretch(vs, edges, tx, ty, hw, hh, gap, stamp, newWorkMeter(len(edges)), true)
		take := ok && !compare
		if ok && compare {
			g := stretchLimit(vs, px, py, hw, hh) // unknown: assume the grid as crowded as it may be
			if gridChecked {
				g = min(gridStretch, g)
			}
			take = clearedArea(vs, tx, ty, min(s2, stretchLimit(vs, tx, ty, hw, hh)), hw, hh) <= tutteAreaAllowance*clearedArea(vs, px, py, g, hw, hh)
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
	if limit := stretchLimit(vs, px, py, hw, hh); stretch > limit {
		stretch, crowded = limit, true
	}
	stretchComponent(r.tri.aug, vs, region, px, py, stretch, tx, ty, seen)
	if !crowded && !gridOnly {
		shrinkComponent(r.tri.aug, vs, region, edges, px, py, hw, hh, gap, tx, ty, seen, stamp)
	}
	// Trees are left out: their layered drawing (spaceComponent) won
	// over the relaxed grid drawing on every random tree measured (30 to
	// 1,000 nodes), and relaxing costs as much again.
	if !gridOnly && !crowded && region != nil && len(edges) != len(vs)-1 && len(vs) <= relaxLimit {
		for _, reach := range relaxReaches(vs, hw, hh, gap) {
			if relaxWins(r.tri.aug, vs, region, edges, px, py, tx, ty, w.lx, w.ly, hw, hh, gap, reach, seen, stamp) {
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

// shrinkComponent scales a cleared component down as far as it stays
// clear, to no less than a quarter: drawings that start on a base-unit
// grid are often roomier than they need be (a face-count drawing has
// about two grid lines per node). Every ratio of need to distance scales
// with the drawing, so one pass over the pairs that a quarter-size drawing
// could bring near (shrinkNeed) gives the factor; the result is then
// checked exactly to round to a plane drawing of the triangulation that
// clears every box, a little above the factor if rounding needs it.
// Without a region to check the rounding against it does nothing, and
// past gridCompareLimit vertices neither.
func shrinkComponent(aug *planarize.Embedding, vs []int32, region *outerRegion, edges [][2]int32, x, y, hw, hh []int64, gap int64, tx, ty []int64, seen []bool, stamp []int32) {
	if aug == nil || region == nil || len(vs) < 3 || len(vs) > gridCompareLimit {
		return
	}
	f, ok := shrinkNeed(vs, edges, x, y, hw, hh, gap, stamp)
	if !ok || f >= 1 {
		return
	}
	for _, try := range []float64{max(f*1.01, 0.25), max(f*1.1, 0.25)} {
		if try >= 1 {
			return
		}
		for _, v := range vs {
			tx[v] = int64(math.Round(float64(float64(x[v]) * try)))
			ty[v] = int64(math.Round(float64(float64(y[v]) * try)))
		}
		if !planeDrawing(aug, vs, region, tx, ty, seen) {
			continue
		}
		if s, checked := clearingStretch(vs, edges, tx, ty, hw, hh, gap, stamp, newWorkMeter(len(edges)), false); checked && s <= 1 {
			for _, v := range vs {
				x[v], y[v] = tx[v], ty[v]
			}
			return
		}
	}
}

// shrinkNeed is the least factor, down to a quarter, by which the
// component's drawing can be scaled and still clear every box: the largest
// ratio of need to distance over the pairs within reach of a drawing a
// quarter the size (a bucket grid of four times the cell). ok is false
// when the work bound stopped it.
func shrinkNeed(vs []int32, edges [][2]int32, x, y, hw, hh []int64, gap int64, stamp []int32) (f float64, ok bool) {
	c := clearance{x: x, y: y, hw: hw, hh: hh, gap: gap, s: 0.25}
	grid := newBucketGrid(vs, x, y, 4*clearanceCell(vs, hw, hh, gap))
	nearVertexPairs(vs, grid, x, y, func(u, w int32) {
		dx, dy := abs64(x[u]-x[w]), abs64(y[u]-y[w])
		needX, needY := hw[u]+hw[w]+gap, hh[u]+hh[w]+gap
		r := math.Inf(1) // scaled by less, they overlap
		if dx > 0 {
			r = float64(needX) / float64(dx)
		}
		if dy > 0 {
			r = min(r, float64(needY)/float64(dy))
		}
		c.s = max(c.s, r)
	})
	ok = nearPairs(vs, edges, x, y, grid, stamp, newWorkMeter(len(edges)), c.edgePair)
	return c.s, ok
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
func (r *Result) convexWins(c int, vs []int32, edges [][2]int32, unit int64, hw, hh []int64, gap int64, region *outerRegion, w *scratch, stretch float64, checked bool) (float64, *outerRegion, bool) {
	px, py, tx, ty, seen, stamp := w.px, w.py, w.tx, w.ty, w.seen, w.stamp
	alt := r.tri.convexAlt[c]
	for i, v := range vs {
		tx[v], ty[v] = alt[0][i]*unit, alt[1][i]*unit
	}
	if region != nil && !planeDrawing(r.tri.aug, vs, region, tx, ty, seen) {
		region = nil
	}
	if region != nil {
		refine(r.tri.aug, vs, region, edges, tx, ty, hw, hh, gap, stamp, seen, w.push, newWorkMeter(len(edges)))
	}
	s, ok := clearingStretch(vs, edges, tx, ty, hw, hh, gap, stamp, newWorkMeter(len(edges)), true)
	if !ok || s > stretchLimit(vs, tx, ty, hw, hh) {
		return 0, nil, false // unknown, or crowded: not a clear win
	}
	if region == nil {
		s = math.Ceil(s)
	}
	if checked && clearedArea(vs, tx, ty, s, hw, hh) >= clearedArea(vs, px, py, min(stretch, stretchLimit(vs, px, py, hw, hh)), hw, hh) {
		return 0, nil, false
	}
	for _, v := range vs {
		px[v], py[v] = tx[v], ty[v]
	}
	return s, region, true
}

// spaceTree draws a tree component in layers (see layeredTree) into x, y:
// columns one box width plus the gap apart, layers one box height plus
// twice the gap. Then the layers are pulled apart by the least factor
// (found by doubling and halving) that keeps every edge off the boxes it
// passes: only a shallow edge can pass a box, always one in a layer it
// ends in, and taller layers make every edge steeper, so widening the
// drawing never helps. Any such scaling keeps the drawing plane once
// rounded: the proof needs only the order of the layers and of the
// vertices within each.
//
// It reports how it ended: cleared, crowded (clearing would need more
// than maxExtent points), or unchecked (the clearance check ran out of
// work).
func spaceTree(vs []int32, edges [][2]int32, hw, hh []int64, gap int64, x, y []int64, stamp []int32) (crowded, unchecked bool) {
	var w, h int64
	for _, v := range vs {
		w, h = max(w, hw[v]), max(h, hh[v])
	}
	column := 2*w + gap
	column += column & 1 // even: half columns are whole points
	layer := max(1, 2*h+2*gap)
	layeredTree(vs, edges, max(2, column), layer, x, y)
	top := int64(0)
	for _, v := range vs {
		top = max(top, y[v])
	}
	depth := top / layer // layers below the root
	clear := func(l int64) bool {
		for _, v := range vs {
			y[v] = y[v] / layer * l
		}
		layer = l
		s, checked := clearingStretch(vs, edges, x, y, hw, hh, gap, stamp, newWorkMeter(len(edges)), true)
		unchecked = !checked
		return checked && s <= 1
	}
	lo, hi := layer, layer
	for !clear(hi) {
		if unchecked {
			return false, true
		}
		lo, hi = hi, 2*hi
		if hi*max(1, depth) > maxExtent {
			return true, false // too tall to clear: the last try stands
		}
	}
	for hi-lo > max(1, lo/64) { // within 1/64 of the least
		mid := lo + (hi-lo)/2
		if clear(mid) {
			hi = mid
		} else {
			lo = mid
		}
	}
	clear(hi)
	return false, false
}

// stretchLimit is the largest stretch that keeps the component's extent,
// boxes included, within maxExtent points.
func stretchLimit(vs []int32, x, y, hw, hh []int64) float64 {
	minX, minY := int64(math.MaxInt64), int64(math.MaxInt64)
	maxX, maxY := int64(math.MinInt64), int64(math.MinInt64)
	for _, v := range vs {
		minX, maxX = min(minX, x[v]-hw[v]), max(maxX, x[v]+hw[v])
		minY, maxY = min(minY, y[v]-hh[v]), max(maxY, y[v]+hh[v])
	}
	return max(1, float64(maxExtent)/float64(max(1, maxX-minX, maxY-minY)))
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
		if planeDrawing(r.tri.aug, vs, r.tri.outer[c], x, y, seen) {
			return true
		}
	}
	return false
}

// stretchComponent scales the component's positions by s >= 1. A scale
// rounded to integers is checked exactly to stay a plane drawing (when the
// triangulation is known); failing that, the positions are multiplied by
// the integer ceil(s), which keeps every orientation.
func stretchComponent(aug *planarize.Embedding, vs []int32, region *outerRegion, x, y []int64, s float64, tx, ty []int64, seen []bool) {
	if s <= 1 {
		return
	}
	if aug != nil && region != nil {
		for _, v := range vs {
			tx[v] = int64(math.Round(float64(float64(x[v]) * s)))
			ty[v] = int64(math.Round(float64(float64(y[v]) * s)))
		}
		if planeDrawing(aug, vs, region, tx, ty, seen) {
			for _, v := range vs {
				x[v], y[v] = tx[v], ty[v]
			}
			return
		}
	}
	k := int64(math.Ceil(s))
	for _, v := range vs {
		x[v] *= k
		y[v] *= k
	}
}

// clearingStretch returns the least factor s >= 1 by which the component's
// point positions must be scaled so that no two node boxes (grown by gap)
// overlap and no edge passes through the grown box of a vertex it does not
// end at, where that vertex lies alongside the edge (its projection falls
// strictly inside the edge). checked is false when the work bound stopped
// the search (s is then 1). allPairsFallback says whether it may then try
// every vertex-edge pair instead, when there are few enough.
func clearingStretch(vs []int32, edges [][2]int32, x, y, hw, hh []int64, gap int64, stamp []int32, meter *workMeter, allPairsFallback bool) (s float64, checked bool) {
	if len(vs) < 2 {
		return 1, true
	}
	c := clearance{x: x, y: y, hw: hw, hh: hh, gap: gap, s: 1}
	grid := newBucketGrid(vs, x, y, clearanceCell(vs, hw, hh, gap))
	// Box pairs: only vertices in neighbouring cells can be that close.
	nearVertexPairs(vs, grid, x, y, c.boxPair)
	// Vertex-edge pairs alongside each other. Long edges can make walking
	// their cells cost more than the meter allows; then every pair is
	// tried instead, if there are few enough (a drawing is only called
	// checked when every pair was).
	if !nearPairs(vs, edges, x, y, grid, stamp, meter, c.edgePair) {
		if !allPairsFallback || int64(len(vs))*int64(len(edges)) > checkAllPairs {
			return 1, false
		}
		c.s = 1
		nearVertexPairs(vs, grid, x, y, c.boxPair)
		allPairs(vs, edges, x, y, grid.cell, c.edgePair)
	}
	return c.s, true
}

// checkAllPairs is the most vertex-edge pairs clearingStretch tries one by
// one when walking the edges' cells ran out of work: about 200 ms.
const checkAllPairs = 80_000_000

// clearanceCell is the cell of the bucket grid the clearance passes use:
// twice the largest grown half size of a box, so that everything that can
// touch a box lies within one cell of it.
func clearanceCell(vs []int32, hw, hh []int64, gap int64) int64 {
	var reach int64
	for _, v := range vs {
		reach = max(reach, hw[v]+gap, hh[v]+gap)
	}
	return max(1, 2*reach)
}

// clearance accumulates in s the least stretch that clears the pairs it
// is shown (see clearingStretch).
type clearance struct {
	x, y, hw, hh []int64
	gap          int64
	s            float64
}

// boxPair takes in two boxes: separating them along either axis is enough.
func (c *clearance) boxPair(u, w int32) {
	x, y, hw, hh := c.x, c.y, c.hw, c.hh
	dx, dy := abs64(x[u]-x[w]), abs64(y[u]-y[w])
	needX, needY := hw[u]+hw[w]+c.gap, hh[u]+hh[w]+c.gap
	if dx >= needX || dy >= needY {
		return
	}
	f := math.Inf(1)
	if dx > 0 {
		f = float64(needX) / float64(dx)
	}
	if dy > 0 {
		f = min(f, float64(needY)/float64(dy))
	}
	c.s = max(c.s, f)
}

// edgePair takes in vertex w and edge e.
func (c *clearance) edgePair(w int32, e [2]int32) {
	if cross, need, ok := c.alongside(w, e); ok {
		c.alongsidePair(cross, need)
		return
	}
	c.cornerPair(w, e)
}

// cornerPair takes in a vertex w not alongside edge e: a wide or tall box
// can still reach over the part of e near one of its ends. In units of
// w's grown half box, relative to w, the box is the unit square of the
// maximum norm, and the stretch that clears it is one over that norm's
// least value along e. The norm is convex and piecewise linear along the
// segment, with breaks only where it crosses a diagonal (|x| = |y|), so
// the least value is at an end or at such a crossing.
func (c *clearance) cornerPair(w int32, e [2]int32) {
	a, b := float64(c.hw[w]+edgeGap), float64(c.hh[w]+edgeGap)
	if a <= 0 || b <= 0 {
		return
	}
	// Every point of e lies in its bounding box, so the norm is at least
	// the box's distance from w: when that alone asks for no more than
	// the stretch so far, nothing below can either (most pairs end here).
	wx, wy := c.x[w], c.y[w]
	ux, uy, vx, vy := c.x[e[0]], c.y[e[0]], c.x[e[1]], c.y[e[1]]
	gapX := max(0, min(ux, vx)-wx, wx-max(ux, vx))
	gapY := max(0, min(uy, vy)-wy, wy-max(uy, vy))
	if float64(gapX)*c.s >= a || float64(gapY)*c.s >= b {
		return
	}
	px, py := float64(ux-wx)/a, float64(uy-wy)/b
	qx, qy := float64(vx-wx)/a, float64(vy-wy)/b
	norm := func(x, y float64) float64 { return max(math.Abs(x), math.Abs(y)) }
	least := min(norm(px, py), norm(qx, qy))
	if (least-norm(px-qx, py-qy)/2)*c.s >= 1 {
		// Every point is within half the length of an end, so the norm is
		// at least this much along it: no more than the stretch so far.
		return
	}
	dx, dy := qx-px, qy-py
	for _, sign := range [2]float64{1, -1} {
		// px + t dx = sign (py + t dy)
		if den := dx - sign*dy; den != 0 {
			if t := (sign*py - px) / den; t > 0 && t < 1 {
				least = min(least, norm(px+t*dx, py+t*dy))
			}
		}
	}
	if least == 0 {
		return // through w itself: a broken drawing, not a spacing matter
	}
	c.s = max(c.s, 1/least)
}

// alongsidePair takes in a vertex alongside an edge, given by alongside's
// figures.
func (c *clearance) alongsidePair(cross int64, need float64) {
	if cross == 0 {
		return // on the edge: a broken drawing, not a spacing matter
	}
	c.s = max(c.s, need/math.Abs(float64(cross)))
}

// alongside reports whether w lies alongside edge e (its projection falls
// strictly inside e) and if so the signed cross product of e and w (its
// size is w's distance from e times e's length) and need, the reach of w's
// box, grown by edgeGap, along e's normal times e's length.
func (c *clearance) alongside(w int32, e [2]int32) (cross int64, need float64, ok bool) {
	x, y := c.x, c.y
	u, v := e[0], e[1]
	ex, ey := x[v]-x[u], y[v]-y[u]
	wx, wy := x[w]-x[u], y[w]-y[u]
	dot := wx*ex + wy*ey
	if dot <= 0 || dot >= ex*ex+ey*ey {
		return 0, 0, false
	}
	need = float64(float64(c.hw[w]+edgeGap)*float64(abs64(ey))) + float64(float64(c.hh[w]+edgeGap)*float64(abs64(ex)))
	return ex*wy - ey*wx, need, true
}

// clearedArea is the area of the component's bounding box, node boxes
// included, once its positions are scaled by s.
func clearedArea(vs []int32, x, y []int64, s float64, hw, hh []int64) float64 {
	minX, minY := math.Inf(1), math.Inf(1)
	maxX, maxY := math.Inf(-1), math.Inf(-1)
	for _, v := range vs {
		fx, fy := float64(float64(x[v])*s), float64(float64(y[v])*s)
		minX, minY = min(minX, fx-float64(hw[v])), min(minY, fy-float64(hh[v]))
		maxX, maxY = max(maxX, fx+float64(hw[v])), max(maxY, fy+float64(hh[v]))
	}
	return (maxX - minX) * (maxY - minY)
}

// nearVertexPairs calls fn(u, w), u < w, for every two vertices in the same
// or neighbouring cells of the grid: all pairs closer than one cell.
func nearVertexPairs(vs []int32, grid *bucketGrid, x, y []int64, fn func(u, w int32)) {
	for _, u := range vs {
		cx, cy := grid.cellOf(x[u], y[u])
		for gx := cx - 1; gx <= cx+1; gx++ {
			for gy := cy - 1; gy <= cy+1; gy++ {
				for _, w := range grid.at(gx, gy) {
					if w > u {
						fn(u, w)
					}
				}
			}
		}
	}
}

// bruteForcePairs is the most vertex-edge pairs nearPairs tries all of:
// below it that is cheaper than walking cells.
const bruteForcePairs = 100_000

// nearPairs calls fn for every pair of a vertex w and an edge e not ending
// at w that lie within one cell of each other (the grid's cell is twice
// the reach of any box): for a small component simply every pair, else
// those met walking each edge's cells. It reports false when the meter ran
// out first.
func nearPairs(vs []int32, edges [][2]int32, x, y []int64, grid *bucketGrid, stamp []int32, meter *workMeter, fn func(w int32, e [2]int32)) bool {
	pairs := int64(len(vs)) * int64(len(edges))
	if pairs <= bruteForcePairs {
		if !meter.spend(len(vs) * len(edges) / 8) {
			return false
		}
		allPairs(vs, edges, x, y, grid.cell, fn)
		return true
	}
	// Walking costs about 9 cell visits per cell an edge crosses; on a
	// sparse drawing with long edges trying every pair is cheaper.
	cell := grid.cell
	walk := int64(0)
	for _, e := range edges {
		ex, ey := x[e[1]]-x[e[0]], y[e[1]]-y[e[0]]
		walk += 9 * (int64(math.Sqrt(float64(float64(ex)*float64(ex))+float64(float64(ey)*float64(ey))))/cell + 2)
	}
	if pairs <= checkAllPairs && pairs/8 < walk {
		if !meter.spend(int(pairs / 8)) {
			return false
		}
		allPairs(vs, edges, x, y, cell, fn)
		return true
	}
	for _, v := range vs {
		stamp[v] = -1
	}
	for ei, e := range edges {
		u, v := e[0], e[1]
		ex, ey := x[v]-x[u], y[v]-y[u]
		length := math.Sqrt(float64(float64(ex)*float64(ex)) + float64(float64(ey)*float64(ey)))
		steps := int(length/float64(cell)) + 1
		if !meter.spend(9 * steps) {
			return false
		}
		for k := 0; k <= steps; k++ {
			t := float64(k) / float64(steps)
			cx, cy := grid.cellOf(x[u]+int64(t*float64(ex)), y[u]+int64(t*float64(ey)))
			for gx := cx - 1; gx <= cx+1; gx++ {
				for gy := cy - 1; gy <= cy+1; gy++ {
					for _, w := range grid.at(gx, gy) {
						if w == u || w == v || stamp[w] == int32(ei) {
							continue
						}
						stamp[w] = int32(ei)
						fn(w, e)
					}
				}
			}
		}
	}
	return true
}

// allPairs calls fn for every vertex w and edge e not ending at w whose
// bounding box, grown by r on every side, holds w: edge by edge, in the
// order of edges, so that what fn adds up for one vertex is added in the
// same order however the vertices lie. Each edge looks only at the
// vertices in its x range, found by binary search in the vertices sorted
// by x.
func allPairs(vs []int32, edges [][2]int32, x, y []int64, r int64, fn func(w int32, e [2]int32)) {
	byX := make([]xVertex, len(vs))
	for i, v := range vs {
		byX[i] = xVertex{x[v], v}
	}
	slices.SortFunc(byX, func(a, b xVertex) int { return cmp.Compare(a.x, b.x) })
	for _, e := range edges {
		x0, x1 := min(x[e[0]], x[e[1]])-r, max(x[e[0]], x[e[1]])+r
		y0, y1 := min(y[e[0]], y[e[1]])-r, max(y[e[0]], y[e[1]])+r
		lo, _ := slices.BinarySearchFunc(byX, x0, func(a xVertex, t int64) int { return cmp.Compare(a.x, t) })
		for _, p := range byX[lo:] {
			if p.x > x1 {
				break
			}
			w := p.v
			if y[w] < y0 || y[w] > y1 || w == e[0] || w == e[1] {
				continue
			}
			fn(w, e)
		}
	}
}

// xVertex is a vertex with its x coordinate, for allPairs.
type xVertex struct {
	x int64
	v int32
}

// workMeter counts down the cell visits a component's spacing may make.
type workMeter struct{ left int }

func newWorkMeter(edges int) *workMeter {
	return &workMeter{left: min(spaceWork, spaceFloor+spacePerEdge*edges)}
}

func (m *workMeter) spend(k int) bool {
	m.left -= k
	return m.left >= 0
}

func abs64(v int64) int64 {
	if v < 0 {
		return -v
	}
	return v
}

// bucketGrid files vertices by square cells: in a dense array of cells
// over the vertices' bounding box when that is not much bigger than the
// number of vertices (the usual case for spread-out drawings), else in a
// map.
type bucketGrid struct {
	cell       int64
	x0, y0     int64 // cell coordinates of the dense array's corner
	cols, rows int64
	start      []int32 // dense: cell -> first entry in items
	items      []int32
	cells      map[uint64][]int32
}

func newBucketGrid(vs []int32, x, y []int64, cell int64) *bucketGrid {
	g := &bucketGrid{cell: cell}
	if len(vs) == 0 {
		g.cells = map[uint64][]int32{}
		return g
	}
	minX, minY := int64(math.MaxInt64), int64(math.MaxInt64)
	maxX, maxY := int64(math.MinInt64), int64(math.MinInt64)
	for _, v := range vs {
		cx, cy := g.cellOf(x[v], y[v])
		minX, minY, maxX, maxY = min(minX, cx), min(minY, cy), max(maxX, cx), max(maxY, cy)
	}
	cols, rows := maxX-minX+1, maxY-minY+1
	if cols > 0 && rows > 0 && cols <= 1<<30/rows && cols*rows <= 64*int64(len(vs))+1024 {
		g.x0, g.y0, g.cols, g.rows = minX, minY, cols, rows
		g.start = make([]int32, cols*rows+1)
		for _, v := range vs {
			cx, cy := g.cellOf(x[v], y[v])
			g.start[(cy-minY)*cols+(cx-minX)+1]++
		}
		for i := 1; i < len(g.start); i++ {
			g.start[i] += g.start[i-1]
		}
		g.items = make([]int32, len(vs))
		fill := append([]int32(nil), g.start[:len(g.start)-1]...)
		for _, v := range vs {
			cx, cy := g.cellOf(x[v], y[v])
			k := (cy-minY)*cols + (cx - minX)
			g.items[fill[k]] = v
			fill[k]++
		}
		return g
	}
	g.cells = make(map[uint64][]int32, len(vs))
	for _, v := range vs {
		cx, cy := g.cellOf(x[v], y[v])
		k := cellKey(cx, cy)
		g.cells[k] = append(g.cells[k], v)
	}
	return g
}

func cellKey(cx, cy int64) uint64 { return uint64(cx)<<32 ^ uint64(cy)&0xffffffff }

func (g *bucketGrid) cellOf(x, y int64) (int64, int64) {
	return floorDiv(x, g.cell), floorDiv(y, g.cell)
}

func (g *bucketGrid) at(cx, cy int64) []int32 {
	if g.cells != nil {
		return g.cells[cellKey(cx, cy)]
	}
	cx, cy = cx-g.x0, cy-g.y0
	if cx < 0 || cy < 0 || cx >= g.cols || cy >= g.rows {
		return nil
	}
	k := cy*g.cols + cx
	return g.items[g.start[k]:g.start[k+1]]
}

func floorDiv(a, b int64) int64 {
	q := a / b
	if a%b != 0 && (a < 0) != (b < 0) {
		q--
	}
	return q
}

// packSpaced places component boxes (sizes in points) in rows, gap apart,
// like pack does for grid boxes.
func packSpaced(boxes []Component, gap int64) { packRows(boxes, 0, gap, gap) }

// relaxWins relaxes a copy of the finished drawing in px, py (see relax),
// stretches and shrinks it as spacing does, and when it then clears every
// box in less area than px, py writes it to px, py and reports true. tx,
// ty, lx, ly are scratch; stamp is relax's and the clearance passes'.
func relaxWins(aug *planarize.Embedding, vs []int32, region *outerRegion, edges [][2]int32, px, py, tx, ty, lx, ly, hw, hh []int64, gap int64, reach [2]int64, seen []bool, stamp []int32) bool {
	if len(vs) > relaxLimit {
		return false
	}
	for _, v := range vs {
		tx[v], ty[v] = px[v], py[v]
	}
	if !relax(aug, vs, region, edges, tx, ty, hw, hh, gap, reach, seen, stamp) {
		return false
	}
	s, ok := clearingStretch(vs, edges, tx, ty, hw, hh, gap, stamp, newWorkMeter(len(edges)), true)
	if !ok || s > stretchLimit(vs, tx, ty, hw, hh) {
		return false
	}
	stretchComponent(aug, vs, region, tx, ty, s, lx, ly, seen)
	shrinkComponent(aug, vs, region, edges, tx, ty, hw, hh, gap, lx, ly, seen, stamp)
	if clearedArea(vs, tx, ty, 1, hw, hh) >= clearedArea(vs, px, py, 1, hw, hh) {
		return false
	}
	for _, v := range vs {
		px[v], py[v] = tx[v], ty[v]
	}
	return true
}
