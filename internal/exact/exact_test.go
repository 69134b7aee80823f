package exact

import (
	"math"
	"math/big"
	"math/rand/v2"
	"testing"
)

// ratOrient is the reference: the determinant in exact rational arithmetic.
func ratOrient(ax, ay, bx, by, cx, cy float64) int {
	r := func(v float64) *big.Rat { return new(big.Rat).SetFloat64(v) }
	acx := new(big.Rat).Sub(r(ax), r(cx))
	acy := new(big.Rat).Sub(r(ay), r(cy))
	bcx := new(big.Rat).Sub(r(bx), r(cx))
	bcy := new(big.Rat).Sub(r(by), r(cy))
	return new(big.Rat).Sub(new(big.Rat).Mul(acx, bcy), new(big.Rat).Mul(acy, bcx)).Sign()
}

func ratInCircle(ax, ay, bx, by, cx, cy, dx, dy float64) int {
	r := func(v float64) *big.Rat { return new(big.Rat).SetFloat64(v) }
	s := func(a, b *big.Rat) *big.Rat { return new(big.Rat).Sub(a, b) }
	m := func(a, b *big.Rat) *big.Rat { return new(big.Rat).Mul(a, b) }
	p := func(a, b *big.Rat) *big.Rat { return new(big.Rat).Add(a, b) }
	adx, ady := s(r(ax), r(dx)), s(r(ay), r(dy))
	bdx, bdy := s(r(bx), r(dx)), s(r(by), r(dy))
	cdx, cdy := s(r(cx), r(dx)), s(r(cy), r(dy))
	al := p(m(adx, adx), m(ady, ady))
	bl := p(m(bdx, bdx), m(bdy, bdy))
	cl := p(m(cdx, cdx), m(cdy, cdy))
	t := m(al, s(m(bdx, cdy), m(cdx, bdy)))
	t = p(t, m(bl, s(m(cdx, ady), m(adx, cdy))))
	t = p(t, m(cl, s(m(adx, bdy), m(bdx, ady))))
	return t.Sign()
}

// TestOrientNearlyCollinear runs the classroom example of L. Kettner, K.
// Mehlhorn, S. Pion, S. Schirra and C. Yap, "Classroom examples of
// robustness problems in geometric computations", Comput. Geom. 40 (2008):
// p = (0.5 + x u, 0.5 + y u) with u = 2^-53 against q = (12, 12) and
// r = (24, 24). Expanding the determinant gives 12 (py - px) exactly, so
// the orientation is the sign of y - x, which the naive float formula gets
// wrong for many (x, y) in that paper's 256 x 256 window.
func TestOrientNearlyCollinear(t *testing.T) {
	u := math.Ldexp(1, -53)
	naiveWrong := 0
	for x := 0; x < 256; x++ {
		for y := 0; y < 256; y++ {
			px, py := 0.5+float64(x)*u, 0.5+float64(y)*u
			want := ratOrient(px, py, 12, 12, 24, 24)
			// want from the expansion: sign(py - px), px and py exact.
			if want != sign(py-px) {
				t.Fatalf("reference disagrees with 12 (py - px) at x=%d y=%d", x, y)
			}
			if got := Orient(px, py, 12, 12, 24, 24); got != want {
				t.Fatalf("Orient at x=%d y=%d = %d, want %d", x, y, got, want)
			}
			if sign(float64((12-px)*(24-py))-float64((12-py)*(24-px))) != want {
				naiveWrong++
			}
		}
	}
	// The example only tests something if plain floating point fails on it.
	if naiveWrong == 0 {
		t.Fatal("the naive formula never failed: the example does not exercise the exact path")
	}
}

func TestOrientRandomAgainstRationals(t *testing.T) {
	rng := rand.New(rand.NewPCG(1, 2))
	for i := 0; i < 20000; i++ {
		var c [6]float64
		for j := range c {
			switch rng.IntN(3) {
			case 0:
				c[j] = float64(rng.IntN(7)) // small grid: many collinear triples
			case 1:
				c[j] = rng.Float64()*2 - 1
			default:
				c[j] = math.Ldexp(rng.Float64(), rng.IntN(200)-100)
			}
		}
		if got, want := Orient(c[0], c[1], c[2], c[3], c[4], c[5]), ratOrient(c[0], c[1], c[2], c[3], c[4], c[5]); got != want {
			t.Fatalf("Orient%v = %d, want %d", c, got, want)
		}
	}
}

func TestInCircleRandomAgainstRationals(t *testing.T) {
	rng := rand.New(rand.NewPCG(3, 4))
	for i := 0; i < 20000; i++ {
		var c [8]float64
		for j := range c {
			if rng.IntN(2) == 0 {
				c[j] = float64(rng.IntN(5)) // cocircular quadruples on the grid
			} else {
				c[j] = math.Ldexp(rng.Float64(), rng.IntN(60)-30)
			}
		}
		if got, want := InCircle(c[0], c[1], c[2], c[3], c[4], c[5], c[6], c[7]), ratInCircle(c[0], c[1], c[2], c[3], c[4], c[5], c[6], c[7]); got != want {
			t.Fatalf("InCircle%v = %d, want %d", c, got, want)
		}
	}
}

// TestInCircleUnitSquare: the four corners of a square lie on one circle
// (Thales), its centre inside and a far point outside.
func TestInCircleUnitSquare(t *testing.T) {
	for _, tc := range []struct {
		dx, dy float64
		want   int
	}{{0, 1, 0}, {0.5, 0.5, 1}, {2, 2, -1}, {0.5, 1.2071067811865475, 1}, {0.5, 1.2071067811865477, -1}} {
		if got := InCircle(0, 0, 1, 0, 1, 1, tc.dx, tc.dy); got != tc.want {
			t.Errorf("InCircle(square, %v, %v) = %d, want %d", tc.dx, tc.dy, got, tc.want)
		}
	}
}
