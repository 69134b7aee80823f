package schnyder

import (
	"testing"

	"github.com/gridwood/gridwood/internal/graphgen"
	"github.com/gridwood/gridwood/planarize"
)

// Schnyder's weak barycentric representation (W. Schnyder, "Embedding
// planar graphs on the grid", SODA 1990): every vertex's three coordinates
// sum to n-1 and lie in [0, n-2]; the outer vertices a1, a2, a3 get
// (n-2, 1, 0), (0, n-2, 1) and (1, 0, n-2); the canonical ordering starts
// a1, a2 and ends a3 (de Fraysseix, Pach and Pollack 1990). The drawing's
// planarity is checked by the place package's tests, with the independent
// checker.
func TestWeakBarycentric(t *testing.T) {
	for _, g := range []graphgen.Graph{
		graphgen.Octahedron(),
		graphgen.Icosahedron(),
		graphgen.NestedTriangles(12),
		graphgen.RandomTriangulation(200, 1),
		graphgen.RandomTriangulation(1000, 2),
	} {
		emb, ok := planarize.Embed(g.N, g.Edges)
		if !ok {
			t.Fatalf("%s: not planar", g.Name)
		}
		n := int32(g.N)
		outer := emb.First(0)
		order := make([]int32, n)
		w := NewWork(g.N)
		if err := w.CanonicalOrder(emb, outer, order); err != nil {
			t.Fatalf("%s: %v", g.Name, err)
		}
		index := make([]int32, n)
		for v := range index {
			index[v] = int32(v)
		}
		coord := make([][3]int32, n)
		w.Barycentric(order, coord, index)
		a1, a2 := emb.Tail(outer), emb.Tail(emb.FaceNext(outer))
		a3 := emb.Tail(emb.FaceNext(emb.FaceNext(outer)))
		if order[0] != a1 || order[1] != a2 || order[n-1] != a3 {
			t.Errorf("%s: order starts %d, %d and ends %d; the outer face is %d, %d, %d", g.Name, order[0], order[1], order[n-1], a1, a2, a3)
		}
		seen := make([]bool, n)
		for _, v := range order {
			if seen[v] {
				t.Fatalf("%s: vertex %d twice in the order", g.Name, v)
			}
			seen[v] = true
		}
		for v, c := range coord {
			if c[0]+c[1]+c[2] != n-1 || min(c[0], c[1], c[2]) < 0 || max(c[0], c[1], c[2]) > n-2 {
				t.Errorf("%s: vertex %d at %v: coordinates must sum to %d and lie in [0, %d]", g.Name, v, c, n-1, n-2)
			}
		}
		for _, c := range []struct {
			v    int32
			want [3]int32
		}{{a1, [3]int32{n - 2, 1, 0}}, {a2, [3]int32{0, n - 2, 1}}, {a3, [3]int32{1, 0, n - 2}}} {
			if coord[c.v] != c.want {
				t.Errorf("%s: outer vertex %d at %v, want %v", g.Name, c.v, coord[c.v], c.want)
			}
		}
	}
}
