package convex

import (
	"errors"
	"fmt"

	"github.com/gridwood/gridwood/internal/exact"
	"github.com/gridwood/gridwood/planarize"
)

var (
	// errNotTriconnected: the graph has fewer than four vertices (and is
	// not a triangle), is disconnected, or has a cut vertex or a separation
	// pair.
	errNotTriconnected = errors.New("convex: the graph is not 3-connected")
	// errInput: the arguments are not a plane embedding of a simple
	// graph together with one of its darts.
	errInput = errors.New("convex: a convex drawing needs a plane embedding of a simple graph and one of its darts")
	// errInternal: a broken invariant, meaning a bug rather than bad
	// input; it is returned instead of panicking.
	errInternal = errors.New("convex: internal error in the convex drawing")
)

// halfEdge marks the outgoing edge of colour i at the outer vertex
// a_i: the half-edge into the outer face of Felsner's suspension.
const halfEdge = -2

// Draw draws a 3-connected plane graph with every face a convex
// polygon on a small integer grid. emb is a plane embedding of a simple
// 3-connected graph (one connected component covering all of emb's
// vertices, n >= 4, or a triangle); outer is a dart whose left face is to
// be the outer face. It returns grid coordinates per vertex and the grid
// extent (all points in [0,w]x[0,h]). errNotTriconnected if the graph is
// not 3-connected (detected, not assumed); errInput if emb is not a
// plane embedding of a simple graph or outer is not one of its darts (so a
// graph without edges gets errInput); another error, wrapping
// errInternal, for internal failures -- it never panics.
//
// Method: face counting in a Schnyder wood, S. Felsner, "Convex drawings
// of planar graphs and the order dimension of 3-polytopes", Order 18
// (2001). With a1 = Head(outer), a2 = Tail(outer) and a3 the vertex
// half-way round the outer face, a canonical ordering of the 3-connected
// graph (G. Kant, "Drawing planar graphs using the canonical ordering",
// Algorithmica 16 (1996) 4-32) yields a Schnyder wood: three trees T1, T2,
// T3 rooted at a1, a2, a3, some edges directed both ways in two colours.
// The paths P1(v), P2(v), P3(v) from v to the roots split the f-1 inner
// faces into the regions R1(v), R2(v), R3(v), and v is placed at
// (|R1(v)|, |R2(v)|), counting faces.
//
// Guarantee (Felsner 2001): the drawing is plane; every inner face is a
// convex polygon, walked counter-clockwise; the outer face is the triangle
// a1 = (f-1, 0), a2 = (0, f-1), a3 = (0, 0), walked clockwise, the edge
// of outer its long side and every other outer vertex on one of its legs
// x = 0 or y = 0. Angles of exactly 180 degrees occur (weak convexity, as
// in the paper); no angle exceeds 180 degrees and no face has zero area.
// w = h = f-1 with f the number of faces, outer face included; f <= 2n-4.
// Convexity and orientation of every face, the three trees and the axioms
// of the wood are checked before the drawing is returned.
//
// Time and memory are O(n): the 3-connectivity test lists 4-cycles of the
// vertex-face incidence graph as in N. Chiba and T. Nishizeki, "Arboricity
// and subgraph listing algorithms", SIAM J. Comput. 14 (1985), the peeling
// keeps per-face counters in the manner of Kant's algorithm, and the face
// counts are sums of subtree weights along tree paths. Nothing recurses.
func Draw(emb *planarize.Embedding, outer int32) (x, y []int64, w, h int64, err error) {
	wood, coord, err := solve(emb, outer)
	if err != nil {
		return nil, nil, 0, 0, err
	}
	w = int64(wood.nf - 1)
	return coord[0], coord[1], w, w, nil
}

// solve does the work of Draw and also returns the Schnyder
// wood and all three face counts per vertex, for the tests.
func solve(emb *planarize.Embedding, outer int32) (*wood, [3][]int64, error) {
	var none [3][]int64
	if emb == nil || outer < 0 || int(outer) >= 2*emb.M() {
		return nil, none, errInput
	}
	if !emb.IsSimple() || !emb.IsPlane() {
		return nil, none, errInput
	}
	n := emb.N()
	if n < 3 || emb.Components() != 1 {
		return nil, none, errNotTriconnected
	}
	if n == 3 && emb.M() != 3 {
		return nil, none, errNotTriconnected // a path
	}
	wood := newWood(emb)
	if !wood.facesAreCycles() {
		return nil, none, errNotTriconnected // a cut vertex
	}
	if n > 3 && !wood.triconnected() {
		return nil, none, errNotTriconnected
	}
	if err := wood.peel(outer); err != nil {
		return nil, none, err
	}
	if err := wood.check(); err != nil {
		return nil, none, err
	}
	coord, err := wood.faceCounts()
	if err != nil {
		return nil, none, err
	}
	if err := wood.checkConvex(coord[0], coord[1]); err != nil {
		return nil, none, err
	}
	return wood, coord, nil
}

