package place

import (
	"fmt"
	"math/rand/v2"
	"reflect"
	"slices"
	"sync/atomic"
	"testing"

	"github.com/gridwood/gridwood/internal/graphgen"
	"github.com/gridwood/gridwood/place/geomcheck"
	"github.com/gridwood/gridwood/planarize"
)

// This file tests Layout. Every drawing goes through the independent exact
// checker place/geomcheck, and the Schnyder invariants are checked from
// the coordinates, the component boxes and the barycentric triples.

// mustEmbed embeds g or stops the test: every graph handed to it is planar.
func mustEmbed(tb testing.TB, g graphgen.Graph) *planarize.Embedding {
	tb.Helper()
	emb, ok := planarize.Embed(g.N, g.Edges)
	if !ok {
		tb.Fatalf("%s: planarize.Embed calls a planar graph non-planar", g.Name)
	}
	return emb
}

func drawingPoints(d *Drawing) []geomcheck.Point {
	pts := make([]geomcheck.Point, len(d.X))
	for v := range pts {
		pts[v] = geomcheck.Point{X: d.X[v], Y: d.Y[v]}
	}
	return pts
}

// checkCrossingFree asks geomcheck whether the straight-line drawing of
// edges is plane: First(pts, edges, 1) is empty exactly when it has no
// crossing, overlap, vertex inside an edge or shared point (geomcheck doc).
func checkCrossingFree(tb testing.TB, name string, d *Drawing, edges [][2]int32) {
	tb.Helper()
	probs, err := geomcheck.First(drawingPoints(d), edges, 1)
	if err != nil {
		tb.Errorf("%s: geomcheck rejects the drawing: %v", name, err)
		return
	}
	if len(probs) > 0 {
		p := probs[0]
		tb.Errorf("%s: geomcheck finds %v (%d, %d)%s", name, p.Kind, p.A, p.B, describeProblem(d, edges, p))
	}
}

func describeProblem(d *Drawing, edges [][2]int32, p geomcheck.Problem) string {
	at := func(v int32) string { return fmt.Sprintf("%d@(%d,%d)", v, d.X[v], d.Y[v]) }
	switch p.Kind {
	case geomcheck.Crossing, geomcheck.Overlap:
		a, b := edges[p.A], edges[p.B]
		return fmt.Sprintf(": edges %s-%s and %s-%s", at(a[0]), at(a[1]), at(b[0]), at(b[1]))
	case geomcheck.VertexOnEdge:
		e := edges[p.B]
		return fmt.Sprintf(": vertex %s on edge %s-%s", at(int32(p.A)), at(e[0]), at(e[1]))
	default:
		return fmt.Sprintf(": vertices %s and %s", at(int32(p.A)), at(int32(p.B)))
	}
}

// maxLexWork bounds vertices x edges for the quadratic check of Schnyder's
// weak barycentric condition, so that the suite stays fast.
const maxLexWork = 4_000_000

// checkDrawing checks everything a drawing of the n-vertex graph with the
// given edges must satisfy.
func checkDrawing(tb testing.TB, name string, n int, edges [][2]int32, d *Drawing) {
	tb.Helper()
	if len(d.X) != n || len(d.Y) != n || len(d.Barycentric) != n {
		tb.Fatalf("%s: %d vertices, but len(X), len(Y), len(bary) = %d, %d, %d", name, n, len(d.X), len(d.Y), len(d.Barycentric))
	}
	checkCrossingFree(tb, name, d, edges)
	label, members := graphgen.Components(n, edges)
	if len(d.Components) != len(members) {
		tb.Errorf("%s: %d components reported, the graph has %d", name, len(d.Components), len(members))
		return
	}
	// The whole drawing lies in [0, Width] x [0, Height] (Layout's doc).
	for v := range n {
		if d.X[v] < 0 || d.X[v] > d.Width || d.Y[v] < 0 || d.Y[v] > d.Height {
			tb.Errorf("%s: vertex %d at (%d,%d) outside [0,%d]x[0,%d]", name, v, d.X[v], d.Y[v], d.Width, d.Height)
			return
		}
	}
	for c, vs := range members {
		if !checkComponent(tb, name, c, vs, d) {
			return
		}
	}
	checkBoxesDisjoint(tb, name, d)
	// Schnyder's weak barycentric condition, per component.
	work := 0
	for _, vs := range members {
		if len(vs) >= 3 {
			work += len(vs)
		}
	}
	if work*len(edges) <= maxLexWork {
		checkWeakBarycentric(tb, name, label, members, edges, d)
	}
}

