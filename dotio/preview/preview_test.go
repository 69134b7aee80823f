package preview

import (
	"bytes"
	"math"
	"slices"
	"strings"
	"testing"

	"github.com/gridwood/gridwood/dotio/nodesize"
)

// A fictional market town: the stalls and the three utility huts form
// K3,3, so one run is removed; a return run, a repeated run, a loop, an
// HTML label, a round shape and a name full of XML's special characters.
const town = `digraph "market<&>" {
	"a<b&\"c\"" -> Water
	{ Rose Ivy Moss } -> { Water Gas Phone }
	Gas -> Water
	Rose -> Water
	Moss -> Moss
	Phone [label=<<b>Ph</b>one<br/>line &amp; co>]
	Rose [shape=circle, width=0.6, height=0.6]
	Ivy [label="Ivy\nhouse"]
}
graph tram { depot -- square -- pier -- depot }
`

func render(t *testing.T, graphs []Graph) ([]byte, Result) {
	t.Helper()
	var buf bytes.Buffer
	res, err := Write(&buf, graphs)
	if err != nil {
		t.Fatal(err)
	}
	return buf.Bytes(), res
}

// shapeBox is the bounding box of a node's outermost outline in document
// coordinates, from its first shape element.
func shapeBox(t *testing.T, node *xmlNode) (x0, y0, x1, y1 float64) {
	t.Helper()
	s := node.find(byClass("", "shape"))
	if len(s) == 0 {
		t.Fatalf("node %q has no shape", node.title())
	}
	e := s[0]
	switch e.XMLName.Local {
	case "rect":
		x, y := atof(t, e.attr("x")), atof(t, e.attr("y"))
		return x, y, x + atof(t, e.attr("width")), y + atof(t, e.attr("height"))
	case "ellipse":
		cx, cy, rx, ry := atof(t, e.attr("cx")), atof(t, e.attr("cy")), atof(t, e.attr("rx")), atof(t, e.attr("ry"))
		return cx - rx, cy - ry, cx + rx, cy + ry
	case "polygon":
		x0, y0, x1, y1 = math.Inf(1), math.Inf(1), math.Inf(-1), math.Inf(-1)
		for _, p := range strings.Fields(e.attr("points")) {
			xy := strings.Split(p, ",")
			x, y := atof(t, xy[0]), atof(t, xy[1])
			x0, y0, x1, y1 = min(x0, x), min(y0, y), max(x1, x), max(y1, y)
		}
		return x0, y0, x1, y1
	}
	t.Fatalf("unknown shape element %s", e.XMLName.Local)
	return
}

