package preview

import (
	"bufio"
	"cmp"
	"fmt"
	"io"
	"math"
	"slices"
	"strings"

	"github.com/gridwood/gridwood/dotio"
	"github.com/gridwood/gridwood/dotio/nodesize"
)

// Graph is one drawing to preview: a graph and where its nodes are.
type Graph struct {
	G *dotio.Graph
	// X and Y are the node centres in points, y up, indexed as G.Nodes.
	X, Y []float64
	// Removed marks the edges the layout removed (nil: none).
	Removed []bool
	// BB is the drawing's bounding box (llx, lly, urx, ury in points);
	// all zero when unknown. The picture covers it and every node.
	BB [4]float64
	// Frames are cluster frames, drawn beneath everything else; nil when
	// the caller has none to give.
	Frames []Frame
	// FromInput says the positions are the input's own pos attributes (a
	// drawing made elsewhere): edge pos splines then belong to the
	// drawing, and the preview says it draws edges straight.
	FromInput bool
}

// Frame is a cluster's frame: its rectangle and its attributes (label,
// color, pencolor, fillcolor, bgcolor, style, penwidth, fontcolor,
// fontsize, labeljust, labelloc).
type Frame struct {
	Name           string // the cluster's name, for \G in its label
	X0, Y0, X1, Y1 float64
	Attrs          []dotio.Attr
}

// FrameKeys lists the cluster attributes a frame is drawn from, for
// Frame.Attrs.
func FrameKeys() []string {
	return []string{"label", "labelloc", "labeljust", "fontsize", "fontcolor", "color",
		"pencolor", "fillcolor", "bgcolor", "style", "penwidth"}
}

// FromLayout makes a Graph from a layout in whole points.
func FromLayout(g *dotio.Graph, lay dotio.Layout) Graph {
	pg := Graph{G: g, Removed: lay.Removed, X: make([]float64, len(lay.X)), Y: make([]float64, len(lay.Y))}
	for i, x := range lay.X {
		pg.X[i] = float64(x)
	}
	for i, y := range lay.Y {
		pg.Y[i] = float64(y)
	}
	for i, v := range lay.BB {
		pg.BB[i] = float64(v)
	}
	return pg
}

// Result says what a preview left out.
type Result struct {
	// NotDrawn lists what the input says that the preview does not draw,
	// each kind once ("node attribute fontname", "shape \"egg\" (2
	// nodes)"); the document holds the same list in a comment.
	NotDrawn []string
	// Unrouted counts the removed edges that no route kept clear of
	// every node box they do not end at (also in NotDrawn).
	Unrouted int
}

// Write writes one self-contained SVG document (no external fonts,
// scripts or images) showing all graphs, stacked top to bottom with a
// small title above each. See the package documentation for what is
// drawn and how. The output depends only on the input.
func Write(w io.Writer, graphs []Graph) (Result, error) {
	var nd notDrawn
	panels := make([]*panel, len(graphs))
	width, height := 0.0, pad
	unrouted := 0
	for i, pg := range graphs {
		p, err := newPanel(pg, i, &nd)
		if err != nil {
			return Result{}, err
		}
		unrouted += p.unrouted
		p.top = height + titleSize + titleGap
		height = p.top + (p.maxY - p.minY) + pad
		width = max(width, p.maxX-p.minX, textWidth(p.title, titleSize))
		panels[i] = p
	}
	width += 2 * pad
	if len(graphs) == 0 {
		height = 2 * pad
	}
	if unrouted > 0 {
		nd.addN("clear routes for removed edges (drawn through node boxes)", "edge", unrouted)
	}
	bw := bufio.NewWriter(w)
	W, H := num(math.Ceil(width)), num(math.Ceil(height))
	fmt.Fprintf(bw, "<?xml version=\"1.0\" encoding=\"UTF-8\"?>\n")
	fmt.Fprintf(bw, "<svg xmlns=\"http://www.w3.org/2000/svg\" version=\"1.1\" width=\"%s\" height=\"%s\" viewBox=\"0 0 %s %s\" font-family=\"%s\">\n", W, H, W, H, fontFamily)
	res := Result{NotDrawn: nd.list(), Unrouted: unrouted}
	if len(res.NotDrawn) > 0 {
		fmt.Fprintf(bw, "<!-- gridwood preview: not drawn: %s -->\n", commentText(strings.Join(res.NotDrawn, "; ")))
	}
	fmt.Fprintf(bw, "<rect class=\"paper\" x=\"0\" y=\"0\" width=\"%s\" height=\"%s\" fill=\"%s\"/>\n", W, H, paperColor)
	for _, p := range panels {
		p.write(bw)
	}
	fmt.Fprintf(bw, "</svg>\n")
	return res, bw.Flush()
}

