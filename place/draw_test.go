package place

import (
	"fmt"
	"math/rand/v2"
	"reflect"
	"testing"

	"github.com/gridwood/gridwood/internal/graphgen"
	"github.com/gridwood/gridwood/planarize"
)

// This file tests Draw on multigraphs and non-planar graphs. The drawing is
// judged by geomcheck, planarity by planarize.IsPlanar, and the reported
// sets are recomputed here from the raw edge list.

// pairKey is an unordered vertex pair.
func pairKey(e [2]int32) [2]int32 { return [2]int32{min(e[0], e[1]), max(e[0], e[1])} }

// multigraph turns the simple graph g into a multigraph: every edge is
// repeated 0 to 2 extra times, each copy in a random direction, loops are
// sprinkled in, and the whole list is shuffled.
func multigraph(g graphgen.Graph, seed uint64) [][2]int32 {
	rng := rand.New(rand.NewPCG(seed, 77))
	var raw [][2]int32
	for _, e := range g.Edges {
		for range 1 + rng.IntN(3) {
			if rng.IntN(2) == 0 {
				raw = append(raw, e)
			} else {
				raw = append(raw, [2]int32{e[1], e[0]})
			}
		}
	}
	for range g.N / 4 {
		v := int32(rng.IntN(g.N))
		raw = append(raw, [2]int32{v, v})
	}
	rng.Shuffle(len(raw), func(i, j int) { raw[i], raw[j] = raw[j], raw[i] })
	return raw
}

// drawCase is one Draw input with what is known about it from outside.
type drawCase struct {
	name string
	n    int
	raw  [][2]int32
	// skew is the known skewness (fewest pairs any planar subgraph must
	// drop), or -1 if unknown.
	skew int
	// planar says whether the underlying simple graph is planar.
	planar bool
	// explain bounds how many removed pairs get their Explain checked.
	explain int
}

