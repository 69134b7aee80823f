package main

import (
	"math"
	"strconv"
	"strings"
	"unicode/utf8"

	"github.com/gridwood/gridwood/dotio"
	"github.com/gridwood/gridwood/place"
)

// Node box rule (README, "Spacing"): a node's box is its width and height
// attributes (inches; DOT's defaults 0.75 and 0.5, from memory of its
// documentation), grown to hold its label unless fixedsize=true. A label
// line is estimated at 0.6 em per character and 1.2 em per line (common
// practice for proportional fonts), with 8 points of padding on each side
// across and 4 above and below; fontsize defaults to 14 points. Circles
// are as wide as they are tall. Boxes keep a quarter inch clear.
const (
	boxGap        = 18 // points
	labelPadX     = 16 // points, both sides together
	labelPadY     = 8
	defaultFont   = 14.0
	charWidthEm   = 0.6
	lineHeightEm  = 1.2
	pointsPerInch = 72
)

// maxBoxSide is the largest box side, in points: 1000 inches, the bound
// the box rule puts on width and height (sizeTaken), which a long label
// could otherwise pass; it keeps every coordinate the spacing checks well
// inside the range where they are exact.
const maxBoxSide = 1000 * pointsPerInch

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
	for i, n := range g.Nodes {
		w := attrInches(n.Attrs.Width, defaultWidth) * pointsPerInch
		h := attrInches(n.Attrs.Height, defaultHeight) * pointsPerInch
		shape := strings.ToLower(n.Attrs.Shape)
		if shape == "point" {
			w, h = min(w, 0.05*pointsPerInch), min(h, 0.05*pointsPerInch)
		} else if !strings.EqualFold(n.Attrs.FixedSize, "true") {
			tw, th := labelSize(n, g)
			w, h = max(w, tw+labelPadX), max(h, th+labelPadY)
		}
		switch shape {
		case "circle", "doublecircle", "point":
			w = max(w, h)
			h = w
		}
		if w > maxBoxSide || h > maxBoxSide {
			w, h = min(w, maxBoxSide), min(h, maxBoxSide)
			if caps.count == 0 {
				caps.first = i
			}
			caps.count++
		}
		b.HalfW[i] = int64(math.Ceil(w / 2))
		b.HalfH[i] = int64(math.Ceil(h / 2))
	}
	return b, caps
}

func attrInches(s string, def float64) float64 {
	if sizeTaken(s) {
		v, _ := strconv.ParseFloat(strings.TrimSpace(s), 64)
		return v
	}
	return def
}

// sizeTaken reports whether a width, height or fontsize value is used as
// given: a number from 0 up to, not including, 1000 (inches or points). The
// others fall back to the default (and the command says so, warnSizes):
// bigger ones would make absurd drawings.
func sizeTaken(s string) bool {
	v, err := strconv.ParseFloat(strings.TrimSpace(s), 64)
	return err == nil && v >= 0 && v < 1000
}

// labelSize estimates the label's text extent in points, from the same
// lines the SVG preview shows (nodeLabel: escapes, HTML tags and entities
// resolved).
func labelSize(n dotio.Node, g *dotio.Graph) (float64, float64) {
	font := defaultFont
	if sizeTaken(n.Attrs.FontSize) {
		if v, _ := strconv.ParseFloat(strings.TrimSpace(n.Attrs.FontSize), 64); v > 0 {
			font = v
		}
	}
	lines := nodeLabel(n, g)
	widest := 0
	for _, l := range lines {
		widest = max(widest, utf8.RuneCountInString(l))
	}
	return float64(widest) * charWidthEm * font, float64(len(lines)) * lineHeightEm * font
}
