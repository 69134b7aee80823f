package spacing

import (
	"github.com/gridwood/gridwood/internal/exact"
	"github.com/gridwood/gridwood/planarize"
)

// Outer describes a component's outer face F as the layout chose it:
// its darts in face order (F on their left) and the dummy edges that
// triangulated F, numbered Lo..Hi-1 (none when F was a triangle).
type Outer struct {
	Face   []int32
	Lo, Hi int
}

func (o *Outer) isDummy(e int32) bool { return int(e) >= o.Lo && int(e) < o.Hi }

// triangleSign returns the orientation sign of the triangle on the left
// of dart d, in the frame x, y.
func triangleSign(emb *planarize.Embedding, d int32, x, y []int64) int {
	a, b := emb.Tail(d), emb.Head(d)
	c := emb.Head(emb.FaceNext(d))
	return exact.OrientInt(x[a], y[a], x[b], y[b], x[c], y[c])
}

// boundaryWinding counts, exactly, how many times the outer face's
// polygon goes round, given that every turn is the sign turn: its edge
// directions then rotate one way by less than a half turn at each corner,
// and each full round passes the direction of the positive x axis once.
// Only 1 makes a simple, hence convex, polygon; all turns one way alone
// would also let a star polygon such as the pentagram through.
func boundaryWinding(emb *planarize.Embedding, outer *Outer, x, y []int64, turn int) int {
	// upper: the direction's angle lies in [0, pi).
	upper := func(d int32) bool {
		dx, dy := x[emb.Head(d)]-x[emb.Tail(d)], y[emb.Head(d)]-y[emb.Tail(d)]
		return dy > 0 || dy == 0 && dx > 0
	}
	k := len(outer.Face)
	rounds := 0
	for i, d := range outer.Face {
		now, next := upper(d), upper(outer.Face[(i+1)%k])
		// Turning left, a round ends where the direction passes from the
		// lower half to the upper one; turning right, the other way.
		if turn > 0 && !now && next || turn < 0 && now && !next {
			rounds++
		}
	}
	return rounds
}

// Plane reports, exactly, whether the component's drawing in the
// frame x, y is a plane drawing of the triangulation minus the outer
// region: the outer face F is a strictly convex polygon and every other
// face is a triangle turning the opposite way. Then each point inside the
// polygon is covered by exactly one triangle (the map from the disk has
// degree one and preserves orientation everywhere), so the drawing has no
// crossing or touching, and neither has any subgraph's. seen is scratch,
// all false, of one entry per dart; it is left all false.
func Plane(emb *planarize.Embedding, vs []int32, outer *Outer, x, y []int64, seen []bool) bool {
	k := len(outer.Face)
	if k < 3 {
		return false
	}
	turn := 0
	for i, d := range outer.Face {
		a, b := emb.Tail(d), emb.Head(d)
		c := emb.Head(outer.Face[(i+1)%k])
		t := exact.OrientInt(x[a], y[a], x[b], y[b], x[c], y[c])
		if t == 0 || turn != 0 && t != turn {
			return false
		}
		turn = t
	}
	if boundaryWinding(emb, outer, x, y, turn) != 1 {
		return false // turns one way, but goes round more than once
	}
	ok := true
	var marked []int32
	mark := func(d int32) {
		seen[d] = true
		marked = append(marked, d)
	}
	for _, d := range outer.Face {
		mark(d)
	}
	for _, v := range vs {
		h := emb.First(v)
		for range emb.Degree(v) {
			if !seen[h] {
				f1 := emb.FaceNext(h)
				f2 := emb.FaceNext(f1)
				mark(h)
				mark(f1)
				mark(f2)
				if emb.FaceNext(f2) != h {
					ok = false
				} else if !(outer.isDummy(h>>1) || outer.isDummy(f1>>1) || outer.isDummy(f2>>1)) {
					if triangleSign(emb, h, x, y) != -turn {
						ok = false
					}
				}
			}
			h = emb.Next(h)
		}
	}
	for _, d := range marked {
		seen[d] = false
	}
	return ok
}
