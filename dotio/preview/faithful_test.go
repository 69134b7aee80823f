package preview

import (
	"bytes"
	"slices"
	"strings"
	"testing"
)

// nodeNamed returns the drawn node whose tooltip is name.
func nodeNamed(t *testing.T, root *xmlNode, name string) *xmlNode {
	t.Helper()
	for _, n := range root.find(byClass("g", "node")) {
		if n.title() == name {
			return n
		}
	}
	t.Fatalf("no node %q drawn", name)
	return nil
}

func edgeNamed(root *xmlNode, name string) *xmlNode {
	for _, e := range root.find(func(x *xmlNode) bool { return byClass("g", "edge")(x) || byClass("g", "removed")(x) }) {
		if e.title() == name {
			return e
		}
	}
	return nil
}

// texts lists the text of every text element under n, in order.
func texts(n *xmlNode) []string {
	var out []string
	for _, x := range n.find(byTag("text")) {
		out = append(out, x.allText())
	}
	return out
}

func shapesOf(n *xmlNode) []*xmlNode { return n.find(byClass("", "shape")) }

// TestDrawsWhatTheDOTSays: each case is a small graph and what its picture
// must hold, after the list (labels with escapes, colours, styles,
// pen widths, shapes, records and tables as cells, arrowheads) and the
// DOT language's definitions (from memory; SOURCES.md).
func TestDrawsWhatTheDOTSays(t *testing.T) {
	cases := []struct {
		name, src string
		check     func(t *testing.T, root *xmlNode, doc string, res Result)
	}{
		{"edge label", `digraph G { a -> b [label="cap 96"] }`, func(t *testing.T, root *xmlNode, doc string, res Result) {
			if got := texts(root.find(byClass("g", "edge-labels"))[0]); !slices.Contains(got, "cap 96") {
				t.Errorf("edge labels %q", got)
			}
		}},
		{"graph label, and the title stays the ID", `graph Site { label="Site plan"; a }`, func(t *testing.T, root *xmlNode, doc string, res Result) {
			gl := root.find(byClass("g", "graph-label"))
			if len(gl) != 1 || gl[0].allText() != "Site plan" {
				t.Errorf("graph label %v", gl)
			}
			if title := root.find(byClass("text", "title"))[0].allText(); title != "Site" {
				t.Errorf("title %q", title)
			}
		}},
		{"xlabels", `digraph G { a [xlabel="outside"]; a -> b [xlabel="beside"] }`, func(t *testing.T, root *xmlNode, doc string, res Result) {
			got := texts(root.find(byClass("g", "edge-labels"))[0])
			if !slices.Contains(got, "outside") || !slices.Contains(got, "beside") {
				t.Errorf("xlabels %q", got)
			}
		}},
		{"head and tail labels", `digraph G { a -> b [headlabel="H", taillabel="T"] }`, func(t *testing.T, root *xmlNode, doc string, res Result) {
			got := texts(root.find(byClass("g", "edge-labels"))[0])
			if !slices.Contains(got, "H") || !slices.Contains(got, "T") {
				t.Errorf("end labels %q", got)
			}
		}},
		{"escapes", `digraph Town { a [label="\N of \G"]; b [label="left\lright\rmid"]; a -> b [label="\E; \T to \H"] }`, func(t *testing.T, root *xmlNode, doc string, res Result) {
			if got := texts(nodeNamed(t, root, "a")); !slices.Equal(got, []string{"a of Town"}) {
				t.Errorf("a shows %q", got)
			}
			b := nodeNamed(t, root, "b").find(byClass("text", "label"))
			if len(b) != 3 || b[0].allText() != "left" || b[0].attr("text-anchor") != "start" ||
				b[1].allText() != "right" || b[1].attr("text-anchor") != "end" ||
				b[2].allText() != "mid" || b[2].attr("text-anchor") != "middle" {
				t.Errorf("b's lines are not left, right and centred")
			}
			if got := texts(root.find(byClass("g", "edge-labels"))[0]); !slices.Contains(got, "a -> b; a to b") {
				t.Errorf("edge label %q", got)
			}
		}},
		{"empty label", `graph G { a [label=""]; b }`, func(t *testing.T, root *xmlNode, doc string, res Result) {
			if got := texts(nodeNamed(t, root, "a")); len(got) != 0 {
				t.Errorf("label=\"\" shows %q", got)
			}
			if got := texts(nodeNamed(t, root, "b")); !slices.Equal(got, []string{"b"}) {
				t.Errorf("an unset label shows %q, want the name", got)
			}
		}},
		{"colours", `digraph G {
				a [color=red, fontcolor=blue]
				b [style=filled, fillcolor="#00ff0080"]
				c [style=filled, color="0.000 1.000 1.000"]
				d [style=filled]
				a -> b [color=navy, fontcolor=crimson, label=x]
			}`, func(t *testing.T, root *xmlNode, doc string, res Result) {
			a := nodeNamed(t, root, "a")
			if s := shapesOf(a)[0]; s.attr("stroke") != "#ff0000" || s.attr("fill") != nodeFill {
				t.Errorf("a: stroke %q fill %q", s.attr("stroke"), s.attr("fill"))
			}
			if l := a.find(byClass("text", "label"))[0]; l.attr("fill") != "#0000ff" {
				t.Errorf("a's fontcolor %q", l.attr("fill"))
			}
			if s := shapesOf(nodeNamed(t, root, "b"))[0]; s.attr("fill") != "#00ff00" || s.attr("fill-opacity") != "0.5" {
				t.Errorf("b: fill %q opacity %q", s.attr("fill"), s.attr("fill-opacity"))
			}
			if s := shapesOf(nodeNamed(t, root, "c"))[0]; s.attr("fill") != "#ff0000" {
				t.Errorf("c (HSV 0 1 1, filled in its color) fill %q", s.attr("fill"))
			}
			if s := shapesOf(nodeNamed(t, root, "d"))[0]; s.attr("fill") != filledDefault {
				t.Errorf("d (filled, no colour) fill %q, want lightgrey", s.attr("fill"))
			}
			if e := edgeNamed(root, "a -> b"); e == nil || e.attr("stroke") != "#000080" {
				t.Errorf("edge stroke %v", e)
			}
			el := root.find(byClass("g", "edge-labels"))[0].find(byClass("text", "label"))
			if len(el) != 1 || el[0].attr("fill") != "#dc143c" {
				t.Errorf("edge fontcolor: %v", el)
			}
		}},
		{"styles and pen widths", `digraph G {
				a [style=dashed]; b [style="dotted, bold"]; c [style=invis]; d [penwidth=3]; e [style="setlinewidth(4)"]
				a -> b [style=dashed]; b -> d [style=bold]; a -> d [style=invis]; d -> e [penwidth=5]
			}`, func(t *testing.T, root *xmlNode, doc string, res Result) {
			if s := shapesOf(nodeNamed(t, root, "a"))[0]; s.attr("stroke-dasharray") == "" {
				t.Error("a is not dashed")
			}
			b := shapesOf(nodeNamed(t, root, "b"))[0]
			if b.attr("stroke-dasharray") == "" || atof(t, b.attr("stroke-width")) != 2*nodePen {
				t.Errorf("b: dashes %q width %q", b.attr("stroke-dasharray"), b.attr("stroke-width"))
			}
			for _, n := range root.find(byClass("g", "node")) {
				if n.title() == "c" {
					t.Error("the invisible node c is drawn")
				}
			}
			if w := shapesOf(nodeNamed(t, root, "d"))[0].attr("stroke-width"); w != "3" {
				t.Errorf("d's penwidth drawn %q", w)
			}
			if w := shapesOf(nodeNamed(t, root, "e"))[0].attr("stroke-width"); w != "4" {
				t.Errorf("e's setlinewidth drawn %q", w)
			}
			if e := edgeNamed(root, "a -> b"); e == nil || e.attr("stroke-dasharray") == "" {
				t.Error("a -> b is not dashed")
			}
			if e := edgeNamed(root, "b -> d"); e == nil || atof(t, e.attr("stroke-width")) != 2*edgePen {
				t.Error("b -> d is not bold")
			}
			if edgeNamed(root, "a -> d") != nil {
				t.Error("the invisible edge a -> d is drawn")
			}
			if e := edgeNamed(root, "d -> e"); e == nil || e.attr("stroke-width") != "5" {
				t.Error("d -> e is not 5 wide")
			}
		}},
		{"shapes", `graph G {
				box [shape=box]; ell [shape=ellipse]; cir [shape=circle]; dc [shape=doublecircle]
				pt [shape=point]; pl [shape=plaintext]; dia [shape=diamond]; hou [shape=house]
				cyl [shape=cylinder]; doc [shape=doubleoctagon]; own
			}`, func(t *testing.T, root *xmlNode, doc string, res Result) {
			kinds := func(name string) string {
				var k []string
				for _, s := range shapesOf(nodeNamed(t, root, name)) {
					k = append(k, s.XMLName.Local)
				}
				return strings.Join(k, " ")
			}
			for name, want := range map[string]string{
				"box": "rect", "ell": "ellipse", "cir": "ellipse", "dc": "ellipse ellipse", "pt": "ellipse",
				"pl": "rect", "dia": "polygon", "hou": "polygon", "cyl": "path ellipse",
				"doc": "polygon polygon", "own": "rect",
			} {
				if got := kinds(name); got != want {
					t.Errorf("%s drawn as %q, want %q", name, got, want)
				}
			}
			if s := shapesOf(nodeNamed(t, root, "box"))[0]; s.attr("rx") != "" {
				t.Error("shape=box drawn with rounded corners")
			}
			if s := shapesOf(nodeNamed(t, root, "own"))[0]; s.attr("rx") == "" || s.attr("fill") != nodeFill {
				t.Error("a node without shape is not in our own look (rounded slate box)")
			}
			if s := shapesOf(nodeNamed(t, root, "cir"))[0]; s.attr("rx") != s.attr("ry") {
				t.Error("the circle is not round")
			}
			if s := shapesOf(nodeNamed(t, root, "pl"))[0]; s.attr("stroke") != "none" || s.attr("fill") != "none" {
				t.Error("plaintext has an outline or a fill")
			}
			if n := len(strings.Fields(shapesOf(nodeNamed(t, root, "dia"))[0].attr("points"))); n != 4 {
				t.Errorf("diamond with %d corners", n)
			}
			if n := len(strings.Fields(shapesOf(nodeNamed(t, root, "doc"))[0].attr("points"))); n != 8 {
				t.Errorf("doubleoctagon with %d corners", n)
			}
			if got := texts(nodeNamed(t, root, "pt")); len(got) != 0 {
				t.Errorf("a point shows %q", got)
			}
		}},
		{"records as fields", `digraph G { r [shape=record, label="<p1> 1|<p2> 2"]; m [shape=Mrecord, label="{top|{l|r}}"] }`, func(t *testing.T, root *xmlNode, doc string, res Result) {
			r := nodeNamed(t, root, "r")
			if got := texts(r); !slices.Equal(got, []string{"1", "2"}) {
				t.Errorf("record shows %q, want fields 1 and 2", got)
			}
			if strings.Contains(doc, "p1") {
				t.Error("the port name shows")
			}
			if n := len(r.find(byClass("line", "field"))); n != 1 {
				t.Errorf("%d lines between two fields", n)
			}
			m := nodeNamed(t, root, "m")
			if got := texts(m); !slices.Equal(got, []string{"top", "l", "r"}) {
				t.Errorf("Mrecord shows %q", got)
			}
			if shapesOf(m)[0].attr("rx") == "" {
				t.Error("Mrecord without rounded corners")
			}
			lines := m.find(byClass("line", "field"))
			if len(lines) != 2 || lines[0].attr("y1") != lines[0].attr("y2") || lines[1].attr("x1") != lines[1].attr("x2") {
				t.Error("{top|{l|r}}: want one line across, then one down between l and r")
			}
		}},
		{"HTML table as cells", `graph G { t [shape=none, label=<<TABLE><TR><TD>a</TD><TD BGCOLOR="yellow">b</TD></TR><TR><TD COLSPAN="2">c</TD></TR></TABLE>>] }`, func(t *testing.T, root *xmlNode, doc string, res Result) {
			n := nodeNamed(t, root, "t")
			cells := n.find(byClass("rect", "cell"))
			if len(cells) != 3 {
				t.Fatalf("%d cells", len(cells))
			}
			if got := texts(n); !slices.Equal(got, []string{"a", "b", "c"}) {
				t.Errorf("cells show %q", got)
			}
			if cells[1].attr("fill") != "#ffff00" {
				t.Errorf("BGCOLOR drawn %q", cells[1].attr("fill"))
			}
			if w0, w2 := atof(t, cells[0].attr("width")), atof(t, cells[2].attr("width")); w2 <= w0 {
				t.Errorf("the spanning cell is %v wide, the first %v", w2, w0)
			}
		}},
		{"arrowheads", `digraph G {
				a -> b; b -> c [dir=both]; c -> d [dir=none]; d -> e [arrowhead=dot]; e -> f [arrowhead=odiamond]
				f -> g [dir=back, arrowtail=inv]; g -> h [arrowhead=crow, arrowsize=2]
			}`, func(t *testing.T, root *xmlNode, doc string, res Result) {
			count := func(name string) []*xmlNode { return edgeNamed(root, name).find(byClass("polygon", "arrow")) }
			for name, want := range map[string]int{"a -> b": 1, "b -> c": 2, "c -> d": 0, "d -> e": 1, "e -> f": 1, "f -> g": 1, "g -> h": 1} {
				if got := len(count(name)); got != want {
					t.Errorf("%s: %d arrowheads, want %d", name, got, want)
				}
			}
			if n := len(strings.Fields(count("d -> e")[0].attr("points"))); n != 24 {
				t.Errorf("dot drawn with %d points", n)
			}
			if f := count("e -> f")[0].attr("fill"); f != paperColor {
				t.Errorf("an open diamond filled %q", f)
			}
			if len(res.NotDrawn) != 0 {
				t.Errorf("not drawn: %q", res.NotDrawn)
			}
		}},
		{"graphs have no arrowheads unless dir says", `graph G { a -- b; b -- c [dir=forward] }`, func(t *testing.T, root *xmlNode, doc string, res Result) {
			if n := len(edgeNamed(root, "a -- b").find(byClass("polygon", "arrow"))); n != 0 {
				t.Errorf("a -- b has %d arrowheads", n)
			}
			if n := len(edgeNamed(root, "b -- c").find(byClass("polygon", "arrow"))); n != 1 {
				t.Errorf("b -- c [dir=forward] has %d arrowheads", n)
			}
		}},
		{"what is not drawn is said once", `digraph G {
				rankdir=LR; splines=true; fontname=Courier
				a [fontname=Courier, shape=egg, color=navyblue]; b [fontname=Times, style=diagonals]
				a -> b [arrowhead=banana, samehead=x]
				subgraph cluster_x { label=Zone; c }
				t [label=<<TABLE><TR><TD BGCOLOR="nocolour"><IMG SRC="x.png"/></TD></TR></TABLE>>]
			}`, func(t *testing.T, root *xmlNode, doc string, res Result) {
			for _, want := range []string{
				`colour "nocolour" (1 label)`, "HTML IMG (1 label)",
				"graph attribute fontname", "node attribute fontname", `shape "egg" (drawn as our own box) (1 node)`,
				`colour "navyblue" (1 node)`, `node style "diagonals" (1 node)`, `arrowhead "banana" (drawn as normal) (1 edge)`,
				"subgraph attributes (cluster frames are not drawn yet): label",
			} {
				if !slices.Contains(res.NotDrawn, want) {
					t.Errorf("NotDrawn %q lacks %q", res.NotDrawn, want)
				}
			}
			for _, quiet := range []string{"rankdir", "splines", "samehead"} {
				if strings.Contains(strings.Join(res.NotDrawn, ";"), quiet) {
					t.Errorf("NotDrawn names %s, which steers a layout", quiet)
				}
			}
			if strings.Count(doc, "<!--") != 1 || !strings.Contains(doc, "<!-- gridwood preview: not drawn: graph attribute fontname;") {
				t.Errorf("want one comment listing what is not drawn:\n%s", doc[:min(len(doc), 600)])
			}
		}},
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			doc, res := render(t, layOut(t, c.src))
			c.check(t, parseSVG(t, doc), string(doc), res)
		})
	}
}

