package main

import (
	"bytes"
	"context"
	"encoding/xml"
	"fmt"
	"image"
	"image/png"
	"math"
	"os"
	"os/exec"
	"path/filepath"
	"strconv"
	"strings"
	"testing"
	"time"

	"github.com/gridwood/gridwood/dotio"
)

// A fictional market town: the stalls and the three utility huts form
// K3,3, so one run is set aside; a return run, a repeated run, a loop, an
// HTML label, a round shape and a name full of XML's special characters.
const svgTown = `digraph "market<&>" {
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

// layOut reads DOT and lays out every graph the way the command does.
func layOut(t *testing.T, src string) []svgGraph {
	t.Helper()
	f, err := dotio.Read([]byte(src), dotio.ReadOptions{Name: "test"})
	if err != nil {
		t.Fatal(err)
	}
	var out []svgGraph
	for _, g := range f.Graphs {
		_, lay, boxes, _, err := layoutGraph(&config{}, g, 0, "test", func(string, float64) {})
		if err != nil {
			t.Fatal(err)
		}
		out = append(out, svgGraph{g, lay, boxes})
	}
	return out
}

// xmlNode is a generic element tree, decoded by encoding/xml.
type xmlNode struct {
	XMLName xml.Name
	Attrs   []xml.Attr `xml:",any,attr"`
	Kids    []xmlNode  `xml:",any"`
	Text    string     `xml:",chardata"`
}

func (n *xmlNode) attr(name string) string {
	for _, a := range n.Attrs {
		if a.Name.Local == name {
			return a.Value
		}
	}
	return ""
}

func (n *xmlNode) hasClass(c string) bool {
	return strings.Contains(" "+n.attr("class")+" ", " "+c+" ")
}

// find returns the descendants of n (n included) for which keep is true,
// in document order.
func (n *xmlNode) find(keep func(*xmlNode) bool) []*xmlNode {
	var out []*xmlNode
	stack := []*xmlNode{n}
	for len(stack) > 0 {
		x := stack[len(stack)-1]
		stack = stack[:len(stack)-1]
		if keep(x) {
			out = append(out, x)
		}
		for i := len(x.Kids) - 1; i >= 0; i-- {
			stack = append(stack, &x.Kids[i])
		}
	}
	return out
}

// allText is the character data of n and its descendants.
func (n *xmlNode) allText() string {
	var b strings.Builder
	for _, x := range n.find(func(*xmlNode) bool { return true }) {
		b.WriteString(x.Text)
	}
	return b.String()
}

func byClass(tag, class string) func(*xmlNode) bool {
	return func(x *xmlNode) bool { return x.XMLName.Local == tag && x.hasClass(class) }
}

func parseSVG(t *testing.T, doc []byte) *xmlNode {
	t.Helper()
	var root xmlNode
	if err := xml.Unmarshal(doc, &root); err != nil {
		t.Fatalf("not well-formed XML: %v\n%s", err, doc)
	}
	if root.XMLName.Local != "svg" || root.XMLName.Space != "http://www.w3.org/2000/svg" {
		t.Fatalf("root element %v, want svg in the SVG namespace", root.XMLName)
	}
	return &root
}

func atof(t *testing.T, s string) float64 {
	t.Helper()
	v, err := strconv.ParseFloat(s, 64)
	if err != nil {
		t.Fatalf("number %q: %v", s, err)
	}
	return v
}

func TestWriteSVG(t *testing.T) {
	graphs := layOut(t, svgTown)
	if graphs[0].lay.Removed == nil {
		t.Fatal("K3,3 must lose an edge (Kuratowski 1930)")
	}
	var buf bytes.Buffer
	if err := writeSVG(&buf, graphs); err != nil {
		t.Fatal(err)
	}
	doc := buf.Bytes()
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
	for gi, sg := range graphs {
		p := panels[gi]
		g, lay := sg.g, sg.lay
		shapes := p.find(func(x *xmlNode) bool {
			return (x.XMLName.Local == "rect" || x.XMLName.Local == "ellipse") && x.hasClass("node")
		})
		labels := p.find(byClass("text", "label"))
		if len(shapes) != len(g.Nodes) || len(labels) != len(g.Nodes) {
			t.Errorf("graph %d: %d shapes and %d labels for %d nodes", gi, len(shapes), len(labels), len(g.Nodes))
			continue
		}

		// Distinct pairs, counted here from the layout.
		kept, removed, loops := map[[2]int32]bool{}, map[[2]int32]bool{}, map[[2]int32]bool{}
		heads := map[[2]int32]bool{} // kept (head, tail) pairs
		for i, e := range g.Edges {
			k := [2]int32{min(e.From, e.To), max(e.From, e.To)}
			switch {
			case e.From == e.To:
				loops[k] = true
			case lay.Removed != nil && lay.Removed[i]:
				removed[k] = true
			default:
				kept[k] = true
				heads[[2]int32{e.To, e.From}] = true
			}
		}
		if n := len(p.find(byClass("line", "edge"))); n != len(kept) {
			t.Errorf("graph %d: %d kept lines, want %d", gi, n, len(kept))
		}
		if n := len(p.find(func(x *xmlNode) bool { return byClass("path", "removed")(x) && !x.hasClass("loop") })); n != len(removed) {
			t.Errorf("graph %d: %d set-aside curves, want %d", gi, n, len(removed))
		}
		if n := len(p.find(byClass("path", "loop"))); n != len(loops) {
			t.Errorf("graph %d: %d loops, want %d", gi, n, len(loops))
		}

		// Layers: set-aside edges first (underneath), thinner, dashed, in
		// another colour; then kept edges; nodes above both.
		var order []string
		for _, k := range p.Kids {
			order = append(order, k.attr("class"))
		}
		want := "title removed-edges removed-arrows edges arrows nodes labels badges"
		if strings.Join(order, " ") != want {
			t.Errorf("graph %d: layers %q, want %q", gi, strings.Join(order, " "), want)
		}
		rg, eg := p.find(byClass("g", "removed-edges"))[0], p.find(byClass("g", "edges"))[0]
		if rg.attr("stroke-dasharray") == "" || eg.attr("stroke-dasharray") != "" ||
			rg.attr("stroke") == eg.attr("stroke") ||
			atof(t, rg.attr("stroke-width")) >= atof(t, eg.attr("stroke-width")) {
			t.Errorf("graph %d: set-aside style %v not apart from kept style %v", gi, rg.Attrs, eg.Attrs)
		}

		// Node centres: x as in DOT, y flipped (higher in DOT is higher on
		// screen, i.e. a smaller SVG y), offsets the same for all nodes.
		cx := make([]float64, len(shapes))
		cy := make([]float64, len(shapes))
		for v, s := range shapes {
			if s.XMLName.Local == "ellipse" {
				cx[v], cy[v] = atof(t, s.attr("cx")), atof(t, s.attr("cy"))
			} else {
				cx[v] = atof(t, s.attr("x")) + atof(t, s.attr("width"))/2
				cy[v] = atof(t, s.attr("y")) + atof(t, s.attr("height"))/2
			}
			// Sizes: the boxes the layout spaced for (width and height,
			// grown to fit the label; see nodeBoxes).
			wantW := float64(2 * nodeBoxes(g).HalfW[v])
			gotW := 2 * atof(t, s.attr("rx"))
			if s.XMLName.Local == "rect" {
				gotW = atof(t, s.attr("width"))
			}
			if math.Abs(gotW-wantW) > 0.01 {
				t.Errorf("graph %d node %d: drawn %v wide, want %v", gi, v, gotW, wantW)
			}
			if s.find(func(x *xmlNode) bool { return x.XMLName.Local == "title" })[0].Text != plainName(g.Nodes[v].Name) {
				t.Errorf("graph %d node %d: tooltip is not the name", gi, v)
			}
		}
		for v := range shapes {
			if dx, dy := cx[v]-float64(lay.X[v]), cy[v]+float64(lay.Y[v]); math.Abs(dx-(cx[0]-float64(lay.X[0]))) > 0.01 || math.Abs(dy-(cy[0]+float64(lay.Y[0]))) > 0.01 {
				t.Errorf("graph %d node %d: centre (%v, %v) is not DOT (%d, %d) shifted and flipped", gi, v, cx[v], cy[v], lay.X[v], lay.Y[v])
			}
		}
		// Panels are stacked top to bottom without overlapping.
		top, bottom := math.Inf(1), math.Inf(-1)
		for v, s := range shapes {
			hh := atof(t, s.attr("ry"))
			if s.XMLName.Local == "rect" {
				hh = atof(t, s.attr("height")) / 2
			}
			top, bottom = min(top, cy[v]-hh), max(bottom, cy[v]+hh)
		}
		if top <= prevBottom || bottom > h {
			t.Errorf("graph %d: drawn from y %v to %v; previous ended at %v, document height %v", gi, top, bottom, prevBottom, h)
		}
		prevBottom = bottom

		// Arrowheads: one per kept (head, tail) direction plus one per
		// kept directed loop, each with its tip on the outline of the
		// head's box.
		arrows := p.find(byClass("polygon", "arrow"))
		wantArrows := 0
		if g.Directed {
			wantArrows = len(heads) + len(loops)
		}
		if len(arrows) != wantArrows {
			t.Errorf("graph %d: %d arrowheads, want %d", gi, len(arrows), wantArrows)
		}
		for _, a := range arrows {
			tip := strings.Split(strings.Fields(a.attr("points"))[0], ",")
			x, y := atof(t, tip[0]), atof(t, tip[1])
			onOutline := false
			for _, s := range shapes {
				if s.XMLName.Local == "ellipse" {
					ex, ey := (x-atof(t, s.attr("cx")))/atof(t, s.attr("rx")), (y-atof(t, s.attr("cy")))/atof(t, s.attr("ry"))
					onOutline = onOutline || math.Abs(math.Hypot(ex, ey)-1) < 0.01
					continue
				}
				x0, y0 := atof(t, s.attr("x")), atof(t, s.attr("y"))
				x1, y1 := x0+atof(t, s.attr("width")), y0+atof(t, s.attr("height"))
				const eps = 0.02
				inX, inY := x >= x0-eps && x <= x1+eps, y >= y0-eps && y <= y1+eps
				onOutline = onOutline || inY && (math.Abs(x-x0) < eps || math.Abs(x-x1) < eps) || inX && (math.Abs(y-y0) < eps || math.Abs(y-y1) < eps)
			}
			if !onOutline {
				t.Errorf("graph %d: arrow tip (%v, %v) is on no node's outline", gi, x, y)
			}
		}
	}

	// Text: names and labels escaped for XML and read back intact; HTML
	// labels without tags; \n breaks lines; the repeated Rose -> Water has
	// a count badge of 2; titles are the graph IDs.
	texts := map[string]bool{}
	for _, x := range root.find(func(x *xmlNode) bool { return x.XMLName.Local == "text" }) {
		texts[x.allText()] = true
	}
	for _, s := range []string{`a<b&"c"`, "Phoneline & co", "Ivyhouse", "2", "market<&>", "tram", "depot"} {
		if !texts[s] {
			t.Errorf("no text %q among %v", s, texts)
		}
	}
	if !bytes.Contains(doc, []byte("a&lt;b&amp;")) || bytes.Contains(doc, []byte("a<b&")) {
		t.Error("node name not escaped")
	}

	// Same bytes every time.
	var again bytes.Buffer
	if err := writeSVG(&again, layOut(t, svgTown)); err != nil || !bytes.Equal(again.Bytes(), doc) {
		t.Errorf("output differs between runs (%v)", err)
	}
}

func TestWriteSVGRejectsMismatchedLayout(t *testing.T) {
	graphs := layOut(t, "graph G { a -- b }")
	bad := graphs[0]
	bad.lay.X = bad.lay.X[:1]
	if err := writeSVG(&bytes.Buffer{}, []svgGraph{bad}); err == nil {
		t.Error("a layout with too few positions was accepted")
	}
	bad = graphs[0]
	bad.lay.Removed = []bool{true, false}
	if err := writeSVG(&bytes.Buffer{}, []svgGraph{bad}); err == nil {
		t.Error("set-aside flags of the wrong length were accepted")
	}
	if err := writeSVG(&bytes.Buffer{}, []svgGraph{{}}); err == nil {
		t.Error("a missing graph was accepted")
	}
}

// chromiumPath finds Debian's chromium, if installed.
func chromiumPath() string {
	if _, err := os.Stat("/usr/bin/chromium"); err == nil {
		return "/usr/bin/chromium"
	}
	if p, err := exec.LookPath("chromium"); err == nil {
		return p
	}
	return ""
}

// The SVG is drawn by a real browser: the screenshot must show the paper,
// the slate of the nodes over most of their area, the teal of kept edges
// and the rust of the set-aside one.
func TestSVGRendersInChromium(t *testing.T) {
	bin := chromiumPath()
	if bin == "" {
		t.Skip("chromium not found: install Debian's chromium package (apt-get install chromium) to run this test")
	}
	graphs := layOut(t, svgTown)[:1]
	var buf bytes.Buffer
	if err := writeSVG(&buf, graphs); err != nil {
		t.Fatal(err)
	}
	root := parseSVG(t, buf.Bytes())
	w, h := atof(t, root.attr("width")), atof(t, root.attr("height"))
	if w > 1200 || h > 1000 {
		t.Fatalf("test drawing is %v x %v, larger than the window", w, h)
	}
	nodeArea := 0.0
	for _, s := range root.find(byClass("rect", "node")) {
		nodeArea += atof(t, s.attr("width")) * atof(t, s.attr("height"))
	}
	for _, s := range root.find(byClass("ellipse", "node")) {
		nodeArea += math.Pi * atof(t, s.attr("rx")) * atof(t, s.attr("ry"))
	}

	dir := t.TempDir()
	svgPath, pngPath := filepath.Join(dir, "town.svg"), filepath.Join(dir, "town.png")
	if err := os.WriteFile(svgPath, buf.Bytes(), 0o644); err != nil {
		t.Fatal(err)
	}
	ctx, cancel := context.WithTimeout(context.Background(), 60*time.Second)
	defer cancel()
	cmd := exec.CommandContext(ctx, bin, "--headless", "--no-sandbox", "--disable-gpu", "--disable-quic",
		"--no-first-run", "--disable-background-networking", "--disable-component-update", "--disable-sync",
		"--user-data-dir="+filepath.Join(dir, "profile"), "--screenshot="+pngPath, "--window-size=1200,1000",
		"file://"+svgPath)
	cmd.Env = append(os.Environ(), "HOME="+dir)
	if out, err := cmd.CombinedOutput(); err != nil {
		t.Fatalf("chromium: %v\n%s", err, out)
	}
	f, err := os.Open(pngPath)
	if err != nil {
		t.Fatal(err)
	}
	defer f.Close()
	img, err := png.Decode(f)
	if err != nil {
		t.Fatal(err)
	}
	count := func(hex string) int {
		want := rgb(hex)
		n := 0
		b := img.Bounds()
		for y := b.Min.Y; y < b.Max.Y; y++ {
			for x := b.Min.X; x < b.Max.X; x++ {
				if near(img, x, y, want) {
					n++
				}
			}
		}
		return n
	}
	paper, slate, teal, rust := count(svgPaper), count(svgNodeFill), count(svgEdge), count(svgRemoved)
	t.Logf("%v: %d paper, %d slate (of %.0f node area), %d teal, %d rust pixels", img.Bounds(), paper, slate, nodeArea, teal, rust)
	if float64(paper) < 0.5*(w*h-nodeArea) {
		t.Errorf("only %d paper pixels: the drawing did not render", paper)
	}
	if float64(slate) < 0.5*nodeArea {
		t.Errorf("only %d node-coloured pixels for %.0f of node area", slate, nodeArea)
	}
	if teal < 100 || rust < 10 {
		t.Errorf("edges barely visible: %d teal, %d rust pixels", teal, rust)
	}
}

// rgb parses "#rrggbb".
func rgb(hex string) [3]uint8 {
	v, _ := strconv.ParseUint(strings.TrimPrefix(hex, "#"), 16, 32)
	return [3]uint8{uint8(v >> 16), uint8(v >> 8), uint8(v)}
}

// near reports whether the pixel is within a small tolerance of c, for
// anti-aliasing and colour conversion.
func near(img image.Image, x, y int, c [3]uint8) bool {
	r, g, b, _ := img.At(x, y).RGBA()
	d := func(v uint32, w uint8) bool { return math.Abs(float64(v>>8)-float64(w)) <= 6 }
	return d(r, c[0]) && d(g, c[1]) && d(b, c[2])
}

// TestSVGSetAsideEdgesShow: every set-aside edge stays visible in the
// picture, measured on the drawn shapes: of points sampled along its curve,
// at least a quarter lie outside every node box and more than 2 units from
// every kept edge. K5 is the case that needed it: laid out, three of its
// nodes came nearly in line, and the set-aside edge between the outer two,
// drawn straight, ran under the two kept edges and the middle box for its
// whole length. K3,3 and K7 are checked the same way.
func TestSVGSetAsideEdgesShow(t *testing.T) {
	for _, src := range []string{
		"graph K5 { v1 -- {v2 v3 v4 v5}; v2 -- {v3 v4 v5}; v3 -- {v4 v5}; v4 -- v5 }",
		"graph K33 { {a b c} -- {x y z} }",
		"digraph K7 { 1 -> {2 3 4 5 6 7}; 2 -> {3 4 5 6 7}; 3 -> {4 5 6 7}; 4 -> {5 6 7}; 5 -> {6 7}; 6 -> 7 }",
	} {
		graphs := layOut(t, src)
		var buf bytes.Buffer
		if err := writeSVG(&buf, graphs); err != nil {
			t.Fatal(err)
		}
		root := parseSVG(t, buf.Bytes())
		type box struct{ x, y, w, h float64 }
		var boxes []box
		for _, r := range root.find(byClass("rect", "node")) {
			boxes = append(boxes, box{atof(t, r.attr("x")), atof(t, r.attr("y")), atof(t, r.attr("width")), atof(t, r.attr("height"))})
		}
		var lines [][4]float64
		for _, l := range root.find(byClass("line", "edge")) {
			lines = append(lines, [4]float64{atof(t, l.attr("x1")), atof(t, l.attr("y1")), atof(t, l.attr("x2")), atof(t, l.attr("y2"))})
		}
		curves := root.find(func(x *xmlNode) bool { return byClass("path", "removed")(x) && !x.hasClass("loop") })
		if len(curves) == 0 {
			t.Fatalf("%s: no set-aside edge drawn", src)
		}
		for _, c := range curves {
			var ax, ay, cx, cy, bx, by float64
			if _, err := fmt.Sscanf(c.attr("d"), "M %g %g Q %g %g %g %g", &ax, &ay, &cx, &cy, &bx, &by); err != nil {
				t.Fatalf("path %q: %v", c.attr("d"), err)
			}
			const samples = 200
			shown := 0
			for i := 1; i < samples; i++ {
				u := float64(i) / samples
				px := (1-u)*(1-u)*ax + 2*u*(1-u)*cx + u*u*bx
				py := (1-u)*(1-u)*ay + 2*u*(1-u)*cy + u*u*by
				hidden := false
				for _, b := range boxes {
					if px >= b.x && px <= b.x+b.w && py >= b.y && py <= b.y+b.h {
						hidden = true
					}
				}
				for _, l := range lines {
					if segmentDistance(px, py, l) <= 2 {
						hidden = true
					}
				}
				if !hidden {
					shown++
				}
			}
			if shown < samples/4 {
				t.Errorf("%s: set-aside edge %q shows at %d of %d sampled points", src, c.attr("d"), shown, samples-1)
			}
		}
	}
}

// segmentDistance is the distance from (px, py) to the segment l.
func segmentDistance(px, py float64, l [4]float64) float64 {
	dx, dy := l[2]-l[0], l[3]-l[1]
	u := 0.0
	if d := dx*dx + dy*dy; d > 0 {
		u = max(0, min(1, ((px-l[0])*dx+(py-l[1])*dy)/d))
	}
	return math.Hypot(px-(l[0]+u*dx), py-(l[1]+u*dy))
}
