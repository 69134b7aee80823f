package geomcheck

import (
	"fmt"
	"math/big"
	"math/rand/v2"
	"slices"
	"testing"
)

// randomDrawing draws n vertices uniformly from [lo, hi]^2 and m edges
// between random vertices; some edges repeat an earlier one (either way
// round) and some are loops, so every kind of problem is frequent on small
// ranges.
func randomDrawing(rng *rand.Rand, n, m int, lo, hi int64) ([]Point, [][2]int32) {
	pts := make([]Point, n)
	for i := range pts {
		pts[i] = Point{lo + rng.Int64N(hi-lo+1), lo + rng.Int64N(hi-lo+1)}
	}
	edges := make([][2]int32, m)
	for i := range edges {
		switch r := rng.IntN(20); {
		case r == 0 && i > 0:
			e := edges[rng.IntN(i)]
			edges[i] = [2]int32{e[1], e[0]}
		case r == 1 && i > 0:
			edges[i] = edges[rng.IntN(i)]
		case r == 2:
			v := int32(rng.IntN(n))
			edges[i] = [2]int32{v, v}
		default:
			edges[i] = [2]int32{int32(rng.IntN(n)), int32(rng.IntN(n))}
		}
	}
	return pts, edges
}

func sameProblems(t *testing.T, what string, got, want []Problem) {
	t.Helper()
	if !slices.Equal(got, want) {
		t.Fatalf("%s:\n got %v\nwant %v", what, got, want)
	}
}

// TestCheckMatchesBrute holds the fast path to the all-pairs reference on
// seeded random drawings, most of them highly degenerate.
func TestCheckMatchesBrute(t *testing.T) {
	type config struct {
		n, m   int
		lo, hi int64
		seeds  int
	}
	configs := []config{
		{3, 3, 0, 1, 3000},
		{6, 8, 0, 2, 3000},
		{8, 12, 0, 4, 3000},
		{15, 25, 0, 4, 2000},
		{30, 40, 0, 4, 500},
		{20, 30, 0, 10, 1000},
		{40, 60, -20, 20, 300},
		{60, 100, 0, 1000, 200},
		{200, 300, 0, 30, 30},
		{5, 6, MaxCoord - 3, MaxCoord, 1000},
		{10, 15, -MaxCoord, -MaxCoord + 3, 1000},
	}
	for _, c := range configs {
		for seed := range c.seeds {
			rng := rand.New(rand.NewPCG(uint64(seed), uint64(c.n*1000+c.m)))
			pts, edges := randomDrawing(rng, c.n, c.m, c.lo, c.hi)
			want, err := checkBrute(pts, edges)
			if err != nil {
				t.Fatal(err)
			}
			got, err := Check(pts, edges)
			if err != nil {
				t.Fatal(err)
			}
			name := fmt.Sprintf("n=%d m=%d [%d,%d] seed %d\npts %v\nedges %v", c.n, c.m, c.lo, c.hi, seed, pts, edges)
			sameProblems(t, name, got, want)
			// First returns a sorted prefix-size subset of Check.
			for _, limit := range []int{1, 2, 5} {
				first, err := First(pts, edges, limit)
				if err != nil {
					t.Fatal(err)
				}
				if len(first) != min(limit, len(want)) {
					t.Fatalf("%s\nFirst(%d) gave %d problems, Check %d", name, limit, len(first), len(want))
				}
				if !slices.IsSortedFunc(first, cmpProblem) {
					t.Fatalf("%s\nFirst(%d) not sorted: %v", name, limit, first)
				}
				for _, p := range first {
					if _, ok := slices.BinarySearchFunc(want, p, cmpProblem); !ok {
						t.Fatalf("%s\nFirst(%d) gave %v, which Check does not", name, limit, p)
					}
				}
			}
		}
	}
}

func cmpProblem(p, q Problem) int {
	s := []Problem{p, q}
	sortProblems(s)
	switch {
	case p == q:
		return 0
	case s[0] == p:
		return -1
	}
	return 1
}

// affine maps (x, y) to (a x + b y + e, c x + d y + f).
type affine struct{ a, b, c, d, e, f int64 }

