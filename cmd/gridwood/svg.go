package main

import (
	"bufio"
	"cmp"
	"encoding/xml"
	"fmt"
	"html"
	"io"
	"math"
	"slices"
	"strconv"
	"strings"
	"unicode/utf8"

	"github.com/gridwood/gridwood/dotio"
	"github.com/gridwood/gridwood/place"
)

// svgGraph is one laid-out graph to draw.
type svgGraph struct {
	g     *dotio.Graph
	lay   dotio.Layout // positions in points, y up; Removed marks set-aside edges
	boxes place.Boxes  // the node boxes the layout spaced for
}

// The preview's own look: warm paper, slate nodes with rounded corners and
// cream text, teal edges, set-aside edges in a thin dashed rust curve beneath
// everything, ochre badges for repeated edges.
const (
	svgPaper      = "#f3ead8" // background
	svgInk        = "#6b4e37" // graph titles
	svgNodeFill   = "#3e4c5c" // node shapes
	svgNodeStroke = "#26303b"
	svgNodeText   = "#f7f0e1" // labels, on the slate
	svgEdge       = "#1b8078" // kept edges and their arrowheads
	svgRemoved    = "#b5542c" // set-aside edges, dashed
	svgBadgeFill  = "#d8a23e" // repeated-edge count badges
	svgBadgeText  = "#2a2118"
	svgFont       = "Verdana, 'DejaVu Sans', sans-serif" // generic fallback: nothing is fetched
)

// Sizes in points (1 SVG unit = 1 point).
const (
	svgPad        = 16.0 // around the document and between graphs
	svgTitleSize  = 13.0
	svgTitleGap   = 8.0 // between a title's baseline and its drawing
	svgLabelSize  = 12.0
	svgMinLabel   = 6.0
	svgCharWidth  = 0.6 // estimated advance of a character, in ems, to fit labels
	svgCorner     = 6.0 // node corner radius, at most a quarter of the box
	svgArrowLen   = 9.0
	svgArrowHalf  = 3.6
	svgBadgeR     = 6.5
	svgBadgeFont  = 8.0
	svgEdgeWidth  = "1.75"
	svgRemovedW   = "1"
	svgRemovedDsh = "5 3.5"
)

// writeSVG writes one self-contained SVG document (no external fonts,
// scripts or images) showing all graphs, stacked top to bottom with a small
// title (the graph's ID) above each.
//
// Nodes are boxes sized by their width and height (inches; DOT's defaults
// 0.75 x 0.5 when absent or not a number): ellipses for the round DOT
// shapes (circle, doublecircle, ellipse, oval, point, egg), rounded
// rectangles otherwise. A node shows its label, or its name when the label
// is unset or "\N"; HTML labels and names show their text without tags.
// Labels are shrunk (down to 6 points) to fit the box width.
//
// Edges are straight segments between node centres. Edges joining the same
// two nodes are drawn once, with an ochre badge at the midpoint giving
// their number; in a digraph the segment gets an arrowhead at each end that
// is some copy's head. Loops are drawn once as a three-quarter circle
// around the node's upper right corner (with a badge when repeated).
// Arrowheads touch the head's box. Set-aside edges (lay.Removed) are drawn
// first, thin, dashed and in rust, bowed off the straight line (see bend),
// so that every kept edge and node lies above them and they still show;
// a pair with kept and set-aside copies is drawn in both styles.
//
// DOT's y axis points up and SVG's down: each graph is flipped inside its
// own panel. The output depends only on the input.
func writeSVG(w io.Writer, graphs []svgGraph) error {
	panels := make([]svgPanel, len(graphs))
	width, height := 0.0, svgPad
	for i, sg := range graphs {
		p, err := newSVGPanel(sg, i)
		if err != nil {
			return err
		}
		p.top = height + svgTitleSize + svgTitleGap
		height = p.top + (p.maxY - p.minY) + svgPad
		width = max(width, p.maxX-p.minX, textWidth(p.title, svgTitleSize))
		panels[i] = p
	}
	width += 2 * svgPad
	if len(graphs) == 0 {
		height = 2 * svgPad
	}
	bw := bufio.NewWriter(w)
	W, H := num(math.Ceil(width)), num(math.Ceil(height))
	fmt.Fprintf(bw, "<?xml version=\"1.0\" encoding=\"UTF-8\"?>\n")
	fmt.Fprintf(bw, "<svg xmlns=\"http://www.w3.org/2000/svg\" version=\"1.1\" width=\"%s\" height=\"%s\" viewBox=\"0 0 %s %s\" font-family=\"%s\">\n", W, H, W, H, svgFont)
	fmt.Fprintf(bw, "<rect class=\"paper\" x=\"0\" y=\"0\" width=\"%s\" height=\"%s\" fill=\"%s\"/>\n", W, H, svgPaper)
	for i := range panels {
		panels[i].write(bw)
	}
	fmt.Fprintf(bw, "</svg>\n")
	return bw.Flush()
}

