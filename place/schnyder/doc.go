// Package schnyder computes, for a triangulated plane graph, a canonical
// ordering (H. de Fraysseix, J. Pach and R. Pollack, "How to draw a planar
// graph on a grid", Combinatorica 10 (1990)), the Schnyder wood it induces
// (W. Schnyder, "Planar graphs and poset dimension", Order 5 (1989)) and
// the weak barycentric coordinates by vertex counts that place every vertex
// on the (n-2) x (n-2) grid with straight, non-crossing edges (W.
// Schnyder, "Embedding planar graphs on the grid", SODA 1990). Both passes
// are iterative and linear in the size of the component.
package schnyder
