package place

import (
	"fmt"
	"testing"

	"github.com/gridwood/gridwood/internal/exact"
	"github.com/gridwood/gridwood/internal/graphgen"
	"github.com/gridwood/gridwood/place/geomcheck"
)

// orientations lists, for every vertex and every edge not ending at it
// whose span along some axis strictly contains the vertex, the sign of
// the vertex's side of the edge's line, and for every vertex pair the
// order along each axis: what compaction must keep (its doc comment:
// points keep their order along the axis shrunk, and no vertex changes
// sides with an edge whose span strictly contains it; outside both spans
// a vertex may pass the line beyond the segment, which changes nothing).
func orientations(x, y []int64, edges [][2]int32) []int {
	inside := func(a, b, c int64) bool { return min(a, b) < c && c < max(a, b) }
	var out []int
	for w := range x {
		for _, e := range edges {
			u, v := e[0], e[1]
			if int(u) == w || int(v) == w || !inside(x[u], x[v], x[w]) && !inside(y[u], y[v], y[w]) {
				continue
			}
			out = append(out, exact.OrientInt(x[u], y[u], x[v], y[v], x[w], y[w]))
		}
		for v := range x {
			out = append(out, cmp64(x[v], x[w]), cmp64(y[v], y[w]))
		}
	}
	return out
}

// TestCompact checks compact on plane straight-line drawings: Schnyder
// grid drawings of random triangulations, grids and nested triangles
// (uncompacted, from Layout), and the same drawings spread out to every
// third grid line. Afterwards the drawing passes geomcheck, the
// independent crossing checker, with every edge of the triangulation;
// every vertex is on the same side of every edge's line and in the same
// order along both axes as before; the extent did not grow, and shrank
// for the spread drawings. The areas are logged (saved on the spread
// drawings: 43% to 92%). TestCompactExact has small cases worked by hand.
func TestCompact(t *testing.T) {
	for _, g := range []graphgen.Graph{
		graphgen.RandomTriangulation(40, 1),
		graphgen.RandomTriangulation(200, 2),
		graphgen.NestedTriangles(15),
		graphgen.TriangulatedGrid(8, 9),
		graphgen.Grid(7, 7),
		graphgen.Wheel(12),
	} {
		emb := mustEmbed(t, g)
		d, err := Layout(emb, Options{})
		if err != nil {
			t.Fatal(err)
		}
		edges := g.Edges
		for _, spread := range []int64{1, 3} {
			name := fmt.Sprintf("%s spread %d", g.Name, spread)
			x, y := make([]int64, g.N), make([]int64, g.N)
			var w0, h0 int64
			for v := range x {
				x[v], y[v] = d.X[v]*spread, d.Y[v]*spread
				w0, h0 = max(w0, x[v]), max(h0, y[v])
			}
			before := orientations(x, y, edges)
			w, h := compact(x, y, edges)
			pts := make([]geomcheck.Point, g.N)
			for v := range pts {
				pts[v] = geomcheck.Point{X: x[v], Y: y[v]}
			}
			if p, err := geomcheck.First(pts, edges, 1); err != nil || len(p) > 0 {
				t.Fatalf("%s: compacted drawing has problems %v %v", name, p, err)
			}
			after := orientations(x, y, edges)
			for i := range before {
				if before[i] != after[i] {
					t.Fatalf("%s: an orientation or axis order changed (entry %d: %d to %d)", name, i, before[i], after[i])
				}
			}
			if w > w0 || h > h0 {
				t.Errorf("%s: extent grew from %d x %d to %d x %d", name, w0, h0, w, h)
			}
			if spread == 3 && w*h >= w0*h0 {
				t.Errorf("%s: nothing saved of %d x %d", name, w0, h0)
			}
			t.Logf("%s: %d x %d to %d x %d (%.0f%% of the area saved)", name, w0, h0, w, h, 100*(1-float64(w*h)/float64(w0*h0)))
		}
	}
}

// TestCompactExact: small drawings worked by hand. A path along the x
// axis at 0, 5, 10 closes to 0, 1, 2 (collinear edges meet only at their
// shared ends either way); a triangle spread to (0,0), (3,0), (0,3) closes
// to the unit triangle. A triangle with a vertex inside, (0,0), (6,0),
// (0,6) and (2,2): both x gaps close (x 0, 1, 2; the inner vertex (1,2)
// stays inside, 3x + y = 5 < 6); of the y gaps only the lower one can
// (closing both would put (1,1) on the edge (2,0)-(0,2)), and a gap goes
// whole or not at all, so the top stays at y = 5.
func TestCompactExact(t *testing.T) {
	for _, tc := range []struct {
		name         string
		x, y         []int64
		edges        [][2]int32
		wantX, wantY []int64
	}{
		{"path", []int64{0, 5, 10}, []int64{0, 0, 0}, [][2]int32{{0, 1}, {1, 2}}, []int64{0, 1, 2}, []int64{0, 0, 0}},
		{"triangle", []int64{0, 3, 0}, []int64{0, 0, 3}, [][2]int32{{0, 1}, {1, 2}, {2, 0}}, []int64{0, 1, 0}, []int64{0, 0, 1}},
		{"triangle and centre", []int64{0, 6, 0, 2}, []int64{0, 0, 6, 2}, [][2]int32{{0, 1}, {1, 2}, {2, 0}, {3, 0}, {3, 1}, {3, 2}}, []int64{0, 2, 0, 1}, []int64{0, 0, 5, 1}},
	} {
		x, y := append([]int64(nil), tc.x...), append([]int64(nil), tc.y...)
		compact(x, y, tc.edges)
		if fmt.Sprint(x, y) != fmt.Sprint(tc.wantX, tc.wantY) {
			t.Errorf("%s: compacted to %v %v, want %v %v", tc.name, x, y, tc.wantX, tc.wantY)
		}
	}
}
