package stress

import (
	"errors"
	"math"
	"slices"
)

// Options tune NewModel. The zero value is the default.
type Options struct {
	// FullLimit is the largest graph that keeps every pair (default 400);
	// larger ones use the sparse model.
	FullLimit int
	// Pivots is the number of pivots of the sparse model and of the
	// pivot-MDS start (default 100, at most the number of vertices).
	Pivots int
	// Groups, if not nil, gives per vertex the groups it lies in, outermost
	// first (a DOT cluster and the clusters inside it). Two vertices not
	// joined by an edge whose lists are equal and not empty are wanted
	// GroupPull times as far apart as the graph says, two whose lists
	// differ GroupPush times: members gather, others keep out.
	Groups [][]int32
	// Flow, if not nil, lists pairs (u, v) of vertices that should follow
	// each other along FlowDir: the position of v, read along FlowDir, at
	// least FlowGap beyond that of u. Every target is projected onto what
	// its vertex's own pairs allow (Model.Project), the localized form of
	// stress majorization with separation constraints (T. Dwyer, Y. Koren,
	// "DIG-CoLa", InfoVis 2005; T. Dwyer, Y. Koren, K. Marriott,
	// "IPSep-CoLa", InfoVis 2006). The pairs should not form a cycle.
	Flow [][2]int32
	// FlowDir is the unit direction of the flow (for example 0, -1 for
	// top to bottom with y pointing up).
	FlowDir [2]float64
	// FlowGap is the least separation along the flow (0: 0.6 times the
	// mean edge length).
	FlowGap float64
}

// GroupPull and GroupPush scale the wanted distance of pairs in one group
// and of pairs split by a group (Options.Groups): strong enough to gather a
// group in the stress layout, mild enough to keep it a stress layout (the
// idea of shorter ideal distances inside a cluster, common practice).
const (
	GroupPull = 0.6
	GroupPush = 1.8
)

const (
	defaultFullLimit = 400
	defaultPivots    = 100
)

// Model is the stress model of one connected graph: its adjacency with
// edge lengths, and either all pairwise distances or the sparse model's
// pivots.
type Model struct {
	n      int
	start  []int32 // adjacency in compressed rows
	adj    []int32
	length []float64 // per adjacency entry

	full []float32 // n x n distances (full model), nil otherwise

	// The sparse model: pivot p's distance to every vertex, pivDist[p*n+v],
	// and the weight it carries for v, pivWeight[p*n+v] (0 where v is p or
	// a neighbour of p, whose term is exact).
	pivots    []int32
	pivDist   []float32
	pivWeight []float32
	pivOf     []int32 // index in pivots of each vertex that is one, else -1
	// sibling holds, per vertex, up to two vertices two steps away: those
	// next to it around its first neighbour, with the length of the path
	// through that neighbour. Without them, vertices the pivots cannot
	// tell apart (leaves of one parent) would all go to one point.
	sibling     [][2]int32
	siblingDist [][2]float64

	// The flow (Options.Flow): per vertex, the vertices it must follow
	// (before) and those that must follow it (after), in compressed rows.
	flowStart, flowAdj []int32 // before: flowAdj[flowStart[v]:flowMid[v]]
	flowMid            []int32 // after: flowAdj[flowMid[v]:flowStart[v+1]]
	flowDir            [2]float64
	flowGap            float64
}

// ErrDisconnected is returned for a graph that is not connected.
var ErrDisconnected = errors.New("stress: the graph is not connected")

var errInput = errors.New("stress: bad input")

