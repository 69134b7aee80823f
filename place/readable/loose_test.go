package readable_test

import (
	"math"
	"testing"

	"github.com/gridwood/gridwood/internal/graphgen"
	"github.com/gridwood/gridwood/place"
	"github.com/gridwood/gridwood/place/quality"
	"github.com/gridwood/gridwood/place/readable"
)

// TestLooseMarginsAlternative: where the best candidate's boxes are
// pressed, but not past loosenBelow (the octahedron's, drawn plane, need
// about three times its size to clear with these boxes), Draw offers the
// drawing from before the margins phase and the one parted with loosened
// boxes beside its result; where they are not pressed (a square grid
// drawn near its stress optimum), or pressed much more (the icosahedron's
// need about ten times), only the first. Each drawing is plane by
// geomcheck, the independent exact checker, at a fine integer scale.
func TestLooseMarginsAlternative(t *testing.T) {
	for _, tc := range []struct {
		g     graphgen.Graph
		loose bool
	}{{graphgen.Octahedron(), true}, {graphgen.Grid(6, 6), false}, {graphgen.Icosahedron(), false}} {
		g := tc.g
		t.Run(g.Name, func(t *testing.T) {
			out, kept := drawFromGrid(t, g)
			names := map[string]readable.Alternative{}
			for _, a := range out.Alternatives {
				names[a.Name] = a
			}
			_, before := names["before margins"]
			_, loose := names["loose margins"]
			if !before || loose != tc.loose || len(out.Alternatives) != len(names) {
				t.Fatalf("%d alternatives (before margins %v, loose margins %v), want loose margins %v", len(out.Alternatives), before, loose, tc.loose)
			}
			if problems := readable.Problems(t, out.X, out.Y, kept); problems > 0 {
				t.Errorf("result: %d crossings or touchings", problems)
			}
			for _, a := range out.Alternatives {
				if problems := readable.Problems(t, a.X, a.Y, kept); problems > 0 {
					t.Errorf("%s: %d crossings or touchings", a.Name, problems)
				}
				if !(a.Gain > 0) || math.IsInf(a.Gain, 0) {
					t.Errorf("%s: gain %v", a.Name, a.Gain)
				}
				s, _ := quality.Stress(a.X, a.Y, kept)
				t.Logf("%s: normalized stress %.4f, gain %.3f", a.Name, s, a.Gain)
			}
		})
	}
}

// drawFromGrid draws g readable from its grid drawing, with the
// command's default boxes and gaps, and returns the result with the kept
// edges.
func drawFromGrid(t *testing.T, g graphgen.Graph) (*readable.Output, [][2]int32) {
	t.Helper()
	res, err := place.Draw(g.N, g.Edges, place.DrawOptions{})
	if err != nil {
		t.Fatal(err)
	}
	x, y, hw, hh := gridStart(res)
	kept := res.Kept()
	out, err := readable.Draw(readable.Input{Edges: kept, X: x, Y: y, HalfW: hw, HalfH: hh, Gap: 18, EdgeGap: 13.5}, readable.Options{})
	if err != nil {
		t.Fatal(err)
	}
	return out, kept
}

// gridStart is the grid drawing of res as a start for Draw, with every
// node a 54 x 36 point box.
func gridStart(res *place.Result) (x, y, hw, hh []float64) {
	n := len(res.X)
	x, y = make([]float64, n), make([]float64, n)
	hw, hh = make([]float64, n), make([]float64, n)
	for i := range x {
		x[i], y[i] = float64(res.X[i]), float64(res.Y[i])
		hw[i], hh[i] = 27, 18
	}
	return x, y, hw, hh
}
