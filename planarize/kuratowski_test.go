package planarize

import (
	"errors"
	"fmt"
	"math/rand/v2"
	"slices"
	"strings"
	"testing"

	"github.com/gridwood/gridwood/internal/graphgen"
)

func pairKey(u, v int32) [2]int32 { return [2]int32{min(u, v), max(u, v)} }

// checkKuratowski verifies k as a certificate of non-planarity of the graph
// formed by the edges with indices in subset (all edges when subset is nil),
// using nothing of the package: the branch vertices and paths must form a
// subdivision of K5 or K3,3 made of exactly the returned edges, and every
// edge of must must be on it. By Kuratowski's theorem (1930) such a
// subdivision proves the graph non-planar.
func checkKuratowski(n int, edges [][2]int32, subset, must []int32, k *Kuratowski) error {
	if k == nil {
		return errors.New("ok but nil certificate")
	}
	var branches, paths int
	switch k.Kind {
	case K5:
		branches, paths = 5, 10
	case K33:
		branches, paths = 6, 9
	default:
		return fmt.Errorf("unknown kind %d", k.Kind)
	}
	if len(k.Branch) != branches || len(k.Paths) != paths {
		return fmt.Errorf("%v with %d branch vertices and %d paths, want %d and %d", k.Kind, len(k.Branch), len(k.Paths), branches, paths)
	}
	isBranch := map[int32]bool{}
	for _, b := range k.Branch {
		if b < 0 || int(b) >= n || isBranch[b] {
			return fmt.Errorf("branch vertex %d out of range or repeated", b)
		}
		isBranch[b] = true
	}
	allowed := map[int32]bool{}
	if subset == nil {
		for i := range edges {
			allowed[int32(i)] = true
		}
	}
	for _, i := range subset {
		allowed[i] = true
	}
	unused := map[[2]int32][]int32{} // returned edges by vertex pair, not yet walked
	returned := map[int32]bool{}
	for _, i := range k.Edges {
		if i < 0 || int(i) >= len(edges) || !allowed[i] {
			return fmt.Errorf("returned edge %d is not in the subset given", i)
		}
		if returned[i] {
			return fmt.Errorf("edge %d returned twice", i)
		}
		returned[i] = true
		e := edges[i]
		unused[pairKey(e[0], e[1])] = append(unused[pairKey(e[0], e[1])], i)
	}
	innerOf := map[int32]int{} // inner vertex -> its path
	branchPairs := map[[2]int32]bool{}
	walked := 0
	for pi, p := range k.Paths {
		if len(p) < 2 {
			return fmt.Errorf("path %d has %d vertices", pi, len(p))
		}
		a, b := p[0], p[len(p)-1]
		if !isBranch[a] || !isBranch[b] || a == b {
			return fmt.Errorf("path %d %v does not join two branch vertices", pi, p)
		}
		if branchPairs[pairKey(a, b)] {
			return fmt.Errorf("two paths join branch vertices %d and %d", a, b)
		}
		branchPairs[pairKey(a, b)] = true
		for j, v := range p {
			if v < 0 || int(v) >= n {
				return fmt.Errorf("path %d: vertex %d out of range", pi, v)
			}
			if j > 0 && j < len(p)-1 {
				if isBranch[v] {
					return fmt.Errorf("path %d passes through branch vertex %d", pi, v)
				}
				if q, ok := innerOf[v]; ok {
					return fmt.Errorf("inner vertex %d on paths %d and %d: not internally disjoint", v, q, pi)
				}
				innerOf[v] = pi
			}
			if j > 0 {
				key := pairKey(p[j-1], v)
				list := unused[key]
				if len(list) == 0 {
					return fmt.Errorf("path %d: no unused returned edge joins %d and %d", pi, p[j-1], v)
				}
				unused[key] = list[1:]
				walked++
			}
		}
	}
	if walked != len(k.Edges) {
		return fmt.Errorf("%d returned edges, but the paths use %d", len(k.Edges), walked)
	}
	// Ten distinct pairs of five vertices are all of K5's edges. For K3,3,
	// two-colour the branch vertices along the paths: nine distinct pairs
	// across two sides of three are all of K3,3's edges.
	if k.Kind == K33 {
		side := map[int32]int{k.Branch[0]: 1}
		for changed := true; changed; {
			changed = false
			for pr := range branchPairs {
				a, b := pr[0], pr[1]
				switch {
				case side[a] != 0 && side[b] == 0:
					side[b], changed = -side[a], true
				case side[b] != 0 && side[a] == 0:
					side[a], changed = -side[b], true
				case side[a] != 0 && side[a] == side[b]:
					return fmt.Errorf("paths join %d and %d on the same side: not bipartite", a, b)
				}
			}
		}
		count := 0
		for _, b := range k.Branch {
			if side[b] == 0 {
				return fmt.Errorf("branch vertex %d not reached by the paths", b)
			}
			if side[b] == 1 {
				count++
			}
		}
		if count != 3 {
			return fmt.Errorf("sides of %d and %d branch vertices, want 3 and 3", count, 6-count)
		}
	}
	for _, e := range must {
		if !returned[e] {
			return fmt.Errorf("must edge %d is not in the certificate", e)
		}
	}
	return nil
}

