package place

import (
	"slices"
	"testing"

	"github.com/gridwood/gridwood/internal/exact"
	"github.com/gridwood/gridwood/internal/graphgen"
	"github.com/gridwood/gridwood/place/geomcheck"
	"github.com/gridwood/gridwood/planarize"
)

// faceTurns walks every face of the embedding and returns, per face, the
// signs of its turns in the drawing x, y (exact integers).
func faceTurns(emb *planarize.Embedding, x, y []int64) [][]int {
	seen := make([]bool, 2*emb.M())
	var faces [][]int
	for d0 := int32(0); int(d0) < len(seen); d0++ {
		if seen[d0] {
			continue
		}
		var ds []int32
		for d := d0; !seen[d]; d = emb.FaceNext(d) {
			seen[d] = true
			ds = append(ds, d)
		}
		var turns []int
		for i, d := range ds {
			a, b := emb.Tail(d), emb.Head(d)
			c := emb.Head(ds[(i+1)%len(ds)])
			turns = append(turns, exact.OrientInt(x[a], y[a], x[b], y[b], x[c], y[c]))
		}
		faces = append(faces, turns)
	}
	return faces
}

// TestDrawConvexMethod checks Method Convex end to end, through Draw and
// Space: a 3-connected graph (Platonic solids from handbook coordinates,
// wheels; 3-connected planar graphs have one embedding up to mirroring,
// Whitney 1933, so the test's own embedding has the same faces) comes out
// with every inner face convex (no turn against the others; straight
// angles allowed, as in Felsner 2001) and the grid bound (f-1) x (f-1);
// and a graph that is not 3-connected falls back and is counted.
func TestDrawConvexMethod(t *testing.T) {
	for _, g := range []graphgen.Graph{
		graphgen.Tetrahedron(), graphgen.Cube(), graphgen.Octahedron(), graphgen.Dodecahedron(), graphgen.Icosahedron(),
		graphgen.Wheel(7), graphgen.Wheel(30), graphgen.RandomTriangulation(60, 3),
	} {
		res, err := Draw(g.N, g.Edges, DrawOptions{Layout: Options{Method: Convex, Compact: true, Smooth: 400}})
		if err != nil {
			t.Fatalf("%s: %v", g.Name, err)
		}
		if res.NotConvex != 0 || len(res.Components) != 1 || !res.Components[0].Convex {
			t.Fatalf("%s: not drawn convex (NotConvex %d)", g.Name, res.NotConvex)
		}
		emb, _ := planarize.Embed(g.N, g.Edges)
		f := emb.Faces()
		if res.Width > int64(f-1) || res.Height > int64(f-1) {
			t.Errorf("%s: grid %dx%d exceeds (f-1) = %d", g.Name, res.Width, res.Height, f-1)
		}
		b := equalBoxes(g.N, 27, 18)
		sp, err := res.Space(b, SpaceOptions{})
		if err != nil {
			t.Fatal(err)
		}
		for name, xy := range map[string][2][]int64{"grid": {res.X, res.Y}, "points": {sp.X, sp.Y}} {
			pts := make([]geomcheck.Point, g.N)
			for v := range pts {
				pts[v] = geomcheck.Point{X: xy[0][v], Y: xy[1][v]}
			}
			if p, err := geomcheck.First(pts, g.Edges, 1); err != nil || len(p) > 0 {
				t.Fatalf("%s %s: drawing problems %v %v", g.Name, name, p, err)
			}
			// All faces but one turn one way (or straight); the outer face,
			// walked with the unbounded region on its left, turns the other.
			positive, negative := 0, 0
			for _, turns := range faceTurns(emb, xy[0], xy[1]) {
				pos, neg := 0, 0
				for _, s := range turns {
					if s > 0 {
						pos++
					} else if s < 0 {
						neg++
					}
				}
				switch {
				case pos > 0 && neg == 0:
					positive++
				case neg > 0 && pos == 0:
					negative++
				default:
					t.Errorf("%s %s: a face turns both ways (not convex): %v", g.Name, name, turns)
				}
			}
			if min(positive, negative) != 1 {
				t.Errorf("%s %s: %d faces turn left and %d right; want exactly one outer face", g.Name, name, positive, negative)
			}
		}
	}
	// A cycle with a chord is 2-connected, not 3-connected: the fallback.
	edges := [][2]int32{{0, 1}, {1, 2}, {2, 3}, {3, 4}, {4, 0}, {0, 2}}
	res, err := Draw(5, edges, DrawOptions{Layout: Options{Method: Convex}})
	if err != nil {
		t.Fatal(err)
	}
	if res.NotConvex != 1 || res.Components[0].Convex || !res.Components[0].FellBack {
		t.Errorf("cycle with chord: NotConvex %d, Convex %v; want the fallback", res.NotConvex, res.Components[0].Convex)
	}
	// Three components: a cube (3-connected, convex), a square on 8..11
	// and a cycle with a chord on 12..16 (not 3-connected): the two
	// fallbacks are named by their least vertices, 8 and 12.
	cube := graphgen.Cube()
	edges = append([][2]int32(nil), cube.Edges...)
	edges = append(edges, [2]int32{9, 10}, [2]int32{10, 11}, [2]int32{11, 8}, [2]int32{8, 9})
	edges = append(edges, [2]int32{13, 14}, [2]int32{14, 15}, [2]int32{15, 16}, [2]int32{16, 12}, [2]int32{12, 13}, [2]int32{12, 14})
	res, err = Draw(17, edges, DrawOptions{Layout: Options{Method: Convex}})
	if err != nil {
		t.Fatal(err)
	}
	if got := res.FellBackVertices(); !slices.Equal(got, []int{8, 12}) || res.NotConvex != 2 {
		t.Errorf("FellBackVertices %v (NotConvex %d), want [8 12]", got, res.NotConvex)
	}
}
