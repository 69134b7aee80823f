package convex

import (
	"errors"
	"fmt"
	"math/rand/v2"
	"slices"
	"strings"
	"testing"

	"github.com/gridwood/gridwood/internal/graphgen"
	"github.com/gridwood/gridwood/place/geomcheck"
	"github.com/gridwood/gridwood/planarize"
)

// This file tests Draw. Every drawing goes through the independent
// exact checker place/geomcheck and through the exact convexity check
// below, which walks the faces of the embedding and looks only at the
// coordinates. Whether a graph is 3-connected is decided here by brute
// force, never by the code under test.

// cvxFaceOf returns the face of every dart (the face on its left) and the
// number of faces.
func cvxFaceOf(emb *planarize.Embedding) ([]int, int) {
	face := make([]int, 2*emb.M())
	for d := range face {
		face[d] = -1
	}
	nf := 0
	for d := range face {
		if face[d] >= 0 {
			continue
		}
		for x := int32(d); face[x] < 0; x = emb.FaceNext(x) {
			face[x] = nf
		}
		nf++
	}
	return face, nf
}

// cvxCheck judges one convex drawing: inside its grid, which is at most
// (f-1) x (f-1) (Felsner 2001); plane by geomcheck (First(pts,
// edges, 1) is empty exactly when the drawing is clean, geomcheck doc);
// every inner face a convex polygon walked counter-clockwise and the outer
// face a convex polygon walked clockwise (the rotation convention of
// planarize.Embedding); and the outer face the triangle a1 = Head(outer) at
// (f-1, 0), a2 = Tail(outer) at (0, f-1) and a third vertex at (0, 0), the
// face counts (all, 0, 0), (0, all, 0), (0, 0, all) of the three
// suspension vertices in Felsner's construction.
func cvxCheck(tb testing.TB, name string, emb *planarize.Embedding, outer int32, x, y []int64, w, h int64) bool {
	tb.Helper()
	n := emb.N()
	if len(x) != n || len(y) != n {
		tb.Errorf("%s: %d, %d coordinates for %d vertices", name, len(x), len(y), n)
		return false
	}
	faces := emb.Faces()
	if w > int64(faces-1) || h > int64(faces-1) || w < 0 || h < 0 {
		tb.Errorf("%s: grid %d x %d exceeds (f-1) x (f-1) = %d x %d", name, w, h, faces-1, faces-1)
		return false
	}
	pts := make([]geomcheck.Point, n)
	for v := range n {
		if x[v] < 0 || x[v] > w || y[v] < 0 || y[v] > h {
			tb.Errorf("%s: vertex %d at (%d, %d) outside [0,%d]x[0,%d]", name, v, x[v], y[v], w, h)
			return false
		}
		pts[v] = geomcheck.Point{X: x[v], Y: y[v]}
	}
	probs, err := geomcheck.First(pts, emb.Edges(), 1)
	if err != nil || len(probs) > 0 {
		tb.Errorf("%s: geomcheck: %v %v", name, probs, err)
		return false
	}
	if msg := cvxConvexity(emb, outer, x, y); msg != "" {
		tb.Errorf("%s: %s", name, msg)
		return false
	}
	a1, a2 := emb.Head(outer), emb.Tail(outer)
	all := int64(faces - 1)
	if x[a1] != all || y[a1] != 0 || x[a2] != 0 || y[a2] != all {
		tb.Errorf("%s: a1 = %d at (%d, %d), a2 = %d at (%d, %d); want (%d, 0) and (0, %d)",
			name, a1, x[a1], y[a1], a2, x[a2], y[a2], all, all)
		return false
	}
	return true
}

// cvxConvexity returns "" if every face is convex as cvxCheck describes,
// else what is wrong. Turns are integer cross products; a zero turn must go
// straight on (positive dot product), not fold back.
func cvxConvexity(emb *planarize.Embedding, outer int32, x, y []int64) string {
	face, nf := cvxFaceOf(emb)
	start := make([]int32, nf)
	for d := len(face) - 1; d >= 0; d-- {
		start[face[d]] = int32(d)
	}
	for f, d0 := range start {
		sign := int64(1)
		if f == face[outer] {
			sign = -1
		}
		var area, corners int64
		var cornerAt []int32
		d := d0
		for {
			a, b := emb.Tail(d), emb.Head(d)
			c := emb.Head(emb.FaceNext(d))
			ux, uy := x[b]-x[a], y[b]-y[a]
			vx, vy := x[c]-x[b], y[c]-y[b]
			cross := ux*vy - uy*vx
			switch {
			case cross*sign < 0:
				return fmt.Sprintf("face %d has a reflex angle at vertex %d", f, b)
			case cross == 0 && ux*vx+uy*vy <= 0:
				return fmt.Sprintf("face %d folds back at vertex %d", f, b)
			case cross != 0:
				corners++
				cornerAt = append(cornerAt, b)
			}
			area += x[a]*y[b] - x[b]*y[a]
			if d = emb.FaceNext(d); d == d0 {
				break
			}
		}
		if area*sign <= 0 {
			return fmt.Sprintf("face %d has signed area %d/2, wrong sign or zero", f, area)
		}
		if f == face[outer] {
			if corners != 3 {
				return fmt.Sprintf("outer face has %d corners, not 3", corners)
			}
			third := false
			for _, v := range cornerAt {
				third = third || x[v] == 0 && y[v] == 0
			}
			if !third {
				return "no outer corner at the origin"
			}
		}
	}
	return ""
}

