package spacing

import (
	"math"
	"testing"

	"github.com/gridwood/gridwood/internal/graphgen"
	"github.com/gridwood/gridwood/planarize"
)

// TestPlaneDrawingRejectsStarBoundary draws a wheel's rim as a convex
// pentagon and as a pentagram: both turn the same way at every corner,
// but only the pentagon is a simple polygon (the pentagram winds round
// twice), so Plane, the exact check every relaxed or refined
// drawing passes, must take the one and refuse the other, whatever the hub's
// place.
func TestPlaneDrawingRejectsStarBoundary(t *testing.T) {
	emb, hub, region, vs := wheelRim(t)
	face := region.Face
	g := graphgen.Wheel(5)
	seen := make([]bool, 2*emb.M())
	for _, tc := range []struct {
		name  string
		step  int // rim vertex i goes to the point at angle 2*pi*step*i/5
		plane bool
	}{{"pentagon", 1, true}, {"pentagram", 2, false}} {
		for _, sign := range []float64{1, -1} {
			x, y := make([]int64, g.N), make([]int64, g.N)
			for i, d := range face {
				a := sign * 2 * math.Pi * float64(tc.step*i) / 5
				x[emb.Tail(d)] = int64(math.Round(1000 * math.Cos(a)))
				y[emb.Tail(d)] = int64(math.Round(1000 * math.Sin(a)))
			}
			// The hub at the centre, or off it: never a plane drawing of
			// the pentagram.
			for _, h := range [][2]int64{{0, 0}, {100, -50}} {
				x[hub], y[hub] = h[0], h[1]
				if got := Plane(emb, vs, region, x, y, seen); got != tc.plane {
					t.Errorf("%s (turning %v, hub at %v): Plane %v, want %v", tc.name, sign, h, got, tc.plane)
				}
			}
		}
	}
}

// wheelRim embeds the wheel on five rim vertices and returns it with its
// hub and the rim face (the face not at the hub) as the outer region.
func wheelRim(t *testing.T) (*planarize.Embedding, int32, *Outer, []int32) {
	t.Helper()
	g := graphgen.Wheel(5)
	emb, ok := planarize.Embed(g.N, g.Edges)
	if !ok {
		t.Fatal("wheel not planar")
	}
	hub := int32(0)
	for v := range int32(g.N) {
		if emb.Degree(v) == 5 {
			hub = v
		}
	}
	var face []int32
	for d := int32(0); int(d) < 2*emb.M() && face == nil; d++ {
		if emb.Tail(d) == hub || emb.Head(d) == hub {
			continue
		}
		f := []int32{d}
		for e := emb.FaceNext(d); e != d; e = emb.FaceNext(e) {
			f = append(f, e)
		}
		if len(f) == 5 {
			face = f
		}
	}
	if face == nil {
		t.Fatal("no rim face")
	}
	vs := make([]int32, g.N)
	for v := range vs {
		vs[v] = int32(v)
	}
	return emb, hub, &Outer{Face: face}, vs
}
