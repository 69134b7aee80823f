package graphgen

import (
	"fmt"
	"math/rand/v2"
)

// triangulation is a triangulation of the sphere stored as a corner table
// (Rossignac 2001). Triangle t owns the corners 3t, 3t+1, 3t+2 in
// counterclockwise order; cs[c].vert is the vertex at corner c and
// cs[c].opp is the corner of the neighbouring triangle that faces c across
// the edge opposite c. For matched corners c and o the shared edge runs
// vert(next(c)) -> vert(prev(c)) in c's triangle and the other way round in
// o's: vert(next(c)) == vert(prev(o)) and vert(prev(c)) == vert(next(o)).
type triangulation struct {
	n      int
	cs     []cornerRec
	corner []int32 // corner[v] is some corner at vertex v
	deg    []int32
	// present, while not nil, holds every edge; randomFlips sets it up so
	// that adjacency tests cost one hashed lookup instead of a walk.
	present *pairSet
}

// cornerRec keeps a corner's vertex and partner side by side: walking
// around a vertex reads both, and at n = 10^6 the table is far larger than
// the caches, so one memory access per triangle instead of two matters.
type cornerRec struct {
	vert, opp int32
}

func next(c int32) int32 {
	if c%3 == 2 {
		return c - 2
	}
	return c + 1
}

func prev(c int32) int32 {
	if c%3 == 0 {
		return c + 2
	}
	return c - 1
}

// maxTriangulationVertices keeps the 6n-12 corner indices within int32.
const maxTriangulationVertices = 1 << 28

// flipsPerVertex is the number of random flip attempts per vertex.
const flipsPerVertex = 2

func (t *triangulation) link(c, o int32) {
	t.cs[c].opp = o
	t.cs[o].opp = c
}

// newStackedTriangulation returns a random stacked triangulation on n >= 3
// vertices: the triangle 0, 1, 2 as two faces, then vertices 3..n-1 each
// inserted into a uniformly random face.
func newStackedTriangulation(n int, rng *rand.Rand) *triangulation {
	faces := 2*n - 4
	t := &triangulation{
		n:      n,
		cs:     make([]cornerRec, 3*faces),
		corner: make([]int32, n),
		deg:    make([]int32, n),
	}
	// Triangle 0 is (0, 1, 2); triangle 1 is (0, 2, 1), its other side.
	for c, v := range []int32{0, 1, 2, 0, 2, 1} {
		t.cs[c].vert = v
	}
	t.link(0, 3) // edge 1-2
	t.link(1, 5) // edge 2-0
	t.link(2, 4) // edge 0-1
	t.corner[0], t.corner[1], t.corner[2] = 0, 1, 2
	t.deg[0], t.deg[1], t.deg[2] = 2, 2, 2
	used := int32(2)
	for x := int32(3); x < int32(n); x++ {
		t.insert(x, int32(rng.IntN(int(used))), used)
		used += 2
	}
	return t
}

// insert places vertex x inside triangle f = (a, b, c), which becomes
// (a, b, x); the new triangles (b, c, x) and (c, a, x) take the indices
// fresh and fresh+1.
func (t *triangulation) insert(x, f, fresh int32) {
	c0, c1, c2 := 3*f, 3*f+1, 3*f+2
	a, b, c := t.cs[c0].vert, t.cs[c1].vert, t.cs[c2].vert
	acrossBC, acrossCA, acrossAB := t.cs[c0].opp, t.cs[c1].opp, t.cs[c2].opp
	d1, d2 := 3*fresh, 3*(fresh+1)
	t.cs[c2].vert = x
	t.cs[d1].vert, t.cs[d1+1].vert, t.cs[d1+2].vert = b, c, x
	t.cs[d2].vert, t.cs[d2+1].vert, t.cs[d2+2].vert = c, a, x
	t.link(c2, acrossAB)
	t.link(d1+2, acrossBC)
	t.link(d2+2, acrossCA)
	t.link(c0, d1+1) // edge b-x
	t.link(c1, d2)   // edge x-a
	t.link(d1, d2+1) // edge c-x
	t.corner[x] = c2
	t.corner[c] = d1 + 1
	t.deg[x] = 3
	t.deg[a]++
	t.deg[b]++
	t.deg[c]++
}

// adjacent reports whether u and v share an edge, walking around the
// endpoint of lower degree.
func (t *triangulation) adjacent(u, v int32) bool {
	if t.present != nil {
		return t.present.has(pairKey(u, v))
	}
	if t.deg[u] > t.deg[v] {
		u, v = v, u
	}
	k := t.corner[u]
	for range t.deg[u] {
		if t.cs[next(k)].vert == v {
			return true
		}
		k = prev(t.cs[prev(k)].opp)
	}
	return false
}

