package readable

import (
	"cmp"
	"math"
	"slices"

	"github.com/gridwood/gridwood/place/mesh"
	"github.com/gridwood/gridwood/planarize"
)

// Bounds on tan(a/2) in meanValue: an angle the wrong way round counts as
// about 5.7 degrees, and none as more than about 178.
const (
	halfTanLow  = 0.05
	halfTanHigh = 60
)

// floaterSweeps bounds the solver's iterations of one solve;
// floaterRounds the solves of nearPlane.
const (
	floaterSweeps = 400
	floaterRounds = 3
)

// pull draws the triangulation of mesh m (all of the drawing's vertices
// inside its frame) as close to the target drawing tx, ty as a plane
// drawing of it can be got in one solve: each vertex is placed at a convex
// combination of its neighbours, with the mean value coordinates of its
// target position among its neighbours' targets as weights (M. S.
// Floater, "Mean value coordinates", Comput. Aided Geom. Design 20, 2003),
// made positive where the target is not inside its neighbours' polygon,
// and the frame fixed around the target. With positive weights and a
// convex frame every solution is plane (W. T. Tutte, "How to draw a
// graph", 1963; M. S. Floater, "One-to-one piecewise linear mappings over
// triangulations", Math. Comp. 72, 2003); where the target agrees with
// the triangulation, the solution is the target itself. The solve is
// Gauss-Seidel from the target, so the result is checked by the caller.
func pull(m *mesh.Mesh, tx, ty []float64, reach float64) (x, y []float64) {
	return solve(m.N(), m.Rings, tx, ty, reach)
}

// solve is pull for any triangulation of the n vertices and the frame
// (vertices n, n+1, n+2, the corners of mesh.Frame(tx, ty, reach)), given
// by rings: it calls its argument with each vertex's neighbours,
// counter-clockwise.
func solve(n int, rings func(func(v int32, ring []int32)), tx, ty []float64, reach float64) (x, y []float64) {
	fx, fy := mesh.Frame(tx, ty, reach)
	px := func(v int32) float64 {
		if int(v) >= n {
			return fx[int(v)-n]
		}
		return tx[v]
	}
	py := func(v int32) float64 {
		if int(v) >= n {
			return fy[int(v)-n]
		}
		return ty[v]
	}
	// Weights, in compressed rows of each vertex's neighbours.
	start := make([]int32, n+1)
	var nbr []int32
	var weight []float64
	rings(func(v int32, ring []int32) {
		nbr = append(nbr, ring...)
		weight = append(weight, meanValue(tx[v], ty[v], ring, px, py)...)
		start[v+1] = int32(len(nbr))
	})
	x, y = make([]float64, n), make([]float64, n)
	free := func(u int32) bool { return int(u) < n }
	solveWeighted(n, start, nbr, weight, free, [2]func(int32) float64{px, py}, [2][]float64{x, y})
	return x, y
}

// solveWeighted puts each free vertex v of 0..n-1 at the weighted mean of
// its neighbours nbr[start[v]:start[v+1]] (weights as given, made to sum
// to 1 per row), the others held where at says (for vertices past n, and
// for the vertices of 0..n-1 that are not free, whose rows are empty): a
// sparse linear solve per axis by biCGStab, from at's positions, into
// out. Each row is scaled to unit diagonal (Jacobi preconditioning).
func solveWeighted(n int, start, nbr []int32, weight []float64, free func(int32) bool, at [2]func(int32) float64, out [2][]float64) {
	for v := range n {
		sum := 0.0
		for k := start[v]; k < start[v+1]; k++ {
			sum += weight[k]
		}
		for k := start[v]; k < start[v+1]; k++ {
			weight[k] /= sum
		}
	}
	apply := func(in, res []float64) {
		for v := range n {
			s := in[v]
			if free(int32(v)) {
				for k := start[v]; k < start[v+1]; k++ {
					if u := nbr[k]; free(u) {
						s -= float64(weight[k] * in[u])
					}
				}
			}
			res[v] = s
		}
	}
	for axis, pos := range out {
		b := make([]float64, n)
		for v := range n {
			if !free(int32(v)) {
				b[v] = at[axis](int32(v))
				pos[v] = b[v]
				continue
			}
			for k := start[v]; k < start[v+1]; k++ {
				if u := nbr[k]; !free(u) {
					b[v] += float64(weight[k] * at[axis](u))
				}
			}
			pos[v] = at[axis](int32(v))
		}
		biCGStab(apply, b, pos, floaterSweeps, 1e-13)
	}
}

