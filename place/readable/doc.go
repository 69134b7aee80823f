// Package readable turns a plane straight-line drawing of a connected
// graph into one that reads like a good stress layout of the same graph
// while staying plane: no two edges cross or touch, and no vertex lies on
// an edge, at every step.
//
// The stage minimizes stress (E. R. Gansner, Y. Koren and S. North,
// "Graph drawing by stress majorization", Graph Drawing 2004) with the
// localized majorization update of package place/stress: each vertex in
// turn moves toward the position that is best for it with the others held
// still. Every move is guarded by a triangulation of the current drawing
// (package place/mesh): the vertex moves only as far as keeps every
// triangle around it turning the same way, which keeps the whole drawing
// plane. The triangulation's sides that are not edges of the graph are
// flipped back to Delaunay after each move, so they never freeze a vertex
// in place; only the graph's own edges hold a vertex back, which is the
// planarity constraint itself. This is the idea of safe per-vertex moves
// of F. Bertault, "A force-directed algorithm that preserves
// edge-crossing properties", Inform. Process. Lett. 74 (2000), and of S.
// Simonetto, D. Archambault, D. Auber and R. Bourqui, "ImPrEd",
// Computer Graphics Forum 30(3) (2011), with stress in place of forces
// and the triangulation in place of their per-face bounds.
//
// Ideal edge lengths come from the node boxes, so that labels fit; a move
// also keeps a vertex's box from coming closer to an edge, or to a nearby
// box, than the gap, wherever it was not already closer.
//
// Where the unconstrained stress layout of the graph is itself plane
// (checked exactly by building its triangulation), it is a candidate too,
// and the candidate with the lower stress is kept.
package readable
