package readable

import (
	"math"

	"github.com/gridwood/gridwood/place/mesh"
	"github.com/gridwood/gridwood/place/stress"
)

// guard runs guarded stress majorization on one drawing: x, y are the
// positions, kept equal to the mesh's.
type guard struct {
	mesh   *mesh.Mesh
	model  *stress.Model
	x, y   []float64
	hw, hh []float64
	gap    float64
	edges  [][2]int32
	corner []mesh.Corner // the star being looked at
	// margins makes the barrier keep boxes, not only points, clear.
	margins bool
	// jumps lets a vertex whose move is stopped early jump to its target.
	jumps bool
	// minHeight is, per vertex, the distance from an edge (or another
	// vertex) below which the barrier starts to cost.
	minHeight []float64
	// conflicts lists, with margins, the boxes and edges too near each
	// vertex's box (see findConflicts), found anew every sweep.
	conflicts [][]conflict
}

// Move rules: a vertex's least height is minHeightShare of its edges'
// mean ideal length, and freeHeightShare of that from a side that is no
// edge (see barrier, weighted by barrierWeight); a move goes
// at most freeSideShare of the way to any side of its star, and tries
// that and steps-1 halvings of it; a vertex that cannot get jumpShare of
// the way to its target tries to jump there.
const (
	minHeightShare  = 0.25
	freeHeightShare = 0.3
	barrierWeight   = 4
	freeSideShare   = 0.9
	steps           = 8
	jumpShare       = 0.5
)

// run makes up to sweeps sweeps over the vertices in index order, each
// vertex stepping toward its stress target as far as the guard allows; it
// stops early when a sweep moves the vertices less than tol times the
// mean ideal length on average, and returns the sweeps made.
func (g *guard) run(sweeps int, tol float64) int {
	n := len(g.x)
	unit := g.meanIdeal()
	for s := 0; s < sweeps; s++ {
		moved := 0.0
		if g.margins {
			g.findConflicts()
		}
		for v := range int32(n) {
			tx, ty, w, ok := g.model.TargetWeight(v, g.x, g.y)
			if !ok {
				continue
			}
			if g.margins {
				tx, ty = g.clearTarget(v, tx, ty, w)
			}
			moved += g.step(v, tx, ty, w)
		}
		if moved < tol*unit*float64(n) {
			return s + 1
		}
	}
	return sweeps
}

// meanIdeal is the mean ideal edge length, recovered from the least
// heights.
func (g *guard) meanIdeal() float64 {
	sum := 0.0
	for _, h := range g.minHeight {
		sum += h
	}
	return max(sum/minHeightShare/float64(len(g.minHeight)), 1e-9)
}

// step moves v toward its stress target (tx, ty), where the majorant of
// its stress is w |q - target|^2 for v at q, as far as is best for that
// majorant plus the clearance barrier (see barrier), trying fractions of
// the longest move that keeps v strictly inside its star. It returns the
// distance moved. A vertex that cannot get jumpShare of the way tries to
// jump (see jump).
func (g *guard) step(v int32, tx, ty, w float64) float64 {
	px, py := g.x[v], g.y[v]
	dx, dy := tx-px, ty-py
	dist := hypot(dx, dy)
	if dist == 0 {
		return 0
	}
	g.star(v)
	limit := g.limit(px, py, dx, dy)
	cost := func(t float64) float64 {
		qx, qy := px+float64(t*dx), py+float64(t*dy)
		ex, ey := qx-tx, qy-ty
		return float64(w*(float64(ex*ex)+float64(ey*ey))) + g.barrier(v, w, qx, qy)
	}
	here := cost(0)
	bestT, bestCost := 0.0, here
	for k, t := 0, limit; k < steps && t > 0; k, t = k+1, t/2 {
		if c := cost(t); c < bestCost {
			bestT, bestCost = t, c
		}
	}
	if bestT < jumpShare && g.jump(v, px, py, tx, ty, w, here) {
		return dist
	}
	for t := bestT; t > 0 && t >= bestT/16; t /= 2 {
		qx, qy := px+float64(t*dx), py+float64(t*dy)
		if g.mesh.CanMove(v, qx, qy) {
			g.mesh.Move(v, qx, qy)
			g.x[v], g.y[v] = qx, qy
			g.mesh.Legalize(v)
			return float64(t * dist)
		}
	}
	return 0
}

// star loads v's triangles into g.corner.
func (g *guard) star(v int32) {
	g.corner = g.corner[:0]
	g.mesh.Star(v, func(c mesh.Corner) { g.corner = append(g.corner, c) })
}

