package nodesize

import (
	"fmt"
	"math"
	"strings"
	"testing"

	"github.com/gridwood/gridwood/dotio"
)

func readGraph(t testing.TB, src string) *dotio.Graph {
	t.Helper()
	f, err := dotio.Read([]byte(src), dotio.ReadOptions{Name: "test"})
	if err != nil {
		t.Fatal(err)
	}
	return f.Graphs[0]
}

// nodeOf sizes the node named name of the one-graph DOT text src.
func nodeOf(t *testing.T, src, name string) Node {
	t.Helper()
	g := readGraph(t, src)
	v, ok := g.Lookup(name)
	if !ok {
		t.Fatalf("no node %q", name)
	}
	return New(g).Node(v)
}

func close2(a, b float64) bool { return math.Abs(a-b) < 1e-6 }

// TestBoxRule: each case is one node and the box the DOT language's
// rules give it (the rules from memory of its documentation, SOURCES.md;
// the figures worked by hand beside each case). A character is 0.6 em,
// a line 1.2 em (common practice), so at 14 points a character is 8.4
// points and a line 16.8; the margin adds 16 across and 8 down.
func TestBoxRule(t *testing.T) {
	cases := []struct {
		name, src    string
		w, h         float64 // the box
		shapeW       float64 // the outline's width, 0 for the box's
		exactW, exth string
	}{
		// Defaults: 0.75 x 0.5 inch; "a" needs 8.4+16 by 16.8+8.
		{"default", `graph { a }`, 54, 36, 0, "0.75", "0.5"},
		// 10 characters: 84 + 16 = 100 across.
		{"long label", `graph { a [label="abcdefghij"] }`, 100, 36, 0, "", "0.5"},
		// Two lines: 2 x 16.8 + 8 = 41.6 down.
		{"two lines", `graph { a [label="ab\ncd"] }`, 54, 41.6, 0, "0.75", ""},
		// fontsize 30: "ab" is 2 x 18 + 16 = 52 across, 36 + 8 = 44 down.
		{"fontsize", `graph { a [label="ab", fontsize=30] }`, 54, 44, 0, "0.75", ""},
		// fixedsize=true: the attributes, whatever the label.
		{"fixedsize", `graph { a [label="a long label indeed", fixedsize=true] }`, 54, 36, 0, "0.75", "0.5"},
		// fixedsize=shape: the outline stays, the box holds the label
		// (19 x 8.4 + 16 = 175.6).
		{"fixedsize shape", `graph { a [label="a long label indeed", fixedsize=shape] }`, 175.6, 36, 54, "", "0.5"},
		// margin="0.5,0.25": 36 and 18 a side: "a" is 8.4+72 by 16.8+36.
		{"margin", `graph { a [margin="0.5,0.25"] }`, 80.4, 52.8, 0, "", ""},
		{"margin one value", `graph { a [margin=0] }`, 54, 36, 0, "0.75", "0.5"},
		// A circle: width alone sets it (the case: 0.3 inch, not
		// 0.5).
		{"circle width fixed", `graph { a [shape=circle, width=0.3, fixedsize=true] }`, 21.6, 21.6, 0, "0.3", "0.3"},
		{"circle height alone", `graph { a [shape=circle, height=0.9, label=""] }`, 64.8, 64.8, 0, "0.9", "0.9"},
		{"circle larger of both", `graph { a [shape=circle, width=0.4, height=0.7, label=""] }`, 50.4, 50.4, 0, "0.7", "0.7"},
		{"circle neither", `graph { a [shape=circle, label=""] }`, 36, 36, 0, "0.5", "0.5"},
		// A label needs the least circle around its box: hypot(24.4,
		// 24.8) = 34.79; the default 36 holds it.
		{"circle label fits", `graph { a [shape=circle] }`, 36, 36, 0, "0.5", "0.5"},
		// "abcdef": 50.4+16 = 66.4 by 24.8: hypot = 70.88.
		{"circle grows", `graph { a [shape=circle, label="abcdef"] }`, math.Hypot(66.4, 24.8), math.Hypot(66.4, 24.8), 0, "", ""},
		// doublecircle: a second ring 4 points out: 34.79 + 8 = 42.79.
		{"doublecircle", `graph { a [shape=doublecircle] }`, math.Hypot(24.4, 24.8) + 8, math.Hypot(24.4, 24.8) + 8, 0, "", ""},
		{"point default", `graph { a [shape=point] }`, 3.6, 3.6, 0, "0.05", "0.05"},
		{"point width", `graph { a [shape=point, width=0.2, label="ignored label"] }`, 14.4, 14.4, 0, "0.2", "0.2"},
		// peripheries=3 on a box: 2 more rings, 8 a side each: 54 is
		// still wider than 24.4+16, and 36 holds 24.8+16.
		{"peripheries", `graph { a [shape=box, peripheries=3, label="abcdefghij"] }`, 116, 40.8, 0, "", ""},
		// An ellipse holds the label's box: with the height 36 given, the
		// width w with (50/w)^2 + (12.4/18)^2 = 1 per half: 100 / sqrt(1 -
		// (24.8/36)^2) = 137.97.
		{"ellipse", `graph { a [shape=ellipse, label="abcdefghij"] }`, 100 / math.Sqrt(1-math.Pow(24.8/36, 2)), 36, 0, "", "0.5"},
		// A diamond: height 2 x 24.8 = 49.6, width 2 x 24.4 = 48.8 < 54.
		{"diamond", `graph { a [shape=diamond] }`, 54, 49.6, 0, "0.75", ""},
		// plain: no size and no margin of its own: the text alone.
		{"plain", `graph { a [shape=plain, label="ab"] }`, 16.8, 16.8, 0, "", ""},
		// An empty label leaves the default size; so does an unset one
		// of an empty name.
		{"empty label", `graph { a [label="", width=0.2, height=0.1] }`, 14.4, 7.2, 0, "0.2", "0.1"},
		// Record fields: "1" and "2" across, each 8.4+16 = 24.4; the
		// record's 54 x 36 holds them.
		{"record", `graph { a [shape=record, label="<p1> 1|<p2> 2"] }`, 54, 36, 0, "0.75", "0.5"},
		// Fields "abcdef|abcdef": 2 x 66.4 = 132.8 across.
		{"record across", `graph { a [shape=record, label="abcdef|abcdef"] }`, 132.8, 36, 0, "", "0.5"},
		// "{a|b|c}" flips down: 3 x 24.8 = 74.4.
		{"record down", `graph { a [shape=record, label="{a|b|c}"] }`, 54, 74.4, 0, "0.75", ""},
		// rankdir=LR starts down: "a|b|c" is then 74.4 high.
		{"record rankdir", `graph { rankdir=LR; a [shape=record, label="a|b|c"] }`, 54, 74.4, 0, "0.75", ""},
		// A one-cell table, defaults BORDER 1, CELLPADDING 2,
		// CELLSPACING 2: cell 8.4 + 2 x (2+1) = 14.4 by 22.8, table 14.4
		// + 2 x 2 + 2 x 1 = 20.4 by 28.8, plus the margin 16 x 8.
		{"table", `graph { a [shape=none, label=<<TABLE><TR><TD>x</TD></TR></TABLE>>] }`, 54, 36.8, 0, "0.75", ""},
		// No border, padding or spacing: the text, 10 characters.
		{"table bare", `graph { a [shape=none, margin=0, label=<<TABLE BORDER="0" CELLPADDING="0" CELLSPACING="0"><TR><TD>abcdefghij</TD></TR></TABLE>>] }`, 84, 36, 0, "", "0.5"},
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			n := nodeOf(t, c.src, "a")
			sw := c.shapeW
			if sw == 0 {
				sw = c.w
			}
			if !close2(n.W, c.w) || !close2(n.H, c.h) || !close2(n.ShapeW, sw) {
				t.Errorf("box %v x %v, outline %v wide; want %v x %v, %v", n.W, n.H, n.ShapeW, c.w, c.h, sw)
			}
			if n.ExactW != c.exactW || n.ExactH != c.exth {
				t.Errorf("exact %q x %q, want %q x %q", n.ExactW, n.ExactH, c.exactW, c.exth)
			}
		})
	}
}

