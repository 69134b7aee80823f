package dotio

import (
	"bytes"
	"math/rand"
	"os"
	"path/filepath"
	"reflect"
	"strings"
	"testing"

	"gonum.org/v1/gonum/graph/formats/dot"
	"gonum.org/v1/gonum/graph/formats/dot/ast"
)

// astCounts counts, recursively and independently of the walker, the node
// mentions, edge operators and subgraphs of a syntax tree.
func astCounts(f *ast.File) (nodes, ops, subs int) {
	var stmt func(ast.Stmt)
	var vertex func(ast.Vertex)
	vertex = func(v ast.Vertex) {
		switch v := v.(type) {
		case *ast.Node:
			nodes++
		case *ast.Subgraph:
			subs++
			for _, s := range v.Stmts {
				stmt(s)
			}
		}
	}
	stmt = func(s ast.Stmt) {
		switch s := s.(type) {
		case *ast.NodeStmt:
			nodes++
		case *ast.EdgeStmt:
			vertex(s.From)
			for e := s.To; e != nil; e = e.To {
				ops++
				vertex(e.Vertex)
			}
		case *ast.Subgraph:
			vertex(s)
		}
	}
	for _, g := range f.Graphs {
		for _, s := range g.Stmts {
			stmt(s)
		}
	}
	return
}

func testInputs(t *testing.T) map[string][]byte {
	t.Helper()
	names, err := filepath.Glob(filepath.Join("testdata", "*.gv"))
	if err != nil || len(names) == 0 {
		t.Fatalf("no testdata inputs: %v", err)
	}
	in := map[string][]byte{}
	for _, n := range names {
		b, err := os.ReadFile(n)
		if err != nil {
			t.Fatal(err)
		}
		in[filepath.Base(n)] = b
	}
	return in
}

// The outside reference here is gonum's own parser: on every valid input
// the scanner must find exactly the node mentions, edge operators,
// subgraphs and graphs that gonum's syntax tree has.
func TestScannerAgreesWithGonum(t *testing.T) {
	check := func(name string, src []byte) {
		t.Helper()
		pm := newPosMap(src)
		sc, err := scan(src, pm, name)
		if err != nil {
			t.Fatalf("%s: scan: %v", name, err)
		}
		f, err := dot.ParseBytes(sc.text)
		if err != nil {
			t.Fatalf("%s: gonum: %v\n%s", name, err, sc.text)
		}
		nodes, ops, subs := astCounts(f)
		if nodes != len(sc.nodeToks) || ops != len(sc.ops) || subs != len(sc.subNodes) || subs != len(sc.subAt) || len(f.Graphs) != len(sc.graphKw) {
			t.Errorf("%s: gonum has %d nodes, %d ops, %d subgraphs, %d graphs; scanner %d, %d, %d, %d\n%s",
				name, nodes, ops, subs, len(f.Graphs), len(sc.nodeToks), len(sc.ops), len(sc.subNodes), len(sc.graphKw), src)
		}
		// Every recorded offset starts the right kind of token.
		for _, off := range sc.ops {
			if op := string(sc.text[off : off+2]); op != "--" && op != "->" {
				t.Errorf("%s: edge operator offset %d points at %q", name, off, op)
			}
		}
	}
	for name, src := range testInputs(t) {
		check(name, src)
	}
	rng := rand.New(rand.NewSource(7))
	for i := 0; i < 3000; i++ {
		src, _ := generate(rng)
		check("generated", []byte(src))
	}
}

// Generated inputs carry their expected graphs from the generator's own
// recursive model of DOT semantics.
func TestReadGenerated(t *testing.T) {
	rng := rand.New(rand.NewSource(11))
	for i := 0; i < 3000; i++ {
		src, want := generate(rng)
		f, err := Read([]byte(src), ReadOptions{Name: "gen"})
		if err != nil {
			t.Fatalf("Read: %v\n%s", err, src)
		}
		if got := dump(f); got != want {
			t.Fatalf("input\n%s\ngot\n%s\nwant\n%s", src, got, want)
		}
	}
}

