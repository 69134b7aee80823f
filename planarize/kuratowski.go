package planarize

import "slices"

// KuratowskiKind names the two obstructions of Kuratowski's theorem.
type KuratowskiKind int

const (
	K33 KuratowskiKind = iota // a subdivision of K3,3
	K5                        // a subdivision of K5
)

func (k KuratowskiKind) String() string {
	if k == K5 {
		return "K5"
	}
	return "K3,3"
}

// A Kuratowski subgraph certifies that a graph is not planar: a subdivision
// of K5 or K3,3 (K. Kuratowski, "Sur le problème des courbes gauches en
// topologie", Fund. Math. 15, 1930).
type Kuratowski struct {
	Kind   KuratowskiKind
	Edges  []int32   // indices into the edge list given
	Branch []int32   // the 5 or 6 branch vertices
	Paths  [][]int32 // one vertex path per edge of K5 or K3,3, branch vertex to branch vertex
}

// Budget bounds the work of a search in edge visits of planarity tests, so
// that the result never depends on timing. A nil Budget is unlimited.
type Budget struct{ Left int64 }

func (b *Budget) spend(m int) bool {
	if b == nil {
		return true
	}
	b.Left -= int64(m) + 1
	return b.Left >= 0
}

// tester runs planarity tests on subsets of one edge list, reusing buffers.
type tester struct {
	n      int
	edges  [][2]int32
	buf    [][2]int32
	budget *Budget
	tests  int
	lr     lr
}

// pick returns the edges with the given indices, in a new slice.
func (t *tester) pick(idx []int32) [][2]int32 {
	out := make([][2]int32, len(idx))
	for i, e := range idx {
		out[i] = t.edges[e]
	}
	return out
}

// planar tests the union of the given index sets; ok is false when the
// budget ran out (the verdict is then meaningless).
func (t *tester) planar(sets ...[]int32) (planar, ok bool) {
	t.buf = t.buf[:0]
	for _, s := range sets {
		for _, i := range s {
			t.buf = append(t.buf, t.edges[i])
		}
	}
	t.tests++
	if !t.budget.spend(len(t.buf)) {
		return false, false
	}
	return t.lr.isPlanar(t.n, t.buf), true
}

// FindKuratowski returns a Kuratowski subgraph of the non-planar simple
// graph formed by the edges with indices in subset (all edges when subset
// is nil). The search stays in the block of the first edge of must and
// prefers the edges of must: when every non-planar subgraph of subset
// contains them (as for an edge removed from a planar graph: subset is
// the kept graph plus that edge) the result contains them all; otherwise
// an edge of must may be left out.
// It deletes edges in adaptively sized groups while the rest stays
// non-planar (the group-testing scheme of delta debugging, Zeller and
// Hildebrandt 2002); an edge-minimal non-planar graph is a subdivision of K5
// or K3,3. The second result is false if the graph is planar or the budget
// ran out.
func FindKuratowski(n int, edges [][2]int32, subset, must []int32, budget *Budget) (*Kuratowski, bool) {
	return findKuratowskiIn(n, edges, subset, must, budget, true)
}

// findKuratowskiIn is FindKuratowski; narrow says whether a large subset
// may first be narrowed to a tube around must[0] (see nearFirst).
func findKuratowskiIn(n int, edges [][2]int32, subset, must []int32, budget *Budget, narrow bool) (*Kuratowski, bool) {
	if subset == nil {
		subset = make([]int32, len(edges))
		for i := range subset {
			subset[i] = int32(i)
		}
	}
	// Work on the subset alone, its vertices renumbered 0..k-1: every test
	// then costs what the subset costs, not what the whole graph does (a
	// small block of a big graph would otherwise pay for all its vertices).
	local := make(map[int32]int32, len(subset))
	var orig []int32 // local vertex -> vertex
	sub := make([][2]int32, len(subset))
	for i, e := range subset {
		for j, v := range edges[e] {
			l, ok := local[v]
			if !ok {
				l = int32(len(orig))
				local[v] = l
				orig = append(orig, v)
			}
			sub[i][j] = l
		}
	}
	at := make(map[int32]int32, len(subset)) // edge -> its place in subset
	for i, e := range subset {
		at[e] = int32(i)
	}
	var mustLocal []int32 // must edges outside subset are not part of the graph
	for _, e := range must {
		if i, ok := at[e]; ok {
			mustLocal = append(mustLocal, i)
		}
	}
	k, ok := findKuratowskiLocal(len(orig), sub, mustLocal, budget, narrow)
	if !ok {
		return nil, false
	}
	for i, e := range k.Edges {
		k.Edges[i] = subset[e]
	}
	slices.Sort(k.Edges)
	for i, v := range k.Branch {
		k.Branch[i] = orig[v]
	}
	slices.Sort(k.Branch)
	for _, path := range k.Paths {
		for i, v := range path {
			path[i] = orig[v]
		}
	}
	return k, true
}

