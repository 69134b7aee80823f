package mesh

import (
	"errors"
	"fmt"
	"math"

	"github.com/gridwood/gridwood/internal/exact"
)

// Corner is one triangle around a vertex v, seen from v: the next two
// corners A and B counter-clockwise, and which of its sides are drawing
// edges (VA, VB the sides at v, AB the one facing it).
type Corner struct {
	A, B       int32
	VA, VB, AB bool
	Frame      bool // A or B is a frame vertex
}

// Star calls fn for every triangle around drawing vertex v, in
// counter-clockwise order.
func (m *Mesh) Star(v int32, fn func(c Corner)) {
	t := m.at[v]
	start := t
	n := int32(m.n)
	for {
		k := m.corner(t, v)
		a, b := m.tri[t][(k+1)%3], m.tri[t][(k+2)%3]
		f := &m.fixed[t]
		fn(Corner{A: a, B: b, VA: f[(k+2)%3], VB: f[(k+1)%3], AB: f[k], Frame: a >= n || b >= n})
		t = m.adj[t][(k+1)%3]
		if t == start {
			return
		}
	}
}

// CanMove reports whether drawing vertex v can move to (x, y) with every
// triangle around it still turning counter-clockwise, which keeps the whole
// drawing plane.
func (m *Mesh) CanMove(v int32, x, y float64) bool {
	if m.tangled {
		return false
	}
	t := m.at[v]
	start := t
	for {
		k := m.corner(t, v)
		a, b := m.tri[t][(k+1)%3], m.tri[t][(k+2)%3]
		if exact.Orient(x, y, m.x[a], m.y[a], m.x[b], m.y[b]) <= 0 {
			return false
		}
		t = m.adj[t][(k+1)%3]
		if t == start {
			return true
		}
	}
}

// Move moves drawing vertex v to (x, y) if CanMove allows it, and reports
// whether it did.
func (m *Mesh) Move(v int32, x, y float64) bool {
	if v < 0 || int(v) >= m.n || !m.CanMove(v, x, y) {
		return false
	}
	m.x[v], m.y[v] = x, y
	return true
}

// Legalize flips the free sides around v and their neighbours until they
// are locally Delaunay, at most about budget flips.
func (m *Mesh) Legalize(v int32) {
	m.queue = m.queue[:0]
	m.Star(v, func(c Corner) {
		m.queue = append(m.queue, flipSide{v, c.A}, flipSide{c.A, c.B})
	})
	m.legalizeQueue(-1)
}

// LegalizeAll makes every free side locally Delaunay (within a work bound
// proportional to the size).
func (m *Mesh) LegalizeAll() {
	m.queue = m.queue[:0]
	for t := range m.tri {
		for i := range 3 {
			b, c := m.tri[t][(i+1)%3], m.tri[t][(i+2)%3]
			if b < c && !m.fixed[t][i] && m.adj[t][i] >= 0 {
				m.queue = append(m.queue, flipSide{b, c})
			}
		}
	}
	m.legalizeQueue(-1)
}

// Positions returns copies of the drawing's vertex positions.
func (m *Mesh) Positions() (x, y []float64) {
	return append([]float64(nil), m.x[:m.n]...), append([]float64(nil), m.y[:m.n]...)
}

// Check verifies the triangulation's own invariants: neighbours point back
// to each other across the same side with the same fixed flag, every
// triangle turns counter-clockwise, every vertex's triangle holds it, and
// the count of triangles is 2N()+1. Tests use it; a nil error also means
// the drawing is plane.
func (m *Mesh) Check() error {
	return m.check(true)
}

// CheckCombinatorics is Check without the orientation test, for tangled
// meshes: the triangles still form a triangulated disc.
func (m *Mesh) CheckCombinatorics() error {
	return m.check(false)
}