// svgNode is a node's box in DOT coordinates (points, y up).
type svgNode struct {
	x, y, hw, hh float64
	round        bool
	label        []string // lines
	name         string   // for the tooltip
}

// svgLink is one drawn segment or loop: all edges with the same two ends
// and the same set-aside state.
type svgLink struct {
	u, v      int32 // u <= v
	removed   bool
	count     int
	headU     bool // some copy is directed into u
	headV     bool
	firstEdge int // for a deterministic order: input order of first copy
}

type svgPanel struct {
	title                  string
	directed               bool
	nodes                  []svgNode
	links                  []svgLink
	minX, minY, maxX, maxY float64 // extent in DOT coordinates
	top                    float64 // document y of maxY
}

func newSVGPanel(sg svgGraph, index int) (svgPanel, error) {
	g, lay := sg.g, sg.lay
	if g == nil {
		return svgPanel{}, fmt.Errorf("svg: graph %d is missing", index+1)
	}
	if len(lay.X) != len(g.Nodes) || len(lay.Y) != len(g.Nodes) {
		return svgPanel{}, fmt.Errorf("svg: graph %d: %d x and %d y positions for %d nodes", index+1, len(lay.X), len(lay.Y), len(g.Nodes))
	}
	if lay.Removed != nil && len(lay.Removed) != len(g.Edges) {
		return svgPanel{}, fmt.Errorf("svg: graph %d: %d set-aside flags for %d edges", index+1, len(lay.Removed), len(g.Edges))
	}
	p := svgPanel{title: svgTitle(g, index), directed: g.Directed, nodes: make([]svgNode, len(g.Nodes))}
	boxes := sg.boxes
	if len(boxes.HalfW) != len(g.Nodes) || len(boxes.HalfH) != len(g.Nodes) {
		return svgPanel{}, fmt.Errorf("svg: graph %d: %d node boxes for %d nodes", index+1, len(boxes.HalfW), len(g.Nodes))
	}
	p.minX, p.minY = float64(min(lay.BB[0], lay.BB[2])), float64(min(lay.BB[1], lay.BB[3]))
	p.maxX, p.maxY = float64(max(lay.BB[0], lay.BB[2])), float64(max(lay.BB[1], lay.BB[3]))
	if len(g.Nodes) > 0 && lay.BB == [4]int64{} {
		p.minX, p.minY = math.Inf(1), math.Inf(1)
		p.maxX, p.maxY = math.Inf(-1), math.Inf(-1)
	}
	for v, n := range g.Nodes {
		sn := svgNode{
			x:     float64(lay.X[v]),
			y:     float64(lay.Y[v]),
			hw:    float64(boxes.HalfW[v]),
			hh:    float64(boxes.HalfH[v]),
			round: roundShape(n.Attrs.Shape),
			label: nodeLabel(n, g),
			name:  plainName(n.Name),
		}
		p.nodes[v] = sn
		p.extend(sn.x-sn.hw, sn.y-sn.hh)
		p.extend(sn.x+sn.hw, sn.y+sn.hh)
	}
	p.links = svgLinks(g, lay.Removed)
	for _, l := range p.links {
		if l.u == l.v {
			n := p.nodes[l.u]
			r := loopRadius(n)
			p.extend(n.x+n.hw+r, n.y+n.hh+r)
		}
	}
	if math.IsInf(p.minX, 0) {
		p.minX, p.minY, p.maxX, p.maxY = 0, 0, 0, 0
	}
	return p, nil
}

func (p *svgPanel) extend(x, y float64) {
	p.minX, p.maxX = min(p.minX, x), max(p.maxX, x)
	p.minY, p.maxY = min(p.minY, y), max(p.maxY, y)
}

