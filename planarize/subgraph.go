package planarize

import (
	"math/rand/v2"
	"slices"

	"github.com/gridwood/gridwood/internal/disjoint"
)

// SubgraphOptions tune MaximalPlanar. The zero value is the default.
type SubgraphOptions struct {
	// Effort buys more search for fewer removed edges: Effort seeded
	// restarts of the greedy growth in shuffled edge orders, and a larger
	// work bound for the exact search on small blocks. The result for a
	// given Effort is deterministic.
	Effort int
	// Progress, if set, is called now and then with the share of the
	// edges decided so far (0 to 1, never decreasing), for a progress
	// display. It does not change the result.
	Progress func(done float64)
}

// Subgraph is the result of MaximalPlanar.
type Subgraph struct {
	Removed []int32 // indices of the removed edges, increasing
	// Optimal is true when len(Removed) is proved to be the minimum: it
	// meets a lower bound in every block, or an exact search finished.
	Optimal bool
	// LowerBound is a proved lower bound on the number of edges any planar
	// subgraph must lose (the sum over blocks of Euler-type bounds and of
	// exact search results).
	LowerBound int
}

// exactEdgeLimit is the largest block (in edges) given to the exact search.
const exactEdgeLimit = 120

// exactGapLimit is the largest gap between the greedy result and the lower
// bound that the exact search tries to close: each step of the search
// branches on a whole Kuratowski subgraph, so wider gaps only burn the
// budget.
const exactGapLimit = 6

// bothSeedsLimit is the largest block (in edges) on which the greedy
// search runs from the cactus seed too when the dense seed applies.
const bothSeedsLimit = 5000

// exactTests bounds the planarity tests of one exact search at Effort 0.
const exactTests = 40000

// MaximalPlanar finds a set of edges whose removal leaves the simple graph
// planar and that is inclusion-minimal: adding back any one removed edge
// makes the kept graph non-planar (a maximal planar subgraph). Finding the
// fewest such edges is NP-hard (Liu and Geldmacher 1977; Yannakakis 1978),
// so it aims low with these steps, per biconnected block (a graph is planar
// iff its blocks are):
//
//   - seed with a triangular cactus (Calinescu, Fernandes, Finkler and
//     Karloff, "A better approximation algorithm for finding planar
//     subgraphs", J. Algorithms 27, 1998) joined by a spanning forest, or
//     on a dense block with a stacked triangulation or quadrangulation
//     that meets Euler's bound on its vertices (see denseSeed);
//   - grow it greedily in edge order, testing edges in adaptively split
//     groups: a whole group is added when the result stays planar, and a
//     single edge is rejected only when it makes the kept graph non-planar,
//     which keeps every rejection valid for the final graph;
//   - reject every remaining edge without a test once the block holds as
//     many edges as Euler's formula allows (3n-6, or 2n-4 for a bipartite
//     block, or g(n-2)/(g-2) for girth g);
//   - for small blocks, search exactly for a smaller removal set, branching
//     on the edges of a Kuratowski subgraph, under a deterministic work bound.
func MaximalPlanar(n int, edges [][2]int32, opt SubgraphOptions) *Subgraph {
	res := &Subgraph{Optimal: true}
	if IsPlanar(n, edges) {
		return res
	}
	block, nb := Blocks(n, edges)
	// Group edge indices by block, keeping input order within a block.
	start, byBlock := groupByLabel(block, nb)
	local := make([]int32, n)
	for v := range local {
		local[v] = -1
	}
	var vs []int32
	var sub [][2]int32
	shown := 0.0
	report := func(decided int, share float64) {} // decided edges before the block, share of the block
	if opt.Progress != nil {
		report = func(decided int, share float64) {
			if d := (float64(decided) + share*float64(len(edges))) / float64(len(edges)); d > shown {
				shown = d
				opt.Progress(d)
			}
		}
	}
	for b := range nb {
		ids := byBlock[start[b]:start[b+1]]
		decided := int(start[b])
		report(decided, 0)
		if len(ids) < 9 {
			continue // fewer edges than K3,3 has: planar
		}
		vs, sub = vs[:0], sub[:0]
		for _, i := range ids {
			e := edges[i]
			for _, v := range e {
				if local[v] < 0 {
					local[v] = int32(len(vs))
					vs = append(vs, v)
				}
			}
			sub = append(sub, [2]int32{local[e[0]], local[e[1]]})
		}
		for _, v := range vs {
			local[v] = -1
		}
		if len(ids) < len(edges) && IsPlanar(len(vs), sub) {
			continue // (a block holding every edge is the graph: known non-planar)
		}
		blockOpt := opt
		blockOpt.Progress = func(done float64) { report(decided, done*float64(len(ids))/float64(len(edges))) }
		r, lb, optimal := planarizeBlock(len(vs), sub, blockOpt)
		for _, i := range r {
			res.Removed = append(res.Removed, ids[i])
		}
		res.LowerBound += lb
		res.Optimal = res.Optimal && optimal
	}
	report(len(edges), 0)
	slices.Sort(res.Removed)
	return res
}

