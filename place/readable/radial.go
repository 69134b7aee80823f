package readable

import (
	"cmp"
	"math"
	"slices"

	"github.com/gridwood/gridwood/internal/trig"
)

// radialStart returns a plane drawing of a tree (n vertices, n-1 edges,
// connected) for the guarded descent to start from: rooted at the tree's
// centre, each vertex on the circle of its depth (circles a mean ideal
// length apart), and each subtree in a wedge of its parent's in
// proportion to its leaves, the children in the order they turn around
// their parent in the target drawing tx, ty, so that the drawing keeps
// the target's embedding. Below the root a vertex's wedge is at most the
// angle within which its children's circle is reached without passing
// inside its own: the radial layout of P. Eades, "Drawing free trees",
// Bull. Inst. Combin. Appl. 5 (1992), which bound keeps it plane (the
// caller still checks it exactly).
func radialStart(n int, edges [][2]int32, lengths []float64, tx, ty []float64) (x, y []float64) {
	start := make([]int32, n+1)
	for _, e := range edges {
		start[e[0]+1]++
		start[e[1]+1]++
	}
	for v := range n {
		start[v+1] += start[v]
	}
	adj := make([]int32, 2*len(edges))
	fill := append([]int32(nil), start[:n]...)
	for _, e := range edges {
		adj[fill[e[0]]] = e[1]
		fill[e[0]]++
		adj[fill[e[1]]] = e[0]
		fill[e[1]]++
	}
	// The centre: the middle of a longest path (two breadth-first
	// searches, in edges).
	parent := make([]int32, n)
	order := make([]int32, 0, n)
	bfs := func(root int32) {
		order = order[:0]
		for v := range parent {
			parent[v] = -2
		}
		parent[root] = -1
		order = append(order, root)
		for i := 0; i < len(order); i++ {
			v := order[i]
			for _, w := range adj[start[v]:start[v+1]] {
				if parent[w] == -2 {
					parent[w] = v
					order = append(order, w)
				}
			}
		}
	}
	bfs(0)
	bfs(order[len(order)-1])
	var path []int32
	for v := order[len(order)-1]; v >= 0; v = parent[v] {
		path = append(path, v)
	}
	root := path[len(path)/2]
	bfs(root)
	// Leaves per subtree, children first: a vertex none of whose
	// children added to it is a leaf.
	leaves := make([]float64, n)
	for i := len(order) - 1; i >= 0; i-- {
		v := order[i]
		if leaves[v] == 0 {
			leaves[v] = 1
		}
		if p := parent[v]; p >= 0 {
			leaves[p] += leaves[v]
		}
	}
	// Wedges, parents first: a vertex's children share its wedge in the
	// order they turn around it in the target, counter-clockwise from the
	// direction back to its parent.
	x, y = make([]float64, n), make([]float64, n)
	radius, angle := make([]float64, n), make([]float64, n)
	// Circles a mean ideal length apart.
	unit := 0.0
	for _, l := range lengths {
		unit += l
	}
	unit /= float64(max(1, len(lengths)))
	from, to := make([]float64, n), make([]float64, n)
	from[root], to[root] = 0, 2*math.Pi
	var kids []int32
	for _, v := range order {
		kids = kids[:0]
		var back [2]float64
		if p := parent[v]; p >= 0 {
			back = [2]float64{tx[p] - tx[v], ty[p] - ty[v]}
		} else {
			back = [2]float64{1, 0}
		}
		for k := start[v]; k < start[v+1]; k++ {
			if w := adj[k]; w != parent[v] {
				kids = append(kids, w)
			}
		}
		slices.SortFunc(kids, turnOrder(tx, ty, v, back))
		// Eades' bound: below the root, the children's wedge is at most
		// the angle within which the next circle can be reached from v
		// without passing inside v's own circle, centred on v.
		lo, hi := from[v], to[v]
		if parent[v] >= 0 {
			bound := 2 * arcCos(radius[v]/(radius[v]+unit))
			if hi-lo > bound {
				lo, hi = max(lo, angle[v]-bound/2), min(hi, angle[v]+bound/2)
			}
		}
		at := lo
		for _, w := range kids {
			share := (hi - lo) * leaves[w] / leaves[v]
			from[w], to[w] = at, at+share
			at += share
			radius[w] = radius[v] + unit
			angle[w] = (from[w] + to[w]) / 2
			x[w], y[w] = float64(radius[w]*trig.Cos(angle[w])), float64(radius[w]*trig.Sin(angle[w]))
		}
	}
	return x, y
}

// turnOrder compares two vertices by the angle they make around v in
// the drawing x, y, counter-clockwise from direction back, exactly: by
// half turn first, then by cross product (ties by number).
func turnOrder(x, y []float64, v int32, back [2]float64) func(a, b int32) int {
	half := func(dx, dy float64) int {
		// 0 from back (included) to half a turn on (excluded), 1 beyond.
		c := float64(back[0]*dy) - float64(back[1]*dx)
		d := float64(back[0]*dx) + float64(back[1]*dy)
		if c > 0 || (c == 0 && d > 0) {
			return 0
		}
		return 1
	}
	return func(a, b int32) int {
		ax, ay := x[a]-x[v], y[a]-y[v]
		bx, by := x[b]-x[v], y[b]-y[v]
		if ha, hb := half(ax, ay), half(bx, by); ha != hb {
			return ha - hb
		}
		if c := float64(ax*by) - float64(ay*bx); c != 0 {
			if c > 0 {
				return -1
			}
			return 1
		}
		return cmp.Compare(a, b)
	}
}

// arcCos returns the angle in [0, pi/2] whose cosine is c, for c in
// [0, 1], by bisection on internal/trig's cosine: the same bits on every
// machine, as the drawing must be.
func arcCos(c float64) float64 {
	lo, hi := 0.0, math.Pi/2
	for range 60 {
		mid := (lo + hi) / 2
		if trig.Cos(mid) > c {
			lo = mid
		} else {
			hi = mid
		}
	}
	return (lo + hi) / 2
}
