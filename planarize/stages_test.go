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
// subgraph of a triangulation plus 10 edges.
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
	}
}