// checkComponent checks the box of component c and the coordinates of its
// vertices vs.
func checkComponent(tb testing.TB, name string, c int, vs []int32, d *Drawing) bool {
	tb.Helper()
	b := d.Components[c]
	nc := int64(len(vs))
	if b.Vertices != len(vs) {
		tb.Errorf("%s: component %d (smallest vertex %d) has %d vertices, reported %d", name, c, vs[0], len(vs), b.Vertices)
		return false
	}
	if b.W < 0 || b.H < 0 || b.X0 < 0 || b.Y0 < 0 || b.X0+b.W > d.Width || b.Y0+b.H > d.Height {
		tb.Errorf("%s: component %d box %+v not inside [0,%d]x[0,%d]", name, c, b, d.Width, d.Height)
		return false
	}
	for _, v := range vs {
		x, y := d.X[v]-b.X0, d.Y[v]-b.Y0
		if x < 0 || x > b.W || y < 0 || y > b.H {
			tb.Errorf("%s: vertex %d at (%d,%d) outside its component box %+v", name, v, d.X[v], d.Y[v], b)
			return false
		}
	}
	switch {
	case nc == 1:
		// A single vertex is a point at the corner of an empty box.
		if b.W != 0 || b.H != 0 || b.Barycentre || d.Barycentric[vs[0]] != [3]int32{} {
			tb.Errorf("%s: one-vertex component %d: box %+v, bary %v", name, c, b, d.Barycentric[vs[0]])
			return false
		}
	case nc == 2:
		// Two vertices: a unit segment, its ends at opposite box corners.
		u, v := vs[0], vs[1]
		unit := (b.W == 1 && b.H == 0) || (b.W == 0 && b.H == 1)
		ends := [2]int64{d.X[u] + d.Y[u], d.X[v] + d.Y[v]}
		lo := b.X0 + b.Y0
		if !unit || b.Barycentre || min(ends[0], ends[1]) != lo || max(ends[0], ends[1]) != lo+1 ||
			d.Barycentric[u] != [3]int32{} || d.Barycentric[v] != [3]int32{} {
			tb.Errorf("%s: two-vertex component %d: box %+v, ends (%d,%d) (%d,%d)", name, c, b, d.X[u], d.Y[u], d.X[v], d.Y[v])
			return false
		}
	default:
		// W. Schnyder, "Embedding planar graphs on the grid", SODA 1990:
		// the weak barycentric coordinates by vertex counts are >= 0 and
		// sum to n-1, and the drawing at (x1, x2) fits in the
		// (n-2) x (n-2) grid.
		if !b.Barycentre {
			tb.Errorf("%s: component %d with %d vertices not placed by the barycentric method", name, c, nc)
			return false
		}
		if b.W > nc-2 || b.H > nc-2 {
			tb.Errorf("%s: component %d with %d vertices has box %dx%d, beyond Schnyder's (n-2)x(n-2)", name, c, nc, b.W, b.H)
			return false
		}
		for _, v := range vs {
			x, y := d.X[v]-b.X0, d.Y[v]-b.Y0
			t := d.Barycentric[v]
			if t[0] < 0 || t[1] < 0 || t[2] < 0 || int64(t[0])+int64(t[1])+int64(t[2]) != nc-1 {
				tb.Errorf("%s: vertex %d of a %d-vertex component has barycentric %v (Schnyder 1990: >= 0, sum n-1)", name, v, nc, t)
				return false
			}
			if x > nc-2 || y > nc-2 || x != int64(t[0]) || y != int64(t[1]) {
				tb.Errorf("%s: vertex %d at relative (%d,%d), barycentric %v: not at (x1, x2) in [0,n-2]^2", name, v, x, y, t)
				return false
			}
		}
	}
	return true
}

// checkBoxesDisjoint checks that no two component boxes share a point.
func checkBoxesDisjoint(tb testing.TB, name string, d *Drawing) {
	tb.Helper()
	idx := make([]int, len(d.Components))
	for i := range idx {
		idx[i] = i
	}
	cs := d.Components
	slices.SortFunc(idx, func(a, b int) int { return int(cs[a].X0 - cs[b].X0) })
	// Sweep in x: only boxes whose x-ranges meet are compared.
	for i, a := range idx {
		for _, b := range idx[i+1:] {
			if cs[b].X0 > cs[a].X0+cs[a].W {
				break
			}
			if cs[b].Y0 <= cs[a].Y0+cs[a].H && cs[a].Y0 <= cs[b].Y0+cs[b].H {
				tb.Errorf("%s: component boxes %d %+v and %d %+v meet", name, a, cs[a], b, cs[b])
				return
			}
		}
	}
}

// lexLess compares (a0, a1) < (b0, b1) lexicographically.
func lexLess(a0, a1, b0, b1 int32) bool { return a0 < b0 || (a0 == b0 && a1 < b1) }

// checkWeakBarycentric checks the defining condition of a weak barycentric
// representation (Schnyder, SODA 1990, from memory): for every edge xy and
// every vertex z other than x and y of its component there is k with
// (x_k, x_k+1) and (y_k, y_k+1) both lexicographically below
// (z_k, z_k+1), indices mod 3. It holds for the dummy edges of the
// triangulation, so in particular for the input's edges.
func checkWeakBarycentric(tb testing.TB, name string, label []int, members [][]int32, edges [][2]int32, d *Drawing) {
	tb.Helper()
	b := d.Barycentric
	for _, e := range edges {
		x, y := e[0], e[1]
		vs := members[label[x]]
		if len(vs) < 3 {
			continue
		}
		for _, z := range vs {
			if z == x || z == y {
				continue
			}
			ok := false
			for k := range 3 {
				k1 := (k + 1) % 3
				if lexLess(b[x][k], b[x][k1], b[z][k], b[z][k1]) && lexLess(b[y][k], b[y][k1], b[z][k], b[z][k1]) {
					ok = true
					break
				}
			}
			if !ok {
				tb.Errorf("%s: edge %d-%d (%v, %v) and vertex %d %v violate the weak barycentric condition", name, x, y, b[x], b[y], z, b[z])
				return
			}
		}
	}
}