// planarizeBlock returns the removed local edge indices for one
// non-planar block, a lower bound, and whether the removal is proved
// minimum.
func planarizeBlock(n int, edges [][2]int32, opt SubgraphOptions) (removed []int32, lower int, optimal bool) {
	// One adjacency structure for every pass over the block, and the
	// dense seed, which no order changes, grown once.
	g := newCSR(n, edges)
	limit := edgeLimit(n, edges, g)
	lower = max(1, len(edges)-limit)
	start, support := analyseBlock(n, edges, g)
	if support != nil {
		markLongCycles(n, edges, g, support)
	}
	dense := denseSeed(n, edges, g, start)
	order := identity(len(edges))
	if support != nil {
		order = bySupport(support, order, denseFirst)
	}
	var best []int32
	var alt []int32 // the mesh-first order, when it is worth trying
	if support != nil && meshLike(support) {
		if alt = bySupport(support, identity(len(edges)), meshFirst); slices.Equal(alt, order) {
			alt = nil
		}
	}
	if alt == nil {
		best = greedyPlanar(n, edges, g, order, support, dense, limit, opt.Progress)
	} else {
		best = bothOrders(n, edges, g, [2][]int32{order, alt}, support, dense, limit, lower, opt.Progress)
	}
	if dense.edges != nil && len(edges) <= bothSeedsLimit && len(best) > lower {
		// Small dense blocks can afford the cactus seed as well; keep the
		// better of the two.
		if cand := greedyPlanar(n, edges, g, order, support, seeded{}, limit, nil); len(cand) < len(best) {
			best = cand
		}
	}
	for r := 1; r <= opt.Effort && len(best) > lower; r++ {
		// Odd restarts shuffle edges of equal support only, even ones
		// shuffle everything, to explore beyond the heuristic order.
		rng := rand.New(rand.NewPCG(uint64(r), 0x9e3779b97f4a7c15))
		perm := identity(len(edges))
		rng.Shuffle(len(perm), func(i, j int) { perm[i], perm[j] = perm[j], perm[i] })
		sup := support
		if r%2 == 1 && support != nil {
			perm = bySupport(support, perm, denseFirst)
		} else {
			sup = nil
		}
		if cand := greedyPlanar(n, edges, g, perm, sup, dense, limit, nil); len(cand) < len(best) {
			best = cand
		}
	}
	if len(best) == lower {
		return best, lower, true
	}
	if len(edges) <= exactEdgeLimit && len(best)-lower <= exactGapLimit {
		budget := &Budget{Left: int64(exactTests) * int64(1+opt.Effort) * int64(len(edges)+1)}
		for k := lower; k < len(best); k++ {
			found, done := exactRemoval(n, edges, k, budget)
			if !done {
				return best, lower, false
			}
			if found != nil {
				return found, k, true
			}
			lower = k + 1 // no removal of k edges exists
		}
		return best, len(best), true
	}
	return best, lower, false
}

// bothOrders runs the greedy search in the dense-first and the mesh-first
// order (orders[0] and orders[1]) and returns the better result, the
// dense-first one on a tie. Either can take far longer than the other (a
// mesh with a dense cluster: the dense-first order, 30 times longer; a
// mesh with thousands of stray edges: the mesh-first order, 1000 times),
// so the two take turns, each a slice of work at a time: the first to
// reach the lower bound wins, and once one has finished, the other may
// spend up to twice its work. That costs at most three times the faster
// search, and the outcome depends on counted work only, never on timing.
func bothOrders(n int, edges [][2]int32, g csr, orders [2][]int32, support []int32, dense seeded, limit, lower int, report func(float64)) []int32 {
	var search [2]*greedySearch
	var done [2]bool
	var work [2]int64
	slice := 4 * int64(len(edges)+1)
	for {
		for i, by := range []int{denseFirst, meshFirst} {
			if done[i] {
				continue
			}
			if search[i] == nil { // made when first needed: seeding costs O(m)
				search[i] = newGreedySearch(n, edges, g, orders[i], support, by, dense, limit)
				search[i].report = report
			}
			gs := search[i]
			gs.t.budget = &Budget{Left: slice}
			done[i] = gs.run()
			work[i] += slice - max(0, gs.t.budget.Left)
			if done[i] && len(gs.rejected) == lower {
				return gs.result() // nothing can do better
			}
			if i == 0 && search[1] == nil && gs.tookTriangles {
				// Every edge on a triangle went in at once: the
				// mesh-first order differs only in the order of those
				// edges (and of the seed's, picked from the same order
				// of the rest), so it would keep the same edges.
				gs.t.budget = nil
				gs.run()
				return gs.result()
			}
		}
		switch {
		case done[0] && done[1]:
			if len(search[1].rejected) < len(search[0].rejected) {
				return search[1].result()
			}
			return search[0].result()
		case done[0] && work[1] >= 2*work[0]:
			return search[0].result()
		case done[1] && work[0] >= 2*work[1]:
			return search[1].result()
		}
	}
}

