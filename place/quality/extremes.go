package quality

import (
	"math"
	"slices"
)

// Extremes are the worst spots of a straight-line drawing on integer
// points: what --report calls min_angle_deg, edge_length_ratio and
// min_vertex_edge_distance.
type Extremes struct {
	// MinAngle is the smallest angle, in degrees, between two edges at a
	// common vertex (180 when no vertex has two edges).
	MinAngle float64
	// EdgeRatio is the longest edge's length over the shortest's (1 for
	// fewer than two edges).
	EdgeRatio float64
	// MinVertexEdge is the smallest distance from a vertex to an edge it
	// is not an end of, in the drawing's units; -1 if the drawing was too
	// big to measure within the work bound, or has no such pair.
	MinVertexEdge float64
}

// extremesWork bounds the vertex-edge pairs MeasureExtremes looks at.
const extremesWork = 50_000_000

// MeasureExtremes computes the Extremes of the drawing with vertices at
// x, y and the given edges (loops ignored).
func MeasureExtremes(x, y []int64, edges [][2]int32) Extremes {
	q := Extremes{MinAngle: 180, EdgeRatio: 1, MinVertexEdge: -1}
	n := len(x)
	dirs := make([][]float64, n)
	shortest, longest := math.Inf(1), 0.0
	for _, e := range edges {
		u, v := e[0], e[1]
		if u == v {
			continue
		}
		dx, dy := float64(x[v]-x[u]), float64(y[v]-y[u])
		l := math.Hypot(dx, dy)
		shortest, longest = min(shortest, l), max(longest, l)
		dirs[u] = append(dirs[u], math.Atan2(dy, dx))
		dirs[v] = append(dirs[v], math.Atan2(-dy, -dx))
	}
	if longest > 0 && shortest > 0 && !math.IsInf(shortest, 1) {
		q.EdgeRatio = longest / shortest
	}
	for _, a := range dirs {
		if len(a) < 2 {
			continue
		}
		slices.Sort(a)
		gap := a[0] + 2*math.Pi - a[len(a)-1]
		for i := 1; i < len(a); i++ {
			gap = min(gap, a[i]-a[i-1])
		}
		q.MinAngle = min(q.MinAngle, gap*180/math.Pi)
	}
	if int64(n)*int64(len(edges)) > extremesWork {
		return q
	}
	best := math.Inf(1)
	for _, e := range edges {
		u, v := e[0], e[1]
		if u == v {
			continue
		}
		ex, ey := float64(x[v]-x[u]), float64(y[v]-y[u])
		l2 := ex*ex + ey*ey
		for w := range n {
			if int32(w) == u || int32(w) == v {
				continue
			}
			wx, wy := float64(x[w]-x[u]), float64(y[w]-y[u])
			t := 0.0
			if l2 > 0 {
				t = min(1, max(0, (wx*ex+wy*ey)/l2))
			}
			best = min(best, math.Hypot(wx-t*ex, wy-t*ey))
		}
	}
	if !math.IsInf(best, 1) {
		q.MinVertexEdge = best
	}
	return q
}
