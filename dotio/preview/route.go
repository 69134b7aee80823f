package preview

import (
	"math"
	"slices"
)

// Routing removed edges. A removed edge is drawn as a curve off the
// straight line, so that it is not taken for a kept edge; the curve must
// also stay clear of every node box it does not end at, or a reader takes
// it for a connection through that node. Each edge tries, in order:
//
//  1. quadratic curves bowed off the straight line by 0.2, 0.35, 0.5,
//     0.75, 1 and 1.4 times its length (at the control point), to the left
//     first, then to the right;
//  2. polylines with two bends that leave the straight line sideways, run
//     parallel to it just past every box in the way on that side, and come
//     back (legs square or slanted, both sides, a little farther out each
//     time).
//
// A route is clear when every piece between its samples (64 along a
// curve; a polyline's corners) misses every other node's box. Boxes are
// taken at three strengths in turn, the next only when no route clears
// the one before: the box and its label where the label spills out of a
// fixed size, grown by routeClearance; the box grown; the box itself. At
// each strength the curves come first, the polylines only when no curve
// is clear. Of the clear routes the first that runs along kept edges
// (within keptNear) for at most a tenth of its samples wins, else the
// clear one that runs along them least; if none is clear even of the
// bare boxes, the one through the fewest, and it is counted
// (Result.Unrouted). The work is bounded in box and segment tests
// (routeBudget); past it, edges get the first curve unchecked, and count
// as unrouted.

const (
	routeClearance = 3.0 // points kept clear of a box
	routeSamples   = 64
	keptNear       = 2.0 // points: a sample this close to a kept edge runs along it
)

// routeBudget bounds the box and segment tests of one panel's routing; a
// variable so that tests can reach it.
var routeBudget int64 = 50_000_000

var bows = []float64{0.2, -0.2, 0.35, -0.35, 0.5, -0.5, 0.75, -0.75, 1, -1, 1.4, -1.4}

// obstacle is a node box to keep clear of, in three strengths (tiers):
// the box and any label spilling out of it, grown by routeClearance; the
// box grown; the box itself.
type obstacle struct {
	r    [3][4]float64 // x0, y0, x1, y1 per tier
	node int32
}

// grid is a uniform bucket grid over boxes and kept segments, each
// bucket list stored contiguously (offsets per cell, then the entries).
type grid struct {
	x0, y0, cell float64
	nx, ny       int
	boxStart     []int32 // per cell and one more: where its boxes begin in boxes
	boxes        []int32 // obstacle indices
	segStart     []int32
	segs         []int32 // kept segment indices
}

func (g *grid) cellOf(x, y float64) (int, int) {
	i := int(math.Floor((x - g.x0) / g.cell))
	j := int(math.Floor((y - g.y0) / g.cell))
	return min(max(i, 0), g.nx-1), min(max(j, 0), g.ny-1)
}

// bucket fills a contiguous bucket list from a function that calls add
// with (cell, item) for every entry, called twice: to count, then to fill.
func bucket(cells int, each func(add func(cell int, item int32))) (start, items []int32) {
	start = make([]int32, cells+1)
	each(func(c int, _ int32) { start[c+1]++ })
	for c := range cells {
		start[c+1] += start[c]
	}
	items = make([]int32, start[cells])
	fill := slices.Clone(start[:cells])
	each(func(c int, it int32) {
		items[fill[c]] = it
		fill[c]++
	})
	return start, items
}

// router routes the removed edges of a panel.
type router struct {
	obs    []obstacle
	segs   [][2]pt
	g      grid
	tests  int64
	budget int64
	mark   []uint32 // per obstacle: last query that saw it
	smark  []uint32
	query  uint32
}

