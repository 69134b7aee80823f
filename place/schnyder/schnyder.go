package schnyder

import (
	"errors"

	"github.com/gridwood/gridwood/planarize"
)

// errBadTriangulation reports a broken invariant; it means a bug, not bad
// input, and is returned rather than panicking.
var errBadTriangulation = errors.New("schnyder: internal error: component is not a triangulation")

// Work is the scratch space for Schnyder woods and their coordinates:
// per-vertex arrays shared by all components of a graph, so that one with
// many small components costs O(n) in total.
type Work struct {
	// The peeling state of each vertex sits in one record: the contour
	// moves through the graph in no particular numbering, so a vertex
	// touched costs one cache line instead of seven.
	peel   []peelState
	parent [3][]int32
	step   int32
	size   [3][]int32 // subtree sizes t_i
	depth  [3][]int32 // edges on the path P_i to the root
	sum    [6][]int32 // S_{i,j}: sum of t_i along P_j
}

// peelState is a vertex's part in the canonical ordering.
type peelState struct {
	onContour bool
	chords    int32
	leftDart  int32 // dart from a contour vertex to its left neighbour
	cl, cr    int32 // contour neighbours
	stamp     int32 // the step that uncovered the vertex
	newIndex  int32 // its place among the vertices that step uncovered
}

// NewWork returns scratch space for graphs of up to n vertices.
func NewWork(n int) *Work {
	w := &Work{peel: make([]peelState, n)}
	for i := range 3 {
		w.parent[i] = make([]int32, n)
		w.size[i] = make([]int32, n)
		w.depth[i] = make([]int32, n)
	}
	for i := range w.sum {
		w.sum[i] = make([]int32, n)
	}
	return w
}

// CanonicalOrder computes a canonical ordering (de Fraysseix, Pach and
// Pollack 1990) of one triangulated component whose outer face is the face
// on the left of dart outer, and the Schnyder wood it induces (Schnyder
// 1989). It peels vertices off the top: the current contour is a path from
// a1 to a2, and a vertex may be removed when it has no chord to the contour;
// its interior neighbours then join the contour. A removed vertex v with
// contour neighbours wl (towards a1) and wr (towards a2) gets the outgoing
// edges v->wl in tree 1 and v->wr in tree 2, and each neighbour it uncovers
// gets its outgoing edge of tree 3 towards v. order receives the ordering
// v1 = a1, v2 = a2, ..., vn = a3 and must have the component's size.
func (w *Work) CanonicalOrder(emb *planarize.Embedding, outer int32, order []int32) error {
	f0 := outer
	f1 := emb.FaceNext(f0)
	f2 := emb.FaceNext(f1)
	if emb.FaceNext(f2) != f0 {
		return errBadTriangulation
	}
	a1, a2, a3 := emb.Tail(f0), emb.Tail(f1), emb.Tail(f2)
	nc := len(order)
	for _, v := range []int32{a1, a2, a3} {
		w.peel[v].onContour = true
		w.peel[v].chords = 0
		for i := range 3 {
			w.parent[i][v] = -1
		}
	}
	w.peel[a1].cr, w.peel[a3].cl, w.peel[a3].cr, w.peel[a2].cl = a3, a1, a2, a3
	w.peel[a3].leftDart = f2 // a3 -> a1
	w.peel[a2].leftDart = f1 // a2 -> a3
	candidates := []int32{a3}
	var uncovered []int32
	k := nc - 1
	for len(candidates) > 0 {
		v := candidates[len(candidates)-1]
		candidates = candidates[:len(candidates)-1]
		if !w.peel[v].onContour || w.peel[v].chords != 0 || v == a1 || v == a2 {
			continue
		}
		if k < 2 {
			return errBadTriangulation
		}
		wl, wr := w.peel[v].cl, w.peel[v].cr
		order[k] = v
		k--
		w.peel[v].onContour = false
		if v != a3 {
			w.parent[0][v], w.parent[1][v] = wl, wr
		}
		// Turning clockwise from v->wl sweeps the side of v below the
		// contour: exactly the neighbours not yet on it, then wr.
		w.step++
		uncovered = uncovered[:0]
		prev := wl
		h := emb.Prev(w.peel[v].leftDart)
		for guard := emb.Degree(v); emb.Head(h) != wr; guard-- {
			if guard <= 0 {
				return errBadTriangulation
			}
			u := emb.Head(h)
			if w.peel[u].onContour {
				return errBadTriangulation // v had a chord after all
			}
			w.peel[u].leftDart = emb.FaceNext(h) // u -> prev, across the face v prev u
			for i := range 3 {
				w.parent[i][u] = -1
			}
			w.parent[2][u] = v
			w.peel[u].onContour = true
			w.peel[u].chords = 0
			w.peel[u].stamp = w.step
			w.peel[u].newIndex = int32(len(uncovered))
			w.peel[u].cl, w.peel[prev].cr = prev, u
			uncovered = append(uncovered, u)
			prev = u
			h = emb.Prev(h)
		}
		w.peel[wr].leftDart = emb.FaceNext(h)
		w.peel[wr].cl, w.peel[prev].cr = prev, wr
		if len(uncovered) == 0 {
			if wl != a1 || wr != a2 {
				// The edge wl wr was a chord and is now a contour edge.
				for _, x := range []int32{wl, wr} {
					if w.peel[x].chords--; w.peel[x].chords == 0 {
						candidates = append(candidates, x)
					}
				}
			}
			continue
		}
		for b, u := range uncovered {
			d := emb.First(u)
			for range emb.Degree(u) {
				x := emb.Head(d)
				d = emb.Next(d)
				if !w.peel[x].onContour || x == w.peel[u].cl || x == w.peel[u].cr {
					continue
				}
				if w.peel[x].stamp == w.step && w.peel[x].newIndex > int32(b) {
					continue // counted from x's side
				}
				w.peel[u].chords++
				w.peel[x].chords++
			}
		}
		for _, u := range uncovered {
			if w.peel[u].chords == 0 {
				candidates = append(candidates, u)
			}
		}
	}
	if k != 1 {
		return errBadTriangulation
	}
	order[0], order[1] = a1, a2
	for _, v := range order {
		w.peel[v].onContour = false
	}
	return nil
}

