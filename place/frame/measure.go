package frame

import (
	"slices"
	"sort"
)

// Counts are the measures of a drawing's clusters.
type Counts struct {
	// Intrusions counts the pairs of a node and a cluster it does not
	// belong to whose frame it lies in; PerCluster splits them by
	// cluster.
	Intrusions int64
	PerCluster []int64
	// Overlaps counts the pairs of clusters, neither inside the other,
	// whose frames overlap.
	Overlaps int64
}

// Measure counts the intrusions and frame overlaps of a drawing, without
// listing them (see the package documentation for what counts and what it
// costs). The frames must nest as the clusters do and hold their own
// nodes' boxes, meeting their interiors, as those of Frames do; Measure
// checks that first and returns an error otherwise.
func Measure(c Clusters, n Nodes, frames []Rect) (Counts, error) {
	if err := c.check(); err != nil {
		return Counts{}, err
	}
	if err := n.check(len(c.Home)); err != nil {
		return Counts{}, err
	}
	if err := checkFrames(c, n, frames); err != nil {
		return Counts{}, err
	}
	t := newTree(c)
	k := len(frames)
	// The queries: frames with an interior; the others meet nothing.
	var qs []Rect
	var qc []int32
	for i, f := range frames {
		if !f.flat() {
			qs = append(qs, f)
			qc = append(qc, int32(i))
		}
	}
	boxes := make([]Rect, len(c.Home))
	for v := range boxes {
		boxes[v] = n.box(v)
	}
	res := Counts{PerCluster: make([]int64, k)}
	// Every member meets its frame (checked above, and frames nest), so
	// the intruders are the boxes meeting a frame less its members.
	for j, m := range meetCounts(boxes, qs) {
		cl := qc[j]
		res.PerCluster[cl] = m - t.size[cl]
		res.Intrusions += res.PerCluster[cl]
	}
	// Frame pairs: all meeting ordered pairs, less each frame with
	// itself, halved, less the nested pairs (a frame with an interior
	// meets every frame holding it).
	var pairs, nested int64
	for _, m := range meetCounts(qs, qs) {
		pairs += m
	}
	for _, cl := range qc {
		nested += int64(t.depth[cl])
	}
	res.Overlaps = (pairs-int64(len(qs)))/2 - nested
	return res, nil
}

// meetCounts returns, for each query (none of them flat), how many of the
// objects meet it: o.X0 < q.X1, q.X0 < o.X1, o.Y0 < q.Y1, q.Y0 < o.Y1. It
// counts the objects that fail a side (A: o.X0 >= q.X1, B: o.X1 <= q.X0,
// C: o.Y0 >= q.Y1, D: o.Y1 <= q.Y0) by inclusion and exclusion: A and B
// exclude each other for a query of positive width, as C and D do, so
// only the four pairs AC, AD, BC, BD come back in, each a dominance
// count.
func meetCounts(objs, qs []Rect) []int64 {
	nq := len(qs)
	px, py := make([]int64, len(objs)), make([]int64, len(objs))
	qx, qy := make([]int64, nq), make([]int64, nq)
	count := func(oxf, oyf func(Rect) int64, qxf, qyf func(Rect) int64) []int64 {
		for i, o := range objs {
			px[i], py[i] = oxf(o), oyf(o)
		}
		for j, q := range qs {
			qx[j], qy[j] = qxf(q), qyf(q)
		}
		return dominance(px, py, qx, qy)
	}
	zero := func(Rect) int64 { return 0 }
	ox0 := func(r Rect) int64 { return r.X0 }
	oy0 := func(r Rect) int64 { return r.Y0 }
	negX1 := func(r Rect) int64 { return -r.X1 }
	negY1 := func(r Rect) int64 { return -r.Y1 }
	qX1 := func(r Rect) int64 { return r.X1 }
	qY1 := func(r Rect) int64 { return r.Y1 }
	negX0 := func(r Rect) int64 { return -r.X0 }
	negY0 := func(r Rect) int64 { return -r.Y0 }
	out := make([]int64, nq)
	for j := range out {
		out[j] = int64(len(objs))
	}
	for _, term := range []struct {
		sign             int64
		ox, oy, qxf, qyf func(Rect) int64
	}{
		{-1, ox0, zero, qX1, zero},       // A
		{-1, negX1, zero, negX0, zero},   // B
		{-1, oy0, zero, qY1, zero},       // C
		{-1, negY1, zero, negY0, zero},   // D
		{+1, ox0, oy0, qX1, qY1},         // AC
		{+1, ox0, negY1, qX1, negY0},     // AD
		{+1, negX1, oy0, negX0, qY1},     // BC
		{+1, negX1, negY1, negX0, negY0}, // BD
	} {
		for j, m := range count(term.ox, term.oy, term.qxf, term.qyf) {
			out[j] += term.sign * m
		}
	}
	return out
}

// dominance returns, for each query j, the number of points i with
// px[i] >= qx[j] and py[i] >= qy[j]: queries by falling qx, points added
// to a binary indexed tree over the ranks of py as qx passes them.
func dominance(px, py, qx, qy []int64) []int64 {
	np, nq := len(px), len(qx)
	ys := slices.Clone(py)
	slices.Sort(ys)
	ys = slices.Compact(ys)
	byX := make([]int32, np)
	for i := range byX {
		byX[i] = int32(i)
	}
	slices.SortFunc(byX, func(a, b int32) int { return cmpDesc(px[a], px[b]) })
	qord := make([]int32, nq)
	for j := range qord {
		qord[j] = int32(j)
	}
	slices.SortFunc(qord, func(a, b int32) int { return cmpDesc(qx[a], qx[b]) })
	tree := make([]int64, len(ys)+1) // Fenwick, 1-based
	out := make([]int64, nq)
	added := 0
	for _, j := range qord {
		for added < np && px[byX[added]] >= qx[j] {
			r := sort.Search(len(ys), func(k int) bool { return ys[k] >= py[byX[added]] })
			for r++; r < len(tree); r += r & -r {
				tree[r]++
			}
			added++
		}
		// Points added with py below qy: a prefix of the ranks.
		r := sort.Search(len(ys), func(k int) bool { return ys[k] >= qy[j] })
		below := int64(0)
		for ; r > 0; r -= r & -r {
			below += tree[r]
		}
		out[j] = int64(added) - below
	}
	return out
}

func cmpDesc(a, b int64) int {
	switch {
	case a > b:
		return -1
	case a < b:
		return 1
	}
	return 0
}
