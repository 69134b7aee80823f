// Package trig computes sines and cosines with plain arithmetic only
// (argument reduction to [-pi, pi] and a Taylor polynomial, each product
// rounded explicitly), so that drawings placed on circles are the same bits
// on every machine: the standard library's trigonometry may be fused
// differently on different architectures.
package trig

const pi = 3.14159265358979323846

// reduce brings t into [-pi, pi].
func reduce(t float64) float64 {
	for t < -pi {
		t += 2 * pi
	}
	for t > pi {
		t -= 2 * pi
	}
	return t
}

// Sin returns the sine of t (radians).
func Sin(t float64) float64 {
	t = reduce(t)
	// sin t = t - t^3/3! + ... ; 12 terms are ample on [-pi, pi].
	term, sum := t, t
	t2 := float64(t * t)
	for n := 1; n < 12; n++ {
		term = float64(-term*t2) / float64((2*n)*(2*n+1))
		sum += term
	}
	return sum
}

// Cos returns the cosine of t (radians).
func Cos(t float64) float64 {
	t = reduce(t)
	term, sum := 1.0, 1.0
	t2 := float64(t * t)
	for n := 1; n < 12; n++ {
		term = float64(-term*t2) / float64((2*n-1)*(2*n))
		sum += term
	}
	return sum
}
