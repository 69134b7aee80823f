package dotio

import (
	"errors"
	"fmt"
	"os"
	"path/filepath"
	"strings"
	"testing"
)

// dump renders the plain graphs of f compactly: per graph its header, the
// canonical node names in order and the edges as From>To (or From-To).
func dump(f *File) string {
	var b strings.Builder
	for _, g := range f.Graphs {
		kind := "graph"
		if g.Directed {
			kind = "digraph"
		}
		if g.Strict {
			kind = "strict " + kind
		}
		fmt.Fprintf(&b, "%s %s;", kind, g.ID)
		b.WriteString(" nodes:")
		for _, n := range g.Nodes {
			b.WriteString(" " + n.Name)
		}
		b.WriteString("; edges:")
		op := "-"
		if g.Directed {
			op = ">"
		}
		for _, e := range g.Edges {
			b.WriteString(" " + g.Nodes[e.From].Name + op + g.Nodes[e.To].Name)
		}
		b.WriteString("\n")
	}
	return b.String()
}

func mustRead(t testing.TB, src string) *File {
	t.Helper()
	f, err := Read([]byte(src), ReadOptions{Name: "t.gv"})
	if err != nil {
		t.Fatalf("Read(%q): %v", src, err)
	}
	return f
}

// The expected semantics follow the DOT conventions listed in
// SOURCES.md ("DOT conventions", from memory of the language
// documentation): first mention creates a node, 1 and "1" are one node,
// a subgraph operand stands for all nodes mentioned in it.
func TestReadSemantics(t *testing.T) {
	tests := []struct {
		name, src, want string
	}{
		{"chain", `graph { a -- b -- c }`, "graph ; nodes: a b c; edges: a-b b-c\n"},
		{"node then subgraph", `graph { a -- {b c} }`, "graph ; nodes: a b c; edges: a-b a-c\n"},
		{"cross product order", `graph { {a b} -- {c d} }`, "graph ; nodes: a b c d; edges: a-c a-d b-c b-d\n"},
		{"numeral and quoted are one node", `graph { 1 -- "1" }`, "graph ; nodes: 1; edges: 1-1\n"},
		{"escaped quote", `graph { "a\"b" -- a }`, "graph ; nodes: a\"b a; edges: a\"b-a\n"},
		{"backslash pair kept", `graph { "a\\b" }`, "graph ; nodes: a\\\\b; edges:\n"},
		{"backslash newline", "graph { \"con\\\ntinued\" -- continued }", "graph ; nodes: continued; edges: continued-continued\n"},
		{"html differs from quoted", `graph { <b> -- "<b>" -- b }`, "graph ; nodes: <b> <b> b; edges: <b>-<b> <b>-b\n"},
		{"self loop and repeated edge kept", `graph { a -- a; a -- b; b -- a }`, "graph ; nodes: a b; edges: a-a a-b b-a\n"},
		{"strict keeps repeated edges", `strict graph { a -- b; a -- b }`, "strict graph ; nodes: a b; edges: a-b a-b\n"},
		{"directed", `digraph D { a -> b }`, "digraph D; nodes: a b; edges: a>b\n"},
		{"nested subgraph operand", `graph { {a {b c}} -- d }`, "graph ; nodes: a b c d; edges: a-d b-d c-d\n"},
		{"repeated mention in operand", `graph { {a a b a} -- c }`, "graph ; nodes: a b c; edges: a-c b-c\n"},
		{"inner edges first", `graph { a -- {b -- c} }`, "graph ; nodes: a b c; edges: b-c a-b a-c\n"},
		{"empty operand", `graph { {} -- a -- {} }`, "graph ; nodes: a; edges:\n"},
		{"operand order of first mention", `graph { {c {a c} b} -- x }`, "graph ; nodes: c a b x; edges: c-x a-x b-x\n"},
		{"node statement creates", `graph { b; a -- b }`, "graph ; nodes: b a; edges: a-b\n"},
		{"attribute IDs are not nodes", `graph { a [label=b]; c = d; e }`, "graph ; nodes: a e; edges:\n"},
		{"ports are not nodes", `graph { a:p:n -- b:s }`, "graph ; nodes: a b; edges: a-b\n"},
		{"quoted compass point", `graph { a:p:"ne" -- b }`, "graph ; nodes: a b; edges: a-b\n"},
		{"subgraph names are not nodes", `graph { subgraph s { a } subgraph t { } }`, "graph ; nodes: a; edges:\n"},
		{"several graphs", "graph A { a -- b }\ndigraph B { b -> a }", "graph A; nodes: a b; edges: a-b\ndigraph B; nodes: b a; edges: b>a\n"},
		{"mixed-case keywords", `sTrIcT DIgraph { NoDe [shape=box]; SUBgraph s { x -> y } eDGE [a=b] }`, "strict digraph ; nodes: x y; edges: x>y\n"},
		{"gonum casings", `Strict Digraph { Node [shape=box]; SubGraph s { x -> y } EDGE [a=b] }`, "strict digraph ; nodes: x y; edges: x>y\n"},
		{"concatenation", `graph { "ab" -- "a" + "b" -- "a" /* c */ + // d
			"b" }`, "graph ; nodes: ab; edges: ab-ab ab-ab\n"},
		{"comments of all kinds", "# line one\n  # indented hash line\ngraph { a /* b */ -- c // d\n }\n// end", "graph ; nodes: a c; edges: a-c\n"},
		{"line comment at end of file", "graph { a } // no newline", "graph ; nodes: a; edges:\n"},
		{"hash line at end of file", "graph { a }\n# no newline", "graph ; nodes: a; edges:\n"},
		{"byte order mark", "\xEF\xBB\xBFgraph { a }", "graph ; nodes: a; edges:\n"},
		{"crlf", "graph {\r\n a -- b\r\n}\r\n", "graph ; nodes: a b; edges: a-b\n"},
		{"maximal munch", `graph { 123abc -- x }`, "graph ; nodes: 123 abc x; edges: abc-x\n"},
		{"negative numerals", `graph { 1--2 -- -3 }`, "graph ; nodes: 1 2 -3; edges: 1-2 2--3\n"},
		{"unicode IDs", `graph { café -- naïve }`, "graph ; nodes: café naïve; edges: café-naïve\n"},
		{"semicolons and commas", `graph { a [x=1, y=2; z=3]; b; }`, "graph ; nodes: a b; edges:\n"},
		{"edge subgraph keyword operand", `graph { a -- subgraph s { b c } -- d }`, "graph ; nodes: a b c d; edges: a-b a-c b-d c-d\n"},
		{"reopened subgraph operand", `graph { subgraph s { a b } subgraph s { } -- c }`, "graph ; nodes: a b c; edges: a-c b-c\n"},
		// The empty name is a name (found by FuzzFilter): "" reopens "".
		{"reopened empty-named subgraph", `graph { subgraph "" { a b } subgraph "" { } -- c }`, "graph ; nodes: a b c; edges: a-c b-c\n"},
		{"anonymous subgraphs never reopen", `graph { subgraph { a b } subgraph { } -- c }`, "graph ; nodes: a b c; edges:\n"},
		// A name is looked up in its parent only (found by FuzzFilter,
		// testdata/fuzz/FuzzFilter/93bcc3f7ef4dde9c in cmd/gridwood).
		{"same name in another parent is another subgraph", `graph { {subgraph s { a }} {subgraph s { b }} -- c }`, "graph ; nodes: a b c; edges: b-c\n"},
		{"same name in the same named parent reopens", `graph { subgraph t {subgraph s { a }} subgraph t {subgraph s { b }} -- c }`, "graph ; nodes: a b c; edges: a-c b-c\n"},
		{"nested operand reopens in its own parent", `graph { subgraph s { a } x -- { y -- subgraph s { b } } }`, "graph ; nodes: a x y b; edges: y-b x-y x-b\n"},
		{"HTML and quoted names differ", `graph { subgraph "x" { a } subgraph <x> { } -- c }`, "graph ; nodes: a c; edges:\n"},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			f := mustRead(t, tt.src)
			if got := dump(f); got != tt.want {
				t.Errorf("got\n%s\nwant\n%s", got, tt.want)
			}
		})
	}
}

