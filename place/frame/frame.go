package frame

import (
	"errors"
	"fmt"
)

// MaxCoord bounds every coordinate, half size, margin and label size the
// package takes, so that sums of a few of them stay exact in int64.
const MaxCoord = 1 << 50

// Rect is an axis-parallel rectangle, lower left (X0, Y0) and upper right
// (X1, Y1), in points with y up. A rectangle with X1 < X0 or Y1 < Y0 is
// empty, as the frame of a cluster without nodes is.
type Rect struct{ X0, Y0, X1, Y1 int64 }

// None is the empty rectangle Frames gives a cluster without nodes.
var None = Rect{0, 0, -1, -1}

// Empty reports whether r holds no point.
func (r Rect) Empty() bool { return r.X1 < r.X0 || r.Y1 < r.Y0 }

// flat reports whether r has no interior (empty, or of zero width or
// height): such a frame meets nothing.
func (r Rect) flat() bool { return r.X1 <= r.X0 || r.Y1 <= r.Y0 }

// Clusters is a laminar family of node sets given as a forest: every node
// belongs to its home cluster and to the clusters holding that one.
type Clusters struct {
	// Parent holds, per cluster, the cluster holding it, -1 for one at
	// the top. A parent comes before its children: Parent[c] < c.
	Parent []int32
	// Home holds, per node, its innermost cluster, -1 for a node in no
	// cluster.
	Home []int32
}

// Nodes are node centres and half box sizes.
type Nodes struct {
	X, Y         []int64
	HalfW, HalfH []int64
}

// box returns the box of node v.
func (n Nodes) box(v int) Rect {
	return Rect{n.X[v] - n.HalfW[v], n.Y[v] - n.HalfH[v], n.X[v] + n.HalfW[v], n.Y[v] + n.HalfH[v]}
}

// Label is the room a cluster's label needs inside its frame.
type Label struct {
	W, H int64
	// Bottom puts the label's room at the bottom of the frame instead of
	// the top (DOT's labelloc=b).
	Bottom bool
}

// Input is what Frames needs.
type Input struct {
	Clusters
	Nodes
	// Margin is the room between the members' boxes (and child frames)
	// and the frame, on every side: at least 1, so that every member's
	// box, and every child's frame, lies strictly inside.
	Margin int64
	// Labels holds one entry per cluster, or is nil for none.
	Labels []Label
}

// Frames returns the frame of every cluster: the union of its own nodes'
// boxes and its children's frames, grown by the margin on every side, by
// the label's height on top (or at the bottom), and widened evenly, to
// the right on an odd point, until it is the label's width plus two
// margins wide. A cluster without nodes, nested ones included, gets None.
// Frames nest as the clusters do.
func Frames(in Input) ([]Rect, error) {
	k := len(in.Parent)
	if err := in.check(); err != nil {
		return nil, err
	}
	if in.Margin < 1 || in.Margin > MaxCoord {
		return nil, fmt.Errorf("frame: margin %d: want 1 to %d", in.Margin, int64(MaxCoord))
	}
	if in.Labels != nil {
		if len(in.Labels) != k {
			return nil, fmt.Errorf("frame: %d labels for %d clusters", len(in.Labels), k)
		}
		for c, l := range in.Labels {
			if l.W < 0 || l.H < 0 || l.W > MaxCoord || l.H > MaxCoord {
				return nil, fmt.Errorf("frame: cluster %d: label size %d x %d out of range", c, l.W, l.H)
			}
		}
	}
	out := make([]Rect, k)
	for c := range out {
		out[c] = None
	}
	grow := func(c int32, r Rect) {
		f := &out[c]
		if f.Empty() {
			*f = r
			return
		}
		f.X0, f.Y0 = min(f.X0, r.X0), min(f.Y0, r.Y0)
		f.X1, f.Y1 = max(f.X1, r.X1), max(f.Y1, r.Y1)
	}
	for v, h := range in.Home {
		if h >= 0 {
			grow(h, in.box(v))
		}
	}
	m := in.Margin
	for c := k - 1; c >= 0; c-- {
		f := &out[c]
		if f.Empty() {
			continue
		}
		f.X0, f.Y0, f.X1, f.Y1 = f.X0-m, f.Y0-m, f.X1+m, f.Y1+m
		if in.Labels != nil {
			l := in.Labels[c]
			if l.Bottom {
				f.Y0 -= l.H
			} else {
				f.Y1 += l.H
			}
			if extra := l.W + 2*m - (f.X1 - f.X0); extra > 0 {
				f.X0 -= extra / 2
				f.X1 += extra - extra/2
			}
		}
		if p := in.Parent[c]; p >= 0 {
			grow(p, *f)
		}
	}
	return out, nil
}

// check validates the clusters and the nodes.
func (in Input) check() error {
	if err := in.Clusters.check(); err != nil {
		return err
	}
	return in.Nodes.check(len(in.Home))
}

