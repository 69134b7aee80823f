package main

import (
	"github.com/gridwood/gridwood/dotio"
	"github.com/gridwood/gridwood/place"
	"github.com/gridwood/gridwood/place/flow"
	"github.com/gridwood/gridwood/place/geomcheck"
)

// flowDirection reads a digraph's rankdir; ok is false for a value that
// is not TB, LR, BT or RL (taken as TB).
func flowDirection(g *dotio.Graph) (d flow.Direction, value string, ok bool) {
	for _, a := range g.GraphAttrs() {
		if a.Name() == "rankdir" {
			value, _ = a.Text()
		}
	}
	d, ok = flow.ParseRankdir(value)
	return d, value, ok
}

// flowCounts counts a digraph's kept edges (as written: repeats and
// loops included) along its flow, against it and on directed cycles of
// the kept edges.
func flowCounts(g *dotio.Graph, removed []bool, x, y []int64) (flow.Counts, error) {
	kept := keptAsWritten(g, removed)
	onCycle, err := flow.OnCycles(len(g.Nodes), kept)
	if err != nil {
		return flow.Counts{}, err
	}
	d, _, _ := flowDirection(g)
	return flow.Count(kept, onCycle, x, y, d)
}

// edgeClear is the room, in points, the spacing keeps between an edge
// and the box of a node it passes (place/doc.go, the spacing rule, step 2).
const edgeClear = 4

// keptAsWritten lists a graph's kept edges as written (repeats and loops
// included), as the flow counts take them.
func keptAsWritten(g *dotio.Graph, removed []bool) [][2]int32 {
	var kept [][2]int32
	for i, e := range g.Edges {
		if removed == nil || !removed[i] {
			kept = append(kept, [2]int32{e.From, e.To})
		}
	}
	return kept
}

// orientFlow turns a digraph's finished drawing (sp, in place) by the
// symmetry that points the most kept edges not on a directed cycle along
// its rankdir (flow.Orient): a mirror image, or, when the drawing stays
// as clear as the spacing made it, a quarter turn or a reflection in a
// diagonal. pairs are the kept node pairs (loops and repeats merged),
// which the clearance check draws. The drawing then starts at 0,0 again:
// a mirror image keeps its bounding box, a swap of the axes gets the
// transposed box grown to hold every node box.
func orientFlow(g *dotio.Graph, removed []bool, pairs [][2]int32, sp *place.Placed, boxes place.Boxes) (flow.Symmetry, error) {
	kept := keptAsWritten(g, removed)
	onCycle, err := flow.OnCycles(len(g.Nodes), kept)
	if err != nil {
		return flow.Identity, err
	}
	d, _, _ := flowDirection(g)
	swapOK := func() bool { return swapStaysClear(sp, boxes, pairs) }
	s, _, err := flow.Orient(kept, onCycle, sp.X, sp.Y, d, swapOK)
	if err != nil || s == flow.Identity {
		return flow.Identity, err
	}
	// The bounding box's corners go where the symmetry sends them.
	x0, y0 := s.Apply(0, 0)
	x1, y1 := s.Apply(sp.Width, sp.Height)
	minX, minY, maxX, maxY := min(x0, x1), min(y0, y1), max(x0, x1), max(y0, y1)
	for v := range sp.X {
		sp.X[v], sp.Y[v] = s.Apply(sp.X[v], sp.Y[v])
		if s.SwapsAxes() {
			minX, maxX = min(minX, sp.X[v]-boxes.HalfW[v]), max(maxX, sp.X[v]+boxes.HalfW[v])
			minY, maxY = min(minY, sp.Y[v]-boxes.HalfH[v]), max(maxY, sp.Y[v]+boxes.HalfH[v])
		}
	}
	for v := range sp.X {
		sp.X[v] -= minX
		sp.Y[v] -= minY
	}
	sp.Width, sp.Height = maxX-minX, maxY-minY
	return s, nil
}

// swapStaysClear reports whether the drawing with its axes swapped keeps
// what the spacing guarantees (place/doc.go, the spacing rule), judged by the
// independent checker: no crossing of kept pairs, node boxes grown by
// half the gap on every side not overlapping, and no kept pair passing
// through a box grown by edgeClear. The other three symmetries that swap
// the axes differ from this one by a mirror image, which changes none of
// these.
func swapStaysClear(sp *place.Placed, boxes place.Boxes, pairs [][2]int32) bool {
	n := len(sp.X)
	pts := make([]geomcheck.Point, n)
	hw, hh := make([]int64, n), make([]int64, n)
	for v := range pts {
		pts[v] = geomcheck.Point{X: sp.Y[v], Y: sp.X[v]}
		hw[v], hh[v] = boxes.HalfW[v]+boxes.Gap/2, boxes.HalfH[v]+boxes.Gap/2
	}
	if probs, err := geomcheck.First(pts, pairs, 1); err != nil || len(probs) > 0 {
		return false
	}
	if over, err := geomcheck.BoxOverlaps(pts, hw, hh); err != nil || len(over) > 0 {
		return false
	}
	for v := range pts {
		hw[v], hh[v] = boxes.HalfW[v]+edgeClear, boxes.HalfH[v]+edgeClear
	}
	through, err := geomcheck.EdgeThroughBox(pts, hw, hh, pairs)
	return err == nil && len(through) == 0
}

// flowPairs lists a digraph's edges that lie on no directed cycle, tail
// first, and the unit direction of its rankdir, for the readable stage
// to point them along (place.ReadableOptions.Flow).
func flowPairs(g *dotio.Graph) ([][2]int32, [2]float64, error) {
	all := keptAsWritten(g, nil)
	onCycle, err := flow.OnCycles(len(g.Nodes), all)
	if err != nil {
		return nil, [2]float64{}, err
	}
	var pairs [][2]int32
	for i, e := range all {
		if !onCycle[i] && e[0] != e[1] {
			pairs = append(pairs, e)
		}
	}
	d, _, _ := flowDirection(g)
	dx, dy := d.Axis()
	return pairs, [2]float64{float64(dx), float64(dy)}, nil
}
