package geomcheck

import (
	"math/rand/v2"
	"slices"
	"testing"
)

// orient64 is a plain int64 orientation, exact for the small coordinates
// (below 2^30) the generators use; it keeps them independent of the
// package's own predicates.
func orient64(a, b, c Point) int64 {
	d := (b.X-a.X)*(c.Y-a.Y) - (b.Y-a.Y)*(c.X-a.X)
	switch {
	case d > 0:
		return 1
	case d < 0:
		return -1
	}
	return 0
}

// stackedTriangulation builds a plane triangulation with up to n vertices
// in [0, size]^2 by repeatedly putting a lattice point strictly inside a
// random triangular face and joining it to the face's three corners; such
// an insertion keeps the drawing plane (common practice: the new edges lie
// inside the face), and the result has 3n-6 edges. Faces too small to
// receive a lattice point are dropped from the candidates.
func stackedTriangulation(rng *rand.Rand, n int, size int64) ([]Point, [][2]int32) {
	pts := []Point{{0, 0}, {size, 0}, {size / 2, size}}
	edges := [][2]int32{{0, 1}, {1, 2}, {2, 0}}
	faces := [][3]int32{{0, 1, 2}}
	for len(pts) < n && len(faces) > 0 {
		fi := rng.IntN(len(faces))
		f := faces[fi]
		a, b, c := pts[f[0]], pts[f[1]], pts[f[2]]
		var p Point
		placed := false
		for range 8 {
			w1, w2, w3 := 1+rng.Int64N(1000), 1+rng.Int64N(1000), 1+rng.Int64N(1000)
			s := w1 + w2 + w3
			p = Point{(w1*a.X + w2*b.X + w3*c.X) / s, (w1*a.Y + w2*b.Y + w3*c.Y) / s}
			o := orient64(a, b, p)
			if o != 0 && orient64(b, c, p) == o && orient64(c, a, p) == o {
				placed = true
				break
			}
		}
		if !placed {
			faces[fi] = faces[len(faces)-1]
			faces = faces[:len(faces)-1]
			continue
		}
		v := int32(len(pts))
		pts = append(pts, p)
		edges = append(edges, [2]int32{f[0], v}, [2]int32{f[1], v}, [2]int32{f[2], v})
		faces[fi] = [3]int32{f[0], f[1], v}
		faces = append(faces, [3]int32{f[1], f[2], v}, [3]int32{f[2], f[0], v})
	}
	return pts, edges
}

// star returns a centre at the origin joined to leaves, which are distinct
// lattice points on the boundary of the square [-h, h]^2 (every other
// one). Distinct boundary points of a square around the centre lie in
// distinct directions from it, so the star is plane.
func star(h int64, leaves int) ([]Point, [][2]int32) {
	pts := []Point{{0, 0}}
	var edges [][2]int32
	// Walk the boundary counter-clockwise from (h, -h).
	p, dir := Point{h, -h}, 0
	steps := [4]Point{{0, 1}, {-1, 0}, {0, -1}, {1, 0}}
	for i := 0; len(pts) <= leaves && i < int(8*h); i++ {
		if i%2 == 0 {
			edges = append(edges, [2]int32{0, int32(len(pts))})
			pts = append(pts, p)
		}
		q := Point{p.X + steps[dir].X, p.Y + steps[dir].Y}
		if q.X < -h || q.X > h || q.Y < -h || q.Y > h {
			dir++
			q = Point{p.X + steps[dir].X, p.Y + steps[dir].Y}
		}
		p = q
	}
	return pts, edges
}

// ladder is a triangulated strip 2 units wide in x per step and 1 unit
// high: bottom vertex 2i at (2i, 0), top vertex 2i+1 at (2i, 1), with
// rails, rungs and one diagonal per square. It is plane by construction.
func ladder(steps int) ([]Point, [][2]int32) {
	var pts []Point
	var edges [][2]int32
	for i := range steps + 1 {
		pts = append(pts, Point{int64(2 * i), 0}, Point{int64(2 * i), 1})
		b, t := int32(2*i), int32(2*i+1)
		edges = append(edges, [2]int32{b, t})
		if i > 0 {
			edges = append(edges, [2]int32{b - 2, b}, [2]int32{t - 2, t}, [2]int32{b - 2, t})
		}
	}
	return pts, edges
}