// countFaces walks the faces of emb with FaceNext and returns, for each
// component label, the number of faces (dart cycles) it has.
func countFaces(emb *planarize.Embedding, label []int, comps int) []int {
	faces := make([]int, comps)
	seen := make([]bool, 2*emb.M())
	for d := range seen {
		if seen[d] {
			continue
		}
		faces[label[emb.Tail(int32(d))]]++
		for x := int32(d); !seen[x]; x = emb.FaceNext(x) {
			seen[x] = true
		}
	}
	return faces
}

// checkEuler checks Euler's formula V - E + F = 2 for every component of
// emb with at least one edge (SOURCES.md: Euler), counting faces by walking
// them; an isolated vertex has no darts.
func checkEuler(tb testing.TB, name string, emb *planarize.Embedding) {
	tb.Helper()
	edges := emb.Edges()
	label, members := graphgen.Components(emb.N(), edges)
	faces := countFaces(emb, label, len(members))
	ecount := make([]int, len(members))
	for _, e := range edges {
		ecount[label[e[0]]]++
	}
	isolated := 0
	for c, vs := range members {
		if ecount[c] == 0 {
			isolated++
			continue
		}
		if len(vs)-ecount[c]+faces[c] != 2 {
			tb.Errorf("%s: component %d: V=%d E=%d F=%d, Euler wants V-E+F=2", name, c, len(vs), ecount[c], faces[c])
		}
	}
	// The embedding's own count, with an isolated vertex as one face.
	total := isolated
	for _, f := range faces {
		total += f
	}
	if emb.Faces() != total {
		tb.Errorf("%s: Embedding.Faces() = %d, walking finds %d", name, emb.Faces(), total)
	}
}

// layoutAndCheck embeds g, lays it out and checks the drawing and that the
// embedding was left alone.
func layoutAndCheck(tb testing.TB, g graphgen.Graph) *Drawing {
	tb.Helper()
	emb := mustEmbed(tb, g)
	return layoutEmbeddingAndCheck(tb, g.Name, emb)
}

func layoutEmbeddingAndCheck(tb testing.TB, name string, emb *planarize.Embedding) *Drawing {
	tb.Helper()
	before := snapshot(emb)
	d, err := Layout(emb, Options{})
	if err != nil {
		tb.Fatalf("%s: Layout: %v", name, err)
	}
	if after := snapshot(emb); !reflect.DeepEqual(before, after) {
		tb.Errorf("%s: Layout modified its input embedding", name)
	}
	checkDrawing(tb, name, emb.N(), emb.Edges(), d)
	return d
}

// embeddingState is everything observable about an embedding.
type embeddingState struct {
	N, M        int
	Edges       [][2]int32
	Next, Prev  []int32
	First, Deg  []int32
	FaceNextArr []int32
}

func snapshot(emb *planarize.Embedding) embeddingState {
	s := embeddingState{N: emb.N(), M: emb.M(), Edges: emb.Edges()}
	for d := int32(0); int(d) < 2*emb.M(); d++ {
		s.Next = append(s.Next, emb.Next(d))
		s.Prev = append(s.Prev, emb.Prev(d))
		s.FaceNextArr = append(s.FaceNextArr, emb.FaceNext(d))
	}
	for v := int32(0); int(v) < emb.N(); v++ {
		s.First = append(s.First, emb.First(v))
		s.Deg = append(s.Deg, int32(emb.Degree(v)))
	}
	return s
}

// named returns g with its name replaced.
func named(g graphgen.Graph, name string) graphgen.Graph {
	g.Name = name
	return g
}

// TestLayoutFamilies draws the named families and checks every drawing.
func TestLayoutFamilies(t *testing.T) {
	for _, g := range graphgen.Zoo() {
		t.Run(g.Name, func(t *testing.T) {
			emb := mustEmbed(t, g)
			checkEuler(t, g.Name, emb)
			layoutEmbeddingAndCheck(t, g.Name, emb)
		})
	}
}

