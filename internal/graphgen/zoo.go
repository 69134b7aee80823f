package graphgen

import "slices"

// Zoo lists named families and their disjoint unions, small to large,
// with awkward cases (empty, isolated vertices, stars, long paths, nested
// triangles, relabelled copies) that the layout and augmentation tests run
// on.
func Zoo() []Graph {
	var gs []Graph
	gs = append(gs,
		Graph{N: 0, Name: "empty"},
		Graph{N: 1, Name: "single-node"},
		Graph{N: 2, Name: "two-isolated"},
		Graph{N: 57, Name: "isolated-57"},
		Tetrahedron(), Cube(), Octahedron(),
		Dodecahedron(), Icosahedron(),
	)
	for _, k := range []int{1, 2, 3, 4, 5, 10, 17, 31, 60} {
		gs = append(gs, Grid(k, k))
	}
	gs = append(gs, Grid(1, 40), Grid(2, 30), Grid(7, 3))
	for _, r := range []int{3, 4, 5, 10, 100, 500} {
		gs = append(gs, Wheel(r))
	}
	for _, l := range []int{0, 1, 2, 3, 4, 10, 1000} {
		gs = append(gs, Star(l))
	}
	for _, n := range []int{1, 2, 3, 4, 5, 100, 2000} {
		gs = append(gs, Path(n))
	}
	for _, n := range []int{3, 4, 5, 6, 100, 1000} {
		gs = append(gs, Cycle(n))
	}
	for i, n := range []int{3, 4, 5, 10, 50, 200, 1000, 3000} {
		gs = append(gs, RandomTree(n, uint64(100+i)))
	}
	for _, l := range []int{1, 2, 3, 4, 10, 50, 100, 300} {
		gs = append(gs, NestedTriangles(l), NestedTrianglesPlain(l))
	}
	for _, rc := range [][2]int{{1, 1}, {1, 5}, {2, 2}, {2, 9}, {5, 7}, {20, 20}, {40, 25}} {
		gs = append(gs, TriangulatedGrid(rc[0], rc[1]))
	}
	gs = append(gs,
		named(Relabel(Grid(12, 9), 5), "grid-12x9-relabelled"),
		named(Relabel(NestedTrianglesPlain(40), 6), "nested-plain-40-relabelled"),
		named(Relabel(Wheel(50), 7), "wheel-50-relabelled"),
		named(Relabel(Star(200), 8), "star-200-relabelled"),
		named(Relabel(TriangulatedGrid(9, 13), 9), "trigrid-9x13-relabelled"),
	)
	// Disjoint unions of everything small, with isolated vertices between.
	var parts []Graph
	for _, g := range gs {
		if g.N <= 400 {
			parts = append(parts, g, Graph{N: 2, Name: "pair-isolated"})
		}
	}
	gs = append(gs, named(DisjointUnion(parts...), "union-of-small-families"))
	gs = append(gs, named(Relabel(DisjointUnion(parts...), 11), "union-of-small-families-relabelled"))
	all := slices.Clone(gs)
	gs = append(gs, named(DisjointUnion(all...), "union-of-all-families"))
	gs = append(gs, named(DisjointUnion(
		Path(2), Path(2), Cycle(3), Path(1), Path(3),
	), "union-tiny"))
	return gs
}

func named(g Graph, name string) Graph {
	g.Name = name
	return g
}
