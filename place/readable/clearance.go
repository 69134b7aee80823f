package readable

import (
	"math"
	"slices"
)

// conflict is something too near vertex v's box: another vertex's box, or
// an edge passing through v's box (both grown by the gap).
type conflict struct {
	w    int32    // the other vertex, or -1 for an edge
	edge [2]int32 // the edge, when w is -1
}

// findConflicts lists, for every vertex, the boxes and edges that come
// nearer its box than the gap, found through a grid of cells at least
// twice the largest box reach: two boxes that touch lie in neighbouring
// cells, and an edge through a box passes through a cell next to the
// box's centre. The cells are widened until there are at most about 4n of
// them, so that a sweep costs O(n + m sqrt n) at worst and O(n + m) when
// edges are about a cell long, as they are near the stress layout.
func (g *guard) findConflicts() {
	n := len(g.x)
	if g.conflicts == nil {
		g.conflicts = make([][]conflict, n)
	}
	for v := range g.conflicts {
		g.conflicts[v] = g.conflicts[v][:0]
	}
	reach := 0.0
	for v := range n {
		reach = max(reach, g.hw[v]+g.gap, g.hh[v]+g.gap)
	}
	grid := newBucketGrid(g.x, g.y, 2*reach)
	// A vertex lists at most maxConflicts conflicts, and an edge is
	// looked at for at most that many boxes: where thousands of boxes pile
	// up (a star's leaves on a small circle) every pair would be
	// quadratic, and a few per vertex say as much about the crowding.
	full := func(v int32) bool { return len(g.conflicts[v]) >= maxConflicts }
	for v := range int32(n) {
		cx, cy := grid.cellOf(g.x[v], g.y[v])
		for gx := cx - 1; gx <= cx+1 && !full(v); gx++ {
			for gy := cy - 1; gy <= cy+1 && !full(v); gy++ {
				for _, w := range grid.at(gx, gy) {
					if w > v && !full(w) && g.boxesMeet(v, w, g.x[v], g.y[v]) {
						g.conflicts[v] = append(g.conflicts[v], conflict{w: w})
						g.conflicts[w] = append(g.conflicts[w], conflict{w: v})
						if full(v) {
							break
						}
					}
				}
			}
		}
	}
	stamp := make([]int32, n)
	for v := range stamp {
		stamp[v] = -1
	}
	cellStamp := make([]int32, len(grid.start)-1)
	for i := range cellStamp {
		cellStamp[i] = -1
	}
	for ei, e := range g.edges {
		a, b := e[0], e[1]
		found := 0
		grid.walk(g.x[a], g.y[a], g.x[b], g.y[b], func(cx, cy int) {
			for gx := cx - 1; gx <= cx+1 && found < maxConflicts; gx++ {
				for gy := cy - 1; gy <= cy+1 && found < maxConflicts; gy++ {
					c := grid.index(gx, gy)
					if c < 0 || cellStamp[c] == int32(ei) {
						continue
					}
					cellStamp[c] = int32(ei)
					for _, w := range grid.cell(c) {
						if w == a || w == b || stamp[w] == int32(ei) || full(w) {
							continue
						}
						stamp[w] = int32(ei)
						if g.edgeMeetsBox(w, g.x[w], g.y[w], a, b) {
							g.conflicts[w] = append(g.conflicts[w], conflict{w: -1, edge: e})
							if found++; found == maxConflicts {
								break
							}
						}
					}
				}
			}
		})
	}
}

// maxConflicts bounds the conflicts findConflicts lists per vertex and
// per edge.
const maxConflicts = 32

// bucketGrid files points into square cells over their bounding box,
// counting-sorted so that a cell's points are one slice.
type bucketGrid struct {
	x0, y0, size float64
	cols, rows   int
	start        []int32 // cell c holds members[start[c]:start[c+1]]
	members      []int32
}

