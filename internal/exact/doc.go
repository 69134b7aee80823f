// Package exact decides the two geometric predicates the drawing stages
// rest on, the orientation of three points and whether a point lies inside
// the circle through three others, exactly for any float64 coordinates.
//
// Each predicate first evaluates its determinant in floating point and
// compares it with a bound on the rounding error (J. R. Shewchuk, "Adaptive
// precision floating-point arithmetic and fast robust geometric
// predicates", Discrete Comput. Geom. 18, 1997, the first stage of his
// orient2d and incircle); only when the sign is in doubt does it
// recompute with math/big, where every float64 and every sum and product
// of them is exact. The fallback is rare (degenerate or nearly degenerate
// input, such as points on a grid) and slow, so callers may rely on the
// answer without caring how it was found.
//
// Products are written with explicit float64 conversions so that no
// compiler may fuse them into fused multiply-adds, which would change the
// filter's rounding and with it, on some machines, which branch is taken.
package exact
