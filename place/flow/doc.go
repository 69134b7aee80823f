// Package flow measures how the edges of a directed graph run in a
// drawing: which edges lie on directed cycles, and of the others, how many
// point along the drawing's flow direction (DOT's rankdir) and how many
// against it.
//
// An edge lies on a directed cycle when its head reaches its tail; a
// self-loop always does. OnCycles finds the strongly connected components
// with Tarjan's algorithm (R. E. Tarjan, "Depth-first search and linear
// graph algorithms", SIAM J. Comput. 1(2), 1972), iteratively, with an
// explicit stack: an edge lies on a cycle exactly when both its ends are
// in one component. It takes linear time.
//
// The flow runs top to bottom by default (rankdir TB); LR runs left to
// right, BT bottom to top and RL right to left (DOT's rankdir values, from
// memory). Positions are DOT's, y pointing up, so TB means decreasing y.
// An edge points along the flow when its head lies strictly further along
// the flow's axis than its tail (the other coordinate does not matter);
// an edge whose ends are level on that axis, or whose head lies behind its
// tail, points against it.
//
// Orient chooses, among the eight symmetries of a finished drawing (the
// identity, three mirror images and four that swap the axes), the one
// that points the most edges not on a cycle along the flow, ties going
// to the identity and then to the order of Symmetries. Mirror images keep
// a drawing's node boxes as clear as they were; a swap of the axes is
// taken only when the caller's check says the swapped drawing stays
// clear. It takes linear time, and the check once at most.
package flow
