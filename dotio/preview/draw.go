package preview

import (
	"bufio"
	"encoding/xml"
	"fmt"
	"math"
	"strings"

	"github.com/gridwood/gridwood/dotio/nodesize"
)

// sx and sy map DOT coordinates to document coordinates.
func (p *panel) sx(x float64) float64 { return pad + x - p.minX }
func (p *panel) sy(y float64) float64 { return p.top + p.maxY - y }

// xmlText writes s escaped as XML character data; characters XML cannot
// hold become U+FFFD.
func xmlText(w *bufio.Writer, s string) {
	// A write error sticks in the bufio.Writer; Write's Flush reports it.
	_ = xml.EscapeText(w, []byte(s))
}

// fillAttrs is the SVG fill of a paint.
func fillAttrs(c paint) string {
	if c.none() {
		return ` fill="none"`
	}
	s := ` fill="` + c.rgb + `"`
	if c.opacity < 1 {
		s += ` fill-opacity="` + num(c.opacity) + `"`
	}
	return s
}

// strokeAttrs is the SVG stroke of a paint at a pen width and dashes.
func strokeAttrs(c paint, width float64, dash string) string {
	if c.none() || width <= 0 {
		return ` stroke="none"`
	}
	s := ` stroke="` + c.rgb + `" stroke-width="` + num(width) + `"`
	if c.opacity < 1 {
		s += ` stroke-opacity="` + num(c.opacity) + `"`
	}
	if dash != "" {
		s += ` stroke-dasharray="` + dash + `"`
	}
	return s
}

func (p *panel) write(w *bufio.Writer) {
	fmt.Fprintf(w, "<g class=\"graph\">\n")
	fmt.Fprintf(w, "<text class=\"title\" x=\"%s\" y=\"%s\" font-size=\"%s\" font-weight=\"bold\" fill=\"%s\">", num(pad), num(p.top-titleGap), num(titleSize), titleColor)
	xmlText(w, p.title)
	fmt.Fprintf(w, "</text>\n")
	if !p.bg.none() {
		fmt.Fprintf(w, "<rect class=\"background\" x=\"%s\" y=\"%s\" width=\"%s\" height=\"%s\"%s/>\n",
			num(p.sx(p.minX)), num(p.sy(p.maxY)), num(p.maxX-p.minX), num(p.maxY-p.minY), fillAttrs(p.bg))
	}

	fmt.Fprintf(w, "<g class=\"frames\">\n")
	for _, f := range p.frames {
		p.writeFrame(w, f)
	}
	fmt.Fprintf(w, "</g>\n")

	// Removed edges first, so that everything else lies above them.
	fmt.Fprintf(w, "<g class=\"removed-edges\" fill=\"none\" stroke-linecap=\"round\">\n")
	for i := range p.links {
		if p.links[i].removed {
			p.writeLink(w, &p.links[i], "removed")
		}
	}
	fmt.Fprintf(w, "</g>\n")
	fmt.Fprintf(w, "<g class=\"edges\" fill=\"none\" stroke-linecap=\"round\">\n")
	for i := range p.links {
		if !p.links[i].removed {
			p.writeLink(w, &p.links[i], "edge")
		}
	}
	fmt.Fprintf(w, "</g>\n")

	fmt.Fprintf(w, "<g class=\"nodes\">\n")
	for i := range p.nodes {
		p.writeNode(w, &p.nodes[i])
	}
	fmt.Fprintf(w, "</g>\n")

	fmt.Fprintf(w, "<g class=\"edge-labels\">\n")
	for i := range p.links {
		p.writeLinkLabels(w, &p.links[i])
	}
	for i := range p.nodes {
		n := &p.nodes[i]
		if n.xlabel.Empty() || n.invis {
			continue
		}
		cx, cy := n.xlabelAt()
		p.writeLabel(w, "xlabel", n.xlabel, p.sx(cx)-n.xlabel.W/2, p.sy(cy)-n.xlabel.H/2, n.xcolor, hexPaint(paperColor))
	}
	fmt.Fprintf(w, "</g>\n")

	fmt.Fprintf(w, "<g class=\"badges\" text-anchor=\"middle\" font-size=\"%s\" font-weight=\"bold\">\n", num(badgeFont))
	for _, l := range p.links {
		if l.count < 2 || l.invis {
			continue
		}
		x, y := p.sx(l.badge[0]), p.sy(l.badge[1])
		fill := badgeFill
		if l.removed {
			fill = removedColor
		}
		fmt.Fprintf(w, "<circle class=\"badge\" cx=\"%s\" cy=\"%s\" r=\"%s\" fill=\"%s\" stroke=\"%s\" stroke-width=\"0.75\"/>", num(x), num(y), num(badgeR), fill, paperColor)
		fmt.Fprintf(w, "<text class=\"count\" x=\"%s\" y=\"%s\" fill=\"%s\">%d</text>\n", num(x), num(y+badgeFont*0.35), badgeText, l.count)
	}
	fmt.Fprintf(w, "</g>\n")
	if p.label != nil {
		p.writeLabel(w, "graph-label", p.label, p.sx(p.labelX)-p.label.W/2, p.sy(p.labelY)-p.label.H/2, p.labelColor, noPaint)
	}
	fmt.Fprintf(w, "</g>\n")
}