// edgeLimit is the most edges a planar simple graph on these vertices can
// have given its girth: 3n-6 in general, 2n-4 without triangles, and
// g(n-2)/(g-2) for girth g (from Euler's formula, every face having at
// least g sides). The girth is only computed for small blocks.
func edgeLimit(n int, edges [][2]int32, adj csr) int {
	limit := 3*n - 6
	g := 3
	if int64(n)*int64(len(edges)) <= 20_000_000 {
		g = girth(n, edges, adj)
	} else if bipartite(n, edges, adj) {
		g = 4
	}
	if g > 3 {
		limit = g * (n - 2) / (g - 2)
	}
	return limit
}

// girth returns the length of a shortest cycle (0 if none), by a
// breadth-first search from every vertex: O(nm).
func girth(n int, edges [][2]int32, g csr) int {
	dist := make([]int32, n)
	from := make([]int32, n)
	best := int32(0)
	queue := make([]int32, 0, n)
	for s := range n {
		for v := range dist {
			dist[v] = -1
		}
		dist[s] = 0
		from[s] = -1
		queue = append(queue[:0], int32(s))
		for qi := 0; qi < len(queue); qi++ {
			v := queue[qi]
			if best > 0 && 2*dist[v]+1 >= best {
				break
			}
			for _, d := range g.adj[g.start[v]:g.start[v+1]] {
				e := d >> 1
				if e == from[v] {
					continue
				}
				w := edges[e][1-d&1]
				if dist[w] < 0 {
					dist[w] = dist[v] + 1
					from[w] = e
					queue = append(queue, w)
				} else if c := dist[v] + dist[w] + 1; best == 0 || c < best {
					best = c
				}
			}
		}
	}
	return int(best)
}

func bipartite(n int, edges [][2]int32, g csr) bool {
	color := make([]int8, n)
	var stack []int32
	for s := range n {
		if color[s] != 0 {
			continue
		}
		color[s] = 1
		stack = append(stack[:0], int32(s))
		for len(stack) > 0 {
			v := stack[len(stack)-1]
			stack = stack[:len(stack)-1]
			for _, d := range g.adj[g.start[v]:g.start[v+1]] {
				w := edges[d>>1][1-d&1]
				if color[w] == 0 {
					color[w] = -color[v]
					stack = append(stack, w)
				} else if color[w] == color[v] {
					return false
				}
			}
		}
	}
	return true
}

func identity(m int) []int32 {
	p := make([]int32, m)
	for i := range p {
		p[i] = int32(i)
	}
	return p
}

// maxSupportLevel caps the triangle counts used for ordering.
const maxSupportLevel = 15

// triangleSupport counts, for every edge, the triangles it lies on, by
// the edge-orientation method of Chiba and Nishizeki ("Arboricity and
// subgraph listing algorithms", SIAM J. Comput. 14, 1985): each edge points
// from its end of lower degree, and each triangle is found once from its
// lowest corner, in O(m a(G)) time, linear for planar-like graphs. With
// work >= 0 it gives up (nil) after that many steps of the inner loop.
func triangleSupport(n int, edges [][2]int32, work int) []int32 {
	deg := make([]int32, n)
	for _, e := range edges {
		deg[e[0]]++
		deg[e[1]]++
	}
	lower := func(u, v int32) bool { return deg[u] < deg[v] || deg[u] == deg[v] && u < v }
	start := make([]int32, n+1)
	for _, e := range edges {
		u, v := e[0], e[1]
		if !lower(u, v) {
			u = v
		}
		start[u+1]++
	}
	for v := 1; v <= n; v++ {
		start[v] += start[v-1]
	}
	out := make([]int32, len(edges)) // edge ids, grouped by lower end
	pos := append([]int32(nil), start[:n]...)
	for i, e := range edges {
		u := e[0]
		if !lower(e[0], e[1]) {
			u = e[1]
		}
		out[pos[u]] = int32(i)
		pos[u]++
	}
	other := func(e, u int32) int32 { return edges[e][0] ^ edges[e][1] ^ u }
	mark := make([]int32, n) // edge u-w + 1 while u is processed
	support := make([]int32, len(edges))
	for u := int32(0); int(u) < n; u++ {
		for _, e := range out[start[u]:start[u+1]] {
			mark[other(e, u)] = e + 1
		}
		for _, e1 := range out[start[u]:start[u+1]] {
			v := other(e1, u)
			if work >= 0 {
				if work -= int(start[v+1] - start[v]); work < 0 {
					return nil
				}
			}
			for _, e2 := range out[start[v]:start[v+1]] {
				if e3 := mark[other(e2, v)]; e3 > 0 {
					support[e1]++
					support[e2]++
					support[e3-1]++
				}
			}
		}
		for _, e := range out[start[u]:start[u+1]] {
			mark[other(e, u)] = 0
		}
	}
	return support
}

// Triangle counts order the greedy search in one of two ways. The first
// takes edges by decreasing count, growing dense planar structure first.
// The second takes the edges on two triangles, then those on one, as the
// edges of a triangulated mesh are (each on its two faces, or one on the
// boundary), then the rest by decreasing count: on a mesh with a dense
// cluster in it, the first order lets the cluster in and the mesh around
// it give way (a 3,000-vertex triangulation plus K_20 lost 503 edges where
// 189 suffice), the second keeps the mesh (193).
const (
	denseFirst = iota
	meshFirst
)

