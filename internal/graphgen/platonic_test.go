package graphgen

import (
	"math/bits"
	"testing"
)

// TestPlatonicSolids checks the skeletons derived from coordinates against
// handbook values: (V, E) and vertex degree from Coxeter, Regular Polytopes,
// Table I (from memory): tetrahedron (4,6) 3-regular, cube (8,12) 3-regular,
// octahedron (6,12) 4-regular, dodecahedron (20,30) 3-regular, icosahedron
// (12,30) 5-regular. Girth, diameter and triangle counts are from memory
// (the diameters are those of A. E. Brouwer, A. M. Cohen and A. Neumaier,
// Distance-Regular Graphs, Springer 1989): the triangles of the tetrahedron,
// octahedron and icosahedron are exactly their 4, 8 and 20 faces.
func TestPlatonicSolids(t *testing.T) {
	// V, E and the degree Q come from the handbook table PlatonicSolids;
	// girth, diameter and triangles, in the order of that table, from the
	// sources above.
	extra := []struct{ girth, diam, triangles int }{
		{3, 1, 4}, {4, 3, 0}, {3, 2, 8}, {5, 5, 0}, {3, 3, 20},
	}
	for i, s := range PlatonicSolids() {
		tt := struct {
			g                      Graph
			v, e, degree           int
			girth, diam, triangles int
		}{s.Graph, s.V, s.E, s.Q, extra[i].girth, extra[i].diam, extra[i].triangles}
		t.Run(tt.g.Name, func(t *testing.T) {
			g := tt.g
			checkSimple(t, g)
			if g.N != tt.v || len(g.Edges) != tt.e {
				t.Fatalf("(V,E) = (%d,%d), want (%d,%d)", g.N, len(g.Edges), tt.v, tt.e)
			}
			for v, d := range degrees(g) {
				if d != tt.degree {
					t.Errorf("vertex %d has degree %d, want %d", v, d, tt.degree)
				}
			}
			if girth, diam := girthAndDiameter(g); girth != tt.girth || diam != tt.diam {
				t.Errorf("girth %d, diameter %d; want %d, %d", girth, diam, tt.girth, tt.diam)
			}
			if got := countTriangles(g); got != tt.triangles {
				t.Errorf("%d triangles, want %d", got, tt.triangles)
			}
		})
	}
}

// TestCubeIsHypercube checks the cube exactly against the 3-cube Q3, whose
// vertices are the 3-bit words and whose edges join words at Hamming
// distance 1 (common practice); Cube documents that vertex k has the sign
// bits of k.
func TestCubeIsHypercube(t *testing.T) {
	got := edgeSet(Cube())
	for i := range int32(8) {
		for j := i + 1; j < 8; j++ {
			want := bits.OnesCount32(uint32(i^j)) == 1
			if got[pairKey(i, j)] != want {
				t.Errorf("pair %d-%d: edge %v, want %v", i, j, got[pairKey(i, j)], want)
			}
		}
	}
}
