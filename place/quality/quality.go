package quality

import (
	"cmp"
	"math"
	"slices"
)

// Measures are the readability figures of one drawing.
type Measures struct {
	// Stress is the normalized stress (see Stress); 0 with fewer than two
	// vertices in any component.
	Stress float64
	// StressSources is the number of breadth-first sources the stress was
	// taken over: every vertex up to ExactStressLimit, a fixed sample
	// above.
	StressSources int
	// EdgeCV is the standard deviation of the edge lengths over their mean
	// (0 without edges).
	EdgeCV float64
	// AngularResolution is the mean, over vertices of degree at least 2,
	// of the smallest angle between two of its edges divided by 360/degree
	// (1 is perfectly even); 1 when no vertex has two edges.
	AngularResolution float64
	// ClosestPair is the distance between the two closest vertices over
	// the mean edge length (0 without edges or with fewer than two
	// vertices).
	ClosestPair float64
	// MeanEdge is the mean edge length.
	MeanEdge float64
}

// ExactStressLimit is the largest graph whose stress is taken over every
// pair; above it, over the pairs from StressSampleSources sources.
const (
	ExactStressLimit    = 3000
	StressSampleSources = 500
)

// Measure computes the measures of the drawing of the graph with vertices
// at (x[v], y[v]) and the given edges (loops and repeats are ignored for
// distances; edge lengths count every listed non-loop edge).
func Measure(x, y []float64, edges [][2]int32) Measures {
	var q Measures
	q.Stress, q.StressSources = Stress(x, y, edges)
	q.EdgeCV, q.MeanEdge = edgeSpread(x, y, edges)
	q.AngularResolution = angularResolution(x, y, edges)
	if q.MeanEdge > 0 && len(x) >= 2 {
		q.ClosestPair = closestPair(x, y) / q.MeanEdge
	}
	return q
}

// Stress returns the normalized stress of the drawing: over vertex pairs
// in one component, with d the hop distance, sum (s |x_i - x_j| / d - 1)^2
// at the scale s that minimizes it, divided by the number of pairs.
// Expanding the square, the minimum is P - (sum r)^2 / sum r^2 with r =
// |x_i - x_j| / d over P pairs. Graphs of up to ExactStressLimit vertices
// use every pair; larger ones the pairs from StressSampleSources sources
// spread evenly over the vertex numbers. It also returns the number of
// sources used.
func Stress(x, y []float64, edges [][2]int32) (float64, int) {
	n := len(x)
	if n < 2 {
		return 0, 0
	}
	start, adj := adjacency(n, edges)
	sources := n
	if n > ExactStressLimit {
		sources = StressSampleSources
	}
	dist := make([]int32, n)
	queue := make([]int32, 0, n)
	var sumR, sumR2, pairs float64
	for i := range sources {
		s := int32(i)
		if sources < n {
			s = int32(int64(i) * int64(n) / int64(sources))
		}
		for v := range dist {
			dist[v] = -1
		}
		dist[s] = 0
		queue = append(queue[:0], s)
		for head := 0; head < len(queue); head++ {
			u := queue[head]
			for k := start[u]; k < start[u+1]; k++ {
				if v := adj[k]; dist[v] < 0 {
					dist[v] = dist[u] + 1
					queue = append(queue, v)
				}
			}
		}
		for _, v := range queue {
			if sources == n && v <= s {
				continue // each pair once
			}
			if v == s {
				continue
			}
			dx, dy := x[v]-x[s], y[v]-y[s]
			r := math.Sqrt(float64(dx*dx)+float64(dy*dy)) / float64(dist[v])
			sumR += r
			sumR2 += float64(r * r)
			pairs++
		}
	}
	if pairs == 0 {
		return 0, sources
	}
	if sumR2 == 0 {
		return 1, sources // every pair at one point: s|x| = 0 for any s
	}
	return (pairs - float64(sumR*sumR)/sumR2) / pairs, sources
}

