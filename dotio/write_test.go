package dotio

import (
	"bytes"
	"flag"
	"fmt"
	"os"
	"path/filepath"
	"slices"
	"sort"
	"strings"
	"testing"

	"gonum.org/v1/gonum/graph/formats/dot/ast"
)

var update = flag.Bool("update", false, "rewrite the golden files in testdata/golden")

// synthLayout gives node i the position (10i, 7i+3).
func synthLayout(f *File) []Layout {
	var out []Layout
	for _, g := range f.Graphs {
		n := len(g.Nodes)
		l := Layout{X: make([]int64, n), Y: make([]int64, n), BB: [4]int64{0, 0, int64(10 * n), int64(7*n + 3)}}
		for i := range n {
			l.X[i] = int64(10 * i)
			l.Y[i] = int64(7*i + 3)
		}
		out = append(out, l)
	}
	return out
}

// removeEvery marks every edge whose index is 1 modulo 3.
func removeEvery(f *File, lays []Layout) [][]int {
	var removed [][]int
	for gi, g := range f.Graphs {
		lays[gi].Removed = make([]bool, len(g.Edges))
		var idx []int
		for i := range g.Edges {
			if i%3 == 1 {
				lays[gi].Removed[i] = true
				idx = append(idx, i)
			}
		}
		removed = append(removed, idx)
	}
	return removed
}

func golden(t *testing.T, name string, got []byte) {
	t.Helper()
	path := filepath.Join("testdata", "golden", name)
	if *update {
		if err := os.WriteFile(path, got, 0o644); err != nil {
			t.Fatal(err)
		}
		return
	}
	want, err := os.ReadFile(path)
	if err != nil {
		t.Fatalf("%v (run go test -update to create it)", err)
	}
	if !bytes.Equal(got, want) {
		t.Errorf("%s differs from the output:\n%s", path, got)
	}
}

// filtered returns the statements of a graph as text, without the stale
// layout attributes Write removes; the last drop statements are left out.
func filtered(g *ast.Graph, drop int) string {
	var stmt func(ast.Stmt) ast.Stmt
	keep := func(attrs []*ast.Attr, gone ...string) []*ast.Attr {
		var out []*ast.Attr
		for _, a := range attrs {
			if k, _ := canonical(a.Key); !slices.Contains(gone, k) {
				out = append(out, a)
			}
		}
		return out
	}
	var vertex func(ast.Vertex) ast.Vertex
	vertex = func(v ast.Vertex) ast.Vertex {
		if s, ok := v.(*ast.Subgraph); ok {
			c := &ast.Subgraph{ID: s.ID}
			for _, st := range s.Stmts {
				if st = stmt(st); st != nil {
					c.Stmts = append(c.Stmts, st)
				}
			}
			return c
		}
		return v
	}
	stmt = func(s ast.Stmt) ast.Stmt {
		switch s := s.(type) {
		case *ast.NodeStmt:
			return &ast.NodeStmt{Node: s.Node, Attrs: keep(s.Attrs, "pos", "xlp")}
		case *ast.EdgeStmt:
			c := &ast.EdgeStmt{From: vertex(s.From), Attrs: keep(s.Attrs, "pos", "lp", "xlp", "head_lp", "tail_lp")}
			tail := &c.To
			for e := s.To; e != nil; e = e.To {
				*tail = &ast.Edge{Directed: e.Directed, Vertex: vertex(e.Vertex)}
				tail = &(*tail).To
			}
			return c
		case *ast.AttrStmt:
			gone := []string{"pos", "xlp"}
			switch s.Kind {
			case ast.EdgeKind:
				gone = []string{"pos", "lp", "xlp", "head_lp", "tail_lp"}
			case ast.GraphKind:
				gone = []string{"bb", "lp", "lwidth", "lheight"}
			}
			kept := keep(s.Attrs, gone...)
			if len(s.Attrs) > 0 && len(kept) == 0 {
				return nil // only stale data: the statement goes
			}
			return &ast.AttrStmt{Kind: s.Kind, Attrs: kept}
		case *ast.Attr:
			if k, _ := canonical(s.Key); slices.Contains([]string{"bb", "lp", "lwidth", "lheight"}, k) {
				return nil
			}
			return s
		case *ast.Subgraph:
			return vertex(s).(*ast.Subgraph)
		}
		return s
	}
	c := &ast.Graph{Strict: g.Strict, Directed: g.Directed, ID: g.ID}
	for _, st := range g.Stmts[:len(g.Stmts)-drop] {
		if st = stmt(st); st != nil {
			c.Stmts = append(c.Stmts, st)
		}
	}
	return c.String()
}

