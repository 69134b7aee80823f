package place

import (
	"errors"
	"fmt"
	"math"
	"slices"
	"time"

	"github.com/gridwood/gridwood/internal/disjoint"
	"github.com/gridwood/gridwood/internal/order"
	"github.com/gridwood/gridwood/planarize"
)

// errNotPlanar means the planar subgraph was not planar: a bug, reported
// instead of a crash.
var errNotPlanar = errors.New("place: internal error: kept subgraph is not planar")

// DrawOptions tune Draw. The zero value is the default.
type DrawOptions struct {
	Layout   Options
	Subgraph planarize.SubgraphOptions
	// Readable keeps the kept graph's embedding for Result.Readable.
	Readable bool
	// Progress, if set, is called as each stage of Draw begins, and now
	// and then during the planar subgraph, with the stage's name and
	// roughly how far through Draw the run is (0 to 1).
	Progress func(stage string, done float64)
}

// Result is a crossing-free straight-line grid drawing of a graph that may
// have loops, repeated edges and crossings-forcing (non-planar) edges.
type Result struct {
	Drawing
	// DistinctPairs is the number of distinct vertex pairs joined by an
	// edge.
	DistinctPairs int
	// Removed lists, in increasing order, the input edges the drawing
	// leaves out to stay planar: every copy of each removed vertex pair.
	// Loops are never listed; they do not affect planarity.
	Removed []int
	// RemovedPairs is the number of distinct pairs removed. Adding back any
	// one of them would make the drawn graph non-planar.
	RemovedPairs int
	// Optimal reports that no planar subgraph keeps more pairs.
	Optimal bool
	// LowerBound is a proved lower bound on the pairs any planar subgraph
	// must drop.
	LowerBound int
	// Times says how long the stages took (for reports; never part of the
	// drawing).
	Times StageTimes

	simple     [][2]int32
	simpleOf   []int32
	removedSP  []int32
	keptComp   []int32              // for Explain: each vertex's component in the kept graph
	keptIn     [][]int32            // for Explain: the kept pairs of each component
	local      *Drawing             // the grid drawing in Draw's own numbering
	tri        *triangulation       // the grid stage's triangulation, for Space
	newID      []int32              // caller's vertex -> Draw's numbering
	keptLocal  [][2]int32           // kept pairs in Draw's numbering
	keptEmb    *planarize.Embedding // the kept graph's embedding (DrawOptions.Readable)
	outerAsked bool                 // Options.Outer was given: Readable keeps the outer face
}

