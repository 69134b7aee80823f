package graphgen

import (
	"math"
	"slices"
	"testing"
)

// TestFamilySizes checks vertex and edge counts against the closed forms.
// Sources: path n-1, cycle n, star k, wheel 2k, K_n n(n-1)/2 and K_{m,n} mn
// edges are the textbook counts (R. Diestel, Graph Theory, 5th ed.,
// chapter 1; from memory); the r x c grid has r(c-1)+c(r-1) = 2rc-r-c edges
// and one diagonal per cell adds (r-1)(c-1) (common practice); the nested
// triangles counts follow from the construction in doc.go, and the maximal
// version must reach Euler's bound 3n-6 for maximal planar graphs (Diestel,
// Corollary 4.2.10; from memory).
func TestFamilySizes(t *testing.T) {
	tests := []struct {
		g    Graph
		n, m int
	}{
		{Path(0), 0, 0},
		{Path(1), 1, 0},
		{Path(7), 7, 6},
		{Path(-3), 0, 0},
		{Cycle(1), 1, 0},
		{Cycle(2), 2, 1},
		{Cycle(3), 3, 3},
		{Cycle(100), 100, 100},
		{Star(0), 1, 0},
		{Star(9), 10, 9},
		{Wheel(3), 4, 6},
		{Wheel(12), 13, 24},
		{Wheel(2), 3, 3},
		{Grid(1, 1), 1, 0},
		{Grid(1, 6), 6, 5},
		{Grid(5, 5), 25, 2*25 - 5 - 5},
		{Grid(7, 3), 21, 2*21 - 7 - 3},
		{Grid(0, 4), 0, 0},
		{TriangulatedGrid(5, 5), 25, 2*25 - 5 - 5 + 16},
		{TriangulatedGrid(3, 8), 24, 2*24 - 3 - 8 + 14},
		{TriangulatedGrid(1, 4), 4, 3},
		{Complete(0), 0, 0},
		{Complete(1), 1, 0},
		{Complete(5), 5, 10},
		{Complete(30), 30, 435},
		{CompleteBipartite(3, 3), 6, 9},
		{CompleteBipartite(2, 7), 9, 14},
		{CompleteBipartite(0, 4), 4, 0},
		{Petersen(), 10, 15},
		{NestedTriangles(1), 3, 3},
		{NestedTriangles(2), 6, 3*6 - 6},
		{NestedTriangles(50), 150, 3*150 - 6},
		{NestedTrianglesPlain(1), 3, 3},
		{NestedTrianglesPlain(50), 150, 150 + 3*49},
		{NestedTriangles(0), 0, 0},
		{DisjointUnion(), 0, 0},
		{DisjointUnion(Complete(4), Cycle(5), Petersen()), 19, 6 + 5 + 15},
	}
	for _, tt := range tests {
		t.Run(tt.g.Name, func(t *testing.T) {
			if tt.g.N != tt.n || len(tt.g.Edges) != tt.m {
				t.Errorf("got (V,E) = (%d,%d), want (%d,%d)", tt.g.N, len(tt.g.Edges), tt.n, tt.m)
			}
			checkSimple(t, tt.g)
		})
	}
}

// TestDegreeSequences checks the degree sequences that define each family
// (common practice).
func TestDegreeSequences(t *testing.T) {
	repeat := func(k, d int) []int { return slices.Repeat([]int{d}, k) }
	tests := []struct {
		g    Graph
		want []int
	}{
		{Path(5), []int{1, 2, 2, 2, 1}},
		{Cycle(6), repeat(6, 2)},
		{Star(4), []int{4, 1, 1, 1, 1}},
		{Wheel(5), append([]int{5}, repeat(5, 3)...)},
		{Complete(6), repeat(6, 5)},
		{CompleteBipartite(2, 3), []int{3, 3, 2, 2, 2}},
		{Petersen(), repeat(10, 3)},
		{Grid(2, 3), []int{2, 3, 2, 2, 3, 2}},
		{TriangulatedGrid(2, 3), []int{3, 4, 2, 2, 4, 3}},
		{NestedTrianglesPlain(3), []int{3, 3, 3, 4, 4, 4, 3, 3, 3}},
		{NestedTriangles(3), []int{4, 4, 4, 6, 6, 6, 4, 4, 4}},
	}
	for _, tt := range tests {
		t.Run(tt.g.Name, func(t *testing.T) {
			if got := degrees(tt.g); !slices.Equal(got, tt.want) {
				t.Errorf("degrees %v, want %v", got, tt.want)
			}
		})
	}
}

