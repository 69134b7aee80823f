package planarize

import (
	"testing"

	"github.com/gridwood/gridwood/internal/graphgen"
)

// shortestCycleByBFS is the oracle for shortCycles: one plain
// breadth-first search from one end of e, in the graph without e, to the
// other end.
func shortestCycleByBFS(n int, edges [][2]int32, e int) int {
	adj := make([][]int32, n)
	for i, uv := range edges {
		if i != e {
			adj[uv[0]] = append(adj[uv[0]], uv[1])
			adj[uv[1]] = append(adj[uv[1]], uv[0])
		}
	}
	dist := make([]int, n)
	for i := range dist {
		dist[i] = -1
	}
	u, v := edges[e][0], edges[e][1]
	dist[u] = 0
	queue := []int32{u}
	for len(queue) > 0 {
		x := queue[0]
		queue = queue[1:]
		for _, w := range adj[x] {
			if dist[w] < 0 {
				dist[w] = dist[x] + 1
				queue = append(queue, w)
			}
		}
	}
	if dist[v] < 0 {
		return 0
	}
	return dist[v] + 1
}

// TestShortCycles compares the two-ended bounded search with the plain
// search on every edge of graphs whose girths are handbook facts (common
// practice): the Petersen graph and the dodecahedron 5, the cube and grids
// 4, cycles their length, K4 and wheels 3; and on a path (no cycle),
// random planar graphs and a random tree with strays.
func TestShortCycles(t *testing.T) {
	graphs := []graphgen.Graph{
		graphgen.Petersen(), graphgen.Dodecahedron(), graphgen.Cube(), graphgen.Cycle(5), graphgen.Cycle(12), graphgen.Cycle(13),
		graphgen.Complete(4), graphgen.Path(6), graphgen.Grid(6, 7), graphgen.Wheel(9),
		graphgen.RandomPlanar(300, 0.5, 2), graphgen.RandomPlanar(300, 0.7, 3),
		graphgen.WithStrays(graphgen.RandomTree(200, 4), 6, 4),
	}
	girth := map[string]int{"petersen": 5, "dodecahedron": 5, "cube": 4, "grid-6x7": 4,
		"cycle-5": 5, "cycle-12": 12, "cycle-13": 13, "complete-4": 3, "wheel-9": 3}
	checked := 0
	for _, g := range graphs {
		edges, _ := Simplify(g.N, g.Edges)
		c := newShortCycles(g.N, edges, newCSR(g.N, edges))
		least := 0
		for e := range edges {
			want := shortestCycleByBFS(g.N, edges, e)
			for _, maxLen := range []int{4, 7, maxCycleLength, 1000} {
				got, spent := c.through(int32(e), maxLen, 1<<30)
				w := want
				if w > maxLen {
					w = 0
				}
				if got != w {
					t.Fatalf("%s edge %d: cycle of %d up to %d, want %d", g.Name, e, got, maxLen, w)
				}
				if spent > 2*len(edges) {
					t.Fatalf("%s edge %d: %d steps for %d edges", g.Name, e, spent, len(edges))
				}
			}
			if want > 0 && (least == 0 || want < least) {
				least = want
			}
		}
		if w, ok := girth[g.Name]; ok {
			checked++
			if least != w {
				t.Errorf("%s: girth %d, want %d", g.Name, least, w)
			}
		}
	}
	if checked != len(girth) {
		t.Errorf("%d of %d girths checked: a graph's name changed", checked, len(girth))
	}
}

// TestShortCyclesWorkBound checks that the search gives up, and says so
// with 0, once its work bound is spent: on a 40 x 40 grid the cycle
// through a boundary edge is 4, found after a handful of steps, but not
// within 2.
func TestShortCyclesWorkBound(t *testing.T) {
	g := graphgen.Grid(40, 40)
	c := newShortCycles(g.N, g.Edges, newCSR(g.N, g.Edges))
	if l, _ := c.through(0, maxCycleLength, 1<<20); l != 4 {
		t.Fatalf("cycle of %d through a grid edge, want 4", l)
	}
	if l, spent := c.through(0, maxCycleLength, 2); l != 0 || spent <= 2 {
		t.Fatalf("with 2 steps of work: cycle %d after %d steps, want 0 after more than 2", l, spent)
	}
}
