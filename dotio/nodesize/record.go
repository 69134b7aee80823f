package nodesize

import (
	"strconv"
	"strings"
)

// maxRecordDepth bounds the nesting of { } in a record label; deeper
// braces are read as text, so a hostile label stays linear.
const maxRecordDepth = 64

// Field is a field of a record label: a leaf with text, or a group of
// fields laid out across (Vertical false) or down. X, Y, W, H are its box,
// from the record's top left corner, y down, in points.
type Field struct {
	Port       string // the <port> name, "" if none
	Lines      []Line // a leaf's text
	Vertical   bool   // a group's direction
	Fields     []*Field
	X, Y, W, H float64
	minW, minH float64
}

// hardSpace stands for an escaped blank ("\ ") while blanks are collapsed.
const hardSpace = '\uE000'

// parseRecord reads a record label into its fields. Top-level fields run
// across, or down when vertical is set (rankdir LR or RL); each { } flips
// the direction. Escapes \{ \} \| \< \> and "\ " make literal characters;
// other escapes are left for TextLines. A label with unbalanced braces is
// read as far as it goes, the missing } supplied, a stray } skipped (and
// named in the notes).
func parseRecord(s string, vertical bool, esc Escapes, size float64, ns *notes) *Field {
	root := &Field{Vertical: vertical}
	stack := []*Field{root}
	deep := 0 // braces past maxRecordDepth, read as text
	var text strings.Builder
	var port strings.Builder
	inPort, hasPort := false, false
	endField := func() {
		top := stack[len(stack)-1]
		f := &Field{}
		if hasPort {
			f.Port = strings.TrimSpace(strings.ReplaceAll(port.String(), string(hardSpace), " "))
		}
		f.Lines = TextLines(collapseBlanks(text.String()), esc, size)
		top.Fields = append(top.Fields, f)
		text.Reset()
		port.Reset()
		inPort, hasPort = false, false
	}
	// A group just closed ends its field without a leaf of its own.
	closed := false
	for i := 0; i < len(s); i++ {
		c := s[i]
		if c == '\\' && i+1 < len(s) {
			switch d := s[i+1]; d {
			case '{', '}', '|', '<', '>':
				i++
				if inPort {
					port.WriteByte(d)
				} else {
					text.WriteByte(d)
				}
				continue
			case ' ':
				i++
				if inPort {
					port.WriteRune(hardSpace)
				} else {
					text.WriteRune(hardSpace)
				}
				continue
			}
			// Kept for TextLines.
			text.WriteByte(c)
			text.WriteByte(s[i+1])
			i++
			continue
		}
		switch {
		case inPort && c == '>':
			inPort = false
		case inPort:
			port.WriteByte(c)
		case c == '<':
			inPort, hasPort = true, true
		case c == '|':
			if !closed {
				endField()
			}
			closed = false
		case c == '{' && len(stack) > maxRecordDepth:
			deep++
			text.WriteByte(c)
		case c == '{':
			if strings.TrimSpace(text.String()) != "" || hasPort {
				ns.add("record label with text before {")
				endField()
			}
			top := stack[len(stack)-1]
			g := &Field{Vertical: !top.Vertical}
			top.Fields = append(top.Fields, g)
			stack = append(stack, g)
			text.Reset()
			closed = false
		case c == '}' && deep > 0:
			deep--
			text.WriteByte(c)
		case c == '}' && len(stack) == 1:
			ns.add("record label with a stray }")
		case c == '}':
			if !closed {
				endField()
			}
			stack = stack[:len(stack)-1]
			closed = true
		default:
			if closed && c != ' ' && c != '\t' && c != '\n' {
				ns.add("record label with text after }")
				closed = false
			}
			text.WriteByte(c)
		}
	}
	if !closed || len(stack) > 1 || len(root.Fields) == 0 {
		endField()
	}
	if len(stack) > 1 {
		ns.add("record label with a missing }")
	}
	return root
}

// collapseBlanks trims a field's text and collapses its runs of blanks to
// one, then turns escaped blanks back into blanks.
func collapseBlanks(s string) string {
	s = strings.Join(strings.FieldsFunc(s, func(r rune) bool { return r == ' ' || r == '\t' }), " ")
	return strings.ReplaceAll(s, string(hardSpace), " ")
}

