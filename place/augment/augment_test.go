package augment

import (
	"testing"

	"github.com/gridwood/gridwood/internal/graphgen"
	"github.com/gridwood/gridwood/planarize"
)

// TestTriangulatesZoo augments every graph of the test zoo and checks the
// result against Euler's formula (SOURCES.md): each component of n >= 3
// vertices ends with 3n - 6 edges, none a loop or a repeat, every face a
// triangle; the original edges keep their order around each vertex.
// (place's augment tests check more, with the layout.)
func TestTriangulatesZoo(t *testing.T) {
	for _, g := range graphgen.Zoo() {
		emb, ok := planarize.Embed(g.N, g.Edges)
		if !ok {
			t.Fatalf("%s: not planar", g.Name)
		}
		work := emb.Clone()
		skip := func(int32) bool { return false }
		Biconnect(work, skip)
		TriangulateFaces(work, skip, nil)
		label, members := graphgen.Components(g.N, g.Edges)
		edges := make([]int, len(members))
		seen := map[[2]int32]bool{}
		for i := range work.M() {
			e := work.Edge(i)
			if e[0] == e[1] {
				t.Fatalf("%s: loop at %d", g.Name, e[0])
			}
			k := [2]int32{min(e[0], e[1]), max(e[0], e[1])}
			if seen[k] {
				t.Fatalf("%s: repeated edge %v", g.Name, k)
			}
			seen[k] = true
			if label[e[0]] != label[e[1]] {
				t.Fatalf("%s: edge %v joins two components", g.Name, e)
			}
			edges[label[e[0]]]++
		}
		for c, vs := range members {
			if n := len(vs); n >= 3 && edges[c] != 3*n-6 {
				t.Fatalf("%s: component of %d vertices has %d edges, want %d", g.Name, n, edges[c], 3*n-6)
			}
		}
		for d := range int32(2 * work.M()) {
			if work.FaceNext(work.FaceNext(work.FaceNext(d))) != d && len(members[label[work.Tail(d)]]) >= 3 {
				t.Fatalf("%s: a face that is not a triangle", g.Name)
			}
		}
		// Original rotations: the old darts in the same cyclic order.
		for v := range int32(g.N) {
			var before, after []int32
			if f := emb.First(v); f >= 0 {
				for d := f; ; {
					before = append(before, d)
					if d = emb.Next(d); d == f {
						break
					}
				}
				for d := f; ; {
					if int(d>>1) < emb.M() {
						after = append(after, d)
					}
					if d = work.Next(d); d == f {
						break
					}
				}
			}
			if len(before) != len(after) {
				t.Fatalf("%s: vertex %d lost edges", g.Name, v)
			}
			for i := range before {
				if before[i] != after[i] {
					t.Fatalf("%s: vertex %d's rotation changed", g.Name, v)
				}
			}
		}
	}
}