// TestLabels: escapes, empty labels and which lines a label shows.
func TestLabels(t *testing.T) {
	cases := []struct {
		src   string
		lines string // lines joined by |, each prefixed by its justification
	}{
		{`digraph Town { a }`, "c:a"},
		{`digraph Town { a [label="\N in \G"] }`, "c:a in Town"},
		{`digraph Town { a [label=""] }`, ""},
		{`digraph Town { a [label="left\lright\rmid\n"] }`, "l:left|r:right|c:mid"},
		{`digraph Town { a [label="x\\y \q"] }`, `c:x\y q`},
		{`digraph Town { <<b>bold</b> name> }`, "c:bold name"},
		{`digraph "Q\"x" { a [label="\G"] }`, `c:Q"x`},
		{`digraph Town { a [label=<one<BR ALIGN="LEFT"/>two &amp; <i>three</i>>] }`, "l:one|c:two & three"},
		{`digraph Town { a [label=<   spaced    out   >] }`, "c:spaced out"},
	}
	for _, c := range cases {
		n := nodeOf(t, c.src, firstName(t, c.src))
		var parts []string
		for _, l := range n.Label.Lines {
			parts = append(parts, string(l.Just)+":"+l.Text())
		}
		if got := strings.Join(parts, "|"); got != c.lines {
			t.Errorf("%s: lines %q, want %q", c.src, got, c.lines)
		}
	}
	// HTML text styles reach the runs.
	n := nodeOf(t, `graph { a [label=<<B>b</B><I>i</I><U>u</U><FONT POINT-SIZE="20" COLOR="red">f</FONT>>] }`, "a")
	r := n.Label.Lines[0].Runs
	if len(r) != 4 || !r[0].Bold || !r[1].Italic || !r[2].Underline || r[3].Size != 20 || r[3].Color != "red" {
		t.Errorf("runs %+v", r)
	}
	// The line is as high as its largest run: 1.2 x 20.
	if !close2(n.Label.Lines[0].H, 24) {
		t.Errorf("line height %v, want 24", n.Label.Lines[0].H)
	}
	// Edge labels know \E, \T and \H; \N is a node's.
	g := readGraph(t, `digraph G { a -> b [label="\E \T \H \N"] }`)
	if got := New(g).EdgeLabel(0).Lines[0].Text(); got != "a -> b a b N" {
		t.Errorf("edge label %q", got)
	}
}

