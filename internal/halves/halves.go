package halves

import "sync"

// Sequential is the input size below which Run does both halves on the
// calling goroutine: starting another costs more than it saves.
const Sequential = 1 << 14

// Run calls f(0, 0, m/2) and f(1, m/2, m), the second on another goroutine
// when m is large, and returns when both have.
func Run(m int, f func(half, lo, hi int)) {
	mid := m / 2
	if m < Sequential {
		f(0, 0, mid)
		f(1, mid, m)
		return
	}
	var wg sync.WaitGroup
	wg.Go(func() { f(1, mid, m) })
	f(0, 0, mid)
	wg.Wait()
}

// Starts turns bucket k's entry counts in the two halves into the slots
// where each half starts filling it, given the bucket's first slot s, and
// returns the first slot of bucket k+1.
func Starts(count *[2][]int32, k int, s int32) int32 {
	a, b := count[0][k], count[1][k]
	count[0][k], count[1][k] = s, s+a
	return s + a + b
}
