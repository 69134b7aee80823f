package main

import (
	"encoding/xml"
	"math"
	"os"
	"path/filepath"
	"strconv"
	"strings"
	"testing"

	"github.com/gridwood/gridwood/dotio"
)

// The preview itself is tested in package dotio/preview; these tests
// check the command's wiring of --svg.

// svgDoc is an SVG document read back generically.
type svgDoc struct {
	XMLName xml.Name
	Attrs   []xml.Attr `xml:",any,attr"`
	Kids    []svgDoc   `xml:",any"`
	Text    string     `xml:",chardata"`
}

func (n *svgDoc) attr(name string) string {
	for _, a := range n.Attrs {
		if a.Name.Local == name {
			return a.Value
		}
	}
	return ""
}

// all returns the elements under n (n included) with the given tag and
// class ("" for any class).
func (n *svgDoc) all(tag, class string) []*svgDoc {
	var out []*svgDoc
	if n.XMLName.Local == tag && (class == "" || strings.Contains(" "+n.attr("class")+" ", " "+class+" ")) {
		out = append(out, n)
	}
	for i := range n.Kids {
		out = append(out, n.Kids[i].all(tag, class)...)
	}
	return out
}

func readSVG(t *testing.T, path string) *svgDoc {
	t.Helper()
	b, err := os.ReadFile(path)
	if err != nil {
		t.Fatal(err)
	}
	var d svgDoc
	if err := xml.Unmarshal(b, &d); err != nil || d.XMLName.Local != "svg" {
		t.Fatalf("%s is no SVG document: %v", path, err)
	}
	return &d
}

// TestSVGFlag: --svg writes the preview of every graph laid out, and one
// line of standard error names what it does not draw (none with -q).
func TestSVGFlag(t *testing.T) {
	dir := t.TempDir()
	in := filepath.Join(dir, "in.dot")
	src := "digraph plant { a [fontname=Courier]; a -> b -> c -> a }\ngraph yard { x -- y }\n"
	if err := os.WriteFile(in, []byte(src), 0o644); err != nil {
		t.Fatal(err)
	}
	out := filepath.Join(dir, "p.svg")
	code, stdout, stderr := runCmd(t, "", "--svg", out, in)
	if code != exitOK || !strings.Contains(stdout, "pos=") {
		t.Fatalf("exit %d\n%s", code, stderr)
	}
	d := readSVG(t, out)
	if n := len(d.all("g", "graph")); n != 2 {
		t.Errorf("%d graphs drawn, want 2", n)
	}
	if n := len(d.all("g", "node")); n != 5 {
		t.Errorf("%d nodes drawn, want 5", n)
	}
	if want := "gridwood: " + out + ": the preview does not draw: node attribute fontname\n"; !strings.Contains(stderr, want) {
		t.Errorf("stderr %q lacks %q", stderr, want)
	}
	if _, _, stderr := runCmd(t, "", "-q", "--svg", out, in); stderr != "" {
		t.Errorf("-q: stderr %q", stderr)
	}
}

