package geomcheck

import (
	"cmp"
	"fmt"
	"math"
	"math/bits"
	"slices"
)

// Point is a vertex position on the integer grid.
type Point struct{ X, Y int64 }

// Kind says what is wrong.
type Kind int

const (
	// Crossing: two edges intersect at a point interior to both.
	Crossing Kind = iota
	// Overlap: two edges are collinear and share more than one point, or
	// they join the same pair of vertices.
	Overlap
	// VertexOnEdge: a vertex lies in the relative interior of an edge it is
	// not an end of. This includes an edge end touching another edge's
	// interior (a T-junction).
	VertexOnEdge
	// SharedPoint: two distinct vertices have the same coordinates. An edge
	// whose two distinct ends coincide shows up this way.
	SharedPoint
)

// String returns a short lower-case name of k.
func (k Kind) String() string {
	switch k {
	case Crossing:
		return "crossing"
	case Overlap:
		return "overlap"
	case VertexOnEdge:
		return "vertex on edge"
	case SharedPoint:
		return "shared point"
	}
	return fmt.Sprintf("Kind(%d)", int(k))
}

// Problem is one defect. For Crossing and Overlap, A < B are edge indices.
// For VertexOnEdge, A is the vertex and B the edge. For SharedPoint, A < B
// are vertices.
type Problem struct {
	Kind Kind
	A, B int
}

// MaxCoord bounds every coordinate: |X|, |Y| <= MaxCoord. Within it every
// coordinate difference is at most 2^41 (2^42 for box corners), every product
// of two differences at most 2^84 in magnitude, and all such products are
// compared exactly in 128-bit integer arithmetic.
const MaxCoord = 1 << 40

// Check returns every problem of the drawing of the graph with vertex
// positions pts and the given edges, sorted by Kind, then A, then B.
//
// Edges are pairs of indices into pts; loops (u, u) are ignored. Two edges
// with the same pair of ends are an Overlap. Edges that share an end may
// meet only at that vertex. Check returns an error if an edge refers to a
// vertex that does not exist or a coordinate lies outside ±MaxCoord.
func Check(pts []Point, edges [][2]int32) ([]Problem, error) {
	return run(pts, edges, 0)
}

// First is Check with an early stop: it returns min(limit, n) of the n
// problems Check would return, sorted, and stops searching once it has limit
// of them. First(pts, edges, 1) is empty exactly when the drawing is clean.
// A limit <= 0 means no limit.
func First(pts []Point, edges [][2]int32, limit int) ([]Problem, error) {
	return run(pts, edges, limit)
}

// validate checks the input contract shared by Check and checkBrute.
func validate(pts []Point, edges [][2]int32) error {
	if len(pts) > math.MaxInt32 || len(edges) > math.MaxInt32 {
		return fmt.Errorf("geomcheck: %d vertices and %d edges; at most %d of each", len(pts), len(edges), math.MaxInt32)
	}
	for i, p := range pts {
		if !inRange(p.X) || !inRange(p.Y) {
			return fmt.Errorf("geomcheck: vertex %d at (%d, %d) lies outside |x|, |y| <= %d", i, p.X, p.Y, int64(MaxCoord))
		}
	}
	for i, e := range edges {
		for _, v := range e {
			if v < 0 || int(v) >= len(pts) {
				return fmt.Errorf("geomcheck: edge %d (%d, %d) refers to a vertex outside 0..%d", i, e[0], e[1], len(pts)-1)
			}
		}
	}
	return nil
}

func inRange(v int64) bool { return -MaxCoord <= v && v <= MaxCoord }

func sortProblems(ps []Problem) {
	slices.SortFunc(ps, func(p, q Problem) int {
		if c := cmp.Compare(p.Kind, q.Kind); c != 0 {
			return c
		}
		if c := cmp.Compare(p.A, q.A); c != 0 {
			return c
		}
		return cmp.Compare(p.B, q.B)
	})
}

// ---------------------------------------------------------------------------
// Exact predicates.

