package nodesize

import (
	"math"
	"strconv"
	"strings"

	"github.com/gridwood/gridwood/dotio"
)

// Sizes and defaults of the DOT language (from memory of its
// documentation; SOURCES.md), and our own where it is silent.
const (
	PointsPerInch   = 72
	DefaultWidth    = 0.75 // inches
	DefaultHeight   = 0.5
	PointSize       = 0.05 // inches, shape=point
	DefaultFontSize = 14.0 // points
	// DefaultMarginX and DefaultMarginY are the room left and right, and
	// above and below, a label (points): DOT's 0.11 x 0.055 inch, rounded
	// to the whole points the layout has always used.
	DefaultMarginX = 8.0
	DefaultMarginY = 4.0
	// PeripheryGap is the room between two outlines (points; from memory).
	PeripheryGap = 4.0
	// MaxSide caps every side of a node's box (points): 1000 inches.
	MaxSide = 1000 * PointsPerInch
	// maxPeripheries bounds the rings drawn and sized for.
	maxPeripheries = 100
)

// NodeKeys are the node attributes the box rule reads.
var NodeKeys = []string{"label", "shape", "width", "height", "fixedsize", "fontsize", "margin", "peripheries"}

// SizeTaken reports whether a width, height or fontsize value is used as
// given: a number from 0 up to, not including, 1000 (inches or points).
// Others count as unset (the command says so): bigger ones would make
// absurd drawings.
func SizeTaken(s string) bool {
	v, err := strconv.ParseFloat(strings.TrimSpace(s), 64)
	return err == nil && v >= 0 && v < 1000
}

// Sizer computes the boxes and labels of one graph's nodes and edges.
type Sizer struct {
	g        *dotio.Graph
	nodes    *dotio.AttrTable
	edges    *dotio.AttrTable
	graph    string // the graph's name, for \G
	vertical bool   // rankdir LR or RL: records start down
}

// New returns a Sizer for g. It reads g's node attributes once.
func New(g *dotio.Graph) *Sizer {
	s := &Sizer{g: g, nodes: g.NodeTable(NodeKeys...)}
	s.graph = PlainName(g.Name, strings.HasPrefix(g.ID, "<"))
	for _, a := range g.GraphAttrs() {
		if a.Name() == "rankdir" {
			v, _ := a.Text()
			switch strings.ToUpper(strings.TrimSpace(v)) {
			case "LR", "RL":
				s.vertical = true
			default:
				s.vertical = false
			}
		}
	}
	return s
}

// Node is the size of a node and its laid-out label.
type Node struct {
	// Shape is the catalog's shape; nil when the node has no shape (our
	// own look) or one the catalog lacks (ShapeName says which).
	Shape     *Shape
	ShapeName string // as written, "" if unset
	// W and H are the box the layout keeps clear (points): the outline
	// and, with fixedsize=shape, the label too; at most MaxSide.
	W, H float64
	// ShapeW and ShapeH are the outermost outline's size (points).
	ShapeW, ShapeH float64
	// Peripheries is the number of outlines (0: none drawn).
	Peripheries int
	// ExactW and ExactH, when set, are the width or height attribute (in
	// inches, as written, or DOT's default) that W or H equals exactly,
	// for exact checks.
	ExactW, ExactH string
	// Capped: the label needed a side over MaxSide.
	Capped bool
	// Label is what the node shows; nil for a point.
	Label *Label
	// MarginX and MarginY are the room around the label (points).
	MarginX, MarginY float64
}

// attr returns the text of node v's attribute key and whether it is set.
func (s *Sizer) attr(v int, key string) (string, bool, bool) {
	a, ok := s.nodes.Get(v, key)
	if !ok {
		return "", false, false
	}
	t, html := a.Text()
	return t, html, true
}

// inches reads a size in inches; ok is false when unset or not taken.
func inches(text string, set bool) (float64, bool) {
	if !set || !SizeTaken(text) {
		return 0, false
	}
	v, _ := strconv.ParseFloat(strings.TrimSpace(text), 64)
	return v, true
}

// FontSize reads a fontsize value: DefaultFontSize unless a size above 0
// is taken.
func FontSize(text string, set bool) float64 {
	if set && SizeTaken(text) {
		if v, _ := strconv.ParseFloat(strings.TrimSpace(text), 64); v > 0 {
			return v
		}
	}
	return DefaultFontSize
}

