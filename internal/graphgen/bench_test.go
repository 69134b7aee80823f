package graphgen

import (
	"fmt"
	"testing"
)

func BenchmarkRandomTriangulation(b *testing.B) {
	for _, n := range []int{1000, 100000, 1000000} {
		b.Run(fmt.Sprintf("n=%d", n), func(b *testing.B) {
			for i := 0; b.Loop(); i++ {
				if g := RandomTriangulation(n, uint64(i)); len(g.Edges) != 3*n-6 {
					b.Fatalf("%d edges", len(g.Edges))
				}
			}
		})
	}
}

func BenchmarkPlanarPlusExtra(b *testing.B) {
	const n = 1000000
	for i := 0; b.Loop(); i++ {
		PlanarPlusExtra(n, 1000, uint64(i))
	}
}

func BenchmarkRandomGnm(b *testing.B) {
	for i := 0; b.Loop(); i++ {
		RandomGnm(1000000, 3000000, uint64(i))
	}
}