// TestCertificateCheckerRejects makes sure checkKuratowski can fail, on
// certificates built by hand.
func TestCertificateCheckerRejects(t *testing.T) {
	k33 := graphgen.CompleteBipartite(3, 3)
	valid := func() *Kuratowski {
		k := &Kuratowski{Kind: K33, Branch: []int32{0, 1, 2, 3, 4, 5}}
		for i, e := range k33.Edges {
			k.Edges = append(k.Edges, int32(i))
			k.Paths = append(k.Paths, []int32{e[0], e[1]})
		}
		return k
	}
	if err := checkKuratowski(6, k33.Edges, nil, nil, valid()); err != nil {
		t.Fatalf("valid K3,3 certificate rejected: %v", err)
	}
	// The triangular prism has six vertices of degree 3 and nine edges but
	// contains triangles, so it is no K3,3 (it is planar).
	prism := [][2]int32{{0, 1}, {1, 2}, {2, 0}, {3, 4}, {4, 5}, {5, 3}, {0, 3}, {1, 4}, {2, 5}}
	fake := &Kuratowski{Kind: K33, Branch: []int32{0, 1, 2, 3, 4, 5}}
	for i, e := range prism {
		fake.Edges = append(fake.Edges, int32(i))
		fake.Paths = append(fake.Paths, []int32{e[0], e[1]})
	}
	if err := checkKuratowski(6, prism, nil, nil, fake); err == nil {
		t.Error("checker accepts the triangular prism as a K3,3")
	}
	corruptions := map[string]func(k *Kuratowski) (subset, must []int32){
		"kind K5":         func(k *Kuratowski) ([]int32, []int32) { k.Kind = K5; return nil, nil },
		"a path missing":  func(k *Kuratowski) ([]int32, []int32) { k.Paths = k.Paths[1:]; return nil, nil },
		"an edge missing": func(k *Kuratowski) ([]int32, []int32) { k.Edges = k.Edges[1:]; return nil, nil },
		"an edge twice":   func(k *Kuratowski) ([]int32, []int32) { k.Edges[1] = k.Edges[0]; return nil, nil },
		"a branch twice":  func(k *Kuratowski) ([]int32, []int32) { k.Branch[5] = 0; return nil, nil },
		"path through a branch vertex": func(k *Kuratowski) ([]int32, []int32) {
			k.Paths[0] = []int32{0, 4, 1, 3} // walks 0-4, 4-1, 1-3
			return nil, nil
		},
		"edge outside the subset": func(k *Kuratowski) ([]int32, []int32) { return []int32{1, 2, 3, 4, 5, 6, 7, 8}, nil },
		"must edge not used":      func(k *Kuratowski) ([]int32, []int32) { return nil, []int32{9} },
		"a path reversed onto another": func(k *Kuratowski) ([]int32, []int32) {
			k.Paths[1] = []int32{k.Paths[0][1], k.Paths[0][0]}
			return nil, nil
		},
	}
	edges := append(slices.Clone(k33.Edges), [2]int32{0, 1}) // edge 9 is extra
	for name, corrupt := range corruptions {
		k := valid()
		subset, must := corrupt(k)
		if err := checkKuratowski(6, edges, subset, must, k); err == nil {
			t.Errorf("checker accepts a certificate with %s", name)
		}
	}
	// Shared inner vertices: subdivide two edges through the same new
	// vertex 6.
	sub := append(slices.Clone(k33.Edges), [2]int32{0, 6}, [2]int32{6, 3}, [2]int32{1, 6}, [2]int32{6, 4})
	k := valid()
	k.Edges = []int32{1, 2, 3, 5, 6, 7, 8, 9, 10, 11, 12}
	k.Paths[0] = []int32{0, 6, 3}
	k.Paths[4] = []int32{1, 6, 4}
	if err := checkKuratowski(7, sub, nil, nil, k); err == nil || !strings.Contains(err.Error(), "internally disjoint") {
		t.Error("checker accepts paths that share an inner vertex")
	}
}

