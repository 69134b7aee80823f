package mesh

import "github.com/gridwood/gridwood/internal/exact"

// Jump moves drawing vertex v to (x, y) in one step, across whatever lies
// between, if the drawing with v there is plane: no edge at v's new place
// may cross or touch an edge, pass through a vertex, or end inside an
// edge, and (x, y) may be no other vertex's point. Edges are straight
// segments, so this is decided by walking each new edge through the
// triangulation from its far end. If the jump is allowed, v is taken out
// of the triangulation (its edges flipped away until three triangles
// remain, which become one) and put back at the new point with its edges
// forced in again. It reports whether v moved.
func (m *Mesh) Jump(v int32, x, y float64) bool {
	if m.tangled || v < 0 || int(v) >= m.n || !m.insideFrame(x, y) {
		return false
	}
	around := m.Around(v)
	for _, w := range around {
		if !m.clearPath(w, v, x, y) {
			return false
		}
	}
	if !m.clearPoint(v, x, y) {
		return false
	}
	px, py := m.x[v], m.y[v]
	t, ok := m.remove(v)
	if !ok {
		// No ear to cut (a star too flat to tell): triangulate the
		// drawing with v at its new place from scratch, or failing that
		// at its old one.
		if m.rebuildWith(v, x, y) {
			return true
		}
		m.restore(v, px, py)
		return false
	}
	m.x[v], m.y[v] = x, y
	if _, err := m.insert(v, t); err != nil {
		m.restore(v, px, py)
		return false
	}
	for _, w := range around {
		if err := m.constrain(v, w); err != nil {
			m.restore(v, px, py)
			return false
		}
	}
	m.legalizeQueue(-1)
	return true
}

// insideFrame reports whether (x, y) lies strictly inside the frame.
func (m *Mesh) insideFrame(x, y float64) bool {
	n := m.n
	for i := range 3 {
		a, b := n+i, n+(i+1)%3
		if orientAt(m.x[a], m.y[a], m.x[b], m.y[b], x, y) <= 0 {
			return false
		}
	}
	return true
}

// clearPoint reports whether (x, y) lies strictly inside a triangle, or
// on a side that is free or at v, and is no vertex's point but v's.
func (m *Mesh) clearPoint(v int32, x, y float64) bool {
	t := m.at[v]
	for steps := 0; steps < 4*len(m.tri)+16; steps++ {
		moved := false
		for i := range 3 {
			a, b := m.tri[t][(i+1)%3], m.tri[t][(i+2)%3]
			o := orientAt(m.x[a], m.y[a], m.x[b], m.y[b], x, y)
			if o < 0 {
				t = m.adj[t][i]
				moved = true
				break
			}
			if o == 0 && m.fixed[t][i] && a != v && b != v {
				return false
			}
		}
		if !moved {
			for _, c := range m.tri[t] {
				if c != v && m.x[c] == x && m.y[c] == y {
					return false
				}
			}
			return true
		}
	}
	return false
}

// clearPath reports whether the segment from vertex w to (x, y) crosses
// no fixed side except v's, and passes through no vertex: the walk of
// crossedSides toward a point.
func (m *Mesh) clearPath(w, v int32, x, y float64) bool {
	forward := func(p int32) bool {
		return float64((m.x[p]-m.x[w])*(x-m.x[w]))+float64((m.y[p]-m.y[w])*(y-m.y[w])) > 0
	}
	ahead := func(p int32) bool {
		// p on the line from w to (x, y): strictly before the point?
		dx, dy := x-m.x[w], y-m.y[w]
		return float64((m.x[p]-m.x[w])*dx)+float64((m.y[p]-m.y[w])*dy) > 0 &&
			float64((m.x[p]-x)*dx)+float64((m.y[p]-y)*dy) < 0
	}
	ray := func(p int32) int { return orientAt(m.x[w], m.y[w], x, y, m.x[p], m.y[p]) }
	inside := func(a, b int32) int { return orientAt(m.x[a], m.y[a], m.x[b], m.y[b], x, y) }
	// The triangle at w whose corner holds the direction to the point.
	t := m.at[w]
	start := t
	var p, r int32
	found := false
	for {
		k := m.corner(t, w)
		p, r = m.tri[t][(k+1)%3], m.tri[t][(k+2)%3]
		op, or := ray(p), ray(r)
		if (op == 0 && forward(p)) || (or == 0 && forward(r)) {
			return false // a vertex on the new edge, or the edge on a side
		}
		if op < 0 && or > 0 {
			found = true
			break
		}
		t = m.adj[t][(k+1)%3]
		if t == start || t < 0 {
			break
		}
	}
	if !found {
		return false
	}
	for steps := 0; steps < 4*len(m.tri)+16; steps++ {
		// The segment is inside triangle t, entering it between p and r
		// (p right of it, r left); it ends here unless it leaves by p-r.
		if s := inside(p, r); s > 0 {
			return true
		} else if s == 0 {
			return false // ends on a side: leave such points alone
		}
		k := m.corner(t, oppositeOf(m, t, p, r))
		if m.fixed[t][k] && p != v && r != v {
			return false
		}
		u := m.adj[t][k]
		if u < 0 {
			return false
		}
		s := oppositeOf(m, u, p, r)
		switch o := ray(s); {
		case o == 0:
			if ahead(s) {
				return false
			}
			// s past the point: the point is inside u or on its sides.
			if inside(p, s) <= 0 || inside(s, r) <= 0 {
				return false
			}
			return true
		case o < 0:
			if inside(p, s) > 0 && inside(s, r) > 0 {
				return true
			}
			p = s
		default:
			if inside(p, s) > 0 && inside(s, r) > 0 {
				return true
			}
			r = s
		}
		t = u
	}
	return false
}