// wood holds the faces of the embedding and the Schnyder wood.
type wood struct {
	emb  *planarize.Embedding
	n, m int

	face      []int32 // face on the left of each dart
	faceStart []int32 // darts of face f: faceDarts[faceStart[f]:faceStart[f+1]], in walk order
	faceDarts []int32
	nf        int
	outerFace int32

	a   [3]int32   // a1, a2, a3: the roots of the three trees
	out [3][]int32 // out[i][v]: the dart leaving v in colour i+1, or halfEdge
	lab []int8     // lab[d]: colour (0..2) of the corner between d and Next(d)
}

func newWood(emb *planarize.Embedding) *wood {
	w := &wood{emb: emb, n: emb.N(), m: emb.M()}
	nd := 2 * w.m
	w.face = make([]int32, nd)
	for d := range w.face {
		w.face[d] = -1
	}
	var first []int32
	var size []int32
	for d := int32(0); int(d) < nd; d++ {
		if w.face[d] >= 0 {
			continue
		}
		id := int32(len(first))
		first = append(first, d)
		k := int32(0)
		for x := d; w.face[x] < 0; x = emb.FaceNext(x) {
			w.face[x] = id
			k++
		}
		size = append(size, k)
	}
	w.nf = len(first)
	w.faceStart = make([]int32, w.nf+1)
	for f, k := range size {
		w.faceStart[f+1] = w.faceStart[f] + k
	}
	w.faceDarts = make([]int32, nd)
	for f, d := range first {
		i := w.faceStart[f]
		x := d
		for {
			w.faceDarts[i] = x
			i++
			if x = emb.FaceNext(x); x == d {
				break
			}
		}
	}
	return w
}

func (w *wood) darts(f int32) []int32 {
	return w.faceDarts[w.faceStart[f]:w.faceStart[f+1]]
}

// facesAreCycles reports whether every face walk visits each vertex at most
// once. A connected plane graph on three or more vertices is 2-connected
// exactly when this holds (common practice: a cut vertex appears twice on
// the walk of some face).
func (w *wood) facesAreCycles() bool {
	seen := make([]int32, w.n)
	for v := range seen {
		seen[v] = -1
	}
	for f := int32(0); int(f) < w.nf; f++ {
		for _, d := range w.darts(f) {
			t := w.emb.Tail(d)
			if seen[t] == f {
				return false
			}
			seen[t] = f
		}
	}
	return true
}

