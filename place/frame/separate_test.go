package frame

import (
	"testing"

	"github.com/gridwood/gridwood/place/geomcheck"
)

// TestSeparate: two clusters drawn interleaved (each a path of three
// nodes, one running through the other's frame) are moved apart whole:
// afterwards no node lies in a foreign frame and no frames overlap
// (Measure), each cluster has only been translated, and the drawing has
// no crossing, no box overlap and no edge through a box by geomcheck,
// the independent checker. A drawing without conflicts is left as it is.
func TestSeparate(t *testing.T) {
	hw, hh := []int64{20, 20, 20, 20, 20, 20}, []int64{10, 10, 10, 10, 10, 10}
	for _, tc := range []struct {
		name  string
		x, y  []int64
		edges [][2]int32
		moves bool
	}{
		{
			// Cluster 0: nodes 0-1-2 along y = 0 from x = 0 to 400;
			// cluster 1: nodes 3-4-5 along y = 25 from x = 300, so that
			// node 3's box reaches into cluster 0's frame and the frames
			// overlap.
			name: "interleaved", x: []int64{0, 200, 400, 300, 500, 700}, y: []int64{0, 0, 0, 25, 25, 25},
			edges: [][2]int32{{0, 1}, {1, 2}, {3, 4}, {4, 5}, {2, 3}}, moves: true,
		},
		{
			name: "apart", x: []int64{0, 200, 400, 0, 200, 400}, y: []int64{0, 0, 0, 300, 300, 300},
			edges: [][2]int32{{0, 1}, {1, 2}, {3, 4}, {4, 5}, {2, 3}},
		},
	} {
		t.Run(tc.name, func(t *testing.T) {
			c := Clusters{Parent: []int32{-1, -1}, Home: []int32{0, 0, 0, 1, 1, 1}}
			in := SeparateInput{Input: Input{Clusters: c, Nodes: Nodes{X: tc.x, Y: tc.y, HalfW: hw, HalfH: hh}, Margin: 8}, Edges: tc.edges, Gap: 18, Across: true}
			before, err := Measure(c, in.Nodes, mustFrames(t, in.Input))
			if err != nil {
				t.Fatal(err)
			}
			if tc.moves && before.Intrusions+before.Overlaps == 0 {
				t.Fatalf("the drawing has no conflict to resolve: %+v", before)
			}
			x, y, moves, err := Separate(in)
			if err != nil {
				t.Fatal(err)
			}
			if (moves > 0) != tc.moves {
				t.Fatalf("%d moves, want moves %v", moves, tc.moves)
			}
			after := Nodes{X: x, Y: y, HalfW: hw, HalfH: hh}
			counts, err := Measure(c, after, mustFrames(t, Input{Clusters: c, Nodes: after, Margin: 8}))
			if err != nil {
				t.Fatal(err)
			}
			t.Logf("before %+v, after %+v (%d moves)", before, counts, moves)
			if counts.Intrusions != 0 || counts.Overlaps != 0 {
				t.Errorf("after: %d intrusions, %d overlaps, want none", counts.Intrusions, counts.Overlaps)
			}
			for v := range x {
				home := c.Home[v]
				first := int(home) * 3
				if x[v]-x[first] != tc.x[v]-tc.x[first] || y[v]-y[first] != tc.y[v]-tc.y[first] {
					t.Errorf("node %d moved apart from its cluster's first node", v)
				}
			}
			pts := make([]geomcheck.Point, len(x))
			for v := range pts {
				pts[v] = geomcheck.Point{X: x[v], Y: y[v]}
			}
			if probs, err := geomcheck.Check(pts, tc.edges); err != nil || len(probs) > 0 {
				t.Errorf("crossings: %v %v", probs, err)
			}
			if o, err := geomcheck.BoxOverlaps(pts, hw, hh); err != nil || len(o) > 0 {
				t.Errorf("box overlaps: %v %v", o, err)
			}
			if e, err := geomcheck.EdgeThroughBox(pts, hw, hh, tc.edges); err != nil || len(e) > 0 {
				t.Errorf("edges through boxes: %v %v", e, err)
			}
			if !tc.moves {
				for v := range x {
					if x[v] != tc.x[v] || y[v] != tc.y[v] {
						t.Fatalf("node %d moved in a drawing without conflicts", v)
					}
				}
			}
		})
	}
}

func mustFrames(t *testing.T, in Input) []Rect {
	t.Helper()
	f, err := Frames(in)
	if err != nil {
		t.Fatal(err)
	}
	return f
}
