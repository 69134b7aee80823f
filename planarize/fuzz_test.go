package planarize_test

import (
	"math/bits"
	"testing"

	"github.com/gridwood/gridwood/planarize"
)

// maxFuzzVertices bounds the graphs of FuzzEmbed so that the brute-force
// planarity test below stays cheap: it enumerates set partitions, of which
// 9 vertices have Bell(9) = 21147.
const maxFuzzVertices = 9

// decodeGraph turns fuzz bytes into a graph: the first byte gives n in
// 0..maxFuzzVertices, each following pair of bytes an edge (u mod n,
// v mod n). Loops and repeats are left in for Simplify to remove.
func decodeGraph(data []byte) (int, [][2]int32) {
	if len(data) == 0 {
		return 0, nil
	}
	n := int(data[0]) % (maxFuzzVertices + 1)
	var edges [][2]int32
	if n == 0 {
		return 0, nil
	}
	for i := 1; i+1 < len(data); i += 2 {
		edges = append(edges, [2]int32{int32(data[i]) % int32(n), int32(data[i+1]) % int32(n)})
	}
	return n, edges
}

// noKuratowskiMinor reports whether the simple graph on n <= 16 vertices,
// given by adjacency bit masks, has neither K5 nor K3,3 as a minor, which
// by Wagner's theorem (K. Wagner, "Über eine Eigenschaft der ebenen
// Komplexe", Math. Ann. 114 (1937)) means it is planar.
//
// A minor model of a graph H is a family of disjoint connected vertex sets
// (branch sets), one per vertex of H, with an edge between the sets of
// every edge of H. Any model extends to a partition of all vertices into
// connected blocks (add the components of the unused vertices as blocks),
// so G has an H minor iff some partition of V(G) into connected blocks has
// a quotient graph containing H as a subgraph. The test enumerates all set
// partitions as restricted growth strings and looks for K5 (five pairwise
// adjacent blocks) and K3,3 (three blocks with three common neighbours).
func noKuratowskiMinor(n int, adj []uint16) bool {
	if n < 5 {
		return true
	}
	block := make([]int, n)
	var rec func(i, blocks int) bool // true when a minor is found
	rec = func(i, blocks int) bool {
		if i == n {
			return blocks >= 5 && quotientHasK5orK33(n, adj, block, blocks)
		}
		for b := 0; b <= blocks && b < n; b++ {
			block[i] = b
			nb := blocks
			if b == blocks {
				nb++
			}
			if rec(i+1, nb) {
				return true
			}
		}
		return false
	}
	return !rec(0, 0)
}

func quotientHasK5orK33(n int, adj []uint16, block []int, blocks int) bool {
	members := make([]uint16, blocks)
	for v := range n {
		members[block[v]] |= 1 << v
	}
	// Every block must be connected.
	for _, m := range members {
		start := m & -m
		reach := start
		for {
			next := reach
			for r := reach; r != 0; r &= r - 1 {
				next |= adj[bits.TrailingZeros16(r)] & m
			}
			if next == reach {
				break
			}
			reach = next
		}
		if reach != m {
			return false
		}
	}
	q := make([]uint16, blocks)
	for v := range n {
		for r := adj[v]; r != 0; r &= r - 1 {
			if w := bits.TrailingZeros16(r); block[w] != block[v] {
				q[block[v]] |= 1 << block[w]
			}
		}
	}
	// K3,3: three blocks A with at least three common neighbours outside A.
	for a := 0; a < blocks; a++ {
		for b := a + 1; b < blocks; b++ {
			for c := b + 1; c < blocks; c++ {
				common := q[a] & q[b] & q[c] &^ (1<<a | 1<<b | 1<<c)
				if bits.OnesCount16(common) >= 3 {
					return true
				}
			}
		}
	}
	// K5: five pairwise adjacent blocks.
	var clique func(cand uint16, size int) bool
	clique = func(cand uint16, size int) bool {
		if size == 5 {
			return true
		}
		for r := cand; r != 0; r &= r - 1 {
			v := bits.TrailingZeros16(r)
			if clique(r&q[v]&^(1<<(v+1)-1), size+1) {
				return true
			}
		}
		return false
	}
	return clique(1<<blocks-1, 0)
}

func adjacency(n int, edges [][2]int32) []uint16 {
	adj := make([]uint16, n)
	for _, e := range edges {
		adj[e[0]] |= 1 << e[1]
		adj[e[1]] |= 1 << e[0]
	}
	return adj
}

