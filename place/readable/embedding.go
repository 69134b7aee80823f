package readable

import (
	"cmp"
	"slices"

	"github.com/gridwood/gridwood/internal/disjoint"
	"github.com/gridwood/gridwood/internal/exact"
	"github.com/gridwood/gridwood/place/mesh"
	"github.com/gridwood/gridwood/planarize"
)

// Follow returns a plane embedding of the planar graph with the given
// edges that agrees with the drawing x, y wherever the drawing is plane,
// and the vertices of the face that should be outer: the face holding the
// most corners of the drawing's convex hull.
//
// The drawing's edges are forced into a triangulation of its points
// shortest first, leaving out each edge that would cross one already in
// (mesh.Greedy); around every vertex the edges kept follow each other as
// drawn. Each edge left out is then added, again shortest first, into a
// face its two ends share, at the corners where its drawn direction
// points, or between two components anywhere. ok is false when some edge
// left out has no face to go into: the kept part's embedding does not
// extend to the whole graph, and the caller should embed it otherwise.
func Follow(x, y []float64, edges [][2]int32) (emb *planarize.Embedding, outer []int32, ok bool) {
	sorted := shortestFirst(x, y, edges)
	doubtful := make([]bool, len(sorted))
	first := make([]bool, len(sorted))
	for try := 0; try < followTries; try++ {
		emb, failed, ok := followOnce(x, y, sorted, doubtful, first)
		if !ok {
			return nil, nil, false
		}
		if len(failed) == 0 {
			return emb, OuterFace(emb, x, y), true
		}
		if len(failed) > followMaxFailed {
			// Folded all over: no embedding near the drawing is worth the
			// search (each failed edge costs a pass over the edges).
			return nil, nil, false
		}
		// The edges drawn crossing an edge that found no face are what
		// boxed it out: next time that edge goes in first, and they are
		// left out of the drawing's part and added last.
		added := 0
		for _, f := range failed {
			if !first[f] {
				first[f] = true
				added++
			}
			a, b := sorted[f][0], sorted[f][1]
			for i, e := range sorted {
				if !doubtful[i] && !first[i] && segmentsCross(x, y, a, b, e[0], e[1]) {
					doubtful[i] = true
					added++
				}
			}
		}
		if added == 0 {
			return nil, nil, false
		}
	}
	return nil, nil, false
}

// followTries bounds Follow's attempts, and followMaxFailed the edges
// that may find no face in one.
const (
	followTries     = 4
	followMaxFailed = 32
)

// followOnce is one attempt of Follow: the edges not marked doubtful are
// forced in shortest first as far as they cross nothing, the rest added
// combinatorially, those marked first before the others and the doubtful
// ones last; it returns the embedding and the indices (in sorted) of the
// edges that found no face.
func followOnce(x, y []float64, sorted [][2]int32, doubtful, first []bool) (*planarize.Embedding, []int, bool) {
	n := len(x)
	var tryEdges [][2]int32
	var tryIndex []int
	for i, e := range sorted {
		if !doubtful[i] && !first[i] {
			tryEdges = append(tryEdges, e)
			tryIndex = append(tryIndex, i)
		}
	}
	m, keptTry, err := mesh.Greedy(x, y, tryEdges, 0)
	if err != nil {
		return nil, nil, false
	}
	kept := make([]bool, len(sorted))
	for k, i := range tryIndex {
		kept[i] = keptTry[k]
	}
	// The kept edges, numbered in the order they were forced in, and the
	// rotation the drawing gives them.
	var keptEdges [][2]int32
	id := make(map[[2]int32]int32, len(sorted))
	for i, e := range sorted {
		if kept[i] {
			id[[2]int32{min(e[0], e[1]), max(e[0], e[1])}] = int32(len(keptEdges))
			keptEdges = append(keptEdges, e)
		}
	}
	around := make([][]int32, n)
	for v := range int32(n) {
		for _, w := range m.Around(v) {
			around[v] = append(around[v], id[[2]int32{min(v, w), max(v, w)}])
		}
	}
	emb, ok := planarize.FromRotation(n, keptEdges, around)
	if !ok || !emb.IsPlane() {
		return nil, nil, false
	}
	comp := disjoint.New(n)
	for _, e := range keptEdges {
		comp.Union(e[0], e[1])
	}
	var failed []int
	for pass := range 3 {
		for i, e := range sorted {
			// Pass 0: the edges marked first; 1: the other edges left out;
			// 2: the doubtful ones.
			if kept[i] || (pass == 0) != first[i] || (pass == 2) != (doubtful[i] && !first[i]) {
				continue
			}
			if !addFollowing(emb, comp, x, y, e[0], e[1]) {
				failed = append(failed, i)
			}
		}
	}
	return emb, failed, emb.IsPlane()
}

