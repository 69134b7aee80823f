package mesh

import (
	"errors"
	"fmt"
	"math"
	"slices"

	"github.com/gridwood/gridwood/internal/exact"
)

// Mesh is a triangulation of a plane straight-line drawing and of the
// region between it and a frame triangle around it.
//
// Vertices 0..N()-1 are the drawing's; the frame's three follow. Triangle
// t has corners tri[t][0..2] in counter-clockwise order; adj[t][i] is the
// triangle across the side opposite corner i (-1 on the frame's sides),
// and fixed[t][i] says that side is an edge of the drawing.
type Mesh struct {
	x, y  []float64
	n     int
	tri   [][3]int32
	adj   [][3]int32
	fixed [][3]bool
	at    []int32 // a triangle at each vertex
	deg   []int32 // number of triangles at each vertex
	walk  uint32  // rotates the side a point location tries first
	queue []flipSide
	free  []int32    // triangles a removal freed, for the next insertion
	edges [][2]int32 // the drawing's edges, as given
	// tangled says Route changed the combinatorics without the drawing:
	// the triangles need no longer turn counter-clockwise, and the
	// geometric operations refuse.
	tangled bool
}

// flipSide names a triangle side by its two ends, which stay valid while
// flips renumber the triangles around them.
type flipSide struct{ a, b int32 }

// Errors of New for a drawing that is not plane.
var (
	ErrSamePoint = errors.New("mesh: two vertices at one point")
	ErrOnEdge    = errors.New("mesh: a vertex lies inside an edge")
	ErrCrossing  = errors.New("mesh: two edges cross")
	errInput     = errors.New("mesh: bad input")
)

// PlaneError is New's error for a drawing that is not plane: Err is one of
// ErrSamePoint, ErrOnEdge and ErrCrossing, and Vertices or Edges say where.
type PlaneError struct {
	Err      error
	Vertices [2]int32 // ErrSamePoint, ErrOnEdge (the vertex, then -1)
	Edges    [2][2]int32
}

func (e *PlaneError) Error() string {
	switch e.Err {
	case ErrSamePoint:
		return fmt.Sprintf("%v: %d and %d", e.Err, e.Vertices[0], e.Vertices[1])
	case ErrOnEdge:
		return fmt.Sprintf("%v: %d inside %d-%d", e.Err, e.Vertices[0], e.Edges[0][0], e.Edges[0][1])
	}
	return fmt.Sprintf("%v: %d-%d and %d-%d", e.Err, e.Edges[0][0], e.Edges[0][1], e.Edges[1][0], e.Edges[1][1])
}

func (e *PlaneError) Unwrap() error { return e.Err }

// New triangulates the drawing of the graph with vertices at (x[v], y[v])
// and the given edges (loops and repeats are not allowed). The frame is an
// equilateral-like triangle around the disc of radius reach about the
// centre of the drawing's bounding box (at least the box itself), so any
// vertex may later move anywhere within that disc's reach of the frame's
// sides. x and y are copied.
func New(x, y []float64, edges [][2]int32, reach float64) (*Mesh, error) {
	fx, fy := Frame(x, y, reach)
	m, _, err := build(x, y, edges, fx, fy, false)
	return m, err
}

// Greedy is New for a drawing that need not be plane: it forces the edges
// in in the order given and leaves out each edge that would cross or
// touch one already in, or pass through a vertex; kept[i] says whether
// edges[i] is in. The kept edges form a plane drawing, and no left-out
// edge can be added to it. Two vertices at one point are still an error.
func Greedy(x, y []float64, edges [][2]int32, reach float64) (m *Mesh, kept []bool, err error) {
	fx, fy := Frame(x, y, reach)
	return build(x, y, edges, fx, fy, true)
}

