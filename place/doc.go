// Package place computes straight-line drawings without crossings of
// planar graphs on the integer grid.
//
// Layout takes a plane embedding (from planarize.Embed) and, per connected
// component, adds dummy edges until the component is a triangulation
// (never a loop or a parallel edge, keeping the input's rotation), takes a
// canonical ordering (H. de Fraysseix, J. Pach and R. Pollack, "How to draw
// a planar graph on a grid", Combinatorica 10, 1990) and the Schnyder wood
// it induces (W. Schnyder, "Planar graphs and poset dimension", Order 5,
// 1989), and places every vertex at its weak barycentric coordinates, the
// vertex counts of its three regions (W. Schnyder, "Embedding planar graphs
// on the grid", SODA 1990): an n-vertex component fits the (n-2) x (n-2)
// grid. The outer face is a largest face of the input. Optionally it
// removes grid lines that can go without changing any crossing or touching
// (Options.Compact, on components of up to 5,000 vertices) and computes
// Tutte's barycentric drawing with that outer face on a convex polygon
// (Options.Smooth). Method Convex draws each 3-connected component with
// every face convex instead, on the (f-1) x (f-1) grid for f faces (S.
// Felsner, "Convex drawings of planar graphs and the order dimension of
// 3-polytopes", Order 18, 2001); neither compaction nor smoothing applies
// to it, since removing a grid line can bend a face's corner.
//
// Draw runs the whole pipeline on any graph: loops and repeated edges are
// ignored, and a non-planar graph first loses an inclusion-minimal set of
// edges (planarize.MaximalPlanar). Result.Space then turns grid points into
// positions in points that respect node boxes, choosing among candidate
// drawings, refining and relaxing them (after F. Bertault, "A
// force-directed algorithm that preserves edge-crossing properties",
// Inform. Process. Lett. 74, 2000); every step that moves vertices off the
// grid is checked exactly to keep the drawing plane. The geometry of these
// steps is in package place/internal/spacing. Result.Readable runs
// Space and then the readable stage (package place/readable) on each
// component. DrawGraph does the same for any gonum graph.
//
// # The spacing rule
//
// Result.Space applies this rule to each connected component; the command
// uses it for --grid and as the start and fallback of the readable
// drawing. Measured effects of each step, with dates, are in
// bench/RESULTS.md.
//
//  1. The base unit is the largest box side plus the gap (Boxes.Gap; the
//     command uses 18 points), so boxes on distinct grid points never
//     overlap.
//  2. A drawing is stretched by the least factor that keeps every edge
//     spacing.EdgeGap (4) points clear of the boxes of the nodes it passes,
//     also where a wide box reaches over the end of an edge, and boxes
//     apart by the gap, however big that makes the drawing: up to spacing's
//     maxExtent (2^29) points across, where the exact integer tests stop; a
//     component that would need more is stretched that far and counted in
//     Placed.Crowded.
//  3. Other drawings are weighed against the grid's (Schnyder's vertex
//     counts crowd), each refined and stretched as in step 2, and the one
//     that clears the boxes in the least area wins. Tutte's barycentric drawing, with the outer face on a
//     convex polygon, is made for components of 4 to 5,000 vertices whose
//     outer face (made a simple cycle by the biconnecting edges) is not a
//     triangle, or is one and the component has at most tutteTriangleLimit
//     (100) vertices, since inside a triangle it crowds the corners; it is
//     preferred to the grid unless it needs more than
//     tutteAreaAllowance (2) times the grid's area, and past
//     spacing.GridCompareLimit (2,000) vertices it is taken without
//     comparing.
//     Felsner's face-count drawing is made of the input's own faces when
//     the component is 3-connected (every face convex; Placed.Convex), else
//     of the triangulation behind the Schnyder drawing (Placed.FaceCounts);
//     it spreads vertices far better than Schnyder's vertex counts. A tree
//     is drawn in layers (spacing.Tree, after E. Reingold and J. Tilford,
//     "Tidier drawings of trees", 1981): rooted at a centre, leaves in
//     consecutive columns, every other vertex over its middle children,
//     layers made taller until no edge passes a box; that drawing wins
//     unless the grid's clears its boxes in less area (Placed.Trees).
//     Refinement (spacing.Refine, after Bertault 2000) pushes crowded
//     vertices apart, every move checked exactly, in integers, so that the
//     whole triangulation behind the drawing stays plane. A component of up
//     to 2,000 vertices that then has room to spare is scaled down by the
//     least factor, to no less than a quarter, at which it still rounds to
//     a plane drawing and clears every box (spacing.Shrink).
//  4. The winner is relaxed (spacing.Relax; components of 4 to 2,000
//     vertices with a plane triangulation behind them, trees excepted): an
//     outer triangle is first mapped onto an equilateral one, then one
//     vertex at a time moves to where the least room around it (the
//     smallest height of a triangle at it, in box sizes) is largest, trying
//     the centroid of its neighbours and then eight directions, for up to
//     spacing's relaxRounds (20) rounds, each move checked exactly;
//     boundary vertices stay within the bounding box and keep the boundary
//     convex. The relaxed drawing is stretched and shrunk the same way and
//     kept when it needs less area (Placed.Relaxed). Room is measured in
//     the component's largest box; when that is over spacing's relaxOutlier
//     (2) times the 90th percentile (a long label, a legend node),
//     relaxation is tried once more with the percentile and the smaller
//     result stays, so that one big node does not spread all the others.
//  5. Components are packed in rows, one base unit apart.
//
// SpaceOptions.Unit skips all of this and puts node centres on a grid of
// that many points; SpaceOptions.GridOnly keeps steps 1, 2 and 5 only.
// Components of more than spacing.ReadableLimit (5,000) vertices keep the
// grid drawing at the base unit, unchecked (boxes never overlap, an edge
// may pass through a box; Placed.Unchecked), and are neither compacted nor
// refined, so that from there up the cost per edge stays flat. On smaller
// components the work of steps 2 to 4 is bounded per edge (spacing's
// spacePerEdge), so spacing stays linear in the size of the graph; when
// walking the cells of long edges runs out of that work, the check tries
// every vertex against every edge instead, up to spacing's checkAllPairs
// (80 million) pairs, and a component whose check still runs out is spaced
// as in step 1 only (Placed.Unchecked).
//
// Every grid method spreads n vertices over about n grid lines each way,
// so these drawings grow with n, not with its square root; the readable
// stage is what brings big graphs down to a size one can read.
//
// # The readable stage
//
// Result.Readable draws each component of 3 to readableMaxVertices
// (20,000) vertices with package place/readable, with ideal edge lengths
// from the boxes (ReadableOptions.EdgeExtra lengthens labelled edges,
// ReadableOptions.Groups gathers clusters). The result is rounded to
// integer points, checked plane exactly (package place/mesh) and
// stretched by the least factor that clears every box. A component keeps
// its spaced drawing (counted by reason in Placed.Unrefined) when the
// stage finds it crowded, when rounding and stretching would need more
// than maxRoundings scalings or more than maxReadableGrowth^2 (4) times
// the spaced drawing's area, or when its normalized stress is higher than
// the spaced drawing's.
package place
