package readable

import (
	"math"
	"slices"

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
	gap    float64 // between boxes
	// edgeGap is the clear space between a box and an edge passing by.
	edgeGap float64
	edges   [][2]int32
	corner  []mesh.Corner // the star being looked at
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
	// lengths are the edges' ideal lengths, and reach the frame's reach
	// when the triangulation is rebuilt (see uncrush).
	lengths []float64
	reach   float64
	adj     [][]int32 // the graph's neighbours, made by runActive
}

// Move rules: a vertex's least height is minHeightShare of its edges'
// mean ideal length (see barrier, weighted by barrierWeight); a move goes
// at most freeSideShare of the way to any side of its star, and tries
// that and steps-1 halvings of it; a vertex that cannot get jumpShare of
// the way to its target tries to jump there.
const (
	minHeightShare = 0.25
	barrierWeight  = 4
	freeSideShare  = 0.9
	steps          = 8
	jumpShare      = 0.5
	floorShare     = 0.05
)

// run makes up to sweeps sweeps over the vertices in index order, each
// vertex stepping toward its stress target as far as the guard allows; it
// stops early when a sweep moves the vertices less than tol times the
// mean ideal length on average, and returns the sweeps made.
func (g *guard) run(sweeps int, tol float64) int {
	n := len(g.x)
	unit := g.meanIdeal()
	last := 0.0
	inflations := 0
	movedBy := make([]float64, n)
	for s := 0; s < sweeps; s++ {
		moved := 0.0
		if s%uncrushEvery == 0 && inflations < maxInflations {
			if (!g.margins && g.uncrush(g.lengths, g.reach)) || (g.margins && g.inflateCrowded()) {
				last = 0
				inflations++
			}
		}
		g.mesh.LegalizeAll()
		if g.margins && s%activeConflictsEvery == 0 && g.stretchNeeded() <= clearEnough {
			return s // every box clear: the margins phase is done
		}
		if g.margins {
			g.findConflicts()
		}
		for v := range int32(n) {
			movedBy[v] = g.stepToTarget(v)
			moved += movedBy[v]
		}
		if moved < tol*unit*float64(n) {
			return s + 1 + g.runActive(movedBy, (sweeps-s-1)*n, tol*unit)
		}
		// Every stressCheck sweeps: stop when stress fell by less than
		// tol in that time (a slow drift, or jumps back and forth). The
		// margins phase may raise stress to part boxes: it stops on
		// movement and its bound alone.
		if (s+1)%stressCheck == 0 && !g.margins {
			st := g.model.Stress(g.x, g.y)
			if last > 0 && st > float64((1-tol)*last) {
				return s + 1
			}
			last = st
		}
	}
	return sweeps
}

// stepToTarget steps v toward its stress target (cleared of its box
// conflicts in the margins phase) and returns the distance moved.
func (g *guard) stepToTarget(v int32) float64 {
	tx, ty, w, ok := g.model.TargetWeight(v, g.x, g.y)
	if !ok {
		return 0
	}
	tx, ty = g.model.Project(v, tx, ty, g.x, g.y)
	if g.margins {
		tx, ty = g.clearTarget(v, tx, ty, w)
	}
	return g.step(v, tx, ty, w)
}

// runActive goes on after the drawing as a whole has settled, sweeping
// only the vertices that still moved more than still in the last sweep
// (and, in the margins phase, those in box conflicts), with their
// neighbours: a crowded corner that unfolds slowly keeps unfolding at the
// cost of its own size, not the graph's. budget bounds the vertex steps;
// it returns the sweeps made, counted in whole-graph sweeps.
func (g *guard) runActive(movedBy []float64, budget int, still float64) int {
	n := len(g.x)
	if g.adj == nil {
		g.adj = make([][]int32, n)
		for _, e := range g.edges {
			g.adj[e[0]] = append(g.adj[e[0]], e[1])
			g.adj[e[1]] = append(g.adj[e[1]], e[0])
		}
	}
	mark := make([]bool, n)
	var active []int32
	add := func(v int32) {
		if !mark[v] {
			mark[v] = true
			active = append(active, v)
		}
	}
	grow := func(seeds []int32) {
		active = active[:0]
		clear(mark)
		for _, v := range seeds {
			add(v)
			for _, w := range g.adj[v] {
				add(w)
			}
		}
		slices.Sort(active)
	}
	var seeds []int32
	for v := range int32(n) {
		if movedBy[v] > still {
			seeds = append(seeds, v)
		}
	}
	steps := 0
	for round := 0; budget > 0; round++ {
		if g.margins && round%activeConflictsEvery == 0 {
			if len(seeds) == 0 && g.stretchNeeded() <= clearEnough {
				break // settled, and every box clear
			}
			for v, cs := range g.conflicts {
				if len(cs) > 0 {
					seeds = append(seeds, int32(v))
				}
			}
		}
		grow(seeds)
		if len(active) == 0 {
			break
		}
		seeds = seeds[:0]
		for _, v := range active {
			if g.stepToTarget(v) > still {
				seeds = append(seeds, v)
			}
		}
		budget -= len(active)
		steps += len(active)
		if len(seeds) == 0 && !g.margins {
			break
		}
		if len(seeds) == 0 && round%activeConflictsEvery != activeConflictsEvery-1 {
			// Settled: one more look at the conflicts decides.
			round = activeConflictsEvery - 1
		}
	}
	return (steps + n - 1) / n
}