func build(x, y []float64, edges [][2]int32, fx, fy [3]float64, skip bool) (*Mesh, []bool, error) {
	n := len(x)
	if len(y) != n || n == 0 || n > math.MaxInt32-3 {
		return nil, nil, errInput
	}
	for _, e := range edges {
		if e[0] < 0 || e[1] < 0 || int(e[0]) >= n || int(e[1]) >= n || e[0] == e[1] {
			return nil, nil, errInput
		}
	}
	m := &Mesh{n: n}
	m.x = make([]float64, n+3)
	m.y = make([]float64, n+3)
	copy(m.x, x)
	copy(m.y, y)
	for v := range n {
		if math.IsNaN(x[v]) || math.IsInf(x[v], 0) || math.IsNaN(y[v]) || math.IsInf(y[v], 0) {
			return nil, nil, errInput
		}
	}
	for i := range 3 {
		m.x[n+i], m.y[n+i] = fx[i], fy[i]
	}
	capacity := 2*n + 1
	m.tri = make([][3]int32, 1, capacity)
	m.adj = make([][3]int32, 1, capacity)
	m.fixed = make([][3]bool, 1, capacity)
	m.tri[0] = [3]int32{int32(n), int32(n + 1), int32(n + 2)}
	m.adj[0] = [3]int32{-1, -1, -1}
	m.at = make([]int32, n+3)
	m.deg = make([]int32, n+3)
	for v := range m.at {
		m.at[v] = -1
	}
	m.at[n], m.at[n+1], m.at[n+2] = 0, 0, 0
	m.deg[n], m.deg[n+1], m.deg[n+2] = 1, 1, 1
	t := int32(0)
	for _, v := range spatialOrder(x, y) {
		var err error
		if t, err = m.insert(v, t); err != nil {
			return nil, nil, err
		}
	}
	// Force the edges in, each from its end with fewer triangles, so that a
	// star's centre is never walked round once per edge.
	kept := make([]bool, len(edges))
	for i, e := range edges {
		a, b := e[0], e[1]
		if m.deg[b] < m.deg[a] {
			a, b = b, a
		}
		err := m.constrain(a, b)
		var pe *PlaneError
		if skip && errors.As(err, &pe) {
			continue
		}
		if err != nil {
			return nil, nil, err
		}
		kept[i] = true
		m.edges = append(m.edges, e)
	}
	m.legalizeQueue(-1)
	return m, kept, nil
}

// Frame returns the corners of the frame New puts around the points x, y
// for the given reach: a triangle whose inradius exceeds the larger of
// reach and half the diagonal of the points' bounding box (at least 1),
// about the box's centre. The corners are the vertices N(), N()+1, N()+2.
func Frame(x, y []float64, reach float64) (fx, fy [3]float64) {
	minX, minY, maxX, maxY := math.Inf(1), math.Inf(1), math.Inf(-1), math.Inf(-1)
	for v := range x {
		minX, maxX = min(minX, x[v]), max(maxX, x[v])
		minY, maxY = min(minY, y[v]), max(maxY, y[v])
	}
	cx, cy := (minX+maxX)/2, (minY+maxY)/2
	w, h := maxX-minX, maxY-minY
	r := max(reach, math.Sqrt(float64(w*w)+float64(h*h))/2, 1)
	// Apex 2.2 r up, base corners 1.1 r down and 1.98 r to either side:
	// inradius about 1.13 r.
	return [3]float64{cx, cx - 1.98*r, cx + 1.98*r}, [3]float64{cy + 2.2*r, cy - 1.1*r, cy - 1.1*r}
}

// N returns the number of the drawing's vertices (the frame not counted).
func (m *Mesh) N() int { return m.n }

// X and Y return vertex v's position.
func (m *Mesh) X(v int32) float64 { return m.x[v] }
func (m *Mesh) Y(v int32) float64 { return m.y[v] }

// Triangles returns the number of triangles (2N()+1).
func (m *Mesh) Triangles() int { return len(m.tri) }

// spatialOrder returns the vertices sorted along a Hilbert curve over
// their bounding box, so that each point location walks from a near
// triangle; ties (equal cells) keep index order.
func spatialOrder(x, y []float64) []int32 {
	n := len(x)
	minX, minY, maxX, maxY := math.Inf(1), math.Inf(1), math.Inf(-1), math.Inf(-1)
	for v := range n {
		minX, maxX = min(minX, x[v]), max(maxX, x[v])
		minY, maxY = min(minY, y[v]), max(maxY, y[v])
	}
	const side = 1 << 16
	sx, sy := (side-1)/max(maxX-minX, 1e-300), (side-1)/max(maxY-minY, 1e-300)
	keys := make([]uint64, n)
	for v := range n {
		hx := uint32(math.Min(side-1, math.Max(0, math.Floor(float64((x[v]-minX)*sx)))))
		hy := uint32(math.Min(side-1, math.Max(0, math.Floor(float64((y[v]-minY)*sy)))))
		keys[v] = hilbert(hx, hy, side)<<32 | uint64(v)
	}
	slices.Sort(keys)
	order := make([]int32, n)
	for i, k := range keys {
		order[i] = int32(uint32(k))
	}
	return order
}