// segmentsCross reports whether the drawn edges a-b and c-d meet other
// than at a shared end (exact orientation tests; touching counts).
func segmentsCross(x, y []float64, a, b, c, d int32) bool {
	if a == c || a == d || b == c || b == d {
		return false
	}
	o := func(p, q, r int32) int { return exact.Orient(x[p], y[p], x[q], y[q], x[r], y[r]) }
	o1, o2, o3, o4 := o(a, b, c), o(a, b, d), o(c, d, a), o(c, d, b)
	if o1*o2 > 0 || o3*o4 > 0 {
		return false
	}
	if o1 == 0 && o2 == 0 {
		// Collinear: they meet if their extents along the line overlap.
		lo := func(p, q int32) (float64, float64) {
			if x[p] != x[q] {
				return min(x[p], x[q]), max(x[p], x[q])
			}
			return min(y[p], y[q]), max(y[p], y[q])
		}
		if x[a] == x[b] && x[c] == x[d] {
			l1, h1 := min(y[a], y[b]), max(y[a], y[b])
			l2, h2 := min(y[c], y[d]), max(y[c], y[d])
			return l1 <= h2 && l2 <= h1
		}
		l1, h1 := lo(a, b)
		l2, h2 := lo(c, d)
		return l1 <= h2 && l2 <= h1
	}
	return true
}

// addFollowing adds edge u-v to the embedding where the drawing points it:
// at u after the dart whose counter-clockwise sector holds the direction
// to v, likewise at v, provided those two corners lie on one face (or u
// and v lie in different components). Failing that, into any face the two
// share. It reports false if they share none.
func addFollowing(emb *planarize.Embedding, comp *disjoint.Sets, x, y []float64, u, v int32) bool {
	a, b := sectorDart(emb, x, y, u, v), sectorDart(emb, x, y, v, u)
	if comp.Find(u) != comp.Find(v) {
		emb.AddEdge(a, b, u, v)
		comp.Union(u, v)
		return true
	}
	if a >= 0 && b >= 0 && onFace(emb, a, b) {
		emb.AddEdge(a, b, u, v)
		return true
	}
	// Any face the two share: walk the faces at u.
	start := emb.First(u)
	for d := start; d >= 0; {
		for f := emb.FaceNext(d); f != d; f = emb.FaceNext(f) {
			if emb.Tail(f) == v {
				emb.AddEdge(d, f, u, v)
				return true
			}
		}
		if d = emb.Next(d); d == start {
			break
		}
	}
	return false
}

// onFace reports whether darts a and b have the same face on their left.
func onFace(emb *planarize.Embedding, a, b int32) bool {
	for f := emb.FaceNext(a); ; f = emb.FaceNext(f) {
		if f == b {
			return true
		}
		if f == a {
			return false
		}
	}
}

// sectorDart returns the dart d at u such that the direction from u to v
// in the drawing lies counter-clockwise from d and before Next(d); -1 if u
// has no edges.
func sectorDart(emb *planarize.Embedding, x, y []float64, u, v int32) int32 {
	start := emb.First(u)
	if start < 0 {
		return -1
	}
	if emb.Next(start) == start {
		return start
	}
	d := start
	for {
		nd := emb.Next(d)
		if turnsBefore(x, y, u, emb.Head(d), v, emb.Head(nd)) {
			return d
		}
		if d = nd; d == start {
			return start
		}
	}
}

