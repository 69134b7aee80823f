package spacing

import (
	"math"
	"slices"

	"github.com/gridwood/gridwood/internal/exact"
	"github.com/gridwood/gridwood/planarize"
)

// Bounds of Relax.
const (
	// relaxRounds bounds the rounds over the vertices; most of the gain
	// comes in the first ten.
	relaxRounds = 20
	// RelaxFrame is the extent, in integer steps, the drawing is scaled
	// up to before it is relaxed, so that small moves are possible; well
	// below 2^30, where orientation tests stop being exact.
	RelaxFrame = 1 << 27
	// relaxEdgeUnits is the median edge length, in grown half boxes, the
	// relaxed drawing is scaled to for the clearance check.
	relaxEdgeUnits = 4
	// relaxOutlier: a largest box more than this times the 90th
	// percentile's gets a second try without it (see Reaches).
	relaxOutlier = 2
)

// RelaxLimit is the largest component relaxed.
const RelaxLimit = GridCompareLimit

// relaxDirections are the directions Relax tries a vertex in.
var relaxDirections = [...][2]float64{{1, 0}, {0.7071, 0.7071}, {0, 1}, {-0.7071, 0.7071}, {-1, 0}, {-0.7071, -0.7071}, {0, -1}, {0.7071, -0.7071}}