// cvxDraw draws emb with the outer face on the left of outer and checks it.
func cvxDraw(tb testing.TB, name string, emb *planarize.Embedding, outer int32) bool {
	tb.Helper()
	x, y, w, h, err := Draw(emb, outer)
	if err != nil {
		tb.Errorf("%s, outer dart %d: %v", name, outer, err)
		return false
	}
	return cvxCheck(tb, fmt.Sprintf("%s, outer dart %d", name, outer), emb, outer, x, y, w, h)
}

// 3-connectivity by brute force. A graph is 3-connected if it has at least
// four vertices and stays connected whenever any two vertices are removed
// (common practice: Menger's definition via vertex cuts).

// cvxConnectedWithout reports whether the graph minus the vertices with
// gone[v] is connected (true if nothing is left).
func cvxConnectedWithout(adj [][]int32, gone []bool) bool {
	n := len(adj)
	seen := make([]bool, n)
	s := -1
	left := 0
	for v := range n {
		if !gone[v] {
			left++
			if s < 0 {
				s = v
			}
		}
	}
	if left == 0 {
		return true
	}
	stack := []int32{int32(s)}
	seen[s] = true
	reached := 1
	for len(stack) > 0 {
		v := stack[len(stack)-1]
		stack = stack[:len(stack)-1]
		for _, u := range adj[v] {
			if !gone[u] && !seen[u] {
				seen[u] = true
				reached++
				stack = append(stack, u)
			}
		}
	}
	return reached == left
}

func cvxAdjacency(n int, edges [][2]int32) [][]int32 {
	adj := make([][]int32, n)
	for _, e := range edges {
		adj[e[0]] = append(adj[e[0]], e[1])
		adj[e[1]] = append(adj[e[1]], e[0])
	}
	return adj
}

// cvxTriconnectedPairs removes every pair of vertices in turn.
func cvxTriconnectedPairs(n int, edges [][2]int32) bool {
	if n < 4 {
		return false
	}
	adj := cvxAdjacency(n, edges)
	gone := make([]bool, n)
	if !cvxConnectedWithout(adj, gone) {
		return false
	}
	for u := range n {
		gone[u] = true
		for v := u + 1; v < n; v++ {
			gone[v] = true
			ok := cvxConnectedWithout(adj, gone)
			gone[v] = false
			if !ok {
				return false
			}
		}
		gone[u] = false
	}
	return true
}

// cvxTriconnectedFast removes every vertex u in turn and asks whether the
// rest is connected without a cut vertex, by the lowpoint test of J.
// Hopcroft and R. Tarjan, "Efficient algorithms for graph manipulation",
// Comm. ACM 16 (1973), run with an explicit stack. It is the pair test
// with the inner loop done in linear time; TestConvexOracles holds the two
// to each other.
func cvxTriconnectedFast(n int, edges [][2]int32) bool {
	if n < 4 {
		return false
	}
	adj := cvxAdjacency(n, edges)
	gone := make([]bool, n)
	disc := make([]int32, n)
	low := make([]int32, n)
	iter := make([]int32, n)
	parent := make([]int32, n)
	type frame struct{ v int32 }
	for u := range n {
		gone[u] = true
		for v := range disc {
			disc[v] = -1
		}
		root := int32(0)
		if u == 0 {
			root = 1
		}
		t := int32(0)
		disc[root], low[root], iter[root], parent[root] = t, t, 0, -1
		t++
		stack := []frame{{root}}
		rootChildren := 0
		reached := 1
		for len(stack) > 0 {
			v := stack[len(stack)-1].v
			if int(iter[v]) < len(adj[v]) {
				w := adj[v][iter[v]]
				iter[v]++
				if gone[w] {
					continue
				}
				if disc[w] < 0 {
					disc[w], low[w], iter[w], parent[w] = t, t, 0, v
					t++
					reached++
					if v == root {
						rootChildren++
					}
					stack = append(stack, frame{w})
				} else if w != parent[v] {
					low[v] = min(low[v], disc[w])
				}
				continue
			}
			stack = stack[:len(stack)-1]
			if p := parent[v]; p >= 0 {
				low[p] = min(low[p], low[v])
				if p != root && low[v] >= disc[p] {
					return false // p cuts v's subtree off
				}
			}
		}
		if reached != n-1 || rootChildren > 1 {
			return false
		}
		gone[u] = false
	}
	return true
}