// turnsBefore reports whether, turning counter-clockwise about u from the
// direction of a, the direction of w comes strictly before that of b (a
// direction equal to a's counts as a full turn), decided exactly.
func turnsBefore(x, y []float64, u, a, w, b int32) bool {
	half := func(p int32) int {
		o := exact.Orient(x[u], y[u], x[a], y[a], x[p], y[p])
		if o > 0 {
			return 0
		}
		if o == 0 && float64((x[p]-x[u])*(x[a]-x[u]))+float64((y[p]-y[u])*(y[a]-y[u])) < 0 {
			return 0 // exactly opposite a: half a turn
		}
		return 1
	}
	hw, hb := half(w), half(b)
	if hw != hb {
		return hw < hb
	}
	if exact.Orient(x[u], y[u], x[a], y[a], x[w], y[w]) == 0 && half(w) == 1 {
		return false // w along a: a full turn, never before b
	}
	return exact.Orient(x[u], y[u], x[w], y[w], x[b], y[b]) > 0
}

// OuterFace returns the distinct vertices of the face of the embedding
// with the most vertices on the convex hull of the drawing x, y (ties: the
// longer face, then the first found): the face to put outside so that a
// drawing of the embedding can look like x, y.
func OuterFace(emb *planarize.Embedding, x, y []float64) []int32 {
	onHull := hull(x, y)
	seen := make([]bool, 2*emb.M())
	stamp := make([]int32, emb.N())
	var best []int32
	bestCount, bestLen := -1, -1
	var face []int32
	for d0 := range 2 * emb.M() {
		if seen[d0] {
			continue
		}
		face = face[:0]
		count, darts := 0, 0
		for d := int32(d0); !seen[d]; d = emb.FaceNext(d) {
			seen[d] = true
			darts++
			v := emb.Tail(d)
			if stamp[v] == int32(d0)+1 {
				continue
			}
			stamp[v] = int32(d0) + 1
			face = append(face, v)
			if onHull[v] {
				count++
			}
		}
		if count > bestCount || (count == bestCount && darts > bestLen) {
			best = append(best[:0], face...)
			bestCount, bestLen = count, darts
		}
	}
	return best
}

// outerDart returns a dart of the face OuterFace chooses (-1 if the
// embedding has no edges).
func outerDart(emb *planarize.Embedding, x, y []float64) int32 {
	onHull := hull(x, y)
	seen := make([]bool, 2*emb.M())
	stamp := make([]int32, emb.N())
	best, bestCount, bestLen := int32(-1), -1, -1
	for d0 := range int32(2 * emb.M()) {
		if seen[d0] {
			continue
		}
		count, darts := 0, 0
		for d := d0; !seen[d]; d = emb.FaceNext(d) {
			seen[d] = true
			darts++
			if v := emb.Tail(d); stamp[v] != d0+1 {
				stamp[v] = d0 + 1
				if onHull[v] {
					count++
				}
			}
		}
		if count > bestCount || (count == bestCount && darts > bestLen) {
			best, bestCount, bestLen = d0, count, darts
		}
	}
	return best
}

// hull marks the vertices on the convex hull of the points (corners
// only), by Andrew's monotone chain with exact orientation tests.
func hull(x, y []float64) []bool {
	n := len(x)
	idx := make([]int32, n)
	for i := range idx {
		idx[i] = int32(i)
	}
	slices.SortFunc(idx, func(a, b int32) int {
		return cmp.Or(cmp.Compare(x[a], x[b]), cmp.Compare(y[a], y[b]), cmp.Compare(a, b))
	})
	on := make([]bool, n)
	chain := make([]int32, 0, n)
	for pass := 0; pass < 2; pass++ {
		chain = chain[:0]
		for _, p := range idx {
			for len(chain) >= 2 {
				a, b := chain[len(chain)-2], chain[len(chain)-1]
				if exact.Orient(x[a], y[a], x[b], y[b], x[p], y[p]) > 0 {
					break
				}
				chain = chain[:len(chain)-1]
			}
			chain = append(chain, p)
		}
		for _, p := range chain {
			on[p] = true
		}
		slices.Reverse(idx)
	}
	return on
}
