package graphgen

import "math"

// The Platonic solids are derived from their standard Cartesian coordinates
// (Coxeter, Regular Polytopes, chapter III): two vertices are joined exactly
// when their distance is the minimum pairwise distance. This is the only
// floating-point code in the package; the tests check the resulting graphs
// exactly.

type point3 struct{ x, y, z float64 }

// signs returns the points (±a, ±b, ±c), skipping repeated points when a
// coordinate is zero, in a fixed order (the sign of x varies slowest).
func signs(a, b, c float64) []point3 {
	var pts []point3
	for _, sx := range []float64{1, -1} {
		if a == 0 && sx < 0 {
			continue
		}
		for _, sy := range []float64{1, -1} {
			if b == 0 && sy < 0 {
				continue
			}
			for _, sz := range []float64{1, -1} {
				if c == 0 && sz < 0 {
					continue
				}
				pts = append(pts, point3{sx * a, sy * b, sz * c})
			}
		}
	}
	return pts
}

// cyclic returns the points (±a, ±b, ±c) under the three cyclic
// permutations of the coordinates.
func cyclic(a, b, c float64) []point3 {
	pts := signs(a, b, c)
	pts = append(pts, signs(b, c, a)...)
	return append(pts, signs(c, a, b)...)
}

// nearestNeighbourGraph joins the pairs of pts at minimum distance. The
// relative tolerance absorbs rounding in the irrational coordinates; in every
// solid the next distance is larger by a factor of at least 1.4.
func nearestNeighbourGraph(name string, pts []point3) Graph {
	dist2 := func(p, q point3) float64 {
		dx, dy, dz := p.x-q.x, p.y-q.y, p.z-q.z
		return dx*dx + dy*dy + dz*dz
	}
	best := math.Inf(1)
	for i := range pts {
		for j := i + 1; j < len(pts); j++ {
			best = min(best, dist2(pts[i], pts[j]))
		}
	}
	g := Graph{N: len(pts), Name: name}
	for i := range pts {
		for j := i + 1; j < len(pts); j++ {
			if math.Abs(dist2(pts[i], pts[j])-best) <= 1e-9*best {
				g.add(int64(i), int64(j))
			}
		}
	}
	return g
}

var phi = (1 + math.Sqrt(5)) / 2

// Tetrahedron returns the skeleton of the regular tetrahedron, from the
// vertices of the cube (±1, ±1, ±1) with an even number of minus signs.
func Tetrahedron() Graph {
	var pts []point3
	for _, p := range signs(1, 1, 1) {
		if p.x*p.y*p.z > 0 {
			pts = append(pts, p)
		}
	}
	return nearestNeighbourGraph("tetrahedron", pts)
}

// Cube returns the skeleton of the cube (±1, ±1, ±1). Vertex k has
// coordinate signs given by the bits of k (bit 2 for x, bit 0 for z, a set
// bit meaning minus), so the result is the 3-dimensional hypercube graph in
// its binary labelling.
func Cube() Graph {
	return nearestNeighbourGraph("cube", signs(1, 1, 1))
}

// Octahedron returns the skeleton of the regular octahedron, from (±1, 0, 0)
// and its permutations.
func Octahedron() Graph {
	return nearestNeighbourGraph("octahedron", cyclic(1, 0, 0))
}

// Dodecahedron returns the skeleton of the regular dodecahedron, from
// (±1, ±1, ±1) and the cyclic permutations of (0, ±1/φ, ±φ), φ the golden
// ratio.
func Dodecahedron() Graph {
	pts := signs(1, 1, 1)
	pts = append(pts, cyclic(0, 1/phi, phi)...)
	return nearestNeighbourGraph("dodecahedron", pts)
}

// Icosahedron returns the skeleton of the regular icosahedron, from the
// cyclic permutations of (0, ±1, ±φ), φ the golden ratio.
func Icosahedron() Graph {
	return nearestNeighbourGraph("icosahedron", cyclic(0, 1, phi))
}

// Solid is a Platonic solid's skeleton with its handbook counts (H. S. M.
// Coxeter, Regular Polytopes, table I; also in SOURCES.md): V vertices,
// E edges and F faces, every face a P-gon and every vertex of degree Q
// (Schläfli symbol {P, Q}). Tests check the generators and the embeddings
// against these numbers, which are not computed from the graphs.
type Solid struct {
	Graph
	V, E, F, P, Q int
}

// PlatonicSolids returns the five solids with their handbook counts.
func PlatonicSolids() []Solid {
	return []Solid{
		{Tetrahedron(), 4, 6, 4, 3, 3},
		{Cube(), 8, 12, 6, 4, 3},
		{Octahedron(), 6, 12, 8, 3, 4},
		{Dodecahedron(), 20, 30, 12, 5, 3},
		{Icosahedron(), 12, 30, 20, 3, 5},
	}
}