// NewModel builds the stress model of the connected graph with n vertices
// and the given edges (no loops, no repeats), edge i of length
// lengths[i] > 0 (nil: all 1).
func NewModel(n int, edges [][2]int32, lengths []float64, opt Options) (*Model, error) {
	if n <= 0 || (lengths != nil && len(lengths) != len(edges)) || (opt.Groups != nil && len(opt.Groups) != n) {
		return nil, errInput
	}
	for i, e := range edges {
		if e[0] < 0 || e[1] < 0 || int(e[0]) >= n || int(e[1]) >= n || e[0] == e[1] {
			return nil, errInput
		}
		if lengths != nil && !(lengths[i] > 0 && lengths[i] < math.Inf(1)) {
			return nil, errInput
		}
	}
	if opt.FullLimit <= 0 {
		opt.FullLimit = defaultFullLimit
	}
	if opt.Pivots <= 0 {
		opt.Pivots = defaultPivots
	}
	m := &Model{n: n}
	m.start = make([]int32, n+1)
	for _, e := range edges {
		m.start[e[0]+1]++
		m.start[e[1]+1]++
	}
	for v := range n {
		m.start[v+1] += m.start[v]
	}
	m.adj = make([]int32, 2*len(edges))
	m.length = make([]float64, 2*len(edges))
	fill := append([]int32(nil), m.start[:n]...)
	for i, e := range edges {
		l := 1.0
		if lengths != nil {
			l = lengths[i]
		}
		m.adj[fill[e[0]]], m.length[fill[e[0]]] = e[1], l
		fill[e[0]]++
		m.adj[fill[e[1]]], m.length[fill[e[1]]] = e[0], l
		fill[e[1]]++
	}
	d := make([]float64, n)
	sp := newPaths(m)
	if sp.from(0, d); slices.Contains(d, math.Inf(1)) {
		return nil, ErrDisconnected
	}
	for _, e := range opt.Flow {
		if e[0] < 0 || e[1] < 0 || int(e[0]) >= n || int(e[1]) >= n || e[0] == e[1] {
			return nil, errInput
		}
	}
	m.setFlow(opt)
	if n <= opt.FullLimit {
		m.fullModel(sp, d, opt.Groups)
		return m, nil
	}
	m.sparse(min(opt.Pivots, n), sp)
	for p, pv := range m.pivots {
		m.regroup(pv, m.pivDist[p*n:(p+1)*n], opt.Groups)
	}
	m.siblings()
	return m, nil
}

// fullModel keeps every pairwise distance.
func (m *Model) fullModel(sp *paths, d []float64, groups [][]int32) {
	n := m.n
	m.full = make([]float32, n*n)
	for s := range n {
		sp.from(int32(s), d)
		row := m.full[s*n : (s+1)*n]
		for v, dv := range d {
			row[v] = float32(dv)
		}
		m.regroup(int32(s), row, groups)
	}
}

// setFlow records Options.Flow in compressed rows.
func (m *Model) setFlow(opt Options) {
	if len(opt.Flow) == 0 {
		return
	}
	n := m.n
	m.flowDir = opt.FlowDir
	if l := math.Hypot(m.flowDir[0], m.flowDir[1]); l > 0 {
		m.flowDir[0], m.flowDir[1] = m.flowDir[0]/l, m.flowDir[1]/l
	} else {
		m.flowDir = [2]float64{0, -1}
	}
	m.flowGap = opt.FlowGap
	if m.flowGap <= 0 {
		m.flowGap = 0.6 * m.meanLength()
	}
	before, after := make([]int32, n), make([]int32, n)
	for _, e := range opt.Flow {
		after[e[0]]++
		before[e[1]]++
	}
	m.flowStart, m.flowMid = make([]int32, n+1), make([]int32, n)
	for v := range n {
		m.flowMid[v] = m.flowStart[v] + before[v]
		m.flowStart[v+1] = m.flowMid[v] + after[v]
	}
	m.flowAdj = make([]int32, m.flowStart[n])
	fillB, fillA := append([]int32(nil), m.flowStart[:n]...), append([]int32(nil), m.flowMid...)
	for _, e := range opt.Flow {
		m.flowAdj[fillA[e[0]]] = e[1]
		fillA[e[0]]++
		m.flowAdj[fillB[e[1]]] = e[0]
		fillB[e[1]]++
	}
}