func (c Clusters) check() error {
	k := len(c.Parent)
	if k > 1<<31-1 {
		return errors.New("frame: too many clusters")
	}
	for i, p := range c.Parent {
		if p < -1 || p >= int32(i) {
			return fmt.Errorf("frame: cluster %d has parent %d; want -1 or an earlier cluster", i, p)
		}
	}
	for v, h := range c.Home {
		if h < -1 || int(h) >= k {
			return fmt.Errorf("frame: node %d has cluster %d of %d", v, h, k)
		}
	}
	return nil
}

func (n Nodes) check(count int) error {
	if len(n.X) != count || len(n.Y) != count || len(n.HalfW) != count || len(n.HalfH) != count {
		return fmt.Errorf("frame: %d nodes with %d x, %d y, %d half widths and %d half heights", count, len(n.X), len(n.Y), len(n.HalfW), len(n.HalfH))
	}
	for v := range count {
		if abs(n.X[v]) > MaxCoord || abs(n.Y[v]) > MaxCoord || n.HalfW[v] < 0 || n.HalfH[v] < 0 || n.HalfW[v] > MaxCoord || n.HalfH[v] > MaxCoord {
			return fmt.Errorf("frame: node %d: centre (%d, %d), half box %d x %d out of range", v, n.X[v], n.Y[v], n.HalfW[v], n.HalfH[v])
		}
	}
	return nil
}

func abs(v int64) int64 {
	if v < 0 {
		return -v
	}
	return v
}

// tree is the forest of a Clusters in preorder, for constant-time
// membership tests.
type tree struct {
	pre, end []int32 // a cluster's subtree is [pre, end) in preorder
	depth    []int32 // clusters holding it, itself excluded
	size     []int64 // nodes belonging to it
}

func newTree(c Clusters) tree {
	k := len(c.Parent)
	t := tree{pre: make([]int32, k), end: make([]int32, k), depth: make([]int32, k), size: make([]int64, k)}
	// Subtree sizes in clusters, then preorder numbers handed out from
	// the top down: parents come first, so one pass each way.
	sub := make([]int32, k)
	for i := k - 1; i >= 0; i-- {
		sub[i]++
		if p := c.Parent[i]; p >= 0 {
			sub[p] += sub[i]
		}
	}
	next := make([]int32, k) // next preorder number for a child of each cluster
	top := int32(0)
	for i, p := range c.Parent {
		if p < 0 {
			t.pre[i] = top
			top += sub[i]
		} else {
			t.pre[i] = next[p]
			t.depth[i] = t.depth[p] + 1
		}
		next[i] = t.pre[i] + 1
		t.end[i] = t.pre[i] + sub[i]
		if p >= 0 {
			next[p] += sub[i]
		}
	}
	for _, h := range c.Home {
		if h >= 0 {
			t.size[h]++
		}
	}
	for i := k - 1; i >= 0; i-- {
		if p := c.Parent[i]; p >= 0 {
			t.size[p] += t.size[i]
		}
	}
	return t
}

// holds reports whether cluster a holds cluster b (a == b included).
func (t tree) holds(a, b int32) bool { return t.pre[a] <= t.pre[b] && t.pre[b] < t.end[a] }

// checkFrames validates frames for Measure and Find: one per cluster;
// every node's box inside its home cluster's frame and meeting its
// interior; every non-empty frame inside its parent's. Frames from Frames
// pass.
func checkFrames(c Clusters, n Nodes, frames []Rect) error {
	if len(frames) != len(c.Parent) {
		return fmt.Errorf("frame: %d frames for %d clusters", len(frames), len(c.Parent))
	}
	for i, f := range frames {
		if !f.Empty() && (abs(f.X0) > MaxCoord || abs(f.Y0) > MaxCoord || abs(f.X1) > MaxCoord || abs(f.Y1) > MaxCoord) {
			return fmt.Errorf("frame: frame %d out of range", i)
		}
		if p := c.Parent[i]; p >= 0 && !f.Empty() && !inside(f, frames[p]) {
			return fmt.Errorf("frame: frame of cluster %d is not inside its parent's", i)
		}
	}
	for v, h := range c.Home {
		if h < 0 {
			continue
		}
		b := n.box(v)
		if f := frames[h]; !inside(b, f) || !meets(b, f) {
			return fmt.Errorf("frame: node %d is not inside the frame of its cluster %d", v, h)
		}
	}
	return nil
}

// inside reports whether a lies in b (closed), a not empty.
func inside(a, b Rect) bool {
	return !b.Empty() && b.X0 <= a.X0 && a.X1 <= b.X1 && b.Y0 <= a.Y0 && a.Y1 <= b.Y1
}

// meets reports whether box a (closed) meets the interior of frame b:
// a0 < b1 and b0 < a1 on both axes, which a box of zero width or height
// passes where it crosses the interior. The same inequalities tell
// whether the interiors of two frames meet, neither of them flat.
func meets(a, b Rect) bool {
	return a.X0 < b.X1 && b.X0 < a.X1 && a.Y0 < b.Y1 && b.Y0 < a.Y1
}
