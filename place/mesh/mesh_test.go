package mesh

import (
	"errors"
	"math"
	"math/rand/v2"
	"testing"

	"github.com/gridwood/gridwood/place/geomcheck"
)

// sides returns the drawing-vertex sides of the mesh, each once.
func (m *Mesh) sides() [][2]int32 {
	var out [][2]int32
	n := int32(m.n)
	for t := range m.tri {
		for i := range 3 {
			b, c := m.tri[t][(i+1)%3], m.tri[t][(i+2)%3]
			if b < c && c < n {
				out = append(out, [2]int32{b, c})
			}
		}
	}
	return out
}

func hasEdges(t *testing.T, m *Mesh, edges [][2]int32) {
	t.Helper()
	for _, e := range edges {
		tr, i := m.side(e[0], e[1])
		if tr < 0 {
			tr, i = m.side(e[1], e[0])
		}
		if tr < 0 || !m.fixed[tr][i] {
			t.Fatalf("edge %v is not a fixed side", e)
		}
	}
}

func points(pts []geomcheck.Point) (x, y []float64) {
	for _, p := range pts {
		x = append(x, float64(p.X))
		y = append(y, float64(p.Y))
	}
	return
}

// TestNewAgreesWithChecker: on small random integer drawings, New accepts
// exactly the drawings the independent checker (place/geomcheck) finds
// plane, and an accepted mesh holds every edge as a fixed side.
func TestNewAgreesWithChecker(t *testing.T) {
	rng := rand.New(rand.NewPCG(7, 8))
	accepted, refused := 0, 0
	for trial := 0; trial < 3000; trial++ {
		n := 3 + rng.IntN(9)
		span := 2 + rng.IntN(6)
		pts := make([]geomcheck.Point, n)
		for i := range pts {
			pts[i] = geomcheck.Point{X: int64(rng.IntN(span)), Y: int64(rng.IntN(span))}
		}
		seen := map[[2]int32]bool{}
		var edges [][2]int32
		for k := rng.IntN(2 * n); k > 0; k-- {
			a, b := int32(rng.IntN(n)), int32(rng.IntN(n))
			if a == b || seen[[2]int32{min(a, b), max(a, b)}] {
				continue
			}
			seen[[2]int32{min(a, b), max(a, b)}] = true
			edges = append(edges, [2]int32{a, b})
		}
		problems, err := geomcheck.Check(pts, edges)
		if err != nil {
			t.Fatal(err)
		}
		x, y := points(pts)
		m, err := New(x, y, edges, 0)
		if len(problems) == 0 {
			if err != nil {
				t.Fatalf("plane drawing %v %v refused: %v", pts, edges, err)
			}
			if err := m.Check(); err != nil {
				t.Fatalf("%v %v: %v", pts, edges, err)
			}
			hasEdges(t, m, edges)
			accepted++
			continue
		}
		var pe *PlaneError
		if !errors.As(err, &pe) {
			t.Fatalf("drawing %v %v with problems %v accepted (err %v)", pts, edges, problems, err)
		}
		refused++
	}
	if accepted < 300 || refused < 300 {
		t.Fatalf("weak sample: %d accepted, %d refused", accepted, refused)
	}
}

// TestMovesKeepDrawingPlane moves vertices of random plane drawings to
// random integer points; every accepted move must leave a drawing the
// independent checker finds plane, with the mesh still valid, also after
// legalizing.
func TestMovesKeepDrawingPlane(t *testing.T) {
	rng := rand.New(rand.NewPCG(9, 10))
	for trial := 0; trial < 60; trial++ {
		n := 10 + rng.IntN(40)
		pts := make([]geomcheck.Point, n)
		used := map[geomcheck.Point]bool{}
		for i := range pts {
			for {
				p := geomcheck.Point{X: int64(rng.IntN(60)), Y: int64(rng.IntN(60))}
				if !used[p] {
					used[p] = true
					pts[i] = p
					break
				}
			}
		}
		x, y := points(pts)
		full, err := New(x, y, nil, 0)
		if err != nil {
			t.Fatal(err)
		}
		// A random half of the Delaunay sides: a plane drawing.
		var edges [][2]int32
		for _, s := range full.sides() {
			if rng.IntN(2) == 0 {
				edges = append(edges, s)
			}
		}
		m, err := New(x, y, edges, 100)
		if err != nil {
			t.Fatal(err)
		}
		moves := 0
		for k := 0; k < 400; k++ {
			v := int32(rng.IntN(n))
			nx, ny := float64(rng.IntN(80)-10), float64(rng.IntN(80)-10)
			if !m.Move(v, nx, ny) {
				continue
			}
			moves++
			pts[v] = geomcheck.Point{X: int64(nx), Y: int64(ny)}
			if k%3 == 0 {
				m.Legalize(v)
			}
			if problems, _ := geomcheck.Check(pts, edges); len(problems) > 0 {
				t.Fatalf("trial %d: move %d of %d to (%v,%v) made %v", trial, k, v, nx, ny, problems[0])
			}
			if err := m.Check(); err != nil {
				t.Fatalf("trial %d: %v", trial, err)
			}
		}
		hasEdges(t, m, edges)
		if moves == 0 {
			t.Fatalf("trial %d: no move accepted", trial)
		}
	}
}