// TestPetersen checks the handbook invariants of the Petersen graph: 10
// vertices, 15 edges, 3-regular, girth 5, diameter 2, twelve 5-cycles and no
// Hamiltonian cycle (D. A. Holton and J. Sheehan, The Petersen Graph,
// Cambridge 1993; from memory).
func TestPetersen(t *testing.T) {
	g := Petersen()
	checkSimple(t, g)
	if g.N != 10 || len(g.Edges) != 15 {
		t.Fatalf("(V,E) = (%d,%d), want (10,15)", g.N, len(g.Edges))
	}
	for v, d := range degrees(g) {
		if d != 3 {
			t.Errorf("degree of %d is %d, want 3", v, d)
		}
	}
	if girth, diam := girthAndDiameter(g); girth != 5 || diam != 2 {
		t.Errorf("girth %d, diameter %d; want 5, 2", girth, diam)
	}
	if c := countCycles5(g); c != 12 {
		t.Errorf("%d 5-cycles, want 12", c)
	}
	if hamiltonian(g) {
		t.Error("found a Hamiltonian cycle")
	}
	// The same two checks on graphs where the answers are known to differ:
	// K5 has 4!/2 = 12 Hamiltonian 5-cycles, C5 one (common practice).
	if c := countCycles5(Complete(5)); c != 12 {
		t.Errorf("K5: %d 5-cycles, want 12", c)
	}
	if !hamiltonian(Cycle(10)) || !hamiltonian(Complete(6)) || hamiltonian(Path(4)) {
		t.Error("hamiltonian helper misjudges C10, K6 or P4")
	}
}

// countCycles5 counts 5-cycles by walking v0 v1 v2 v3 v4 v0 with v0 the
// smallest vertex; each cycle is found twice, once per direction.
func countCycles5(g Graph) int {
	adj := adjacency(g)
	has := edgeSet(g)
	walks := 0
	for v0 := range int32(g.N) {
		for _, v1 := range adj[v0] {
			for _, v2 := range adj[v1] {
				for _, v3 := range adj[v2] {
					for _, v4 := range adj[v3] {
						vs := []int32{v0, v1, v2, v3, v4}
						if slices.Min(vs) != v0 || !has[pairKey(v4, v0)] {
							continue
						}
						slices.Sort(vs)
						if len(slices.Compact(vs)) == 5 {
							walks++
						}
					}
				}
			}
		}
	}
	return walks / 2
}

// hamiltonian reports whether g has a Hamiltonian cycle, by dynamic
// programming over vertex subsets (R. Bellman, J. ACM 9 (1962) 61-63).
func hamiltonian(g Graph) bool {
	n := g.N
	if n < 3 {
		return false
	}
	has := edgeSet(g)
	// reach[s] has bit v set when a path from 0 visits exactly s and ends at v.
	reach := make([]uint32, 1<<n)
	reach[1] = 1
	for s := 1; s < 1<<n; s += 2 {
		for v := range n {
			if reach[s]>>v&1 == 0 {
				continue
			}
			for w := range n {
				if s>>w&1 == 0 && has[pairKey(int32(v), int32(w))] {
					reach[s|1<<w] |= 1 << w
				}
			}
		}
	}
	full := 1<<n - 1
	for v := 1; v < n; v++ {
		if reach[full]>>v&1 == 1 && has[pairKey(0, int32(v))] {
			return true
		}
	}
	return false
}