// flip replaces the edge opposite corner c, shared by triangles (C, A, B)
// and (D, B, A), by the edge C-D, giving (C, A, D) and (D, B, C). It refuses
// (and reports false) when C and D are equal or already adjacent, which keeps
// the triangulation simple and every degree at least 3.
func (t *triangulation) flip(c int32) bool {
	o := t.cs[c].opp
	n1, p1 := next(c), prev(c)
	n2, p2 := next(o), prev(o)
	vc, va, vb, vd := t.cs[c].vert, t.cs[n1].vert, t.cs[p1].vert, t.cs[o].vert
	if vc == vd || t.adjacent(vc, vd) {
		return false
	}
	acrossBC := t.cs[n1].opp
	acrossAD := t.cs[n2].opp
	// The corners p1 and p2 keep their outer neighbours: p1 (now D) still
	// faces edge C-A and p2 (now C) still faces edge D-B.
	t.cs[p1].vert = vd
	t.cs[p2].vert = vc
	t.link(c, acrossAD)
	t.link(o, acrossBC)
	t.link(n1, n2) // the new edge C-D
	if t.present != nil {
		t.present.remove(pairKey(va, vb))
		t.present.insert(pairKey(vc, vd))
	}
	t.corner[va] = n1
	t.corner[vb] = n2
	t.deg[va]--
	t.deg[vb]--
	t.deg[vc]++
	t.deg[vd]++
	return true
}

// randomFlips makes attempts flips of uniformly random edges (a uniformly
// random corner names the edge opposite it, and every edge has two corners)
// and returns how many succeeded.
func (t *triangulation) randomFlips(attempts int, rng *rand.Rand) int {
	corners := len(t.cs)
	t.present = newPairSet(corners / 2)
	for c := range int32(corners) {
		if c < t.cs[c].opp {
			t.present.insert(pairKey(t.cs[next(c)].vert, t.cs[prev(c)].vert))
		}
	}
	defer func() { t.present = nil }()
	done := 0
	for range attempts {
		if t.flip(int32(rng.IntN(corners))) {
			done++
		}
	}
	return done
}

// edges lists every edge once, from the corner with the smaller index.
func (t *triangulation) edges() [][2]int32 {
	out := make([][2]int32, 0, len(t.cs)/2)
	for c := range int32(len(t.cs)) {
		if c < t.cs[c].opp {
			out = append(out, [2]int32{t.cs[next(c)].vert, t.cs[prev(c)].vert})
		}
	}
	return out
}

// randomTriangulation builds the triangulation behind RandomTriangulation
// (n >= 3) and reports the number of successful flips.
func randomTriangulation(n int, rng *rand.Rand) (*triangulation, int) {
	t := newStackedTriangulation(n, rng)
	flips := t.randomFlips(flipsPerVertex*n, rng)
	return t, flips
}

const (
	streamMaximalPlanar = 0x6d61787074726931
	streamTree          = 0x72616e6474726565
	streamGnm           = 0x72616e64676e6d31
	streamRelabel       = 0x72656c6162656c31
	streamStrays        = 0x7374726179733031
)

// maximalPlanar returns RandomTriangulation(n, seed) together with the
// triangulation it came from and the relabelling: vertex v of the
// triangulation is vertex perm[v] of the graph. For n < 3 the triangulation
// is nil.
func maximalPlanar(n int, seed uint64, rng *rand.Rand) (Graph, *triangulation, []int32) {
	nn := clamp(n)
	name := fmt.Sprintf("tri-%d-seed%d", nn, seed)
	if nn > maxTriangulationVertices {
		return Graph{Name: name}, nil, nil
	}
	if nn < 3 {
		g := Complete(n)
		g.Name = name
		return g, nil, identity(int(nn))
	}
	t, _ := randomTriangulation(int(nn), rng)
	edges := t.edges()
	perm := relabelInPlace(int(nn), edges, rng)
	return Graph{N: int(nn), Edges: edges, Name: name}, t, perm
}

// RandomTriangulation returns a random maximal planar graph (a simple
// triangulation of the sphere) on n >= 3 vertices, with exactly 3n-6 edges.
// It is a random stacked triangulation mixed by 2n random edge-flip attempts
// (about 60% of which succeed), with its vertices relabelled by a random
// permutation and its edges shuffled and randomly oriented; see the package
// documentation. For n < 3 it returns
// K_n, and n above 2^28 yields the empty graph. The distribution is not
// uniform over triangulations.
func RandomTriangulation(n int, seed uint64) Graph {
	rng := rand.New(rand.NewPCG(seed, streamMaximalPlanar))
	g, _, _ := maximalPlanar(n, seed, rng)
	return g
}