// meshLike reports whether at least half the edges lie on one or two
// triangles, as in a triangulated mesh; only then is the mesh-first order
// worth a second search.
func meshLike(support []int32) bool {
	k := 0
	for _, s := range support {
		if s == 1 || s == 2 {
			k++
		}
	}
	return 2*k >= len(support)
}

// noShortCycle is the code, in the triangle counts, of an edge on no
// triangle and on no cycle of up to maxCycleLength edges; markLongCycles
// codes an edge on no triangle and no 4-cycle whose shortest cycle has l
// edges, up to maxCycleLength, as 4-l (-1 for a 5-cycle and down). Such
// edges go last in both orders, by increasing length, and those on no
// short cycle very last.
const noShortCycle = 3 - maxCycleLength

// maxCycleLength is the longest cycle markLongCycles looks for through an
// edge, and each length up to it is a level of its own. The faces of a
// sparse planar mesh are short, so its own edges lie on short cycles and
// strays between far parts of it mostly do not: of the about 7,000
// candidates on no 4-cycle in 60% of a random 10^5-vertex triangulation's
// edges plus 10 random pairs, 5,350 lie on a 5-cycle, 1,263 on a 6-cycle,
// 264, 63 and 19 on shortest cycles of 7, 8 and 9 to 12 edges, and 4 on
// none; as one level they took 588 whole-block tests, as levels 41.
const maxCycleLength = 12

// cycleWork bounds the search for a short cycle through one edge, in
// adjacency entries scanned; an edge whose search costs more counts as
// on no short cycle (an end of huge degree: a hub is not a mesh).
const cycleWork = 4096

// markLongCycles codes every edge on no triangle (support 0) that lies on
// no 4-cycle by its shortest cycle (see noShortCycle): in a mesh without
// triangles, such as a grid, the edges of the mesh lie on 4-cycles and
// stray long edges do not, so taking the latter last keeps the mesh (a
// 50 x 50 grid with 10 random edges lost 284 of its own edges, in the
// order of the depth-first renumbering, instead of the 10 strays). An
// edge u v lies on a 4-cycle if some neighbour of u other than v is
// adjacent to some neighbour of v other than u. The work is bounded, in
// steps per edge like the triangle counts, and when it runs out nothing
// is coded at all, so the order never depends on where it stopped.
// The edges on no 4-cycle then get a bounded search for a shortest cycle
// through them (see shortCycles); if that search runs out of its own work
// bound, every one of them is noShortCycle.
func markLongCycles(n int, edges [][2]int32, g csr, support []int32) {
	work := supportWork * len(edges)
	mark := make([]int32, n) // edge index + 1 while v's neighbours are marked
	var marked []int32
	around := func(x int32) []int32 { return g.adj[g.start[x]:g.start[x+1]] }
	other := func(d int32) int32 { return edges[d>>1][1-d&1] }
	on4 := make([]bool, len(edges))
	for e, uv := range edges {
		if support[e] != 0 {
			continue
		}
		u, v := uv[0], uv[1]
		if len(around(u)) > len(around(v)) {
			u, v = v, u
		}
		// Mark the neighbours of v (but u), then look two steps from u.
		work -= len(around(v))
		marked = marked[:0]
		for _, d := range around(v) {
			if w := other(d); w != u {
				mark[w] = int32(e) + 1
				marked = append(marked, w)
			}
		}
	search:
		for _, d := range around(u) {
			x := other(d)
			if x == v {
				continue
			}
			if work -= len(around(x)); work < 0 {
				break
			}
			for _, d2 := range around(x) {
				if w := other(d2); w != u && mark[w] == int32(e)+1 {
					on4[e] = true
					break search
				}
			}
		}
		for _, w := range marked {
			mark[w] = 0
		}
		if work < 0 {
			return // out of work: leave every count as it was
		}
	}
	var long []int32 // edges on no 4-cycle
	for e := range edges {
		if support[e] == 0 && !on4[e] {
			support[e] = noShortCycle
			long = append(long, int32(e))
		}
	}
	if len(long) == 0 {
		return
	}
	work = supportWork * len(edges)
	found := make([]int32, len(long))
	c := newShortCycles(n, edges, g)
	for i, e := range long {
		l, spent := c.through(e, maxCycleLength, min(work, cycleWork))
		if work -= spent; work < 0 {
			return // out of work: all stay noShortCycle
		}
		found[i] = int32(l)
	}
	for i, e := range long {
		if found[i] > 0 {
			support[e] = 4 - found[i]
		}
	}
}

// supportRank is an edge's place in the given order by its triangle count.
func supportRank(s int32, order int) int32 {
	if s < 0 { // a cycle-length code, see noShortCycle
		return maxSupportLevel - s // after every edge on a triangle or 4-cycle
	}
	down := maxSupportLevel - min(s, maxSupportLevel) // 0..maxSupportLevel
	if order == denseFirst || s == 0 || s > 2 {
		return down
	}
	return -s // -2 for two triangles, -1 for one: ahead of the rest
}

