package place

import (
	"math"
	"testing"

	"github.com/gridwood/gridwood/internal/exact"
	"github.com/gridwood/gridwood/internal/graphgen"
	"github.com/gridwood/gridwood/place/geomcheck"
	"github.com/gridwood/gridwood/place/internal/spacing"
)

// TestRelaxKeepsTriangulationPlane relaxes the Schnyder drawing of whole
// augmented triangulations, dummy edges included, and checks the result
// with geomcheck, the independent crossing checker: spacing.Relax's moves
// are judged by orientation tests alone (spacing's moveGuard), and this
// checks that argument on every edge of the triangulation, not only on the
// kept ones. It also checks that relax moved something.
func TestRelaxKeepsTriangulationPlane(t *testing.T) {
	for _, g := range []graphgen.Graph{
		graphgen.RandomTriangulation(60, 1),
		graphgen.RandomTriangulation(300, 2),
		graphgen.RandomPlanar(200, 0.5, 3),
		graphgen.NestedTriangles(30),
		graphgen.Wheel(30),
		graphgen.Grid(12, 12),
	} {
		res, err := Draw(g.N, g.Edges, DrawOptions{Layout: Options{Compact: true, Smooth: 400}})
		if err != nil {
			t.Fatal(err)
		}
		d := res.tri // the triangulation behind the grid drawing res.local
		relaxed := 0
		for c, vs := range d.members {
			if len(vs) < 4 || d.triOuter[c] < 0 {
				continue
			}
			f0 := d.triOuter[c]
			f1 := d.aug.FaceNext(f0)
			region := &spacing.Outer{Face: []int32{f0, f1, d.aug.FaceNext(f1)}}
			n := d.aug.N()
			x, y := make([]int64, n), make([]int64, n)
			for _, v := range vs {
				x[v], y[v] = res.local.X[v], res.local.Y[v]
			}
			corners := [3]int32{d.aug.Tail(f0), d.aug.Tail(f1), d.aug.Tail(d.aug.FaceNext(f1))}
			before := cornerCoordinates(vs, corners, x, y)
			b := equalBoxes(n, 27, 18)
			in := make(map[int32]bool, len(vs))
			for _, v := range vs {
				in[v] = true
			}
			var edges [][2]int32
			for _, e := range res.keptLocal {
				if in[e[0]] {
					edges = append(edges, e)
				}
			}
			if !spacing.Relax(d.aug, vs, region, edges, x, y, b.HalfW, b.HalfH, b.Gap, spacing.Reaches(vs, b.HalfW, b.HalfH, b.Gap)[0], make([]bool, 2*d.aug.M()), make([]int32, n)) {
				t.Fatalf("%s: relax did not run on component %d", g.Name, c)
			}
			relaxed++
			// The component alone, renumbered: other components sit
			// at the origin here.
			index := make(map[int32]int32, len(vs))
			pts := make([]geomcheck.Point, len(vs))
			for i, v := range vs {
				index[v] = int32(i)
				pts[i] = geomcheck.Point{X: x[v], Y: y[v]}
			}
			var all [][2]int32
			for i := range d.aug.M() {
				e := d.aug.Edge(i)
				if a, ok := index[e[0]]; ok {
					all = append(all, [2]int32{a, index[e[1]]})
				}
			}
			if p, err := geomcheck.First(pts, all, 1); err != nil || len(p) > 0 {
				t.Fatalf("%s: relaxed triangulation not plane: %v %v", g.Name, p, err)
			}
			// Compare places within the outer triangle: relax maps it
			// affinely onto an equilateral one, which keeps those.
			after := cornerCoordinates(vs, corners, x, y)
			moved := 0
			for i := range vs {
				if math.Abs(after[i][0]-before[i][0])+math.Abs(after[i][1]-before[i][1]) > 1e-3 {
					moved++
				}
			}
			if moved == 0 {
				t.Errorf("%s: relax moved nothing", g.Name)
			}
		}
		if relaxed == 0 {
			t.Errorf("%s: no component to relax", g.Name)
		}
	}
}

// cornerCoordinates gives each vertex's coordinates in the affine frame of
// the triangle's corners (corner 0 as origin, the sides to corners 1 and 2
// as axes), which an affine map of the drawing keeps.
func cornerCoordinates(vs []int32, corners [3]int32, x, y []int64) [][2]float64 {
	a, b, c := corners[0], corners[1], corners[2]
	bx, by := float64(x[b]-x[a]), float64(y[b]-y[a])
	cx, cy := float64(x[c]-x[a]), float64(y[c]-y[a])
	det := bx*cy - cx*by
	out := make([][2]float64, len(vs))
	for i, v := range vs {
		ux, uy := float64(x[v]-x[a]), float64(y[v]-y[a])
		out[i] = [2]float64{(ux*cy - uy*cx) / det, (bx*uy - by*ux) / det}
	}
	return out
}