func edgeNames(g *Graph, keep func(i int) bool) []string {
	var out []string
	for i, e := range g.Edges {
		if keep == nil || keep(i) {
			out = append(out, g.Nodes[e.From].Name+"|"+g.Nodes[e.To].Name)
		}
	}
	return out
}

func nodeNames(g *Graph) []string {
	var out []string
	for _, n := range g.Nodes {
		out = append(out, n.Name)
	}
	return out
}

func writeString(t *testing.T, f *File, lays []Layout, opt WriteOptions) []byte {
	t.Helper()
	var b bytes.Buffer
	if err := Write(&b, f, lays, opt); err != nil {
		t.Fatalf("Write: %v", err)
	}
	return b.Bytes()
}

func TestRoundTrip(t *testing.T) {
	for name, src := range testInputs(t) {
		t.Run(name, func(t *testing.T) {
			f1, err := Read(src, ReadOptions{Name: name})
			if err != nil {
				t.Fatal(err)
			}
			lays := synthLayout(f1)
			out := writeString(t, f1, lays, WriteOptions{})
			golden(t, strings.TrimSuffix(name, ".gv")+".out", out)
			if again := writeString(t, f1, lays, WriteOptions{}); !bytes.Equal(out, again) {
				t.Errorf("output not deterministic")
			}
			f2, err := Read(out, ReadOptions{Name: "out"})
			if err != nil {
				t.Fatalf("re-read: %v\n%s", err, out)
			}
			if len(f2.Graphs) != len(f1.Graphs) {
				t.Fatalf("%d graphs, want %d", len(f2.Graphs), len(f1.Graphs))
			}
			for gi, g1 := range f1.Graphs {
				g2 := f2.Graphs[gi]
				if g1.ID != g2.ID || g1.Directed != g2.Directed || g1.Strict != g2.Strict {
					t.Errorf("graph %d header changed", gi)
				}
				if !slices.Equal(nodeNames(g1), nodeNames(g2)) {
					t.Errorf("nodes %v, want %v", nodeNames(g2), nodeNames(g1))
				}
				if !slices.Equal(edgeNames(g1, nil), edgeNames(g2, nil)) {
					t.Errorf("edges %v, want %v", edgeNames(g2, nil), edgeNames(g1, nil))
				}
				for i := range g1.Nodes {
					a1, a2 := g1.Nodes[i].Attrs, g2.Nodes[i].Attrs
					wantPos := fmt.Sprintf("%d,%d", lays[gi].X[i], lays[gi].Y[i])
					if a2.Pos != wantPos {
						t.Errorf("node %s pos %q, want %q", g1.Nodes[i].Name, a2.Pos, wantPos)
					}
					a1.Pos, a2.Pos = "", ""
					if a1 != a2 {
						t.Errorf("node %s attrs %+v, want %+v", g1.Nodes[i].Name, a2, a1)
					}
				}
				for i := range g1.Edges {
					if fmt.Sprint(g2.EdgeAttrs(i)) != fmt.Sprint(withoutPos(g1.EdgeAttrs(i))) {
						t.Errorf("edge %d attrs %v, want %v", i, g2.EdgeAttrs(i), g1.EdgeAttrs(i))
					}
				}
				// Statements are the same, up to the stale layout data and
				// the appended pos and bb statements.
				s1 := filtered(g1.ast, 0)
				s2 := filtered(g2.ast, len(g2.Nodes)+1)
				if s1 != s2 {
					t.Errorf("statements changed:\n%s\nwant\n%s", s2, s1)
				}
				if bb := g2.ast.Stmts[len(g2.ast.Stmts)-1].String(); bb != fmt.Sprintf(`graph [bb="0,0,%d,%d"]`, lays[gi].BB[2], lays[gi].BB[3]) {
					t.Errorf("last statement %s", bb)
				}
			}
		})
	}
}

func withoutPos(attrs []Attr) []Attr {
	var out []Attr
	for _, a := range attrs {
		if k, _ := canonical(a.Key); k != "pos" {
			out = append(out, a)
		}
	}
	return out
}

var removedMark = []Attr{{Key: "class", Value: `"removed"`}, {Key: "color", Value: "gray"}}

func hasMark(attrs []Attr) bool {
	return slices.Contains(attrs, removedMark[0])
}

