// Package readable turns a plane straight-line drawing of a connected
// graph into one that reads like a good stress layout of the same graph
// while staying plane: no two edges cross or touch, and no vertex lies on
// an edge, at every step.
//
// The stage minimizes stress (E. R. Gansner, Y. Koren and S. North,
// "Graph drawing by stress majorization", Graph Drawing 2004) with the
// localized majorization update of package place/stress: each vertex in
// turn moves toward the position that is best for it with the others held
// still. Every move is guarded by a triangulation of the current drawing
// (package place/mesh): the vertex moves only as far as keeps every
// triangle around it turning the same way, which keeps the whole drawing
// plane. The triangulation's sides that are not edges of the graph are
// flipped back to Delaunay after each move, so they never freeze a vertex
// in place; only the graph's own edges hold a vertex back, which is the
// planarity constraint itself. This is the idea of safe per-vertex moves
// of F. Bertault, "A force-directed algorithm that preserves
// edge-crossing properties", Inform. Process. Lett. 74 (2000), and of S.
// Simonetto, D. Archambault, D. Auber and R. Bourqui, "ImPrEd",
// Computer Graphics Forum 30(3) (2011), with stress in place of forces
// and the triangulation in place of their per-face bounds.
//
// What the caller says about structure enters through the stress model
// (package place/stress): longer ideal lengths for labelled edges
// (Input.EdgeExtra), shorter wanted distances inside a cluster and longer
// ones across (Input.Groups), and a digraph's edges kept pointing one way
// by projecting each target onto its separation constraints (Input.Flow;
// after T. Dwyer and Y. Koren, "DIG-CoLa", InfoVis 2005, and T. Dwyer,
// Y. Koren and K. Marriott, "IPSep-CoLa", InfoVis 2006). The projection
// keeps pairs along the flow that a drawing has along but does not turn
// a folded one round, so with a flow the start is always a candidate (the
// caller turns it to flow the most), and candidates are weighed by their
// stress times 1 + flowWeight times the share of pairs against the flow.
//
// Ideal edge lengths come from the node boxes, so that labels fit; a move
// also keeps a vertex's box from coming closer to a nearby box than
// Input.Gap, or to an edge than Input.EdgeGap, wherever it was not
// already closer.
//
// Draw weighs several plane starting drawings, refines each by the guarded
// descent, and keeps the one of least stress among those whose boxes can
// be cleared without much stretching (boxCrowding):
//
//   - "follow": the unconstrained stress layout (the reference), with an
//     embedding read off it (Follow) and made plane near it (nearPlane):
//     where the reference is itself plane this is the reference;
//   - "near" and "unfolded": the same with the start's embedding, or from a
//     stress layout grown from the start, where the reference folds;
//   - "radial": for a tree, its radial drawing with the reference's order
//     of children around each vertex, wedges bounded as in P. Eades,
//     "Drawing free trees", Bull. Inst. Combin. Appl. 5 (1992), so that it
//     is plane: the reference's crossings between subtrees are parted
//     instead of folded into knots;
//   - "convex": a Tutte drawing of the embedding with its outer face on a
//     convex polygon and weights from the reference (W. T. Tutte, "How to
//     draw a graph", Proc. London Math. Soc. 13 (1963); M. S. Floater,
//     "One-to-one piecewise linear mappings over triangulations",
//     Math. Comp. 72 (2003)), plane for any positive weights;
//   - "untangled": when the best of these is crowded or needs its boxes
//     stretched more than untangleAbove (4) times, the reference with
//     its folds repaired (untangle: vertices at crossings moved one at a
//     time, then the neighbourhoods of the folds relaxed to
//     barycentres), read and made plane as "follow" is: a map whose
//     stress layout folds at a few coasts;
//   - "start": the plane drawing given, when nothing else is uncrowded.
//
// A last phase ("margins") runs the same descent with each vertex's box
// conflicts (a box too near another box or an edge) added to its target,
// and locally inflates crowded spots, so that the boxes part with little
// uniform stretching. Parting boxes in one spot can press another
// tighter, and parting boxes pressed all over can wreck the drawing's
// shape, so Output.Alternatives holds the drawing from before the phase
// and, where the best candidate's boxes needed two to six times its size
// to clear, the phase run with boxes loosened by the square root of that
// (parting them half way, the rest left to an even stretch), for the
// caller to keep whichever reads no worse than its start and clears its
// boxes in the least area by its own exact check. Work is bounded in
// stress terms (Options.Work), and every phase by a number of sweeps: the
// result never depends on a clock.
package readable