func TestNodeIDAndPositions(t *testing.T) {
	src := "graph G {\n\t\"1\" -- 1 -- café -- \"x\" + \"y\" -- <<b>z</b>>\n}\n"
	f := mustRead(t, src)
	g := f.Graphs[0]
	want := []struct {
		id, name  string
		line, col int
	}{
		{`"1"`, "1", 2, 2},
		{"café", "café", 2, 14},
		{`"xy"`, "xy", 2, 23},
		{"<<b>z</b>>", "<<b>z</b>>", 2, 36},
	}
	if len(g.Nodes) != len(want) {
		t.Fatalf("got %d nodes, want %d", len(g.Nodes), len(want))
	}
	for i, w := range want {
		n := g.Nodes[i]
		if n.ID != w.id || n.Name != w.name || n.Line != w.line || n.Col != w.col {
			t.Errorf("node %d: got %s %q %d:%d, want %s %q %d:%d", i, n.ID, n.Name, n.Line, n.Col, w.id, w.name, w.line, w.col)
		}
	}
	if g.Line != 1 || g.Col != 1 {
		t.Errorf("graph at %d:%d, want 1:1", g.Line, g.Col)
	}
	// Edge operators: after "1" (col 6), after 1 (col 11), after café (col
	// 20: é is two bytes), after the concatenation (col 33).
	wantOps := [][2]int{{2, 6}, {2, 11}, {2, 20}, {2, 33}}
	for i, w := range wantOps {
		if l, c := g.EdgePos(i); l != w[0] || c != w[1] {
			t.Errorf("edge %d at %d:%d, want %d:%d", i, l, c, w[0], w[1])
		}
	}
	if i, ok := g.Lookup("1"); !ok || i != 0 {
		t.Errorf("Lookup(1) = %d, %v", i, ok)
	}
	if i, ok := g.Lookup("<<b>z</b>>"); !ok || i != 3 {
		t.Errorf("Lookup(html) = %d, %v", i, ok)
	}
	if _, ok := g.Lookup(`"1"`); ok {
		t.Errorf("Lookup takes canonical names, not lexemes")
	}
}

