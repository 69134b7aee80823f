package planarize

import (
	"math/rand/v2"
	"slices"
	"testing"

	"github.com/gridwood/gridwood/internal/graphgen"
)

// faceOf returns the darts of the face on the left of d, in FaceNext order.
func faceOf(emb *Embedding, d int32) []int32 {
	face := []int32{d}
	for x := emb.FaceNext(d); x != d; x = emb.FaceNext(x) {
		face = append(face, x)
		if len(face) > 2*emb.M() {
			return nil // not a permutation; the checker reports why
		}
	}
	return face
}

// TestAddEdgeByHand builds a quadrilateral with a diagonal dart by dart.
// Expected face counts follow from Euler's formula F = E - V + 2 for a
// connected plane graph (SOURCES.md): a tree has 1 face, a 4-cycle 2, and
// a 4-cycle with a diagonal 3.
func TestAddEdgeByHand(t *testing.T) {
	emb := NewEmbedding(4)
	var edges [][2]int32
	add := func(a, b, u, v int32) int {
		i := emb.AddEdge(a, b, u, v)
		if a >= 0 {
			u = emb.Tail(a)
		}
		if b >= 0 {
			v = emb.Tail(b)
		}
		edges = append(edges, [2]int32{u, v})
		if i != len(edges)-1 {
			t.Fatalf("AddEdge returned index %d, want %d", i, len(edges)-1)
		}
		if err := checkEmbedding(4, edges, emb); err != nil {
			t.Fatalf("after edge %d: %v", i, err)
		}
		return i
	}
	if emb.Faces() != 4 || emb.Components() != 4 {
		t.Fatalf("4 isolated vertices: %d faces, %d components, want 4 and 4", emb.Faces(), emb.Components())
	}
	add(-1, -1, 0, 1) // darts 0: 0->1, 1: 1->0
	add(1, -1, 0, 2)  // darts 2: 1->2, 3: 2->1
	add(3, -1, 0, 3)  // darts 4: 2->3, 5: 3->2
	if emb.Faces() != 1 {
		t.Fatalf("path 0-1-2-3: %d faces, want 1", emb.Faces())
	}
	add(5, 0, 0, 0) // closes the cycle 3 -> 0: darts 6: 3->0, 7: 0->3
	if emb.Faces() != 2 {
		t.Fatalf("4-cycle: %d faces, want 2", emb.Faces())
	}
	// A diagonal 0-2 through the face on the left of dart 0 (0->1).
	a := int32(0)
	var b int32 = -1
	for _, x := range faceOf(emb, a) {
		if emb.Tail(x) == 2 {
			b = x
		}
	}
	if b < 0 {
		t.Fatal("vertex 2 is not on the face of dart 0 in a 4-cycle")
	}
	i := add(a, b, 0, 0)
	if emb.Faces() != 3 {
		t.Fatalf("4-cycle with a diagonal: %d faces, want 3", emb.Faces())
	}
	// AddEdge documents: one face holds a and the new dart v->u, the other
	// the new dart u->v and b.
	uv, vu := int32(2*i), int32(2*i+1)
	if !slices.Contains(faceOf(emb, a), vu) {
		t.Errorf("face of a = %v lacks the new dart v->u %d", faceOf(emb, a), vu)
	}
	if !slices.Contains(faceOf(emb, uv), b) {
		t.Errorf("face of the new dart u->v = %v lacks b = %d", faceOf(emb, uv), b)
	}
	if f := faceOf(emb, a); len(f) != 3 {
		t.Errorf("the diagonal should leave two triangles, face of a has %d darts", len(f))
	}
}

// TestAddEdgeSplitsFaces adds random chords inside faces of embedded planar
// graphs. Each chord between two corners of one face keeps the embedding
// plane and adds exactly one face (Euler: E grows by one, V and C stay).
func TestAddEdgeSplitsFaces(t *testing.T) {
	var c embChecker
	for seed := range uint64(20) {
		g := graphgen.RandomPlanar(60, 0.4, seed)
		if seed%4 == 0 {
			g = graphgen.RandomTree(60, seed)
		}
		base, ok := Embed(g.N, g.Edges)
		if !ok {
			t.Fatalf("%s: not planar", g.Name)
		}
		emb := base.Clone()
		edges := append([][2]int32(nil), g.Edges...)
		rng := rand.New(rand.NewPCG(seed, 3))
		for range 40 {
			if emb.M() == 0 {
				break
			}
			a := int32(rng.IntN(2 * emb.M()))
			face := faceOf(emb, a)
			var b int32 = -1
			for _, x := range face {
				if emb.Tail(x) != emb.Tail(a) && !adjacent(edges, emb.Tail(a), emb.Tail(x)) {
					b = x
					break
				}
			}
			if b < 0 {
				continue
			}
			before := emb.Faces()
			emb.AddEdge(a, b, -1, -1)
			edges = append(edges, [2]int32{emb.Tail(a), emb.Tail(b)})
			if err := c.check(g.N, edges, emb); err != nil {
				t.Fatalf("%s: after a chord: %v", g.Name, err)
			}
			if emb.Faces() != before+1 {
				t.Fatalf("%s: chord gave %d faces, want %d", g.Name, emb.Faces(), before+1)
			}
		}
		// Clone is independent: the original is untouched.
		if err := c.check(g.N, g.Edges, base); err != nil {
			t.Errorf("%s: AddEdge on a clone changed the original: %v", g.Name, err)
		}
	}
}

func adjacent(edges [][2]int32, u, v int32) bool {
	for _, e := range edges {
		if e == [2]int32{u, v} || e == [2]int32{v, u} {
			return true
		}
	}
	return false
}

// TestEmbedKeepsOwnEdges checks that an embedding returned by Embed does
// not share storage with the caller's edge slice: Embed documents that
// edge i of the result is edges[i], and an Embedding is later extended
// with AddEdge, so a caller reusing its slice must not change the
// embedding, and AddEdge must not write into the caller's array (common
// practice for Go APIs that do not document retention).
func TestEmbedKeepsOwnEdges(t *testing.T) {
	edges := make([][2]int32, 3, 8) // spare capacity, as after appends
	copy(edges, [][2]int32{{0, 1}, {1, 2}, {2, 0}})
	emb, ok := Embed(4, edges)
	if !ok {
		t.Fatal("triangle not planar")
	}
	emb.AddEdge(emb.First(0), -1, -1, 3)
	if emb.Edge(3) != [2]int32{0, 3} {
		t.Fatalf("AddEdge gave edge %v, want [0 3]", emb.Edge(3))
	}
	if spare := edges[:4]; spare[3] != [2]int32{} {
		t.Errorf("AddEdge on the result of Embed wrote %v into the caller's edge array", spare[3])
	}
	edges = append(edges, [2]int32{1, 3})
	edges[0] = [2]int32{2, 1}
	if emb.Edge(3) != [2]int32{0, 3} || emb.Edge(0) != [2]int32{0, 1} {
		t.Errorf("the caller reusing its slice changed the embedding: edges 0 and 3 are now %v and %v", emb.Edge(0), emb.Edge(3))
	}
}
