package trig

import (
	"math"
	"testing"
)

// TestAgainstMath compares with the standard library (accurate to an ulp
// or so on any one machine): the series agrees to about 1e-12 over a few
// turns (its last term near pi is about 1e-13, and each reduction by 2 pi
// rounds), ample for placing points on a circle.
func TestAgainstMath(t *testing.T) {
	for i := -1000; i <= 1000; i++ {
		x := float64(i) * 0.0173
		if d := math.Abs(Sin(x) - math.Sin(x)); d > 1e-11 {
			t.Fatalf("Sin(%v) off by %g", x, d)
		}
		if d := math.Abs(Cos(x) - math.Cos(x)); d > 1e-11 {
			t.Fatalf("Cos(%v) off by %g", x, d)
		}
	}
}
