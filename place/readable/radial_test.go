package readable

import (
	"math"
	"math/rand/v2"
	"slices"
	"testing"

	"github.com/gridwood/gridwood/internal/graphgen"
	"github.com/gridwood/gridwood/place/geomcheck"
)

// TestRadialStartPlane: the radial drawing of a tree, with each wedge
// bounded as P. Eades bounds it ("Drawing free trees", 1992), is plane,
// checked by geomcheck (the independent exact checker) at a fine integer
// scale, and turns the neighbours of every vertex in the order the target
// drawing does: it keeps the target's embedding. The targets are random
// points, so their own drawings cross all over.
func TestRadialStartPlane(t *testing.T) {
	for _, g := range []graphgen.Graph{
		graphgen.Path(40),
		graphgen.Star(60),
		graphgen.RandomTree(12, 1),
		graphgen.RandomTree(300, 2),
		graphgen.RandomTree(3000, 3),
		graphgen.RandomTree(10000, 1),
	} {
		t.Run(g.Name, func(t *testing.T) {
			rng := rand.New(rand.NewPCG(7, uint64(g.N)))
			tx, ty := make([]float64, g.N), make([]float64, g.N)
			for v := range tx {
				tx[v], ty[v] = rng.Float64(), rng.Float64()
			}
			lengths := make([]float64, len(g.Edges))
			for i := range lengths {
				lengths[i] = 60 + 40*rng.Float64()
			}
			x, y := radialStart(g.N, g.Edges, lengths, tx, ty)
			ext := 0.0
			for v := range x {
				ext = max(ext, math.Abs(x[v]), math.Abs(y[v]))
			}
			s := float64(1<<30) / ext
			pts := make([]geomcheck.Point, g.N)
			for v := range pts {
				pts[v] = geomcheck.Point{X: int64(math.Round(x[v] * s)), Y: int64(math.Round(y[v] * s))}
			}
			problems, err := geomcheck.Check(pts, g.Edges)
			if err != nil {
				t.Fatal(err)
			}
			if len(problems) > 0 {
				t.Fatalf("%d crossings or touchings, first %+v", len(problems), problems[0])
			}
			nbrs := make([][]int32, g.N)
			for _, e := range g.Edges {
				nbrs[e[0]] = append(nbrs[e[0]], e[1])
				nbrs[e[1]] = append(nbrs[e[1]], e[0])
			}
			for v, ws := range nbrs {
				if len(ws) < 3 {
					continue
				}
				a, b := turning(ws, tx, ty, int32(v)), turning(ws, x, y, int32(v))
				if !sameCycle(a, b) {
					t.Fatalf("vertex %d: neighbours turn %v in the target, %v in the drawing", v, a, b)
				}
			}
		})
	}
}

// turning lists ws counter-clockwise around v by angle (math.Atan2: a
// test may use the library's angles).
func turning(ws []int32, x, y []float64, v int32) []int32 {
	out := slices.Clone(ws)
	slices.SortFunc(out, func(a, b int32) int {
		da := math.Atan2(y[a]-y[v], x[a]-x[v])
		db := math.Atan2(y[b]-y[v], x[b]-x[v])
		switch {
		case da < db:
			return -1
		case da > db:
			return 1
		}
		return 0
	})
	return out
}

// sameCycle reports whether b is a rotation of a.
func sameCycle(a, b []int32) bool {
	if len(a) != len(b) {
		return false
	}
	k := slices.Index(b, a[0])
	if k < 0 {
		return false
	}
	for i := range a {
		if a[i] != b[(i+k)%len(b)] {
			return false
		}
	}
	return true
}

// TestArcCos checks the bisection against the standard library's
// math.Acos (a test may use it; the drawing may not).
func TestArcCos(t *testing.T) {
	for _, c := range []float64{0, 0.1, 0.5, 0.9, 0.999, 1} {
		if got, want := arcCos(c), math.Acos(c); math.Abs(got-want) > 1e-12 {
			t.Errorf("arcCos(%g) = %g, want %g", c, got, want)
		}
	}
}