// bySupport sorts order stably by supportRank.
func bySupport(support, order []int32, by int) []int32 {
	const shift = 2 // ranks run from -2 to maxSupportLevel-noShortCycle
	var count [maxSupportLevel - noShortCycle + shift + 2]int32
	level := func(e int32) int32 { return supportRank(support[e], by) + shift }
	for _, e := range order {
		count[level(e)+1]++
	}
	for k := 1; k < len(count); k++ {
		count[k] += count[k-1]
	}
	out := make([]int32, len(order))
	for _, e := range order {
		l := level(e)
		out[count[l]] = e
		count[l]++
	}
	return out
}

// greedyPlanar grows a planar subgraph from a triangular cactus seed,
// adding edges in the given order, and returns the rejected edges. When
// support is given, the order runs through levels of equal supportRank
// (dense-first) and each level is first tried as one group: on a mesh with
// a few stray long edges the well-supported edges then go in with a
// handful of tests, after which the Euler bound rejects the rest untested.
//
// On a dense block (see denseSeed) the seed is a stacked triangulation or
// a quadrangulation instead, and every edge between two of its vertices is
// rejected without a test.
func greedyPlanar(n int, edges [][2]int32, g csr, order, support []int32, dense seeded, limit int, report func(float64)) []int32 {
	gs := newGreedySearch(n, edges, g, order, support, denseFirst, dense, limit)
	gs.report = report
	gs.run() // no budget: runs to the end
	return gs.result()
}

// greedySearch is the state of one greedy search, so that it can stop when
// its budget runs out and go on later with a new one (see bothOrders).
type greedySearch struct {
	support  []int32
	by       int
	limit    int
	kept     []int32
	rejected []int32
	cand     []int32
	t        *tester
	i, end   int // next candidate; end of the current level
	chunk    int // size of the next group
	failing  int // > 0: the kept graph fails with the next failing edges
	good     int // edges taken since the last rejection in this level
	sorted   bool
	// triangles is the number of leading candidates on some triangle, the
	// first group; tookTriangles says that they passed together.
	triangles     int
	tookTriangles bool
	proof         *localProof // made at the first single-candidate test once the kept graph has localProofSize edges
	proofMisses   int         // failed proofs in a row
	proofSkip     int         // single candidates to test without a proof
	proofTried    int         // the candidate index of the last proof step, or -1
	skeleton      *skeleton   // made at the first single-candidate test once the kept graph has skeletonSize edges
	noSkeleton    bool        // the skeleton was no smaller than the kept graph: test whole
	report        func(done float64)
	nextReport    int // the candidate index at which to report next
}

// localProofSize is the least kept graph, in edges, on which a single
// candidate is first tried with a localProof: below it a whole test is as
// cheap. localProofWork is the least work bound of its path search; it is
// a quarter of the kept graph when that is more.
var localProofSize = 2000 // a variable for the test that turns the proofs off

const localProofWork = 4096

func newGreedySearch(n int, edges [][2]int32, adj csr, order, support []int32, by int, dense seeded, limit int) *greedySearch {
	g := &greedySearch{support: support, by: by, limit: limit, t: &tester{n: n, edges: edges}, chunk: 1, proofTried: -1}
	// The dense seed is shared by every search of the block: each grows
	// its own copy.
	kept, spanned := slices.Clone(dense.edges), dense.spanned
	if kept == nil {
		kept = cactusSeed(n, edges, adj, order)
	}
	g.kept = kept
	inSeed := make([]bool, len(edges))
	for _, e := range kept {
		inSeed[e] = true
	}
	g.cand = make([]int32, 0, len(edges)-len(kept))
	for _, e := range order {
		switch {
		case inSeed[e]:
		case spanned != nil && spanned[edges[e][0]] && spanned[edges[e][1]]:
			// The seed holds Euler's bound on its vertices: with one edge
			// more between them it would break it.
			g.rejected = append(g.rejected, e)
		default:
			g.cand = append(g.cand, e)
		}
	}
	if support != nil {
		// First try every edge on some triangle at once: on a mesh with a
		// few stray edges that is the whole mesh, accepted in one test.
		for g.end < len(g.cand) && support[g.cand[g.end]] > 0 {
			g.end++
		}
		g.chunk = g.end
		g.triangles = g.end
	}
	return g
}

// levelEnd is the end of the level of equal rank that starts at i.
func (g *greedySearch) levelEnd(i int) int {
	if g.support == nil {
		return len(g.cand)
	}
	l := supportRank(g.support[g.cand[i]], g.by)
	j := i
	for j < len(g.cand) && supportRank(g.support[g.cand[j]], g.by) == l {
		j++
	}
	return j
}

