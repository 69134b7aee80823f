package preview

import (
	"bytes"
	"context"
	"fmt"
	"image"
	"image/png"
	"math"
	"os"
	"os/exec"
	"path/filepath"
	"slices"
	"strconv"
	"strings"
	"testing"
	"time"
)

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

// screenshot renders an SVG document in headless Chromium and returns the
// picture; the test is skipped when Chromium is missing.
func screenshot(t *testing.T, doc []byte, width, height int) image.Image {
	t.Helper()
	bin := chromiumPath()
	if bin == "" {
		t.Skip("chromium not found: install Debian's chromium package (apt-get install chromium) to run this test")
	}
	dir := t.TempDir()
	svgPath, pngPath := filepath.Join(dir, "picture.svg"), filepath.Join(dir, "picture.png")
	if err := os.WriteFile(svgPath, doc, 0o644); err != nil {
		t.Fatal(err)
	}
	ctx, cancel := context.WithTimeout(context.Background(), 90*time.Second)
	defer cancel()
	cmd := exec.CommandContext(ctx, bin, "--headless", "--no-sandbox", "--disable-gpu", "--disable-quic",
		"--no-first-run", "--disable-background-networking", "--disable-component-update", "--disable-sync",
		"--hide-scrollbars", "--force-device-scale-factor=1",
		"--user-data-dir="+filepath.Join(dir, "profile"), "--screenshot="+pngPath,
		fmt.Sprintf("--window-size=%d,%d", width, height), "file://"+svgPath)
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
	return img
}

// rgbOf parses "#rrggbb".
func rgbOf(hex string) [3]uint8 {
	v, _ := strconv.ParseUint(strings.TrimPrefix(hex, "#"), 16, 32)
	return [3]uint8{uint8(v >> 16), uint8(v >> 8), uint8(v)}
}

// near reports whether the pixel is within tol of c in every channel, for
// anti-aliasing and colour conversion.
func near(img image.Image, x, y int, c [3]uint8, tol float64) bool {
	r, g, b, _ := img.At(x, y).RGBA()
	d := func(v uint32, w uint8) bool { return math.Abs(float64(v>>8)-float64(w)) <= tol }
	return d(r, c[0]) && d(g, c[1]) && d(b, c[2])
}

func countColor(img image.Image, hex string) int {
	want := rgbOf(hex)
	n := 0
	b := img.Bounds()
	for y := b.Min.Y; y < b.Max.Y; y++ {
		for x := b.Min.X; x < b.Max.X; x++ {
			if near(img, x, y, want, 6) {
				n++
			}
		}
	}
	return n
}