// problemsOfLast lists, by definition, the problems that involve the last
// edge of a drawing whose other edges and vertices are known to be free of
// problems among themselves (and share no positions).
func problemsOfLast(pts []Point, edges [][2]int32) []Problem {
	last := len(edges) - 1
	e := edges[last]
	a, b := pts[e[0]], pts[e[1]]
	var out []Problem
	for f, g := range edges[:last] {
		if samePair(e, g) {
			out = append(out, Problem{Overlap, f, last})
		} else if k, ok := pairKind(a, b, pts[g[0]], pts[g[1]]); ok {
			out = append(out, Problem{k, f, last})
		}
	}
	for v, p := range pts {
		if inOpenSegment(a, b, p) {
			out = append(out, Problem{VertexOnEdge, v, last})
		}
	}
	sortProblems(out)
	return out
}

func bigSize(t *testing.T) int {
	if testing.Short() {
		return 20002
	}
	return 100002
}

// TestLargeTriangulation checks a plane stacked triangulation with
// 100,002 vertices and 300,000 edges in [0, 100000]^2, then the same with
// one added edge whose problems are listed by definition.
func TestLargeTriangulation(t *testing.T) {
	n := bigSize(t)
	rng := rand.New(rand.NewPCG(42, 42))
	pts, edges := stackedTriangulation(rng, n, 100000)
	if len(pts) != n || len(edges) != 3*n-6 {
		t.Fatalf("generator made %d vertices, %d edges; want %d, %d", len(pts), len(edges), n, 3*n-6)
	}
	got, err := Check(pts, edges)
	if err != nil {
		t.Fatal(err)
	}
	if len(got) != 0 {
		t.Fatalf("plane triangulation: %d problems, first %v", len(got), got[0])
	}
	for trial := range 5 {
		u, w := int32(rng.IntN(n)), int32(rng.IntN(n))
		if u == w {
			continue
		}
		bad := append(edges[:len(edges):len(edges)], [2]int32{u, w})
		want := problemsOfLast(pts, bad)
		got, err := Check(pts, bad)
		if err != nil {
			t.Fatal(err)
		}
		sameProblems(t, "triangulation plus one edge", got, want)
		t.Logf("trial %d: extra edge %d-%d has %d problems", trial, u, w, len(want))
		first, err := First(pts, bad, 3)
		if err != nil {
			t.Fatal(err)
		}
		if len(first) != min(3, len(want)) {
			t.Fatalf("First(3) returned %d problems of %d", len(first), len(want))
		}
	}
}

// TestStar checks a star of 100,000 edges (one vertex of degree 10^5),
// then adds a horizontal edge y = h that crosses exactly the star edges
// whose leaf lies above it and passes through the leaves at height h.
func TestStar(t *testing.T) {
	const h = 25000
	pts, edges := star(h, 100000)
	if len(edges) != 100000 {
		t.Fatalf("star has %d edges", len(edges))
	}
	got, err := Check(pts, edges)
	if err != nil {
		t.Fatal(err)
	}
	if len(got) != 0 {
		t.Fatalf("star: %d problems, first %v", len(got), got[0])
	}
	const y = 1234
	u := int32(len(pts))
	pts = append(pts, Point{-h - 5000, y}, Point{h + 5000, y})
	edges = append(edges, [2]int32{u, u + 1})
	last := len(edges) - 1
	var want []Problem
	for i, e := range edges[:last] {
		switch leaf := pts[e[1]]; {
		case leaf.Y > y:
			want = append(want, Problem{Crossing, i, last})
		case leaf.Y == y:
			want = append(want, Problem{VertexOnEdge, int(e[1]), last})
		}
	}
	sortProblems(want)
	got, err = Check(pts, edges)
	if err != nil {
		t.Fatal(err)
	}
	sameProblems(t, "star plus horizontal edge", got, want)
}