// svgLinks groups the edges by unordered pair of ends and set-aside state,
// in order of first appearance.
func svgLinks(g *dotio.Graph, removed []bool) []svgLink {
	type key struct {
		u, v    int32
		removed bool
	}
	order := make([]int, len(g.Edges))
	for i := range order {
		order[i] = i
	}
	keyOf := func(i int) key {
		e := g.Edges[i]
		return key{min(e.From, e.To), max(e.From, e.To), removed != nil && removed[i]}
	}
	cmpKey := func(a, b key) int {
		if c := cmp.Compare(a.u, b.u); c != 0 {
			return c
		}
		if c := cmp.Compare(a.v, b.v); c != 0 {
			return c
		}
		if a.removed == b.removed {
			return 0
		}
		if a.removed {
			return 1
		}
		return -1
	}
	slices.SortStableFunc(order, func(a, b int) int { return cmpKey(keyOf(a), keyOf(b)) })
	var links []svgLink
	for j, i := range order {
		k := keyOf(i)
		if j == 0 || cmpKey(keyOf(order[j-1]), k) != 0 {
			links = append(links, svgLink{u: k.u, v: k.v, removed: k.removed, firstEdge: i})
		}
		l := &links[len(links)-1]
		l.count++
		if g.Directed {
			if g.Edges[i].To == k.u {
				l.headU = true
			} else {
				l.headV = true
			}
		}
	}
	slices.SortFunc(links, func(a, b svgLink) int { return cmp.Compare(a.firstEdge, b.firstEdge) })
	return links
}

// sx and sy map DOT coordinates to document coordinates.
func (p *svgPanel) sx(x float64) float64 { return svgPad + x - p.minX }
func (p *svgPanel) sy(y float64) float64 { return p.top + p.maxY - y }

func (p *svgPanel) write(w *bufio.Writer) {
	fmt.Fprintf(w, "<g class=\"graph\">\n")
	fmt.Fprintf(w, "<text class=\"title\" x=\"%s\" y=\"%s\" font-size=\"%s\" font-weight=\"bold\" fill=\"%s\">", num(svgPad), num(p.top-svgTitleGap), num(svgTitleSize), svgInk)
	xmlText(w, p.title)
	fmt.Fprintf(w, "</text>\n")

	// Set-aside edges first, so that everything else lies above them.
	fmt.Fprintf(w, "<g class=\"removed-edges\" stroke=\"%s\" stroke-width=\"%s\" stroke-dasharray=\"%s\" fill=\"none\">\n", svgRemoved, svgRemovedW, svgRemovedDsh)
	p.writeLinks(w, true, "removed")
	fmt.Fprintf(w, "</g>\n")
	fmt.Fprintf(w, "<g class=\"removed-arrows\" fill=\"%s\" stroke=\"none\">\n", svgRemoved)
	p.writeArrows(w, true, "removed-arrow")
	fmt.Fprintf(w, "</g>\n")

	fmt.Fprintf(w, "<g class=\"edges\" stroke=\"%s\" stroke-width=\"%s\" stroke-linecap=\"round\" fill=\"none\">\n", svgEdge, svgEdgeWidth)
	p.writeLinks(w, false, "edge")
	fmt.Fprintf(w, "</g>\n")
	fmt.Fprintf(w, "<g class=\"arrows\" fill=\"%s\" stroke=\"none\">\n", svgEdge)
	p.writeArrows(w, false, "arrow")
	fmt.Fprintf(w, "</g>\n")

	fmt.Fprintf(w, "<g class=\"nodes\" fill=\"%s\" stroke=\"%s\" stroke-width=\"1.25\">\n", svgNodeFill, svgNodeStroke)
	for _, n := range p.nodes {
		cx, cy := p.sx(n.x), p.sy(n.y)
		if n.round {
			fmt.Fprintf(w, "<ellipse class=\"node\" cx=\"%s\" cy=\"%s\" rx=\"%s\" ry=\"%s\"><title>", num(cx), num(cy), num(n.hw), num(n.hh))
			xmlText(w, n.name)
			fmt.Fprintf(w, "</title></ellipse>\n")
			continue
		}
		r := min(svgCorner, n.hw/2, n.hh/2)
		fmt.Fprintf(w, "<rect class=\"node\" x=\"%s\" y=\"%s\" width=\"%s\" height=\"%s\" rx=\"%s\" ry=\"%s\"><title>", num(cx-n.hw), num(cy-n.hh), num(2*n.hw), num(2*n.hh), num(r), num(r))
		xmlText(w, n.name)
		fmt.Fprintf(w, "</title></rect>\n")
	}
	fmt.Fprintf(w, "</g>\n")

	fmt.Fprintf(w, "<g class=\"labels\" fill=\"%s\" text-anchor=\"middle\">\n", svgNodeText)
	for _, n := range p.nodes {
		p.writeLabel(w, n)
	}
	fmt.Fprintf(w, "</g>\n")

	fmt.Fprintf(w, "<g class=\"badges\" text-anchor=\"middle\" font-size=\"%s\" font-weight=\"bold\">\n", num(svgBadgeFont))
	for _, l := range p.links {
		if l.count < 2 {
			continue
		}
		x, y := p.badgeAt(l)
		fill := svgBadgeFill
		if l.removed {
			fill = svgRemoved
		}
		fmt.Fprintf(w, "<circle class=\"badge\" cx=\"%s\" cy=\"%s\" r=\"%s\" fill=\"%s\" stroke=\"%s\" stroke-width=\"0.75\"/>", num(x), num(y), num(svgBadgeR), fill, svgPaper)
		fmt.Fprintf(w, "<text class=\"count\" x=\"%s\" y=\"%s\" fill=\"%s\">%d</text>\n", num(x), num(y+svgBadgeFont*0.35), svgBadgeText, l.count)
	}
	fmt.Fprintf(w, "</g>\n")
	fmt.Fprintf(w, "</g>\n")
}