// Project moves the target (tx, ty) of v along the flow direction into
// the range its flow pairs allow with the others where they are: at least
// FlowGap beyond every vertex v follows, and FlowGap short of every vertex
// that follows v (halfway between when the two bounds cross). Without a
// flow it returns the target unchanged.
func (m *Model) Project(v int32, tx, ty float64, x, y []float64) (float64, float64) {
	if m.flowStart == nil {
		return tx, ty
	}
	dx, dy := m.flowDir[0], m.flowDir[1]
	lo, hi := math.Inf(-1), math.Inf(1)
	for _, u := range m.flowAdj[m.flowStart[v]:m.flowMid[v]] {
		lo = max(lo, float64(x[u]*dx)+float64(y[u]*dy)+m.flowGap)
	}
	for _, w := range m.flowAdj[m.flowMid[v]:m.flowStart[v+1]] {
		hi = min(hi, float64(x[w]*dx)+float64(y[w]*dy)-m.flowGap)
	}
	at := float64(tx*dx) + float64(ty*dy)
	want := at
	switch {
	case lo > hi:
		want = (lo + hi) / 2
	case at < lo:
		want = lo
	case at > hi:
		want = hi
	}
	return tx + float64((want-at)*dx), ty + float64((want-at)*dy)
}

// regroup scales the distances row from vertex s to every vertex by
// GroupPull or GroupPush (Options.Groups), except to s itself and to its
// neighbours, whose distance is an edge's ideal length.
func (m *Model) regroup(s int32, row []float32, groups [][]int32) {
	if groups == nil {
		return
	}
	for v := range row {
		if int32(v) == s {
			continue
		}
		switch {
		case !slices.Equal(groups[s], groups[v]):
			row[v] *= GroupPush
		case len(groups[s]) > 0:
			row[v] *= GroupPull
		}
	}
	for i := m.start[s]; i < m.start[s+1]; i++ {
		row[m.adj[i]] = float32(m.length[i])
	}
}

// N returns the number of vertices.
func (m *Model) N() int { return m.n }

// Full reports whether the model keeps every pair.
func (m *Model) Full() bool { return m.full != nil }

// Distance returns the graph distance from a pivot or, in the full model,
// any vertex u to v; ok is false when the model does not keep it.
func (m *Model) Distance(u, v int32) (d float64, ok bool) {
	if m.full != nil {
		return float64(m.full[int(u)*m.n+int(v)]), true
	}
	if p := m.pivOf[u]; p >= 0 {
		return float64(m.pivDist[int(p)*m.n+int(v)]), true
	}
	if p := m.pivOf[v]; p >= 0 {
		return float64(m.pivDist[int(p)*m.n+int(u)]), true
	}
	return 0, false
}

