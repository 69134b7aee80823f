// Package place computes straight-line drawings without crossings of
// planar graphs on the integer grid.
//
// Layout takes a plane embedding (from planarize.Embed) and, per connected
// component, adds dummy edges until the component is a triangulation
// (never a loop or a parallel edge, keeping the input's rotation), takes a
// canonical ordering (H. de Fraysseix, J. Pach and R. Pollack, "How to draw
// a planar graph on a grid", Combinatorica 10, 1990) and the Schnyder wood
// it induces (W. Schnyder, "Planar graphs and poset dimension", Order 5,
// 1989), and places every vertex at its weak barycentric coordinates, the
// vertex counts of its three regions (W. Schnyder, "Embedding planar graphs
// on the grid", SODA 1990): an n-vertex component fits the (n-2) x (n-2)
// grid. The outer face is a largest face of the input. Optionally it
// removes grid lines that can go (Options.Compact) and computes Tutte's
// barycentric drawing with that outer face on a convex polygon
// (Options.Smooth).
//
// Draw runs the whole pipeline on any graph: loops and repeated edges are
// ignored, and a non-planar graph first loses an inclusion-minimal set of
// edges (planarize.MaximalPlanar). Result.Space then turns grid points into
// positions in points that respect node boxes, choosing among candidate
// drawings, refining and relaxing them (after F. Bertault, "A
// force-directed algorithm that preserves edge-crossing properties",
// Inform. Process. Lett. 74, 2000); every step that moves vertices off the
// grid is checked exactly to keep the drawing plane.
// DrawGraph does the same for any gonum graph.
package place
