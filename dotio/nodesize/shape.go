package nodesize

import (
	"math"
	"strings"
)

// Kind is how a shape's outline is made.
type Kind int

const (
	Rect      Kind = iota // a rectangle (box, rect, rectangle, square)
	Ellipse               // an ellipse (ellipse, oval, circle, doublecircle, point)
	Polygon               // Shape.Poly
	NoOutline             // plaintext, plain, none: the label alone
	Record                // record, Mrecord: fields in a rectangle
	Cylinder              // a rectangle with elliptic ends
	Note                  // a rectangle with a folded corner
	Tab                   // a rectangle with a tab on its top left
	Folder                // a rectangle with a tab on its top right
	Box3D                 // a rectangle with depth
	Component             // a rectangle with two small bars on its left
	Underline             // a line under the label
)

// Shape is a node shape of the catalog.
type Shape struct {
	Name string
	Kind Kind
	// Poly is a Polygon's outline, counter-clockwise, in the unit box
	// [-0.5, 0.5] x [-0.5, 0.5] (y up), centred on the node.
	Poly [][2]float64
	// Peripheries is the default number of outlines.
	Peripheries int
	// Regular shapes are as wide as tall.
	Regular bool
	// Rounded draws a Rect or Record with rounded corners (Mrecord).
	Rounded bool
	// halfWidth(y) is the half width of the outline, as a fraction of the
	// box's width, at height y of the unit box (the least of y and -y),
	// and 0 where the outline does not reach.
	halfWidth func(y float64) float64
}

// regularPolygon is an n-gon inscribed in the unit box, a vertex at angle
// start (radians, counter-clockwise from +x), stretched to fill the box.
func regularPolygon(n int, start float64) [][2]float64 {
	pts := make([][2]float64, n)
	minX, maxX, minY, maxY := math.Inf(1), math.Inf(-1), math.Inf(1), math.Inf(-1)
	for i := range pts {
		a := start + 2*math.Pi*float64(i)/float64(n)
		pts[i] = [2]float64{math.Cos(a), math.Sin(a)}
		minX, maxX = min(minX, pts[i][0]), max(maxX, pts[i][0])
		minY, maxY = min(minY, pts[i][1]), max(maxY, pts[i][1])
	}
	for i := range pts {
		pts[i][0] = (pts[i][0]-minX)/(maxX-minX) - 0.5
		pts[i][1] = (pts[i][1]-minY)/(maxY-minY) - 0.5
	}
	return pts
}

func star() [][2]float64 {
	pts := make([][2]float64, 10)
	for i := range pts {
		r := 0.5
		if i%2 == 1 {
			r = 0.2
		}
		a := math.Pi/2 + math.Pi*float64(i)/5
		pts[i] = [2]float64{r * math.Cos(a), r * math.Sin(a)}
	}
	// Stretch to the unit box.
	minY, maxY := math.Inf(1), math.Inf(-1)
	minX, maxX := math.Inf(1), math.Inf(-1)
	for _, p := range pts {
		minX, maxX = min(minX, p[0]), max(maxX, p[0])
		minY, maxY = min(minY, p[1]), max(maxY, p[1])
	}
	for i := range pts {
		pts[i][0] = (pts[i][0]-minX)/(maxX-minX) - 0.5
		pts[i][1] = (pts[i][1]-minY)/(maxY-minY) - 0.5
	}
	return pts
}

func flipY(p [][2]float64) [][2]float64 {
	out := make([][2]float64, len(p))
	for i, q := range p {
		out[len(p)-1-i] = [2]float64{q[0], -q[1]}
	}
	return out
}

