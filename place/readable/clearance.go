package readable

import (
	"cmp"
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
// nearer its box than the gap, found through a grid of cells twice the
// largest box reach: two boxes that touch lie in neighbouring cells, and
// an edge through a box passes through a cell next to the box's centre.
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
	cell := max(2*reach, 1e-9)
	type entry struct {
		key uint64
		v   int32
	}
	cellOf := func(x, y float64) (int64, int64) {
		return int64(math.Floor(x / cell)), int64(math.Floor(y / cell))
	}
	key := func(cx, cy int64) uint64 { return uint64(cx)<<32 ^ uint64(cy)&0xffffffff }
	entries := make([]entry, n)
	for v := range int32(n) {
		cx, cy := cellOf(g.x[v], g.y[v])
		entries[v] = entry{key(cx, cy), v}
	}
	slices.SortFunc(entries, func(a, b entry) int { return cmp.Or(cmp.Compare(a.key, b.key), cmp.Compare(a.v, b.v)) })
	at := func(cx, cy int64) []entry {
		k := key(cx, cy)
		i, _ := slices.BinarySearchFunc(entries, k, func(e entry, k uint64) int { return cmp.Compare(e.key, k) })
		j := i
		for j < len(entries) && entries[j].key == k {
			j++
		}
		return entries[i:j]
	}
	for v := range int32(n) {
		cx, cy := cellOf(g.x[v], g.y[v])
		for gx := cx - 1; gx <= cx+1; gx++ {
			for gy := cy - 1; gy <= cy+1; gy++ {
				for _, e := range at(gx, gy) {
					if w := e.v; w > v && g.boxesMeet(v, w, g.x[v], g.y[v]) {
						g.conflicts[v] = append(g.conflicts[v], conflict{w: w})
						g.conflicts[w] = append(g.conflicts[w], conflict{w: v})
					}
				}
			}
		}
	}
	stamp := make([]int32, n)
	for v := range stamp {
		stamp[v] = -1
	}
	for ei, e := range g.edges {
		a, b := e[0], e[1]
		ax, ay, bx, by := g.x[a], g.y[a], g.x[b], g.y[b]
		steps := int(hypot(bx-ax, by-ay)/cell*2) + 1
		for k := 0; k <= steps; k++ {
			t := float64(k) / float64(steps)
			cx, cy := cellOf(ax+float64(t*(bx-ax)), ay+float64(t*(by-ay)))
			for gx := cx - 1; gx <= cx+1; gx++ {
				for gy := cy - 1; gy <= cy+1; gy++ {
					for _, en := range at(gx, gy) {
						w := en.v
						if w == a || w == b || stamp[w] == int32(ei) {
							continue
						}
						stamp[w] = int32(ei)
						if g.edgeMeetsBox(w, g.x[w], g.y[w], a, b) {
							g.conflicts[w] = append(g.conflicts[w], conflict{w: -1, edge: e})
						}
					}
				}
			}
		}
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
	rx, ry := g.hw[w]+g.gap, g.hh[w]+g.gap
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
		sx += float64(w * ax)
		sy += float64(w * ay)
		sw += w
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
	parent := make([]int32, n)
	for v := range parent {
		parent[v] = int32(v)
	}
	find := func(v int32) int32 {
		for parent[v] != v {
			parent[v] = parent[parent[v]]
			v = parent[v]
		}
		return v
	}
	any := false
	for _, e := range g.edges {
		if factor[e[0]] > inflateAbove && factor[e[1]] > inflateAbove {
			parent[find(e[0])] = find(e[1])
			any = true
		}
	}
	if !any {
		return false
	}
	members := map[int32][]int32{}
	var roots []int32
	for v := range int32(n) {
		if factor[v] > inflateAbove {
			r := find(v)
			if len(members[r]) == 0 {
				roots = append(roots, r)
			}
			members[r] = append(members[r], v)
		}
	}
	slices.Sort(roots)
	var parts [][]int32
	var factors []float64
	for _, r := range roots {
		vs := members[r]
		if len(vs) < 2 {
			continue
		}
		f := 1.0
		for _, v := range vs {
			f = max(f, factor[v])
		}
		parts = append(parts, vs)
		factors = append(factors, min(f, maxInflate))
	}
	return g.blowUp(parts, factors, g.reach)
}

// Parts whose conflicts need more than inflateAbove to clear are blown up
// (by at most maxInflate at a time).
const (
	inflateAbove = 1.5
	maxInflate   = 8
)
