package planarize

import (
	"fmt"
	"slices"
	"testing"

	"github.com/gridwood/gridwood/internal/graphgen"
	"github.com/gridwood/gridwood/internal/order"
)

// keptEdges returns the edges that res keeps.
func keptEdges(edges [][2]int32, res *Subgraph) [][2]int32 {
	gone := make([]bool, len(edges))
	for _, e := range res.Removed {
		if e >= 0 && int(e) < len(edges) {
			gone[e] = true
		}
	}
	kept := make([][2]int32, 0, len(edges)-len(res.Removed))
	for i, e := range edges {
		if !gone[i] {
			kept = append(kept, e)
		}
	}
	return kept
}

// checkSubgraph verifies a MaximalPlanar result against its documented
// contract: Removed is increasing and in range, the kept graph is planar
// (its embedding passes embChecker), putting back any one removed edge
// makes it non-planar (maximality), LowerBound <= len(Removed), and Optimal
// implies equality. If skew >= 0 it is the true minimum (skewness), and
// then LowerBound <= skew <= len(Removed) must hold, with equality when
// Optimal is claimed.
func checkSubgraph(n int, edges [][2]int32, res *Subgraph, skew int) error {
	if res == nil {
		return fmt.Errorf("nil result")
	}
	for j, e := range res.Removed {
		if e < 0 || int(e) >= len(edges) {
			return fmt.Errorf("removed edge %d out of range", e)
		}
		if j > 0 && res.Removed[j-1] >= e {
			return fmt.Errorf("Removed not strictly increasing at %d: %v", j, res.Removed[j-1:j+1])
		}
	}
	kept := keptEdges(edges, res)
	emb, ok := Embed(n, kept)
	if !ok {
		return fmt.Errorf("kept graph (%d edges) is not planar", len(kept))
	}
	if err := checkEmbedding(n, kept, emb); err != nil {
		return fmt.Errorf("kept graph: %v", err)
	}
	var l lr
	plus := append(kept, [2]int32{})
	for _, e := range res.Removed {
		plus[len(plus)-1] = edges[e]
		if l.isPlanar(n, plus) {
			return fmt.Errorf("removed edge %d %v can be put back: not maximal", e, edges[e])
		}
	}
	if res.LowerBound < 0 || res.LowerBound > len(res.Removed) {
		return fmt.Errorf("LowerBound %d outside [0, %d]", res.LowerBound, len(res.Removed))
	}
	if res.Optimal && res.LowerBound != len(res.Removed) {
		return fmt.Errorf("Optimal with LowerBound %d < %d removed", res.LowerBound, len(res.Removed))
	}
	if skew >= 0 {
		if len(res.Removed) < skew {
			return fmt.Errorf("%d removed, below the skewness %d", len(res.Removed), skew)
		}
		if res.LowerBound > skew {
			return fmt.Errorf("LowerBound %d exceeds the skewness %d: not a valid bound", res.LowerBound, skew)
		}
		if res.Optimal && len(res.Removed) != skew {
			return fmt.Errorf("claims optimal with %d removed, skewness is %d", len(res.Removed), skew)
		}
	}
	return nil
}

// bruteSkewness finds the fewest edges whose removal leaves a planar graph
// by trying every k-subset for k = 0, 1, ... (starting at the Euler bound
// m - (3n-6)). Only for small graphs; returns -1 beyond maxK.
func bruteSkewness(n int, edges [][2]int32, maxK int) int {
	m := len(edges)
	start := 0
	if n >= 3 {
		start = max(0, m-(3*n-6))
	}
	var l lr
	rest := make([][2]int32, 0, m)
	out := make([]bool, m)
	var try func(from, k int) bool
	try = func(from, k int) bool { // depth k <= maxK
		if k == 0 {
			rest = rest[:0]
			for i, e := range edges {
				if !out[i] {
					rest = append(rest, e)
				}
			}
			return l.isPlanar(n, rest)
		}
		for i := from; i <= m-k; i++ {
			out[i] = true
			found := try(i+1, k-1)
			out[i] = false
			if found {
				return true
			}
		}
		return false
	}
	for k := start; k <= maxK && k <= m; k++ {
		if try(0, k) {
			return k
		}
	}
	return -1
}