// triconnected decides whether the 2-connected plane graph (n >= 4) is
// 3-connected. In the vertex-face incidence graph every edge uv closes the
// 4-cycle u, F, v, F' through the two faces of uv; call those trivial. The
// graph has a separation pair exactly when some other 4-cycle exists: two
// faces that share two vertices not joined by an edge bounding both (the
// closed curve through the two faces and the two vertices then separates
// the rest of either face); conversely a separation pair {u, v} puts u and
// v non-consecutively on a face at a change of component around u, and on
// a second face at the other change. The 4-cycles are listed as in Chiba
// and Nishizeki (1985): nodes in order of falling degree, each looking at
// 2-paths through not yet processed nodes, which costs O(arboricity * edges)
// = O(m) for this planar graph.
func (w *wood) triconnected() bool {
	emb := w.emb
	n := int32(w.n)
	total := int(n) + w.nf
	// Incidences as corners (darts): node x < n is a vertex with the darts
	// leaving it, node n+f a face with its darts; the corner d joins Tail(d)
	// and n+face[d].
	start := make([]int32, total+1)
	for v := int32(0); v < n; v++ {
		start[v+1] = start[v] + int32(emb.Degree(v))
	}
	for f := 0; f < w.nf; f++ {
		start[int(n)+f+1] = start[int(n)+f] + w.faceStart[f+1] - w.faceStart[f]
	}
	corner := make([]int32, start[total])
	for v := int32(0); v < n; v++ {
		d := emb.First(v)
		for i := start[v]; i < start[v+1]; i++ {
			corner[i] = d
			d = emb.Next(d)
		}
	}
	copy(corner[start[n]:], w.faceDarts)
	other := func(x, d int32) int32 {
		if x < n {
			return n + w.face[d]
		}
		return emb.Tail(d)
	}
	// Counting sort by falling degree.
	maxDeg := int32(0)
	for x := range total {
		maxDeg = max(maxDeg, start[x+1]-start[x])
	}
	bucket := make([]int32, maxDeg+2)
	for x := range total {
		bucket[maxDeg-(start[x+1]-start[x])+1]++
	}
	for i := 1; i < len(bucket); i++ {
		bucket[i] += bucket[i-1]
	}
	order := make([]int32, total)
	for x := range total {
		k := maxDeg - (start[x+1] - start[x])
		order[bucket[k]] = int32(x)
		bucket[k]++
	}
	done := make([]bool, total)
	stamp := make([]int32, total)
	for i := range stamp {
		stamp[i] = -1
	}
	count := make([]int32, total)
	firstA := make([]int32, total)  // corner x-y of the first 2-path to z
	firstB := make([]int32, total)  // corner y-z of the first 2-path to z
	secondA := make([]int32, total) // corner x-y of the second
	var touched []int32
	for _, x := range order {
		touched = touched[:0]
		for _, d1 := range corner[start[x]:start[x+1]] {
			y := other(x, d1)
			if done[y] {
				continue
			}
			for _, d2 := range corner[start[y]:start[y+1]] {
				z := other(y, d2)
				if z == x || done[z] {
					continue
				}
				if stamp[z] != x {
					stamp[z] = x
					count[z] = 0
					touched = append(touched, z)
				}
				switch count[z] {
				case 0:
					firstA[z], firstB[z] = d1, d2
				case 1:
					secondA[z] = d1
				}
				count[z]++
			}
		}
		for _, z := range touched {
			if count[z] >= 3 || count[z] == 2 && !w.trivialFourCycle(x, z, firstA[z], firstB[z], secondA[z]) {
				return false
			}
		}
		done[x] = true
	}
	return true
}

// trivialFourCycle reports whether the incidence 4-cycle x, y1, z, y2 is the
// one around an edge. a1 is the corner x-y1, b1 the corner y1-z, a2 the
// corner x-y2.
func (w *wood) trivialFourCycle(x, z, a1, b1, a2 int32) bool {
	emb := w.emb
	n := int32(w.n)
	if x < n {
		// Vertices u = x, v = z on faces F1 = face[a1] and F2 = face[a2]:
		// trivial iff the edge uv has F1 on one side and F2 on the other.
		u, v := x, z
		f2 := w.face[a2]
		return emb.Head(a1) == v && w.face[a1^1] == f2 ||
			emb.Head(b1) == u && w.face[b1^1] == f2
	}
	// Faces F = x, F' = z sharing the vertices p = Tail(a1) and q = Tail(a2):
	// trivial iff the edge pq has F and F' on its two sides.
	f, g := x-n, z-n
	q := emb.Tail(a2)
	return emb.Head(a1) == q && w.face[a1^1] == g ||
		emb.Head(b1) == q && w.face[b1^1] == f
}

// peeling is the state of the canonical-ordering peel. The current graph
// H = G_k is 2-connected; its outer cycle is the contour, a path from a1 to
// a2 over the top, closed by the base edge a2 a1. For every inner face of
// H it keeps outv (contour vertices on it) and oute (contour edges on it,
// the base edge not counted), and for every contour vertex z the score
// sc(z) = sum over the inner faces F at z of min(outv(F)-1, 2).
//
// A contour vertex z (not a1, a2) of degree >= 3 may be removed alone iff
// its faces meet the contour only in z and, for the two faces on the
// contour edges at z, in the neighbour across that edge: that is sc(z) ==
// 2. Removing it then leaves a 2-connected graph whose contour runs along
// the faces around z. A face F may have its contour vertices of degree 2
// removed as a chain iff it meets the contour in one path with inner
// vertices: outv(F) - oute(F) == 1 and outv(F) >= 3. Every vertex removed
// after a3 must have a removed neighbour (Kant's condition that each
// vertex has a later neighbour). outv and oute only grow while a face is
// inner, so sc changes only when outv passes 2 and 3 (the first two
// contour vertices of each face are remembered) or a face at z opens to
// the outside; all updates are O(1) per dart. The graph left after a
// removal inherits internal 3-connectivity, so a choice never has to be
// undone, and Kant (1996) shows that a removable vertex or chain always
// exists until only the base face is left; should none be found, peel
// reports an internal error rather than guessing.
type peeling struct {
	w            *wood
	rnext, rprev []int32 // rotation of H: removed darts are unlinked
	dead         []bool  // face merged into the outer face
	outv, oute   []int32
	rec          [][2]int32 // first two contour vertices of each face
	nrec         []uint8
	onC          []bool // on the contour
	removed      []bool
	touched      []bool // has a removed neighbour
	deg          []int32
	sc           []int32
	outDart      []int32 // contour vertex: dart leaving it with the outer face on its left
	stack        []int32 // candidates: v >= 0 a vertex, -1-f a face
	fresh        []int32
	baseEdge     int32
	baseFace     int32 // the inner face on the base edge
	vn           int32
	removedCount int
}