// commentText makes s safe inside an XML comment: no "--", no characters
// XML cannot hold.
func commentText(s string) string {
	var b strings.Builder
	for _, r := range s {
		switch {
		case r == '-' && strings.HasSuffix(b.String(), "-"):
			b.WriteString(" -")
		case r == '\t' || r == '\n' || r == '\r' || r >= 0x20 && r != 0xfffe && r != 0xffff && (r < 0xd800 || r > 0xdfff):
			b.WriteRune(r)
		default:
			b.WriteRune('\uFFFD')
		}
	}
	out := b.String()
	if strings.HasSuffix(out, "-") {
		out += " "
	}
	return out
}

// The preview's own look, for what the DOT leaves unsaid: warm paper,
// slate nodes with rounded corners and cream text, teal edges, removed
// edges in a thin dashed rust curve beneath everything, ochre badges for
// repeated edges, sand cluster frames.
const (
	paperColor    = "#f3ead8" // background
	titleColor    = "#6b4e37" // graph titles
	nodeFill      = "#3e4c5c" // node shapes
	nodeStroke    = "#26303b"
	nodeText      = "#f7f0e1" // labels, on the slate
	inkColor      = "#2a2118" // text on paper
	edgeColor     = "#1b8078" // kept edges and their arrowheads
	removedColor  = "#b5542c" // removed edges, dashed
	badgeFill     = "#d8a23e" // repeated-edge count badges
	badgeText     = "#2a2118"
	frameStroke   = "#9a8060" // cluster frames
	frameFill     = "#ebdfc5"
	filledDefault = "#d3d3d3" // style=filled with no colour: DOT's lightgrey (from memory)
	fontFamily    = "Verdana, 'DejaVu Sans', sans-serif"
)

// Sizes in points (1 SVG unit = 1 point).
const (
	pad          = 16.0 // around the document and between graphs
	titleSize    = 13.0
	titleGap     = 8.0 // between a title's baseline and its drawing
	corner       = 6.0 // our node corner radius, at most a quarter of the box
	badgeR       = 6.5
	badgeFont    = 8.0
	nodePen      = 1.25
	edgePen      = 1.75
	removedPen   = 1.0
	labelGap     = 4.0 // between an edge and its label
	loopMinR     = 5.0
	loopMaxR     = 12.0
	frameLabelIn = 6.0 // a frame label's distance from the frame's sides
)

// textWidth estimates the advance of s at the given size.
func textWidth(s string, size float64) float64 {
	return float64(len([]rune(s))) * nodesize.CharWidthEm * size
}

// pnode is a node as drawn, in DOT coordinates.
type pnode struct {
	x, y   float64
	size   nodesize.Node
	bw, bh float64 // half the box the layout kept clear
	sw, sh float64 // half the outline
	kind   nodesize.Kind
	own    bool // our own look: no shape, or one the catalog lacks
	fill   paint
	stroke paint
	text   paint // label colour where no run says otherwise
	pen    float64
	dash   string
	invis  bool
	round  bool // rounded corners
	name   string
	tip    string // tooltip
	xlabel *nodesize.Label
	xcolor paint
}

// plink is one drawn line: all edges with the same two ends and the same
// removed state, in the look of the first.
type plink struct {
	u, v      int32 // u <= v
	removed   bool
	count     int
	first     int // input order of the first copy
	arrows    [2][]arrowPart
	arrowSize float64
	stroke    paint
	pen       float64
	dash      string
	invis     bool
	labels    []*nodesize.Label // distinct labels of the copies
	xlabels   []*nodesize.Label
	endLabels [2]*nodesize.Label // taillabel or headlabel at u, at v
	text      paint              // label colour
	endText   paint              // head and tail label colour
	endSize   float64
	tip       string
	curve     path // centre to centre (routed, for a removed edge)
	drawn     path // trimmed at the outlines and arrowheads
	tips      [2]arrowTip
	labelAt   [][2]float64 // centres of labels, then xlabels
	endAt     [2][2]float64
	badge     [2]float64
	loop      bool
	differ    bool // copies differ in look
}