// findKuratowski calls FindKuratowski and turns a panic into an error, so
// that one bad case does not stop the rest of the suite.
func findKuratowski(n int, edges [][2]int32, subset, must []int32, budget *Budget) (k *Kuratowski, ok bool, err error) {
	defer func() {
		if r := recover(); r != nil {
			err = fmt.Errorf("FindKuratowski panicked: %v", r)
		}
	}()
	k, ok = FindKuratowski(n, edges, subset, must, budget)
	return k, ok, nil
}

// subdivide replaces each edge of g by a path with extra(i) inner vertices.
func subdivide(g graphgen.Graph, extra func(i int) int) graphgen.Graph {
	h := graphgen.Graph{N: g.N, Name: g.Name + "-subdivided"}
	for i, e := range g.Edges {
		prev := e[0]
		for range extra(i) {
			v := int32(h.N)
			h.N++
			h.Edges = append(h.Edges, [2]int32{prev, v})
			prev = v
		}
		h.Edges = append(h.Edges, [2]int32{prev, e[1]})
	}
	return h
}

// joinAt glues b to a by identifying vertex 0 of b with vertex at of a.
func joinAt(a graphgen.Graph, at int32, b graphgen.Graph) graphgen.Graph {
	g := graphgen.Graph{N: a.N + b.N - 1, Name: a.Name + "-joined-" + b.Name}
	g.Edges = append(g.Edges, a.Edges...)
	for _, e := range b.Edges {
		var f [2]int32
		for j, v := range e {
			f[j] = v + int32(a.N) - 1
			if v == 0 {
				f[j] = at
			}
		}
		g.Edges = append(g.Edges, f)
	}
	return g
}

