package place

import (
	"fmt"
	"slices"
	"testing"

	"github.com/gridwood/gridwood/internal/graphgen"
	"github.com/gridwood/gridwood/place/augment"
	"github.com/gridwood/gridwood/planarize"
)

// This file tests the augmentation: Biconnect, then
// TriangulateFaces, must turn every component with n >= 3 vertices into a
// triangulation (a simple plane graph with 3n-6 edges, all faces
// triangles) without disturbing the input's rotation system.

// rotations returns, for every vertex, the darts of emb's original edges
// (index < origM) around it, counter-clockwise, starting at start[v].
func rotations(emb *planarize.Embedding, origM int, start []int32) [][]int32 {
	rot := make([][]int32, emb.N())
	for v := range rot {
		f := start[v]
		if f < 0 {
			continue
		}
		for d := f; ; {
			if int(d>>1) < origM {
				rot[v] = append(rot[v], d)
			}
			if d = emb.Next(d); d == f {
				break
			}
		}
	}
	return rot
}

// checkRotationSystem checks that emb is a consistent rotation system:
// Next and Prev are inverse, stay at their tail, and cycle through Degree
// darts.
func checkRotationSystem(t *testing.T, name string, emb *planarize.Embedding) bool {
	t.Helper()
	for v := int32(0); int(v) < emb.N(); v++ {
		f := emb.First(v)
		if f < 0 {
			if emb.Degree(v) != 0 {
				t.Errorf("%s: vertex %d has no dart but degree %d", name, v, emb.Degree(v))
				return false
			}
			continue
		}
		k := 0
		for d := f; ; {
			if emb.Tail(d) != v || emb.Prev(emb.Next(d)) != d || k > emb.Degree(v) {
				t.Errorf("%s: rotation at vertex %d is broken at dart %d", name, v, d)
				return false
			}
			k++
			if d = emb.Next(d); d == f {
				break
			}
		}
		if k != emb.Degree(v) {
			t.Errorf("%s: vertex %d: rotation of %d darts, degree %d", name, v, k, emb.Degree(v))
			return false
		}
	}
	return true
}

// augmentCheck holds what the checks compare against.
type augmentCheck struct {
	name    string
	orig    *planarize.Embedding
	label   []int
	members [][]int32
}

func newAugmentCheck(name string, orig *planarize.Embedding) *augmentCheck {
	label, members := graphgen.Components(orig.N(), orig.Edges())
	return &augmentCheck{name: name, orig: orig, label: label, members: members}
}

// checkCommon checks what biconnect and triangulateFaces both promise:
// original edges and rotations kept, no loop, no parallel edge, no edge
// between components.
func (a *augmentCheck) checkCommon(t *testing.T, stage string, work *planarize.Embedding) bool {
	t.Helper()
	name := a.name + " after " + stage
	if work.N() != a.orig.N() || work.M() < a.orig.M() {
		t.Errorf("%s: N %d M %d, input N %d M %d", name, work.N(), work.M(), a.orig.N(), a.orig.M())
		return false
	}
	if !checkRotationSystem(t, name, work) {
		return false
	}
	seen := make(map[[2]int32]bool, work.M())
	for i := range work.M() {
		e := work.Edge(i)
		if i < a.orig.M() && e != a.orig.Edge(i) {
			t.Errorf("%s: edge %d changed from %v to %v", name, i, a.orig.Edge(i), e)
			return false
		}
		if e[0] == e[1] {
			t.Errorf("%s: loop %v (edge %d)", name, e, i)
			return false
		}
		if seen[pairKey(e)] {
			t.Errorf("%s: parallel edge %v (edge %d)", name, e, i)
			return false
		}
		seen[pairKey(e)] = true
		if a.label[e[0]] != a.label[e[1]] {
			t.Errorf("%s: edge %v joins two components", name, e)
			return false
		}
	}
	// The rotation restricted to the original darts is unchanged.
	start := make([]int32, a.orig.N())
	for v := range start {
		start[v] = a.orig.First(int32(v))
	}
	want := rotations(a.orig, a.orig.M(), start)
	got := rotations(work, a.orig.M(), start)
	for v := range want {
		if !slices.Equal(want[v], got[v]) {
			t.Errorf("%s: rotation of original darts at vertex %d was %v, is %v", name, v, want[v], got[v])
			return false
		}
	}
	return true
}

