package graphgen

import (
	"maps"
	"math/rand/v2"
	"reflect"
	"slices"
	"testing"
)

// treeKey encodes a graph on at most 11 vertices as the bit set of its
// pairs, so equal edge sets give equal keys.
func treeKey(g Graph) uint64 {
	var k uint64
	for _, e := range g.Edges {
		u, v := min(e[0], e[1]), max(e[0], e[1])
		k |= 1 << (int(u)*g.N + int(v))
	}
	return k
}

// TestRandomTree checks that RandomTree returns trees (n-1 edges and
// connected; common practice) and that all labelled trees appear about
// equally often: Cayley's formula gives n^(n-2) labelled trees, 16 for
// n = 4 and 125 for n = 5 (A. Cayley, "A theorem on trees", Quart. J. Math.
// 23 (1889) 376-378; OEIS A000272).
func TestRandomTree(t *testing.T) {
	for _, n := range []int{0, 1, 2, 3, 10, 1000, 100000} {
		for seed := range uint64(5) {
			g := RandomTree(n, seed)
			checkSimple(t, g)
			if g.N != n || len(g.Edges) != max(n-1, 0) || !connected(g) {
				t.Fatalf("%s: %d vertices, %d edges, connected %v: not a tree on %d vertices", g.Name, g.N, len(g.Edges), connected(g), n)
			}
		}
	}
	for _, tt := range []struct {
		n, trees, draws int
	}{
		{4, 16, 1600},
		{5, 125, 12500},
	} {
		counts := make(map[uint64]int)
		for seed := range uint64(tt.draws) {
			counts[treeKey(RandomTree(tt.n, seed))]++
		}
		if len(counts) != tt.trees {
			t.Errorf("n=%d: %d distinct trees, want %d", tt.n, len(counts), tt.trees)
		}
		// 100 expected draws each; a standard deviation is about 10, and
		// the window allows five.
		for k, c := range counts {
			if c < 50 || c > 150 {
				t.Errorf("n=%d: tree %b drawn %d times of %d", tt.n, k, c, tt.draws)
			}
		}
	}
}

// TestRandomGnm checks counts, simplicity and uniformity: each of the
// C(N, m) edge sets, N = n(n-1)/2, is equally likely (Erdős and Rényi 1959).
func TestRandomGnm(t *testing.T) {
	tests := []struct {
		n, m, wantM int
	}{
		{0, 0, 0},
		{1, 5, 0},
		{2, 1, 1},
		{10, 0, 0},
		{10, 20, 20},
		{10, 40, 40},   // dense branch
		{10, 45, 45},   // complete
		{10, 1000, 45}, // capped
		{10, -3, 0},
		{-2, 3, 0},
		{1000, 5000, 5000},
		{100000, 300000, 300000},
	}
	for _, tt := range tests {
		g := RandomGnm(tt.n, tt.m, 7)
		checkSimple(t, g)
		if g.N != max(tt.n, 0) || len(g.Edges) != tt.wantM {
			t.Errorf("%s: (V,E) = (%d,%d), want (%d,%d)", g.Name, g.N, len(g.Edges), max(tt.n, 0), tt.wantM)
		}
	}
	// n = 4 has 6 pairs: m = 2 and 3 use rejection (C(6,2) = 15 and
	// C(6,3) = 20 sets), m = 5 lists the complement (6 sets).
	for _, tt := range []struct{ m, sets int }{{2, 15}, {3, 20}, {5, 6}} {
		draws := 100 * tt.sets
		counts := make(map[uint64]int)
		for seed := range uint64(draws) {
			counts[treeKey(RandomGnm(4, tt.m, seed))]++
		}
		if len(counts) != tt.sets || len(counts) != binomial(6, tt.m) {
			t.Errorf("m=%d: %d distinct edge sets, want %d", tt.m, len(counts), tt.sets)
		}
		for k, c := range counts {
			if c < 50 || c > 150 {
				t.Errorf("m=%d: edge set %b drawn %d times of %d", tt.m, k, c, draws)
			}
		}
	}
}

// TestRelabel checks that Relabel is an isomorphism given by its
// permutation, drops invalid edges and shuffles.
func TestRelabel(t *testing.T) {
	for _, g := range []Graph{Petersen(), Grid(7, 9), NestedTriangles(20), Star(30), Path(1), Graph{}} {
		for seed := range uint64(5) {
			r := Relabel(g, seed)
			checkSimple(t, r)
			edges := slices.Clone(g.Edges)
			perm := relabelInPlace(g.N, edges, rand.New(rand.NewPCG(seed, streamRelabel)))
			if !isPermutation(perm) || !slices.Equal(edges, r.Edges) {
				t.Fatalf("%s: Relabel does not follow its permutation", r.Name)
			}
			has := edgeSet(r)
			for _, e := range g.Edges {
				if !has[pairKey(perm[e[0]], perm[e[1]])] {
					t.Fatalf("%s: edge %v lost", r.Name, e)
				}
			}
			if r.N != g.N || len(r.Edges) != len(g.Edges) {
				t.Fatalf("%s: (V,E) = (%d,%d), want (%d,%d)", r.Name, r.N, len(r.Edges), g.N, len(g.Edges))
			}
			if d1, d2 := degrees(g), degrees(r); !slices.Equal(slices.Sorted(slices.Values(d1)), slices.Sorted(slices.Values(d2))) {
				t.Fatalf("%s: degree multiset changed", r.Name)
			}
		}
	}
	bad := Graph{N: 3, Edges: [][2]int32{{0, 1}, {1, 5}, {-1, 2}, {2, 0}}, Name: "bad"}
	if r := Relabel(bad, 1); len(r.Edges) != 2 {
		t.Errorf("kept %d edges of bad, want the 2 valid ones", len(r.Edges))
	}
	if r := Relabel(Path(1000), 3); slices.Equal(r.Edges, Path(1000).Edges) {
		t.Error("Relabel left a path unchanged")
	}
}

// TestDeterminism checks that every random generator repeats itself for a
// seed and differs between seeds.
func TestDeterminism(t *testing.T) {
	gens := map[string]func(seed uint64) Graph{
		"tree":    func(s uint64) Graph { return RandomTree(500, s) },
		"gnm":     func(s uint64) Graph { return RandomGnm(500, 2000, s) },
		"gnm-big": func(s uint64) Graph { return RandomGnm(60, 1700, s) },
		"tri":     func(s uint64) Graph { return RandomTriangulation(500, s) },
		"planar":  func(s uint64) Graph { return RandomPlanar(500, 0.7, s) },
		"plus":    func(s uint64) Graph { return PlanarPlusExtra(500, 30, s) },
		"relabel": func(s uint64) Graph { return Relabel(Grid(20, 20), s) },
	}
	for _, name := range slices.Sorted(maps.Keys(gens)) {
		gen := gens[name]
		for seed := range uint64(4) {
			a, b := gen(seed), gen(seed)
			if !reflect.DeepEqual(a, b) {
				t.Errorf("%s seed %d: two calls differ", name, seed)
			}
			if c := gen(seed + 1000); reflect.DeepEqual(a.Edges, c.Edges) {
				t.Errorf("%s: seeds %d and %d agree", name, seed, seed+1000)
			}
		}
	}
}
