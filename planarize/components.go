package planarize

// Components returns the number of connected components, isolated vertices
// included.
func (e *Embedding) Components() int {
	_, count := e.componentLabels()
	return int(count)
}

// ComponentLabels labels the vertices by connected component, numbering
// components by their smallest vertex, and lists each component's vertices
// in increasing order.
func (e *Embedding) ComponentLabels() (label []int32, members [][]int32) {
	label, count := e.componentLabels()
	start, flat := groupByLabel(label, int(count))
	members = make([][]int32, count)
	for c := range members {
		members[c] = flat[start[c]:start[c+1]:start[c+1]]
	}
	return label, members
}

// componentLabels labels the vertices as ComponentLabels does and returns
// the number of components.
func (e *Embedding) componentLabels() (label []int32, count int32) {
	if label, count, ok := e.intervalLabels(); ok {
		return label, count
	}
	n := e.N()
	label = make([]int32, n)
	for v := range label {
		label[v] = -1
	}
	var stack []int32
	for s := int32(0); int(s) < n; s++ {
		if label[s] >= 0 {
			continue
		}
		label[s] = count
		stack = append(stack[:0], s)
		for len(stack) > 0 {
			v := stack[len(stack)-1]
			stack = stack[:len(stack)-1]
			f := e.first[v]
			if f < 0 {
				continue
			}
			for d := f; ; {
				if w := e.Head(d); label[w] < 0 {
					label[w] = count
					stack = append(stack, w)
				}
				if d = e.next[d]; d == f {
					break
				}
			}
		}
		count++
	}
	return label, count
}

// intervalLabels finds the components in two sequential passes when each
// is an interval of vertex numbers, as after a depth-first renumbering, and
// reports false otherwise. The intervals are the stretches no edge leaves;
// such a stretch is connected when each of its vertices but the first has
// a smaller neighbour in it, since following smaller neighbours then leads
// every vertex to the first.
func (e *Embedding) intervalLabels() (label []int32, count int32, ok bool) {
	n := e.N()
	reach := make([]int32, n) // the largest neighbour, or the vertex itself
	below := make([]bool, n)  // has a smaller neighbour
	for v := range reach {
		reach[v] = int32(v)
	}
	for _, ed := range e.edges {
		lo, hi := min(ed[0], ed[1]), max(ed[0], ed[1])
		reach[lo] = max(reach[lo], hi)
		below[hi] = true
	}
	label = make([]int32, n)
	first, far := 0, int32(-1)
	for v := range n {
		if v > first && !below[v] {
			return nil, 0, false
		}
		label[v] = count
		far = max(far, reach[v])
		if far == int32(v) {
			count++
			first = v + 1
		}
	}
	return label, count, true
}

// groupByLabel lists the indices of label grouped by their label (each in
// 0..count-1), in increasing order within a group: group c is
// flat[start[c]:start[c+1]]. A counting sort, linear in len(label)+count.
func groupByLabel(label []int32, count int) (start, flat []int32) {
	start = make([]int32, count+1)
	for _, c := range label {
		start[c+1]++
	}
	for c := 1; c <= count; c++ {
		start[c] += start[c-1]
	}
	flat = make([]int32, len(label))
	fill := append([]int32(nil), start[:count]...)
	for i, c := range label {
		flat[fill[c]] = int32(i)
		fill[c]++
	}
	return start, flat
}