// TestWagnerBruteForceMatchesOEIS checks the brute-force test against the
// number of labelled planar graphs on n vertices, OEIS A066537: 1, 2, 8,
// 64, 1023, 32071 for n = 1..6. On 5 vertices only K5 itself is not planar.
func TestWagnerBruteForceMatchesOEIS(t *testing.T) {
	want := []int{1, 2, 8, 64, 1023, 32071} // OEIS A066537, n = 1..6
	for n := 1; n <= 6; n++ {
		var pairs [][2]int32
		for u := range n {
			for v := u + 1; v < n; v++ {
				pairs = append(pairs, [2]int32{int32(u), int32(v)})
			}
		}
		planar, lr := 0, 0
		for mask := range 1 << len(pairs) {
			var edges [][2]int32
			for i, p := range pairs {
				if mask>>i&1 == 1 {
					edges = append(edges, p)
				}
			}
			brute := noKuratowskiMinor(n, adjacency(n, edges))
			if brute {
				planar++
			}
			if planarize.IsPlanar(n, edges) {
				lr++
			}
			if brute != planarize.IsPlanar(n, edges) {
				t.Errorf("n=%d %v: brute force %v, IsPlanar %v", n, edges, brute, !brute)
			}
		}
		if planar != want[n-1] {
			t.Errorf("n=%d: brute force counts %d planar graphs, OEIS A066537 says %d", n, planar, want[n-1])
		}
		if lr != want[n-1] {
			t.Errorf("n=%d: IsPlanar counts %d planar graphs, OEIS A066537 says %d", n, lr, want[n-1])
		}
	}
}

// TestWagnerBruteForceKnownGraphs pins the brute force on graphs of 7 to 9
// vertices whose planarity is textbook (common practice): the Wagner graph
// V8 (has a K3,3 minor), K3,3 subdivided, K5 plus a pendant path, the cube,
// the wheel W8 and a maximal planar graph on 9 vertices.
func TestWagnerBruteForceKnownGraphs(t *testing.T) {
	cycle := func(n int) [][2]int32 {
		var e [][2]int32
		for i := range n {
			e = append(e, [2]int32{int32(i), int32((i + 1) % n)})
		}
		return e
	}
	v8 := append(cycle(8), [2]int32{0, 4}, [2]int32{1, 5}, [2]int32{2, 6}, [2]int32{3, 7})
	k33sub := [][2]int32{{0, 3}, {0, 4}, {0, 6}, {6, 5}, {1, 3}, {1, 4}, {1, 5}, {2, 3}, {2, 7}, {7, 4}, {2, 5}}
	k5path := [][2]int32{{0, 1}, {0, 2}, {0, 3}, {0, 4}, {1, 2}, {1, 3}, {1, 4}, {2, 3}, {2, 4}, {3, 4}, {4, 5}, {5, 6}}
	cube := [][2]int32{{0, 1}, {1, 2}, {2, 3}, {3, 0}, {4, 5}, {5, 6}, {6, 7}, {7, 4}, {0, 4}, {1, 5}, {2, 6}, {3, 7}}
	wheel := cycle(8)
	for i := range 8 {
		wheel = append(wheel, [2]int32{8, int32(i)})
	}
	// A stacked triangulation: start with triangle 0 1 2, put each new
	// vertex into a face of the previous one; 3n-6 = 21 edges for n = 9.
	stacked := [][2]int32{{0, 1}, {1, 2}, {2, 0}}
	faces := [][3]int32{{0, 1, 2}}
	for v := int32(3); v < 9; v++ {
		f := faces[len(faces)-1]
		stacked = append(stacked, [2]int32{v, f[0]}, [2]int32{v, f[1]}, [2]int32{v, f[2]})
		faces = append(faces, [3]int32{f[0], f[1], v}, [3]int32{f[1], f[2], v}, [3]int32{f[0], f[2], v})
	}
	if len(stacked) != 21 {
		t.Fatalf("stacked triangulation has %d edges, want 3n-6 = 21", len(stacked))
	}
	for _, tc := range []struct {
		name   string
		n      int
		edges  [][2]int32
		planar bool
	}{
		{"Wagner V8", 8, v8, false},
		{"K3,3 subdivided", 8, k33sub, false},
		{"K5 with a pendant path", 7, k5path, false},
		{"cube", 8, cube, true},
		{"wheel W8", 9, wheel, true},
		{"stacked triangulation", 9, stacked, true},
	} {
		if got := noKuratowskiMinor(tc.n, adjacency(tc.n, tc.edges)); got != tc.planar {
			t.Errorf("%s: brute force says planar=%v", tc.name, got)
		}
	}
}