func (p *panel) writeFrame(w *bufio.Writer, f pframe) {
	if f.invis {
		return
	}
	x, y := p.sx(f.x0), p.sy(f.y1)
	r := 0.0
	if f.round {
		r = min(corner, (f.x1-f.x0)/4, (f.y1-f.y0)/4)
	}
	fmt.Fprintf(w, "<rect class=\"frame\" x=\"%s\" y=\"%s\" width=\"%s\" height=\"%s\" rx=\"%s\"%s%s/>\n",
		num(x), num(y), num(f.x1-f.x0), num(f.y1-f.y0), num(r), fillAttrs(f.fill), strokeAttrs(f.stroke, f.pen, f.dash))
	if f.label != nil && !f.label.Empty() {
		p.writeLabel(w, "frame-label", f.label, p.sx(f.labelX)-f.label.W/2, p.sy(f.labelY)-f.label.H/2, f.text, noPaint)
	}
}

// writeLink draws one line with its arrowheads.
func (p *panel) writeLink(w *bufio.Writer, l *plink, class string) {
	if l.invis {
		return
	}
	a, b := &p.nodes[l.u], &p.nodes[l.v]
	fmt.Fprintf(w, "<g class=\"%s\"%s>", class, strokeAttrs(l.stroke, l.pen, l.dash))
	fmt.Fprintf(w, "<title>")
	if l.tip != "" {
		xmlText(w, l.tip)
	} else {
		op := " -- "
		if p.directed {
			op = " -> "
		}
		xmlText(w, a.name+op+b.name)
		if l.removed {
			xmlText(w, " (removed)")
		}
	}
	fmt.Fprintf(w, "</title>")
	if l.loop {
		r := loopRadius(a)
		cx, cy := p.sx(a.x+a.sw), p.sy(a.y+a.sh)
		fmt.Fprintf(w, "<path class=\"loop\" d=\"M %s %s A %s %s 0 1 1 %s %s\"/>", num(cx-r), num(cy), num(r), num(r), num(cx), num(cy+r))
	} else if l.drawn.p != nil {
		fmt.Fprintf(w, "<path class=\"line\" d=\"%s\"/>", p.pathData(l.drawn))
	}
	for side, t := range l.tips {
		if !t.on {
			continue
		}
		polys, filled, _ := arrowPolygons(l.arrows[side], t.x, t.y, t.ux, t.uy, l.arrowSize)
		for k, poly := range polys {
			fill := l.stroke
			if !filled[k] {
				fill = hexPaint(paperColor)
			}
			fmt.Fprintf(w, "<polygon class=\"arrow\" points=\"")
			for j, q := range poly {
				if j > 0 {
					w.WriteByte(' ')
				}
				fmt.Fprintf(w, "%s,%s", num(p.sx(q[0])), num(p.sy(q[1])))
			}
			fmt.Fprintf(w, "\"%s stroke-dasharray=\"none\" stroke-width=\"%s\"/>", fillAttrs(fill), num(min(l.pen, 1.5)))
		}
	}
	fmt.Fprintf(w, "</g>\n")
}