func newRouter(p *panel) *router {
	r := &router{budget: routeBudget}
	minX, minY, maxX, maxY := math.Inf(1), math.Inf(1), math.Inf(-1), math.Inf(-1)
	var sides []float64
	for i, n := range p.nodes {
		bw, bh := max(n.bw, n.sw), max(n.bh, n.sh)
		lw, lh := bw, bh
		if !n.size.Label.Empty() && !n.invis {
			lw, lh = max(lw, n.size.Label.W/2), max(lh, n.size.Label.H/2)
		}
		o := obstacle{node: int32(i)}
		for k, h := range [3][2]float64{{lw + routeClearance, lh + routeClearance}, {bw + routeClearance, bh + routeClearance}, {bw, bh}} {
			o.r[k] = [4]float64{n.x - h[0], n.y - h[1], n.x + h[0], n.y + h[1]}
		}
		r.obs = append(r.obs, o)
		minX, minY, maxX, maxY = min(minX, o.r[0][0]), min(minY, o.r[0][1]), max(maxX, o.r[0][2]), max(maxY, o.r[0][3])
		sides = append(sides, 2*max(lw, lh)+2*routeClearance)
	}
	for _, l := range p.links {
		if l.removed || l.loop {
			continue
		}
		a, b := p.nodes[l.u], p.nodes[l.v]
		r.segs = append(r.segs, [2]pt{{a.x, a.y}, {b.x, b.y}})
	}
	if len(r.obs) == 0 {
		return r
	}
	// Cells about two median boxes wide, and no more cells than about
	// four per node.
	slices.Sort(sides)
	area := (maxX - minX) * (maxY - minY)
	cell := max(2*sides[len(sides)/2], 16, math.Sqrt(area/float64(4*len(r.obs)+64)))
	r.g = grid{x0: minX, y0: minY, cell: cell}
	r.g.nx = int((maxX-minX)/cell) + 1
	r.g.ny = int((maxY-minY)/cell) + 1
	cells := r.g.nx * r.g.ny
	r.g.boxStart, r.g.boxes = bucket(cells, func(add func(int, int32)) {
		for k, o := range r.obs {
			i0, j0 := r.g.cellOf(o.r[0][0], o.r[0][1])
			i1, j1 := r.g.cellOf(o.r[0][2], o.r[0][3])
			for i := i0; i <= i1; i++ {
				for j := j0; j <= j1; j++ {
					add(i*r.g.ny+j, int32(k))
				}
			}
		}
	})
	// Every cell within reach of a segment: stepped along it at half a
	// cell, with the neighbours of each; a stamp per cell keeps each
	// segment once in a cell.
	stamp := make([]int32, cells)
	r.g.segStart, r.g.segs = bucket(cells, func(add func(int, int32)) {
		clear(stamp)
		for k, s := range r.segs {
			n := int(math.Hypot(s[1][0]-s[0][0], s[1][1]-s[0][1])/(cell/2)) + 1
			for t := 0; t <= n; t++ {
				f := float64(t) / float64(n)
				ci, cj := r.g.cellOf(s[0][0]+f*(s[1][0]-s[0][0]), s[0][1]+f*(s[1][1]-s[0][1]))
				for i := max(ci-1, 0); i <= min(ci+1, r.g.nx-1); i++ {
					for j := max(cj-1, 0); j <= min(cj+1, r.g.ny-1); j++ {
						if c := i*r.g.ny + j; stamp[c] != int32(k)+1 {
							stamp[c] = int32(k) + 1
							add(c, int32(k))
						}
					}
				}
			}
		}
	})
	r.mark = make([]uint32, len(r.obs))
	r.smark = make([]uint32, len(r.segs))
	return r
}

// hits counts the boxes (of the given tier), other than those of u and v,
// that the piece a-b meets.
func (r *router) hits(a, b pt, u, v int32, tier int) int {
	if len(r.obs) == 0 {
		return 0
	}
	r.query++
	i0, j0 := r.g.cellOf(min(a[0], b[0]), min(a[1], b[1]))
	i1, j1 := r.g.cellOf(max(a[0], b[0]), max(a[1], b[1]))
	n := 0
	for i := i0; i <= i1; i++ {
		for j := j0; j <= j1; j++ {
			c := i*r.g.ny + j
			for _, k := range r.g.boxes[r.g.boxStart[c]:r.g.boxStart[c+1]] {
				if r.mark[k] == r.query {
					continue
				}
				r.mark[k] = r.query
				o := r.obs[k]
				if o.node == u || o.node == v {
					continue
				}
				r.tests++
				if segMeetsBox(a, b, o.r[tier]) {
					n++
				}
			}
		}
	}
	return n
}