// Draw lays out the graph with n vertices and the given edges (ordered
// pairs; direction, loops and repeats are ignored for the layout). Each
// vertex gets an integer grid point; edges that are kept are straight
// segments that neither cross nor touch except at common ends. If the graph
// is not planar, an inclusion-minimal set of vertex pairs is removed first
// (see planarize.MaximalPlanar) and reported in Result.Removed.
func Draw(n int, edges [][2]int32, opt DrawOptions) (*Result, error) {
	if err := checkInput(n, edges); err != nil {
		return nil, err
	}
	progress := opt.Progress
	if progress == nil {
		progress = func(string, float64) {}
	}
	progress("renumbering", 0)
	start := time.Now()
	// Renumber first, so that even removing repeats runs on local data.
	// The new numbers do not depend on the edges' directions, and each
	// renamed pair is then taken with its smaller end first, so that
	// direction cannot change the drawing: a b and b a lay out alike.
	newID, renamed, rawOf := order.DepthFirst(n, edges)
	for i, e := range renamed {
		if e[0] > e[1] {
			renamed[i] = [2]int32{e[1], e[0]}
		}
	}
	local, localIndex := planarize.Simplify(n, renamed)
	// Number the pairs in order of first occurrence in the input, as
	// PairList promises: edgeOf maps a local pair to that number.
	var edgeOf, index []int32
	var simple [][2]int32
	if len(local) == len(edges) {
		// No loops and no repeats, the usual case: the pairs are the edges,
		// local pair k is renamed edge k, so no scattered lookups are needed.
		edgeOf = rawOf
		simple = append([][2]int32(nil), edges...)
		index = make([]int32, len(edges))
		for i := range index {
			index[i] = int32(i)
		}
	} else {
		edgeOf, simple, index = pairsInInputOrder(edges, rawOf, localIndex, len(local))
	}
	res := &Result{DistinctPairs: len(simple), Optimal: true, simple: simple, simpleOf: index}
	kept := local
	progress("planarity test", 0.25)
	emb, ok := planarize.Embed(n, local)
	if !ok {
		progress("planar subgraph", 0.4)
		subOpt := opt.Subgraph
		if subOpt.Progress == nil {
			subOpt.Progress = func(done float64) { progress("planar subgraph", 0.4+0.3*done) }
		}
		sub := planarize.MaximalPlanar(n, local, subOpt)
		res.Optimal, res.LowerBound = sub.Optimal, sub.LowerBound
		res.RemovedPairs = len(sub.Removed)
		gone := make([]bool, len(simple)) // by original pair index
		for _, e := range sub.Removed {
			gone[edgeOf[e]] = true
		}
		kept = make([][2]int32, 0, len(local)-len(sub.Removed))
		for i, e := range local {
			if !gone[edgeOf[i]] {
				kept = append(kept, e)
			}
		}
		for e, g := range gone {
			if g {
				res.removedSP = append(res.removedSP, int32(e))
			}
		}
		for i, s := range index {
			if s >= 0 && gone[s] {
				res.Removed = append(res.Removed, i)
			}
		}
		if emb, ok = planarize.Embed(n, kept); !ok {
			return nil, errNotPlanar
		}
		res.groupKept(n, gone)
	}
	lopt := opt.Layout
	if len(lopt.Outer) > 0 {
		res.outerAsked = true
		// Find an embedding with all of Outer on one face: join them to a
		// new vertex, embed, and take the vertex out again.
		outer := make([]int32, len(lopt.Outer))
		withHub := append([][2]int32(nil), kept...)
		for i, v := range lopt.Outer {
			if v < 0 || int(v) >= n {
				return nil, fmt.Errorf("place: outer vertex %d outside 0..%d", v, n-1)
			}
			outer[i] = newID[v]
			withHub = append(withHub, [2]int32{outer[i], int32(n)})
		}
		hubbed, _ := planarize.Simplify(n+1, withHub)
		e2, ok := planarize.Embed(n+1, hubbed)
		if !ok {
			return nil, ErrOuter
		}
		emb = e2.WithoutLastVertex()
		lopt.Outer = outer
	}
	res.Times.Planarize = time.Since(start)
	progress("placing", 0.7)
	start = time.Now()
	if opt.Readable {
		res.keptEmb = emb.Clone()
	}
	d, tri, err := layout(emb, lopt) // emb is ours to augment
	res.Times.Layout = time.Since(start)
	if err != nil {
		return nil, err
	}
	res.local, res.tri, res.newID, res.keptLocal = d, tri, newID, kept
	// Back to the caller's numbering.
	res.Drawing = *d
	res.X, res.Y, res.Barycentric = make([]int64, n), make([]int64, n), make([][3]int32, n)
	for v, w := range newID {
		res.X[v], res.Y[v], res.Barycentric[v] = d.X[w], d.Y[w], d.Barycentric[w]
	}
	return res, nil
}

// FellBackVertices lists, for each component that Method Convex could
// not draw convex (Component.FellBack), its least vertex, in increasing
// order, so that a caller can name the component.
func (r *Result) FellBackVertices() []int {
	if r.NotConvex == 0 {
		return nil
	}
	callerID := make([]int, len(r.newID))
	for v, w := range r.newID {
		callerID[w] = v
	}
	var out []int
	for c, vs := range r.tri.members {
		if !r.Components[c].FellBack {
			continue
		}
		least := callerID[vs[0]]
		for _, w := range vs {
			least = min(least, callerID[w])
		}
		out = append(out, least)
	}
	slices.Sort(out)
	return out
}

