package place

import (
	"testing"

	"github.com/gridwood/gridwood/internal/graphgen"
	"github.com/gridwood/gridwood/place/internal/spacing"
)

// BenchmarkSpaceSmall measures Space alone, with and without relaxation,
// on drawings of the sizes documentation builds draw by the hundred: the
// cost relaxation adds, as a ratio within one run.
func BenchmarkSpaceSmall(b *testing.B) {
	for _, g := range []graphgen.Graph{graphgen.RandomPlanar(50, 0.6, 1), graphgen.RandomPlanar(200, 0.6, 1), graphgen.RandomTriangulation(100, 1), graphgen.RandomTriangulation(1000, 1)} {
		res, err := Draw(g.N, g.Edges, DrawOptions{Layout: Options{Compact: true, Smooth: 400}})
		if err != nil {
			b.Fatal(err)
		}
		boxes := equalBoxes(g.N, 38, 18)
		for _, mode := range []struct {
			name  string
			limit int
		}{{"relaxed", spacing.GridCompareLimit}, {"unrelaxed", 0}} {
			b.Run(g.Name+"/"+mode.name, func(b *testing.B) {
				defer func(limit int) { relaxLimit = limit }(relaxLimit)
				relaxLimit = mode.limit
				b.ReportAllocs()
				for b.Loop() {
					if _, err := res.Space(boxes, SpaceOptions{}); err != nil {
						b.Fatal(err)
					}
				}
			})
		}
	}
}
