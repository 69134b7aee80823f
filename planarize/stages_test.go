package planarize

import (
	"fmt"
	"runtime"
	"slices"
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

// depthFirstLabels renumbers vertices in depth-first preorder and sorts the
// edges by their smaller end, as place.Draw does before these stages run
// (a local copy: this package cannot import place).
func depthFirstLabels(n int, edges [][2]int32) [][2]int32 {
	g := newCSR(n, edges)
	id := make([]int32, n)
	for v := range id {
		id[v] = -1
	}
	next := int32(0)
	cursor := append([]int32(nil), g.start[:n]...)
	var stack []int32
	for s := range n {
		if id[s] >= 0 {
			continue
		}
		id[s] = next
		next++
		stack = append(stack[:0], int32(s))
		for len(stack) > 0 {
			v := stack[len(stack)-1]
			if cursor[v] == g.start[v+1] {
				stack = stack[:len(stack)-1]
				continue
			}
			d := g.adj[cursor[v]]
			cursor[v]++
			if w := edges[d>>1][1-d&1]; id[w] < 0 {
				id[w] = next
				next++
				stack = append(stack, w)
			}
		}
	}
	out := make([][2]int32, len(edges))
	for i, e := range edges {
		out[i] = [2]int32{id[e[0]], id[e[1]]}
	}
	slices.SortStableFunc(out, func(a, b [2]int32) int { return int(min(a[0], a[1]) - min(b[0], b[1])) })
	return out
}

// BenchmarkStage measures the planarity stages on the benchmark families
// (see bench/run), on the renumbered input the command gives them: embed is
// the left-right test with its embedding, subgraph the maximal planar
// subgraph of a triangulation plus 10 edges.
func BenchmarkStage(b *testing.B) {
	for _, n := range graphgen.StageSizes {
		for _, g := range graphgen.StageFamilies(n) {
			simple, _ := Simplify(g.N, depthFirstLabels(g.N, g.Edges))
			b.Run(fmt.Sprintf("embed/%s", g.Name), func(b *testing.B) {
				reportPerEdge(b, len(simple), func() { Embed(g.N, simple) })
			})
		}
		x := graphgen.PlanarPlusExtra(n, 10, 1)
		xe := depthFirstLabels(x.N, x.Edges)
		b.Run(fmt.Sprintf("subgraph/%s", x.Name), func(b *testing.B) {
			reportPerEdge(b, len(xe), func() { MaximalPlanar(x.N, xe, SubgraphOptions{}) })
		})
	}
}
