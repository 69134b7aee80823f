package readable

import "slices"

// Bounds on untangle: the edges of the largest graph it takes, its
// rounds, and the segment pairs it may test in all (a step count, so
// that the result never depends on a clock); untangleNear bounds the
// neighbours a vertex tries places near, and the crossed edges it tries
// mirror places across (a hub's would cost its degree squared times the
// edges).
const (
	untangleMaxEdges = 3000
	untangleRounds   = 30
	untangleWork     = 20_000_000
	untangleNear     = 16
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
// nothing crosses, or at its bounds, it stops. It returns the drawing,
// which may still cross itself (the caller reads an embedding off it with
// Follow, which allows a few crossings), or nil for a graph of more than
// untangleMaxEdges edges.
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
	// crossingsAt counts the crossing pairs of an edge at p (or at q,
	// when q >= 0) and any edge, each pair once.
	crossingsAt := func(p, q int32) int {
		c := 0
		for _, i := range at[p] {
			for j := range int32(m) {
				if crosses(i, j) {
					c++
				}
			}
		}
		work += len(at[p]) * m
		if q >= 0 {
			for _, i := range at[q] {
				for j := range int32(m) {
					if crosses(i, j) && !slices.Contains(at[p], j) {
						c++
					}
				}
			}
			work += len(at[q]) * m
		}
		return c
	}
	last, sideways := -1, false
	for range untangleRounds {
		// The vertices at a crossing edge, and how many pairs cross.
		tangled := make([]bool, n)
		now := 0
		for i := range int32(m) {
			for j := i + 1; j < int32(m); j++ {
				if crosses(i, j) {
					for _, v := range [4]int32{edges[i][0], edges[i][1], edges[j][0], edges[j][1]} {
						tangled[v] = true
					}
					now++
				}
			}
		}
		work += m * m / 2
		if now == 0 {
			break
		}
		if last >= 0 && now >= last {
			if sideways {
				break
			}
			sideways = true
		} else {
			sideways = false
		}
		last = now
		for v := range int32(n) {
			if !tangled[v] || work > untangleWork {
				continue
			}
			untangleVertex(v, ux, uy, edges, at[v], nbr[v], sideways, crosses, func() int { return crossingsAt(v, -1) }, &work)
		}
		for i := range int32(m) {
			for j := i + 1; j < int32(m) && work <= untangleWork; j++ {
				if !crosses(i, j) {
					continue
				}
				for _, p := range edges[i] {
					for _, q := range edges[j] {
						if p == q {
							continue
						}
						before := crossingsAt(p, q)
						ux[p], ux[q], uy[p], uy[q] = ux[q], ux[p], uy[q], uy[p]
						if crossingsAt(p, q) >= before {
							ux[p], ux[q], uy[p], uy[q] = ux[q], ux[p], uy[q], uy[p]
						}
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
		c := 0
		on := make([]bool, n)
		for i := range int32(m) {
			for j := i + 1; j < int32(m); j++ {
				if crosses(i, j) {
					for _, v := range [4]int32{edges[i][0], edges[i][1], edges[j][0], edges[j][1]} {
						on[v] = true
					}
					c++
				}
			}
		}
		work += m * m / 2
		return c, on
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
// crossings, with v where the drawing has it), if that is fewer than
// where it is, or, with sideways, as few and elsewhere.
func untangleVertex(v int32, x, y []float64, edges [][2]int32, at, nbr []int32, sideways bool, crosses func(i, j int32) bool, crossings func() int, work *int) {
	m := int32(len(edges))
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
	mirrors := 0
	for _, i := range at {
		for j := range m {
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
		*work += int(m)
	}
	best := crossings()
	bestX, bestY := px, py
	for _, c := range cand {
		if *work > untangleWork {
			break
		}
		x[v], y[v] = c[0], c[1]
		k := crossings()
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
