package place

import (
	"testing"

	"github.com/gridwood/gridwood/internal/geomcheck"
	"github.com/gridwood/gridwood/internal/graphgen"
)

// TestReadableLimit checks both sides of readableLimit on Space: a
// component of readableLimit vertices gets the clearance check (no node box
// overlaps another, no edge passes through a box it does not end at, found
// by geomcheck), one of readableLimit+1 is counted Unchecked and keeps
// disjoint boxes; both drawings pass the crossing checker. The graph is a
// wheel's rim with spokes to a hub, so the drawing has long edges to clear.
func TestReadableLimit(t *testing.T) {
	for _, tc := range []struct {
		n         int
		unchecked int
	}{
		{readableLimit, 0},
		{readableLimit + 1, 1},
	} {
		g := graphgen.Grid(50, 100)
		if tc.n > g.N {
			g.Edges = append(g.Edges, [2]int32{int32(g.N - 1), int32(g.N)})
			g.N++
		}
		if g.N != tc.n {
			t.Fatalf("%d vertices, want %d", g.N, tc.n)
		}
		res, err := Draw(g.N, g.Edges, DrawOptions{Layout: Options{Compact: true, Smooth: 400}})
		if err != nil {
			t.Fatal(err)
		}
		b := Boxes{HalfW: make([]int64, g.N), HalfH: make([]int64, g.N), Gap: 18}
		for i := range b.HalfW {
			b.HalfW[i], b.HalfH[i] = 27, 18
		}
		sp, err := res.Space(b, SpaceOptions{})
		if err != nil {
			t.Fatal(err)
		}
		if sp.Unchecked != tc.unchecked {
			t.Errorf("n=%d: Unchecked %d, want %d", tc.n, sp.Unchecked, tc.unchecked)
		}
		pts := make([]geomcheck.Point, g.N)
		for v := range pts {
			pts[v] = geomcheck.Point{X: sp.X[v], Y: sp.Y[v]}
		}
		if p, err := geomcheck.First(pts, g.Edges, 1); err != nil || len(p) > 0 {
			t.Fatalf("n=%d: drawing problems %v %v", tc.n, p, err)
		}
		if o, err := geomcheck.BoxOverlaps(pts, b.HalfW, b.HalfH); err != nil || len(o) > 0 {
			t.Errorf("n=%d: %d box overlaps (%v)", tc.n, len(o), err)
		}
		if tc.unchecked == 0 {
			through, err := geomcheck.EdgeThroughBox(pts, b.HalfW, b.HalfH, g.Edges)
			if err != nil || len(through) > 0 {
				t.Errorf("n=%d: %d edges through boxes (%v)", tc.n, len(through), err)
			}
		}
	}
}