// Barycentric computes Schnyder's weak barycentric representation by vertex
// counts (W. Schnyder, "Embedding planar graphs on the grid", SODA 1990):
// for an inner vertex v, x_i(v) = |R_i(v)| - |P_{i-1}(v)|, where P_j(v) is
// the path of tree j from v to its root and R_i(v) the closed region bounded
// by P_{i+1}(v), P_{i-1}(v) and the outer edge opposite a_i. The region is
// the union of the tree-i subtrees hanging off its two boundary paths, so
// |R_i(v)| = S_{i,i+1}(v) + S_{i,i-1}(v) - t_i(v), with t_i the subtree
// size and S_{i,j}(v) the sum of t_i along P_j(v); each of these is one pass
// over the canonical order, in which tree-3 parents come later and tree-1
// and tree-2 parents earlier. The outer vertices get (n-2, 1, 0),
// (0, n-2, 1) and (1, 0, n-2). The coordinates of every vertex sum to n-1
// and lie in [0, n-2].
func (w *Work) Barycentric(order []int32, coord [][3]int32, index []int32) {
	nc := len(order)
	for _, v := range order {
		for i := range 3 {
			w.size[i][v] = 1
		}
	}
	for _, v := range order { // tree 3: children first
		if p := w.parent[2][v]; p >= 0 {
			w.size[2][p] += w.size[2][v]
		}
	}
	for k := nc - 1; k >= 0; k-- { // trees 1, 2: children first
		v := order[k]
		for i := range 2 {
			if p := w.parent[i][v]; p >= 0 {
				w.size[i][p] += w.size[i][v]
			}
		}
	}
	// Along tree j, sum[2*j+s] accumulates t_i for the two i != j:
	// s = 0 for i = j+1, s = 1 for i = j+2 (mod 3).
	visit := func(v int32, j int) {
		p := w.parent[j][v]
		i0, i1 := (j+1)%3, (j+2)%3
		if p < 0 {
			w.depth[j][v] = 0
			w.sum[2*j][v] = w.size[i0][v]
			w.sum[2*j+1][v] = w.size[i1][v]
			return
		}
		w.depth[j][v] = w.depth[j][p] + 1
		w.sum[2*j][v] = w.sum[2*j][p] + w.size[i0][v]
		w.sum[2*j+1][v] = w.sum[2*j+1][p] + w.size[i1][v]
	}
	for _, v := range order { // trees 1, 2: parents first
		visit(v, 0)
		visit(v, 1)
	}
	for k := nc - 1; k >= 0; k-- { // tree 3: parents first
		visit(order[k], 2)
	}
	for k, v := range order {
		var c [3]int32
		switch k {
		case 0:
			c = [3]int32{int32(nc - 2), 1, 0}
		case 1:
			c = [3]int32{0, int32(nc - 2), 1}
		case nc - 1:
			c = [3]int32{1, 0, int32(nc - 2)}
		default:
			for i := range 3 {
				up, down := (i+1)%3, (i+2)%3 // P_{i+1} and P_{i-1}
				// t_i summed along P_{i+1}: tree j = up, i = j+2.
				alongUp := w.sum[2*up+1][v]
				// t_i summed along P_{i-1}: tree j = down, i = j+1.
				alongDown := w.sum[2*down][v]
				region := alongUp + alongDown - w.size[i][v]
				c[i] = region - (w.depth[down][v] + 1)
			}
		}
		coord[index[v]] = c
	}
}
