package spacing

import (
	"github.com/gridwood/gridwood/internal/exact"
	"github.com/gridwood/gridwood/planarize"
)

// moveGuard judges, exactly, single-vertex moves in a plane drawing of a
// component of the augmented triangulation (see Plane): a vertex
// may move where every triangle at it keeps the orientation of the inner
// faces, and, on the outer face, where the boundary stays a strictly
// convex polygon turning the same way. Each allowed move keeps the drawing
// plane, so any sequence of them does.
type moveGuard struct {
	emb          *planarize.Embedding
	outer        *Outer
	x, y         []int64
	pos          map[int32]int // boundary vertex -> its place on the outer face
	outerDart    map[int32]bool
	boundaryTurn int
	innerSign    int
}

// newMoveGuard sets up the guard for the drawing in x, y, which must be a
// plane drawing; ok is false when the drawing has no inner vertex or a
// degenerate boundary to take the orientations from.
func newMoveGuard(emb *planarize.Embedding, vs []int32, outer *Outer, x, y []int64) (*moveGuard, bool) {
	g := &moveGuard{emb: emb, outer: outer, x: x, y: y,
		pos: make(map[int32]int, len(outer.Face)), outerDart: make(map[int32]bool, len(outer.Face))}
	for i, d := range outer.Face {
		g.pos[emb.Tail(d)] = i
		g.outerDart[d] = true
	}
	g.boundaryTurn = g.turnAt(0, -1, 0, 0)
	for _, v := range vs {
		if _, on := g.pos[v]; !on {
			g.innerSign = triangleSign(emb, emb.First(v), x, y)
			break
		}
	}
	return g, g.innerSign != 0 && g.boundaryTurn != 0
}

// at is the vertex at place i (mod k) of the outer face.
func (g *moveGuard) at(i int) int32 {
	k := len(g.outer.Face)
	return g.emb.Tail(g.outer.Face[((i%k)+k)%k])
}

// turnAt is the boundary's turn at place i with v moved to (px, py).
func (g *moveGuard) turnAt(i int, v int32, px, py int64) int {
	x, y := g.x, g.y
	a, b, c := g.at(i-1), g.at(i), g.at(i+1)
	ax, ay, bx, by, cx, cy := x[a], y[a], x[b], y[b], x[c], y[c]
	switch v {
	case a:
		ax, ay = px, py
	case b:
		bx, by = px, py
	case c:
		cx, cy = px, py
	}
	return exact.OrientInt(ax, ay, bx, by, cx, cy)
}

// regionCorner reports whether the triangle on the left of dart h is
// outside the drawn region: the outer face, or a triangle of its dummies.
func (g *moveGuard) regionCorner(h int32) bool {
	if g.outerDart[h] {
		return true
	}
	emb := g.emb
	f1 := emb.FaceNext(h)
	return g.outer.isDummy(h>>1) || g.outer.isDummy(f1>>1) || g.outer.isDummy(emb.FaceNext(f1)>>1)
}

// allows reports whether v may move to (px, py).
func (g *moveGuard) allows(v int32, px, py int64) bool {
	if i, on := g.pos[v]; on {
		for j := i - 1; j <= i+1; j++ {
			if g.turnAt(j, v, px, py) != g.boundaryTurn {
				return false
			}
		}
	}
	emb, x, y := g.emb, g.x, g.y
	h := emb.First(v)
	for range emb.Degree(v) {
		if !g.regionCorner(h) {
			a, b := emb.Head(h), emb.Head(emb.Next(h))
			if exact.OrientInt(px, py, x[a], y[a], x[b], y[b]) != g.innerSign {
				return false
			}
		}
		h = emb.Next(h)
	}
	return true
}