func (w *wood) internal(format string, args ...any) error {
	return fmt.Errorf("%w: "+format, append([]any{errInternal}, args...)...)
}

// peel computes a canonical ordering of the 3-connected plane graph with
// base edge a1 a2 (outer = a2 -> a1) and last vertex a3, removing vertices
// and chains from the top, and records the Schnyder wood it induces: a
// removed singleton z gets z -> (left contact) in colour 1 and z ->
// (right contact) in colour 2; a chain z1..zl gets zi -> z(i-1) in colour
// 1 and zi -> z(i+1) in colour 2, with z0, z(l+1) the contacts; and every
// vertex gets colour 3 towards the first of its neighbours to be removed,
// i.e. its latest neighbour in the ordering (the correspondence between
// canonical orderings and Schnyder woods of 3-connected graphs is
// described by Felsner 2001 and in his book "Geometric Graphs and
// Arrangements", 2004). The half-edges at a1, a2, a3 close the wood; check
// verifies the result against the axioms instead of trusting this.
func (w *wood) peel(outer int32) error {
	emb := w.emb
	n := w.n
	nd := 2 * w.m
	p := &peeling{
		w:        w,
		rnext:    make([]int32, nd),
		rprev:    make([]int32, nd),
		dead:     make([]bool, w.nf),
		outv:     make([]int32, w.nf),
		oute:     make([]int32, w.nf),
		rec:      make([][2]int32, w.nf),
		nrec:     make([]uint8, w.nf),
		onC:      make([]bool, n),
		removed:  make([]bool, n),
		touched:  make([]bool, n),
		deg:      make([]int32, n),
		sc:       make([]int32, n),
		outDart:  make([]int32, n),
		baseEdge: outer >> 1,
		baseFace: w.face[outer^1],
	}
	for d := int32(0); int(d) < nd; d++ {
		p.rnext[d], p.rprev[d] = emb.Next(d), emb.Prev(d)
	}
	for i := range w.out {
		w.out[i] = make([]int32, n)
		for v := range w.out[i] {
			w.out[i][v] = -1
		}
	}
	a1, a2 := emb.Head(outer), emb.Tail(outer)
	w.outerFace = w.face[outer]
	p.dead[w.outerFace] = true
	outerDarts := w.darts(w.outerFace)
	k := len(outerDarts)
	for _, d := range outerDarts {
		t := emb.Tail(d)
		p.onC[t] = true
		p.outDart[t] = d
		if d != outer {
			p.oute[w.face[d^1]]++
		}
	}
	// a3 half-way along the outer walk a2, a1, c1, c2, ..., so that the
	// two sides of the outer triangle get similar numbers of vertices.
	d := outer
	for range 2 + (k-3)/2 {
		d = emb.FaceNext(d)
	}
	a3 := emb.Tail(d)
	w.a = [3]int32{a1, a2, a3}
	p.vn = a3
	for f := int32(0); int(f) < w.nf; f++ {
		if p.dead[f] {
			continue
		}
		for _, d := range w.darts(f) {
			if t := emb.Tail(d); p.onC[t] {
				if p.nrec[f] < 2 {
					p.rec[f][p.nrec[f]] = t
					p.nrec[f]++
				}
				p.outv[f]++
			}
		}
	}
	for v := int32(0); int(v) < n; v++ {
		p.deg[v] = int32(emb.Degree(v))
	}
	for _, d := range outerDarts {
		t := emb.Tail(d)
		p.sc[t] = p.score(t)
	}
	for f := int32(0); int(f) < w.nf; f++ {
		if !p.dead[f] {
			p.stack = append(p.stack, -1-f)
		}
	}
	p.stack = append(p.stack, a3)
	for p.removedCount < n-2 {
		if len(p.stack) == 0 {
			return w.internal("canonical ordering stuck after %d of %d vertices", p.removedCount, n-2)
		}
		c := p.stack[len(p.stack)-1]
		p.stack = p.stack[:len(p.stack)-1]
		var err error
		if c >= 0 {
			if p.singletonFeasible(c) {
				err = p.singleton(c)
			}
		} else {
			f := -1 - c
			if !p.dead[f] && p.outv[f]-p.oute[f] == 1 && p.outv[f] >= 3 {
				err = p.chain(f)
			}
		}
		if err != nil {
			return err
		}
	}
	w.out[0][a1], w.out[1][a1] = halfEdge, outer^1
	w.out[0][a2], w.out[1][a2] = outer, halfEdge
	if w.out[2][a3] != -1 {
		return w.internal("the last vertex has a colour-3 edge")
	}
	w.out[2][a3] = halfEdge
	for i := range w.out {
		for v, d := range w.out[i] {
			if d == -1 {
				return w.internal("vertex %d has no outgoing edge of colour %d", v, i+1)
			}
		}
	}
	return nil
}

