package place

import (
	"math/rand/v2"
	"slices"
	"testing"
)

// TestAllPairsMatchesEveryPair checks allPairs against its definition,
// written out as a plain double loop: the same vertex-edge pairs, and for
// each vertex its edges in the order of edges (refine adds up pushes per
// vertex, so that order reaches the output). Coordinates are drawn from a
// small range so that many vertices share an x, and the reach r runs from
// none to more than the drawing.
func TestAllPairsMatchesEveryPair(t *testing.T) {
	rng := rand.New(rand.NewPCG(7, 11))
	for trial := range 200 {
		n := 2 + rng.IntN(40)
		span := int64(1 + rng.IntN(30))
		x, y := make([]int64, n+3), make([]int64, n+3)
		vs := make([]int32, 0, n)
		for v := range n {
			w := int32(v + 3) // vertex numbers need not start at 0
			vs = append(vs, w)
			x[w], y[w] = rng.Int64N(span)-span/2, rng.Int64N(span)-span/2
		}
		var edges [][2]int32
		index := map[[2]int32]int{} // each edge once, so that fn's e names it
		for range rng.IntN(3 * n) {
			e := [2]int32{vs[rng.IntN(n)], vs[rng.IntN(n)]}
			if _, dup := index[e]; !dup && e[0] != e[1] {
				index[e] = len(edges)
				edges = append(edges, e)
			}
		}
		r := rng.Int64N(span + 2)
		want := map[int32][]int{}
		for ei, e := range edges {
			for _, w := range vs {
				if w == e[0] || w == e[1] {
					continue
				}
				if x[w] >= min(x[e[0]], x[e[1]])-r && x[w] <= max(x[e[0]], x[e[1]])+r &&
					y[w] >= min(y[e[0]], y[e[1]])-r && y[w] <= max(y[e[0]], y[e[1]])+r {
					want[w] = append(want[w], ei)
				}
			}
		}
		got := map[int32][]int{}
		allPairs(vs, edges, x, y, r, func(w int32, e [2]int32) {
			got[w] = append(got[w], index[e])
		})
		for _, w := range vs {
			if !slices.Equal(got[w], want[w]) {
				t.Fatalf("trial %d (n=%d, r=%d), vertex %d: edges %v, want %v", trial, n, r, w, got[w], want[w])
			}
		}
	}
}
