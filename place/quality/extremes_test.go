package quality

import (
	"math"
	"testing"
)

// TestMeasureExtremes checks the extremes on drawings worked by hand
// (plane geometry, common practice): a right angle at a corner, edges of
// lengths 3 and 4 (ratio 4/3) with each far end 3 or 4 points from the
// other edge, and a node 2 points from an edge.
func TestMeasureExtremes(t *testing.T) {
	for _, tc := range []struct {
		name                 string
		x, y                 []int64
		edges                [][2]int32
		angle, ratio, vertex float64
	}{
		{"right angle", []int64{0, 3, 0}, []int64{0, 0, 4}, [][2]int32{{0, 1}, {0, 2}}, 90, 4.0 / 3, 3},
		{"one edge", []int64{0, 10, 5}, []int64{0, 0, 2}, [][2]int32{{0, 1}}, 180, 1, 2},
		{"loop ignored", []int64{0, 10}, []int64{0, 0}, [][2]int32{{0, 1}, {1, 1}}, 180, 1, -1},
	} {
		t.Run(tc.name, func(t *testing.T) {
			q := MeasureExtremes(tc.x, tc.y, tc.edges)
			if math.Abs(q.MinAngle-tc.angle) > 1e-9 || math.Abs(q.EdgeRatio-tc.ratio) > 1e-9 || math.Abs(q.MinVertexEdge-tc.vertex) > 1e-9 {
				t.Errorf("got angle %v, ratio %v, vertex-edge %v; want %v, %v, %v", q.MinAngle, q.EdgeRatio, q.MinVertexEdge, tc.angle, tc.ratio, tc.vertex)
			}
		})
	}
}
