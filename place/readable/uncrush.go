package readable

import (
	"slices"

	"github.com/gridwood/gridwood/internal/disjoint"
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
	parts := joinedParts(len(g.x), g.edges, func(i int) bool {
		e := g.edges[i]
		return hypot(g.x[e[0]]-g.x[e[1]], g.y[e[0]]-g.y[e[1]]) < crushedShare*lengths[i]
	}, nil)
	if len(parts) == 0 {
		return false
	}
	// Each part grows by the factor that gives its edges their ideal mean
	// length: the sums over its edges, in one pass over all edges.
	partOf := make([]int32, len(g.x))
	for v := range partOf {
		partOf[v] = -1
	}
	for k, vs := range parts {
		for _, v := range vs {
			partOf[v] = int32(k)
		}
	}
	drawn, ideal := make([]float64, len(parts)), make([]float64, len(parts))
	for i, e := range g.edges {
		if k := partOf[e[0]]; k >= 0 && k == partOf[e[1]] {
			drawn[k] += hypot(g.x[e[0]]-g.x[e[1]], g.y[e[0]]-g.y[e[1]])
			ideal[k] += lengths[i]
		}
	}
	var grown [][]int32
	var factors []float64
	for k, vs := range parts {
		if drawn[k] > 0 {
			grown = append(grown, vs)
			factors = append(factors, ideal[k]/drawn[k])
		}
	}
	return g.blowUp(grown, factors, reach)
}

// joinedParts joins the ends of every edge i for which join(i) holds and
// returns the parts of two or more vertices for which keep holds (nil:
// all), each in increasing order, the parts in the order of their roots
// (the second end's root stays the root of a joined pair).
func joinedParts(n int, edges [][2]int32, join func(i int) bool, keep func(v int32) bool) [][]int32 {
	sets := disjoint.New(n)
	joined := false
	for i, e := range edges {
		if join(i) {
			sets.Union(e[1], e[0])
			joined = true
		}
	}
	if !joined {
		return nil
	}
	members := map[int32][]int32{}
	var roots []int32
	for v := range int32(n) {
		if keep != nil && !keep(v) {
			continue
		}
		r := sets.Find(v)
		if len(members[r]) == 0 {
			roots = append(roots, r)
		}
		members[r] = append(members[r], v)
	}
	slices.Sort(roots)
	var parts [][]int32
	for _, r := range roots {
		if len(members[r]) >= 2 {
			parts = append(parts, members[r])
		}
	}
	return parts
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