func firstName(t *testing.T, src string) string {
	return readGraph(t, src).Nodes[0].Name
}

// TestRecordFields: the field tree of record labels (DOT's record grammar,
// from memory: | separates, {} flips, <port> names, backslash escapes).
func TestRecordFields(t *testing.T) {
	cases := []struct{ label, want, note string }{
		{`<p1> 1|<p2> 2`, `<p1>"1"|<p2>"2"`, ""},
		{`{a|{b|c}|d}`, `{"a"|{"b"|"c"}|"d"}`, ""},
		{`\{x\}\|\<y\>`, `"{x}|<y>"`, ""},
		{`a\ \ b   c`, `"a  b c"`, ""},
		{`  spaced  `, `"spaced"`, ""},
		{`a||b`, `"a"|""|"b"`, ""},
		{`{a|b`, `{"a"|"b"}`, "record label with a missing }"},
		{`a}b`, `"ab"`, "record label with a stray }"},
		{`x{a}`, `"x"|{"a"}`, "record label with text before {"},
		{`top\nline`, `"top\nline"`, ""},
		{``, `""`, ""},
	}
	for _, c := range cases {
		var ns notes
		f := parseRecord(c.label, false, Escapes{}, 14, &ns)
		if got := f.String(); got != c.want {
			t.Errorf("%q: fields %s, want %s", c.label, got, c.want)
		}
		if c.note == "" && len(ns) > 0 || c.note != "" && (len(ns) == 0 || ns[0] != c.note) {
			t.Errorf("%q: notes %q, want %q", c.label, ns, c.note)
		}
	}
	// Directions: across at the top, down inside one pair of braces.
	f := parseRecord(`a|{b|c}`, false, Escapes{}, 14, new(notes))
	if f.Vertical || !f.Fields[1].Vertical {
		t.Error("directions do not flip")
	}
	// Placing: extra room shared equally. "a|bbbbbbbbbbbbbbbbbbbb" in 300
	// points: least widths 24.4 and 184, 91.6 over, 45.8 each.
	n := nodeOf(t, `graph { r [shape=record, width=4.16667, label="a|bbbbbbbbbbbbbbbbbbbb"] }`, "r")
	rec := n.Label.Record
	if w0, w1 := rec.Fields[0].W, rec.Fields[1].W; !close2(w0, 24.4+(n.ShapeW-208.4)/2) || !close2(w0+w1, n.ShapeW) {
		t.Errorf("fields %v and %v wide in %v", w0, w1, n.ShapeW)
	}
}