// cvxThin removes random edges of g one at a time, keeping each removal
// only if the graph stays 3-connected by the given brute-force test.
func cvxThin(g graphgen.Graph, tries int, seed uint64, triconnected func(int, [][2]int32) bool) graphgen.Graph {
	rng := rand.New(rand.NewPCG(seed, 0xc0))
	edges := slices.Clone(g.Edges)
	deg := make([]int, g.N)
	for _, e := range edges {
		deg[e[0]]++
		deg[e[1]]++
	}
	for range tries {
		if len(edges) == 0 {
			break
		}
		i := rng.IntN(len(edges))
		e := edges[i]
		if deg[e[0]] <= 3 || deg[e[1]] <= 3 {
			continue // 3-connected graphs have minimum degree 3
		}
		edges[i] = edges[len(edges)-1]
		edges = edges[:len(edges)-1]
		if triconnected(g.N, edges) {
			deg[e[0]]--
			deg[e[1]]--
			continue
		}
		edges = append(edges, e)
		edges[i], edges[len(edges)-1] = edges[len(edges)-1], edges[i]
	}
	return graphgen.Graph{N: g.N, Edges: edges, Name: fmt.Sprintf("%s-thin%d", g.Name, len(g.Edges)-len(edges))}
}

// Graph families built here.

// cvxPrism is C_k x K2: outer cycle 0..k-1, inner cycle k..2k-1, spokes
// i -- k+i. It is the graph of the k-sided prism, a 3-polytope, hence
// 3-connected for k >= 3 (M. L. Balinski, "On the graph structure of convex
// polyhedra in n-space", Pacific J. Math. 11 (1961): the graph of a
// d-polytope is d-connected).
func cvxPrism(k int) graphgen.Graph {
	g := graphgen.Graph{N: 2 * k, Name: fmt.Sprintf("prism-%d", k)}
	for i := range k {
		j := (i + 1) % k
		g.Edges = append(g.Edges, [2]int32{int32(i), int32(j)}, [2]int32{int32(k + i), int32(k + j)}, [2]int32{int32(i), int32(k + i)})
	}
	return g
}

// cvxGridApex is the rows x cols grid (graphgen.Grid or TriangulatedGrid)
// with one extra vertex joined to every boundary vertex of the grid. It is
// 3-connected for rows, cols >= 2: removing the apex and one grid vertex
// leaves a 2-connected grid minus a vertex, which is connected; removing
// two grid vertices leaves every component with a boundary vertex, because
// a set S of non-boundary vertices has at least four neighbours outside it
// (above its top row, below its bottom row, left of its left column, right
// of its right column: four distinct vertices), so every component reaches
// the apex. The triangulated grid only adds edges. The apex goes into the
// outer face, so the graph stays planar.
func cvxGridApex(rows, cols int, triangulated bool) graphgen.Graph {
	g := graphgen.Grid(rows, cols)
	if triangulated {
		g = graphgen.TriangulatedGrid(rows, cols)
	}
	apex := int32(rows * cols)
	edges := slices.Clone(g.Edges)
	for r := range rows {
		for c := range cols {
			if r == 0 || c == 0 || r == rows-1 || c == cols-1 {
				edges = append(edges, [2]int32{int32(r*cols + c), apex})
			}
		}
	}
	return graphgen.Graph{N: rows*cols + 1, Edges: edges, Name: g.Name + "-apex"}
}

// cvxTubes is C_k x P_l, l cycles of length k, consecutive ones joined
// by a perfect matching (3-connected for k >= 3, l >= 2: the graph of a
// stack of prisms; it is checked by brute force in the test as well).
func cvxTubes(k, l int) graphgen.Graph {
	g := graphgen.Graph{N: k * l, Name: fmt.Sprintf("tubes-%dx%d", k, l)}
	for r := range l {
		for i := range k {
			v := int32(r*k + i)
			g.Edges = append(g.Edges, [2]int32{v, int32(r*k + (i+1)%k)})
			if r+1 < l {
				g.Edges = append(g.Edges, [2]int32{v, v + int32(k)})
			}
		}
	}
	return g
}

func cvxFamilies() []graphgen.Graph {
	gs := []graphgen.Graph{
		graphgen.Tetrahedron(), graphgen.Cube(), graphgen.Octahedron(),
		graphgen.Dodecahedron(), graphgen.Icosahedron(),
	}
	for k := 3; k <= 30; k++ {
		gs = append(gs, graphgen.Wheel(k), cvxPrism(k))
	}
	for k := 2; k <= 12; k++ {
		gs = append(gs, cvxGridApex(k, k, false), cvxGridApex(k, k, true), cvxGridApex(k, k+3, false))
	}
	for l := 2; l <= 12; l++ {
		gs = append(gs, graphgen.NestedTriangles(l), graphgen.NestedTrianglesPlain(l), cvxTubes(5, l))
	}
	return gs
}