// limit returns the largest fraction t <= 1 of the move (dx, dy) from
// (px, py) that keeps the moving vertex at least 1 - freeSideShare of its
// present distance off every side of its star (g.corner).
func (g *guard) limit(px, py, dx, dy float64) float64 {
	t := 1.0
	for _, c := range g.corner {
		ax, ay, bx, by := g.mesh.X(c.A), g.mesh.Y(c.A), g.mesh.X(c.B), g.mesh.Y(c.B)
		// Twice the area of (q, a, b), linear in q = p + t d.
		area := float64((ax-px)*(by-py)) - float64((ay-py)*(bx-px))
		rate := float64((ay-by)*dx) + float64((bx-ax)*dy)
		if rate < 0 {
			t = min(t, float64(freeSideShare*area)/-rate)
		}
	}
	return max(0, t)
}

// barrier is the clearance cost of v at (qx, qy) in its star (g.corner),
// in the units of its stress majorant (w its weight): for every graph edge
// of the star and vertex beside it nearer than the vertex's least height
// (with margins, than its box reaches across the edge), and for every
// neighbour in the star nearer than the two least heights together (with
// margins, than keeps their boxes apart), w H^2 (H/h - 1)^2 for distance
// h and threshold H. It grows without bound as a vertex closes in on an
// edge, so that no move flattens the drawing onto its edges.
func (g *guard) barrier(v int32, w, qx, qy float64) float64 {
	sum := 0.0
	term := func(h, need float64) {
		if need <= 0 || h >= need {
			return
		}
		if h <= 0 {
			sum = math.Inf(1)
			return
		}
		r := need/h - 1
		sum += float64(float64(barrierWeight*w)*float64(need*need)) * float64(r*r)
	}
	for _, c := range g.corner {
		if c.Frame {
			continue
		}
		a, b := c.A, c.B
		ax, ay, bx, by := g.x[a], g.y[a], g.x[b], g.y[b]
		area := float64((ax-qx)*(by-qy)) - float64((ay-qy)*(bx-qx))
		// Each corner of the triangle beside the opposite side: a graph
		// edge must stay clear; a free side only far enough that no
		// triangle flattens.
		side := func(p int32, fixed bool, ex, ey float64) {
			need := float64(freeHeightShare * g.minHeight[p])
			if fixed {
				need = g.minHeight[p]
				if g.margins {
					need = max(need, g.reachAcross(p, ex, ey))
				}
			}
			term(area/hypot(ex, ey), need)
		}
		side(v, c.AB, bx-ax, by-ay)
		side(b, c.VA, ax-qx, ay-qy)
		side(a, c.VB, bx-qx, by-qy)
		ex, ey := qx-ax, qy-ay
		d := hypot(ex, ey)
		need := g.minHeight[v] + g.minHeight[a]
		if g.margins && d > 0 {
			need = max(need, g.boxDistance(v, a, ex/d, ey/d))
		}
		term(d, need)
	}
	if g.margins {
		g.conflictBarrier(v, term, qx, qy)
	}
	return sum
}

// reachAcross is how far v's box, grown by the gap, reaches across a line
// along (ex, ey): the box's support in the line's unit normal direction.
func (g *guard) reachAcross(v int32, ex, ey float64) float64 {
	l := hypot(ex, ey)
	if l == 0 {
		return 0
	}
	return float64(g.hw[v]*math.Abs(ey))/l + float64(g.hh[v]*math.Abs(ex))/l + g.gap
}

// boxDistance is how far apart along the unit direction (ux, uy) the
// centres of v's and a's boxes, grown by the gap, must be not to overlap.
func (g *guard) boxDistance(v, a int32, ux, uy float64) float64 {
	sx, sy := g.hw[v]+g.hw[a]+g.gap, g.hh[v]+g.hh[a]+g.gap
	d := math.Inf(1)
	if ux != 0 {
		d = sx / math.Abs(ux)
	}
	if uy != 0 {
		d = min(d, sy/math.Abs(uy))
	}
	return d
}

// jump tries to move v from (px, py) straight to its target (tx, ty),
// across whatever lies between, when the drawing stays plane (see
// mesh.Jump) and v's cost there, its barrier in its new star, is below
// here, its cost before; else v stays.
func (g *guard) jump(v int32, px, py, tx, ty, w, here float64) bool {
	if !g.jumps || !g.mesh.Jump(v, tx, ty) {
		return false
	}
	g.x[v], g.y[v] = tx, ty
	g.star(v)
	if g.barrier(v, w, tx, ty) < here {
		return true
	}
	if g.mesh.Jump(v, px, py) {
		g.x[v], g.y[v] = px, py
		return false
	}
	return true // cannot go back (a side exactly in the way): stay there
}

// hypot is the length of (x, y), with no library function but the
// correctly rounded square root, so that every machine gets the same bits.
func hypot(x, y float64) float64 { return math.Sqrt(float64(x*x) + float64(y*y)) }
