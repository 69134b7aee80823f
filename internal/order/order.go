package order

import "github.com/gridwood/gridwood/internal/halves"

// DepthFirst renumbers the vertices of a graph (loops and repeated edges
// allowed) in depth-first preorder, component by component in order of
// their smallest vertex, and lists the edges renamed and sorted stably by
// their smaller new end. On inputs whose numbering is scattered (a file
// written in random order), every later pass, the depth-first searches of
// the planarity test above all, then reads memory almost in order: the
// layout of a million vertices runs about four times faster. newID maps an
// old vertex to its new number and edgeOf maps a new edge index to the old
// one.
//
// The two scattering passes (adjacency lists, sort) run in halves (see
// package halves).
func DepthFirst(n int, edges [][2]int32) (newID []int32, renamed [][2]int32, edgeOf []int32) {
	// A vertex's new number sits beside the start of its adjacency list:
	// on a scattered input each step of the search below then costs one
	// cache miss for the vertex instead of two.
	type vertex struct{ start, id int32 }
	vs := make([]vertex, n+1)
	var fill [2][]int32 // per half: the next free slot of each bucket
	halves.Run(len(edges), func(h, lo, hi int) {
		c := make([]int32, n)
		for _, e := range edges[lo:hi] {
			c[e[0]]++
			c[e[1]]++
		}
		fill[h] = c
	})
	s := int32(0)
	for v := range n {
		vs[v] = vertex{s, -1}
		s = halves.Starts(&fill, v, s)
	}
	vs[n].start = s
	adj := make([]int32, 2*len(edges))
	halves.Run(len(edges), func(h, lo, hi int) {
		pos := fill[h]
		for _, e := range edges[lo:hi] {
			adj[pos[e[0]]] = e[1]
			pos[e[0]]++
			adj[pos[e[1]]] = e[0]
			pos[e[1]]++
		}
	})
	// Depth-first preorder, iteratively: the planarity test's own
	// depth-first passes then walk memory almost in order. Each stack
	// frame carries its vertex's place in its adjacency and the end of it,
	// so returning to a vertex reads the stack, not arrays indexed by a
	// scattered vertex number.
	type frame struct{ at, end int32 }
	next := int32(0)
	var stack []frame
	for s := range n {
		if vs[s].id >= 0 {
			continue
		}
		vs[s].id = next
		next++
		stack = append(stack[:0], frame{vs[s].start, vs[s+1].start})
		for len(stack) > 0 {
			top := &stack[len(stack)-1]
			if top.at == top.end {
				stack = stack[:len(stack)-1]
				continue
			}
			w := adj[top.at]
			top.at++
			if vs[w].id < 0 {
				vs[w].id = next
				next++
				stack = append(stack, frame{vs[w].start, vs[w+1].start})
			}
		}
	}
	newID = make([]int32, n)
	for v := range newID {
		newID[v] = vs[v].id
	}
	// Counting sort by the smaller new end, stable.
	halves.Run(len(edges), func(h, lo, hi int) {
		c := fill[h]
		clear(c)
		for _, e := range edges[lo:hi] {
			c[min(newID[e[0]], newID[e[1]])]++
		}
	})
	s = 0
	for k := range n {
		s = halves.Starts(&fill, k, s)
	}
	renamed = make([][2]int32, len(edges))
	edgeOf = make([]int32, len(edges))
	halves.Run(len(edges), func(h, lo, hi int) {
		pos := fill[h]
		for i := lo; i < hi; i++ {
			e := edges[i]
			a, b := newID[e[0]], newID[e[1]]
			k := min(a, b)
			renamed[pos[k]] = [2]int32{a, b}
			edgeOf[pos[k]] = int32(i)
			pos[k]++
		}
	})
	return newID, renamed, edgeOf
}
