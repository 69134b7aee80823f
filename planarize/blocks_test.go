package planarize

import (
	"fmt"
	"runtime/debug"
	"testing"

	"github.com/gridwood/gridwood/internal/graphgen"
)

// edgeUnion is a union-find over edge indices for the reference partitions.
type edgeUnion []int32

func newEdgeUnion(m int) edgeUnion {
	u := make(edgeUnion, m)
	for i := range u {
		u[i] = int32(i)
	}
	return u
}

func (u edgeUnion) find(x int32) int32 {
	for u[x] != x {
		x = u[x]
	}
	return x
}

func (u edgeUnion) union(a, b int32) { u[u.find(a)] = u.find(b) }

// componentsWithout labels the components of G - skip (skip = -1 deletes
// nothing); the deleted vertex gets label -1.
func componentsWithout(n int, edges [][2]int32, skip int32) []int32 {
	parent := make([]int32, n)
	for v := range parent {
		parent[v] = int32(v)
	}
	var find func(int32) int32
	find = func(x int32) int32 {
		for parent[x] != x {
			x = parent[x]
		}
		return x
	}
	for _, e := range edges {
		if e[0] != skip && e[1] != skip {
			parent[find(e[0])] = find(e[1])
		}
	}
	label := make([]int32, n)
	for v := range label {
		label[v] = find(int32(v))
	}
	if skip >= 0 {
		label[skip] = -1
	}
	return label
}

// blocksByCutVertices is a brute-force block partition. Two distinct edges
// e and f lie in one block exactly when they are connected and no vertex v
// separates them, that is, all ends of e and f other than v stay in one
// component of G - v. (Blocks and cut vertices form a tree, the block graph,
// in which the path between two blocks runs through the cut vertices that
// separate them; R. Diestel, Graph Theory, 5th ed., Lemma 3.1.4; from
// memory.) It deletes every vertex in turn and compares all pairs of edges:
// O(n m (n + m) + m^2 n), fine for small graphs.
func blocksByCutVertices(n int, edges [][2]int32) []int32 {
	m := len(edges)
	whole := componentsWithout(n, edges, -1)
	without := make([][]int32, n)
	for v := range n {
		without[v] = componentsWithout(n, edges, int32(v))
	}
	u := newEdgeUnion(m)
	for i := range m {
		for j := i + 1; j < m; j++ {
			e, f := edges[i], edges[j]
			same := whole[e[0]] == whole[f[0]]
			for v := range int32(n) {
				if !same {
					break
				}
				c := int32(-1)
				for _, x := range [4]int32{e[0], e[1], f[0], f[1]} {
					if x == v {
						continue
					}
					if c < 0 {
						c = without[v][x]
					} else if without[v][x] != c {
						same = false
					}
				}
			}
			if same {
				u.union(int32(i), int32(j))
			}
		}
	}
	label := make([]int32, m)
	for i := range label {
		label[i] = u.find(int32(i))
	}
	return label
}

// blocksByCycles is a second brute-force block partition: two edges lie in
// one block exactly when they are equal or lie on a common cycle (H.
// Whitney, "Non-separable and planar graphs", Trans. AMS 34 (1932); from
// memory). It lists every simple cycle by depth-first search from its
// smallest vertex and merges the edges of each, so it is exponential: use
// it only for n <= 6.
func blocksByCycles(n int, edges [][2]int32) []int32 {
	id := make([][]int32, n)
	for v := range id {
		id[v] = make([]int32, n)
		for w := range id[v] {
			id[v][w] = -1
		}
	}
	for i, e := range edges {
		id[e[0]][e[1]], id[e[1]][e[0]] = int32(i), int32(i)
	}
	u := newEdgeUnion(len(edges))
	onPath := make([]bool, n)
	var path []int32 // edge indices of the current path from s
	var extend func(s, v int32)
	extend = func(s, v int32) { // depth at most n <= 6
		for w := s; int(w) < n; w++ {
			e := id[v][w]
			if e < 0 {
				continue
			}
			if w == s && len(path) >= 2 {
				for _, f := range path {
					u.union(f, e)
				}
				continue
			}
			if w == s || onPath[w] {
				continue
			}
			onPath[w] = true
			path = append(path, e)
			extend(s, w)
			path = path[:len(path)-1]
			onPath[w] = false
		}
	}
	for s := range int32(n) {
		onPath[s] = true
		extend(s, s)
		onPath[s] = false
	}
	label := make([]int32, len(edges))
	for i := range label {
		label[i] = u.find(int32(i))
	}
	return label
}

// samePartition reports why the labelling got (with count classes) does not
// induce the same partition of the edges as want, or "" if it does.
func samePartition(got []int32, count int, want []int32) string {
	if len(got) != len(want) {
		return fmt.Sprintf("%d labels for %d edges", len(got), len(want))
	}
	g2w := map[int32]int32{}
	w2g := map[int32]int32{}
	for i := range got {
		if got[i] < 0 || int(got[i]) >= count {
			return fmt.Sprintf("edge %d has label %d outside [0,%d)", i, got[i], count)
		}
		if w, ok := g2w[got[i]]; ok && w != want[i] {
			return fmt.Sprintf("edge %d shares block %d with edges of another true block", i, got[i])
		}
		if g, ok := w2g[want[i]]; ok && g != got[i] {
			return fmt.Sprintf("edge %d is split from its true block (labels %d and %d)", i, g, got[i])
		}
		g2w[got[i]], w2g[want[i]] = want[i], got[i]
	}
	if len(g2w) != count {
		return fmt.Sprintf("count is %d but %d labels are used", count, len(g2w))
	}
	return ""
}