// adjacency returns the graph in compressed rows, loops left out.
func adjacency(n int, edges [][2]int32) (start, adj []int32) {
	start = make([]int32, n+1)
	for _, e := range edges {
		if e[0] != e[1] {
			start[e[0]+1]++
			start[e[1]+1]++
		}
	}
	for v := range n {
		start[v+1] += start[v]
	}
	adj = make([]int32, start[n])
	fill := append([]int32(nil), start[:n]...)
	for _, e := range edges {
		if e[0] != e[1] {
			adj[fill[e[0]]] = e[1]
			fill[e[0]]++
			adj[fill[e[1]]] = e[0]
			fill[e[1]]++
		}
	}
	return start, adj
}

func edgeSpread(x, y []float64, edges [][2]int32) (cv, mean float64) {
	var sum, sum2, k float64
	for _, e := range edges {
		if e[0] == e[1] {
			continue
		}
		dx, dy := x[e[0]]-x[e[1]], y[e[0]]-y[e[1]]
		l := math.Sqrt(float64(dx*dx) + float64(dy*dy))
		sum += l
		sum2 += float64(l * l)
		k++
	}
	if k == 0 || sum == 0 {
		return 0, 0
	}
	mean = sum / k
	variance := max(0, sum2/k-float64(mean*mean))
	return math.Sqrt(variance) / mean, mean
}

func angularResolution(x, y []float64, edges [][2]int32) float64 {
	n := len(x)
	start, adj := adjacency(n, edges)
	var total float64
	count := 0
	var angles []float64
	for v := range n {
		deg := int(start[v+1] - start[v])
		if deg < 2 {
			continue
		}
		angles = angles[:0]
		for k := start[v]; k < start[v+1]; k++ {
			u := adj[k]
			angles = append(angles, math.Atan2(y[u]-y[v], x[u]-x[v]))
		}
		slices.Sort(angles)
		gap := angles[0] + 2*math.Pi - angles[len(angles)-1]
		for i := 1; i < len(angles); i++ {
			gap = min(gap, angles[i]-angles[i-1])
		}
		total += gap / (2 * math.Pi / float64(deg))
		count++
	}
	if count == 0 {
		return 1
	}
	return total / float64(count)
}

// closestPair returns the smallest distance between two vertices, by
// divide and conquer on x with the strip merged in y order (M. I. Shamos
// and D. Hoey, "Closest-point problems", FOCS 1975): O(n log n).
func closestPair(x, y []float64) float64 {
	type pt struct{ x, y float64 }
	ps := make([]pt, len(x))
	for i := range x {
		ps[i] = pt{x[i], y[i]}
	}
	slices.SortFunc(ps, func(a, b pt) int { return cmp.Or(cmp.Compare(a.x, b.x), cmp.Compare(a.y, b.y)) })
	buf := make([]pt, len(ps))
	var rec func(p []pt) float64
	rec = func(p []pt) float64 {
		if len(p) <= 3 {
			best := math.Inf(1)
			for i := range p {
				for j := i + 1; j < len(p); j++ {
					best = min(best, math.Hypot(p[i].x-p[j].x, p[i].y-p[j].y))
				}
			}
			slices.SortFunc(p, func(a, b pt) int { return cmp.Compare(a.y, b.y) })
			return best
		}
		mid := len(p) / 2
		midX := p[mid].x
		best := min(rec(p[:mid]), rec(p[mid:]))
		// Merge the halves by y.
		merged := buf[:0]
		i, j := 0, mid
		for i < mid || j < len(p) {
			if j >= len(p) || (i < mid && p[i].y <= p[j].y) {
				merged = append(merged, p[i])
				i++
			} else {
				merged = append(merged, p[j])
				j++
			}
		}
		copy(p, merged)
		strip := buf[:0]
		for _, q := range p {
			if math.Abs(q.x-midX) < best {
				strip = append(strip, q)
			}
		}
		for a := range strip {
			for b := a + 1; b < len(strip) && strip[b].y-strip[a].y < best; b++ {
				best = min(best, math.Hypot(strip[a].x-strip[b].x, strip[a].y-strip[b].y))
			}
		}
		return best
	}
	return rec(ps)
}