// biCGStab solves A x = b for the operator apply, from x as given, by the
// stabilized bi-conjugate gradient method (H. A. van der Vorst,
// "Bi-CGSTAB: a fast and smoothly converging variant of Bi-CG", SIAM J.
// Sci. Stat. Comput. 13, 1992), for at most iters iterations or until the
// residual's norm is below tol times b's (or the method breaks down). It
// reports the iterations made.
func biCGStab(apply func(in, out []float64), b, x []float64, iters int, tol float64) int {
	n := len(b)
	r, r0, p, v, s, t := make([]float64, n), make([]float64, n), make([]float64, n), make([]float64, n), make([]float64, n), make([]float64, n)
	dot := func(a, c []float64) float64 {
		sum := 0.0
		for i := range a {
			sum += float64(a[i] * c[i])
		}
		return sum
	}
	apply(x, r)
	for i := range r {
		r[i] = b[i] - r[i]
	}
	copy(r0, r)
	bnorm := math.Sqrt(dot(b, b))
	if bnorm == 0 {
		bnorm = 1
	}
	rho, alpha, omega := 1.0, 1.0, 1.0
	for it := 0; it < iters; it++ {
		if math.Sqrt(dot(r, r)) <= tol*bnorm {
			return it
		}
		next := dot(r0, r)
		if next == 0 || omega == 0 {
			return it
		}
		beta := float64(next/rho) * float64(alpha/omega)
		rho = next
		for i := range p {
			p[i] = r[i] + float64(beta*(p[i]-float64(omega*v[i])))
		}
		apply(p, v)
		den := dot(r0, v)
		if den == 0 {
			return it
		}
		alpha = rho / den
		for i := range s {
			s[i] = r[i] - float64(alpha*v[i])
		}
		apply(s, t)
		tt := dot(t, t)
		if tt == 0 {
			for i := range x {
				x[i] += float64(alpha * p[i])
			}
			return it + 1
		}
		omega = dot(t, s) / tt
		for i := range x {
			x[i] += float64(alpha*p[i]) + float64(omega*s[i])
			r[i] = s[i] - float64(omega*t[i])
		}
	}
	return iters
}

// meanValue returns the mean value coordinates of point (vx, vy) among
// the ring of neighbours (counter-clockwise), made positive: each weight
// is (tan(a0/2) + tan(a1/2)) / r for the angles a0, a1 the point sees
// between the neighbour and its two ring neighbours, r its distance, with
// tan(a/2) = sin a / (1 + cos a) computed from cross and dot products,
// each kept within bounds so that every weight is positive and finite.
func meanValue(vx, vy float64, ring []int32, px, py func(int32) float64) []float64 {
	k := len(ring)
	w := make([]float64, k)
	r := make([]float64, k)
	half := make([]float64, k) // tan of half the angle from ring[i] to ring[i+1]
	for i, u := range ring {
		dx, dy := px(u)-vx, py(u)-vy
		r[i] = hypot(dx, dy)
	}
	for i := range k {
		if r[i] == 0 {
			// The point sits on a neighbour: fall back to equal weights.
			for j := range w {
				w[j] = 1
			}
			return w
		}
	}
	for i, u := range ring {
		nu := ring[(i+1)%k]
		ax, ay := px(u)-vx, py(u)-vy
		bx, by := px(nu)-vx, py(nu)-vy
		cross := float64(ax*by) - float64(ay*bx)
		dot := float64(ax*bx) + float64(ay*by)
		den := float64(r[i]*r[(i+1)%k]) + dot
		// tan(a/2), at most halfTanHigh, and halfTanLow for an angle the
		// wrong way round (the target not inside the ring): angles near a
		// half turn would give weights without bound, negative ones
		// weights below zero.
		h := float64(halfTanHigh)
		if den > 0 {
			h = cross / den
		}
		if cross < 0 {
			h = halfTanLow
		}
		half[i] = min(halfTanHigh, h)
	}
	for i := range k {
		w[i] = (half[(i+k-1)%k] + half[i]) / r[i]
	}
	return w
}

