package planarize

// This file implements the left-right planarity test of de Fraysseix and
// Rosenstiehl in the formulation of U. Brandes, "The Left-Right Planarity
// Test" (2009): a DFS orientation with lowpoints and nesting depths, a
// testing DFS that maintains a stack of conflict pairs of return-edge
// intervals, and an embedding DFS that turns the side of every back edge
// into a rotation system. All three depth-first searches are iterative.

// Embed tests the simple graph on n vertices with the given edges for
// planarity. If it is planar, Embed returns a combinatorial embedding whose
// edge i is edges[i]; otherwise it returns nil and false. The graph must not
// have loops or repeated pairs (see Simplify). It runs in O(n + m) time.
func Embed(n int, edges [][2]int32) (*Embedding, bool) {
	if n >= 3 && len(edges) > 3*n-6 {
		return nil, false // Euler's bound for simple planar graphs.
	}
	var t lr
	t.reset(n, edges)
	t.orient()
	if !t.test() {
		return nil, false
	}
	return t.embed(), true
}

// IsPlanar reports whether the simple graph is planar.
func IsPlanar(n int, edges [][2]int32) bool {
	if n >= 3 && len(edges) > 3*n-6 {
		return false
	}
	var t lr
	return t.isPlanar(n, edges)
}

// isPlanar runs the test reusing t's buffers, which makes the many small
// tests of the planar-subgraph search cheap.
func (t *lr) isPlanar(n int, edges [][2]int32) bool {
	if n >= 3 && len(edges) > 3*n-6 {
		return false
	}
	t.reset(n, edges)
	t.orient()
	return t.test()
}

// conflictPair holds two intervals of return edges that must lie on
// opposite sides; an interval is given by its lowest and highest edge, -1
// when empty.
type conflictPair struct {
	lLow, lHigh, rLow, rHigh int32
}

type lr struct {
	n     int
	edges [][2]int32

	adjStart []int32 // CSR of darts leaving each vertex
	adj      []int32

	height     []int32
	parentEdge []int32
	roots      []int32

	src, dst     []int32 // orientation of every edge
	lowpt        []int32
	lowpt2       []int32
	nesting      []int32
	ref          []int32
	side         []int8
	lowptEdge    []int32
	stackBottom  []int32
	outStart     []int32 // CSR of oriented out-edges, sorted by nesting depth
	out          []int32
	stack        []conflictPair
	vertexStack  []int32
	iter         []int32
	returnedFrom []bool
	count, byKey []int32 // counting-sort scratch
}

// grow returns s with length n, reusing its storage when it is big enough.
// New storage is at least twice the old, so that a buffer reused for a
// graph that grows by an edge at a time (the planar-subgraph search's) is
// not made again each time; a first use takes n exactly.
func grow[T any](s []T, n int) []T {
	if cap(s) >= n {
		return s[:n]
	}
	return make([]T, n, max(n, 2*cap(s)))
}

func (t *lr) reset(n int, edges [][2]int32) {
	m := len(edges)
	t.n, t.edges = n, edges
	t.adjStart = grow(t.adjStart, n+1)
	clear(t.adjStart)
	for _, e := range edges {
		t.adjStart[e[0]+1]++
		t.adjStart[e[1]+1]++
	}
	for v := 1; v <= n; v++ {
		t.adjStart[v] += t.adjStart[v-1]
	}
	t.adj = grow(t.adj, 2*m)
	t.iter = grow(t.iter, n)
	pos := t.iter
	copy(pos, t.adjStart[:n])
	for i, e := range edges {
		t.adj[pos[e[0]]] = int32(2 * i)
		pos[e[0]]++
		t.adj[pos[e[1]]] = int32(2*i + 1)
		pos[e[1]]++
	}
	t.height = grow(t.height, n)
	t.parentEdge = grow(t.parentEdge, n)
	t.src = grow(t.src, m)
	t.dst = grow(t.dst, m)
	t.lowpt = grow(t.lowpt, m)
	t.lowpt2 = grow(t.lowpt2, m)
	t.nesting = grow(t.nesting, m)
	t.ref = grow(t.ref, m)
	t.side = grow(t.side, m)
	t.lowptEdge = grow(t.lowptEdge, m)
	t.stackBottom = grow(t.stackBottom, m)
	t.returnedFrom = grow(t.returnedFrom, n)
	clear(t.returnedFrom)
	t.outStart = grow(t.outStart, n+1)
	t.out = grow(t.out, m)
	t.roots = t.roots[:0]
	t.stack = t.stack[:0]
}

func (t *lr) head(d int32) int32 { return t.edges[d>>1][1-d&1] }

