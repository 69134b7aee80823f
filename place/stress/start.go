package stress

import "math"

// startPivots is the number of pivots of the pivot-MDS start.
const startPivots = 50

// Start returns a start for Layout by pivot multidimensional scaling
// (Brandes and Pich 2006): the distances to k pivots, squared and double
// centred, projected on the two leading eigenvectors of their k x k
// product matrix, found by orthogonal iteration from fixed vectors. The
// result is scaled to the model's best scale.
func (m *Model) Start() (x, y []float64) {
	n := m.n
	x, y = make([]float64, n), make([]float64, n)
	if n < 2 {
		return x, y
	}
	piv, dist := m.startPivots()
	k := len(piv)
	// c[v*k+p]: squared distance, double centred.
	c := make([]float64, n*k)
	rowMean := make([]float64, n)
	colMean := make([]float64, k)
	total := 0.0
	for v := range n {
		for p := range k {
			d := dist(p, v)
			s := float64(d * d)
			c[v*k+p] = s
			rowMean[v] += s
			colMean[p] += s
		}
	}
	for v := range n {
		total += rowMean[v]
		rowMean[v] /= float64(k)
	}
	for p := range k {
		colMean[p] /= float64(n)
	}
	total /= float64(n * k)
	for v := range n {
		for p := range k {
			c[v*k+p] = -0.5 * (c[v*k+p] - rowMean[v] - colMean[p] + total)
		}
	}
	// b = c^T c, k x k.
	b := make([]float64, k*k)
	for v := range n {
		row := c[v*k : (v+1)*k]
		for p := range k {
			rp := row[p]
			if rp == 0 {
				continue
			}
			bp := b[p*k : (p+1)*k]
			for q := range k {
				bp[q] += float64(rp * row[q])
			}
		}
	}
	e1, e2 := leadingPair(b, k)
	for v := range n {
		row := c[v*k : (v+1)*k]
		var sx, sy float64
		for p := range k {
			sx += float64(row[p] * e1[p])
			sy += float64(row[p] * e2[p])
		}
		x[v], y[v] = sx, sy
	}
	// Vertices the pivots cannot tell apart (leaves of one parent, say)
	// get one position, and majorization never separates vertices at one
	// point: nudge every vertex by a small fixed offset of its own.
	spread := 0.0
	for v := range n {
		spread = max(spread, math.Abs(x[v]), math.Abs(y[v]))
	}
	nudge := 1e-3 * max(spread, 1) / math.Sqrt(float64(n))
	for v := range n {
		a, b := jitter(uint64(v))
		x[v] += float64(nudge * a)
		y[v] += float64(nudge * b)
	}
	if s := m.BestScale(x, y); s > 0 && s != 1 {
		for v := range n {
			x[v] *= s
			y[v] *= s
		}
	}
	return x, y
}

// startPivots picks the pivots of the start: the sparse model's own, or in
// the full model up to startPivots chosen by max-min distance.
func (m *Model) startPivots() ([]int32, func(p, v int) float64) {
	n := m.n
	if m.full == nil {
		k := min(len(m.pivots), startPivots)
		return m.pivots[:k], func(p, v int) float64 { return float64(m.pivDist[p*n+v]) }
	}
	k := min(n, startPivots)
	nearest := make([]float64, n)
	for v := range nearest {
		nearest[v] = math.Inf(1)
	}
	piv := make([]int32, 0, k)
	next := int32(0)
	for v := range n { // the vertex farthest from vertex 0
		if m.full[v] > m.full[next] {
			next = int32(v)
		}
	}
	for len(piv) < k {
		piv = append(piv, next)
		row := m.full[int(next)*n : int(next+1)*n]
		for v := range n {
			nearest[v] = min(nearest[v], float64(row[v]))
		}
		next = int32(argmax(nearest))
		if nearest[next] == 0 {
			break
		}
	}
	return piv, func(p, v int) float64 { return float64(m.full[int(piv[p])*n+v]) }
}

// leadingPair returns unit eigenvectors of the two largest eigenvalues of
// the symmetric positive semi-definite k x k matrix b, by orthogonal
// iteration from fixed start vectors for a fixed number of rounds.
func leadingPair(b []float64, k int) (e1, e2 []float64) {
	e1, e2 = make([]float64, k), make([]float64, k)
	for i := range k {
		e1[i] = 1 + float64(i%7)/7
		e2[i] = float64(i%5) - 2 + float64(i%3)/3
	}
	t1, t2 := make([]float64, k), make([]float64, k)
	mul := func(v, out []float64) {
		for p := range k {
			s := 0.0
			row := b[p*k : (p+1)*k]
			for q := range k {
				s += float64(row[q] * v[q])
			}
			out[p] = s
		}
	}
	normalize := func(v []float64) {
		s := 0.0
		for _, x := range v {
			s += float64(x * x)
		}
		if s = math.Sqrt(s); s > 0 {
			for i := range v {
				v[i] /= s
			}
		}
	}
	normalize(e1)
	for range 200 {
		mul(e1, t1)
		mul(e2, t2)
		normalize(t1)
		dot := 0.0
		for i := range k {
			dot += float64(t1[i] * t2[i])
		}
		for i := range k {
			t2[i] -= float64(dot * t1[i])
		}
		normalize(t2)
		e1, t1 = t1, e1
		e2, t2 = t2, e2
	}
	return e1, e2
}

// jitter returns two numbers in [-1, 1) determined by i alone (a
// splitmix64 hash of it).
func jitter(i uint64) (float64, float64) {
	z := i + 0x9e3779b97f4a7c15
	z = (z ^ z>>30) * 0xbf58476d1ce4e5b9
	z = (z ^ z>>27) * 0x94d049bb133111eb
	z ^= z >> 31
	return float64(z>>40)/float64(1<<23) - 1, float64(z&0xffffff)/float64(1<<23) - 1
}