// checkBiconnected checks that every component with n >= 3 vertices is
// one block, with planarize.Blocks (Hopcroft and Tarjan's lowpoint
// method, run by a different package).
func (a *augmentCheck) checkBiconnected(t *testing.T, work *planarize.Embedding) {
	t.Helper()
	edges := work.Edges()
	block, _ := planarize.Blocks(work.N(), edges)
	compBlock := make([]int, len(a.members))
	for c := range compBlock {
		compBlock[c] = -1
	}
	for i, e := range edges {
		c := a.label[e[0]]
		if compBlock[c] < 0 {
			compBlock[c] = int(block[i])
		} else if compBlock[c] != int(block[i]) {
			t.Errorf("%s after biconnect: component %d (smallest vertex %d, %d vertices) has two blocks",
				a.name, c, a.members[c][0], len(a.members[c]))
			return
		}
	}
}

// checkTriangulated checks the end result: 3n-6 edges per component with
// n >= 3 (Euler's bound met exactly, SOURCES.md), every face a triangle,
// V - E + F = 2 per component (Euler).
func (a *augmentCheck) checkTriangulated(t *testing.T, work *planarize.Embedding) {
	t.Helper()
	ecount := make([]int, len(a.members))
	for i := range work.M() {
		ecount[a.label[work.Edge(i)[0]]]++
	}
	origCount := make([]int, len(a.members))
	for i := range a.orig.M() {
		origCount[a.label[a.orig.Edge(i)[0]]]++
	}
	for c, vs := range a.members {
		nc := len(vs)
		want := 3*nc - 6
		if nc < 3 {
			want = origCount[c] // nothing to add: 0 or 1 edge
		}
		if ecount[c] != want {
			t.Errorf("%s: component %d with %d vertices has %d edges, want %d", a.name, c, nc, ecount[c], want)
			return
		}
	}
	faces := countFaces(work, a.label, len(a.members))
	for _, size := range faceSizes(work) {
		if size != 3 && size != 2 { // 2: the face of a lone edge
			t.Errorf("%s: face of length %d after triangulation", a.name, size)
			return
		}
	}
	for c, vs := range a.members {
		if ecount[c] > 0 && len(vs)-ecount[c]+faces[c] != 2 {
			t.Errorf("%s: component %d: V=%d E=%d F=%d, Euler wants V-E+F=2", a.name, c, len(vs), ecount[c], faces[c])
			return
		}
	}
}

// augment runs biconnect and triangulateFaces on a copy of emb with all
// checks, and returns the triangulated copy.
func augmented(t *testing.T, name string, emb *planarize.Embedding) *planarize.Embedding {
	t.Helper()
	a := newAugmentCheck(name, emb)
	work := emb.Clone()
	augment.Biconnect(work, noSkip)
	if !a.checkCommon(t, "biconnect", work) {
		return work
	}
	a.checkBiconnected(t, work)
	if emb.M() > 0 && blockCount(emb) == 1 && work.M() != emb.M() {
		// biconnect's doc: edges are added only between neighbours whose
		// edges lie in different blocks, so a biconnected input stays.
		t.Errorf("%s: biconnect added %d edges to a biconnected graph", name, work.M()-emb.M())
	}
	// Faces of length k >= 4 need k-3 diagonals each (a polygon
	// triangulation has k-3 diagonals; common practice).
	wantSplits, wantAdded := 0, 0
	for _, k := range faceSizes(work) {
		if k >= 4 {
			wantSplits++
			wantAdded += k - 3
		}
	}
	before := work.M()
	splits, sizes := 0, 0
	augment.TriangulateFaces(work, noSkip, func(face []int32, tri int32) {
		size := len(face)
		splits++
		sizes += size - 3
		if size < 4 || tri < 0 || int(tri) >= 2*work.M() {
			t.Errorf("%s: onSplit(%d, %d) for a face that needs no split or a bad dart", name, size, tri)
		}
	})
	if !a.checkCommon(t, "triangulateFaces", work) {
		return work
	}
	if splits != wantSplits || sizes != wantAdded || work.M()-before != wantAdded {
		t.Errorf("%s: %d splits adding %d edges (callback sizes say %d); the faces need %d splits and %d edges",
			name, splits, work.M()-before, sizes, wantSplits, wantAdded)
	}
	a.checkTriangulated(t, work)
	return work
}

// blockCount returns the number of blocks of emb's graph.
func blockCount(emb *planarize.Embedding) int {
	_, count := planarize.Blocks(emb.N(), emb.Edges())
	return count
}

// TestAugmentFamilies augments the embeddings of the named families.
func TestAugmentFamilies(t *testing.T) {
	for _, g := range graphgen.Zoo() {
		t.Run(g.Name, func(t *testing.T) {
			augmented(t, g.Name, mustEmbed(t, g))
		})
	}
}