// orient is the first DFS: it orients every edge away from the root (tree
// edges downwards, back edges towards ancestors) and computes heights,
// lowpoints and nesting depths.
func (t *lr) orient() {
	for v := range t.height {
		t.height[v] = -1
		t.parentEdge[v] = -1
	}
	for e := range t.src {
		t.src[e] = -1
	}
	copy(t.iter, t.adjStart[:t.n])
	stack := t.vertexStack[:0]
	for s := int32(0); int(s) < t.n; s++ {
		if t.height[s] >= 0 {
			continue
		}
		t.height[s] = 0
		t.roots = append(t.roots, s)
		stack = append(stack, s)
		for len(stack) > 0 {
			v := stack[len(stack)-1]
			if t.iter[v] < t.adjStart[v+1] {
				d := t.adj[t.iter[v]]
				t.iter[v]++
				e := d >> 1
				if t.src[e] >= 0 {
					continue
				}
				w := t.head(d)
				t.src[e], t.dst[e] = v, w
				t.lowpt[e], t.lowpt2[e] = t.height[v], t.height[v]
				if t.height[w] < 0 {
					t.parentEdge[w] = e
					t.height[w] = t.height[v] + 1
					stack = append(stack, w)
				} else {
					t.lowpt[e] = t.height[w]
					t.finishOrient(e, v)
				}
				continue
			}
			stack = stack[:len(stack)-1]
			if pe := t.parentEdge[v]; pe >= 0 {
				t.finishOrient(pe, t.src[pe])
			}
		}
	}
	t.vertexStack = stack
}

// finishOrient sets the nesting depth of e, an out-edge of v whose lowpoints
// are final, and passes its lowpoints up to the parent edge of v.
func (t *lr) finishOrient(e, v int32) {
	t.nesting[e] = 2 * t.lowpt[e]
	if t.lowpt2[e] < t.height[v] {
		t.nesting[e]++ // chordal: returns to two different heights
	}
	p := t.parentEdge[v]
	if p < 0 {
		return
	}
	switch {
	case t.lowpt[e] < t.lowpt[p]:
		t.lowpt2[p] = min(t.lowpt[p], t.lowpt2[e])
		t.lowpt[p] = t.lowpt[e]
	case t.lowpt[e] > t.lowpt[p]:
		t.lowpt2[p] = min(t.lowpt2[p], t.lowpt[e])
	default:
		t.lowpt2[p] = min(t.lowpt2[p], t.lowpt2[e])
	}
}

// sortOut builds the out-edge lists ordered by key (non-decreasing), with
// a counting sort over keys in [0, span).
func (t *lr) sortOut(key func(e int32) int32, span int) {
	m := len(t.edges)
	t.count = grow(t.count, span+1)
	cnt := t.count
	clear(cnt)
	for e := range m {
		cnt[key(int32(e))+1]++
	}
	for k := 1; k <= span; k++ {
		cnt[k] += cnt[k-1]
	}
	t.byKey = grow(t.byKey, m)
	byKey := t.byKey
	for e := range m {
		k := key(int32(e))
		byKey[cnt[k]] = int32(e)
		cnt[k]++
	}
	clear(t.outStart)
	for e := range m {
		t.outStart[t.src[e]+1]++
	}
	for v := 1; v <= t.n; v++ {
		t.outStart[v] += t.outStart[v-1]
	}
	pos := t.iter
	copy(pos, t.outStart[:t.n])
	for _, e := range byKey {
		s := t.src[e]
		t.out[pos[s]] = e
		pos[s]++
	}
}

// test is the second DFS; it returns false as soon as the constraints on
// the sides of the back edges are contradictory, which by the left-right
// criterion means the graph is not planar.
func (t *lr) test() bool {
	m := len(t.edges)
	t.sortOut(func(e int32) int32 { return t.nesting[e] }, 2*t.n+2)
	for e := range m {
		t.ref[e] = -1
		t.side[e] = 1
	}
	copy(t.iter, t.outStart[:t.n])
	stack := t.vertexStack[:0]
	defer func() { t.vertexStack = stack[:0] }()
	for _, s := range t.roots {
		stack = append(stack, s)
		for len(stack) > 0 {
			v := stack[len(stack)-1]
			if t.returnedFrom[v] {
				t.returnedFrom[v] = false
				if !t.integrate(v, t.out[t.iter[v]]) {
					return false
				}
				t.iter[v]++
				continue
			}
			if t.iter[v] == t.outStart[v+1] {
				stack = stack[:len(stack)-1]
				t.finishTest(v)
				continue
			}
			ei := t.out[t.iter[v]]
			t.stackBottom[ei] = int32(len(t.stack))
			if w := t.dst[ei]; t.parentEdge[w] == ei {
				t.returnedFrom[v] = true
				stack = append(stack, w)
				continue
			}
			t.lowptEdge[ei] = ei
			t.stack = append(t.stack, conflictPair{-1, -1, ei, ei})
			if !t.integrate(v, ei) {
				return false
			}
			t.iter[v]++
		}
	}
	return true
}