// hilbert returns the index of cell (x, y) along the Hilbert curve over a
// side x side grid (side a power of two).
func hilbert(x, y, side uint32) uint64 {
	var d uint64
	for s := side / 2; s > 0; s /= 2 {
		var rx, ry uint32
		if x&s != 0 {
			rx = 1
		}
		if y&s != 0 {
			ry = 1
		}
		d += uint64(s) * uint64(s) * uint64((3*rx)^ry)
		if ry == 0 {
			if rx == 1 {
				x, y = s-1-x, s-1-y
			}
			x, y = y, x
		}
	}
	return d
}

func (m *Mesh) orient(a, b, c int32) int {
	return exact.Orient(m.x[a], m.y[a], m.x[b], m.y[b], m.x[c], m.y[c])
}

// corner returns the index of v among t's corners, or -1.
func (m *Mesh) corner(t, v int32) int {
	tv := &m.tri[t]
	switch v {
	case tv[0]:
		return 0
	case tv[1]:
		return 1
	case tv[2]:
		return 2
	}
	return -1
}

// locate walks from triangle t to the triangle holding vertex v's point.
// It returns the triangle and, if the point lies on a side, that side's
// opposite corner (else -1); a point equal to a corner is ErrSamePoint.
func (m *Mesh) locate(v, t int32) (int32, int, error) {
	px, py := m.x[v], m.y[v]
	for steps := 0; ; steps++ {
		if steps > 4*len(m.tri)+16 {
			return -1, -1, errInput // cannot happen in a valid triangulation
		}
		m.walk++
		moved := false
		onSide, zeros := -1, 0
		for k := range 3 {
			i := (k + int(m.walk)) % 3
			a, b := m.tri[t][(i+1)%3], m.tri[t][(i+2)%3]
			o := exact.Orient(m.x[a], m.y[a], m.x[b], m.y[b], px, py)
			if o < 0 {
				t = m.adj[t][i]
				moved = true
				break
			}
			if o == 0 {
				onSide = i
				zeros++
			}
		}
		if moved {
			continue
		}
		if zeros >= 2 {
			w := m.tri[t][(onSide+1)%3]
			if m.x[w] != px || m.y[w] != py {
				w = m.tri[t][(onSide+2)%3]
			}
			if m.x[w] != px || m.y[w] != py {
				w = m.tri[t][onSide]
			}
			return -1, -1, &PlaneError{Err: ErrSamePoint, Vertices: [2]int32{min(v, w), max(v, w)}}
		}
		return t, onSide, nil
	}
}

// insert adds vertex v to the triangulation, starting the search at t,
// and returns a triangle at v.
func (m *Mesh) insert(v, start int32) (int32, error) {
	t, side, err := m.locate(v, start)
	if err != nil {
		return -1, err
	}
	m.queue = m.queue[:0]
	if side < 0 {
		m.splitTriangle(t, v)
	} else {
		m.splitSide(t, side, v)
	}
	m.legalizeQueue(v)
	return m.at[v], nil
}

func (m *Mesh) newTriangle() int32 {
	if k := len(m.free); k > 0 {
		t := m.free[k-1]
		m.free = m.free[:k-1]
		m.adj[t] = [3]int32{-1, -1, -1}
		m.fixed[t] = [3]bool{}
		return t
	}
	m.tri = append(m.tri, [3]int32{})
	m.adj = append(m.adj, [3]int32{-1, -1, -1})
	m.fixed = append(m.fixed, [3]bool{})
	return int32(len(m.tri) - 1)
}

// relink makes the triangle across t's side opposite corner i, if any,
// point back to t across the same side, whose ends are a and b.
func (m *Mesh) relink(t int32, i int, a, b int32) {
	u := m.adj[t][i]
	if u < 0 {
		return
	}
	for j := range 3 {
		if c := m.tri[u][j]; c != a && c != b {
			m.adj[u][j] = t
			return
		}
	}
}