// TestTables: cells on the grid (COLSPAN, ROWSPAN) and their sizes.
func TestTables(t *testing.T) {
	l := htmlLabel(`<TABLE CELLSPACING="0" CELLPADDING="0" BORDER="0">
		<TR><TD ROWSPAN="2">tall</TD><TD>a</TD><TD>b</TD></TR>
		<TR><TD COLSPAN="2">wide cell</TD></TR>
	</TABLE>`, 10)
	if l.Table == nil || len(l.Table.Cells) != 4 {
		t.Fatalf("label %+v", l)
	}
	c := l.Table.Cells
	// At 10 points a character is 6 wide, a line 12 high; no padding,
	// spacing or borders. Columns: "tall" 24; then "a" and "b" 6 each,
	// grown to share "wide cell" (54): 27 each.
	want := [][4]float64{{0, 0, 24, 24}, {24, 0, 27, 12}, {51, 0, 27, 12}, {24, 12, 54, 12}}
	for i, w := range want {
		if !close2(c[i].X, w[0]) || !close2(c[i].Y, w[1]) || !close2(c[i].W, w[2]) || !close2(c[i].H, w[3]) {
			t.Errorf("cell %d at %v,%v size %v x %v, want %v", i, c[i].X, c[i].Y, c[i].W, c[i].H, w)
		}
	}
	if !close2(l.W, 78) || !close2(l.H, 24) {
		t.Errorf("table %v x %v, want 78 x 24", l.W, l.H)
	}
	// A nested table sits inside its cell.
	l = htmlLabel(`<TABLE><TR><TD><TABLE><TR><TD>in</TD></TR></TABLE></TD></TR></TABLE>`, 10)
	inner := l.Table.Cells[0].Table
	if inner == nil || inner.X < l.Table.Cells[0].X || inner.X+inner.W > l.Table.Cells[0].X+l.Table.Cells[0].W {
		t.Errorf("nested table %+v not inside its cell %+v", inner, l.Table.Cells[0])
	}
	// What is not laid out is named.
	l = htmlLabel(`<TABLE SIDES="LT"><TR><TD><IMG SRC="x.png"/></TD></TR><HR/></TABLE>`, 10)
	for _, want := range []string{"HTML TABLE SIDES", "HTML IMG", "HTML HR and VR rules"} {
		if !strings.Contains(strings.Join(l.Notes, ";"), want) {
			t.Errorf("notes %q lack %q", l.Notes, want)
		}
	}
	// Text beside a table makes the label text: the cells' text, rows as
	// lines.
	l = htmlLabel(`before<TABLE><TR><TD>a</TD><TD>b</TD></TR><TR><TD>c</TD></TR></TABLE>`, 10)
	var got []string
	for _, ln := range l.Lines {
		got = append(got, ln.Text())
	}
	if l.Table != nil || strings.Join(got, "|") != "beforea b|c" {
		t.Errorf("mixed label lines %q", got)
	}
}

// TestCaps: no side beyond MaxSide; the node is marked.
func TestCaps(t *testing.T) {
	n := nodeOf(t, fmt.Sprintf(`graph { a [fontsize=999, label=%q] }`, strings.Repeat("x", 200)), "a")
	if !n.Capped || n.W != MaxSide || n.H > MaxSide {
		t.Errorf("box %v x %v capped %v", n.W, n.H, n.Capped)
	}
	// A width of 1000 inches or more, or not a number, counts as unset.
	for _, w := range []string{"1000", "abc", "-1", "NaN"} {
		n := nodeOf(t, fmt.Sprintf(`graph { a [width=%q, label=""] }`, w), "a")
		if n.W != 54 || n.Capped {
			t.Errorf("width %q: box %v wide, want the default 54", w, n.W)
		}
	}
}

// TestEdgeLabelHalves: half sizes of edge labels, 0 for none.
func TestEdgeLabelHalves(t *testing.T) {
	g := readGraph(t, `digraph G { a -> b [label="abc"]; b -> c; c -> a [label="x\ny", fontsize=10]; a -> c [label=""] }`)
	hw, hh := EdgeLabelHalves(g)
	want := [][2]float64{{25.2 / 2, 16.8 / 2}, {0, 0}, {6.0 / 2, 24.0 / 2}, {0, 0}}
	for i, w := range want {
		if !close2(hw[i], w[0]) || !close2(hh[i], w[1]) {
			t.Errorf("edge %d: %v x %v, want %v", i, hw[i], hh[i], w)
		}
	}
}

