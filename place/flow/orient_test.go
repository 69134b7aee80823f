package flow

import (
	"math/rand/v2"
	"testing"

	"github.com/gridwood/gridwood/place/geomcheck"
)

// TestSymmetries: each symmetry maps the unit vectors where its comment
// says (plane geometry: reflections in the axes and the diagonals,
// rotations by quarter turns, counter-clockwise with y up), is undone by
// its inverse, and keeps a plane drawing plane (geomcheck).
func TestSymmetries(t *testing.T) {
	for _, tc := range []struct {
		s              Symmetry
		ex, ey, fx, fy int64 // images of (1, 0) and (0, 1)
		swaps          bool
	}{
		{Identity, 1, 0, 0, 1, false},
		{MirrorX, -1, 0, 0, 1, false},
		{MirrorY, 1, 0, 0, -1, false},
		{Rotate180, -1, 0, 0, -1, false},
		{Transpose, 0, 1, 1, 0, true},
		{Rotate90, 0, 1, -1, 0, true},
		{Rotate270, 0, -1, 1, 0, true},
		{AntiTranspose, 0, -1, -1, 0, true},
	} {
		ex, ey := tc.s.Apply(1, 0)
		fx, fy := tc.s.Apply(0, 1)
		if ex != tc.ex || ey != tc.ey || fx != tc.fx || fy != tc.fy || tc.s.SwapsAxes() != tc.swaps {
			t.Errorf("%v: (1,0) -> (%d,%d), (0,1) -> (%d,%d), swaps %v", tc.s, ex, ey, fx, fy, tc.s.SwapsAxes())
		}
		if x, y := tc.s.inverse().Apply(tc.s.Apply(3, -7)); x != 3 || y != -7 {
			t.Errorf("%v: inverse gives (%d,%d) for (3,-7)", tc.s, x, y)
		}
	}
	// The drawing of TestCount, mapped by each symmetry.
	x := []int64{0, -100, 100, 0, 0, 150, -200, 250}
	y := []int64{300, 200, 200, 100, 0, 50, 300, 100}
	edges := [][2]int32{{0, 1}, {0, 2}, {1, 3}, {2, 3}, {3, 4}, {1, 2}, {4, 6}, {3, 5}, {5, 7}, {7, 3}}
	for _, s := range Symmetries {
		pts := make([]geomcheck.Point, len(x))
		for v := range pts {
			pts[v].X, pts[v].Y = s.Apply(x[v], y[v])
		}
		if p, err := geomcheck.Check(pts, edges); err != nil || len(p) > 0 {
			t.Errorf("%v: %v %v", s, p, err)
		}
	}
}