// mul128 returns the exact signed product a*b as a two's-complement 128-bit
// number (hi, lo). The unsigned product of the bit patterns differs from the
// signed one by 2^64 times b (if a < 0) plus a (if b < 0), modulo 2^128.
func mul128(a, b int64) (hi int64, lo uint64) {
	h, l := bits.Mul64(uint64(a), uint64(b))
	hi = int64(h)
	if a < 0 {
		hi -= b
	}
	if b < 0 {
		hi -= a
	}
	return hi, l
}

// cmpProd returns the sign of a*b - c*d, computed exactly for all int64
// arguments (each product fits in 127 bits plus sign).
func cmpProd(a, b, c, d int64) int {
	h1, l1 := mul128(a, b)
	h2, l2 := mul128(c, d)
	switch {
	case h1 < h2:
		return -1
	case h1 > h2:
		return 1
	case l1 < l2:
		return -1
	case l1 > l2:
		return 1
	}
	return 0
}

// orient returns +1 if c lies to the left of the directed line a->b
// (counter-clockwise turn), -1 if to the right and 0 if a, b, c are collinear.
// The differences stay below 2^63 whenever all coordinates are within
// ±2^61, so orient is exact on everything this package feeds it.
func orient(a, b, c Point) int {
	return cmpProd(b.X-a.X, c.Y-a.Y, b.Y-a.Y, c.X-a.X)
}

// lexCmp orders points by X, then Y. Along any line this order is monotone,
// so it serves as "position along a segment" for collinear points.
func lexCmp(p, q Point) int {
	if c := cmp.Compare(p.X, q.X); c != 0 {
		return c
	}
	return cmp.Compare(p.Y, q.Y)
}

func lexLess(p, q Point) bool { return p.X < q.X || p.X == q.X && p.Y < q.Y }

// inOpenSegment reports whether p lies on segment ab but is neither end of
// it (the relative interior). A zero-length segment has an empty interior.
func inOpenSegment(a, b, p Point) bool {
	if !(lexLess(a, p) && lexLess(p, b) || lexLess(b, p) && lexLess(p, a)) {
		return false
	}
	return orient(a, b, p) == 0
}

// properCrossing reports whether segments ab and cd meet in a single point
// interior to both: each segment's ends lie strictly on opposite sides of
// the other's line.
func properCrossing(a, b, c, d Point) bool {
	o1, o2 := orient(a, b, c), orient(a, b, d)
	if o1*o2 >= 0 {
		return false
	}
	o3, o4 := orient(c, d, a), orient(c, d, b)
	return o3*o4 < 0
}

// collinearOverlap reports whether segments ab and cd lie on one line and
// share more than one point. If either is a single point it is false.
func collinearOverlap(a, b, c, d Point) bool {
	if orient(a, b, c) != 0 || orient(a, b, d) != 0 || orient(c, d, a) != 0 {
		return false
	}
	if lexLess(b, a) {
		a, b = b, a
	}
	if lexLess(d, c) {
		c, d = d, c
	}
	lo, hi := a, b
	if lexLess(lo, c) {
		lo = c
	}
	if lexLess(d, hi) {
		hi = d
	}
	return lexLess(lo, hi)
}

// pairKind classifies two edges drawn as segments ab and cd that do not join
// the same pair of vertices. Touching in a single point that is an end of at
// least one segment is not a pair problem: it is either allowed (a shared
// vertex) or reported for the vertex (VertexOnEdge, SharedPoint).
func pairKind(a, b, c, d Point) (Kind, bool) {
	if collinearOverlap(a, b, c, d) {
		return Overlap, true
	}
	if properCrossing(a, b, c, d) {
		return Crossing, true
	}
	return 0, false
}

// rect is a closed axis-parallel rectangle [xlo, xhi] x [ylo, yhi].
type rect struct{ xlo, ylo, xhi, yhi int64 }

// segTouchesClosedRect reports whether segment ab meets the closed rectangle
// r (which may be degenerate). By the separating axis theorem (common
// practice) two convex polygons are disjoint exactly when their projections
// on one of the polygons' edge normals are disjoint; here those normals are
// the two axes and the normal of ab.
func segTouchesClosedRect(a, b Point, r rect) bool {
	if max(a.X, b.X) < r.xlo || min(a.X, b.X) > r.xhi || max(a.Y, b.Y) < r.ylo || min(a.Y, b.Y) > r.yhi {
		return false
	}
	s := orient(a, b, Point{r.xlo, r.ylo}) + orient(a, b, Point{r.xhi, r.ylo}) +
		orient(a, b, Point{r.xhi, r.yhi}) + orient(a, b, Point{r.xlo, r.yhi})
	return s != 4 && s != -4
}