// TestFindKuratowskiKnown checks certificates for graphs whose obstruction
// is known. Kind: a subdivision of K5 has only five vertices of degree >= 3,
// too few for K3,3, and a graph of maximum degree 3 has no subdivision of K5
// (degree counting; common practice). A subdivision of K5 or K3,3 is
// edge-minimal non-planar, so the certificate is the whole graph.
func TestFindKuratowskiKnown(t *testing.T) {
	k5, k33 := graphgen.Complete(5), graphgen.CompleteBipartite(3, 3)
	rng := rand.New(rand.NewPCG(5, 5))
	random := func(int) int { return rng.IntN(6) }
	type testCase struct {
		g     graphgen.Graph
		kind  KuratowskiKind
		whole bool // the certificate is the whole graph
	}
	tests := []testCase{
		{k5, K5, true},
		{k33, K33, true},
		{graphgen.Petersen(), K33, false},
		{graphgen.Relabel(graphgen.Petersen(), 9), K33, false},
	}
	for s := range 6 {
		for _, g := range []graphgen.Graph{k5, k33} {
			kind := K5
			if g.N == 6 {
				kind = K33
			}
			h := subdivide(g, func(int) int { return s })
			tests = append(tests, testCase{h, kind, true}, testCase{graphgen.Relabel(h, uint64(s)), kind, true})
			tests = append(tests, testCase{graphgen.Relabel(subdivide(g, random), uint64(s)), kind, true})
			// The obstruction hidden in a planar graph: glued at a vertex
			// to a grid and a triangulation (every Kuratowski subgraph
			// lies in one block, and the others are planar).
			big := joinAt(joinAt(subdivide(g, random), 0, graphgen.TriangulatedGrid(8, 8)), 1, graphgen.RandomTriangulation(60, uint64(s)))
			tests = append(tests, testCase{graphgen.Relabel(big, uint64(s)), kind, false})
		}
	}
	for _, tt := range tests {
		k, ok, err := findKuratowski(tt.g.N, tt.g.Edges, nil, nil, nil)
		if err != nil || !ok {
			t.Errorf("%s: ok=%v err=%v, want a certificate", tt.g.Name, ok, err)
			continue
		}
		if err := checkKuratowski(tt.g.N, tt.g.Edges, nil, nil, k); err != nil {
			t.Errorf("%s: %v", tt.g.Name, err)
			continue
		}
		if k.Kind != tt.kind {
			t.Errorf("%s: kind %v, want %v", tt.g.Name, k.Kind, tt.kind)
		}
		if tt.whole && len(k.Edges) != len(tt.g.Edges) {
			t.Errorf("%s: certificate has %d of the %d edges of an edge-minimal non-planar graph", tt.g.Name, len(k.Edges), len(tt.g.Edges))
		}
	}
}

// TestFindKuratowskiSubset restricts the search to part of the edges.
func TestFindKuratowskiSubset(t *testing.T) {
	g := graphgen.DisjointUnion(graphgen.Complete(5), graphgen.Petersen(), graphgen.CompleteBipartite(3, 3))
	for _, tc := range []struct {
		name     string
		from, to int // edge index range of the subset
		kind     KuratowskiKind
	}{
		{"K5 part", 0, 10, K5},
		{"Petersen part", 10, 25, K33}, // maximum degree 3: no K5 subdivision
		{"K3,3 part", 25, 34, K33},
	} {
		var subset []int32
		for i := tc.from; i < tc.to; i++ {
			subset = append(subset, int32(i))
		}
		k, ok, err := findKuratowski(g.N, g.Edges, subset, nil, nil)
		if err != nil || !ok {
			t.Errorf("%s: ok=%v err=%v", tc.name, ok, err)
			continue
		}
		if err := checkKuratowski(g.N, g.Edges, subset, nil, k); err != nil {
			t.Errorf("%s: %v", tc.name, err)
		} else if k.Kind != tc.kind {
			t.Errorf("%s: kind %v, want %v", tc.name, k.Kind, tc.kind)
		}
	}
	// A planar subset of a non-planar graph has no certificate, also when
	// must names an edge outside the subset: the graph searched is the
	// subset alone ("formed by the edges with indices in subset"), and K5
	// minus an edge is planar.
	k5minus := []int32{0, 1, 2, 3, 4, 5, 6, 7, 8}
	for _, must := range [][]int32{nil, {9}} {
		k, ok, err := findKuratowski(g.N, g.Edges, k5minus, must, nil)
		if err == nil && ok {
			err = checkKuratowski(g.N, g.Edges, k5minus, nil, k)
		}
		if err != nil {
			t.Errorf("K5 minus an edge as subset, must = %v: %v", must, err)
		}
	}
}

