package planarize

import (
	"math"
	"math/rand/v2"
	"slices"
	"testing"

	"github.com/gridwood/gridwood/internal/disjoint"
	"github.com/gridwood/gridwood/internal/graphgen"
)

// skeletonAgrees checks skeleton.planarWith against the whole left-right
// test of the kept graph plus each candidate, and returns how many
// candidates kept it planar.
func skeletonAgrees(t *testing.T, name string, n int, edges [][2]int32, kept, cands []int32) int {
	t.Helper()
	s := newSkeleton(n, edges)
	if !s.build(kept, math.MaxInt) {
		t.Fatalf("%s: no skeleton made", name)
	}
	planar := 0
	with := make([][2]int32, 0, len(kept)+1)
	for _, k := range kept {
		with = append(with, edges[k])
	}
	for _, c := range cands {
		want := IsPlanar(n, append(with, edges[c]))
		if got := s.planarWith(c); got != want {
			t.Fatalf("%s: kept %d edges plus %v: skeleton says planar=%v, the whole test %v", name, len(kept), edges[c], got, want)
		}
		if want {
			planar++
		}
	}
	return planar
}

// TestSkeletonSmallGraphs checks the skeleton on every labelled planar
// graph on 6 vertices (the planar ones of AllSimpleGraphs, 32,071 of them
// by OEIS A066537) with every missing edge as the candidate: trees,
// cycles, theta graphs, several components, chains split once or twice,
// all of them.
func TestSkeletonSmallGraphs(t *testing.T) {
	const n = 6
	var all [][2]int32
	for u := range int32(n) {
		for v := u + 1; v < n; v++ {
			all = append(all, [2]int32{u, v})
		}
	}
	graphs, checks, planar := 0, 0, 0
	graphgen.AllSimpleGraphs(n, func(edges [][2]int32) {
		if !IsPlanar(n, edges) {
			return
		}
		graphs++
		var kept, cands []int32
		for i, e := range all {
			if slices.Contains(edges, e) {
				kept = append(kept, int32(i))
			} else {
				cands = append(cands, int32(i))
			}
		}
		checks += len(cands)
		planar += skeletonAgrees(t, "6 vertices", n, all, kept, cands)
	})
	if graphs != 32071 {
		t.Fatalf("%d planar graphs on 6 vertices, want 32071 (OEIS A066537)", graphs)
	}
	if planar == 0 || planar == checks {
		t.Fatalf("%d of %d candidates planar: the check saw only one answer", planar, checks)
	}
	t.Logf("%d graphs, %d candidates, %d planar", graphs, checks, planar)
}

// TestSkeletonSparseGraphs checks the skeleton on the kind of kept graph
// it is for: a spanning tree of a random triangulation plus a share of
// its other edges (from none, a tree, to all, a triangulation), on its own
// and beside other components, with random pairs as candidates and pairs
// near each other (in one pendant tree, on one chain) that random pairs
// seldom give.
func TestSkeletonSparseGraphs(t *testing.T) {
	for _, n := range []int{8, 30, 200, 1000} {
		for _, share := range []float64{0, 0.02, 0.1, 0.3, 1} {
			for seed := range uint64(3) {
				tri := graphgen.RandomTriangulation(n, seed+1)
				rng := rand.New(rand.NewPCG(seed, uint64(n)))
				g := graphgen.DisjointUnion(tri, graphgen.RandomTree(n/4+2, seed), graphgen.Cycle(5))
				edges, _ := Simplify(g.N, g.Edges)
				// A spanning forest by union-find, then the share of the rest.
				sets := disjoint.New(g.N)
				var kept []int32
				for _, i := range rng.Perm(len(edges)) {
					u, v := edges[i][0], edges[i][1]
					if sets.Find(u) != sets.Find(v) || rng.Float64() < share {
						sets.Union(u, v)
						kept = append(kept, int32(i))
					}
				}
				// Candidates: pairs not kept, random ones and near ones.
				present := map[[2]int32]bool{}
				for _, e := range edges {
					present[[2]int32{min(e[0], e[1]), max(e[0], e[1])}] = true
				}
				all := slices.Clone(edges)
				var cands []int32
				add := func(u, v int32) {
					if u == v || present[[2]int32{min(u, v), max(u, v)}] {
						return
					}
					present[[2]int32{min(u, v), max(u, v)}] = true
					cands = append(cands, int32(len(all)))
					all = append(all, [2]int32{u, v})
				}
				for range 150 {
					add(int32(rng.IntN(g.N)), int32(rng.IntN(g.N)))
				}
				for range 150 { // two steps apart along kept edges
					k := kept[rng.IntN(len(kept))]
					u, w := edges[k][0], edges[k][1]
					for _, k2 := range kept {
						if e := edges[k2]; e[0] == w && e[1] != u {
							add(u, e[1])
							break
						} else if e[1] == w && e[0] != u {
							add(u, e[0])
							break
						}
					}
				}
				skeletonAgrees(t, tri.Name, g.N, all, kept, cands)
			}
		}
	}
}