// remove takes drawing vertex v out of the triangulation: while more
// than three spokes are left, it flips away a spoke to a neighbour whose
// corner of the surrounding polygon is an ear (convex, with v not beyond
// the new side: the polygon is star-shaped from v, so such a neighbour
// exists and its triangle holds no other neighbour; the triangle left at
// v may be flat, which does not matter as v is leaving), and its last
// three triangles become one, which is returned. The two freed triangles
// wait in m.free for the next insertion. ok is false if no ear was found.
func (m *Mesh) remove(v int32) (int32, bool) {
	for m.deg[v] > 3 {
		flipped := false
		t := m.at[v]
		for range m.deg[v] {
			k := m.corner(t, v)
			// The spoke from v to the next corner a, side opposite corner
			// k+2 (b); across it the previous neighbour d.
			i := (k + 2) % 3
			a, b := m.tri[t][(k+1)%3], m.tri[t][i]
			u := m.adj[t][i]
			d := oppositeOf(m, u, v, a)
			if m.orient(d, a, b) > 0 && m.orient(v, d, b) >= 0 {
				m.flip(t, i)
				flipped = true
				break
			}
			t = m.adj[t][(k+1)%3]
		}
		if !flipped {
			return -1, false
		}
	}
	// Three triangles (v, a, b), (v, b, c), (v, c, a) become (a, b, c).
	t := m.at[v]
	k := m.corner(t, v)
	a, b := m.tri[t][(k+1)%3], m.tri[t][(k+2)%3]
	t2 := m.adj[t][(k+1)%3] // across v-b
	k2 := m.corner(t2, v)
	c := m.tri[t2][(k2+2)%3]
	t3 := m.adj[t2][(k2+1)%3] // across v-c
	k3 := m.corner(t3, v)
	nab, fab := m.adj[t][k], m.fixed[t][k]
	nbc, fbc := m.adj[t2][k2], m.fixed[t2][k2]
	nca, fca := m.adj[t3][k3], m.fixed[t3][k3]
	m.set(t, a, b, c, nbc, nca, nab, fbc, fca, fab)
	m.relink(t, 0, b, c)
	m.relink(t, 1, c, a)
	m.relink(t, 2, a, b)
	m.deg[a]--
	m.deg[b]--
	m.deg[c]--
	m.deg[v] = 0
	m.at[v] = -1
	m.free = append(m.free, t2, t3)
	return t, true
}

// rebuildWith triangulates the drawing anew with v at (px, py) and
// reports whether that drawing is plane (the mesh is unchanged if not):
// the way out when a jump that its checks allowed fails midway.
func (m *Mesh) rebuildWith(v int32, px, py float64) bool {
	n := m.n
	x := append([]float64(nil), m.x[:n]...)
	y := append([]float64(nil), m.y[:n]...)
	x[v], y[v] = px, py
	fx := [3]float64{m.x[n], m.x[n+1], m.x[n+2]}
	fy := [3]float64{m.y[n], m.y[n+1], m.y[n+2]}
	fresh, _, err := build(x, y, m.edges, fx, fy, false)
	if err != nil {
		return false
	}
	*m = *fresh
	return true
}

// restore puts v back at (px, py), where the drawing was plane a moment
// ago, and triangulates it anew. Should even that fail (it cannot: the
// positions are those the mesh held, inside the same frame), the mesh is
// marked broken and refuses every move from then on, so that the drawing
// stays as it was.
func (m *Mesh) restore(v int32, px, py float64) {
	if !m.rebuildWith(v, px, py) {
		m.x[v], m.y[v] = px, py
		m.tangled = true
	}
}

func orientAt(ax, ay, bx, by, cx, cy float64) int { return exact.Orient(ax, ay, bx, by, cx, cy) }
