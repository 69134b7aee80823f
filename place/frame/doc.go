// Package frame computes the frames of clusters (nested groups of nodes)
// around a drawing, and measures how well the drawing keeps each cluster
// in a region of its own: nodes inside the frame of a cluster they do not
// belong to, and overlapping frames of clusters that are not nested.
//
// A frame is the union of its members' node boxes and its child clusters'
// frames, grown by a margin on every side and by its label's height on
// top (or at the bottom), and widened to hold the label; so frames nest as
// the clusters do. Coordinates are integer points with y up, as in DOT.
//
// # What counts
//
// A node box is closed and a frame is open: a node lies in a frame when
// its box meets the frame's interior (a box touching the frame's edge
// from outside does not; a zero-size box counts by its centre lying
// strictly inside). Two frames overlap when their interiors meet. An
// intrusion is a pair of a node and a cluster it does not belong to
// (directly or through a nested cluster) whose frame it lies in; a node
// in the frames of two clusters, one inside the other, is two intrusions.
// A frame overlap is a pair of clusters, neither inside the other, whose
// frames overlap.
//
// # Cost
//
// Frames is linear. Measure counts without listing: the nodes in each
// frame by inclusion and exclusion over the four sides of the frame, each
// pair of sides an offline two-dimensional dominance count with a binary
// indexed tree (P. M. Fenwick, "A new data structure for cumulative
// frequency tables", Software: Practice and Experience 24(3), 1994), the
// members subtracted; O((n + k) log(n + k)) for n nodes and k clusters,
// however many intrusions there are. Find lists them: a sweep over x with,
// for the boxes and frames the sweep line crosses, a segment tree over
// their lower y holding the largest upper y (common practice), which
// reports each meeting pair in O(log(n + k)); its cost is O((n + k + P)
// log(n + k)), P the meeting pairs, members with their own frames
// included (the sum over nodes of the depth of their innermost cluster).
package frame