// pairsInInputOrder numbers the distinct pairs of edges in order of first
// occurrence: simple lists them with the caller's vertex numbers,
// index[i] is the pair of raw edge i (-1 for a loop) and edgeOf[p] the
// number of local pair p. rawOf and localIndex say which raw edge each
// renamed edge is and which local pair it became.
func pairsInInputOrder(edges [][2]int32, rawOf, localIndex []int32, pairs int) (edgeOf []int32, simple [][2]int32, index []int32) {
	edgeOf = make([]int32, pairs)
	for i := range edgeOf {
		edgeOf[i] = -1
	}
	posOf := make([]int32, len(edges)) // raw edge -> its place in renamed
	for k, i := range rawOf {
		posOf[i] = int32(k)
	}
	simple = make([][2]int32, 0, pairs)
	index = make([]int32, len(edges))
	for i, e := range edges {
		p := localIndex[posOf[i]]
		if p < 0 {
			index[i] = -1
			continue
		}
		if edgeOf[p] < 0 {
			edgeOf[p] = int32(len(simple))
			simple = append(simple, e)
		}
		index[i] = edgeOf[p]
	}
	return edgeOf, simple, index
}

// StageTimes are the durations of Draw's stages.
type StageTimes struct {
	Planarize time.Duration // simple graph, planarity test, planar subgraph, embedding
	Layout    time.Duration // augmentation, ordering, coordinates, compaction, Tutte drawing
}

// Kept returns the distinct vertex pairs of the drawing, without the
// removed ones: the straight segments a renderer will draw.
func (r *Result) Kept() [][2]int32 {
	gone := make([]bool, len(r.simple))
	for _, e := range r.removedSP {
		gone[e] = true
	}
	var out [][2]int32
	for i, e := range r.simple {
		if !gone[i] {
			out = append(out, e)
		}
	}
	return out
}

// Explain returns, for the removed input edge i, a Kuratowski subgraph made
// of that edge's pair and kept pairs, as indices into PairList(). ok is
// false when the budget ran out.
func (r *Result) Explain(i int, budget *planarize.Budget) (*planarize.Kuratowski, bool) {
	if i < 0 || i >= len(r.simpleOf) || r.simpleOf[i] < 0 {
		return nil, false // no such edge, or a loop
	}
	target := r.simpleOf[i]
	if _, removed := slices.BinarySearch(r.removedSP, target); !removed {
		return nil, false // a kept pair has no certificate
	}
	// A Kuratowski subgraph through the pair lies in the kept component of
	// its ends: search that one only, so that explaining many edges of a
	// graph of many small parts does not walk the whole graph each time.
	c := r.keptComp[r.simple[target][0]]
	subset := append(append(make([]int32, 0, len(r.keptIn[c])+1), r.keptIn[c]...), target)
	return planarize.FindKuratowski(len(r.X), r.simple, subset, []int32{target}, budget)
}

// PairList returns the distinct vertex pairs of the input, in order of
// first occurrence; Explain's edge indices refer to it.
func (r *Result) PairList() [][2]int32 { return r.simple }

// checkInput rejects what would otherwise index out of range.
func checkInput(n int, edges [][2]int32) error {
	if n < 0 || n > math.MaxInt32/2 {
		return fmt.Errorf("place: %d vertices", n)
	}
	for i, e := range edges {
		if e[0] < 0 || int(e[0]) >= n || e[1] < 0 || int(e[1]) >= n {
			return fmt.Errorf("place: edge %d joins %d and %d, outside 0..%d", i, e[0], e[1], n-1)
		}
	}
	return nil
}

// groupKept labels the vertices by connected component of the kept pairs
// and lists each component's kept pairs, for Explain; Draw does it when it
// sets pairs aside (a linear pass, small next to finding them).
func (r *Result) groupKept(n int, gone []bool) {
	uf := disjoint.New(n)
	for e, p := range r.simple {
		if !gone[e] {
			uf.Union(p[0], p[1])
		}
	}
	r.keptComp = make([]int32, n)
	ids := make(map[int32]int32)
	for v := range n {
		root := uf.Find(int32(v))
		id, ok := ids[root]
		if !ok {
			id = int32(len(r.keptIn))
			ids[root] = id
			r.keptIn = append(r.keptIn, nil)
		}
		r.keptComp[v] = id
	}
	for e, p := range r.simple {
		if !gone[e] {
			c := r.keptComp[p[0]]
			r.keptIn[c] = append(r.keptIn[c], int32(e))
		}
	}
}
