package main

import (
	"fmt"
	"math"
	"slices"
	"strconv"
	"strings"

	"github.com/gridwood/gridwood/dotio"
	"github.com/gridwood/gridwood/dotio/nodesize"
	"github.com/gridwood/gridwood/dotio/preview"
	"github.com/gridwood/gridwood/place"
	"github.com/gridwood/gridwood/place/frame"
)

// frameMargin is the room between a cluster's nodes (and nested frames)
// and its frame, in points (our own choice): below half the gap the
// spacing keeps between node boxes (boxGap), so the frames of two
// clusters whose nodes are kept apart do not overlap by their margins
// alone.
const frameMargin = 8

// clusterInfo is the cluster structure of a graph and its frames in a
// drawing.
type clusterInfo struct {
	set    *dotio.ClusterSet
	tree   frame.Clusters
	nodes  frame.Nodes
	frames []frame.Rect
}

// clusterFrames computes the frames of g's clusters for nodes at (x, y)
// with half boxes hw x hh, all in units of 1/unit point (1 for a layout,
// 10^d for --check): the margin and label sizes are scaled to match.
func clusterFrames(set *dotio.ClusterSet, x, y, hw, hh []int64, unit int64) (*clusterInfo, error) {
	in := frameInput(set, x, y, hw, hh, unit)
	ci := &clusterInfo{set: set, tree: in.Clusters, nodes: in.Nodes}
	frames, err := frame.Frames(in)
	if err != nil {
		return nil, err
	}
	ci.frames = frames
	return ci, nil
}

// frameInput is what package frame needs to frame set's clusters round
// nodes at (x, y) with half boxes hw x hh, in units of 1/unit point.
// Labels are sized as the preview draws them (nodesize), up to the
// largest box side.
func frameInput(set *dotio.ClusterSet, x, y, hw, hh []int64, unit int64) frame.Input {
	in := frame.Input{Nodes: frame.Nodes{X: x, Y: y, HalfW: hw, HalfH: hh}, Margin: frameMargin * unit}
	in.Home = set.Home
	in.Parent = make([]int32, len(set.Clusters))
	in.Labels = make([]frame.Label, len(set.Clusters))
	for c, cl := range set.Clusters {
		in.Parent[c] = int32(cl.Parent)
		if !cl.LabelSet {
			continue
		}
		l := nodesize.Layout(cl.Label, cl.LabelHTML, nodesize.FontSize(cl.FontSize, cl.FontSize != ""), nodesize.Escapes{G: cl.Name})
		if l.Empty() {
			continue
		}
		side := func(v float64) int64 { return int64(math.Ceil(min(v, maxBoxSide))) * unit }
		in.Labels[c] = frame.Label{W: side(l.W), H: side(l.H), Bottom: strings.EqualFold(strings.TrimSpace(cl.LabelLoc), "b")}
	}
	return in
}

// separateClusters moves whole clusters of a readable drawing apart where
// their frames overlap or hold foreign nodes (frame.Separate), across x
// first unless a digraph flows along x, and writes the new positions into
// sp.
func separateClusters(set *dotio.ClusterSet, sp *place.Placed, boxes place.Boxes, kept [][2]int32, alongX bool) error {
	in := frame.SeparateInput{Input: frameInput(set, sp.X, sp.Y, boxes.HalfW, boxes.HalfH, 1), Edges: kept, Gap: boxes.Gap, Across: !alongX}
	x, y, moves, err := frame.Separate(in)
	if err != nil || moves == 0 {
		return err
	}
	// Back to the origin, as the spacing stage leaves a drawing.
	minX, minY, maxX, maxY := int64(math.MaxInt64), int64(math.MaxInt64), int64(math.MinInt64), int64(math.MinInt64)
	for v := range x {
		minX, minY = min(minX, x[v]-boxes.HalfW[v]), min(minY, y[v]-boxes.HalfH[v])
		maxX, maxY = max(maxX, x[v]+boxes.HalfW[v]), max(maxY, y[v]+boxes.HalfH[v])
	}
	for v := range x {
		sp.X[v], sp.Y[v] = x[v]-minX, y[v]-minY
	}
	sp.Width, sp.Height = maxX-minX, maxY-minY
	return nil
}

