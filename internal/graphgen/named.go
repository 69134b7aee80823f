package graphgen

import (
	"bufio"
	"fmt"
	"io"
	"math/rand/v2"
	"slices"
)

// SquareGrid is the largest k x k grid with at most n vertices.
func SquareGrid(n int) Graph {
	k := 1
	for (k+1)*(k+1) <= n {
		k++
	}
	return Grid(k, k)
}

// Named builds the benchmark family with the given name at about n
// vertices: tri (RandomTriangulation), grid (SquareGrid), tree, planar
// (RandomPlanar keeping 60%), extra (PlanarPlusExtra with extra edges),
// planar-extra (the random planar graph WithStrays, extra of them), gnm
// (RandomGnm with 3n edges), star, path or nested (NestedTriangles of n/3
// levels). ok is false for an unknown name.
func Named(family string, n, extra int, seed uint64) (g Graph, ok bool) {
	switch family {
	case "tri":
		return RandomTriangulation(n, seed), true
	case "grid":
		return SquareGrid(n), true
	case "tree":
		return RandomTree(n, seed), true
	case "planar":
		return RandomPlanar(n, 0.6, seed), true
	case "extra":
		return PlanarPlusExtra(n, extra, seed), true
	case "planar-extra":
		return WithStrays(RandomPlanar(n, 0.6, seed), extra, seed), true
	case "gnm":
		return RandomGnm(n, 3*n, seed), true
	case "star":
		return Star(n - 1), true
	case "path":
		return Path(n), true
	case "nested":
		return NestedTriangles(n / 3), true
	}
	return Graph{}, false
}

// WithStrays returns g with k random vertex pairs appended to its edges, as
// a user's stray long edges in a mesh: uniform and independent, so a pair
// may repeat an edge or be a loop.
func WithStrays(g Graph, k int, seed uint64) Graph {
	rng := rand.New(rand.NewPCG(seed, streamStrays^uint64(g.N)))
	out := Graph{Name: fmt.Sprintf("%s-plus-%d", g.Name, k), N: g.N, Edges: slices.Clip(g.Edges)}
	if g.N == 0 {
		return out
	}
	for range k {
		out.Edges = append(out.Edges, [2]int32{int32(rng.IntN(g.N)), int32(rng.IntN(g.N))})
	}
	return out
}

// WriteDOT writes g as an undirected DOT graph named after it: one node
// statement per vertex (nodes n0, n1, ...), then one edge statement per
// edge, in order. The benchmark inputs and tools all use this form.
func WriteDOT(w io.Writer, g Graph) error {
	bw := bufio.NewWriterSize(w, 1<<20)
	fmt.Fprintf(bw, "graph %q {\n", g.Name)
	for v := range g.N {
		fmt.Fprintf(bw, "\tn%d\n", v)
	}
	for _, e := range g.Edges {
		fmt.Fprintf(bw, "\tn%d -- n%d\n", e[0], e[1])
	}
	fmt.Fprintln(bw, "}")
	return bw.Flush()
}
