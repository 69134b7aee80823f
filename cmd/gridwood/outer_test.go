package main

import (
	"math/big"
	"slices"
	"strings"
	"testing"

	"gonum.org/v1/gonum/graph/formats/dot"

	"github.com/gridwood/gridwood/dotio"
	"github.com/gridwood/gridwood/place/geomcheck"
)

// This file checks README.md's "Grid drawings" on --outer: with --outer A,B,C the
// named nodes lie on the outer boundary of their component's drawing. The
// check is geometric and independent of package place: the faces of the
// output drawing are traced from the angular order of the edges at each
// node (a plane straight-line drawing's rotation system; faces are the
// orbits of "next dart after u->v is v->w, w the neighbour of v just
// clockwise of u"), and the outer face is the one traversed with the
// opposite orientation to all the others (common practice: with this rule
// every bounded face is walked counter-clockwise, so positive shoelace area,
// and the unbounded one clockwise). Euler's formula V - E + F = 2 per
// component confirms the tracing.

// outerDrawing is a laid-out graph read back from the output.
type outerDrawing struct {
	index map[string]int // node name to vertex
	pts   []geomcheck.Point
	edges [][2]int32
}

// readOuterDrawing takes the nodes and edges from the input (one graph)
// and the positions from the output.
func readOuterDrawing(t *testing.T, in, out string) outerDrawing {
	t.Helper()
	src, err := dotio.Read([]byte(in), dotio.ReadOptions{Name: "in"})
	if err != nil || len(src.Graphs) != 1 {
		t.Fatalf("test input: %v", err)
	}
	g := src.Graphs[0]
	parsed, err := dot.ParseString(out)
	if err != nil || len(parsed.Graphs) != 1 {
		t.Fatalf("output does not parse as one graph: %v\n%s", err, out)
	}
	pos := positions(t, parsed.Graphs[0])
	d := outerDrawing{index: map[string]int{}}
	for v, n := range g.Nodes {
		p, ok := pos[n.ID]
		if !ok {
			t.Fatalf("node %s has no pos", n.ID)
		}
		d.index[n.Name] = v
		d.pts = append(d.pts, geomcheck.Point{X: p[0], Y: p[1]})
	}
	for _, e := range g.Edges {
		d.edges = append(d.edges, [2]int32{e.From, e.To})
	}
	// Every drawing must be crossing-free, and the face tracing below
	// relies on it (no two edges leave a node in the same direction).
	probs, err := geomcheck.First(d.pts, d.edges, 1)
	if err != nil || len(probs) > 0 {
		t.Fatalf("drawing is not clean: %v %v\n%s", probs, err, out)
	}
	return d
}

// half is 0 for directions with angle in [0, π) and 1 for [π, 2π).
func half(d geomcheck.Point) int {
	if d.Y > 0 || d.Y == 0 && d.X > 0 {
		return 0
	}
	return 1
}

// cross returns a.X*b.Y - a.Y*b.X exactly (coordinates may reach 2^40).
func cross(a, b geomcheck.Point) *big.Int {
	l := new(big.Int).Mul(big.NewInt(a.X), big.NewInt(b.Y))
	r := new(big.Int).Mul(big.NewInt(a.Y), big.NewInt(b.X))
	return l.Sub(l, r)
}

// ccwCmp orders directions counter-clockwise from the positive x axis:
// by half-plane, then by the sign of the cross product.
func ccwCmp(a, b geomcheck.Point) int {
	if ha, hb := half(a), half(b); ha != hb {
		return ha - hb
	}
	return -cross(a, b).Sign()
}

// drawnFace is one face boundary walk: its vertices in order and twice its
// signed area.
type drawnFace struct {
	verts []int
	area2 *big.Int
}

// traceFaces returns every face walk of the drawing (loops and repeated
// edges are not expected in the test inputs).
func traceFaces(t *testing.T, d outerDrawing) []drawnFace {
	t.Helper()
	n := len(d.pts)
	rot := make([][]int, n)
	for _, e := range d.edges {
		u, v := int(e[0]), int(e[1])
		if u == v {
			t.Fatal("test inputs have no loops")
		}
		rot[u] = append(rot[u], v)
		rot[v] = append(rot[v], u)
	}
	dir := func(u, v int) geomcheck.Point {
		return geomcheck.Point{X: d.pts[v].X - d.pts[u].X, Y: d.pts[v].Y - d.pts[u].Y}
	}
	at := make([]map[int]int, n) // at[v][w]: position of w in rot[v]
	for v := range rot {
		slices.SortFunc(rot[v], func(a, b int) int { return ccwCmp(dir(v, a), dir(v, b)) })
		at[v] = map[int]int{}
		for i, w := range rot[v] {
			if _, dup := at[v][w]; dup {
				t.Fatal("test inputs have no repeated edges")
			}
			at[v][w] = i
		}
	}
	seen := map[[2]int]bool{}
	var faces []drawnFace
	for u := range rot {
		for _, v := range rot[u] {
			if seen[[2]int{u, v}] {
				continue
			}
			f := drawnFace{area2: new(big.Int)}
			for a, b := u, v; !seen[[2]int{a, b}]; {
				seen[[2]int{a, b}] = true
				f.verts = append(f.verts, a)
				f.area2.Add(f.area2, cross(d.pts[a], d.pts[b]))
				deg := len(rot[b])
				a, b = b, rot[b][(at[b][a]+deg-1)%deg]
			}
			faces = append(faces, f)
		}
	}
	return faces
}

