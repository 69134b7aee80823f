package graphgen

import (
	"fmt"
	"math"
	"strings"
)

// Graph is a simple undirected graph on the vertices 0..N-1.
type Graph struct {
	// N is the number of vertices.
	N int
	// Edges lists each undirected edge once, as a pair of endpoints.
	Edges [][2]int32
	// Name identifies the graph in test and benchmark names,
	// e.g. "grid-5x5" or "tri-300-seed7".
	Name string
}

// maxEdges bounds the edge lists this package is willing to allocate.
const maxEdges = math.MaxInt32

// fits reports whether a graph with n vertices and m edges can be built.
// Callers compute n and m in int64 from clamped sizes, so neither overflows.
func fits(n, m int64) bool {
	return n >= 0 && n <= math.MaxInt32 && m >= 0 && m <= maxEdges
}

// clamp maps a size argument to [0, 2^31]: negative sizes become 0, and
// sizes too large for int32 labels become 2^31, which fits rejects. Products
// of two clamped sizes fit in an int64.
func clamp(k int) int64 {
	if k < 0 {
		return 0
	}
	if int64(k) > math.MaxInt32 {
		return math.MaxInt32 + 1
	}
	return int64(k)
}

// newGraph returns an empty graph with room for m edges, or nil edges when
// the size does not fit; ok reports which.
func newGraph(name string, n, m int64) (g Graph, ok bool) {
	if !fits(n, m) {
		return Graph{Name: name}, false
	}
	return Graph{N: int(n), Edges: make([][2]int32, 0, m), Name: name}, true
}

func (g *Graph) add(u, v int64) {
	g.Edges = append(g.Edges, [2]int32{int32(u), int32(v)})
}

// Path returns the path 0-1-...-(n-1) with n-1 edges.
func Path(n int) Graph {
	nn := clamp(n)
	g, ok := newGraph(fmt.Sprintf("path-%d", nn), nn, max(nn-1, 0))
	if !ok {
		return g
	}
	for i := int64(1); i < nn; i++ {
		g.add(i-1, i)
	}
	return g
}

// Cycle returns the cycle 0-1-...-(n-1)-0 with n edges. For n < 3 a cycle
// would not be simple, and the result is Path(n) (named as a cycle).
func Cycle(n int) Graph {
	nn := clamp(n)
	name := fmt.Sprintf("cycle-%d", nn)
	if nn < 3 {
		g := Path(n)
		g.Name = name
		return g
	}
	g, ok := newGraph(name, nn, nn)
	if !ok {
		return g
	}
	for i := int64(1); i < nn; i++ {
		g.add(i-1, i)
	}
	g.add(nn-1, 0)
	return g
}

// Star returns the star with centre 0 and leaves 1..leaves.
func Star(leaves int) Graph {
	k := clamp(leaves)
	g, ok := newGraph(fmt.Sprintf("star-%d", k), k+1, k)
	if !ok {
		return g
	}
	for i := int64(1); i <= k; i++ {
		g.add(0, i)
	}
	return g
}

// Wheel returns the wheel with hub 0 and rim cycle 1-2-...-rim-1; it has
// 2*rim edges for rim >= 3. For rim < 3 the rim is a path, as in Cycle.
func Wheel(rim int) Graph {
	k := clamp(rim)
	rimEdges := k
	if k < 3 {
		rimEdges = max(k-1, 0)
	}
	g, ok := newGraph(fmt.Sprintf("wheel-%d", k), k+1, k+rimEdges)
	if !ok {
		return g
	}
	for i := int64(1); i <= k; i++ {
		g.add(0, i)
	}
	for i := int64(2); i <= k; i++ {
		g.add(i-1, i)
	}
	if k >= 3 {
		g.add(k, 1)
	}
	return g
}

// Grid returns the rows x cols grid graph: vertex r*cols+c is joined to its
// right and lower neighbours, giving 2*rows*cols-rows-cols edges for
// rows, cols >= 1.
func Grid(rows, cols int) Graph {
	return grid("grid", rows, cols, false)
}

// TriangulatedGrid returns Grid(rows, cols) plus, in every cell, the
// diagonal from r*cols+c to (r+1)*cols+c+1. It is planar, every inner face
// is a triangle, and the outer face is bounded by the grid's boundary cycle
// (so it is not a full triangulation); it has
// 2*rows*cols-rows-cols+(rows-1)*(cols-1) edges for rows, cols >= 1.
func TriangulatedGrid(rows, cols int) Graph {
	return grid("trigrid", rows, cols, true)
}

