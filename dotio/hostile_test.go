package dotio

import (
	"bytes"
	"errors"
	"fmt"
	"strings"
	"testing"
)

// crossProduct returns `graph { {a1 ... an} -- {b1 ... bn} }`.
func crossProduct(n int) []byte {
	var b bytes.Buffer
	b.WriteString("graph {\n\t{")
	for i := range n {
		fmt.Fprintf(&b, " a%d", i)
	}
	b.WriteString(" } -- {")
	for i := range n {
		fmt.Fprintf(&b, " b%d", i)
	}
	b.WriteString(" }\n}\n")
	return b.Bytes()
}

func TestExpansionCap(t *testing.T) {
	src := crossProduct(3000)
	_, err := Read(src, ReadOptions{Name: "x.gv"})
	var e *Error
	if !errors.As(err, &e) {
		t.Fatalf("got %v, want *Error", err)
	}
	op := bytes.Index(src, []byte("--"))
	want := fmt.Sprintf("x.gv:2:%d: edge statement expands to 9000000 edges, more than the limit of 1000000 (raise it with --max-expansion)", op-bytes.IndexByte(src, '\n'))
	if err.Error() != want {
		t.Errorf("got  %v\nwant %s", err, want)
	}

	tests := []struct {
		src   string
		limit int
		want  string // "" for success
	}{
		{"graph { {a b c} -- {d e f} }", 8, "t:1:17: edge statement expands to 9 edges, more than the limit of 8 (raise it with --max-expansion)"},
		{"graph { {a b c} -- {d e f} }", 9, ""},
		{"graph { {a b c} -- {d e f} }", -1, ""},
		{"graph { {a b} -- {c d}\n{a b} -- {c d} }", 5, "t:2:7: edge statements with subgraph operands expand to 8 edges in total, more than the limit of 5 (raise it with --max-expansion)"},
		{"graph { a -- b -- c -- d -- e -- f }", 1, ""}, // node-to-node edges are not capped
		{"graph { {a a a a} -- {b b} }", 1, ""},         // sets, not mentions, count
		{"graph A { {a b} -- c }\ngraph B { {a b} -- c }", 3, "t:2:17: edge statements with subgraph operands expand to 4 edges in total, more than the limit of 3 (raise it with --max-expansion)"},
	}
	for _, tt := range tests {
		_, err := Read([]byte(tt.src), ReadOptions{Name: "t", MaxExpansion: tt.limit})
		got := ""
		if err != nil {
			got = err.Error()
		}
		if got != tt.want {
			t.Errorf("%q limit %d: got %q, want %q", tt.src, tt.limit, got, tt.want)
		}
	}
}

func nested(depth int, inner string) []byte {
	var b bytes.Buffer
	b.WriteString("graph {\n")
	b.WriteString(strings.Repeat("{", depth))
	b.WriteString(inner)
	b.WriteString(strings.Repeat("}", depth))
	b.WriteString("\n}\n")
	return b.Bytes()
}

func TestDeepNesting(t *testing.T) {
	const depth = 100_000
	src := nested(depth, "a -- b")
	f, err := Read(src, ReadOptions{Name: "deep"})
	if err != nil {
		t.Fatal(err)
	}
	if got := dump(f); got != "graph ; nodes: a b; edges: a-b\n" {
		t.Errorf("got %s", got)
	}
	var out bytes.Buffer
	if err := Write(&out, f, synthLayout(f), WriteOptions{}); err != nil {
		t.Fatal(err)
	}
	// Indentation is capped, so the output stays linear in the depth.
	if out.Len() > 25*depth {
		t.Errorf("output of %d bytes for depth %d", out.Len(), depth)
	}
	f2, err := Read(out.Bytes(), ReadOptions{Name: "deep.out"})
	if err != nil {
		t.Fatal(err)
	}
	if dump(f2) != dump(f) {
		t.Errorf("re-read gives %s", dump(f2))
	}
}

// nestedOperands builds, depth levels deep, `{ PREFIX -- { ... } }` where
// each level is the right operand of the level above.
func nestedOperands(depth int, level func(i int) string) []byte {
	var b bytes.Buffer
	b.WriteString("graph {\n")
	for i := range depth {
		b.WriteString(level(i))
		b.WriteString(" -- {")
	}
	b.WriteString("z")
	b.WriteString(strings.Repeat("}", depth))
	b.WriteString("\n}\n")
	return b.Bytes()
}