// TestSkeletonKeepsResults checks that testing single candidates on the
// skeleton changes no result of MaximalPlanar: the same edges removed,
// the same bounds, on graphs where it is used and where it is not.
func TestSkeletonKeepsResults(t *testing.T) {
	graphs := []graphgen.Graph{
		graphgen.RandomGnm(600, 1800, 1),
		graphgen.RandomGnm(1500, 4000, 2),
		graphgen.PlanarPlusExtra(1500, 300, 3),
		graphgen.WithStrays(graphgen.Grid(30, 30), 60, 4),
		graphgen.Complete(30),
	}
	results := func() []*Subgraph {
		var out []*Subgraph
		for _, g := range graphs {
			out = append(out, MaximalPlanar(g.N, g.Edges, SubgraphOptions{}))
		}
		return out
	}
	saved := skeletonSize
	defer func() { skeletonSize = saved }()
	skeletonSize = 50
	with := results()
	skeletonSize = 1 << 30
	without := results()
	for i, g := range graphs {
		a, b := with[i], without[i]
		if !slices.Equal(a.Removed, b.Removed) || a.LowerBound != b.LowerBound || a.Optimal != b.Optimal {
			t.Errorf("%s: %d removed with the skeleton, %d without", g.Name, len(a.Removed), len(b.Removed))
		}
		if err := checkSubgraph(g.N, g.Edges, a, -1); err != nil {
			t.Errorf("%s: %v", g.Name, err)
		}
	}
}

// TestSkeletonSize checks build's size limit, as the search sets it (the
// kept graph's vertices plus edges): a triangulation has no vertex of
// degree below 3, so its skeleton is itself and is refused; a spanning
// tree plus a few edges has a small one.
func TestSkeletonSize(t *testing.T) {
	g := graphgen.RandomTriangulation(2000, 5)
	edges, _ := Simplify(g.N, g.Edges)
	s := newSkeleton(g.N, edges)
	if s.build(identity(len(edges)), g.N+len(edges)) {
		t.Errorf("%s: a skeleton of %d branch vertices and %d edges was made for the whole triangulation", g.Name, s.branches, len(s.base))
	}
	tree := graphgen.RandomTree(2000, 5)
	sparse := append(slices.Clone(tree.Edges), [][2]int32{{0, 1000}, {5, 1500}, {17, 1999}, {3, 700}}...)
	sparse, _ = Simplify(tree.N, sparse)
	s = newSkeleton(tree.N, sparse)
	if !s.build(identity(len(sparse)), tree.N+len(sparse)) {
		t.Fatalf("no skeleton for a tree plus 4 edges")
	}
	// A connected graph with c independent cycles (here c <= 4) keeps c
	// in its skeleton, E - B = c - 1, and every branch vertex has degree
	// 3 or more, 2E >= 3B: so B <= 2(c-1) = 6 and E <= 3(c-1) = 9 (common
	// practice, from the handshake lemma).
	if s.branches > 6 || len(s.base) > 9 {
		t.Errorf("tree plus 4 edges: %d branch vertices, %d edges", s.branches, len(s.base))
	}
}

// FuzzSkeleton checks the skeleton on fuzzed graphs: the bytes give up to
// 16 vertices and pairs of them; the kept graph takes each pair in turn
// that keeps it planar (the greedy search's kind of kept graph), and every
// other pair of vertices is a candidate, checked against the whole test.
func FuzzSkeleton(f *testing.F) {
	f.Add([]byte{6, 0, 1, 1, 2, 2, 0, 3, 4, 4, 5, 5, 3, 0, 3})
	f.Add([]byte{10, 0, 1, 1, 2, 2, 3, 3, 4, 4, 5, 5, 6, 6, 7, 7, 8, 8, 9, 9, 0, 0, 5, 2, 7})
	f.Add([]byte{7, 0, 1, 0, 2, 0, 3, 1, 2, 1, 3, 2, 3, 4, 5, 5, 6})
	f.Add([]byte{16})
	f.Fuzz(func(t *testing.T, data []byte) {
		if len(data) == 0 {
			return
		}
		n := 2 + int(data[0])%15
		var all [][2]int32
		seen := map[[2]int32]bool{}
		pair := func(u, v int32) {
			k := [2]int32{min(u, v), max(u, v)}
			if u != v && !seen[k] {
				seen[k] = true
				all = append(all, k)
			}
		}
		for i := 1; i+1 < len(data); i += 2 {
			pair(int32(data[i])%int32(n), int32(data[i+1])%int32(n))
		}
		var kept, cands []int32
		var with [][2]int32
		for i, e := range all {
			if IsPlanar(n, append(with, e)) {
				with = append(with, e)
				kept = append(kept, int32(i))
			} else {
				cands = append(cands, int32(i))
			}
		}
		for u := range int32(n) {
			for v := u + 1; v < int32(n); v++ {
				if !seen[[2]int32{u, v}] {
					pair(u, v)
					cands = append(cands, int32(len(all)-1))
				}
			}
		}
		skeletonAgrees(t, "fuzzed", n, all, kept, cands)
	})
}
