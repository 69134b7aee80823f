package main

import (
	"bytes"
	"os"
	"path/filepath"
	"strconv"
	"strings"
	"testing"

	"gonum.org/v1/gonum/graph/formats/dot"
	"gonum.org/v1/gonum/graph/formats/dot/ast"

	"github.com/gridwood/gridwood/dotio"
	"github.com/gridwood/gridwood/internal/geomcheck"
	"github.com/gridwood/gridwood/planarize"
)

// runCmd runs the command in-process and returns its exit status, output
// and messages.
func runCmd(t *testing.T, stdin string, args ...string) (int, string, string) {
	t.Helper()
	var out, errs bytes.Buffer
	code := run(args, strings.NewReader(stdin), &out, &errs)
	return code, out.String(), errs.String()
}

// positions reads the pos attributes from top-level node statements of a
// graph in the output, using gonum's parser directly (independent of
// dotio's reader): the last pos of a node wins, as in DOT. Node names are
// canonicalized the simple way, quotes stripped.
func positions(t *testing.T, g *ast.Graph) map[string][2]int64 {
	t.Helper()
	pos := map[string][2]int64{}
	for _, st := range g.Stmts {
		ns, ok := st.(*ast.NodeStmt)
		if !ok {
			continue
		}
		for _, a := range ns.Attrs {
			if a.Key != "pos" {
				continue
			}
			v := strings.Trim(a.Val, `"`)
			xy := strings.Split(v, ",")
			if len(xy) != 2 {
				t.Fatalf("node %s: pos %q is not X,Y", ns.Node.ID, a.Val)
			}
			x, err1 := strconv.ParseInt(xy[0], 10, 64)
			y, err2 := strconv.ParseInt(xy[1], 10, 64)
			if err1 != nil || err2 != nil {
				t.Fatalf("node %s: pos %q is not integral", ns.Node.ID, a.Val)
			}
			pos[ns.Node.ID] = [2]int64{x, y}
		}
	}
	return pos
}

func TestEndToEndKeepsStatementsAndDrawsCleanly(t *testing.T) {
	in, err := os.ReadFile("testdata/features.dot")
	if err != nil {
		t.Fatal(err)
	}
	code, out, errs := runCmd(t, string(in), "-q")
	if code != exitOK {
		t.Fatalf("exit %d: %s", code, errs)
	}
	got, err := dot.ParseString(out)
	if err != nil {
		t.Fatalf("output does not parse: %v\n%s", err, out)
	}
	src, err := dotio.Read(in, dotio.ReadOptions{Name: "features.dot"})
	if err != nil {
		t.Fatal(err)
	}
	want := src.AST()
	if len(got.Graphs) != len(want.Graphs) {
		t.Fatalf("%d graphs out, %d in", len(got.Graphs), len(want.Graphs))
	}
	for gi, wg := range want.Graphs {
		gg := got.Graphs[gi]
		if gg.Strict != wg.Strict || gg.Directed != wg.Directed || gg.ID != wg.ID {
			t.Errorf("graph %d header changed", gi)
		}
		// Every input statement is still there, in order, except the stale
		// layout attributes that are documented to be replaced.
		var wantStmts []string
		for _, st := range wg.Stmts {
			if s := stripLayout(st); s != "" {
				wantStmts = append(wantStmts, s)
			}
		}
		var gotStmts []string
		for _, st := range gg.Stmts[:len(wantStmts)] {
			gotStmts = append(gotStmts, st.String())
		}
		if strings.Join(gotStmts, "\n") != strings.Join(wantStmts, "\n") {
			t.Errorf("graph %d statements changed:\ngot:\n%s\nwant:\n%s", gi, strings.Join(gotStmts, "\n"), strings.Join(wantStmts, "\n"))
		}
		// Every node has an integral pos; the drawing has no crossings.
		pos := positions(t, gg)
		g := src.Graphs[gi]
		pts := make([]geomcheck.Point, len(g.Nodes))
		for v, n := range g.Nodes {
			p, ok := pos[n.ID]
			if !ok {
				t.Fatalf("graph %d: node %s has no pos", gi, n.ID)
			}
			pts[v] = geomcheck.Point{X: p[0], Y: p[1]}
		}
		raw := make([][2]int32, len(g.Edges))
		for i, e := range g.Edges {
			raw[i] = [2]int32{e.From, e.To}
		}
		simple, _ := planarize.Simplify(len(g.Nodes), raw)
		if !planarize.IsPlanar(len(g.Nodes), simple) {
			t.Fatalf("graph %d: test input should be planar", gi)
		}
		probs, err := geomcheck.Check(pts, simple)
		if err != nil || len(probs) > 0 {
			t.Errorf("graph %d: drawing problems %v %v", gi, probs, err)
		}
	}
}

