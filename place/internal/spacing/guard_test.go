package spacing

import (
	"math"
	"testing"
)

// TestMoveGuardBoundary checks moveGuard on a boundary vertex of a wheel
// drawn with its rim as a regular pentagon round the hub: moving a rim
// vertex along its ray keeps both of its triangles turning the same way
// until it reaches the hub, so only the boundary's convexity can refuse it,
// and it must once the vertex passes the chord between its neighbours
// (at cos 72 degrees, 0.309 of the radius, in a regular pentagon).
func TestMoveGuardBoundary(t *testing.T) {
	emb, _, region, vs := wheelRim(t)
	x, y := make([]int64, len(vs)), make([]int64, len(vs))
	for i, d := range region.Face {
		a := 2 * math.Pi * float64(i) / 5
		x[emb.Tail(d)] = int64(math.Round(10000 * math.Cos(a)))
		y[emb.Tail(d)] = int64(math.Round(10000 * math.Sin(a)))
	}
	if !Plane(emb, vs, region, x, y, make([]bool, 2*emb.M())) {
		t.Fatal("the pentagon drawing is not plane")
	}
	guard, ok := newMoveGuard(emb, vs, region, x, y)
	if !ok {
		t.Fatal("no guard")
	}
	v := emb.Tail(region.Face[0])
	for _, tc := range []struct {
		radius float64
		ok     bool
	}{{1.1, true}, {0.5, true}, {0.35, true}, {0.28, false}, {0.1, false}} {
		px, py := int64(math.Round(10000*tc.radius)), int64(0)
		if got := guard.allows(v, px, py); got != tc.ok {
			t.Errorf("rim vertex to %.2f of the radius: allowed %v, want %v", tc.radius, got, tc.ok)
		}
	}
	// Past the hub the triangles flip too.
	if guard.allows(v, -100, 0) {
		t.Error("rim vertex moved past the hub: allowed")
	}
}
