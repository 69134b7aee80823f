package graphgen

// Components labels the vertices of the graph by connected component,
// numbering components by their smallest vertex, with its own union-find so
// that tests using it share no code with the packages they test.
func Components(n int, edges [][2]int32) (label []int, members [][]int32) {
	parent := make([]int, n)
	for v := range parent {
		parent[v] = v
	}
	var find func(int) int
	find = func(x int) int {
		for parent[x] != x {
			parent[x] = parent[parent[x]]
			x = parent[x]
		}
		return x
	}
	for _, e := range edges {
		a, b := find(int(e[0])), find(int(e[1]))
		if a != b {
			parent[max(a, b)] = min(a, b) // the root is the smallest vertex
		}
	}
	label = make([]int, n)
	id := make(map[int]int)
	for v := range n {
		r := find(v)
		c, ok := id[r]
		if !ok { // vertices are visited in increasing order
			c = len(members)
			id[r] = c
			members = append(members, nil)
		}
		label[v] = c
		members[c] = append(members[c], int32(v))
	}
	return label, members
}