// stripLayout prints a statement as the output should contain it: with
// pos removed from node and edge statements and defaults, and bb from
// graph attributes. Statements left empty by this are dropped ("").
func stripLayout(st ast.Stmt) string {
	drop := func(attrs []*ast.Attr, key string) []*ast.Attr {
		var out []*ast.Attr
		for _, a := range attrs {
			if a.Key != key {
				out = append(out, a)
			}
		}
		return out
	}
	switch s := st.(type) {
	case *ast.NodeStmt:
		c := *s
		c.Attrs = drop(s.Attrs, "pos")
		return c.String()
	case *ast.EdgeStmt:
		c := *s
		c.Attrs = drop(s.Attrs, "pos")
		return c.String()
	case *ast.Attr:
		if s.Key == "bb" {
			return ""
		}
	case *ast.AttrStmt:
		c := *s
		switch s.Kind {
		case ast.GraphKind:
			c.Attrs = drop(s.Attrs, "bb")
		default:
			c.Attrs = drop(s.Attrs, "pos")
		}
		if len(c.Attrs) == 0 {
			return ""
		}
		return c.String()
	}
	return st.String()
}

func TestExitStatusesAndMessages(t *testing.T) {
	k5 := "graph K5 { a -- b -- c -- d -- e -- a -- c -- e -- b -- d -- a }\n"
	for _, tc := range []struct {
		name   string
		stdin  string
		args   []string
		code   int
		errHas string
	}{
		{"syntax error", "graph G {\n  a -- b\n  c -- ]\n}\n", nil, exitBadInput, "<stdin>:3:8: "},
		{"arrow in graph", "graph G {\n a -> b\n}\n", nil, exitBadInput, "<stdin>:2:4: "},
		{"dashes in digraph", "digraph G { a -- b }", nil, exitBadInput, "<stdin>:1:15: "},
		{"empty input", "", nil, exitBadInput, "<stdin>"},
		{"not DOT", "hello, world\n", nil, exitBadInput, "<stdin>:1:"},
		{"unknown flag", "", []string{"--no-such-flag"}, exitBadInput, "unknown flag"},
		{"bad unit", "graph{}", []string{"--unit", "-3"}, exitBadInput, "--unit"},
		{"planar only", k5, []string{"--planar-only"}, exitNonPlanar, `graph "K5" is not planar`},
		{"non-planar reported", k5, nil, exitOK, `graph "K5": 1 of 10 edges set aside`},
		{"quiet", k5, []string{"-q"}, exitOK, ""},
		{"missing file", "", []string{"/no/such/file.dot"}, exitBadInput, "no such file"},
	} {
		t.Run(tc.name, func(t *testing.T) {
			code, out, errs := runCmd(t, tc.stdin, tc.args...)
			if code != tc.code {
				t.Fatalf("exit %d, want %d; stderr: %s", code, tc.code, errs)
			}
			if tc.errHas != "" && !strings.Contains(errs, tc.errHas) {
				t.Errorf("stderr %q lacks %q", errs, tc.errHas)
			}
			if tc.errHas == "" && errs != "" {
				t.Errorf("stderr should be empty, got %q", errs)
			}
			if code != exitOK && out != "" {
				t.Errorf("failed run wrote to stdout: %q", out)
			}
		})
	}
}

func TestHelpAndVersion(t *testing.T) {
	code, errs, _ := runCmd(t, "", "--help") // help goes to standard output
	if code != exitOK {
		t.Fatalf("--help exit %d", code)
	}
	for _, flag := range []string{"--output", "--unit", "--quiet", "--removed", "--drop-removed", "--mark-removed", "--planar-only", "--explain", "--effort", "--max-expansion", "--version", "--svg", "--check", "--grid", "Exit status", "default: 1000000", "default: schnyder"} {
		if !strings.Contains(errs, flag) {
			t.Errorf("help lacks %q", flag)
		}
	}
	code, errs, _ = runCmd(t, "", "--version")
	if code != exitOK || !strings.HasPrefix(errs, "gridwood ") {
		t.Errorf("--version: exit %d, %q", code, errs)
	}
}

