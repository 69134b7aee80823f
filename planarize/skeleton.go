package planarize

// skeleton answers, one candidate edge at a time, whether the kept graph of
// a greedy search plus the edge is planar, by testing a smaller graph that
// is planar exactly when that one is. Two reductions give it, both from
// Kuratowski's theorem (a graph is planar iff it holds no subdivision of
// K5 or K3,3): a vertex of degree 0 or 1 lies on no such subdivision, so
// the pendant trees come off (what is left is the 2-core); and a graph is
// planar iff any subdivision of it is, so every path whose inner vertices
// have degree 2 becomes one edge (and parallel edges, which never change
// planarity, become one). The candidate's ends are first moved to where
// their pendant trees hang from the core: the tree paths and the candidate
// then form one path between two core vertices, which is again a
// subdivided edge. So the test sees the branch vertices of the core (degree
// 3 and up), one edge per distinct pair of them joined by a chain, a vertex
// for each end of the candidate inside a chain, joined to that chain's two
// ends, and the candidate (see planarWith).
//
// Where the kept graph is a spanning tree plus a few cycles, as in a sparse
// random graph most of whose edges are removed, that is a few times
// smaller than the kept graph (G(5000, 15000): 669 branch vertices and
// 1,158 chains against 5,000 vertices and 5,479 kept edges at the end). On
// a kept graph close to a triangulation it is no smaller, and build says
// so before it has done more than peel the pendant trees.
type skeleton struct {
	n     int
	edges [][2]int32
	kept  int // the length of the kept list it was built from

	// Per vertex.
	comp   []int32 // connected component in the kept graph
	attach []int32 // the core vertex its pendant tree hangs from; itself in the core; a tree component's last peeled vertex
	chain  []int32 // its chain, for an inner vertex of one; -1 otherwise
	place  []int32 // a branch vertex's number in the skeleton
	// Per chain: its two end branch vertices, as skeleton numbers.
	ends [][2]int32

	branches int
	base     [][2]int32          // the skeleton's edges, each pair once
	index    map[uint64]struct{} // the pairs in base

	// Build scratch, and the test's.
	deg, parent, order, queue []int32
	peeled                    []bool
	usedEdge                  []bool
	g                         csr
	sub                       [][2]int32
	buf, extra                [][2]int32
	lr                        lr
}

// skeletonSize is the least kept graph, in edges, on which single
// candidates are tested on the skeleton: below it a whole test is as
// cheap as building one. A variable so that tests can reach the skeleton
// on small graphs.
var skeletonSize = 1000

func newSkeleton(n int, edges [][2]int32) *skeleton {
	return &skeleton{n: n, edges: edges, index: make(map[uint64]struct{}),
		comp: make([]int32, n), attach: make([]int32, n), chain: make([]int32, n), place: make([]int32, n),
		deg: make([]int32, n), parent: make([]int32, n), peeled: make([]bool, n)}
}

func skeletonKey(a, b int32) uint64 {
	if a > b {
		a, b = b, a
	}
	return uint64(uint32(a))<<32 | uint64(uint32(b))
}