// The preview drawn by a real browser: the paper, the slate of the nodes
// over most of their area, the teal of kept edges and the rust of the
// removed one.
func TestRendersInChromium(t *testing.T) {
	if chromiumPath() == "" {
		t.Skip("chromium not found: install Debian's chromium package (apt-get install chromium) to run this test")
	}
	graphs := layOut(t, town)[:1]
	doc, _ := render(t, graphs)
	root := parseSVG(t, doc)
	w, h := atof(t, root.attr("width")), atof(t, root.attr("height"))
	if w > 1200 || h > 1000 {
		t.Fatalf("test drawing is %v x %v, larger than the window", w, h)
	}
	nodeArea := 0.0
	for _, n := range root.find(byClass("g", "node")) {
		x0, y0, x1, y1 := shapeBox(t, n)
		nodeArea += (x1 - x0) * (y1 - y0)
	}
	img := screenshot(t, doc, 1200, 1000)
	paper, slate, teal, rust := countColor(img, paperColor), countColor(img, nodeFill), countColor(img, edgeColor), countColor(img, removedColor)
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

// TestColoursShowInChromium: the picture differs where the DOT gives a
// colour: a red fill covers most of its node, a blue edge and a magenta
// edge label show, and none of these colours is there without them.
func TestColoursShowInChromium(t *testing.T) {
	if chromiumPath() == "" {
		t.Skip("chromium not found: install Debian's chromium package (apt-get install chromium) to run this test")
	}
	plain := `digraph G { a -> b [label="96 fibres", fontsize=30]; b -> c }`
	coloured := `digraph G { a [style=filled, fillcolor=red]; a -> b [label="96 fibres", fontsize=30, fontcolor=magenta]; b -> c [color=blue, penwidth=4] }`
	count := func(src string) (red, blue, magenta int, area float64) {
		doc, _ := render(t, layOut(t, src))
		root := parseSVG(t, doc)
		x0, y0, x1, y1 := shapeBox(t, nodeNamed(t, root, "a"))
		img := screenshot(t, doc, 800, 800)
		return countColor(img, "#ff0000"), countColor(img, "#0000ff"), countColor(img, "#ff00ff"), (x1 - x0) * (y1 - y0)
	}
	r0, b0, m0, _ := count(plain)
	r1, b1, m1, area := count(coloured)
	t.Logf("plain: %d red, %d blue, %d magenta; coloured: %d red (of %.0f), %d blue, %d magenta", r0, b0, m0, r1, area, b1, m1)
	if r0+b0+m0 != 0 {
		t.Errorf("the plain drawing has %d red, %d blue, %d magenta pixels", r0, b0, m0)
	}
	if float64(r1) < 0.6*area {
		t.Errorf("%d red pixels for a node of %.0f", r1, area)
	}
	if b1 < 50 || m1 < 30 {
		t.Errorf("%d blue edge pixels, %d magenta label pixels", b1, m1)
	}
}

// TestNamedColorsMatchBrowser checks our list of colour names against the
// browser's own (CSS Color Module Level 3, section 4.3, as Chromium
// implements it): a square filled by name beside one filled with our
// value must come out the same colour, for every name. The list holds the
// SVG 1.1 keywords: 147 names.
func TestNamedColorsMatchBrowser(t *testing.T) {
	if len(namedColors) != 147 {
		t.Errorf("%d colour names, want the 147 of SVG 1.1", len(namedColors))
	}
	if chromiumPath() == "" {
		t.Skip("chromium not found: install Debian's chromium package (apt-get install chromium) to run this test")
	}
	names := make([]string, 0, len(namedColors))
	for n := range namedColors {
		names = append(names, n)
	}
	slices.Sort(names)
	const cell, cols = 20, 10
	rows := (len(names) + cols - 1) / cols
	var b bytes.Buffer
	fmt.Fprintf(&b, `<svg xmlns="http://www.w3.org/2000/svg" width="%d" height="%d">`, 2*cols*cell, rows*cell)
	for i, n := range names {
		x, y := (i%cols)*2*cell, (i/cols)*cell
		fmt.Fprintf(&b, `<rect x="%d" y="%d" width="%d" height="%d" fill="%s"/>`, x, y, cell, cell, n)
		fmt.Fprintf(&b, `<rect x="%d" y="%d" width="%d" height="%d" fill="%s"/>`, x+cell, y, cell, cell, rgbPaint(namedColors[n], 1).rgb)
	}
	b.WriteString("</svg>")
	img := screenshot(t, b.Bytes(), 2*cols*cell+40, rows*cell+40)
	for i, n := range names {
		x, y := (i%cols)*2*cell+cell/2, (i/cols)*cell+cell/2
		r, g, bl, _ := img.At(x, y).RGBA()
		if !near(img, x+cell, y, [3]uint8{uint8(r >> 8), uint8(g >> 8), uint8(bl >> 8)}, 0) {
			r2, g2, b2, _ := img.At(x+cell, y).RGBA()
			t.Errorf("%s: the browser draws %02x%02x%02x, our value %06x draws %02x%02x%02x", n, r>>8, g>>8, bl>>8, namedColors[n], r2>>8, g2>>8, b2>>8)
		}
	}
}