// newBucketGrid files the points into cells at least least wide, and
// wider where that would make more than about 4n cells.
func newBucketGrid(x, y []float64, least float64) *bucketGrid {
	n := len(x)
	minX, minY, maxX, maxY := math.Inf(1), math.Inf(1), math.Inf(-1), math.Inf(-1)
	for v := range n {
		minX, maxX = min(minX, x[v]), max(maxX, x[v])
		minY, maxY = min(minY, y[v]), max(maxY, y[v])
	}
	if n == 0 {
		minX, minY, maxX, maxY = 0, 0, 0, 0
	}
	side := max(maxX-minX, maxY-minY)
	size := max(least, side/(2*math.Sqrt(float64(n))+1), 1e-9)
	g := &bucketGrid{x0: minX, y0: minY, size: size}
	g.cols = int((maxX-minX)/size) + 1
	g.rows = int((maxY-minY)/size) + 1
	g.start = make([]int32, g.cols*g.rows+1)
	cellOf := make([]int32, n)
	for v := range n {
		cx, cy := g.cellOf(x[v], y[v])
		cellOf[v] = int32(g.index(cx, cy))
		g.start[cellOf[v]+1]++
	}
	for c := 1; c < len(g.start); c++ {
		g.start[c] += g.start[c-1]
	}
	fill := append([]int32(nil), g.start[:len(g.start)-1]...)
	g.members = make([]int32, n)
	for v := range n {
		g.members[fill[cellOf[v]]] = int32(v)
		fill[cellOf[v]]++
	}
	return g
}

// cellOf gives the cell column and row of a point (clamped to the grid).
func (g *bucketGrid) cellOf(x, y float64) (int, int) {
	cx := int((x - g.x0) / g.size)
	cy := int((y - g.y0) / g.size)
	return min(max(cx, 0), g.cols-1), min(max(cy, 0), g.rows-1)
}

// index is the cell's number, or -1 outside the grid.
func (g *bucketGrid) index(cx, cy int) int {
	if cx < 0 || cy < 0 || cx >= g.cols || cy >= g.rows {
		return -1
	}
	return cy*g.cols + cx
}

func (g *bucketGrid) cell(c int) []int32 { return g.members[g.start[c]:g.start[c+1]] }

// at gives the points of a cell; none outside the grid.
func (g *bucketGrid) at(cx, cy int) []int32 {
	c := g.index(cx, cy)
	if c < 0 {
		return nil
	}
	return g.cell(c)
}

// walk calls visit for the cells the segment passes through, in order
// from (ax, ay), stepping half a cell at a time (so that no cell the
// segment crosses is skipped by more than a neighbour, which callers
// cover by looking at neighbours too).
func (g *bucketGrid) walk(ax, ay, bx, by float64, visit func(cx, cy int)) {
	steps := int(math.Min(hypot(bx-ax, by-ay)/g.size*2, float64(2*(g.cols+g.rows)))) + 1
	lastX, lastY := -2, -2
	for k := 0; k <= steps; k++ {
		t := float64(k) / float64(steps)
		cx, cy := g.cellOf(ax+float64(t*(bx-ax)), ay+float64(t*(by-ay)))
		if cx == lastX && cy == lastY {
			continue
		}
		lastX, lastY = cx, cy
		visit(cx, cy)
	}
}

// boxesMeet reports whether v at (vx, vy) and w have boxes, grown by the
// gap, that overlap.
func (g *guard) boxesMeet(v, w int32, vx, vy float64) bool {
	return math.Abs(vx-g.x[w]) < g.hw[v]+g.hw[w]+g.gap && math.Abs(vy-g.y[w]) < g.hh[v]+g.hh[w]+g.gap
}

// edgeMeetsBox reports whether the edge a-b passes through the box of w,
// at (wx, wy) and grown by the gap (Liang-Barsky clipping of the segment
// to the box).
func (g *guard) edgeMeetsBox(w int32, wx, wy float64, a, b int32) bool {
	ax, ay := g.x[a]-wx, g.y[a]-wy
	dx, dy := g.x[b]-g.x[a], g.y[b]-g.y[a]
	rx, ry := g.hw[w]+g.edgeGap, g.hh[w]+g.edgeGap
	lo, hi := 0.0, 1.0
	clip := func(p, q float64) bool { // p t <= q
		if p == 0 {
			return q >= 0
		}
		t := q / p
		if p < 0 {
			lo = max(lo, t)
		} else {
			hi = min(hi, t)
		}
		return lo < hi
	}
	return clip(-dx, ax+rx) && clip(dx, rx-ax) && clip(-dy, ay+ry) && clip(dy, ry-ay)
}