// TestLayoutPlatonic checks the Platonic solids against their handbook
// counts and draws them.
func TestLayoutPlatonic(t *testing.T) {
	// (V, E, F) and face length P of the Schläfli symbol {P, Q}: handbook
	// facts (graphgen.PlatonicSolids: Coxeter, Regular Polytopes, table I).
	// A 3-connected planar graph has a unique embedding (H. Whitney 1933,
	// from memory), so every face has length P.
	for _, tt := range graphgen.PlatonicSolids() {
		t.Run(tt.Name, func(t *testing.T) {
			if tt.N != tt.V || len(tt.Edges) != tt.E {
				t.Fatalf("graphgen gives V=%d E=%d, handbook V=%d E=%d", tt.N, len(tt.Edges), tt.V, tt.E)
			}
			emb := mustEmbed(t, tt.Graph)
			checkEuler(t, tt.Name, emb)
			if emb.Faces() != tt.F {
				t.Errorf("embedding has %d faces, handbook F=%d", emb.Faces(), tt.F)
			}
			for _, size := range faceSizes(emb) {
				if size != tt.P {
					t.Errorf("face of length %d, the solid's faces have %d", size, tt.P)
					break
				}
			}
			d := layoutEmbeddingAndCheck(t, tt.Name, emb)
			// One component, drawn in Schnyder's (n-2) x (n-2) grid.
			if len(d.Components) != 1 || d.Width > int64(tt.V-2) || d.Height > int64(tt.V-2) {
				t.Errorf("drawing %dx%d with %d components, want one component within %dx%d",
					d.Width, d.Height, len(d.Components), tt.V-2, tt.V-2)
			}
		})
	}
}

// faceSizes returns the length of every face of emb.
func faceSizes(emb *planarize.Embedding) []int {
	var sizes []int
	seen := make([]bool, 2*emb.M())
	for d := range seen {
		k := 0
		for x := int32(d); !seen[x]; x = emb.FaceNext(x) {
			seen[x] = true
			k++
		}
		if k > 0 {
			sizes = append(sizes, k)
		}
	}
	return sizes
}

// TestLayoutSmallCases pins the drawings whose shape is forced.
func TestLayoutSmallCases(t *testing.T) {
	tests := []struct {
		g    graphgen.Graph
		w, h int64 // exact extent
	}{
		// n = 0: nothing to draw (common practice: an empty drawing).
		{graphgen.Graph{N: 0, Name: "empty"}, 0, 0},
		// One vertex: a point.
		{graphgen.Graph{N: 1, Name: "one"}, 0, 0},
		// One edge: a unit segment.
		{graphgen.Path(2), 1, 0},
		// A triangle in Schnyder's 1 x 1 grid (n-2 = 1): the three
		// points (1,1), (0,1), (1,0) of the outer-vertex coordinates
		// (n-2, 1, 0), (0, n-2, 1), (1, 0, n-2) (Schnyder 1990).
		{graphgen.Cycle(3), 1, 1},
	}
	for _, tt := range tests {
		d := layoutAndCheck(t, tt.g)
		if d.Width != tt.w || d.Height != tt.h {
			t.Errorf("%s: extent %dx%d, want %dx%d", tt.g.Name, d.Width, d.Height, tt.w, tt.h)
		}
	}
}

// TestLayoutWorkedExamples compares the barycentric triples of the two
// smallest triangulations with values worked out by hand from Schnyder's
// definition x_i(v) = |R_i(v)| - |P_{i-1}(v)| with the outer vertices at
// (n-2, 1, 0), (0, n-2, 1), (1, 0, n-2) (Schnyder, SODA 1990; from
// memory). In K4 each region of the inner vertex is a triangle of three
// vertices and each path has two, so it gets (1, 1, 1).
func TestLayoutWorkedExamples(t *testing.T) {
	tests := []struct {
		g    graphgen.Graph
		want [][3]int32
	}{
		{graphgen.Cycle(3), [][3]int32{{1, 1, 0}, {0, 1, 1}, {1, 0, 1}}},
		{graphgen.Tetrahedron(), [][3]int32{{2, 1, 0}, {0, 2, 1}, {1, 0, 2}, {1, 1, 1}}},
	}
	cmp := func(a, b [3]int32) int { return slices.Compare(a[:], b[:]) }
	for _, tt := range tests {
		d := layoutAndCheck(t, tt.g)
		got := slices.SortedFunc(slices.Values(d.Barycentric), cmp)
		want := slices.SortedFunc(slices.Values(tt.want), cmp)
		if !slices.Equal(got, want) {
			t.Errorf("%s: barycentric triples %v, worked by hand %v", tt.g.Name, got, want)
		}
	}
}

// TestLayoutRandomTriangulation draws 1000 random maximal planar graphs
// with n spread over 4..500, and a random edge subset of each.
func TestLayoutRandomTriangulation(t *testing.T) {
	const count = 1000
	keeps := []float64{0.1, 0.35, 0.6, 0.85, 0.97}
	var ran atomic.Int64
	t.Cleanup(func() { // after both parallel halves
		if got := ran.Load(); got != count && !t.Failed() {
			t.Errorf("checked %d graphs, want %d", got, count)
		}
	})
	for half := range 2 { // two halves for the two cores
		t.Run(fmt.Sprintf("half-%d", half), func(t *testing.T) {
			t.Parallel()
			for i := half; i < count; i += 2 {
				n := 4 + i*497/count // 4 .. 500
				seed := uint64(7000 + i)
				g := graphgen.RandomTriangulation(n, seed)
				// Euler: a maximal planar graph on n >= 3 vertices has 3n-6 edges.
				if len(g.Edges) != 3*n-6 {
					t.Fatalf("%s: %d edges, Euler wants %d", g.Name, len(g.Edges), 3*n-6)
				}
				layoutAndCheck(t, g)
				keep := keeps[i%len(keeps)]
				sub := graphgen.RandomPlanar(n, keep, seed)
				layoutAndCheck(t, named(sub, fmt.Sprintf("%s-keep%.2f", g.Name, keep)))
				if t.Failed() {
					return
				}
				ran.Add(1)
			}
		})
	}
}

