package flow

import (
	"fmt"
	"math/rand/v2"
	"slices"
	"testing"

	"github.com/gridwood/gridwood/place/geomcheck"
)

func TestOnCycles(t *testing.T) {
	for _, tc := range []struct {
		name  string
		n     int
		edges [][2]int32
		want  []bool
	}{
		{"empty", 0, nil, []bool{}},
		{"path", 3, [][2]int32{{0, 1}, {1, 2}}, []bool{false, false}},
		{"triangle and a tail", 4, [][2]int32{{0, 1}, {1, 2}, {2, 0}, {2, 3}}, []bool{true, true, true, false}},
		{"self-loop", 2, [][2]int32{{0, 0}, {0, 1}}, []bool{true, false}},
		{"two-cycle and a parallel edge", 2, [][2]int32{{0, 1}, {1, 0}, {0, 1}}, []bool{true, true, true}},
		// Two cycles joined one way: the joining edges lie on none.
		{"two components", 6, [][2]int32{{0, 1}, {1, 0}, {1, 2}, {2, 3}, {3, 4}, {4, 2}, {0, 5}, {5, 3}},
			[]bool{true, true, false, true, true, true, false, false}},
		// A diamond is acyclic however it is numbered.
		{"diamond", 4, [][2]int32{{3, 1}, {3, 2}, {1, 0}, {2, 0}}, []bool{false, false, false, false}},
	} {
		got, err := OnCycles(tc.n, tc.edges)
		if err != nil {
			t.Fatal(err)
		}
		if !slices.Equal(got, tc.want) {
			t.Errorf("%s: %v, want %v", tc.name, got, tc.want)
		}
	}
	if _, err := OnCycles(2, [][2]int32{{0, 2}}); err == nil {
		t.Error("edge out of range: no error")
	}
}

// reaches reports whether a path leads from s to t, by breadth-first
// search.
func reaches(n int, edges [][2]int32, s, t int32) bool {
	seen := make([]bool, n)
	queue := []int32{s}
	seen[s] = true
	for len(queue) > 0 {
		u := queue[0]
		queue = queue[1:]
		if u == t {
			return true
		}
		for _, e := range edges {
			if e[0] == u && !seen[e[1]] {
				seen[e[1]] = true
				queue = append(queue, e[1])
			}
		}
	}
	return false
}

// TestOnCyclesAgainstSearch: an edge u -> v lies on a cycle exactly when
// v reaches u, checked by a search from every edge's head on random
// digraphs.
func TestOnCyclesAgainstSearch(t *testing.T) {
	rng := rand.New(rand.NewPCG(18, 4))
	for trial := range 500 {
		n := 1 + rng.IntN(12)
		edges := make([][2]int32, rng.IntN(3*n))
		for i := range edges {
			edges[i] = [2]int32{int32(rng.IntN(n)), int32(rng.IntN(n))}
		}
		got, err := OnCycles(n, edges)
		if err != nil {
			t.Fatal(err)
		}
		for i, e := range edges {
			if want := reaches(n, edges, e[1], e[0]); got[i] != want {
				t.Fatalf("trial %d: edge %v on a cycle: %v, want %v (edges %v)", trial, e, got[i], want, edges)
			}
		}
	}
}

// TestOnCyclesLong: a cycle of a million nodes and a path of a million
// more, deeper than any recursion should go.
func TestOnCyclesLong(t *testing.T) {
	const n = 1_000_000
	edges := make([][2]int32, 0, 2*n)
	for v := range int32(n) {
		edges = append(edges, [2]int32{v, (v + 1) % n})
	}
	for v := int32(n); v < 2*n-1; v++ {
		edges = append(edges, [2]int32{v, v + 1})
	}
	got, err := OnCycles(2*n, edges)
	if err != nil {
		t.Fatal(err)
	}
	for i, on := range got {
		if on != (i < n) {
			t.Fatalf("edge %d on a cycle: %v", i, on)
		}
	}
}