// set fills triangle t with corners a, b, c, the triangles across their
// opposite sides and those sides' fixed flags, and points each vertex at
// it.
func (m *Mesh) set(t int32, a, b, c int32, na, nb, nc int32, fa, fb, fc bool) {
	m.tri[t] = [3]int32{a, b, c}
	m.adj[t] = [3]int32{na, nb, nc}
	m.fixed[t] = [3]bool{fa, fb, fc}
	m.at[a], m.at[b], m.at[c] = t, t, t
}

// splitTriangle puts v, inside triangle t, into it: three triangles.
func (m *Mesh) splitTriangle(t, v int32) {
	a, b, c := m.tri[t][0], m.tri[t][1], m.tri[t][2]
	na, nb, nc := m.adj[t][0], m.adj[t][1], m.adj[t][2]
	f := m.fixed[t]
	t1, t2 := m.newTriangle(), m.newTriangle()
	// t: (v, b, c) opposite side bc; t1: (v, c, a); t2: (v, a, b).
	m.set(t, v, b, c, na, t1, t2, f[0], false, false)
	m.set(t1, v, c, a, nb, t2, t, f[1], false, false)
	m.set(t2, v, a, b, nc, t, t1, f[2], false, false)
	m.relink(t1, 0, c, a)
	m.relink(t2, 0, a, b)
	m.deg[v] = 3
	m.deg[a]++
	m.deg[b]++
	m.deg[c]++
	m.queue = append(m.queue, flipSide{b, c}, flipSide{c, a}, flipSide{a, b})
}

// splitSide puts v, inside the side of t opposite corner i, into it: the
// two triangles on that side become four.
func (m *Mesh) splitSide(t int32, i int, v int32) {
	a, b, c := m.tri[t][i], m.tri[t][(i+1)%3], m.tri[t][(i+2)%3]
	u := m.adj[t][i]
	j := m.corner(u, oppositeOf(m, u, b, c))
	d := m.tri[u][j] // u = (d, c, b)
	tca, tab := m.adj[t][(i+1)%3], m.adj[t][(i+2)%3]
	fca, fab := m.fixed[t][(i+1)%3], m.fixed[t][(i+2)%3]
	ubd, udc := m.adj[u][(j+1)%3], m.adj[u][(j+2)%3]
	fbd, fdc := m.fixed[u][(j+1)%3], m.fixed[u][(j+2)%3]
	t2, u2 := m.newTriangle(), m.newTriangle()
	// v on bc: t = (a, b, v), t2 = (a, v, c), u = (d, c, v), u2 = (d, v, b).
	m.set(t, a, b, v, u2, t2, tab, false, false, fab)
	m.set(t2, a, v, c, u, tca, t, false, fca, false)
	m.set(u, d, c, v, t2, u2, udc, false, false, fdc)
	m.set(u2, d, v, b, t, ubd, u, false, fbd, false)
	m.relink(t2, 1, c, a)
	m.relink(u2, 1, b, d)
	m.deg[v] = 4
	m.deg[a]++
	m.deg[d]++
	m.queue = append(m.queue, flipSide{a, b}, flipSide{c, a}, flipSide{d, c}, flipSide{b, d})
}

// oppositeOf returns the corner of u that is neither a nor b.
func oppositeOf(m *Mesh, u, a, b int32) int32 {
	for _, c := range m.tri[u] {
		if c != a && c != b {
			return c
		}
	}
	return -1
}

// side finds the triangle with the side from a to b, counter-clockwise
// (b follows a in its corner order), and the corner opposite that side;
// -1 if a and b are not joined. It walks round whichever end has fewer
// triangles, so that the sides at a hub cost what its neighbours' do.
func (m *Mesh) side(a, b int32) (int32, int) {
	if m.deg[b] < m.deg[a] {
		// Round b: the triangle where a comes just before b.
		t := m.around(b, func(t int32, k int) bool { return m.tri[t][(k+2)%3] == a })
		if t < 0 {
			return -1, -1
		}
		return t, (m.corner(t, b) + 1) % 3
	}
	t := m.around(a, func(t int32, k int) bool { return m.tri[t][(k+1)%3] == b })
	if t < 0 {
		return -1, -1
	}
	return t, (m.corner(t, a) + 2) % 3
}

