package mesh

// constrain makes a-b a side of the triangulation and marks it fixed.
// The sides the segment crosses are flipped away (Sloan 1993); the new
// sides are queued for the Delaunay pass that follows all constraints.
func (m *Mesh) constrain(a, b int32) error {
	if t, i := m.side(a, b); t >= 0 {
		m.fix(t, i)
		return nil
	}
	crossed, err := m.crossedSides(a, b)
	if err != nil {
		return err
	}
	// Flip every crossed side away. A side that is not yet flippable (its
	// quadrilateral is not convex) waits for its neighbours; some crossed
	// side is always flippable, so the queue empties (Sloan's lemma).
	budget := 8*len(crossed)*len(crossed) + 64
	for head := 0; head < len(crossed); head++ {
		if budget--; budget < 0 {
			return errInput // cannot happen: see the lemma above
		}
		s := crossed[head]
		t, i := m.side(s.a, s.b)
		if t < 0 {
			return errInput
		}
		if !m.flippable(t, i) {
			crossed = append(crossed, s)
			continue
		}
		p := m.tri[t][i]
		u := m.adj[t][i]
		q := oppositeOf(m, u, s.a, s.b)
		m.flip(t, i)
		if m.crosses(a, b, p, q) {
			crossed = append(crossed, flipSide{p, q})
		} else {
			m.queue = append(m.queue, flipSide{p, q})
		}
	}
	t, i := m.side(a, b)
	if t < 0 {
		return errInput
	}
	m.fix(t, i)
	return nil
}

// fix marks the side of t opposite corner i, on both its triangles.
func (m *Mesh) fix(t int32, i int) {
	m.fixed[t][i] = true
	b, c := m.tri[t][(i+1)%3], m.tri[t][(i+2)%3]
	if u := m.adj[t][i]; u >= 0 {
		m.fixed[u][m.corner(u, oppositeOf(m, u, b, c))] = true
	}
}

// crosses reports whether segments ab and pq cross at a point inside both.
func (m *Mesh) crosses(a, b, p, q int32) bool {
	if p == a || p == b || q == a || q == b {
		return false
	}
	return m.orient(a, b, p)*m.orient(a, b, q) < 0 && m.orient(p, q, a)*m.orient(p, q, b) < 0
}

// crossedSides walks from a to b through the triangulation and lists the
// sides the segment ab crosses, in order. It fails if the segment passes
// through a vertex or crosses a fixed side.
func (m *Mesh) crossedSides(a, b int32) ([]flipSide, error) {
	onEdge := func(v int32) error {
		return &PlaneError{Err: ErrOnEdge, Vertices: [2]int32{v, -1}, Edges: [2][2]int32{{min(a, b), max(a, b)}}}
	}
	// The triangle at a whose far side the segment leaves through.
	t := m.at[a]
	start := t
	var p, q int32
	found := false
	for {
		k := m.corner(t, a)
		p, q = m.tri[t][(k+1)%3], m.tri[t][(k+2)%3]
		op, oq := m.orient(a, b, p), m.orient(a, b, q)
		if op == 0 && m.ahead(a, b, p) {
			return nil, onEdge(p)
		}
		if op < 0 && oq > 0 {
			found = true
			break
		}
		t = m.adj[t][(k+1)%3]
		if t == start || t < 0 {
			break
		}
	}
	if !found {
		return nil, errInput // a's triangles always surround it
	}
	var out []flipSide
	for {
		k := m.corner(t, a)
		if len(out) > 0 {
			k = m.corner(t, oppositeOf(m, t, p, q))
		}
		if m.fixed[t][k] {
			return nil, &PlaneError{Err: ErrCrossing, Edges: [2][2]int32{{min(a, b), max(a, b)}, {min(p, q), max(p, q)}}}
		}
		out = append(out, flipSide{p, q})
		u := m.adj[t][k]
		r := oppositeOf(m, u, p, q)
		if r == b {
			return out, nil
		}
		switch o := m.orient(a, b, r); {
		case o == 0:
			return nil, onEdge(r)
		case o < 0:
			p = r
		default:
			q = r
		}
		t = u
	}
}

// ahead reports whether p lies on the ray from a through b, past a.
func (m *Mesh) ahead(a, b, p int32) bool {
	return float64((m.x[p]-m.x[a])*(m.x[b]-m.x[a]))+float64((m.y[p]-m.y[a])*(m.y[b]-m.y[a])) > 0
}