// score computes sc(t) from scratch.
func (p *peeling) score(t int32) int32 {
	d := p.outDart[t]
	s := int32(0)
	for range p.deg[t] {
		if f := p.w.face[d]; !p.dead[f] {
			s += p.contrib(f)
		}
		d = p.rnext[d]
	}
	return s
}

func (p *peeling) contrib(f int32) int32 { return min(p.outv[f]-1, 2) }

func (p *peeling) singletonFeasible(z int32) bool {
	w := p.w
	if !p.onC[z] || p.removed[z] || z == w.a[0] || z == w.a[1] {
		return false
	}
	if p.removedCount == 0 {
		if z != p.vn {
			return false
		}
	} else if !p.touched[z] {
		return false
	}
	return p.deg[z] >= 3 && p.sc[z] == 2
}

// unlink removes dart t from the rotation of its tail.
func (p *peeling) unlink(t int32) {
	a, b := p.rprev[t], p.rnext[t]
	p.rnext[a], p.rprev[b] = b, a
	y := p.w.emb.Tail(t)
	p.deg[y]--
	p.touched[y] = true
}

// singleton removes the contour vertex z; see peeling.
func (p *peeling) singleton(z int32) error {
	w := p.w
	emb := w.emb
	dr := p.outDart[z] // z -> right contact
	dl := p.rnext[dr]  // z -> left contact
	cp, cq := emb.Head(dl), emb.Head(dr)
	w.out[0][z], w.out[1][z] = dl, dr
	if w.out[2][cp] == -1 {
		w.out[2][cp] = dl ^ 1
	}
	if w.out[2][cq] == -1 {
		w.out[2][cq] = dr ^ 1
	}
	p.sc[cp] -= p.contrib(w.face[dl])
	p.sc[cq] -= p.contrib(w.face[p.rprev[dr]])
	// The faces in the corners from z->cp round to z->cq open up; the
	// vertices between are covered by z: their colour-3 edge goes to z.
	for d := dl; d != dr; d = p.rnext[d] {
		f := w.face[d]
		if p.dead[f] {
			return w.internal("vertex %d: face %d already outside", z, f)
		}
		p.dead[f] = true
		if d != dl {
			u := emb.Head(d)
			if p.onC[u] || w.out[2][u] != -1 {
				return w.internal("vertex %d: covered neighbour %d was exposed", z, u)
			}
			w.out[2][u] = d ^ 1
		}
	}
	start := p.rprev[dl^1] // cp's dart along the face in the corner at z
	d := dr
	for range p.deg[z] {
		p.unlink(d ^ 1)
		d = p.rnext[d]
	}
	p.removed[z], p.onC[z] = true, false
	p.removedCount++
	return p.expose(cp, cq, start)
}