// ---------------------------------------------------------------------------
// Reference implementation.

// checkBrute is Check by definition: every pair of vertices, every
// vertex-edge pair and every pair of edges. It is quadratic and serves as
// the reference the fast path is tested against.
func checkBrute(pts []Point, edges [][2]int32) ([]Problem, error) {
	if err := validate(pts, edges); err != nil {
		return nil, err
	}
	var out []Problem
	for i := range pts {
		for j := i + 1; j < len(pts); j++ {
			if pts[i] == pts[j] {
				out = append(out, Problem{SharedPoint, i, j})
			}
		}
	}
	for v := range pts {
		for e, uw := range edges {
			if uw[0] != uw[1] && inOpenSegment(pts[uw[0]], pts[uw[1]], pts[v]) {
				out = append(out, Problem{VertexOnEdge, v, e})
			}
		}
	}
	for e, ab := range edges {
		if ab[0] == ab[1] {
			continue
		}
		for f := e + 1; f < len(edges); f++ {
			cd := edges[f]
			if cd[0] == cd[1] {
				continue
			}
			if samePair(ab, cd) {
				out = append(out, Problem{Overlap, e, f})
				continue
			}
			if k, ok := pairKind(pts[ab[0]], pts[ab[1]], pts[cd[0]], pts[cd[1]]); ok {
				out = append(out, Problem{k, e, f})
			}
		}
	}
	sortProblems(out)
	return out, nil
}

func samePair(e, f [2]int32) bool {
	return e == f || e[0] == f[1] && e[1] == f[0]
}

// ---------------------------------------------------------------------------
// Fast path.

// collector gathers problems up to a limit (0: none).
type collector struct {
	out   []Problem
	limit int
}

// add records p and reports whether there is room for more.
func (c *collector) add(p Problem) bool {
	c.out = append(c.out, p)
	return c.limit <= 0 || len(c.out) < c.limit
}

// seg is a non-degenerate edge with its ends in sweep order: l before r
// lexicographically.
type seg struct {
	l, r       Point
	edge       int32
	lpos, rpos int32 // indices of l and r among the distinct vertex positions
	degree     int   // number of segments at l plus number at r
}

// box is s's bounding box.
func (s *seg) box() rect {
	return rect{s.l.X, min(s.l.Y, s.r.Y), s.r.X, max(s.l.Y, s.r.Y)}
}

// span is the L1 size of s's bounding box.
func (s *seg) span() int64 {
	dy := s.r.Y - s.l.Y
	if dy < 0 {
		dy = -dy
	}
	return s.r.X - s.l.X + dy
}