// RandomPlanar returns the subgraph of RandomTriangulation(n, seed) that
// keeps each edge independently with probability keep, in the same order. It
// may be disconnected. keep <= 0 (or NaN) keeps no edge and keep >= 1 keeps
// all.
func RandomPlanar(n int, keep float64, seed uint64) Graph {
	rng := rand.New(rand.NewPCG(seed, streamMaximalPlanar))
	g, _, _ := maximalPlanar(n, seed, rng)
	g.Name = fmt.Sprintf("planar-%d-keep%g-seed%d", g.N, keep, seed)
	kept := g.Edges[:0]
	for _, e := range g.Edges {
		if rng.Float64() < keep {
			kept = append(kept, e)
		}
	}
	g.Edges = kept
	return g
}

// PlanarPlusExtra returns RandomTriangulation(n, seed) plus extra distinct
// random pairs that are not edges of it, the whole edge list shuffled and the
// new pairs randomly oriented. extra is capped at the number of non-edges,
// n(n-1)/2-(3n-6).
//
// For extra >= 1 and n >= 5 the result is never planar: a simple planar
// graph on n >= 3 vertices has at most 3n-6 edges (a consequence of Euler's
// formula), and the result has more. For n <= 4 the maximal planar graph is
// complete, so nothing can be added.
func PlanarPlusExtra(n, extra int, seed uint64) Graph {
	rng := rand.New(rand.NewPCG(seed, streamMaximalPlanar))
	g, t, perm := maximalPlanar(n, seed, rng)
	g.Name = fmt.Sprintf("%s-plus-%d", g.Name, clamp(extra))
	if t == nil || extra <= 0 {
		return g
	}
	nn := int64(g.N)
	nonEdges := nn*(nn-1)/2 - int64(len(g.Edges))
	k := min(int64(extra), nonEdges)
	if !fits(nn, int64(len(g.Edges))+k) {
		return Graph{Name: g.Name}
	}
	var added [][2]int32
	if 2*k <= nonEdges {
		added = sparseNonEdges(t, int(k), rng)
	} else {
		added = denseNonEdges(t, int(k), rng)
	}
	for _, e := range added {
		u, v := perm[e[0]], perm[e[1]]
		if rng.Uint64()&1 == 1 {
			u, v = v, u
		}
		g.Edges = append(g.Edges, [2]int32{u, v})
	}
	shuffle(g.Edges, rng)
	return g
}

// sparseNonEdges draws k distinct non-adjacent pairs of t by rejection; the
// caller guarantees that at least half of all non-edges remain unchosen, so
// each draw succeeds with probability bounded away from zero once n >= 5.
func sparseNonEdges(t *triangulation, k int, rng *rand.Rand) [][2]int32 {
	n := t.n
	chosen := make(map[uint64]struct{}, k)
	out := make([][2]int32, 0, k)
	for len(out) < k {
		u, v := int32(rng.IntN(n)), int32(rng.IntN(n))
		if u == v {
			continue
		}
		key := pairKey(u, v)
		if _, dup := chosen[key]; dup || t.adjacent(u, v) {
			continue
		}
		chosen[key] = struct{}{}
		out = append(out, [2]int32{u, v})
	}
	return out
}

// denseNonEdges lists all non-adjacent pairs of t and keeps a random k of
// them. The caller uses it only when k is at least half of the non-edges, so
// the quadratic enumeration is linear in the output.
func denseNonEdges(t *triangulation, k int, rng *rand.Rand) [][2]int32 {
	n := int32(t.n)
	mark := make([]int32, n)
	for i := range mark {
		mark[i] = -1
	}
	var all [][2]int32
	for u := range n {
		c := t.corner[u]
		for range t.deg[u] {
			mark[t.cs[next(c)].vert] = u
			c = prev(t.cs[prev(c)].opp)
		}
		for v := u + 1; v < n; v++ {
			if mark[v] != u {
				all = append(all, [2]int32{u, v})
			}
		}
	}
	// A partial Fisher-Yates shuffle puts a uniform k-subset first.
	for i := range k {
		j := i + rng.IntN(len(all)-i)
		all[i], all[j] = all[j], all[i]
	}
	return all[:k]
}

func pairKey(u, v int32) uint64 {
	if u > v {
		u, v = v, u
	}
	return uint64(u)<<32 | uint64(v)
}