// clearTarget blends v's stress target (tx, ty, of weight w) with a point
// clear of each of its conflicts, each of weight w: for a box, the point
// along the line from the other vertex where the boxes just part; for an
// edge, the point beside it where the box just clears it.
// clearWeight is the weight of a conflict's clear point in clearTarget,
// relative to the stress target's: boxes must part, and stress gives way.
const clearWeight = 4

func (g *guard) clearTarget(v int32, tx, ty, w float64) (float64, float64) {
	if len(g.conflicts) == 0 || len(g.conflicts[v]) == 0 {
		return tx, ty
	}
	sx, sy, sw := float64(w*tx), float64(w*ty), w
	px, py := g.x[v], g.y[v]
	for _, c := range g.conflicts[v] {
		var ax, ay float64
		if c.w >= 0 {
			ux, uy := px-g.x[c.w], py-g.y[c.w]
			d := hypot(ux, uy)
			if d == 0 {
				ux, uy, d = 1, 0, 1
			}
			ux, uy = ux/d, uy/d
			need := g.boxDistance(v, c.w, ux, uy)
			ax, ay = g.x[c.w]+float64(need*ux), g.y[c.w]+float64(need*uy)
		} else {
			a, b := c.edge[0], c.edge[1]
			ex, ey := g.x[b]-g.x[a], g.y[b]-g.y[a]
			l2 := float64(ex*ex) + float64(ey*ey)
			if l2 == 0 {
				continue
			}
			t := min(1, max(0, (float64((px-g.x[a])*ex)+float64((py-g.y[a])*ey))/l2))
			fx, fy := g.x[a]+float64(t*ex), g.y[a]+float64(t*ey)
			l := math.Sqrt(l2)
			nx, ny := -ey/l, ex/l
			if float64((px-fx)*nx)+float64((py-fy)*ny) < 0 {
				nx, ny = -nx, -ny
			}
			need := g.reachAcross(v, ex, ey)
			ax, ay = fx+float64(need*nx), fy+float64(need*ny)
		}
		sx += float64(clearWeight * w * ax)
		sy += float64(clearWeight * w * ay)
		sw += clearWeight * w
	}
	return sx / sw, sy / sw
}

// conflictBarrier is the barrier's part for v's conflicts at (qx, qy).
func (g *guard) conflictBarrier(v int32, term func(h, need float64), qx, qy float64) {
	if len(g.conflicts) == 0 {
		return
	}
	for _, c := range g.conflicts[v] {
		if c.w >= 0 {
			ux, uy := qx-g.x[c.w], qy-g.y[c.w]
			d := hypot(ux, uy)
			if d == 0 {
				term(0, 1)
				continue
			}
			term(d, g.boxDistance(v, c.w, ux/d, uy/d))
			continue
		}
		a, b := c.edge[0], c.edge[1]
		ex, ey := g.x[b]-g.x[a], g.y[b]-g.y[a]
		l2 := float64(ex*ex) + float64(ey*ey)
		if l2 == 0 {
			continue
		}
		t := min(1, max(0, (float64((qx-g.x[a])*ex)+float64((qy-g.y[a])*ey))/l2))
		fx, fy := g.x[a]+float64(t*ex), g.y[a]+float64(t*ey)
		term(hypot(qx-fx, qy-fy), g.reachAcross(v, ex, ey))
	}
}

// stretchNeeded is the uniform scale that clears every conflict of the
// drawing (1 if none): how much bigger it must grow to clear its boxes.
func (g *guard) stretchNeeded() float64 {
	f := 1.0
	for _, x := range g.conflictFactors() {
		f = max(f, x)
	}
	return f
}

