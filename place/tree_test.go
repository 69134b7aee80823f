package place

import (
	"testing"

	"github.com/gridwood/gridwood/internal/graphgen"
)

// TestLayeredTrees checks trees drawn in layers (spacing.Tree)
// with geomcheck, the independent crossing checker: on 300 seeded random
// trees of 3 to 600 vertices, stars, paths and a forest, with boxes of
// varied widths, no two edges cross or touch, no node lies on an edge,
// no boxes overlap and no edge passes through a box unless the component
// was counted crowded or unchecked. Where the layered drawing is taken,
// it is at most one column per leaf wide (plus a box), which a grid
// drawing of a tree never is for long: the point of drawing trees this
// way.
func TestLayeredTrees(t *testing.T) {
	graphs := []graphgen.Graph{graphgen.Star(40), graphgen.Path(60), graphgen.DisjointUnion(graphgen.RandomTree(30, 1), graphgen.Path(3), graphgen.Star(5))}
	for seed := uint64(1); seed <= 300; seed++ {
		graphs = append(graphs, graphgen.RandomTree(3+int(seed*seed*7)%598, seed))
	}
	taken := 0
	for _, g := range graphs {
		b := variedBoxes(g.N)
		res, sp := drawSpaced(t, g, b, SpaceOptions{})
		checkSpaced(t, g.Name, sp, b, g.Edges, false)
		if sp.Trees == 0 {
			continue
		}
		taken++
		if len(res.Components) == 1 {
			deg := make([]int, g.N)
			for _, e := range g.Edges {
				deg[e[0]]++
				deg[e[1]]++
			}
			leaves := 0
			for _, d := range deg {
				if d == 1 {
					leaves++
				}
			}
			if limit := int64(leaves) * (2*56 + 18 + 1); sp.Width > limit {
				t.Errorf("%s: layered drawing %d points wide, more than %d for %d leaves", g.Name, sp.Width, limit, leaves)
			}
		}
	}
	if taken < len(graphs)*9/10 {
		t.Errorf("layered drawing taken for %d of %d trees", taken, len(graphs))
	}
}