func TestConvexPlatonic(t *testing.T) {
	// (V, E, F) of the Platonic solids: handbook values
	// (graphgen.PlatonicSolids, SOURCES.md).
	for _, tc := range graphgen.PlatonicSolids() {
		emb := mustEmbed(t, tc.Graph)
		if emb.N() != tc.V || emb.M() != tc.E || emb.Faces() != tc.F {
			t.Fatalf("%s: (V, E, F) = (%d, %d, %d), want (%d, %d, %d)", tc.Name, emb.N(), emb.M(), emb.Faces(), tc.V, tc.E, tc.F)
		}
		for d := int32(0); int(d) < 2*emb.M(); d++ {
			x, y, w, h, err := Draw(emb, d)
			if err != nil {
				t.Fatalf("%s, outer dart %d: %v", tc.Name, d, err)
			}
			// Felsner's grid is exactly (f-1) x (f-1): a1 sits at x = f-1.
			if w != int64(tc.F-1) || h != int64(tc.F-1) {
				t.Errorf("%s: grid %d x %d, want %d x %d", tc.Name, w, h, tc.F-1, tc.F-1)
			}
			cvxCheck(t, fmt.Sprintf("%s, outer dart %d", tc.Name, d), emb, d, x, y, w, h)
		}
	}
}

// TestConvexFamilies draws wheels, prisms, grids with an apex, nested
// triangles and stacked prisms, each with the outer face on the left of
// every dart while the graph is small and of a few darts otherwise.
func TestConvexFamilies(t *testing.T) {
	drawings := 0
	for _, g := range cvxFamilies() {
		oracle := cvxTriconnectedFast
		if g.N <= 40 {
			oracle = cvxTriconnectedPairs
		}
		if !oracle(g.N, g.Edges) {
			t.Fatalf("%s: brute force says it is not 3-connected", g.Name)
		}
		emb := mustEmbed(t, g)
		m := int32(emb.M())
		darts := []int32{0, 1, m - 1, m, 2*m - 1}
		if m <= 60 {
			darts = darts[:0]
			for d := range 2 * m {
				darts = append(darts, d)
			}
		}
		for _, d := range darts {
			if !cvxDraw(t, g.Name, emb, d) {
				return
			}
			drawings++
		}
	}
	t.Logf("%d drawings", drawings)
}

// TestConvexRandom draws random 3-connected planar graphs: random maximal
// planar graphs (3-connected for n >= 4: a simple triangulation on n >= 4
// vertices is 3-connected, common practice) with random edges removed while
// brute force says the graph stays 3-connected.
func TestConvexRandom(t *testing.T) {
	type size struct{ n, count int }
	plan := []size{{4, 20}, {5, 30}, {6, 40}, {8, 50}, {10, 50}, {14, 50}, {20, 50}, {30, 40}, {45, 30}, {60, 20}, {100, 8}, {200, 4}, {300, 3}}
	instances, removed, edges := 0, 0, 0
	for _, s := range plan {
		for i := range s.count {
			seed := uint64(1000*s.n + i)
			g := graphgen.RandomTriangulation(s.n, seed)
			oracle, tries := cvxTriconnectedPairs, 3*s.n
			if s.n > 30 {
				oracle, tries = cvxTriconnectedFast, min(3*s.n, 150)
			}
			thin := cvxThin(g, tries, seed, oracle)
			removed += len(g.Edges) - len(thin.Edges)
			edges += len(thin.Edges)
			emb := mustEmbed(t, thin)
			rng := rand.New(rand.NewPCG(seed, 1))
			darts := []int32{0, rng.Int32N(int32(2 * emb.M()))}
			if s.n <= 8 {
				darts = darts[:0]
				for d := range int32(2 * emb.M()) {
					darts = append(darts, d)
				}
			}
			for _, d := range darts {
				if !cvxDraw(t, thin.Name, emb, d) {
					return
				}
			}
			instances++
		}
	}
	if removed == 0 {
		t.Fatal("thinning removed no edge: the inputs are all triangulations")
	}
	// Cubic graphs with large faces: duals of random triangulations and of
	// thinned ones (the dual of a 3-connected plane graph is 3-connected,
	// common practice; brute force confirms it here).
	duals := 0
	for i := range 60 {
		n := 4 + 2*i
		g := graphgen.RandomTriangulation(n, uint64(i))
		if i%2 == 1 {
			g = cvxThin(g, 2*n, uint64(i), cvxTriconnectedFast)
		}
		dual := cvxDual(mustEmbed(t, g))
		if !cvxTriconnectedFast(dual.N, dual.Edges) {
			t.Fatalf("%s: brute force says it is not 3-connected", dual.Name)
		}
		emb := mustEmbed(t, dual)
		for _, d := range []int32{0, int32(emb.M()), int32(2*emb.M() - 1)} {
			if !cvxDraw(t, dual.Name, emb, d) {
				return
			}
		}
		duals++
	}
	t.Logf("%d random 3-connected graphs, %d edges removed, %d kept; %d duals", instances, removed, edges, duals)
}