func TestDropAndMarkRemoved(t *testing.T) {
	for _, name := range []string{"chains.gv", "fibre.gv", "tram.gv", "multi.gv"} {
		t.Run(name, func(t *testing.T) {
			f1 := readFile(t, name)
			base := strings.TrimSuffix(name, ".gv")
			lays := synthLayout(f1)
			removed := removeEvery(f1, lays)

			drop := writeString(t, f1, lays, WriteOptions{DropRemoved: true})
			golden(t, base+".drop.out", drop)
			f2, err := Read(drop, ReadOptions{Name: "drop"})
			if err != nil {
				t.Fatalf("re-read: %v\n%s", err, drop)
			}
			for gi, g1 := range f1.Graphs {
				g2 := f2.Graphs[gi]
				kept := edgeNames(g1, func(i int) bool { return !lays[gi].Removed[i] })
				if got := edgeNames(g2, nil); !slices.Equal(got, kept) {
					t.Errorf("graph %d: edges after drop %v, want %v", gi, got, kept)
				}
				if !slices.Equal(nodeNames(g1), nodeNames(g2)) {
					t.Errorf("graph %d: node order changed: %v", gi, nodeNames(g2))
				}
			}

			mark := writeString(t, f1, lays, WriteOptions{MarkRemoved: removedMark})
			golden(t, base+".mark.out", mark)
			f3, err := Read(mark, ReadOptions{Name: "mark"})
			if err != nil {
				t.Fatalf("re-read: %v\n%s", err, mark)
			}
			for gi, g1 := range f1.Graphs {
				g3 := f3.Graphs[gi]
				if !slices.Equal(edgeNames(g3, nil), edgeNames(g1, nil)) {
					t.Errorf("graph %d: edges after mark %v, want %v", gi, edgeNames(g3, nil), edgeNames(g1, nil))
					continue
				}
				if !slices.Equal(nodeNames(g1), nodeNames(g3)) {
					t.Errorf("graph %d: node order changed: %v", gi, nodeNames(g3))
				}
				for i := range g3.Edges {
					if hasMark(g3.EdgeAttrs(i)) != lays[gi].Removed[i] {
						t.Errorf("graph %d edge %d: mark %v, removed %v", gi, i, !lays[gi].Removed[i], lays[gi].Removed[i])
					}
				}
			}

			var rb bytes.Buffer
			if err := WriteRemoved(&rb, f1, removed); err != nil {
				t.Fatal(err)
			}
			golden(t, base+".removed.out", rb.Bytes())
			f4, err := Read(rb.Bytes(), ReadOptions{Name: "removed"})
			if err != nil {
				t.Fatalf("re-read: %v\n%s", err, rb.Bytes())
			}
			for gi, g1 := range f1.Graphs {
				g4 := f4.Graphs[gi]
				if g4.ID != g1.ID || g4.Directed != g1.Directed || g4.Strict != g1.Strict {
					t.Errorf("graph %d: header changed", gi)
				}
				want := edgeNames(g1, func(i int) bool { return lays[gi].Removed[i] })
				if got := edgeNames(g4, nil); !slices.Equal(got, want) {
					t.Errorf("graph %d: removed edges %v, want %v", gi, got, want)
					continue
				}
				for k, i := range removed[gi] {
					if got, want := fmt.Sprint(g4.EdgeAttrs(k)), fmt.Sprint(withoutPos(g1.EdgeAttrs(i))); got != want {
						t.Errorf("graph %d removed edge %d: attrs %s, want %s", gi, i, got, want)
					}
				}
			}
		})
	}
}

func TestWriteRemovedEmptyAndErrors(t *testing.T) {
	f := mustRead(t, "strict digraph G { a -> b }\ngraph { x -- y }")
	var b bytes.Buffer
	if err := WriteRemoved(&b, f, [][]int{nil}); err != nil {
		t.Fatal(err)
	}
	if want := "strict digraph G {\n}\ngraph {\n}\n"; b.String() != want {
		t.Errorf("got %q, want %q", b.String(), want)
	}
	if err := WriteRemoved(&b, f, [][]int{{1}}); err == nil {
		t.Error("out-of-range index accepted")
	}
	if err := WriteRemoved(&b, f, [][]int{nil, nil, nil}); err == nil {
		t.Error("too many graphs accepted")
	}
	lays := synthLayout(f)
	if err := Write(&b, f, lays[:1], WriteOptions{}); err == nil {
		t.Error("missing layout accepted")
	}
	lays[0].X = lays[0].X[:1]
	if err := Write(&b, f, lays, WriteOptions{}); err == nil {
		t.Error("short X accepted")
	}
	lays = synthLayout(f)
	lays[1].Removed = []bool{true, false}
	if err := Write(&b, f, lays, WriteOptions{}); err == nil {
		t.Error("Removed of the wrong length accepted")
	}
}