type arrowTip struct {
	on     bool
	x, y   float64
	ux, uy float64
}

// panel is one graph laid out on the page.
type panel struct {
	title                  string
	directed               bool
	nodes                  []pnode
	links                  []plink
	frames                 []pframe
	bg                     paint
	label                  *nodesize.Label
	labelColor             paint
	labelX, labelY         float64 // centre of the graph label, DOT coordinates
	minX, minY, maxX, maxY float64 // extent in DOT coordinates
	top                    float64 // document y of maxY
	unrouted               int
}

type pframe struct {
	x0, y0, x1, y1 float64
	fill, stroke   paint
	pen            float64
	dash           string
	round, invis   bool
	label          *nodesize.Label
	text           paint
	labelX, labelY float64 // centre of the label
}

// Node and edge attributes the preview reads (nodesize reads the sizes).
var (
	nodeKeys = []string{"color", "fillcolor", "fontcolor", "style", "penwidth", "xlabel", "tooltip", "fontsize"}
	edgeKeys = []string{"color", "fontcolor", "fontsize", "style", "penwidth", "dir", "arrowhead", "arrowtail",
		"arrowsize", "xlabel", "headlabel", "taillabel", "labelfontcolor", "labelfontsize", "tooltip", "label"}
)

// attrText is the text of a table entry.
func attrText(t *dotio.AttrTable, i int, key string) (string, bool) {
	a, ok := t.Get(i, key)
	if !ok {
		return "", false
	}
	s, _ := a.Text()
	return s, true
}

func newPanel(pg Graph, index int, nd *notDrawn) (*panel, error) {
	g := pg.G
	if g == nil {
		return nil, fmt.Errorf("preview: graph %d is missing", index+1)
	}
	if len(pg.X) != len(g.Nodes) || len(pg.Y) != len(g.Nodes) {
		return nil, fmt.Errorf("preview: graph %d: %d x and %d y positions for %d nodes", index+1, len(pg.X), len(pg.Y), len(g.Nodes))
	}
	if pg.Removed != nil && len(pg.Removed) != len(g.Edges) {
		return nil, fmt.Errorf("preview: graph %d: %d removed flags for %d edges", index+1, len(pg.Removed), len(g.Edges))
	}
	for i := range pg.X {
		if math.IsNaN(pg.X[i]) || math.IsInf(pg.X[i], 0) || math.IsNaN(pg.Y[i]) || math.IsInf(pg.Y[i], 0) {
			return nil, fmt.Errorf("preview: graph %d: node %d is at no finite point", index+1, i+1)
		}
	}
	keys := g.AttrKeys()
	keyNotes(nd, keys.Graph, keys.Subgraph, keys.Node, keys.Edge, pg.Frames != nil, pg.FromInput)

	p := &panel{title: title(g, index), directed: g.Directed, nodes: make([]pnode, len(g.Nodes))}
	p.minX, p.minY, p.maxX, p.maxY = math.Inf(1), math.Inf(1), math.Inf(-1), math.Inf(-1)
	if pg.BB != [4]float64{} {
		p.extend(min(pg.BB[0], pg.BB[2]), min(pg.BB[1], pg.BB[3]))
		p.extend(max(pg.BB[0], pg.BB[2]), max(pg.BB[1], pg.BB[3]))
	}
	sizer := nodesize.New(g)
	graphName := nodesize.PlainName(g.Name, strings.HasPrefix(g.ID, "<"))

	nt := g.NodeTable(nodeKeys...)
	for v, n := range g.Nodes {
		pn := newNode(sizer, nt, v, n, pg.X[v], pg.Y[v], graphName, nd)
		p.nodes[v] = pn
		p.extend(pn.x-max(pn.bw, pn.sw), pn.y-max(pn.bh, pn.sh))
		p.extend(pn.x+max(pn.bw, pn.sw), pn.y+max(pn.bh, pn.sh))
	}
	for _, f := range pg.Frames {
		fr := newFrame(f, graphName, nd)
		p.frames = append(p.frames, fr)
		p.extend(fr.x0, fr.y0)
		p.extend(fr.x1, fr.y1)
	}
	p.links = newLinks(g, sizer, pg.Removed, graphName, nd)
	p.route()
	for i := range p.links {
		p.placeLink(&p.links[i])
	}
	for i := range p.nodes {
		p.placeXLabel(i)
	}
	p.graphLabel(g, graphName, nd)
	if math.IsInf(p.minX, 0) {
		p.minX, p.minY, p.maxX, p.maxY = 0, 0, 0, 0
	}
	if p.label != nil {
		p.placeGraphLabel(g)
	}
	return p, nil
}