// writeLinks draws the segments and loops of one style.
func (p *svgPanel) writeLinks(w *bufio.Writer, removed bool, class string) {
	for _, l := range p.links {
		if l.removed != removed {
			continue
		}
		a, b := p.nodes[l.u], p.nodes[l.v]
		if l.u == l.v {
			// Three quarters of a circle centred on the upper right corner,
			// from the top side to the right side, outside the box.
			r := loopRadius(a)
			cx, cy := p.sx(a.x+a.hw), p.sy(a.y+a.hh)
			fmt.Fprintf(w, "<path class=\"%s loop\" d=\"M %s %s A %s %s 0 1 1 %s %s\"/>\n", class, num(cx-r), num(cy), num(r), num(r), num(cx), num(cy+r))
			continue
		}
		if removed {
			cx, cy := p.bend(l)
			fmt.Fprintf(w, "<path class=\"%s\" d=\"M %s %s Q %s %s %s %s\"/>\n", class, num(p.sx(a.x)), num(p.sy(a.y)), num(cx), num(cy), num(p.sx(b.x)), num(p.sy(b.y)))
			continue
		}
		fmt.Fprintf(w, "<line class=\"%s\" x1=\"%s\" y1=\"%s\" x2=\"%s\" y2=\"%s\"/>\n", class, num(p.sx(a.x)), num(p.sy(a.y)), num(p.sx(b.x)), num(p.sy(b.y)))
	}
}

// svgBow is how far a set-aside edge's control point lies off the straight
// line, as a fraction of its length: the curve's middle is half that off
// (a tenth of the length), so that it shows even where the straight
// segment would run under kept edges and boxes (three nearly collinear
// nodes of K5 hid the set-aside edge between the outer two entirely).
const svgBow = 0.2

// bend is the control point, in document coordinates, of the quadratic
// curve a set-aside edge is drawn as: off its middle, to the left of the
// way from its first node to its second.
func (p *svgPanel) bend(l svgLink) (float64, float64) {
	a, b := p.nodes[l.u], p.nodes[l.v]
	ax, ay, bx, by := p.sx(a.x), p.sy(a.y), p.sx(b.x), p.sy(b.y)
	return (ax+bx)/2 + svgBow*(by-ay), (ay+by)/2 - svgBow*(bx-ax)
}

