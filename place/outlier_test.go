package place

import (
	"fmt"
	"math/rand/v2"
	"testing"

	"github.com/gridwood/gridwood/internal/graphgen"
)

// outlierBoxes gives n nodes default-sized boxes (half 27 x 18 points, 18
// points apart, as the command's defaults) except for a seeded few that are
// very wide (a long label), very tall (many label lines) or big both ways,
// the boxes whose corners reach over edges whose ends lie outside them.
func outlierBoxes(n int, seed uint64) Boxes {
	b := equalBoxes(n, 27, 18)
	rng := rand.New(rand.NewPCG(seed, 7))
	for v := range n {
		switch rng.IntN(8) {
		case 0:
			b.HalfW[v] = 100 + rng.Int64N(300)
		case 1:
			b.HalfH[v] = 60 + rng.Int64N(150)
		case 2:
			b.HalfW[v], b.HalfH[v] = 80+rng.Int64N(200), 60+rng.Int64N(100)
		}
	}
	return b
}

// TestSpacingOutlierBoxes checks the spacing rule with geomcheck on small
// graphs where a few boxes are far bigger than the rest: no two boxes
// overlap and no edge passes through a box it does not end at, and none
// of these components is left unchecked or crowded. (The command's
// TestSpacingClearsWideLabels holds the inputs on which an edge once cut
// the corner of a wide box.)
func TestSpacingOutlierBoxes(t *testing.T) {
	var graphs []graphgen.Graph
	for seed := uint64(1); seed <= 40; seed++ {
		n := 8 + int(seed%12)*4
		graphs = append(graphs,
			graphgen.RandomPlanar(n, 0.6, seed),
			graphgen.RandomTriangulation(n, seed),
			graphgen.RandomTree(n, seed))
	}
	graphs = append(graphs, graphgen.Grid(5, 6))
	for i, g := range graphs {
		b := outlierBoxes(g.N, uint64(i))
		res, sp := drawSpaced(t, g, b, SpaceOptions{})
		if sp.Unchecked+sp.Crowded > 0 {
			t.Errorf("%s: unchecked %d, crowded %d", g.Name, sp.Unchecked, sp.Crowded)
		}
		checkSpaced(t, fmt.Sprintf("%s boxes %d", g.Name, i), sp, b, res.Kept(), true)
	}
}
