package geomcheck

import (
	"fmt"
	"math/big"
	"math/rand/v2"
	"slices"
	"testing"
)

type boxVertex struct {
	p      Point
	hw, hh int64
}

func splitBoxes(vs []boxVertex) (pts []Point, hw, hh []int64) {
	for _, v := range vs {
		pts = append(pts, v.p)
		hw = append(hw, v.hw)
		hh = append(hh, v.hh)
	}
	return pts, hw, hh
}

func TestBoxOverlapsTable(t *testing.T) {
	cases := []struct {
		name  string
		boxes []boxVertex
		want  [][2]int
	}{
		{"overlapping", []boxVertex{{Point{0, 0}, 2, 2}, {Point{3, 0}, 2, 2}}, [][2]int{{0, 1}}},
		{"touching sides", []boxVertex{{Point{0, 0}, 2, 2}, {Point{4, 0}, 2, 2}}, nil},
		{"touching corners", []boxVertex{{Point{0, 0}, 2, 2}, {Point{4, 4}, 2, 2}}, nil},
		{"overlap in x only", []boxVertex{{Point{0, 0}, 2, 2}, {Point{1, 5}, 2, 2}}, nil},
		{"nested", []boxVertex{{Point{0, 0}, 5, 5}, {Point{1, 1}, 1, 1}}, [][2]int{{0, 1}}},
		{"equal", []boxVertex{{Point{7, 7}, 1, 3}, {Point{7, 7}, 1, 3}}, [][2]int{{0, 1}}},
		{"plus sign", []boxVertex{{Point{0, 0}, 5, 1}, {Point{0, 0}, 1, 5}}, [][2]int{{0, 1}}},
		{"zero width inside", []boxVertex{{Point{0, 0}, 5, 5}, {Point{1, 1}, 0, 3}}, nil},
		{"point boxes", []boxVertex{{Point{0, 0}, 0, 0}, {Point{0, 0}, 0, 0}}, nil},
		{"chain", []boxVertex{{Point{0, 0}, 2, 1}, {Point{3, 0}, 2, 1}, {Point{6, 0}, 2, 1}, {Point{9, 0}, 1, 1}},
			[][2]int{{0, 1}, {1, 2}}},
		{"at the bound", []boxVertex{{Point{-MaxCoord, -MaxCoord}, MaxCoord, MaxCoord}, {Point{MaxCoord, MaxCoord}, MaxCoord, MaxCoord},
			{Point{0, 0}, 1, 1}}, [][2]int{{0, 2}, {1, 2}}},
	}
	for _, tc := range cases {
		pts, hw, hh := splitBoxes(tc.boxes)
		got, err := BoxOverlaps(pts, hw, hh)
		if err != nil {
			t.Fatalf("%s: %v", tc.name, err)
		}
		if !slices.Equal(got, tc.want) {
			t.Errorf("%s: BoxOverlaps = %v, want %v", tc.name, got, tc.want)
		}
		brute, _ := boxOverlapsBrute(pts, hw, hh)
		if !slices.Equal(brute, tc.want) {
			t.Errorf("%s: boxOverlapsBrute = %v, want %v", tc.name, brute, tc.want)
		}
	}
}

