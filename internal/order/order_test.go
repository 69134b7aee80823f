package order

import (
	"math/rand/v2"
	"slices"
	"sort"
	"testing"
)

// reference renumbers by a recursive depth-first search over adjacency
// lists in edge order and sorts the renamed edges with the standard
// library's stable sort: the plain statement of what DepthFirst promises.
func reference(n int, edges [][2]int32) ([]int32, [][2]int32, []int32) {
	adj := make([][]int32, n)
	for _, e := range edges {
		adj[e[0]] = append(adj[e[0]], e[1])
		adj[e[1]] = append(adj[e[1]], e[0])
	}
	newID := make([]int32, n)
	for v := range newID {
		newID[v] = -1
	}
	next := int32(0)
	var visit func(v int32)
	visit = func(v int32) {
		newID[v] = next
		next++
		for _, w := range adj[v] {
			if newID[w] < 0 {
				visit(w)
			}
		}
	}
	for v := range n {
		if newID[v] < 0 {
			visit(int32(v))
		}
	}
	edgeOf := make([]int32, len(edges))
	for i := range edgeOf {
		edgeOf[i] = int32(i)
	}
	lo := func(i int32) int32 { return min(newID[edges[i][0]], newID[edges[i][1]]) }
	sort.SliceStable(edgeOf, func(x, y int) bool { return lo(edgeOf[x]) < lo(edgeOf[y]) })
	renamed := make([][2]int32, len(edges))
	for k, i := range edgeOf {
		renamed[k] = [2]int32{newID[edges[i][0]], newID[edges[i][1]]}
	}
	return newID, renamed, edgeOf
}

func TestDepthFirstMatchesReference(t *testing.T) {
	rng := rand.New(rand.NewPCG(7, 11))
	for trial := range 500 {
		n := 1 + rng.IntN(40)
		m := rng.IntN(3 * n)
		edges := make([][2]int32, m)
		for i := range edges {
			u := int32(rng.IntN(n))
			v := int32(rng.IntN(n))
			if rng.IntN(8) == 0 {
				v = u // loops
			}
			if i > 0 && rng.IntN(6) == 0 {
				u, v = edges[i-1][1], edges[i-1][0] // repeats, reversed
			}
			edges[i] = [2]int32{u, v}
		}
		gotID, gotRenamed, gotOf := DepthFirst(n, edges)
		wantID, wantRenamed, wantOf := reference(n, edges)
		if !slices.Equal(gotID, wantID) || !slices.Equal(gotRenamed, wantRenamed) || !slices.Equal(gotOf, wantOf) {
			t.Fatalf("trial %d (n=%d, edges %v):\n got %v %v %v\nwant %v %v %v", trial, n, edges,
				gotID, gotRenamed, gotOf, wantID, wantRenamed, wantOf)
		}
	}
}

// TestDepthFirstLargeMatchesReference covers inputs large enough for the
// scattering passes to run in two goroutines.
func TestDepthFirstLargeMatchesReference(t *testing.T) {
	rng := rand.New(rand.NewPCG(13, 17))
	n, m := 20000, 60000
	edges := make([][2]int32, m)
	for i := range edges {
		edges[i] = [2]int32{int32(rng.IntN(n)), int32(rng.IntN(n))}
	}
	gotID, gotRenamed, gotOf := DepthFirst(n, edges)
	wantID, wantRenamed, wantOf := reference(n, edges)
	if !slices.Equal(gotID, wantID) || !slices.Equal(gotRenamed, wantRenamed) || !slices.Equal(gotOf, wantOf) {
		t.Fatal("DepthFirst differs from the reference on a random multigraph of 60000 edges")
	}
}

func TestDepthFirstEmpty(t *testing.T) {
	id, renamed, of := DepthFirst(0, nil)
	if len(id) != 0 || len(renamed) != 0 || len(of) != 0 {
		t.Fatalf("empty graph: %v %v %v", id, renamed, of)
	}
	id, renamed, of = DepthFirst(3, nil)
	if !slices.Equal(id, []int32{0, 1, 2}) || len(renamed) != 0 || len(of) != 0 {
		t.Fatalf("three isolated vertices: %v %v %v", id, renamed, of)
	}
}