// nearKept reports whether a point lies within keptNear of a kept edge.
func (r *router) nearKept(p pt) bool {
	if len(r.segs) == 0 {
		return false
	}
	r.query++
	ci, cj := r.g.cellOf(p[0], p[1])
	c := ci*r.g.ny + cj
	for _, k := range r.g.segs[r.g.segStart[c]:r.g.segStart[c+1]] {
		if r.smark[k] == r.query {
			continue
		}
		r.smark[k] = r.query
		s := r.segs[k]
		r.tests++
		if pointSegDist(p, s[0], s[1]) <= keptNear {
			return true
		}
	}
	return false
}

// segMeetsBox reports whether the closed segment a-b meets the box x0,
// y0, x1, y1 (Liang and Barsky's clipping, 1984).
func segMeetsBox(a, b pt, o [4]float64) bool {
	t0, t1 := 0.0, 1.0
	dx, dy := b[0]-a[0], b[1]-a[1]
	for _, e := range [4][2]float64{{-dx, a[0] - o[0]}, {dx, o[2] - a[0]}, {-dy, a[1] - o[1]}, {dy, o[3] - a[1]}} {
		pp, q := e[0], e[1]
		if pp == 0 {
			if q < 0 {
				return false
			}
			continue
		}
		t := q / pp
		if pp < 0 {
			t0 = max(t0, t)
		} else {
			t1 = min(t1, t)
		}
		if t0 > t1 {
			return false
		}
	}
	return true
}

func pointSegDist(p, a, b pt) float64 {
	dx, dy := b[0]-a[0], b[1]-a[1]
	u := 0.0
	if d := dx*dx + dy*dy; d > 0 {
		u = max(0, min(1, ((p[0]-a[0])*dx+(p[1]-a[1])*dy)/d))
	}
	return math.Hypot(p[0]-(a[0]+u*dx), p[1]-(a[1]+u*dy))
}

// quads lists the curves tried for a removed edge from a to b.
func quads(a, b pt) []path {
	dx, dy := b[0]-a[0], b[1]-a[1]
	L := math.Hypot(dx, dy)
	if L == 0 {
		return []path{{straight, []pt{a, b}}}
	}
	nx, ny := -dy/L, dx/L // left of the way from a to b
	mid := pt{(a[0] + b[0]) / 2, (a[1] + b[1]) / 2}
	var out []path
	for _, h := range bows {
		out = append(out, path{quadratic, []pt{a, {mid[0] + nx*h*L, mid[1] + ny*h*L}, b}})
	}
	return out
}

// detours lists the polylines tried when no curve is clear: out sideways
// past every box alongside the edge, parallel to it, and back. Finding
// how far costs a look at every box, charged to the work bound.
func (r *router) detours(a, b pt, u, v int32) []path {
	dx, dy := b[0]-a[0], b[1]-a[1]
	L := math.Hypot(dx, dy)
	if L == 0 {
		return nil
	}
	ux, uy := dx/L, dy/L
	nx, ny := -uy, ux
	// How far each side a parallel run must stay to pass every box that
	// lies alongside the edge: the box's far extent along the normal.
	need := [2]float64{0, 0} // left, right
	r.tests += int64(len(r.obs))
	for _, o := range r.obs {
		if o.node == u || o.node == v {
			continue
		}
		lo, hi := math.Inf(1), math.Inf(-1)
		nlo, nhi := math.Inf(1), math.Inf(-1)
		x0, y0, x1, y1 := o.r[0][0], o.r[0][1], o.r[0][2], o.r[0][3]
		for _, c := range [4]pt{{x0, y0}, {x1, y0}, {x0, y1}, {x1, y1}} {
			along := (c[0]-a[0])*ux + (c[1]-a[1])*uy
			side := (c[0]-a[0])*nx + (c[1]-a[1])*ny
			lo, hi = min(lo, along), max(hi, along)
			nlo, nhi = min(nlo, side), max(nhi, side)
		}
		if hi < 0 || lo > L {
			continue
		}
		if nhi > 0 {
			need[0] = max(need[0], nhi)
		}
		if nlo < 0 {
			need[1] = max(need[1], -nlo)
		}
	}
	step := max(L/8, 8)
	var out []path
	for k := range 4 {
		for s, sign := range [2]float64{1, -1} {
			d := max(need[s]+routeClearance+float64(k)*step, step)
			ox, oy := sign*nx*d, sign*ny*d
			out = append(out, path{polyline, []pt{a, {a[0] + ox, a[1] + oy}, {b[0] + ox, b[1] + oy}, b}})
			slant := min(d, L/4)
			out = append(out, path{polyline, []pt{a,
				{a[0] + ox + ux*slant, a[1] + oy + uy*slant},
				{b[0] + ox - ux*slant, b[1] + oy - uy*slant}, b}})
		}
	}
	return out
}