func TestMarkWholeStatement(t *testing.T) {
	f := mustRead(t, "graph {\n\ta -- {b c} [w=1]\n\td -- e -- f\n}\n")
	lays := synthLayout(f)
	lays[0].Removed = []bool{true, true, false, true}
	got := string(writeString(t, f, lays, WriteOptions{MarkRemoved: []Attr{{"color", "red"}}}))
	want := "graph {\n\ta -- {b c} [w=1, color=red]\n\td\n\te\n\td -- e\n\tf\n\te -- f [color=red]\n" +
		"\ta [pos=\"0,3\"]\n\tb [pos=\"10,10\"]\n\tc [pos=\"20,17\"]\n\td [pos=\"30,24\"]\n\te [pos=\"40,31\"]\n\tf [pos=\"50,38\"]\n\tgraph [bb=\"0,0,60,45\"]\n}\n"
	if got != want {
		t.Errorf("got\n%s\nwant\n%s", got, want)
	}
}

// TestMarkReplacesSameKey checks that a mark of a key the edge statement
// already has replaces it, not repeats it, in both the whole-statement and
// the split form.
func TestMarkReplacesSameKey(t *testing.T) {
	f := mustRead(t, "graph {\n\ta -- b [color=blue, w=2]\n\tc -- d -- e [\"color\"=green]\n}\n")
	lays := synthLayout(f)
	lays[0].Removed = []bool{true, false, true}
	got := string(writeString(t, f, lays, WriteOptions{MarkRemoved: []Attr{{"color", "red"}}}))
	want := "graph {\n\ta -- b [w=2, color=red]\n\tc\n\td\n\tc -- d [\"color\"=green]\n\te\n\td -- e [color=red]\n" +
		"\ta [pos=\"0,3\"]\n\tb [pos=\"10,10\"]\n\tc [pos=\"20,17\"]\n\td [pos=\"30,24\"]\n\te [pos=\"40,31\"]\n\tgraph [bb=\"0,0,50,38\"]\n}\n"
	if got != want {
		t.Errorf("got\n%s\nwant\n%s", got, want)
	}
}

