package spacing

import (
	"github.com/gridwood/gridwood/internal/trig"
	"github.com/gridwood/gridwood/planarize"
)

// fineSpan is the side of the integer frame the Tutte drawing is
// rounded into: fine enough for detail, small enough that orientation
// tests on its coordinates stay exact in int64.
const fineSpan = 1 << 30

// ReadableLimit is the largest component given the passes that are there
// only for the picture: Tutte's drawing, compaction, refinement and the
// clearance check. A component this big is hardly read as a picture, and
// above it every component goes through the same linear passes, so the
// cost per edge stays flat from 10^4 vertices up (bench/RESULTS.md, The
// usual traps).
const ReadableLimit = 5000

// Tutte computes W. T. Tutte's barycentric drawing ("How to draw a
// graph", Proc. London Math. Soc. 13, 1963) of one component of the
// augmented triangulation, with the outer face F pinned to a convex polygon
// and F's own dummy edges left out: every other vertex sits at the average
// of its neighbours. The linear system is solved by conjugate gradients
// (Hestenes and Stiefel 1952) for at most iters steps and the result
// rounded into the frame [0, fineSpan]^2. A triangulated disk with a
// convex boundary drawn this way is a plane drawing (Tutte's theorem, and
// for triangulations Floater 2003), but rounding and an unfinished solve
// could spoil it, so the caller checks it exactly with Plane. x, y
// receive the coordinates of the component's vertices.
func Tutte(emb *planarize.Embedding, vs []int32, outer *Outer, x, y []int64, iters int) {
	k := len(outer.Face)
	onOuter := make(map[int32]bool, k)
	// The polygon: F is walked with the outer face on its left, which is
	// clockwise in the final picture, so place its vertices clockwise.
	half := float64(fineSpan / 2)
	for i, d := range outer.Face {
		v := emb.Tail(d)
		onOuter[v] = true
		c, s := circlePoint(i, k)
		x[v] = int64(half + float64(half*c))
		y[v] = int64(half - float64(half*s))
	}
	inner := make([]int32, 0, len(vs))
	index := make(map[int32]int32, len(vs))
	for _, v := range vs {
		if !onOuter[v] {
			index[v] = int32(len(inner))
			inner = append(inner, v)
		}
	}
	m := len(inner)
	if m == 0 {
		return
	}
	// A = D - (adjacency among inner vertices), b = sum of pinned
	// neighbours. Each inner vertex's neighbours in rotation order.
	deg := make([]float64, m)
	var nbrStart = make([]int32, m+1)
	var nbr []int32 // inner index, or -1 - outer vertex
	for i, v := range inner {
		h := emb.First(v)
		for range emb.Degree(v) {
			w := emb.Head(h)
			if j, ok := index[w]; ok {
				nbr = append(nbr, j)
			} else {
				nbr = append(nbr, -1-w)
			}
			deg[i]++
			h = emb.Next(h)
		}
		nbrStart[i+1] = int32(len(nbr))
	}
	mul := func(p, out []float64) {
		for i := range m {
			s := float64(deg[i] * p[i])
			for _, j := range nbr[nbrStart[i]:nbrStart[i+1]] {
				if j >= 0 {
					s -= p[j]
				}
			}
			out[i] = s
		}
	}
	solve := func(coord []int64) []float64 {
		b := make([]float64, m)
		for i := range m {
			for _, j := range nbr[nbrStart[i]:nbrStart[i+1]] {
				if j < 0 {
					b[i] += float64(coord[-1-j])
				}
			}
		}
		sol := make([]float64, m)
		for i := range sol {
			sol[i] = half
		}
		r, p, ap := make([]float64, m), make([]float64, m), make([]float64, m)
		mul(sol, ap)
		rr := 0.0
		for i := range m {
			r[i] = b[i] - ap[i]
			p[i] = r[i]
			rr += float64(r[i] * r[i])
		}
		tol := float64(1e-6 * 1e-6 * float64(m))
		for it := 0; it < iters && rr > tol; it++ {
			mul(p, ap)
			pap := 0.0
			for i := range m {
				pap += float64(p[i] * ap[i])
			}
			if pap <= 0 {
				break
			}
			alpha := rr / pap
			next := 0.0
			for i := range m {
				sol[i] += float64(alpha * p[i])
				r[i] -= float64(alpha * ap[i])
				next += float64(r[i] * r[i])
			}
			beta := next / rr
			rr = next
			for i := range m {
				p[i] = r[i] + float64(beta*p[i])
			}
		}
		return sol
	}
	sx, sy := solve(x), solve(y)
	for i, v := range inner {
		x[v] = roundClamp(sx[i])
		y[v] = roundClamp(sy[i])
	}
}

func roundClamp(f float64) int64 {
	switch {
	case !(f >= 0):
		return 0
	case f > fineSpan:
		return fineSpan
	}
	return int64(f + 0.5)
}

// circlePoint returns cos and sin of -2*pi*i/k, the same bits on every
// machine (package internal/trig).
func circlePoint(i, k int) (float64, float64) {
	const pi = 3.14159265358979323846
	t := -2 * pi * float64(i) / float64(k)
	return trig.Cos(t), trig.Sin(t)
}