// pathData is a path's SVG data in document coordinates.
func (p *panel) pathData(c path) string {
	var b strings.Builder
	q := func(x pt) string { return num(p.sx(x[0])) + " " + num(p.sy(x[1])) }
	b.WriteString("M " + q(c.p[0]))
	switch c.kind {
	case quadratic:
		b.WriteString(" Q " + q(c.p[1]) + " " + q(c.p[2]))
	default:
		for _, x := range c.p[1:] {
			b.WriteString(" L " + q(x))
		}
	}
	return b.String()
}

func (p *panel) writeLinkLabels(w *bufio.Writer, l *plink) {
	if l.invis {
		return
	}
	halo := hexPaint(paperColor)
	k := 0
	for _, group := range [2][]*nodesize.Label{l.labels, l.xlabels} {
		if len(group) == 0 {
			continue
		}
		if k >= len(l.labelAt) {
			break
		}
		m := l.labelAt[k]
		k++
		bw, bh := labelBlock(group)
		top := p.sy(m[1]) - bh/2
		for _, lab := range group {
			if lab.Empty() {
				continue
			}
			p.writeLabel(w, "edge-label", lab, p.sx(m[0])-lab.W/2, top, l.text, halo)
			top += lab.H
		}
		_ = bw
	}
	for side, lab := range l.endLabels {
		if lab.Empty() {
			continue
		}
		at := l.endAt[side]
		p.writeLabel(w, "end-label", lab, p.sx(at[0])-lab.W/2, p.sy(at[1])-lab.H/2, l.endText, halo)
	}
}

// writeNode draws a node's outlines, then its label.
func (p *panel) writeNode(w *bufio.Writer, n *pnode) {
	if n.invis {
		return
	}
	fmt.Fprintf(w, "<g class=\"node\"><title>")
	xmlText(w, n.tip)
	fmt.Fprintf(w, "</title>")
	cx, cy := p.sx(n.x), p.sy(n.y)
	rings := n.size.Peripheries
	switch {
	case n.own:
		rings = max(rings, 1)
	case n.kind == nodesize.NoOutline:
		rings = 0
	}
	// Outermost first; the fill goes on the innermost (or, with no
	// outline, on the shape itself).
	count := max(rings, 1)
	for k := range count {
		hw := n.sw - float64(k)*nodesize.PeripheryGap
		hh := n.sh - float64(k)*nodesize.PeripheryGap
		if hw <= 0 || hh <= 0 {
			break
		}
		fill := noPaint
		if k == count-1 {
			fill = n.fill
		}
		stroke := n.stroke
		if rings == 0 {
			stroke = noPaint
		}
		p.writeOutline(w, n, cx, cy, hw, hh, fillAttrs(fill)+strokeAttrs(stroke, n.pen, n.dash))
	}
	if n.kind == nodesize.Record && n.size.Label != nil && n.size.Label.Record != nil && !n.own {
		// The lines between fields.
		left, top := cx-n.sw, cy-n.sh
		n.size.Label.Record.Groups(func(g *nodesize.Field) {
			for i, f := range g.Fields {
				if i == 0 {
					continue
				}
				if g.Vertical {
					fmt.Fprintf(w, "<line class=\"field\" x1=\"%s\" y1=\"%s\" x2=\"%s\" y2=\"%s\"%s/>", num(left+g.X), num(top+f.Y), num(left+g.X+g.W), num(top+f.Y), strokeAttrs(n.stroke, n.pen, n.dash))
				} else {
					fmt.Fprintf(w, "<line class=\"field\" x1=\"%s\" y1=\"%s\" x2=\"%s\" y2=\"%s\"%s/>", num(left+f.X), num(top+g.Y), num(left+f.X), num(top+g.Y+g.H), strokeAttrs(n.stroke, n.pen, n.dash))
				}
			}
		})
	}
	p.writeNodeLabel(w, n, cx, cy)
	fmt.Fprintf(w, "</g>\n")
}