func (m affine) apply(p Point) Point {
	return Point{m.a*p.X + m.b*p.Y + m.e, m.c*p.X + m.d*p.Y + m.f}
}

// TestAffineInvariance checks that an invertible affine map, which keeps
// incidences, collinearity and betweenness (common practice), leaves the
// problems unchanged, also when it blows a small degenerate drawing up to
// coordinates at the MaxCoord bound where products need 84 bits.
func TestAffineInvariance(t *testing.T) {
	const s = MaxCoord / 8 // inputs lie in [0, 4]^2, images within ±MaxCoord
	maps := []affine{
		{1, 0, 0, 1, 0, 0},
		{s, 0, 0, s, -MaxCoord / 2, -MaxCoord / 2},
		{s, 1, 1, s - 1, 0, 0},
		{-s, s - 3, s - 7, s - 5, MaxCoord / 2, -3},
		{0, 1, 1, 0, 5, -5}, // reflection
		{-1, 0, 0, -1, 0, 0},
	}
	for seed := range 1500 {
		rng := rand.New(rand.NewPCG(uint64(seed), 77))
		pts, edges := randomDrawing(rng, 10, 14, 0, 4)
		want, err := Check(pts, edges)
		if err != nil {
			t.Fatal(err)
		}
		for _, m := range maps {
			if new(big.Int).Mul(big.NewInt(m.a), big.NewInt(m.d)).Cmp(new(big.Int).Mul(big.NewInt(m.b), big.NewInt(m.c))) == 0 {
				t.Fatalf("map %v is singular", m)
			}
			q := make([]Point, len(pts))
			for i, p := range pts {
				q[i] = m.apply(p)
			}
			got, err := Check(q, edges)
			if err != nil {
				t.Fatalf("map %v: %v", m, err)
			}
			sameProblems(t, fmt.Sprintf("seed %d map %v", seed, m), got, want)
			brute, err := checkBrute(q, edges)
			if err != nil {
				t.Fatal(err)
			}
			sameProblems(t, fmt.Sprintf("brute seed %d map %v", seed, m), brute, want)
		}
	}
}

// TestMostlyCleanMatchesBrute perturbs a few vertices of a plane
// triangulation so that the sweep sees long runs of clean segments with a
// few conflicts among them.
func TestMostlyCleanMatchesBrute(t *testing.T) {
	for seed := range 60 {
		rng := rand.New(rand.NewPCG(uint64(seed), 99))
		pts, edges := stackedTriangulation(rng, 150, 300)
		for range 1 + rng.IntN(4) {
			v := rng.IntN(len(pts))
			pts[v] = Point{rng.Int64N(301), rng.Int64N(301)}
		}
		if rng.IntN(2) == 0 { // put a vertex on an edge
			e := edges[rng.IntN(len(edges))]
			a, b := pts[e[0]], pts[e[1]]
			pts[rng.IntN(len(pts))] = Point{(a.X + b.X) / 2, (a.Y + b.Y) / 2}
		}
		want, err := checkBrute(pts, edges)
		if err != nil {
			t.Fatal(err)
		}
		got, err := Check(pts, edges)
		if err != nil {
			t.Fatal(err)
		}
		sameProblems(t, fmt.Sprintf("seed %d", seed), got, want)
	}
}

// TestCmpProdAgainstBig compares the 128-bit product comparison with
// math/big on random and extreme arguments.
func TestCmpProdAgainstBig(t *testing.T) {
	rng := rand.New(rand.NewPCG(1, 2))
	extremes := []int64{0, 1, -1, 2, -2, 1 << 41, -(1 << 41), 1<<41 - 1, -(1<<41 - 1),
		1 << 62, -(1 << 62), 1<<63 - 1, -(1 << 62) - 1, 1<<32 + 1, -(1<<32 + 1), 1 << 32, 3037000499}
	pick := func() int64 {
		switch rng.IntN(4) {
		case 0:
			return extremes[rng.IntN(len(extremes))]
		case 1:
			return rng.Int64N(1<<42) - 1<<41
		case 2:
			return rng.Int64N(7) - 3
		}
		return int64(rng.Uint64()>>1) - (1 << 62) // within ±2^62
	}
	for range 200000 {
		a, b, c, d := pick(), pick(), pick(), pick()
		want := new(big.Int).Sub(new(big.Int).Mul(big.NewInt(a), big.NewInt(b)),
			new(big.Int).Mul(big.NewInt(c), big.NewInt(d))).Sign()
		if got := cmpProd(a, b, c, d); got != want {
			t.Fatalf("cmpProd(%d, %d, %d, %d) = %d, want %d", a, b, c, d, got, want)
		}
	}
}

