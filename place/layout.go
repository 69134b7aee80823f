package place

import (
	"errors"
	"math"
	"slices"

	"github.com/gridwood/gridwood/place/augment"
	"github.com/gridwood/gridwood/place/convex"
	"github.com/gridwood/gridwood/place/internal/spacing"
	"github.com/gridwood/gridwood/place/schnyder"
	"github.com/gridwood/gridwood/planarize"
)

// Drawing is a straight-line grid drawing: vertex v sits at (X[v], Y[v]),
// all points lie in [0, Width] x [0, Height].
type Drawing struct {
	X, Y          []int64
	Width, Height int64
	// Components lists the connected components in order of their smallest
	// vertex, with the box each occupies.
	Components []Component
	// NotConvex counts the components of three or more vertices that
	// Method Convex could not draw convex (not 3-connected) and so drew
	// with the Schnyder method.
	NotConvex int

	// Barycentric holds each vertex's weak barycentric coordinates within
	// its component's Schnyder wood (Schnyder 1990): the vertex counts
	// that place it. Zero for components of one or two vertices and for
	// those drawn convex.
	Barycentric [][3]int32
}

// triangulation is what the grid stage hands on to spacing besides the
// drawing: each component's vertices and, with Options.Smooth, the
// triangulation the Schnyder drawings were made of and the other drawings
// of it that Space weighs against the grid.
type triangulation struct {
	members [][]int32 // each component's vertices, in increasing order
	// The rest is set with Options.Smooth only.
	aug      *planarize.Embedding // the input with its dummy edges
	triOuter []int32              // each Schnyder drawing's outer triangle (a dart of aug), -1 if none
	// outer is each component's outer region (nil where no Tutte drawing
	// was made), and tutteX, tutteY Tutte's drawing in the frame
	// spacing.Tutte rounds into (nil if none was made).
	outer          []*spacing.Outer
	tutteX, tutteY []int64
	// convexAlt holds, per component (nil if none), a face-count drawing
	// to weigh against the Schnyder one: x and y in the order of members;
	// convexOwn says it is of the component's own faces (3-connected:
	// every face convex), not of its triangulation's.
	convexAlt [][2][]int64
	convexOwn []bool
}

// Component describes one connected component of a drawing.
type Component struct {
	Vertices   int
	X0, Y0     int64 // lower-left corner of its box
	W, H       int64 // box extent in grid steps
	Barycentre bool  // placed by Schnyder's barycentric method (3+ vertices)
	// FullW, FullH is the extent before compaction (equal to W, H without
	// Options.Compact).
	FullW, FullH int64
	// Convex reports a convex drawing (Method Convex).
	Convex bool
	// FellBack reports a component Method Convex could not draw convex
	// (not 3-connected), drawn with the Schnyder method instead.
	FellBack bool
}

// Options tune Layout. The zero value is the default.
type Options struct {
	// Outer lists vertices that must lie on the outer face of their
	// component. The outer face is otherwise a largest face of the input.
	Outer []int32
	// Compact removes grid columns and rows that can go without changing
	// any crossing or touching (see compact); the grid bound still holds.
	Compact bool
	// Method chooses how components are drawn; see Method.
	Method Method
	// Smooth, if positive, also computes for every component of 4 to
	// spacing.ReadableLimit vertices Tutte's barycentric drawing with its
	// outer face on a convex polygon, solving for at most that many
	// conjugate-gradient steps (see spacing.Tutte); Space uses it where the
	// grid crowds.
	Smooth int
}

// Method is a drawing method.
type Method int

const (
	// Schnyder draws each component at the weak barycentric coordinates
	// of a Schnyder wood of a triangulation of it.
	Schnyder Method = iota
	// Convex draws each 3-connected component with every face a convex
	// polygon, on the (f-1) x (f-1) grid (S. Felsner, "Convex drawings of
	// planar graphs and the order dimension of 3-polytopes", Order 18,
	// 2001; see package place/convex); other components get the Schnyder method
	// and are counted in Drawing.NotConvex.
	Convex
)