// run goes on with the search until it is done (true) or its tester's
// budget runs out (false; run may be called again with a new budget, and
// repeats the test that did not fit). Adaptive group testing, in the
// manner of Hwang's generalized binary splitting ("A method for detecting
// all defective members in a population by group testing", J. Amer.
// Statist. Assoc. 67, 1972): a group that fails is halved from its front
// until its first bad edge is found, so one bad edge among g costs about
// log2 g tests, and the group after a rejection is as long as the run of
// good edges before it, doubling after each success, so runs of good
// edges cost few tests and a cluster of bad ones about one test each.
func (g *greedySearch) run() bool {
	for g.i < len(g.cand) {
		if g.report != nil && g.i >= g.nextReport {
			g.report(float64(g.i) / float64(len(g.cand)))
			g.nextReport = g.i + len(g.cand)/200 + 1
		}
		if len(g.kept) >= g.limit {
			g.rejected = append(g.rejected, g.cand[g.i:]...)
			g.i = len(g.cand)
			break
		}
		if g.i == g.end { // a new level: try it whole first
			g.end = g.levelEnd(g.i)
			g.chunk = g.end - g.i
			g.good = 0
		}
		k := min(g.chunk, g.end-g.i, g.limit-len(g.kept))
		if g.failing > 0 {
			if g.failing == 1 {
				// The kept graph is planar and fails with this edge.
				g.rejected = append(g.rejected, g.cand[g.i])
				g.i++
				g.failing = 0
				g.chunk, g.good = max(1, g.good), 0
				continue
			}
			k = g.failing / 2
		}
		group := g.cand[g.i : g.i+k]
		if k == 1 && g.failing == 0 && len(g.kept) >= localProofSize && g.proofTried != g.i {
			// g.proofTried: a test that did not fit the budget is repeated
			// on re-entry, without a second proof or back-off step.
			g.proofTried = g.i
			if g.proof == nil {
				g.proof = newLocalProof(g.t.n, g.t.edges, g.kept)
			}
			if g.proofSkip > 0 {
				g.proofSkip--
			} else {
				proved, spent := g.proof.rejects(group[0], max(localProofWork, len(g.kept)/4))
				g.t.budget.spend(spent) // counted work, as the tests' (an overdraft stops the next test)
				if proved {
					g.rejected = append(g.rejected, group[0])
					g.i++
					g.good = 0
					g.proofMisses = 0
					continue
				}
				// After m failed proofs in a row, skip the next m
				// candidates: where tubes prove nothing (a random
				// graph) the proofs cost little, where they do they
				// are never skipped.
				g.proofMisses++
				g.proofSkip = g.proofMisses
			}
		}
		p, ok := g.planar(group)
		if !ok {
			return false
		}
		switch {
		case p:
			if g.i == 0 && k == g.triangles {
				g.tookTriangles = true
			}
			g.kept = append(g.kept, group...)
			if g.proof != nil {
				g.proof.add(group)
			}
			g.i += k
			g.good += k
			if g.failing > 0 {
				g.failing -= k // the failing group's first bad edge is further on
			} else {
				g.chunk = 2 * k
			}
		default:
			g.failing = k
		}
	}
	return true
}

// planar tests the kept graph plus group, on the skeleton (see skeleton)
// when group is one edge and the skeleton pays; ok is false when the
// budget ran out. A skeleton test is charged as the whole test it stands
// for, so that the search takes the same course either way (bothOrders
// shares out work by these charges).
func (g *greedySearch) planar(group []int32) (p, ok bool) {
	if len(group) != 1 || g.noSkeleton || len(g.kept) < skeletonSize {
		return g.t.planar(g.kept, group)
	}
	if g.skeleton == nil {
		g.skeleton = newSkeleton(g.t.n, g.t.edges)
	}
	if g.skeleton.kept != len(g.kept) { // the kept list only grows, at its end
		if !g.skeleton.build(g.kept, g.t.n+len(g.kept)) {
			g.noSkeleton = true // it only grows faster than the kept graph: it would not pay later
			g.skeleton = nil
			return g.t.planar(g.kept, group)
		}
	}
	g.t.tests++
	if !g.t.budget.spend(len(g.kept) + 1) {
		return false, false
	}
	return g.skeleton.planarWith(group[0]), true
}

// result returns the rejected edges, sorted, once run is done.
func (g *greedySearch) result() []int32 {
	if !g.sorted {
		slices.Sort(g.rejected)
		g.sorted = true
	}
	return g.rejected
}

// seedStart says whether a block gets the dense seed, and how to start it.
type seedStart struct {
	dense    bool
	triangle int32 // an edge on a triangle, or -1 when the block has none
}

// analyseBlock decides the seed of a block and returns the triangle counts
// of its edges for the greedy order (nil when they cost too much).
// Counting triangles (Chiba and Nishizeki) costs O(m) times the
// arboricity, which on a dense block is about n, so there it stops after
// supportWork steps per edge; the block then looks for one triangle with
// O(m) work, or proves it has none by being bipartite.
func analyseBlock(n int, edges [][2]int32, g csr) (start seedStart, support []int32) {
	if n < 5 || len(edges) == 0 || int64(len(edges))*16 < int64(n)*int64(n) {
		return seedStart{}, triangleSupport(n, edges, -1)
	}
	if support = triangleSupport(n, edges, supportWork*len(edges)); support != nil {
		// Start from the edge the greedy order puts first: on most
		// triangles (counts capped as bySupport caps them), first in edge
		// order among equals.
		start = seedStart{dense: true, triangle: -1}
		best := int32(0)
		for e, c := range support {
			if c = min(c, maxSupportLevel); c > best {
				start.triangle, best = int32(e), c
			}
		}
		return start, support
	}
	if e := findTriangle(n, edges, g, 2*len(edges)); e >= 0 {
		return seedStart{dense: true, triangle: e}, nil
	}
	if bipartite(n, edges, g) {
		return seedStart{dense: true, triangle: -1}, nil
	}
	return seedStart{}, nil // no proof either way: the plain greedy search
}