// TestSubgraphCheckerRejects makes sure checkSubgraph can fail, on K5
// (skewness 1: Kuratowski 1930, and K5 minus an edge is planar).
func TestSubgraphCheckerRejects(t *testing.T) {
	k5 := graphgen.Complete(5)
	if err := checkSubgraph(5, k5.Edges, &Subgraph{Removed: []int32{3}, Optimal: true, LowerBound: 1}, 1); err != nil {
		t.Fatalf("valid result rejected: %v", err)
	}
	for name, res := range map[string]*Subgraph{
		"nothing removed":     {Optimal: true},
		"not maximal":         {Removed: []int32{0, 1}, LowerBound: 1},
		"repeated":            {Removed: []int32{3, 3}, LowerBound: 1},
		"unsorted":            {Removed: []int32{7, 2}, LowerBound: 1},
		"out of range":        {Removed: []int32{10}, LowerBound: 1},
		"false optimal claim": {Removed: []int32{3}, Optimal: true},
		"bound above result":  {Removed: []int32{3}, LowerBound: 2},
	} {
		if err := checkSubgraph(5, k5.Edges, res, 1); err == nil {
			t.Errorf("checker accepts a result with %s", name)
		}
	}
	// Against a wrong skewness the valid result must fail too.
	if err := checkSubgraph(5, k5.Edges, &Subgraph{Removed: []int32{3}, Optimal: true, LowerBound: 1}, 2); err == nil {
		t.Error("checker accepts fewer removals than the skewness")
	}
}

// TestMaximalPlanarSkewness checks families with a known skewness
// (SOURCES.md, "Skewness"): K_n keeps a triangulation, 3n-6 edges (the
// Euler bound, reached since K_n contains a triangulation); K_{m,n} keeps
// 2(m+n)-4 edges (the bipartite Euler bound, reached), so it is planar for
// m or n = 2; the Petersen graph loses 2 (girth 5 allows 13 of 15 edges).
func TestMaximalPlanarSkewness(t *testing.T) {
	type testCase struct {
		g    graphgen.Graph
		skew int
	}
	var tests []testCase
	for _, n := range []int{5, 6, 7, 8, 9, 10, 11, 12, 13, 14, 15, 30, 60} {
		tests = append(tests, testCase{graphgen.Complete(n), n*(n-1)/2 - (3*n - 6)})
	}
	bip := [][2]int{{10, 12}}
	for a := 2; a <= 8; a++ {
		for b := 2; b <= 8; b++ {
			bip = append(bip, [2]int{a, b})
		}
	}
	for _, ab := range bip {
		a, b := ab[0], ab[1]
		tests = append(tests, testCase{graphgen.CompleteBipartite(a, b), max(0, a*b-2*(a+b)+4)})
	}
	tests = append(tests,
		testCase{graphgen.Petersen(), 2},
		testCase{graphgen.Relabel(graphgen.Petersen(), 4), 2},
		testCase{graphgen.Relabel(graphgen.Complete(9), 4), 15},
		testCase{graphgen.Relabel(graphgen.CompleteBipartite(5, 7), 4), 35 - 24 + 4},
	)
	for _, tt := range tests {
		res := MaximalPlanar(tt.g.N, tt.g.Edges, SubgraphOptions{})
		if err := checkSubgraph(tt.g.N, tt.g.Edges, res, tt.skew); err != nil {
			t.Errorf("%s: %v", tt.g.Name, err)
			continue
		}
		if len(res.Removed) != tt.skew {
			t.Errorf("%s: %d removed, skewness is %d", tt.g.Name, len(res.Removed), tt.skew)
		}
	}
}

