package readable

import (
	"math/rand/v2"
	"testing"

	"github.com/gridwood/gridwood/internal/graphgen"
	"github.com/gridwood/gridwood/place/mesh"
)

// TestUntangleRepairsFolds folds plane drawings (a grid at its grid
// points; Delaunay triangulations of random points, less a third of their
// sides) by moving one to three vertices to random places, and checks
// with the independent checker that untangle never leaves more crossings
// than it was given, and that it repairs every fold of one vertex in the
// grid (its barycentre is a plane place for it).
func TestUntangleRepairsFolds(t *testing.T) {
	rng := rand.New(rand.NewPCG(21, 22))
	grid := graphgen.Grid(6, 6)
	gx, gy := make([]float64, grid.N), make([]float64, grid.N)
	for v := range gx {
		gx[v], gy[v] = float64(v%6), float64(v/6)
	}
	repaired := 0
	for trial := range 60 {
		var x, y []float64
		var edges [][2]int32
		moves := 1
		if trial%2 == 0 {
			x, y, edges = append([]float64(nil), gx...), append([]float64(nil), gy...), grid.Edges
		} else {
			n := 10 + rng.IntN(30)
			x, y = make([]float64, n), make([]float64, n)
			for i := range x {
				x[i], y[i] = float64(rng.IntN(1000))/100, float64(rng.IntN(1000))/100+float64(i)/1e5
			}
			m, err := mesh.New(x, y, nil, 0)
			if err != nil {
				t.Fatal(err)
			}
			for _, s := range meshSides(m) {
				if rng.IntN(3) != 0 {
					edges = append(edges, s)
				}
			}
			moves = 1 + rng.IntN(3)
		}
		lo, hi := x[0], x[0]
		for _, c := range x {
			lo, hi = min(lo, c), max(hi, c)
		}
		for range moves {
			v := rng.IntN(len(x))
			x[v], y[v] = lo+rng.Float64()*(hi-lo), lo+rng.Float64()*(hi-lo)
		}
		before := Problems(t, x, y, edges)
		ux, uy := untangle(x, y, edges)
		after := Problems(t, ux, uy, edges)
		if after > before {
			t.Fatalf("trial %d: %d crossings before untangle, %d after", trial, before, after)
		}
		if trial%2 == 0 && before > 0 {
			if after != 0 {
				t.Errorf("trial %d: a grid with one vertex moved keeps %d of %d crossings", trial, after, before)
			}
			repaired++
		}
	}
	if repaired < 10 {
		t.Fatalf("only %d folded grids", repaired)
	}
}

// meshSides lists the sides of m between drawing vertices, each once.
func meshSides(m *mesh.Mesh) [][2]int32 {
	var out [][2]int32
	m.Rings(func(v int32, ring []int32) {
		for _, w := range ring {
			if v < w && int(w) < m.N() {
				out = append(out, [2]int32{v, w})
			}
		}
	})
	return out
}
