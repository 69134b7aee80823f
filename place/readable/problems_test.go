package readable

import (
	"math"
	"testing"

	"github.com/gridwood/gridwood/place/geomcheck"
)

// Problems counts the problems geomcheck, the independent exact checker,
// finds in the drawing scaled so that its extent is about 2^30 and
// rounded to integers: crossings, overlaps, vertices on edges. It is
// exported for the package's external tests.
func Problems(t *testing.T, x, y []float64, edges [][2]int32) int {
	t.Helper()
	ext := 0.0
	for i := range x {
		ext = max(ext, math.Abs(x[i]), math.Abs(y[i]))
	}
	s := float64(1<<30) / ext
	pts := make([]geomcheck.Point, len(x))
	for i := range x {
		pts[i] = geomcheck.Point{X: int64(math.Round(x[i] * s)), Y: int64(math.Round(y[i] * s))}
	}
	problems, err := geomcheck.Check(pts, edges)
	if err != nil {
		t.Fatal(err)
	}
	return len(problems)
}
