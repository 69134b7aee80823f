package nodesize

import (
	"html"
	"slices"
	"strconv"
	"strings"
)

// HTML-like labels (the DOT language's subset of HTML, from memory of its
// documentation): text with B, I, U, S, FONT and BR, or a TABLE of TR and
// TD. Parsing is lenient: an unknown tag is listed in the notes and its
// text kept, a close tag with no open match is skipped, an element left
// open ends with its parent.

// Limits that keep a hostile label linear in its length.
const (
	maxHTMLDepth  = 64        // open elements; deeper tags are flattened
	maxTableDepth = 16        // nested tables; deeper ones become text
	maxSpan       = 1000      // COLSPAN and ROWSPAN
	maxGridSlots  = 1_000_000 // rows times columns of one table
)

// hnode is an element or a text node of an HTML-like label.
type hnode struct {
	tag   string // lower case; "" for text
	attrs [][2]string
	text  string // text nodes: entities decoded
	kids  []*hnode
}

func (n *hnode) attr(name string) (string, bool) {
	for _, a := range n.attrs {
		if a[0] == name {
			return a[1], true
		}
	}
	return "", false
}

// voidTags never hold anything.
var voidTags = map[string]bool{"br": true, "hr": true, "vr": true, "img": true}

// notes collects what is not laid out, each once, in order.
type notes []string

func (ns *notes) add(s string) {
	if !slices.Contains(*ns, s) {
		*ns = append(*ns, s)
	}
}

// parseHTML builds the element tree of an HTML-like label's inside.
func parseHTML(s string, ns *notes) *hnode {
	root := &hnode{tag: "#root"}
	stack := []*hnode{root}
	text := func(t string) {
		if t != "" {
			top := stack[len(stack)-1]
			top.kids = append(top.kids, &hnode{text: html.UnescapeString(t)})
		}
	}
	for len(s) > 0 {
		i := strings.IndexByte(s, '<')
		if i < 0 {
			text(s)
			break
		}
		text(s[:i])
		s = s[i:]
		if strings.HasPrefix(s, "<!--") {
			j := strings.Index(s, "-->")
			if j < 0 {
				break
			}
			s = s[j+3:]
			continue
		}
		j := strings.IndexByte(s, '>')
		if j < 0 {
			text(s)
			break
		}
		inside := s[1:j]
		s = s[j+1:]
		if strings.HasPrefix(inside, "/") {
			name := strings.ToLower(strings.TrimSpace(inside[1:]))
			for k := len(stack) - 1; k > 0; k-- {
				if stack[k].tag == name {
					stack = stack[:k]
					break
				}
			}
			continue
		}
		selfClosing := strings.HasSuffix(inside, "/")
		inside = strings.TrimSuffix(inside, "/")
		name, rest, _ := strings.Cut(strings.TrimSpace(inside), " ")
		if k := strings.IndexAny(name, "\t\n\r"); k >= 0 {
			name, rest = name[:k], name[k:]+" "+rest
		}
		el := &hnode{tag: strings.ToLower(name), attrs: parseHTMLAttrs(rest)}
		top := stack[len(stack)-1]
		top.kids = append(top.kids, el)
		if selfClosing || voidTags[el.tag] {
			continue
		}
		if len(stack) >= maxHTMLDepth {
			ns.add("HTML nesting deeper than " + strconv.Itoa(maxHTMLDepth))
			continue
		}
		stack = append(stack, el)
	}
	return root
}

// parseHTMLAttrs reads NAME="value" pairs (quotes ' or ", or none); names
// are lower-cased, values entity-decoded.
func parseHTMLAttrs(s string) [][2]string {
	var out [][2]string
	for {
		s = strings.TrimLeft(s, " \t\r\n")
		if s == "" {
			return out
		}
		k := strings.IndexAny(s, "= \t\r\n")
		if k < 0 {
			return append(out, [2]string{strings.ToLower(s), ""})
		}
		name := strings.ToLower(s[:k])
		s = strings.TrimLeft(s[k:], " \t\r\n")
		if !strings.HasPrefix(s, "=") {
			out = append(out, [2]string{name, ""})
			continue
		}
		s = strings.TrimLeft(s[1:], " \t\r\n")
		var val string
		if s != "" && (s[0] == '"' || s[0] == '\'') {
			q := s[0]
			e := strings.IndexByte(s[1:], q)
			if e < 0 {
				val, s = s[1:], ""
			} else {
				val, s = s[1:1+e], s[2+e:]
			}
		} else {
			e := strings.IndexAny(s, " \t\r\n")
			if e < 0 {
				e = len(s)
			}
			val, s = s[:e], s[e:]
		}
		out = append(out, [2]string{name, html.UnescapeString(val)})
	}
}