// measureRecord sets every field's least size: a leaf its text plus the
// margins on each side, a group the sum of its fields along its direction
// and the largest across it.
func (f *Field) measureRecord(mx, my float64) {
	// Post-order without recursion: the stack holds each group twice.
	type item struct {
		f    *Field
		done bool
	}
	stack := []item{{f, false}}
	for len(stack) > 0 {
		it := stack[len(stack)-1]
		stack = stack[:len(stack)-1]
		g := it.f
		if g.Fields == nil {
			w, h := measure(g.Lines, 0)
			g.minW, g.minH = w+2*mx, h+2*my
			continue
		}
		if !it.done {
			stack = append(stack, item{g, true})
			for _, k := range g.Fields {
				stack = append(stack, item{k, false})
			}
			continue
		}
		g.minW, g.minH = 0, 0
		for _, k := range g.Fields {
			if g.Vertical {
				g.minW, g.minH = max(g.minW, k.minW), g.minH+k.minH
			} else {
				g.minW, g.minH = g.minW+k.minW, max(g.minH, k.minH)
			}
		}
	}
}

// place sets the fields' boxes inside (x, y, w, h): along a group's
// direction each field gets its least size plus an equal share of what is
// left over (from memory: DOT shares extra room equally), across it the
// whole.
func (f *Field) place(x, y, w, h float64) {
	type item struct {
		f          *Field
		x, y, w, h float64
	}
	stack := []item{{f, x, y, w, h}}
	for len(stack) > 0 {
		it := stack[len(stack)-1]
		stack = stack[:len(stack)-1]
		g := it.f
		g.X, g.Y, g.W, g.H = it.x, it.y, it.w, it.h
		n := float64(len(g.Fields))
		if n == 0 {
			continue
		}
		if g.Vertical {
			extra := (it.h - g.minH) / n
			at := it.y
			for _, k := range g.Fields {
				stack = append(stack, item{k, it.x, at, it.w, k.minH + extra})
				at += k.minH + extra
			}
		} else {
			extra := (it.w - g.minW) / n
			at := it.x
			for _, k := range g.Fields {
				stack = append(stack, item{k, at, it.y, k.minW + extra, it.h})
				at += k.minW + extra
			}
		}
	}
}

// Leaves calls visit for every field that holds text, in label order.
func (f *Field) Leaves(visit func(*Field)) {
	stack := []*Field{f}
	for len(stack) > 0 {
		g := stack[len(stack)-1]
		stack = stack[:len(stack)-1]
		if g.Fields == nil {
			visit(g)
			continue
		}
		for i := len(g.Fields) - 1; i >= 0; i-- {
			stack = append(stack, g.Fields[i])
		}
	}
}

// Groups calls visit for every group, outermost first, for drawing the
// lines between its fields.
func (f *Field) Groups(visit func(*Field)) {
	stack := []*Field{f}
	for len(stack) > 0 {
		g := stack[len(stack)-1]
		stack = stack[:len(stack)-1]
		if g.Fields == nil {
			continue
		}
		visit(g)
		for i := len(g.Fields) - 1; i >= 0; i-- {
			stack = append(stack, g.Fields[i])
		}
	}
}

// String shows the field tree, for tests and messages: leaves as their
// text (with <port>), groups in braces, fields separated by |.
func (f *Field) String() string {
	var b strings.Builder
	var walk func(g *Field, top bool)
	walk = func(g *Field, top bool) {
		if g.Fields == nil {
			if g.Port != "" {
				b.WriteString("<" + g.Port + ">")
			}
			parts := make([]string, len(g.Lines))
			for i, l := range g.Lines {
				parts[i] = l.Text()
			}
			b.WriteString(strconv.Quote(strings.Join(parts, "\n")))
			return
		}
		if !top {
			b.WriteString("{")
		}
		for i, k := range g.Fields {
			if i > 0 {
				b.WriteString("|")
			}
			walk(k, false)
		}
		if !top {
			b.WriteString("}")
		}
	}
	walk(f, true)
	return b.String()
}
