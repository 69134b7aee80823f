package planarize

import "slices"

// An Embedding is a combinatorial embedding (rotation system) of a simple
// undirected graph on the vertices 0..N()-1.
//
// Edge e joins Edge(e)[0] and Edge(e)[1]. Each edge has two darts
// (half-edges): dart 2e leaves Edge(e)[0] and dart 2e+1 leaves Edge(e)[1].
// Around every vertex the darts leaving it form a cycle in counter-clockwise
// order, reached with Next and Prev.
//
// Faces are traversed with FaceNext, which keeps the face on the left of
// every dart: inner faces of a drawing that respects the rotation are walked
// counter-clockwise, the outer face clockwise.
type Embedding struct {
	edges [][2]int32
	next  []int32 // counter-clockwise successor of a dart around its tail
	prev  []int32 // counter-clockwise predecessor
	first []int32 // a dart leaving the vertex, -1 if it is isolated
	deg   []int32
}

// NewEmbedding returns an embedding of n isolated vertices, ready for
// AddEdge. It is the starting point for building embeddings by hand.
func NewEmbedding(n int) *Embedding {
	e := &Embedding{first: make([]int32, n), deg: make([]int32, n)}
	for v := range e.first {
		e.first[v] = -1
	}
	return e
}

// N returns the number of vertices.
func (e *Embedding) N() int { return len(e.first) }

// M returns the number of edges.
func (e *Embedding) M() int { return len(e.edges) }

// Edge returns the two ends of edge i.
func (e *Embedding) Edge(i int) [2]int32 { return e.edges[i] }

// Edges returns a copy of the edge list, edge i at index i.
func (e *Embedding) Edges() [][2]int32 { return slices.Clone(e.edges) }

// Tail returns the vertex dart d leaves.
func (e *Embedding) Tail(d int32) int32 { return e.edges[d>>1][d&1] }

// Head returns the vertex dart d enters.
func (e *Embedding) Head(d int32) int32 { return e.edges[d>>1][1-d&1] }

// Next returns the dart after d, counter-clockwise around Tail(d).
func (e *Embedding) Next(d int32) int32 { return e.next[d] }

// Prev returns the dart before d, counter-clockwise around Tail(d).
func (e *Embedding) Prev(d int32) int32 { return e.prev[d] }

// FaceNext returns the dart that follows d along the face on the left of d.
func (e *Embedding) FaceNext(d int32) int32 { return e.prev[d^1] }

// First returns a dart leaving v, or -1 if v has no edges.
func (e *Embedding) First(v int32) int32 { return e.first[v] }

// Degree returns the number of edges at v.
func (e *Embedding) Degree(v int32) int { return int(e.deg[v]) }

// AddEdge adds an edge between u = Tail(a) and v = Tail(b). Its dart leaving
// u is placed counter-clockwise right after a, its dart leaving v right after
// b. When a and b lie on one face (the face on their left), that face is
// split in two: one face holds a and the new dart v->u, the other the new
// dart u->v and b. Either argument may be -1 for an isolated vertex, given
// as u or v. The new edge's index is returned.
func (e *Embedding) AddEdge(a, b int32, u, v int32) int {
	if a >= 0 {
		u = e.Tail(a)
	}
	if b >= 0 {
		v = e.Tail(b)
	}
	id := len(e.edges)
	e.edges = append(e.edges, [2]int32{u, v})
	d := int32(2 * id)
	e.next = append(e.next, d, d+1)
	e.prev = append(e.prev, d, d+1)
	e.insertAfter(d, a, u)
	e.insertAfter(d+1, b, v)
	return id
}

// insertAfter links the new dart d into the rotation of v right after a, or
// makes it the only dart of v when a is -1.
func (e *Embedding) insertAfter(d, a, v int32) {
	e.deg[v]++
	if a < 0 {
		if e.first[v] >= 0 {
			a = e.prev[e.first[v]]
		} else {
			e.first[v] = d
			return
		}
	}
	n := e.next[a]
	e.next[a] = d
	e.prev[d] = a
	e.next[d] = n
	e.prev[n] = d
}

// Faces returns the number of faces of the embedding, counting every
// connected component on its own sphere: for a planar rotation system with
// V vertices, E edges and C components, Faces = 2C - V + E (Euler), where an
// isolated vertex is a component with one face.
func (e *Embedding) Faces() int {
	seen := make([]bool, len(e.next))
	faces := 0
	for d := range e.next {
		if seen[d] {
			continue
		}
		faces++
		for x := int32(d); !seen[x]; x = e.FaceNext(x) {
			seen[x] = true
		}
	}
	for _, f := range e.first {
		if f < 0 {
			faces++
		}
	}
	return faces
}

// IsPlane reports whether the rotation system describes a drawing in the
// plane: in every connected component V - E + F = 2 (Euler), which holds
// exactly for genus zero. Embeddings from Embed always are; hand-built ones
// may not be.
func (e *Embedding) IsPlane() bool {
	return e.Faces() == 2*e.Components()-e.N()+e.M()
}

// Reserve makes room for m more edges, so that adding them later does not
// copy the arrays again.
func (e *Embedding) Reserve(m int) {
	if m <= 0 {
		return
	}
	e.edges = append(make([][2]int32, 0, len(e.edges)+m), e.edges...)
	e.next = append(make([]int32, 0, len(e.next)+2*m), e.next...)
	e.prev = append(make([]int32, 0, len(e.prev)+2*m), e.prev...)
}

