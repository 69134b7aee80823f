// Command gendot writes generated graphs as DOT, for benchmarks: the same
// family and size always give the same bytes.
//
//	go run ./bench/gendot -family tri -n 300000 > tri.dot
package main

import (
	"flag"
	"fmt"
	"os"

	"github.com/gridwood/gridwood/internal/graphgen"
)

func main() {
	family := flag.String("family", "tri", "tri (random triangulation), grid (k x k grid), tree, planar (random planar), extra (triangulation plus -extra edges), planar-extra (random planar plus -extra random pairs), gnm (random graph, 3n edges), star, path, nested")
	n := flag.Int("n", 1000, "number of vertices (for grid: the side is the square root)")
	extra := flag.Int("extra", 10, "extra edges for -family extra and planar-extra")
	seed := flag.Uint64("seed", 1, "random seed")
	flag.Parse()
	g, ok := graphgen.Named(*family, *n, *extra, *seed)
	if !ok {
		fmt.Fprintf(os.Stderr, "gendot: unknown family %q\n", *family)
		os.Exit(2)
	}
	if err := graphgen.WriteDOT(os.Stdout, g); err != nil {
		fmt.Fprintln(os.Stderr, "gendot:", err)
		os.Exit(1)
	}
}