func (p *panel) extend(x, y float64) {
	p.minX, p.maxX = min(p.minX, x), max(p.maxX, x)
	p.minY, p.maxY = min(p.minY, y), max(p.maxY, y)
}

// extendLabel grows the extent to hold a label centred at (x, y).
func (p *panel) extendLabel(l *nodesize.Label, x, y float64) {
	if l.Empty() {
		return
	}
	p.extend(x-l.W/2, y-l.H/2)
	p.extend(x+l.W/2, y+l.H/2)
}

// title is the small heading above a graph: its name, or which anonymous
// graph it is (our own look).
func title(g *dotio.Graph, index int) string {
	if g.ID == "" {
		kind := "graph"
		if g.Directed {
			kind = "digraph"
		}
		return fmt.Sprintf("(anonymous %s %d)", kind, index+1)
	}
	return nodesize.PlainName(g.Name, strings.HasPrefix(g.ID, "<"))
}

// colorOf reads a colour attribute into a paint; unknown colours are
// noted and give def.
func colorOf(text string, set bool, def paint, nd *notDrawn, unit string) paint {
	if !set {
		return def
	}
	c, note, ok := parseColor(text)
	if note != "" {
		nd.add(note, unit)
	}
	if !ok {
		return def
	}
	return c
}

func newNode(sizer *nodesize.Sizer, nt *dotio.AttrTable, v int, n dotio.Node, x, y float64, graphName string, nd *notDrawn) pnode {
	sz := sizer.Node(v)
	pn := pnode{x: x, y: y, size: sz, bw: sz.W / 2, bh: sz.H / 2, sw: sz.ShapeW / 2, sh: sz.ShapeH / 2}
	pn.name = nodesize.PlainName(n.Name, strings.HasPrefix(n.ID, "<"))
	pn.tip = pn.name
	if t, ok := attrText(nt, v, "tooltip"); ok {
		pn.tip = t
	}
	if sz.Shape == nil {
		pn.own, pn.kind = true, nodesize.Rect
		if sz.ShapeName != "" {
			nd.add(fmt.Sprintf("shape %q (drawn as our own box)", sz.ShapeName), "node")
		}
	} else {
		pn.kind = sz.Shape.Kind
		pn.round = sz.Shape.Rounded
	}
	styleText, _ := attrText(nt, v, "style")
	st, unknown := parseStyle(styleText, "node")
	for _, u := range unknown {
		nd.add(fmt.Sprintf("node style %q", u), "node")
	}
	pn.invis = st.invis
	if st.rounded {
		switch {
		case pn.kind == nodesize.Rect || pn.kind == nodesize.Record:
			pn.round = true
		case pn.own:
		default:
			nd.add(fmt.Sprintf("style rounded on shape %q", sz.ShapeName), "node")
		}
	}
	colorText, colorSet := attrText(nt, v, "color")
	fillText, fillSet := attrText(nt, v, "fillcolor")
	fontText, fontSet := attrText(nt, v, "fontcolor")
	penText, penSet := attrText(nt, v, "penwidth")
	pn.pen, _ = penWidth(penText, penSet, st, nodePen)
	pn.stroke = colorOf(colorText, colorSet, hexPaint(nodeStroke), nd, "node")
	pn.dash = st.dashArray(pn.pen)
	switch {
	case pn.kind == nodesize.NoOutline || pn.kind == nodesize.Underline:
		pn.fill = noPaint
		if st.filled {
			pn.fill = colorOf(fillText, fillSet, colorOf(colorText, colorSet, hexPaint(filledDefault), nd, "node"), nd, "node")
		}
	case st.filled || (!pn.own && pn.size.Shape != nil && pn.size.Shape.Name == "point" && (fillSet || colorSet)):
		pn.fill = colorOf(fillText, fillSet, colorOf(colorText, colorSet, hexPaint(filledDefault), nd, "node"), nd, "node")
	default:
		pn.fill = hexPaint(nodeFill)
	}
	switch {
	case pn.fill.none() || pn.fill.opacity < 0.5:
		pn.text = hexPaint(inkColor)
	case pn.fill.luminance() > 0.5:
		pn.text = hexPaint(inkColor)
	default:
		pn.text = hexPaint(nodeText)
	}
	pn.text = colorOf(fontText, fontSet, pn.text, nd, "node")
	labelNotes(sz.Label, nd)
	if a, ok := nt.Get(v, "xlabel"); ok {
		fsText, fsSet := attrText(nt, v, "fontsize")
		font := nodesize.FontSize(fsText, fsSet)
		pn.xlabel = labelOf(a, font, nodesize.Escapes{N: pn.name, HasN: true, G: graphName})
		labelNotes(pn.xlabel, nd)
		pn.xcolor = colorOf(fontText, fontSet, hexPaint(inkColor), nd, "node")
	}
	return pn
}