func TestEdgeThroughBoxTable(t *testing.T) {
	cases := []struct {
		name  string
		boxes []boxVertex
		edges [][2]int32
		want  [][2]int
	}{
		{"through the middle",
			[]boxVertex{{Point{5, 0}, 1, 1}, {Point{0, 0}, 0, 0}, {Point{10, 0}, 0, 0}},
			[][2]int32{{1, 2}}, [][2]int{{0, 0}}},
		{"ends inside its own ends' boxes",
			[]boxVertex{{Point{0, 0}, 2, 2}, {Point{10, 0}, 3, 3}},
			[][2]int32{{0, 1}}, nil},
		{"ends inside another vertex's box",
			[]boxVertex{{Point{0, 0}, 0, 0}, {Point{10, 0}, 0, 0}, {Point{11, 0}, 2, 2}},
			[][2]int32{{0, 1}}, [][2]int{{2, 0}}},
		{"touches a corner", // x + y = 8 meets the box [4,6]^2 only at (4, 4)
			[]boxVertex{{Point{5, 5}, 1, 1}, {Point{0, 8}, 0, 0}, {Point{8, 0}, 0, 0}},
			[][2]int32{{1, 2}}, nil},
		{"cuts a corner", // x + y = 9 cuts off the corner (4, 4) of [4,6]^2
			[]boxVertex{{Point{5, 5}, 1, 1}, {Point{0, 9}, 0, 0}, {Point{9, 0}, 0, 0}},
			[][2]int32{{1, 2}}, [][2]int{{0, 0}}},
		{"along the bottom side",
			[]boxVertex{{Point{5, 5}, 1, 1}, {Point{0, 4}, 0, 0}, {Point{10, 4}, 0, 0}},
			[][2]int32{{1, 2}}, nil},
		{"along the left side, partly",
			[]boxVertex{{Point{5, 5}, 1, 1}, {Point{4, 0}, 0, 0}, {Point{4, 5}, 0, 0}},
			[][2]int32{{1, 2}}, nil},
		{"just inside the bottom side",
			[]boxVertex{{Point{5, 5}, 2, 2}, {Point{0, 4}, 0, 0}, {Point{10, 4}, 0, 0}},
			[][2]int32{{1, 2}}, [][2]int{{0, 0}}},
		{"ends on the boundary",
			[]boxVertex{{Point{5, 5}, 1, 1}, {Point{0, 5}, 0, 0}, {Point{4, 5}, 0, 0}},
			[][2]int32{{1, 2}}, nil},
		{"zero-width box",
			[]boxVertex{{Point{5, 0}, 0, 3}, {Point{0, 0}, 0, 0}, {Point{10, 0}, 0, 0}},
			[][2]int32{{1, 2}}, nil},
		{"loop and zero-length edge inside a box",
			[]boxVertex{{Point{5, 5}, 3, 3}, {Point{5, 5}, 0, 0}, {Point{6, 6}, 0, 0}, {Point{6, 6}, 0, 0}},
			[][2]int32{{1, 1}, {2, 3}}, nil},
		{"two boxes, two edges",
			[]boxVertex{{Point{0, 0}, 1, 1}, {Point{4, 0}, 1, 1}, {Point{-5, 0}, 0, 0}, {Point{9, 1}, 0, 0}, {Point{4, -5}, 0, 0}, {Point{4, 5}, 0, 0}},
			[][2]int32{{2, 3}, {4, 5}}, [][2]int{{0, 0}, {1, 0}, {1, 1}}},
		{"at the bound",
			[]boxVertex{{Point{0, 0}, MaxCoord, 1}, {Point{-MaxCoord, -MaxCoord}, 0, 0}, {Point{MaxCoord, MaxCoord}, 0, 0}},
			[][2]int32{{1, 2}}, [][2]int{{0, 0}}},
	}
	for _, tc := range cases {
		pts, hw, hh := splitBoxes(tc.boxes)
		got, err := EdgeThroughBox(pts, hw, hh, tc.edges)
		if err != nil {
			t.Fatalf("%s: %v", tc.name, err)
		}
		if !slices.Equal(got, tc.want) {
			t.Errorf("%s: EdgeThroughBox = %v, want %v", tc.name, got, tc.want)
		}
		brute, _ := edgeThroughBoxBrute(pts, hw, hh, tc.edges)
		if !slices.Equal(brute, tc.want) {
			t.Errorf("%s: edgeThroughBoxBrute = %v, want %v", tc.name, brute, tc.want)
		}
	}
}

func TestBoxErrors(t *testing.T) {
	pts := []Point{{0, 0}, {1, 1}}
	bad := []struct {
		name   string
		pts    []Point
		hw, hh []int64
		edges  [][2]int32
	}{
		{"short hw", pts, []int64{1}, []int64{1, 1}, nil},
		{"short hh", pts, []int64{1, 1}, []int64{1}, nil},
		{"negative", pts, []int64{1, -1}, []int64{1, 1}, nil},
		{"too large", pts, []int64{1, 1}, []int64{MaxCoord + 1, 1}, nil},
		{"coordinate", []Point{{0, 0}, {MaxCoord + 1, 0}}, []int64{1, 1}, []int64{1, 1}, nil},
	}
	for _, tc := range bad {
		if _, err := BoxOverlaps(tc.pts, tc.hw, tc.hh); err == nil {
			t.Errorf("BoxOverlaps accepted %s", tc.name)
		}
		if _, err := EdgeThroughBox(tc.pts, tc.hw, tc.hh, tc.edges); err == nil {
			t.Errorf("EdgeThroughBox accepted %s", tc.name)
		}
	}
	if _, err := EdgeThroughBox(pts, []int64{1, 1}, []int64{1, 1}, [][2]int32{{0, 2}}); err == nil {
		t.Error("EdgeThroughBox accepted an edge to a missing vertex")
	}
}