// TestBlocksAllSmallGraphs compares Blocks with both brute-force references
// on every labelled graph with at most 6 vertices.
func TestBlocksAllSmallGraphs(t *testing.T) {
	for n := 0; n <= 6; n++ {
		failures := 0
		graphgen.AllSimpleGraphs(n, func(edges [][2]int32) {
			if failures > 3 {
				return
			}
			got, count := Blocks(n, edges)
			if why := samePartition(got, count, blocksByCutVertices(n, edges)); why != "" {
				t.Errorf("n=%d %v: against the cut-vertex reference: %s", n, edges, why)
				failures++
			}
			if why := samePartition(got, count, blocksByCycles(n, edges)); why != "" {
				t.Errorf("n=%d %v: against the cycle reference: %s", n, edges, why)
				failures++
			}
		})
	}
}

// TestBlocksRandom compares Blocks with the cut-vertex reference on random
// graphs, many of them disconnected or with isolated vertices.
func TestBlocksRandom(t *testing.T) {
	for n := 1; n <= 14; n++ {
		for seed := range uint64(30) {
			m := int(seed) * n * 2 / 30
			g := graphgen.RandomGnm(n, m, seed)
			got, count := Blocks(g.N, g.Edges)
			if why := samePartition(got, count, blocksByCutVertices(g.N, g.Edges)); why != "" {
				t.Errorf("%s %v: %s", g.Name, g.Edges, why)
			}
		}
	}
	// Sparse graphs with many bridges and cut vertices: a tree plus a few
	// chords.
	for seed := range uint64(40) {
		tree := graphgen.RandomTree(25, seed)
		chords := graphgen.RandomGnm(25, 1+int(seed%5), seed)
		simple, _ := Simplify(25, append(tree.Edges, chords.Edges...))
		got, count := Blocks(25, simple)
		if why := samePartition(got, count, blocksByCutVertices(25, simple)); why != "" {
			t.Errorf("tree+chords seed %d %v: %s", seed, simple, why)
		}
	}
}

// TestBlockCounts checks block counts known by hand.
func TestBlockCounts(t *testing.T) {
	bowtie := graphgen.Graph{N: 5, Name: "two-triangles-at-a-vertex", Edges: [][2]int32{{0, 1}, {1, 2}, {2, 0}, {2, 3}, {3, 4}, {4, 2}}}
	dumbbell := graphgen.Graph{N: 6, Name: "triangles-joined-by-a-bridge", Edges: [][2]int32{{0, 1}, {1, 2}, {2, 0}, {2, 3}, {3, 4}, {4, 5}, {5, 3}}}
	tests := []struct {
		g    graphgen.Graph
		want int
	}{
		// Every edge of a tree is a bridge and so a block of its own: k
		// blocks for k edges (Diestel 3.1; from memory).
		{graphgen.Path(2), 1},
		{graphgen.Path(50), 49},
		{graphgen.Star(30), 30},
		{graphgen.RandomTree(1000, 4), 999},
		{graphgen.RandomTree(2, 4), 1},
		{graphgen.DisjointUnion(graphgen.RandomTree(40, 1), graphgen.RandomTree(60, 2)), 39 + 59},
		// Cycles, complete graphs, wheels, grids and the Petersen graph are
		// 2-connected: one block (common practice).
		{graphgen.Cycle(3), 1},
		{graphgen.Cycle(100), 1},
		{graphgen.Complete(6), 1},
		{graphgen.Wheel(8), 1},
		{graphgen.Grid(20, 30), 1},
		{graphgen.Petersen(), 1},
		{graphgen.RandomTriangulation(500, 3), 1},
		// A shared cut vertex separates the two triangles; a bridge is a
		// block of its own (by the definition of a block).
		{bowtie, 2},
		{graphgen.Relabel(bowtie, 2), 2},
		{dumbbell, 3},
		{graphgen.DisjointUnion(graphgen.Complete(4), graphgen.Complete(4), graphgen.Path(1)), 2},
		{graphgen.Graph{N: 7, Name: "isolated"}, 0},
		{graphgen.Graph{Name: "empty"}, 0},
	}
	for _, tt := range tests {
		block, count := Blocks(tt.g.N, tt.g.Edges)
		if count != tt.want {
			t.Errorf("%s: %d blocks, want %d", tt.g.Name, count, tt.want)
		}
		if len(block) != len(tt.g.Edges) {
			t.Errorf("%s: %d labels for %d edges", tt.g.Name, len(block), len(tt.g.Edges))
		}
	}
}

// TestBlocksHuge runs Blocks on a path and a star of 10^6 edges with the
// goroutine stack capped at 16 MiB, so a recursive search would overflow
// (RULES.md: iterative DFS). Each edge of a tree is its own block.
func TestBlocksHuge(t *testing.T) {
	if testing.Short() {
		t.Skip("10^6-edge inputs skipped in -short")
	}
	old := debug.SetMaxStack(16 << 20)
	defer debug.SetMaxStack(old)
	for _, g := range []graphgen.Graph{graphgen.Path(1000001), graphgen.Star(1000000), graphgen.Cycle(1000000)} {
		block, count := Blocks(g.N, g.Edges)
		want := len(g.Edges)
		if g.N == len(g.Edges) { // the cycle
			want = 1
		}
		if count != want {
			t.Errorf("%s: %d blocks, want %d", g.Name, count, want)
			continue
		}
		used := make([]bool, count)
		for _, b := range block {
			if b < 0 || int(b) >= count {
				t.Fatalf("%s: label %d outside [0,%d)", g.Name, b, count)
			}
			used[b] = true
		}
		for b, u := range used {
			if !u {
				t.Errorf("%s: block %d has no edge", g.Name, b)
				break
			}
		}
	}
}