// style is the text style in force.
type style struct {
	size                            float64
	bold, italic, underline, strike bool
	color                           string
}

// applyStyle returns st changed by a text element; ok is false for an
// element that is not a text style.
func applyStyle(st style, el *hnode, ns *notes) (style, bool) {
	switch el.tag {
	case "b":
		st.bold = true
	case "i":
		st.italic = true
	case "u":
		st.underline = true
	case "s":
		st.strike = true
	case "o", "sub", "sup":
		ns.add("HTML " + strings.ToUpper(el.tag) + " (drawn as plain text)")
	case "font":
		for _, a := range el.attrs {
			switch a[0] {
			case "point-size":
				if v, err := strconv.ParseFloat(strings.TrimSpace(a[1]), 64); err == nil && v > 0 && v < 1000 {
					st.size = v
				}
			case "color":
				st.color = a[1]
			case "face":
				ns.add("HTML FONT FACE")
			default:
				ns.add("HTML FONT " + strings.ToUpper(a[0]))
			}
		}
	default:
		return st, false
	}
	return st, true
}

// textBuilder gathers runs into lines, collapsing blanks as HTML does: a
// run of blanks is one blank between words, none at a line's ends.
type textBuilder struct {
	lines []Line
	cur   []Run
	size  float64
	space bool // a blank is due before the next word
}

func (b *textBuilder) add(t string, st style) {
	if startsBlank(t) {
		b.space = true
	}
	words := strings.Fields(t)
	if len(words) == 0 {
		return
	}
	body := strings.Join(words, " ")
	if b.space && len(b.cur) > 0 {
		body = " " + body
	}
	b.space = endsBlank(t)
	b.cur = append(b.cur, Run{Text: body, Size: st.size, Bold: st.bold, Italic: st.italic, Underline: st.underline, Strike: st.strike, Color: st.color})
}

func startsBlank(t string) bool { return t != "" && strings.IndexByte(" \t\r\n", t[0]) >= 0 }
func endsBlank(t string) bool   { return t != "" && strings.IndexByte(" \t\r\n", t[len(t)-1]) >= 0 }

// brk ends the current line with the given justification.
func (b *textBuilder) brk(just byte) {
	b.lines = append(b.lines, Line{Runs: b.cur, Just: just})
	b.cur = nil
	b.space = false
}

// finish ends the last line unless it is empty and the text had lines.
func (b *textBuilder) finish() []Line {
	if len(b.cur) > 0 || len(b.lines) == 0 {
		b.brk('c')
	}
	if len(b.lines) == 1 && len(b.lines[0].Runs) == 0 {
		return nil
	}
	measure(b.lines, b.size)
	return b.lines
}

// justOf reads a BR's or BALIGN's ALIGN value.
func justOf(v string, def byte) byte {
	switch strings.ToLower(strings.TrimSpace(v)) {
	case "left":
		return 'l'
	case "right":
		return 'r'
	case "center":
		return 'c'
	}
	return def
}

// collectText appends the text under n to b; a table met on the way has
// its rows as lines and its cells separated by blanks. just is the
// justification of lines ended by a BR without ALIGN.
func collectText(n *hnode, st style, b *textBuilder, just byte, ns *notes) {
	type item struct {
		n    *hnode
		st   style
		exit string // non-empty: the end of an element
	}
	stack := []item{{n: n, st: st}}
	for len(stack) > 0 {
		it := stack[len(stack)-1]
		stack = stack[:len(stack)-1]
		switch it.exit {
		case "tr":
			b.brk(just)
			continue
		case "td":
			b.space = true
			continue
		}
		x := it.n
		if x.tag == "" {
			b.add(x.text, it.st)
			continue
		}
		cst := it.st
		switch x.tag {
		case "#root", "table":
		case "br":
			a, _ := x.attr("align")
			b.brk(justOf(a, just))
			continue
		case "tr", "td":
			stack = append(stack, item{st: it.st, exit: x.tag})
		case "img":
			ns.add("HTML IMG")
			continue
		case "hr", "vr":
			ns.add("HTML HR and VR rules")
			continue
		default:
			var ok bool
			if cst, ok = applyStyle(it.st, x, ns); !ok {
				ns.add("HTML <" + x.tag + ">")
			}
		}
		for i := len(x.kids) - 1; i >= 0; i-- {
			stack = append(stack, item{n: x.kids[i], st: cst})
		}
	}
}

