package frame

import (
	"cmp"
	"math"
	"slices"
	"sort"
)

// Intrusion is a node lying in the frame of a cluster it does not belong
// to.
type Intrusion struct{ Node, Cluster int32 }

// Overlap is a pair of clusters, neither inside the other, whose frames
// overlap; A < B.
type Overlap struct{ A, B int32 }

// Found lists the intrusions (by cluster, then node) and the frame
// overlaps (by A, then B) of a drawing.
type Found struct {
	Intrusions []Intrusion
	Overlaps   []Overlap
}

// Find lists the intrusions and frame overlaps Measure counts, with the
// same requirements on the frames (see the package documentation for
// what it costs).
func Find(c Clusters, n Nodes, frames []Rect) (Found, error) {
	if err := c.check(); err != nil {
		return Found{}, err
	}
	if err := n.check(len(c.Home)); err != nil {
		return Found{}, err
	}
	if err := checkFrames(c, n, frames); err != nil {
		return Found{}, err
	}
	t := newTree(c)
	nn := len(c.Home)
	// Objects: node boxes 0..nn-1, then the frames with an interior.
	rects := make([]Rect, 0, nn+len(frames))
	for v := range nn {
		rects = append(rects, n.box(v))
	}
	var cl []int32 // cluster of each frame object
	for i, f := range frames {
		if !f.flat() {
			rects = append(rects, f)
			cl = append(cl, int32(i))
		}
	}
	isFrame := func(o int32) bool { return int(o) >= nn }
	enter := make([]int32, len(rects))
	for i := range enter {
		enter[i] = int32(i)
	}
	leave := slices.Clone(enter)
	slices.SortFunc(enter, func(a, b int32) int { return cmp.Or(cmp.Compare(rects[a].X0, rects[b].X0), cmp.Compare(a, b)) })
	slices.SortFunc(leave, func(a, b int32) int { return cmp.Or(cmp.Compare(rects[a].X1, rects[b].X1), cmp.Compare(a, b)) })
	nodes := newActiveSet(rects[:nn])
	boxes := newActiveSet(rects[nn:])
	var out Found
	// The sweep meets each pair when the later of the two to enter does:
	// the earlier one is still on the line exactly when its X1 is beyond
	// the later one's X0, which the pair needs anyway.
	li := 0
	for _, o := range enter {
		r := rects[o]
		for ; li < len(leave) && rects[leave[li]].X1 <= r.X0; li++ {
			if l := leave[li]; isFrame(l) {
				boxes.remove(l - int32(nn))
			} else {
				nodes.remove(l)
			}
		}
		if !isFrame(o) {
			v := o
			boxes.query(r.Y0, r.Y1, func(f int32) {
				if ci := cl[f]; meets(r, rects[nn+int(f)]) && !t.member(c.Home[v], ci) {
					out.Intrusions = append(out.Intrusions, Intrusion{v, ci})
				}
			})
			nodes.insert(v)
			continue
		}
		fi := o - int32(nn)
		ci := cl[fi]
		nodes.query(r.Y0, r.Y1, func(v int32) {
			if meets(rects[v], r) && !t.member(c.Home[v], ci) {
				out.Intrusions = append(out.Intrusions, Intrusion{v, ci})
			}
		})
		boxes.query(r.Y0, r.Y1, func(f int32) {
			if cj := cl[f]; meets(rects[nn+int(f)], r) && !t.holds(ci, cj) && !t.holds(cj, ci) {
				out.Overlaps = append(out.Overlaps, Overlap{min(ci, cj), max(ci, cj)})
			}
		})
		boxes.insert(fi)
	}
	slices.SortFunc(out.Intrusions, func(a, b Intrusion) int {
		return cmp.Or(cmp.Compare(a.Cluster, b.Cluster), cmp.Compare(a.Node, b.Node))
	})
	slices.SortFunc(out.Overlaps, func(a, b Overlap) int { return cmp.Or(cmp.Compare(a.A, b.A), cmp.Compare(a.B, b.B)) })
	return out, nil
}

// member reports whether a node of home cluster h belongs to cluster c.
func (t tree) member(h, c int32) bool { return h >= 0 && t.holds(c, h) }

// activeSet holds the rectangles the sweep line crosses, and reports
// those whose y range meets a query's. Each rectangle has a fixed rank by
// its lower y; a segment tree over the ranks keeps the largest upper y of
// the active rectangles below each node, so a query descends only into
// ranks whose lower y is below the query's top and whose largest upper y
// is above its bottom.
type activeSet struct {
	y0   []int64 // lower y by rank, increasing
	y1   []int64 // upper y by rank
	id   []int32 // rectangle by rank
	rank []int32 // rank by rectangle
	top  []int64 // segment tree, leaves from len(top)/2
	half int
}

const inactive = math.MinInt64

func newActiveSet(rs []Rect) *activeSet {
	n := len(rs)
	s := &activeSet{y0: make([]int64, n), y1: make([]int64, n), id: make([]int32, n), rank: make([]int32, n)}
	for i := range s.id {
		s.id[i] = int32(i)
	}
	slices.SortFunc(s.id, func(a, b int32) int { return cmp.Or(cmp.Compare(rs[a].Y0, rs[b].Y0), cmp.Compare(a, b)) })
	for r, i := range s.id {
		s.rank[i] = int32(r)
		s.y0[r], s.y1[r] = rs[i].Y0, rs[i].Y1
	}
	s.half = 1
	for s.half < n {
		s.half *= 2
	}
	s.top = make([]int64, 2*s.half)
	for i := range s.top {
		s.top[i] = inactive
	}
	return s
}

func (s *activeSet) set(i int32, v int64) {
	k := s.half + int(s.rank[i])
	s.top[k] = v
	for k /= 2; k >= 1; k /= 2 {
		s.top[k] = max(s.top[2*k], s.top[2*k+1])
	}
}

func (s *activeSet) insert(i int32) { s.set(i, s.y1[s.rank[i]]) }
func (s *activeSet) remove(i int32) { s.set(i, inactive) }

// query calls visit for every active rectangle with y0 < q1 and y1 > q0.
func (s *activeSet) query(q0, q1 int64, visit func(int32)) {
	end := sort.Search(len(s.y0), func(r int) bool { return s.y0[r] >= q1 })
	var walk func(k, lo, hi int)
	walk = func(k, lo, hi int) {
		if lo >= end || s.top[k] <= q0 {
			return
		}
		if hi-lo == 1 {
			visit(s.id[lo])
			return
		}
		mid := (lo + hi) / 2
		walk(2*k, lo, mid)
		walk(2*k+1, mid, hi)
	}
	if len(s.y0) > 0 {
		walk(1, 0, s.half)
	}
}