// writeArrows draws the arrowheads of one style, in document coordinates.
func (p *svgPanel) writeArrows(w *bufio.Writer, removed bool, class string) {
	if !p.directed {
		return
	}
	for _, l := range p.links {
		if l.removed != removed {
			continue
		}
		if l.u == l.v {
			// The loop ends on the right side heading left, into the box.
			n := p.nodes[l.u]
			r := loopRadius(n)
			tipX, tipY := p.sx(n.x+n.hw), p.sy(n.y+n.hh)+r
			writeArrow(w, class, tipX, tipY, -1, 0)
			continue
		}
		for _, end := range [2]struct {
			head, tail int32
			on         bool
		}{{l.u, l.v, l.headU}, {l.v, l.u, l.headV}} {
			if !end.on {
				continue
			}
			h, t := p.nodes[end.head], p.nodes[end.tail]
			dx, dy := p.sx(h.x)-p.sx(t.x), p.sy(h.y)-p.sy(t.y) // tail to head
			if removed {
				// Along the curve's tangent at the head: from the
				// control point.
				cx, cy := p.bend(l)
				dx, dy = p.sx(h.x)-cx, p.sy(h.y)-cy
			}
			d := math.Hypot(dx, dy)
			if d == 0 {
				continue
			}
			ux, uy := dx/d, dy/d
			s := boundary(h, ux, uy) // distance from the head's centre to its box
			if s >= d {
				continue // the tail lies inside the head's box
			}
			writeArrow(w, class, p.sx(h.x)-ux*s, p.sy(h.y)-uy*s, ux, uy)
		}
	}
}

// writeArrow draws a triangle with its tip at (x, y) pointing along the
// unit vector (ux, uy).
func writeArrow(w *bufio.Writer, class string, x, y, ux, uy float64) {
	bx, by := x-ux*svgArrowLen, y-uy*svgArrowLen
	px, py := -uy*svgArrowHalf, ux*svgArrowHalf
	fmt.Fprintf(w, "<polygon class=\"%s\" points=\"%s,%s %s,%s %s,%s\"/>\n", class, num(x), num(y), num(bx+px), num(by+py), num(bx-px), num(by-py))
}

// boundary returns the distance from a node's centre to its outline in
// direction (ux, uy), a unit vector.
func boundary(n svgNode, ux, uy float64) float64 {
	if n.hw == 0 || n.hh == 0 {
		return 0
	}
	if n.round {
		return 1 / math.Hypot(ux/n.hw, uy/n.hh)
	}
	s := math.Inf(1)
	if ux != 0 {
		s = n.hw / math.Abs(ux)
	}
	if uy != 0 {
		s = min(s, n.hh/math.Abs(uy))
	}
	return s
}

func loopRadius(n svgNode) float64 {
	return min(max(min(n.hw, n.hh)*0.5, 5), 12)
}

// badgeAt returns where a repeated edge's count goes, in document
// coordinates: the segment's midpoint, or the loop's outermost point.
func (p *svgPanel) badgeAt(l svgLink) (float64, float64) {
	a, b := p.nodes[l.u], p.nodes[l.v]
	if l.u == l.v {
		r := loopRadius(a) * math.Sqrt2 / 2
		return p.sx(a.x+a.hw) + r, p.sy(a.y+a.hh) - r
	}
	mx, my := (p.sx(a.x)+p.sx(b.x))/2, (p.sy(a.y)+p.sy(b.y))/2
	if l.removed {
		// The curve's middle: halfway to the control point.
		cx, cy := p.bend(l)
		return (mx + cx) / 2, (my + cy) / 2
	}
	return mx, my
}

func (p *svgPanel) writeLabel(w *bufio.Writer, n svgNode) {
	size := svgLabelSize
	longest := 0
	for _, line := range n.label {
		longest = max(longest, utf8.RuneCountInString(line))
	}
	if avail := 2*n.hw - 4; longest > 0 && textWidth(strings.Repeat("m", longest), size) > avail {
		size = max(svgMinLabel, avail/(float64(longest)*svgCharWidth))
	}
	size = math.Round(size*100) / 100
	lead := size * 1.2
	cx := p.sx(n.x)
	first := p.sy(n.y) - lead*float64(len(n.label)-1)/2 + size*0.35
	fmt.Fprintf(w, "<text class=\"label\" x=\"%s\" y=\"%s\" font-size=\"%s\">", num(cx), num(first), num(size))
	if len(n.label) == 1 {
		xmlText(w, n.label[0])
	} else {
		for i, line := range n.label {
			dy := "0"
			if i > 0 {
				dy = num(lead)
			}
			fmt.Fprintf(w, "<tspan x=\"%s\" dy=\"%s\">", num(cx), dy)
			xmlText(w, line)
			fmt.Fprintf(w, "</tspan>")
		}
	}
	fmt.Fprintf(w, "</text>\n")
}

