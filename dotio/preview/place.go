package preview

import (
	"math"
	"strings"

	"github.com/gridwood/gridwood/dotio"
	"github.com/gridwood/gridwood/dotio/nodesize"
)

// inside reports whether q lies inside node n's outermost outline.
func (n *pnode) inside(q pt) bool {
	if n.sw <= 0 || n.sh <= 0 {
		return false
	}
	dx, dy := q[0]-n.x, q[1]-n.y
	switch {
	case n.kind == nodesize.Ellipse && !n.own:
		return (dx/n.sw)*(dx/n.sw)+(dy/n.sh)*(dy/n.sh) <= 1
	case n.kind == nodesize.Polygon && !n.own:
		return inPolygon(n.size.Shape.Poly, dx/(2*n.sw), dy/(2*n.sh))
	}
	return math.Abs(dx) <= n.sw && math.Abs(dy) <= n.sh
}

// boundary is the distance from the node's centre to its outermost
// outline in the direction of the unit vector (ux, uy): where inside
// stops holding along that ray.
func (n *pnode) boundary(ux, uy float64) float64 {
	if n.sw <= 0 || n.sh <= 0 {
		return 0
	}
	switch {
	case n.kind == nodesize.Ellipse && !n.own:
		return 1 / math.Hypot(ux/n.sw, uy/n.sh)
	case n.kind == nodesize.Polygon && !n.own:
		// The nearest crossing of the ray with the scaled outline.
		poly := n.size.Shape.Poly
		best := math.Inf(1)
		for i := range poly {
			p, q := poly[i], poly[(i+1)%len(poly)]
			ax, ay := p[0]*2*n.sw, p[1]*2*n.sh
			ex, ey := q[0]*2*n.sw-ax, q[1]*2*n.sh-ay
			den := ux*ey - uy*ex
			if den == 0 {
				continue
			}
			t := (ax*ey - ay*ex) / den // along the ray
			s := (ax*uy - ay*ux) / den // along the side
			if t >= 0 && s >= 0 && s <= 1 {
				best = min(best, t)
			}
		}
		if math.IsInf(best, 1) {
			return 0
		}
		return best
	}
	d := math.Inf(1)
	if ux != 0 {
		d = n.sw / math.Abs(ux)
	}
	if uy != 0 {
		d = min(d, n.sh/math.Abs(uy))
	}
	return d
}

// inPolygon is the even-odd test of (x, y) against a polygon.
func inPolygon(poly [][2]float64, x, y float64) bool {
	in := false
	for i := range poly {
		a, b := poly[i], poly[(i+1)%len(poly)]
		if (a[1] > y) != (b[1] > y) && x < a[0]+(y-a[1])/(b[1]-a[1])*(b[0]-a[0]) {
			in = !in
		}
	}
	return in
}

func loopRadius(n *pnode) float64 {
	return min(max(min(n.sw, n.sh)*0.5, loopMinR), loopMaxR)
}

// labelBlock is the size of labels stacked top to bottom.
func labelBlock(ls []*nodesize.Label) (w, h float64) {
	for _, l := range ls {
		if !l.Empty() {
			w = max(w, l.W)
			h += l.H
		}
	}
	return w, h
}

// beside is the centre of a w x h block placed next to point m on the
// side of unit normal (nx, ny), gap away from the line.
func beside(m pt, nx, ny, w, h, gap float64) pt {
	d := math.Abs(nx)*w/2 + math.Abs(ny)*h/2 + gap
	return pt{m[0] + nx*d, m[1] + ny*d}
}

