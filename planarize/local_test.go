package planarize

import (
	"math/rand/v2"
	"slices"
	"testing"

	"github.com/gridwood/gridwood/internal/graphgen"
)

// TestLocalProofSound checks localProof against the whole left-right test:
// a proof must never call a planar graph non-planar. The kept graphs are
// random triangulations (where every added edge between non-adjacent
// vertices breaks planarity, by Euler's formula: 3n-6 edges is the most a
// planar graph has) and random 60% parts of them (where many added edges
// keep it planar); the candidates are random pairs. On the triangulations
// nearly every candidate must be proved, as the tube around a shortest
// path holds a subdivision of K5 (see localProof).
func TestLocalProofSound(t *testing.T) {
	for _, tc := range []struct {
		g         graphgen.Graph
		minProved float64 // the least share of non-planar candidates proved
	}{
		{graphgen.RandomTriangulation(3000, 1), 0.95},
		{graphgen.RandomTriangulation(500, 2), 0.95},
		{graphgen.RandomPlanar(3000, 0.6, 3), 0},
		{graphgen.Grid(40, 40), 0},
	} {
		g := tc.g
		edges, _ := Simplify(g.N, g.Edges)
		adjacent := map[[2]int32]bool{}
		for _, e := range edges {
			adjacent[pairKey(e[0], e[1])] = true
		}
		kept := identity(len(edges))
		rng := rand.New(rand.NewPCG(uint64(g.N), 7))
		var cands [][2]int32
		for len(cands) < 300 {
			u, v := int32(rng.IntN(g.N)), int32(rng.IntN(g.N))
			if u != v && !adjacent[pairKey(u, v)] {
				cands = append(cands, [2]int32{u, v})
			}
		}
		all := append(append([][2]int32(nil), edges...), cands...)
		p := newLocalProof(g.N, all, kept)
		nonPlanar, proved := 0, 0
		for i, c := range cands {
			e := int32(len(edges) + i)
			planar := IsPlanar(g.N, append(append([][2]int32(nil), edges...), c))
			if !planar {
				nonPlanar++
			}
			if ok, _ := p.rejects(e, 1<<30); ok {
				if planar {
					t.Fatalf("%s: pair %v proved non-planar, but the graph with it is planar", g.Name, c)
				}
				proved++
			}
		}
		t.Logf("%s: %d of %d non-planar candidates proved locally", g.Name, proved, nonPlanar)
		if float64(proved) < tc.minProved*float64(nonPlanar) {
			t.Errorf("%s: %d of %d non-planar candidates proved, want at least %.0f%%", g.Name, proved, nonPlanar, 100*tc.minProved)
		}
	}
}

// TestLocalProofWorkBound checks that a path search past its work bound
// gives up instead of proving: a triangulation plus a pair, with a bound
// too small to reach from one end to the other.
func TestLocalProofWorkBound(t *testing.T) {
	g := graphgen.RandomTriangulation(2000, 4)
	edges, _ := Simplify(g.N, g.Edges)
	adjacent := map[[2]int32]bool{}
	for _, e := range edges {
		adjacent[pairKey(e[0], e[1])] = true
	}
	var c [2]int32
	for v := int32(1); ; v++ {
		if !adjacent[pairKey(0, v)] {
			c = [2]int32{0, v}
			break
		}
	}
	all := append(append([][2]int32(nil), edges...), c)
	p := newLocalProof(g.N, all, identity(len(edges)))
	if proved, _ := p.rejects(int32(len(edges)), 1); proved {
		t.Fatal("proved with a work bound of 1")
	}
	if proved, spent := p.rejects(int32(len(edges)), 1<<30); !proved || spent == 0 {
		t.Fatalf("not proved without a bound (proved=%v after %d steps)", proved, spent)
	}
}

// TestLocalProofSameResult checks that the local proofs change the time
// of MaximalPlanar and nothing else: on a triangulation plus as many random
// pairs (where the proofs reject most strays) the removed is the same
// with them and without, planar and inclusion-minimal (checkSubgraph).
func TestLocalProofSameResult(t *testing.T) {
	g := graphgen.PlanarPlusExtra(1500, 1500, 9)
	edges, _ := Simplify(g.N, g.Edges)
	with := MaximalPlanar(g.N, edges, SubgraphOptions{})
	saved := localProofSize
	localProofSize = 1 << 30
	without := MaximalPlanar(g.N, edges, SubgraphOptions{})
	localProofSize = saved
	if !slices.Equal(with.Removed, without.Removed) {
		t.Fatalf("%d removed with local proofs, %d without, or other edges", len(with.Removed), len(without.Removed))
	}
	if err := checkSubgraph(g.N, edges, with, -1); err != nil {
		t.Fatal(err)
	}
	if len(with.Removed) < 1500 {
		t.Fatalf("%d removed: fewer than the Euler bound allows", len(with.Removed))
	}
}
