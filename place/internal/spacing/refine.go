package spacing

import (
	"math"

	"github.com/gridwood/gridwood/planarize"
)

// refineRounds bounds the push rounds of Refine.
const refineRounds = 16

// Refine pushes vertices away from what crowds them, in the spirit of
// F. Bertault's planarity-preserving force-directed refinement ("A
// force-directed algorithm that preserves edge-crossing properties",
// Inform. Process. Lett. 74, 2000), but with an exact guard instead of
// movement zones: a vertex is pushed away from node boxes that overlap its
// own and from edges that pass through its box, and the move is taken only
// if every triangle of the augmented triangulation at that vertex keeps
// the orientation of the inner faces (tested in integers), halving the
// step until it does. Boundary vertices move only as far as the boundary
// stays a strictly convex polygon. So a drawing that starts plane (see
// Plane; Refine checks it first, since the argument needs it) stays
// plane after every move, while the need to stretch the whole drawing to
// clear its boxes shrinks. seen is Plane's scratch, push scratch of
// one entry per vertex of the whole graph.
func Refine(emb *planarize.Embedding, vs []int32, outer *Outer, edges [][2]int32, x, y, hw, hh []int64, gap int64, stamp []int32, seen []bool, push [][2]float64, meter *Meter) {
	if len(vs) < 4 || len(vs) > ReadableLimit {
		return // big components keep their drawing: many rounds would dominate the run
	}
	if !Plane(emb, vs, outer, x, y, seen) {
		return // not the triangulation's plane drawing: moves could not be judged locally
	}
	guard, ok := newMoveGuard(emb, vs, outer, x, y)
	if !ok {
		return
	}
	valid := guard.allows
	cell := clearanceCell(vs, hw, hh, gap)
	// The drawing that needs the least stretch to clear its boxes wins:
	// pushing one vertex off an edge can push it onto another, so a round
	// may make things worse, and the best state seen is restored at the end.
	// Each round measures the stretch its state needs in the same pass over
	// near pairs that computes its pushes.
	bestStretch := math.Inf(1)
	var bestX, bestY []int64
	startX, startY := make([]int64, len(vs)), make([]int64, len(vs))
	for i, v := range vs {
		startX[i], startY[i] = x[v], y[v]
	}
	defer func() {
		for i, v := range bestX {
			x[vs[i]], y[vs[i]] = v, bestY[i]
		}
		// Every move was checked locally; the whole is checked once
		// more, as local checks on the boundary cannot see it wind round
		// twice. Failing that, the drawing is left as it came.
		if !Plane(emb, vs, outer, x, y, seen) {
			for i, v := range vs {
				x[v], y[v] = startX[i], startY[i]
			}
		}
	}()
	for round := 0; ; round++ {
		for _, v := range vs {
			push[v] = [2]float64{}
		}
		grid := newBucketGrid(vs, x, y, cell)
		c := clearance{x: x, y: y, hw: hw, hh: hh, gap: gap, s: 1}
		// Overlapping boxes push each other apart along the axis that
		// needs the smaller move.
		nearVertexPairs(vs, grid, x, y, func(u, w int32) {
			c.boxPair(u, w)
			dx, dy := x[w]-x[u], y[w]-y[u]
			ox := hw[u] + hw[w] + gap - abs64(dx)
			oy := hh[u] + hh[w] + gap - abs64(dy)
			if ox <= 0 || oy <= 0 {
				return
			}
			if ox <= oy {
				s := sign64(dx, u < w)
				push[u][0] -= float64(s * ox / 2)
				push[w][0] += float64(s * ox / 2)
			} else {
				s := sign64(dy, u < w)
				push[u][1] -= float64(s * oy / 2)
				push[w][1] += float64(s * oy / 2)
			}
		})
		// An edge through a box pushes that vertex off it, along the
		// edge's normal, by the depth of the intrusion.
		ok := nearPairs(vs, edges, x, y, grid, stamp, meter, func(w int32, e [2]int32) {
			icross, need, along := c.alongside(w, e)
			if !along {
				c.cornerPair(w, e) // counted, not pushed: rare, and the stretch clears it
				return
			}
			c.alongsidePair(icross, need)
			// Both |cross| and need are lengths times the edge's length:
			// compare them before taking the square root.
			cross := float64(icross)
			if math.Abs(cross) >= need {
				return
			}
			u, v := e[0], e[1]
			ex, ey := x[v]-x[u], y[v]-y[u]
			length := math.Sqrt(float64(float64(ex)*float64(ex)) + float64(float64(ey)*float64(ey)))
			// Unit normal towards w's side.
			nx, ny := -float64(ey)/length, float64(ex)/length
			if cross < 0 {
				nx, ny = -nx, -ny
			}
			depth := (need-math.Abs(cross))/length + 1
			push[w][0] += float64(nx * depth)
			push[w][1] += float64(ny * depth)
		})
		if !ok {
			return // out of work: the best state so far is restored
		}
		if c.s < bestStretch {
			bestStretch = c.s
			if bestX == nil {
				bestX, bestY = make([]int64, len(vs)), make([]int64, len(vs))
			}
			for i, v := range vs {
				bestX[i], bestY[i] = x[v], y[v]
			}
		}
		if round == refineRounds || bestStretch <= 1 {
			return
		}
		moved := false
		for _, v := range vs {
			dx, dy := int64(math.Round(push[v][0])), int64(math.Round(push[v][1]))
			for try := 0; try < 8 && (dx != 0 || dy != 0); try++ {
				if valid(v, x[v]+dx, y[v]+dy) {
					x[v] += dx
					y[v] += dy
					moved = true
					break
				}
				dx /= 2
				dy /= 2
			}
		}
		if !moved {
			return
		}
	}
}

// sign64 is the sign of d, or +1/-1 chosen by tie when d is 0 so that
// coincident boxes still separate.
func sign64(d int64, tie bool) int64 {
	switch {
	case d > 0:
		return 1
	case d < 0:
		return -1
	case tie:
		return 1
	}
	return -1
}
