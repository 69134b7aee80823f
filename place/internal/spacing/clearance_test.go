package spacing

import (
	"math"
	"math/rand/v2"
	"slices"
	"testing"

	"github.com/gridwood/gridwood/place/geomcheck"
)

// TestAllPairsMatchesEveryPair checks allPairs against its definition,
// written out as a plain double loop: the same vertex-edge pairs, and for
// each vertex its edges in the order of edges (Refine adds up pushes per
// vertex, so that order reaches the output). Coordinates are drawn from a
// small range so that many vertices share an x, and the reach r runs from
// none to more than the drawing.
func TestAllPairsMatchesEveryPair(t *testing.T) {
	rng := rand.New(rand.NewPCG(7, 11))
	for trial := range 200 {
		n := 2 + rng.IntN(40)
		span := int64(1 + rng.IntN(30))
		x, y := make([]int64, n+3), make([]int64, n+3)
		vs := make([]int32, 0, n)
		for v := range n {
			w := int32(v + 3) // vertex numbers need not start at 0
			vs = append(vs, w)
			x[w], y[w] = rng.Int64N(span)-span/2, rng.Int64N(span)-span/2
		}
		var edges [][2]int32
		index := map[[2]int32]int{} // each edge once, so that fn's e names it
		for range rng.IntN(3 * n) {
			e := [2]int32{vs[rng.IntN(n)], vs[rng.IntN(n)]}
			if _, dup := index[e]; !dup && e[0] != e[1] {
				index[e] = len(edges)
				edges = append(edges, e)
			}
		}
		r := rng.Int64N(span + 2)
		want := map[int32][]int{}
		for ei, e := range edges {
			for _, w := range vs {
				if w == e[0] || w == e[1] {
					continue
				}
				if x[w] >= min(x[e[0]], x[e[1]])-r && x[w] <= max(x[e[0]], x[e[1]])+r &&
					y[w] >= min(y[e[0]], y[e[1]])-r && y[w] <= max(y[e[0]], y[e[1]])+r {
					want[w] = append(want[w], ei)
				}
			}
		}
		got := map[int32][]int{}
		allPairs(vs, edges, x, y, r, func(w int32, e [2]int32) {
			got[w] = append(got[w], index[e])
		})
		for _, w := range vs {
			if !slices.Equal(got[w], want[w]) {
				t.Fatalf("trial %d (n=%d, r=%d), vertex %d: edges %v, want %v", trial, n, r, w, got[w], want[w])
			}
		}
	}
}

// TestCornerPair checks cornerPair on a wide box whose centre lies beyond
// the end of an edge that cuts its corner (worked by hand, common
// practice of the trade: the maximum-norm distance to a box): the box is
// 200 x 20 points around the origin (grown by EdgeGap, 208 x 28), the edge
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
		// The box grown by EdgeGap, as the spacing rule keeps it.
		got, err := geomcheck.EdgeThroughBox(pts, []int64{hw[0] + EdgeGap, 0, 0}, []int64{hh[0] + EdgeGap, 0, 0}, [][2]int32{e})
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
