package place_test

import (
	"fmt"
	"os"

	"gonum.org/v1/gonum/graph/simple"

	"github.com/gridwood/gridwood/dotio"
	"github.com/gridwood/gridwood/place"
)

// Draw takes a plain graph: vertices 0..n-1 and edges as pairs.
func ExampleDraw() {
	// A square with one diagonal, plus a pendant vertex.
	edges := [][2]int32{{0, 1}, {1, 2}, {2, 3}, {3, 0}, {0, 2}, {2, 4}}
	res, err := place.Draw(5, edges, place.DrawOptions{})
	if err != nil {
		panic(err)
	}
	for v := range 5 {
		fmt.Printf("vertex %d at (%d,%d)\n", v, res.X[v], res.Y[v])
	}
	fmt.Println("removed:", len(res.Removed))
	// Output:
	// vertex 0 at (1,2)
	// vertex 1 at (1,1)
	// vertex 2 at (0,3)
	// vertex 3 at (3,1)
	// vertex 4 at (1,0)
	// removed: 0
}

// DrawGraph takes any gonum graph; a non-planar one loses a few pairs.
func ExampleDrawGraph() {
	g := simple.NewUndirectedGraph()
	// K3,3: three sheds {1,2,3} and three taps {10,20,30}, all connected.
	for _, s := range []int64{1, 2, 3} {
		for _, t := range []int64{10, 20, 30} {
			g.SetEdge(g.NewEdge(simple.Node(s), simple.Node(t)))
		}
	}
	d, err := place.DrawGraph(g, place.DrawOptions{})
	if err != nil {
		panic(err)
	}
	fmt.Println("nodes:", d.IDs)
	fmt.Println("removed:", d.Removed)
	// Output:
	// nodes: [1 2 3 10 20 30]
	// removed: [[3 20]]
}

// The command's pipeline in a few lines: read DOT, draw each graph, write
// DOT with positions (one grid step = 72 points here, no margin; the
// command instead spaces the drawing by its node boxes, as in the example
// of Result.Space).
func Example_dot() {
	src := []byte(`graph office { desk -- printer -- router -- desk; router -- modem }`)
	f, err := dotio.Read(src, dotio.ReadOptions{Name: "office.dot"})
	if err != nil {
		panic(err)
	}
	layouts := make([]dotio.Layout, len(f.Graphs))
	for i, g := range f.Graphs {
		edges := make([][2]int32, len(g.Edges))
		for j, e := range g.Edges {
			edges[j] = [2]int32{e.From, e.To}
		}
		res, err := place.Draw(len(g.Nodes), edges, place.DrawOptions{})
		if err != nil {
			panic(err)
		}
		l := dotio.Layout{X: make([]int64, len(g.Nodes)), Y: make([]int64, len(g.Nodes))}
		for v := range g.Nodes {
			l.X[v], l.Y[v] = 72*res.X[v], 72*res.Y[v]
		}
		l.BB = [4]int64{0, 0, 72 * res.Width, 72 * res.Height}
		layouts[i] = l
	}
	if err := dotio.Write(os.Stdout, f, layouts, dotio.WriteOptions{}); err != nil {
		panic(err)
	}
	// Output:
	// graph office {
	// 	desk -- printer -- router -- desk
	// 	router -- modem
	// 	desk [pos="144,72"]
	// 	printer [pos="72,72"]
	// 	router [pos="0,144"]
	// 	modem [pos="72,0"]
	// 	graph [bb="0,0,144,144"]
	// }
}

// Space turns the grid drawing into points that respect node boxes: here
// every box is 54 x 36 points (half sizes 27 and 18) with 18 points between
// boxes, and the base unit follows from them (see doc.go, The spacing rule).
func ExampleResult_Space() {
	// A wheel: a hub (0) and a rim of five.
	edges := [][2]int32{{1, 2}, {2, 3}, {3, 4}, {4, 5}, {5, 1}, {0, 1}, {0, 2}, {0, 3}, {0, 4}, {0, 5}}
	res, err := place.Draw(6, edges, place.DrawOptions{Layout: place.Options{Compact: true, Smooth: 400}})
	if err != nil {
		panic(err)
	}
	b := place.Boxes{HalfW: make([]int64, 6), HalfH: make([]int64, 6), Gap: 18}
	for v := range 6 {
		b.HalfW[v], b.HalfH[v] = 27, 18
	}
	sp, err := res.Space(b, place.SpaceOptions{})
	if err != nil {
		panic(err)
	}
	fmt.Println("base unit:", sp.Unit, "size:", sp.Width, "x", sp.Height)
	for v := range 6 {
		fmt.Printf("vertex %d at (%d,%d)\n", v, sp.X[v], sp.Y[v])
	}
	// Output:
	// base unit: 72 size: 166 x 148
	// vertex 0 at (66,75)
	// vertex 1 at (128,130)
	// vertex 2 at (139,75)
	// vertex 3 at (128,18)
	// vertex 4 at (27,18)
	// vertex 5 at (31,130)
}
