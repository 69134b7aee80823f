package readable

import (
	"cmp"
	"slices"
)

// Bounds on untangle: the edges of the largest graph it takes, its
// rounds, and the segment pairs it may test in all (a step count, so
// that the result never depends on a clock); untangleNear bounds the
// neighbours a vertex tries places near, and the crossed edges it tries
// mirror places across (a hub's would cost its degree squared times the
// edges).
const (
	untangleMaxEdges = 10000
	untangleRounds   = 30
	untangleWork     = 20_000_000
	untangleNear     = 16
	// untangleScanShare: a pass over the edges' boxes counts as this many
	// times fewer steps than as many exact tests.
	untangleScanShare = 8
	// untangleRings bounds the rings of neighbours the relaxation of a
	// fold takes in, and untangleSweeps its sweeps.
	untangleRings  = 4
	untangleSweeps = 200
)

// untangle repairs a drawing that crosses itself in a few places (a
// stress layout that folds a little, as a map's does at its coasts), by
// greedy local crossing reduction (common practice, no source). In each
// round every vertex at a crossing edge moves to the place where the
// fewest of its edges cross, if that is fewer than where it is: of places
// on the way to the barycentre of its neighbours, round it, near each
// neighbour, and mirrored across each edge its edges cross (a vertex
// folded over an edge goes back). Then the ends of two crossing edges
// trade places where that makes fewer crossings (a twist that no single
// move undoes). A round that leaves no fewer crossings than the one
// before is followed by one that also takes moves to places as good as
// where a vertex is, to leave the plateau; after two such rounds, when
// nothing crosses, or at its bounds, the moves stop. Folds left then are
// relaxed: the vertices about them, with up to untangleRings rings of
// neighbours, go to the barycentres of their neighbours with the rest
// held, kept where that leaves fewer crossings. It returns the drawing,
// which may still cross itself (the caller reads an embedding off it with
// Follow, which allows a few crossings), or nil for a graph of more than
// untangleMaxEdges edges or one whose crossings alone cost more to find
// than the work bound.
func untangle(x, y []float64, edges [][2]int32) (ux, uy []float64) {
	n, m := len(x), len(edges)
	if m > untangleMaxEdges {
		return nil, nil
	}
	ux, uy = slices.Clone(x), slices.Clone(y)
	at := make([][]int32, n) // edges at each vertex
	nbr := make([][]int32, n)
	for i, e := range edges {
		at[e[0]] = append(at[e[0]], int32(i))
		at[e[1]] = append(at[e[1]], int32(i))
		nbr[e[0]] = append(nbr[e[0]], e[1])
		nbr[e[1]] = append(nbr[e[1]], e[0])
	}
	work := 0
	crosses := func(i, j int32) bool {
		a, b := edges[i], edges[j]
		// Apart in x or in y: no exact test needed (most pairs).
		if max(ux[a[0]], ux[a[1]]) < min(ux[b[0]], ux[b[1]]) || max(ux[b[0]], ux[b[1]]) < min(ux[a[0]], ux[a[1]]) ||
			max(uy[a[0]], uy[a[1]]) < min(uy[b[0]], uy[b[1]]) || max(uy[b[0]], uy[b[1]]) < min(uy[a[0]], uy[a[1]]) {
			return false
		}
		return segmentsCross(ux, uy, a[0], a[1], b[0], b[1])
	}
	// near lists, in index order, the edges whose bounding boxes meet the
	// box spanned by the points (px, py): no other edge can cross a
	// segment between two of them.
	near := func(px, py []float64) []int32 {
		x0, x1 := slices.Min(px), slices.Max(px)
		y0, y1 := slices.Min(py), slices.Max(py)
		var out []int32
		for j, e := range edges {
			if max(ux[e[0]], ux[e[1]]) >= x0 && min(ux[e[0]], ux[e[1]]) <= x1 &&
				max(uy[e[0]], uy[e[1]]) >= y0 && min(uy[e[0]], uy[e[1]]) <= y1 {
				out = append(out, int32(j))
			}
		}
		work += m / untangleScanShare
		return out
	}
	// crossingsAt counts the crossing pairs of an edge at p (or at q,
	// when q >= 0) and an edge of list, each pair once.
	crossingsAt := func(p, q int32, list []int32) int {
		c := 0
		for _, i := range at[p] {
			for _, j := range list {
				if crosses(i, j) {
					c++
				}
			}
		}
		work += len(at[p]) * len(list)
		if q >= 0 {
			for _, i := range at[q] {
				for _, j := range list {
					if crosses(i, j) && !slices.Contains(at[p], j) {
						c++
					}
				}
			}
			work += len(at[q]) * len(list)
		}
		return c
	}
	// crossingPairs lists the crossing pairs of edges (lower index
	// first), by a sweep along x over the edges' extents; ok is false
	// when the sweep ran past the work bound (long edges overlapping
	// along x all over).
	byLeft := make([]int32, m)
	for i := range byLeft {
		byLeft[i] = int32(i)
	}
	crossingPairs := func() (pairs [][2]int32, ok bool) {
		left := func(i int32) float64 { return min(ux[edges[i][0]], ux[edges[i][1]]) }
		slices.SortStableFunc(byLeft, func(a, b int32) int { return cmp.Compare(left(a), left(b)) })
		for k, i := range byLeft {
			if work > untangleWork {
				return nil, false
			}
			right := max(ux[edges[i][0]], ux[edges[i][1]])
			for _, j := range byLeft[k+1:] {
				if left(j) > right {
					break
				}
				work++
				if crosses(i, j) {
					pairs = append(pairs, [2]int32{min(i, j), max(i, j)})
				}
			}
		}
		slices.SortFunc(pairs, func(a, b [2]int32) int {
			if a[0] != b[0] {
				return cmp.Compare(a[0], b[0])
			}
			return cmp.Compare(a[1], b[1])
		})
		return pairs, true
	}
	// endsOf marks the vertices at an edge of the pairs.
	endsOf := func(pairs [][2]int32) []bool {
		on := make([]bool, n)
		for _, p := range pairs {
			for _, v := range [4]int32{edges[p[0]][0], edges[p[0]][1], edges[p[1]][0], edges[p[1]][1]} {
				on[v] = true
			}
		}
		return on
	}
	last, sideways := -1, false
	for range untangleRounds {
		// The vertices at a crossing edge, and how many pairs cross.
		pairs, ok := crossingPairs()
		if !ok {
			return nil, nil
		}
		if len(pairs) == 0 {
			break
		}
		tangled := endsOf(pairs)
		if now := len(pairs); last >= 0 && now >= last {
			if sideways {
				break
			}
			sideways = true
		} else {
			sideways = false
		}
		last = len(pairs)
		for v := range int32(n) {
			if !tangled[v] || work > untangleWork {
				continue
			}
			untangleVertex(v, ux, uy, edges, at[v], nbr[v], sideways, crosses, near, func(list []int32) int { return crossingsAt(v, -1, list) }, &work)
		}
		for _, pair := range pairs {
			i, j := pair[0], pair[1]
			if work > untangleWork {
				break
			}
			if !crosses(i, j) {
				continue
			}
			for _, p := range edges[i] {
				for _, q := range edges[j] {
					if p == q {
						continue
					}
					var px, py []float64
					for _, v := range [2]int32{p, q} {
						px, py = append(px, ux[v]), append(py, uy[v])
						for _, w := range nbr[v] {
							px, py = append(px, ux[w]), append(py, uy[w])
						}
					}
					list := near(px, py)
					before := crossingsAt(p, q, list)
					ux[p], ux[q], uy[p], uy[q] = ux[q], ux[p], uy[q], uy[p]
					if crossingsAt(p, q, list) >= before {
						ux[p], ux[q], uy[p], uy[q] = ux[q], ux[p], uy[q], uy[p]
					}
				}
			}
		}
		if work > untangleWork {
			break
		}
	}
	// Folds that single moves leave: the vertices about the remaining
	// crossings, one ring of neighbours more each time, go to the
	// barycentres of their neighbours with the rest held (Tutte's
	// relaxation, locally; W. T. Tutte, "How to draw a graph", 1963),
	// kept where that leaves fewer crossings.
	count := func() (int, []bool) {
		pairs, ok := crossingPairs()
		if !ok {
			return 0, nil // past the bound: stop
		}
		return len(pairs), endsOf(pairs)
	}
	now, at0 := count()
	for ring := 0; ring < untangleRings && now > 0 && work <= untangleWork; ring++ {
		free := at0
		for range ring {
			grown := slices.Clone(free)
			for v := range free {
				if free[v] {
					for _, w := range nbr[v] {
						grown[w] = true
					}
				}
			}
			free = grown
		}
		sx, sy := slices.Clone(ux), slices.Clone(uy)
		for range untangleSweeps {
			for v := range n {
				if !free[v] || len(nbr[v]) < 2 {
					continue
				}
				bx, by := 0.0, 0.0
				for _, w := range nbr[v] {
					bx += ux[w]
					by += uy[w]
				}
				ux[v], uy[v] = bx/float64(len(nbr[v])), by/float64(len(nbr[v]))
			}
			work += n
		}
		after, on := count()
		if on == nil { // past the bound: keep what was
			copy(ux, sx)
			copy(uy, sy)
			break
		}
		if after < now {
			now, at0 = after, on
			ring = -1 // start again from the new crossings
			continue
		}
		copy(ux, sx)
		copy(uy, sy)
	}
	return ux, uy
}

