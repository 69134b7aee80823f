package dotio

import (
	"bytes"
	"fmt"
	"io"
	"strings"
	"testing"

	"github.com/gridwood/gridwood/internal/graphgen"
	"github.com/gridwood/gridwood/internal/stagebench"
)

// stageDOT writes g as the command's benchmark inputs are written.
func stageDOT(g graphgen.Graph) []byte {
	var buf bytes.Buffer
	graphgen.WriteDOT(&buf, g)
	return buf.Bytes()
}

// BenchmarkStage measures reading (our scanner and gonum's parser: DOT
// text to syntax tree), building the graph (the walk that collects nodes
// and edges from the tree, and the edge list the layout takes), and
// writing, on the benchmark families (see bench/run).
func BenchmarkStage(b *testing.B) {
	for _, n := range stagebench.Sizes {
		for _, g := range stagebench.Families(n) {
			src := stageDOT(g)
			m := len(g.Edges)
			b.Run(fmt.Sprintf("read/%s", g.Name), func(b *testing.B) {
				stagebench.PerEdge(b, m, func() {
					if _, err := parseTree(src, "bench", func() {}); err != nil {
						b.Fatal(err)
					}
				})
			})
			t, err := parseTree(src, "bench", func() {})
			if err != nil {
				b.Fatal(err)
			}
			b.Run(fmt.Sprintf("build/%s", g.Name), func(b *testing.B) {
				stagebench.PerEdge(b, m, func() {
					f, err := t.build(ReadOptions{})
					if err != nil {
						b.Fatal(err)
					}
					gr := f.Graphs[0]
					edges := make([][2]int32, len(gr.Edges))
					for i, e := range gr.Edges {
						edges[i] = [2]int32{e.From, e.To}
					}
				})
			})
			f, err := t.build(ReadOptions{})
			if err != nil {
				b.Fatal(err)
			}
			gr := f.Graphs[0]
			lay := Layout{X: make([]int64, len(gr.Nodes)), Y: make([]int64, len(gr.Nodes))}
			b.Run(fmt.Sprintf("write/%s", g.Name), func(b *testing.B) {
				stagebench.PerEdge(b, m, func() {
					if err := Write(io.Discard, f, []Layout{lay}, WriteOptions{}); err != nil {
						b.Fatal(err)
					}
				})
			})
		}
	}
}

// TestTreeBuildsAgain: the walk that builds the graphs leaves the syntax
// tree as it was, so building twice from one tree (as BenchmarkStage's
// build stage does) gives the same graphs, and the same as Read.
func TestTreeBuildsAgain(t *testing.T) {
	src := []byte("graph G { a -- {b c} -- d [w=1]; subgraph s { e -- a } }\ndigraph H { x -> y -> x }\n")
	tr, err := parseTree(src, "t", func() {})
	if err != nil {
		t.Fatal(err)
	}
	describe := func(f *File) string {
		var b strings.Builder
		for _, g := range f.Graphs {
			fmt.Fprintf(&b, "%s %d:", g.ID, len(g.Nodes))
			for _, e := range g.Edges {
				fmt.Fprintf(&b, " %s-%s", g.Nodes[e.From].Name, g.Nodes[e.To].Name)
			}
			b.WriteString("\n")
		}
		return b.String()
	}
	var got []string
	for range 2 {
		f, err := tr.build(ReadOptions{})
		if err != nil {
			t.Fatal(err)
		}
		got = append(got, describe(f))
	}
	f, err := Read(src, ReadOptions{Name: "t"})
	if err != nil {
		t.Fatal(err)
	}
	if want := describe(f); got[0] != want || got[1] != want {
		t.Errorf("built %q then %q, Read gives %q", got[0], got[1], want)
	}
}