// sparse sets up the sparse model with k pivots chosen by max-min
// distance (each next pivot the vertex farthest from those chosen, ties to
// the lowest index), the first the vertex farthest from vertex 0.
func (m *Model) sparse(k int, sp *paths) {
	n := m.n
	m.pivots = make([]int32, 0, k)
	m.pivDist = make([]float32, k*n)
	m.pivOf = make([]int32, n)
	for v := range m.pivOf {
		m.pivOf[v] = -1
	}
	d := make([]float64, n)
	nearest := make([]float64, n) // distance to the nearest pivot so far
	region := make([]int32, n)    // index of that pivot
	sp.from(0, d)
	next := int32(argmax(d))
	for v := range nearest {
		nearest[v] = math.Inf(1)
	}
	for len(m.pivots) < k {
		p := int32(len(m.pivots))
		m.pivots = append(m.pivots, next)
		m.pivOf[next] = p
		sp.from(next, d)
		row := m.pivDist[int(p)*n : int(p+1)*n]
		for v, dv := range d {
			row[v] = float32(dv)
			if dv < nearest[v] {
				nearest[v], region[v] = dv, p
			}
		}
		next = int32(argmax(nearest))
		if nearest[next] == 0 {
			break // every vertex is a pivot
		}
	}
	k = len(m.pivots)
	m.pivDist = m.pivDist[:k*n]
	// Pivot p stands, for vertex v, for the vertices of its region at
	// most half of d(p, v) from p (Ortmann et al.'s weight).
	members := make([][]float32, k)
	for v := range n {
		members[region[v]] = append(members[region[v]], float32(nearest[v]))
	}
	for _, ds := range members {
		slices.Sort(ds)
	}
	m.pivWeight = make([]float32, k*n)
	for p := range k {
		row := m.pivDist[p*n : (p+1)*n]
		w := m.pivWeight[p*n : (p+1)*n]
		for v := range n {
			dv := row[v]
			if dv == 0 {
				continue
			}
			count, _ := slices.BinarySearch(members[p], dv/2)
			for count < len(members[p]) && members[p][count] <= dv/2 {
				count++
			}
			w[v] = float32(float64(count) / float64(float64(dv)*float64(dv)))
		}
		// Neighbours' terms are exact edge terms already.
		pv := m.pivots[p]
		for i := m.start[pv]; i < m.start[pv+1]; i++ {
			w[m.adj[i]] = 0
		}
	}
}

// siblings fills sibling and siblingDist (see Model).
func (m *Model) siblings() {
	n := m.n
	m.sibling = make([][2]int32, n)
	m.siblingDist = make([][2]float64, n)
	for v := range int32(n) {
		m.sibling[v] = [2]int32{-1, -1}
		if m.start[v] == m.start[v+1] {
			continue
		}
		p, lvp := m.adj[m.start[v]], m.length[m.start[v]]
		lo, hi := m.start[p], m.start[p+1]
		deg := hi - lo
		if deg < 2 {
			continue
		}
		at := lo
		for at < hi && m.adj[at] != v {
			at++
		}
		for k, step := range [2]int32{deg - 1, 1} {
			i := lo + (at-lo+step)%deg
			if w := m.adj[i]; w != v {
				m.sibling[v][k] = w
				m.siblingDist[v][k] = lvp + m.length[i]
			}
		}
	}
}

func argmax(d []float64) int {
	best := 0
	for v, dv := range d {
		if dv > d[best] {
			best = v
		}
	}
	return best
}

// Target returns where the localized majorization moves v with every other
// vertex held at (x, y): the weighted mean of each other vertex's position
// pushed out along the line to v to its ideal distance (Gansner, Koren
// and North 2004). ok is false when v has no term to go by (a lone vertex,
// or every term's vertex at v's position).
func (m *Model) Target(v int32, x, y []float64) (tx, ty float64, ok bool) {
	tx, ty, _, ok = m.TargetWeight(v, x, y)
	return tx, ty, ok
}

// TargetWeight is Target, also returning the sum w of the weights of v's
// terms: the majorant of v's stress is w |q - target|^2 plus a constant
// for v at q.
func (m *Model) TargetWeight(v int32, x, y []float64) (tx, ty, w float64, ok bool) {
	var sx, sy, sw float64
	vx, vy := x[v], y[v]
	term := func(j int32, d, w float64) {
		dx, dy := vx-x[j], vy-y[j]
		dist := math.Sqrt(float64(dx*dx) + float64(dy*dy))
		if dist <= 0 {
			return
		}
		f := d / dist
		sx += float64(w * (x[j] + float64(f*dx)))
		sy += float64(w * (y[j] + float64(f*dy)))
		sw += w
	}
	if m.full != nil {
		row := m.full[int(v)*m.n : int(v+1)*m.n]
		for j, d := range row {
			if int32(j) == v {
				continue
			}
			dd := float64(d)
			term(int32(j), dd, 1/float64(dd*dd))
		}
	} else {
		for i := m.start[v]; i < m.start[v+1]; i++ {
			l := m.length[i]
			term(m.adj[i], l, 1/float64(l*l))
		}
		for k, w := range m.sibling[v] {
			if w >= 0 {
				d := m.siblingDist[v][k]
				term(w, d, 1/float64(d*d))
			}
		}
		n := m.n
		for p, pv := range m.pivots {
			w := float64(m.pivWeight[p*n+int(v)])
			if w == 0 || pv == v {
				continue
			}
			term(pv, float64(m.pivDist[p*n+int(v)]), w)
		}
	}
	if sw == 0 {
		return vx, vy, 0, false
	}
	return sx / sw, sy / sw, sw, true
}