// chain removes the contour vertices of degree 2 on face f; see peeling.
func (p *peeling) chain(f int32) error {
	w := p.w
	emb := w.emb
	ds := w.darts(f)
	L := len(ds)
	onContour := func(i int) bool {
		d := ds[i%L]
		return d>>1 != p.baseEdge && p.dead[w.face[d^1]]
	}
	// The contour edges of f, walked along f (right to left on the
	// contour): cq -> zl, ..., z1 -> cp.
	s := -1
	for i := range L {
		if onContour(i) && !onContour(i+L-1) {
			if s >= 0 {
				return w.internal("face %d meets the contour twice", f)
			}
			s = i
		}
	}
	if s < 0 {
		return w.internal("face %d has no contour edge", f)
	}
	r := 0
	for r < L && onContour(s+r) {
		r++
	}
	if r != int(p.oute[f]) || r < 2 || r >= L {
		return w.internal("face %d: contour run of %d edges, counted %d", f, r, p.oute[f])
	}
	at := func(i int) int32 { return ds[(s+i)%L] }
	cq, cp := emb.Tail(at(0)), emb.Head(at(r-1))
	if p.removedCount == 0 && (r != 2 || emb.Tail(at(1)) != p.vn) {
		return nil // a3 must come first
	}
	for j := 1; j < r; j++ {
		z := emb.Tail(at(j))
		if p.deg[z] != 2 || !p.onC[z] || z == w.a[0] || z == w.a[1] {
			return w.internal("face %d: chain vertex %d has degree %d", f, z, p.deg[z])
		}
		w.out[0][z] = at(j)       // towards the left
		w.out[1][z] = at(j-1) ^ 1 // towards the right
		p.removed[z], p.onC[z] = true, false
	}
	if w.out[2][cp] == -1 {
		w.out[2][cp] = at(r-1) ^ 1
	}
	if w.out[2][cq] == -1 {
		w.out[2][cq] = at(0)
	}
	p.sc[cp] -= p.contrib(f)
	p.sc[cq] -= p.contrib(f)
	p.dead[f] = true
	for j := 1; j < r; j++ {
		z := emb.Tail(at(j))
		for _, e := range [2]int32{w.out[0][z], w.out[1][z]} {
			if !p.removed[emb.Head(e)] {
				p.unlink(e ^ 1)
			}
		}
	}
	p.removedCount += r - 1
	if f == p.baseFace {
		if p.removedCount != w.n-2 {
			return w.internal("base face removed with %d of %d vertices", p.removedCount, w.n-2)
		}
		return nil
	}
	return p.expose(cp, cq, at(r))
}

// expose makes the path from cp to cq that starts with dart a and follows
// the faces just opened the new contour between cp and cq.
func (p *peeling) expose(cp, cq, a int32) error {
	w := p.w
	emb := w.emb
	p.outDart[cp] = a
	p.fresh = p.fresh[:0]
	for guard := 0; ; guard++ {
		if guard > w.n {
			return w.internal("new contour from %d does not reach %d", cp, cq)
		}
		f := w.face[a^1]
		if p.dead[f] || !p.dead[w.face[a]] {
			return w.internal("new contour edge %d is not between an inner face and the outside", a>>1)
		}
		p.oute[f]++
		p.stack = append(p.stack, -1-f)
		x := emb.Head(a)
		if x == cq {
			break
		}
		if p.onC[x] || p.removed[x] {
			return w.internal("new contour meets vertex %d twice", x)
		}
		p.onC[x] = true
		a = p.rprev[a^1]
		p.outDart[x] = a
		p.fresh = append(p.fresh, x)
	}
	for _, x := range p.fresh {
		p.join(x)
	}
	p.stack = append(p.stack, cp, cq)
	p.stack = append(p.stack, p.fresh...)
	return nil
}

// join updates the face counters for x, which has just come onto the
// contour.
func (p *peeling) join(x int32) {
	w := p.w
	p.sc[x] = 0
	d := p.outDart[x]
	for range p.deg[x] {
		if f := w.face[d]; !p.dead[f] {
			o := p.outv[f]
			p.outv[f] = o + 1
			switch o + 1 {
			case 2:
				p.sc[p.rec[f][0]]++
			case 3:
				p.sc[p.rec[f][0]]++
				p.sc[p.rec[f][1]]++
			}
			if p.nrec[f] < 2 {
				p.rec[f][p.nrec[f]] = x
				p.nrec[f]++
			}
			p.sc[x] += min(o, 2)
			p.stack = append(p.stack, -1-f)
		}
		d = p.rnext[d]
	}
}

// outColour returns i if d is the colour-(i+1) dart of its tail, else -1.
func (w *wood) outColour(d int32) int {
	t := w.emb.Tail(d)
	for i := range 3 {
		if w.out[i][t] == d {
			return i
		}
	}
	return -1
}