// checkDraw runs Draw on c and checks every documented property of the
// result. It returns the result for further checks.
func checkDraw(t *testing.T, c drawCase) *Result {
	t.Helper()
	r, err := Draw(c.n, c.raw, DrawOptions{})
	if err != nil {
		t.Fatalf("%s: Draw: %v", c.name, err)
	}
	// The distinct pairs, in order of first occurrence, recomputed.
	pairIndex := map[[2]int32]int{}
	var pairs [][2]int32
	for _, e := range c.raw {
		if e[0] == e[1] {
			continue
		}
		k := pairKey(e)
		if _, ok := pairIndex[k]; !ok {
			pairIndex[k] = len(pairs)
			pairs = append(pairs, k)
		}
	}
	if r.DistinctPairs != len(pairs) || len(r.PairList()) != len(pairs) {
		t.Fatalf("%s: DistinctPairs %d, PairList %d, the input has %d distinct pairs", c.name, r.DistinctPairs, len(r.PairList()), len(pairs))
	}
	for k, p := range r.PairList() {
		if pairKey(p) != pairs[k] {
			t.Fatalf("%s: PairList()[%d] = %v, first occurrences give %v", c.name, k, p, pairs[k])
		}
	}
	// Removed: increasing, no loop, every copy of each removed pair.
	removedSet := map[[2]int32]bool{}
	for j, i := range r.Removed {
		if i < 0 || i >= len(c.raw) || (j > 0 && r.Removed[j-1] >= i) {
			t.Fatalf("%s: Removed %v is not an increasing list of edge indices", c.name, r.Removed)
		}
		if c.raw[i][0] == c.raw[i][1] {
			t.Fatalf("%s: Removed lists the loop %d %v", c.name, i, c.raw[i])
		}
		removedSet[pairKey(c.raw[i])] = true
	}
	listed := map[int]bool{}
	for _, i := range r.Removed {
		listed[i] = true
	}
	for i, e := range c.raw {
		if e[0] != e[1] && removedSet[pairKey(e)] != listed[i] {
			t.Fatalf("%s: edge %d %v: its pair is removed = %v, but it is listed = %v", c.name, i, e, removedSet[pairKey(e)], listed[i])
		}
	}
	if r.RemovedPairs != len(removedSet) {
		t.Errorf("%s: RemovedPairs = %d, Removed holds %d distinct pairs", c.name, r.RemovedPairs, len(removedSet))
	}
	// Kept: exactly the pairs not removed.
	kept := r.Kept()
	keptSet := map[[2]int32]bool{}
	for _, e := range kept {
		k := pairKey(e)
		if _, ok := pairIndex[k]; !ok || removedSet[k] || keptSet[k] || e[0] == e[1] {
			t.Fatalf("%s: Kept() holds %v: not a distinct, kept input pair", c.name, e)
		}
		keptSet[k] = true
	}
	if len(kept)+len(removedSet) != len(pairs) {
		t.Fatalf("%s: %d kept + %d removed pairs, the input has %d", c.name, len(kept), len(removedSet), len(pairs))
	}
	if !planarize.IsPlanar(c.n, kept) {
		t.Fatalf("%s: Kept() is not planar", c.name)
	}
	checkDrawing(t, c.name, c.n, kept, &r.Drawing)
	if c.planar {
		if len(r.Removed) != 0 || r.RemovedPairs != 0 || !r.Optimal || r.LowerBound != 0 {
			t.Errorf("%s: planar input, yet Removed %v, RemovedPairs %d, Optimal %v, LowerBound %d",
				c.name, r.Removed, r.RemovedPairs, r.Optimal, r.LowerBound)
		}
		return r
	}
	// Maximality: adding back any removed pair makes Kept() non-planar
	// (the definition of a maximal planar subgraph, SOURCES.md: Cai, Han
	// and Tarjan 1993). Pairs are taken in PairList order.
	var removedPairs [][2]int32
	for _, p := range pairs {
		if removedSet[p] {
			removedPairs = append(removedPairs, p)
		}
	}
	for _, p := range removedPairs {
		if planarize.IsPlanar(c.n, append(kept[:len(kept):len(kept)], p)) {
			t.Errorf("%s: pair %v was removed, but Kept() plus it is still planar", c.name, p)
		}
	}
	// Counting bounds. Euler: a simple planar graph on n >= 3 vertices has
	// at most 3n-6 edges (SOURCES.md), so at least len(pairs)-(3n-6) go.
	if c.n >= 3 && r.RemovedPairs < len(pairs)-(3*c.n-6) {
		t.Errorf("%s: %d pairs removed, Euler needs at least %d", c.name, r.RemovedPairs, len(pairs)-(3*c.n-6))
	}
	if r.LowerBound < 0 || r.LowerBound > r.RemovedPairs {
		t.Errorf("%s: LowerBound %d, RemovedPairs %d", c.name, r.LowerBound, r.RemovedPairs)
	}
	if c.skew >= 0 {
		// Known skewness (SOURCES.md: K_n, K_{m,n}, Petersen).
		if r.RemovedPairs < c.skew || r.LowerBound > c.skew {
			t.Errorf("%s: RemovedPairs %d, LowerBound %d, but the skewness is %d", c.name, r.RemovedPairs, r.LowerBound, c.skew)
		}
		if r.Optimal && r.RemovedPairs != c.skew {
			t.Errorf("%s: claims optimal with %d removed pairs, the skewness is %d", c.name, r.RemovedPairs, c.skew)
		}
	}
	if r.RemovedPairs == 0 {
		t.Errorf("%s: non-planar input drawn without removing anything", c.name)
	}
	t.Logf("%s: n=%d, %d pairs, %d removed (lower bound %d, optimal %v, skewness %d)",
		c.name, c.n, len(pairs), r.RemovedPairs, r.LowerBound, r.Optimal, c.skew)
	// Explain a few removed edges, picking a random copy of the pair.
	rng := rand.New(rand.NewPCG(uint64(len(c.raw)), 3))
	copies := map[[2]int32][]int{}
	for _, i := range r.Removed {
		k := pairKey(c.raw[i])
		copies[k] = append(copies[k], i)
	}
	for j, p := range removedPairs {
		if j >= c.explain {
			break
		}
		i := copies[p][rng.IntN(len(copies[p]))]
		k, ok := r.Explain(i, nil)
		if !ok {
			t.Errorf("%s: Explain(%d) found no Kuratowski subgraph without a budget", c.name, i)
			continue
		}
		checkExplanation(t, fmt.Sprintf("%s: Explain(%d) for pair %v", c.name, i, p), c.n, r.PairList(), pairIndex[p], keptSet, k)
	}
	return r
}