// placeLink trims a link's curve at its ends' outlines and arrowheads,
// and places its labels and badge.
func (p *panel) placeLink(l *plink) {
	a, b := &p.nodes[l.u], &p.nodes[l.v]
	lw, lh := labelBlock(l.labels)
	xw, xh := labelBlock(l.xlabels)
	if l.loop {
		// Three quarters of a circle centred on the outline's upper right
		// corner, from its top side to its right side, outside the node.
		r := loopRadius(a)
		cx, cy := a.x+a.sw, a.y+a.sh
		p.extend(cx+r, cy+r)
		if l.arrows[1] != nil {
			l.tips[1] = arrowTip{on: true, x: cx, y: cy - r, ux: -1, uy: 0}
		}
		if l.arrows[0] != nil {
			l.tips[0] = arrowTip{on: true, x: cx - r, y: cy, ux: 0, uy: -1}
		}
		out := pt{cx + r*math.Sqrt2/2, cy + r*math.Sqrt2/2}
		l.badge = out
		m := beside(out, math.Sqrt2/2, math.Sqrt2/2, lw, lh, labelGap)
		l.labelAt = append(l.labelAt, m)
		p.extendLabels(l.labels, m)
		if len(l.xlabels) > 0 {
			xm := beside(pt{cx + r, cy}, 1, 0, xw, xh, labelGap)
			l.labelAt = append(l.labelAt, xm)
			p.extendLabels(l.xlabels, xm)
		}
		return
	}
	c := l.curve
	for _, q := range c.samples(routeSamples) {
		p.extend(q[0], q[1])
	}
	var t0, t1 float64
	if c.kind == straight {
		// Straight from centre to centre: where the ray leaves each
		// outline, exactly.
		dx, dy := b.x-a.x, b.y-a.y
		if L := math.Hypot(dx, dy); L > 0 {
			t0 = min(a.boundary(dx/L, dy/L)/L, 1)
			t1 = 1 - min(b.boundary(-dx/L, -dy/L)/L, 1)
		}
	} else {
		t0 = c.firstOutside(a.inside, false)
		t1 = c.firstOutside(b.inside, true)
	}
	if t0 >= t1 {
		// The outlines overlap along the whole line: nothing shows.
		t0, t1 = 0.5, 0.5
	}
	s0, s1 := t0, t1
	for side, t := range [2]float64{t0, t1} {
		parts := l.arrows[side]
		if parts == nil || t0 >= t1 {
			continue
		}
		_, _, length := arrowPolygons(parts, 0, 0, 1, 0, l.arrowSize)
		var tip, back pt
		if side == 1 {
			tip, back = c.at(t), c.at(c.cutBack(t0, t1, max(length, 1)))
			s1 = c.cutBack(t0, t1, max(length-0.5, 0))
		} else {
			tip, back = c.at(t), c.at(c.cutFront(t0, t1, max(length, 1)))
			s0 = c.cutFront(t0, t1, max(length-0.5, 0))
		}
		dx, dy := tip[0]-back[0], tip[1]-back[1]
		if d := math.Hypot(dx, dy); d > 0 {
			l.tips[side] = arrowTip{on: true, x: tip[0], y: tip[1], ux: dx / d, uy: dy / d}
		}
	}
	if s0 < s1 {
		l.drawn = c.sub(s0, s1)
	}
	// Labels beside the middle of the visible part: edge labels on the
	// left of the way from u to v, xlabels on the right.
	mid := c.at((t0 + t1) / 2)
	q0, q1 := c.at(max((t0+t1)/2-0.01, 0)), c.at(min((t0+t1)/2+0.01, 1))
	tx, ty := q1[0]-q0[0], q1[1]-q0[1]
	if d := math.Hypot(tx, ty); d > 0 {
		tx, ty = tx/d, ty/d
	} else {
		tx, ty = 1, 0
	}
	nx, ny := -ty, tx
	l.badge = mid
	m := beside(mid, nx, ny, lw, lh, labelGap+l.pen/2)
	l.labelAt = append(l.labelAt, m)
	p.extendLabels(l.labels, m)
	if len(l.xlabels) > 0 {
		xm := beside(mid, -nx, -ny, xw, xh, labelGap+l.pen/2)
		l.labelAt = append(l.labelAt, xm)
		p.extendLabels(l.xlabels, xm)
	}
	// Head and tail labels: near their end, a little along the edge and
	// to its left.
	for side, t := range [2]float64{t0, t1} {
		lab := l.endLabels[side]
		if lab.Empty() {
			continue
		}
		end := c.at(t)
		var along pt
		if side == 0 {
			along = c.at(c.cutFront(t0, t1, 14))
		} else {
			along = c.at(c.cutBack(t0, t1, 14))
		}
		dx, dy := along[0]-end[0], along[1]-end[1]
		if d := math.Hypot(dx, dy); d > 0 {
			dx, dy = dx/d, dy/d
		}
		at := beside(along, -dy, dx, lab.W, lab.H, labelGap)
		if side == 1 {
			at = beside(along, dy, -dx, lab.W, lab.H, labelGap)
		}
		l.endAt[side] = at
		p.extendLabel(lab, at[0], at[1])
	}
}