// Relax evens out a plane drawing of a component of the augmented
// triangulation (see Plane) by moving one vertex at a time to
// where the room around it is largest: the combination of Laplacian and
// optimization-based smoothing used on triangle meshes (L. A. Freitag,
// "On combining Laplacian and optimization-based mesh smoothing
// techniques", ASME AMD 220, 1997; cited from memory), with the exact guard
// of F. Bertault's planarity-preserving refinement in place of his movement
// zones (see Refine).
//
// The room at a vertex is the least height of a triangle at it (any of its
// three vertices over the opposite side) and half the larger axis distance
// to a neighbour, measured in grown half boxes (x in units of reach[0], y
// of reach[1]: the widest box's half width and the tallest's half height,
// each plus the gap, or typical ones, see Reaches), so that it evens
// out the room boxes need. The least height over all triangles
// bounds every distance from a vertex to an edge it does not end at (the
// segment between them leaves the vertex's star through one of its far
// sides), so raising the smallest room lowers the stretch the drawing needs
// to clear its boxes. Each vertex tries the centroid of its neighbours,
// then eight directions at steps from its room down; a move is taken when
// it raises the room and keeps every triangle at the vertex turning the
// way the inner faces do (moveGuard's test), so the drawing stays plane
// throughout. Boundary vertices move too, within the drawing's bounding
// box and keeping the boundary strictly convex; an outer triangle is first
// mapped onto an equilateral one (see Equilateral).
//
// local is scratch of one entry per vertex of the whole graph.
//
// On return x, y hold the relaxed drawing scaled so that its median input
// edge is relaxEdgeUnits grown half boxes long, rounded and checked to be
// a plane drawing (or at a larger scale where it rounds to one), and Relax
// reports true; when it cannot run, or its result is not a plane drawing,
// it reports false and x, y are unusable.
func Relax(emb *planarize.Embedding, vs []int32, outer *Outer, edges [][2]int32, x, y, hw, hh []int64, gap int64, reach [2]int64, seen []bool, local []int32) bool {
	n := len(vs)
	if n < 4 || n > RelaxLimit || len(edges) == 0 || !Plane(emb, vs, outer, x, y, seen) {
		return false
	}
	reachX, reachY := reach[0], reach[1]
	unitX, unitY := float64(max(1, reachX)), float64(max(1, reachY))
	minX, minY := int64(math.MaxInt64), int64(math.MaxInt64)
	maxX, maxY := int64(math.MinInt64), int64(math.MinInt64)
	for _, v := range vs {
		minX, maxX = min(minX, x[v]), max(maxX, x[v])
		minY, maxY = min(minY, y[v]), max(maxY, y[v])
	}
	// Scale up by a whole factor, which keeps every orientation, and move
	// the corner to the origin.
	k := max(1, RelaxFrame/max(1, maxX-minX, maxY-minY))
	for _, v := range vs {
		x[v], y[v] = (x[v]-minX)*k, (y[v]-minY)*k
	}
	if len(outer.Face) == 3 {
		Equilateral(emb, vs, outer, x, y, seen)
	}
	guard, ok := newMoveGuard(emb, vs, outer, x, y)
	if !ok {
		return false
	}
	// The stars in local numbers (local[v] is v's place in vs; scratch
	// of one entry per vertex of the whole graph, so that no component
	// allocates one): start[i]..start[i+1] are vertex i's neighbours in
	// rotation order, and open says whether the triangle between a
	// neighbour and the next one is drawn (not the outer face or its
	// dummies).
	for i, v := range vs {
		local[v] = int32(i)
	}
	start := make([]int32, n+1)
	for i, v := range vs {
		start[i+1] = start[i] + int32(emb.Degree(v))
	}
	nbr := make([]int32, start[n])
	open := make([]bool, start[n])
	boundary := make([]bool, n)
	for i, v := range vs {
		_, boundary[i] = guard.pos[v]
		h := emb.First(v)
		for j := start[i]; j < start[i+1]; j++ {
			nbr[j] = local[emb.Head(h)]
			open[j] = !guard.regionCorner(h)
			h = emb.Next(h)
		}
	}
	// Moves are made in x, y, which moveGuard reads; fx, fy hold the same
	// positions in grown half boxes, in local numbers, for room2.
	fx, fy := make([]float64, n), make([]float64, n)
	for i, v := range vs {
		fx[i], fy[i] = float64(x[v])/unitX, float64(y[v])/unitY
	}
	// allowed is moveGuard.allows for inner vertex i, with the star in
	// local numbers.
	allowed := func(i int32, px, py int64) bool {
		lo, hi := start[i], start[i+1]
		for j := lo; j < hi; j++ {
			if open[j] {
				jb := j + 1
				if jb == hi {
					jb = lo
				}
				a, b := vs[nbr[j]], vs[nbr[jb]]
				if exact.OrientInt(px, py, x[a], y[a], x[b], y[b]) != guard.innerSign {
					return false
				}
			}
		}
		return true
	}
	// The star of the vertex being moved, gathered once per visit: its
	// neighbours' positions in order, and for each whether the triangle
	// with the next one is drawn.
	var starX, starY []float64
	var starOpen []bool
	var hint int // where room2 starts: the neighbour that last stopped it
	gather := func(i int) {
		starX, starY, starOpen, hint = starX[:0], starY[:0], starOpen[:0], 0
		for j := start[i]; j < start[i+1]; j++ {
			starX = append(starX, fx[nbr[j]])
			starY = append(starY, fy[nbr[j]])
			starOpen = append(starOpen, open[j])
		}
	}
	// room2 is the square of the room at the gathered vertex placed at
	// (vx, vy), or some value at most floor once it is known not to
	// exceed floor: the room is a least value, and a spot is only taken
	// when its room beats the best so far, so the rest of the star need
	// not be looked at. It starts at the neighbour that stopped it last
	// time, since nearby spots tend to fail on the same side. Plain
	// comparisons: the builtin min and max on floats pay for NaN and
	// signed zeros, which cannot occur here, and this is the inner loop.
	room2 := func(vx, vy, floor float64) float64 {
		q := math.Inf(1)
		k := len(starX)
		j := hint
		for range k {
			ax, ay := starX[j]-vx, starY[j]-vy
			c := ax
			if c < 0 {
				c = -c
			}
			if ay > c {
				c = ay
			} else if -ay > c {
				c = -ay
			}
			if c*c < 4*q {
				q = c * c / 4
			}
			jb := j + 1
			if jb == k {
				jb = 0
			}
			if starOpen[j] {
				bx, by := starX[jb]-vx, starY[jb]-vy
				cross := float64(ax*by) - float64(ay*bx)
				cross *= cross
				sx, sy := bx-ax, by-ay
				long := float64(sx*sx) + float64(sy*sy)
				if l := float64(ax*ax) + float64(ay*ay); l > long {
					long = l
				}
				if l := float64(bx*bx) + float64(by*by); l > long {
					long = l
				}
				if cross < q*long {
					q = cross / long
				}
			}
			if q <= floor {
				hint = j
				return q
			}
			j = jb
		}
		return q
	}
	// Each round tries every vertex whose star changed in the round
	// before (all of them at first): the others would find what they
	// found then.
	dirty, next := make([]bool, n), make([]bool, n)
	for i := range dirty {
		dirty[i] = true
	}
	// Boundary vertices move within the drawing's bounding box, so that
	// the drawing never grows, and as moveGuard allows (the boundary stays
	// strictly convex).
	bbX0, bbY0, bbX1, bbY1 := x[vs[0]], y[vs[0]], x[vs[0]], y[vs[0]]
	for _, v := range vs {
		bbX0, bbX1 = min(bbX0, x[v]), max(bbX1, x[v])
		bbY0, bbY1 = min(bbY0, y[v]), max(bbY1, y[v])
	}
	canMove := func(i int, li int32, px, py int64) bool {
		if !boundary[i] {
			return allowed(li, px, py)
		}
		return px >= bbX0 && px <= bbX1 && py >= bbY0 && py <= bbY1 && guard.allows(vs[i], px, py)
	}
	for range relaxRounds {
		moved := false
		for i, v := range vs {
			if !dirty[i] {
				continue
			}
			li := int32(i)
			gather(i)
			cur := room2(fx[i], fy[i], 0)
			best, bx, by := cur, x[v], y[v]
			// First the centroid of the neighbours (Laplacian smoothing),
			// which evens out sizes where the room search alone would
			// stop at a local best.
			var cx, cy float64
			for _, a := range nbr[start[i]:start[i+1]] {
				cx, cy = cx+fx[a], cy+fy[a]
			}
			deg := float64(start[i+1] - start[i])
			px, py := int64(math.Round(cx/deg*unitX)), int64(math.Round(cy/deg*unitY))
			if q := room2(float64(px)/unitX, float64(py)/unitY, best); q > best && canMove(i, li, px, py) {
				best, bx, by = q, px, py
			}
			// Then steps from the room itself down: the best spot is
			// usually within it.
			reach := math.Sqrt(cur)
			for step := reach; step > reach/16 && best == cur; step /= 2 {
				for _, d := range relaxDirections {
					px := x[v] + int64(math.Round(d[0]*step*unitX))
					py := y[v] + int64(math.Round(d[1]*step*unitY))
					if q := room2(float64(px)/unitX, float64(py)/unitY, best); q > best && canMove(i, li, px, py) {
						best, bx, by = q, px, py
					}
				}
			}
			if best > cur {
				x[v], y[v] = bx, by
				fx[i], fy[i] = float64(bx)/unitX, float64(by)/unitY
				moved = true
				next[i] = true
				for _, a := range nbr[start[i]:start[i+1]] {
					next[a] = true
				}
			}
		}
		if !moved {
			break
		}
		dirty, next = next, dirty
		clear(next)
	}
	// Back to a scale where the clearance check is meaningful.
	lengths := make([]float64, 0, len(edges))
	for _, e := range edges {
		a, b := local[e[0]], local[e[1]]
		if a < 0 || int(a) >= n || vs[a] != e[0] || b < 0 || int(b) >= n || vs[b] != e[1] {
			continue // not this component's (the caller passes its own)
		}
		dx, dy := fx[b]-fx[a], fy[b]-fy[a]
		lengths = append(lengths, math.Sqrt(float64(dx*dx)+float64(dy*dy)))
	}
	if len(lengths) == 0 {
		return false
	}
	slices.Sort(lengths)
	median := lengths[len(lengths)/2]
	if !(median > 0) {
		return false
	}
	big := make([][2]int64, n)
	for i, v := range vs {
		big[i] = [2]int64{x[v], y[v]}
	}
	for f := relaxEdgeUnits / median; f < 1; f *= 2 {
		for i, v := range vs {
			x[v] = int64(math.Round(float64(big[i][0]) * f))
			y[v] = int64(math.Round(float64(big[i][1]) * f))
		}
		if Plane(emb, vs, outer, x, y, seen) {
			return true
		}
	}
	for i, v := range vs {
		x[v], y[v] = big[i][0], big[i][1]
	}
	// Every move was checked locally; the whole is checked once more, as
	// local checks on the boundary cannot see it wind round twice.
	return Plane(emb, vs, outer, x, y, seen)
}