func grid(family string, rows, cols int, diagonals bool) Graph {
	r, c := clamp(rows), clamp(cols)
	name := fmt.Sprintf("%s-%dx%d", family, r, c)
	if r == 0 || c == 0 {
		return Graph{Name: name}
	}
	m := 2*r*c - r - c
	if diagonals {
		m += (r - 1) * (c - 1)
	}
	g, ok := newGraph(name, r*c, m)
	if !ok {
		return g
	}
	for i := int64(0); i < r; i++ {
		for j := int64(0); j < c; j++ {
			v := i*c + j
			if j+1 < c {
				g.add(v, v+1)
			}
			if i+1 < r {
				g.add(v, v+c)
			}
			if diagonals && i+1 < r && j+1 < c {
				g.add(v, v+c+1)
			}
		}
	}
	return g
}

// Complete returns K_n, with n(n-1)/2 edges.
func Complete(n int) Graph {
	nn := clamp(n)
	g, ok := newGraph(fmt.Sprintf("complete-%d", nn), nn, nn*(nn-1)/2)
	if !ok {
		return g
	}
	for i := int64(0); i < nn; i++ {
		for j := i + 1; j < nn; j++ {
			g.add(i, j)
		}
	}
	return g
}

// CompleteBipartite returns K_{m,n} with parts 0..m-1 and m..m+n-1, and m*n
// edges.
func CompleteBipartite(m, n int) Graph {
	a, b := clamp(m), clamp(n)
	g, ok := newGraph(fmt.Sprintf("complete-bipartite-%d-%d", a, b), a+b, a*b)
	if !ok {
		return g
	}
	for i := int64(0); i < a; i++ {
		for j := int64(0); j < b; j++ {
			g.add(i, a+j)
		}
	}
	return g
}

// Petersen returns the Petersen graph: outer 5-cycle 0..4, spokes i -- i+5,
// and the inner pentagram 5+i -- 5+(i+2)%5.
func Petersen() Graph {
	g, _ := newGraph("petersen", 10, 15)
	for i := int64(0); i < 5; i++ {
		g.add(i, (i+1)%5)
		g.add(i, i+5)
		g.add(5+i, 5+(i+2)%5)
	}
	return g
}

// NestedTriangles returns levels nested triangles, consecutive ones joined
// corner to corner and by one diagonal per quadrilateral, which makes the
// graph maximal planar with 3n-6 edges (n = 3*levels >= 3). Ring i is the
// triangle 3i, 3i+1, 3i+2; the join edges are 3i+j -- 3(i+1)+j and the
// diagonals 3i+j -- 3(i+1)+(j+1)%3. See the package documentation.
func NestedTriangles(levels int) Graph {
	return nested("nested", levels, true)
}

// NestedTrianglesPlain returns NestedTriangles(levels) without the
// diagonals: 3*levels vertices and 3*levels+3*(levels-1) edges.
func NestedTrianglesPlain(levels int) Graph {
	return nested("nested-plain", levels, false)
}

func nested(family string, levels int, diagonals bool) Graph {
	l := clamp(levels)
	name := fmt.Sprintf("%s-%d", family, l)
	if l == 0 {
		return Graph{Name: name}
	}
	m := 3*l + 3*(l-1)
	if diagonals {
		m += 3 * (l - 1)
	}
	g, ok := newGraph(name, 3*l, m)
	if !ok {
		return g
	}
	for i := int64(0); i < l; i++ {
		for j := int64(0); j < 3; j++ {
			g.add(3*i+j, 3*i+(j+1)%3)
		}
		if i+1 == l {
			break
		}
		for j := int64(0); j < 3; j++ {
			g.add(3*i+j, 3*(i+1)+j)
			if diagonals {
				g.add(3*i+j, 3*(i+1)+(j+1)%3)
			}
		}
	}
	return g
}

// DisjointUnion returns the disjoint union of gs: the vertices of gs[k] are
// shifted by the vertex counts of gs[0..k-1]. Edges are copied as they are,
// so the result is simple when every input is.
func DisjointUnion(gs ...Graph) Graph {
	var n, m int64
	names := make([]string, 0, len(gs))
	for _, h := range gs {
		n += clamp(h.N)
		m += int64(len(h.Edges))
		names = append(names, h.Name)
	}
	name := strings.Join(names, "+")
	if len(gs) == 0 {
		name = "empty"
	}
	if !fits(n, m) {
		return Graph{Name: name}
	}
	g, _ := newGraph(name, n, m)
	var offset int32
	for _, h := range gs {
		for _, e := range h.Edges {
			g.Edges = append(g.Edges, [2]int32{e[0] + offset, e[1] + offset})
		}
		offset += int32(clamp(h.N))
	}
	return g
}
