package planarize

import (
	"fmt"
	"testing"

	"github.com/gridwood/gridwood/internal/graphgen"
	"github.com/gridwood/gridwood/internal/order"
	"github.com/gridwood/gridwood/internal/stagebench"
)

// BenchmarkStage measures the planarity stages on the benchmark families
// (see bench/run), on the renumbered input the command gives them: embed is
// the left-right test with its embedding, subgraph the maximal planar
// subgraph of a triangulation plus 10 edges, and (up to 10^5 vertices:
// each stray that must go costs about log2 of its level's size in
// whole-block tests, 41 tests in all on the random planar graph at 10^5,
// bench/RESULTS.md, The usual traps) of the grid and the random planar graph
// plus 10 random pairs, and (up to 10^4) of blocks with many edges to set
// aside.
func BenchmarkStage(b *testing.B) {
	for _, n := range stagebench.Sizes {
		for _, g := range stagebench.Families(n) {
			_, local, _ := order.DepthFirst(g.N, g.Edges)
			simple, _ := Simplify(g.N, local)
			b.Run(fmt.Sprintf("embed/%s", g.Name), func(b *testing.B) {
				stagebench.PerEdge(b, len(simple), func() { Embed(g.N, simple) })
			})
		}
		x := graphgen.PlanarPlusExtra(n, 10, 1)
		_, xe, _ := order.DepthFirst(x.N, x.Edges)
		b.Run(fmt.Sprintf("subgraph/%s", x.Name), func(b *testing.B) {
			stagebench.PerEdge(b, len(xe), func() { MaximalPlanar(x.N, xe, SubgraphOptions{}) })
		})
		if n <= 10_000 {
			// Many edges to removed in one block: a triangulation plus as
			// many random edges (local proofs reject most), and a random
			// graph with 3n edges (they reject none, and single candidates
			// go to the skeleton): each rejection costs a test, so these
			// grow faster than the size.
			many := []graphgen.Graph{graphgen.PlanarPlusExtra(n, n, 1), graphgen.RandomGnm(n, 3*n, 1)}
			for _, g := range many {
				_, ge, _ := order.DepthFirst(g.N, g.Edges)
				simple, _ := Simplify(g.N, ge)
				b.Run(fmt.Sprintf("subgraph/%s", g.Name), func(b *testing.B) {
					stagebench.PerEdge(b, len(simple), func() { MaximalPlanar(g.N, simple, SubgraphOptions{}) })
				})
			}
		}
		if n > 100_000 {
			continue
		}
		for _, g := range stagebench.Families(n) {
			if g.Name[:4] != "grid" && g.Name[:6] != "planar" {
				continue
			}
			simple := withStrays(g, 10, 1)
			b.Run(fmt.Sprintf("subgraph/%s-plus-10", g.Name), func(b *testing.B) {
				stagebench.PerEdge(b, len(simple), func() { MaximalPlanar(g.N, simple, SubgraphOptions{}) })
			})
		}
	}
}