func run(pts []Point, edges [][2]int32, limit int) ([]Problem, error) {
	if err := validate(pts, edges); err != nil {
		return nil, err
	}
	c := &collector{limit: limit}

	// Vertices sorted by position, then index; runs of equal positions are
	// the SharedPoint problems and the distinct positions are sweep events.
	order := make([]int32, len(pts))
	for i := range order {
		order[i] = int32(i)
	}
	slices.SortFunc(order, func(i, j int32) int {
		if c := lexCmp(pts[i], pts[j]); c != 0 {
			return c
		}
		return cmp.Compare(i, j)
	})
	posOf := make([]int32, len(pts))
	var positions []Point
	var posStart []int32 // vertices at positions[k] are order[posStart[k]:posStart[k+1]]
	for i, v := range order {
		if i == 0 || pts[v] != pts[order[i-1]] {
			positions = append(positions, pts[v])
			posStart = append(posStart, int32(i))
		}
		posOf[v] = int32(len(positions) - 1)
	}
	posStart = append(posStart, int32(len(order)))
	for k := range positions {
		same := order[posStart[k]:posStart[k+1]]
		for i := range same {
			for j := i + 1; j < len(same); j++ {
				if !c.add(Problem{SharedPoint, int(same[i]), int(same[j])}) {
					return finish(c), nil
				}
			}
		}
	}

	// Edges joining the same pair of vertices.
	var byPair []int32
	for e, uw := range edges {
		if uw[0] != uw[1] {
			byPair = append(byPair, int32(e))
		}
	}
	key := func(e int32) (int32, int32) {
		u, w := edges[e][0], edges[e][1]
		return min(u, w), max(u, w)
	}
	slices.SortFunc(byPair, func(e, f int32) int {
		eu, ew := key(e)
		fu, fw := key(f)
		if c := cmp.Compare(eu, fu); c != 0 {
			return c
		}
		if c := cmp.Compare(ew, fw); c != 0 {
			return c
		}
		return cmp.Compare(e, f)
	})
	for i := 0; i < len(byPair); {
		j := i + 1
		for j < len(byPair) && samePair(edges[byPair[i]], edges[byPair[j]]) {
			j++
		}
		for a := i; a < j; a++ {
			for b := a + 1; b < j; b++ {
				if !c.add(Problem{Overlap, int(byPair[a]), int(byPair[b])}) {
					return finish(c), nil
				}
			}
		}
		i = j
	}

	// Segments: edges of positive length, in edge order.
	var segs []seg
	degree := make([]int, len(positions))
	for e, uw := range edges {
		u, w := uw[0], uw[1]
		if u == w || pts[u] == pts[w] {
			continue
		}
		if lexLess(pts[w], pts[u]) {
			u, w = w, u
		}
		segs = append(segs, seg{l: pts[u], r: pts[w], edge: int32(e), lpos: posOf[u], rpos: posOf[w]})
		degree[posOf[u]]++
		degree[posOf[w]]++
	}
	for i := range segs {
		segs[i].degree = degree[segs[i].lpos] + degree[segs[i].rpos]
	}

	g := &drawing{c: c, segs: segs, edges: edges, positions: positions, posStart: posStart, order: order}
	if !g.sweep() {
		return finish(c), nil
	}
	var suspects []int32
	for i, r := range g.removed {
		if r {
			suspects = append(suspects, int32(i))
		}
	}
	if len(suspects) > 0 {
		g.fallback(suspects)
	}
	return finish(c), nil
}

// drawing holds what the sweep and the fallback share.
type drawing struct {
	c         *collector
	segs      []seg
	edges     [][2]int32
	positions []Point
	posStart  []int32 // vertices at positions[k] are order[posStart[k]:posStart[k+1]]
	order     []int32
	removed   []bool            // per segment: removed by the sweep
	inside    map[int32][]int32 // per segment: increasing positions the sweep found inside it
}

// reportInside reports every vertex at position k as lying inside segment
// s, and reports whether there is room for more problems.
func (g *drawing) reportInside(k, s int32) bool {
	for _, v := range g.order[g.posStart[k]:g.posStart[k+1]] {
		if !g.c.add(Problem{VertexOnEdge, int(v), int(g.segs[s].edge)}) {
			return false
		}
	}
	return true
}

func finish(c *collector) []Problem {
	sortProblems(c.out)
	return c.out
}