func TestLookupPrefersQuoted(t *testing.T) {
	g := mustRead(t, `graph { <b> -- "<b>" }`).Graphs[0]
	if i, ok := g.Lookup("<b>"); !ok || i != 1 {
		t.Errorf("Lookup(<b>) = %d, %v; want the quoted node 1", i, ok)
	}
	g = mustRead(t, `graph { <b> }`).Graphs[0]
	if i, ok := g.Lookup("<b>"); !ok || i != 0 {
		t.Errorf("Lookup(<b>) = %d, %v; want the HTML node 0", i, ok)
	}
}

func readFile(t testing.TB, name string) *File {
	t.Helper()
	src, err := os.ReadFile(filepath.Join("testdata", name))
	if err != nil {
		t.Fatal(err)
	}
	f, err := Read(src, ReadOptions{Name: name})
	if err != nil {
		t.Fatal(err)
	}
	return f
}

func TestNodeAttrsScoped(t *testing.T) {
	g := readFile(t, "scopes.gv").Graphs[0]
	want := map[string]NodeAttrs{
		"a": {Shape: "box", Width: "1"},
		"b": {Shape: "circle", Width: "1", Label: "Bee", FontSize: "12"},
		"c": {Shape: "circle", Width: "2"},
		"d": {Shape: "circle", Width: "2"},
		"e": {Shape: "circle", Width: "1"},
		"f": {Shape: "box", Width: "1"},
		"g": {Shape: "box", Width: "1", Height: "3"},
	}
	if len(g.Nodes) != len(want) {
		t.Fatalf("got %d nodes", len(g.Nodes))
	}
	for _, n := range g.Nodes {
		if n.Attrs != want[n.Name] {
			t.Errorf("node %s: got %+v, want %+v", n.Name, n.Attrs, want[n.Name])
		}
	}
	g = readFile(t, "tram.gv").Graphs[0]
	i, _ := g.Lookup("Harbour")
	if got := g.Nodes[i].Attrs; got.Pos != "10,20!" || got.Width != "0.5" || got.Shape != "circle" {
		t.Errorf("Harbour: %+v", got)
	}
	i, _ = g.Lookup("Cathedral")
	if got := g.Nodes[i].Attrs; got.Label != "St. Ives" || got.FontSize != "9" || got.Shape != "doublecircle" || got.Pos != "0,0" {
		t.Errorf("Cathedral: %+v", got)
	}
	i, _ = g.Lookup("Market") // created before the cluster changed the shape
	if got := g.Nodes[i].Attrs.Shape; got != "circle" {
		t.Errorf("Market shape %q, want circle", got)
	}
}