// Margin reads a margin value "x" or "x,y" in inches into points; the
// defaults where it is unset or not a size.
func Margin(text string, set bool) (mx, my float64) {
	mx, my = DefaultMarginX, DefaultMarginY
	if !set {
		return mx, my
	}
	xs, ys, two := strings.Cut(text, ",")
	if x, ok := inches(xs, true); ok {
		mx, my = x*PointsPerInch, x*PointsPerInch
	}
	if two {
		if y, ok := inches(ys, true); ok {
			my = y * PointsPerInch
		}
	}
	return mx, my
}

// Bool reads a DOT boolean: true, yes (any case) or a non-zero integer.
func Bool(text string) bool {
	t := strings.ToLower(strings.TrimSpace(text))
	if t == "true" || t == "yes" {
		return true
	}
	n, err := strconv.Atoi(t)
	return err == nil && n != 0
}

// Node computes node v's box and label.
func (s *Sizer) Node(v int) Node {
	n := s.g.Nodes[v]
	var out Node
	shapeText, _, _ := s.attr(v, "shape")
	out.ShapeName = strings.TrimSpace(shapeText)
	shape, known := LookupShape(out.ShapeName)
	if known {
		out.Shape = shape
	}
	name := shapeName(shape, known)

	wText, _, wSet := s.attr(v, "width")
	hText, _, hSet := s.attr(v, "height")
	w0, wOK := inches(wText, wSet)
	h0, hOK := inches(hText, hSet)
	exactW, exactH := strings.TrimSpace(wText), strings.TrimSpace(hText)
	if !wOK {
		w0, exactW = DefaultWidth, "0.75"
	}
	if !hOK {
		h0, exactH = DefaultHeight, "0.5"
	}
	fsText, _, fsSet := s.attr(v, "fontsize")
	font := FontSize(fsText, fsSet)
	mText, _, mSet := s.attr(v, "margin")
	out.MarginX, out.MarginY = Margin(mText, mSet)
	fixedText, _, _ := s.attr(v, "fixedsize")
	fixed := Bool(fixedText)
	fixedShape := strings.EqualFold(strings.TrimSpace(fixedText), "shape")

	out.Peripheries = 1
	if known {
		out.Peripheries = shape.Peripheries
	}
	if pText, _, pSet := s.attr(v, "peripheries"); pSet {
		if p, err := strconv.Atoi(strings.TrimSpace(pText)); err == nil && p >= 0 {
			out.Peripheries = min(p, maxPeripheries)
		}
	}

	switch name {
	case "point":
		w0, h0, exactW, exactH = regularSide(w0, wOK, wText, h0, hOK, hText, PointSize, "0.05")
		fixed = true
	case "plain":
		// plain is plaintext with no size and no margin of its own.
		if !wOK {
			w0, exactW = 0, "0"
		}
		if !hOK {
			h0, exactH = 0, "0"
		}
		out.MarginX, out.MarginY = 0, 0
	}
	regular := known && shape.Regular
	if regular && name != "point" {
		w0, h0, exactW, exactH = regularSide(w0, wOK, wText, h0, hOK, hText, min(DefaultWidth, DefaultHeight), "0.5")
	}
	sw, sh := w0*PointsPerInch, h0*PointsPerInch

	// The label and the room it needs inside the outline.
	var cw, ch float64
	if name != "point" {
		out.Label = s.nodeLabel(v, n, shape, known, font, out.MarginX, out.MarginY)
		if !out.Label.Empty() {
			cw, ch = out.Label.W, out.Label.H
			if out.Label.Record == nil {
				cw += 2 * out.MarginX
				ch += 2 * out.MarginY
			}
		}
	}
	// The outline that holds the label, with its extra rings.
	ring := 2 * PeripheryGap * float64(max(out.Peripheries-1, 0))
	var needW, needH float64
	if cw > 0 || ch > 0 {
		fit := shapeOrBox(shape, known)
		if regular {
			needW = fit.fitRegular(cw, ch)
			needH = needW
		} else {
			needH = ch * fit.fitScale()
			needW = fit.fitWidth(cw, ch, max(needH, sh-ring))
		}
		needW += ring
		needH += ring
	}
	switch {
	case fixed && !fixedShape:
		out.ShapeW, out.ShapeH = sw, sh
		out.W, out.H = sw, sh
	case fixedShape:
		out.ShapeW, out.ShapeH = sw, sh
		out.W, out.H = max(sw, cw), max(sh, ch)
	default:
		out.ShapeW, out.ShapeH = max(sw, needW), max(sh, needH)
		if regular {
			out.ShapeW = max(out.ShapeW, out.ShapeH)
			out.ShapeH = out.ShapeW
		}
		out.W, out.H = out.ShapeW, out.ShapeH
	}
	if out.W != sw {
		exactW = ""
	}
	if out.H != sh {
		exactH = ""
	}
	out.ExactW, out.ExactH = exactW, exactH
	if out.W > MaxSide || out.H > MaxSide || math.IsInf(out.W, 0) || math.IsInf(out.H, 0) {
		out.W, out.H = min(out.W, MaxSide), min(out.H, MaxSide)
		out.ShapeW, out.ShapeH = min(out.ShapeW, MaxSide), min(out.ShapeH, MaxSide)
		out.Capped = true
	}
	if out.Label != nil && out.Label.Record != nil {
		out.Label.Record.place(0, 0, out.ShapeW, out.ShapeH)
	}
	return out
}