// ErrOuter reports that no face of the embedding holds all of
// Options.Outer.
var ErrOuter = errors.New("place: no face holds all the vertices asked for on the outer face")

// Layout draws the embedded planar graph on the integer grid with straight,
// non-crossing edges. Each connected component with n >= 3 vertices is
// triangulated with dummy edges (dropped again afterwards), given a
// canonical ordering and its Schnyder wood, and placed at its weak
// barycentric coordinates, inside [0, n-2] x [0, n-2] (Schnyder 1990).
// Components are packed in rows without overlapping boxes. The embedding
// is not modified.
// It returns an error if the rotation system is not a plane embedding
// (see planarize.Embedding.IsPlane) or has loops or repeated edges.
func Layout(emb *planarize.Embedding, opt Options) (*Drawing, error) {
	if !emb.IsPlane() {
		return nil, errNotPlane
	}
	if !emb.IsSimple() {
		return nil, errNotSimple
	}
	d, _, err := layout(emb.Clone(), opt)
	return d, err
}

var (
	errNotPlane  = errors.New("place: the rotation system is not a plane embedding")
	errNotSimple = errors.New("place: the embedding has a loop or a repeated edge")
)

// tutteTriangleLimit is the largest component given Tutte's drawing when
// its outer face is a triangle.
const tutteTriangleLimit = 100

