package main

import (
	"github.com/gridwood/gridwood/dotio"
	"github.com/gridwood/gridwood/place/flow"
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
	var kept [][2]int32
	for i, e := range g.Edges {
		if removed == nil || !removed[i] {
			kept = append(kept, [2]int32{e.From, e.To})
		}
	}
	onCycle, err := flow.OnCycles(len(g.Nodes), kept)
	if err != nil {
		return flow.Counts{}, err
	}
	d, _, _ := flowDirection(g)
	return flow.Count(kept, onCycle, x, y, d)
}
