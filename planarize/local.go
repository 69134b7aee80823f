package planarize

// tubeRadius is the radius of localProof's tube. A square grid plus
// strays would need 2, but with 2 a 100 x 100 grid with 3,000 random pairs
// took 14.9 s instead of 16.9, and a 5,000-vertex triangulation with 5,000
// took 3.3 s instead of 1.4: the bigger tube costs more than it proves.
const tubeRadius = 1

// localProof proves, for one candidate edge at a time, that the kept
// graph of a greedy search plus the edge is non-planar, by testing a small
// part of the kept graph only: the tube of radius tubeRadius around a
// shortest path between the edge's ends (the vertices within that
// distance of the path, and the kept edges among them). A subgraph of a
// planar graph is planar, so a non-planar tube proves the rejection
// exactly, and the greedy result is the same as with a test of the whole
// kept graph. In a triangulation the tube always holds one (the wheel
// around one end, three disjoint paths from the other end to it, and the
// edge make a subdivision of K5, all within radius 1), so when a
// near-triangulation rejects thousands of stray edges, each costs a search
// about the two ends instead of a test of the whole block. When the tube
// is planar, or the search and the tube would pass the work bound, the
// proof fails and the caller tests the whole graph.
type localProof struct {
	edges  [][2]int32
	adj    [][]int32 // the kept graph's neighbours of each vertex
	seen   [2][]int32
	parent [2][]int32
	front  [2][]int32
	next   []int32
	inTube []int32 // the call's stamp once in the tube; local holds its number
	local  []int32
	tube   []int32
	buf    [][2]int32
	stamp  int32
	lr     lr
}

func newLocalProof(n int, edges [][2]int32, kept []int32) *localProof {
	p := &localProof{edges: edges, adj: make([][]int32, n), inTube: make([]int32, n), local: make([]int32, n)}
	for s := range 2 {
		p.seen[s] = make([]int32, n)
		p.parent[s] = make([]int32, n)
	}
	p.add(kept)
	return p
}

// add records newly kept edges.
func (p *localProof) add(kept []int32) {
	for _, e := range kept {
		u, v := p.edges[e][0], p.edges[e][1]
		p.adj[u] = append(p.adj[u], v)
		p.adj[v] = append(p.adj[v], u)
	}
}

// rejects reports whether the kept graph plus edge e is proved non-planar,
// and the work spent: adjacency entries scanned and tube edges tested.
// The path search may spend about work and the tube four times that: past
// either, the proof fails. (With the tube held to work as well, near hubs
// of a 5,000-vertex triangulation with 5,000 strays, proofs failed and the
// run took 6.1 s instead of 2.1.)
func (p *localProof) rejects(e int32, work int) (proved bool, spent int) {
	u, v := p.edges[e][0], p.edges[e][1]
	meet, spent, ok := p.path(u, v, work)
	if !ok {
		return false, spent
	}
	// The path's vertices, from meet back to each end, and their
	// neighbours make the tube.
	p.tube = p.tube[:0]
	addTube := func(x int32) {
		if p.inTube[x] != p.stamp {
			p.inTube[x] = p.stamp
			p.local[x] = int32(len(p.tube))
			p.tube = append(p.tube, x)
		}
	}
	for s := range 2 {
		for x := meet; ; x = p.parent[s][x] {
			addTube(x)
			if x == p.edges[e][s] {
				break
			}
		}
	}
	searched := spent
	from := 0
	for range tubeRadius {
		to := len(p.tube)
		for _, x := range p.tube[from:to] {
			if spent += len(p.adj[x]); spent-searched > 4*work {
				return false, spent // a hub near the path: the tube is no small part
			}
			for _, w := range p.adj[x] {
				addTube(w)
			}
		}
		from = to
	}
	p.buf = p.buf[:0]
	for _, x := range p.tube {
		if spent += len(p.adj[x]); spent-searched > 4*work {
			return false, spent
		}
		for _, w := range p.adj[x] {
			if x < w && p.inTube[w] == p.stamp {
				p.buf = append(p.buf, [2]int32{p.local[x], p.local[w]})
			}
		}
	}
	p.buf = append(p.buf, [2]int32{p.local[u], p.local[v]})
	if len(p.buf) < 9 { // fewer edges than K3,3 has
		return false, spent
	}
	spent += len(p.buf) + len(p.tube)
	return !p.lr.isPlanar(len(p.tube), p.buf), spent
}

// path searches the kept graph breadth-first from u and from v, a level
// of the smaller frontier at a time, and returns a vertex where the two
// searches met (with parent links back to u in parent[0] and to v in
// parent[1]) once a shortest path is found, and the adjacency entries it
// scanned; ok is false when there is no path or the work bound would be
// passed.
func (p *localProof) path(u, v int32, work int) (meet int32, spent int, ok bool) {
	p.stamp++
	ends := [2]int32{u, v}
	for s, x := range ends {
		p.seen[s][x] = p.stamp
		p.parent[s][x] = x
		p.front[s] = append(p.front[s][:0], x)
	}
	for {
		s := 0
		if len(p.front[1]) < len(p.front[0]) {
			s = 1
		}
		if len(p.front[s]) == 0 {
			return 0, spent, false
		}
		p.next = p.next[:0]
		found := int32(-1)
		for _, x := range p.front[s] {
			if spent += len(p.adj[x]); spent > work {
				return 0, spent, false
			}
			for _, w := range p.adj[x] {
				if p.seen[s][w] == p.stamp {
					continue
				}
				p.seen[s][w] = p.stamp
				p.parent[s][w] = x
				if found < 0 && p.seen[1-s][w] == p.stamp {
					found = w // the first meeting: any one on this level is shortest to within one edge
				}
				p.next = append(p.next, w)
			}
		}
		p.front[s], p.next = p.next, p.front[s]
		if found >= 0 {
			return found, spent, true
		}
	}
}