// nearPlane returns a plane drawing of the graph, with the plane
// embedding emb (vertices and edges as in edges, any edge order), close to
// the drawing rx, ry (crossings allowed). The edges that cross nothing in
// rx, ry, shortest first, and whose order around both ends agrees with
// emb (or its mirror image, whichever agrees more) are forced into a
// triangulation of rx, ry; the others are routed through it
// combinatorially (mesh.Route) into the corners emb puts them in; the
// triangulation is then drawn by pull with rx, ry as the target, and
// again on the triangulation of that drawing, floaterRounds times in all.
// ok is false when an edge cannot be routed or no round is plane.
func nearPlane(rx, ry []float64, edges [][2]int32, emb *planarize.Embedding, reach float64) (x, y []float64, ok bool) {
	n := len(rx)
	rot := newRotation(emb)
	sign := rot.orientation(rx, ry)
	sorted := shortestFirst(rx, ry, edges)
	_, kept, err := mesh.Greedy(rx, ry, sorted, reach)
	if err != nil {
		return nil, nil, false
	}
	// Keep the crossing-free edges whose places around their ends agree
	// with emb.
	around := make([][]int32, n) // kept neighbours, counter-clockwise in rx, ry
	var keep, route [][2]int32
	for i, e := range sorted {
		if kept[i] && rot.agrees(around, rx, ry, e[0], e[1], sign) && rot.agrees(around, rx, ry, e[1], e[0], sign) {
			around[e[0]] = insertByAngle(around[e[0]], rx, ry, e[0], e[1])
			around[e[1]] = insertByAngle(around[e[1]], rx, ry, e[1], e[0])
			rot.mark(e[0], e[1])
			keep = append(keep, e)
			continue
		}
		route = append(route, e)
	}
	if len(route) == 0 {
		// The target is itself plane, with this embedding: nothing to do.
		return append([]float64(nil), rx...), append([]float64(nil), ry...), true
	}
	m, err := mesh.New(rx, ry, keep, reach)
	if err != nil {
		return nil, nil, false
	}
	for _, e := range route {
		u, v := e[0], e[1]
		if !m.Route(u, v, rot.before(u, v, sign), rot.before(v, u, sign)) {
			return nil, nil, false
		}
		rot.mark(u, v)
	}
	rings := m.Rings
	for round := 0; round < floaterRounds; round++ {
		nx, ny := solve(n, rings, rx, ry, reach)
		next, err := mesh.New(nx, ny, edges, reach)
		if err != nil {
			break
		}
		x, y, ok, rings = nx, ny, true, next.Rings
	}
	return x, y, ok
}

// rotation is an embedding's order of neighbours around each vertex, with
// a mark on the edges placed so far.
type rotation struct {
	start  []int32 // compressed rows: neighbours of v at nbr[start[v]:start[v+1]]
	nbr    []int32
	marked []bool
	index  map[[2]int32]int32 // (v, w) -> position of w in v's row
}