// layoutFrames frames the clusters of a laid-out graph and writes their
// boxes into lay: positions move so that the drawing, frames included,
// starts at 0,0 (by whole steps of step points when step > 0, as under
// --unit), and the graph's bb grows to hold every frame.
func layoutFrames(set *dotio.ClusterSet, lay *dotio.Layout, boxes place.Boxes, step int64) (*clusterInfo, error) {
	ci, err := clusterFrames(set, lay.X, lay.Y, boxes.HalfW, boxes.HalfH, 1)
	if err != nil {
		return nil, err
	}
	bb := lay.BB
	for _, f := range ci.frames {
		if f.Empty() {
			continue
		}
		bb = [4]int64{min(bb[0], f.X0), min(bb[1], f.Y0), max(bb[2], f.X1), max(bb[3], f.Y1)}
	}
	dx, dy := -bb[0], -bb[1] // bb[0], bb[1] <= 0: lay.BB starts at 0,0
	if step > 0 {
		dx, dy = (dx+step-1)/step*step, (dy+step-1)/step*step
	}
	for v := range lay.X {
		lay.X[v] += dx
		lay.Y[v] += dy
	}
	lay.BB = [4]int64{0, 0, bb[2] + dx, bb[3] + dy}
	lay.ClusterBB = make([][4]int64, len(ci.frames))
	for c, f := range ci.frames {
		if f.Empty() {
			lay.ClusterBB[c] = dotio.NoBB
			continue
		}
		f.X0, f.Y0, f.X1, f.Y1 = f.X0+dx, f.Y0+dy, f.X1+dx, f.Y1+dy
		ci.frames[c] = f
		lay.ClusterBB[c] = [4]int64{f.X0, f.Y0, f.X1, f.Y1}
	}
	return ci, nil
}

// previewFrames gives the preview the frames of a graph's clusters,
// parents before children (so a child is drawn over its parent), with
// the attributes that say how a frame looks. A graph without clusters
// gets an empty, non-nil list: frames are drawn, there are none.
func previewFrames(ci *clusterInfo) []preview.Frame {
	out := []preview.Frame{}
	if ci == nil {
		return out
	}
	for c, cl := range ci.set.Clusters {
		f := ci.frames[c]
		if f.Empty() {
			continue
		}
		out = append(out, preview.Frame{Name: cl.Name, X0: float64(f.X0), Y0: float64(f.Y0), X1: float64(f.X1), Y1: float64(f.Y1), Attrs: cl.Attrs})
	}
	return out
}

// warnClusters names, one line per graph at the first instance, the
// nodes mentioned in two clusters neither of which holds the other (the
// first placement is kept) and the clusters without nodes (drawn without
// a frame).
func warnClusters(note func(format string, args ...any), name string, g *dotio.Graph, gi int, set *dotio.ClusterSet) {
	if k := len(set.Conflicts); k > 0 {
		cf := set.Conflicts[0]
		n := g.Nodes[cf.Node]
		kept, dropped := set.Clusters[cf.Kept], set.Clusters[cf.Dropped]
		more := ""
		if k > 1 {
			more = fmt.Sprintf(" (and %d more such in %s)", k-1, g.Describe(gi))
		}
		note("gridwood: %s\n", positioned(name, dropped.Line, dropped.Col, "node %s is in cluster %s (line %d) and in cluster %s, neither inside the other; it stays in the first%s",
			strconv.Quote(n.Name), strconv.Quote(kept.Name), kept.Line, strconv.Quote(dropped.Name), more))
	}
	empty, first := 0, -1
	for c := range set.Clusters {
		if set.Size(c) == 0 {
			if empty == 0 {
				first = c
			}
			empty++
		}
	}
	if empty > 0 {
		cl := set.Clusters[first]
		more := ""
		if empty > 1 {
			more = fmt.Sprintf(" (and %d more in %s)", empty-1, g.Describe(gi))
		}
		note("gridwood: %s\n", positioned(name, cl.Line, cl.Col, "cluster %s has no nodes and gets no frame%s", strconv.Quote(cl.Name), more))
	}
}

// clusterChains lists, per node, the clusters of set it lies in,
// outermost first, for the readable stage to gather
// (place.ReadableOptions.Groups); nil for a graph without clusters.
func clusterChains(set *dotio.ClusterSet) [][]int32 {
	if len(set.Clusters) == 0 {
		return nil
	}
	chains := make([][]int32, len(set.Home))
	for v, h := range set.Home {
		var chain []int32
		for c := int(h); c >= 0; c = set.Clusters[c].Parent {
			chain = append(chain, int32(c))
		}
		slices.Reverse(chain)
		chains[v] = chain
	}
	return chains
}