// TestFramesBeneathNodes: cluster frames handed in (made here by hand;
// dotio does not give clusters yet) are drawn first, where they are, with
// their label and colours.
func TestFramesBeneathNodes(t *testing.T) {
	graphs := layOut(t, `graph G { a -- b; subgraph cluster_1 { label="ignored here"; a } }`)
	g := graphs[0]
	ax, ay := g.X[0], g.Y[0]
	attrs := layOut(t, `graph H { graph [label="North quad", color=red, style=filled, fillcolor="#ffeeaa", labeljust=l] }`)[0].G.GraphAttrs()
	g.Frames = []Frame{{Name: "cluster_1", X0: ax - 50, Y0: ay - 40, X1: ax + 50, Y1: ay + 60, Attrs: attrs}}
	doc, res := render(t, []Graph{g})
	root := parseSVG(t, doc)
	for _, n := range res.NotDrawn {
		if strings.Contains(n, "cluster") {
			t.Errorf("frames given, yet NotDrawn says %q", n)
		}
	}
	panel := root.find(byClass("g", "graph"))[0]
	if panel.Kids[1].attr("class") != "frames" {
		t.Fatalf("frames are not the first layer under the title: %q", panel.Kids[1].attr("class"))
	}
	frames := panel.find(byClass("rect", "frame"))
	if len(frames) != 1 {
		t.Fatalf("%d frames drawn", len(frames))
	}
	f := frames[0]
	if f.attr("stroke") != "#ff0000" || f.attr("fill") != "#ffeeaa" {
		t.Errorf("frame stroke %q fill %q", f.attr("stroke"), f.attr("fill"))
	}
	if atof(t, f.attr("width")) != 100 || atof(t, f.attr("height")) != 100 {
		t.Errorf("frame %s x %s, want 100 x 100", f.attr("width"), f.attr("height"))
	}
	// Where: a's centre lies 50 from the frame's left and 40 from its
	// bottom, 60 from its top (y flipped).
	x0, y0, x1, y1 := shapeBox(t, nodeNamed(t, root, "a"))
	cx, cy := (x0+x1)/2, (y0+y1)/2
	if fx, fy := atof(t, f.attr("x")), atof(t, f.attr("y")); fx != cx-50 || fy != cy-60 {
		t.Errorf("frame at (%v, %v), want (%v, %v)", fx, fy, cx-50, cy-60)
	}
	label := panel.find(byClass("g", "frame-label"))
	if len(label) != 1 || label[0].allText() != "North quad" {
		t.Fatalf("frame label %v", label)
	}
	// labeljust=l: the label's block starts frameLabelIn inside the
	// frame; its one line is centred in the block.
	text := label[0].find(byTag("text"))[0]
	if lx, want := atof(t, text.attr("x")), atof(t, f.attr("x"))+frameLabelIn+textWidth("North quad", 14)/2; lx != want || text.attr("text-anchor") != "middle" {
		t.Errorf("labeljust=l label centred at %v, want %v", lx, want)
	}

	// Without frames, the cluster's label is named as not drawn.
	_, res = render(t, graphs)
	if !slices.Contains(res.NotDrawn, "subgraph attributes (cluster frames are not drawn yet): label") {
		t.Errorf("NotDrawn %q", res.NotDrawn)
	}
}

// TestCommentSafe: what the comment lists cannot end it early.
func TestCommentSafe(t *testing.T) {
	doc, res := render(t, layOut(t, `graph G { a [shape="--x-->"] }`))
	if len(res.NotDrawn) == 0 {
		t.Fatal("an unknown shape is not noted")
	}
	root := parseSVG(t, doc)
	if len(root.find(byClass("g", "node"))) != 1 {
		t.Error("the comment swallowed the drawing")
	}
	if bytes.Contains(doc, []byte("--x--")) {
		t.Error("a double hyphen is inside the comment")
	}
}