// cvxDual returns the dual graph of emb: a vertex per face, an edge across
// every edge.
func cvxDual(emb *planarize.Embedding) graphgen.Graph {
	face, nf := cvxFaceOf(emb)
	g := graphgen.Graph{N: nf, Name: fmt.Sprintf("dual-%d-%d", emb.N(), emb.M())}
	for e := range emb.M() {
		g.Edges = append(g.Edges, [2]int32{int32(face[2*e]), int32(face[2*e+1])})
	}
	return g
}

// TestConvexNotTriconnected: graphs that are not 3-connected must be
// refused with errNotTriconnected.
func TestConvexNotTriconnected(t *testing.T) {
	named := []graphgen.Graph{
		graphgen.Cycle(5),
		{N: 5, Name: "triangles-sharing-a-vertex", Edges: [][2]int32{{0, 1}, {1, 2}, {2, 0}, {0, 3}, {3, 4}, {4, 0}}},
		{N: 4, Name: "triangles-sharing-an-edge", Edges: [][2]int32{{0, 1}, {1, 2}, {2, 0}, {1, 3}, {3, 2}}},
		{N: 6, Name: "K4s-sharing-an-edge", Edges: [][2]int32{{0, 1}, {0, 2}, {0, 3}, {1, 2}, {1, 3}, {2, 3}, {0, 4}, {0, 5}, {1, 4}, {1, 5}, {4, 5}}},
		{N: 5, Name: "K2,3", Edges: [][2]int32{{0, 2}, {0, 3}, {0, 4}, {1, 2}, {1, 3}, {1, 4}}},
		{N: 8, Name: "disjoint-K4s", Edges: [][2]int32{{0, 1}, {0, 2}, {0, 3}, {1, 2}, {1, 3}, {2, 3}, {4, 5}, {4, 6}, {4, 7}, {5, 6}, {5, 7}, {6, 7}}},
		{N: 7, Name: "wheel-5-subdivided-spoke", Edges: [][2]int32{{0, 6}, {6, 1}, {0, 2}, {0, 3}, {0, 4}, {0, 5}, {1, 2}, {2, 3}, {3, 4}, {4, 5}, {5, 1}}},
		// Two wheels glued at their hubs: a cut vertex of degree 8.
		{N: 9, Name: "wheels-sharing-the-hub", Edges: [][2]int32{{0, 1}, {0, 2}, {0, 3}, {0, 4}, {1, 2}, {2, 3}, {3, 4}, {4, 1}, {0, 5}, {0, 6}, {0, 7}, {0, 8}, {5, 6}, {6, 7}, {7, 8}, {8, 5}}},
		graphgen.Path(3), graphgen.Path(2), graphgen.Star(4),
		graphgen.Grid(4, 4), graphgen.Grid(2, 6), graphgen.TriangulatedGrid(5, 5),
	}
	// A prism less one outer-cycle edge: its two ends have degree 2.
	named = append(named, graphgen.Graph{N: 12, Name: "prism-6-minus-edge", Edges: cvxPrism(6).Edges[1:]})
	for _, g := range named {
		if cvxTriconnectedPairs(g.N, g.Edges) {
			t.Fatalf("%s: brute force says it is 3-connected", g.Name)
		}
		emb := mustEmbed(t, g)
		for d := range int32(2 * emb.M()) {
			if _, _, _, _, err := Draw(emb, d); !errors.Is(err, errNotTriconnected) {
				t.Errorf("%s, outer dart %d: error %v, want errNotTriconnected", g.Name, d, err)
				break
			}
		}
	}
}

// TestConvexDecidesTriconnectivity compares Draw's verdict with
// brute force on random planar graphs near the threshold: triangulations
// with random edges removed without looking, and random planar subgraphs.
func TestConvexDecidesTriconnectivity(t *testing.T) {
	yes, no := 0, 0
	for i := range 600 {
		n := 4 + i%26
		seed := uint64(7000 + i)
		g := graphgen.RandomTriangulation(n, seed)
		rng := rand.New(rand.NewPCG(seed, 2))
		k := rng.IntN(n)
		if i%3 == 2 {
			g = graphgen.RandomPlanar(n, 0.6+0.4*rng.Float64(), seed)
			k = 0
		}
		edges := slices.Clone(g.Edges)
		rng.Shuffle(len(edges), func(a, b int) { edges[a], edges[b] = edges[b], edges[a] })
		edges = edges[:len(edges)-min(k, len(edges))]
		if len(edges) == 0 {
			continue
		}
		h := graphgen.Graph{N: n, Edges: edges, Name: fmt.Sprintf("%s-minus%d", g.Name, k)}
		want := cvxTriconnectedPairs(n, edges)
		emb := mustEmbed(t, h)
		d := rng.Int32N(int32(2 * len(edges)))
		x, y, w, hh, err := Draw(emb, d)
		switch {
		case want && err != nil:
			t.Errorf("%s: 3-connected by brute force, but %v", h.Name, err)
		case want:
			cvxCheck(t, h.Name, emb, d, x, y, w, hh)
			yes++
		case !errors.Is(err, errNotTriconnected):
			t.Errorf("%s: not 3-connected by brute force, but error %v", h.Name, err)
		default:
			no++
		}
	}
	if yes < 50 || no < 50 {
		t.Errorf("unbalanced sample: %d 3-connected, %d not", yes, no)
	}
	t.Logf("%d 3-connected, %d not", yes, no)
}

