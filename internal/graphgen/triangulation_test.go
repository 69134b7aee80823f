package graphgen

import (
	"fmt"
	"math/rand/v2"
	"slices"
	"testing"
)

// sphereError checks that tr is a triangulation of the sphere with n
// vertices and returns nil exactly then. The checks: 2n-4 triangles, each
// with three distinct vertices; opp an involution pairing corners of
// different triangles across the same edge traversed in opposite
// directions (so the surface is closed and oriented); every unordered edge
// in exactly two triangles, 3n-6 edges in all; the corners at each vertex
// form a single cycle under rotation (the link of every vertex is one
// circle, so the surface is a manifold); and the stored degrees and corners
// agree. With the Euler characteristic n-(3n-6)+(2n-4) = 2 and a connected
// graph (checked by the caller), the classification of closed surfaces
// makes it a sphere (common practice), i.e. a simple plane triangulation.
func sphereError(tr *triangulation, n int) error {
	faces := 2*n - 4
	if len(tr.cs) != 3*faces {
		return fmt.Errorf("%d corners, want %d", len(tr.cs), 3*faces)
	}
	count := make([]int32, n)
	for c, rec := range tr.cs {
		v := rec.vert
		if v < 0 || int(v) >= n {
			return fmt.Errorf("corner %d has vertex %d", c, v)
		}
		count[v]++
	}
	edgeUse := make(map[uint64]int, 3*n)
	for f := range int32(faces) {
		a, b, c := tr.cs[3*f].vert, tr.cs[3*f+1].vert, tr.cs[3*f+2].vert
		if a == b || b == c || a == c {
			return fmt.Errorf("triangle %d = (%d,%d,%d) is degenerate", f, a, b, c)
		}
		edgeUse[pairKey(a, b)]++
		edgeUse[pairKey(b, c)]++
		edgeUse[pairKey(c, a)]++
	}
	for k, uses := range edgeUse {
		if uses != 2 {
			return fmt.Errorf("edge %d-%d lies in %d triangles", k>>32, uint32(k), uses)
		}
	}
	if len(edgeUse) != 3*n-6 {
		return fmt.Errorf("%d edges, want %d", len(edgeUse), 3*n-6)
	}
	for c := range int32(len(tr.cs)) {
		o := tr.cs[c].opp
		if o < 0 || int(o) >= len(tr.cs) || tr.cs[o].opp != c || o/3 == c/3 {
			return fmt.Errorf("corner %d: opp %d is not a partner", c, o)
		}
		if tr.cs[next(c)].vert != tr.cs[prev(o)].vert || tr.cs[prev(c)].vert != tr.cs[next(o)].vert {
			return fmt.Errorf("corners %d and %d do not face the same edge in opposite directions", c, o)
		}
	}
	for v := range int32(n) {
		if tr.deg[v] != count[v] {
			return fmt.Errorf("vertex %d: degree %d stored, %d corners", v, tr.deg[v], count[v])
		}
		start := tr.corner[v]
		if tr.cs[start].vert != v {
			return fmt.Errorf("vertex %d: stored corner %d holds %d", v, start, tr.cs[start].vert)
		}
		k, steps := start, int32(0)
		for {
			if tr.cs[k].vert != v {
				return fmt.Errorf("vertex %d: rotation reached corner %d of %d", v, k, tr.cs[k].vert)
			}
			steps++
			k = prev(tr.cs[prev(k)].opp)
			if k == start || steps > count[v] {
				break
			}
		}
		if k != start || steps != count[v] {
			return fmt.Errorf("vertex %d: link is not one cycle through its %d corners", v, count[v])
		}
	}
	return nil
}

// TestStackedAndFlippedTriangulations checks the corner table after the
// insertion phase alone, after the standard flips, and after many more.
func TestStackedAndFlippedTriangulations(t *testing.T) {
	for _, n := range []int{3, 4, 5, 6, 7, 10, 50, 300} {
		for seed := range uint64(10) {
			rng := rand.New(rand.NewPCG(seed, 1))
			tr := newStackedTriangulation(n, rng)
			if err := sphereError(tr, n); err != nil {
				t.Fatalf("n=%d seed=%d stacked: %v", n, seed, err)
			}
			tr.randomFlips(2*n, rng)
			if err := sphereError(tr, n); err != nil {
				t.Fatalf("n=%d seed=%d after 2n flips: %v", n, seed, err)
			}
			tr.randomFlips(50*n, rng)
			if err := sphereError(tr, n); err != nil {
				t.Fatalf("n=%d seed=%d after 52n flips: %v", n, seed, err)
			}
			g := Graph{N: n, Edges: tr.edges()}
			checkSimple(t, g)
			if !connected(g) {
				t.Fatalf("n=%d seed=%d: disconnected", n, seed)
			}
		}
	}
}