// labelNotes notes what a label holds that is not drawn: what nodesize
// could not lay out, and HTML colours that are not known.
func labelNotes(l *nodesize.Label, nd *notDrawn) {
	if l == nil {
		return
	}
	for _, note := range l.Notes {
		nd.add(note, "label")
	}
	color := func(c string) {
		if c == "" {
			return
		}
		if _, note, ok := parseColor(c); !ok || note != "" {
			nd.add(note, "label")
		}
	}
	lines := func(ls []nodesize.Line) {
		for _, ln := range ls {
			for _, r := range ln.Runs {
				color(r.Color)
			}
		}
	}
	lines(l.Lines)
	tables := []*nodesize.Table{l.Table}
	for len(tables) > 0 {
		t := tables[len(tables)-1]
		tables = tables[:len(tables)-1]
		if t == nil {
			continue
		}
		color(t.Color)
		color(t.BGColor)
		for _, c := range t.Cells {
			color(c.Color)
			color(c.BGColor)
			lines(c.Lines)
			tables = append(tables, c.Table)
		}
	}
}

// labelOf lays out an extra label (xlabel, headlabel, taillabel, a graph
// or cluster label).
func labelOf(a dotio.Attr, font float64, esc nodesize.Escapes) *nodesize.Label {
	text, html := a.Text()
	return nodesize.Layout(text, html, font, esc)
}

func newFrame(f Frame, graphName string, nd *notDrawn) pframe {
	get := func(key string) (string, dotio.Attr, bool) {
		for i := len(f.Attrs) - 1; i >= 0; i-- {
			if f.Attrs[i].Name() == key {
				t, _ := f.Attrs[i].Text()
				return t, f.Attrs[i], true
			}
		}
		return "", dotio.Attr{}, false
	}
	fr := pframe{x0: min(f.X0, f.X1), y0: min(f.Y0, f.Y1), x1: max(f.X0, f.X1), y1: max(f.Y0, f.Y1)}
	styleText, _, _ := get("style")
	st, unknown := parseStyle(styleText, "cluster")
	for _, u := range unknown {
		nd.add(fmt.Sprintf("cluster style %q", u), "cluster")
	}
	fr.invis, fr.round = st.invis, st.rounded
	penText, _, penSet := get("penwidth")
	fr.pen, _ = penWidth(penText, penSet, st, 1)
	fr.dash = st.dashArray(fr.pen)
	colorText, _, colorSet := get("color")
	pencolorText, _, pencolorSet := get("pencolor")
	fr.stroke = colorOf(colorText, colorSet, hexPaint(frameStroke), nd, "cluster")
	fr.stroke = colorOf(pencolorText, pencolorSet, fr.stroke, nd, "cluster")
	fillText, _, fillSet := get("fillcolor")
	bgText, _, bgSet := get("bgcolor")
	fr.fill = colorOf(bgText, bgSet, hexPaint(frameFill), nd, "cluster")
	if st.filled {
		fr.fill = colorOf(fillText, fillSet, colorOf(colorText, colorSet, hexPaint(filledDefault), nd, "cluster"), nd, "cluster")
	}
	fontText, _, fontSet := get("fontcolor")
	fr.text = colorOf(fontText, fontSet, hexPaint(titleColor), nd, "cluster")
	if _, a, ok := get("label"); ok {
		fsText, _, fsSet := get("fontsize")
		font := nodesize.FontSize(fsText, fsSet)
		fr.label = labelOf(a, font, nodesize.Escapes{G: f.Name})
		labelNotes(fr.label, nd)
		// Inside the frame: at its top by default (labelloc t for
		// clusters, from memory), centred unless labeljust says l or r.
		loc, _, _ := get("labelloc")
		just, _, _ := get("labeljust")
		fr.labelX = (fr.x0 + fr.x1) / 2
		switch strings.ToLower(strings.TrimSpace(just)) {
		case "l":
			fr.labelX = fr.x0 + frameLabelIn + fr.label.W/2
		case "r":
			fr.labelX = fr.x1 - frameLabelIn - fr.label.W/2
		}
		fr.labelY = fr.y1 - frameLabelIn/2 - fr.label.H/2
		if strings.ToLower(strings.TrimSpace(loc)) == "b" {
			fr.labelY = fr.y0 + frameLabelIn/2 + fr.label.H/2
		}
	}
	return fr
}