// check verifies Felsner's axioms of a Schnyder wood of the suspension and
// records the corner colours: (W1) every edge is directed one way or both
// ways, in different colours; (W2) around every vertex the outgoing edges
// of colours 1, 2, 3 follow each other counter-clockwise, with a_i's
// half-edge of colour i in its outer corner, and an edge entering in
// colour i lies in the closed sector between the outgoing edges of colours
// i+1 and i-1; (W3) no inner face is bounded by a directed cycle of one
// colour. The corner after the colour-(i+1) dart, up to the next outgoing
// dart, is labelled i+2 (0-based: (i+2)%3), the label of its sector.
func (w *wood) check() error {
	emb := w.emb
	w.lab = make([]int8, 2*w.m)
	for v := int32(0); int(v) < w.n; v++ {
		for i := range 3 {
			d := w.out[i][v]
			half := w.a[i] == v
			switch {
			case half != (d == halfEdge):
				return w.internal("vertex %d: half-edge of colour %d misplaced", v, i+1)
			case !half && (d < 0 || emb.Tail(d) != v):
				return w.internal("vertex %d: bad dart of colour %d", v, i+1)
			case !half && (d == w.out[(i+1)%3][v] || d == w.out[(i+2)%3][v]):
				return w.internal("vertex %d: outgoing darts coincide", v)
			}
		}
	}
	for v := int32(0); int(v) < w.n; v++ {
		half := -1
		for i := range 3 {
			if w.out[i][v] == halfEdge {
				half = i
			}
		}
		var start int32
		for i := range 3 {
			if w.out[i][v] >= 0 {
				start = w.out[i][v]
				break
			}
		}
		last := w.outColour(start)
		seen := 0
		label := -1
		d := start
		for range emb.Degree(v) {
			oc := w.outColour(d)
			ic := w.outColour(d ^ 1)
			switch {
			case oc >= 0:
				if seen > 0 && oc != (last+1)%3 {
					return w.internal("vertex %d: outgoing colours out of order", v)
				}
				if ic == oc {
					return w.internal("edge %d: both ways in colour %d", d>>1, oc+1)
				}
				last, seen, label = oc, seen+1, (oc+2)%3
			case ic < 0:
				return w.internal("edge %d is not directed", d>>1)
			case ic != label:
				return w.internal("vertex %d: edge %d enters in colour %d in sector %d", v, d>>1, ic+1, label+1)
			}
			w.lab[d] = int8(label)
			if half >= 0 && w.face[d] == w.outerFace {
				if half != (last+1)%3 {
					return w.internal("vertex %d: half-edge out of order", v)
				}
				last, seen, label = half, seen+1, (half+2)%3
			}
			d = emb.Next(d)
		}
		if seen != 3 {
			return w.internal("vertex %d: %d outgoing colours", v, seen)
		}
	}
	for f := int32(0); int(f) < w.nf; f++ {
		if f == w.outerFace {
			continue
		}
		for i := range 3 {
			ccw, cw := true, true
			for _, d := range w.darts(f) {
				ccw = ccw && w.out[i][emb.Tail(d)] == d
				cw = cw && w.out[i][emb.Head(d)] == d^1
			}
			if ccw || cw {
				return w.internal("face %d is a directed cycle of colour %d", f, i+1)
			}
		}
	}
	return nil
}