// layout is Layout on an embedding it may change; it also returns what
// spacing needs of the triangulation behind the drawing.
func layout(work *planarize.Embedding, opt Options) (*Drawing, *triangulation, error) {
	n := work.N()
	comp, members := work.ComponentLabels()
	// A component that already has 3n-6 edges is a triangulation: it needs
	// no augmentation, which on meshes saves a third of the time.
	full := make([]bool, len(members))
	edgesIn := make([]int, len(members))
	for v := range n {
		edgesIn[comp[v]] += work.Degree(int32(v))
	}
	extra := 0
	for c, vs := range members {
		k := len(vs)
		full[c] = k < 3 || edgesIn[c]/2 == 3*k-6
		if !full[c] {
			extra += 3*k - 6 - edgesIn[c]/2
		}
	}
	chosen, err := chooseOuterFaces(work, comp, members, full, opt.Outer)
	if err != nil {
		return nil, nil, err
	}
	// Convex drawings work on the input's own embedding: draw them first
	// and leave those components out of the augmentation.
	var convexXY [][2][]int64
	var convexWH [][2]int64
	notConvex := 0
	fellBack := make([]bool, len(members))
	if opt.Method == Convex {
		convexXY = make([][2][]int64, len(members))
		convexWH = make([][2]int64, len(members))
		for c, vs := range members {
			if len(vs) < 3 || chosen[c] < 0 {
				continue
			}
			x, y, w, h, err := convexComponent(work, vs, chosen[c])
			if err != nil {
				notConvex++
				fellBack[c] = true
				continue
			}
			convexXY[c], convexWH[c] = [2][]int64{x, y}, [2]int64{w, h}
			if !full[c] {
				extra -= 3*len(vs) - 6 - edgesIn[c]/2
			}
			full[c] = true // no augmentation
		}
	}
	// For the picture (Options.Smooth), each 3-connected component of the
	// default method also gets Felsner's convex drawing, which Space
	// weighs against the Schnyder one: on triangulations it often needs
	// far less room to clear the node boxes.
	var convexAlt [][2][]int64
	var convexOwn []bool // made with convexAlt
	addConvexAlt := func(c int, x, y []int64, own bool) {
		if convexAlt == nil {
			convexAlt, convexOwn = make([][2][]int64, len(members)), make([]bool, len(members))
		}
		convexAlt[c], convexOwn[c] = [2][]int64{x, y}, own
	}
	if opt.Smooth > 0 && opt.Method == Schnyder {
		for c, vs := range members {
			if len(vs) < 4 || len(vs) > spacing.ReadableLimit || chosen[c] < 0 {
				continue
			}
			if x, y, _, _, err := convexComponent(work, vs, chosen[c]); err == nil {
				addConvexAlt(c, x, y, true)
			}
		}
	}
	skip := func(v int32) bool { return full[comp[v]] }
	// Remember the chosen faces' darts: biconnection may cut a face that
	// passes a cut vertex twice, and then the largest piece is used.
	chosenDarts := make([][]int32, len(members))
	if opt.Smooth > 0 {
		for c, d := range chosen {
			if d < 0 || full[c] {
				continue
			}
			for x := d; ; {
				chosenDarts[c] = append(chosenDarts[c], x)
				if x = work.FaceNext(x); x == d {
					break
				}
			}
		}
	}
	work.Reserve(extra)
	augment.Biconnect(work, skip)
	// Each dart of a chosen face now lies on one piece; walk every piece
	// once (marking its darts) and keep the longest.
	onPiece := make(map[int32]bool)
	for c, ds := range chosenDarts {
		best := 0
		for _, d := range ds {
			if onPiece[d] {
				continue
			}
			k := 0
			for x := d; ; {
				onPiece[x] = true
				k++
				if x = work.FaceNext(x); x == d {
					break
				}
			}
			if k > best {
				best, chosen[c] = k, d
			}
		}
	}
	// A chosen face that gets triangulated hands over one of its
	// triangles: as the unbounded triangle it makes the whole face the
	// outer face of the final drawing, once the dummy edges are gone.
	wanted := make([]bool, 2*work.M())
	outerDart := make([]int32, len(members))
	regions := make([]*spacing.Outer, len(members))
	for c, d := range chosen {
		outerDart[c] = d
		if d >= 0 {
			wanted[d] = true
			if opt.Smooth > 0 {
				// The face after biconnection: a simple cycle (the input's
				// face may pass a cut vertex twice), cut from the chosen
				// one by the biconnecting edges only.
				r := &spacing.Outer{}
				for x := d; ; {
					r.Face = append(r.Face, x)
					if x = work.FaceNext(x); x == d {
						break
					}
				}
				regions[c] = r
			}
		}
	}
	augment.TriangulateFaces(work, skip, func(face []int32, tri int32) {
		for _, d := range face {
			if int(d) < len(wanted) && wanted[d] {
				c := comp[work.Tail(tri)]
				outerDart[c] = tri
				if r := regions[c]; r != nil {
					// This face's dummies were the last len(face)-3 edges.
					r.Lo, r.Hi = work.M()-(len(face)-3), work.M()
				}
				return
			}
		}
	})
	// Compaction keeps the whole triangulation plane, dummy edges too, so
	// that the grid drawing can still be refined under exact checks.
	var origEdges [][]int32
	if opt.Compact {
		origEdges = edgesByComponent(work, comp, members, work.M())
	}
	d := &Drawing{X: make([]int64, n), Y: make([]int64, n), Barycentric: make([][3]int32, n)}
	tri := &triangulation{members: members}
	ww := schnyder.NewWork(n)
	index := make([]int32, n) // position of a vertex within its component
	var coord [][3]int32
	var order []int32
	boxes := make([]Component, len(members))
	for c, vs := range members {
		for i, v := range vs {
			index[v] = int32(i)
		}
		switch len(vs) {
		case 1:
			boxes[c] = Component{Vertices: 1}
			continue
		case 2:
			d.X[vs[1]] = 1
			boxes[c] = Component{Vertices: 2, W: 1, FullW: 1}
			continue
		}
		if convexXY != nil && convexXY[c][0] != nil {
			for i, v := range vs {
				d.X[v], d.Y[v] = convexXY[c][0][i], convexXY[c][1][i]
			}
			w, h := convexWH[c][0], convexWH[c][1]
			boxes[c] = Component{Vertices: len(vs), W: w, H: h, FullW: w, FullH: h, Convex: true}
			continue
		}
		outer := outerDart[c]
		if outer < 0 {
			outer = work.First(vs[0])
		}
		if opt.Smooth > 0 {
			if tri.triOuter == nil {
				tri.triOuter = make([]int32, len(members))
				for i := range tri.triOuter {
					tri.triOuter[i] = -1
				}
			}
			tri.triOuter[c] = outer
		}
		order = append(order[:0], make([]int32, len(vs))...)
		if err := ww.CanonicalOrder(work, outer, order); err != nil {
			return nil, nil, err
		}
		coord = append(coord[:0], make([][3]int32, len(vs))...)
		ww.Barycentric(order, coord, index)
		if opt.Smooth > 0 && len(vs) >= 4 && len(vs) <= spacing.ReadableLimit && (convexAlt == nil || convexAlt[c][0] == nil) {
			// No convex drawing of the input's own faces (not
			// 3-connected): Felsner's drawing of the triangulation, with
			// the same outer triangle, is a candidate still; its face
			// counts crowd far less than the vertex counts above.
			if x, y, _, _, err := convexComponent(work, vs, outer); err == nil {
				addConvexAlt(c, x, y, false)
			}
		}
		// Tutte's drawing inside a triangle squeezes a big triangulation's
		// interior exponentially; it is worth computing for a larger
		// outer face, or for small components.
		if r := regions[c]; r != nil && len(vs) >= 4 && len(vs) <= spacing.ReadableLimit && (len(r.Face) > 3 || len(vs) <= tutteTriangleLimit) {
			if tri.tutteX == nil {
				tri.tutteX, tri.tutteY = make([]int64, n), make([]int64, n)
				tri.outer = make([]*spacing.Outer, len(members))
			}
			spacing.Tutte(work, vs, r, tri.tutteX, tri.tutteY, opt.Smooth)
			tri.outer[c] = r
		}
		var w, h int64
		for i, v := range vs {
			d.Barycentric[v] = coord[i]
			d.X[v], d.Y[v] = int64(coord[i][0]), int64(coord[i][1])
			w, h = max(w, d.X[v]), max(h, d.Y[v])
		}
		fw, fh := w, h
		if opt.Compact && len(vs) <= spacing.ReadableLimit {
			w, h = compactComponent(work, d, vs, index, origEdges[c])
		}
		boxes[c] = Component{Vertices: len(vs), W: w, H: h, Barycentre: true, FullW: fw, FullH: fh, FellBack: fellBack[c]}
	}
	pack(boxes)
	for c, vs := range members {
		for _, v := range vs {
			d.X[v] += boxes[c].X0
			d.Y[v] += boxes[c].Y0
		}
		d.Width = max(d.Width, boxes[c].X0+boxes[c].W)
		d.Height = max(d.Height, boxes[c].Y0+boxes[c].H)
	}
	d.Components = boxes
	d.NotConvex = notConvex
	if opt.Smooth > 0 {
		tri.aug = work
		tri.convexAlt, tri.convexOwn = convexAlt, convexOwn
	}
	return d, tri, nil
}

