// Command gendot writes generated graphs as DOT, for benchmarks: the same
// family and size always give the same bytes.
//
//	go run ./bench/gendot -family tri -n 300000 > tri.dot
package main

import (
	"bufio"
	"flag"
	"fmt"
	"os"

	"github.com/gridwood/gridwood/internal/graphgen"
)

func main() {
	family := flag.String("family", "tri", "tri (random triangulation), grid (k x k grid), tree, planar (random planar), extra (triangulation plus -extra edges), star, path, nested")
	n := flag.Int("n", 1000, "number of vertices (for grid: the side is the square root)")
	extra := flag.Int("extra", 10, "extra edges for -family extra")
	seed := flag.Uint64("seed", 1, "random seed")
	flag.Parse()
	var g graphgen.Graph
	switch *family {
	case "tri":
		g = graphgen.RandomMaximalPlanar(*n, *seed)
	case "grid":
		k := 1
		for (k+1)*(k+1) <= *n {
			k++
		}
		g = graphgen.Grid(k, k)
	case "tree":
		g = graphgen.RandomTree(*n, *seed)
	case "planar":
		g = graphgen.RandomPlanar(*n, 0.6, *seed)
	case "extra":
		g = graphgen.PlanarPlusExtra(*n, *extra, *seed)
	case "star":
		g = graphgen.Star(*n - 1)
	case "path":
		g = graphgen.Path(*n)
	case "nested":
		g = graphgen.NestedTriangles(*n / 3)
	default:
		fmt.Fprintf(os.Stderr, "gendot: unknown family %q\n", *family)
		os.Exit(2)
	}
	w := bufio.NewWriterSize(os.Stdout, 1<<20)
	fmt.Fprintf(w, "graph %q {\n", g.Name)
	for v := range g.N {
		fmt.Fprintf(w, "\tn%d\n", v)
	}
	for _, e := range g.Edges {
		fmt.Fprintf(w, "\tn%d -- n%d\n", e[0], e[1])
	}
	fmt.Fprintln(w, "}")
	if err := w.Flush(); err != nil {
		fmt.Fprintln(os.Stderr, "gendot:", err)
		os.Exit(1)
	}
}
