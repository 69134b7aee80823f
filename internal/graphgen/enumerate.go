package graphgen

// maxEnumerated is the largest n for which AllSimpleGraphs enumerates:
// 2^21 graphs at n = 7, 2^28 at n = 8.
const maxEnumerated = 7

// AllSimpleGraphs calls f once for each of the 2^(n(n-1)/2) labelled simple
// graphs on the vertices 0..n-1, for 0 <= n <= 7 (for other n, or a nil f,
// it does nothing). The graph numbered by the bit mask b has the pair
// (i, j), i < j, taken in lexicographic order as the k-th pair, exactly when
// bit k of b is set; graphs are visited in increasing b, and each edge list
// is in pair order with i < j.
//
// The edges slice is reused between calls: f must not retain it (or any
// subslice) after it returns; it may modify it.
func AllSimpleGraphs(n int, f func(edges [][2]int32)) {
	if n < 0 || n > maxEnumerated || f == nil {
		return
	}
	var pairs [][2]int32
	for i := range int32(n) {
		for j := i + 1; j < int32(n); j++ {
			pairs = append(pairs, [2]int32{i, j})
		}
	}
	edges := make([][2]int32, 0, len(pairs))
	for mask := uint32(0); mask < 1<<len(pairs); mask++ {
		edges = edges[:0]
		for k, p := range pairs {
			if mask>>k&1 == 1 {
				edges = append(edges, p)
			}
		}
		f(edges)
	}
}
