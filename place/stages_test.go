package place

import (
	"fmt"
	"testing"

	"github.com/gridwood/gridwood/internal/graphgen"
	"github.com/gridwood/gridwood/internal/order"
	"github.com/gridwood/gridwood/internal/stagebench"
	"github.com/gridwood/gridwood/place/augment"
	"github.com/gridwood/gridwood/planarize"
)

// BenchmarkStage measures the layout stages on the benchmark families
// (see bench/run), each on the input the command would give it:
// renumber (the locality pass of Draw), augment (biconnect and triangulate
// faces), place (canonical ordering, Schnyder wood, coordinates, for every
// component, with compaction and Tutte's drawing) and space (node
// boxes to points).
func BenchmarkStage(b *testing.B) {
	for _, n := range stagebench.Sizes {
		for _, g := range stagebench.Families(n) {
			_, local, _ := order.DepthFirst(g.N, g.Edges)
			emb, ok := planarize.Embed(g.N, local)
			if !ok {
				b.Fatalf("%s: not planar", g.Name)
			}
			m := len(g.Edges)
			b.Run(fmt.Sprintf("renumber/%s", g.Name), func(b *testing.B) {
				stagebench.PerEdge(b, m, func() { order.DepthFirst(g.N, g.Edges) })
			})
			b.Run(fmt.Sprintf("augment/%s", g.Name), func(b *testing.B) {
				noSkip := func(int32) bool { return false }
				stagebench.PerEdge(b, m, func() {
					work := emb.Clone()
					work.Reserve(3*g.N - work.M())
					augment.Biconnect(work, noSkip)
					augment.TriangulateFaces(work, noSkip, nil)
				})
			})
			b.Run(fmt.Sprintf("place/%s", g.Name), func(b *testing.B) {
				stagebench.PerEdge(b, m, func() {
					if _, _, err := layout(emb.Clone(), Options{Compact: true, Smooth: 400}); err != nil {
						b.Fatal(err)
					}
				})
			})
			res, err := Draw(g.N, g.Edges, DrawOptions{Layout: Options{Compact: true, Smooth: 400}})
			if err != nil {
				b.Fatal(err)
			}
			boxes := equalBoxes(g.N, 38, 18)
			b.Run(fmt.Sprintf("space/%s", g.Name), func(b *testing.B) {
				stagebench.PerEdge(b, m, func() {
					if _, err := res.Space(boxes, SpaceOptions{}); err != nil {
						b.Fatal(err)
					}
				})
			})
		}
	}
}

// BenchmarkReadable measures the default drawing (Result.Readable: the
// spaced drawing, then the readable stage on each component) with default
// node boxes, on the inputs the issue of the readable stage names: random
// planar graphs of 1,000 and 10,000 vertices, and a grid of 10,000 for
// comparison. Targets and figures: bench/RESULTS.md.
func BenchmarkReadable(b *testing.B) {
	for _, g := range []graphgen.Graph{
		graphgen.RandomPlanar(1000, 0.5, 1),
		graphgen.RandomPlanar(10000, 0.5, 1),
		graphgen.Grid(100, 100),
	} {
		res, err := Draw(g.N, g.Edges, DrawOptions{Layout: Options{Compact: true, Smooth: 400}, Readable: true})
		if err != nil {
			b.Fatal(err)
		}
		boxes := equalBoxes(g.N, 27, 18)
		b.Run(g.Name, func(b *testing.B) {
			for b.Loop() {
				if _, err := res.Readable(boxes, ReadableOptions{}); err != nil {
					b.Fatal(err)
				}
			}
		})
	}
}
