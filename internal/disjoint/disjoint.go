package disjoint

// Sets is a partition of 0..n-1; each set is named by its root.
type Sets struct{ parent []int32 }

// New returns n singleton sets.
func New(n int) *Sets {
	p := make([]int32, n)
	for i := range p {
		p[i] = int32(i)
	}
	return &Sets{p}
}

// Find returns the root of x's set, compressing the path to it.
func (s *Sets) Find(x int32) int32 {
	r := x
	for s.parent[r] != r {
		r = s.parent[r]
	}
	for s.parent[x] != r {
		s.parent[x], x = r, s.parent[x]
	}
	return r
}

// Union merges the sets of a and b and returns the merged set's root: a's
// root, under which b's root is linked.
func (s *Sets) Union(a, b int32) int32 {
	a, b = s.Find(a), s.Find(b)
	if a != b {
		s.parent[b] = a
	}
	return a
}
