package place

import (
	"testing"
	"time"

	"github.com/gridwood/gridwood/internal/graphgen"
)

// BenchmarkCore measures the layout core as the command runs it, graph in
// memory: Draw (simple graph, planarity and embedding, planar subgraph
// when needed, augmentation, ordering, coordinates, compaction, barycentric
// drawing) and Space (node boxes of 75 x 36 points). Targets (issue 5):
// a 10^6-vertex triangulation under 1.5 s and 1 GB.
func BenchmarkCore(b *testing.B) {
	for _, tc := range []struct {
		name string
		g    func() graphgen.Graph
	}{
		{"tri-1e4", func() graphgen.Graph { return graphgen.RandomTriangulation(10000, 1) }},
		{"tri-1e5", func() graphgen.Graph { return graphgen.RandomTriangulation(100000, 1) }},
		{"tri-1e6", func() graphgen.Graph { return graphgen.RandomTriangulation(1000000, 1) }},
		{"grid-1e4", func() graphgen.Graph { return graphgen.Grid(100, 100) }},
		{"grid-1e6", func() graphgen.Graph { return graphgen.Grid(1000, 1000) }},
		{"star-1e4", func() graphgen.Graph { return graphgen.Star(9999) }},
		{"star-1e6", func() graphgen.Graph { return graphgen.Star(999999) }},
		{"path-1e4", func() graphgen.Graph { return graphgen.Path(10000) }},
		{"path-1e6", func() graphgen.Graph { return graphgen.Path(1000000) }},
		{"nested-1e4", func() graphgen.Graph { return graphgen.NestedTriangles(3333) }},
		{"nested-1e6", func() graphgen.Graph { return graphgen.NestedTriangles(333333) }},
		{"tree-1e4", func() graphgen.Graph { return graphgen.RandomTree(10000, 1) }},
		{"tree-1e6", func() graphgen.Graph { return graphgen.RandomTree(1000000, 1) }},
		// Dense non-planar blocks of about 10^4 and 10^6 edges.
		{"complete-142", func() graphgen.Graph { return graphgen.Complete(142) }},
		{"complete-1415", func() graphgen.Graph { return graphgen.Complete(1415) }},
		{"extra-1e5+10", func() graphgen.Graph { return graphgen.PlanarPlusExtra(100000, 10, 1) }},
		{"gnm-2000-6000", func() graphgen.Graph { return graphgen.RandomGnm(2000, 6000, 1) }},
		{"complete-60", func() graphgen.Graph { return graphgen.Complete(60) }},
	} {
		b.Run(tc.name, func(b *testing.B) {
			g := tc.g() // here, so that a -bench filter generates only what it runs
			boxes := equalBoxes(g.N, 38, 18)
			b.ReportAllocs()
			// The split: Draw per input edge, Space per kept pair (on a
			// dense block the kept graph is far smaller than the input).
			var drawTime, spaceTime time.Duration
			kept := 0
			for b.Loop() {
				start := time.Now()
				res, err := Draw(g.N, g.Edges, DrawOptions{Layout: Options{Compact: true, Smooth: 400}})
				if err != nil {
					b.Fatal(err)
				}
				mid := time.Now()
				if _, err := res.Space(boxes, SpaceOptions{}); err != nil {
					b.Fatal(err)
				}
				drawTime += mid.Sub(start)
				spaceTime += time.Since(mid)
				kept = len(res.Kept())
			}
			runs := float64(b.N)
			b.ReportMetric(float64(b.Elapsed().Nanoseconds())/runs/float64(max(1, len(g.Edges))), "ns/edge")
			b.ReportMetric(float64(drawTime.Nanoseconds())/runs/float64(max(1, len(g.Edges))), "draw-ns/edge")
			b.ReportMetric(float64(spaceTime.Nanoseconds())/runs/float64(max(1, kept)), "space-ns/kept")
		})
	}
}