func TestRankdir(t *testing.T) {
	for _, tc := range []struct {
		in     string
		want   Direction
		ok     bool
		dx, dy int
	}{
		{"", TopToBottom, true, 0, -1},
		{"TB", TopToBottom, true, 0, -1},
		{" lr ", LeftToRight, true, 1, 0},
		{"BT", BottomToTop, true, 0, 1},
		{"Rl", RightToLeft, true, -1, 0},
		{"sideways", TopToBottom, false, 0, -1},
	} {
		d, ok := ParseRankdir(tc.in)
		dx, dy := d.Axis()
		if d != tc.want || ok != tc.ok || dx != tc.dx || dy != tc.dy {
			t.Errorf("%q: %v %v (%d, %d)", tc.in, d, ok, dx, dy)
		}
		if ok && tc.in != "" {
			if back, _ := ParseRankdir(d.String()); back != d {
				t.Errorf("%v does not read back", d)
			}
		}
	}
}

// TestCount: a build pipeline drawn top to bottom (y falling), with a
// level edge, an upward edge and a three-node cycle, counted under each
// rankdir. Nodes (y up): fetch 0 (0,300), compile 1 (-100,200), lint 2
// (100,200), test 3 (0,100), package 4 (0,0), retry 5 (150,50), notify 6
// (-200,300), flaky 7 (250,100). Five edges run down, compile -> lint is
// level, package -> notify runs up and left, test -> retry -> flaky ->
// test is a cycle. Across: x rises on fetch -> lint, compile -> test and
// compile -> lint, falls on fetch -> compile, lint -> test and package ->
// notify, stays on test -> package.
func TestCount(t *testing.T) {
	x := []int64{0, -100, 100, 0, 0, 150, -200, 250}
	y := []int64{300, 200, 200, 100, 0, 50, 300, 100}
	edges := [][2]int32{
		{0, 1}, {0, 2}, {1, 3}, {2, 3}, {3, 4}, // down
		{1, 2},                 // level
		{4, 6},                 // up
		{3, 5}, {5, 7}, {7, 3}, // cycle
	}
	pts := make([]geomcheck.Point, len(x))
	for v := range pts {
		pts[v] = geomcheck.Point{X: x[v], Y: y[v]}
	}
	if p, err := geomcheck.Check(pts, edges); err != nil || len(p) > 0 {
		t.Fatalf("geomcheck: %v %v", p, err)
	}
	onCycle, err := OnCycles(len(x), edges)
	if err != nil {
		t.Fatal(err)
	}
	for _, tc := range []struct {
		d    Direction
		want Counts
	}{
		{TopToBottom, Counts{Along: 5, Against: 2, OnCycles: 3}},
		{BottomToTop, Counts{Along: 1, Against: 6, OnCycles: 3}},
		{LeftToRight, Counts{Along: 3, Against: 4, OnCycles: 3}},
		{RightToLeft, Counts{Along: 3, Against: 4, OnCycles: 3}},
	} {
		got, err := Count(edges, onCycle, x, y, tc.d)
		if err != nil {
			t.Fatal(err)
		}
		if got != tc.want || got.Along+got.Against+got.OnCycles != len(edges) {
			t.Errorf("%v: %+v, want %+v", tc.d, got, tc.want)
		}
		fx, fy := make([]float64, len(x)), make([]float64, len(y))
		for v := range x {
			fx[v], fy[v] = float64(x[v]), float64(y[v])
		}
		if gotF, _ := Count(edges, onCycle, fx, fy, tc.d); gotF != got {
			t.Errorf("%v: float positions %+v, integer %+v", tc.d, gotF, got)
		}
	}
	if _, err := Count(edges, onCycle[:2], x, y, TopToBottom); err == nil {
		t.Error("short cycle flags: no error")
	}
	if _, err := Count([][2]int32{{0, 9}}, []bool{false}, x, y, TopToBottom); err == nil {
		t.Error("edge out of range: no error")
	}
}

func ExampleCount() {
	// a -> b -> c drawn top to bottom, and c -> a back up: all three
	// lie on a cycle; d -> a points up, against the flow.
	edges := [][2]int32{{0, 1}, {1, 2}, {2, 0}, {3, 0}}
	x := []int64{0, 0, 100, -100}
	y := []int64{200, 100, 0, 0}
	onCycle, _ := OnCycles(4, edges)
	c, _ := Count(edges, onCycle, x, y, TopToBottom)
	fmt.Printf("%+v\n", c)
	// Output: {Along:0 Against:1 OnCycles:3}
}