// parseHTMLText reads an HTML-like label as text lines only.
func parseHTMLText(s string, size float64) []Line {
	var ns notes
	root := parseHTML(s, &ns)
	b := &textBuilder{size: size}
	collectText(root, style{size: size}, b, 'c', &ns)
	return b.finish()
}

// Table is a laid-out HTML table. Positions are from the label's top left
// corner, y down, in points.
type Table struct {
	X, Y, W, H     float64
	Border         float64
	BGColor, Color string // as written; "" if unset
	Cells          []Cell
}

// Cell is a laid-out table cell: its box (border included) and content.
type Cell struct {
	X, Y, W, H     float64
	Border, Pad    float64
	BGColor, Color string
	Lines          []Line // text, or
	Table          *Table // a nested table
	Align          byte   // content block: 'c', 'l' or 'r'
	VAlign         byte   // 'c', 't' or 'b'
	ContentW       float64
	ContentH       float64
}

// htmlLabel lays out an HTML-like label (its inside, without the outer
// angle brackets) at the given font size.
func htmlLabel(s string, size float64) *Label {
	var ns notes
	root := parseHTML(s, &ns)
	l := &Label{FontSize: size}
	st := style{size: size}
	if tbl, tst := soleTable(root, st, &ns); tbl != nil {
		if t, ok := layoutTable(tbl, tst, 0, &ns); ok {
			t.place(0, 0)
			l.Table, l.W, l.H = t, t.W, t.H
			l.Notes = ns
			return l
		}
	}
	b := &textBuilder{size: size}
	collectText(root, st, b, 'c', &ns)
	l.Lines = b.finish()
	l.W, l.H = measure(l.Lines, size)
	l.Notes = ns
	return l
}

// soleTable finds the one TABLE a label consists of, inside text style
// elements only, and the style in force there; nil if the label is text.
func soleTable(n *hnode, st style, ns *notes) (*hnode, style) {
	for {
		var only *hnode
		for _, k := range n.kids {
			if k.tag == "" {
				if strings.TrimSpace(k.text) != "" {
					return nil, st
				}
				continue
			}
			if only != nil {
				return nil, st
			}
			only = k
		}
		if only == nil {
			return nil, st
		}
		if only.tag == "table" {
			return only, st
		}
		var ok bool
		if st, ok = applyStyle(st, only, ns); !ok {
			return nil, st
		}
		n = only
	}
}

// tableCell is a TD on the grid before layout.
type tableCell struct {
	el           *hnode
	row, col     int
	rspan, cspan int
	cell         Cell
	nested       *Table
	minW, minH   float64
	fixed        bool
}

// htmlNumber reads a non-negative integer attribute, capped; def if unset
// or malformed.
func htmlNumber(el *hnode, name string, def, most float64, ns *notes) float64 {
	v, ok := el.attr(name)
	if !ok {
		return def
	}
	f, err := strconv.ParseFloat(strings.TrimSpace(v), 64)
	if err != nil || f < 0 {
		ns.add("HTML " + strings.ToUpper(name) + "=" + strconv.Quote(v) + " (not a number)")
		return def
	}
	return min(f, most)
}

// Table attributes drawn or laid out; others the table ignores silently
// (PORT, HREF, ID, TITLE, TOOLTIP, TARGET: not part of the picture) or
// names in the notes.
var tableSilent = map[string]bool{"port": true, "href": true, "id": true, "title": true, "tooltip": true, "target": true}

