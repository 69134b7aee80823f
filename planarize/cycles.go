package planarize

// shortCycles finds, for single edges, the length of a shortest cycle
// through them by a breadth-first search from both ends that avoids the
// edge itself, expanding the smaller frontier one level at a time (common
// practice for shortest paths between two given vertices). The greedy
// planar subgraph uses it to rank the edges on no triangle and no 4-cycle:
// a stray edge between distant parts of a mesh lies on no short cycle at
// all, while the mesh's own edges on long faces still do.
type shortCycles struct {
	edges [][2]int32
	g     csr
	seen  [2][]int32 // the stamp of the search that reached a vertex from each end
	dist  [2][]int32 // its distance from that end, valid where seen holds the stamp
	front [2][]int32
	next  []int32
	stamp int32
}

func newShortCycles(n int, edges [][2]int32, g csr) *shortCycles {
	c := &shortCycles{edges: edges, g: g}
	for s := range 2 {
		c.seen[s] = make([]int32, n)
		c.dist[s] = make([]int32, n)
	}
	return c
}

// through returns the length of a shortest cycle through edge e when it
// has at most maxLen edges, else 0, and the work spent (adjacency entries
// scanned). It gives up, returning 0, once the work would pass work.
func (c *shortCycles) through(e int32, maxLen, work int) (length, spent int) {
	c.stamp++
	for s, v := range c.edges[e] {
		c.seen[s][v] = c.stamp
		c.dist[s][v] = 0
		c.front[s] = append(c.front[s][:0], v)
	}
	var depth [2]int32
	// A path found at the next level has at most depth[0]+depth[1]+1
	// edges; with e it closes a cycle one longer.
	for int(depth[0]+depth[1])+2 <= maxLen {
		s := 0
		if len(c.front[1]) < len(c.front[0]) {
			s = 1
		}
		if len(c.front[s]) == 0 {
			return 0, spent // that end's side is exhausted: e is a bridge
		}
		best := int32(0)
		c.next = c.next[:0]
		for _, x := range c.front[s] {
			around := c.g.adj[c.g.start[x]:c.g.start[x+1]]
			if spent += len(around); spent > work {
				return 0, spent
			}
			for _, d := range around {
				if d>>1 == e {
					continue
				}
				w := c.edges[d>>1][1-d&1]
				if c.seen[s][w] == c.stamp {
					continue
				}
				c.seen[s][w] = c.stamp
				c.dist[s][w] = depth[s] + 1
				if c.seen[1-s][w] == c.stamp {
					if l := depth[s] + 1 + c.dist[1-s][w] + 1; best == 0 || l < best {
						best = l
					}
				}
				c.next = append(c.next, w)
			}
		}
		depth[s]++
		c.front[s], c.next = c.next, c.front[s]
		if best > 0 {
			// Every vertex nearer to either end has been seen, so no
			// shorter path can meet later.
			if int(best) <= maxLen {
				return int(best), spent
			}
			return 0, spent
		}
	}
	return 0, spent
}