func TestEdgeAttrsScoped(t *testing.T) {
	g := readFile(t, "scopes.gv").Graphs[0]
	want := []string{
		"color=blue style=bold",
		"color=green style=bold",
		"color=black",
	}
	if len(g.Edges) != len(want) {
		t.Fatalf("got %d edges", len(g.Edges))
	}
	for i := range g.Edges {
		var parts []string
		for _, a := range g.EdgeAttrs(i) {
			parts = append(parts, a.Key+"="+a.Value)
		}
		if got := strings.Join(parts, " "); got != want[i] {
			t.Errorf("edge %d: got %q, want %q", i, got, want[i])
		}
	}
	// A quoted key replaces the unquoted one in place.
	g = mustRead(t, `graph { edge [color=red, w=1]; a -- b ["color"=blue] }`).Graphs[0]
	got := g.EdgeAttrs(0)
	if len(got) != 2 || got[0] != (Attr{`"color"`, "blue"}) || got[1] != (Attr{"w", "1"}) {
		t.Errorf("got %v", got)
	}
}

// Positions are 1-based lines and byte columns with tabs counting 1, the
// convention of Go tooling (common practice).
func TestReadErrors(t *testing.T) {
	tests := []struct {
		name, src, want string
	}{
		{"empty", "", "t.gv:1:1: no graph in input"},
		{"only comments", "// nothing\n/* here */\n", "t.gv:3:1: no graph in input"},
		{"stray at", "graph {\n\ta @ b\n}", "t.gv:2:4: unexpected character '@'"},
		{"stray after utf8", "graph { café @ }", "t.gv:1:15: unexpected character '@'"},
		{"lone dash", "graph { a - b }", "t.gv:1:11: unexpected '-' (edge operators are -- and ->)"},
		{"triple dash", "graph { a --- b }", "t.gv:1:13: unexpected '-' (edge operators are -- and ->)"},
		{"lone slash", "graph { a / b }", "t.gv:1:11: unexpected character '/'"},
		{"lone dot", "graph { . }", "t.gv:1:9: unexpected '.'"},
		{"control char", "graph { \x07 }", "t.gv:1:9: unexpected character U+0007"},
		{"invalid utf8", "graph { ab\xffc }", "t.gv:1:11: invalid UTF-8 encoding"},
		{"invalid utf8 in comment", "graph { /* \xc3 */ }", "t.gv:1:12: invalid UTF-8 encoding"},
		{"invalid utf8 in string", "graph {\n\t\"x\xe2\x82\" }", "t.gv:2:4: invalid UTF-8 encoding"},
		{"nul", "graph { a\x00 }", "t.gv:1:10: NUL byte in input"},
		{"nul in comment", "graph { } // \x00", "t.gv:1:14: NUL byte in input"},
		{"replacement char", "graph { \uFFFD }", "t.gv:1:9: character U+FFFD is not allowed outside comments"},
		{"replacement char in string", "graph { \"a\uFFFD\" }", "t.gv:1:11: character U+FFFD is not allowed outside comments"},
		{"unterminated string", "graph {\n\ta -- \"b\n}\n", "t.gv:2:7: unterminated quoted string"},
		{"unterminated html", "graph { <a <b> }", "t.gv:1:9: unterminated HTML string"},
		{"html too deep", "graph { <a<b<c>>> }", "t.gv:1:13: '<' inside a tag of an HTML string is not supported"},
		{"unterminated comment", "graph { /* a\n */ b /* c", "t.gv:2:7: unterminated block comment"},
		{"plus without strings", "graph { a + b }", "t.gv:1:11: '+' must join two quoted strings"},
		{"plus before id", "graph { \"a\" + b }", "t.gv:1:13: '+' must join two quoted strings"},
		{"plus after html", "graph { <a> + \"b\" }", "t.gv:1:13: '+' must join two quoted strings"},
		{"hash mid line", "graph { a [color=#ff0000] }", `t.gv:1:18: '#' starts a comment only at the beginning of a line; quote IDs that contain it, e.g. "#ff0000"`},
		{"undirected op in digraph", "digraph {\n\ta -- b\n}", "t.gv:2:4: '--' in a digraph; use '->'"},
		{"directed op in graph", "graph { a -> b }", "t.gv:1:11: '->' in an undirected graph; use '--'"},
		{"second graph kind", "digraph { a -> b }\ngraph { a -> b }", "t.gv:2:11: '->' in an undirected graph; use '--'"},
		{"bad compass", "graph { a:p:up }", "t.gv:1:13: invalid compass point \"up\"; want one of n, ne, e, se, s, sw, w, nw, c, _"},
		{"escaped backslash before newline", "graph { \"a\\\\\n\" }", `t.gv:1:11: line break right after an escaped backslash (\\) in a quoted string is not supported`},
		// Syntax errors come from gonum's parser, positioned in our metric.
		{"missing operand", "graph {\n\ta -- b -- }", `t.gv:2:12: syntax error: unexpected "}"; expected one of "{", subgraph or ID`},
		{"tabs before error", "graph {\n\t\t\ta = }", `t.gv:2:8: syntax error: unexpected "}"; expected ID`},
		{"utf8 before error", "graph { é ö = ; }", `t.gv:1:17: syntax error: unexpected ";"; expected ID`},
		{"crlf before error", "graph {\r\n a\r\n ]\r\n}", `t.gv:3:2: syntax error: unexpected "]"; expected one of "{", "}", graph, ";", "--", "->", node, edge, "[", "=", subgraph, ":", or ID`},
		{"after concatenation", "graph {\n\t\"a\" +\n\t\"b\" +\n\t\"c\" = ]\n}", `t.gv:4:8: syntax error: unexpected "]"; expected ID`},
		{"end of input", "graph { a", "t.gv:1:10: syntax error: unexpected end of input; expected one of \"{\", \"}\", graph, \";\", \"--\", \"->\", node, edge, \"[\", \"=\", subgraph, \":\", or ID"},
		{"junk after graph", "graph { }\nx", `t.gv:2:1: syntax error: unexpected "x"; expected one of end of input, strict, graph, or digraph`},
		{"no graph keyword", "a -- b", `t.gv:1:1: syntax error: unexpected "a"; expected one of strict, graph or digraph`},
		{"empty statement", "graph { a;; }", `t.gv:1:11: syntax error: unexpected ";"; expected one of "{", "}", graph, node, edge, subgraph, or ID`},
		{"bare cr", "graph { a\rb = ; }", `t.gv:1:15: syntax error: unexpected ";"; expected ID`},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			_, err := Read([]byte(tt.src), ReadOptions{Name: "t.gv"})
			if err == nil {
				t.Fatalf("no error, want %s", tt.want)
			}
			var e *Error
			if !errors.As(err, &e) {
				t.Fatalf("error %v is %T, not *Error", err, err)
			}
			if err.Error() != tt.want {
				t.Errorf("got  %s\nwant %s", err, tt.want)
			}
		})
	}
}