// Reaches are the grown half boxes Relax measures room in, per axis:
// the largest, and, when that is more than relaxOutlier times the 90th
// percentile, the percentile as well, so that a few big nodes (a long
// label, a legend) need not set every other node's room and blow the
// drawing up around them; the final stretch still clears the big boxes.
// The spacing rule (place.Result.Space) relaxes with each and keeps the
// smaller drawing: neither wins everywhere. Measured on a 100-node random
// planar graph with one 52-character label: 9,624 x 8,898 points, against
// 23,317 x 20,726 with the largest box only; relaxing by the percentile
// alone, the shipped campus example, whose labels vary less, came out
// 472 x 414 instead of 428 x 369 (bench/RESULTS.md has the corpus figures).
func Reaches(vs []int32, hw, hh []int64, gap int64) [][2]int64 {
	rx, ry := make([]int64, len(vs)), make([]int64, len(vs))
	for i, v := range vs {
		rx[i], ry[i] = hw[v]+gap, hh[v]+gap
	}
	slices.Sort(rx)
	slices.Sort(ry)
	widest := [2]int64{rx[len(rx)-1], ry[len(ry)-1]}
	typical := widest
	for axis, r := range [2][]int64{rx, ry} {
		if p90 := r[len(r)*9/10]; r[len(r)-1] > relaxOutlier*p90 {
			typical[axis] = p90
		}
	}
	if typical == widest {
		return [][2]int64{widest}
	}
	return [][2]int64{widest, typical}
}

