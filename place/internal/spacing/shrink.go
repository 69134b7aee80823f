package spacing

import (
	"math"

	"github.com/gridwood/gridwood/planarize"
)

const (
	// maxExtent caps a component's extent in points, and so its stretch:
	// with coordinate differences below 2^30 the orientation tests on them
	// are exact in int64. A drawing that would need more stays crowded
	// (the caller counts it).
	maxExtent = 1 << 29
	// GridCompareLimit is the largest component whose grid drawing is
	// compared with its Tutte drawing, and the largest Shrink shrinks.
	GridCompareLimit = 2000
)

// Shrink scales a cleared component down as far as it stays
// clear, to no less than a quarter: drawings that start on a base-unit
// grid are often roomier than they need be (a face-count drawing has
// about two grid lines per node). Every ratio of need to distance scales
// with the drawing, so one pass over the pairs that a quarter-size drawing
// could bring near (shrinkNeed) gives the factor; the result is then
// checked exactly to round to a plane drawing of the triangulation that
// clears every box, a little above the factor if rounding needs it.
// Without a region to check the rounding against it does nothing, and
// past GridCompareLimit vertices neither.
func Shrink(aug *planarize.Embedding, vs []int32, region *Outer, edges [][2]int32, x, y, hw, hh []int64, gap int64, tx, ty []int64, seen []bool, stamp []int32) {
	if aug == nil || region == nil || len(vs) < 3 || len(vs) > GridCompareLimit {
		return
	}
	f, ok := shrinkNeed(vs, edges, x, y, hw, hh, gap, stamp)
	if !ok || f >= 1 {
		return
	}
	for _, try := range []float64{max(f*1.01, 0.25), max(f*1.1, 0.25)} {
		if try >= 1 {
			return
		}
		for _, v := range vs {
			tx[v] = int64(math.Round(float64(float64(x[v]) * try)))
			ty[v] = int64(math.Round(float64(float64(y[v]) * try)))
		}
		if !Plane(aug, vs, region, tx, ty, seen) {
			continue
		}
		if s, checked := ClearingStretch(vs, edges, tx, ty, hw, hh, gap, stamp, NewMeter(len(edges)), false); checked && s <= 1 {
			for _, v := range vs {
				x[v], y[v] = tx[v], ty[v]
			}
			return
		}
	}
}

// shrinkNeed is the least factor, down to a quarter, by which the
// component's drawing can be scaled and still clear every box: the largest
// ratio of need to distance over the pairs within reach of a drawing a
// quarter the size (a bucket grid of four times the cell). ok is false
// when the work bound stopped it.
func shrinkNeed(vs []int32, edges [][2]int32, x, y, hw, hh []int64, gap int64, stamp []int32) (f float64, ok bool) {
	c := clearance{x: x, y: y, hw: hw, hh: hh, gap: gap, s: 0.25}
	grid := newBucketGrid(vs, x, y, 4*clearanceCell(vs, hw, hh, gap))
	nearVertexPairs(vs, grid, x, y, func(u, w int32) {
		dx, dy := abs64(x[u]-x[w]), abs64(y[u]-y[w])
		needX, needY := hw[u]+hw[w]+gap, hh[u]+hh[w]+gap
		r := math.Inf(1) // scaled by less, they overlap
		if dx > 0 {
			r = float64(needX) / float64(dx)
		}
		if dy > 0 {
			r = min(r, float64(needY)/float64(dy))
		}
		c.s = max(c.s, r)
	})
	ok = nearPairs(vs, edges, x, y, grid, stamp, NewMeter(len(edges)), c.edgePair)
	return c.s, ok
}

// StretchLimit is the largest stretch that keeps the component's extent,
// boxes included, within maxExtent points.
func StretchLimit(vs []int32, x, y, hw, hh []int64) float64 {
	minX, minY := int64(math.MaxInt64), int64(math.MaxInt64)
	maxX, maxY := int64(math.MinInt64), int64(math.MinInt64)
	for _, v := range vs {
		minX, maxX = min(minX, x[v]-hw[v]), max(maxX, x[v]+hw[v])
		minY, maxY = min(minY, y[v]-hh[v]), max(maxY, y[v]+hh[v])
	}
	return max(1, float64(maxExtent)/float64(max(1, maxX-minX, maxY-minY)))
}

// Stretch scales the component's positions by s >= 1. A scale
// rounded to integers is checked exactly to stay a plane drawing (when the
// triangulation is known); failing that, the positions are multiplied by
// the integer ceil(s), which keeps every orientation.
func Stretch(aug *planarize.Embedding, vs []int32, region *Outer, x, y []int64, s float64, tx, ty []int64, seen []bool) {
	if s <= 1 {
		return
	}
	if aug != nil && region != nil {
		for _, v := range vs {
			tx[v] = int64(math.Round(float64(float64(x[v]) * s)))
			ty[v] = int64(math.Round(float64(float64(y[v]) * s)))
		}
		if Plane(aug, vs, region, tx, ty, seen) {
			for _, v := range vs {
				x[v], y[v] = tx[v], ty[v]
			}
			return
		}
	}
	k := int64(math.Ceil(s))
	for _, v := range vs {
		x[v] *= k
		y[v] *= k
	}
}
