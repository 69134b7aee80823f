package place

import (
	"errors"
	"fmt"
	"testing"

	"github.com/gridwood/gridwood/internal/graphgen"
	"github.com/gridwood/gridwood/place/geomcheck"
	"github.com/gridwood/gridwood/place/internal/spacing"
)

// equalBoxes gives n nodes boxes of half sizes hw x hh points, 18 points
// apart (the command's gap).
func equalBoxes(n int, hw, hh int64) Boxes {
	b := Boxes{HalfW: make([]int64, n), HalfH: make([]int64, n), Gap: 18}
	for v := range b.HalfW {
		b.HalfW[v], b.HalfH[v] = hw, hh
	}
	return b
}

// variedBoxes gives n nodes boxes of five widths (half widths 20 to 56
// points) and one height, 18 points apart, so that spacing is not only
// exercised on equal boxes.
func variedBoxes(n int) Boxes {
	b := equalBoxes(n, 0, 18)
	for v := range b.HalfW {
		b.HalfW[v] = 20 + int64(v%5)*9
	}
	return b
}

// drawSpaced draws g with the command's layout options and spaces the
// drawing for boxes b, failing the test on an error.
func drawSpaced(t *testing.T, g graphgen.Graph, b Boxes, opt SpaceOptions) (*Result, *Placed) {
	t.Helper()
	res, err := Draw(g.N, g.Edges, DrawOptions{Layout: Options{Compact: true, Smooth: 400}})
	if err != nil {
		t.Fatal(err)
	}
	sp, err := res.Space(b, opt)
	if err != nil {
		t.Fatal(err)
	}
	return res, sp
}

// checkSpaced checks a spaced drawing with geomcheck, the independent
// crossing checker: its edges neither cross nor touch (fatal), no two node
// boxes overlap, and no edge passes through a box it does not end at, which
// strict demands outright and otherwise only of components Space did not
// count unchecked or crowded.
func checkSpaced(t *testing.T, name string, sp *Placed, b Boxes, edges [][2]int32, strict bool) {
	t.Helper()
	pts := make([]geomcheck.Point, len(sp.X))
	for v := range pts {
		pts[v] = geomcheck.Point{X: sp.X[v], Y: sp.Y[v]}
	}
	if p, err := geomcheck.First(pts, edges, 1); err != nil || len(p) > 0 {
		t.Fatalf("%s: drawing problems %v %v", name, p, err)
	}
	if o, err := geomcheck.BoxOverlaps(pts, b.HalfW, b.HalfH); err != nil || len(o) > 0 {
		t.Errorf("%s: %d box overlaps (%v)", name, len(o), err)
	}
	through, err := geomcheck.EdgeThroughBox(pts, b.HalfW, b.HalfH, edges)
	if err != nil || len(through) > 0 && (strict || sp.Unchecked+sp.Crowded == 0) {
		t.Errorf("%s: %d edges through boxes, unchecked %d, crowded %d, strict %v (%v)", name, len(through), sp.Unchecked, sp.Crowded, strict, err)
	}
}

// TestReadableLimit checks both sides of spacing.ReadableLimit on Space: a
// component of spacing.ReadableLimit vertices gets the clearance check (no
// node box overlaps another, no edge passes through a box it does not end
// at, found by geomcheck), one of spacing.ReadableLimit+1 is counted
// Unchecked and keeps disjoint boxes; both drawings pass the crossing
// checker. The graphs are the 50 x 100 grid and the same with a pendant
// vertex: drawings that need stretching (or refinement) to clear their
// boxes, and can be cleared.
func TestReadableLimit(t *testing.T) {
	for _, tc := range []struct {
		n         int
		unchecked int
	}{
		{spacing.ReadableLimit, 0},
		{spacing.ReadableLimit + 1, 1},
	} {
		g := graphgen.Grid(50, 100)
		if tc.n > g.N {
			g.Edges = append(g.Edges, [2]int32{int32(g.N - 1), int32(g.N)})
			g.N++
		}
		if g.N != tc.n {
			t.Fatalf("%d vertices, want %d", g.N, tc.n)
		}
		b := equalBoxes(g.N, 27, 18)
		_, sp := drawSpaced(t, g, b, SpaceOptions{})
		if sp.Unchecked != tc.unchecked {
			t.Errorf("n=%d: Unchecked %d, want %d", tc.n, sp.Unchecked, tc.unchecked)
		}
		checkSpaced(t, fmt.Sprintf("n=%d", tc.n), sp, b, g.Edges, tc.unchecked == 0)
	}
}