func TestWrite(t *testing.T) {
	graphs := layOut(t, town)
	if graphs[0].Removed == nil {
		t.Fatal("K3,3 must lose an edge (Kuratowski 1930)")
	}
	doc, _ := render(t, graphs)
	root := parseSVG(t, doc)

	// Size and view box agree.
	w, h := atof(t, root.attr("width")), atof(t, root.attr("height"))
	if w <= 0 || h <= 0 || root.attr("viewBox") != "0 0 "+root.attr("width")+" "+root.attr("height") {
		t.Errorf("width %q height %q viewBox %q", root.attr("width"), root.attr("height"), root.attr("viewBox"))
	}
	// Nothing external: no scripts, images, links, imported fonts.
	for _, bad := range []string{"<script", "<image", "href", "@import", "url(", "<foreignObject"} {
		if bytes.Contains(doc, []byte(bad)) {
			t.Errorf("document contains %q", bad)
		}
	}
	panels := root.find(byClass("g", "graph"))
	if len(panels) != len(graphs) {
		t.Fatalf("%d graph groups, want %d", len(panels), len(graphs))
	}
	prevBottom := math.Inf(-1)
	for gi, pg := range graphs {
		p, g := panels[gi], pg.G
		nodes := p.find(byClass("g", "node"))
		if len(nodes) != len(g.Nodes) {
			t.Fatalf("graph %d: %d nodes drawn, want %d", gi, len(nodes), len(g.Nodes))
		}
		// Distinct pairs, counted here from the layout.
		kept, removed := map[[2]int32]bool{}, map[[2]int32]bool{}
		heads := map[[2]int32]bool{} // kept (head, tail) pairs, loops included
		for i, e := range g.Edges {
			k := [2]int32{min(e.From, e.To), max(e.From, e.To)}
			if pg.Removed != nil && pg.Removed[i] {
				removed[k] = true
				continue
			}
			kept[k] = true
			heads[[2]int32{e.To, e.From}] = true
		}
		if n := len(p.find(byClass("g", "edge"))); n != len(kept) {
			t.Errorf("graph %d: %d kept edges drawn, want %d", gi, n, len(kept))
		}
		if n := len(p.find(byClass("g", "removed"))); n != len(removed) {
			t.Errorf("graph %d: %d removed edges drawn, want %d", gi, n, len(removed))
		}
		// Layers: frames, then removed edges (underneath), kept edges,
		// nodes above both, then edge labels and badges.
		var order []string
		for _, k := range p.Kids {
			order = append(order, k.attr("class"))
		}
		if want := "title frames removed-edges edges nodes edge-labels badges"; strings.Join(order, " ") != want {
			t.Errorf("graph %d: layers %q, want %q", gi, strings.Join(order, " "), want)
		}
		// Removed edges dashed, kept ones not; each drawn in a stroke of
		// its own group.
		for _, r := range p.find(byClass("g", "removed")) {
			if r.attr("stroke-dasharray") == "" || r.attr("stroke") != removedColor {
				t.Errorf("graph %d: removed edge %q: stroke %q dashes %q", gi, r.title(), r.attr("stroke"), r.attr("stroke-dasharray"))
			}
		}
		for _, e := range p.find(byClass("g", "edge")) {
			if e.attr("stroke-dasharray") != "" || e.attr("stroke") != edgeColor {
				t.Errorf("graph %d: kept edge %q: stroke %q dashes %q", gi, e.title(), e.attr("stroke"), e.attr("stroke-dasharray"))
			}
		}

		// Outlines: the sizes nodesize gives; centres: x as in DOT, y
		// flipped, the same offset for all nodes.
		sizer := nodesize.New(g)
		cx := make([]float64, len(nodes))
		cy := make([]float64, len(nodes))
		top, bottom := math.Inf(1), math.Inf(-1)
		for v, n := range nodes {
			x0, y0, x1, y1 := shapeBox(t, n)
			cx[v], cy[v] = (x0+x1)/2, (y0+y1)/2
			sz := sizer.Node(v)
			if math.Abs((x1-x0)-sz.ShapeW) > 0.02 || math.Abs((y1-y0)-sz.ShapeH) > 0.02 {
				t.Errorf("graph %d node %d: drawn %v x %v, want %v x %v", gi, v, x1-x0, y1-y0, sz.ShapeW, sz.ShapeH)
			}
			if n.title() != nodesize.PlainName(g.Nodes[v].Name, false) {
				t.Errorf("graph %d node %d: tooltip %q is not the name %q", gi, v, n.title(), g.Nodes[v].Name)
			}
			top, bottom = min(top, y0), max(bottom, y1)
		}
		for v := range nodes {
			if dx, dy := cx[v]-pg.X[v], cy[v]+pg.Y[v]; math.Abs(dx-(cx[0]-pg.X[0])) > 0.02 || math.Abs(dy-(cy[0]+pg.Y[0])) > 0.02 {
				t.Errorf("graph %d node %d: centre (%v, %v) is not DOT (%v, %v) shifted and flipped", gi, v, cx[v], cy[v], pg.X[v], pg.Y[v])
			}
		}
		// Panels are stacked top to bottom without overlapping.
		if top <= prevBottom || bottom > h {
			t.Errorf("graph %d: drawn from y %v to %v; previous ended at %v, document height %v", gi, top, bottom, prevBottom, h)
		}
		prevBottom = bottom

		// Arrowheads: one per kept (head, tail) direction in a digraph,
		// none in a graph, each with its tip on the outline of a node.
		arrows := p.find(func(x *xmlNode) bool { return byClass("polygon", "arrow")(x) })
		keptArrows := 0
		for _, e := range p.find(byClass("g", "edge")) {
			keptArrows += len(e.find(byClass("polygon", "arrow")))
		}
		want := 0
		if g.Directed {
			want = len(heads)
		}
		if keptArrows != want {
			t.Errorf("graph %d: %d arrowheads on kept edges, want %d", gi, keptArrows, want)
		}
		for _, a := range arrows {
			tip := strings.Split(strings.Fields(a.attr("points"))[0], ",")
			x, y := atof(t, tip[0]), atof(t, tip[1])
			onOutline := false
			for _, n := range nodes {
				s := n.find(byClass("", "shape"))[0]
				if s.XMLName.Local == "ellipse" {
					ex, ey := (x-atof(t, s.attr("cx")))/atof(t, s.attr("rx")), (y-atof(t, s.attr("cy")))/atof(t, s.attr("ry"))
					onOutline = onOutline || math.Abs(math.Hypot(ex, ey)-1) < 0.02
					continue
				}
				x0, y0, x1, y1 := shapeBox(t, n)
				const eps = 0.05
				inX, inY := x >= x0-eps && x <= x1+eps, y >= y0-eps && y <= y1+eps
				onOutline = onOutline || inY && (math.Abs(x-x0) < eps || math.Abs(x-x1) < eps) || inX && (math.Abs(y-y0) < eps || math.Abs(y-y1) < eps)
			}
			if !onOutline {
				t.Errorf("graph %d: arrow tip (%v, %v) is on no node's outline", gi, x, y)
			}
		}
	}

	// Text: names and labels escaped for XML and read back intact; HTML
	// labels without tags, the bold part bold; \n breaks lines; the
	// repeated Rose -> Water has a count badge of 2; titles are the graph
	// IDs.
	texts := map[string]bool{}
	for _, x := range root.find(byTag("text")) {
		texts[x.allText()] = true
	}
	for _, s := range []string{`a<b&"c"`, "Phone", "line & co", "Ivy", "house", "2", "market<&>", "tram", "depot"} {
		if !texts[s] {
			t.Errorf("no text %q among %v", s, texts)
		}
	}
	if !slices.ContainsFunc(root.find(byTag("tspan")), func(x *xmlNode) bool { return x.Text == "Ph" && x.attr("font-weight") == "bold" }) {
		t.Error("the <b>Ph</b> of Phone's HTML label is not bold")
	}
	if !bytes.Contains(doc, []byte("a&lt;b&amp;")) || bytes.Contains(doc, []byte("a<b&")) {
		t.Error("node name not escaped")
	}

	// Same bytes every time.
	again, _ := render(t, layOut(t, town))
	if !bytes.Equal(again, doc) {
		t.Error("output differs between runs")
	}
}

func TestWriteRejectsMismatchedLayout(t *testing.T) {
	graphs := layOut(t, "graph G { a -- b }")
	for _, c := range []struct {
		name string
		bad  func(g *Graph)
	}{
		{"too few positions", func(g *Graph) { g.X = g.X[:1] }},
		{"removed flags of the wrong length", func(g *Graph) { g.Removed = []bool{true, false} }},
		{"a missing graph", func(g *Graph) { *g = Graph{} }},
		{"a position at infinity", func(g *Graph) { g.Y = []float64{0, math.Inf(1)} }},
	} {
		bad := graphs[0]
		bad.X, bad.Y = slices.Clone(bad.X), slices.Clone(bad.Y)
		c.bad(&bad)
		if _, err := Write(&bytes.Buffer{}, []Graph{bad}); err == nil {
			t.Errorf("%s accepted", c.name)
		}
	}
}