// fallback reports every problem that involves a segment the sweep removed
// (a suspect) and that the sweep did not report.
//
// Each pair of segments with at least one suspect is examined exactly once,
// by a path query of the larger segment (by span, then index) among
// bounding boxes of smaller ones: a suspect looks among all smaller
// segments, and a segment that is not a suspect looks among smaller
// suspects. Querying with the larger one keeps a long segment's large box
// from being visited by every small suspect near it (a star's edges by
// stubs at their middles, say); the boxes are kept in trees by size class
// so that a query never descends into boxes much larger than its own.
func (g *drawing) fallback(suspects []int32) {
	c, segs, removed, edges, positions := g.c, g.segs, g.removed, g.edges, g.positions
	larger := func(a, b int32) bool { // a is queried after b
		sa, sb := segs[a].span(), segs[b].span()
		return sa > sb || sa == sb && a > b
	}
	class := func(s int32) int { return bits.Len64(uint64(segs[s].span())) }
	byClass := func(members []int32) []*boxTree {
		var ids [][]int32
		for _, s := range members {
			k := class(s)
			for len(ids) <= k {
				ids = append(ids, nil)
			}
			ids[k] = append(ids[k], s)
		}
		trees := make([]*boxTree, len(ids))
		for k, list := range ids {
			boxes := make([]rect, len(list))
			for i, s := range list {
				boxes[i] = segs[s].box()
			}
			trees[k] = newBoxTree(list, boxes)
		}
		return trees
	}
	all := make([]int32, len(segs))
	for i := range all {
		all[i] = int32(i)
	}
	allTrees, suspectTrees := byClass(all), byClass(suspects)

	// pairs examines q against every smaller segment in trees.
	pairs := func(q int32, trees []*boxTree) bool {
		r := &segs[q]
		hit := func(b rect) bool { return segTouchesClosedRect(r.l, r.r, b) }
		for k := range min(class(q)+1, len(trees)) {
			more := trees[k].search(hit, func(si int32) bool {
				if !larger(q, si) {
					return true
				}
				s := &segs[si]
				if samePair(edges[r.edge], edges[s.edge]) {
					return true // reported by the same-pair pass
				}
				if kind, ok := pairKind(r.l, r.r, s.l, s.r); ok {
					e, f := int(r.edge), int(s.edge)
					return c.add(Problem{kind, min(e, f), max(e, f)})
				}
				return true
			})
			if !more {
				return false
			}
		}
		return true
	}
	for _, q := range suspects {
		if !pairs(q, allTrees) {
			return
		}
	}
	for q := range segs {
		if !removed[q] && !pairs(int32(q), suspectTrees) {
			return
		}
	}

	// Vertices inside suspects.
	pids := make([]int32, len(positions))
	pboxes := make([]rect, len(positions))
	for k, p := range positions {
		pids[k] = int32(k)
		pboxes[k] = rect{p.X, p.Y, p.X, p.Y}
	}
	posTree := newBoxTree(pids, pboxes)
	for _, ri := range suspects {
		r := &segs[ri]
		seen := g.inside[ri]
		more := posTree.search(func(b rect) bool { return segTouchesClosedRect(r.l, r.r, b) }, func(k int32) bool {
			if !inOpenSegment(r.l, r.r, positions[k]) {
				return true
			}
			if _, ok := slices.BinarySearch(seen, k); ok {
				return true // reported by the sweep
			}
			return g.reportInside(k, ri)
		})
		if !more {
			return
		}
	}
}

// ---------------------------------------------------------------------------
// Sweep.

// conflict reports whether segments s and t meet anywhere except in a
// single point that is an end of both: a proper crossing, a collinear
// overlap, or an end of one inside the other.
func conflict(s, t *seg) bool {
	if s.r.X < t.l.X || t.r.X < s.l.X ||
		max(s.l.Y, s.r.Y) < min(t.l.Y, t.r.Y) || max(t.l.Y, t.r.Y) < min(s.l.Y, s.r.Y) {
		return false
	}
	return inOpenSegment(s.l, s.r, t.l) || inOpenSegment(s.l, s.r, t.r) ||
		inOpenSegment(t.l, t.r, s.l) || inOpenSegment(t.l, t.r, s.r) ||
		properCrossing(s.l, s.r, t.l, t.r) || collinearOverlap(s.l, s.r, t.l, t.r)
}

// sweeper runs the sweep of Shamos and Hoey with removal. The status is a
// treap (Seidel and Aragon) of the present segments ordered from below to
// above along the sweep line; node i is segment i.
type sweeper struct {
	segs                []seg
	removed             []bool
	in                  []bool
	left, right, parent []int32
	prio                []uint32
	root                int32
}

