package dotio

import (
	"fmt"
	"math/rand"
	"slices"
	"strings"
	"testing"
)

// nodeAttrKeys are the keys NodeAttrs holds, with a getter for each.
var nodeAttrKeys = []struct {
	key string
	get func(NodeAttrs) string
}{
	{"width", func(a NodeAttrs) string { return a.Width }},
	{"height", func(a NodeAttrs) string { return a.Height }},
	{"label", func(a NodeAttrs) string { return a.Label }},
	{"fontsize", func(a NodeAttrs) string { return a.FontSize }},
	{"shape", func(a NodeAttrs) string { return a.Shape }},
	{"fixedsize", func(a NodeAttrs) string { return a.FixedSize }},
	{"pos", func(a NodeAttrs) string { return a.Pos }},
}

// tablesAgree checks NodeTable against the reader's NodeAttrs (two
// computations of one rule: one during the walk, one after it) and
// EdgeTable against EdgeAttrs.
func tablesAgree(t *testing.T, name string, f *File) {
	t.Helper()
	keys := make([]string, len(nodeAttrKeys))
	for i, k := range nodeAttrKeys {
		keys[i] = k.key
	}
	for _, g := range f.Graphs {
		nt := g.NodeTable(keys...)
		for v, n := range g.Nodes {
			for _, k := range nodeAttrKeys {
				a, ok := nt.Get(v, k.key)
				got, _ := a.Text()
				if want := k.get(n.Attrs); got != want || !ok && want != "" {
					t.Fatalf("%s: node %s %s: table %q (set %v), NodeAttrs %q", name, n.Name, k.key, got, ok, want)
				}
			}
		}
		ekeys := g.AttrKeys().Edge
		et := g.EdgeTable(ekeys...)
		for i := range g.Edges {
			want := g.EdgeAttrs(i)
			for _, key := range ekeys {
				got, ok := et.Get(i, key)
				j := slices.IndexFunc(want, func(a Attr) bool { return a.Name() == key })
				switch {
				case j < 0 && ok:
					t.Fatalf("%s: edge %d: %s=%s in the table, not in EdgeAttrs %v", name, i, key, got.Value, want)
				case j >= 0 && (!ok || got != want[j]):
					t.Fatalf("%s: edge %d: %s is %v (set %v) in the table, %v in EdgeAttrs", name, i, key, got, ok, want[j])
				}
			}
		}
	}
}

func TestTablesAgreeWithReader(t *testing.T) {
	for name, src := range testInputs(t) {
		f, err := Read(src, ReadOptions{Name: name})
		if err != nil {
			t.Fatal(err)
		}
		tablesAgree(t, name, f)
	}
	rng := rand.New(rand.NewSource(23))
	for range 2000 {
		src, _ := generate(rng)
		f, err := Read([]byte(src), ReadOptions{Name: "gen"})
		if err != nil {
			t.Fatal(err)
		}
		tablesAgree(t, src, f)
	}
}

func TestNodeTableScopes(t *testing.T) {
	src := `digraph G {
		node [shape=box, "label"="L"]
		a
		subgraph s { node [shape=circle] b; a [color=red] }
		c -> { node [color=blue] d } [color=green]
		b [shape=egg, label=""]
		e [label=<<b>x</b>>]
	}`
	g := mustRead(t, src).Graphs[0]
	nt := g.NodeTable("shape", "label", "color")
	want := map[string]string{
		"a": "shape=box label=L color=red",
		"b": "shape=egg label= color=",
		"c": "shape=box label=L color=",
		"d": "shape=box label=L color=blue",
		"e": "shape=box label=<<b>x</b>> color=",
	}
	for v, n := range g.Nodes {
		var parts []string
		for _, k := range []string{"shape", "label", "color"} {
			a, _ := nt.Get(v, k)
			text, _ := a.Text()
			parts = append(parts, k+"="+text)
		}
		if got := strings.Join(parts, " "); got != want[n.Name] {
			t.Errorf("%s: %q, want %q", n.Name, got, want[n.Name])
		}
	}
	// label="" is set (to nothing); an unknown key never is.
	if a, ok := nt.Get(1, "label"); !ok || a.Value != `""` {
		t.Errorf("b's label: %v %v, want set to \"\"", a, ok)
	}
	if _, ok := nt.Get(0, "width"); ok {
		t.Error("a key the table was not made for is set")
	}
	if a, html := (Attr{Value: "<<b>x</b>>"}).Text(); !html || a != "<<b>x</b>>" {
		t.Errorf("HTML value %q %v", a, html)
	}
}

func TestGraphAttrsAndKeys(t *testing.T) {
	src := `graph "g\"1" {
		graph [label="top", rankdir=LR]
		fontsize=9
		subgraph cluster_a { label="inner"; color=red; a [shape=box] }
		node [width=1]
		a -- b [penwidth=2]
		edge [style=dashed]
		{ c [fixedsize=true] } -- d
		label="again"
	}`
	g := mustRead(t, src).Graphs[0]
	if g.Name != `g"1` {
		t.Errorf("Name %q", g.Name)
	}
	var got []string
	for _, a := range g.GraphAttrs() {
		text, _ := a.Text()
		got = append(got, a.Name()+"="+text)
	}
	if want := "label=again rankdir=LR fontsize=9"; strings.Join(got, " ") != want {
		t.Errorf("GraphAttrs %q, want %q", strings.Join(got, " "), want)
	}
	k := g.AttrKeys()
	for _, c := range []struct {
		kind      string
		got, want []string
	}{
		{"graph", k.Graph, []string{"label", "rankdir", "fontsize"}},
		{"subgraph", k.Subgraph, []string{"label", "color"}},
		{"node", k.Node, []string{"shape", "width", "fixedsize"}},
		{"edge", k.Edge, []string{"penwidth", "style"}},
	} {
		if !slices.Equal(c.got, c.want) {
			t.Errorf("%s keys %q, want %q", c.kind, c.got, c.want)
		}
	}
}

// Large defaults and many node statements cost the keys asked for, not
// their product: a table of 2 keys over 1,000 defaults and 20,000 node
// statements holds one defaults snapshot per `node [...]` statement.
func TestNodeTableNotQuadratic(t *testing.T) {
	var b strings.Builder
	b.WriteString("graph G {\n node [")
	for i := range 1000 {
		fmt.Fprintf(&b, "k%d=1 ", i)
	}
	b.WriteString("]\n")
	for i := range 20000 {
		fmt.Fprintf(&b, " n%d [k%d=2]\n", i, i%1000)
	}
	b.WriteString("}\n")
	g := mustRead(t, b.String()).Graphs[0]
	nt := g.NodeTable("k1", "k2")
	if len(nt.snaps) != 2 {
		t.Errorf("%d defaults snapshots, want 2 (none, and the one node statement)", len(nt.snaps))
	}
	if a, _ := nt.Get(1, "k1"); a.Value != "2" {
		t.Errorf("n1's k1 %q, want its own 2", a.Value)
	}
	if a, _ := nt.Get(2, "k1"); a.Value != "1" {
		t.Errorf("n2's k1 %q, want the default 1", a.Value)
	}
}
