package place

import (
	"testing"

	"github.com/gridwood/gridwood/internal/graphgen"
	"github.com/gridwood/gridwood/planarize"
)

func TestConvexScratch(t *testing.T) {
	for _, g := range []graphgen.Graph{graphgen.Tetrahedron(), graphgen.Cube(), graphgen.Octahedron(), graphgen.Dodecahedron(), graphgen.Icosahedron(), graphgen.Wheel(5), graphgen.RandomMaximalPlanar(50, 1)} {
		emb, _ := planarize.Embed(g.N, g.Edges)
		for d := int32(0); int(d) < 2*emb.M(); d++ {
			x, y, w, h, err := convexDrawing(emb, d)
			if err != nil {
				t.Fatalf("%s dart %d: %v", g.Name, d, err)
			}
			if d == 0 {
				t.Logf("%s: %v %v %d %d", g.Name, x, y, w, h)
			}
		}
	}
}
