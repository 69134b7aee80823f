// Package halves runs the two halves of a scattering pass on two cores.
//
// Counting sorts and adjacency-list builds over millions of edges are
// bound by memory latency, not arithmetic: each write lands on a cache
// line of its own. Two goroutines, each on one half of the input, keep
// twice as many misses in flight. Each half counts its own entries, and
// the second half's entries in a bucket are placed after the first's, so
// the result is exactly that of one sequential pass, whatever the
// scheduling and GOMAXPROCS.
package halves