// sweep sets g.removed and g.inside and reports the VertexOnEdge problems
// it finds on its way; it returns false if the collector filled up.
// Segments never removed are pairwise free of conflicts, and every vertex
// inside one of them has been reported, so every problem of the drawing
// that is not reported by the sweep, and is not a SharedPoint or a
// same-pair Overlap, involves a removed segment.
//
// The sweep line is vertical after an infinitesimal shear x' = x + εy, so
// that events are the vertex positions in lexicographic order and no
// segment is vertical; orientation is invariant under the shear, so all
// comparisons use orient on the original coordinates. At each position p:
// segments ending at p leave; the segment with p in its interior, if any,
// is found and the vertices at p are reported as inside it; segments
// starting at p enter. Whenever two segments become neighbours they are
// tested with conflict, and one of a conflicting pair is removed. As in
// Shamos and Hoey's argument, the lexicographically first conflict point
// among the segments that stay would have been preceded by the two
// segments meeting there being neighbours, so no conflict survives; for the
// same reason at most one present segment has p in its interior.
func (g *drawing) sweep() bool {
	segs, positions := g.segs, g.positions
	n := len(segs)
	g.inside = map[int32][]int32{}
	w := &sweeper{
		segs:    segs,
		removed: make([]bool, n),
		in:      make([]bool, n),
		left:    make([]int32, n),
		right:   make([]int32, n),
		parent:  make([]int32, n),
		prio:    make([]uint32, n),
		root:    -1,
	}
	x := uint32(2463534242)
	for i := range w.prio {
		x ^= x << 13
		x ^= x >> 17
		x ^= x << 5
		w.prio[i] = x
	}

	// Segments starting and ending at each position, in segment order.
	startOff := make([]int32, len(positions)+1)
	endOff := make([]int32, len(positions)+1)
	for i := range segs {
		startOff[segs[i].lpos+1]++
		endOff[segs[i].rpos+1]++
	}
	for k := range positions {
		startOff[k+1] += startOff[k]
		endOff[k+1] += endOff[k]
	}
	starts := make([]int32, n)
	ends := make([]int32, n)
	fillS := slices.Clone(startOff[:len(positions)])
	fillE := slices.Clone(endOff[:len(positions)])
	for i := range segs {
		s := &segs[i]
		starts[fillS[s.lpos]] = int32(i)
		fillS[s.lpos]++
		ends[fillE[s.rpos]] = int32(i)
		fillE[s.rpos]++
	}

	for k, p := range positions {
		for _, s := range ends[endOff[k]:endOff[k+1]] {
			if w.in[s] {
				a, b := w.pred(s), w.succ(s)
				w.delete(s)
				w.resolve(a, b)
			}
		}
		if s := w.containing(p); s >= 0 {
			g.inside[s] = append(g.inside[s], int32(k))
			if !g.reportInside(int32(k), s) {
				return false
			}
		}
		for _, t := range starts[startOff[k]:startOff[k+1]] {
			w.insert(t)
		}
	}
	g.removed = w.removed
	return true
}

// victim picks which of two conflicting segments leaves the sweep. Any
// choice is correct; this one aims to keep the later exact checks cheap.
// Checking a removed segment costs about as many segments as lie near it,
// which is large when an end of it is a vertex of high degree, so the
// segment with the smaller total degree at its ends goes; among equals, the
// longer one, which is likely to conflict with more.
func (w *sweeper) victim(a, b int32) int32 {
	sa, sb := &w.segs[a], &w.segs[b]
	if sa.degree != sb.degree {
		if sa.degree < sb.degree {
			return a
		}
		return b
	}
	la, lb := sa.span(), sb.span()
	if la > lb || la == lb && a > b {
		return a
	}
	return b
}

// remove takes s out of the sweep for good and repairs the neighbourhood.
func (w *sweeper) remove(s int32) {
	a, b := w.pred(s), w.succ(s)
	w.delete(s)
	w.removed[s] = true
	w.resolve(a, b)
}

// resolve makes the neighbours a (below) and b (above) conflict-free,
// removing segments until they are; each removal creates a new pair of
// neighbours, which is tested in turn.
func (w *sweeper) resolve(a, b int32) {
	for a >= 0 && b >= 0 && conflict(&w.segs[a], &w.segs[b]) {
		if w.victim(a, b) == b {
			nb := w.succ(b)
			w.delete(b)
			w.removed[b] = true
			b = nb
		} else {
			na := w.pred(a)
			w.delete(a)
			w.removed[a] = true
			a = na
		}
	}
}