// checkExplanation checks that k is a subdivision of K5 or K3,3 (K.
// Kuratowski, Fund. Math. 15, 1930) made of the pair with index target
// in pairs and of kept pairs only: its paths join its branch vertices as
// the edges of K5 or K3,3 do, are internally disjoint and use exactly the
// edges listed, each once.
func checkExplanation(t *testing.T, name string, n int, pairs [][2]int32, target int, kept map[[2]int32]bool, k *planarize.Kuratowski) {
	t.Helper()
	fail := func(format string, args ...any) { t.Errorf(name+": "+format, args...) }
	edgeSet := map[[2]int32]bool{}
	hasTarget := false
	var sub [][2]int32
	for _, e := range k.Edges {
		if e < 0 || int(e) >= len(pairs) {
			fail("edge index %d outside PairList()", e)
			return
		}
		p := pairKey(pairs[e])
		if edgeSet[p] {
			fail("pair %v listed twice", p)
			return
		}
		edgeSet[p] = true
		sub = append(sub, p)
		if int(e) == target {
			hasTarget = true
		} else if !kept[p] {
			fail("uses pair %v, which is neither the explained pair nor kept", p)
			return
		}
	}
	if !hasTarget {
		fail("does not contain the explained pair %v", pairs[target])
		return
	}
	branches, paths := 5, 10
	if k.Kind == planarize.K33 {
		branches, paths = 6, 9
	}
	if len(k.Branch) != branches || len(k.Paths) != paths {
		fail("%v with %d branch vertices and %d paths", k.Kind, len(k.Branch), len(k.Paths))
		return
	}
	isBranch := map[int32]bool{}
	for _, b := range k.Branch {
		isBranch[b] = true
	}
	if len(isBranch) != branches {
		fail("repeated branch vertex in %v", k.Branch)
		return
	}
	used := map[[2]int32]bool{}
	inner := map[int32]bool{}
	ends := map[[2]int32]bool{}
	for _, path := range k.Paths {
		if len(path) < 2 || !isBranch[path[0]] || !isBranch[path[len(path)-1]] || path[0] == path[len(path)-1] {
			fail("path %v does not join two branch vertices", path)
			return
		}
		ends[pairKey([2]int32{path[0], path[len(path)-1]})] = true
		for i, v := range path {
			if v < 0 || int(v) >= n {
				fail("vertex %d out of range", v)
				return
			}
			if i > 0 && i < len(path)-1 {
				if isBranch[v] || inner[v] {
					fail("path %v is not internally disjoint from the others", path)
					return
				}
				inner[v] = true
			}
			if i > 0 {
				p := pairKey([2]int32{path[i-1], v})
				if !edgeSet[p] || used[p] {
					fail("path %v step %v is not an unused edge of the subgraph", path, p)
					return
				}
				used[p] = true
			}
		}
	}
	if len(used) != len(edgeSet) {
		fail("%d edges listed, the paths use %d", len(edgeSet), len(used))
		return
	}
	if len(ends) != paths {
		fail("two paths join the same branch pair")
		return
	}
	if k.Kind == planarize.K33 {
		// The 9 joined pairs must be all pairs across a 3+3 split: the
		// side of Branch[0] is the branch vertices it is not joined to.
		side := map[int32]bool{}
		for _, b := range k.Branch {
			if b == k.Branch[0] || !ends[pairKey([2]int32{k.Branch[0], b})] {
				side[b] = true
			}
		}
		if len(side) != 3 {
			fail("branch vertices do not split 3+3")
			return
		}
		for p := range ends {
			if side[p[0]] == side[p[1]] {
				fail("path joins %v on the same side of K3,3", p)
				return
			}
		}
	}
	// A subdivision of K5 or K3,3 is not planar (Kuratowski).
	if planarize.IsPlanar(n, sub) {
		fail("the subgraph is planar")
	}
}