// TestSpacingRule checks the spacing rule (place/doc.go, The spacing rule) on drawings
// that need stretching and refinement, with geomcheck: no two node boxes
// overlap, and no kept edge passes through the box of a node it does not
// end at, unless Space counted the component Unchecked or Crowded; every
// drawing is crossing-free. Boxes vary in width so that the rule is not
// only exercised on equal boxes.
func TestSpacingRule(t *testing.T) {
	for _, g := range []graphgen.Graph{
		graphgen.RandomTriangulation(300, 1),
		graphgen.TriangulatedGrid(30, 30),
		graphgen.Grid(50, 50),
		graphgen.RandomPlanar(300, 0.6, 2),
		graphgen.NestedTriangles(100),
		graphgen.Star(300),
		graphgen.RandomTree(300, 3),
		graphgen.PlanarPlusExtra(500, 30, 4),
		graphgen.DisjointUnion(graphgen.Wheel(40), graphgen.Cube(), graphgen.Path(30)),
	} {
		for _, grid := range []bool{false, true} {
			b := variedBoxes(g.N)
			res, sp := drawSpaced(t, g, b, SpaceOptions{GridOnly: grid})
			checkSpaced(t, fmt.Sprintf("%s grid=%v", g.Name, grid), sp, b, res.Kept(), false)
			t.Logf("%s grid=%v: %d x %d points, unchecked %d, crowded %d", g.Name, grid, sp.Width, sp.Height, sp.Unchecked, sp.Crowded)
		}
	}
}

// TestDrawingSizeBound checks that the candidates Space weighs keep
// drawings of typical graphs within the face-count grid at the base unit:
// at most (2n-4) base units across (Felsner 2001: f - 1 <= 2n - 5 grid
// steps, plus a box), where the Schnyder grid alone, stretched to clear
// the boxes, grows past a hundred times that on these graphs (bench/RESULTS.md,
// Spacing). Every drawing still passes geomcheck and clears every box.
func TestDrawingSizeBound(t *testing.T) {
	for _, g := range []graphgen.Graph{
		graphgen.RandomTriangulation(300, 1),
		graphgen.RandomPlanar(300, 0.6, 1),
		graphgen.NestedTriangles(100),
		graphgen.RandomTriangulation(1000, 2),
	} {
		b := equalBoxes(g.N, 27, 18)
		res, sp := drawSpaced(t, g, b, SpaceOptions{})
		if limit := int64(2*g.N-4) * sp.Unit; sp.Width > limit || sp.Height > limit {
			t.Errorf("%s: %d x %d points, more than %d across", g.Name, sp.Width, sp.Height, limit)
		}
		if sp.Unchecked+sp.Crowded > 0 {
			t.Errorf("%s: unchecked %d, crowded %d", g.Name, sp.Unchecked, sp.Crowded)
		}
		checkSpaced(t, g.Name, sp, b, res.Kept(), true)
	}
}

// TestSpaceBoxLimit checks the bound on box sizes: over 65,536 points
// Space refuses (with half sizes of 2^30 the spacing checks would leave
// exact arithmetic and could pass crossing drawings), and at the bound the
// drawings still pass geomcheck and clear their boxes.
func TestSpaceBoxLimit(t *testing.T) {
	for _, g := range []graphgen.Graph{graphgen.RandomTriangulation(50, 3), graphgen.NestedTriangles(12), graphgen.Grid(6, 7)} {
		res, err := Draw(g.N, g.Edges, DrawOptions{Layout: Options{Compact: true, Smooth: 400}})
		if err != nil {
			t.Fatal(err)
		}
		for _, b := range []Boxes{equalBoxes(g.N, 10, maxBoxHalf+1), equalBoxes(g.N, 1<<30, 10), {HalfW: make([]int64, g.N), HalfH: make([]int64, g.N), Gap: maxBoxHalf + 1}} {
			if _, err := res.Space(b, SpaceOptions{}); !errors.Is(err, errBoxSize) {
				t.Errorf("%s: boxes over the bound: error %v, want %v", g.Name, err, errBoxSize)
			}
		}
		b := equalBoxes(g.N, 10, maxBoxHalf)
		b.Gap = maxBoxHalf
		sp, err := res.Space(b, SpaceOptions{})
		if err != nil {
			t.Fatal(err)
		}
		checkSpaced(t, g.Name+" at the bound", sp, b, res.Kept(), false)
	}
}