// Clone returns an independent copy, so that augmentation can add edges
// without touching the caller's embedding.
func (e *Embedding) Clone() *Embedding {
	c := &Embedding{
		edges: append([][2]int32(nil), e.edges...),
		next:  append([]int32(nil), e.next...),
		prev:  append([]int32(nil), e.prev...),
		first: append([]int32(nil), e.first...),
		deg:   append([]int32(nil), e.deg...),
	}
	return c
}

// WithoutLastVertex returns a copy of the embedding with its last vertex
// and every edge at it removed, the other edges keeping their order (and
// so their numbers, when the removed edges come last) and their rotation.
// Adding a vertex joined to a set of vertices, embedding, and removing it
// again is how an embedding with all of those vertices on one face is
// found.
func (e *Embedding) WithoutLastVertex() *Embedding {
	last := int32(e.N() - 1)
	newEdge := make([]int32, len(e.edges))
	out := &Embedding{first: make([]int32, last), deg: make([]int32, last)}
	for i, ed := range e.edges {
		if ed[0] == last || ed[1] == last {
			newEdge[i] = -1
			continue
		}
		newEdge[i] = int32(len(out.edges))
		out.edges = append(out.edges, ed)
	}
	dart := func(d int32) int32 { return 2*newEdge[d>>1] + d&1 }
	out.next = make([]int32, 2*len(out.edges))
	out.prev = make([]int32, 2*len(out.edges))
	for v := int32(0); v < last; v++ {
		out.first[v] = -1
		f := e.first[v]
		if f < 0 {
			continue
		}
		var kept []int32
		for d := f; ; {
			if newEdge[d>>1] >= 0 {
				kept = append(kept, dart(d))
			}
			if d = e.next[d]; d == f {
				break
			}
		}
		for i, d := range kept {
			n := kept[(i+1)%len(kept)]
			out.next[d], out.prev[n] = n, d
		}
		if len(kept) > 0 {
			out.first[v] = kept[0]
		}
		out.deg[v] = int32(len(kept))
	}
	return out
}

// Restrict returns the embedding induced on the vertices vs (which must be
// closed under adjacency, such as a connected component), with vertex vs[i]
// renumbered i and the rotations kept, and for each new dart the old dart
// it came from.
func (e *Embedding) Restrict(vs []int32) (*Embedding, []int32) {
	local := make(map[int32]int32, len(vs))
	for i, v := range vs {
		local[v] = int32(i)
	}
	out := NewEmbedding(len(vs))
	var oldDart []int32
	newDart := make(map[int32]int32)
	for _, v := range vs {
		f := e.first[v]
		if f < 0 {
			continue
		}
		for d := f; ; {
			if _, ok := newDart[d]; !ok {
				id := int32(len(out.edges))
				a, b := e.Tail(d), e.Head(d)
				out.edges = append(out.edges, [2]int32{local[a], local[b]})
				newDart[d], newDart[d^1] = 2*id, 2*id+1
				oldDart = append(oldDart, d, d^1)
			}
			if d = e.next[d]; d == f {
				break
			}
		}
	}
	out.next = make([]int32, len(oldDart))
	out.prev = make([]int32, len(oldDart))
	for nd, od := range oldDart {
		n := newDart[e.next[od]]
		out.next[nd] = n
		out.prev[n] = int32(nd)
	}
	for i, v := range vs {
		if f := e.first[v]; f >= 0 {
			out.first[i] = newDart[f]
		}
		out.deg[i] = e.deg[v]
	}
	return out, oldDart
}

// FromRotation builds the embedding of the graph with n vertices and the
// given edges in which the edges at each vertex v follow each other
// counter-clockwise in the order around[v] lists them (edge indices; each
// edge at v exactly once). It returns false if around does not list every
// edge at each of its ends exactly once. The result need not be plane
// (see IsPlane).
func FromRotation(n int, edges [][2]int32, around [][]int32) (*Embedding, bool) {
	if len(around) != n {
		return nil, false
	}
	e := NewEmbedding(n)
	e.edges = append([][2]int32(nil), edges...)
	e.next = make([]int32, 2*len(edges))
	e.prev = make([]int32, 2*len(edges))
	placed := make([]bool, 2*len(edges))
	for v, list := range around {
		for i, id := range list {
			if id < 0 || int(id) >= len(edges) {
				return nil, false
			}
			d := dartAt(edges, id, int32(v))
			if d < 0 || placed[d] {
				return nil, false
			}
			placed[d] = true
			nd := dartAt(edges, list[(i+1)%len(list)], int32(v))
			if nd < 0 {
				return nil, false
			}
			e.next[d] = nd
			e.prev[nd] = d
		}
		if len(list) > 0 {
			e.first[v] = dartAt(edges, list[0], int32(v))
		}
		e.deg[v] = int32(len(list))
	}
	for _, p := range placed {
		if !p {
			return nil, false
		}
	}
	return e, true
}

// dartAt returns the dart of edge id leaving v, or -1 if v is not an end.
func dartAt(edges [][2]int32, id, v int32) int32 {
	switch v {
	case edges[id][0]:
		if edges[id][1] == v {
			return -1 // a loop has no single dart at v
		}
		return 2 * id
	case edges[id][1]:
		return 2*id + 1
	}
	return -1
}
