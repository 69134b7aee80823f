// Package stress computes stress-based layouts of connected graphs and the
// measures used to judge any drawing by its stress.
//
// The stress of a drawing is sum over vertex pairs of w_ij (|x_i - x_j| -
// d_ij)^2 with d_ij the shortest-path distance and w_ij = d_ij^-2 (E. R.
// Gansner, Y. Koren and S. North, "Graph drawing by stress majorization",
// Graph Drawing 2004, LNCS 3383). A Model holds the target distances; its
// Target method is the localized majorization update of that paper, the
// position that minimizes the stress's majorant with every other vertex
// held still. Moving each vertex there in turn never raises the stress;
// Layout does so from a start, and the readable stage (package
// place/readable) does so under a planarity guard.
//
// Up to Options.FullLimit vertices the model keeps every pair. Larger
// graphs use the sparse stress model of M. Ortmann, M. Klimenta and U.
// Brandes, "A sparse stress model", J. Graph Algorithms Appl. 21(5),
// 2017: a vertex sees its neighbours exactly and the rest of the graph
// through k pivots, each pivot weighted by the number of vertices of its
// region that it stands for, so that one sweep costs O(k n + m). Starts
// come from pivot multidimensional scaling (U. Brandes and C. Pich,
// "Eigensolver methods for progressive multidimensional scaling of large
// data", Graph Drawing 2006).
//
// Normalized is the scale-free measure used to compare drawings: the
// stress at the uniform scale that minimizes it, over hop distances,
// divided by the number of pairs.
//
// All arithmetic is deterministic: fixed orders, no concurrency, products
// in sums written with explicit conversions so that no compiler may fuse
// them, and math.Sqrt the only library function.
package stress