// TestEveryVerdictCertified checks random graphs around the planarity
// threshold: each planar verdict must come with a valid plane embedding,
// each non-planar one must be backed by a Kuratowski subgraph that the
// independent checker accepts. Together this verifies the planarity test on
// inputs below the 3n-6 shortcut without trusting any of its parts.
func TestEveryVerdictCertified(t *testing.T) {
	var c embChecker
	planar, nonPlanar := 0, 0
	var gs []graphgen.Graph
	for n := 6; n <= 80; n += 2 {
		for seed := range uint64(8) {
			m := n + int(seed)*(2*n-6)/7 // from n to 3n-6 edges
			gs = append(gs, graphgen.RandomGnm(n, m, seed), graphgen.RandomPlanar(n, 0.9, seed))
		}
	}
	// Near-planar graphs: a random planar graph plus one to three random
	// new pairs, which may or may not destroy planarity.
	for seed := range uint64(60) {
		n := 10 + int(seed)*4
		g := graphgen.RandomPlanar(n, 0.5+float64(seed%5)/10, seed)
		rng := rand.New(rand.NewPCG(seed, 9))
		have := map[[2]int32]bool{}
		for _, e := range g.Edges {
			have[pairKey(e[0], e[1])] = true
		}
		for added := 0; added < 1+int(seed%3); {
			u, v := int32(rng.IntN(n)), int32(rng.IntN(n))
			if u != v && !have[pairKey(u, v)] {
				have[pairKey(u, v)] = true
				g.Edges = append(g.Edges, [2]int32{u, v})
				added++
			}
		}
		g.Name += "-plus-random"
		gs = append(gs, g)
	}
	for _, g := range gs {
		if emb, ok := Embed(g.N, g.Edges); ok {
			planar++
			if err := c.check(g.N, g.Edges, emb); err != nil {
				t.Errorf("%s: %v", g.Name, err)
			}
			if _, ok, err := findKuratowski(g.N, g.Edges, nil, nil, nil); ok || err != nil {
				t.Errorf("%s: planar, yet FindKuratowski ok=%v err=%v", g.Name, ok, err)
			}
			continue
		}
		nonPlanar++
		k, ok, err := findKuratowski(g.N, g.Edges, nil, nil, nil)
		if err != nil || !ok {
			t.Errorf("%s: not planar by Embed, but FindKuratowski ok=%v err=%v", g.Name, ok, err)
			continue
		}
		if err := checkKuratowski(g.N, g.Edges, nil, nil, k); err != nil {
			t.Errorf("%s: %v", g.Name, err)
		}
	}
	if planar < 50 || nonPlanar < 50 {
		t.Errorf("the sample should hold both verdicts: %d planar, %d not", planar, nonPlanar)
	}
}

// TestFindKuratowskiPlanar checks that planar inputs get no certificate.
func TestFindKuratowskiPlanar(t *testing.T) {
	k5, k33 := graphgen.Complete(5), graphgen.CompleteBipartite(3, 3)
	gs := []graphgen.Graph{
		{Name: "empty"}, {N: 4, Name: "isolated"}, graphgen.Cube(), graphgen.Grid(6, 7),
		graphgen.RandomTriangulation(300, 1), graphgen.RandomTree(50, 2), graphgen.Wheel(9),
		{N: 5, Edges: k5.Edges[1:], Name: "K5-minus-edge"},
		{N: 6, Edges: k33.Edges[:8], Name: "K3,3-minus-edge"},
	}
	for _, g := range gs {
		if k, ok, err := findKuratowski(g.N, g.Edges, nil, nil, nil); ok || err != nil {
			t.Errorf("%s: planar, yet ok=%v err=%v (%+v)", g.Name, ok, err, k)
		}
		if len(g.Edges) > 0 {
			if _, ok, err := findKuratowski(g.N, g.Edges, nil, []int32{0}, nil); ok || err != nil {
				t.Errorf("%s with must={0}: planar, yet ok=%v err=%v", g.Name, ok, err)
			}
		}
	}
}