// Layout moves every vertex, in index order, to its Target, for the given
// number of sweeps or until a sweep moves the vertices by less than tol
// times the mean edge length on average; it returns the sweeps made.
func (m *Model) Layout(x, y []float64, sweeps int, tol float64) int {
	scale := m.meanLength()
	for s := 0; s < sweeps; s++ {
		moved := 0.0
		for v := range int32(m.n) {
			tx, ty, ok := m.Target(v, x, y)
			if !ok {
				continue
			}
			tx, ty = m.Project(v, tx, ty, x, y)
			dx, dy := tx-x[v], ty-y[v]
			moved += math.Sqrt(float64(dx*dx) + float64(dy*dy))
			x[v], y[v] = tx, ty
		}
		if moved < tol*scale*float64(m.n) {
			return s + 1
		}
	}
	return sweeps
}

// meanLength is the mean edge length (1 without edges).
func (m *Model) meanLength() float64 {
	if len(m.length) == 0 {
		return 1
	}
	sum := 0.0
	for _, l := range m.length {
		sum += l
	}
	return sum / float64(len(m.length))
}

// BestScale returns the factor s that minimizes the model's stress of the
// drawing scaled by s about the origin, over the pairs the model keeps
// (closed form: sum w d |x| / sum w |x|^2); 1 if undefined.
func (m *Model) BestScale(x, y []float64) float64 {
	var num, den float64
	pair := func(u, v int32, d, w float64) {
		dx, dy := x[u]-x[v], y[u]-y[v]
		dist := math.Sqrt(float64(dx*dx) + float64(dy*dy))
		num += float64(float64(w*d) * dist)
		den += float64(float64(w*dist) * dist)
	}
	m.pairs(pair)
	if den <= 0 || num <= 0 {
		return 1
	}
	return num / den
}

// Stress returns the model's stress of the drawing over the pairs it
// keeps (all pairs in the full model, edges and pivot terms otherwise).
func (m *Model) Stress(x, y []float64) float64 {
	var sum float64
	m.pairs(func(u, v int32, d, w float64) {
		dx, dy := x[u]-x[v], y[u]-y[v]
		e := math.Sqrt(float64(dx*dx)+float64(dy*dy)) - d
		sum += float64(float64(w*e) * e)
	})
	return sum
}

// pairs calls fn for every term of the model, each pair once.
func (m *Model) pairs(fn func(u, v int32, d, w float64)) {
	n := m.n
	if m.full != nil {
		for u := range n {
			row := m.full[u*n : (u+1)*n]
			for v := u + 1; v < n; v++ {
				d := float64(row[v])
				fn(int32(u), int32(v), d, 1/float64(d*d))
			}
		}
		return
	}
	for u := range int32(n) {
		for i := m.start[u]; i < m.start[u+1]; i++ {
			if v := m.adj[i]; v > u {
				l := m.length[i]
				fn(u, v, l, 1/float64(l*l))
			}
		}
	}
	for p, pv := range m.pivots {
		for v := range int32(n) {
			if w := float64(m.pivWeight[p*n+int(v)]); w > 0 && v != pv {
				fn(pv, v, float64(m.pivDist[p*n+int(v)]), w)
			}
		}
	}
}