// TestGridIsCocircular builds the mesh of a square grid of points, where
// every unit square's corners lie on one circle, with and without the
// grid's edges: the exact in-circle test must not flip forever.
func TestGridIsCocircular(t *testing.T) {
	const k = 30
	var x, y []float64
	var edges [][2]int32
	for i := 0; i < k; i++ {
		for j := 0; j < k; j++ {
			x = append(x, float64(i))
			y = append(y, float64(j))
			v := int32(i*k + j)
			if j+1 < k {
				edges = append(edges, [2]int32{v, v + 1})
			}
			if i+1 < k {
				edges = append(edges, [2]int32{v, v + k})
			}
		}
	}
	for _, es := range [][][2]int32{nil, edges} {
		m, err := New(x, y, es, 0)
		if err != nil {
			t.Fatal(err)
		}
		if err := m.Check(); err != nil {
			t.Fatal(err)
		}
		hasEdges(t, m, es)
	}
}

// TestJumpAgreesWithChecker jumps vertices of random plane drawings to
// random points: a jump is taken only if the independent checker finds
// the drawing with the vertex there plane, and almost every such jump is
// taken (the mesh refuses, to be safe, points exactly on a side and edges
// through the vertex's old place).
func TestJumpAgreesWithChecker(t *testing.T) {
	rng := rand.New(rand.NewPCG(11, 12))
	taken, refusedPlane, refused := 0, 0, 0
	for trial := 0; trial < 80; trial++ {
		n := 8 + rng.IntN(30)
		pts := make([]geomcheck.Point, n)
		used := map[geomcheck.Point]bool{}
		for i := range pts {
			for {
				p := geomcheck.Point{X: int64(rng.IntN(40)), Y: int64(rng.IntN(40))}
				if !used[p] {
					used[p] = true
					pts[i] = p
					break
				}
			}
		}
		x, y := points(pts)
		full, err := New(x, y, nil, 0)
		if err != nil {
			t.Fatal(err)
		}
		var edges [][2]int32
		for _, s := range full.sides() {
			if rng.IntN(3) == 0 {
				edges = append(edges, s)
			}
		}
		m, err := New(x, y, edges, 60)
		if err != nil {
			t.Fatal(err)
		}
		for k := 0; k < 150; k++ {
			v := int32(rng.IntN(n))
			q := geomcheck.Point{X: int64(rng.IntN(50) - 5), Y: int64(rng.IntN(50) - 5)}
			old := pts[v]
			pts[v] = q
			problems, err := geomcheck.Check(pts, edges)
			if err != nil {
				t.Fatal(err)
			}
			if m.Jump(v, float64(q.X), float64(q.Y)) {
				if len(problems) > 0 {
					t.Fatalf("trial %d: jump of %d to %v taken, but %v", trial, v, q, problems[0])
				}
				if err := m.Check(); err != nil {
					t.Fatal(err)
				}
				hasEdges(t, m, edges)
				taken++
				continue
			}
			pts[v] = old
			if len(problems) == 0 {
				refusedPlane++
			} else {
				refused++
			}
		}
	}
	if taken < 500 || refused < 500 || refusedPlane*20 > taken {
		t.Fatalf("taken %d, refused %d rightly and %d of plane drawings", taken, refused, refusedPlane)
	}
}