// findKuratowskiLocal is FindKuratowski on a whole graph whose vertices
// are all used: it searches all of edges, preferring the edges in must.
func findKuratowskiLocal(n int, edges [][2]int32, must []int32, budget *Budget, narrow bool) (*Kuratowski, bool) {
	subset := make([]int32, len(edges))
	for i := range subset {
		subset[i] = int32(i)
	}
	t := &tester{n: n, edges: edges, budget: budget}
	isMust := make(map[int32]bool, len(must))
	for _, e := range must {
		isMust[e] = true
	}
	fixed := append([]int32(nil), must...)
	// narrowTo searches the tube around must[0] in rest, when it is
	// smaller than rest, on the tube's own vertices: every test then
	// costs what the tube costs, not what the whole block does.
	narrowTo := func(rest []int32) (k *Kuratowski, ok, done bool) {
		tube, ok := nearFirst(t, n, edges, fixed, rest, must[0])
		if !ok {
			return nil, false, true
		}
		if len(tube) < len(rest) {
			k, ok := findKuratowskiIn(n, edges, append(tube, fixed...), must, budget, false)
			return k, ok, true
		}
		return nil, false, false
	}
	early := narrow && len(must) > 0 && len(edges) > earlyNarrowSize
	if early {
		// Before the passes over the whole graph below: a path between
		// the ends of must[0] closes a cycle with it, so the tube reaches
		// into its block, and the search of the tube restricts itself.
		var others []int32
		for _, e := range subset {
			if !isMust[e] {
				others = append(others, e)
			}
		}
		if k, ok, done := narrowTo(others); done {
			return k, ok
		}
	}
	// Restricting to the block and pruning leaves cost a pass over the
	// graph; charge it like a test.
	if !budget.spend(len(subset) + n) {
		return nil, false
	}
	if len(must) > 0 {
		subset = blockOf(n, edges, subset, must[0])
	}
	rest := pruneLeaves(n, edges, subset, isMust)
	if narrow && !early && len(must) > 0 && len(rest) > nearFirstSize {
		if k, ok, done := narrowTo(rest); done {
			return k, ok
		}
	}
	var need []int32
	if p, ok := t.planar(fixed, rest); !ok || p {
		return nil, false
	}
	chunk := max(1, len(rest)/2)
	for len(rest) > 0 {
		k := min(chunk, len(rest))
		p, ok := t.planar(fixed, need, rest[k:])
		if !ok {
			return nil, false
		}
		if !p { // still non-planar without rest[:k]: drop them
			rest = rest[k:]
			chunk = min(2*chunk, max(1, len(rest)))
			continue
		}
		if k == 1 {
			need = append(need, rest[0])
			rest = rest[1:]
			continue
		}
		chunk = k / 2
	}
	// An edge of must can be superfluous (the rest stays non-planar
	// without it) when no Kuratowski subgraph holds all of must; drop such
	// edges so that the result is edge-minimal.
	for i := 0; i < len(fixed); {
		others := append(append([]int32(nil), fixed[:i]...), fixed[i+1:]...)
		p, ok := t.planar(others, need)
		if !ok {
			return nil, false
		}
		if p {
			i++
			continue
		}
		fixed = others
	}
	sub := append(fixed, need...)
	return classify(edges, sub)
}

