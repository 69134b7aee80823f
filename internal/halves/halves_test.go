package halves

import (
	"math/rand/v2"
	"slices"
	"sort"
	"testing"
)

// TestStableSortMatchesStandardLibrary sorts by a counting sort in two
// halves and compares with sort.SliceStable from the standard library, on
// inputs below and above the size where the halves run concurrently.
func TestStableSortMatchesStandardLibrary(t *testing.T) {
	rng := rand.New(rand.NewPCG(3, 5))
	for _, m := range []int{0, 1, 2, 3, 100, Sequential - 1, Sequential, 3*Sequential + 7} {
		buckets := 1 + rng.IntN(50)
		keys := make([]int32, m)
		for i := range keys {
			keys[i] = int32(rng.IntN(buckets))
		}
		var count [2][]int32
		Run(m, func(h, lo, hi int) {
			c := make([]int32, buckets)
			for _, k := range keys[lo:hi] {
				c[k]++
			}
			count[h] = c
		})
		s := int32(0)
		for k := range buckets {
			s = Starts(&count, k, s)
		}
		if int(s) != m {
			t.Fatalf("m=%d: buckets end at %d", m, s)
		}
		got := make([]int32, m)
		Run(m, func(h, lo, hi int) {
			pos := count[h]
			for i := lo; i < hi; i++ {
				got[pos[keys[i]]] = int32(i)
				pos[keys[i]]++
			}
		})
		want := make([]int32, m)
		for i := range want {
			want[i] = int32(i)
		}
		sort.SliceStable(want, func(a, b int) bool { return keys[want[a]] < keys[want[b]] })
		if !slices.Equal(got, want) {
			t.Fatalf("m=%d: counting sort in halves differs from the stable sort", m)
		}
	}
}