// TestMaximalPlanarAgainstBruteForce runs every non-planar labelled graph
// on 6 vertices, and random graphs on 7 to 9 vertices, against the
// exhaustive skewness: the lower bound must be valid and any claim of
// optimality true.
func TestMaximalPlanarAgainstBruteForce(t *testing.T) {
	nonPlanar, optimal, beyondEuler, provedBeyond := 0, 0, 0, 0
	graphgen.AllSimpleGraphs(6, func(edges [][2]int32) {
		if IsPlanar(6, edges) {
			return
		}
		nonPlanar++
		res := MaximalPlanar(6, edges, SubgraphOptions{})
		if res.Optimal {
			optimal++
		}
		if err := checkSubgraph(6, edges, res, bruteSkewness(6, edges, 3)); err != nil {
			t.Errorf("%v: %v", edges, err)
		}
	})
	// A066537: 2^15 - 32071 = 697 labelled non-planar graphs on 6 vertices.
	if nonPlanar != 697 {
		t.Errorf("%d non-planar graphs on 6 vertices, want 697", nonPlanar)
	}
	t.Logf("n=6: %d of %d results claim optimality", optimal, nonPlanar)
	for n := 7; n <= 10; n++ {
		for seed := range uint64(25) {
			m := 2*n + int(seed)%(n+2)
			g := graphgen.RandomGnm(n, m, seed)
			res := MaximalPlanar(g.N, g.Edges, SubgraphOptions{})
			skew := bruteSkewness(g.N, g.Edges, 4)
			if err := checkSubgraph(g.N, g.Edges, res, skew); err != nil {
				t.Errorf("%s: %v", g.Name, err)
			}
			if skew > max(0, len(g.Edges)-(3*n-6)) {
				beyondEuler++
				if res.Optimal {
					provedBeyond++
				}
			}
		}
	}
	t.Logf("n=7..10: %d graphs with skewness above the Euler bound, %d of them proved optimal", beyondEuler, provedBeyond)
}

// TestMaximalPlanarRandom checks the contract on random, dense and
// planar-plus-extra graphs.
func TestMaximalPlanarRandom(t *testing.T) {
	gs := []graphgen.Graph{
		graphgen.RandomGnm(10, 30, 1), graphgen.RandomGnm(20, 60, 2), graphgen.RandomGnm(50, 150, 3),
		graphgen.RandomGnm(100, 300, 4), graphgen.RandomGnm(300, 1000, 5), graphgen.RandomGnm(2000, 6000, 6),
		graphgen.RandomGnm(30, 300, 7), graphgen.RandomGnm(60, 1000, 8), graphgen.RandomGnm(100, 3000, 9),
		graphgen.RandomGnm(500, 600, 10), // sparse: many small blocks
	}
	for _, n := range []int{10, 100, 1000, 20000} {
		for _, k := range []int{1, 3, 10} {
			gs = append(gs, graphgen.PlanarPlusExtra(n, k, uint64(n+k)))
		}
	}
	for _, g := range gs {
		res := MaximalPlanar(g.N, g.Edges, SubgraphOptions{})
		if err := checkSubgraph(g.N, g.Edges, res, -1); err != nil {
			t.Errorf("%s: %v", g.Name, err)
			continue
		}
		// Euler (SOURCES.md): at most 3n-6 edges can stay.
		if need := len(g.Edges) - (3*g.N - 6); len(res.Removed) < need {
			t.Errorf("%s: %d removed, Euler needs at least %d", g.Name, len(res.Removed), need)
		}
		t.Logf("%s: %d removed, lower bound %d, optimal %v", g.Name, len(res.Removed), res.LowerBound, res.Optimal)
	}
}

