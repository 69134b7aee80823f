// Package graphgen generates the graphs that gridwood's tests and benchmarks
// run on: planarity tests, planar-subgraph tests and grid drawing tests.
//
// A Graph is N vertices numbered 0..N-1 and a list of undirected edges, each
// an ordered pair of int32 endpoints. Every generator returns a simple graph
// (no loops, no two edges joining the same unordered pair) and every
// generator is deterministic: the same arguments give the same Graph,
// edge order included.
//
// # Families
//
// Path, Cycle, Star, Wheel, Grid, TriangulatedGrid, Complete,
// CompleteBipartite, Petersen, NestedTriangles and NestedTrianglesPlain are
// the usual named graphs; each function documents its vertex numbering.
// Tetrahedron, Cube, Octahedron, Dodecahedron and Icosahedron are the
// skeletons of the Platonic solids, derived from their standard Cartesian
// coordinates (H. S. M. Coxeter, Regular Polytopes, 3rd ed., Dover 1973,
// chapter III) by joining the vertex pairs at minimum distance.
//
// Nested triangles (NestedTriangles with levels L) use 3L vertices; ring i
// (0 <= i < L) is the triangle 3i, 3i+1, 3i+2, ring 0 being the outermost in
// the intended drawing and ring L-1 the innermost. Consecutive rings are
// joined corner to corner, 3i+j to 3(i+1)+j, which cuts the band between
// them into three quadrilaterals 3i+j, 3i+(j+1)%3, 3(i+1)+(j+1)%3,
// 3(i+1)+j; each quadrilateral gets the diagonal 3i+j -- 3(i+1)+(j+1)%3.
// Every face is then a triangle (the outermost ring, the innermost ring and
// two per quadrilateral), so the graph is maximal planar with 3n-6 = 9L-6
// edges. NestedTrianglesPlain omits the diagonals (3L+3(L-1) edges). The
// family is a classic worst case for drawing algorithms: its graph distance
// from the outer face grows linearly in n.
//
// # Random graphs
//
// Random generators take an explicit seed and draw from a math/rand/v2 PCG
// generator seeded with it (and a fixed per-family stream constant), so their
// output is reproducible from run to run (on 64-bit platforms, where it has
// been pinned by testdata/golden.txt).
//
// RandomTriangulation keeps its own combinatorial triangulation of the
// sphere (a corner table: for each triangle corner its vertex and the corner
// facing it across the opposite edge; J. Rossignac, "3D compression made
// simple: Edgebreaker with ZipandWrap on a corner-table", Proc. Shape
// Modeling International 2001). It starts from a triangle seen as two faces,
// inserts vertices 3..n-1 each into a uniformly random face (a random
// stacked triangulation, or Apollonian network), and then makes 2n random
// flip attempts: a uniformly random edge ab with triangles abc and abd is
// replaced by cd unless c and d are already adjacent (K. Wagner, "Bemerkungen
// zum Vierfarbenproblem", Jahresber. DMV 46 (1936) 26-32, showed such flips
// connect all triangulations). Finally the vertices are relabelled by a
// random permutation and the edge list is shuffled and each pair randomly
// oriented, so that callers never see the construction order. The work is
// expected linear in n: a flip's adjacency test is one lookup in a hashed
// edge set.
//
// RandomPlanar, PlanarPlusExtra, RandomTree (uniform over labelled trees, by
// Prüfer decoding; H. Prüfer, "Neuer Beweis eines Satzes über
// Permutationen", Arch. Math. Phys. 27 (1918) 142-144) and RandomGnm
// (uniform over simple graphs with n vertices and m edges; P. Erdős and A.
// Rényi, "On random graphs I", Publ. Math. Debrecen 6 (1959) 290-297) are
// documented at their functions.
//
// # Degenerate and oversized arguments
//
// No input panics. Negative sizes count as zero, and families that need a
// minimum size degrade as documented at each function (for example
// Cycle(2) is a single edge). A request whose vertex count or edge count
// would exceed math.MaxInt32 returns a graph with no vertices and no edges
// (Name is still set), because its labels or its edge list could not be
// represented. Requests just below that limit are built as asked, so the
// caller chooses sizes that fit in memory.
package graphgen