// Equilateral maps a plane drawing whose outer face is a triangle
// affinely onto one whose outer face is an equilateral triangle of side
// RelaxFrame, turning the same way, and keeps it if it rounds to a plane
// drawing. The Schnyder and face-count drawings put the outer triangle on
// a right angle and two half right angles; the vertices whose edges fan
// out in a narrow corner are where a drawing crowds, and Relax moves the
// corners only within the drawing's bounding box. An equilateral outer triangle took a fifth to two
// thirds of the area off relaxed random triangulations and random planar
// graphs of 100 to 1,000 nodes (see bench/RESULTS.md).
func Equilateral(emb *planarize.Embedding, vs []int32, outer *Outer, x, y []int64, seen []bool) {
	a, b, c := emb.Tail(outer.Face[0]), emb.Tail(outer.Face[1]), emb.Tail(outer.Face[2])
	ax, ay := float64(x[a]), float64(y[a])
	bx, by := float64(x[b])-ax, float64(y[b])-ay
	cx, cy := float64(x[c])-ax, float64(y[c])-ay
	det := float64(bx*cy) - float64(cx*by)
	if det == 0 {
		return
	}
	// The corners' new places, turning as a, b, c did.
	side := float64(RelaxFrame)
	height := math.Sqrt(0.75) * side
	qbx, qby, qcx, qcy := side, 0.0, side/2, height
	if det < 0 {
		qbx, qby, qcx, qcy = side/2, height, side, 0
	}
	old := make([][2]int64, len(vs))
	for i, v := range vs {
		old[i] = [2]int64{x[v], y[v]}
		// v's coordinates in the frame of the sides a->b and a->c.
		ux, uy := float64(x[v])-ax, float64(y[v])-ay
		s := (float64(ux*cy) - float64(uy*cx)) / det
		t := (float64(bx*uy) - float64(by*ux)) / det
		x[v] = int64(math.Round(float64(s*qbx) + float64(t*qcx)))
		y[v] = int64(math.Round(float64(s*qby) + float64(t*qcy)))
	}
	if !Plane(emb, vs, outer, x, y, seen) {
		for i, v := range vs {
			x[v], y[v] = old[i][0], old[i][1]
		}
	}
}

// RelaxWins relaxes a copy of the finished drawing in px, py (see Relax),
// stretches and shrinks it as spacing does, and when it then clears every
// box in less area than px, py writes it to px, py and reports true. tx,
// ty, lx, ly are scratch; stamp is Relax's and the clearance passes'.
func RelaxWins(aug *planarize.Embedding, vs []int32, region *Outer, edges [][2]int32, px, py, tx, ty, lx, ly, hw, hh []int64, gap int64, reach [2]int64, seen []bool, stamp []int32) bool {
	if len(vs) > RelaxLimit {
		return false
	}
	for _, v := range vs {
		tx[v], ty[v] = px[v], py[v]
	}
	if !Relax(aug, vs, region, edges, tx, ty, hw, hh, gap, reach, seen, stamp) {
		return false
	}
	s, ok := ClearingStretch(vs, edges, tx, ty, hw, hh, gap, stamp, NewMeter(len(edges)), true)
	if !ok || s > StretchLimit(vs, tx, ty, hw, hh) {
		return false
	}
	Stretch(aug, vs, region, tx, ty, s, lx, ly, seen)
	Shrink(aug, vs, region, edges, tx, ty, hw, hh, gap, lx, ly, seen, stamp)
	if ClearedArea(vs, tx, ty, 1, hw, hh) >= ClearedArea(vs, px, py, 1, hw, hh) {
		return false
	}
	for _, v := range vs {
		px[v], py[v] = tx[v], ty[v]
	}
	return true
}
