package preview

import "math"

type pt = [2]float64

// pathKind is how a path's points make its curve.
type pathKind int

const (
	straight  pathKind = iota // two points
	quadratic                 // a quadratic Bezier curve: start, control, end
	polyline                  // straight pieces through every point
)

// path is an edge's drawn line in DOT coordinates (points, y up).
type path struct {
	kind pathKind
	p    []pt
}

// at is the point at parameter t in [0, 1]; a polyline gives each piece
// an equal share of t.
func (c path) at(t float64) pt {
	switch c.kind {
	case quadratic:
		a, b, d := c.p[0], c.p[1], c.p[2]
		s := 1 - t
		return pt{s*s*a[0] + 2*s*t*b[0] + t*t*d[0], s*s*a[1] + 2*s*t*b[1] + t*t*d[1]}
	case polyline:
		n := len(c.p) - 1
		f := t * float64(n)
		i := min(int(f), n-1)
		f -= float64(i)
		a, b := c.p[i], c.p[i+1]
		return pt{a[0] + f*(b[0]-a[0]), a[1] + f*(b[1]-a[1])}
	}
	a, b := c.p[0], c.p[len(c.p)-1]
	return pt{a[0] + t*(b[0]-a[0]), a[1] + t*(b[1]-a[1])}
}

// sub is the part of the path between parameters t0 < t1, of the same
// kind.
func (c path) sub(t0, t1 float64) path {
	switch c.kind {
	case quadratic:
		// de Casteljau: the control point of the piece is where the
		// tangents at its ends meet, on the lerp of the control polygon.
		a, b, d := c.p[0], c.p[1], c.p[2]
		lerp := func(p, q pt, t float64) pt { return pt{p[0] + t*(q[0]-p[0]), p[1] + t*(q[1]-p[1])} }
		ctrl := lerp(lerp(a, b, t0), lerp(b, d, t0), t1)
		return path{quadratic, []pt{c.at(t0), ctrl, c.at(t1)}}
	case polyline:
		n := len(c.p) - 1
		i0 := min(int(t0*float64(n)), n-1)
		i1 := min(int(t1*float64(n)), n-1)
		out := []pt{c.at(t0)}
		for i := i0 + 1; i <= i1; i++ {
			out = append(out, c.p[i])
		}
		out = append(out, c.at(t1))
		return path{polyline, out}
	}
	return path{straight, []pt{c.at(t0), c.at(t1)}}
}

// endDir is the unit direction in which the path arrives at its end (at
// its start when start is set, pointing out of the start backwards).
func (c path) endDir(start bool) (float64, float64) {
	var from, to pt
	n := len(c.p)
	if start {
		from, to = c.p[1], c.p[0]
		for k := 1; k < n && from == to; k++ {
			from = c.p[k]
		}
	} else {
		from, to = c.p[n-2], c.p[n-1]
		for k := n - 2; k >= 0 && from == to; k-- {
			from = c.p[k]
		}
	}
	dx, dy := to[0]-from[0], to[1]-from[1]
	d := math.Hypot(dx, dy)
	if d == 0 {
		return 0, 0
	}
	return dx / d, dy / d
}

// samples returns n+1 points of the path at equal steps of t.
func (c path) samples(n int) []pt {
	if c.kind == straight {
		return []pt{c.p[0], c.p[1]}
	}
	if c.kind == polyline {
		// Every corner is a sample: a piece is straight.
		return c.p
	}
	out := make([]pt, n+1)
	for i := range out {
		out[i] = c.at(float64(i) / float64(n))
	}
	return out
}

// firstOutside is the least parameter, found by bisection, at which the
// path leaves the region inside (true at t = 0); from the end backwards
// when fromEnd. 0 (1) if it is never inside.
func (c path) firstOutside(inside func(pt) bool, fromEnd bool) float64 {
	param := func(t float64) float64 {
		if fromEnd {
			return 1 - t
		}
		return t
	}
	if !inside(c.at(param(0))) {
		return param(0)
	}
	const steps = 64
	lo, hi := 0.0, -1.0
	for i := 1; i <= steps; i++ {
		t := float64(i) / steps
		if !inside(c.at(param(t))) {
			hi = t
			break
		}
		lo = t
	}
	if hi < 0 {
		return param(1)
	}
	for range 40 {
		mid := (lo + hi) / 2
		if inside(c.at(param(mid))) {
			lo = mid
		} else {
			hi = mid
		}
	}
	return param(hi)
}

// cutBack is the parameter, before t1, at which the path is length d
// from its point at t1 (straight-line distance), or t0 if it never is.
func (c path) cutBack(t0, t1, d float64) float64 {
	end := c.at(t1)
	far := func(t float64) bool {
		p := c.at(t)
		return math.Hypot(p[0]-end[0], p[1]-end[1]) >= d
	}
	if d <= 0 {
		return t1
	}
	if !far(t0) {
		return t0
	}
	lo, hi := t0, t1 // far at lo, near at hi
	for range 50 {
		mid := (lo + hi) / 2
		if far(mid) {
			lo = mid
		} else {
			hi = mid
		}
	}
	return lo
}

// cutFront is cutBack from the start: the parameter after t0 at which the
// path is d from its point at t0.
func (c path) cutFront(t0, t1, d float64) float64 {
	start := c.at(t0)
	far := func(t float64) bool {
		p := c.at(t)
		return math.Hypot(p[0]-start[0], p[1]-start[1]) >= d
	}
	if d <= 0 {
		return t0
	}
	if !far(t1) {
		return t1
	}
	lo, hi := t0, t1 // near at lo, far at hi
	for range 50 {
		mid := (lo + hi) / 2
		if far(mid) {
			hi = mid
		} else {
			lo = mid
		}
	}
	return hi
}