// containing returns a present segment with p in its interior, or -1. At
// this point every present segment s has s.l < p < s.r, so orientation 0
// means p is inside s.
func (w *sweeper) containing(p Point) int32 {
	x := w.root
	for x >= 0 {
		s := &w.segs[x]
		switch orient(s.l, s.r, p) {
		case 0:
			return x
		case 1:
			x = w.right[x]
		default:
			x = w.left[x]
		}
	}
	return -1
}

// insert adds segment t, whose left end is the current event, and then
// resolves its two new neighbour pairs.
func (w *sweeper) insert(t int32) {
	for {
		s := w.tryInsert(t)
		if s < 0 {
			break
		}
		if w.victim(s, t) == t {
			w.removed[t] = true
			return
		}
		w.remove(s)
	}
	w.resolve(w.pred(t), t)
	if w.in[t] {
		w.resolve(t, w.succ(t))
	}
}

// tryInsert places t in the status, or returns a present segment that t
// cannot be ordered against because they conflict at t's left end.
func (w *sweeper) tryInsert(t int32) int32 {
	ts := &w.segs[t]
	p := ts.l
	x, par := w.root, int32(-1)
	above := false
	for x >= 0 {
		s := &w.segs[x]
		var o int
		if s.l == p {
			o = orient(p, s.r, ts.r) // both start here: order by direction
		} else {
			o = orient(s.l, s.r, p)
		}
		if o == 0 {
			return x
		}
		par, above = x, o > 0
		if above {
			x = w.right[x]
		} else {
			x = w.left[x]
		}
	}
	w.left[t], w.right[t], w.parent[t] = -1, -1, par
	w.in[t] = true
	switch {
	case par < 0:
		w.root = t
	case above:
		w.right[par] = t
	default:
		w.left[par] = t
	}
	for w.parent[t] >= 0 && w.prio[t] > w.prio[w.parent[t]] {
		w.rotateUp(t)
	}
	return -1
}

// rotateUp rotates x above its parent, keeping the in-order sequence.
func (w *sweeper) rotateUp(x int32) {
	p := w.parent[x]
	g := w.parent[p]
	if w.left[p] == x {
		b := w.right[x]
		w.left[p] = b
		if b >= 0 {
			w.parent[b] = p
		}
		w.right[x] = p
	} else {
		b := w.left[x]
		w.right[p] = b
		if b >= 0 {
			w.parent[b] = p
		}
		w.left[x] = p
	}
	w.parent[p] = x
	w.parent[x] = g
	switch {
	case g < 0:
		w.root = x
	case w.left[g] == p:
		w.left[g] = x
	default:
		w.right[g] = x
	}
}

// delete unlinks x from the status by rotating it down to a leaf.
func (w *sweeper) delete(x int32) {
	for {
		l, r := w.left[x], w.right[x]
		if l < 0 && r < 0 {
			break
		}
		if r < 0 || l >= 0 && w.prio[l] > w.prio[r] {
			w.rotateUp(l)
		} else {
			w.rotateUp(r)
		}
	}
	switch p := w.parent[x]; {
	case p < 0:
		w.root = -1
	case w.left[p] == x:
		w.left[p] = -1
	default:
		w.right[p] = -1
	}
	w.parent[x] = -1
	w.in[x] = false
}

func (w *sweeper) succ(x int32) int32 {
	if r := w.right[x]; r >= 0 {
		for w.left[r] >= 0 {
			r = w.left[r]
		}
		return r
	}
	for {
		p := w.parent[x]
		if p < 0 || w.left[p] == x {
			return p
		}
		x = p
	}
}

func (w *sweeper) pred(x int32) int32 {
	if l := w.left[x]; l >= 0 {
		for w.right[l] >= 0 {
			l = w.right[l]
		}
		return l
	}
	for {
		p := w.parent[x]
		if p < 0 || w.right[p] == x {
			return p
		}
		x = p
	}
}

// ---------------------------------------------------------------------------
// Bounding-box tree.