// integrate adds the return edges of ei, an out-edge of v whose subtree is
// done, to the constraints of the parent edge of v.
func (t *lr) integrate(v, ei int32) bool {
	if t.lowpt[ei] >= t.height[v] {
		return true // no return edge below v
	}
	e := t.parentEdge[v]
	if ei == t.out[t.outStart[v]] {
		t.lowptEdge[e] = t.lowptEdge[ei]
		return true
	}
	return t.addConstraints(ei, e)
}

func emptyL(p conflictPair) bool { return p.lLow < 0 && p.lHigh < 0 }
func emptyR(p conflictPair) bool { return p.rLow < 0 && p.rHigh < 0 }

func swapSides(p *conflictPair) {
	p.lLow, p.rLow = p.rLow, p.lLow
	p.lHigh, p.rHigh = p.rHigh, p.lHigh
}

func (t *lr) conflicting(high, b int32) bool {
	return high >= 0 && t.lowpt[high] > t.lowpt[b]
}

func (t *lr) pop() conflictPair {
	p := t.stack[len(t.stack)-1]
	t.stack = t.stack[:len(t.stack)-1]
	return p
}

func (t *lr) addConstraints(ei, e int32) bool {
	p := conflictPair{-1, -1, -1, -1}
	// Merge the return edges of ei into p's right interval.
	for {
		q := t.pop()
		if !emptyL(q) {
			swapSides(&q)
		}
		if !emptyL(q) {
			return false
		}
		if t.lowpt[q.rLow] > t.lowpt[e] {
			if emptyR(p) {
				p.rHigh = q.rHigh
			} else {
				t.ref[p.rLow] = q.rHigh
			}
			p.rLow = q.rLow
		} else {
			t.ref[q.rLow] = t.lowptEdge[e] // aligned with the lowest return edge of e
		}
		if int32(len(t.stack)) == t.stackBottom[ei] {
			break
		}
	}
	// Merge the conflicting return edges of earlier siblings into p.L.
	for len(t.stack) > 0 {
		top := t.stack[len(t.stack)-1]
		if !t.conflicting(top.lHigh, ei) && !t.conflicting(top.rHigh, ei) {
			break
		}
		q := t.pop()
		if t.conflicting(q.rHigh, ei) {
			swapSides(&q)
		}
		if t.conflicting(q.rHigh, ei) {
			return false
		}
		if p.rLow >= 0 {
			t.ref[p.rLow] = q.rHigh
		}
		if q.rLow >= 0 {
			p.rLow = q.rLow
		}
		if emptyL(p) {
			p.lHigh = q.lHigh
		} else {
			t.ref[p.lLow] = q.lHigh
		}
		p.lLow = q.lLow
	}
	if !emptyL(p) || !emptyR(p) {
		t.stack = append(t.stack, p)
	}
	return true
}

func (t *lr) lowest(p conflictPair) int32 {
	switch {
	case emptyL(p):
		return t.lowpt[p.rLow]
	case emptyR(p):
		return t.lowpt[p.lLow]
	}
	return min(t.lowpt[p.lLow], t.lowpt[p.rLow])
}

// finishTest runs when the subtree of v is done: back edges returning to
// the parent of v are dropped from the constraints, and the parent edge of v
// learns the side of its highest return edge.
func (t *lr) finishTest(v int32) {
	e := t.parentEdge[v]
	if e < 0 {
		return
	}
	u := t.src[e]
	t.trimBackEdges(u)
	if t.lowpt[e] < t.height[u] {
		top := t.stack[len(t.stack)-1]
		hl, hr := top.lHigh, top.rHigh
		if hl >= 0 && (hr < 0 || t.lowpt[hl] > t.lowpt[hr]) {
			t.ref[e] = hl
		} else {
			t.ref[e] = hr
		}
	}
}

func (t *lr) trimBackEdges(u int32) {
	hu := t.height[u]
	for len(t.stack) > 0 && t.lowest(t.stack[len(t.stack)-1]) == hu {
		p := t.pop()
		if p.lLow >= 0 {
			t.side[p.lLow] = -1
		}
	}
	if len(t.stack) == 0 {
		return
	}
	p := t.pop()
	for p.lHigh >= 0 && t.dst[p.lHigh] == u {
		p.lHigh = t.ref[p.lHigh]
	}
	if p.lHigh < 0 && p.lLow >= 0 {
		t.ref[p.lLow] = p.rLow
		t.side[p.lLow] = -1
		p.lLow = -1
	}
	for p.rHigh >= 0 && t.dst[p.rHigh] == u {
		p.rHigh = t.ref[p.rHigh]
	}
	if p.rHigh < 0 && p.rLow >= 0 {
		t.ref[p.rLow] = p.lLow
		t.side[p.rLow] = -1
		p.rLow = -1
	}
	t.stack = append(t.stack, p)
}