// writeOutline draws one outline of a node with half size hw x hh at
// document point (cx, cy).
func (p *panel) writeOutline(w *bufio.Writer, n *pnode, cx, cy, hw, hh float64, paint string) {
	left, top, right, bottom := cx-hw, cy-hh, cx+hw, cy+hh
	rect := func(r float64) {
		fmt.Fprintf(w, "<rect class=\"shape\" x=\"%s\" y=\"%s\" width=\"%s\" height=\"%s\"", num(left), num(top), num(2*hw), num(2*hh))
		if r > 0 {
			fmt.Fprintf(w, " rx=\"%s\" ry=\"%s\"", num(r), num(r))
		}
		fmt.Fprintf(w, "%s/>", paint)
	}
	poly := func(pts ...pt) {
		fmt.Fprintf(w, "<polygon class=\"shape\" points=\"")
		for i, q := range pts {
			if i > 0 {
				w.WriteByte(' ')
			}
			fmt.Fprintf(w, "%s,%s", num(q[0]), num(q[1]))
		}
		fmt.Fprintf(w, "\"%s/>", paint)
	}
	line := func(d string) {
		// The stroke part of the paint only.
		fmt.Fprintf(w, "<path class=\"detail\" d=\"%s\" fill=\"none\"%s/>", d, paint[strings.Index(paint, " stroke"):])
	}
	if n.own {
		rect(min(corner, hw/2, hh/2))
		return
	}
	switch n.kind {
	case nodesize.Rect, nodesize.NoOutline:
		r := 0.0
		if n.round {
			r = min(corner, hw/2, hh/2)
		}
		rect(r)
	case nodesize.Record:
		r := 0.0
		if n.round {
			r = min(corner*1.5, hw/2, hh/2)
		}
		rect(r)
	case nodesize.Ellipse:
		fmt.Fprintf(w, "<ellipse class=\"shape\" cx=\"%s\" cy=\"%s\" rx=\"%s\" ry=\"%s\"%s/>", num(cx), num(cy), num(hw), num(hh), paint)
	case nodesize.Polygon:
		pts := make([]pt, len(n.size.Shape.Poly))
		for i, q := range n.size.Shape.Poly {
			pts[i] = pt{cx + q[0]*2*hw, cy - q[1]*2*hh}
		}
		poly(pts...)
	case nodesize.Cylinder:
		e := min(hh*0.3, hw*0.5, 10)
		fmt.Fprintf(w, "<path class=\"shape\" d=\"M %s %s L %s %s A %s %s 0 0 0 %s %s L %s %s Z\"%s/>",
			num(left), num(top+e), num(left), num(bottom-e), num(hw), num(e), num(right), num(bottom-e), num(right), num(top+e), paint)
		fmt.Fprintf(w, "<ellipse class=\"shape\" cx=\"%s\" cy=\"%s\" rx=\"%s\" ry=\"%s\"%s/>", num(cx), num(top+e), num(hw), num(e), paint)
	case nodesize.Note:
		f := min(8, hw, hh)
		poly(pt{left, top}, pt{right - f, top}, pt{right, top + f}, pt{right, bottom}, pt{left, bottom})
		line(fmt.Sprintf("M %s %s L %s %s L %s %s", num(right-f), num(top), num(right-f), num(top+f), num(right), num(top+f)))
	case nodesize.Tab:
		rect(0)
		tw, th := min(12, hw), min(5, hh/2)
		line(fmt.Sprintf("M %s %s L %s %s L %s %s", num(left), num(top+th), num(left+tw), num(top+th), num(left+tw), num(top)))
	case nodesize.Folder:
		t, tw := min(5, hh/3), min(2*hw/3, 24)
		poly(pt{left, top + t}, pt{right - tw - t, top + t}, pt{right - tw, top}, pt{right - t, top}, pt{right, top + t}, pt{right, bottom}, pt{left, bottom})
	case nodesize.Box3D:
		d := min(4, hw/4, hh/4)
		poly(pt{left, top + d}, pt{left + d, top}, pt{right, top}, pt{right, bottom - d}, pt{right - d, bottom}, pt{left, bottom})
		line(fmt.Sprintf("M %s %s L %s %s L %s %s M %s %s L %s %s", num(left), num(top+d), num(right-d), num(top+d), num(right-d), num(bottom), num(right-d), num(top+d), num(right), num(top)))
	case nodesize.Component:
		rect(0)
		bw, bh := min(8, hw/2), min(4, hh/4)
		for _, y := range []float64{cy - hh/2, cy + hh/2} {
			fmt.Fprintf(w, "<rect class=\"detail\" x=\"%s\" y=\"%s\" width=\"%s\" height=\"%s\"%s/>", num(left-bw/2), num(y-bh/2), num(bw), num(bh), paint)
		}
	case nodesize.Underline:
		line(fmt.Sprintf("M %s %s L %s %s", num(left), num(bottom), num(right), num(bottom)))
	}
}