// TestConvexTriangle: the triangle is drawn on the 1 x 1 grid (f = 2).
func TestConvexTriangle(t *testing.T) {
	emb := mustEmbed(t, graphgen.Cycle(3))
	for d := range int32(6) {
		x, y, w, h, err := Draw(emb, d)
		if err != nil {
			t.Fatalf("outer dart %d: %v", d, err)
		}
		if w != 1 || h != 1 {
			t.Errorf("outer dart %d: grid %d x %d, want 1 x 1", d, w, h)
		}
		cvxCheck(t, fmt.Sprintf("triangle, outer dart %d", d), emb, d, x, y, w, h)
	}
}

// TestConvexBadInput: arguments that are not a plane embedding of a simple
// graph with one of its darts are refused with errInput.
func TestConvexBadInput(t *testing.T) {
	k4 := mustEmbed(t, graphgen.Tetrahedron())
	for _, d := range []int32{-1, 12, 1 << 30} {
		if _, _, _, _, err := Draw(k4, d); !errors.Is(err, errInput) {
			t.Errorf("K4 with dart %d: error %v, want errInput", d, err)
		}
	}
	if _, _, _, _, err := Draw(nil, 0); !errors.Is(err, errInput) {
		t.Errorf("nil embedding: error %v, want errInput", err)
	}
	if _, _, _, _, err := Draw(planarize.NewEmbedding(1), 0); !errors.Is(err, errInput) {
		t.Errorf("one vertex: error %v, want errInput", err)
	}
	// A multigraph: K4 plus a second copy of the edge 0-1.
	multi := planarize.NewEmbedding(4)
	for _, e := range [][2]int32{{0, 1}, {0, 2}, {0, 3}, {1, 2}, {1, 3}, {2, 3}, {0, 1}} {
		multi.AddEdge(-1, -1, e[0], e[1])
	}
	if _, _, _, _, err := Draw(multi, 0); !errors.Is(err, errInput) {
		t.Errorf("K4 with a doubled edge: error %v, want errInput", err)
	}
	// A rotation system of K4 that is not plane: edges added in some order
	// with every dart appended to its vertex's rotation; search the orders
	// for one with the wrong Euler characteristic.
	edges := k4.Edges()
	found := false
	perm := []int{0, 1, 2, 3, 4, 5}
	for !found {
		e := planarize.NewEmbedding(4)
		for _, i := range perm {
			e.AddEdge(-1, -1, edges[i][0], edges[i][1])
		}
		if !e.IsPlane() {
			found = true
			if _, _, _, _, err := Draw(e, 0); !errors.Is(err, errInput) {
				t.Errorf("non-plane K4: error %v, want errInput", err)
			}
			break
		}
		if !cvxNextPerm(perm) {
			break
		}
	}
	if !found {
		t.Error("no non-plane rotation system of K4 found")
	}
}

func cvxNextPerm(p []int) bool {
	i := len(p) - 2
	for i >= 0 && p[i] >= p[i+1] {
		i--
	}
	if i < 0 {
		return false
	}
	j := len(p) - 1
	for p[j] <= p[i] {
		j--
	}
	p[i], p[j] = p[j], p[i]
	slices.Reverse(p[i+1:])
	return true
}

// TestConvexOracles holds the two brute-force 3-connectivity tests to each
// other and to known cases: K4, the cube, K3,3 and the Petersen graph are
// 3-connected (from memory; each is 3-regular and 3-connected), a cycle,
// K2,3 and a path are not, and neither is anything on three vertices.
func TestConvexOracles(t *testing.T) {
	known := []struct {
		g    graphgen.Graph
		want bool
	}{
		{graphgen.Tetrahedron(), true}, {graphgen.Cube(), true},
		{graphgen.CompleteBipartite(3, 3), true}, {graphgen.Petersen(), true},
		{graphgen.Cycle(6), false}, {graphgen.CompleteBipartite(2, 3), false},
		{graphgen.Path(5), false}, {graphgen.Cycle(3), false}, {graphgen.Complete(5), true},
	}
	for _, k := range known {
		if got := cvxTriconnectedPairs(k.g.N, k.g.Edges); got != k.want {
			t.Errorf("pairs: %s: %v, want %v", k.g.Name, got, k.want)
		}
		if got := cvxTriconnectedFast(k.g.N, k.g.Edges); got != k.want {
			t.Errorf("fast: %s: %v, want %v", k.g.Name, got, k.want)
		}
	}
	yes := 0
	for i := range 400 {
		n := 4 + i%12
		g := graphgen.RandomGnm(n, min(n*(n-1)/2, n+i%(2*n)), uint64(i))
		a, b := cvxTriconnectedPairs(n, g.Edges), cvxTriconnectedFast(n, g.Edges)
		if a != b {
			t.Fatalf("%s: pairs %v, fast %v", g.Name, a, b)
		}
		if a {
			yes++
		}
	}
	if yes < 40 || yes > 360 {
		t.Errorf("the random sample has %d of 400 3-connected graphs", yes)
	}
}