// extendLabels grows the extent to hold labels stacked around centre m.
func (p *panel) extendLabels(ls []*nodesize.Label, m pt) {
	w, h := labelBlock(ls)
	if w > 0 || h > 0 {
		p.extend(m[0]-w/2, m[1]-h/2)
		p.extend(m[0]+w/2, m[1]+h/2)
	}
}

// placeXLabel grows the extent for node i's xlabel, set outside the
// upper left corner of its outline.
func (p *panel) placeXLabel(i int) {
	n := &p.nodes[i]
	if n.xlabel.Empty() || n.invis {
		return
	}
	cx, cy := n.xlabelAt()
	p.extendLabel(n.xlabel, cx, cy)
}

// xlabelAt is the centre of the node's xlabel.
func (n *pnode) xlabelAt() (float64, float64) {
	return n.x - max(n.sw, n.bw) - n.xlabel.W/2, n.y + max(n.sh, n.bh) + n.xlabel.H/2
}

// graphLabel reads the graph's own label and its colours.
func (p *panel) graphLabel(g *dotio.Graph, graphName string, nd *notDrawn) {
	var label dotio.Attr
	var hasLabel bool
	font := nodesize.DefaultFontSize
	p.labelColor = hexPaint(inkColor)
	p.bg = noPaint
	for _, a := range g.GraphAttrs() {
		text, _ := a.Text()
		switch a.Name() {
		case "label":
			label, hasLabel = a, true
		case "fontsize":
			font = nodesize.FontSize(text, true)
		case "fontcolor":
			p.labelColor = colorOf(text, true, hexPaint(inkColor), nd, "graph")
		case "bgcolor":
			p.bg = colorOf(text, true, noPaint, nd, "graph")
		}
	}
	if hasLabel {
		p.label = labelOf(label, font, nodesize.Escapes{G: graphName})
		labelNotes(p.label, nd)
		if p.label.Empty() {
			p.label = nil
		}
	}
}

// placeGraphLabel sets the graph label below the drawing (labelloc b, the
// default for a graph, from memory) or above it (t), centred unless
// labeljust says l or r.
func (p *panel) placeGraphLabel(g *dotio.Graph) {
	loc, just := "b", "c"
	for _, a := range g.GraphAttrs() {
		text, _ := a.Text()
		switch a.Name() {
		case "labelloc":
			loc = strings.ToLower(strings.TrimSpace(text))
		case "labeljust":
			just = strings.ToLower(strings.TrimSpace(text))
		}
	}
	l := p.label
	p.labelX = (p.minX + p.maxX) / 2
	switch just {
	case "l":
		p.labelX = p.minX + l.W/2
	case "r":
		p.labelX = p.maxX - l.W/2
	}
	if loc == "t" {
		p.labelY = p.maxY + labelGap + l.H/2
	} else {
		p.labelY = p.minY - labelGap - l.H/2
	}
	p.extendLabel(l, p.labelX, p.labelY)
}
