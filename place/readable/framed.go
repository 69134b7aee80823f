package readable

import (
	"github.com/gridwood/gridwood/place/augment"
	"github.com/gridwood/gridwood/planarize"
)

// framed returns the triangulation, as an embedding of n+3 vertices, of
// the plane embedding emb (vertices 0..n-1) set inside a frame triangle
// n, n+1, n+2 whose face is the outer one: the frame hangs in emb's face
// to the left of dart outer, joined to its tail, and every face but the
// frame's is then triangulated (package augment). With mirror, emb's
// rotations are reversed first (its mirror image).
func framed(emb *planarize.Embedding, outer int32, mirror bool) (*planarize.Embedding, bool) {
	n := emb.N()
	edges := make([][2]int32, emb.M())
	for i := range edges {
		edges[i] = emb.Edge(i)
	}
	around := make([][]int32, n+3)
	for v := range int32(n) {
		f := emb.First(v)
		if f < 0 {
			continue
		}
		for d := f; ; {
			around[v] = append(around[v], d>>1)
			if d = emb.Next(d); d == f {
				break
			}
		}
		if mirror {
			for i, j := 0, len(around[v])-1; i < j; i, j = i+1, j-1 {
				around[v][i], around[v][j] = around[v][j], around[v][i]
			}
		}
	}
	t, ok := planarize.FromRotation(n+3, edges, around)
	if !ok {
		return nil, false
	}
	if mirror {
		outer ^= 1 // the same face, walked the other way round
	}
	f0, f1, f2 := int32(n), int32(n+1), int32(n+2)
	// A path o - f0 - f1 - f2 into the face, closed into a triangle whose
	// own face is empty: the new dart f0 -> f2 goes right after f0 -> o,
	// so that f1 -> f0 is followed by f0 -> f2 around the triangle.
	var e0 int
	if outer >= 0 {
		e0 = t.AddEdge(outer, -1, -1, f0)
	} else {
		e0 = t.AddEdge(-1, -1, 0, f0) // emb has no edges: vertex 0 alone
	}
	e1 := t.AddEdge(int32(2*e0+1), -1, -1, f1)
	e2 := t.AddEdge(int32(2*e1+1), -1, -1, f2)
	t.AddEdge(int32(2*e2+1), int32(2*e0+1), -1, -1)
	skip := func(int32) bool { return false }
	augment.Biconnect(t, skip)
	augment.TriangulateFaces(t, skip, nil)
	return t, t.IsPlane()
}

// embeddingRings calls fn with each of the first n vertices of emb and
// its neighbours, counter-clockwise.
func embeddingRings(emb *planarize.Embedding, n int) func(func(v int32, ring []int32)) {
	return func(fn func(v int32, ring []int32)) {
		var ring []int32
		for v := range int32(n) {
			ring = ring[:0]
			if f := emb.First(v); f >= 0 {
				for d := f; ; {
					ring = append(ring, emb.Head(d))
					if d = emb.Next(d); d == f {
						break
					}
				}
			}
			fn(v, ring)
		}
	}
}
