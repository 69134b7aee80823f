package stagebench

import (
	"runtime"
	"testing"

	"github.com/gridwood/gridwood/internal/graphgen"
)

// Sizes are the vertex counts the stage benchmarks use.
var Sizes = []int{1000, 10000, 100000, 1000000}

// Families are the graph families the stage benchmarks run on, at a given
// size: a random triangulation, a square grid, a random tree and a random
// planar graph (a random 60% of a triangulation's edges).
func Families(n int) []graphgen.Graph {
	return []graphgen.Graph{
		graphgen.RandomTriangulation(n, 1),
		graphgen.SquareGrid(n),
		graphgen.RandomTree(n, 1),
		graphgen.RandomPlanar(n, 0.6, 1),
	}
}

// PerEdge runs fn b.N times and reports ns/edge and allocated B/edge for a
// graph of m edges.
func PerEdge(b *testing.B, m int, fn func()) {
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
