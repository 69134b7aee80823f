package dotio

import (
	"bytes"
	"fmt"
	"io"
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

// BenchmarkStage measures reading (scanner, gonum's parser and the walk
// that builds the graph), building the edge list the layout takes, and
// writing, on the benchmark families (see bench/run).
func BenchmarkStage(b *testing.B) {
	for _, n := range stagebench.Sizes {
		for _, g := range stagebench.Families(n) {
			src := stageDOT(g)
			m := len(g.Edges)
			b.Run(fmt.Sprintf("read/%s", g.Name), func(b *testing.B) {
				stagebench.PerEdge(b, m, func() {
					if _, err := Read(src, ReadOptions{Name: "bench"}); err != nil {
						b.Fatal(err)
					}
				})
			})
			f, err := Read(src, ReadOptions{Name: "bench"})
			if err != nil {
				b.Fatal(err)
			}
			gr := f.Graphs[0]
			b.Run(fmt.Sprintf("build/%s", g.Name), func(b *testing.B) {
				stagebench.PerEdge(b, m, func() {
					edges := make([][2]int32, len(gr.Edges))
					for i, e := range gr.Edges {
						edges[i] = [2]int32{e.From, e.To}
					}
				})
			})
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