// onOuterFace reports for each vertex whether it lies on the outer face of
// its connected component's drawing.
func onOuterFace(t *testing.T, d outerDrawing) []bool {
	t.Helper()
	n := len(d.pts)
	pairs := make([][2]int, len(d.edges))
	for i, e := range d.edges {
		pairs[i] = [2]int{int(e[0]), int(e[1])}
	}
	comp, k := components(n, pairs) // report_test.go
	nv, ne, first := make([]int, k), make([]int, k), make([]int, k)
	for v := n - 1; v >= 0; v-- {
		nv[comp[v]]++
		first[comp[v]] = v
	}
	for _, e := range d.edges {
		ne[comp[e[0]]]++
	}
	byComp := make([][]drawnFace, k)
	for _, f := range traceFaces(t, d) {
		c := comp[f.verts[0]]
		byComp[c] = append(byComp[c], f)
	}
	on := make([]bool, n)
	for c, vs := range nv {
		faces := byComp[c]
		if ne[c] == 0 { // a lone node: the whole plane is its face
			on[first[c]] = true
			continue
		}
		if vs-ne[c]+len(faces) != 2 {
			t.Fatalf("component of %d nodes, %d edges: %d faces break Euler's formula", vs, ne[c], len(faces))
		}
		if ne[c] == vs-1 { // a tree: one face, of area zero, through every node
			if faces[0].area2.Sign() != 0 {
				t.Fatalf("tree face has area %v", faces[0].area2)
			}
			for _, v := range faces[0].verts {
				on[v] = true
			}
			continue
		}
		outer := -1
		for i, f := range faces {
			switch f.area2.Sign() {
			case -1:
				if outer >= 0 {
					t.Fatalf("component has two clockwise faces")
				}
				outer = i
			case 0:
				t.Fatalf("bounded face of zero area: %v", f.verts)
			}
		}
		if outer < 0 {
			t.Fatal("component with a cycle has no clockwise face")
		}
		for _, v := range faces[outer].verts {
			on[v] = true
		}
	}
	return on
}

const outerCube = `graph cube {
	a0 -- a1 -- a2 -- a3 -- a0
	b0 -- b1 -- b2 -- b3 -- b0
	a0 -- b0; a1 -- b1; a2 -- b2; a3 -- b3
}
`

// outerGrid is the 4 x 4 grid graph with hostile_test.go's node names.
func outerGrid() string {
	var b strings.Builder
	b.WriteString("graph grid {\n")
	gridEdges(4, func(i, j, i2, j2 int) {
		b.WriteString("\t" + gridName(i, j) + " -- " + gridName(i2, j2) + "\n")
	})
	b.WriteString("}\n")
	return b.String()
}

// outerParallel joins s and t by four internally disjoint paths a, b, c, d.
// {s, t} is a separation pair: an embedding orders the paths around s, its
// faces are the four cycles of two consecutive paths, and the two pairs of
// opposite paths share no face until the embedding is changed (a flip).
const outerParallel = `graph sp {
	s -- a1 -- a2 -- a3 -- a4 -- t
	s -- b1 -- b2 -- b3 -- t
	s -- c1 -- t
	s -- d1 -- t
}
`

// shareFace reports whether some face of the drawing holds every named node.
func shareFace(t *testing.T, d outerDrawing, names []string) bool {
	t.Helper()
	for _, f := range traceFaces(t, d) {
		all := true
		for _, name := range names {
			all = all && slices.Contains(f.verts, d.index[name])
		}
		if all {
			return true
		}
	}
	return false
}