// sign resolves the side of e relative to the root of its reference chain,
// iteratively so that long chains cannot exhaust the stack.
func (t *lr) sign(e int32, chain []int32) ([]int32, int8) {
	chain = append(chain[:0], e)
	for x := e; t.ref[x] >= 0; {
		x = t.ref[x]
		chain = append(chain, x)
	}
	for i := len(chain) - 2; i >= 0; i-- {
		x := chain[i]
		t.side[x] *= t.side[chain[i+1]]
		t.ref[x] = -1
	}
	return chain, t.side[e]
}

// dartFrom returns the dart of edge e that leaves x.
func (t *lr) dartFrom(e, x int32) int32 {
	if t.edges[e][0] == x {
		return 2 * e
	}
	return 2*e + 1
}

// embed is the third DFS: with every back edge's side known, it orders the
// out-edges of each vertex from left to right (by signed nesting depth) and
// inserts each back edge at its ancestor next to the tree edge it returns
// through: right edges directly after it, left edges before the leftmost
// one inserted so far. Seen from below (the parent edge at the bottom),
// left to right is clockwise; the rotation stored is counter-clockwise.
func (t *lr) embed() *Embedding {
	m := len(t.edges)
	var chain []int32
	for e := range m {
		var s int8
		chain, s = t.sign(int32(e), chain)
		t.nesting[e] *= int32(s)
	}
	// Nesting depths lie in [0, 2n), so signed ones in (-2n, 2n).
	offset := int32(2 * t.n)
	t.sortOut(func(e int32) int32 { return t.nesting[e] + offset }, 4*t.n+1)

	emb := &Embedding{
		edges: append([][2]int32(nil), t.edges...), // the caller keeps its slice
		next:  make([]int32, 2*m),
		prev:  make([]int32, 2*m),
		first: make([]int32, t.n),
		deg:   make([]int32, t.n),
	}
	// Clockwise: parent dart, then out-darts left to right. Link it as a
	// counter-clockwise cycle: parent, out_k, ..., out_1.
	link := func(a, b int32) { emb.next[a] = b; emb.prev[b] = a } // b follows a ccw
	for v := int32(0); int(v) < t.n; v++ {
		emb.first[v] = -1
		last := int32(-1) // most recently linked dart in ccw order
		start := int32(-1)
		if pe := t.parentEdge[v]; pe >= 0 {
			start = t.dartFrom(pe, v)
			last = start
		}
		for i := t.outStart[v+1] - 1; i >= t.outStart[v]; i-- {
			d := t.dartFrom(t.out[i], v)
			if last < 0 {
				start = d
			} else {
				link(last, d)
			}
			last = d
		}
		if start >= 0 {
			link(last, start)
			emb.first[v] = start
		}
	}
	leftRef := make([]int32, t.n)
	rightRef := make([]int32, t.n)
	copy(t.iter, t.outStart[:t.n])
	stack := t.vertexStack[:0]
	insertBefore := func(d, at int32) { // d goes ccw right before at
		p := emb.prev[at]
		link(p, d)
		link(d, at)
	}
	insertAfter := func(d, at int32) {
		n := emb.next[at]
		link(at, d)
		link(d, n)
	}
	for _, s := range t.roots {
		stack = append(stack, s)
		for len(stack) > 0 {
			v := stack[len(stack)-1]
			if t.iter[v] == t.outStart[v+1] {
				stack = stack[:len(stack)-1]
				continue
			}
			ei := t.out[t.iter[v]]
			t.iter[v]++
			w := t.dst[ei]
			if t.parentEdge[w] == ei {
				d := t.dartFrom(ei, v)
				leftRef[v], rightRef[v] = d, d
				stack = append(stack, w)
				continue
			}
			b := t.dartFrom(ei, w) // the back edge's dart at its ancestor w
			if t.side[ei] == 1 {
				insertBefore(b, rightRef[w]) // clockwise right after
			} else {
				insertAfter(b, leftRef[w]) // clockwise right before
				leftRef[w] = b
			}
		}
	}
	t.vertexStack = stack[:0]
	for _, e := range t.edges {
		emb.deg[e[0]]++
		emb.deg[e[1]]++
	}
	return emb
}
