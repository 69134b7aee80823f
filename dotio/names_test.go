package dotio

import (
	"testing"

	"gonum.org/v1/gonum/graph/formats/dot"
	"gonum.org/v1/gonum/graph/formats/dot/ast"
)

// QuoteText escapes backslashes and double quotes, and what it writes is
// one DOT string token: gonum's DOT parser (an outside reading of the
// grammar) takes it whole as the attribute's value.
func TestQuoteText(t *testing.T) {
	for _, c := range []struct{ text, want string }{
		{"plain", `"plain"`},
		{`say "hi"`, `"say \"hi\""`},
		{`a\b`, `"a\\b"`},
		{"two words, and a comma", `"two words, and a comma"`},
		{"", `""`},
	} {
		got := QuoteText(c.text)
		if got != c.want {
			t.Errorf("QuoteText(%q) = %s, want %s", c.text, got, c.want)
		}
		f, err := dot.ParseString("graph { x [label=" + got + "] }")
		if err != nil {
			t.Errorf("QuoteText(%q) = %s does not parse: %v", c.text, got, err)
			continue
		}
		st, ok := f.Graphs[0].Stmts[0].(*ast.NodeStmt)
		if !ok || len(st.Attrs) != 1 || st.Attrs[0].Val != got {
			t.Errorf("QuoteText(%q) = %s: gonum's parser reads %#v", c.text, got, f.Graphs[0].Stmts[0])
		}
	}
}

func TestDescribe(t *testing.T) {
	for _, c := range []struct {
		src   string
		index int
		want  string
	}{
		{"graph G { a }", 0, `graph "G"`},
		{"digraph \"two words\" { a }", 0, `digraph "two words"`},
		{"graph { a }", 2, "anonymous graph 3"},
		{"digraph { a }", 0, "anonymous digraph 1"},
	} {
		f, err := Read([]byte(c.src), ReadOptions{Name: "t.dot"})
		if err != nil {
			t.Fatalf("%s: %v", c.src, err)
		}
		if got := f.Graphs[0].Describe(c.index); got != c.want {
			t.Errorf("%s: Describe(%d) = %s, want %s", c.src, c.index, got, c.want)
		}
	}
}