// TestFindKuratowskiBudget checks that a search out of budget reports
// failure rather than a wrong certificate.
func TestFindKuratowskiBudget(t *testing.T) {
	for _, g := range []graphgen.Graph{
		graphgen.Complete(5), graphgen.Petersen(),
		graphgen.Relabel(subdivide(graphgen.CompleteBipartite(3, 3), func(i int) int { return i % 4 }), 1),
		graphgen.PlanarPlusExtra(200, 1, 3),
		graphgen.RandomGnm(40, 110, 2),
	} {
		for _, left := range []int64{0, 1, 5} {
			if k, ok, err := findKuratowski(g.N, g.Edges, nil, nil, &Budget{Left: left}); ok || err != nil {
				t.Errorf("%s: budget %d is too small for one test, yet ok=%v err=%v (%+v)", g.Name, left, ok, err, k)
			}
		}
		succeeded := false
		for left := int64(1); left < 1<<24 && !succeeded; left = left*3/2 + 1 {
			k, ok, err := findKuratowski(g.N, g.Edges, nil, nil, &Budget{Left: left})
			if err != nil {
				t.Errorf("%s budget %d: %v", g.Name, left, err)
				break
			}
			if ok {
				succeeded = true
				if err := checkKuratowski(g.N, g.Edges, nil, nil, k); err != nil {
					t.Errorf("%s budget %d: %v", g.Name, left, err)
				}
			}
		}
		if !succeeded {
			t.Errorf("%s: no certificate with any budget below 2^24", g.Name)
		}
	}
}

// TestExplainRemovedEdges is the explanation use case: for each edge e that
// MaximalPlanar removed, the kept graph plus e is non-planar (the kept graph
// is maximal) and the kept graph alone is planar, so every Kuratowski
// subgraph of kept+e contains e, and FindKuratowski with must = {e} must
// find one.
func TestExplainRemovedEdges(t *testing.T) {
	gs := []graphgen.Graph{
		graphgen.Complete(5), graphgen.Complete(7), graphgen.Complete(12),
		graphgen.CompleteBipartite(3, 3), graphgen.CompleteBipartite(4, 6), graphgen.Petersen(),
		joinAt(graphgen.Complete(5), 2, graphgen.CompleteBipartite(3, 3)),
		graphgen.PlanarPlusExtra(300, 5, 1),
		graphgen.PlanarPlusExtra(40, 30, 2),
		// Past nearFirstSize: the search narrows to a ball first.
		graphgen.PlanarPlusExtra(3000, 5, 3),
		graphgen.WithStrays(graphgen.RandomPlanar(3000, 0.6, 3), 10, 3),
		graphgen.WithStrays(graphgen.Grid(40, 40), 10, 3),
		graphgen.RandomGnm(400, 1200, 7),
	}
	for seed := range uint64(6) {
		gs = append(gs, graphgen.RandomGnm(30+10*int(seed), 90+40*int(seed), seed))
	}
	for _, g := range gs {
		g.Edges, _ = Simplify(g.N, g.Edges) // strays may repeat an edge or be loops
		res := MaximalPlanar(g.N, g.Edges, SubgraphOptions{})
		gone := make([]bool, len(g.Edges))
		for _, e := range res.Removed {
			gone[e] = true
		}
		var kept []int32
		for i := range g.Edges {
			if !gone[i] {
				kept = append(kept, int32(i))
			}
		}
		for j, e := range res.Removed {
			if j == 20 {
				break // enough per graph
			}
			subset := append(slices.Clone(kept), e)
			must := []int32{e}
			k, ok, err := findKuratowski(g.N, g.Edges, subset, must, nil)
			if err != nil || !ok {
				t.Errorf("%s: removed edge %d: ok=%v err=%v, want a certificate through it", g.Name, e, ok, err)
				continue
			}
			if err := checkKuratowski(g.N, g.Edges, subset, must, k); err != nil {
				t.Errorf("%s: removed edge %d: %v", g.Name, e, err)
			}
		}
	}
}