func TestOuterFaceNodes(t *testing.T) {
	for _, tc := range []struct {
		name  string
		dot   string
		outer []string
		// inner are nodes that cannot share the outer face with the named
		// ones in any embedding: seeing them off it shows the face test
		// is not vacuous.
		inner []string
		// flip: instead of outer, ask in turn for each of these sets that
		// no face of the default drawing holds (there must be wantFlip
		// of them), so that --outer has to change the embedding; found
		// from the drawing so as not to depend on the default embedding.
		flip     [][]string
		wantFlip int
		fail     string // for a refused run: what stderr must contain
	}{
		// The cube is 3-connected, so its faces are the same in every
		// embedding (Whitney): three nodes of a 4-face pick that face.
		{name: "cube side face", dot: outerCube, outer: []string{"a0", "a1", "b1"}, inner: []string{"a2", "a3", "b2", "b3"}},
		{name: "cube top face", dot: outerCube, outer: []string{"b1", "b2", "b3"}, inner: []string{"a0", "a1", "a2", "a3"}},
		// No corners: the middle square, then one node inside each side.
		{name: "grid middle square", dot: outerGrid(), outer: []string{gridName(1, 1), gridName(1, 2), gridName(2, 2)}, inner: []string{gridName(0, 0), gridName(3, 3)}},
		{name: "grid side middles", dot: outerGrid(), outer: []string{gridName(0, 1), gridName(1, 3), gridName(3, 2), gridName(2, 0)}, inner: []string{gridName(1, 1), gridName(2, 2)}},
		{name: "two components", dot: strings.Replace(outerCube, "}", "\tx -- y -- z -- w -- x\n}", 1), outer: []string{"b1", "b2", "b3"}, inner: []string{"a0", "a1", "a2", "a3"}},
		{name: "tree leaves", dot: "graph tree { r -- {x y z}; x -- {x1 x2}; y -- y1 }", outer: []string{"x1", "y1", "z", "r"}},
		// One node inside each of two paths; of the six pairs exactly the
		// two opposite in the default embedding need a flip.
		{name: "separation pair flip", dot: outerParallel, wantFlip: 2, flip: [][]string{
			{"a2", "b2"}, {"a2", "c1"}, {"a2", "d1"}, {"b2", "c1"}, {"b2", "d1"}, {"c1", "d1"},
		}},
		// Failures. Opposite corners of the cube share no face.
		{name: "cube opposite corners", dot: outerCube, outer: []string{"a0", "b2"}, fail: "--outer a0,b2"},
		{name: "different components", dot: "graph two { a -- b -- c -- a; x -- y -- z -- x }", outer: []string{"a", "x"}, fail: "--outer a,x"},
		{name: "unknown node", dot: outerCube, outer: []string{"a0", "nosuch"}, fail: `--outer a0,nosuch: no graph has all of these nodes (graph "cube" lacks "nosuch")`},
	} {
		t.Run(tc.name, func(t *testing.T) {
			sets := [][]string{tc.outer}
			if tc.flip != nil {
				code, out, errs := runCmd(t, tc.dot, "-q")
				if code != exitOK {
					t.Fatalf("default run: exit %d: %s", code, errs)
				}
				d := readOuterDrawing(t, tc.dot, out)
				sets = nil
				for _, names := range tc.flip {
					if !shareFace(t, d, names) {
						sets = append(sets, names)
					}
				}
				if len(sets) != tc.wantFlip {
					t.Fatalf("%d of the sets share no face of the default drawing, want %d: %v", len(sets), tc.wantFlip, sets)
				}
			}
			for _, names := range sets {
				code, out, errs := runCmd(t, tc.dot, "-q", "--outer", strings.Join(names, ","))
				if tc.fail != "" {
					if code != exitBadInput || out != "" || !strings.Contains(errs, tc.fail) {
						t.Fatalf("exit %d (want %d), stdout %q, stderr %q (want it to contain %q)", code, exitBadInput, out, errs, tc.fail)
					}
					continue
				}
				if code != exitOK || errs != "" {
					t.Fatalf("--outer %v: exit %d: %s", names, code, errs)
				}
				d := readOuterDrawing(t, tc.dot, out)
				on := onOuterFace(t, d)
				for _, name := range names {
					if !on[d.index[name]] {
						t.Errorf("--outer %v: %s is not on the outer face\n%s", names, name, out)
					}
				}
				for _, name := range tc.inner {
					if on[d.index[name]] {
						t.Errorf("--outer %v: %s is on the outer face, which cannot also hold them\n%s", names, name, out)
					}
				}
			}
		})
	}
}

// TestOuterNamesMissingFromSomeGraphs: in a file of several graphs,
// --outer applies to those that have all its nodes, and standard error
// names each other graph and the names it lacks (nothing under -q).
func TestOuterNamesMissingFromSomeGraphs(t *testing.T) {
	src := "graph G { a -- b -- c -- a }\ngraph H { a -- b -- zz -- a }\n"
	code, _, errs := runCmd(t, src, "--outer", "a,zz")
	if code != exitOK {
		t.Fatalf("exit %d: %s", code, errs)
	}
	if want := "gridwood: <stdin>:1:1: --outer: graph \"G\" lacks \"zz\"; its outer face is chosen as without --outer\n"; errs != want {
		t.Errorf("stderr %q, want %q", errs, want)
	}
	if code, _, errs := runCmd(t, src, "-q", "--outer", "a,zz"); code != exitOK || errs != "" {
		t.Errorf("-q: exit %d, stderr %q", code, errs)
	}
}
