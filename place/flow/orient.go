package flow

import "fmt"

// Symmetry is one of the eight symmetries of the square, applied to a
// drawing's coordinates about the origin: the four that keep each axis
// (the identity and the mirror images) and the four that swap them.
type Symmetry uint8

const (
	Identity      Symmetry = iota // (x, y)
	MirrorX                       // (-x, y): left and right exchanged
	MirrorY                       // (x, -y): top and bottom exchanged
	Rotate180                     // (-x, -y): both
	Transpose                     // (y, x)
	Rotate90                      // (-y, x): a quarter turn counter-clockwise
	Rotate270                     // (y, -x): a quarter turn clockwise
	AntiTranspose                 // (-y, -x)
)

// Symmetries lists the eight in the order Orient breaks ties by.
var Symmetries = [8]Symmetry{Identity, MirrorX, MirrorY, Rotate180, Transpose, Rotate90, Rotate270, AntiTranspose}

// String names s.
func (s Symmetry) String() string {
	switch s {
	case Identity:
		return "identity"
	case MirrorX:
		return "mirror x"
	case MirrorY:
		return "mirror y"
	case Rotate180:
		return "rotate 180"
	case Transpose:
		return "transpose"
	case Rotate90:
		return "rotate 90"
	case Rotate270:
		return "rotate 270"
	case AntiTranspose:
		return "anti-transpose"
	}
	return fmt.Sprintf("Symmetry(%d)", uint8(s))
}

// SwapsAxes reports whether s exchanges the x and y axes.
func (s Symmetry) SwapsAxes() bool { return s >= Transpose && s <= AntiTranspose }

// Apply maps the point (x, y) by s.
func (s Symmetry) Apply(x, y int64) (int64, int64) {
	switch s {
	case MirrorX:
		return -x, y
	case MirrorY:
		return x, -y
	case Rotate180:
		return -x, -y
	case Transpose:
		return y, x
	case Rotate90:
		return -y, x
	case Rotate270:
		return y, -x
	case AntiTranspose:
		return -y, -x
	}
	return x, y
}

// inverse is the symmetry that undoes s.
func (s Symmetry) inverse() Symmetry {
	switch s {
	case Rotate90:
		return Rotate270
	case Rotate270:
		return Rotate90
	}
	return s
}

// Orient chooses the symmetry of a drawing under which the most edges not
// on a cycle (onCycle, as OnCycles gives it) point along d, as Count
// counts them, and returns it with the counts it gives. Ties go to the
// earlier in Symmetries, so the identity stays unless another does
// strictly better.
//
// Every symmetry keeps a straight-line drawing free of crossings, and the
// mirror images (those that keep the axes) also keep node boxes, which
// are symmetric about their centres, clear of each other and of the
// edges. One that swaps the axes moves centres but not box sides (a box
// stays as wide as it was), so it is taken only when swapOK reports that
// the drawing with its axes swapped stays clear; the four that swap the
// axes differ by mirror images, so one answer holds for all of them.
// swapOK is called at most once, and only when swapping would point
// more edges along d; nil means never swap.
func Orient[T Coord](edges [][2]int32, onCycle []bool, x, y []T, d Direction, swapOK func() bool) (Symmetry, Counts, error) {
	if len(onCycle) != len(edges) || len(x) != len(y) {
		return Identity, Counts{}, fmt.Errorf("flow: %d cycle flags for %d edges, %d x for %d y", len(onCycle), len(edges), len(x), len(y))
	}
	// ahead[i] counts the edges whose head lies strictly further than
	// their tail along axis direction i: +x, -x, +y, -y.
	var ahead [4]int
	acyclic, cycles := 0, 0
	for i, e := range edges {
		if e[0] < 0 || e[1] < 0 || int(e[0]) >= len(x) || int(e[1]) >= len(x) {
			return Identity, Counts{}, fmt.Errorf("flow: edge %d (%d, %d) outside nodes 0..%d", i, e[0], e[1], len(x)-1)
		}
		if onCycle[i] {
			cycles++
			continue
		}
		acyclic++
		t, h := e[0], e[1]
		switch {
		case x[h] > x[t]:
			ahead[0]++
		case x[h] < x[t]:
			ahead[1]++
		}
		switch {
		case y[h] > y[t]:
			ahead[2]++
		case y[h] < y[t]:
			ahead[3]++
		}
	}
	// An edge points along d in the drawing mapped by s when its own
	// direction has a positive component along s's inverse image of d's
	// axis: a . S(v) = (S^-1 a) . v for a signed permutation S.
	along := func(s Symmetry) int {
		ax, ay := d.Axis()
		ux, uy := s.inverse().Apply(int64(ax), int64(ay))
		switch {
		case ux > 0:
			return ahead[0]
		case ux < 0:
			return ahead[1]
		case uy > 0:
			return ahead[2]
		}
		return ahead[3]
	}
	best, bestAlong := Identity, -1
	swapAsked, swapFine := false, false
	for _, s := range Symmetries {
		a := along(s)
		if a <= bestAlong {
			continue
		}
		if s.SwapsAxes() {
			if !swapAsked {
				swapAsked = true
				swapFine = swapOK != nil && swapOK()
			}
			if !swapFine {
				continue
			}
		}
		best, bestAlong = s, a
	}
	return best, Counts{Along: bestAlong, Against: acyclic - bestAlong, OnCycles: cycles}, nil
}