// TestBoxesMatchBrute holds the tree-based box checks to the all-pairs
// definitions on random, often degenerate inputs.
func TestBoxesMatchBrute(t *testing.T) {
	for seed := range 3000 {
		rng := rand.New(rand.NewPCG(uint64(seed), 11))
		n := 2 + rng.IntN(25)
		r := int64(3 + seed%20)
		pts, edges := randomDrawing(rng, n, rng.IntN(30), 0, r)
		hw := make([]int64, n)
		hh := make([]int64, n)
		for i := range hw {
			hw[i], hh[i] = rng.Int64N(4), rng.Int64N(4)
		}
		name := fmt.Sprintf("seed %d pts %v hw %v hh %v edges %v", seed, pts, hw, hh, edges)
		got, err := BoxOverlaps(pts, hw, hh)
		if err != nil {
			t.Fatal(err)
		}
		want, _ := boxOverlapsBrute(pts, hw, hh)
		if !slices.Equal(got, want) {
			t.Fatalf("%s\nBoxOverlaps = %v\nbrute      = %v", name, got, want)
		}
		gotE, err := EdgeThroughBox(pts, hw, hh, edges)
		if err != nil {
			t.Fatal(err)
		}
		wantE, _ := edgeThroughBoxBrute(pts, hw, hh, edges)
		if !slices.Equal(gotE, wantE) {
			t.Fatalf("%s\nEdgeThroughBox = %v\nbrute          = %v", name, gotE, wantE)
		}
	}
}

// ratClip returns whether some t in [0, 1] puts a + t(b-a) inside the
// rectangle r, open or closed, by intersecting the parameter intervals of
// the four side constraints over the rationals (the Liang-Barsky clipping
// idea; common practice).
func ratClip(a, b Point, r rect, open bool) bool {
	var lo, hi *big.Rat                     // nil: unbounded
	cmpStrict := func(x, y *big.Rat) bool { // x < y, or x <= y when closed
		if open {
			return x.Cmp(y) < 0
		}
		return x.Cmp(y) <= 0
	}
	// Constraint lower < p + t d < upper (or <=) on one axis.
	axis := func(p, d, lower, upper int64) bool {
		if d == 0 {
			if open {
				return lower < p && p < upper
			}
			return lower <= p && p <= upper
		}
		t1 := big.NewRat(lower-p, d)
		t2 := big.NewRat(upper-p, d)
		if d < 0 {
			t1, t2 = t2, t1
		}
		if lo == nil || t1.Cmp(lo) > 0 {
			lo = t1
		}
		if hi == nil || t2.Cmp(hi) < 0 {
			hi = t2
		}
		return true
	}
	if !axis(a.X, b.X-a.X, r.xlo, r.xhi) || !axis(a.Y, b.Y-a.Y, r.ylo, r.yhi) {
		return false
	}
	zero, one := new(big.Rat), big.NewRat(1, 1)
	// The constraint set is (lo, hi) (or [lo, hi]) intersected with [0, 1].
	if lo != nil && hi != nil && !cmpStrict(lo, hi) {
		return false
	}
	if lo != nil && !cmpStrict(lo, one) {
		return false
	}
	if hi != nil && !cmpStrict(zero, hi) {
		return false
	}
	return true
}

// TestRectPredicatesAgainstClipping compares the separating-axis tests with
// rational parametric clipping, for open boxes of positive size and for
// closed, possibly degenerate ones.
func TestRectPredicatesAgainstClipping(t *testing.T) {
	rng := rand.New(rand.NewPCG(8, 9))
	for i := range 200000 {
		m := int64(3 + i%5)
		p := func() Point { return Point{rng.Int64N(m), rng.Int64N(m)} }
		a, b := p(), p()
		x0, x1 := rng.Int64N(m), rng.Int64N(m)
		y0, y1 := rng.Int64N(m), rng.Int64N(m)
		r := rect{min(x0, x1), min(y0, y1), max(x0, x1), max(y0, y1)}
		openWant := r.xlo < r.xhi && r.ylo < r.yhi && a != b && ratClip(a, b, r, true)
		if got := segMeetsOpenRect(a, b, r); got != openWant {
			t.Fatalf("segMeetsOpenRect(%v, %v, %v) = %v, clipping says %v", a, b, r, got, openWant)
		}
		if got, want := segTouchesClosedRect(a, b, r), ratClip(a, b, r, false); got != want {
			t.Fatalf("segTouchesClosedRect(%v, %v, %v) = %v, clipping says %v", a, b, r, got, want)
		}
	}
}

func BenchmarkEdgeThroughBox100k(b *testing.B) {
	rng := rand.New(rand.NewPCG(42, 42))
	pts, edges := stackedTriangulation(rng, 100002, 100000)
	hw := make([]int64, len(pts))
	hh := make([]int64, len(pts))
	for i := range hw {
		hw[i], hh[i] = 1, 1
	}
	for b.Loop() {
		if _, err := EdgeThroughBox(pts, hw, hh, edges); err != nil {
			b.Fatal(err)
		}
	}
}
