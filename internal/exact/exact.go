package exact

import "math/big"

// epsilon is half the distance from 1 to the next float64: the relative
// rounding error of one operation.
const epsilon = 1.0 / (1 << 53)

// Error bound factors of Shewchuk's filters (his ccwerrboundA and
// iccerrboundA).
const (
	orientBound = (3 + 16*epsilon) * epsilon
	circleBound = (10 + 96*epsilon) * epsilon
)

// Orient returns +1 if a, b, c turn counter-clockwise (c lies left of the
// directed line from a to b), -1 if clockwise, and 0 if they are collinear.
func Orient(ax, ay, bx, by, cx, cy float64) int {
	left := float64((ax - cx) * (by - cy))
	right := float64((ay - cy) * (bx - cx))
	det := left - right
	var sum float64
	switch {
	case left > 0:
		if right <= 0 {
			return sign(det)
		}
		sum = left + right
	case left < 0:
		if right >= 0 {
			return sign(det)
		}
		sum = -left - right
	default:
		return sign(det)
	}
	if bound := float64(orientBound * sum); det >= bound || -det >= bound {
		return sign(det)
	}
	return orientExact(ax, ay, bx, by, cx, cy)
}

// InCircle returns +1 if d lies inside the circle through a, b, c (which
// must turn counter-clockwise), -1 if outside and 0 if on it.
func InCircle(ax, ay, bx, by, cx, cy, dx, dy float64) int {
	adx, ady := ax-dx, ay-dy
	bdx, bdy := bx-dx, by-dy
	cdx, cdy := cx-dx, cy-dy
	bc, cb := float64(bdx*cdy), float64(cdx*bdy)
	ca, ac := float64(cdx*ady), float64(adx*cdy)
	ab, ba := float64(adx*bdy), float64(bdx*ady)
	alift := float64(adx*adx) + float64(ady*ady)
	blift := float64(bdx*bdx) + float64(bdy*bdy)
	clift := float64(cdx*cdx) + float64(cdy*cdy)
	det := float64(alift*(bc-cb)) + float64(blift*(ca-ac)) + float64(clift*(ab-ba))
	permanent := float64((abs(bc)+abs(cb))*alift) + float64((abs(ca)+abs(ac))*blift) + float64((abs(ab)+abs(ba))*clift)
	if bound := float64(circleBound * permanent); det > bound || -det > bound {
		return sign(det)
	}
	return inCircleExact(ax, ay, bx, by, cx, cy, dx, dy)
}

func sign(v float64) int {
	switch {
	case v > 0:
		return 1
	case v < 0:
		return -1
	}
	return 0
}

func abs(v float64) float64 {
	if v < 0 {
		return -v
	}
	return v
}

// exactPrec holds any sum or product the exact paths form: a difference
// of two float64 spans at most about 2,150 bits from its highest to its
// lowest bit, a product of two such 4,300, and the incircle determinant's
// products of four 8,600; sums add a bit each.
const exactPrec = 8800

func num(v float64) *big.Float { return new(big.Float).SetPrec(exactPrec).SetFloat64(v) }

func sub(a, b *big.Float) *big.Float { return new(big.Float).SetPrec(exactPrec).Sub(a, b) }
func add(a, b *big.Float) *big.Float { return new(big.Float).SetPrec(exactPrec).Add(a, b) }
func mul(a, b *big.Float) *big.Float { return new(big.Float).SetPrec(exactPrec).Mul(a, b) }

func orientExact(ax, ay, bx, by, cx, cy float64) int {
	acx, acy := sub(num(ax), num(cx)), sub(num(ay), num(cy))
	bcx, bcy := sub(num(bx), num(cx)), sub(num(by), num(cy))
	return sub(mul(acx, bcy), mul(acy, bcx)).Sign()
}

func inCircleExact(ax, ay, bx, by, cx, cy, dx, dy float64) int {
	adx, ady := sub(num(ax), num(dx)), sub(num(ay), num(dy))
	bdx, bdy := sub(num(bx), num(dx)), sub(num(by), num(dy))
	cdx, cdy := sub(num(cx), num(dx)), sub(num(cy), num(dy))
	alift := add(mul(adx, adx), mul(ady, ady))
	blift := add(mul(bdx, bdx), mul(bdy, bdy))
	clift := add(mul(cdx, cdx), mul(cdy, cdy))
	t1 := mul(alift, sub(mul(bdx, cdy), mul(cdx, bdy)))
	t2 := mul(blift, sub(mul(cdx, ady), mul(adx, cdy)))
	t3 := mul(clift, sub(mul(adx, bdy), mul(bdx, ady)))
	return add(add(t1, t2), t3).Sign()
}
