package place

import (
	"fmt"
	"math"
	"math/rand/v2"
	"slices"
	"testing"

	"github.com/gridwood/gridwood/internal/graphgen"
	"github.com/gridwood/gridwood/place/geomcheck"
)

// outlierBoxes gives n nodes default-sized boxes (half 27 x 18 points, 18
// points apart, as the command's defaults) except for a seeded few that are
// very wide (a long label), very tall (many label lines) or big both ways,
// the boxes whose corners reach over edges whose ends lie outside them.
func outlierBoxes(n int, seed uint64) Boxes {
	b := equalBoxes(n, 27, 18)
	rng := rand.New(rand.NewPCG(seed, 7))
	for v := range n {
		switch rng.IntN(8) {
		case 0:
			b.HalfW[v] = 100 + rng.Int64N(300)
		case 1:
			b.HalfH[v] = 60 + rng.Int64N(150)
		case 2:
			b.HalfW[v], b.HalfH[v] = 80+rng.Int64N(200), 60+rng.Int64N(100)
		}
	}
	return b
}

// TestSpacingOutlierBoxes checks the spacing rule with geomcheck on small
// graphs where a few boxes are far bigger than the rest: no two boxes
// overlap and no edge passes through a box it does not end at, and none
// of these components is left unchecked or crowded. (The command's
// TestSpacingClearsWideLabels holds the inputs on which an edge once cut
// the corner of a wide box.)
func TestSpacingOutlierBoxes(t *testing.T) {
	var graphs []graphgen.Graph
	for seed := uint64(1); seed <= 40; seed++ {
		n := 8 + int(seed%12)*4
		graphs = append(graphs,
			graphgen.RandomPlanar(n, 0.6, seed),
			graphgen.RandomMaximalPlanar(n, seed),
			graphgen.RandomTree(n, seed))
	}
	graphs = append(graphs, graphgen.Grid(5, 6))
	for i, g := range graphs {
		b := outlierBoxes(g.N, uint64(i))
		res, sp := drawSpaced(t, g, b, SpaceOptions{})
		if sp.Unchecked+sp.Crowded > 0 {
			t.Errorf("%s: unchecked %d, crowded %d", g.Name, sp.Unchecked, sp.Crowded)
		}
		checkSpaced(t, fmt.Sprintf("%s boxes %d", g.Name, i), sp, b, res.Kept(), true)
	}
}

// TestCornerPair checks cornerPair on a wide box whose centre lies beyond
// the end of an edge that cuts its corner (worked by hand, common
// practice of the trade: the maximum-norm distance to a box): the box is
// 200 x 20 points around the origin (grown by edgeGap, 208 x 28), the edge
// runs from (80, 20) to (200, -40), so the origin's projection falls
// before its start, yet it crosses the box's corner (y = 14 at x = 92). The stretch cornerPair asks for must
// clear the box, checked exactly with geomcheck once applied, and a
// stretch a little smaller must not.
func TestCornerPair(t *testing.T) {
	x := []int64{0, 80, 200}
	y := []int64{0, 20, -40}
	hw := []int64{100, 0, 0}
	hh := []int64{10, 0, 0}
	c := clearance{x: x, y: y, hw: hw, hh: hh, gap: 18, s: 1}
	e := [2]int32{1, 2}
	if _, _, along := c.alongside(0, e); along {
		t.Fatal("the origin is alongside the edge: not the case under test")
	}
	c.edgePair(0, e)
	if !(c.s > 1) {
		t.Fatalf("stretch %v, want more than 1", c.s)
	}
	through := func(s float64) int {
		pts := make([]geomcheck.Point, 3)
		for v := range pts {
			pts[v] = geomcheck.Point{X: int64(math.Round(float64(x[v]) * s)), Y: int64(math.Round(float64(y[v]) * s))}
		}
		// The box grown by edgeGap, as the spacing rule keeps it.
		got, err := geomcheck.EdgeThroughBox(pts, []int64{hw[0] + edgeGap, 0, 0}, []int64{hh[0] + edgeGap, 0, 0}, [][2]int32{e})
		if err != nil {
			t.Fatal(err)
		}
		return len(got)
	}
	if n := through(1); n != 1 {
		t.Fatalf("unstretched: %d edges through the box, want 1", n)
	}
	if n := through(c.s * 1.001); n != 0 {
		t.Errorf("stretched by %v: %d edges through the box, want 0", c.s, n)
	}
	if n := through(c.s * 0.95); n != 1 {
		t.Errorf("stretched by %v: %d edges through the box, want 1", c.s*0.95, n)
	}
}

// TestCornerPairWhenShrinking: shrinkNeed starts from a stretch below 1
// and asks how far the drawing may shrink, so a pair already clear must
// still bound it. The box as in TestCornerPair (208 x 28 grown); the edge
// from (208, 20) to (218, 10) lies beyond it, its least maximum-norm
// distance is 2 (x / 104 = 2 at its left end, worked by hand), so from a
// stretch of 0.25 cornerPair must ask for 0.5, and from 0.6 leave it.
func TestCornerPairWhenShrinking(t *testing.T) {
	x := []int64{0, 208, 218}
	y := []int64{0, 20, 10}
	hw := []int64{100, 0, 0}
	hh := []int64{10, 0, 0}
	for _, tc := range []struct{ from, want float64 }{{0.25, 0.5}, {0.6, 0.6}} {
		c := clearance{x: x, y: y, hw: hw, hh: hh, gap: 18, s: tc.from}
		if _, _, along := c.alongside(0, [2]int32{1, 2}); along {
			t.Fatal("the origin is alongside the edge: not the case under test")
		}
		c.edgePair(0, [2]int32{1, 2})
		if math.Abs(c.s-tc.want) > 1e-12 {
			t.Errorf("from %v: stretch %v, want %v", tc.from, c.s, tc.want)
		}
	}
}

// TestRelaxReaches checks relaxReaches: equal boxes and mildly varied ones
// give the largest reach only, and one box more than relaxOutlier times
// the 90th percentile's adds a second reach without it, on that axis.
func TestRelaxReaches(t *testing.T) {
	vs := make([]int32, 20)
	for i := range vs {
		vs[i] = int32(i)
	}
	for _, tc := range []struct {
		name       string
		bigW, bigH int64
		want       [][2]int64
	}{
		{"equal", 27, 18, [][2]int64{{45, 36}}},
		{"mild", 60, 18, [][2]int64{{78, 36}}},
		{"wide outlier", 400, 18, [][2]int64{{418, 36}, {45, 36}}},
		{"tall outlier", 27, 300, [][2]int64{{45, 318}, {45, 36}}},
		{"big outlier", 400, 300, [][2]int64{{418, 318}, {45, 36}}},
	} {
		hw, hh := make([]int64, len(vs)), make([]int64, len(vs))
		for i := range vs {
			hw[i], hh[i] = 27, 18
		}
		hw[7], hh[7] = tc.bigW, tc.bigH
		if got := relaxReaches(vs, hw, hh, 18); !slices.Equal(got, tc.want) {
			t.Errorf("%s: reaches %v, want %v", tc.name, got, tc.want)
		}
	}
}
