package exact

import (
	"math/big"
	"math/rand/v2"
	"testing"
)

// CrossSign against math/big, on small values (its int64 path) and on
// products near 2^124, where int64 arithmetic would overflow: the standard
// library's arbitrary precision integers are the outside reference.
func TestCrossSignAgainstBig(t *testing.T) {
	r := rand.New(rand.NewPCG(1, 2))
	const limit = 1 << 61
	for range 20000 {
		v := [4]int64{}
		// Half the draws small enough for the int64 path, half not.
		bound := int64(limit)
		if r.IntN(2) == 0 {
			bound = 1 << 31
		}
		for i := range v {
			v[i] = r.Int64N(2*bound) - bound
		}
		if r.IntN(4) == 0 {
			v[2], v[3] = v[0], v[1] // equal products: a zero cross product
		}
		want := new(big.Int).Sub(new(big.Int).Mul(big.NewInt(v[0]), big.NewInt(v[3])), new(big.Int).Mul(big.NewInt(v[1]), big.NewInt(v[2]))).Sign()
		if got := CrossSign(v[0], v[1], v[2], v[3]); got != want {
			t.Fatalf("CrossSign%v = %d, math/big says %d", v, got, want)
		}
	}
}

func TestOrientIntSmall(t *testing.T) {
	for _, c := range []struct {
		p    [6]int64
		want int
	}{
		{[6]int64{0, 0, 1, 0, 0, 1}, 1},
		{[6]int64{0, 0, 0, 1, 1, 0}, -1},
		{[6]int64{0, 0, 1, 1, 2, 2}, 0},
		{[6]int64{-3, -3, 1 << 40, 1 << 40, 1<<41 + 3, 1<<41 + 3}, 0},
	} {
		if got := OrientInt(c.p[0], c.p[1], c.p[2], c.p[3], c.p[4], c.p[5]); got != c.want {
			t.Errorf("OrientInt%v = %d, want %d", c.p, got, c.want)
		}
	}
}