// route finds the path of a removed edge between nodes u and v; clear
// is false when it runs through some other node's box (or was not
// checked).
func (r *router) route(a, b pt, u, v int32) (path, bool) {
	curves := quads(a, b)
	var polys []path
	best, bestHits := curves[0], math.MaxInt
	for tier := range 3 {
		for _, cands := range [2]*[]path{&curves, &polys} {
			if r.tests > r.budget {
				return curves[0], false
			}
			if cands == &polys && polys == nil {
				polys = r.detours(a, b, u, v)
			}
			c, hits := r.pick(*cands, u, v, tier)
			if hits == 0 {
				return c, true
			}
			if tier == 2 && hits < bestHits {
				best, bestHits = c, hits
			}
		}
	}
	return best, false
}

// pick chooses among candidates at one tier of obstacles: the first clear
// one that runs along kept edges (within keptNear) for at most a tenth of
// its samples, else the clear one that runs along them least; with none
// clear, the one through the fewest boxes, and how many.
func (r *router) pick(cands []path, u, v int32, tier int) (path, int) {
	best, bestNear := -1, math.MaxInt
	fallback, fewest := 0, math.MaxInt
	for ci, c := range cands {
		s := c.samples(routeSamples)
		hits := 0
		for k := 1; k < len(s) && hits < fewest; k++ {
			hits += r.hits(s[k-1], s[k], u, v, tier)
		}
		if hits > 0 {
			if hits < fewest {
				fallback, fewest = ci, hits
			}
			continue
		}
		ds := c
		if c.kind == polyline {
			ds = path{polyline, densify(c.p, routeSamples)}
		}
		pts := ds.samples(routeSamples)
		near := 0
		for _, q := range pts[1 : len(pts)-1] {
			if r.nearKept(q) {
				near++
			}
		}
		if near*10 <= len(pts) {
			return c, 0
		}
		if near < bestNear {
			best, bestNear = ci, near
		}
		if r.tests > r.budget {
			break
		}
	}
	if best >= 0 {
		return cands[best], 0
	}
	if len(cands) == 0 {
		return path{}, math.MaxInt
	}
	return cands[fallback], fewest
}

// densify puts about n points along a polyline, its corners among them.
func densify(p []pt, n int) []pt {
	total := 0.0
	for i := 1; i < len(p); i++ {
		total += math.Hypot(p[i][0]-p[i-1][0], p[i][1]-p[i-1][1])
	}
	out := []pt{p[0]}
	for i := 1; i < len(p); i++ {
		seg := math.Hypot(p[i][0]-p[i-1][0], p[i][1]-p[i-1][1])
		k := 1
		if total > 0 {
			k = max(1, int(math.Round(seg/total*float64(n))))
		}
		for j := 1; j <= k; j++ {
			f := float64(j) / float64(k)
			out = append(out, pt{p[i-1][0] + f*(p[i][0]-p[i-1][0]), p[i-1][1] + f*(p[i][1]-p[i-1][1])})
		}
	}
	return out
}

// route gives every removed link its path and every kept one its
// straight line, centre to centre.
func (p *panel) route() {
	var r *router
	for i := range p.links {
		l := &p.links[i]
		a, b := p.nodes[l.u], p.nodes[l.v]
		l.curve = path{straight, []pt{{a.x, a.y}, {b.x, b.y}}}
		if !l.removed || l.loop {
			continue
		}
		if r == nil {
			r = newRouter(p)
		}
		var clear bool
		l.curve, clear = r.route(pt{a.x, a.y}, pt{b.x, b.y}, l.u, l.v)
		if !clear {
			p.unrouted++
		}
	}
}