// regularSide is the side of a regular shape (inches): the width alone,
// the height alone, or the larger of the two when both are given, else
// def; with the attribute text that gives it.
func regularSide(w float64, wOK bool, wText string, h float64, hOK bool, hText string, def float64, defText string) (float64, float64, string, string) {
	switch {
	case wOK && hOK && h > w:
		return h, h, strings.TrimSpace(hText), strings.TrimSpace(hText)
	case wOK:
		return w, w, strings.TrimSpace(wText), strings.TrimSpace(wText)
	case hOK:
		return h, h, strings.TrimSpace(hText), strings.TrimSpace(hText)
	}
	return def, def, defText, defText
}

// shapeName is the catalog name of a known shape in lower case, "" for
// our own look.
func shapeName(s *Shape, known bool) string {
	if !known {
		return ""
	}
	return strings.ToLower(s.Name)
}

// ownLook is the box a node without a known shape is sized as.
var ownLook = shapes["box"]

func shapeOrBox(s *Shape, known bool) *Shape {
	if known {
		return s
	}
	return ownLook
}

// nodeLabel lays out node v's label.
func (s *Sizer) nodeLabel(v int, n dotio.Node, shape *Shape, known bool, font, mx, my float64) *Label {
	text, html, set := s.attr(v, "label")
	if !set {
		text, html = `\N`, false
	}
	esc := Escapes{N: PlainName(n.Name, strings.HasPrefix(n.ID, "<")), G: s.graph, HasN: true}
	if known && shape.Kind == Record && !html {
		var ns notes
		f := parseRecord(text, s.vertical, esc, font, &ns)
		f.measureRecord(mx, my)
		return &Label{W: f.minW, H: f.minH, FontSize: font, Record: f, Notes: ns}
	}
	return Layout(text, html, font, esc)
}

// Layout lays out a label that is not a record's: an HTML-like label
// (html set, text in its angle brackets) or plain text with DOT's
// escapes, at the given font size.
func Layout(text string, html bool, font float64, esc Escapes) *Label {
	if html && isHTML(text) {
		return htmlLabel(text[1:len(text)-1], font)
	}
	l := &Label{FontSize: font, Lines: TextLines(text, esc, font)}
	l.W, l.H = measure(l.Lines, font)
	return l
}

// EdgeKeys are the edge attributes EdgeLabel reads.
var EdgeKeys = []string{"label", "fontsize"}

// EdgeLabel lays out edge i's label (nil when it has none).
func (s *Sizer) EdgeLabel(i int) *Label {
	if s.edges == nil {
		s.edges = s.g.EdgeTable(EdgeKeys...)
	}
	a, ok := s.edges.Get(i, "label")
	if !ok {
		return nil
	}
	text, html := a.Text()
	fs, fsSet := s.edges.Get(i, "fontsize")
	fsText, _ := fs.Text()
	font := FontSize(fsText, fsSet)
	e := s.g.Edges[i]
	tail, head := s.g.Nodes[e.From], s.g.Nodes[e.To]
	esc := Escapes{
		G: s.graph, HasE: true,
		T: PlainName(tail.Name, strings.HasPrefix(tail.ID, "<")),
		H: PlainName(head.Name, strings.HasPrefix(head.ID, "<")),
	}
	op := " -- "
	if s.g.Directed {
		op = " -> "
	}
	esc.E = esc.T + op + esc.H
	return Layout(text, html, font, esc)
}

// EdgeLabelHalves returns, per edge, half the width and half the height
// (points) of its label's box: the text or table alone, no margin (0, 0
// when it has none or an empty one). For making room for edge labels in
// a layout.
func EdgeLabelHalves(g *dotio.Graph) (halfW, halfH []float64) {
	s := New(g)
	halfW, halfH = make([]float64, len(g.Edges)), make([]float64, len(g.Edges))
	for i := range g.Edges {
		if l := s.EdgeLabel(i); !l.Empty() {
			halfW[i], halfH[i] = min(l.W, MaxSide)/2, min(l.H, MaxSide)/2
		}
	}
	return halfW, halfH
}