// TestPlaneDrawings proves planarity of the grid and nested-triangle
// families by an explicit crossing-free straight-line drawing, and with the
// edge count 3n-6 (Euler's bound) that NestedTriangles is maximal planar.
func TestPlaneDrawings(t *testing.T) {
	gridPos := func(rows, cols int) []pt {
		var pos []pt
		for r := range rows {
			for c := range cols {
				pos = append(pos, pt{int64(c), int64(r)})
			}
		}
		return pos
	}
	// Ring i is the triangle (0,2), (-2,-1), (2,-1) scaled by levels-i about
	// its centroid, the origin: consecutive rings bound trapezoids, which are
	// convex, so each diagonal lies inside its quadrilateral.
	nestedPos := func(levels int) []pt {
		base := []pt{{0, 2}, {-2, -1}, {2, -1}}
		var pos []pt
		for i := range levels {
			s := int64(levels - i)
			for _, b := range base {
				pos = append(pos, pt{b.x * s, b.y * s})
			}
		}
		return pos
	}
	tests := []struct {
		g   Graph
		pos []pt
	}{
		{Grid(6, 9), gridPos(6, 9)},
		{TriangulatedGrid(7, 5), gridPos(7, 5)},
		{NestedTrianglesPlain(12), nestedPos(12)},
		{NestedTriangles(12), nestedPos(12)},
		{NestedTriangles(2), nestedPos(2)},
	}
	for _, tt := range tests {
		t.Run(tt.g.Name, func(t *testing.T) {
			if err := planeDrawingError(tt.g, tt.pos); err != nil {
				t.Error(err)
			}
		})
	}
	// The checker must reject bad drawings: K4 with its vertices on a convex
	// quadrilateral crosses its diagonals, and a path folded back onto
	// itself overlaps.
	square := []pt{{0, 0}, {1, 0}, {1, 1}, {0, 1}}
	if planeDrawingError(Complete(4), square) == nil {
		t.Error("accepted K4 on a convex quadrilateral")
	}
	if planeDrawingError(Path(3), []pt{{0, 0}, {2, 0}, {1, 0}}) == nil {
		t.Error("accepted a folded path")
	}
	if planeDrawingError(Star(3), []pt{{0, 0}, {1, 0}, {2, 0}, {0, 1}}) == nil {
		t.Error("accepted a vertex on a star edge")
	}
}

// TestNestedTrianglesTriangles counts triangles: each of the L rings, plus
// two faces per quadrilateral (6 per band between rings), and no others
// since edges only join equal or consecutive rings; that is 7L-6, of which
// the 2n-4 = 6L-4 faces of the triangulation and the L-2 middle rings as
// separating triangles.
func TestNestedTrianglesTriangles(t *testing.T) {
	for _, l := range []int{1, 2, 3, 10} {
		g := NestedTriangles(l)
		if got, want := countTriangles(g), 7*l-6; got != want {
			t.Errorf("%s: %d triangles, want %d", g.Name, got, want)
		}
		if got, want := countTriangles(NestedTrianglesPlain(l)), l; got != want {
			t.Errorf("plain %d: %d triangles, want %d", l, got, want)
		}
	}
}

// TestDisjointUnion checks vertex shifting and the component structure.
func TestDisjointUnion(t *testing.T) {
	a, b := Cycle(4), Path(3)
	u := DisjointUnion(a, b)
	want := [][2]int32{{0, 1}, {1, 2}, {2, 3}, {3, 0}, {4, 5}, {5, 6}}
	if u.N != 7 || !slices.Equal(u.Edges, want) {
		t.Errorf("union = %d %v, want 7 %v", u.N, u.Edges, want)
	}
	if u.Name != "cycle-4+path-3" {
		t.Errorf("name %q", u.Name)
	}
	if connected(u) {
		t.Error("union of two graphs is connected")
	}
}

// TestOversized checks that requests too large to represent return the
// empty graph instead of panicking or allocating.
func TestOversized(t *testing.T) {
	huge := math.MaxInt32 + 1
	tests := []Graph{
		Path(huge), Cycle(huge), Star(huge), Wheel(huge),
		Grid(1<<20, 1<<20), TriangulatedGrid(huge, huge),
		Complete(1 << 20), CompleteBipartite(1<<20, 1<<20),
		NestedTriangles(huge), NestedTrianglesPlain(1 << 30),
		RandomTree(huge, 1), RandomGnm(huge, 3, 1), RandomGnm(1<<20, 1<<40, 1),
		RandomTriangulation(1<<29, 1), RandomPlanar(1<<29, 0.5, 1),
		PlanarPlusExtra(1<<29, 1, 1), PlanarPlusExtra(1<<17, 1<<40, 1),
		Relabel(Graph{N: huge}, 1),
		DisjointUnion(Graph{N: math.MaxInt32}, Path(2)),
	}
	for _, g := range tests {
		if g.N != 0 || len(g.Edges) != 0 || g.Name == "" {
			t.Errorf("%q: got %d vertices, %d edges; want the named empty graph", g.Name, g.N, len(g.Edges))
		}
	}
}