// supportWork bounds the triangle counting on a dense block, in steps per
// edge.
const supportWork = 64

// findTriangle returns the first edge, in edge order, that lies on a
// triangle, giving up (-1) once it has spent work steps.
func findTriangle(n int, edges [][2]int32, g csr, work int) int32 {
	mark := make([]int32, n)
	for e, uv := range edges {
		u, v := uv[0], uv[1]
		if work -= int(g.start[u+1] - g.start[u] + g.start[v+1] - g.start[v]); work < 0 {
			return -1
		}
		if _, _, ok := triangleOn(edges, g, int32(e), mark); ok {
			return int32(e)
		}
	}
	return -1
}

// triangleOn finds a triangle through edge e: it returns the edges from
// e's first and second end to a common neighbour. mark must be all zero,
// and is again on return.
func triangleOn(edges [][2]int32, g csr, e int32, mark []int32) (e1, e2 int32, ok bool) {
	u, v := edges[e][0], edges[e][1]
	around := func(x int32) []int32 { return g.adj[g.start[x]:g.start[x+1]] }
	for _, d := range around(u) {
		mark[edges[d>>1][1-d&1]] = d>>1 + 1
	}
	for _, d := range around(v) {
		if w := edges[d>>1][1-d&1]; w != u && mark[w] > 0 {
			e1, e2, ok = mark[w]-1, d>>1, true
			break
		}
	}
	for _, d := range around(u) {
		mark[edges[d>>1][1-d&1]] = 0
	}
	return e1, e2, ok
}

// denseSeed grows a seed for a dense block (at least n^2/16 edges) that
// holds as many edges as Euler's formula allows on the vertices it spans,
// so that no edge between two of them can join it: on a complete graph it
// is the whole answer, where testing edge after edge costs a planarity
// test each, O(nm) in all.
//
//   - With a triangle, a stacked triangulation (3k-6 edges on k vertices):
//     the first triangle in edge order, then each further vertex, in
//     vertex order, put into the first face whose three corners are all
//     its neighbours.
//   - Without any triangle in the block, a quadrangulation (2k-4 edges,
//     the bound for triangle-free planar graphs, which every subgraph of
//     the block is): the first 4-cycle through the first edge, then each
//     vertex put into the first face two opposite corners of which are its
//     neighbours.
//
// The face scans cost O(n^2) in all, which the density keeps within O(m).
// It returns the seed's edges and the vertices it spans, or nothing when
// start says the block is not dense or no seed of four or more vertices
// was found.
func denseSeed(n int, edges [][2]int32, g csr, start seedStart) seeded {
	if !start.dense {
		return seeded{}
	}
	first := start.triangle
	var seed []int32
	mark := make([]int32, n) // edge index to the marked vertex, + 1
	markAround := func(x int32, on bool) {
		for _, d := range g.adj[g.start[x]:g.start[x+1]] {
			if on {
				mark[edges[d>>1][1-d&1]] = d>>1 + 1
			} else {
				mark[edges[d>>1][1-d&1]] = 0
			}
		}
	}
	around := func(x int32) []int32 { return g.adj[g.start[x]:g.start[x+1]] }
	other := func(d int32) int32 { return edges[d>>1][1-d&1] }
	spanned := make([]bool, n)
	var faces [][4]int32 // corners in order; the fourth is -1 in a triangle
	if first >= 0 {
		if e1, e2, ok := triangleOn(edges, g, first, mark); ok {
			u, v := edges[first][0], edges[first][1]
			w := edges[e1][0] ^ edges[e1][1] ^ u
			seed = append(seed, first, e1, e2)
			faces = [][4]int32{{u, v, w, -1}, {u, w, v, -1}}
		}
	} else {
		// A 4-cycle u v w z through the first edge: z a neighbour of u
		// and of some neighbour w of v.
		first = 0
		u, v := edges[first][0], edges[first][1]
		markAround(u, true)
	search:
		for _, dw := range around(v) {
			w := other(dw)
			if w == u {
				continue
			}
			for _, dz := range around(w) {
				if z := other(dz); z != v && mark[z] > 0 {
					seed = append(seed, first, dw>>1, dz>>1, mark[z]-1)
					faces = [][4]int32{{u, v, w, z}, {u, z, w, v}}
					break search
				}
			}
		}
		markAround(u, false)
	}
	if faces == nil {
		return seeded{}
	}
	for _, x := range faces[0] {
		if x >= 0 {
			spanned[x] = true
		}
	}
	for x := range int32(n) {
		if spanned[x] {
			continue
		}
		markAround(x, true)
		for i, f := range faces {
			if f[3] < 0 { // triangle p q r: x joins all three
				if mark[f[0]] == 0 || mark[f[1]] == 0 || mark[f[2]] == 0 {
					continue
				}
				seed = append(seed, mark[f[0]]-1, mark[f[1]]-1, mark[f[2]]-1)
				faces[i] = [4]int32{f[0], f[1], x, -1}
				faces = append(faces, [4]int32{f[1], f[2], x, -1}, [4]int32{f[2], f[0], x, -1})
			} else { // quadrangle p q r s: x joins p and r (or q and s)
				if mark[f[0]] == 0 || mark[f[2]] == 0 {
					f = [4]int32{f[1], f[2], f[3], f[0]}
					if mark[f[0]] == 0 || mark[f[2]] == 0 {
						continue
					}
				}
				seed = append(seed, mark[f[0]]-1, mark[f[2]]-1)
				faces[i] = [4]int32{f[0], f[1], f[2], x}
				faces = append(faces, [4]int32{f[2], f[3], f[0], x})
			}
			spanned[x] = true
			break
		}
		markAround(x, false)
	}
	if len(seed) < 6 {
		return seeded{} // the first triangle or 4-cycle alone: no better than the cactus
	}
	return seeded{seed, spanned}
}

