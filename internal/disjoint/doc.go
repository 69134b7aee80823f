// Package disjoint keeps a partition of 0..n-1 into disjoint sets, with
// path compression (R. E. Tarjan, "Efficiency of a good but not linear set
// union algorithm", J. ACM 22, 1975). Union links the second root under
// the first, so callers that need a particular representative get it.
package disjoint