// TestOrient: small drawings whose best symmetry is worked out by hand.
func TestOrient(t *testing.T) {
	// A path 0 -> 1 -> 2 drawn going up (y up, as in DOT).
	upX, upY := []int64{0, 10, 0}, []int64{0, 100, 200}
	path := [][2]int32{{0, 1}, {1, 2}}
	// The same path drawn left to right on one level.
	flatX, flatY := []int64{0, 100, 200}, []int64{0, 0, 0}
	// A triangle 0 -> 1 -> 2 -> 0 (a cycle) and 3 -> 0 drawn pointing
	// left and down.
	cycX, cycY := []int64{0, 100, 50, 300}, []int64{0, 0, 100, 50}
	cyc := [][2]int32{{0, 1}, {1, 2}, {2, 0}, {3, 0}}
	// One edge up, one down: a tie that keeps the identity.
	tieX, tieY := []int64{0, 0, 100, 100}, []int64{0, 100, 100, 0}
	tie := [][2]int32{{0, 1}, {2, 3}}
	yes := func() bool { return true }
	no := func() bool { return false }
	for _, tc := range []struct {
		name   string
		x, y   []int64
		edges  [][2]int32
		d      Direction
		swapOK func() bool
		want   Symmetry
		counts Counts
		asked  bool // whether swapOK is to be asked
	}{
		{"upward path, TB", upX, upY, path, TopToBottom, yes, MirrorY, Counts{2, 0, 0}, false},
		{"upward path, BT", upX, upY, path, BottomToTop, yes, Identity, Counts{2, 0, 0}, false},
		// Only a quarter turn makes the level path point down: (1, 0)
		// must go to (0, -1), which Rotate270 does first (then
		// AntiTranspose).
		{"level path, TB", flatX, flatY, path, TopToBottom, yes, Rotate270, Counts{2, 0, 0}, true},
		{"level path, TB, no swap", flatX, flatY, path, TopToBottom, no, Identity, Counts{0, 2, 0}, true},
		{"level path, TB, nil", flatX, flatY, path, TopToBottom, nil, Identity, Counts{0, 2, 0}, false},
		{"level path, LR", flatX, flatY, path, LeftToRight, yes, Identity, Counts{2, 0, 0}, false},
		{"level path, RL", flatX, flatY, path, RightToLeft, yes, MirrorX, Counts{2, 0, 0}, false},
		// (0, 1) to (-1, 0): Rotate90 comes before AntiTranspose.
		{"upward path, RL", upX, upY, path, RightToLeft, yes, Rotate90, Counts{2, 0, 0}, true},
		// 3 -> 0 runs left and down: TB has it already; LR wants it
		// mirrored in x; the cycle's three edges never count.
		{"cycle and a tail, TB", cycX, cycY, cyc, TopToBottom, yes, Identity, Counts{1, 0, 3}, false},
		{"cycle and a tail, LR", cycX, cycY, cyc, LeftToRight, yes, MirrorX, Counts{1, 0, 3}, false},
		{"cycle and a tail, BT", cycX, cycY, cyc, BottomToTop, yes, MirrorY, Counts{1, 0, 3}, false},
		{"tie", tieX, tieY, tie, TopToBottom, yes, Identity, Counts{1, 1, 0}, false},
		{"no edges", upX, upY, nil, TopToBottom, yes, Identity, Counts{0, 0, 0}, false},
	} {
		onCycle, err := OnCycles(len(tc.x), tc.edges)
		if err != nil {
			t.Fatal(err)
		}
		asked := false
		ok := tc.swapOK
		if ok != nil {
			ok = func() bool {
				if asked {
					t.Errorf("%s: swapOK asked twice", tc.name)
				}
				asked = true
				return tc.swapOK()
			}
		}
		s, c, err := Orient(tc.edges, onCycle, tc.x, tc.y, tc.d, ok)
		if err != nil {
			t.Fatal(err)
		}
		if s != tc.want || c != tc.counts || asked != tc.asked {
			t.Errorf("%s: %v %+v (asked %v), want %v %+v (asked %v)", tc.name, s, c, asked, tc.want, tc.counts, tc.asked)
		}
		// The counts are those of the drawing mapped by the choice.
		mx, my := make([]int64, len(tc.x)), make([]int64, len(tc.x))
		for v := range mx {
			mx[v], my[v] = s.Apply(tc.x[v], tc.y[v])
		}
		if got, _ := Count(tc.edges, onCycle, mx, my, tc.d); got != c {
			t.Errorf("%s: Count of the mapped drawing %+v, Orient says %+v", tc.name, got, c)
		}
	}
	if _, _, err := Orient([][2]int32{{0, 5}}, []bool{false}, upX, upY, TopToBottom, nil); err == nil {
		t.Error("edge out of range: no error")
	}
	if _, _, err := Orient(path, []bool{false}, upX, upY, TopToBottom, nil); err == nil {
		t.Error("short cycle flags: no error")
	}
}

// TestOrientAgainstEverySymmetry: on random digraphs at random points,
// Orient's choice is the first in Symmetries among the allowed ones with
// the most edges along, each symmetry applied to the points and counted
// by Count (independent of Orient's count by axis).
func TestOrientAgainstEverySymmetry(t *testing.T) {
	rng := rand.New(rand.NewPCG(18, 3))
	for trial := range 2000 {
		n := 1 + rng.IntN(8)
		x, y := make([]int64, n), make([]int64, n)
		for v := range x {
			x[v], y[v] = int64(rng.IntN(5)), int64(rng.IntN(5)) // small range: level edges and ties
		}
		edges := make([][2]int32, rng.IntN(2*n+1))
		for i := range edges {
			edges[i] = [2]int32{int32(rng.IntN(n)), int32(rng.IntN(n))}
		}
		onCycle, err := OnCycles(n, edges)
		if err != nil {
			t.Fatal(err)
		}
		d := Direction(rng.IntN(4))
		swap := rng.IntN(2) == 0
		got, c, err := Orient(edges, onCycle, x, y, d, func() bool { return swap })
		if err != nil {
			t.Fatal(err)
		}
		want, best := Identity, Counts{Along: -1}
		for _, s := range Symmetries {
			if s.SwapsAxes() && !swap {
				continue
			}
			mx, my := make([]int64, n), make([]int64, n)
			for v := range mx {
				mx[v], my[v] = s.Apply(x[v], y[v])
			}
			k, err := Count(edges, onCycle, mx, my, d)
			if err != nil {
				t.Fatal(err)
			}
			if k.Along > best.Along {
				want, best = s, k
			}
		}
		if got != want || c != best {
			t.Fatalf("trial %d (%v, swap %v): %v %+v, want %v %+v\nx %v y %v edges %v", trial, d, swap, got, c, want, best, x, y, edges)
		}
	}
}