// TestMaximalPlanarDense covers blocks dense enough for the dense seed,
// where a test per edge would cost O(nm): the removal must still be
// maximal, on K_n it must be the skewness n(n-1)/2 - (3n-6) (the Euler
// bound, reached by any triangulation), and on K_{m,n} it must be
// mn - 2(m+n) + 4 (the bound for triangle-free planar graphs, reached by a
// quadrangulation; SOURCES.md gives both formulas).
func TestMaximalPlanarDense(t *testing.T) {
	for _, tc := range []struct {
		g     graphgen.Graph
		dense bool // the dense seed applies
		skew  int  // the skewness when known, else -1
	}{
		{graphgen.Complete(5), true, 1},
		{graphgen.Complete(200), true, 200*199/2 - (3*200 - 6)},
		{graphgen.RandomGnm(80, 2000, 1), true, -1},
		{graphgen.RandomGnm(150, 5000, 2), true, -1},
		{graphgen.RandomGnm(300, 6000, 3), true, -1},
		{graphgen.CompleteBipartite(40, 40), true, 40*40 - 2*80 + 4},
		{graphgen.CompleteBipartite(3, 30), true, 3*30 - 2*33 + 4},
		{graphgen.RandomGnm(2000, 6000, 4), false, -1}, // sparse
	} {
		g := tc.g
		adj := newCSR(g.N, g.Edges)
		start, _ := analyseBlock(g.N, g.Edges, adj)
		seed := denseSeed(g.N, g.Edges, adj, start)
		if (seed.edges != nil) != tc.dense {
			t.Errorf("%s: dense seed used = %v, want %v", g.Name, seed.edges != nil, tc.dense)
		}
		res := MaximalPlanar(g.N, g.Edges, SubgraphOptions{})
		if err := checkSubgraph(g.N, g.Edges, res, -1); err != nil {
			t.Errorf("%s: %v", g.Name, err)
			continue
		}
		if tc.skew >= 0 && (len(res.Removed) != tc.skew || !res.Optimal) {
			t.Errorf("%s: %d removed (optimal %v), the skewness is %d", g.Name, len(res.Removed), res.Optimal, tc.skew)
		}
	}
}

// TestMaximalPlanarMeshWithCluster covers a triangulated mesh with a dense
// cluster on some of its vertices: the mesh alone already has Euler's 3n-6
// edges, so at least as many edges as the cluster adds must go (the lower
// bound), and keeping the mesh reaches it. Taking the cluster's edges first
// (the dense-first order alone) removed 503 edges here, the mesh-first
// order 193 (measured when written); the check allows 5% over the bound.
func TestMaximalPlanarMeshWithCluster(t *testing.T) {
	g := graphgen.RandomTriangulation(3000, 2)
	raw := append([][2]int32(nil), g.Edges...)
	for i := range int32(20) {
		for j := i + 1; j < 20; j++ {
			raw = append(raw, [2]int32{i * 97, j * 97})
		}
	}
	edges, _ := Simplify(g.N, raw)
	res := MaximalPlanar(g.N, edges, SubgraphOptions{})
	if err := checkSubgraph(g.N, edges, res, -1); err != nil {
		t.Fatal(err)
	}
	lower := len(edges) - (3*g.N - 6)
	if res.LowerBound != lower {
		t.Errorf("lower bound %d, want Euler's %d", res.LowerBound, lower)
	}
	if len(res.Removed)*100 > lower*105 {
		t.Errorf("%d edges removed, more than 5%% over the lower bound %d", len(res.Removed), lower)
	}
}

// withStrays returns g's edges with k seeded random pairs added (loops and
// repeats possible), renumbered depth-first and simplified as the command
// gives them to MaximalPlanar.
func withStrays(g graphgen.Graph, k int, seed uint64) [][2]int32 {
	x := graphgen.WithStrays(g, k, seed)
	_, renamed, _ := order.DepthFirst(x.N, x.Edges)
	edges, _ := Simplify(x.N, renamed)
	return edges
}

