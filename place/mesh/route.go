package mesh

// Route makes u-v a fixed side by changing only the triangulation's
// combinatorics, not the drawing: the corridor of triangles crossed by a
// shortest path in the dual graph from u to v over free sides (the same
// face of the drawing's edges) is taken out, and the two polygons on
// either side of the new side u-v are triangulated again without creating
// a side that already exists. The result is a triangulation of the same
// disc with u-v in it, but its triangles need no longer turn
// counter-clockwise where the drawing is: the mesh is then tangled, and
// only Rings may be used on it (for a solve that draws it plane again).
// Route reports false, changing nothing, when u and v share no face or
// the corridor pinches (a vertex on both of its sides).
//
// afterU, if not -1, must be joined to u by a fixed side: the new side
// then leaves u in the corner counter-clockwise after that side (up to
// the next fixed side), which picks the face when u and v share several.
// afterV does the same at v.
func (m *Mesh) Route(u, v, afterU, afterV int32) bool {
	if u == v || u < 0 || v < 0 || int(u) >= m.n || int(v) >= m.n {
		return false
	}
	if t, i := m.side(u, v); t >= 0 {
		m.fix(t, i)
		return true
	}
	path := m.dualPath(m.sector(u, afterU), m.sector(v, afterV))
	if path == nil && (afterU >= 0 || afterV >= 0) {
		// The corners asked for lie on different faces: any will do.
		path = m.dualPath(m.sector(u, -1), m.sector(v, -1))
	}
	if path == nil {
		return false
	}
	// The corridor's two chains, from u to v: left (counter-clockwise of
	// the path, seen walking from u) and right.
	left, right, ok := m.chains(u, v, path)
	if !ok {
		return false
	}
	// Outer neighbours and fixed flags of the corridor's boundary sides,
	// keyed by their ends.
	type outside struct {
		t     int32
		fixed bool
	}
	boundary := map[[2]int32]outside{}
	inPath := map[int32]bool{}
	for _, t := range path {
		inPath[t] = true
	}
	for _, t := range path {
		for i := range 3 {
			if nb := m.adj[t][i]; !inPath[nb] {
				a, b := m.tri[t][(i+1)%3], m.tri[t][(i+2)%3]
				boundary[[2]int32{a, b}] = outside{nb, m.fixed[t][i]}
			}
		}
	}
	// Triangulate the two polygons, each counter-clockwise: the left chain
	// walked back from v to u, and the right chain from u to v.
	polyL := []int32{v}
	for i := len(left) - 1; i >= 0; i-- {
		polyL = append(polyL, left[i])
	}
	polyL = append(polyL, u)
	polyR := append(append([]int32{u}, right...), v)
	// The corridor's inner sides go away: they do not count as existing.
	gone := map[[2]int32]bool{}
	for i := 0; i+1 < len(path); i++ {
		for k := range 3 {
			if m.adj[path[i]][k] == path[i+1] {
				a, b := m.tri[path[i]][(k+1)%3], m.tri[path[i]][(k+2)%3]
				gone[[2]int32{a, b}], gone[[2]int32{b, a}] = true, true
			}
		}
	}
	var tris [][3]int32
	for _, poly := range [][]int32{polyL, polyR} {
		t, ok := m.fillPolygon(poly, u, v, gone)
		if !ok {
			return false
		}
		tris = append(tris, t...)
	}
	if len(tris) != len(path) {
		return false // the corridor was not a disc
	}
	// Write them into the corridor's slots and link them.
	for i, t := range path {
		c := tris[i]
		m.tri[t] = c
		m.adj[t] = [3]int32{-1, -1, -1}
		m.fixed[t] = [3]bool{}
	}
	inner := map[[2]int32][2]int32{} // side (a, b) -> triangle and corner
	for _, t := range path {
		for i := range 3 {
			a, b := m.tri[t][(i+1)%3], m.tri[t][(i+2)%3]
			if o, ok := boundary[[2]int32{a, b}]; ok {
				m.adj[t][i], m.fixed[t][i] = o.t, o.fixed
				if o.t >= 0 {
					m.relink(t, i, a, b)
				}
				continue
			}
			if other, ok := inner[[2]int32{b, a}]; ok {
				m.adj[t][i] = other[0]
				m.adj[other[0]][other[1]] = t
				if (a == u && b == v) || (a == v && b == u) {
					m.fixed[t][i] = true
					m.fixed[other[0]][other[1]] = true
				}
				continue
			}
			inner[[2]int32{a, b}] = [2]int32{t, int32(i)}
		}
		for _, c := range m.tri[t] {
			m.at[c] = t
		}
	}
	// Degrees: count triangles again around the corridor's vertices.
	for _, poly := range [][]int32{polyL, polyR} {
		for _, c := range poly {
			m.deg[c] = 0
		}
	}
	for _, poly := range [][]int32{polyL, polyR} {
		for _, c := range poly {
			if m.deg[c] == 0 {
				m.deg[c] = int32(m.countStar(c))
			}
		}
	}
	m.edges = append(m.edges, [2]int32{u, v})
	m.tangled = true
	return true
}