// faceCounts returns, for every vertex v and colour i, the number of inner
// faces in the region R_i(v) between P_{i+1}(v) and P_{i-1}(v) (Felsner's
// face counting).
//
// Each inner face F is charged to one of its corners labelled i, the owner
// o_i(F) (each face has corners of all three labels). For a vertex x on
// P_{i+1}(v) or P_{i-1}(v), its corners labelled i lie on the R_i(v) side,
// and so do all edges entering x in colour i; the T_i-paths from inside
// R_i(v) leave it through those paths. Hence the vertices of the closed
// region are the T_i-subtrees of the vertices b of P_{i+1}(v) and
// P_{i-1}(v), and |R_i(v)| is the sum of the owner counts in them. Two of
// these subtrees nest only when the edge from the path predecessor c of b
// to b is also b's colour-i edge (a two-coloured edge), and then b's
// subtree lies in c's. With S_i(b) the owner count of b's subtree,
//
//	|R_i(v)| = sum_{b in P_{i+1}(v)} S_i(b) + sum_{b in P_{i-1}(v)} S_i(b) - S_i(v)
//	           - sum over such nested b on either path of S_i(b),
//
// and each sum is accumulated from the root down along its tree.
func (w *wood) faceCounts() ([3][]int64, error) {
	emb := w.emb
	n := w.n
	var coord [3][]int64
	var own [3][]int64
	for i := range 3 {
		own[i] = make([]int64, n)
	}
	for f := int32(0); int(f) < w.nf; f++ {
		if f == w.outerFace {
			continue
		}
		var found [3]bool
		for _, d := range w.darts(f) {
			if c := w.lab[d]; !found[c] {
				found[c] = true
				own[c][emb.Tail(d)]++
			}
		}
		if !found[0] || !found[1] || !found[2] {
			return coord, w.internal("face %d lacks a corner colour", f)
		}
	}
	var parent [3][]int32
	var order [3][]int32
	for i := range 3 {
		parent[i] = make([]int32, n)
		for v := range parent[i] {
			if d := w.out[i][v]; d >= 0 {
				parent[i][v] = emb.Head(d)
			} else {
				parent[i][v] = -1
			}
		}
		var ok bool
		if order[i], ok = treeOrder(parent[i], w.a[i]); !ok {
			return coord, w.internal("colour %d is not a tree", i+1)
		}
	}
	var sub [3][]int64 // S_i
	for i := range 3 {
		sub[i] = append([]int64(nil), own[i]...)
		for k := n - 1; k > 0; k-- {
			v := order[i][k]
			sub[i][parent[i][v]] += sub[i][v]
		}
	}
	along := make([]int64, n)
	for i := range 3 {
		coord[i] = make([]int64, n)
		for v := range coord[i] {
			coord[i][v] = -sub[i][v]
		}
		for _, j := range [2]int{(i + 1) % 3, (i + 2) % 3} {
			// along[v] = sum over b in P_j(v) of S_i(b), less the nested ones.
			for _, v := range order[j] {
				pv := parent[j][v]
				if pv < 0 {
					along[v] = sub[i][v]
					continue
				}
				along[v] = along[pv] + sub[i][v]
				if parent[i][pv] == v {
					along[v] -= sub[i][pv]
				}
			}
			for v := range coord[i] {
				coord[i][v] += along[v]
			}
		}
	}
	inner := int64(w.nf - 1)
	for v := range n {
		s := coord[0][v] + coord[1][v] + coord[2][v]
		if s != inner {
			return coord, w.internal("vertex %d: face counts sum to %d, not %d", v, s, inner)
		}
		for i := range 3 {
			if coord[i][v] < 0 || coord[i][v] > inner {
				return coord, w.internal("vertex %d: face count %d out of range", v, coord[i][v])
			}
		}
	}
	return coord, nil
}

// treeOrder lists the vertices of the tree given by parent (root has
// parent -1) from the root down, breadth first; ok is false unless root is
// the only root and every vertex is reached.
func treeOrder(parent []int32, root int32) ([]int32, bool) {
	n := len(parent)
	start := make([]int32, n+1)
	for v, p := range parent {
		if p < 0 {
			if int32(v) != root {
				return nil, false
			}
			continue
		}
		start[p+1]++
	}
	if parent[root] >= 0 {
		return nil, false
	}
	for v := range n {
		start[v+1] += start[v]
	}
	child := make([]int32, n)
	fill := append([]int32(nil), start[:n]...)
	for v, p := range parent {
		if p >= 0 {
			child[fill[p]] = int32(v)
			fill[p]++
		}
	}
	order := make([]int32, 0, n)
	order = append(order, root)
	for k := 0; k < len(order); k++ {
		v := order[k]
		order = append(order, child[start[v]:start[v+1]]...)
		if len(order) > n {
			return nil, false
		}
	}
	return order, len(order) == n
}

// checkConvex confirms what Felsner's theorem promises before the drawing
// leaves: every inner face turns only left or straight on, with at least
// one left turn; the outer face the same with right turns. Signs are
// exact (128-bit products).
func (w *wood) checkConvex(x, y []int64) error {
	emb := w.emb
	for f := int32(0); int(f) < w.nf; f++ {
		want := 1
		if f == w.outerFace {
			want = -1
		}
		strict := false
		for _, d := range w.darts(f) {
			a, b := emb.Tail(d), emb.Head(d)
			c := emb.Head(emb.FaceNext(d))
			ux, uy := x[b]-x[a], y[b]-y[a]
			vx, vy := x[c]-x[b], y[c]-y[b]
			switch s := exact.CrossSign(ux, uy, vx, vy); {
			case s == want:
				strict = true
			case s != 0:
				return w.internal("face %d turns the wrong way at vertex %d", f, b)
			case exact.CrossSign(ux, uy, -vy, vx) <= 0:
				// ux*vx + uy*vy <= 0: a reversal or a repeated point.
				return w.internal("face %d folds back at vertex %d", f, b)
			}
		}
		if !strict {
			return w.internal("face %d is flat", f)
		}
	}
	return nil
}
