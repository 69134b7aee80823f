package readable

import (
	"math"
	"testing"
)

// TestConflictsBounded piles the boxes of a star's 5,000 leaves on a
// small circle round its centre, every box over hundreds of others and
// every spoke through them: findConflicts must still list some conflicts
// at every vertex, and never more than maxConflicts (listing every pair
// would be 25 million, the trap this bound closes).
func TestConflictsBounded(t *testing.T) {
	const leaves = 5000
	n := leaves + 1
	g := &guard{x: make([]float64, n), y: make([]float64, n), hw: make([]float64, n), hh: make([]float64, n), gap: 18, edgeGap: 13.5}
	for v := range n {
		g.hw[v], g.hh[v] = 27, 18
	}
	for i := range leaves {
		a := 2 * math.Pi * float64(i) / leaves
		g.x[i+1], g.y[i+1] = 80*math.Cos(a), 80*math.Sin(a)
		g.edges = append(g.edges, [2]int32{0, int32(i + 1)})
	}
	g.findConflicts()
	for v, cs := range g.conflicts {
		if len(cs) == 0 || len(cs) > maxConflicts {
			t.Fatalf("vertex %d lists %d conflicts, want 1 to %d", v, len(cs), maxConflicts)
		}
	}
	if s := g.stretchNeeded(); s < 10 {
		t.Errorf("stretch needed %.1f: the pile should need far more than 10 (boxes 72 pt apart on a circle of 503 pt for 5,000 of them)", s)
	}
}