func TestOutputFileIsReplacedAtomically(t *testing.T) {
	dir := t.TempDir()
	outPath := filepath.Join(dir, "out.dot")
	if err := os.WriteFile(outPath, []byte("old contents\n"), 0o600); err != nil {
		t.Fatal(err)
	}
	// A failing run leaves the file as it was.
	code, _, _ := runCmd(t, "graph G { a -- }", "-o", outPath)
	if code != exitBadInput {
		t.Fatalf("exit %d", code)
	}
	if b, _ := os.ReadFile(outPath); string(b) != "old contents\n" {
		t.Fatalf("failed run changed the output file: %q", b)
	}
	// A good run replaces it and keeps its permissions.
	code, out, errs := runCmd(t, "graph G { a -- b }", "-o", outPath)
	if code != exitOK || out != "" {
		t.Fatalf("exit %d, stdout %q, stderr %q", code, out, errs)
	}
	b, _ := os.ReadFile(outPath)
	if !strings.Contains(string(b), `pos="`) {
		t.Fatalf("output file lacks positions: %q", b)
	}
	if fi, _ := os.Stat(outPath); fi.Mode().Perm() != 0o600 {
		t.Errorf("mode %v, want 0600", fi.Mode().Perm())
	}
	entries, _ := os.ReadDir(dir)
	if len(entries) != 1 {
		t.Errorf("temporary files left behind: %v", entries)
	}
}

func TestRemovedFileListsExactlyTheSetAsideEdges(t *testing.T) {
	dir := t.TempDir()
	rm := filepath.Join(dir, "removed.dot")
	// K3,3 written with a repeated edge and a loop: the pair set aside
	// takes its copies with it, the loop never counts.
	in := "digraph U {\n {h1 h2 h3} -> {w g p}\n h1 -> w\n h1 -> h1\n}\n"
	code, out, errs := runCmd(t, in, "-q", "--removed", rm)
	if code != exitOK {
		t.Fatalf("exit %d: %s", code, errs)
	}
	b, err := os.ReadFile(rm)
	if err != nil {
		t.Fatal(err)
	}
	f, err := dotio.Read(b, dotio.ReadOptions{Name: "removed.dot"})
	if err != nil {
		t.Fatalf("removed file does not parse: %v\n%s", err, b)
	}
	if len(f.Graphs) != 1 || !f.Graphs[0].Directed || f.Graphs[0].ID != "U" {
		t.Fatalf("removed file: want one digraph U, got %s", b)
	}
	removed := f.Graphs[0].Edges
	if len(removed) == 0 {
		t.Fatal("K3,3 must lose an edge")
	}
	// The main output still has every edge; dropping the removed ones
	// leaves a planar graph, and adding any one back does not.
	src, _ := dotio.Read([]byte(in), dotio.ReadOptions{Name: "in"})
	g := src.Graphs[0]
	isRemoved := map[[2]string]bool{}
	for _, e := range removed {
		rg := f.Graphs[0]
		isRemoved[[2]string{rg.Nodes[e.From].Name, rg.Nodes[e.To].Name}] = true
	}
	var kept [][2]int32
	for _, e := range g.Edges {
		a, b := g.Nodes[e.From].Name, g.Nodes[e.To].Name
		if !isRemoved[[2]string{a, b}] && !isRemoved[[2]string{b, a}] && e.From != e.To {
			kept = append(kept, [2]int32{e.From, e.To})
		}
	}
	simple, _ := planarize.Simplify(len(g.Nodes), kept)
	if !planarize.IsPlanar(len(g.Nodes), simple) {
		t.Error("kept edges are not planar")
	}
	for _, e := range removed {
		rg := f.Graphs[0]
		u, _ := g.Lookup(rg.Nodes[e.From].Name)
		v, _ := g.Lookup(rg.Nodes[e.To].Name)
		if planarize.IsPlanar(len(g.Nodes), append(append([][2]int32(nil), simple...), [2]int32{int32(u), int32(v)})) {
			t.Errorf("removed edge %v could stay", e)
		}
	}
	if o, err := dotio.Read([]byte(out), dotio.ReadOptions{Name: "out"}); err != nil || len(o.Graphs[0].Edges) != 11 {
		t.Errorf("main output should keep all 11 edges (9, a repeat, a loop): %v\n%s", err, out)
	}
	// A planar graph gives an empty graph in the removed file.
	code, _, _ = runCmd(t, "graph P { a -- b }", "-q", "--removed", rm)
	b, _ = os.ReadFile(rm)
	if code != exitOK || strings.TrimSpace(string(b)) != "graph P {\n}" {
		t.Errorf("planar graph: exit %d, removed file %q", code, b)
	}
}

func TestSameInputSameBytes(t *testing.T) {
	in, _ := os.ReadFile("../../examples/tram-network.dot")
	_, first, _ := runCmd(t, string(in), "-q")
	for range 3 {
		if _, again, _ := runCmd(t, string(in), "-q"); again != first {
			t.Fatal("output differs between runs")
		}
	}
	dir := t.TempDir()
	p := filepath.Join(dir, "tram.dot")
	os.WriteFile(p, in, 0o644)
	if _, fromFile, _ := runCmd(t, "", "-q", p); fromFile != first {
		t.Fatal("output differs between file and standard input")
	}
}