// TestOrientNearlyCollinearAtBound shows a case that needs exact
// arithmetic. With M = MaxCoord, a = (-M, -M), b = (0, -1), c = (1, 0) the
// determinant is M*M - (M-1)*(M+1) = 1, while float64 (53-bit mantissa)
// rounds both products to 2^80 and sees 0.
func TestOrientNearlyCollinearAtBound(t *testing.T) {
	const M = MaxCoord
	cases := []struct {
		a, b, c Point
		want    int
	}{
		{Point{-M, -M}, Point{0, -1}, Point{1, 0}, 1},
		{Point{0, -1}, Point{-M, -M}, Point{1, 0}, -1},
		{Point{-M, -M}, Point{0, -1}, Point{M, M - 2}, 0}, // a + 2(b-a)
		{Point{-M, -M}, Point{M, M}, Point{M, M - 1}, -1},
		{Point{-M, -M}, Point{M, M}, Point{M - 1, M}, 1},
		{Point{-M, M}, Point{M, -M}, Point{0, 0}, 0},
		{Point{-M, M}, Point{M, -M}, Point{1, 0}, 1},
	}
	for _, tc := range cases {
		if w := bigOrient(tc.a, tc.b, tc.c); w != tc.want {
			t.Fatalf("test case %v: big.Int says %d", tc, w)
		}
		if got := orient(tc.a, tc.b, tc.c); got != tc.want {
			t.Errorf("orient(%v, %v, %v) = %d, want %d", tc.a, tc.b, tc.c, got, tc.want)
		}
	}
	// The premise: a float64 evaluation gets the first case wrong.
	m, m1, p1 := int64(M), int64(M-1), int64(M+1)
	if fl := float64(m)*float64(m) - float64(m1)*float64(p1); fl != 0 {
		t.Errorf("float64 gave %v; the first case no longer shows rounding", fl)
	}
}

func bigOrient(a, b, c Point) int {
	bx := new(big.Int).Sub(big.NewInt(b.X), big.NewInt(a.X))
	by := new(big.Int).Sub(big.NewInt(b.Y), big.NewInt(a.Y))
	cx := new(big.Int).Sub(big.NewInt(c.X), big.NewInt(a.X))
	cy := new(big.Int).Sub(big.NewInt(c.Y), big.NewInt(a.Y))
	return new(big.Int).Sub(new(big.Int).Mul(bx, cy), new(big.Int).Mul(by, cx)).Sign()
}

// ratSegment is segment ab in exact rationals, used to cross-check the
// integer predicates against the textbook parametric formulas (common
// practice): a + t(b-a), t in [0, 1].
func ratPoint(p Point) (x, y *big.Rat) {
	return new(big.Rat).SetInt64(p.X), new(big.Rat).SetInt64(p.Y)
}

