package exact

import "math/bits"

// CrossSign returns the sign of ax*by - ay*bx, computed exactly in 128
// bits; |ax|, |ay|, |bx|, |by| must be below 2^62.
func CrossSign(ax, ay, bx, by int64) int {
	if small(ax) && small(ay) && small(bx) && small(by) {
		// Both products below 2^62: their difference fits in int64.
		switch d := ax*by - ay*bx; {
		case d > 0:
			return 1
		case d < 0:
			return -1
		}
		return 0
	}
	h1, l1 := mul128(ax, by)
	h2, l2 := mul128(ay, bx)
	switch {
	case h1 != h2:
		if h1 < h2 {
			return -1
		}
		return 1
	case l1 != l2:
		if l1 < l2 {
			return -1
		}
		return 1
	}
	return 0
}

// OrientInt is Orient for integer points: +1 if p, q, r turn
// counter-clockwise, -1 if clockwise, 0 if they are collinear; coordinate
// differences must be below 2^62 in size.
func OrientInt(px, py, qx, qy, rx, ry int64) int {
	return CrossSign(qx-px, qy-py, rx-px, ry-py)
}

// small reports whether |v| < 2^31.
func small(v int64) bool { return v > -1<<31 && v < 1<<31 }

// mul128 returns a*b as a 128-bit two's-complement number; |a|, |b| <
// 2^62.
func mul128(a, b int64) (hi int64, lo uint64) {
	neg := (a < 0) != (b < 0)
	ua, ub := uint64(a), uint64(b)
	if a < 0 {
		ua = uint64(-a)
	}
	if b < 0 {
		ub = uint64(-b)
	}
	h, l := bits.Mul64(ua, ub)
	if neg {
		l = ^l + 1
		h = ^h
		if l == 0 {
			h++
		}
	}
	return int64(h), l
}