// TestLayoutKeepsEmbedding checks that Layout leaves its input alone, also
// when it is called twice on the same embedding.
func TestLayoutKeepsEmbedding(t *testing.T) {
	for _, g := range []graphgen.Graph{
		graphgen.Star(30), graphgen.Path(40), graphgen.Grid(8, 8),
		graphgen.NestedTrianglesPlain(20), graphgen.RandomPlanar(300, 0.5, 3),
		graphgen.DisjointUnion(graphgen.Cycle(5), graphgen.RandomTree(50, 2), graphgen.Graph{N: 3}),
	} {
		emb := mustEmbed(t, g)
		before := snapshot(emb)
		for range 2 {
			if _, err := Layout(emb, Options{}); err != nil {
				t.Fatalf("%s: %v", g.Name, err)
			}
		}
		if !reflect.DeepEqual(before, snapshot(emb)) {
			t.Errorf("%s: Layout changed Next/Prev/First/M of its input", g.Name)
		}
	}
}

// TestLayoutOtherRotations draws planar rotation systems that Embed would
// not necessarily produce: mirror images of embeddings, trees with random
// rotations, and embeddings taken from a geometric drawing, so Layout is
// not tested only on the embedder's habits.
func TestLayoutOtherRotations(t *testing.T) {
	for _, g := range []graphgen.Graph{
		graphgen.Octahedron(), graphgen.Grid(9, 6), graphgen.NestedTrianglesPlain(12),
		graphgen.RandomPlanar(200, 0.6, 21), graphgen.RandomTriangulation(150, 22),
		graphgen.TriangulatedGrid(6, 6), graphgen.Wheel(9),
	} {
		emb := mustEmbed(t, g)
		m := mirrored(t, emb)
		checkEuler(t, g.Name+"-mirror", m)
		layoutEmbeddingAndCheck(t, g.Name+"-mirror", m)
	}
	rng := rand.New(rand.NewPCG(5, 5))
	for i, n := range []int{3, 4, 8, 30, 300} {
		g := graphgen.RandomTree(n, uint64(40+i))
		// Every rotation system of a tree is planar: one face, and
		// V - E + F = n - (n-1) + 1 = 2 (Euler).
		emb := withRotation(t, n, g.Edges, func(v int32, darts []int32) {
			rng.Shuffle(len(darts), func(a, b int) { darts[a], darts[b] = darts[b], darts[a] })
		})
		checkEuler(t, g.Name+"-random-rotation", emb)
		layoutEmbeddingAndCheck(t, g.Name+"-random-rotation", emb)
	}
	// A grid and nested triangles embedded from their natural drawings.
	for _, k := range []int{2, 5, 12} {
		g := graphgen.Grid(k, k+3)
		pts := make([]geomcheck.Point, g.N)
		for v := range pts {
			pts[v] = geomcheck.Point{X: int64(v % (k + 3)), Y: int64(v / (k + 3))}
		}
		emb := fromPoints(t, g, pts)
		checkEuler(t, g.Name+"-natural", emb)
		layoutEmbeddingAndCheck(t, g.Name+"-natural", emb)
	}
	for _, levels := range []int{2, 6, 20} {
		for _, g := range []graphgen.Graph{graphgen.NestedTriangles(levels), graphgen.NestedTrianglesPlain(levels)} {
			emb := fromPoints(t, g, nestedTrianglePoints(levels))
			checkEuler(t, g.Name+"-natural", emb)
			layoutEmbeddingAndCheck(t, g.Name+"-natural", emb)
		}
	}
}

// nestedTrianglePoints draws ring i of NestedTriangles as the outer
// triangle (0,0), (6L,0), (3L,6L) shrunk by (L-i)/L towards its centroid
// (3L, 2L): homothetic rings, so every band quadrilateral is convex and
// either diagonal lies inside it.
func nestedTrianglePoints(levels int) []geomcheck.Point {
	l := int64(levels)
	pts := make([]geomcheck.Point, 3*levels)
	for i := range l {
		pts[3*i] = geomcheck.Point{X: 3 * i, Y: 2 * i}
		pts[3*i+1] = geomcheck.Point{X: 6*l - 3*i, Y: 2 * i}
		pts[3*i+2] = geomcheck.Point{X: 3 * l, Y: 6*l - 4*i}
	}
	return pts
}

