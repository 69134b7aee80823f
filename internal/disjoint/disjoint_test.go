package disjoint

import (
	"math/rand/v2"
	"testing"
)

// TestSetsAgainstLabels checks Sets against a plain relabelling partition
// (merge by rewriting every label of one set: quadratic, obviously right)
// on seeded random unions, and that Union returns a's old root.
func TestSetsAgainstLabels(t *testing.T) {
	for seed := range uint64(20) {
		r := rand.New(rand.NewPCG(seed, 7))
		n := 1 + r.IntN(200)
		s := New(n)
		label := make([]int, n)
		for i := range label {
			label[i] = i
		}
		for range 3 * n {
			a, b := int32(r.IntN(n)), int32(r.IntN(n))
			ra := s.Find(a)
			if got := s.Union(a, b); got != ra {
				t.Fatalf("seed %d: Union(%d, %d) = %d, want a's root %d", seed, a, b, got, ra)
			}
			la, lb := label[a], label[b]
			for i := range label {
				if label[i] == lb {
					label[i] = la
				}
			}
			for range 5 {
				x, y := int32(r.IntN(n)), int32(r.IntN(n))
				if same, want := s.Find(x) == s.Find(y), label[x] == label[y]; same != want {
					t.Fatalf("seed %d: %d and %d together %v, want %v", seed, x, y, same, want)
				}
			}
		}
	}
}
