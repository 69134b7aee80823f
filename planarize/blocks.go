package planarize

// csr is a compact adjacency structure: the darts leaving v are
// adj[start[v]:start[v+1]]; dart 2e leaves edges[e][0], dart 2e+1 leaves
// edges[e][1].
type csr struct {
	start []int32
	adj   []int32
}

func newCSR(n int, edges [][2]int32) csr {
	var pos []int32
	return csr{}.refill(n, edges, &pos)
}

// refill is newCSR reusing g's storage, and *pos as scratch.
func (g csr) refill(n int, edges [][2]int32, pos *[]int32) csr {
	start := grow(g.start, n+1)
	clear(start)
	for _, e := range edges {
		start[e[0]+1]++
		start[e[1]+1]++
	}
	for v := 1; v <= n; v++ {
		start[v] += start[v-1]
	}
	adj := grow(g.adj, 2*len(edges))
	*pos = append((*pos)[:0], start[:n]...)
	p := *pos
	for i, e := range edges {
		adj[p[e[0]]] = int32(2 * i)
		p[e[0]]++
		adj[p[e[1]]] = int32(2*i + 1)
		p[e[1]]++
	}
	return csr{start, adj}
}

// Blocks labels each edge of the simple graph with its biconnected
// component (block), numbered from 0 in order of completion, and returns
// the labels and the number of blocks. A graph is planar if and only if
// each of its blocks is, so planarity work can be split along them. It is
// the lowpoint method of Hopcroft and Tarjan, "Efficient algorithms for
// graph manipulation", Comm. ACM 16 (1973), run with explicit stacks.
func Blocks(n int, edges [][2]int32) (block []int32, count int) {
	g := newCSR(n, edges)
	block = make([]int32, len(edges))
	disc := make([]int32, n)
	low := make([]int32, n)
	parentEdge := make([]int32, n)
	cursor := make([]int32, n)
	for v := range disc {
		disc[v] = -1
	}
	var vstack, estack []int32
	clock := int32(0)
	nb := int32(0)
	head := func(d int32) int32 { return edges[d>>1][1-d&1] }
	for s := int32(0); int(s) < n; s++ {
		if disc[s] >= 0 {
			continue
		}
		disc[s], low[s] = clock, clock
		clock++
		parentEdge[s] = -1
		cursor[s] = g.start[s]
		vstack = append(vstack, s)
		for len(vstack) > 0 {
			v := vstack[len(vstack)-1]
			if cursor[v] == g.start[v+1] {
				vstack = vstack[:len(vstack)-1]
				pe := parentEdge[v]
				if pe < 0 {
					continue
				}
				u := head(2*pe) ^ head(2*pe+1) ^ v // the other end
				low[u] = min(low[u], low[v])
				if low[v] >= disc[u] {
					for {
						e := estack[len(estack)-1]
						estack = estack[:len(estack)-1]
						block[e] = nb
						if e == pe {
							break
						}
					}
					nb++
				}
				continue
			}
			d := g.adj[cursor[v]]
			cursor[v]++
			e := d >> 1
			if e == parentEdge[v] {
				continue
			}
			w := head(d)
			switch {
			case disc[w] < 0:
				disc[w], low[w] = clock, clock
				clock++
				parentEdge[w] = e
				cursor[w] = g.start[w]
				estack = append(estack, e)
				vstack = append(vstack, w)
			case disc[w] < disc[v]:
				low[v] = min(low[v], disc[w])
				estack = append(estack, e)
			}
		}
	}
	return block, int(nb)
}