// withRotation builds an embedding of the graph with, around every vertex,
// the darts in the order left by arrange, which receives them in order of
// edge index. Dart 2e leaves edges[e][0], dart 2e+1 leaves edges[e][1], as
// in planarize.Embedding. Quadratic in the degree; for small graphs.
func withRotation(tb testing.TB, n int, edges [][2]int32, arrange func(v int32, darts []int32)) *planarize.Embedding {
	tb.Helper()
	rot := make([][]int32, n)
	for e, uv := range edges {
		rot[uv[0]] = append(rot[uv[0]], int32(2*e))
		rot[uv[1]] = append(rot[uv[1]], int32(2*e+1))
	}
	pos := make([]int, 2*len(edges))
	for v := range rot {
		arrange(int32(v), rot[v])
		for i, d := range rot[v] {
			pos[d] = i
		}
	}
	placed := make([]bool, 2*len(edges))
	// pred finds the placed dart that comes last before d in its target
	// rotation, so that inserting after it keeps the target order.
	pred := func(d int32, v int32) int32 {
		r := rot[v]
		for j := 1; j < len(r); j++ {
			if p := r[(pos[d]-j+len(r))%len(r)]; placed[p] {
				return p
			}
		}
		return -1
	}
	emb := planarize.NewEmbedding(n)
	for e, uv := range edges {
		a, b := pred(int32(2*e), uv[0]), pred(int32(2*e+1), uv[1])
		if got := emb.AddEdge(a, b, uv[0], uv[1]); got != e {
			tb.Fatalf("AddEdge numbered edge %d as %d", e, got)
		}
		placed[2*e], placed[2*e+1] = true, true
	}
	for v := range rot {
		if len(rot[v]) == 0 {
			continue
		}
		d := rot[v][0]
		for i := range rot[v] {
			if d != rot[v][i] {
				tb.Fatalf("withRotation: vertex %d rotation not as asked", v)
			}
			d = emb.Next(d)
		}
	}
	return emb
}

// withNeighbourOrder embeds g with the neighbours of vertex v in the
// counter-clockwise order order[v].
func withNeighbourOrder(tb testing.TB, g graphgen.Graph, order [][]int32) *planarize.Embedding {
	tb.Helper()
	head := func(d int32) int32 { return g.Edges[d>>1][1-d&1] }
	return withRotation(tb, g.N, g.Edges, func(v int32, darts []int32) {
		slices.SortFunc(darts, func(p, q int32) int {
			return slices.Index(order[v], head(p)) - slices.Index(order[v], head(q))
		})
	})
}

// mirrored returns emb with every rotation reversed: the mirror image,
// planar when emb is.
func mirrored(tb testing.TB, emb *planarize.Embedding) *planarize.Embedding {
	tb.Helper()
	return withRotation(tb, emb.N(), emb.Edges(), func(v int32, darts []int32) {
		f := emb.First(v)
		if f < 0 {
			return
		}
		darts = darts[:0]
		for d := f; ; {
			darts = append(darts, d)
			if d = emb.Prev(d); d == f {
				break
			}
		}
	})
}

// fromPoints embeds g with the rotations of its straight-line drawing at
// pts (counter-clockwise by angle, compared exactly), which must be plane.
func fromPoints(tb testing.TB, g graphgen.Graph, pts []geomcheck.Point) *planarize.Embedding {
	tb.Helper()
	if probs, err := geomcheck.First(pts, g.Edges, 1); err != nil || len(probs) > 0 {
		tb.Fatalf("%s: the given drawing is not plane: %v %v", g.Name, probs, err)
	}
	dir := func(d int32) (int64, int64) {
		e := g.Edges[d>>1]
		a, b := e[d&1], e[1-d&1]
		return pts[b].X - pts[a].X, pts[b].Y - pts[a].Y
	}
	upper := func(x, y int64) bool { return y > 0 || (y == 0 && x > 0) }
	return withRotation(tb, g.N, g.Edges, func(v int32, darts []int32) {
		slices.SortFunc(darts, func(p, q int32) int {
			px, py := dir(p)
			qx, qy := dir(q)
			if up, uq := upper(px, py), upper(qx, qy); up != uq {
				if up {
					return -1
				}
				return 1
			}
			switch c := px*qy - py*qx; {
			case c > 0:
				return -1
			case c < 0:
				return 1
			}
			return 0
		})
	})
}

// TestLayoutDeterministic checks that the same input gives the same
// drawing, also from an embedding built again from the same edge list
// (RULES: output is deterministic).
func TestLayoutDeterministic(t *testing.T) {
	for _, g := range []graphgen.Graph{
		graphgen.RandomTriangulation(400, 1), graphgen.RandomPlanar(400, 0.4, 2),
		graphgen.Grid(20, 20), graphgen.NestedTrianglesPlain(50),
		graphgen.DisjointUnion(graphgen.Star(20), graphgen.Graph{N: 5}, graphgen.RandomTree(80, 3), graphgen.Cube()),
	} {
		first := layoutAndCheck(t, g)
		for range 3 {
			again, err := Layout(mustEmbed(t, g), Options{})
			if err != nil {
				t.Fatal(err)
			}
			if !reflect.DeepEqual(first, again) {
				t.Errorf("%s: Layout gives different drawings for the same input", g.Name)
				break
			}
		}
	}
}