// TestExplainWithinBudget checks that certificates for strays in a big
// mesh come within the command's work bound for one certificate (20
// million, cmd/gridwood explainBudgetEach): the search narrows to a ball
// around the stray's ends before deleting edges. Before that, none of the
// 8 certificates of a 10^5-vertex random planar graph plus 10 random pairs
// was computed.
func TestExplainWithinBudget(t *testing.T) {
	const each = 20_000_000
	g := graphgen.WithStrays(graphgen.RandomPlanar(30000, 0.6, 5), 10, 5)
	edges, _ := Simplify(g.N, g.Edges)
	res := MaximalPlanar(g.N, edges, SubgraphOptions{})
	if len(res.Removed) == 0 {
		t.Fatal("no edge removed: the strays are planar with the mesh")
	}
	gone := make([]bool, len(edges))
	for _, e := range res.Removed {
		gone[e] = true
	}
	var kept []int32
	for i := range edges {
		if !gone[i] {
			kept = append(kept, int32(i))
		}
	}
	for _, e := range res.Removed {
		subset := append(slices.Clone(kept), e)
		budget := &Budget{Left: each}
		k, ok, err := findKuratowski(g.N, edges, subset, []int32{e}, budget)
		if err != nil || !ok {
			t.Errorf("removed edge %d: ok=%v err=%v, want a certificate within %d", e, ok, err, each)
			continue
		}
		if err := checkKuratowski(g.N, edges, subset, []int32{e}, k); err != nil {
			t.Errorf("removed edge %d: %v", e, err)
		}
		t.Logf("edge %d: %s, %d edges, %d of the budget spent", e, k.Kind, len(k.Edges), each-budget.Left)
	}
}

// TestFindKuratowskiMustOptional gives must edges while the rest of the
// graph is non-planar without them. FindKuratowski documents that an edge
// of must may then be left out, so only a valid certificate is required;
// how often the edge was kept is logged. In K_n (n >= 6) every edge lies on
// a K5 and in K_{a,b} (a, b >= 3) on a K3,3 (common practice), so a
// certificate through the edge always exists.
func TestFindKuratowskiMustOptional(t *testing.T) {
	for _, g := range []graphgen.Graph{
		graphgen.Complete(6), graphgen.Complete(7),
		graphgen.CompleteBipartite(3, 4), graphgen.CompleteBipartite(4, 4),
	} {
		bad, through := 0, 0
		for e := range int32(len(g.Edges)) {
			k, ok, err := findKuratowski(g.N, g.Edges, nil, []int32{e}, nil)
			if err == nil && !ok {
				err = errors.New("no certificate")
			}
			if err == nil {
				err = checkKuratowski(g.N, g.Edges, nil, nil, k)
			}
			if err != nil {
				bad++
				if bad <= 3 {
					t.Errorf("%s, must = {%d} %v: %v", g.Name, e, g.Edges[e], err)
				}
				continue
			}
			if slices.Contains(k.Edges, e) {
				through++
			}
		}
		if bad > 3 {
			t.Errorf("%s: %d of %d must edges failed", g.Name, bad, len(g.Edges))
		}
		t.Logf("%s: %d of %d certificates contain their must edge", g.Name, through, len(g.Edges))
	}
}

// TestFindKuratowskiImpossibleMust gives must edges that no single
// Kuratowski subgraph can hold (two different blocks). The promise is then
// void, but the answer must still be either no certificate or a valid one.
func TestFindKuratowskiImpossibleMust(t *testing.T) {
	twoK5 := joinAt(graphgen.Complete(5), 0, graphgen.Complete(5))
	withPendant := graphgen.Graph{N: 6, Name: "K5-with-pendant", Edges: append(slices.Clone(graphgen.Complete(5).Edges), [2]int32{4, 5})}
	for _, tc := range []struct {
		g    graphgen.Graph
		must []int32
	}{
		{twoK5, []int32{0, 19}},
		{twoK5, []int32{19, 0}},
		{withPendant, []int32{10}},
		{withPendant, []int32{10, 0}},
		{withPendant, []int32{0, 10}},
	} {
		k, ok, err := findKuratowski(tc.g.N, tc.g.Edges, nil, tc.must, nil)
		if err == nil && ok {
			err = checkKuratowski(tc.g.N, tc.g.Edges, nil, nil, k)
		}
		if err != nil {
			t.Errorf("%s, must = %v: %v", tc.g.Name, tc.must, err)
		}
	}
}
