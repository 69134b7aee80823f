package spacing

import (
	"slices"
	"testing"
)

// TestRelaxReaches checks Reaches: equal boxes and mildly varied ones
// give the largest reach only, and one box more than relaxOutlier times
// the 90th percentile's adds a second reach without it, on that axis.
func TestRelaxReaches(t *testing.T) {
	vs := make([]int32, 20)
	for i := range vs {
		vs[i] = int32(i)
	}
	for _, tc := range []struct {
		name       string
		bigW, bigH int64
		want       [][2]int64
	}{
		{"equal", 27, 18, [][2]int64{{45, 36}}},
		{"mild", 60, 18, [][2]int64{{78, 36}}},
		{"wide outlier", 400, 18, [][2]int64{{418, 36}, {45, 36}}},
		{"tall outlier", 27, 300, [][2]int64{{45, 318}, {45, 36}}},
		{"big outlier", 400, 300, [][2]int64{{418, 318}, {45, 36}}},
	} {
		hw, hh := make([]int64, len(vs)), make([]int64, len(vs))
		for i := range vs {
			hw[i], hh[i] = 27, 18
		}
		hw[7], hh[7] = tc.bigW, tc.bigH
		if got := Reaches(vs, hw, hh, 18); !slices.Equal(got, tc.want) {
			t.Errorf("%s: reaches %v, want %v", tc.name, got, tc.want)
		}
	}
}