// TestLayoutInvalidEmbeddings hands Layout rotation systems that are not
// plane embeddings of simple graphs. Layout must not panic (RULES: never
// panic on any input); it must return an error, or else a drawing that
// geomcheck accepts.
func TestLayoutInvalidEmbeddings(t *testing.T) {
	rng := rand.New(rand.NewPCG(9, 9))
	var cases []struct {
		name string
		emb  *planarize.Embedding
	}
	add := func(name string, emb *planarize.Embedding) {
		cases = append(cases, struct {
			name string
			emb  *planarize.Embedding
		}{name, emb})
	}
	// K4 with the rotations 0: (1 2 3), 1: (0 2 3), 2: (0 3 1), 3: (0 1 2),
	// counter-clockwise: two faces, so V - E + F = 0 and it lies on the
	// torus, not the sphere (Euler).
	k4 := graphgen.Tetrahedron()
	add("k4-torus", withRotation(t, k4.N, k4.Edges, func(v int32, darts []int32) {
		if v == 2 {
			darts[1], darts[2] = darts[2], darts[1]
		}
	}))
	// K3,3 (not planar at all) with the rotations 0: (3 4 5), 1: (3 4 5),
	// 2: (3 5 4), 3: (0 1 2), 4: (0 1 2), 5: (0 2 1): three faces, so
	// V - E + F = 0 (a torus). No plane drawing exists (Kuratowski).
	k33 := graphgen.CompleteBipartite(3, 3)
	add("k33-torus", withNeighbourOrder(t, k33, [][]int32{{3, 4, 5}, {3, 4, 5}, {3, 5, 4}, {0, 1, 2}, {0, 1, 2}, {0, 2, 1}}))
	// Random rotation systems of planar graphs: most have higher genus.
	for i, g := range []graphgen.Graph{
		graphgen.Tetrahedron(), graphgen.Octahedron(), graphgen.Cube(), graphgen.Icosahedron(),
		graphgen.RandomTriangulation(12, 3), graphgen.Grid(3, 4), graphgen.Wheel(6),
		graphgen.Complete(5), graphgen.CompleteBipartite(3, 3), graphgen.Petersen(),
	} {
		for j := range 6 {
			emb := withRotation(t, g.N, g.Edges, func(v int32, darts []int32) {
				rng.Shuffle(len(darts), func(a, b int) { darts[a], darts[b] = darts[b], darts[a] })
			})
			add(fmt.Sprintf("%s-rotation-%d-%d", g.Name, i, j), emb)
		}
	}
	// A loop and a repeated pair, which AddEdge accepts.
	loop := planarize.NewEmbedding(3)
	loop.AddEdge(-1, -1, 0, 1)
	loop.AddEdge(loop.First(1), -1, 1, 2)
	loop.AddEdge(loop.First(2), loop.First(2), 2, 2)
	add("loop", loop)
	par := planarize.NewEmbedding(3)
	par.AddEdge(-1, -1, 0, 1)
	par.AddEdge(par.First(1), -1, 1, 2)
	par.AddEdge(par.First(2), par.First(0), 2, 0)
	par.AddEdge(par.First(0), par.First(1), 0, 1)
	add("repeated-pair", par)
	for _, c := range cases {
		func() {
			defer func() {
				if r := recover(); r != nil {
					t.Errorf("%s: Layout panics: %v", c.name, r)
				}
			}()
			edges := c.emb.Edges()
			d, err := Layout(c.emb, Options{})
			if err != nil {
				return
			}
			if len(d.X) != c.emb.N() || len(d.Y) != c.emb.N() {
				t.Errorf("%s: drawing has %d points for %d vertices", c.name, len(d.X), c.emb.N())
				return
			}
			checkCrossingFree(t, c.name+" (accepted without error)", d, edges)
		}()
	}
}

// benchLayout times Layout on g and reports ns per edge as well.
func benchLayout(b *testing.B, g graphgen.Graph) {
	emb, ok := planarize.Embed(g.N, g.Edges)
	if !ok {
		b.Fatalf("%s: not planar", g.Name)
	}
	b.ReportAllocs()
	b.ResetTimer()
	iters := 0
	for b.Loop() {
		if _, err := Layout(emb, Options{}); err != nil {
			b.Fatal(err)
		}
		iters++
	}
	b.ReportMetric(float64(b.Elapsed().Nanoseconds())/float64(iters)/float64(max(1, emb.M())), "ns/edge")
}

// BenchmarkLayout times Layout alone, the embedding built beforehand.
func BenchmarkLayout(b *testing.B) {
	cases := []struct {
		name string
		gen  func() graphgen.Graph
	}{
		{"maximal-1e4", func() graphgen.Graph { return graphgen.RandomTriangulation(10_000, 1) }},
		{"maximal-1e5", func() graphgen.Graph { return graphgen.RandomTriangulation(100_000, 1) }},
		{"maximal-1e6", func() graphgen.Graph { return graphgen.RandomTriangulation(1_000_000, 1) }},
		{"grid-1000x1000", func() graphgen.Graph { return graphgen.Grid(1000, 1000) }},
		{"star-1e6", func() graphgen.Graph { return graphgen.Star(1_000_000) }},
		{"path-1e6", func() graphgen.Graph { return graphgen.Path(1_000_000) }},
		{"nested-3e5", func() graphgen.Graph { return graphgen.NestedTriangles(100_000) }},
		{"nested-plain-3e5", func() graphgen.Graph { return graphgen.NestedTrianglesPlain(100_000) }},
	}
	for _, c := range cases {
		b.Run(c.name, func(b *testing.B) { benchLayout(b, c.gen()) })
	}
}