// TestCheckSVG: --check --svg draws the drawing as the input gives it,
// each node at its pos, and checks it as before; the report and the
// picture are both written.
func TestCheckSVG(t *testing.T) {
	dir := t.TempDir()
	in := filepath.Join(dir, "drawn.dot")
	src := `graph drawn { bb="0,0,300,200"; a [pos="0,0"]; b [pos="200,0"]; c [pos="100,150.5"]; d [pos="100,-40"]
		a -- b -- c -- a; c -- d; a -- b [pos="e,1,1 2,2"] }
graph undrawn { p -- q; p [pos="1,2"] }
`
	if err := os.WriteFile(in, []byte(src), 0o644); err != nil {
		t.Fatal(err)
	}
	svg, report := filepath.Join(dir, "drawn.svg"), filepath.Join(dir, "report.txt")
	code, stdout, stderr := runCmd(t, "", "--check", "--svg", svg, "-o", report, in)
	// c -- d crosses a -- b: one problem, and the undrawn graph lacks pos.
	if code != exitProblems || stdout != "" {
		t.Fatalf("exit %d, stdout %q, stderr %s", code, stdout, stderr)
	}
	rep, err := os.ReadFile(report)
	if err != nil || !strings.Contains(string(rep), "cross") || !strings.Contains(string(rep), "has no pos") {
		t.Errorf("report %q (%v)", rep, err)
	}
	for _, want := range []string{
		`: graph "undrawn": not in the preview: node "q" has no pos`,
		"the preview does not draw: edge attribute pos (splines: edges are drawn straight)",
	} {
		if !strings.Contains(stderr, want) {
			t.Errorf("stderr %q lacks %q", stderr, want)
		}
	}
	d := readSVG(t, svg)
	if n := len(d.all("g", "graph")); n != 1 {
		t.Fatalf("%d graphs drawn, want the one with positions", n)
	}
	// Node centres are the pos values shifted, y flipped.
	f, err := dotio.Read([]byte(src), dotio.ReadOptions{Name: "drawn"})
	if err != nil {
		t.Fatal(err)
	}
	g := f.Graphs[0]
	nodes := d.all("g", "node")
	if len(nodes) != len(g.Nodes) {
		t.Fatalf("%d nodes drawn, want %d", len(nodes), len(g.Nodes))
	}
	var dx0, dy0 float64
	for v, n := range nodes {
		r := n.all("rect", "shape")[0]
		cx := atof(t, r.attr("x")) + atof(t, r.attr("width"))/2
		cy := atof(t, r.attr("y")) + atof(t, r.attr("height"))/2
		xs, ys, _ := strings.Cut(g.Nodes[v].Attrs.Pos, ",")
		x, y := atof(t, xs), atof(t, ys)
		if v == 0 {
			dx0, dy0 = cx-x, cy+y
		} else if math.Abs(cx-x-dx0) > 0.01 || math.Abs(cy+y-dy0) > 0.01 {
			t.Errorf("node %s drawn at (%v, %v), pos (%v, %v)", g.Nodes[v].Name, cx, cy, x, y)
		}
	}
	// The picture covers the drawing's bb too.
	if w := atof(t, d.attr("width")); w < 300 {
		t.Errorf("picture %v wide, bb 300", w)
	}

	// Layout flags still do not go with --check; --svg must not name an
	// input.
	if code, _, stderr := runCmd(t, "", "--check", "--svg", svg, "--unit", "36", in); code != exitBadInput || !strings.Contains(stderr, "--unit does not go with it") {
		t.Errorf("--check --svg --unit: exit %d, %s", code, stderr)
	}
	if code, _, _ := runCmd(t, "", "--check", "--svg", in, in); code != exitBadInput {
		t.Errorf("--check --svg naming the input: exit %d", code)
	}
	// A clean drawing: exit 0, report on standard output, picture written.
	clean := filepath.Join(dir, "clean.dot")
	if err := os.WriteFile(clean, []byte(`graph { a [pos="0,0"]; b [pos="100,0"]; a -- b }`), 0o644); err != nil {
		t.Fatal(err)
	}
	os.Remove(svg)
	if code, stdout, stderr := runCmd(t, "", "--check", "--svg", svg, clean); code != exitOK || stdout != "" || stderr != "" {
		t.Errorf("clean: exit %d, stdout %q, stderr %q", code, stdout, stderr)
	}
	if n := len(readSVG(t, svg).all("g", "edge")); n != 1 {
		t.Errorf("clean: %d edges drawn", n)
	}
}

func atof(t *testing.T, s string) float64 {
	t.Helper()
	v, err := strconv.ParseFloat(strings.TrimSpace(s), 64)
	if err != nil {
		t.Fatalf("number %q: %v", s, err)
	}
	return v
}
