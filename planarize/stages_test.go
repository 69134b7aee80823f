package planarize

import (
	"fmt"
	"runtime"
	"testing"

	"github.com/gridwood/gridwood/internal/graphgen"
)

// reportPerEdge adds ns/edge and B/edge to a benchmark that ran fn b.N times.
func reportPerEdge(b *testing.B, m int, fn func()) {
	var before, after runtime.MemStats
	runtime.ReadMemStats(&before)
	for b.Loop() {
		fn()
	}
	runtime.ReadMemStats(&after)
	m = max(m, 1)
	b.ReportMetric(float64(b.Elapsed().Nanoseconds())/float64(b.N)/float64(m), "ns/edge")
	b.ReportMetric(float64(after.TotalAlloc-before.TotalAlloc)/float64(b.N)/float64(m), "B/edge")
}

// BenchmarkStage measures the planarity stages on the benchmark families
// (see bench/run): embed is the left-right test with its embedding,
// subgraph the maximal planar subgraph of a triangulation plus 10 edges.
func BenchmarkStage(b *testing.B) {
	for _, n := range graphgen.StageSizes {
		for _, g := range graphgen.StageFamilies(n) {
			simple, _ := Simplify(g.N, g.Edges)
			b.Run(fmt.Sprintf("embed/%s", g.Name), func(b *testing.B) {
				reportPerEdge(b, len(simple), func() { Embed(g.N, simple) })
			})
		}
		x := graphgen.PlanarPlusExtra(n, 10, 1)
		b.Run(fmt.Sprintf("subgraph/%s", x.Name), func(b *testing.B) {
			reportPerEdge(b, len(x.Edges), func() { MaximalPlanar(x.N, x.Edges, SubgraphOptions{}) })
		})
	}
}