// boxCrowding is how much the drawing would need stretching to clear all
// but a few of its conflicts: the stretch that clears every conflict but
// the worst crowdedShare of the vertices' worth. A handful of pressed
// spots are the margins phase's to clear; a drawing pressed all over is
// crowded.
func (g *guard) boxCrowding() float64 {
	need := g.conflictFactors()
	if len(need) == 0 {
		return 1
	}
	slices.Sort(need)
	skip := min(len(need)-1, int(crowdedShare*float64(len(g.x))))
	return max(1, need[len(need)-1-skip])
}

// conflictFactors finds the conflicts and returns, for each, the scale at
// which its two boxes, or its box and edge, part.
func (g *guard) conflictFactors() []float64 {
	g.findConflicts()
	var need []float64
	for v, cs := range g.conflicts {
		for _, c := range cs {
			if c.w >= 0 {
				if c.w < int32(v) {
					continue // each pair once
				}
				dx, dy := math.Abs(g.x[v]-g.x[c.w]), math.Abs(g.y[v]-g.y[c.w])
				f := math.Inf(1)
				if dx > 0 {
					f = (g.hw[v] + g.hw[c.w] + g.gap) / dx
				}
				if dy > 0 {
					f = min(f, (g.hh[v]+g.hh[c.w]+g.gap)/dy)
				}
				need = append(need, f)
				continue
			}
			a, b := c.edge[0], c.edge[1]
			d := segmentDistance(g.x[v], g.y[v], g.x[a], g.y[a], g.x[b], g.y[b])
			if d > 0 {
				need = append(need, g.reachAcross(int32(v), g.x[b]-g.x[a], g.y[b]-g.y[a])/d)
			} else {
				need = append(need, math.Inf(1))
			}
		}
	}
	return need
}

// inflateCrowded blows up, each about its centroid, the parts of the
// drawing (joined by edges) whose vertices have a conflict that would need
// the whole drawing stretched by more than inflateAbove to clear, each by
// the largest such stretch of its own (at most maxInflate), as far as the
// drawing stays plane (see blowUp). A few tight spots then cost room where
// they are, not a stretch of everything.
func (g *guard) inflateCrowded() bool {
	n := len(g.x)
	factor := make([]float64, n)
	g.findConflicts()
	for v, cs := range g.conflicts {
		for _, c := range cs {
			var f float64
			if c.w >= 0 {
				dx, dy := math.Abs(g.x[v]-g.x[c.w]), math.Abs(g.y[v]-g.y[c.w])
				f = math.Inf(1)
				if dx > 0 {
					f = (g.hw[v] + g.hw[c.w] + g.gap) / dx
				}
				if dy > 0 {
					f = min(f, (g.hh[v]+g.hh[c.w]+g.gap)/dy)
				}
				factor[c.w] = max(factor[c.w], f)
			} else {
				a, b := c.edge[0], c.edge[1]
				f = math.Inf(1)
				if d := segmentDistance(g.x[v], g.y[v], g.x[a], g.y[a], g.x[b], g.y[b]); d > 0 {
					f = g.reachAcross(int32(v), g.x[b]-g.x[a], g.y[b]-g.y[a]) / d
				}
				factor[a], factor[b] = max(factor[a], f), max(factor[b], f)
			}
			factor[v] = max(factor[v], f)
		}
	}
	parts := joinedParts(n, g.edges, func(i int) bool {
		e := g.edges[i]
		return factor[e[0]] > inflateAbove && factor[e[1]] > inflateAbove
	}, func(v int32) bool { return factor[v] > inflateAbove })
	factors := make([]float64, len(parts))
	for k, vs := range parts {
		f := 1.0
		for _, v := range vs {
			f = max(f, factor[v])
		}
		factors[k] = min(f, maxInflate)
	}
	if len(parts) == 0 {
		return false
	}
	return g.blowUp(parts, factors, g.reach)
}

// Parts whose conflicts need more than inflateAbove to clear are blown up
// (by at most maxInflate at a time).
const (
	inflateAbove = 1.5
	maxInflate   = 8
)
