package preview

import (
	"math"
	"testing"

	"github.com/gridwood/gridwood/dotio"
	"github.com/gridwood/gridwood/dotio/nodesize"
	"github.com/gridwood/gridwood/place"
)

// layOut reads DOT and lays out every graph as the command does (place
// with its default options, node boxes from nodesize, a quarter inch
// between boxes).
func layOut(t testing.TB, src string) []Graph {
	t.Helper()
	f, err := dotio.Read([]byte(src), dotio.ReadOptions{Name: "test"})
	if err != nil {
		t.Fatal(err)
	}
	var out []Graph
	for _, g := range f.Graphs {
		edges := make([][2]int32, len(g.Edges))
		for i, e := range g.Edges {
			edges[i] = [2]int32{e.From, e.To}
		}
		res, err := place.Draw(len(g.Nodes), edges, place.DrawOptions{Layout: place.Options{Compact: true, Smooth: 400}})
		if err != nil {
			t.Fatal(err)
		}
		s := nodesize.New(g)
		b := place.Boxes{HalfW: make([]int64, len(g.Nodes)), HalfH: make([]int64, len(g.Nodes)), Gap: 18}
		for i := range g.Nodes {
			n := s.Node(i)
			b.HalfW[i], b.HalfH[i] = int64(math.Ceil(n.W/2)), int64(math.Ceil(n.H/2))
		}
		sp, err := res.Space(b, place.SpaceOptions{})
		if err != nil {
			t.Fatal(err)
		}
		lay := dotio.Layout{X: sp.X, Y: sp.Y, BB: [4]int64{0, 0, sp.Width, sp.Height}}
		if len(res.Removed) > 0 {
			lay.Removed = make([]bool, len(g.Edges))
			for _, i := range res.Removed {
				lay.Removed[i] = true
			}
		}
		out = append(out, FromLayout(g, lay))
	}
	return out
}
