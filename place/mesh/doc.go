// Package mesh keeps a triangulation of a plane straight-line drawing, so
// that its vertices can be moved one at a time while the drawing provably
// stays plane.
//
// New builds the constrained Delaunay triangulation of the drawing's
// vertices with its edges as constraints (L. P. Chew, "Constrained
// Delaunay triangulations", Algorithmica 4, 1989), inside a frame of three
// extra vertices far outside the drawing: points are inserted one by one
// with Lawson's flips (C. L. Lawson, "Software for C1 surface
// interpolation", 1977), and each edge is then forced in by flipping away
// the triangulation edges it crosses (S. W. Sloan, "A fast algorithm for
// generating constrained Delaunay triangulations", Computers & Structures
// 47, 1993). New refuses a drawing that is not plane: two vertices at one
// point, a vertex inside an edge, or two edges that cross or overlap.
//
// The triangulation is the certificate: as long as every triangle turns
// counter-clockwise and the frame stays put, the drawing is plane (a
// triangulated disc whose triangles all keep their orientation is
// embedded; common practice, and the reason this package exists). Move
// checks exactly that, for the triangles around the moved vertex only,
// with the exact orientation test of internal/exact. Edges that are not
// drawing edges are free to flip: Legalize restores the Delaunay property
// near a vertex, which keeps the triangles around every vertex fat and so
// leaves it room to move; only the drawing's own edges ever hold a vertex
// back.
package mesh