// TestConvexFaceCounts recomputes every coordinate from Felsner's
// definition: for vertex v and colour i, flood-fill the inner faces from
// v's corner after its colour-(i+1) edge, never crossing an edge of the
// paths P_{i+1}(v) or P_{i-1}(v), and count them. It also checks his lemma
// that the three paths leaving a vertex meet only there.
func TestConvexFaceCounts(t *testing.T) {
	var gs []graphgen.Graph
	for _, g := range cvxFamilies() {
		if g.N <= 60 {
			gs = append(gs, g)
		}
	}
	for i := range 60 {
		n := 5 + i
		g := graphgen.RandomTriangulation(n, uint64(i))
		gs = append(gs, cvxThin(g, 2*n, uint64(i), cvxTriconnectedFast))
	}
	for _, g := range gs {
		emb := mustEmbed(t, g)
		for _, outer := range []int32{0, int32(emb.M())} {
			wood, coord, err := solve(emb, outer)
			if err != nil {
				t.Fatalf("%s: %v", g.Name, err)
			}
			if msg := cvxBruteFaceCounts(emb, outer, wood.out, coord); msg != "" {
				t.Fatalf("%s, outer dart %d: %s", g.Name, outer, msg)
			}
		}
	}
}

func cvxBruteFaceCounts(emb *planarize.Embedding, outer int32, out [3][]int32, coord [3][]int64) string {
	face, nf := cvxFaceOf(emb)
	n := emb.N()
	path := func(v int32, i int) []int32 { // darts of P_i(v)
		var ds []int32
		for d := out[i][v]; d >= 0; d = out[i][emb.Head(d)] {
			ds = append(ds, d)
			if len(ds) > n {
				return nil
			}
		}
		return ds
	}
	barrier := make([]int, emb.M())
	seen := make([]int, nf)
	stamp := 0
	for v := int32(0); int(v) < n; v++ {
		onPath := make(map[int32]int)
		for i := range 3 {
			p := path(v, i)
			if p == nil && out[i][v] >= 0 {
				return fmt.Sprintf("colour %d path from %d does not end", i+1, v)
			}
			for _, d := range p {
				h := emb.Head(d)
				if j, ok := onPath[h]; ok && j != i {
					return fmt.Sprintf("paths %d and %d from %d meet at %d", j+1, i+1, v, h)
				}
				onPath[h] = i
			}
		}
		for i := range 3 {
			stamp++
			for _, j := range []int{(i + 1) % 3, (i + 2) % 3} {
				for _, d := range path(v, j) {
					barrier[d>>1] = stamp
				}
			}
			count := int64(0)
			if d0 := out[(i+1)%3][v]; d0 >= 0 && face[d0] != face[outer] {
				seen[face[d0]] = stamp
				queue := []int32{d0}
				for len(queue) > 0 {
					d := queue[len(queue)-1]
					queue = queue[:len(queue)-1]
					count++
					x := d
					for {
						g := face[x^1]
						if barrier[x>>1] != stamp && g != face[outer] && seen[g] != stamp {
							seen[g] = stamp
							queue = append(queue, x^1)
						}
						if x = emb.FaceNext(x); x == d {
							break
						}
					}
				}
			}
			if count != coord[i][v] {
				return fmt.Sprintf("vertex %d: region %d has %d faces, coordinate %d", v, i+1, count, coord[i][v])
			}
		}
	}
	return ""
}

// TestConvexDeterministic: the same input gives the same drawing, and the
// embedding is left as it was.
func TestConvexDeterministic(t *testing.T) {
	g := cvxThin(graphgen.RandomTriangulation(150, 3), 200, 3, cvxTriconnectedFast)
	emb := mustEmbed(t, g)
	before := make([]int32, 2*emb.M())
	for d := range before {
		before[d] = emb.Next(int32(d))
	}
	x1, y1, _, _, err1 := Draw(emb, 7)
	x2, y2, _, _, err2 := Draw(emb, 7)
	if err1 != nil || err2 != nil {
		t.Fatal(err1, err2)
	}
	if !slices.Equal(x1, x2) || !slices.Equal(y1, y2) {
		t.Error("two runs differ")
	}
	for d := range before {
		if emb.Next(int32(d)) != before[d] {
			t.Fatal("the embedding was changed")
		}
	}
}