// layoutTable sizes a TABLE element and its cells; ok is false when the
// table is beyond the limits (then the label is read as text).
func layoutTable(el *hnode, st style, depth int, ns *notes) (*Table, bool) {
	if depth >= maxTableDepth {
		ns.add("HTML tables nested deeper than " + strconv.Itoa(maxTableDepth) + " (drawn as text)")
		return nil, false
	}
	t := &Table{}
	border := htmlNumber(el, "border", 1, 127, ns)
	cellBorder := htmlNumber(el, "cellborder", border, 127, ns)
	pad := htmlNumber(el, "cellpadding", 2, 255, ns)
	spacing := htmlNumber(el, "cellspacing", 2, 127, ns)
	minW := htmlNumber(el, "width", 0, 65535, ns)
	minH := htmlNumber(el, "height", 0, 65535, ns)
	t.Border = border
	for _, a := range el.attrs {
		switch a[0] {
		case "border", "cellborder", "cellpadding", "cellspacing", "width", "height", "align", "valign":
		case "bgcolor":
			t.BGColor = a[1]
		case "color":
			t.Color = a[1]
		default:
			if !tableSilent[a[0]] {
				ns.add("HTML TABLE " + strings.ToUpper(a[0]))
			}
		}
	}

	// Place the cells on the grid: each TD at the first free column of
	// its row, past columns held by row spans from above.
	var cells []*tableCell
	var rowsLeft []int // per column: rows still held by a span from above
	nrows, ncols, row := 0, 0, 0
	for _, tr := range el.kids {
		switch tr.tag {
		case "tr":
		case "hr":
			ns.add("HTML HR and VR rules")
			continue
		case "":
			continue
		default:
			ns.add("HTML <" + tr.tag + "> in a TABLE")
			continue
		}
		col := 0
		for _, td := range tr.kids {
			switch td.tag {
			case "td":
			case "vr":
				ns.add("HTML HR and VR rules")
				continue
			case "":
				continue
			default:
				ns.add("HTML <" + td.tag + "> in a TR")
				continue
			}
			cs := int(max(1, htmlNumber(td, "colspan", 1, maxSpan, ns)))
			rs := int(max(1, htmlNumber(td, "rowspan", 1, maxSpan, ns)))
			for !spanFree(rowsLeft, col, cs) {
				col++
			}
			for len(rowsLeft) < col+cs {
				rowsLeft = append(rowsLeft, 0)
			}
			for c := col; c < col+cs; c++ {
				rowsLeft[c] = rs
			}
			cells = append(cells, &tableCell{el: td, row: row, col: col, rspan: rs, cspan: cs})
			ncols = max(ncols, col+cs)
			nrows = max(nrows, row+rs)
			col += cs
		}
		for c := range rowsLeft {
			if rowsLeft[c] > 0 {
				rowsLeft[c]--
			}
		}
		row++
		if int64(max(row, nrows))*int64(max(ncols, 1)) > maxGridSlots {
			ns.add("HTML table of more than " + strconv.Itoa(maxGridSlots) + " grid cells (drawn as text)")
			return nil, false
		}
	}
	nrows = max(nrows, row)

	// Each cell's own size: content, padding and border.
	for _, c := range cells {
		cb := htmlNumber(c.el, "border", cellBorder, 127, ns)
		cp := htmlNumber(c.el, "cellpadding", pad, 255, ns)
		c.cell = Cell{Border: cb, Pad: cp, Align: 'c', VAlign: 'c'}
		just := byte('c')
		for _, a := range c.el.attrs {
			switch a[0] {
			case "border", "cellpadding", "colspan", "rowspan", "width", "height", "fixedsize":
			case "bgcolor":
				c.cell.BGColor = a[1]
			case "color":
				c.cell.Color = a[1]
			case "align":
				c.cell.Align = justOf(a[1], 'c')
			case "balign":
				just = justOf(a[1], 'c')
			case "valign":
				switch strings.ToLower(strings.TrimSpace(a[1])) {
				case "top":
					c.cell.VAlign = 't'
				case "bottom":
					c.cell.VAlign = 'b'
				}
			default:
				if !tableSilent[a[0]] {
					ns.add("HTML TD " + strings.ToUpper(a[0]))
				}
			}
		}
		if inner, ist := soleTable(c.el, st, ns); inner != nil {
			if nt, ok := layoutTable(inner, ist, depth+1, ns); ok {
				c.nested = nt
				c.cell.ContentW, c.cell.ContentH = nt.W, nt.H
			}
		}
		if c.nested == nil {
			b := &textBuilder{size: st.size}
			collectText(c.el, st, b, just, ns)
			c.cell.Lines = b.finish()
			c.cell.ContentW, c.cell.ContentH = measure(c.cell.Lines, st.size)
		}
		c.minW = c.cell.ContentW + 2*(cp+cb)
		c.minH = c.cell.ContentH + 2*(cp+cb)
		v, _ := c.el.attr("fixedsize")
		c.fixed = strings.EqualFold(strings.TrimSpace(v), "true")
		w, h := htmlNumber(c.el, "width", 0, 65535, ns), htmlNumber(c.el, "height", 0, 65535, ns)
		if c.fixed {
			c.minW, c.minH = w, h
		} else {
			c.minW, c.minH = max(c.minW, w), max(c.minH, h)
		}
	}

	// Column widths and row heights: single-span cells first, then each
	// spanning cell, fewest spans first, shares what it still lacks
	// equally among its columns (rows).
	colW := make([]float64, ncols)
	rowH := make([]float64, nrows)
	order := make([]*tableCell, len(cells))
	copy(order, cells)
	slices.SortStableFunc(order, func(a, b *tableCell) int { return a.cspan - b.cspan })
	for _, c := range order {
		grow(colW[c.col:c.col+c.cspan], c.minW-float64(c.cspan-1)*spacing)
	}
	slices.SortStableFunc(order, func(a, b *tableCell) int { return a.rspan - b.rspan })
	for _, c := range order {
		grow(rowH[c.row:c.row+c.rspan], c.minH-float64(c.rspan-1)*spacing)
	}
	natW := sum(colW) + float64(ncols+1)*spacing + 2*border
	natH := sum(rowH) + float64(nrows+1)*spacing + 2*border
	if minW > natW && ncols > 0 {
		grow(colW, sum(colW)+minW-natW)
	}
	if minH > natH && nrows > 0 {
		grow(rowH, sum(rowH)+minH-natH)
	}
	t.W, t.H = max(natW, minW), max(natH, minH)

	// Cell boxes, from the table's top left corner.
	colX := make([]float64, ncols+1)
	colX[0] = border + spacing
	for c := range ncols {
		colX[c+1] = colX[c] + colW[c] + spacing
	}
	rowY := make([]float64, nrows+1)
	rowY[0] = border + spacing
	for r := range nrows {
		rowY[r+1] = rowY[r] + rowH[r] + spacing
	}
	for _, c := range cells {
		cell := c.cell
		cell.X, cell.Y = colX[c.col], rowY[c.row]
		cell.W = colX[c.col+c.cspan] - spacing - cell.X
		cell.H = rowY[c.row+c.rspan] - spacing - cell.Y
		cell.Table = c.nested
		t.Cells = append(t.Cells, cell)
	}
	return t, true
}