// countStar counts the triangles at v by walking its star.
func (m *Mesh) countStar(v int32) int {
	t := m.at[v]
	start, k := t, 0
	for {
		k++
		c := m.corner(t, v)
		t = m.adj[t][(c+1)%3]
		if t < 0 {
			// A frame vertex: count the other way too.
			t = start
			for {
				c := m.corner(t, v)
				t = m.adj[t][(c+2)%3]
				if t < 0 || t == start {
					return k
				}
				k++
			}
		}
		if t == start {
			return k
		}
	}
}

// sector returns the triangles at v counter-clockwise after its fixed side
// to after, up to its next fixed side; all of v's triangles if after is -1
// or not joined to v by a fixed side.
func (m *Mesh) sector(v, after int32) []int32 {
	var all, out []int32
	in := false
	done := false
	m.Star(v, func(c Corner) {
		all = append(all, m.cornerTriangle(v, c))
	})
	if after < 0 {
		return all
	}
	// Two passes round the star so that a sector wrapping past the start
	// is whole.
	k := len(all)
	for i := 0; i < 2*k && !done; i++ {
		t := all[i%k]
		c := m.corner(t, v)
		a := m.tri[t][(c+1)%3]
		spokeFixed := m.fixed[t][(c+2)%3] // side v-a
		if in && spokeFixed {
			done = true
			break
		}
		if a == after && spokeFixed {
			if in {
				break
			}
			in = true
		}
		if in {
			out = append(out, t)
		}
	}
	if len(out) == 0 {
		return all
	}
	return out
}

// cornerTriangle returns the triangle Star showed as c (the one at v with
// corners A and B after v).
func (m *Mesh) cornerTriangle(v int32, c Corner) int32 {
	t, _ := m.side(c.A, c.B)
	return t
}

// dualPath returns a shortest sequence of triangles, the first among from
// and the last among to, each across a free side from the one before; nil
// if there is none.
func (m *Mesh) dualPath(from, to []int32) []int32 {
	prev := map[int32]int32{}
	target := map[int32]bool{}
	for _, t := range to {
		target[t] = true
	}
	var queue []int32
	for _, t := range from {
		if _, seen := prev[t]; !seen {
			prev[t] = -1
			queue = append(queue, t)
		}
	}
	for head := 0; head < len(queue); head++ {
		t := queue[head]
		if target[t] {
			var path []int32
			for ; t >= 0; t = prev[t] {
				path = append(path, t)
			}
			for i, j := 0, len(path)-1; i < j; i, j = i+1, j-1 {
				path[i], path[j] = path[j], path[i]
			}
			return path
		}
		for i := range 3 {
			nb := m.adj[t][i]
			if nb < 0 || m.fixed[t][i] {
				continue
			}
			if _, seen := prev[nb]; seen {
				continue
			}
			prev[nb] = t
			queue = append(queue, nb)
		}
	}
	return nil
}