// TestDrawMultigraphsPlanar draws planar multigraphs: repeats, both
// directions and loops must not change anything.
func TestDrawMultigraphsPlanar(t *testing.T) {
	var cases []drawCase
	add := func(name string, n int, raw [][2]int32) {
		cases = append(cases, drawCase{name: name, n: n, raw: raw, skew: 0, planar: true})
	}
	add("empty", 0, nil)
	add("one-vertex", 1, nil)
	add("loop-only", 1, [][2]int32{{0, 0}, {0, 0}})
	add("loops-and-isolated", 4, [][2]int32{{0, 0}, {2, 2}, {3, 3}})
	add("edge-both-ways", 2, [][2]int32{{0, 1}, {1, 0}, {0, 1}, {1, 1}})
	add("triangle-with-loops", 3, [][2]int32{{0, 0}, {0, 1}, {1, 1}, {1, 2}, {2, 0}, {2, 2}, {0, 2}})
	add("k4-directed-duplicates", 4, [][2]int32{
		{0, 1}, {1, 0}, {0, 2}, {2, 0}, {0, 3}, {3, 0}, {1, 2}, {2, 1}, {1, 3}, {3, 1}, {2, 3}, {3, 2},
	})
	for i, g := range []graphgen.Graph{
		graphgen.Path(50), graphgen.Star(40), graphgen.Cycle(30), graphgen.Wheel(20), graphgen.Grid(10, 10),
		graphgen.Icosahedron(), graphgen.NestedTrianglesPlain(30), graphgen.NestedTriangles(30),
		graphgen.RandomTriangulation(300, 4), graphgen.RandomPlanar(300, 0.5, 5), graphgen.RandomTree(200, 6),
		graphgen.DisjointUnion(graphgen.Cube(), graphgen.Graph{N: 3}, graphgen.Path(2), graphgen.Octahedron()),
	} {
		add(g.Name+"-multi", g.N, multigraph(g, uint64(i)))
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			r := checkDraw(t, c)
			// The same drawing as Draw of the simple graph (its pairs in
			// order of first occurrence): repeats and loops are ignored
			// for the layout (Draw's doc).
			simple := r.PairList()
			d, err := Draw(c.n, simple, DrawOptions{})
			if err != nil {
				t.Fatal(err)
			}
			if !reflect.DeepEqual(d.X, r.X) || !reflect.DeepEqual(d.Y, r.Y) || d.Width != r.Width || d.Height != r.Height {
				t.Errorf("Draw of the multigraph and of its simple graph differ")
			}
		})
	}
}