// seeded is a dense seed: its edges and the vertices it spans (none when
// edges is nil).
type seeded struct {
	edges   []int32
	spanned []bool
}

// cactusSeed picks, in edge order, triangles whose three corners lie in
// three different components of the structure built so far (the greedy
// triangular cactus), then joins the components with a spanning forest.
// The result is planar: every block is a triangle or a single edge.
func cactusSeed(n int, edges [][2]int32, g csr, order []int32) []int32 {
	uf := disjoint.New(n)
	mark := make([]int32, n) // edge index to the marked vertex, + 1
	var seed []int32
	for _, e := range order {
		u, v := edges[e][0], edges[e][1]
		if uf.Find(u) == uf.Find(v) {
			continue
		}
		if g.start[u+1]-g.start[u] > g.start[v+1]-g.start[v] {
			u, v = v, u
		}
		for _, d := range g.adj[g.start[u]:g.start[u+1]] {
			mark[edges[d>>1][1-d&1]] = d>>1 + 1
		}
		for _, d := range g.adj[g.start[v]:g.start[v+1]] {
			w := edges[d>>1][1-d&1]
			if w == u || mark[w] == 0 {
				continue
			}
			ru, rv, rw := uf.Find(u), uf.Find(v), uf.Find(w)
			if ru != rv && rv != rw && ru != rw {
				seed = append(seed, e, mark[w]-1, d>>1)
				uf.Union(ru, rv)
				uf.Union(ru, rw)
				break
			}
		}
		for _, d := range g.adj[g.start[u]:g.start[u+1]] {
			mark[edges[d>>1][1-d&1]] = 0
		}
	}
	for _, e := range order {
		u, v := edges[e][0], edges[e][1]
		if ru, rv := uf.Find(u), uf.Find(v); ru != rv {
			seed = append(seed, e)
			uf.Union(ru, rv)
		}
	}
	return seed
}

// exactRemoval looks for k edges whose removal makes the graph planar,
// branching on the edges of a Kuratowski subgraph: some edge of every
// Kuratowski subgraph must go. In the branch for its i-th edge, the first
// i-1 edges are kept for good, so no removal set is visited twice. done is
// false when the budget ran out.
func exactRemoval(n int, edges [][2]int32, k int, budget *Budget) (found []int32, done bool) {
	removed := make([]bool, len(edges))
	fixed := make([]bool, len(edges))
	var chosen []int32
	var rest []int32
	var search func(k int) (bool, bool)
	search = func(k int) (bool, bool) { // recursion depth is at most k
		rest = rest[:0]
		for i := range edges {
			if !removed[i] {
				rest = append(rest, int32(i))
			}
		}
		if !budget.spend(len(rest)) {
			return false, false
		}
		var buf [][2]int32
		for _, i := range rest {
			buf = append(buf, edges[i])
		}
		if IsPlanar(n, buf) {
			return true, true
		}
		if k == 0 {
			return false, true
		}
		ks, ok := FindKuratowski(n, edges, append([]int32(nil), rest...), nil, budget)
		if !ok {
			return false, budget.Left >= 0
		}
		var undo []int32
		defer func() {
			for _, e := range undo {
				fixed[e] = false
			}
		}()
		for _, e := range ks.Edges {
			if fixed[e] {
				continue
			}
			removed[e] = true
			chosen = append(chosen, e)
			f, d := search(k - 1)
			if !d || f {
				return f, d
			}
			chosen = chosen[:len(chosen)-1]
			removed[e] = false
			fixed[e] = true
			undo = append(undo, e)
		}
		return false, true
	}
	f, d := search(k)
	if !d || !f {
		return nil, d
	}
	out := append([]int32(nil), chosen...)
	slices.Sort(out)
	return out, true
}
