package graphgen

import (
	"testing"
)

// TestAllSimpleGraphs checks the enumeration against published counts:
// 2^(n(n-1)/2) labelled graphs on n vertices (OEIS A006125), of which
// C(n(n-1)/2, k) have k edges (common practice), the connected ones number
// 1, 1, 1, 4, 38, 728, 26704, 1866256 for n = 0..7 (OEIS A001187; from
// memory, and they satisfy the recurrence c(n) = 2^C(n,2) - (1/n) sum_k
// k C(n,k) 2^C(n-k,2) c(k)), and the connected ones with n-1 edges are the
// n^(n-2) labelled trees (Cayley 1889; OEIS A000272).
func TestAllSimpleGraphs(t *testing.T) {
	connectedCounts := []int{1, 1, 1, 4, 38, 728, 26704, 1866256}
	maxN := 7
	if testing.Short() {
		maxN = 6
	}
	for n := 0; n <= maxN; n++ {
		pairs := n * (n - 1) / 2
		byEdges := make([]int, pairs+1)
		total, conn, trees := 0, 0, 0
		AllSimpleGraphs(n, func(edges [][2]int32) {
			total++
			byEdges[len(edges)]++
			g := Graph{N: n, Edges: edges}
			if total <= 5000 || n < 7 {
				checkSimple(t, g)
			}
			if connectedUF(n, edges) {
				conn++
				if len(edges) == n-1 {
					trees++
				}
			}
		})
		if total != 1<<pairs {
			t.Errorf("n=%d: %d graphs, want %d", n, total, 1<<pairs)
		}
		for k, c := range byEdges {
			if c != binomial(pairs, k) {
				t.Errorf("n=%d: %d graphs with %d edges, want %d", n, c, k, binomial(pairs, k))
			}
		}
		if conn != connectedCounts[n] {
			t.Errorf("n=%d: %d connected graphs, want %d", n, conn, connectedCounts[n])
		}
		if n >= 1 {
			wantTrees := 1
			for range n - 2 {
				wantTrees *= n
			}
			if trees != wantTrees {
				t.Errorf("n=%d: %d trees, want %d", n, trees, wantTrees)
			}
		}
	}
	calls := 0
	AllSimpleGraphs(8, func([][2]int32) { calls++ })
	AllSimpleGraphs(-1, func([][2]int32) { calls++ })
	AllSimpleGraphs(3, nil)
	if calls != 0 {
		t.Errorf("out-of-range n made %d calls", calls)
	}
}

// TestAllSimpleGraphsDistinct checks on n = 4 that the 64 graphs are
// pairwise different edge sets.
func TestAllSimpleGraphsDistinct(t *testing.T) {
	seen := make(map[uint64]bool)
	AllSimpleGraphs(4, func(edges [][2]int32) {
		k := treeKey(Graph{N: 4, Edges: edges})
		if seen[k] {
			t.Errorf("edge set %v visited twice", edges)
		}
		seen[k] = true
	})
	if len(seen) != 64 {
		t.Errorf("%d distinct graphs, want 64", len(seen))
	}
}

// connectedUF reports connectivity with a union-find over the edges.
func connectedUF(n int, edges [][2]int32) bool {
	if n == 0 {
		return true
	}
	var parent [8]int32
	for i := range parent {
		parent[i] = int32(i)
	}
	find := func(x int32) int32 {
		for parent[x] != x {
			parent[x] = parent[parent[x]]
			x = parent[x]
		}
		return x
	}
	parts := n
	for _, e := range edges {
		if a, b := find(e[0]), find(e[1]); a != b {
			parent[a] = b
			parts--
		}
	}
	return parts == 1
}
