// Package stagebench holds what the per-stage benchmarks of dotio,
// planarize and place share (see bench/run): the graph families and sizes
// they run on, and the per-edge figures they report.
package stagebench
