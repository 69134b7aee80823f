package nodesize

import (
	"strings"
	"unicode/utf8"
)

// Text measures (common practice for proportional fonts: an average
// character is about 0.6 em wide, a line 1.2 em apart).
const (
	CharWidthEm  = 0.6
	LineHeightEm = 1.2
)

// Label is a laid-out label. Exactly one of Lines, Record and Table holds
// its content; an empty label has none. Sizes are in points; positions
// inside are from the label's top left corner, y down.
type Label struct {
	W, H     float64 // the content's extent, without the node's margin
	FontSize float64
	Lines    []Line // a text label (plain or HTML text)
	Record   *Field // a record label; its fields fill the node's outline
	Table    *Table // an HTML table
	// Notes names what the label holds that is not laid out (an HTML IMG,
	// an unknown table attribute, a malformed record), each once.
	Notes []string
}

// Empty reports whether the label shows nothing.
func (l *Label) Empty() bool {
	return l == nil || len(l.Lines) == 0 && l.Record == nil && l.Table == nil
}

// Line is one line of text.
type Line struct {
	Runs []Run
	Just byte    // 'c' centred, 'l' left, 'r' right
	W, H float64 // points
}

// Text is the line's text, runs joined.
func (l Line) Text() string {
	var b strings.Builder
	for _, r := range l.Runs {
		b.WriteString(r.Text)
	}
	return b.String()
}

// Run is a piece of a line in one style.
type Run struct {
	Text                            string
	Size                            float64 // points
	Bold, Italic, Underline, Strike bool
	Color                           string // an HTML FONT COLOR, as written; "" if none
}

// runWidth estimates the advance of a run.
func runWidth(r Run) float64 {
	return float64(utf8.RuneCountInString(r.Text)) * CharWidthEm * r.Size
}

// measure sets each line's size and returns the lines' extent.
func measure(lines []Line, size float64) (w, h float64) {
	for i := range lines {
		l := &lines[i]
		l.W, l.H = 0, 0
		for _, r := range l.Runs {
			l.W += runWidth(r)
			l.H = max(l.H, r.Size*LineHeightEm)
		}
		if len(l.Runs) == 0 {
			l.H = size * LineHeightEm
		}
		w = max(w, l.W)
		h += l.H
	}
	return w, h
}

// Escapes holds what DOT's label escapes stand for: \N the node's name,
// \G the graph's, \E the edge's ("tail -> head"), \T its tail's name and
// \H its head's. An escape with nothing set stands for its letter.
type Escapes struct {
	N, G, E, T, H string
	HasN, HasE    bool // whether \N (nodes) and \E, \T, \H (edges) apply
}

// TextLines applies DOT's escapes to a plain label and breaks it into
// lines at \n, \l and \r (which end a line centred, left or right
// aligned) and at line feeds. A backslash before any other character
// stands for that character; \\ is a backslash. A label ending in a line
// break has no empty last line; "" has no lines at all.
func TextLines(s string, esc Escapes, size float64) []Line {
	var lines []Line
	var cur strings.Builder
	end := func(just byte) {
		lines = append(lines, Line{Runs: []Run{{Text: cur.String(), Size: size}}, Just: just})
		cur.Reset()
	}
	for i := 0; i < len(s); i++ {
		c := s[i]
		if c == '\n' {
			end('c')
			continue
		}
		if c == '\r' {
			continue
		}
		if c != '\\' || i+1 == len(s) {
			cur.WriteByte(c)
			continue
		}
		i++
		switch d := s[i]; {
		case d == 'n':
			end('c')
		case d == 'l':
			end('l')
		case d == 'r':
			end('r')
		case d == 'N' && esc.HasN:
			cur.WriteString(esc.N)
		case d == 'G':
			cur.WriteString(esc.G)
		case d == 'E' && esc.HasE:
			cur.WriteString(esc.E)
		case d == 'T' && esc.HasE:
			cur.WriteString(esc.T)
		case d == 'H' && esc.HasE:
			cur.WriteString(esc.H)
		default:
			cur.WriteByte(d)
		}
	}
	if cur.Len() > 0 {
		end('c')
	}
	for i := range lines {
		if lines[i].Runs[0].Text == "" {
			lines[i].Runs = nil
		}
	}
	measure(lines, size)
	return lines
}

// PlainName is a node or graph name as text: an HTML name (html set,
// name in its angle brackets) without its tags, its lines joined by blanks.
func PlainName(name string, html bool) string {
	if !html || !isHTML(name) {
		return name
	}
	lines := parseHTMLText(name[1:len(name)-1], 1)
	parts := make([]string, 0, len(lines))
	for _, l := range lines {
		parts = append(parts, l.Text())
	}
	return strings.Join(parts, " ")
}

func isHTML(s string) bool { return len(s) >= 2 && s[0] == '<' && s[len(s)-1] == '>' }
