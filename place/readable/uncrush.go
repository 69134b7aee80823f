package readable

import (
	"slices"

	"github.com/gridwood/gridwood/place/mesh"
)

// Crushed parts. A plane start drawn as convex combinations (Tutte's and
// Floater's drawings) can shrink a whole part of the graph, a chain or a
// pocket behind a cut vertex, to a speck far below its edges' ideal
// lengths. Stress would blow it up, but a vertex may move only inside its
// own triangles, which in the speck are specks too, and the guard refuses
// to flatten the triangles around it: moving one vertex at a time, the
// part stays crushed. uncrush blows such parts up whole instead.

// crushedShare: an edge drawn shorter than this share of its ideal length
// is crushed.
const crushedShare = 0.05

// uncrush finds the parts of the drawing held together by crushed edges
// (components of the graph of crushed edges) and scales each about its
// centroid by the factor that gives its edges their ideal mean length,
// halving the factor until the drawing stays plane (checked exactly by
// triangulating it anew), and keeps the largest that does. It returns
// whether anything moved; the guard's triangulation is then rebuilt.
func (g *guard) uncrush(lengths []float64, reach float64) bool {
	n := len(g.x)
	parent := make([]int32, n)
	for v := range parent {
		parent[v] = int32(v)
	}
	var find func(int32) int32
	find = func(v int32) int32 {
		for parent[v] != v {
			parent[v] = parent[parent[v]]
			v = parent[v]
		}
		return v
	}
	crushed := false
	for i, e := range g.edges {
		if hypot(g.x[e[0]]-g.x[e[1]], g.y[e[0]]-g.y[e[1]]) < crushedShare*lengths[i] {
			parent[find(e[0])] = find(e[1])
			crushed = true
		}
	}
	if !crushed {
		return false
	}
	// The parts, as lists of vertices in index order, each to grow by
	// the factor that gives its edges their ideal mean length.
	members := map[int32][]int32{}
	for v := range int32(n) {
		r := find(v)
		members[r] = append(members[r], v)
	}
	roots := make([]int32, 0, len(members))
	for r, vs := range members {
		if len(vs) >= 2 {
			roots = append(roots, r)
		}
	}
	slices.Sort(roots)
	var parts [][]int32
	var factors []float64
	for _, r := range roots {
		vs := members[r]
		in := make(map[int32]bool, len(vs))
		for _, v := range vs {
			in[v] = true
		}
		var drawn, ideal float64
		for i, e := range g.edges {
			if in[e[0]] && in[e[1]] {
				drawn += hypot(g.x[e[0]]-g.x[e[1]], g.y[e[0]]-g.y[e[1]])
				ideal += lengths[i]
			}
		}
		if drawn > 0 {
			parts = append(parts, vs)
			factors = append(factors, ideal/drawn)
		}
	}
	return g.blowUp(parts, factors, reach)
}

// blowUp scales each part about its centroid by its factor, halving the
// factor until the drawing stays plane (checked exactly by triangulating
// it anew) and no more crowded than before (see crowding), and keeps the
// largest that does, if more than 1.5; it reports whether anything moved
// (the guard's triangulation is then the new one).
func (g *guard) blowUp(parts [][]int32, factors []float64, reach float64) bool {
	moved := false
	before := min(1, g.crowding())
	for k, vs := range parts {
		var cx, cy float64
		for _, v := range vs {
			cx += g.x[v]
			cy += g.y[v]
		}
		cx, cy = cx/float64(len(vs)), cy/float64(len(vs))
		x := append([]float64(nil), g.x...)
		y := append([]float64(nil), g.y...)
		for f := factors[k]; f > 1.5; f /= 2 {
			for _, v := range vs {
				x[v] = cx + float64(f*(g.x[v]-cx))
				y[v] = cy + float64(f*(g.y[v]-cy))
			}
			m, err := mesh.New(x, y, g.edges, reach)
			if err != nil {
				continue
			}
			// Plane is not enough: the part must not land pressed against
			// what lies around it.
			trial := *g
			trial.mesh, trial.x, trial.y = m, x, y
			if trial.crowding() < before {
				continue
			}
			copy(g.x, x)
			copy(g.y, y)
			g.mesh = m
			moved = true
			break
		}
	}
	return moved
}