func TestNormalizeOnlyWhenNeeded(t *testing.T) {
	src := []byte("graph { Node [a=b]; x -- y }\n")
	sc, err := scan(src, newPosMap(src), "t")
	if err != nil {
		t.Fatal(err)
	}
	if &sc.text[0] != &src[0] {
		t.Errorf("input without changes was copied")
	}
	tests := []struct{ in, want string }{
		{"graph { nOdE [a=b] }\n", "graph { node [a=b] }\n"},
		{"graph { \"a\" + \"b\" }", "graph { \"ab\"      }\n"},
		{"graph { \"a\" +\n \"b\" + \"\" -- c }\n", "graph { \"ab\"            -- c }\n"},
		{"\xEF\xBB\xBFgraph {}\n", "   graph {}\n"},
		{"graph { a:p:\"ne\" }\n", "graph { a:p: ne  }\n"},
	}
	for _, tt := range tests {
		in := []byte(tt.in)
		orig := string(in)
		sc, err := scan(in, newPosMap(in), "t")
		if err != nil {
			t.Fatalf("%q: %v", tt.in, err)
		}
		if string(sc.text) != tt.want {
			t.Errorf("%q: normalized to %q, want %q", tt.in, sc.text, tt.want)
		}
		if string(in) != orig {
			t.Errorf("%q: input modified", tt.in)
		}
		if len(strings.TrimRight(tt.in, "\n")) == len(strings.TrimRight(tt.want, "\n")) {
			continue
		}
		t.Errorf("%q: length changed", tt.in)
	}
}

// gonumTokenOffset reads the byte offset gonum's parser reports for a
// syntax error through reflection (its error type is internal); it
// cross-checks the replay of gonum's line:col metric.
func gonumTokenOffset(err error) (int, bool) {
	v := reflect.ValueOf(err)
	if v.Kind() != reflect.Pointer || v.Elem().Kind() != reflect.Struct {
		return 0, false
	}
	tok := v.Elem().FieldByName("ErrorToken")
	if !tok.IsValid() || tok.IsNil() {
		return 0, false
	}
	off := tok.Elem().FieldByName("Pos").FieldByName("Offset")
	if !off.IsValid() {
		return 0, false
	}
	return int(off.Int()), true
}

func TestSyntaxErrorOffsets(t *testing.T) {
	rng := rand.New(rand.NewSource(3))
	checked := 0
	for i := 0; i < 3000; i++ {
		src, _ := generate(rng)
		// Break the input: delete or duplicate one byte that is a
		// punctuation character, which keeps it lexically valid.
		b := []byte(src)
		var at []int
		for j, c := range b {
			if bytes.IndexByte([]byte("{}[]=;:,"), c) >= 0 {
				at = append(at, j)
			}
		}
		if len(at) == 0 {
			continue
		}
		j := at[rng.Intn(len(at))]
		if rng.Intn(2) == 0 {
			b = append(b[:j:j], b[j+1:]...)
		} else {
			b = append(b[:j+1:j+1], b[j:]...)
		}
		pm := newPosMap(b)
		sc, err := scan(b, pm, "t")
		if err != nil {
			continue
		}
		_, perr := dot.ParseBytes(sc.text)
		if perr == nil {
			continue
		}
		off, ok := gonumTokenOffset(perr)
		if !ok {
			continue // not a positioned parser error
		}
		e, ok := syntaxError(perr, sc, pm, "t", len(b)).(*Error)
		if !ok {
			t.Fatalf("syntaxError(%v) is not *Error", perr)
		}
		wl, wc := pm.lineCol(min(off, len(b)))
		if e.Line != wl || e.Col != wc {
			t.Fatalf("%q: %v: at %d:%d, gonum's offset %d is %d:%d", b, perr, e.Line, e.Col, off, wl, wc)
		}
		checked++
	}
	if checked < 500 {
		t.Errorf("only %d syntax errors checked", checked)
	}
}