// spanFree reports whether columns col..col+n-1 are free of spans from
// above.
func spanFree(rowsLeft []int, col, n int) bool {
	for c := col; c < col+n && c < len(rowsLeft); c++ {
		if rowsLeft[c] > 0 {
			return false
		}
	}
	return true
}

// grow raises the sizes so that they sum to at least need, sharing the
// shortfall equally.
func grow(sizes []float64, need float64) {
	if have := sum(sizes); need > have && len(sizes) > 0 {
		d := (need - have) / float64(len(sizes))
		for i := range sizes {
			sizes[i] += d
		}
	}
}

func sum(xs []float64) float64 {
	s := 0.0
	for _, x := range xs {
		s += x
	}
	return s
}

// place moves the table's top left corner to (x, y) and its nested
// tables with their cells.
func (t *Table) place(x, y float64) {
	t.X, t.Y = x, y
	for i := range t.Cells {
		c := &t.Cells[i]
		c.X += x
		c.Y += y
		if c.Table == nil {
			continue
		}
		inner := c.Border + c.Pad
		bx := c.X + inner
		switch c.Align {
		case 'c':
			bx = c.X + (c.W-c.Table.W)/2
		case 'r':
			bx = c.X + c.W - inner - c.Table.W
		}
		by := c.Y + (c.H-c.Table.H)/2
		switch c.VAlign {
		case 't':
			by = c.Y + inner
		case 'b':
			by = c.Y + c.H - inner - c.Table.H
		}
		c.Table.place(bx, by)
	}
}
