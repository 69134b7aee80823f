package place

import (
	"errors"
	"math"

	"github.com/gridwood/gridwood/place/mesh"
	"github.com/gridwood/gridwood/place/readable"
)

// maxRoundings bounds the scalings tried when rounding a readable drawing
// to integer points; errRounding reports running out (a bug: a plane
// drawing rounds to a plane one at a large enough scale).
const maxRoundings = 40

var errRounding = errors.New("place: internal error: the readable drawing does not round to a plane one")

// ReadableOptions tune Readable. The zero value is the default.
type ReadableOptions struct {
	// Work bounds the readable stage of each component (see
	// readable.Options.Work); 0 is the default.
	Work int64
}

// Readable turns the grid drawing into a readable one in points: each
// connected component of three or more vertices is drawn by the readable
// stage (package place/readable: stress majorization kept plane by a
// triangulation, started from the grid drawing or from a plane drawing
// near the component's stress layout), with ideal edge lengths from the
// node boxes; the result is rounded to integer points, checked exactly to
// be plane, and stretched by the least factor that clears every box (as
// Space does) where the stage left a box too near. Components are then
// packed in rows. Draw must have been run with DrawOptions.Readable.
func (r *Result) Readable(b Boxes, opt ReadableOptions) (*Placed, error) {
	n := len(r.X)
	hw, hh, gap, unit, err := r.localBoxes(b)
	if err != nil {
		return nil, err
	}
	d := r.local
	out := &Placed{X: make([]int64, n), Y: make([]int64, n), Unit: unit}
	px, py := make([]int64, n), make([]int64, n)
	edgesOf := r.edgesByComponent()
	boxes := make([]Component, len(d.members))
	stamp := make([]int32, n)
	for c, vs := range d.members {
		k := len(vs)
		switch {
		case k == 1:
			px[vs[0]], py[vs[0]] = 0, 0
		case k == 2:
			u, v := vs[0], vs[1]
			px[u], py[u] = 0, 0
			px[v], py[v] = hw[u]+hw[v]+gap, 0
		default:
			if err := r.readableComponent(c, vs, edgesOf[c], hw, hh, gap, opt, px, py, stamp, out); err != nil {
				return nil, err
			}
		}
		boxes[c] = shiftToOrigin(vs, px, py, hw, hh)
	}
	packSpaced(boxes, unit)
	for c, vs := range d.members {
		for _, v := range vs {
			px[v] += boxes[c].X0
			py[v] += boxes[c].Y0
		}
		out.Width = max(out.Width, boxes[c].X0+boxes[c].W)
		out.Height = max(out.Height, boxes[c].Y0+boxes[c].H)
	}
	for v, w := range r.newID {
		out.X[v], out.Y[v] = px[w], py[w]
	}
	return out, nil
}

// readableComponent draws component c (vertices vs, kept edges in Draw's
// numbering) by the readable stage and writes its integer points into
// px, py.
func (r *Result) readableComponent(c int, vs []int32, edges [][2]int32, hw, hh []int64, gap int64, opt ReadableOptions, px, py []int64, stamp []int32, out *Placed) error {
	d := r.local
	emb, _ := r.keptEmb.Restrict(vs)
	k := len(vs)
	index := make(map[int32]int32, k)
	for i, v := range vs {
		index[v] = int32(i)
	}
	local := make([][2]int32, emb.M())
	for i := range local {
		local[i] = emb.Edge(i)
	}
	in := readable.Input{Edges: local, X: make([]float64, k), Y: make([]float64, k), HalfW: make([]float64, k), HalfH: make([]float64, k), Gap: float64(gap), Embedding: emb}
	for i, v := range vs {
		in.X[i], in.Y[i] = float64(d.X[v]), float64(d.Y[v])
		in.HalfW[i], in.HalfH[i] = float64(hw[v]), float64(hh[v])
	}
	res, err := readable.Draw(in, readable.Options{Work: opt.Work})
	if err != nil {
		return err
	}
	out.Readable++
	// To integer points: round, check plane exactly, stretch to clear the
	// boxes; each scaling of the float drawing keeps it plane, and a
	// rounding that is not is tried again at twice the scale.
	scale := 1.0
	for attempt := 0; ; attempt++ {
		if attempt > maxRoundings {
			return errRounding
		}
		fx, fy := make([]float64, k), make([]float64, k)
		for i, v := range vs {
			px[v] = int64(math.Round(float64(res.X[i] * scale)))
			py[v] = int64(math.Round(float64(res.Y[i] * scale)))
			fx[i], fy[i] = float64(px[v]), float64(py[v])
		}
		if _, err := mesh.New(fx, fy, local, 0); err != nil {
			scale *= 2
			continue
		}
		s, checked := neededStretch(vs, edges, px, py, hw, hh, gap, stamp, newWorkMeter(len(edges)))
		if !checked {
			out.Unchecked++
		}
		if s <= 1 {
			break
		}
		scale *= s * 1.0001
	}
	return nil
}