// newLinks groups the edges by unordered pair of ends and removed state,
// in order of first appearance, each group in the look of its first copy.
func newLinks(g *dotio.Graph, sizer *nodesize.Sizer, removed []bool, graphName string, nd *notDrawn) []plink {
	type key struct {
		u, v    int32
		removed bool
	}
	keyOf := func(i int) key {
		e := g.Edges[i]
		return key{min(e.From, e.To), max(e.From, e.To), removed != nil && removed[i]}
	}
	cmpKey := func(a, b key) int {
		return cmp.Or(cmp.Compare(a.u, b.u), cmp.Compare(a.v, b.v), cmpBool(a.removed, b.removed))
	}
	order := make([]int, len(g.Edges))
	for i := range order {
		order[i] = i
	}
	slices.SortStableFunc(order, func(a, b int) int { return cmpKey(keyOf(a), keyOf(b)) })
	et := g.EdgeTable(edgeKeys...)
	look := func(i int) string {
		var b strings.Builder
		for _, k := range []string{"color", "style", "penwidth", "dir", "arrowhead", "arrowtail", "arrowsize"} {
			t, _ := attrText(et, i, k)
			b.WriteString(t + "\x00")
		}
		return b.String()
	}
	groups := 0
	for j, i := range order {
		if j == 0 || cmpKey(keyOf(order[j-1]), keyOf(i)) != 0 {
			groups++
		}
	}
	links := make([]plink, 0, groups)
	for j, i := range order {
		k := keyOf(i)
		e := g.Edges[i]
		if j == 0 || cmpKey(keyOf(order[j-1]), k) != 0 {
			links = append(links, newLink(g, et, i, k.u, k.v, k.removed, nd))
		}
		l := &links[len(links)-1]
		l.count++
		if l.count > 1 && !l.differ && look(i) != look(l.first) {
			l.differ = true
		}
		// Labels of every copy, each distinct one once.
		if lab := sizer.EdgeLabel(i); !lab.Empty() {
			labelNotes(lab, nd)
			if !slices.ContainsFunc(l.labels, func(x *nodesize.Label) bool { return sameText(x, lab) }) {
				l.labels = append(l.labels, lab)
			}
		}
		tail := nodesize.PlainName(g.Nodes[e.From].Name, strings.HasPrefix(g.Nodes[e.From].ID, "<"))
		head := nodesize.PlainName(g.Nodes[e.To].Name, strings.HasPrefix(g.Nodes[e.To].ID, "<"))
		op := " -- "
		if g.Directed {
			op = " -> "
		}
		esc := nodesize.Escapes{G: graphName, HasE: true, T: tail, H: head, E: tail + op + head}
		fsText, fsSet := attrText(et, i, "fontsize")
		font := nodesize.FontSize(fsText, fsSet)
		if a, ok := et.Get(i, "xlabel"); ok {
			lab := labelOf(a, font, esc)
			if !lab.Empty() && !slices.ContainsFunc(l.xlabels, func(x *nodesize.Label) bool { return sameText(x, lab) }) {
				l.xlabels = append(l.xlabels, lab)
			}
		}
		lfText, lfSet := attrText(et, i, "labelfontsize")
		endFont := font
		if lfSet {
			endFont = nodesize.FontSize(lfText, lfSet)
		}
		for _, end := range []struct {
			key  string
			node int32
		}{{"taillabel", e.From}, {"headlabel", e.To}} {
			a, ok := et.Get(i, end.key)
			if !ok {
				continue
			}
			lab := labelOf(a, endFont, esc)
			side := 0
			if end.node == l.v && l.u != l.v {
				side = 1
			}
			if l.endLabels[side] == nil && !lab.Empty() {
				l.endLabels[side] = lab
			}
		}
	}
	slices.SortFunc(links, func(a, b plink) int { return cmp.Compare(a.first, b.first) })
	differ := 0
	for _, l := range links {
		if l.differ {
			differ++
		}
	}
	if differ > 0 {
		nd.addN("the looks of repeated edges after the first (each pair is drawn once)", "pair", differ)
	}
	return links
}

