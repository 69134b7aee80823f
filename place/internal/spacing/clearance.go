package spacing

import (
	"cmp"
	"math"
	"slices"
)

// EdgeGap is the clear space, in points, between a node box and an edge
// passing by: enough that the edge visibly misses the box.
const EdgeGap = 4

// ClearingStretch returns the least factor s >= 1 by which the component's
// point positions must be scaled so that no two node boxes (grown by gap)
// overlap and no edge passes through the grown box of a vertex it does not
// end at, where that vertex lies alongside the edge (its projection falls
// strictly inside the edge). checked is false when the work bound stopped
// the search (s is then 1). allPairsFallback says whether it may then try
// every vertex-edge pair instead, when there are few enough.
func ClearingStretch(vs []int32, edges [][2]int32, x, y, hw, hh []int64, gap int64, stamp []int32, meter *Meter, allPairsFallback bool) (s float64, checked bool) {
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

// checkAllPairs is the most vertex-edge pairs ClearingStretch tries one by
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
// is shown (see ClearingStretch).
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
	a, b := float64(c.hw[w]+EdgeGap), float64(c.hh[w]+EdgeGap)
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
// box, grown by EdgeGap, along e's normal times e's length.
func (c *clearance) alongside(w int32, e [2]int32) (cross int64, need float64, ok bool) {
	x, y := c.x, c.y
	u, v := e[0], e[1]
	ex, ey := x[v]-x[u], y[v]-y[u]
	wx, wy := x[w]-x[u], y[w]-y[u]
	dot := wx*ex + wy*ey
	if dot <= 0 || dot >= ex*ex+ey*ey {
		return 0, 0, false
	}
	need = float64(float64(c.hw[w]+EdgeGap)*float64(abs64(ey))) + float64(float64(c.hh[w]+EdgeGap)*float64(abs64(ex)))
	return ex*wy - ey*wx, need, true
}

// ClearedArea is the area of the component's bounding box, node boxes
// included, once its positions are scaled by s.
func ClearedArea(vs []int32, x, y []int64, s float64, hw, hh []int64) float64 {
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
func nearPairs(vs []int32, edges [][2]int32, x, y []int64, grid *bucketGrid, stamp []int32, meter *Meter, fn func(w int32, e [2]int32)) bool {
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

func abs64(v int64) int64 {
	if v < 0 {
		return -v
	}
	return v
}