// writeNodeLabel draws a node's label: text centred in the node, record
// fields in their boxes, a table centred.
func (p *panel) writeNodeLabel(w *bufio.Writer, n *pnode, cx, cy float64) {
	lab := n.size.Label
	if lab.Empty() {
		return
	}
	// Text spilling out of a filled outline gets a halo of the fill, to
	// stay legible over the paper.
	halo := noPaint
	if (lab.W > 2*n.sw || lab.H > 2*n.sh) && !n.fill.none() {
		halo = n.fill
	}
	if lab.Record != nil && !n.own && n.kind == nodesize.Record {
		left, top := cx-n.sw, cy-n.sh
		lab.Record.Leaves(func(f *nodesize.Field) {
			if len(f.Lines) == 0 {
				return
			}
			_, h := linesSize(f.Lines)
			p.writeLines(w, f.Lines, left+f.X+n.size.MarginX, top+f.Y+(f.H-h)/2, f.W-2*n.size.MarginX, n.text, halo)
		})
		return
	}
	if lab.Record != nil {
		// A record label on a node drawn in our own look: its fields'
		// text, one line each.
		var lines []nodesize.Line
		lab.Record.Leaves(func(f *nodesize.Field) { lines = append(lines, f.Lines...) })
		_, h := linesSize(lines)
		w2, _ := linesSize(lines)
		p.writeLines(w, lines, cx-w2/2, cy-h/2, w2, n.text, halo)
		return
	}
	p.writeLabel(w, "", lab, cx-lab.W/2, cy-lab.H/2, n.text, halo)
}

func linesSize(lines []nodesize.Line) (w, h float64) {
	for _, l := range lines {
		w = max(w, l.W)
		h += l.H
	}
	return w, h
}

// writeLabel draws a text or table label with its top left corner at
// document point (left, top). class, if set, names a group around it.
func (p *panel) writeLabel(w *bufio.Writer, class string, lab *nodesize.Label, left, top float64, color, halo paint) {
	if lab.Empty() {
		return
	}
	if class != "" {
		fmt.Fprintf(w, "<g class=\"%s\">", class)
	}
	if lab.Table != nil {
		p.writeTable(w, lab.Table, left, top, color)
	} else {
		p.writeLines(w, lab.Lines, left, top, lab.W, color, halo)
	}
	if class != "" {
		fmt.Fprintf(w, "</g>\n")
	}
}