// TestRelaxShrinksDrawings spaces seeded graphs with and without
// relaxation: every drawing passes geomcheck and clears every box either
// way, relaxation never makes a drawing bigger (it is kept only when it
// wins; the meshes at the end are drawings it does not win on), and on
// random triangulations and random planar graphs of 30 to 300 nodes it
// saves at least half of the area in total (measured on 2026-12-02: 80%).
func TestRelaxShrinksDrawings(t *testing.T) {
	var gs []graphgen.Graph
	for seed := uint64(1); seed <= 4; seed++ {
		for _, n := range []int{30, 100, 300} {
			gs = append(gs, graphgen.RandomTriangulation(n, seed), graphgen.RandomPlanar(n, 0.6, seed))
		}
	}
	// Meshes whose Tutte drawing wins and relaxing it does not: the
	// unrelaxed drawing must then be kept.
	losers := []graphgen.Graph{graphgen.Grid(10, 10), graphgen.TriangulatedGrid(8, 8), graphgen.Wheel(20)}
	gs = append(gs, losers...)
	kept := 0
	defer func(limit int) { relaxLimit = limit }(relaxLimit)
	var with, without float64
	relaxed := 0
	for _, g := range gs {
		b := equalBoxes(g.N, 27, 18)
		relaxLimit = spacing.GridCompareLimit
		res, on := drawSpaced(t, g, b, SpaceOptions{})
		checkSpaced(t, g.Name+" relaxed", on, b, res.Kept(), true)
		relaxLimit = 0
		res, off := drawSpaced(t, g, b, SpaceOptions{})
		checkSpaced(t, g.Name+" not relaxed", off, b, res.Kept(), true)
		if off.Relaxed != 0 {
			t.Fatalf("%s: relaxed with relaxation off", g.Name)
		}
		a1, a0 := float64(on.Width)*float64(on.Height), float64(off.Width)*float64(off.Height)
		// A component's box is compared as a whole; allow the rounding
		// of the packing a point or two.
		if a1 > a0*1.01 {
			t.Errorf("%s: relaxed %d x %d, bigger than %d x %d", g.Name, on.Width, on.Height, off.Width, off.Height)
		}
		with += a1
		without += a0
		relaxed += on.Relaxed
		t.Logf("%s: %d x %d relaxed, %d x %d not", g.Name, on.Width, on.Height, off.Width, off.Height)
		if on.Relaxed == 0 {
			kept++
		}
	}
	if with > without/2 {
		t.Errorf("relaxation saved %.0f%% of the area, want at least half", 100*(1-with/without))
	}
	if relaxed == 0 {
		t.Error("no component relaxed")
	}
	if kept == 0 {
		t.Error("every graph relaxed: the case where relaxing loses was not exercised")
	}
	t.Logf("relaxation saved %.0f%% of the area; %d of %d graphs relaxed", 100*(1-with/without), relaxed, len(gs))
}

// TestEquilateral maps Schnyder drawings of triangulations, whose outer
// triangle has a right angle, onto an equilateral outer triangle, and
// checks that the corners end up equally far apart (up to rounding), that
// every vertex keeps its place relative to the corners (an affine map),
// and that the result is still a plane drawing turning the same way.
func TestEquilateral(t *testing.T) {
	for _, g := range []graphgen.Graph{graphgen.RandomTriangulation(50, 1), graphgen.RandomTriangulation(300, 2), graphgen.NestedTriangles(20)} {
		res, err := Draw(g.N, g.Edges, DrawOptions{Layout: Options{Compact: true, Smooth: 400}})
		if err != nil {
			t.Fatal(err)
		}
		d := res.tri // the triangulation behind the grid drawing res.local
		vs := d.members[0]
		f0 := d.triOuter[0]
		f1 := d.aug.FaceNext(f0)
		region := &spacing.Outer{Face: []int32{f0, f1, d.aug.FaceNext(f1)}}
		corners := [3]int32{d.aug.Tail(f0), d.aug.Tail(f1), d.aug.Tail(d.aug.FaceNext(f1))}
		n := d.aug.N()
		x, y := make([]int64, n), make([]int64, n)
		for _, v := range vs {
			x[v], y[v] = res.local.X[v]*1000, res.local.Y[v]*1000
		}
		seen := make([]bool, 2*d.aug.M())
		// The turn of the outer triangle, the one on the left of f0.
		outerTurn := func() int {
			a, b, c := corners[0], corners[1], corners[2]
			return exact.OrientInt(x[a], y[a], x[b], y[b], x[c], y[c])
		}
		turn := outerTurn()
		before := cornerCoordinates(vs, corners, x, y)
		spacing.Equilateral(d.aug, vs, region, x, y, seen)
		side := func(a, b int32) float64 { return math.Hypot(float64(x[b]-x[a]), float64(y[b]-y[a])) }
		s01, s12, s20 := side(corners[0], corners[1]), side(corners[1], corners[2]), side(corners[2], corners[0])
		if math.Abs(s01-spacing.RelaxFrame) > 2 || math.Abs(s12-spacing.RelaxFrame) > 2 || math.Abs(s20-spacing.RelaxFrame) > 2 {
			t.Errorf("%s: outer sides %.1f, %.1f, %.1f, want %d", g.Name, s01, s12, s20, spacing.RelaxFrame)
		}
		if got := outerTurn(); got != turn {
			t.Errorf("%s: outer triangle turns %d, was %d", g.Name, got, turn)
		}
		if !spacing.Plane(d.aug, vs, region, x, y, seen) {
			t.Errorf("%s: not a plane drawing after the map", g.Name)
		}
		after := cornerCoordinates(vs, corners, x, y)
		for i := range vs {
			if math.Abs(after[i][0]-before[i][0])+math.Abs(after[i][1]-before[i][1]) > 1e-6 {
				t.Fatalf("%s: vertex %d moved relative to the corners: %v to %v", g.Name, vs[i], before[i], after[i])
			}
		}
	}
}