// textWidth estimates the advance of s at the given size.
func textWidth(s string, size float64) float64 {
	return float64(utf8.RuneCountInString(s)) * svgCharWidth * size
}

func roundShape(shape string) bool {
	switch strings.ToLower(strings.TrimSpace(shape)) {
	case "circle", "doublecircle", "ellipse", "oval", "point", "egg":
		return true
	}
	return false
}

// nodeLabel returns the lines a node shows.
func nodeLabel(n dotio.Node, g *dotio.Graph) []string {
	// NodeAttrs cannot tell an explicit label="" from an unset label, so
	// both show the name. A quoted label that looks like HTML ("<b>") is
	// taken as HTML for the same reason.
	l := n.Attrs.Label
	switch {
	case l == "":
		return []string{plainName(n.Name)}
	case isHTML(l):
		return htmlLines(l[1 : len(l)-1])
	}
	return escLines(l, plainName(n.Name), plainName(unquoteID(g.ID)))
}

func isHTML(s string) bool { return len(s) >= 2 && s[0] == '<' && s[len(s)-1] == '>' }

// plainName is a node or graph name as text: HTML names without tags.
func plainName(name string) string {
	if isHTML(name) {
		return strings.Join(htmlLines(name[1:len(name)-1]), " ")
	}
	return name
}

// htmlLines strips the tags of an HTML-like label, breaking lines at <br>
// and decoding character references.
func htmlLines(s string) []string {
	var lines []string
	var cur strings.Builder
	for len(s) > 0 {
		i := strings.IndexByte(s, '<')
		if i < 0 {
			cur.WriteString(s)
			break
		}
		cur.WriteString(s[:i])
		j := strings.IndexByte(s[i:], '>')
		if j < 0 {
			cur.WriteString(s[i:])
			break
		}
		tag := strings.ToLower(strings.TrimLeft(s[i+1:i+j], "/ "))
		if tag == "br" || strings.HasPrefix(tag, "br ") || strings.HasPrefix(tag, "br/") {
			lines = append(lines, cur.String())
			cur.Reset()
		}
		s = s[i+j+1:]
	}
	lines = append(lines, cur.String())
	for i, l := range lines {
		lines[i] = strings.Join(strings.Fields(html.UnescapeString(l)), " ")
	}
	return lines
}

// escLines applies DOT's escapes in a node label: \N is the node name, \G
// the graph name, \n \l \r end a line, \\ is a backslash; any other
// backslash pair stands for its second character.
func escLines(s, node, graph string) []string {
	var lines []string
	var cur strings.Builder
	for i := 0; i < len(s); i++ {
		c := s[i]
		if c != '\\' || i+1 == len(s) {
			cur.WriteByte(c)
			continue
		}
		i++
		switch s[i] {
		case 'N':
			cur.WriteString(node)
		case 'G':
			cur.WriteString(graph)
		case 'n', 'l', 'r':
			lines = append(lines, cur.String())
			cur.Reset()
		default:
			cur.WriteByte(s[i])
		}
	}
	if cur.Len() > 0 || len(lines) == 0 {
		lines = append(lines, cur.String())
	}
	return lines
}

// unquoteID returns the text of a graph ID as written.
func unquoteID(id string) string {
	if len(id) >= 2 && id[0] == '"' && id[len(id)-1] == '"' {
		return strings.ReplaceAll(id[1:len(id)-1], `\"`, `"`)
	}
	return id
}

func svgTitle(g *dotio.Graph, index int) string {
	if g.ID == "" {
		kind := "graph"
		if g.Directed {
			kind = "digraph"
		}
		return fmt.Sprintf("(anonymous %s %d)", kind, index+1)
	}
	return plainName(unquoteID(g.ID))
}

// xmlText writes s escaped as XML character data; characters XML cannot
// hold become U+FFFD.
func xmlText(w *bufio.Writer, s string) {
	// A write error sticks in the bufio.Writer; writeSVG's Flush reports it.
	_ = xml.EscapeText(w, []byte(s))
}

// num formats a coordinate with at most two decimals.
func num(v float64) string {
	v = math.Round(v*100) / 100
	if v == 0 {
		v = 0 // no "-0"
	}
	return strconv.FormatFloat(v, 'f', -1, 64)
}