// TestShapesHoldTheirLabels: for every shape of the catalog, the label's
// box (with its margin) lies inside the outline it is given: its corners
// pass the outline's own inside test.
func TestShapesHoldTheirLabels(t *testing.T) {
	for name, s := range shapes {
		if s.Kind != Polygon && s.Kind != Ellipse {
			continue
		}
		for _, label := range []string{"a", "a longer label", "two\nlines"} {
			n := nodeOf(t, fmt.Sprintf(`graph { a [shape=%s, label=%q] }`, name, label), "a")
			if name == "point" {
				continue
			}
			ring := 2 * PeripheryGap * float64(max(n.Peripheries-1, 0))
			w, h := n.ShapeW-ring, n.ShapeH-ring
			cw, ch := n.Label.W+2*n.MarginX, n.Label.H+2*n.MarginY
			for _, c := range [][2]float64{{1, 1}, {-1, 1}, {1, -1}, {-1, -1}} {
				x, y := c[0]*cw/2/w, c[1]*ch/2/h // in the unit box
				in := false
				if s.Kind == Ellipse {
					in = 4*x*x+4*y*y <= 1+1e-9
				} else {
					in = rayToOutline(s.Poly, 0, y, math.Copysign(1, x)) >= math.Abs(x)-1e-9
				}
				if !in {
					t.Errorf("%s, label %q: corner (%v, %v) outside the %v x %v outline", name, label, x, y, w, h)
				}
			}
		}
	}
}

// FuzzLabels: record and HTML labels of any text lay out without panic,
// with sizes that are numbers.
func FuzzLabels(f *testing.F) {
	for _, s := range []string{"<p1> a|{b|<c> c}", `\{\}\|`, "{{{{", "}}}}", "<TABLE><TR><TD COLSPAN=\"3\">x</TD></TR></TABLE>",
		"<TABLE><TR><TD ROWSPAN=\"9\">a</TD></TR><TR><TD>b</TD></TR></TABLE>", "a<BR/>b<B>c</B>", "<TABLE><TR><TD><TABLE></TABLE></TD></TR></TABLE>"} {
		f.Add(s)
	}
	f.Fuzz(func(t *testing.T, s string) {
		var ns notes
		r := parseRecord(s, false, Escapes{}, 14, &ns)
		r.measureRecord(8, 4)
		r.place(0, 0, r.minW+10, r.minH+10)
		l := htmlLabel(s, 14)
		for _, v := range []float64{r.minW, r.minH, l.W, l.H} {
			if math.IsNaN(v) || math.IsInf(v, 0) || v < 0 {
				t.Fatalf("%q: size %v", s, v)
			}
		}
	})
}

// TestHostileLabels: deep nesting and huge spans stay bounded and linear.
func TestHostileLabels(t *testing.T) {
	deep := strings.Repeat("{", 100000) + "x" + strings.Repeat("}", 100000)
	var ns notes
	f := parseRecord(deep, false, Escapes{}, 14, &ns)
	f.measureRecord(8, 4)
	if f.minW <= 0 {
		t.Error("deep record has no size")
	}
	html := strings.Repeat("<B>", 100000) + "x"
	if l := htmlLabel(html, 14); len(l.Lines) != 1 || l.Lines[0].Text() != "x" {
		t.Errorf("deep HTML: %+v", l.Lines)
	}
	tables := strings.Repeat("<TABLE><TR><TD>", 100) + "x" + strings.Repeat("</TD></TR></TABLE>", 100)
	if l := htmlLabel(tables, 14); l.Table == nil || !strings.Contains(strings.Join(l.Notes, ";"), "nested deeper") {
		t.Errorf("deep tables: notes %q", l.Notes)
	}
	var b strings.Builder
	b.WriteString("<TABLE>")
	for range 2000 {
		b.WriteString(`<TR><TD COLSPAN="1000">x</TD></TR>`)
	}
	b.WriteString("</TABLE>")
	if l := htmlLabel(b.String(), 14); l.Table != nil || !strings.Contains(strings.Join(l.Notes, ";"), "grid cells") {
		t.Errorf("huge grid laid out as a table; notes %q", l.Notes)
	}
}
