package spacing

// Tree draws a tree component in layers (see layeredTree) into x, y:
// columns one box width plus the gap apart, layers one box height plus
// twice the gap. Then the layers are pulled apart by the least factor
// (found by doubling and halving) that keeps every edge off the boxes it
// passes: only a shallow edge can pass a box, always one in a layer it
// ends in, and taller layers make every edge steeper, so widening the
// drawing never helps. Any such scaling keeps the drawing plane once
// rounded: the proof needs only the order of the layers and of the
// vertices within each.
//
// It reports how it ended: cleared, crowded (clearing would need more
// than maxExtent points), or unchecked (the clearance check ran out of
// work).
func Tree(vs []int32, edges [][2]int32, hw, hh []int64, gap int64, x, y []int64, stamp []int32) (crowded, unchecked bool) {
	var w, h int64
	for _, v := range vs {
		w, h = max(w, hw[v]), max(h, hh[v])
	}
	column := 2*w + gap
	column += column & 1 // even: half columns are whole points
	layer := max(1, 2*h+2*gap)
	layeredTree(vs, edges, max(2, column), layer, x, y)
	top := int64(0)
	for _, v := range vs {
		top = max(top, y[v])
	}
	depth := top / layer // layers below the root
	clear := func(l int64) bool {
		for _, v := range vs {
			y[v] = y[v] / layer * l
		}
		layer = l
		s, checked := ClearingStretch(vs, edges, x, y, hw, hh, gap, stamp, NewMeter(len(edges)), true)
		unchecked = !checked
		return checked && s <= 1
	}
	lo, hi := layer, layer
	for !clear(hi) {
		if unchecked {
			return false, true
		}
		lo, hi = hi, 2*hi
		if hi*max(1, depth) > maxExtent {
			return true, false // too tall to clear: the last try stands
		}
	}
	for hi-lo > max(1, lo/64) { // within 1/64 of the least
		mid := lo + (hi-lo)/2
		if clear(mid) {
			hi = mid
		} else {
			lo = mid
		}
	}
	clear(hi)
	return false, false
}

// layeredTree draws a tree component in layers, in the manner of the tidy
// drawings of E. Reingold and J. Tilford ("Tidier drawings of trees", IEEE
// Trans. Softw. Eng. 7, 1981) without their contour packing: rooted at a
// centre of the tree (so it is as shallow as it can be), each vertex sits
// one layer below its parent, the leaves take consecutive columns in
// depth-first order, and every other vertex sits over the middle of its
// middle children. The drawing is plane by construction: edges join
// consecutive layers only, and the vertices of each layer appear in
// depth-first order, each inside the column range of its own subtree, so
// two edges between the same two layers are ordered the same way at both
// ends. A Schnyder drawing of a tree spreads it over an (n-2) x (n-2)
// grid; this one is as wide as the tree has leaves and as tall as its
// radius.
//
// vs are the component's vertices and edges its len(vs)-1 edges; column
// and layer are the steps in points. x, y receive the positions (y up,
// the root on top).
func layeredTree(vs []int32, edges [][2]int32, column, layer int64, x, y []int64) {
	n := len(vs)
	index := make(map[int32]int32, n)
	for i, v := range vs {
		index[v] = int32(i)
	}
	// Adjacency in edge order, so that children keep the input's order.
	start := make([]int32, n+1)
	for _, e := range edges {
		start[index[e[0]]+1]++
		start[index[e[1]]+1]++
	}
	for i := 1; i <= n; i++ {
		start[i] += start[i-1]
	}
	adj := make([]int32, 2*len(edges))
	fill := append([]int32(nil), start[:n]...)
	for _, e := range edges {
		a, b := index[e[0]], index[e[1]]
		adj[fill[a]], fill[a] = b, fill[a]+1
		adj[fill[b]], fill[b] = a, fill[b]+1
	}
	// A centre: peel leaves layer by layer; the last vertex peeled (the
	// first in vertex order among the last layer) is one.
	deg := make([]int32, n)
	var layerVs []int32
	for i := range n {
		deg[i] = start[i+1] - start[i]
		if deg[i] <= 1 {
			layerVs = append(layerVs, int32(i))
		}
	}
	root, left := layerVs[0], n
	for len(layerVs) > 0 {
		root = layerVs[0]
		left -= len(layerVs)
		if left == 0 {
			break
		}
		var next []int32
		for _, v := range layerVs {
			for _, w := range adj[start[v]:start[v+1]] {
				if deg[w]--; deg[w] == 1 {
					next = append(next, w)
				}
			}
			deg[v] = 0
		}
		layerVs = next
	}
	// Depth-first from the root, iteratively: depth on the way down,
	// columns on the way up (post-order).
	parent := make([]int32, n)
	depth := make([]int32, n)
	col := make([]int64, n)
	next := make([]int32, n) // next adjacency slot to look at
	for i := range parent {
		parent[i] = -1
		next[i] = start[i]
	}
	stack := []int32{root}
	parent[root] = root
	leaves := int64(0)
	maxDepth := int32(0)
	var kids []int32
	for len(stack) > 0 {
		v := stack[len(stack)-1]
		if next[v] < start[v+1] {
			w := adj[next[v]]
			next[v]++
			if parent[w] < 0 {
				parent[w] = v
				depth[w] = depth[v] + 1
				maxDepth = max(maxDepth, depth[w])
				stack = append(stack, w)
			}
			continue
		}
		stack = stack[:len(stack)-1]
		kids = kids[:0]
		for _, w := range adj[start[v]:start[v+1]] {
			if parent[w] == v && w != v {
				kids = append(kids, w)
			}
		}
		if len(kids) == 0 {
			col[v] = 2 * leaves // half columns, so a midpoint is whole
			leaves++
			continue
		}
		k := len(kids)
		col[v] = (col[kids[(k-1)/2]] + col[kids[k/2]]) / 2
	}
	for i, v := range vs {
		x[v] = col[i] * column / 2
		y[v] = int64(maxDepth-depth[i]) * layer
	}
}
