package graphgen

// StageFamilies are the graph families the per-stage benchmarks run on,
// at a given size: a random triangulation, a square grid, a random tree
// and a random planar graph (a random 60% of a triangulation's edges).
func StageFamilies(n int) []Graph {
	k := 1
	for (k+1)*(k+1) <= n {
		k++
	}
	return []Graph{
		RandomMaximalPlanar(n, 1),
		Grid(k, k),
		RandomTree(n, 1),
		RandomPlanar(n, 0.6, 1),
	}
}

// StageSizes are the sizes the per-stage benchmarks use.
var StageSizes = []int{1000, 10000, 100000, 1000000}