// TestMaximalPlanarMeshWithStrays checks a planar mesh with a few stray
// long edges, in the vertex order a depth-first search gives (the
// command's renumbering, which puts strays among the mesh's edges): the
// 50 x 50 grid (planar: drawn on itself) and 60% of a random triangulation's
// edges, each with 10 random extra pairs. Setting aside the strays is
// enough, so at most 10 may go (the grid lost 284 of its own edges before
// edges on no triangle and no 4-cycle were taken last).
func TestMaximalPlanarMeshWithStrays(t *testing.T) {
	for _, g := range []graphgen.Graph{graphgen.Grid(50, 50), graphgen.RandomPlanar(3000, 0.6, 3)} {
		edges := withStrays(g, 10, 5)
		res := MaximalPlanar(g.N, edges, SubgraphOptions{})
		if err := checkSubgraph(g.N, edges, res, -1); err != nil {
			t.Fatal(err)
		}
		if len(res.Removed) > 10 {
			t.Errorf("%s + 10: %d edges removed, where the 10 strays would do", g.Name, len(res.Removed))
		}
	}
}

// TestMaximalPlanarComposite checks inputs made of several blocks or
// components. Skewness adds over blocks, since a graph is planar iff each
// of its blocks is (common practice), and K5 and K3,3 each need exactly one
// removal (Kuratowski 1930, and each minus an edge is planar).
func TestMaximalPlanarComposite(t *testing.T) {
	k5, k33, pet := graphgen.Complete(5), graphgen.CompleteBipartite(3, 3), graphgen.Petersen()
	bridged := graphgen.DisjointUnion(k5, k33)
	bridged.Edges = append(bridged.Edges, [2]int32{4, 5})
	bridged.Name = "K5-bridge-K3,3"
	tests := []struct {
		g    graphgen.Graph
		skew int
	}{
		{graphgen.DisjointUnion(k5, k33), 2},
		{joinAt(k5, 0, k33), 2},
		{joinAt(k33, 5, k5), 2},
		{graphgen.Relabel(joinAt(k5, 3, k33), 8), 2},
		{bridged, 2},
		{graphgen.DisjointUnion(pet, pet, pet, k5), 7},
		{joinAt(joinAt(k5, 0, k5), 0, k5), 3},
		{graphgen.DisjointUnion(k5, graphgen.RandomTriangulation(200, 1), k33, graphgen.Path(10)), 2},
		{graphgen.Relabel(graphgen.DisjointUnion(graphgen.Complete(7), graphgen.CompleteBipartite(4, 4), graphgen.Grid(5, 5)), 3), 6 + 4},
	}
	for _, tt := range tests {
		res := MaximalPlanar(tt.g.N, tt.g.Edges, SubgraphOptions{})
		if err := checkSubgraph(tt.g.N, tt.g.Edges, res, tt.skew); err != nil {
			t.Errorf("%s: %v", tt.g.Name, err)
			continue
		}
		if len(res.Removed) != tt.skew {
			t.Errorf("%s: %d removed, want %d", tt.g.Name, len(res.Removed), tt.skew)
		}
	}
}

// TestMaximalPlanarPlanarInput checks that planar graphs lose nothing.
func TestMaximalPlanarPlanarInput(t *testing.T) {
	for _, g := range []graphgen.Graph{
		{Name: "empty"}, {N: 3, Name: "isolated"}, graphgen.Complete(4), graphgen.Grid(30, 30),
		graphgen.RandomTriangulation(3000, 2), graphgen.NestedTriangles(500), graphgen.RandomTree(100, 1),
	} {
		res := MaximalPlanar(g.N, g.Edges, SubgraphOptions{Effort: 2})
		if len(res.Removed) != 0 || !res.Optimal || res.LowerBound != 0 {
			t.Errorf("%s: planar input gave %+v", g.Name, res)
		}
	}
}