// TestDrawNonPlanar draws non-planar multigraphs.
func TestDrawNonPlanar(t *testing.T) {
	kn := func(n int) int { return n*(n-1)/2 - (3*n - 6) } // SOURCES.md: skewness of K_n
	kmn := func(m, n int) int { return m*n - 2*(m+n) + 4 } // SOURCES.md: skewness of K_{m,n}
	var cases []drawCase
	add := func(g graphgen.Graph, skew int, seed uint64, explain int) {
		cases = append(cases, drawCase{name: g.Name, n: g.N, raw: g.Edges, skew: skew, explain: explain})
		cases = append(cases, drawCase{name: g.Name + "-multi", n: g.N, raw: multigraph(g, seed), skew: skew, explain: explain})
	}
	for _, n := range []int{5, 6, 7, 8, 10} {
		add(graphgen.Complete(n), kn(n), uint64(n), 10)
	}
	for _, mn := range [][2]int{{3, 3}, {3, 4}, {4, 4}, {3, 7}, {5, 5}} {
		add(graphgen.CompleteBipartite(mn[0], mn[1]), kmn(mn[0], mn[1]), uint64(mn[0]*10+mn[1]), 10)
	}
	add(graphgen.Petersen(), 2, 1, 10) // SOURCES.md: skewness of Petersen is 2
	add(graphgen.Relabel(graphgen.Petersen(), 4), 2, 2, 10)
	for i, nm := range [][2]int{{8, 20}, {12, 40}, {30, 100}, {60, 250}, {200, 700}, {500, 2000}} {
		add(graphgen.RandomGnm(nm[0], nm[1], uint64(50+i)), -1, uint64(60+i), 6)
	}
	for i, ne := range [][2]int{{5, 1}, {6, 2}, {20, 1}, {50, 5}, {200, 20}, {400, 60}} {
		add(graphgen.PlanarPlusExtra(ne[0], ne[1], uint64(70+i)), -1, uint64(80+i), 6)
	}
	// A non-planar part next to planar parts and isolated vertices.
	add(graphgen.DisjointUnion(graphgen.Grid(4, 4), graphgen.Complete(5), graphgen.Graph{N: 2},
		graphgen.CompleteBipartite(3, 3), graphgen.Path(2)), 2, 9, 10)
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			g := graphgen.Graph{N: c.n}
			for _, e := range c.raw {
				if e[0] != e[1] {
					g.Edges = append(g.Edges, e)
				}
			}
			simple, _ := planarize.Simplify(c.n, g.Edges)
			if planarize.IsPlanar(c.n, simple) {
				t.Fatalf("test input is planar")
			}
			checkDraw(t, c)
		})
	}
}

// TestDrawPlanarPlusExtraBound checks Euler's bound exactly where it bites:
// a maximal planar graph plus e extra pairs loses at least e pairs.
func TestDrawPlanarPlusExtraBound(t *testing.T) {
	for i, ne := range [][2]int{{5, 1}, {10, 3}, {100, 10}, {300, 40}} {
		g := graphgen.PlanarPlusExtra(ne[0], ne[1], uint64(90+i))
		r, err := Draw(g.N, g.Edges, DrawOptions{})
		if err != nil {
			t.Fatal(err)
		}
		// Euler: at most 3n-6 of the 3n-6+extra pairs stay (SOURCES.md).
		if r.RemovedPairs < ne[1] || r.LowerBound > r.RemovedPairs {
			t.Errorf("%s: RemovedPairs %d, LowerBound %d; Euler needs >= %d", g.Name, r.RemovedPairs, r.LowerBound, ne[1])
		}
		if len(r.Kept()) > 3*g.N-6 {
			t.Errorf("%s: %d kept pairs, more than 3n-6 = %d", g.Name, len(r.Kept()), 3*g.N-6)
		}
		checkCrossingFree(t, g.Name, &r.Drawing, r.Kept())
	}
}

