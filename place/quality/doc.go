// Package quality measures how readable a straight-line drawing is, with
// the measures the field's evaluations use (common practice): normalized
// stress (E. R. Gansner, Y. Koren and S. North, "Graph drawing by stress
// majorization", Graph Drawing 2004), the spread of edge lengths, angular
// resolution, the closest pair of nodes and the drawing's size; and, on
// integer points, the worst spots (MeasureExtremes: the smallest angle at
// a node, the longest over the shortest edge, the nearest a node comes to
// an edge it is not on), which --report gives.
//
// The measures are computed from the positions and the graph alone,
// independently of the code that made the drawing: shortest paths here
// are plain breadth-first searches, not the layout's model.
package quality
