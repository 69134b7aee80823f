package place

import (
	"errors"
	"math"

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

	// bary holds each vertex's weak barycentric coordinates within its
	// component (zero for components of one or two vertices); tests check
	// them against Schnyder's invariants.
	bary [][3]int32
}

// Component describes one connected component of a drawing.
type Component struct {
	Vertices   int
	X0, Y0     int64 // lower-left corner of its box
	W, H       int64 // box extent in grid steps
	Barycentre bool  // placed by Schnyder's barycentric method (3+ vertices)
}

// Options tune Layout. The zero value is the default.
type Options struct{}

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
	if !simpleEdges(emb) {
		return nil, errNotSimple
	}
	return layout(emb.Clone(), opt)
}

var (
	errNotPlane  = errors.New("place: the rotation system is not a plane embedding")
	errNotSimple = errors.New("place: the embedding has a loop or a repeated edge")
)

// simpleEdges reports whether no edge is a loop and no pair repeats.
func simpleEdges(emb *planarize.Embedding) bool {
	edges := make([][2]int32, emb.M())
	for i := range edges {
		edges[i] = emb.Edge(i)
		if edges[i][0] == edges[i][1] {
			return false
		}
	}
	simple, _ := planarize.Simplify(emb.N(), edges)
	return len(simple) == len(edges)
}

// layout is Layout on an embedding it may change.
func layout(work *planarize.Embedding, _ Options) (*Drawing, error) {
	n := work.N()
	comp, members := components(work)
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
	skip := func(v int32) bool { return full[comp[v]] }
	work.Reserve(extra)
	biconnect(work, skip)
	// Prefer an outer triangle cut from the largest face of each
	// component, so the drawing's outline follows a big face of the input.
	bestSize := make([]int, len(members))
	bestDart := make([]int32, len(members))
	for i := range bestDart {
		bestDart[i] = -1
	}
	triangulateFaces(work, skip, func(size int, tri int32) {
		c := comp[work.Tail(tri)]
		if size > bestSize[c] {
			bestSize[c], bestDart[c] = size, tri
		}
	})
	d := &Drawing{X: make([]int64, n), Y: make([]int64, n), bary: make([][3]int32, n)}
	ww := newWoodWork(n)
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
			boxes[c] = Component{Vertices: 2, W: 1}
			continue
		}
		outer := bestDart[c]
		if outer < 0 {
			outer = work.First(vs[0])
		}
		order = append(order[:0], make([]int32, len(vs))...)
		if err := ww.canonicalOrder(work, outer, order); err != nil {
			return nil, err
		}
		coord = append(coord[:0], make([][3]int32, len(vs))...)
		ww.barycentric(order, coord, index)
		var w, h int64
		for i, v := range vs {
			d.bary[v] = coord[i]
			d.X[v], d.Y[v] = int64(coord[i][0]), int64(coord[i][1])
			w, h = max(w, d.X[v]), max(h, d.Y[v])
		}
		boxes[c] = Component{Vertices: len(vs), W: w, H: h, Barycentre: true}
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
	return d, nil
}

// components labels vertices by connected component, numbering components
// by their smallest vertex, and lists each component's vertices in
// increasing order.
func components(emb *planarize.Embedding) (comp []int32, members [][]int32) {
	n := emb.N()
	comp = make([]int32, n)
	for v := range comp {
		comp[v] = -1
	}
	var stack []int32
	count := int32(0)
	for s := int32(0); int(s) < n; s++ {
		if comp[s] >= 0 {
			continue
		}
		comp[s] = count
		stack = append(stack[:0], s)
		for len(stack) > 0 {
			v := stack[len(stack)-1]
			stack = stack[:len(stack)-1]
			f := emb.First(v)
			if f < 0 {
				continue
			}
			for d := f; ; {
				if w := emb.Head(d); comp[w] < 0 {
					comp[w] = count
					stack = append(stack, w)
				}
				if d = emb.Next(d); d == f {
					break
				}
			}
		}
		count++
	}
	sizes := make([]int32, count+1)
	for _, c := range comp {
		sizes[c+1]++
	}
	for c := int32(1); c <= count; c++ {
		sizes[c] += sizes[c-1]
	}
	flat := make([]int32, n)
	fill := append([]int32(nil), sizes[:count]...)
	for v, c := range comp {
		flat[fill[c]] = int32(v)
		fill[c]++
	}
	members = make([][]int32, count)
	for c := range members {
		members[c] = flat[sizes[c]:sizes[c+1]:sizes[c+1]]
	}
	return comp, members
}

// pack places component boxes left to right in rows, with one empty grid
// line between neighbours,
// starting a new row when a row would grow wider than about the square
// root of the total area, so that many small components do not become one
// endless line. Rows are stacked upwards in order.
func pack(boxes []Component) {
	if len(boxes) == 0 {
		return
	}
	var area, widest int64
	for _, b := range boxes {
		area += (b.W + 1) * (b.H + 1)
		widest = max(widest, b.W+1)
	}
	limit := max(widest, isqrt(area))
	var x, y, rowH int64
	for i := range boxes {
		b := &boxes[i]
		if x > 0 && x+b.W+1 > limit {
			y += rowH + 2
			x, rowH = 0, 0
		}
		b.X0, b.Y0 = x, y
		x += b.W + 2
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