// nearFirstSize is the least number of candidate edges for which the
// group deletion of findKuratowskiLocal first narrows them to a tube
// around the edge it must keep (see nearFirst). Past earlyNarrowSize
// edges it narrows before restricting to the block and pruning leaves,
// passes over the whole graph that then cost more than they save (a
// 10^5-vertex random planar graph plus 10 random pairs, whole run with its
// 8 certificates: 4.1 s instead of 4.9 s); below it, after them (G(2000,
// 6000) with its 3,649: 13.9 s, where narrowing first took 16.3 s).
const (
	nearFirstSize   = 200
	earlyNarrowSize = 20000
)

// nearFirst returns the edges of rest inside the smallest tube of radius
// 1, 2, 4, ... around a shortest path between the ends of edge e (in the
// graph of rest) that, with fixed, is non-planar, or rest itself when no
// smaller tube is (ok is false when the budget ran out). An edge removed
// from a big mesh has a Kuratowski subgraph along such a path: in a
// triangulation, the wheel around one end, three disjoint paths from the
// other end to that wheel, and the edge make a subdivision of K5, and the
// tube of radius 1 holds one. The group deletion then works on the tube's
// edges, farthest from the path first, instead of the whole block's; each
// tube costs one test and a pass over rest.
func nearFirst(t *tester, n int, edges [][2]int32, fixed, rest []int32, e int32) ([]int32, bool) {
	if !t.budget.spend(2 * len(rest)) { // the adjacency and the path search
		return nil, false
	}
	all := t.pick(rest)
	g := newCSR(n, all)
	other := func(d int32) int32 { return all[d>>1][1-d&1] }
	dist := make([]int32, n)
	for v := range dist {
		dist[v] = -1
	}
	// A shortest path from one end of e to the other, without e (which
	// is in fixed), by breadth-first search with parent darts.
	from, to := edges[e][0], edges[e][1]
	parent := make([]int32, n)
	queue := make([]int32, 0, 64)
	queue = append(queue, from)
	dist[from] = 0
	for head := 0; head < len(queue) && dist[to] < 0; head++ {
		x := queue[head]
		for _, d := range g.adj[g.start[x]:g.start[x+1]] {
			if w := other(d); dist[w] < 0 {
				dist[w], parent[w] = 0, d
				queue = append(queue, w)
			}
		}
	}
	if dist[to] < 0 {
		return rest, true // no such path: e is on no cycle of rest
	}
	for _, v := range queue {
		dist[v] = -1
	}
	// The path's vertices are the sources of the tube's search.
	queue = queue[:0]
	for v := to; ; v = all[parent[v]>>1][parent[v]&1] { // the dart's own end
		dist[v] = 0
		queue = append(queue, v)
		if v == from {
			break
		}
	}
	head := 0
	var tube []int32
	for radius := int32(1); ; radius *= 2 {
		for head < len(queue) && dist[queue[head]] < radius {
			x := queue[head]
			head++
			for _, d := range g.adj[g.start[x]:g.start[x+1]] {
				if w := other(d); dist[w] < 0 {
					dist[w] = dist[x] + 1
					queue = append(queue, w)
				}
			}
		}
		if !t.budget.spend(len(rest)) {
			return nil, false
		}
		tube = tube[:0]
		for _, i := range rest {
			if a, b := dist[edges[i][0]], dist[edges[i][1]]; a >= 0 && b >= 0 && a <= radius && b <= radius {
				tube = append(tube, i)
			}
		}
		if len(tube) == len(rest) || head == len(queue) {
			return rest, true
		}
		p, ok := t.planar(fixed, tube)
		if !ok {
			return nil, false
		}
		if !p {
			// Farthest first: the group deletion drops its leading
			// edges first, and the far ones are the likeliest to go.
			far := func(i int32) int32 { return max(dist[edges[i][0]], dist[edges[i][1]]) }
			tube = slices.Clone(tube)
			slices.SortStableFunc(tube, func(a, b int32) int { return int(far(b) - far(a)) })
			return tube, true
		}
	}
}

// blockOf returns the edges of subset that lie in the same biconnected
// component as edge e (itself in subset): a Kuratowski subgraph through e
// lies inside that block.
func blockOf(n int, edges [][2]int32, subset []int32, e int32) []int32 {
	sub := make([][2]int32, len(subset))
	at := -1
	for i, x := range subset {
		sub[i] = edges[x]
		if x == e {
			at = i
		}
	}
	if at < 0 {
		return subset
	}
	block, _ := Blocks(n, sub)
	var out []int32
	for i, x := range subset {
		if block[i] == block[at] {
			out = append(out, x)
		}
	}
	return out
}