// TestRouteKeepsDisc routes random pairs of vertices of random plane
// drawings through the triangulation and checks that the result is still
// a triangulated disc holding every edge, and that Tutte's barycentric
// drawing of it (equal weights, frame fixed) is plane: by Tutte's theorem
// (W. T. Tutte, "How to draw a graph", 1963) that holds exactly when the
// combinatorics are those of a 3-connected plane triangulation with that
// outer face, and the independent checker judges it.
func TestRouteKeepsDisc(t *testing.T) {
	rng := rand.New(rand.NewPCG(13, 14))
	routed := 0
	for trial := 0; trial < 100; trial++ {
		n := 6 + rng.IntN(30)
		x, y := make([]float64, n), make([]float64, n)
		for i := range x {
			x[i], y[i] = float64(rng.IntN(1000)), float64(rng.IntN(1000))+float64(i)/1000
		}
		full, err := New(x, y, nil, 0)
		if err != nil {
			t.Fatal(err)
		}
		var edges [][2]int32
		for _, s := range full.sides() {
			if rng.IntN(3) == 0 {
				edges = append(edges, s)
			}
		}
		m, err := New(x, y, edges, 0)
		if err != nil {
			t.Fatal(err)
		}
		for k := 0; k < 3; k++ {
			u, v := int32(rng.IntN(n)), int32(rng.IntN(n))
			if u == v || m.Fixed(u, v) {
				continue
			}
			if !m.Route(u, v, -1, -1) {
				continue
			}
			edges = append(edges, [2]int32{u, v})
			routed++
			if err := m.CheckCombinatorics(); err != nil {
				t.Fatalf("trial %d: after routing %d-%d: %v", trial, u, v, err)
			}
			for _, e := range edges {
				if !m.Fixed(e[0], e[1]) && !m.Fixed(e[1], e[0]) {
					t.Fatalf("trial %d: after routing %d-%d, edge %v is not fixed", trial, u, v, e)
				}
			}
		}
		hasEdges(t, m, edges)
		tx, ty := tutte(m)
		pts := make([]geomcheck.Point, n)
		for i := range pts {
			pts[i] = geomcheck.Point{X: int64(math.Round(tx[i] * 1e6)), Y: int64(math.Round(ty[i] * 1e6))}
		}
		if p, err := geomcheck.Check(pts, edges); err != nil || len(p) > 0 {
			t.Fatalf("trial %d: Tutte drawing of the routed mesh: %v %v", trial, p, err)
		}
	}
	if routed < 50 {
		t.Fatalf("only %d routes", routed)
	}
}

// tutte solves for Tutte's barycentric drawing of the mesh with the frame
// fixed, by Gauss-Seidel sweeps to convergence.
func tutte(m *Mesh) (x, y []float64) {
	n := m.n
	x, y = make([]float64, n+3), make([]float64, n+3)
	for i := n; i < n+3; i++ {
		x[i], y[i] = m.x[i]/1000, m.y[i]/1000
	}
	rings := make([][]int32, n)
	m.Rings(func(v int32, ring []int32) { rings[v] = append([]int32(nil), ring...) })
	for sweep := 0; sweep < 20000; sweep++ {
		change := 0.0
		for v := range n {
			sx, sy := 0.0, 0.0
			for _, u := range rings[v] {
				sx += x[u]
				sy += y[u]
			}
			sx /= float64(len(rings[v]))
			sy /= float64(len(rings[v]))
			change = max(change, math.Abs(sx-x[v]), math.Abs(sy-y[v]))
			x[v], y[v] = sx, sy
		}
		if change < 1e-13 {
			break
		}
	}
	return x[:n], y[:n]
}

// TestRouteTakesTheCornerAsked routes an edge whose two ends already share
// a free side of the triangulation, but in other corners than asked: in a
// diamond u, a, v, b with the four outer sides fixed, the free diagonal
// u-v runs inside, while u-v is asked to leave u after a and v after b
// (counter-clockwise), which are the corners outside the diamond. The
// edge must go round outside, leaving the inside to the other diagonal
// a-b; Tutte's drawing of the result (frame fixed) must be plane, judged
// by the independent checker.
func TestRouteTakesTheCornerAsked(t *testing.T) {
	// u, v, a, b, and two vertices far out so that the outside has room.
	x := []float64{0, 200, 100, 100, -600, 800}
	y := []float64{0, 0, 300, -300, 900, -900}
	const u, v, a, b = 0, 1, 2, 3
	edges := [][2]int32{{u, a}, {a, v}, {v, b}, {b, u}}
	m, err := New(x, y, edges, 0)
	if err != nil {
		t.Fatal(err)
	}
	if s, _ := m.side(u, v); s < 0 {
		t.Fatal("the diagonal u-v is not a side of the Delaunay triangulation; the test needs it")
	}
	if !m.Route(u, v, a, b) {
		t.Fatal("no route")
	}
	if err := m.CheckCombinatorics(); err != nil {
		t.Fatal(err)
	}
	if s, _ := m.side(a, b); s < 0 {
		t.Fatal("u-v was fixed inside the diamond, not in the corners asked")
	}
	edges = append(edges, [2]int32{u, v})
	hasEdges(t, m, edges)
	tx, ty := tutte(m)
	pts := make([]geomcheck.Point, len(x))
	for i := range pts {
		pts[i] = geomcheck.Point{X: int64(math.Round(tx[i] * 1e6)), Y: int64(math.Round(ty[i] * 1e6))}
	}
	if p, err := geomcheck.Check(pts, edges); err != nil || len(p) > 0 {
		t.Fatalf("Tutte drawing of the routed mesh: %v %v", p, err)
	}
}
