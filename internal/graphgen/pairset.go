package graphgen

// pairSet is a set of nonzero uint64 keys (pairKey of two distinct
// vertices is never 0) in an open-addressing table with linear probing and
// backward-shift deletion (D. E. Knuth, The Art of Computer Programming,
// vol. 3, 2nd ed., §6.4, Algorithm R). The table is kept at most 3/8 full,
// so probes stay short; the triangulation uses it for its edge set during
// flips, where a map would cost several times as much.
type pairSet struct {
	slots []uint64
	mask  uint64
}

func newPairSet(capacity int) *pairSet {
	size := 16
	for size*3 < capacity*8 {
		size *= 2
	}
	return &pairSet{slots: make([]uint64, size), mask: uint64(size - 1)}
}

// home is the slot a key hashes to (Fibonacci hashing, Knuth §6.4).
func (s *pairSet) home(key uint64) uint64 {
	return (key * 0x9e3779b97f4a7c15) >> 32 & s.mask
}

func (s *pairSet) has(key uint64) bool {
	for i := s.home(key); ; i = (i + 1) & s.mask {
		switch s.slots[i] {
		case key:
			return true
		case 0:
			return false
		}
	}
}

// insert adds key; the caller keeps the set within its capacity.
func (s *pairSet) insert(key uint64) {
	i := s.home(key)
	for s.slots[i] != 0 {
		if s.slots[i] == key {
			return
		}
		i = (i + 1) & s.mask
	}
	s.slots[i] = key
}

func (s *pairSet) remove(key uint64) {
	i := s.home(key)
	for s.slots[i] != key {
		if s.slots[i] == 0 {
			return
		}
		i = (i + 1) & s.mask
	}
	// Move later keys of the probe run back into the hole when their home
	// slot does not lie cyclically in (hole, j].
	hole := i
	for j := (i + 1) & s.mask; s.slots[j] != 0; j = (j + 1) & s.mask {
		h := s.home(s.slots[j])
		if (j-h)&s.mask >= (j-hole)&s.mask {
			s.slots[hole] = s.slots[j]
			hole = j
		}
	}
	s.slots[hole] = 0
}