// TestSphereErrorRejects makes sure sphereError can fail: a corrupted
// partner, a pinched link and a wrong degree are each reported.
func TestSphereErrorRejects(t *testing.T) {
	fresh := func() *triangulation {
		return newStackedTriangulation(8, rand.New(rand.NewPCG(3, 3)))
	}
	tr := fresh()
	tr.cs[0].opp, tr.cs[1].opp = tr.cs[1].opp, tr.cs[0].opp
	if sphereError(tr, 8) == nil {
		t.Error("accepted swapped partners")
	}
	tr = fresh()
	tr.cs[0].vert = tr.cs[1].vert
	if sphereError(tr, 8) == nil {
		t.Error("accepted a degenerate triangle")
	}
	tr = fresh()
	tr.deg[5]++
	if sphereError(tr, 8) == nil {
		t.Error("accepted a wrong degree")
	}
}

// TestRandomTriangulation checks the published graph: 3n-6 simple edges
// (Euler's bound for maximal planar graphs; Diestel, Graph Theory,
// Corollary 4.2.10, from memory), connected, minimum degree 3 for n >= 4
// (a triangulation with n >= 4 is 3-connected; Whitney 1931, from memory),
// and exactly the edge set of its internal triangulation (checked by
// sphereError) under the returned relabelling.
func TestRandomTriangulation(t *testing.T) {
	for _, n := range []int{3, 4, 5, 6, 8, 13, 100, 1000, 20000} {
		seeds := uint64(20)
		if n >= 1000 {
			seeds = 3
		}
		for seed := range seeds {
			rng := rand.New(rand.NewPCG(seed, streamMaximalPlanar))
			g, tr, perm := maximalPlanar(n, seed, rng)
			if !slices.Equal(g.Edges, RandomTriangulation(n, seed).Edges) {
				t.Fatalf("n=%d seed=%d: internal and exported results differ", n, seed)
			}
			checkSimple(t, g)
			if g.N != n || len(g.Edges) != 3*n-6 {
				t.Fatalf("n=%d seed=%d: (V,E) = (%d,%d), want (%d,%d)", n, seed, g.N, len(g.Edges), n, 3*n-6)
			}
			if !connected(g) {
				t.Fatalf("n=%d seed=%d: disconnected", n, seed)
			}
			if n >= 4 && slices.Min(degrees(g)) < 3 {
				t.Fatalf("n=%d seed=%d: minimum degree %d", n, seed, slices.Min(degrees(g)))
			}
			if err := sphereError(tr, n); err != nil {
				t.Fatalf("n=%d seed=%d: %v", n, seed, err)
			}
			if !isPermutation(perm) {
				t.Fatalf("n=%d seed=%d: relabelling is not a permutation", n, seed)
			}
			want := make(map[uint64]bool, len(g.Edges))
			for _, e := range tr.edges() {
				want[pairKey(perm[e[0]], perm[e[1]])] = true
			}
			for _, e := range g.Edges {
				if !want[pairKey(e[0], e[1])] {
					t.Fatalf("n=%d seed=%d: edge %v not in the triangulation", n, seed, e)
				}
			}
		}
	}
}

func isPermutation(p []int32) bool {
	seen := make([]bool, len(p))
	for _, v := range p {
		if v < 0 || int(v) >= len(p) || seen[v] {
			return false
		}
		seen[v] = true
	}
	return true
}

// TestRandomTriangulationMixing checks that flips happen and that the
// output hides the construction: labels permuted, edges reordered and about
// half of them reversed.
func TestRandomTriangulationMixing(t *testing.T) {
	const n = 2000
	_, flips := randomTriangulation(n, rand.New(rand.NewPCG(11, 0)))
	// A broken adjacency test would refuse every flip.
	if flips < n/4 {
		t.Errorf("%d successful flips out of %d attempts", flips, flipsPerVertex*n)
	}
	rng := rand.New(rand.NewPCG(11, streamMaximalPlanar))
	g, tr, perm := maximalPlanar(n, 11, rng)
	fixed := 0
	for v, p := range perm {
		if int(p) == v {
			fixed++
		}
	}
	// A uniform permutation has one fixed point on average (common
	// practice); 20 would be a near-identity.
	if fixed > 20 {
		t.Errorf("relabelling fixes %d of %d vertices", fixed, n)
	}
	same, forward := 0, 0
	for i, e := range tr.edges() {
		if pairKey(perm[e[0]], perm[e[1]]) == pairKey(g.Edges[i][0], g.Edges[i][1]) {
			same++
		}
		if g.Edges[i][0] < g.Edges[i][1] {
			forward++
		}
	}
	if same > 20 {
		t.Errorf("%d of %d edges keep their construction position", same, len(g.Edges))
	}
	if m := len(g.Edges); forward < 2*m/5 || forward > 3*m/5 {
		t.Errorf("%d of %d edges run from the smaller label", forward, m)
	}
}