// TestConvexCheckerCatchesDefects hands the convexity check drawings that
// are wrong on purpose, so that its silence elsewhere means something.
func TestConvexCheckerCatchesDefects(t *testing.T) {
	emb := mustEmbed(t, graphgen.Cube())
	const outer = 0
	x, y, _, _, err := Draw(emb, outer)
	if err != nil {
		t.Fatal(err)
	}
	if msg := cvxConvexity(emb, outer, x, y); msg != "" {
		t.Fatalf("the good drawing is refused: %s", msg)
	}
	if msg := cvxConvexity(emb, outer, y, x); msg == "" {
		t.Error("a mirrored drawing (every face walked the wrong way) passes")
	}
	zero := make([]int64, len(x))
	if msg := cvxConvexity(emb, outer, zero, zero); msg == "" {
		t.Error("a drawing with every vertex at one point passes")
	}
	// Scale by 100 and pull one vertex v of an inner face just across the
	// chord between its two neighbours on that face: a reflex angle.
	face, _ := cvxFaceOf(emb)
	onOuter := make([]bool, emb.N())
	for d := int32(outer); ; {
		onOuter[emb.Tail(d)] = true
		if d = emb.FaceNext(d); d == outer {
			break
		}
	}
	moved := false
	for d := int32(0); int(d) < 2*emb.M() && !moved; d++ {
		v := emb.Head(d)
		if face[d] == face[outer] || onOuter[v] {
			continue
		}
		u, w := emb.Tail(d), emb.Head(emb.FaceNext(d))
		bx, by := make([]int64, len(x)), make([]int64, len(y))
		for i := range x {
			bx[i], by[i] = 100*x[i], 100*y[i]
		}
		// The left normal of u->w points into the rest of the face.
		bx[v] = 50*(x[u]+x[w]) - (y[w] - y[u])
		by[v] = 50*(y[u]+y[w]) + (x[w] - x[u])
		if msg := cvxConvexity(emb, outer, bx, by); !strings.Contains(msg, "reflex") {
			t.Errorf("vertex %d pulled inside its face: check says %q", v, msg)
		}
		moved = true
	}
	if !moved {
		t.Fatal("no inner vertex found")
	}
}

// cvxLocal renumbers g breadth first from vertex 0, as Draw does before it
// embeds (place/relabel.go), so that the benchmark also shows the cost on
// a local numbering.
func cvxLocal(g graphgen.Graph) graphgen.Graph {
	adj := cvxAdjacency(g.N, g.Edges)
	id := make([]int32, g.N)
	for v := range id {
		id[v] = -1
	}
	next := int32(0)
	for s := range g.N {
		if id[s] >= 0 {
			continue
		}
		id[s] = next
		next++
		queue := []int32{int32(s)}
		for len(queue) > 0 {
			v := queue[0]
			queue = queue[1:]
			for _, u := range adj[v] {
				if id[u] < 0 {
					id[u] = next
					next++
					queue = append(queue, u)
				}
			}
		}
	}
	edges := make([][2]int32, len(g.Edges))
	for i, e := range g.Edges {
		edges[i] = [2]int32{id[e[0]], id[e[1]]}
	}
	slices.SortFunc(edges, func(a, b [2]int32) int {
		return int(min(a[0], a[1])) - int(min(b[0], b[1]))
	})
	return graphgen.Graph{N: g.N, Edges: edges, Name: g.Name + "-bfs"}
}

// BenchmarkConvex draws 3-connected graphs of about 10^5 vertices: a random
// triangulation as generated (scattered numbering) and renumbered, a grid
// with an apex, a wheel (a hub of degree 10^5), a prism (two faces of
// 5 * 10^4 vertices) and nested triangles (graph distance to the outer
// face growing linearly).
func BenchmarkConvex(b *testing.B) {
	tri := graphgen.RandomTriangulation(100000, 1)
	for _, g := range []graphgen.Graph{
		tri,
		cvxLocal(tri),
		cvxGridApex(316, 316, false),
		graphgen.Wheel(100000),
		cvxPrism(50000),
		graphgen.NestedTriangles(33334),
	} {
		emb, ok := planarize.Embed(g.N, g.Edges)
		if !ok {
			b.Fatalf("%s is not planar", g.Name)
		}
		b.Run(g.Name, func(b *testing.B) {
			for b.Loop() {
				if _, _, _, _, err := Draw(emb, 0); err != nil {
					b.Fatal(err)
				}
			}
		})
	}
}

func mustEmbed(tb testing.TB, g graphgen.Graph) *planarize.Embedding {
	tb.Helper()
	emb, ok := planarize.Embed(g.N, g.Edges)
	if !ok {
		tb.Fatalf("%s: planarize.Embed calls a planar graph non-planar", g.Name)
	}
	return emb
}
