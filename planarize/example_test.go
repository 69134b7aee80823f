package planarize_test

import (
	"fmt"

	"github.com/gridwood/gridwood/planarize"
)

// The tram network of the fictional town of Lindqvist Ferry: a ring line
// of six stops around a central square (stop 0), with a spoke from the
// square to every ring stop. It is a wheel, so it is planar, and Euler's
// formula gives F = E - V + 2 = 12 - 7 + 2 = 7 faces: six triangles and the
// outside.
func ExampleEmbed() {
	edges := [][2]int32{
		{1, 2}, {2, 3}, {3, 4}, {4, 5}, {5, 6}, {6, 1}, // the ring line
		{0, 1}, {0, 2}, {0, 3}, {0, 4}, {0, 5}, {0, 6}, // the spokes
	}
	emb, ok := planarize.Embed(7, edges)
	fmt.Println("planar:", ok)
	fmt.Println("faces:", emb.Faces())
	fmt.Println("lines at the square:", emb.Degree(0))
	// Output:
	// planar: true
	// faces: 7
	// lines at the square: 6
}

// The fibre plan of a fictional five-building campus joins every building
// to every other: K5, which has no crossing-free drawing (Kuratowski). One
// link has to be drawn apart, and FindKuratowski explains why it cannot be
// put back.
func ExampleMaximalPlanar() {
	var edges [][2]int32
	for a := int32(0); a < 5; a++ {
		for b := a + 1; b < 5; b++ {
			edges = append(edges, [2]int32{a, b})
		}
	}
	sub := planarize.MaximalPlanar(5, edges, planarize.SubgraphOptions{})
	fmt.Println("links removed:", len(sub.Removed), "optimal:", sub.Optimal)

	// Explain the removed link: it closes a subdivision of K5 with the
	// kept ones.
	subset := make([]int32, len(edges))
	for i := range subset {
		subset[i] = int32(i)
	}
	k, ok := planarize.FindKuratowski(5, edges, subset, sub.Removed, nil)
	fmt.Println("explained:", ok, "by a", k.Kind, "with", len(k.Paths), "paths")
	// Output:
	// links removed: 1 optimal: true
	// explained: true by a K5 with 10 paths
}

// Three depots of a fictional delivery firm each need a road to each of
// three villages: K3,3, the other Kuratowski graph.
func ExampleFindKuratowski() {
	var edges [][2]int32
	for depot := int32(0); depot < 3; depot++ {
		for village := int32(3); village < 6; village++ {
			edges = append(edges, [2]int32{depot, village})
		}
	}
	k, ok := planarize.FindKuratowski(6, edges, nil, nil, nil)
	fmt.Println(ok, k.Kind, len(k.Branch), "branch vertices,", len(k.Edges), "edges")
	// Output:
	// true K3,3 6 branch vertices, 9 edges
}