// around returns the first triangle at v, turning round it from m.at[v],
// for which found(t, v's corner in t) holds; -1 if none.
func (m *Mesh) around(v int32, found func(t int32, k int) bool) int32 {
	t := m.at[v]
	start := t
	for {
		k := m.corner(t, v)
		if found(t, k) {
			return t
		}
		t = m.adj[t][(k+1)%3]
		if t < 0 || t == start {
			break
		}
	}
	// v on the frame: its triangles do not close round; walk the other way.
	t = start
	for t >= 0 {
		k := m.corner(t, v)
		if found(t, k) {
			return t
		}
		t = m.adj[t][(k+2)%3]
		if t == start {
			break
		}
	}
	return -1
}

// flippable reports whether the side of t opposite corner i can be
// flipped: it is not fixed, not on the frame, and its two triangles form
// a strictly convex quadrilateral.
func (m *Mesh) flippable(t int32, i int) bool {
	if m.fixed[t][i] {
		return false
	}
	u := m.adj[t][i]
	if u < 0 {
		return false
	}
	a, b, c := m.tri[t][i], m.tri[t][(i+1)%3], m.tri[t][(i+2)%3]
	d := oppositeOf(m, u, b, c)
	return m.orient(a, b, d) > 0 && m.orient(a, d, c) > 0
}

// flip replaces the side of t opposite corner i (bc, with t = abc and the
// triangle across it dcb) by ad. The caller has checked flippable.
func (m *Mesh) flip(t int32, i int) {
	u := m.adj[t][i]
	a, b, c := m.tri[t][i], m.tri[t][(i+1)%3], m.tri[t][(i+2)%3]
	j := m.corner(u, oppositeOf(m, u, b, c))
	d := m.tri[u][j]
	nca, nab := m.adj[t][(i+1)%3], m.adj[t][(i+2)%3]
	fca, fab := m.fixed[t][(i+1)%3], m.fixed[t][(i+2)%3]
	// u = (d, c, b): opposite c is bd, opposite b is dc.
	nbd, ndc := m.adj[u][(j+1)%3], m.adj[u][(j+2)%3]
	fbd, fdc := m.fixed[u][(j+1)%3], m.fixed[u][(j+2)%3]
	// t = (a, b, d), u = (a, d, c).
	m.set(t, a, b, d, nbd, u, nab, fbd, false, fab)
	m.set(u, a, d, c, ndc, nca, t, fdc, fca, false)
	m.relink(t, 0, b, d)
	m.relink(u, 1, c, a)
	m.deg[a]++
	m.deg[d]++
	m.deg[b]--
	m.deg[c]--
}

// delaunay reports whether the side of t opposite corner i is locally
// Delaunay: the far corner of the other triangle is not strictly inside
// t's circumcircle.
func (m *Mesh) delaunay(t int32, i int) bool {
	u := m.adj[t][i]
	if u < 0 {
		return true
	}
	a, b, c := m.tri[t][i], m.tri[t][(i+1)%3], m.tri[t][(i+2)%3]
	d := oppositeOf(m, u, b, c)
	return exact.InCircle(m.x[a], m.y[a], m.x[b], m.y[b], m.x[c], m.y[c], m.x[d], m.y[d]) <= 0
}

// legalizeQueue flips the queued sides until each is locally Delaunay or
// fixed; flips push the sides they make new. With v >= 0 only the sides
// facing v are queued after a flip (point insertion, where the others are
// already Delaunay); with v < 0 all four outer sides are.
func (m *Mesh) legalizeQueue(v int32) {
	budget := 64*len(m.tri) + 1024
	for len(m.queue) > 0 && budget > 0 {
		budget--
		s := m.queue[len(m.queue)-1]
		m.queue = m.queue[:len(m.queue)-1]
		t, i := m.side(s.a, s.b)
		if t < 0 || m.fixed[t][i] || m.delaunay(t, i) || !m.flippable(t, i) {
			continue
		}
		a := m.tri[t][i]
		u := m.adj[t][i]
		d := oppositeOf(m, u, s.a, s.b)
		m.flip(t, i)
		if v >= 0 {
			// After inserting v (= a or d), the new edge is ad; the sides
			// facing v are b-d, d-c (if v is a) or a-b, c-a (if v is d).
			if a == v {
				m.queue = append(m.queue, flipSide{s.a, d}, flipSide{d, s.b})
			} else {
				m.queue = append(m.queue, flipSide{a, s.a}, flipSide{s.b, a})
			}
			continue
		}
		m.queue = append(m.queue, flipSide{s.a, d}, flipSide{d, s.b}, flipSide{s.b, a}, flipSide{a, s.a})
	}
	m.queue = m.queue[:0]
}