// The catalog. Outlines of our own drawing, after the shapes' names and
// the DOT documentation's descriptions (from memory).
var shapes = func() map[string]*Shape {
	house := [][2]float64{{0, 0.5}, {-0.5, 0.1}, {-0.5, -0.5}, {0.5, -0.5}, {0.5, 0.1}}
	triangle := [][2]float64{{0, 0.5}, {-0.5, -0.5}, {0.5, -0.5}}
	trapezium := [][2]float64{{-0.5, -0.5}, {0.5, -0.5}, {0.3, 0.5}, {-0.3, 0.5}}
	list := []*Shape{
		{Name: "box", Kind: Rect},
		{Name: "rect", Kind: Rect},
		{Name: "rectangle", Kind: Rect},
		{Name: "square", Kind: Rect, Regular: true},
		{Name: "ellipse", Kind: Ellipse},
		{Name: "oval", Kind: Ellipse},
		{Name: "circle", Kind: Ellipse, Regular: true},
		{Name: "doublecircle", Kind: Ellipse, Regular: true, Peripheries: 2},
		{Name: "point", Kind: Ellipse, Regular: true},
		{Name: "plaintext", Kind: NoOutline},
		{Name: "plain", Kind: NoOutline},
		{Name: "none", Kind: NoOutline},
		{Name: "record", Kind: Record},
		{Name: "Mrecord", Kind: Record, Rounded: true},
		{Name: "diamond", Kind: Polygon, Poly: [][2]float64{{0.5, 0}, {0, 0.5}, {-0.5, 0}, {0, -0.5}}},
		{Name: "triangle", Kind: Polygon, Poly: triangle},
		{Name: "invtriangle", Kind: Polygon, Poly: flipY(triangle)},
		{Name: "house", Kind: Polygon, Poly: house},
		{Name: "invhouse", Kind: Polygon, Poly: flipY(house)},
		{Name: "pentagon", Kind: Polygon, Poly: regularPolygon(5, math.Pi/2)},
		{Name: "hexagon", Kind: Polygon, Poly: regularPolygon(6, 0)},
		{Name: "septagon", Kind: Polygon, Poly: regularPolygon(7, math.Pi/2)},
		{Name: "octagon", Kind: Polygon, Poly: regularPolygon(8, math.Pi/8)},
		{Name: "doubleoctagon", Kind: Polygon, Poly: regularPolygon(8, math.Pi/8), Peripheries: 2},
		{Name: "tripleoctagon", Kind: Polygon, Poly: regularPolygon(8, math.Pi/8), Peripheries: 3},
		{Name: "parallelogram", Kind: Polygon, Poly: [][2]float64{{-0.5, -0.5}, {0.3, -0.5}, {0.5, 0.5}, {-0.3, 0.5}}},
		{Name: "trapezium", Kind: Polygon, Poly: trapezium},
		{Name: "invtrapezium", Kind: Polygon, Poly: flipY(trapezium)},
		{Name: "star", Kind: Polygon, Poly: star()},
		{Name: "cylinder", Kind: Cylinder},
		{Name: "note", Kind: Note},
		{Name: "tab", Kind: Tab},
		{Name: "folder", Kind: Folder},
		{Name: "box3d", Kind: Box3D},
		{Name: "component", Kind: Component},
		{Name: "underline", Kind: Underline},
	}
	m := make(map[string]*Shape, len(list))
	for _, s := range list {
		if s.Peripheries == 0 && s.Kind != NoOutline {
			s.Peripheries = 1
		}
		switch s.Kind {
		case Ellipse:
			s.halfWidth = func(y float64) float64 {
				if math.Abs(y) >= 0.5 {
					return 0
				}
				return 0.5 * math.Sqrt(1-4*y*y)
			}
		case Polygon:
			poly := s.Poly
			s.halfWidth = func(y float64) float64 { return polyHalfWidth(poly, y) }
		default:
			s.halfWidth = func(y float64) float64 {
				if math.Abs(y) > 0.5 {
					return 0
				}
				return 0.5
			}
		}
		m[strings.ToLower(s.Name)] = s
	}
	return m
}()

// LookupShape returns the catalog's shape of a DOT shape name, compared
// without regard to case, and whether there is one.
func LookupShape(name string) (*Shape, bool) {
	s, ok := shapes[strings.ToLower(strings.TrimSpace(name))]
	return s, ok
}

// polyHalfWidth is the room, as a fraction of the box's width, from the
// centre line x = 0 to the polygon's outline along the horizontal lines at
// heights y and -y, the least of the four ways (a label is centred).
func polyHalfWidth(poly [][2]float64, y float64) float64 {
	least := math.Inf(1)
	for _, yy := range [2]float64{y, -y} {
		for _, dir := range [2]float64{1, -1} {
			least = min(least, rayToOutline(poly, 0, yy, dir))
		}
	}
	return least
}

// rayToOutline is the distance from (x0, y0) along the horizontal ray in
// direction dir (+1 or -1) to the nearest crossing of the polygon's
// outline, +Inf if none.
func rayToOutline(poly [][2]float64, x0, y0, dir float64) float64 {
	best := math.Inf(1)
	for i := range poly {
		a, b := poly[i], poly[(i+1)%len(poly)]
		if (a[1] > y0) == (b[1] > y0) && a[1] != y0 && b[1] != y0 {
			continue
		}
		if a[1] == b[1] {
			continue
		}
		t := (y0 - a[1]) / (b[1] - a[1])
		if t < 0 || t > 1 {
			continue
		}
		x := a[0] + t*(b[0]-a[0])
		if d := (x - x0) * dir; d >= 0 {
			best = min(best, d)
		}
	}
	if math.IsInf(best, 1) {
		return 0
	}
	return best
}

// fitWidth is the least width of the outline, at height h, that holds a
// centred w x lh rectangle; lh < h. +Inf if none does.
func (s *Shape) fitWidth(w, lh, h float64) float64 {
	if w <= 0 || lh <= 0 {
		return max(w, 0)
	}
	hw := s.halfWidth(lh / 2 / h)
	if hw <= 0 {
		return math.Inf(1)
	}
	return w / (2 * hw)
}

// fitRegular is the least side of a regular outline (as wide as tall)
// that holds a centred w x h rectangle.
func (s *Shape) fitRegular(w, h float64) float64 {
	m := max(w, h)
	if m <= 0 {
		return 0
	}
	holds := func(d float64) bool {
		return h <= d && (w <= 0 || h <= 0 || w <= 2*d*s.halfWidth(h/2/d))
	}
	lo, hi := m, s.fitScale()*m
	if holds(lo) {
		return lo
	}
	for range 60 {
		mid := (lo + hi) / 2
		if holds(mid) {
			hi = mid
		} else {
			lo = mid
		}
	}
	return hi
}

// fitScale is the least factor by which a rectangle's sides must grow for
// the outline, stretched over the grown rectangle, to hold it: 1 for a
// box, sqrt(2) for an ellipse, 2 for a diamond.
func (s *Shape) fitScale() float64 {
	switch s.Kind {
	case Ellipse:
		return math.Sqrt2
	case Polygon:
		// The corner (a, a) of the label's box, in unit-box units, lies
		// inside when 2 * halfWidth(a) >= 2a; search the largest such a.
		lo, hi := 0.0, 0.5
		for range 60 {
			mid := (lo + hi) / 2
			if s.halfWidth(mid) >= mid {
				lo = mid
			} else {
				hi = mid
			}
		}
		if lo <= 0 {
			return 1
		}
		return 0.5 / lo
	}
	return 1
}