// boxTree is a static bounding-volume hierarchy over closed rectangles,
// packed bottom-up from the items in Z-order of their centres (Morton's
// interleaved-bit order; packing as in Kamel and Faloutsos, "On packing
// R-trees", CIKM 1993, with Z-order in place of the Hilbert curve). It only
// prunes: callers test every item they are handed exactly.
type boxTree struct {
	ids    []int32
	boxes  []rect
	levels [][]rect // levels[0][k] bounds boxes[k*fan:], levels[l][k] bounds levels[l-1][k*fan:]
	stack  []treeNode
}

type treeNode struct{ level, index int }

const fan = 8

func newBoxTree(ids []int32, boxes []rect) *boxTree {
	t := &boxTree{}
	n := len(ids)
	if n == 0 {
		return t
	}
	minX, minY := boxes[0].xlo+boxes[0].xhi, boxes[0].ylo+boxes[0].yhi
	maxX, maxY := minX, minY
	for _, b := range boxes {
		cx, cy := b.xlo+b.xhi, b.ylo+b.yhi
		minX, maxX = min(minX, cx), max(maxX, cx)
		minY, maxY = min(minY, cy), max(maxY, cy)
	}
	shift := max(0, bits.Len64(uint64(max(maxX-minX, maxY-minY)))-32)
	keys := make([]uint64, n)
	perm := make([]int32, n)
	for i, b := range boxes {
		ux := uint64(b.xlo+b.xhi-minX) >> shift
		uy := uint64(b.ylo+b.yhi-minY) >> shift
		keys[i] = spread(uint32(ux)) | spread(uint32(uy))<<1
		perm[i] = int32(i)
	}
	slices.SortFunc(perm, func(i, j int32) int {
		if c := cmp.Compare(keys[i], keys[j]); c != 0 {
			return c
		}
		return cmp.Compare(ids[i], ids[j])
	})
	t.ids = make([]int32, n)
	t.boxes = make([]rect, n)
	for k, i := range perm {
		t.ids[k] = ids[i]
		t.boxes[k] = boxes[i]
	}
	level := t.boxes
	for {
		next := make([]rect, (len(level)+fan-1)/fan)
		for k := range next {
			grp := level[k*fan : min(len(level), (k+1)*fan)]
			u := grp[0]
			for _, b := range grp[1:] {
				u.xlo, u.ylo = min(u.xlo, b.xlo), min(u.ylo, b.ylo)
				u.xhi, u.yhi = max(u.xhi, b.xhi), max(u.yhi, b.yhi)
			}
			next[k] = u
		}
		t.levels = append(t.levels, next)
		if len(next) == 1 {
			return t
		}
		level = next
	}
}

// spread moves bit i of v to bit 2i.
func spread(v uint32) uint64 {
	x := uint64(v)
	x = (x | x<<16) & 0x0000ffff0000ffff
	x = (x | x<<8) & 0x00ff00ff00ff00ff
	x = (x | x<<4) & 0x0f0f0f0f0f0f0f0f
	x = (x | x<<2) & 0x3333333333333333
	x = (x | x<<1) & 0x5555555555555555
	return x
}

// search calls visit for every item whose box passes hit, descending only
// into nodes whose bounding box passes hit; hit must hold for a node
// whenever it holds for any box inside it. It stops early, returning false,
// when visit does.
func (t *boxTree) search(hit func(rect) bool, visit func(id int32) bool) bool {
	if len(t.levels) == 0 {
		return true
	}
	stack := append(t.stack[:0], treeNode{len(t.levels) - 1, 0})
	defer func() { t.stack = stack[:0] }()
	for len(stack) > 0 {
		nd := stack[len(stack)-1]
		stack = stack[:len(stack)-1]
		if !hit(t.levels[nd.level][nd.index]) {
			continue
		}
		lo := nd.index * fan
		if nd.level == 0 {
			for i := lo; i < min(lo+fan, len(t.boxes)); i++ {
				if hit(t.boxes[i]) && !visit(t.ids[i]) {
					return false
				}
			}
			continue
		}
		for i := min(lo+fan, len(t.levels[nd.level-1])) - 1; i >= lo; i-- {
			stack = append(stack, treeNode{nd.level - 1, i})
		}
	}
	return true
}
