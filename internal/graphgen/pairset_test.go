package graphgen

import (
	"math/rand/v2"
	"testing"
)

// TestPairSet runs random inserts, removals and lookups against a Go map
// as the reference, on tables small enough that probe runs wrap around the
// end and deletions must shift keys back.
func TestPairSet(t *testing.T) {
	for _, tt := range []struct{ capacity, keyRange, ops int }{
		{6, 40, 20000},
		{100, 300, 50000},
		{1000, 1 << 40, 20000},
	} {
		rng := rand.New(rand.NewPCG(uint64(tt.capacity), 9))
		s := newPairSet(tt.capacity)
		ref := make(map[uint64]bool)
		for op := range tt.ops {
			key := 1 + uint64(rng.Int64N(int64(tt.keyRange)))
			switch r := rng.IntN(3); {
			case r == 0 && len(ref) < tt.capacity:
				s.insert(key)
				ref[key] = true
			case r == 1:
				s.remove(key)
				delete(ref, key)
			}
			if s.has(key) != ref[key] {
				t.Fatalf("capacity %d, op %d: has(%d) = %v, want %v", tt.capacity, op, key, s.has(key), ref[key])
			}
		}
		for key := range ref {
			if !s.has(key) {
				t.Fatalf("capacity %d: lost key %d", tt.capacity, key)
			}
		}
		stored := 0
		for _, k := range s.slots {
			if k != 0 {
				stored++
			}
		}
		if stored != len(ref) {
			t.Errorf("capacity %d: %d slots used, %d keys", tt.capacity, stored, len(ref))
		}
	}
}