func cmpBool(a, b bool) int {
	switch {
	case a == b:
		return 0
	case a:
		return 1
	}
	return -1
}

// sameText reports whether two labels show the same lines.
func sameText(a, b *nodesize.Label) bool {
	if len(a.Lines) != len(b.Lines) || a.Table != nil || b.Table != nil {
		return false
	}
	for i := range a.Lines {
		if a.Lines[i].Text() != b.Lines[i].Text() {
			return false
		}
	}
	return true
}

// normalArrow is the arrowhead DOT draws when none is named; shared, never
// changed.
var normalArrow = []arrowPart{{shape: "normal"}}

// newLink starts a group from its first copy, edge i.
func newLink(g *dotio.Graph, et *dotio.AttrTable, i int, u, v int32, removed bool, nd *notDrawn) plink {
	l := plink{u: u, v: v, removed: removed, first: i, loop: u == v}
	styleText, _ := attrText(et, i, "style")
	st, unknown := parseStyle(styleText, "edge")
	for _, x := range unknown {
		nd.add(fmt.Sprintf("edge style %q", x), "edge")
	}
	l.invis = st.invis
	colorText, colorSet := attrText(et, i, "color")
	penText, penSet := attrText(et, i, "penwidth")
	ours, def := edgePen, hexPaint(edgeColor)
	if removed {
		ours, def = removedPen, hexPaint(removedColor)
		if !st.dotted {
			st.dashed = true
		}
	}
	l.pen, _ = penWidth(penText, penSet, st, ours)
	l.stroke = colorOf(colorText, colorSet, def, nd, "edge")
	l.dash = st.dashArray(l.pen)
	fontText, fontSet := attrText(et, i, "fontcolor")
	l.text = colorOf(fontText, fontSet, hexPaint(inkColor), nd, "edge")
	lfc, lfcSet := attrText(et, i, "labelfontcolor")
	l.endText = colorOf(lfc, lfcSet, l.text, nd, "edge")
	if t, ok := attrText(et, i, "tooltip"); ok {
		l.tip = t
	}
	asText, asSet := attrText(et, i, "arrowsize")
	l.arrowSize = arrowSize(asText, asSet)

	// Arrowheads: dir says which ends have one (forward in a digraph,
	// none in a graph, by default); arrowhead and arrowtail say which.
	e := g.Edges[i]
	dir := "none"
	if g.Directed {
		dir = "forward"
	}
	if d, ok := attrText(et, i, "dir"); ok {
		switch d = strings.ToLower(strings.TrimSpace(d)); d {
		case "forward", "back", "both", "none":
			dir = d
		default:
			nd.add(fmt.Sprintf("dir %q", d), "edge")
		}
	}
	arrow := func(key string) []arrowPart {
		text, ok := attrText(et, i, key)
		if !ok {
			return normalArrow
		}
		parts, ok := parseArrow(text)
		if !ok {
			nd.add(fmt.Sprintf("%s %q (drawn as normal)", key, text), "edge")
			return normalArrow
		}
		return parts
	}
	side := func(n int32) int {
		if n == v && u != v {
			return 1
		}
		return 0
	}
	if dir == "forward" || dir == "both" {
		l.arrows[side(e.To)] = arrow("arrowhead")
	}
	if dir == "back" || dir == "both" {
		s := side(e.From)
		if u == v {
			s = 1 // a loop: the tail's arrow at the loop's start
		}
		l.arrows[s] = arrow("arrowtail")
	}
	return l
}