func (m *Mesh) check(orientation bool) error {
	if len(m.tri) != 2*m.n+1 {
		return fmt.Errorf("mesh: %d triangles for %d vertices", len(m.tri), m.n)
	}
	frameSides := 0
	for t := range m.tri {
		tt := int32(t)
		a, b, c := m.tri[t][0], m.tri[t][1], m.tri[t][2]
		if orientation && m.orient(a, b, c) <= 0 {
			return fmt.Errorf("mesh: triangle %d (%d %d %d) does not turn counter-clockwise", t, a, b, c)
		}
		for i := range 3 {
			u := m.adj[t][i]
			p, q := m.tri[t][(i+1)%3], m.tri[t][(i+2)%3]
			if u < 0 {
				frameSides++
				continue
			}
			j := m.corner(u, oppositeOf(m, u, p, q))
			if j < 0 || m.adj[u][j] != tt || m.fixed[u][j] != m.fixed[t][i] {
				return fmt.Errorf("mesh: triangles %d and %d disagree about their side %d-%d", t, u, p, q)
			}
			if m.tri[u][(j+1)%3] != q || m.tri[u][(j+2)%3] != p {
				return fmt.Errorf("mesh: triangles %d and %d do not share side %d-%d", t, u, p, q)
			}
		}
	}
	if frameSides != 3 {
		return errors.New("mesh: the frame is not one triangle")
	}
	for v, t := range m.at {
		if t < 0 || m.corner(t, int32(v)) < 0 {
			return fmt.Errorf("mesh: vertex %d is not in its triangle", v)
		}
		if v < m.n && m.countStar(int32(v)) != int(m.deg[v]) {
			return fmt.Errorf("mesh: vertex %d has %d triangles, counted %d", v, m.countStar(int32(v)), m.deg[v])
		}
	}
	return nil
}

// Around returns the drawing vertices joined to v by fixed sides (edges of
// the drawing), counter-clockwise.
func (m *Mesh) Around(v int32) []int32 {
	var out []int32
	m.Star(v, func(c Corner) {
		if c.VA {
			out = append(out, c.A)
		}
	})
	return out
}

// Spokes is the number of triangles at vertex v: its degree in the
// triangulation, dummy sides included.
func (m *Mesh) Spokes(v int32) int { return int(m.deg[v]) }

// Fixed reports whether a and b are joined by a fixed side.
func (m *Mesh) Fixed(a, b int32) bool {
	t, i := m.side(a, b)
	return t >= 0 && m.fixed[t][i]
}

// Height returns the least distance from drawing vertex v to the line of
// a side of its star that has no frame vertex (+Inf if there is none).
func (m *Mesh) Height(v int32) float64 {
	best := math.Inf(1)
	m.Star(v, func(c Corner) {
		if c.Frame {
			return
		}
		ax, ay, bx, by := m.x[c.A], m.y[c.A], m.x[c.B], m.y[c.B]
		l := math.Sqrt(float64((bx-ax)*(bx-ax)) + float64((by-ay)*(by-ay)))
		area := float64((ax-m.x[v])*(by-m.y[v])) - float64((ay-m.y[v])*(bx-m.x[v]))
		if l > 0 {
			best = min(best, area/l)
		}
	})
	return best
}

// AddEdge makes a-b an edge of the drawing (a fixed side) if the segment
// crosses no edge and passes through no vertex, and reports whether it
// did; the triangulation is unchanged otherwise.
func (m *Mesh) AddEdge(a, b int32) bool {
	if m.tangled || a < 0 || b < 0 || int(a) >= m.n || int(b) >= m.n || a == b {
		return false
	}
	if m.deg[b] < m.deg[a] {
		a, b = b, a
	}
	if m.constrain(a, b) != nil {
		return false
	}
	m.edges = append(m.edges, [2]int32{a, b})
	m.legalizeQueue(-1)
	return true
}

// LeastHeight returns the least height (corner to opposite side) over the
// triangles with no frame vertex, and a vertex at that corner.
func (m *Mesh) LeastHeight() (float64, int32) {
	best, at := math.Inf(1), int32(-1)
	n := int32(m.n)
	for t := range m.tri {
		a, b, c := m.tri[t][0], m.tri[t][1], m.tri[t][2]
		if a >= n || b >= n || c >= n {
			continue
		}
		area := float64((m.x[b]-m.x[a])*(m.y[c]-m.y[a])) - float64((m.y[b]-m.y[a])*(m.x[c]-m.x[a]))
		for k, p := range [3]int32{a, b, c} {
			q, r := m.tri[t][(k+1)%3], m.tri[t][(k+2)%3]
			l := math.Sqrt(float64((m.x[r]-m.x[q])*(m.x[r]-m.x[q])) + float64((m.y[r]-m.y[q])*(m.y[r]-m.y[q])))
			if h := area / l; h < best {
				best, at = h, p
			}
		}
	}
	return best, at
}

// Scale multiplies every position, the frame's included, by f > 0 about
// the origin: every orientation is kept, so the triangulation stays
// valid.
func (m *Mesh) Scale(f float64) {
	for v := range m.x {
		m.x[v] *= f
		m.y[v] *= f
	}
}