// build makes the skeleton of the kept graph (indices into edges), unless
// twice its vertices and edges would pass limit: it then reports false
// and leaves the skeleton unusable. The search passes the kept graph's
// vertices and edges, so that the skeleton is at most half the size.
func (s *skeleton) build(kept []int32, limit int) bool {
	n := s.n
	s.kept = len(kept)
	s.sub = s.sub[:0]
	for _, e := range kept {
		s.sub = append(s.sub, s.edges[e])
	}
	s.g = s.g.refill(n, s.sub, &s.queue) // reused: a search builds one after each edge it takes
	g, sub := s.g, s.sub
	other := func(d int32) int32 { return sub[d>>1][1-d&1] }

	// Components, by breadth-first search.
	for v := range s.comp {
		s.comp[v] = -1
	}
	for r := range n {
		if s.comp[r] >= 0 {
			continue
		}
		s.comp[r] = int32(r)
		s.queue = append(s.queue[:0], int32(r))
		for i := 0; i < len(s.queue); i++ {
			v := s.queue[i]
			for _, d := range g.adj[g.start[v]:g.start[v+1]] {
				if w := other(d); s.comp[w] < 0 {
					s.comp[w] = int32(r)
					s.queue = append(s.queue, w)
				}
			}
		}
	}

	// Peel the pendant trees; parent is the neighbour a peeled vertex
	// hung from (-1 for the last of a tree component).
	s.queue, s.order = s.queue[:0], s.order[:0]
	for v := range n {
		s.deg[v] = g.start[v+1] - g.start[v]
		s.peeled[v] = false
		s.parent[v] = -1
		if s.deg[v] <= 1 {
			s.queue = append(s.queue, int32(v))
		}
	}
	for len(s.queue) > 0 {
		v := s.queue[len(s.queue)-1]
		s.queue = s.queue[:len(s.queue)-1]
		if s.peeled[v] {
			continue
		}
		s.peeled[v] = true
		s.order = append(s.order, v)
		for _, d := range g.adj[g.start[v]:g.start[v+1]] {
			if w := other(d); !s.peeled[w] {
				s.parent[v] = w
				if s.deg[w]--; s.deg[w] == 1 {
					s.queue = append(s.queue, w)
				}
			}
		}
	}
	for v := range n {
		s.attach[v] = int32(v)
	}
	for i := len(s.order) - 1; i >= 0; i-- {
		if v := s.order[i]; s.parent[v] >= 0 {
			s.attach[v] = s.attach[s.parent[v]]
		}
	}

	// Branch vertices, then the chains between them; a cycle of degree-2
	// vertices gets its first vertex as a branch vertex. Each inner vertex
	// of a chain joins two core edges into one, so the chains are known
	// in number before they are walked.
	s.branches = 0
	coreDarts, inner := 0, 0
	for v := range n {
		s.chain[v] = -1
		switch {
		case s.peeled[v]:
		case s.deg[v] >= 3:
			s.place[v] = int32(s.branches)
			s.branches++
			coreDarts += int(s.deg[v])
		default:
			coreDarts += 2
			inner++
		}
	}
	if 2*(s.branches+coreDarts/2-inner) > limit {
		return false
	}
	s.usedEdge = grow(s.usedEdge, len(sub))
	clear(s.usedEdge)
	s.ends = s.ends[:0]
	walk := func(x int32) {
		for _, d := range g.adj[g.start[x]:g.start[x+1]] {
			if s.usedEdge[d>>1] || s.peeled[other(d)] {
				continue
			}
			id := int32(len(s.ends))
			s.usedEdge[d>>1] = true
			cur := other(d)
			for s.deg[cur] == 2 && s.chain[cur] < 0 {
				s.chain[cur] = id
				for _, d2 := range g.adj[g.start[cur]:g.start[cur+1]] {
					if !s.usedEdge[d2>>1] && !s.peeled[other(d2)] {
						s.usedEdge[d2>>1] = true
						cur = other(d2)
						break
					}
				}
			}
			s.ends = append(s.ends, [2]int32{s.place[x], s.place[cur]})
		}
	}
	for v := range n {
		if s.isBranch(int32(v)) {
			walk(int32(v))
		}
	}
	for v := range n {
		if !s.peeled[v] && s.deg[v] == 2 && s.chain[v] < 0 {
			s.place[v] = int32(s.branches)
			s.branches++
			s.deg[v] = 3 // marks it a branch vertex from here on
			walk(int32(v))
		}
	}

	clear(s.index)
	s.base = s.base[:0]
	for _, c := range s.ends {
		if c[0] == c[1] {
			continue // a loop: never matters for planarity
		}
		k := skeletonKey(c[0], c[1])
		if _, ok := s.index[k]; !ok {
			s.index[k] = struct{}{}
			s.base = append(s.base, c)
		}
	}
	return true
}

// endsAt reports whether chain c ends at branch vertex v.
func (s *skeleton) endsAt(c, v int32) bool {
	return s.ends[c][0] == s.place[v] || s.ends[c][1] == s.place[v]
}

// isBranch reports whether core vertex v is a branch vertex of the
// skeleton.
func (s *skeleton) isBranch(v int32) bool { return !s.peeled[v] && s.deg[v] >= 3 }

// planarWith reports whether the kept graph the skeleton was built from
// plus edge e is planar.
func (s *skeleton) planarWith(e int32) bool {
	u, v := s.edges[e][0], s.edges[e][1]
	if s.comp[u] != s.comp[v] {
		return true // a bridge between planar components
	}
	a, b := s.attach[u], s.attach[v]
	if a == b {
		return true // a new cycle through one core vertex: a block of its own
	}
	// Both are core vertices now. On one chain (ends included) the
	// candidate closes a cycle alongside a stretch of it, which a drawing
	// can always fit in.
	ca, cb := s.chain[a], s.chain[b]
	switch {
	case ca >= 0 && cb >= 0 && ca == cb,
		ca >= 0 && cb < 0 && s.endsAt(ca, b),
		cb >= 0 && ca < 0 && s.endsAt(cb, a):
		return true
	case ca < 0 && cb < 0:
		if _, joined := s.index[skeletonKey(s.place[a], s.place[b])]; joined {
			return true
		}
	}
	// Terminals: a branch vertex is its skeleton number; an inner vertex
	// of a chain is a new vertex on it, joined to the chain's two ends.
	// The chain's own edge stays: it runs alongside the new vertex's two
	// edges, and with the candidate that vertex has degree 3, so a drawing
	// without the chain's edge can always take it back in the face between
	// those two edges that the candidate does not leave by. (A chain that
	// is a loop has no edge; its vertex then gets one edge to the end.)
	next := int32(s.branches)
	extra := s.extra[:0]
	term := func(x int32) int32 {
		c := s.chain[x]
		if c < 0 {
			return s.place[x]
		}
		t := next
		next++
		extra = append(extra, [2]int32{s.ends[c][0], t})
		if s.ends[c][1] != s.ends[c][0] {
			extra = append(extra, [2]int32{t, s.ends[c][1]})
		}
		return t
	}
	ta := term(a)
	tb := term(b)
	extra = append(extra, [2]int32{ta, tb})
	s.extra = extra
	// No new pair is in base (each holds a new vertex, or is two branch
	// vertices with no chain between them), and none is twice in extra.
	s.buf = append(append(s.buf[:0], s.base...), extra...)
	return s.lr.isPlanar(int(next), s.buf)
}
