// Package planarize tests graphs for planarity, embeds planar ones and
// finds planar subgraphs of the others.
//
// Graphs are plain: n vertices 0..n-1 and a list of edges as pairs of
// vertex indices. Embed and IsPlanar run the left-right planarity test
// (H. de Fraysseix and P. Rosenstiehl; in the formulation of U. Brandes,
// "The Left-Right Planarity Test", 2009) in linear time with iterative
// depth-first searches; Embed returns a rotation system (Embedding) whose
// faces obey Euler's formula. Simplify turns a multigraph with loops into
// the simple graph these functions expect, and Blocks splits a graph into
// biconnected components.
//
// MaximalPlanar finds, for a non-planar graph, an inclusion-minimal set of
// edges whose removal leaves it planar (adding back any one of them breaks
// planarity), aiming for few edges: the fewest is NP-hard to find, but it
// reaches the minimum where Euler's formula gives a matching bound and on
// small blocks by exact search. FindKuratowski returns a subdivision of K5
// or K3,3 that proves a graph non-planar, which explains why an edge had to
// go.
//
// The greedy search tests each candidate edge against its block, so when
// many edges must go the time could grow with their number times the
// block's size. Two shortcuts give the same answers for less: a first try
// on the part of the block around a shortest path between the candidate's
// ends (localProof; in a near-triangulation that part already holds a
// Kuratowski subgraph), and, where what stays is a tree with a few cycles,
// a test on that graph's skeleton, its 2-core with every chain of degree-2
// vertices made one edge (skeleton). FindKuratowski likewise searches
// outward from a shortest path between the edge's ends (nearFirst), so
// certificates in big meshes stay small and quick.
//
// Inputs must be valid: endpoints in 0..n-1, and for Embed, IsPlanar,
// Blocks, MaximalPlanar and FindKuratowski no loops or repeated pairs
// (Simplify first). Every search that could be long has a work bound
// counted in steps (Budget), so results never depend on timing.
package planarize