// convexComponent draws the component of emb with vertices vs convex (see
// convex.Draw), with the face left of emb's dart outer as its outer face;
// the coordinates are in the order of vs.
func convexComponent(emb *planarize.Embedding, vs []int32, outer int32) (x, y []int64, w, h int64, err error) {
	sub, oldDart := emb.Restrict(vs)
	inSub := int32(-1)
	for nd, od := range oldDart {
		if od == outer {
			inSub = int32(nd)
			break
		}
	}
	return convex.Draw(sub, inSub)
}

// pack places component boxes left to right in rows, with one empty grid
// line between neighbours,
// starting a new row when a row would grow wider than about the square
// root of the total area, so that many small components do not become one
// endless line. Rows are stacked upwards in order.
func pack(boxes []Component) { packRows(boxes, 1, 1, 0) }

// packRows places boxes in rows no wider than about the square root of
// their total area (or the widest box): each box takes W+pad by H+pad,
// boxes in a row and rows sit sep apart, and areaSep of that separation
// counts toward the area. Grid boxes (pack) hold W+1 points a side and
// keep one free step between them; boxes in points (packSpaced) keep the
// gap.
func packRows(boxes []Component, pad, sep, areaSep int64) {
	if len(boxes) == 0 {
		return
	}
	var area, widest int64
	for _, b := range boxes {
		area += (b.W + pad + areaSep) * (b.H + pad + areaSep)
		widest = max(widest, b.W+pad)
	}
	limit := max(widest, isqrt(area))
	var x, y, rowH int64
	for i := range boxes {
		b := &boxes[i]
		if x > 0 && x+b.W+pad > limit {
			y += rowH + pad + sep
			x, rowH = 0, 0
		}
		b.X0, b.Y0 = x, y
		x += b.W + pad + sep
		rowH = max(rowH, b.H)
	}
}