func newRotation(emb *planarize.Embedding) *rotation {
	n := emb.N()
	r := &rotation{start: make([]int32, n+1), index: make(map[[2]int32]int32, 2*emb.M())}
	for v := range int32(n) {
		if d := emb.First(v); d >= 0 {
			for {
				w := emb.Head(d)
				r.index[[2]int32{v, w}] = int32(len(r.nbr))
				r.nbr = append(r.nbr, w)
				if d = emb.Next(d); d == emb.First(v) {
					break
				}
			}
		}
		r.start[v+1] = int32(len(r.nbr))
	}
	r.marked = make([]bool, len(r.nbr))
	return r
}

// orientation returns +1 if the embedding turns the way the drawing does
// at most vertices of three or more neighbours, else -1 (its mirror image
// agrees more).
func (r *rotation) orientation(x, y []float64) float64 {
	votes := 0
	for v := range int32(len(r.start) - 1) {
		row := r.nbr[r.start[v]:r.start[v+1]]
		if len(row) < 3 {
			continue
		}
		if turnsBefore(x, y, v, row[0], row[1], row[2]) {
			votes++
		} else {
			votes--
		}
	}
	if votes < 0 {
		return -1
	}
	return 1
}

// agrees reports whether adding neighbour w to v's kept neighbours, in
// their counter-clockwise order in the drawing, puts it between the same
// two as the embedding does (turned by sign).
func (r *rotation) agrees(around [][]int32, x, y []float64, v, w int32, sign float64) bool {
	list := around[v]
	if len(list) < 2 {
		return true
	}
	i := angleSlot(list, x, y, v, w)
	p, q := list[i-1], list[i%len(list)]
	deg := int(r.start[v+1] - r.start[v])
	pos := func(u int32) int {
		k := int(r.index[[2]int32{v, u}] - r.start[v])
		if sign < 0 {
			k = deg - 1 - k
		}
		return k
	}
	pw, pq := (pos(w)-pos(p)+deg)%deg, (pos(q)-pos(p)+deg)%deg
	return pw > 0 && pw < pq
}

// angleSlot returns where w goes in list (counter-clockwise about v from
// list[0], at least 1): the index of the first element it turns before.
func angleSlot(list []int32, x, y []float64, v, w int32) int {
	for i := 1; i < len(list); i++ {
		if turnsBefore(x, y, v, list[0], w, list[i]) {
			return i
		}
	}
	return len(list)
}

func insertByAngle(list []int32, x, y []float64, v, w int32) []int32 {
	if len(list) < 1 {
		return append(list, w)
	}
	i := angleSlot(list, x, y, v, w)
	return slices.Insert(list, i, w)
}

// mark records that edge v-w is placed.
func (r *rotation) mark(v, w int32) {
	r.marked[r.index[[2]int32{v, w}]] = true
	r.marked[r.index[[2]int32{w, v}]] = true
}

// before returns the placed neighbour of v that comes last before w in the
// embedding's order turned by sign (counter-clockwise in the drawing), or
// -1 if v has none placed.
func (r *rotation) before(v, w int32, sign float64) int32 {
	lo, hi := r.start[v], r.start[v+1]
	deg := hi - lo
	k := r.index[[2]int32{v, w}] - lo
	step := deg - 1 // one back, cyclically
	if sign < 0 {
		step = 1
	}
	for i := int32(1); i < deg; i++ {
		k = (k + step) % deg
		if r.marked[lo+k] {
			return r.nbr[lo+k]
		}
	}
	return -1
}

// shortestFirst returns the edges sorted by their length in the drawing,
// shortest first (ties in input order).
func shortestFirst(x, y []float64, edges [][2]int32) [][2]int32 {
	order := make([]int32, len(edges))
	length := make([]float64, len(edges))
	for i, e := range edges {
		order[i] = int32(i)
		length[i] = hypot(x[e[0]]-x[e[1]], y[e[0]]-y[e[1]])
	}
	slices.SortStableFunc(order, func(a, b int32) int { return cmp.Compare(length[a], length[b]) })
	sorted := make([][2]int32, len(edges))
	for i, id := range order {
		sorted[i] = edges[id]
	}
	return sorted
}
