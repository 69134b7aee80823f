package main

import (
	"math"

	"github.com/gridwood/gridwood/dotio"
	"github.com/gridwood/gridwood/dotio/nodesize"
	"github.com/gridwood/gridwood/place"
)

// Node boxes come from package nodesize (README, "Node boxes"): the DOT
// attribute rules for width, height, shape, label, fixedsize, fontsize,
// margin and peripheries. Boxes keep a quarter inch clear.
const boxGap = 18 // points

// maxBoxSide is the largest box side, in points: 1000 inches, the bound
// the box rule puts on width and height (sizeTaken), which a long label
// could otherwise pass; it keeps every coordinate the spacing checks well
// inside the range where they are exact.
const maxBoxSide = nodesize.MaxSide

// boxCaps counts the nodes whose label needed a box side over maxBoxSide
// and names the first (-1 if none).
type boxCaps struct{ count, first int }

// nodeBoxes computes the half sizes, in points, of every node's box.
func nodeBoxes(g *dotio.Graph) place.Boxes {
	b, _ := cappedNodeBoxes(g)
	return b
}

// cappedNodeBoxes is nodeBoxes, also saying which boxes were capped at
// maxBoxSide.
func cappedNodeBoxes(g *dotio.Graph) (place.Boxes, boxCaps) {
	caps := boxCaps{first: -1}
	b := place.Boxes{HalfW: make([]int64, len(g.Nodes)), HalfH: make([]int64, len(g.Nodes)), Gap: boxGap}
	s := nodesize.New(g)
	for i := range g.Nodes {
		n := s.Node(i)
		if n.Capped {
			if caps.count == 0 {
				caps.first = i
			}
			caps.count++
		}
		b.HalfW[i] = int64(math.Ceil(n.W / 2))
		b.HalfH[i] = int64(math.Ceil(n.H / 2))
	}
	return b, caps
}

// sizeTaken reports whether a width, height or fontsize value is used as
// given (nodesize.SizeTaken); warnSizes names the others.
func sizeTaken(s string) bool { return nodesize.SizeTaken(s) }
