// Package convex draws 3-connected plane graphs with every face a convex
// polygon, on the (f-1) x (f-1) grid, by face counting in a Schnyder wood:
// S. Felsner, "Convex drawings of planar graphs and the order dimension of
// 3-polytopes", Order 18 (2001). The Schnyder wood comes from a canonical
// ordering of the 3-connected graph (G. Kant, "Drawing planar graphs using
// the canonical ordering", Algorithmica 16 (1996) 4-32), found by peeling
// the graph from the top. Draw checks its own result (every face convex
// and turning the right way, the wood's axioms) before returning it, and
// reports a graph that is not 3-connected instead of assuming it is.
package convex