// TestMaximalPlanarDeterministic checks RULES.md ("Output is
// deterministic") and the Effort contract: the same input and Effort give
// the same result, and more Effort never removes more edges, since the
// restarts keep the best (the documented intent of SubgraphOptions).
// Blocks of more than 120 edges skip the exact search and so are fast at
// any Effort; two smaller graphs exercise the exact search, which at
// Effort 0 already costs a few hundred milliseconds each.
func TestMaximalPlanarDeterministic(t *testing.T) {
	type testCase struct {
		g       graphgen.Graph
		efforts []int
	}
	all := []int{1, 2, 5}
	tests := []testCase{
		{graphgen.Petersen(), all},
		{graphgen.CompleteBipartite(5, 6), all},
		{graphgen.PlanarPlusExtra(300, 20, 1), all},
		{graphgen.RandomGnm(12, 36, 0), []int{1}},
		{graphgen.RandomGnm(24, 60, 102), []int{1}},
	}
	for seed := range uint64(8) {
		n := 42 + 6*int(seed)
		tests = append(tests, testCase{graphgen.RandomGnm(n, 3*n, seed), all}, testCase{graphgen.RandomGnm(n, 4*n, seed+100), all})
	}
	for _, tt := range tests {
		g := tt.g
		base := MaximalPlanar(g.N, g.Edges, SubgraphOptions{})
		again := MaximalPlanar(g.N, g.Edges, SubgraphOptions{})
		if !slices.Equal(base.Removed, again.Removed) || base.LowerBound != again.LowerBound || base.Optimal != again.Optimal {
			t.Errorf("%s: two runs at effort 0 differ", g.Name)
		}
		for _, effort := range tt.efforts {
			a := MaximalPlanar(g.N, g.Edges, SubgraphOptions{Effort: effort})
			if err := checkSubgraph(g.N, g.Edges, a, -1); err != nil {
				t.Errorf("%s effort %d: %v", g.Name, effort, err)
			}
			if len(a.Removed) > len(base.Removed) {
				t.Errorf("%s: effort %d removes %d edges, effort 0 only %d", g.Name, effort, len(a.Removed), len(base.Removed))
			}
			if len(tt.efforts) > 1 {
				b := MaximalPlanar(g.N, g.Edges, SubgraphOptions{Effort: effort})
				if !slices.Equal(a.Removed, b.Removed) || a.LowerBound != b.LowerBound || a.Optimal != b.Optimal {
					t.Errorf("%s effort %d: two runs differ", g.Name, effort)
				}
			}
		}
	}
}

func BenchmarkMaximalPlanar(b *testing.B) {
	const seed = 1
	for _, g := range []graphgen.Graph{
		graphgen.RandomGnm(2000, 6000, seed),
		graphgen.Complete(60),
		graphgen.PlanarPlusExtra(100000, 10, seed),
	} {
		b.Run(g.Name, func(b *testing.B) {
			for b.Loop() {
				MaximalPlanar(g.N, g.Edges, SubgraphOptions{})
			}
		})
	}
	// PlanarPlusExtra(100000, 10, seed) is this triangulation plus ten
	// edges: the ratio of the two lines is the cost of planarizing over
	// plain embedding.
	g := graphgen.RandomTriangulation(100000, seed)
	b.Run("embed-"+g.Name, func(b *testing.B) {
		for b.Loop() {
			Embed(g.N, g.Edges)
		}
	})
}

// TestMaximalPlanarProgress checks the progress reports: never falling,
// between 0 and 1, ending at 1, and without effect on the result.
func TestMaximalPlanarProgress(t *testing.T) {
	g := graphgen.PlanarPlusExtra(2000, 300, 4)
	edges, _ := Simplify(g.N, g.Edges)
	plain := MaximalPlanar(g.N, edges, SubgraphOptions{})
	var seen []float64
	watched := MaximalPlanar(g.N, edges, SubgraphOptions{Progress: func(done float64) { seen = append(seen, done) }})
	if !slices.Equal(plain.Removed, watched.Removed) {
		t.Fatalf("%d removed with progress reports, %d without", len(watched.Removed), len(plain.Removed))
	}
	if len(seen) < 3 {
		t.Fatalf("%d progress reports: %v", len(seen), seen)
	}
	for i, d := range seen {
		if d < 0 || d > 1 || i > 0 && d < seen[i-1] {
			t.Fatalf("report %d of %d is %v after %v", i, len(seen), d, seen[max(0, i-1)])
		}
	}
	if last := seen[len(seen)-1]; last != 1 {
		t.Fatalf("last report %v, want 1", last)
	}
}

