package quality

import (
	"math"
	"testing"
)

// TestStressWorkedExamples checks Stress against values worked out by hand
// from its definition (normalized stress, Gansner, Koren and North, GD
// 2004: pairs in one component, hop distance d, (s|x_i - x_j|/d - 1)^2 at
// the best scale s, over the number of pairs).
func TestStressWorkedExamples(t *testing.T) {
	sq2 := math.Sqrt2
	for _, tc := range []struct {
		name   string
		x, y   []float64
		edges  [][2]int32
		want   float64
		pairs  int
		reason string
	}{
		{"path on a line", []float64{0, 1, 2, 3}, []float64{0, 0, 0, 0}, [][2]int32{{0, 1}, {1, 2}, {2, 3}}, 0, 6,
			"every distance equals the hop distance"},
		{"path scaled", []float64{0, 5, 10}, []float64{0, 0, 0}, [][2]int32{{0, 1}, {1, 2}}, 0, 3,
			"the best scale absorbs any uniform factor"},
		// C4 as a unit square: 4 pairs with r = 1, 2 opposite pairs with
		// r = sqrt2/2. Sum r = 4 + sqrt2, sum r^2 = 5, P = 6: stress =
		// (6 - (4+sqrt2)^2/5)/6.
		{"square", []float64{0, 1, 1, 0}, []float64{0, 0, 1, 1}, [][2]int32{{0, 1}, {1, 2}, {2, 3}, {3, 0}},
			(6 - (4+sq2)*(4+sq2)/5) / 6, 6, "by hand"},
		// A path of 3 folded to a right angle: r = 1, 1, sqrt2/2.
		{"bent path", []float64{0, 1, 1}, []float64{0, 0, 1}, [][2]int32{{0, 1}, {1, 2}},
			(3 - (2+sq2/2)*(2+sq2/2)/2.5) / 3, 3, "by hand"},
		// Two components: pairs across them do not count.
		{"two edges apart", []float64{0, 1, 50, 51}, []float64{0, 0, 7, 7}, [][2]int32{{0, 1}, {2, 3}}, 0, 2,
			"pairs in different components are left out"},
	} {
		got, sources := Stress(tc.x, tc.y, tc.edges)
		if math.Abs(got-tc.want) > 1e-12 {
			t.Errorf("%s: stress %.15f, want %.15f (%s)", tc.name, got, tc.want, tc.reason)
		}
		if sources != len(tc.x) {
			t.Errorf("%s: %d sources, want every vertex", tc.name, sources)
		}
	}
}

// TestMeasureWorkedExamples checks the other measures on drawings whose
// values follow from plane geometry.
func TestMeasureWorkedExamples(t *testing.T) {
	// A star of 6 leaves on the unit circle, evenly: every angle 60
	// degrees, every edge 1.
	x, y := []float64{0}, []float64{0}
	var star [][2]int32
	for i := range 6 {
		a := float64(i) * math.Pi / 3
		x, y = append(x, math.Cos(a)), append(y, math.Sin(a))
		star = append(star, [2]int32{0, int32(i + 1)})
	}
	q := Measure(x, y, star)
	if q.EdgeCV > 1e-12 || math.Abs(q.MeanEdge-1) > 1e-12 {
		t.Errorf("even star: edge CV %g, mean %g, want 0 and 1", q.EdgeCV, q.MeanEdge)
	}
	if math.Abs(q.AngularResolution-1) > 1e-9 {
		t.Errorf("even star: angular resolution %g, want 1", q.AngularResolution)
	}
	// Leaves 1 and 2 at 60 degrees apart are the closest pair: distance 1
	// (a chord of 60 degrees on the unit circle), as is centre to leaf.
	if math.Abs(q.ClosestPair-1) > 1e-9 {
		t.Errorf("even star: closest pair %g, want 1", q.ClosestPair)
	}
	// Edges of lengths 1 and 3: mean 2, standard deviation 1, CV 0.5; the
	// angle at the middle vertex is 90 degrees of an even 180: 0.5.
	q = Measure([]float64{0, 1, 1}, []float64{0, 0, 3}, [][2]int32{{0, 1}, {1, 2}})
	if math.Abs(q.EdgeCV-0.5) > 1e-12 || math.Abs(q.AngularResolution-0.5) > 1e-9 {
		t.Errorf("right angle: edge CV %g, angular resolution %g, want 0.5 and 0.5", q.EdgeCV, q.AngularResolution)
	}
}