func isqrt(a int64) int64 {
	r := int64(math.Sqrt(float64(a)))
	for r*r > a {
		r--
	}
	for (r+1)*(r+1) <= a {
		r++
	}
	return r
}

// chooseOuterFaces picks, per component, a dart of the face to be the
// outer one: a largest face, the first found in dart order on ties, or
// when outer is given, a largest face holding all of those vertices in
// their component. -1 leaves a component's choice open.
func chooseOuterFaces(emb *planarize.Embedding, comp []int32, members [][]int32, full []bool, outer []int32) ([]int32, error) {
	ncomp := len(members)
	chosen := make([]int32, ncomp)
	size := make([]int, ncomp)
	for c := range chosen {
		chosen[c] = -1
	}
	need := -1
	mark := make([]int32, emb.N())
	if len(outer) > 0 {
		need = int(comp[outer[0]])
		for _, v := range outer {
			if int(comp[v]) != need {
				return nil, ErrOuter
			}
			mark[v] = -1 // -1: wanted, not yet seen in this face
		}
	}
	// A triangulation's faces are all triangles: any will do, unless the
	// outer vertices must be found on one (its darts are marked seen).
	seen := make([]bool, 2*emb.M())
	for c, vs := range members {
		if !full[c] || int(c) == need || len(vs) < 3 {
			continue
		}
		chosen[c] = emb.First(vs[0])
		for _, v := range vs {
			d := emb.First(v)
			for range emb.Degree(v) {
				seen[d] = true
				d = emb.Next(d)
			}
		}
	}
	faceID := int32(0)
	distinct := countDistinct(outer)
	for d0 := int32(0); int(d0) < len(seen); d0++ {
		if seen[d0] {
			continue
		}
		faceID++
		k, hits := 0, 0
		for d := d0; !seen[d]; d = emb.FaceNext(d) {
			seen[d] = true
			k++
			if v := emb.Tail(d); need >= 0 && mark[v] != 0 && mark[v] != faceID {
				mark[v] = faceID
				hits++
			}
		}
		c := comp[emb.Tail(d0)]
		if int(c) == need && hits < distinct {
			continue
		}
		if k > size[c] {
			size[c], chosen[c] = k, d0
		}
	}
	if need >= 0 && chosen[need] < 0 {
		return nil, ErrOuter
	}
	return chosen, nil
}

func countDistinct(vs []int32) int {
	s := append([]int32(nil), vs...)
	slices.Sort(s)
	return len(slices.Compact(s))
}

// edgesByComponent lists the first m edges of emb per component, as pairs of positions within the
// component's vertex list (see layout's index).
// Components too big to compact get no list.
func edgesByComponent(emb *planarize.Embedding, comp []int32, members [][]int32, m int) [][]int32 {
	out := make([][]int32, len(members))
	for e := range m {
		c := comp[emb.Edge(e)[0]]
		if len(members[c]) <= spacing.ReadableLimit {
			out[c] = append(out[c], int32(e))
		}
	}
	return out
}

// compactComponent compacts one component in place (coordinates relative
// to its box) and returns its new extent.
func compactComponent(emb *planarize.Embedding, d *Drawing, vs []int32, index []int32, edgeIDs []int32) (int64, int64) {
	x := make([]int64, len(vs))
	y := make([]int64, len(vs))
	for i, v := range vs {
		x[i], y[i] = d.X[v], d.Y[v]
	}
	pairs := make([][2]int32, len(edgeIDs))
	for i, e := range edgeIDs {
		ends := emb.Edge(int(e))
		pairs[i] = [2]int32{index[ends[0]], index[ends[1]]}
	}
	w, h := compact(x, y, pairs)
	for i, v := range vs {
		d.X[v], d.Y[v] = x[i], y[i]
	}
	return w, h
}