// TestLadder checks a long thin plane drawing (x in [0, 100000], y in
// {0, 1}), then adds an edge along the whole bottom rail: it overlaps every
// rail edge and passes through every bottom vertex between its ends.
func TestLadder(t *testing.T) {
	const steps = 50000
	pts, edges := ladder(steps)
	got, err := Check(pts, edges)
	if err != nil {
		t.Fatal(err)
	}
	if len(got) != 0 {
		t.Fatalf("ladder: %d problems, first %v", len(got), got[0])
	}
	edges = append(edges, [2]int32{0, 2 * steps})
	last := len(edges) - 1
	var want []Problem
	for i, e := range edges[:last] {
		if pts[e[0]].Y == 0 && pts[e[1]].Y == 0 {
			want = append(want, Problem{Overlap, i, last})
		}
	}
	for v := 2; v < 2*steps; v += 2 {
		want = append(want, Problem{VertexOnEdge, v, last})
	}
	if len(want) != 2*steps-1 {
		t.Fatalf("expected %d problems by construction, listed %d", 2*steps-1, len(want))
	}
	sortProblems(want)
	got, err = Check(pts, edges)
	if err != nil {
		t.Fatal(err)
	}
	sameProblems(t, "ladder plus rail edge", got, want)
}

func BenchmarkCheck100k(b *testing.B) {
	rng := rand.New(rand.NewPCG(42, 42))
	pts, edges := stackedTriangulation(rng, 100002, 100000)
	b.ResetTimer()
	for b.Loop() {
		ps, err := Check(pts, edges)
		if err != nil || len(ps) != 0 {
			b.Fatal(err, len(ps))
		}
	}
}

func BenchmarkCheckStar100k(b *testing.B) {
	pts, edges := star(25000, 100000)
	for b.Loop() {
		ps, err := Check(pts, edges)
		if err != nil || len(ps) != 0 {
			b.Fatal(err, len(ps))
		}
	}
}

func BenchmarkCheckLadder100k(b *testing.B) {
	pts, edges := ladder(50000)
	for b.Loop() {
		ps, err := Check(pts, edges)
		if err != nil || len(ps) != 0 {
			b.Fatal(err, len(ps))
		}
	}
}

// TestStarWithVertexInEveryEdge puts an isolated vertex at the midpoint of
// each of the 100,000 edges of the star (every leaf has even coordinates,
// so the midpoint is a lattice point): exactly 100,000 VertexOnEdge
// problems, all at the hub's edges.
func TestStarWithVertexInEveryEdge(t *testing.T) {
	pts, edges := star(25000, 100000)
	var want []Problem
	for i, e := range edges {
		leaf := pts[e[1]]
		if leaf.X%2 != 0 || leaf.Y%2 != 0 {
			t.Fatalf("leaf %v has an odd coordinate", leaf)
		}
		want = append(want, Problem{VertexOnEdge, len(pts), i})
		pts = append(pts, Point{leaf.X / 2, leaf.Y / 2})
	}
	got, err := Check(pts, edges)
	if err != nil {
		t.Fatal(err)
	}
	sameProblems(t, "star with midpoints", got, want)
}

// starWithStubs adds to a star a short edge from the midpoint of every star
// edge, one unit to the right: a T-junction on every edge of the hub, and
// possibly crossings with neighbouring star edges.
func starWithStubs(leaves int) ([]Point, [][2]int32) {
	h := int64(leaves / 4)
	pts, edges := star(h, leaves)
	for _, e := range slices.Clone(edges) {
		leaf := pts[e[1]]
		m := Point{leaf.X / 2, leaf.Y / 2}
		v := int32(len(pts))
		pts = append(pts, m, Point{m.X + 1, m.Y})
		edges = append(edges, [2]int32{v, v + 1})
	}
	return pts, edges
}

func TestStarWithStubsMatchesBrute(t *testing.T) {
	pts, edges := starWithStubs(2000)
	want, err := checkBrute(pts, edges)
	if err != nil {
		t.Fatal(err)
	}
	if len(want) < 2000 {
		t.Fatalf("brute force found only %d problems; every stub should touch its edge", len(want))
	}
	got, err := Check(pts, edges)
	if err != nil {
		t.Fatal(err)
	}
	sameProblems(t, "star with stubs", got, want)
}

// BenchmarkCheckStarStubs100k measures a drawing with many problems at the
// edges of one vertex of degree 100,000: a stub from the middle of every
// star edge (200,006 problems in all, mostly T-junctions and stub ends
// meeting other stubs' starts).
func BenchmarkCheckStarStubs100k(b *testing.B) {
	pts, edges := starWithStubs(100000)
	for b.Loop() {
		if _, err := Check(pts, edges); err != nil {
			b.Fatal(err)
		}
	}
}
