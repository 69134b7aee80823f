package planarize

// Simplify returns the simple undirected graph underlying a multigraph on n
// vertices: loops are dropped and each unordered pair is kept once, at the
// position of its first occurrence. index[i] is the simple edge that raw
// edge i became, or -1 for a loop. It runs in O(n + len(raw)) with two
// counting-sort passes, so the result does not depend on map order.
func Simplify(n int, raw [][2]int32) (simple [][2]int32, index []int32) {
	index = make([]int32, len(raw))
	// Bucket raw edges by their smaller end, then scan each bucket marking
	// the larger end to detect repeats. Input already sorted by smaller end
	// and free of loops (as Draw passes it) needs no bucketing: the buckets
	// are runs of raw itself.
	count := make([]int32, n+1)
	sorted := true
	prevLo := int32(-1)
	for _, e := range raw {
		u, v := e[0], e[1]
		if u == v {
			sorted = false
			continue
		}
		lo := min(u, v)
		sorted = sorted && lo >= prevLo
		prevLo = lo
		count[lo+1]++
	}
	for v := 1; v <= n; v++ {
		count[v] += count[v-1]
	}
	order := make([]int32, count[n])
	if sorted {
		for i := range order {
			order[i] = int32(i)
		}
	} else {
		fill := append([]int32(nil), count[:n]...)
		for i, e := range raw {
			u, v := e[0], e[1]
			if u == v {
				index[i] = -1
				continue
			}
			lo := min(u, v)
			order[fill[lo]] = int32(i)
			fill[lo]++
		}
	}
	// first[i] is the raw edge that first carried the pair of raw edge i.
	firstRaw := make([]int32, len(raw))
	mark := make([]int32, n)
	for v := range mark {
		mark[v] = -1
	}
	for lo := 0; lo < n; lo++ {
		for _, i := range order[count[lo]:count[lo+1]] {
			hi := max(raw[i][0], raw[i][1])
			if m := mark[hi]; m >= 0 {
				firstRaw[i] = m
			} else {
				mark[hi] = i
				firstRaw[i] = i
			}
		}
		for _, i := range order[count[lo]:count[lo+1]] {
			mark[max(raw[i][0], raw[i][1])] = -1
		}
	}
	// Number the pairs in order of first occurrence.
	simple = make([][2]int32, 0, count[n])
	for i, e := range raw {
		if e[0] == e[1] {
			continue
		}
		if f := firstRaw[i]; f == int32(i) {
			index[i] = int32(len(simple))
			simple = append(simple, e)
		} else {
			index[i] = index[f]
		}
	}
	return simple, index
}

// IsSimple reports whether the embedding has no loop and no two edges
// joining the same pair, in O(n + m).
func (e *Embedding) IsSimple() bool {
	n := e.N()
	seen := make([]int32, n) // seen[u] == v: u is already a neighbour of v
	for v := range seen {
		seen[v] = -1
	}
	for v := int32(0); int(v) < n; v++ {
		d := e.First(v)
		for range e.Degree(v) {
			u := e.Head(d)
			if u == v || seen[u] == v {
				return false
			}
			seen[u] = v
			d = e.Next(d)
		}
	}
	return true
}
