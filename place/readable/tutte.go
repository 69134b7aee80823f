package readable

import (
	"math"

	"github.com/gridwood/gridwood/internal/trig"
	"github.com/gridwood/gridwood/place/augment"
	"github.com/gridwood/gridwood/planarize"
)

// convexStart returns a plane drawing of the connected graph with plane
// embedding emb in which the outer face is a circle and every other vertex
// sits at a convex combination of its neighbours in a triangulation of emb
// (W. T. Tutte, "How to draw a graph", Proc. London Math. Soc. 13, 1963;
// with any positive weights, M. S. Floater, "One-to-one piecewise linear
// mappings over triangulations", Math. Comp. 72, 2003), the weights being
// the mean value coordinates of the target drawing tx, ty so that the
// drawing follows the target where the target agrees with the
// triangulation (or, with uniform, all equal: Tutte's own barycentric
// drawing, which ignores the target but never crowds where the target
// disagrees). The outer face is the face with the most of the
// target's hull, made a simple cycle first by biconnecting (package
// augment), and its vertices go round a circle as long as the ideal
// lengths of its edges, each at an angle in proportion to its edge's.
// ok is false when the solve does not converge to a plane drawing.
func convexStart(emb *planarize.Embedding, tx, ty []float64, lengths map[[2]int32]float64, uniform, longest bool) (x, y []float64, ok bool) {
	n := emb.N()
	t := emb.Clone()
	skip := func(int32) bool { return false }
	augment.Biconnect(t, skip)
	outer := outerDart(t, tx, ty)
	if longest {
		outer = longestFace(t)
	}
	if outer < 0 {
		return nil, nil, false
	}
	var face []int32
	for d := outer; ; {
		face = append(face, t.Tail(d))
		if d = t.FaceNext(d); d == outer {
			break
		}
	}
	// A hub in the outer face joined to all of it, so that triangulating
	// every face leaves the outer polygon alone; the hub is not drawn.
	hubbed, ok := addHub(t, outer)
	if !ok {
		return nil, nil, false
	}
	augment.TriangulateFaces(hubbed, skip, nil)
	// The outer polygon on a circle; the face is walked clockwise, so go
	// round clockwise too.
	total := 0.0
	arc := make([]float64, len(face))
	for i, v := range face {
		w := face[(i+1)%len(face)]
		l := lengths[[2]int32{min(v, w), max(v, w)}]
		if l <= 0 {
			l = 1
		}
		arc[i] = l
		total += l
	}
	r := total / (2 * math.Pi)
	fixed := make([]bool, n)
	x, y = make([]float64, n), make([]float64, n)
	angle := 0.0
	for i, v := range face {
		fixed[v] = true
		x[v], y[v] = float64(r*trig.Cos(angle)), -float64(r*trig.Sin(angle))
		angle += 2 * math.Pi * arc[i] / total
	}
	// Mean value weights of the target, rows of the inner vertices.
	px := func(v int32) float64 { return tx[v] }
	py := func(v int32) float64 { return ty[v] }
	start := make([]int32, n+1)
	var nbr []int32
	var weight []float64
	var ring []int32
	for v := range int32(n) {
		if !fixed[v] {
			ring = ring[:0]
			f := hubbed.First(v)
			for d := f; ; {
				ring = append(ring, hubbed.Head(d))
				if d = hubbed.Next(d); d == f {
					break
				}
			}
			nbr = append(nbr, ring...)
			if uniform {
				for range ring {
					weight = append(weight, 1)
				}
			} else {
				weight = append(weight, meanValue(tx[v], ty[v], ring, px, py)...)
			}
		}
		start[v+1] = int32(len(nbr))
	}
	free := func(u int32) bool { return int(u) < n && !fixed[u] }
	held := func(pos, target []float64) func(int32) float64 {
		return func(u int32) float64 {
			switch {
			case int(u) >= n:
				return 0 // the hub: never a neighbour of an inner vertex
			case fixed[u]:
				return pos[u]
			}
			return target[u]
		}
	}
	solveWeighted(n, start, nbr, weight, free, [2]func(int32) float64{held(x, tx), held(y, ty)}, [2][]float64{x, y})
	return x, y, true
}

// addHub returns a copy of emb with one more vertex, inside the face to
// the left of dart outer and joined to each of that face's corners.
func addHub(emb *planarize.Embedding, outer int32) (*planarize.Embedding, bool) {
	n := emb.N()
	edges := emb.Edges()
	around := make([][]int32, n+1)
	for v := range int32(n) {
		if f := emb.First(v); f >= 0 {
			for d := f; ; {
				around[v] = append(around[v], d>>1)
				if d = emb.Next(d); d == f {
					break
				}
			}
		}
	}
	t, ok := planarize.FromRotation(n+1, edges, around)
	if !ok {
		return nil, false
	}
	hub := int32(n)
	// Walk the face and join each corner: the first edge from the hub's
	// isolated state, then each next one right after the previous.
	var corners []int32
	for d := outer; ; {
		corners = append(corners, d)
		if d = emb.FaceNext(d); d == outer {
			break
		}
	}
	prev := int32(-1)
	for _, d := range corners {
		// In t the darts keep their numbers: d still leaves Tail(d), and
		// the face on its left is the hub's face.
		e := t.AddEdge(d, prev, -1, hub)
		prev = int32(2*e + 1)
	}
	return t, true
}

// longestFace returns a dart of a face with the most darts (the first
// found).
func longestFace(emb *planarize.Embedding) int32 {
	seen := make([]bool, 2*emb.M())
	best, bestLen := int32(-1), 0
	for d0 := range int32(2 * emb.M()) {
		if seen[d0] {
			continue
		}
		k := 0
		for d := d0; !seen[d]; d = emb.FaceNext(d) {
			seen[d] = true
			k++
		}
		if k > bestLen {
			best, bestLen = d0, k
		}
	}
	return best
}