func TestParseAttrList(t *testing.T) {
	tests := []struct {
		in   string
		want string // Key=Value;... or "error"
	}{
		{"color=red", "color=red"},
		{"color=red,style=dashed", "color=red;style=dashed"},
		{" color = red , style=bold ", "color=red;style=bold"},
		{"label=hello world", `label="hello world"`},
		{`label="a,b",w=2`, `label="a,b";w=2`},
		{"w=1.5,x=-3,y=.5", "w=1.5;x=-3;y=.5"},
		{"k=", `k=""`},
		{`label=say "hi"`, `label="say \"hi\""`},
		{"label=node", `label="node"`},
		{`label=a\nb`, `label="a\nb"`},
		{"label=café", `label="café"`},
		{"penwidth=2.", "penwidth=2."},
		{"", "error"},
		{"color", "error"},
		{"=red", "error"},
		{"1a=b", "error"},
		{"node=x", "error"},
		{"color=red,", "error"},
		{`label="open`, "error"},
		{`label="x"y`, "error"},
		{`a=b\`, "error"},
		{"a=\xff", "error"},
		{"a=b\x00", "error"},
	}
	for _, tt := range tests {
		attrs, err := ParseAttrList(tt.in)
		got := "error"
		if err == nil {
			var parts []string
			for _, a := range attrs {
				parts = append(parts, a.Key+"="+a.Value)
			}
			got = strings.Join(parts, ";")
		}
		if got != tt.want {
			t.Errorf("ParseAttrList(%q) = %s (%v), want %s", tt.in, got, err, tt.want)
		}
		// Whatever is accepted must be valid DOT.
		for _, a := range attrs {
			src := "graph { x [" + a.Key + "=" + a.Value + "] }"
			if _, err := Read([]byte(src), ReadOptions{Name: "attr"}); err != nil {
				t.Errorf("ParseAttrList(%q) gave invalid DOT %s: %v", tt.in, src, err)
			}
		}
	}
}

func TestWriteDeterministicOrder(t *testing.T) {
	// Node statements at the end follow node order, not any map order.
	var b strings.Builder
	b.WriteString("graph {\n")
	names := []string{"k", "b", "z", "a", "m", "c", "y", "d"}
	for _, n := range names {
		b.WriteString("\t" + n + "\n")
	}
	b.WriteString("}\n")
	f := mustRead(t, b.String())
	out := string(writeString(t, f, synthLayout(f), WriteOptions{}))
	var got []string
	for _, line := range strings.Split(out, "\n") {
		if strings.Contains(line, "pos=") {
			got = append(got, strings.Fields(line)[0])
		}
	}
	if !slices.Equal(got, names) {
		t.Errorf("pos statements in order %v, want %v", got, names)
	}
	if sort.StringsAreSorted(names) {
		t.Fatal("test names must not be sorted")
	}
}

// TestStaleLayoutStatementsLeftOut checks which statements go when
// removing stale layout data leaves them saying nothing: a default
// statement of only pos or bb, and a top-level node statement of only pos
// for a node named before it (as a laid-out graph's appended positions
// are). A node statement that first names its node, one inside a
// subgraph (it makes the node a member), one with another attribute, and
// a default statement written empty stay.
func TestStaleLayoutStatementsLeftOut(t *testing.T) {
	for _, tc := range []struct{ in, want string }{
		{"graph {\n\ta -- b\n\ta [pos=\"1,2\"]\n\tgraph [bb=\"0,0,1,1\"]\n}\n",
			"graph {\n\ta -- b\n"},
		{"graph {\n\ta [pos=\"1,2\"]\n\ta -- b\n}\n",
			"graph {\n\ta\n\ta -- b\n"},
		{"graph {\n\ta -- b\n\tsubgraph s {\n\t\ta [pos=\"1,2\"]\n\t\tb\n\t}\n}\n",
			"graph {\n\ta -- b\n\tsubgraph s {a b}\n"},
		{"graph {\n\ta -- b\n\ta [pos=\"1,2\", color=red]\n\tb [\"pos\"=\"1,2\"] [pos=\"3,4\"]\n}\n",
			"graph {\n\ta -- b\n\ta [color=red]\n"},
		{"graph {\n\tnode [pos=\"1,1\"]\n\tedge [pos=\"e,1,1\"]\n\tgraph []\n\tnode [pos=\"1,1\", shape=box]\n\ta\n}\n",
			"graph {\n\tgraph []\n\tnode [shape=box]\n\ta\n"},
		{"digraph {\n\t{a -> b; graph [bb=\"1,1,2,2\"]} -> c\n\tb [pos=\"1,1\"]\n}\n",
			"digraph {\n\t{\n\t\ta -> b\n\t} -> c\n"},
		// All of a layout's output attributes, each on its own kind (lp
		// on a node is none of them and stays); SOURCES.md.
		{"graph {\n\ta -- b [lp=\"1,1\", head_lp=\"1\", tail_lp=2, xlp=3, color=red]\n\ta [xlp=\"1,1\"]\n\tsubgraph cluster_x {lp=\"1,2\"; lwidth=1; lheight=2; c}\n\tgraph [lp=\"3,4\", label=L]\n\tnode [xlp=1]\n\tedge [lp=2]\n\td [lp=kept]\n\tlwidth=3\n}\n",
			"graph {\n\ta -- b [color=red]\n\tsubgraph cluster_x {c}\n\tgraph [label=L]\n\td [lp=kept]\n"},
		// The compact form is chosen from what is printed, so that the
		// output read again prints the same.
		{"graph {\n\tsubgraph s {\n\t\ta\n\t\tbb=\"1,1,2,2\"\n\t}\n}\n",
			"graph {\n\tsubgraph s {a}\n"},
		{"graph {\n\ta -- {b; node [pos=\"1,1\"]} -- {c; edge [lp=1]; graph [bb=1]}\n}\n",
			"graph {\n\ta -- {b} -- {c}\n"},
		{"graph {\n\tsubgraph s {a; lp=1; node []}\n}\n",
			"graph {\n\tsubgraph s {\n\t\ta\n\t\tnode []\n\t}\n"},
	} {
		f := mustRead(t, tc.in)
		got := string(writeString(t, f, synthLayout(f), WriteOptions{}))
		body, _, _ := strings.Cut(got, "\n\ta [pos=\"0,3\"]")
		if body+"\n" != tc.want {
			t.Errorf("%q:\ngot\n%s\nwant\n%s", tc.in, body, tc.want)
		}
	}
}