// chains returns the vertices on either side of the corridor path from u
// to v, in order from u, the left one counter-clockwise of the walk; a
// vertex met again on its side after others (the corridor wrapping a
// pocket) is listed again. ok is false if a vertex shows up on both sides
// (the corridor pinches).
func (m *Mesh) chains(u, v int32, path []int32) (left, right []int32, ok bool) {
	if len(path) == 1 {
		return nil, nil, false // u and v in one triangle are joined
	}
	// The side crossed from path[0] into path[1], then onward: each shared
	// side's ends are one left, one right.
	seen := map[int32]int{u: 3, v: 3}
	add := func(c int32, side int) bool {
		chain := &right
		if side == 1 {
			chain = &left
		}
		if s, ok := seen[c]; ok {
			if s != side {
				return false
			}
			if (*chain)[len(*chain)-1] == c {
				return true // still the same corner
			}
			// Met again on the same side: the corridor wraps a pocket.
		}
		seen[c] = side
		*chain = append(*chain, c)
		return true
	}
	for i := 0; i+1 < len(path); i++ {
		t, next := path[i], path[i+1]
		var k int
		for k = 0; k < 3 && m.adj[t][k] != next; k++ {
		}
		// Side of t opposite corner k, from a to b counter-clockwise in t:
		// walking across it away from t, a is on the right, b on the left.
		a, b := m.tri[t][(k+1)%3], m.tri[t][(k+2)%3]
		if !add(a, 2) || !add(b, 1) {
			return nil, nil, false
		}
	}
	return left, right, true
}

// fillPolygon triangulates the polygon (its vertices in order, u-v one of
// its sides) combinatorially without using a side that exists outside it
// (other than u-v; the sides in gone are about to go): from its vertex of least degree, a fan when that
// vertex has no neighbour among the others, else first cut off the part
// beyond such a chord (the argument of the augmentation that triangulates
// faces: a chord outside the polygon separates its two arcs). The
// triangles are listed counter-clockwise.
func (m *Mesh) fillPolygon(poly []int32, u, v int32, gone map[[2]int32]bool) ([][3]int32, bool) {
	var out [][3]int32
	joined := func(a, b int32) bool {
		if (a == u && b == v) || (a == v && b == u) {
			return true
		}
		if gone[[2]int32{a, b}] {
			return false
		}
		t, _ := m.side(a, b)
		if t < 0 {
			t, _ = m.side(b, a)
		}
		return t >= 0
	}
	var rec func(p []int32) bool
	// A walk that meets a vertex twice is a polygon with pockets: each
	// pocket, from a vertex back to it, is filled on its own.
	split := func(walk []int32) [][]int32 {
		var polys [][]int32
		var stack []int32
		at := map[int32]int{}
		for _, c := range walk {
			if i, ok := at[c]; ok {
				pocket := append([]int32(nil), stack[i:]...)
				polys = append(polys, pocket)
				for _, d := range stack[i+1:] {
					delete(at, d)
				}
				stack = stack[:i+1]
				continue
			}
			at[c] = len(stack)
			stack = append(stack, c)
		}
		return append(polys, stack)
	}
	rec = func(p []int32) bool {
		k := len(p)
		if k < 3 {
			return k == 2
		}
		if k == 3 {
			out = append(out, [3]int32{p[0], p[1], p[2]})
			return true
		}
		best := 0
		for i := range p {
			if m.deg[p[i]] < m.deg[p[best]] {
				best = i
			}
		}
		q := append(append([]int32(nil), p[best:]...), p[:best]...)
		for i := 2; i <= k-2; i++ {
			if joined(q[0], q[i]) {
				// q0-qi exists elsewhere: cut with q1-q(i+1)...: use q[1]
				// as the apex of the part beyond, which cannot be joined to
				// q(i+1)..q(k-1) by planarity.
				for j := i + 1; j <= k-1; j++ {
					if joined(q[1], q[j]) {
						return false
					}
				}
				// Triangles q1 q(j) q(j+1) for j = i+1..k-2, and q0 q1 q(k-1),
				// then the rest q1..q(i+1).
				out = append(out, [3]int32{q[0], q[1], q[k-1]})
				for j := k - 1; j > i+1; j-- {
					out = append(out, [3]int32{q[1], q[j-1], q[j]})
				}
				return rec(q[1 : i+2])
			}
		}
		for i := 1; i+1 < k; i++ {
			out = append(out, [3]int32{q[0], q[i], q[i+1]})
		}
		return true
	}
	for _, p := range split(poly) {
		if !rec(p) {
			return nil, false
		}
	}
	return out, true
}

// Rings calls fn for every drawing vertex with its neighbours,
// counter-clockwise in the triangulation's own order (valid also when the
// mesh is tangled).
func (m *Mesh) Rings(fn func(v int32, ring []int32)) {
	var ring []int32
	for v := range int32(m.n) {
		ring = ring[:0]
		m.Star(v, func(c Corner) { ring = append(ring, c.A) })
		fn(v, ring)
	}
}
