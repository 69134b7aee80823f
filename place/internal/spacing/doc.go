// Package spacing holds the geometry behind the spacing rule of package
// place (Result.Space): it takes one component's drawing in integer points,
// with a box around each vertex, and makes it clear its boxes without
// losing planarity.
//
//   - Clearance: ClearingStretch finds the least factor by which a drawing
//     must be scaled so that no two boxes (grown by the gap) overlap and no
//     edge passes within EdgeGap points of a box it does not end at,
//     walking the cells of a bucket grid under a work Meter; ClearedArea is
//     the area a scaled drawing then takes.
//   - Refine and Relax move one vertex at a time, Refine away from what
//     crowds it, Relax to where the room around it is largest, after F.
//     Bertault, "A force-directed algorithm that preserves edge-crossing
//     properties", Inform. Process. Lett. 74, 2000, but with an exact guard
//     in place of his movement zones: every move keeps each triangle of the
//     augmented triangulation turning the way the inner faces do, tested
//     in integers, so the drawing stays plane. RelaxWins keeps a relaxed
//     drawing only when it clears its boxes in less area, trying each of
//     the box sizes Reaches gives.
//   - Tutte computes W. T. Tutte's barycentric drawing ("How to draw a
//     graph", Proc. London Math. Soc. 13, 1963) with the outer face (Outer)
//     on a convex polygon, and Plane checks exactly that a drawing is a
//     plane drawing of the triangulation.
//   - Stretch scales a drawing up, Shrink down as far as it stays clear,
//     both checked to round to a plane drawing; StretchLimit bounds the
//     stretch by the extent where the exact tests stop.
//   - Tree draws a tree in layers and pulls the layers apart until no edge
//     passes a box.
//
// Slices indexed by vertex (x, y, box half sizes, scratch) span the whole
// graph; a component is given by its vertices vs and its edges.
package spacing