// TestDrawDeterministic runs Draw and Explain again on the same input and
// on a copy of it (RULES: output is deterministic).
func TestDrawDeterministic(t *testing.T) {
	for i, g := range []graphgen.Graph{
		graphgen.RandomGnm(300, 1000, 1), graphgen.PlanarPlusExtra(200, 30, 2),
		graphgen.Complete(9), graphgen.RandomPlanar(300, 0.7, 3),
	} {
		raw := multigraph(g, uint64(i))
		first, err := Draw(g.N, raw, DrawOptions{})
		if err != nil {
			t.Fatal(err)
		}
		for range 2 {
			again, err := Draw(g.N, append([][2]int32(nil), raw...), DrawOptions{})
			if err != nil {
				t.Fatal(err)
			}
			again.Times = first.Times // durations are measured, not computed
			if !reflect.DeepEqual(first, again) {
				t.Errorf("%s: Draw gives different results for the same input", g.Name)
				break
			}
			if len(first.Removed) > 0 {
				i := first.Removed[len(first.Removed)/2]
				k1, ok1 := first.Explain(i, nil)
				k2, ok2 := again.Explain(i, nil)
				if ok1 != ok2 || !reflect.DeepEqual(k1, k2) {
					t.Errorf("%s: Explain(%d) differs between runs", g.Name, i)
				}
			}
		}
	}
}

// TestDrawInvalidInput hands Draw edges that name no vertex. RULES: never
// panic on any input; return errors. An edge with an end outside 0..n-1
// is not an edge of an n-vertex graph, so Draw must say so.
func TestDrawInvalidInput(t *testing.T) {
	tests := []struct {
		name  string
		n     int
		edges [][2]int32
	}{
		{"negative-n", -1, nil},
		{"end-equal-to-n", 3, [][2]int32{{0, 1}, {0, 3}}},
		{"negative-end", 3, [][2]int32{{-1, 0}}},
		{"loop-outside", 2, [][2]int32{{0, 1}, {5, 5}}},
		{"loop-in-empty-graph", 0, [][2]int32{{0, 0}}},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			defer func() {
				if r := recover(); r != nil {
					t.Errorf("Draw(%d, %v) panics: %v", tt.n, tt.edges, r)
				}
			}()
			if _, err := Draw(tt.n, tt.edges, DrawOptions{}); err == nil {
				t.Errorf("Draw(%d, %v) returns no error", tt.n, tt.edges)
			}
		})
	}
}

// TestExplainMisuse asks Explain about edges that were not removed: a
// kept edge, a loop and indices outside the edge list. Explain has
// nothing to explain there and must say so with ok = false, not panic
// (RULES: never panic on any input).
func TestExplainMisuse(t *testing.T) {
	raw := [][2]int32{{0, 1}, {0, 0}, {1, 2}, {2, 0}, {3, 4}}
	r, err := Draw(5, raw, DrawOptions{})
	if err != nil {
		t.Fatal(err)
	}
	for _, i := range []int{0, 1, 4, 5, -1} {
		func() {
			defer func() {
				if p := recover(); p != nil {
					t.Errorf("Explain(%d) panics: %v", i, p)
				}
			}()
			if k, ok := r.Explain(i, nil); ok {
				t.Errorf("Explain(%d) explains an edge that was not removed: %+v", i, k)
			}
		}()
	}
}

// TestExplainBudget checks that a tiny budget makes Explain give up
// rather than return something unchecked, and that an ample one works.
func TestExplainBudget(t *testing.T) {
	g := graphgen.PlanarPlusExtra(300, 5, 12)
	r, err := Draw(g.N, g.Edges, DrawOptions{})
	if err != nil {
		t.Fatal(err)
	}
	if len(r.Removed) == 0 {
		t.Fatal("nothing removed from a non-planar graph")
	}
	i := r.Removed[0]
	if k, ok := r.Explain(i, &planarize.Budget{Left: 1}); ok {
		t.Errorf("Explain with a budget of one edge visit succeeded: %+v", k)
	}
	k, ok := r.Explain(i, &planarize.Budget{Left: 1 << 40})
	if !ok {
		t.Fatal("Explain with an ample budget failed")
	}
	kept := map[[2]int32]bool{}
	for _, e := range r.Kept() {
		kept[pairKey(e)] = true
	}
	target := -1
	for j, p := range r.PairList() {
		if pairKey(p) == pairKey(g.Edges[i]) {
			target = j
		}
	}
	checkExplanation(t, "budgeted Explain", g.N, r.PairList(), target, kept, k)
}
