package readable

import (
	"math"
	"math/rand/v2"
	"testing"

	"github.com/gridwood/gridwood/place/mesh"
)

// TestPullReproducesPlaneTarget: when the target is itself a plane drawing
// of the triangulation, the mean value weights reproduce it (Floater 2003,
// the reproduction property of mean value coordinates).
func TestPullReproducesPlaneTarget(t *testing.T) {
	rng := rand.New(rand.NewPCG(1, 1))
	n := 200
	x, y := make([]float64, n), make([]float64, n)
	for i := range x {
		x[i], y[i] = rng.Float64()*1000, rng.Float64()*1000
	}
	m, err := mesh.New(x, y, nil, 0)
	if err != nil {
		t.Fatal(err)
	}
	// Solve with the frame the mesh itself uses.
	px, py := pull(m, x, y, 0)
	worst := 0.0
	for i := range x {
		worst = max(worst, math.Abs(px[i]-x[i]), math.Abs(py[i]-y[i]))
	}
	if worst > 1e-6 {
		t.Fatalf("pull moved a vertex by %g", worst)
	}
}