// TestAugmentRandom augments random planar graphs, trees and mirrored
// embeddings.
func TestAugmentRandom(t *testing.T) {
	keeps := []float64{0.05, 0.2, 0.4, 0.6, 0.8, 0.95, 1}
	for i := range 300 {
		n := 3 + i*497/300
		keep := keeps[i%len(keeps)]
		g := graphgen.RandomPlanar(n, keep, uint64(3000+i))
		name := fmt.Sprintf("%s-keep%.2f", g.Name, keep)
		emb := mustEmbed(t, g)
		augmented(t, name, emb)
		if i%10 == 0 {
			augmented(t, name+"-mirror", mirrored(t, emb))
		}
		if t.Failed() {
			return
		}
	}
	for i := range 50 {
		g := graphgen.RandomTree(3+i*20, uint64(4000+i))
		augmented(t, g.Name, mustEmbed(t, g))
	}
}

// TestAugmentChordFaces builds faces whose least-degree vertex has a
// chord outside the face (triangulateFaces's second case): face f0..fk-1
// with the chord f0-fi outside, and each other face vertex made of high
// degree by a fan of new vertices, so that f0 or fi is the least-degree
// vertex of the face.
func TestAugmentChordFaces(t *testing.T) {
	for _, c := range [][2]int{{4, 2}, {5, 2}, {5, 3}, {6, 3}, {7, 2}, {7, 4}, {9, 4}, {12, 6}} {
		k, i := c[0], c[1]
		g := chordFace(k, i, 8)
		emb := mustEmbed(t, g)
		augmented(t, g.Name, emb)
		augmented(t, g.Name+"-mirror", mirrored(t, emb))
		layoutEmbeddingAndCheck(t, g.Name, emb)
	}
}

// chordFace returns the graph described at TestAugmentChordFaces: the
// cycle f0..f(k-1) (vertices 0..k-1), the chord f0-fi, and in each of the
// two regions the chord cuts off, a path of new vertices from f0 to fi
// with every boundary vertex strictly between them joined to m
// consecutive path vertices.
func chordFace(k, i, m int) graphgen.Graph {
	g := graphgen.Graph{N: k, Name: fmt.Sprintf("chord-face-%d-%d", k, i)}
	add := func(a, b int) { g.Edges = append(g.Edges, [2]int32{int32(a), int32(b)}) }
	for j := range k {
		add(j, (j+1)%k)
	}
	add(0, i)
	region := func(inner []int) { // boundary vertices strictly between f0 and fi
		prev := 0
		for _, b := range inner {
			for range m {
				x := g.N
				g.N++
				add(prev, x)
				add(b, x)
				prev = x
			}
		}
		add(prev, i)
	}
	var r1, r2 []int
	for j := 1; j < i; j++ {
		r1 = append(r1, j)
	}
	for j := k - 1; j > i; j-- {
		r2 = append(r2, j)
	}
	region(r1)
	region(r2)
	return g
}

// TestAugmentLarge augments the shapes that expose quadratic corners:
// large stars, paths and nested triangles, checking the result (their
// speed is measured by BenchmarkAugment).
func TestAugmentLarge(t *testing.T) {
	for _, g := range []graphgen.Graph{
		graphgen.Star(100_000), graphgen.Path(100_000),
		graphgen.NestedTrianglesPlain(33_334), graphgen.NestedTriangles(33_334),
	} {
		augmented(t, g.Name, mustEmbed(t, g))
	}
}

// BenchmarkAugment times biconnect plus triangulateFaces on a fresh copy
// of the embedding (the copy is not timed). ns/edge should stay flat from
// 10^4 to 10^5: linear work.
func BenchmarkAugment(b *testing.B) {
	type benchCase struct {
		name string
		g    graphgen.Graph
	}
	var cases []benchCase
	for _, n := range []int{10_000, 100_000} {
		cases = append(cases,
			benchCase{fmt.Sprintf("star-%d", n), graphgen.Star(n)},
			benchCase{fmt.Sprintf("path-%d", n), graphgen.Path(n)},
			benchCase{fmt.Sprintf("nested-plain-%d", 3*(n/3)), graphgen.NestedTrianglesPlain(n / 3)},
			benchCase{fmt.Sprintf("random-tree-%d", n), graphgen.RandomTree(n, 1)},
		)
	}
	for _, c := range cases {
		b.Run(c.name, func(b *testing.B) {
			emb, ok := planarize.Embed(c.g.N, c.g.Edges)
			if !ok {
				b.Fatal("not planar")
			}
			b.ReportAllocs()
			iters, m := 0, 0
			for b.Loop() {
				b.StopTimer()
				work := emb.Clone()
				b.StartTimer()
				augment.Biconnect(work, noSkip)
				augment.TriangulateFaces(work, noSkip, nil)
				iters++
				m = work.M()
			}
			b.ReportMetric(float64(b.Elapsed().Nanoseconds())/float64(iters)/float64(m), "ns/edge")
		})
	}
}

// noSkip augments every component.
func noSkip(int32) bool { return false }