// TestNumeralRunIntoLetter: DOT's lexer ends a numeral at the first
// character that cannot continue it, so `1e3` is the two IDs 1 and e3
// (SOURCES.md, numerals); Read follows it and says so in File.Warnings,
// once, at the first such place, with how many more there are.
func TestNumeralRunIntoLetter(t *testing.T) {
	tests := []struct {
		src   string
		nodes string // the nodes read
		warn  string // the warning, "" for none
	}{
		{"graph { a -- 1e3 }", "a 1 e3", `t.gv:1:14: "1e3" is read as two IDs, 1 and e3, as DOT reads numerals (no exponent, no suffix); quote it to make it one`},
		{"graph { -2.5x; 7_a }", "-2.5 x 7 _a", `t.gv:1:9: "-2.5x" is read as two IDs, -2.5 and x, as DOT reads numerals (no exponent, no suffix); quote it to make it one (and 1 more like it)`},
		{"graph {\n 1.2.3 }", "1.2 .3", `t.gv:2:2: "1.2.3" is read as two IDs, 1.2 and .3, as DOT reads numerals (no exponent, no suffix); quote it to make it one`},
		{"graph { 1 e3; \"1e3\"; a [width=2]; 12 }", "1 e3 1e3 a 12", ""},
	}
	for _, tc := range tests {
		f, err := Read([]byte(tc.src), ReadOptions{Name: "t.gv"})
		if err != nil {
			t.Errorf("%q: %v", tc.src, err)
			continue
		}
		if got := strings.Join(nodeNames(f.Graphs[0]), " "); got != tc.nodes {
			t.Errorf("%q: nodes %q, want %q", tc.src, got, tc.nodes)
		}
		var warns []string
		for _, w := range f.Warnings {
			warns = append(warns, w.Error())
		}
		if got := strings.Join(warns, "\n"); got != tc.warn {
			t.Errorf("%q: warnings\n%s\nwant\n%s", tc.src, got, tc.warn)
		}
	}
}