// pruneLeaves drops, repeatedly, edges at vertices of degree one: they lie
// on no cycle and so in no Kuratowski subgraph. Edges in keep stay, and
// count towards degrees.
func pruneLeaves(n int, edges [][2]int32, subset []int32, keep map[int32]bool) []int32 {
	deg := make([]int32, n)
	start := make([]int32, n+1)
	for _, i := range subset {
		e := edges[i]
		deg[e[0]]++
		deg[e[1]]++
		if !keep[i] {
			start[e[0]+1]++
			start[e[1]+1]++
		}
	}
	for v := 1; v <= n; v++ {
		start[v] += start[v-1]
	}
	inc := make([]int32, start[n])
	pos := append([]int32(nil), start[:n]...)
	for _, i := range subset {
		if keep[i] {
			continue
		}
		for _, v := range edges[i] {
			inc[pos[v]] = i
			pos[v]++
		}
	}
	gone := make([]bool, len(edges))
	var queue []int32
	for v := range n {
		if deg[v] == 1 {
			queue = append(queue, int32(v))
		}
	}
	for len(queue) > 0 {
		v := queue[len(queue)-1]
		queue = queue[:len(queue)-1]
		if deg[v] != 1 {
			continue
		}
		for _, i := range inc[start[v]:start[v+1]] {
			if gone[i] {
				continue
			}
			gone[i] = true
			e := edges[i]
			deg[e[0]]--
			deg[e[1]]--
			if w := e[0] ^ e[1] ^ v; deg[w] == 1 {
				queue = append(queue, w)
			}
			break
		}
	}
	out := make([]int32, 0, len(subset))
	for _, i := range subset {
		if !keep[i] && !gone[i] {
			out = append(out, i)
		}
	}
	return out
}

// classify reads off the branch vertices and paths of an edge-minimal
// non-planar graph.
func classify(edges [][2]int32, sub []int32) (*Kuratowski, bool) {
	adj := make(map[int32][]int32)
	for _, i := range sub {
		e := edges[i]
		adj[e[0]] = append(adj[e[0]], i)
		adj[e[1]] = append(adj[e[1]], i)
	}
	var branch []int32
	kind := K33
	for _, i := range sub {
		for _, v := range edges[i] {
			d := len(adj[v])
			if d >= 3 && !containsVertex(branch, v) {
				branch = append(branch, v)
			}
			if d == 4 {
				kind = K5
			}
		}
	}
	want := 6
	if kind == K5 {
		want = 5
	}
	if len(branch) != want {
		return nil, false
	}
	slices.Sort(branch)
	isBranch := make(map[int32]bool, len(branch))
	for _, b := range branch {
		isBranch[b] = true
	}
	used := make(map[int32]bool)
	var paths [][]int32
	for _, b := range branch {
		for _, e0 := range adj[b] {
			if used[e0] {
				continue
			}
			path := []int32{b}
			v, e := b, e0
			for {
				used[e] = true
				w := edges[e][0] ^ edges[e][1] ^ v
				path = append(path, w)
				if isBranch[w] {
					break
				}
				if len(adj[w]) != 2 || len(path) > len(sub)+1 {
					return nil, false // not a subdivision
				}
				next := adj[w][0]
				if next == e {
					next = adj[w][1]
				}
				v, e = w, next
			}
			paths = append(paths, path)
		}
	}
	wantDeg, wantPaths := 3, 9
	if kind == K5 {
		wantDeg, wantPaths = 4, 10
	}
	for _, b := range branch {
		if len(adj[b]) != wantDeg {
			return nil, false
		}
	}
	if len(paths) != wantPaths || len(used) != len(sub) {
		return nil, false
	}
	k := &Kuratowski{Kind: kind, Edges: append([]int32(nil), sub...), Branch: branch, Paths: paths}
	slices.Sort(k.Edges)
	return k, true
}

func containsVertex(s []int32, v int32) bool { return slices.Contains(s, v) }