// writeTable draws an HTML table and its cells; borders in the label's
// colour unless COLOR says otherwise.
func (p *panel) writeTable(w *bufio.Writer, t *nodesize.Table, left, top float64, color paint) {
	tableColor := htmlPaint(t.Color, color)
	bg := htmlPaint(t.BGColor, noPaint)
	bw := t.Border
	fmt.Fprintf(w, "<rect class=\"table\" x=\"%s\" y=\"%s\" width=\"%s\" height=\"%s\"%s%s/>",
		num(left+t.X+bw/2), num(top+t.Y+bw/2), num(max(t.W-bw, 0)), num(max(t.H-bw, 0)), fillAttrs(bg), strokeAttrs(tableColor, bw, ""))
	for _, c := range t.Cells {
		cc := htmlPaint(c.Color, tableColor)
		cbg := htmlPaint(c.BGColor, noPaint)
		fmt.Fprintf(w, "<rect class=\"cell\" x=\"%s\" y=\"%s\" width=\"%s\" height=\"%s\"%s%s/>",
			num(left+c.X+c.Border/2), num(top+c.Y+c.Border/2), num(max(c.W-c.Border, 0)), num(max(c.H-c.Border, 0)), fillAttrs(cbg), strokeAttrs(cc, c.Border, ""))
		if c.Table != nil {
			p.writeTable(w, c.Table, left, top, color)
			continue
		}
		inner := c.Border + c.Pad
		x := left + c.X + inner
		switch c.Align {
		case 'c':
			x = left + c.X + (c.W-c.ContentW)/2
		case 'r':
			x = left + c.X + c.W - inner - c.ContentW
		}
		y := top + c.Y + (c.H-c.ContentH)/2
		switch c.VAlign {
		case 't':
			y = top + c.Y + inner
		case 'b':
			y = top + c.Y + c.H - inner - c.ContentH
		}
		p.writeLines(w, c.Lines, x, y, c.ContentW, color, noPaint)
	}
}

// htmlPaint reads an HTML label's colour, def when unset or unknown.
func htmlPaint(s string, def paint) paint {
	if s == "" {
		return def
	}
	c, _, ok := parseColor(s)
	if !ok {
		return def
	}
	return c
}

// writeLines draws text lines in a block of the given width from its top
// left corner; each line centred, or at the left or right as its escape
// said.
func (p *panel) writeLines(w *bufio.Writer, lines []nodesize.Line, left, top, width float64, color, halo paint) {
	y := top
	for _, l := range lines {
		size := 0.0
		for _, r := range l.Runs {
			size = max(size, r.Size)
		}
		if len(l.Runs) == 0 {
			y += l.H
			continue
		}
		base := y + l.H/2 + 0.35*size
		x, anchor := left+width/2, "middle"
		switch l.Just {
		case 'l':
			x, anchor = left, "start"
		case 'r':
			x, anchor = left+width, "end"
		}
		fmt.Fprintf(w, "<text class=\"label\" x=\"%s\" y=\"%s\" font-size=\"%s\" text-anchor=\"%s\"%s", num(x), num(base), num(size), anchor, fillAttrs(color))
		if !halo.none() {
			fmt.Fprintf(w, " stroke=\"%s\" stroke-width=\"%s\" stroke-linejoin=\"round\" paint-order=\"stroke\"", halo.rgb, num(math.Max(1.5, size/6)))
		}
		w.WriteString(">")
		for _, r := range l.Runs {
			var attrs strings.Builder
			if r.Size != size {
				fmt.Fprintf(&attrs, " font-size=\"%s\"", num(r.Size))
			}
			if r.Bold {
				attrs.WriteString(" font-weight=\"bold\"")
			}
			if r.Italic {
				attrs.WriteString(" font-style=\"italic\"")
			}
			switch {
			case r.Underline && r.Strike:
				attrs.WriteString(" text-decoration=\"underline line-through\"")
			case r.Underline:
				attrs.WriteString(" text-decoration=\"underline\"")
			case r.Strike:
				attrs.WriteString(" text-decoration=\"line-through\"")
			}
			if r.Color != "" {
				if c, _, ok := parseColor(r.Color); ok {
					attrs.WriteString(fillAttrs(c))
				}
			}
			if attrs.Len() == 0 && len(l.Runs) == 1 {
				xmlText(w, r.Text)
				continue
			}
			fmt.Fprintf(w, "<tspan%s>", attrs.String())
			xmlText(w, r.Text)
			w.WriteString("</tspan>")
		}
		w.WriteString("</text>")
		y += l.H
	}
}