// oneAtATime is the plain statement of the greedy search: from the same
// seed and the same candidates, each candidate is kept if the kept graph
// with it is planar (one whole test each), and rejected otherwise or once
// the kept graph holds Euler's bound.
func oneAtATime(gs *greedySearch, edges [][2]int32, n int) []int32 {
	kept := slices.Clone(gs.kept)
	rejected := slices.Clone(gs.rejected)
	for _, e := range gs.cand {
		if len(kept) >= gs.limit {
			rejected = append(rejected, e)
			continue
		}
		var with [][2]int32
		for _, k := range kept {
			with = append(with, edges[k])
		}
		if IsPlanar(n, append(with, edges[e])) {
			kept = append(kept, e)
		} else {
			rejected = append(rejected, e)
		}
	}
	slices.Sort(rejected)
	return rejected
}

// TestGreedyMatchesOneAtATime checks that the group testing, the local
// proofs and stopping and going on under a work budget (as bothOrders
// runs the searches) change the cost of the greedy search and nothing
// else: in both orders, from both seeds, with the proofs off and on from
// small kept graphs, the rejected edges are those of oneAtATime.
func TestGreedyMatchesOneAtATime(t *testing.T) {
	gs := []graphgen.Graph{
		graphgen.PlanarPlusExtra(300, 40, 1),
		graphgen.PlanarPlusExtra(200, 200, 2),
		graphgen.WithStrays(graphgen.RandomPlanar(400, 0.6, 3), 30, 3),
		graphgen.WithStrays(graphgen.Grid(15, 15), 25, 3),
		graphgen.RandomGnm(120, 360, 5),
		graphgen.Complete(12),
		graphgen.CompleteBipartite(6, 7),
	}
	saved := localProofSize
	defer func() { localProofSize = saved }()
	proofs := 0
	for _, from := range []int{1 << 30, 5} {
		localProofSize = from
		for _, gg := range gs {
			_, renamed, _ := order.DepthFirst(gg.N, gg.Edges)
			edges, _ := Simplify(gg.N, renamed)
			n := gg.N
			adj := newCSR(n, edges)
			limit := edgeLimit(n, edges, adj)
			start, support := analyseBlock(n, edges, adj)
			if support != nil {
				markLongCycles(n, edges, adj, support)
			}
			dense := denseSeed(n, edges, adj, start)
			for _, by := range []int{denseFirst, meshFirst} {
				ord := identity(len(edges))
				if support != nil {
					ord = bySupport(support, ord, by)
				}
				for _, seed := range []seeded{dense, {}} {
					search := func() *greedySearch { return newGreedySearch(n, edges, adj, ord, support, by, seed, limit) }
					a := search()
					want := oneAtATime(a, edges, n)
					a.run()
					if a.proof != nil {
						proofs += int(a.proof.stamp)
					}
					if got := a.result(); !slices.Equal(got, want) {
						t.Errorf("%s, proofs from %d, order %d: %d rejected, one at a time %d", gg.Name, from, by, len(got), len(want))
					}
					for _, slice := range []int64{int64(len(edges)) + 1, int64(2*len(edges)) + 3} {
						b := search()
						for rounds := 0; ; rounds++ {
							b.t.budget = &Budget{Left: slice}
							if b.run() {
								break
							}
							if rounds > 1_000_000 {
								t.Fatalf("%s: no progress with slices of %d", gg.Name, slice)
							}
						}
						if got := b.result(); !slices.Equal(got, want) {
							t.Errorf("%s, proofs from %d, order %d, slices of %d: %d rejected, one at a time %d", gg.Name, from, by, slice, len(got), len(want))
						}
					}
				}
			}
		}
	}
	if proofs == 0 {
		t.Error("no local proof was tried: the proofs are not tested")
	}
}