// FuzzEmbed checks the planarity test and embedder on small graphs against
// the brute force: IsPlanar and Embed agree with it, and a planar verdict
// comes with a valid rotation system (every dart of a vertex in one cycle
// of Next, Prev its inverse) whose faces satisfy Euler's formula
// V - E + F = 1 + C counted per component, i.e. Faces() = 2C - V + E
// (SOURCES.md); the faces are traced here independently of Faces().
func FuzzEmbed(f *testing.F) {
	f.Add([]byte{5, 0, 1, 0, 2, 0, 3, 0, 4, 1, 2, 1, 3, 1, 4, 2, 3, 2, 4, 3, 4})             // K5
	f.Add([]byte{6, 0, 3, 0, 4, 0, 5, 1, 3, 1, 4, 1, 5, 2, 3, 2, 4, 2, 5})                   // K3,3
	f.Add([]byte{6, 0, 1, 0, 2, 0, 3, 0, 4, 1, 2, 1, 3, 1, 5, 2, 4, 2, 5, 3, 4, 3, 5, 4, 5}) // octahedron
	f.Add([]byte{8, 0, 1, 1, 2, 2, 3, 3, 4, 4, 5, 5, 6, 6, 7, 7, 0, 0, 4, 1, 5, 2, 6, 3, 7}) // Wagner V8
	f.Add([]byte{9, 0, 0, 1, 1, 0, 1, 1, 0, 3, 4})                                           // loops, repeats, isolated vertices
	f.Add([]byte{})
	f.Fuzz(func(t *testing.T, data []byte) {
		n, raw := decodeGraph(data)
		edges, _ := planarize.Simplify(n, raw)
		want := noKuratowskiMinor(n, adjacency(n, edges))
		if got := planarize.IsPlanar(n, edges); got != want {
			t.Fatalf("n=%d %v: IsPlanar %v, brute force %v", n, edges, got, want)
		}
		emb, ok := planarize.Embed(n, edges)
		if ok != want {
			t.Fatalf("n=%d %v: Embed %v, brute force %v", n, edges, ok, want)
		}
		if !ok {
			if emb != nil {
				t.Fatalf("Embed returned an embedding with false")
			}
			return
		}
		checkRotationSystem(t, n, edges, emb)
	})
}

func checkRotationSystem(t *testing.T, n int, edges [][2]int32, emb *planarize.Embedding) {
	t.Helper()
	if emb.N() != n || emb.M() != len(edges) {
		t.Fatalf("embedding has %d vertices and %d edges, want %d and %d", emb.N(), emb.M(), n, len(edges))
	}
	for i, e := range edges {
		if emb.Edge(i) != e {
			t.Fatalf("edge %d is %v, want %v", i, emb.Edge(i), e)
		}
	}
	darts := int32(2 * len(edges))
	for d := range darts {
		if emb.Tail(d) != edges[d/2][d%2] || emb.Head(d) != edges[d/2][1-d%2] {
			t.Fatalf("dart %d: tail %d head %d, edge %v", d, emb.Tail(d), emb.Head(d), edges[d/2])
		}
		nx := emb.Next(d)
		if nx < 0 || nx >= darts || emb.Tail(nx) != emb.Tail(d) || emb.Prev(nx) != d {
			t.Fatalf("dart %d: Next %d is not a dart at the same vertex with Prev back", d, nx)
		}
	}
	deg := make([]int, n)
	for _, e := range edges {
		deg[e[0]]++
		deg[e[1]]++
	}
	for v := range int32(n) {
		if emb.Degree(v) != deg[v] {
			t.Fatalf("vertex %d: Degree %d, want %d", v, emb.Degree(v), deg[v])
		}
		first := emb.First(v)
		if deg[v] == 0 {
			if first != -1 {
				t.Fatalf("isolated vertex %d: First %d", v, first)
			}
			continue
		}
		// The rotation at v is one cycle through all deg[v] darts.
		seen := map[int32]bool{}
		d := first
		for !seen[d] {
			seen[d] = true
			d = emb.Next(d)
		}
		if d != first || len(seen) != deg[v] {
			t.Fatalf("vertex %d: rotation is not one cycle of its %d darts", v, deg[v])
		}
	}
	// Faces: the dart after u->v on its face is the one before v->u in the
	// counter-clockwise rotation at v.
	seen := make([]bool, darts)
	faces := 0
	for d := range darts {
		if seen[d] {
			continue
		}
		faces++
		for x := d; !seen[x]; x = emb.Prev(x ^ 1) {
			seen[x] = true
		}
	}
	// Components by union-find, isolated vertices included.
	parent := make([]int32, n)
	for v := range parent {
		parent[v] = int32(v)
	}
	var find func(int32) int32
	find = func(x int32) int32 {
		for parent[x] != x {
			parent[x] = parent[parent[x]]
			x = parent[x]
		}
		return x
	}
	comps := n
	for _, e := range edges {
		if a, b := find(e[0]), find(e[1]); a != b {
			parent[a] = b
			comps--
		}
	}
	isolated := 0
	for v := range n {
		if deg[v] == 0 {
			isolated++
		}
	}
	// Each isolated vertex is a component with one face of its own.
	if want := 2*comps - n + len(edges); faces+isolated != want {
		t.Fatalf("%d faces traced (+%d isolated), Euler wants %d for V=%d E=%d C=%d: %v", faces, isolated, want, n, len(edges), comps, edges)
	}
	if emb.Faces() != faces+isolated || emb.Components() != comps {
		t.Fatalf("Faces() %d Components() %d, traced %d and counted %d", emb.Faces(), emb.Components(), faces+isolated, comps)
	}
}