// ratPairKind classifies two positive-length segments by solving
// a + t(b-a) = c + u(d-c) over the rationals.
func ratPairKind(a, b, c, d Point) (Kind, bool) {
	ax, ay := ratPoint(a)
	bx, by := ratPoint(b)
	cx, cy := ratPoint(c)
	dx, dy := ratPoint(d)
	rx, ry := new(big.Rat).Sub(bx, ax), new(big.Rat).Sub(by, ay)
	sx, sy := new(big.Rat).Sub(dx, cx), new(big.Rat).Sub(dy, cy)
	qx, qy := new(big.Rat).Sub(cx, ax), new(big.Rat).Sub(cy, ay)
	cross := func(ux, uy, vx, vy *big.Rat) *big.Rat {
		return new(big.Rat).Sub(new(big.Rat).Mul(ux, vy), new(big.Rat).Mul(uy, vx))
	}
	den := cross(rx, ry, sx, sy)
	zero, one := new(big.Rat), big.NewRat(1, 1)
	if den.Sign() != 0 {
		t := new(big.Rat).Quo(cross(qx, qy, sx, sy), den)
		u := new(big.Rat).Quo(cross(qx, qy, rx, ry), den)
		if t.Cmp(zero) > 0 && t.Cmp(one) < 0 && u.Cmp(zero) > 0 && u.Cmp(one) < 0 {
			return Crossing, true
		}
		return 0, false
	}
	if cross(qx, qy, rx, ry).Sign() != 0 {
		return 0, false // parallel, different lines
	}
	// Collinear: parameters of c and d along ab.
	rr := new(big.Rat).Add(new(big.Rat).Mul(rx, rx), new(big.Rat).Mul(ry, ry))
	param := func(px, py *big.Rat) *big.Rat {
		vx, vy := new(big.Rat).Sub(px, ax), new(big.Rat).Sub(py, ay)
		return new(big.Rat).Quo(new(big.Rat).Add(new(big.Rat).Mul(vx, rx), new(big.Rat).Mul(vy, ry)), rr)
	}
	t0, t1 := param(cx, cy), param(dx, dy)
	if t0.Cmp(t1) > 0 {
		t0, t1 = t1, t0
	}
	lo, hi := t0, t1
	if lo.Cmp(zero) < 0 {
		lo = zero
	}
	if hi.Cmp(one) > 0 {
		hi = one
	}
	if lo.Cmp(hi) < 0 {
		return Overlap, true
	}
	return 0, false
}

// TestPairKindAgainstRationals compares the orientation-based pair
// classification with the rational parametric solution.
func TestPairKindAgainstRationals(t *testing.T) {
	rng := rand.New(rand.NewPCG(3, 4))
	for i := range 100000 {
		r := int64(2 + i%6)
		p := func() Point { return Point{rng.Int64N(r), rng.Int64N(r)} }
		a, b, c, d := p(), p(), p(), p()
		if a == b || c == d {
			continue
		}
		gk, gok := pairKind(a, b, c, d)
		wk, wok := ratPairKind(a, b, c, d)
		if gk != wk || gok != wok {
			t.Fatalf("pairKind(%v, %v, %v, %v) = %v %v, rationals say %v %v", a, b, c, d, gk, gok, wk, wok)
		}
	}
}

// TestInOpenSegmentAgainstRationals checks the vertex-on-edge predicate:
// p = a + t(b-a) with 0 < t < 1.
func TestInOpenSegmentAgainstRationals(t *testing.T) {
	rng := rand.New(rand.NewPCG(5, 6))
	for i := range 100000 {
		r := int64(2 + i%5)
		p := func() Point { return Point{rng.Int64N(r), rng.Int64N(r)} }
		a, b, q := p(), p(), p()
		want := false
		if a != b {
			ax, ay := ratPoint(a)
			bx, by := ratPoint(b)
			qx, qy := ratPoint(q)
			rx, ry := new(big.Rat).Sub(bx, ax), new(big.Rat).Sub(by, ay)
			var tt *big.Rat
			if rx.Sign() != 0 {
				tt = new(big.Rat).Quo(new(big.Rat).Sub(qx, ax), rx)
			} else {
				tt = new(big.Rat).Quo(new(big.Rat).Sub(qy, ay), ry)
			}
			onX := new(big.Rat).Add(ax, new(big.Rat).Mul(tt, rx)).Cmp(qx) == 0
			onY := new(big.Rat).Add(ay, new(big.Rat).Mul(tt, ry)).Cmp(qy) == 0
			want = onX && onY && tt.Sign() > 0 && tt.Cmp(big.NewRat(1, 1)) < 0
		}
		if got := inOpenSegment(a, b, q); got != want {
			t.Fatalf("inOpenSegment(%v, %v, %v) = %v, want %v", a, b, q, got, want)
		}
	}
}
