package frame

import (
	"math"

	"github.com/gridwood/gridwood/place/internal/spacing"
	"github.com/gridwood/gridwood/place/mesh"
)

// SeparateInput is a finished drawing with its clusters: what Separate
// needs to move clusters apart.
type SeparateInput struct {
	Input
	// Edges are the drawing's straight edges, distinct pairs of nodes.
	Edges [][2]int32
	// Gap is the clear space node boxes keep from each other; edges keep
	// spacing.EdgeGap from boxes they pass.
	Gap int64
	// Across says which axis a cluster moves along first: true for x
	// (a drawing that flows top to bottom keeps its flow when clusters
	// move sideways), false for y.
	Across bool
}

// separateRounds bounds the moves Separate makes, separateTries the
// conflicting pairs it tries before each move, and separateLimit the nodes
// of a drawing it works on: each try rebuilds a triangulation and the
// frames of the whole drawing.
const (
	separateRounds = 24
	separateTries  = 8
	separateLimit  = 2000
	// separateWork bounds the tries by their size: each costs about
	// n + m steps (times a logarithm), and all of them together at most
	// this many.
	separateWork = 20_000_000
)

// Separate moves whole clusters, one at a time, by whole translations, so
// that fewer nodes lie in frames of clusters they do not belong to and
// fewer frames overlap. For the conflicts Find lists (an overlap of two
// frames, or a node inside a foreign frame), first to last, it tries
// moving either side (a cluster with its members; for an intruding node,
// its outermost cluster not holding the other, or the node alone) just
// clear of the other along each of the four directions. A move counts
// only when the drawing stays plane (checked exactly, package mesh),
// every box stays clear of the other boxes and edges (the spacing rule's
// own exact test), and the number of intrusions plus overlaps falls; of
// one conflict's moves the one leaving the fewest conflicts wins, then
// one across (Across) over one along, then the one with the shortest
// edges in total. It stops when no conflict is left, when no move helps,
// after separateRounds moves, or when its work bound (separateWork, in
// node and edge steps) runs out, and returns the new positions (copies)
// and the moves made. Drawings of more than separateLimit nodes are
// returned as they are.
func Separate(in SeparateInput) (x, y []int64, moves int, err error) {
	x, y = append([]int64(nil), in.X...), append([]int64(nil), in.Y...)
	n := len(x)
	if n > separateLimit || len(in.Parent) == 0 {
		return x, y, 0, nil
	}
	t := newTree(in.Clusters)
	all := make([]int32, n)
	for v := range all {
		all[v] = int32(v)
	}
	stamp := make([]int32, n)
	conflicts := func(x, y []int64) (Found, []Rect, error) {
		nodes := Nodes{X: x, Y: y, HalfW: in.HalfW, HalfH: in.HalfH}
		frames, err := Frames(Input{Clusters: in.Clusters, Nodes: nodes, Margin: in.Margin, Labels: in.Labels})
		if err != nil {
			return Found{}, nil, err
		}
		f, err := Find(in.Clusters, nodes, frames)
		return f, frames, err
	}
	// members lists the nodes of cluster c, nested clusters' included.
	members := func(c int32) []int32 {
		var vs []int32
		for v, h := range in.Home {
			if t.member(h, c) {
				vs = append(vs, int32(v))
			}
		}
		return vs
	}
	clear := func(x, y []int64) bool {
		fx, fy := make([]float64, n), make([]float64, n)
		for v := range n {
			fx[v], fy[v] = float64(x[v]), float64(y[v])
		}
		if _, err := mesh.New(fx, fy, in.Edges, 0); err != nil {
			return false
		}
		for v := range stamp {
			stamp[v] = -1
		}
		s, checked := spacing.ClearingStretch(all, in.Edges, x, y, in.HalfW, in.HalfH, in.Gap, stamp, spacing.NewMeter(len(in.Edges)), true)
		return checked && s <= 1
	}
	tries := separateWork / (n + len(in.Edges) + 1)
	found, frames, err := conflicts(x, y)
	if err != nil {
		return nil, nil, 0, err
	}
	score := len(found.Intrusions) + len(found.Overlaps)
	// rect is one side of a conflict: cluster c's frame, or for -1-v the
	// box of node v alone.
	rect := func(c int32) Rect {
		if c >= 0 {
			return frames[c]
		}
		return Nodes{X: x, Y: y, HalfW: in.HalfW, HalfH: in.HalfH}.box(int(-1 - c))
	}
	for moves < separateRounds && score > 0 {
		// The pairs in conflict: two clusters, each moved clear of the
		// other's frame (an intruding node's outermost cluster not holding
		// the other, or the node alone when there is none).
		var pairs [][2]int32 // (cluster to move, cluster to clear); -1-v stands for node v alone
		for _, o := range found.Overlaps {
			pairs = append(pairs, [2]int32{o.B, o.A}, [2]int32{o.A, o.B})
		}
		for _, in0 := range found.Intrusions {
			own := in.Home[in0.Node]
			if own >= 0 && t.holds(own, in0.Cluster) {
				own = -1
			}
			for own >= 0 && in.Parent[own] >= 0 && !t.holds(in.Parent[own], in0.Cluster) {
				own = in.Parent[own]
			}
			mover := own
			if own < 0 {
				mover = -1 - in0.Node
			}
			pairs = append(pairs, [2]int32{in0.Cluster, mover}, [2]int32{mover, in0.Cluster})
		}
		if len(pairs) > separateTries {
			pairs = pairs[:separateTries]
		}
		moved := false
		// The two sides of each conflict compete: the fewest conflicts
		// left, then a move across before one along, then the shortest
		// edges in total (the least the drawing is pulled apart).
		for k := 0; k+1 < len(pairs) && !moved; k += 2 {
			bestScore, bestAlong, bestLength := score, true, 0.0
			var bestVs []int32
			var bestShift [2]int64
			var bestFound Found
			var bestFrames []Rect
			for _, p := range pairs[k : k+2] {
				box, other := rect(p[0]), rect(p[1])
				vs := []int32{-1 - p[0]}
				if p[0] >= 0 {
					vs = members(p[0])
				}
				if box.Empty() || other.Empty() {
					continue
				}
				// Just clear of the other, each way.
				for _, d := range [4][2]int64{
					{other.X1 - box.X0 + in.Gap, 0}, {other.X0 - box.X1 - in.Gap, 0},
					{0, other.Y1 - box.Y0 + in.Gap}, {0, other.Y0 - box.Y1 - in.Gap},
				} {
					if tries--; tries < 0 {
						return x, y, moves, nil
					}
					along := (d[0] != 0) != in.Across
					tx, ty := append([]int64(nil), x...), append([]int64(nil), y...)
					for _, v := range vs {
						tx[v] += d[0]
						ty[v] += d[1]
					}
					f, fr, err := conflicts(tx, ty)
					if err != nil {
						return nil, nil, 0, err
					}
					sc := len(f.Intrusions) + len(f.Overlaps)
					if sc > bestScore || (sc == bestScore && (bestVs == nil || along && !bestAlong)) {
						continue
					}
					length := edgeLength(tx, ty, in.Edges)
					if sc == bestScore && along == bestAlong && length >= bestLength {
						continue
					}
					if clear(tx, ty) {
						bestScore, bestAlong, bestLength = sc, along, length
						bestVs, bestShift, bestFound, bestFrames = vs, d, f, fr
					}
				}
			}
			if bestVs == nil {
				continue
			}
			for _, v := range bestVs {
				x[v] += bestShift[0]
				y[v] += bestShift[1]
			}
			found, frames, score = bestFound, bestFrames, bestScore
			moves++
			moved = true
		}
		if !moved {
			break
		}
	}
	return x, y, moves, nil
}

// edgeLength is the total length of the edges drawn at x, y.
func edgeLength(x, y []int64, edges [][2]int32) float64 {
	sum := 0.0
	for _, e := range edges {
		dx, dy := float64(x[e[0]]-x[e[1]]), float64(y[e[0]]-y[e[1]])
		sum += math.Sqrt(float64(dx*dx) + float64(dy*dy))
	}
	return sum
}