// untangleVertex moves v (with edges at and neighbours nbr) to the place,
// of those untangle tries, where the fewest of its edges cross (counted by
// crossings among the edges near lists, with v where the drawing has
// it), if that is fewer than where it is, or, with sideways, as few and
// elsewhere.
func untangleVertex(v int32, x, y []float64, edges [][2]int32, at, nbr []int32, sideways bool, crosses func(i, j int32) bool, near func(px, py []float64) []int32, crossings func(list []int32) int, work *int) {
	bx, by := 0.0, 0.0
	for _, w := range nbr {
		bx += x[w]
		by += y[w]
	}
	bx /= float64(len(nbr))
	by /= float64(len(nbr))
	px, py := x[v], y[v]
	reach := 0.0
	for _, w := range nbr {
		reach += hypot(x[w]-bx, y[w]-by)
	}
	reach /= float64(len(nbr))
	var cand [][2]float64
	for _, t := range [3]float64{1, 0.5, 0.25} {
		cand = append(cand, [2]float64{px + float64(t*(bx-px)), py + float64(t*(by-py))})
	}
	for k := range 8 {
		c, s := unitCircle8(k)
		cand = append(cand, [2]float64{bx + float64(0.5*reach*c), by + float64(0.5*reach*s)})
	}
	for _, w := range nbr[:min(len(nbr), untangleNear)] {
		for _, t := range [2]float64{0.3, 0.6} {
			cand = append(cand, [2]float64{x[w] + float64(t*(bx-x[w])), y[w] + float64(t*(by-y[w]))})
		}
	}
	// The edges that can cross v's where it is.
	sx, sy := []float64{px}, []float64{py}
	for _, w := range nbr {
		sx, sy = append(sx, x[w]), append(sy, y[w])
	}
	mirrors := 0
	here := near(sx, sy)
	for _, i := range at {
		for _, j := range here {
			if mirrors == untangleNear || !crosses(i, j) {
				continue
			}
			c, d := edges[j][0], edges[j][1]
			ex, ey := x[d]-x[c], y[d]-y[c]
			l2 := float64(ex*ex) + float64(ey*ey)
			if c == v || d == v || l2 == 0 {
				continue
			}
			f := (float64((px-x[c])*ex) + float64((py-y[c])*ey)) / l2
			fx, fy := x[c]+float64(f*ex), y[c]+float64(f*ey) // v's foot on the line
			cand = append(cand, [2]float64{2*fx - px, 2*fy - py})
			mirrors++
		}
	}
	// The edges that can cross v's at any place tried.
	for _, c := range cand {
		sx, sy = append(sx, c[0]), append(sy, c[1])
	}
	list := near(sx, sy)
	best := crossings(list)
	bestX, bestY := px, py
	for _, c := range cand {
		if *work > untangleWork {
			break
		}
		x[v], y[v] = c[0], c[1]
		k := crossings(list)
		stay := bestX == px && bestY == py
		if (k < best || sideways && stay && k == best) && !onVertex(x, y, v) {
			best, bestX, bestY = k, c[0], c[1]
		}
	}
	x[v], y[v] = bestX, bestY
}

// onVertex reports whether vertex v sits on another vertex.
func onVertex(x, y []float64, v int32) bool {
	for w := range x {
		if int32(w) != v && x[w] == x[v] && y[w] == y[v] {
			return true
		}
	}
	return false
}

// unitCircle8 is the k-th of eight directions an eighth of a turn apart
// (cos and sin of k times 45 degrees, the diagonals' rounded alike), exact
// on every machine.
func unitCircle8(k int) (float64, float64) {
	const d = 0.7071067811865476
	return [8]float64{1, d, 0, -d, -1, -d, 0, d}[k], [8]float64{0, d, 1, d, 0, -d, -1, -d}[k]
}