// TestRandomPlanar checks that RandomPlanar keeps a subsequence of
// RandomTriangulation with about keep of its edges.
func TestRandomPlanar(t *testing.T) {
	const n = 1000
	for _, tt := range []struct {
		keep     float64
		min, max int
	}{
		{0, 0, 0},
		{-1, 0, 0},
		{1, 3*n - 6, 3*n - 6},
		{2, 3*n - 6, 3*n - 6},
		// Binomial(2994, 0.5): mean 1497, standard deviation 27.4; the
		// window is about five deviations wide on each side.
		{0.5, 1360, 1634},
		{0.1, 220, 380},
	} {
		for seed := range uint64(5) {
			g := RandomPlanar(n, tt.keep, seed)
			full := RandomTriangulation(n, seed)
			checkSimple(t, g)
			if g.N != n || len(g.Edges) < tt.min || len(g.Edges) > tt.max {
				t.Errorf("%s: %d vertices, %d edges; want %d vertices, %d..%d edges", g.Name, g.N, len(g.Edges), n, tt.min, tt.max)
			}
			if !isSubsequence(g.Edges, full.Edges) {
				t.Errorf("%s: not a subsequence of %s", g.Name, full.Name)
			}
		}
	}
}

func isSubsequence(sub, seq [][2]int32) bool {
	i := 0
	for _, e := range seq {
		if i < len(sub) && sub[i] == e {
			i++
		}
	}
	return i == len(sub)
}

// TestPlanarPlusExtra checks that the result is RandomTriangulation plus
// exactly the requested number of distinct non-edges, in both the sparse
// and the dense selection, and that it is K_n when everything is added.
func TestPlanarPlusExtra(t *testing.T) {
	tests := []struct {
		n, extra, wantExtra int
	}{
		{5, 1, 1},        // K5: the one non-edge of a 5-vertex triangulation
		{5, 7, 1},        // capped
		{4, 3, 0},        // K4 is complete
		{8, 100, 10},     // capped: 28-18 non-edges, dense selection
		{10, 20, 20},     // 21 non-edges, dense selection
		{10, 5, 5},       // sparse selection
		{300, 50, 50},    // sparse
		{60, 1500, 1500}, // 1596 non-edges, dense
		{50, 0, 0},
		{50, -4, 0},
	}
	for _, tt := range tests {
		for seed := range uint64(5) {
			g := PlanarPlusExtra(tt.n, tt.extra, seed)
			base := RandomTriangulation(tt.n, seed)
			checkSimple(t, g)
			if g.N != tt.n || len(g.Edges) != len(base.Edges)+tt.wantExtra {
				t.Fatalf("%s: (V,E) = (%d,%d), want (%d,%d)", g.Name, g.N, len(g.Edges), tt.n, len(base.Edges)+tt.wantExtra)
			}
			has := edgeSet(g)
			for _, e := range base.Edges {
				if !has[pairKey(e[0], e[1])] {
					t.Fatalf("%s: lost planar edge %v", g.Name, e)
				}
			}
			// More than 3n-6 edges on n >= 3 vertices: not planar by
			// Euler's bound (Diestel, Corollary 4.2.10; from memory).
			if tt.wantExtra > 0 && len(g.Edges) <= 3*tt.n-6 {
				t.Fatalf("%s: %d edges do not exceed 3n-6", g.Name, len(g.Edges))
			}
		}
	}
	if g := PlanarPlusExtra(9, 1000, 2); len(g.Edges) != 36 {
		t.Errorf("%s: %d edges, want K9's 36", g.Name, len(g.Edges))
	}
}

// TestRandomTriangulationMillion runs the full check once at the size the
// project's benchmarks use.
func TestRandomTriangulationMillion(t *testing.T) {
	if testing.Short() {
		t.Skip("n = 10^6 takes a few seconds")
	}
	const n = 1000000
	rng := rand.New(rand.NewPCG(5, streamMaximalPlanar))
	g, tr, _ := maximalPlanar(n, 5, rng)
	checkSimple(t, g)
	if len(g.Edges) != 3*n-6 || !connected(g) || slices.Min(degrees(g)) < 3 {
		t.Fatalf("%d edges, connected %v, minimum degree %d", len(g.Edges), connected(g), slices.Min(degrees(g)))
	}
	if err := sphereError(tr, n); err != nil {
		t.Fatal(err)
	}
}
