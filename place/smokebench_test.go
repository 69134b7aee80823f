package place

import (
	"math/rand/v2"
	"testing"

	"github.com/gridwood/gridwood/planarize"
)

// stacked builds a random stacked triangulation (quick local generator for
// smoke benchmarks).
func stacked(n int, seed uint64) [][2]int32 {
	rng := rand.New(rand.NewPCG(seed, 7))
	faces := [][3]int32{{0, 1, 2}, {0, 2, 1}}
	edges := [][2]int32{{0, 1}, {1, 2}, {2, 0}}
	for v := int32(3); int(v) < n; v++ {
		i := rng.IntN(len(faces))
		f := faces[i]
		faces[i] = [3]int32{f[0], f[1], v}
		faces = append(faces, [3]int32{f[1], f[2], v}, [3]int32{f[2], f[0], v})
		edges = append(edges, [2]int32{f[0], v}, [2]int32{f[1], v}, [2]int32{f[2], v})
	}
	rng.Shuffle(len(edges), func(i, j int) { edges[i], edges[j] = edges[j], edges[i] })
	return edges
}

func BenchmarkSmokeEmbed100k(b *testing.B) {
	edges := stacked(100000, 1)
	for b.Loop() {
		planarize.Embed(100000, edges)
	}
}

func BenchmarkSmokeLayout100k(b *testing.B) {
	edges := stacked(100000, 1)
	emb, _ := planarize.Embed(100000, edges)
	for b.Loop() {
		Layout(emb, Options{})
	}
}

func BenchmarkSmokeEmbed1M(b *testing.B) {
	edges := stacked(1000000, 1)
	for b.Loop() {
		planarize.Embed(1000000, edges)
	}
}

func BenchmarkSmokeLayout1M(b *testing.B) {
	edges := stacked(1000000, 1)
	emb, _ := planarize.Embed(1000000, edges)
	for b.Loop() {
		Layout(emb, Options{})
	}
}
