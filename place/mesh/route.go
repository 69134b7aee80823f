package mesh

import "slices"

// Route makes u-v a fixed side by changing only the triangulation's
// combinatorics, not the drawing: the corridor of triangles crossed by a
// shortest path in the dual graph from u to v over free sides (the same
// face of the drawing's edges) is taken out, and the two polygons on
// either side of the new side u-v are triangulated again without creating
// a side that already exists. The result is a triangulation of the same
// disc with u-v in it, but its triangles need no longer turn
// counter-clockwise where the drawing is: the mesh is then tangled, and
// only Rings may be used on it (for a solve that draws it plane again).
// Route reports false when u and v share no face or the corridor pinches
// (a vertex on both of its sides); it changes nothing then, except that a
// free side u-v lying in other corners than asked may have been flipped
// away (see below), and the caller should drop the mesh.
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
		if m.fixed[t][i] {
			return true
		}
		if m.inCorner(t, u, afterU) && m.inCorner(t, v, afterV) {
			m.fix(t, i)
			return true
		}
		// A side u-v of the triangulation, but in another corner of u or v
		// than the one asked for: flip it away (the mesh is only
		// combinatorial from here on) and route it through the corner.
		nb := m.adj[t][i]
		if nb < 0 {
			return false
		}
		d := oppositeOf(m, nb, m.tri[t][(i+1)%3], m.tri[t][(i+2)%3])
		if s, _ := m.side(m.tri[t][i], d); s >= 0 || d == m.tri[t][i] {
			return false
		}
		m.flip(t, i)
		m.tangled = true
	}
	// A shortest corridor through the face: the dual graph of a face's
	// triangles is a tree, so within a face the corridor is the only one.
	path := m.dualPath(u, v, m.sector(u, afterU), m.sector(v, afterV))
	if path == nil && (afterU >= 0 || afterV >= 0) {
		// The corners asked for lie on different faces: any will do.
		path = m.dualPath(u, v, m.sector(u, -1), m.sector(v, -1))
	}
	if path == nil {
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
	wasFixed := map[[2]int32]bool{} // sides inside the corridor that are edges (a slit)
	for _, t := range path {
		for i := range 3 {
			a, b := m.tri[t][(i+1)%3], m.tri[t][(i+2)%3]
			if nb := m.adj[t][i]; !inPath[nb] {
				boundary[[2]int32{a, b}] = outside{nb, m.fixed[t][i]}
			} else if m.fixed[t][i] {
				wasFixed[[2]int32{min(a, b), max(a, b)}] = true
			}
		}
	}
	// The corridor's boundary, walked counter-clockwise, split at u and v
	// into the two polygons the new side closes.
	walk := m.boundaryWalk(path, inPath)
	iu, iv := -1, -1
	for i, c := range walk {
		switch c {
		case u:
			if iu >= 0 {
				return false // the corridor meets u twice
			}
			iu = i
		case v:
			if iv >= 0 {
				return false
			}
			iv = i
		}
	}
	if iu < 0 || iv < 0 || len(walk) != len(path)+2 {
		return false
	}
	var polyL, polyR []int32 // from v round to u, and from u round to v
	for i := iv; ; i = (i + 1) % len(walk) {
		polyL = append(polyL, walk[i])
		if i == iu {
			break
		}
	}
	for i := iu; ; i = (i + 1) % len(walk) {
		polyR = append(polyR, walk[i])
		if i == iv {
			break
		}
	}
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
	made := map[[2]int32]bool{{min(u, v), max(u, v)}: true}
	for _, poly := range [][]int32{polyL, polyR} {
		t, ok := m.fillPolygon(poly, gone, made)
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
				if (a == u && b == v) || (a == v && b == u) || wasFixed[[2]int32{min(a, b), max(a, b)}] {
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
// (triangles at u) and the last among to (at v), each across a free side
// from the one before, and none other at u or v (the corridor would meet
// them twice); nil if there is none.
func (m *Mesh) dualPath(u, v int32, from, to []int32) []int32 {
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
			if !target[nb] && (m.corner(nb, u) >= 0 || m.corner(nb, v) >= 0) {
				continue
			}
			prev[nb] = t
			queue = append(queue, nb)
		}
	}
	return nil
}

// boundaryWalk returns the corners of the corridor's boundary in order,
// counter-clockwise (the corridor on the left); a vertex the boundary
// passes more than once is listed each time, and an edge between two of
// the corridor's triangles (a slit) is walked along both its sides. From each boundary side a->b
// the next is found by turning round b through the corridor's triangles
// until a side leaves it.
func (m *Mesh) boundaryWalk(path []int32, inPath map[int32]bool) []int32 {
	// A first boundary side: one of path[0]'s.
	t0, i0 := path[0], -1
	for i := range 3 {
		if !inPath[m.adj[t0][i]] || m.fixed[t0][i] {
			i0 = i
			break
		}
	}
	if i0 < 0 {
		return nil
	}
	var walk []int32
	t, i := t0, i0
	for steps := 0; steps < 4*len(path)+8; steps++ {
		// Boundary side of t opposite corner i, from a to b; then turn
		// round b: in t the next side at b is b -> c, opposite a.
		a, b := m.tri[t][(i+1)%3], m.tri[t][(i+2)%3]
		walk = append(walk, a)
		for {
			ka := (i + 1) % 3 // corner of a in t: the side b -> c is opposite it
			nb := m.adj[t][ka]
			if !inPath[nb] || m.fixed[t][ka] {
				// Out of the corridor, or along an edge inside it (a slit,
				// whose two sides are both boundary).
				i = ka
				break
			}
			// Into the triangle across b -> c, which holds c -> b; go on
			// round b there.
			c := m.tri[t][i]
			t = nb
			j := m.corner(t, oppositeOf(m, t, b, c))
			// In the new t, with its corner j opposite c-b, the side after
			// c -> b at b is b -> d, opposite c: make c play a's part.
			i = j
		}
		if t == t0 && i == i0 {
			return walk
		}
	}
	return nil
}

// fillPolygon triangulates the polygon (its vertices in order; a vertex
// may come more than once, where the polygon wraps round a piece of the
// drawing it touches) combinatorially by cutting ears: three consecutive
// corners whose outer two are neither the same vertex nor already joined
// (by a side outside the polygon, one of its own sides, or a diagonal in
// made, where each cut adds its own; the sides in gone are about to go
// and do not count). Any sequence of such cuts triangulates the polygon as a
// disc; it fails only if no corner is left to cut. The triangles are
// listed counter-clockwise.
func (m *Mesh) fillPolygon(poly []int32, gone, made map[[2]int32]bool) ([][3]int32, bool) {
	joined := func(a, b int32) bool {
		if a == b {
			return true
		}
		k := [2]int32{min(a, b), max(a, b)}
		if made[k] {
			return true
		}
		if gone[[2]int32{a, b}] {
			return false
		}
		if t, _ := m.side(a, b); t >= 0 {
			return true
		}
		t, _ := m.side(b, a)
		return t >= 0
	}
	p := append([]int32(nil), poly...)
	var out [][3]int32
	for len(p) > 3 {
		cut := -1
		for i := range p {
			a, c := p[(i+len(p)-1)%len(p)], p[(i+1)%len(p)]
			if !joined(a, c) {
				cut = i
				break
			}
		}
		if cut < 0 {
			return nil, false
		}
		k := len(p)
		a, b, c := p[(cut+k-1)%k], p[cut], p[(cut+1)%k]
		out = append(out, [3]int32{a, b, c})
		made[[2]int32{min(a, c), max(a, c)}] = true
		p = append(p[:cut], p[cut+1:]...)
	}
	if len(p) == 3 {
		out = append(out, [3]int32{p[0], p[1], p[2]})
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

// inCorner reports whether triangle t at v lies in the corner of v after
// its fixed side to after (sector), or after is -1.
func (m *Mesh) inCorner(t int32, v, after int32) bool {
	if after < 0 {
		return true
	}
	return slices.Contains(m.sector(v, after), t)
}