// Nested subgraph operands must not cost time quadratic in the depth: the
// node set of each operand is computed once and reused by the enclosing one.
func TestNestedOperandsNotQuadratic(t *testing.T) {
	const depth = 20_000
	// The same node at every level: the innermost level gives a--z, every
	// other one a--a and a--z (its right operand holds {a, z}).
	f, err := Read(nestedOperands(depth, func(int) string { return "a" }), ReadOptions{Name: "n"})
	if err != nil {
		t.Fatal(err)
	}
	if g := f.Graphs[0]; len(g.Nodes) != 2 || len(g.Edges) != 2*depth-1 {
		t.Errorf("%d nodes, %d edges", len(g.Nodes), len(g.Edges))
	}
	// Empty left operands: no edges at all however deep the sets are.
	f, err = Read(nestedOperands(depth, func(i int) string { return fmt.Sprintf("n%d {}", i) }), ReadOptions{Name: "n"})
	if err != nil {
		t.Fatal(err)
	}
	if g := f.Graphs[0]; len(g.Nodes) != depth+1 || len(g.Edges) != 0 {
		t.Errorf("%d nodes, %d edges", len(g.Nodes), len(g.Edges))
	}
}

func TestHostileBytes(t *testing.T) {
	for _, src := range []string{
		"\x00", "\xff\xfe", "graph {\xc0\xaf}", "graph { \"\x00\" }", "graph { <\xff> }",
		strings.Repeat("{", 1000), strings.Repeat("graph {", 1000), strings.Repeat("\"", 1001),
		"graph { a -- " + strings.Repeat("{", 5000), "graph {" + strings.Repeat("a -- ", 10000) + "}",
	} {
		f, err := Read([]byte(src), ReadOptions{Name: "h"})
		if err == nil {
			t.Errorf("%.40q: accepted (%d graphs)", src, len(f.Graphs))
			continue
		}
		var e *Error
		if !errors.As(err, &e) || e.Line == 0 {
			t.Errorf("%.40q: %v is not a positioned *Error", src, err)
		}
	}
}

// TestChainLimit checks the cap on the operators of one edge statement
// (maxChain, lowered here to 3): a chain of 3 edges is read, one of 4 is
// refused at its fourth operator; semicolons, attribute lists, new
// statements and braces end or open counts, so neither several short
// chains nor a chain with subgraph operands holding chains is refused.
func TestChainLimit(t *testing.T) {
	defer func(old int32) { maxChain = old }(maxChain)
	maxChain = 3
	tests := []struct {
		src string
		col int // column of the refused operator; 0: read
	}{
		{"graph { a -- b -- c -- d }", 0},
		{"graph { a -- b -- c -- d -- e }", 26},
		{"graph { a -- b -- c -- d; e -- f -- g -- h }", 0},
		{"graph { a -- b -- c -- d [w=1] e -- f -- g -- h }", 0},
		{"graph { a -- b -- c -- d e -- f -- g -- h }", 0},
		{"graph { a -- {b -- c -- d -- e} -- f -- g }", 0},
		{"graph { a -- {b -- c -- d -- e -- x} }", 32},
		{"graph { a:p -- b:q:n -- c -- d -- e }", 32},
		{"graph { subgraph s { a -- b } -- c -- d -- e }", 0},
		{"graph { subgraph s { a -- b } -- c -- d -- e -- f }", 46},
	}
	for _, tc := range tests {
		_, err := Read([]byte(tc.src), ReadOptions{Name: "t.gv"})
		var e *Error
		switch {
		case tc.col == 0 && err != nil:
			t.Errorf("%s: %v", tc.src, err)
		case tc.col > 0 && (!errors.As(err, &e) || e.Line != 1 || e.Col != tc.col || !strings.Contains(e.Msg, "chains more than 3 edges")):
			t.Errorf("%s: error %v, want one at 1:%d", tc.src, err, tc.col)
		}
	}
}

// TestNestingLimit: braces nested past maxNesting are refused by the
// scanner, before gonum's parser (whose syntax check recurses once per
// level) sees them, with the position of the first brace too deep. A
// graph's body is level 1; subgraph bodies, subgraph operands and
// anonymous braces all count, and closing braces give the levels back.
func TestNestingLimit(t *testing.T) {
	defer func(old int) { maxNesting = old }(maxNesting)
	maxNesting = 4
	tests := []struct {
		src string
		col int // column of the refused brace; 0: read
	}{
		{"graph { {{{a}}} }", 0},
		{"graph { {{{{a}}}} }", 12},
		{"graph { subgraph s { x -- {y -- {z}} } }", 0},
		{"graph { subgraph s { x -- {y -- {z -- {w}}} } }", 39},
		{"graph { {{{a}}} {{{b}}} {{{c}}} }", 0},
		{"graph { {{{a}}} } graph { {{{b}}} }", 0},
		{"digraph { {{{a -> {b}}}} }", 19},
	}
	for _, tc := range tests {
		_, err := Read([]byte(tc.src), ReadOptions{Name: "t.gv"})
		var e *Error
		switch {
		case tc.col == 0 && err != nil:
			t.Errorf("%s: %v", tc.src, err)
		case tc.col > 0 && (!errors.As(err, &e) || e.Line != 1 || e.Col != tc.col || e.Msg != "braces nested more than 4 levels deep, the most gridwood reads"):
			t.Errorf("%s: error %v, want one at 1:%d", tc.src, err, tc.col)
		}
	}
	if MaxNesting != 1_000_000 {
		t.Errorf("MaxNesting is %d; README.md documents 1,000,000", MaxNesting)
	}
}
