package geomcheck

import (
	"cmp"
	"fmt"
	"slices"
)

// The box of vertex v is the closed axis-parallel rectangle centred on
// pts[v] with half-width hw[v] and half-height hh[v]:
// [X-hw, X+hw] x [Y-hh, Y+hh]. Its interior is the open rectangle; a box
// with hw == 0 or hh == 0 has an empty interior.

// BoxOverlaps returns the pairs (i, j), i < j, of vertices whose boxes
// overlap with positive area, sorted. Boxes that only touch along their
// boundaries are not reported; neither are boxes of zero width or height.
// It returns an error if the slices differ in length, a half-size is
// negative or exceeds MaxCoord, or a coordinate lies outside ±MaxCoord.
func BoxOverlaps(pts []Point, hw, hh []int64) ([][2]int, error) {
	if err := validateBoxes(pts, hw, hh); err != nil {
		return nil, err
	}
	ids, boxes := openBoxes(pts, hw, hh)
	tree := newBoxTree(ids, boxes)
	var out [][2]int
	for k, i := range ids {
		bi := boxes[k]
		tree.search(func(b rect) bool { return openOverlap(bi, b) }, func(j int32) bool {
			if j > i {
				out = append(out, [2]int{int(i), int(j)})
			}
			return true
		})
	}
	sortPairs(out)
	return out, nil
}

// EdgeThroughBox returns the pairs (v, e) such that edge e passes through
// the interior of the box of a vertex v that is not one of e's ends, sorted.
// "Passes through" means the closed segment of e meets the open box; for a
// segment of positive length this is the same as a positive-length
// intersection with it, while a segment that only touches a box corner or
// runs along its boundary does not pass through. Loops and zero-length
// edges never pass through a box. Errors are as for BoxOverlaps, and also
// for edges with an end outside 0..len(pts)-1.
func EdgeThroughBox(pts []Point, hw, hh []int64, edges [][2]int32) ([][2]int, error) {
	if err := validateBoxes(pts, hw, hh); err != nil {
		return nil, err
	}
	if err := validate(pts, edges); err != nil {
		return nil, err
	}
	ids, boxes := openBoxes(pts, hw, hh)
	tree := newBoxTree(ids, boxes)
	var out [][2]int
	for e, uw := range edges {
		a, b := pts[uw[0]], pts[uw[1]]
		if a == b {
			continue
		}
		tree.search(func(r rect) bool { return segMeetsOpenRect(a, b, r) }, func(v int32) bool {
			if v != uw[0] && v != uw[1] {
				out = append(out, [2]int{int(v), e})
			}
			return true
		})
	}
	sortPairs(out)
	return out, nil
}

func validateBoxes(pts []Point, hw, hh []int64) error {
	if len(hw) != len(pts) || len(hh) != len(pts) {
		return fmt.Errorf("geomcheck: %d vertices but %d half-widths and %d half-heights", len(pts), len(hw), len(hh))
	}
	for v := range pts {
		if hw[v] < 0 || hw[v] > MaxCoord || hh[v] < 0 || hh[v] > MaxCoord {
			return fmt.Errorf("geomcheck: vertex %d has half-sizes (%d, %d) outside 0..%d", v, hw[v], hh[v], int64(MaxCoord))
		}
	}
	return validate(pts, nil)
}

func boxOf(p Point, hw, hh int64) rect {
	return rect{p.X - hw, p.Y - hh, p.X + hw, p.Y + hh}
}

// openBoxes returns the vertices whose boxes have a non-empty interior,
// with their boxes.
func openBoxes(pts []Point, hw, hh []int64) ([]int32, []rect) {
	var ids []int32
	var boxes []rect
	for v, p := range pts {
		if hw[v] > 0 && hh[v] > 0 {
			ids = append(ids, int32(v))
			boxes = append(boxes, boxOf(p, hw[v], hh[v]))
		}
	}
	return ids, boxes
}

// openOverlap reports whether the interiors of a and b meet, that is
// whether their intersection has positive width and positive height.
func openOverlap(a, b rect) bool {
	return max(a.xlo, b.xlo) < min(a.xhi, b.xhi) && max(a.ylo, b.ylo) < min(a.yhi, b.yhi)
}

// segMeetsOpenRect reports whether segment ab meets the interior of r. If
// the interior is empty, it does not. Otherwise, by the separating axis
// theorem for convex sets (common practice), the closed segment misses the
// open rectangle exactly when, along one of the axes or the normal of ab,
// the projections of the two are separated with touching allowed: the
// segment's x-range ends at or before the rectangle's begins (or the other
// way round), likewise in y, or all four corners lie in one closed
// half-plane of ab's line.
func segMeetsOpenRect(a, b Point, r rect) bool {
	if r.xlo >= r.xhi || r.ylo >= r.yhi {
		return false
	}
	if max(a.X, b.X) <= r.xlo || min(a.X, b.X) >= r.xhi || max(a.Y, b.Y) <= r.ylo || min(a.Y, b.Y) >= r.yhi {
		return false
	}
	pos, neg := false, false
	for _, c := range [4]Point{{r.xlo, r.ylo}, {r.xhi, r.ylo}, {r.xhi, r.yhi}, {r.xlo, r.yhi}} {
		switch orient(a, b, c) {
		case 1:
			pos = true
		case -1:
			neg = true
		}
	}
	return pos && neg
}

func sortPairs(ps [][2]int) {
	slices.SortFunc(ps, func(p, q [2]int) int {
		if c := cmp.Compare(p[0], q[0]); c != 0 {
			return c
		}
		return cmp.Compare(p[1], q[1])
	})
}

// boxOverlapsBrute is BoxOverlaps by definition, over all pairs.
func boxOverlapsBrute(pts []Point, hw, hh []int64) ([][2]int, error) {
	if err := validateBoxes(pts, hw, hh); err != nil {
		return nil, err
	}
	var out [][2]int
	for i := range pts {
		for j := i + 1; j < len(pts); j++ {
			if openOverlap(boxOf(pts[i], hw[i], hh[i]), boxOf(pts[j], hw[j], hh[j])) {
				out = append(out, [2]int{i, j})
			}
		}
	}
	return out, nil
}

// edgeThroughBoxBrute is EdgeThroughBox by definition, over all
// vertex-edge pairs.
func edgeThroughBoxBrute(pts []Point, hw, hh []int64, edges [][2]int32) ([][2]int, error) {
	if err := validateBoxes(pts, hw, hh); err != nil {
		return nil, err
	}
	if err := validate(pts, edges); err != nil {
		return nil, err
	}
	var out [][2]int
	for v := range pts {
		for e, uw := range edges {
			if int(uw[0]) == v || int(uw[1]) == v {
				continue
			}
			if segMeetsOpenRect(pts[uw[0]], pts[uw[1]], boxOf(pts[v], hw[v], hh[v])) {
				out = append(out, [2]int{v, e})
			}
		}
	}
	return out, nil
}
