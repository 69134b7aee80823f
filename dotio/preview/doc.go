// Package preview draws laid-out DOT graphs as one self-contained SVG
// document (no scripts, external fonts or images), to look at in any
// browser. It draws what the DOT says, and its own look where the DOT is
// silent; what the DOT says that it does not draw it lists once, in a
// comment at the top of the document and in Result.NotDrawn, instead of
// drawing something else.
//
// Drawn from the DOT:
//
//   - node shapes (package nodesize's catalog: box, rect, rectangle,
//     square, ellipse, oval, circle, doublecircle, point, plaintext, plain,
//     none, diamond, triangle, invtriangle, house, invhouse, pentagon,
//     hexagon, septagon, octagon, doubleoctagon, tripleoctagon,
//     parallelogram, trapezium, invtrapezium, star, cylinder, note, tab,
//     folder, box3d, component, underline, record, Mrecord) at the sizes
//     nodesize gives, with peripheries 4 points apart; records as their
//     fields, HTML tables as their cells;
//   - labels of nodes, edges (beside the middle of the edge), the graph
//     (below the drawing, or above with labelloc=t; labeljust l or r) and
//     cluster frames; xlabel (nodes: outside the upper left corner; edges:
//     on the other side from the label), headlabel and taillabel; escapes
//     \n \l \r \N \G \E \T \H; label="" shows nothing;
//   - color, fillcolor (with style=filled), fontcolor, bgcolor, pencolor
//     (frames), labelfontcolor: the SVG 1.1 colour names, #rrggbb,
//     #rrggbbaa, HSV triples, transparent; a colour list by its first
//     colour;
//   - style solid, dashed, dotted, bold, filled, invis, rounded,
//     setlinewidth(N); penwidth; fontsize and labelfontsize;
//   - arrowheads at the ends dir says (forward in a digraph, none in a
//     graph, by default), of the arrowhead and arrowtail types normal, inv,
//     vee, crow, tee, box, diamond, dot, none with the o, l and r
//     modifiers and up to four in a row; arrowsize;
//   - cluster frames given in Graph.Frames, beneath everything.
//
// Our own look, where the DOT leaves it unsaid: warm paper, slate nodes
// with cream text, rounded boxes for nodes with no shape, teal edges,
// removed edges (Graph.Removed) thin, dashed and rust beneath all kept
// edges, sand frames, and a small title above each graph.
//
// Edges are straight lines from outline to outline. Edges joining the same
// two nodes are drawn once, in the look of the first, with an ochre badge
// giving their number; a loop is three quarters of a circle on its node's
// upper right corner. A removed edge is bowed off the straight line and
// routed clear of every node box it does not end at (see route.go), so
// that it is not taken for a kept edge nor for a connection through
// another node.
//
// DOT's y axis points up and SVG's down: each graph is flipped inside its
// own panel. The output depends only on the input.
package preview
