package place

import (
	"slices"

	"github.com/gridwood/gridwood/internal/exact"
	"github.com/gridwood/gridwood/place/internal/spacing"
)

// compactPairLimit bounds the vertex-edge pairs one compaction check may
// look at, and compactPerEdge (plus compactFloor) per edge all checks of
// one axis together, so compaction stays linear in the graph; beyond them
// a drawing keeps the gaps not yet closed.
const (
	compactPairLimit = 2_000_000
	compactPerEdge   = 200
	compactFloor     = 200_000
)

// compact removes empty grid columns and rows of one component's drawing
// where that provably changes nothing about crossings or touching: the
// points keep their order along the axis being shrunk, so a crossing, a
// touching or a vertex on an edge can only appear or vanish if some vertex
// changes sides with some edge whose span along that axis strictly
// contains it; compact checks every such pair with exact integer
// orientation tests. The gaps to close are chosen greedily with adaptive
// group tests (all at once first). It returns the new extent.
func compact(x, y []int64, edges [][2]int32) (w, h int64) {
	for round := 0; round < 2 && len(x) <= spacing.ReadableLimit; round++ {
		cx := compactAxis(x, y, edges)
		cy := compactAxis(y, x, edges)
		if !cx && !cy {
			break
		}
	}
	for i := range x {
		w, h = max(w, x[i]), max(h, y[i])
	}
	return w, h
}

// compactAxis closes empty gaps in coordinate a (b is the other one) and
// reports whether it changed anything.
func compactAxis(a, b []int64, edges [][2]int32) bool {
	n := len(a)
	if n < 3 {
		return false
	}
	byA := make([]int32, n)
	for i := range byA {
		byA[i] = int32(i)
	}
	slices.SortFunc(byA, func(p, q int32) int { return cmp64(a[p], a[q]) })
	sortedA := make([]int64, n)
	for i, v := range byA {
		sortedA[i] = a[v]
	}
	// Pairs to check: each edge with the vertices strictly inside its span.
	var total int64
	for _, e := range edges {
		lo, hi := min(a[e[0]], a[e[1]]), max(a[e[0]], a[e[1]])
		i, _ := slices.BinarySearch(sortedA, lo+1)
		j, _ := slices.BinarySearch(sortedA, hi)
		total += int64(max(0, j-i))
	}
	if total > compactPairLimit {
		return false
	}
	// Gaps between consecutive distinct values, by the value above them.
	var gapAt []int64  // value just above the gap
	var gapLen []int64 // empty lines in the gap
	if sortedA[0] > 0 {
		gapAt, gapLen = append(gapAt, sortedA[0]), append(gapLen, sortedA[0])
	}
	for i := 1; i < n; i++ {
		if d := sortedA[i] - sortedA[i-1] - 1; d > 0 {
			gapAt, gapLen = append(gapAt, sortedA[i]), append(gapLen, d)
		}
	}
	if len(gapAt) == 0 {
		return false
	}
	closed := make([]bool, len(gapAt))
	next := make([]int64, n)
	shifted := func() {
		// next[v] = a[v] minus the closed gaps at or below it.
		var shift int64
		g := 0
		for _, v := range byA {
			for g < len(gapAt) && gapAt[g] <= a[v] {
				if closed[g] {
					shift += gapLen[g]
				}
				g++
			}
			next[v] = a[v] - shift
		}
	}
	safe := func() bool {
		shifted()
		for _, e := range edges {
			u, v := e[0], e[1]
			lo, hi := min(a[u], a[v]), max(a[u], a[v])
			i, _ := slices.BinarySearch(sortedA, lo+1)
			j, _ := slices.BinarySearch(sortedA, hi)
			if j <= i {
				continue
			}
			for _, w := range byA[i:j] {
				if exact.OrientInt(a[u], b[u], a[v], b[v], a[w], b[w]) != exact.OrientInt(next[u], b[u], next[v], b[v], next[w], b[w]) {
					return false
				}
			}
		}
		return true
	}
	changed := false
	chunk := len(gapAt)
	spent := int64(0)
	budget := int64(compactFloor + compactPerEdge*len(edges))
	for i := 0; i < len(gapAt) && spent+total <= budget; spent += total {
		k := min(chunk, len(gapAt)-i)
		for g := i; g < i+k; g++ {
			closed[g] = true
		}
		if safe() {
			changed = true
			i += k
			chunk = 2 * k
			continue
		}
		for g := i; g < i+k; g++ {
			closed[g] = false
		}
		if k == 1 {
			i++
			continue
		}
		chunk = k / 2
	}
	if changed {
		shifted()
		copy(a, next)
	}
	return changed
}

func cmp64(p, q int64) int {
	switch {
	case p < q:
		return -1
	case p > q:
		return 1
	}
	return 0
}
