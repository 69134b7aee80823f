// Package geomcheck is an exact checker for straight-line drawings on the
// integer grid. It does not trust the code that made a drawing: every
// drawing a gridwood test makes, and every drawing the command's --check
// mode reads, is judged here from the coordinates alone.
//
// # What is checked
//
// A drawing is a slice of vertex positions and a list of edges, each drawn
// as the closed segment between its ends. Loops are ignored. Check reports
//
//   - Crossing: two edges meet in a point interior to both;
//   - Overlap: two edges lie on one line and share more than one point, or
//     join the same two vertices (so parallel duplicate edges are always
//     reported, even when their ends coincide);
//   - VertexOnEdge: a vertex lies in the interior of an edge (not at an
//     end); an edge end touching the middle of another edge is this;
//   - SharedPoint: two vertices have equal coordinates. An edge whose two
//     distinct ends coincide is reported only this way; such a zero-length
//     edge has no interior, so it takes part in no Crossing or Overlap
//     except with an edge joining the same two vertices.
//
// Edges that meet only in a point that is an end of both are fine if that
// end is one vertex; if it is two vertices at one position, SharedPoint
// says so. Hence a drawing is a plane straight-line drawing of its graph
// exactly when Check reports nothing.
//
// BoxOverlaps and EdgeThroughBox do the same for vertices drawn as boxes:
// boxes overlapping with positive area, and edges meeting the open box of
// a vertex they do not end at.
//
// # Exact arithmetic
//
// Every decision is made with integers; there is no floating point. All
// predicates reduce to the orientation of three points, the sign of
// (b-a)×(c-a), and to comparisons of coordinates. Coordinates are bounded
// by MaxCoord = 2^40, so a difference of coordinates is below 2^41 (2^42
// with box half-sizes, which are bounded by MaxCoord too) and a product of
// two differences below 2^84 in magnitude. Such products are formed exactly
// as 128-bit two's-complement numbers with math/bits.Mul64 and compared
// word by word, so the sign is exact; the bound leaves more than 40 bits of
// headroom. Inputs outside the bound are rejected with an error rather than
// judged.
//
// # Algorithms
//
// checkBrute tests every pair of vertices, every vertex against every edge
// and every pair of edges: obviously correct and quadratic, it is the
// reference the tests hold the fast path to.
//
// Check first sorts the vertices (equal positions give SharedPoint) and the
// edges by their pair of ends (same pair gives Overlap). It then runs the
// sweep-line test of M. I. Shamos and D. Hoey, "Geometric intersection
// problems", Proc. 17th IEEE FOCS (1976) 208-215, extended to set segments
// aside: whenever two segments become neighbours in the sweep status and
// conflict (they meet other than in a common end point), one of them is
// removed from the sweep, and each vertex the sweep passes is located in
// the status, which finds the segment it lies inside, if any. The status is
// a treap (R. Seidel and C. R. Aragon, "Randomized search trees",
// Algorithmica 16 (1996) 464-497). By Shamos and Hoey's argument (the first
// conflict point is preceded by its two segments being neighbours) the
// segments that stay are pairwise free of problems. Only pairs with a
// removed segment are then classified exactly, each pair once, found by a
// path query of the larger segment among the bounding boxes of smaller ones
// in packed bounding-box trees; vertices inside removed segments are
// found the same way.
//
// On a drawing without problems this takes O((n+m) log(n+m)) time and
// linear memory for n vertices and m edges, whatever its shape (stars, long
// thin drawings). Measured on a 2-core machine: about 0.55 s for a plane
// triangulation with 100,002 vertices and 300,000 edges in [0, 100000]^2,
// 0.1 s for a star of 100,000 edges. With problems, the extra cost is that
// of the path queries, which is proportional to the boxes each query
// touches: near-linear in the number of problems for typical drawings, but
// without a worst-case bound better than O(m) per removed segment (many
// long, mutually near-parallel removed segments are the bad case).
package geomcheck