// clearEnough is the stretch that counts as clear in the margins phase:
// the rounding to points stretches the drawing by what remains, and boxes
// that just touch at an ideal length would otherwise keep it going.
const clearEnough = 1.05

// activeConflictsEvery is how often, in active rounds, the margins phase
// looks for box conflicts anew.
const activeConflictsEvery = 10

// stressCheck is how often, in sweeps, run weighs the stress, and
// uncrushEvery how often it looks for crushed parts.
const (
	stressCheck  = 10
	uncrushEvery = 20
	// maxInflations bounds the parts blown up in one run: each is
	// followed by a descent that may undo some of it, and without a bound
	// the two can take turns forever.
	maxInflations = 6
)

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
	if g.smooth(v) {
		return 0
	}
	if ex, ey, ok := g.escapeTarget(v, tx, ty, w); ok {
		tx, ty = ex, ey
		dx, dy = tx-px, ty-py
		if dist = hypot(dx, dy); dist == 0 {
			return 0
		}
	}
	limit := g.limit(px, py, dx, dy)
	// cost is the majorant plus the barrier at p + t d, and the barrier.
	cost := func(t float64) (float64, float64) {
		qx, qy := px+float64(t*dx), py+float64(t*dy)
		ex, ey := qx-tx, qy-ty
		b := g.barrier(v, w, qx, qy)
		return float64(w*(float64(ex*ex)+float64(ey*ey))) + b, b
	}
	here, _ := cost(0)
	bestT, bestCost := 0.0, here
	for k, t := 0, limit; k < steps && t > 0; k, t = k+1, t/2 {
		c, b := cost(t)
		if c < bestCost {
			bestT, bestCost = t, c
		}
		if k == 0 && b == 0 {
			break // the majorant only falls toward the target: take it
		}
	}
	if bestT < jumpShare && g.jump(v, px, py, tx, ty, w, here) {
		return dist
	}
	for t := bestT; t > 0 && t >= bestT/16; t /= 2 {
		qx, qy := px+float64(t*dx), py+float64(t*dy)
		if g.keepsFloor(v, px, py, qx, qy) && g.mesh.CanMove(v, qx, qy) {
			g.mesh.Move(v, qx, qy)
			g.x[v], g.y[v] = qx, qy
			g.mesh.Legalize(v)
			return float64(t * dist)
		}
	}
	return 0
}

// keepsFloor reports whether moving v from p to q keeps every height of
// every triangle around it (each corner's distance from the opposite
// side's line) and every neighbour's distance at least floorShare of the
// corner's least height, or, where some are below that already, does not
// lower the worst of them in proportion to its floor (the barrier is
// soft, and this keeps a crowded start from being pressed flat by
// stress, by one vertex's moves or by two taking turns, while a pressed
// corner may still open up).
func (g *guard) keepsFloor(v int32, px, py, qx, qy float64) bool {
	worstBefore, worstAfter := math.Inf(1), math.Inf(1)
	for _, c := range g.corner {
		if c.Frame {
			continue
		}
		a, b := c.A, c.B
		ax, ay, bx, by := g.x[a], g.y[a], g.x[b], g.y[b]
		heights := func(vx, vy float64) [4]float64 {
			return [4]float64{
				segmentDistance(vx, vy, ax, ay, bx, by), // v from a-b
				segmentDistance(bx, by, vx, vy, ax, ay), // b from v-a
				segmentDistance(ax, ay, vx, vy, bx, by), // a from v-b
				hypot(vx-ax, vy-ay),                     // v to a
			}
		}
		before, after := heights(px, py), heights(qx, qy)
		floor := [4]float64{g.minHeight[v], g.minHeight[b], g.minHeight[a], g.minHeight[v]}
		counts := [4]bool{c.AB, c.VA, c.VB, true}
		for i := range after {
			if !counts[i] {
				continue
			}
			f := float64(floorShare * floor[i])
			if f <= 0 {
				continue
			}
			worstBefore = min(worstBefore, before[i]/f)
			worstAfter = min(worstAfter, after[i]/f)
		}
	}
	return worstAfter >= 1 || worstAfter >= worstBefore
}