// recorder is a testing.TB that only notes failures, for checking that
// the checks above can fail.
type recorder struct {
	testing.TB
	failed bool
	msg    string
}

type fatalSentinel struct{}

func (r *recorder) Helper() {}
func (r *recorder) Errorf(format string, args ...any) {
	if !r.failed {
		r.msg = fmt.Sprintf(format, args...)
	}
	r.failed = true
}
func (r *recorder) Fatalf(format string, args ...any) {
	r.Errorf(format, args...)
	panic(fatalSentinel{})
}

// rejects reports whether check fails on a recorder.
func rejects(t *testing.T, check func(tb testing.TB)) (bool, string) {
	r := &recorder{TB: t}
	func() {
		defer func() {
			if p := recover(); p != nil {
				if _, ok := p.(fatalSentinel); !ok {
					panic(p)
				}
			}
		}()
		check(r)
	}()
	return r.failed, r.msg
}

// TestCheckersCatchDefects spoils correct drawings in small ways and
// makes sure checkDrawing notices each one, so that the checks above are
// not vacuous.
func TestCheckersCatchDefects(t *testing.T) {
	g := graphgen.DisjointUnion(graphgen.RandomTriangulation(30, 1), graphgen.Path(2),
		graphgen.Graph{N: 1}, graphgen.RandomPlanar(40, 0.7, 2))
	emb := mustEmbed(t, g)
	edges := emb.Edges()
	good, err := Layout(emb, Options{})
	if err != nil {
		t.Fatal(err)
	}
	if ok, msg := rejects(t, func(tb testing.TB) { checkDrawing(tb, "good", g.N, edges, good) }); ok {
		t.Fatalf("the correct drawing is rejected: %s", msg)
	}
	clone := func() *Drawing {
		d := *good
		d.X, d.Y = slices.Clone(good.X), slices.Clone(good.Y)
		d.Barycentric = slices.Clone(good.Barycentric)
		d.Components = slices.Clone(good.Components)
		return &d
	}
	// Vertex u is a vertex of the triangulation with a neighbour v.
	u, v := edges[0][0], edges[0][1]
	spoil := []struct {
		name string
		fn   func(d *Drawing)
	}{
		{"vertex-onto-neighbour", func(d *Drawing) { d.X[u], d.Y[u] = d.X[v], d.Y[v] }},
		{"swap-two-vertices", func(d *Drawing) {
			d.X[u], d.X[v], d.Y[u], d.Y[v] = d.X[v], d.X[u], d.Y[v], d.Y[u]
			d.Barycentric[u], d.Barycentric[v] = d.Barycentric[v], d.Barycentric[u]
		}},
		{"bary-sum", func(d *Drawing) { d.Barycentric[u][2]++ }},
		{"bary-negative", func(d *Drawing) {
			d.Barycentric[u][2] -= d.Barycentric[u][2] + 1
			d.Barycentric[u][0] += d.Barycentric[u][2] + 1
		}},
		{"not-at-bary", func(d *Drawing) { d.Barycentric[u][0], d.Barycentric[u][2] = d.Barycentric[u][2], d.Barycentric[u][0] }},
		{"box-too-wide", func(d *Drawing) { d.Components[0].W = 29 }},
		{"width-too-small", func(d *Drawing) { d.Width-- }},
		{"boxes-meet", func(d *Drawing) {
			dx := d.Components[1].X0 - d.Components[0].X0
			dy := d.Components[1].Y0 - d.Components[0].Y0
			for _, w := range []int{30, 31} {
				d.X[w] -= dx
				d.Y[w] -= dy
			}
			d.Components[1].X0 -= dx
			d.Components[1].Y0 -= dy
		}},
		{"long-segment", func(d *Drawing) { d.X[31]++; d.Components[1].W++ }},
		{"vertex-count", func(d *Drawing) { d.Components[2].Vertices = 2 }},
		{"component-missing", func(d *Drawing) { d.Components = d.Components[:len(d.Components)-1] }},
	}
	for _, s := range spoil {
		d := clone()
		s.fn(d)
		if ok, _ := rejects(t, func(tb testing.TB) { checkDrawing(tb, s.name, g.N, edges, d) }); !ok {
			t.Errorf("%s: the spoiled drawing passes checkDrawing", s.name)
		}
	}
	// The weak barycentric check alone catches two swapped triples.
	d := clone()
	label, members := graphgen.Components(g.N, edges)
	d.Barycentric[u], d.Barycentric[v] = d.Barycentric[v], d.Barycentric[u]
	if ok, _ := rejects(t, func(tb testing.TB) { checkWeakBarycentric(tb, "swapped", label, members, edges, d) }); !ok {
		t.Errorf("swapping two barycentric triples passes the weak barycentric check")
	}
}