// escapeTarget blends v's stress target (tx, ty, of weight w) with a
// point clear of each edge of its star that v is nearer than the barrier
// allows (the nearest point of the edge moved out to that distance), of
// each neighbour nearer than their least distance, and for each edge at v
// with a vertex beside it too near, a point across that swings the edge
// away, each of weight w: a vertex crowded by its triangles moves out, and
// one whose edges crowd others makes room, even where stress would not
// move it that way. ok is false when nothing crowds v.
func (g *guard) escapeTarget(v int32, tx, ty, w float64) (float64, float64, bool) {
	px, py := g.x[v], g.y[v]
	sx, sy, sw := float64(w*tx), float64(w*ty), w
	crowded := false
	for _, c := range g.corner {
		if c.Frame {
			continue
		}
		ax, ay, bx, by := g.x[c.A], g.y[c.A], g.x[c.B], g.y[c.B]
		ex, ey := bx-ax, by-ay
		l := hypot(ex, ey)
		if l > 0 && c.AB {
			need := g.minHeight[v]
			if g.margins {
				need = max(need, g.reachAcross(v, ex, ey))
			}
			if h := segmentDistance(px, py, ax, ay, bx, by); h < need && h > 0 {
				// The nearest point of the edge, then out along the line
				// from it to v.
				t := min(1, max(0, (float64((px-ax)*ex)+float64((py-ay)*ey))/float64(l*l)))
				fx, fy := ax+float64(t*ex), ay+float64(t*ey)
				sx += float64(w * (fx + float64(need*(px-fx)/h)))
				sy += float64(w * (fy + float64(need*(py-fy)/h)))
				sw += w
				crowded = true
			}
		}
		ux, uy := px-ax, py-ay
		d := hypot(ux, uy)
		if need := g.minHeight[v] + g.minHeight[c.A]; d < need && d > 0 {
			sx += float64(w * (ax + float64(need*ux/d)))
			sy += float64(w * (ay + float64(need*uy/d)))
			sw += w
			crowded = true
		}
		// An edge of v's, v-a, with the next corner b too near it: move v
		// across so that the edge swings away from b (the nearer b lies to
		// a, the further v must go).
		for _, sp := range [2]struct {
			fixed bool
			a, b  int32
		}{{c.VA, c.A, c.B}, {c.VB, c.B, c.A}} {
			if !sp.fixed {
				continue
			}
			ax, ay, bx, by := g.x[sp.a], g.y[sp.a], g.x[sp.b], g.y[sp.b]
			h := segmentDistance(bx, by, px, py, ax, ay)
			need := g.minHeight[sp.b]
			if g.margins {
				need = max(need, g.reachAcross(sp.b, ax-px, ay-py))
			}
			if h >= need {
				continue
			}
			ex, ey := px-ax, py-ay
			l := hypot(ex, ey)
			if l == 0 {
				continue
			}
			// Unit normal of the edge, pointing away from b.
			nx, ny := -ey/l, ex/l
			if float64((bx-ax)*nx)+float64((by-ay)*ny) > 0 {
				nx, ny = -nx, -ny
			}
			along := max(0.25*l, float64((bx-ax)*ex)/l+float64((by-ay)*ey)/l)
			push := min(4*l, float64((need-h)*l)/along)
			sx += float64(w * (px + float64(push*nx)))
			sy += float64(w * (py + float64(push*ny)))
			sw += w
			crowded = true
		}
	}
	if !crowded {
		return tx, ty, false
	}
	return sx / sw, sy / sw, true
}

// smooth moves v, when some height of its triangles is below its floor
// (floorShare of the least height: a crowded spot, often from a start
// drawing that crowds), toward the centroid of its neighbours, the classic
// smoothing of meshes, as far as the guard allows and only if that raises
// its worst height; it reports whether v moved. Stress alone would leave
// such a vertex where it is, since its target need not lead out.
func (g *guard) smooth(v int32) bool {
	px, py := g.x[v], g.y[v]
	if g.worstHeight(v, px, py) >= 1 {
		return false
	}
	var cx, cy float64
	k := 0
	for _, c := range g.corner {
		if !c.Frame || c.A < int32(len(g.x)) {
			if int(c.A) < len(g.x) {
				cx += g.x[c.A]
				cy += g.y[c.A]
				k++
			}
		}
	}
	if k == 0 {
		return false
	}
	cx, cy = cx/float64(k), cy/float64(k)
	worst := g.worstHeight(v, px, py)
	for t := 1.0; t >= 1.0/64; t /= 2 {
		qx, qy := px+float64(t*(cx-px)), py+float64(t*(cy-py))
		if g.worstHeight(v, qx, qy) > worst && g.keepsFloor(v, px, py, qx, qy) && g.mesh.CanMove(v, qx, qy) {
			g.mesh.Move(v, qx, qy)
			g.x[v], g.y[v] = qx, qy
			g.mesh.Legalize(v)
			return true
		}
	}
	return false
}

// worstHeight is the least ratio, over the triangles around v at (vx, vy)
// (g.corner), of a height (corner to opposite side, or v to a neighbour)
// to its floor (floorShare of the corner's least height).
func (g *guard) worstHeight(v int32, vx, vy float64) float64 {
	worst := math.Inf(1)
	for _, c := range g.corner {
		if c.Frame {
			continue
		}
		a, b := c.A, c.B
		ax, ay, bx, by := g.x[a], g.y[a], g.x[b], g.y[b]
		hs := [4]float64{segmentDistance(vx, vy, ax, ay, bx, by), segmentDistance(bx, by, vx, vy, ax, ay), segmentDistance(ax, ay, vx, vy, bx, by), hypot(vx-ax, vy-ay)}
		fs := [4]float64{g.minHeight[v], g.minHeight[b], g.minHeight[a], g.minHeight[v]}
		counts := [4]bool{c.AB, c.VA, c.VB, true}
		for i := range hs {
			if !counts[i] {
				continue
			}
			worst = min(worst, hs[i]/float64(floorShare*fs[i]))
		}
	}
	return worst
}

// crowding returns the least, over all vertices, of worstHeight: how near
// the drawing comes to pressing a vertex onto an edge or another vertex,
// in proportion to the floors.
func (g *guard) crowding() float64 {
	worst := math.Inf(1)
	for v := range int32(len(g.x)) {
		g.star(v)
		worst = min(worst, g.worstHeight(v, g.x[v], g.y[v]))
	}
	return worst
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
		// Each corner of the triangle beside the opposite side, where that
		// side is a graph edge, must stay clear of it. (Sides that are no
		// edge do not matter: the triangulation is kept Delaunay, so a
		// vertex near an edge has it among its own triangles' sides.)
		side := func(p int32, fixed bool, px, py, sx, sy, ex, ey float64) {
			if !fixed {
				return
			}
			need := g.minHeight[p]
			if g.margins {
				need = max(need, g.reachAcross(p, ex-sx, ey-sy))
			}
			// Far from the side's bounding box, far from the side: no
			// cost, and no square root (most sides of most stars).
			bx := max(min(sx, ex)-px, px-max(sx, ex), 0)
			by := max(min(sy, ey)-py, py-max(sy, ey), 0)
			if float64(bx*bx)+float64(by*by) >= float64(need*need) {
				return
			}
			term(segmentDistance(px, py, sx, sy, ex, ey), need)
		}
		side(v, c.AB, qx, qy, ax, ay, bx, by)
		side(b, c.VA, bx, by, qx, qy, ax, ay)
		side(a, c.VB, ax, ay, qx, qy, bx, by)
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
	return float64(g.hw[v]*math.Abs(ey))/l + float64(g.hh[v]*math.Abs(ex))/l + g.edgeGap
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
	if !g.jumps || g.nearHub(v) || !g.mesh.Jump(v, tx, ty) {
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

// nearHub reports whether v or one of its neighbours in the graph has
// more than maxJumpSpokes triangles around it: a jump walks round each of
// them, and on a star every leaf trying one would cost the square of the
// number of leaves. It reads v's star from g.corner, which step has
// filled.
func (g *guard) nearHub(v int32) bool {
	if g.mesh.Spokes(v) > maxJumpSpokes {
		return true
	}
	for _, c := range g.corner {
		if c.VA && g.mesh.Spokes(c.A) > maxJumpSpokes {
			return true
		}
	}
	return false
}

// maxJumpSpokes: see nearHub.
const maxJumpSpokes = 64

// segmentDistance is the distance from (px, py) to the segment from (ax,
// ay) to (bx, by).
func segmentDistance(px, py, ax, ay, bx, by float64) float64 {
	ex, ey := bx-ax, by-ay
	l2 := float64(ex*ex) + float64(ey*ey)
	if l2 == 0 {
		return hypot(px-ax, py-ay)
	}
	t := min(1, max(0, (float64((px-ax)*ex)+float64((py-ay)*ey))/l2))
	return hypot(px-ax-float64(t*ex), py-ay-float64(t*ey))
}

// hypot is the length of (x, y), with no library function but the
// correctly rounded square root, so that every machine gets the same bits.
func hypot(x, y float64) float64 { return math.Sqrt(float64(x*x) + float64(y*y)) }
