package main

import (
	"encoding/json"
	"fmt"
	"maps"
	"math"
	"os"
	"path/filepath"
	"regexp"
	"slices"
	"strconv"
	"strings"
	"testing"
	"unicode/utf8"

	"gonum.org/v1/gonum/graph/formats/dot"
	"gonum.org/v1/gonum/graph/formats/dot/ast"
)

// This file checks the --report file against README.md ("Quality report"):
// every documented field is there and nothing else, and each figure that
// can be derived from the command's own DOT output (positions, bb, edges,
// and the --removed file) agrees with the documented definition. The
// figures are recomputed here from the output as parsed by gonum's parser
// and the DOT interpreter of lossless_test.go, not from the command's
// internal data.

// reportOut is the documented shape of the report, decoded on its own.
type reportOut struct {
	Files []struct {
		File         string        `json:"file"`
		ReadSeconds  float64       `json:"read_seconds"`
		WriteSeconds float64       `json:"write_seconds"`
		Graphs       []graphRecord `json:"graphs"`
	} `json:"files"`
}

type graphRecord struct {
	Graph                 string             `json:"graph"`
	Directed              bool               `json:"directed"`
	Nodes                 int                `json:"nodes"`
	Edges                 int                `json:"edges"`
	RemovedEdges          int                `json:"removed_edges"`
	RemovedPairs          int                `json:"removed_pairs"`
	RemovalOptimal        bool               `json:"removal_optimal"`
	Method                string             `json:"method"`
	Components            int                `json:"components"`
	TutteComponents       int                `json:"tutte_components"`
	ConvexComponents      int                `json:"convex_components"`
	TreeComponents        int                `json:"tree_components"`
	FaceCountComponents   int                `json:"face_count_components"`
	ReadableComponents    int                `json:"readable_components"`
	UnrefinedComponents   int                `json:"unrefined_components"`
	UnrefinedWhy          map[string]int     `json:"unrefined_why"`
	GridWidth             int64              `json:"grid_width"`
	GridHeight            int64              `json:"grid_height"`
	AreaRatio             float64            `json:"area_ratio"`
	CompactionSaved       float64            `json:"compaction_saved"`
	Unit                  int64              `json:"unit"`
	WidthPt               int64              `json:"width_pt"`
	HeightPt              int64              `json:"height_pt"`
	MinAngleDeg           float64            `json:"min_angle_deg"`
	EdgeLengthRatio       float64            `json:"edge_length_ratio"`
	MinVertexEdgeDistance *float64           `json:"min_vertex_edge_distance"`
	BoxOverlaps           int                `json:"box_overlaps"`
	EdgesThroughBoxes     int                `json:"edges_through_boxes"`
	Seconds               map[string]float64 `json:"seconds"`
	Clusters              int                `json:"clusters"`
	ClusterIntrusions     int64              `json:"cluster_intrusions"`
	FrameOverlaps         int64              `json:"frame_overlaps"`
	FlowAlong             *int               `json:"flow_along"`
	FlowAgainst           *int               `json:"flow_against"`
	FlowOnCycles          *int               `json:"flow_on_cycles"`
	Stress                float64            `json:"stress"`
	EdgeLengthCV          float64            `json:"edge_length_cv"`
	AngularResolution     float64            `json:"angular_resolution"`
}

// reportInputs are the graphs the report is checked on, written as DOT.
var reportInputs = []struct{ name, src string }{
	// The wheel W5 (hub h, rim a..e) is planar; a repeated rim edge and a
	// loop count as edges but must not count as angles or lengths twice.
	{"wheel.dot", "graph wheel {\n h -- {a b c d e}\n a -- b -- c -- d -- e -- a\n a -- b\n c -- c\n}\n"},
	{"k5.dot", "graph K5 { a -- b -- c -- d -- e -- a -- c -- e -- b -- d -- a }\n"},
	// K3,3 with one edge repeated.
	{"k33.dot", "digraph U {\n {h1 h2 h3} -> {w g p}\n h1 -> w\n}\n"},
	// Two components: a triangle and a square with a diagonal.
	{"two.dot", "graph two {\n a -- b -- c -- a\n d -- e -- f -- g -- d\n d -- f\n}\n"},
	// Two tiny graphs in one file.
	{"tiny.dot", "graph one { a }\ngraph pair { a -- b }\n"},
}

// The shipped examples, by path from this package.
var reportExamples = []string{
	"../../examples/campus-fibre.dot",
	"../../examples/cottages.dot",
	"../../examples/tram-network.dot",
}

// reportExpect holds outside facts about some of the inputs, by graph ID.
// Removed pairs: a simple planar graph with n >= 3 nodes has at most 3n-6
// edges, a bipartite one at most 2n-4 (both from Euler's formula v-e+f=2;
// e.g. Diestel, Graph Theory, Corollary 4.2.10), and K5 or K3,3 minus any
// edge is planar (Kuratowski's minimal non-planar graphs); so K5 needs
// exactly 10-9 = 1 pair removed and K3,3 exactly 9-8 = 1. README.md says
// gridwood proves that minimum where Euler's bound matches, so
// removal_optimal must be true there. Wheels are planar.
var reportExpect = map[string]struct {
	removedPairs, components int
	optimal                  bool
}{
	"wheel":    {0, 1, true},
	"K5":       {1, 1, true},
	"U":        {1, 1, true},
	"wrenfold": {1, 1, true}, // examples/cottages.dot is K3,3
	"two":      {0, 2, true},
	"one":      {0, 1, true},
	"pair":     {0, 1, true},
}

// readmeReport is what README.md's "Quality report" section lists.
type readmeReport struct {
	intro     string            // the prose before the table
	fileKeys  []string          // the keys of a file record, and "files"
	graphKeys []string          // the field table's first column
	meaning   map[string]string // each graph key's meaning cell
	subKeys   map[string][]string
}

// parseReadmeReport reads the section: the JSON sketch in the prose before
// the table gives the file-level keys, the table rows the graph-level ones
// (a cell may name several), and for a field whose value is an object the
// names in its meaning cell are its keys.
func parseReadmeReport(t *testing.T) readmeReport {
	t.Helper()
	b, err := os.ReadFile("../../README.md")
	if err != nil {
		t.Fatal(err)
	}
	text := string(b)
	start := strings.Index(text, "\n## Quality report\n")
	if start < 0 {
		t.Fatal(`README.md has no "## Quality report" section`)
	}
	sec := text[start+1:]
	if end := strings.Index(sec[3:], "\n## "); end >= 0 {
		sec = sec[:end+3]
	}
	tableAt := strings.Index(sec, "\n| field")
	if tableAt < 0 {
		t.Fatal("README.md, Quality report: no field table")
	}
	rr := readmeReport{intro: sec[:tableAt], meaning: map[string]string{}, subKeys: map[string][]string{}}
	for _, m := range regexp.MustCompile(`"([a-z_]+)"`).FindAllStringSubmatch(sec[:tableAt], -1) {
		if !slices.Contains(rr.fileKeys, m[1]) {
			rr.fileKeys = append(rr.fileKeys, m[1])
		}
	}
	code := regexp.MustCompile("`([^`]+)`")
	for _, line := range strings.Split(sec[tableAt+1:], "\n") {
		if !strings.HasPrefix(line, "|") {
			break
		}
		cells := strings.Split(strings.Trim(line, "|"), "|")
		if len(cells) < 2 || strings.TrimSpace(cells[0]) == "field" || strings.HasPrefix(strings.TrimSpace(cells[0]), "---") {
			continue
		}
		meaning := strings.TrimSpace(strings.Join(cells[1:], "|"))
		for _, m := range code.FindAllStringSubmatch(cells[0], -1) {
			rr.graphKeys = append(rr.graphKeys, m[1])
			rr.meaning[m[1]] = meaning
			for _, s := range code.FindAllStringSubmatch(meaning, -1) {
				rr.subKeys[m[1]] = append(rr.subKeys[m[1]], s[1])
			}
		}
	}
	if len(rr.graphKeys) == 0 || len(rr.fileKeys) == 0 {
		t.Fatalf("README.md, Quality report: found file keys %q and graph keys %q", rr.fileKeys, rr.graphKeys)
	}
	return rr
}

// reportRun is one run of the command over every input with --report and
// --removed: the decoded report, its untyped form, and the output and
// removed graphs, one per report record in order.
type reportRun struct {
	rep     reportOut
	raw     map[string]any
	records []graphRecord
	out     []*ast.Graph
	removed []*ast.Graph
	inputs  []string
}

func runReport(t *testing.T, extra ...string) reportRun {
	t.Helper()
	dir := t.TempDir()
	var inputs []string
	for _, in := range reportInputs {
		p := filepath.Join(dir, in.name)
		if err := os.WriteFile(p, []byte(in.src), 0o644); err != nil {
			t.Fatal(err)
		}
		inputs = append(inputs, p)
	}
	inputs = append(inputs, reportExamples...)
	repPath, rmPath := filepath.Join(dir, "report.json"), filepath.Join(dir, "removed.dot")
	args := append([]string{"-q", "--report", repPath, "--removed", rmPath}, extra...)
	code, out, errs := runCmd(t, "", append(args, inputs...)...)
	if code != exitOK {
		t.Fatalf("exit %d: %s", code, errs)
	}
	var r reportRun
	r.inputs = inputs
	b, err := os.ReadFile(repPath)
	if err != nil {
		t.Fatal(err)
	}
	if err := json.Unmarshal(b, &r.rep); err != nil {
		t.Fatalf("report does not decode: %v\n%s", err, b)
	}
	if err := json.Unmarshal(b, &r.raw); err != nil {
		t.Fatal(err)
	}
	for _, f := range r.rep.Files {
		r.records = append(r.records, f.Graphs...)
	}
	of, err := dot.ParseString(out)
	if err != nil {
		t.Fatalf("output does not parse: %v", err)
	}
	rb, err := os.ReadFile(rmPath)
	if err != nil {
		t.Fatal(err)
	}
	rf, err := dot.ParseBytes(rb)
	if err != nil {
		t.Fatalf("removed file does not parse: %v\n%s", err, rb)
	}
	r.out, r.removed = of.Graphs, rf.Graphs
	if len(r.records) != len(r.out) || len(r.removed) != len(r.out) {
		t.Fatalf("%d report records, %d output graphs, %d removed-file graphs", len(r.records), len(r.out), len(r.removed))
	}
	return r
}

// drawn is one output graph as the tests below measure it.
type drawn struct {
	m      *graphMeaning
	pos    [][2]int64
	bbW    int64
	bbH    int64
	kept   [][2]int // distinct node pairs, loops and removed pairs left out
	all    [][2]int // distinct node pairs of every edge, loops left out
	rs     removedSet
	nRmEdg int
}

func drawGraph(t *testing.T, out, removed *ast.Graph) drawn {
	t.Helper()
	d := drawn{m: interpretGraph(out)}
	var err error
	_, d.pos, d.bbW, d.bbH, err = appendedLayout(out, d.m)
	if err != nil {
		t.Fatalf("graph %s: %v", out.ID, err)
	}
	d.rs = readRemoved(removed)
	d.nRmEdg = len(interpretGraph(removed).Edges)
	seenAll, seenKept := map[[2]int]bool{}, map[[2]int]bool{}
	for _, e := range d.m.Edges {
		if e.From == e.To {
			continue
		}
		k := [2]int{min(e.From, e.To), max(e.From, e.To)}
		if !seenAll[k] {
			seenAll[k] = true
			d.all = append(d.all, k)
		}
		if !d.rs.hasPair(d.m, e) && !seenKept[k] {
			seenKept[k] = true
			d.kept = append(d.kept, k)
		}
	}
	return d
}

// components returns a component number per node, joined by the pairs.
func components(n int, pairs [][2]int) ([]int, int) {
	parent := make([]int, n)
	for i := range parent {
		parent[i] = i
	}
	var find func(int) int
	find = func(v int) int {
		for parent[v] != v {
			parent[v] = parent[parent[v]]
			v = parent[v]
		}
		return v
	}
	for _, p := range pairs {
		parent[find(p[0])] = find(p[1])
	}
	comp, number := make([]int, n), map[int]int{}
	for v := range n {
		r := find(v)
		if _, ok := number[r]; !ok {
			number[r] = len(number)
		}
		comp[v] = number[r]
	}
	return comp, len(number)
}

// minAngle is the smallest angle in degrees between two of the pairs at a
// common node, over every two pairs there (ok false: no node has two).
func minAngle(pos [][2]int64, pairs [][2]int) (float64, bool) {
	at := make([][]int, len(pos))
	for _, p := range pairs {
		at[p[0]] = append(at[p[0]], p[1])
		at[p[1]] = append(at[p[1]], p[0])
	}
	best, ok := 180.0, false
	for v, nb := range at {
		for i := range nb {
			for j := i + 1; j < len(nb); j++ {
				ax, ay := float64(pos[nb[i]][0]-pos[v][0]), float64(pos[nb[i]][1]-pos[v][1])
				bx, by := float64(pos[nb[j]][0]-pos[v][0]), float64(pos[nb[j]][1]-pos[v][1])
				a := math.Atan2(math.Abs(ax*by-ay*bx), ax*bx+ay*by) * 180 / math.Pi
				best, ok = min(best, a), true
			}
		}
	}
	return best, ok
}

func segLength(pos [][2]int64, p [2]int) float64 {
	return math.Hypot(float64(pos[p[1]][0]-pos[p[0]][0]), float64(pos[p[1]][1]-pos[p[0]][1]))
}

// minNodeEdge is the smallest distance from a node to a segment of a pair
// it is not in (ok false: there is no such node and pair).
func minNodeEdge(pos [][2]int64, pairs [][2]int) (float64, bool) {
	best, ok := math.Inf(1), false
	for _, p := range pairs {
		ax, ay := float64(pos[p[0]][0]), float64(pos[p[0]][1])
		bx, by := float64(pos[p[1]][0]), float64(pos[p[1]][1])
		for w := range pos {
			if w == p[0] || w == p[1] {
				continue
			}
			wx, wy := float64(pos[w][0]), float64(pos[w][1])
			// Distance to the closest of the segment's ends or to its
			// line, when the foot of the perpendicular lies on it.
			d := min(math.Hypot(wx-ax, wy-ay), math.Hypot(wx-bx, wy-by))
			ex, ey := bx-ax, by-ay
			if proj := (wx-ax)*ex + (wy-ay)*ey; proj > 0 && proj < ex*ex+ey*ey {
				d = min(d, math.Abs(ex*(wy-ay)-ey*(wx-ax))/math.Hypot(ex, ey))
			}
			best, ok = min(best, d), true
		}
	}
	return best, ok
}

// box is a node box in points per README.md, Node boxes, as half sizes.
type box struct{ hw, hh float64 }

// readmeBoxes computes every node's box by README.md's rule ("Node boxes", in full in dotio/nodesize/doc.go):
// width and height in inches (0.75 and 0.5), grown to fit the label unless
// fixedsize=true, a label line being 0.6 em per character and 1.2 em per
// line (fontsize, 14 points) plus 8 points across and 4 above and below;
// a circle as wide as tall, from width alone, height alone or the larger
// of both (0.5 inch if neither), grown to the least circle around the
// label's box. ok is false when a node has something the rule does not
// cover simply (an escape or HTML in its label, a margin or peripheries,
// another shape than a box, plaintext or circle).
func readmeBoxes(m *graphMeaning) ([]box, bool) {
	num := func(a attrMap, key string, def float64) (float64, bool, bool) {
		s, set := a[key]
		if !set {
			return def, false, true
		}
		v, err := strconv.ParseFloat(strings.TrimSpace(s), 64)
		return v, true, err == nil && v > 0
	}
	boxes := make([]box, len(m.Nodes))
	for i, n := range m.Nodes {
		w, wSet, ok1 := num(n.Attrs, "width", 0.75)
		h, hSet, ok2 := num(n.Attrs, "height", 0.5)
		font, _, ok3 := num(n.Attrs, "fontsize", 14)
		if !ok1 || !ok2 || !ok3 {
			return nil, false
		}
		if _, set := n.Attrs["margin"]; set {
			return nil, false
		}
		if _, set := n.Attrs["peripheries"]; set {
			return nil, false
		}
		shape := strings.ToLower(n.Attrs["shape"])
		circle := shape == "circle"
		switch shape {
		case "", "box", "rect", "rectangle", "plaintext", "none", "circle":
		default:
			return nil, false
		}
		if circle {
			switch {
			case wSet && hSet:
				w = max(w, h)
			case hSet:
				w = h
			case !wSet:
				w = 0.5
			}
			h = w
		}
		w, h = w*72, h*72
		fixed := strings.EqualFold(n.Attrs["fixedsize"], "true")
		label, set := n.Attrs["label"]
		if !set || label == `\N` {
			label = n.Key
		}
		if strings.ContainsAny(label, "\\\x00\n") || strings.HasPrefix(label, "<") {
			return nil, false
		}
		if !fixed && label != "" {
			lw := float64(utf8.RuneCountInString(label))*0.6*font + 16
			lh := 1.2*font + 8
			if circle {
				w = max(w, math.Hypot(lw, lh))
				h = w
			} else {
				w, h = max(w, lw), max(h, lh)
			}
		}
		boxes[i] = box{w / 2, h / 2}
	}
	return boxes, true
}

// segThroughOpenBox reports whether the segment a-b meets the open box
// around c in a piece of positive length (Liang-Barsky clipping).
func segThroughOpenBox(a, b, c [2]int64, bx box) bool {
	t0, t1 := 0.0, 1.0
	for k, half := range []float64{bx.hw, bx.hh} {
		p, d := float64(a[k]-c[k]), float64(b[k]-a[k])
		lo, hi := -half, half
		if d == 0 {
			if p <= lo || p >= hi {
				return false
			}
			continue
		}
		ta, tb := (lo-p)/d, (hi-p)/d
		if ta > tb {
			ta, tb = tb, ta
		}
		t0, t1 = max(t0, ta), min(t1, tb)
	}
	return t0 < t1
}

func nearRel(got, want, tol float64) bool {
	return math.Abs(got-want) <= tol*max(1, math.Abs(want))
}

// checkRecord compares one report record with what the output says.
func checkRecord(t *testing.T, rec graphRecord, out *ast.Graph, d drawn, unitFlag int64) {
	t.Helper()
	id := canonicalID(out.ID)
	n := len(d.m.Nodes)
	// Which graph (its name, unquoted; "" when anonymous), and its size
	// (edges as written, repeats and loops).
	if rec.Directed != out.Directed || rec.Graph != strings.TrimPrefix(id, "\x00") {
		t.Errorf("graph %q: directed %v, want the output's %v %q", rec.Graph, rec.Directed, out.Directed, id)
	}
	if rec.Nodes != n || rec.Edges != len(d.m.Edges) {
		t.Errorf("%s: nodes %d edges %d, output has %d nodes %d edges", id, rec.Nodes, rec.Edges, n, len(d.m.Edges))
	}
	// Set aside: the --removed file's edges and their distinct pairs.
	if rec.RemovedEdges != d.nRmEdg || rec.RemovedPairs != len(d.rs.pairs) {
		t.Errorf("%s: removed_edges %d removed_pairs %d, --removed lists %d edges on %d pairs", id, rec.RemovedEdges, rec.RemovedPairs, d.nRmEdg, len(d.rs.pairs))
	}
	if rec.RemovedEdges == 0 && !rec.RemovalOptimal {
		t.Errorf("%s: nothing removed but removal_optimal false", id)
	}
	_, ncomp := components(n, d.all)
	if want, ok := reportExpect[id]; ok {
		if rec.RemovedPairs != want.removedPairs || rec.RemovalOptimal != want.optimal || ncomp != want.components {
			t.Errorf("%s: removed_pairs %d removal_optimal %v (computed components %d), want %d %v %d", id, rec.RemovedPairs, rec.RemovalOptimal, ncomp, want.removedPairs, want.optimal, want.components)
		}
	}
	if rec.Method != "schnyder" {
		t.Errorf("%s: method %q, want the default schnyder", id, rec.Method)
	}
	if rec.Components != ncomp || rec.TutteComponents < 0 || rec.ConvexComponents != 0 || rec.TutteComponents > ncomp {
		t.Errorf("%s: components %d (tutte %d, convex %d), output has %d", id, rec.Components, rec.TutteComponents, rec.ConvexComponents, ncomp)
	}
	if rec.TreeComponents < 0 || rec.FaceCountComponents < 0 || rec.TreeComponents+rec.TutteComponents+rec.FaceCountComponents > ncomp || unitFlag > 0 && rec.TreeComponents+rec.FaceCountComponents != 0 {
		t.Errorf("%s: tree_components %d, face_count_components %d (tutte %d) of %d components, --unit %d", id, rec.TreeComponents, rec.FaceCountComponents, rec.TutteComponents, ncomp, unitFlag)
	}
	// Each component the readable stage left alone is counted under one
	// reason (README.md, Quality report).
	why := 0
	for k, c := range rec.UnrefinedWhy {
		if c < 0 {
			t.Errorf("%s: unrefined_why.%s = %d", id, k, c)
		}
		why += c
	}
	if why != rec.UnrefinedComponents || rec.ReadableComponents < 0 || rec.ReadableComponents+rec.UnrefinedComponents > ncomp {
		t.Errorf("%s: readable_components %d, unrefined_components %d, unrefined_why %v (sum %d), of %d components", id, rec.ReadableComponents, rec.UnrefinedComponents, rec.UnrefinedWhy, why, ncomp)
	}
	if unitFlag > 0 && rec.TutteComponents != 0 {
		t.Errorf("%s: --unit skips the Tutte drawing (place/doc.go, The spacing rule), but tutte_components %d", id, rec.TutteComponents)
	}
	// Grid extent and area.
	if rec.GridWidth < 0 || rec.GridHeight < 0 {
		t.Errorf("%s: grid %d x %d", id, rec.GridWidth, rec.GridHeight)
	}
	if n != 2 { // n = 2 divides by zero; TestReportFieldsAreDocumented asks README
		if want := float64(rec.GridWidth*rec.GridHeight) / float64((n-2)*(n-2)); !nearRel(rec.AreaRatio, want, 1e-12) {
			t.Errorf("%s: area_ratio %v, grid %d x %d / (n-2)^2 = %v", id, rec.AreaRatio, rec.GridWidth, rec.GridHeight, want)
		}
	}
	if rec.CompactionSaved < 0 || rec.CompactionSaved >= 1 {
		t.Errorf("%s: compaction_saved %v, want a fraction", id, rec.CompactionSaved)
	}
	// Size in points: the output's bb.
	if rec.WidthPt != d.bbW || rec.HeightPt != d.bbH {
		t.Errorf("%s: width_pt x height_pt %d x %d, output bb 0,0,%d,%d", id, rec.WidthPt, rec.HeightPt, d.bbW, d.bbH)
	}
	// Angles and lengths over the drawn (kept, distinct) segments.
	if got, ok := minAngle(d.pos, d.kept); ok && !nearRel(rec.MinAngleDeg, got, 1e-9) {
		t.Errorf("%s: min_angle_deg %v, the output's positions give %v", id, rec.MinAngleDeg, got)
	} else if !ok && rec.MinAngleDeg != 180 {
		t.Errorf("%s: no node has two edges; min_angle_deg %v", id, rec.MinAngleDeg)
	}
	if len(d.kept) > 0 {
		lo, hi := math.Inf(1), 0.0
		for _, p := range d.kept {
			l := segLength(d.pos, p)
			lo, hi = min(lo, l), max(hi, l)
		}
		if !nearRel(rec.EdgeLengthRatio, hi/lo, 1e-12) {
			t.Errorf("%s: edge_length_ratio %v, the output gives %v / %v = %v", id, rec.EdgeLengthRatio, hi, lo, hi/lo)
		}
	}
	if rec.Unit <= 0 || (unitFlag > 0 && rec.Unit != unitFlag) {
		t.Errorf("%s: unit %d (--unit %d)", id, rec.Unit, unitFlag)
	}
	if dist, ok := minNodeEdge(d.pos, d.kept); ok {
		if rec.MinVertexEdgeDistance == nil {
			t.Errorf("%s: min_vertex_edge_distance null on a %d-node graph", id, n)
		} else if want := dist / float64(rec.Unit); !nearRel(*rec.MinVertexEdgeDistance, want, 1e-9) {
			t.Errorf("%s: min_vertex_edge_distance %v, the output gives %v / unit %d = %v", id, *rec.MinVertexEdgeDistance, dist, rec.Unit, want)
		}
	}
	// Node boxes, where README's rule gives them.
	if boxes, ok := readmeBoxes(d.m); ok {
		side := 0.0
		for _, b := range boxes {
			side = max(side, 2*b.hw, 2*b.hh)
		}
		// README, Grid drawings: the grid step (base unit) is the largest box side plus 18 points.
		// The output is integral: each half size is rounded up to a whole
		// point, which adds less than 2.
		if want := side + 18; unitFlag == 0 && (float64(rec.Unit) < want || float64(rec.Unit) >= want+2) {
			t.Errorf("%s: unit %d, README's rule gives %v (largest box side %v + 18)", id, rec.Unit, want, side)
		}
		overlaps, pairs := 0, 0
		through := map[[2]int]bool{}
		for i := range n {
			for j := i + 1; j < n; j++ {
				if math.Abs(float64(d.pos[i][0]-d.pos[j][0])) < boxes[i].hw+boxes[j].hw && math.Abs(float64(d.pos[i][1]-d.pos[j][1])) < boxes[i].hh+boxes[j].hh {
					overlaps++
				}
			}
		}
		for _, p := range d.kept {
			for v := range n {
				if v != p[0] && v != p[1] && segThroughOpenBox(d.pos[p[0]], d.pos[p[1]], d.pos[v], boxes[v]) {
					pairs++
					through[p] = true
				}
			}
		}
		if rec.BoxOverlaps != overlaps {
			t.Errorf("%s: box_overlaps %d, README's boxes at the output's positions overlap in %d pairs", id, rec.BoxOverlaps, overlaps)
		}
		if rec.EdgesThroughBoxes != len(through) {
			t.Errorf("%s: edges_through_boxes %d; README: \"edges passing through a box they do not end at\": %d edges do (%d edge-box pairs)", id, rec.EdgesThroughBoxes, len(through), pairs)
		}
	} else if rec.BoxOverlaps < 0 || rec.EdgesThroughBoxes < 0 {
		t.Errorf("%s: box_overlaps %d edges_through_boxes %d", id, rec.BoxOverlaps, rec.EdgesThroughBoxes)
	}
	for k, s := range rec.Seconds {
		if s < 0 || math.IsNaN(s) {
			t.Errorf("%s: seconds.%s = %v", id, k, s)
		}
	}
}

// TestReportFiguresMatchOutput checks every record of a default run.
func TestReportFiguresMatchOutput(t *testing.T) {
	r := runReport(t)
	if len(r.rep.Files) != len(r.inputs) {
		t.Fatalf("%d file records for %d inputs", len(r.rep.Files), len(r.inputs))
	}
	for i, f := range r.rep.Files {
		if f.File != r.inputs[i] || f.ReadSeconds < 0 || f.WriteSeconds < 0 {
			t.Errorf("file record %d: %q read %v write %v, want %q and times >= 0", i, f.File, f.ReadSeconds, f.WriteSeconds, r.inputs[i])
		}
	}
	for i, rec := range r.records {
		checkRecord(t, rec, r.out[i], drawGraph(t, r.out[i], r.removed[i]), 0)
	}
}

// TestReportGridExtentOnUnitGrid runs with --unit, which puts node centres
// on a grid of that many points (README, Grid drawings): there the grid extent
// is visible in the positions, and node boxes of 54 x 36 points on a 40
// point grid overlap, so the box counts are exercised.
func TestReportGridExtentOnUnitGrid(t *testing.T) {
	const unit = 40
	def := runReport(t)
	r := runReport(t, "--unit", strconv.Itoa(unit))
	for i, rec := range r.records {
		d := drawGraph(t, r.out[i], r.removed[i])
		checkRecord(t, rec, r.out[i], d, unit)
		id := canonicalID(r.out[i].ID)
		if w := def.records[i]; rec.GridWidth != w.GridWidth || rec.GridHeight != w.GridHeight {
			t.Errorf("%s: grid %d x %d with --unit, %d x %d without: the grid drawing should not depend on spacing", id, rec.GridWidth, rec.GridHeight, w.GridWidth, w.GridHeight)
		}
		comp, ncomp := components(len(d.pos), d.kept)
		lo := make([][2]int64, ncomp)
		hi := make([][2]int64, ncomp)
		count := make([]int, ncomp)
		for c := range ncomp {
			lo[c] = [2]int64{math.MaxInt64, math.MaxInt64}
			hi[c] = [2]int64{math.MinInt64, math.MinInt64}
		}
		for v, p := range d.pos {
			c := comp[v]
			count[c]++
			for k := range 2 {
				lo[c][k], hi[c][k] = min(lo[c][k], p[k]), max(hi[c][k], p[k])
			}
		}
		for v, p := range d.pos {
			c := comp[v]
			if (p[0]-lo[c][0])%unit != 0 || (p[1]-lo[c][1])%unit != 0 {
				t.Errorf("%s: node %s at %v is off its component's %d-point grid", id, d.m.Nodes[v].ID, p, unit)
			}
		}
		for c := range ncomp {
			w, h := (hi[c][0]-lo[c][0])/unit, (hi[c][1]-lo[c][1])/unit
			if ncomp == 1 && (w != rec.GridWidth || h != rec.GridHeight) {
				t.Errorf("%s: grid_width x grid_height %d x %d, the positions span %d x %d steps", id, rec.GridWidth, rec.GridHeight, w, h)
			}
			if w > rec.GridWidth || h > rec.GridHeight {
				t.Errorf("%s: component %d spans %d x %d steps, more than grid %d x %d", id, c, w, h, rec.GridWidth, rec.GridHeight)
			}
			// README, Grid drawings: all points lie on the (n-2) x (n-2) grid.
			if k := int64(count[c]); k >= 3 && (w > k-2 || h > k-2) {
				t.Errorf("%s: a component of %d nodes spans %d x %d steps, beyond (n-2) x (n-2)", id, k, w, h)
			}
		}
	}
}

// TestReportFieldsAreDocumented compares the report's keys with README.md's
// list, at every level, and checks that README says what is reported in
// the cases where its definitions give no number.
func TestReportFieldsAreDocumented(t *testing.T) {
	doc := parseReadmeReport(t)
	r := runReport(t)
	diff := func(where string, got []string, want []string) {
		t.Helper()
		slices.Sort(got)
		want = slices.Sorted(slices.Values(want))
		var missing, extra []string
		for _, k := range want {
			if !slices.Contains(got, k) {
				missing = append(missing, k)
			}
		}
		for _, k := range got {
			if !slices.Contains(want, k) {
				extra = append(extra, k)
			}
		}
		if len(missing) > 0 || len(extra) > 0 {
			t.Errorf("%s: README.md documents but the report lacks %q; the report has but README.md does not document %q", where, missing, extra)
		}
	}
	files, _ := r.raw["files"].([]any)
	if len(files) == 0 {
		t.Fatalf("report has no files: %v", r.raw)
	}
	top := slices.Collect(maps.Keys(r.raw))
	var fileKeys []string
	for _, f := range files {
		fm, _ := f.(map[string]any)
		for k := range fm {
			if !slices.Contains(fileKeys, k) {
				fileKeys = append(fileKeys, k)
			}
		}
		diff("file record", slices.Collect(maps.Keys(fm)), slices.DeleteFunc(slices.Clone(doc.fileKeys), func(k string) bool { return k == "files" }))
		graphs, _ := fm["graphs"].([]any)
		for _, g := range graphs {
			gm, _ := g.(map[string]any)
			diff(fmt.Sprintf("graph record %v", gm["graph"]), slices.Collect(maps.Keys(gm)), doc.graphKeys)
			for k, v := range gm {
				if sub, ok := v.(map[string]any); ok {
					diff(fmt.Sprintf("graph record %v, %s", gm["graph"], k), slices.Collect(maps.Keys(sub)), doc.subKeys[k])
				}
			}
		}
	}
	diff("top level", top, []string{"files"})

	// Where a definition gives no number (no node with two edges, no edge,
	// fewer than 3 nodes, no node beside an edge it does not end at), the
	// value the report gives must be one README.md states.
	for i, rec := range r.records {
		d := drawGraph(t, r.out[i], r.removed[i])
		id := canonicalID(r.out[i].ID)
		say := func(field, cond, value string, documented *regexp.Regexp) {
			t.Helper()
			if !documented.MatchString(doc.meaning[field]) {
				t.Errorf("%s: %s; the report gives %s = %s, but README.md's row (%q) does not say what is reported then", id, cond, field, value, doc.meaning[field])
			}
		}
		if _, ok := minAngle(d.pos, d.kept); !ok {
			say("min_angle_deg", "no node has two edges", strconv.FormatFloat(rec.MinAngleDeg, 'g', -1, 64), regexp.MustCompile(`\b`+regexp.QuoteMeta(strconv.FormatFloat(rec.MinAngleDeg, 'g', -1, 64))+`\b`))
		}
		if len(d.kept) == 0 {
			say("edge_length_ratio", "no edge is drawn", strconv.FormatFloat(rec.EdgeLengthRatio, 'g', -1, 64), regexp.MustCompile(`\b`+regexp.QuoteMeta(strconv.FormatFloat(rec.EdgeLengthRatio, 'g', -1, 64))+`\b`))
		}
		if len(d.m.Nodes) == 2 {
			say("area_ratio", "2 nodes, (n-2)^2 = 0", strconv.FormatFloat(rec.AreaRatio, 'g', -1, 64), regexp.MustCompile(`(?i)fewer than (3|three)|n\s*<\s*3|n\s*(<=|≤)\s*2|\b`+regexp.QuoteMeta(strconv.FormatFloat(rec.AreaRatio, 'g', -1, 64))+` (for|when|with|below)`))
		}
		// Removed edges stay in the output (README, Non-planar graphs)
		// and a renderer draws them; where measuring them too would give
		// another figure, README must say they are left out.
		kept := regexp.MustCompile(`(?i)\bkept\b|set.aside|drawn edges|planar subgraph`)
		keptDoc := kept.MatchString(doc.intro)
		lit := func(field string, got, all float64) {
			t.Helper()
			if !nearRel(got, all, 1e-9) && !keptDoc && !kept.MatchString(doc.meaning[field]) {
				t.Errorf("%s: %s = %v is measured over the kept edges only; over every edge in the output (removed ones too) it is %v, and README.md does not say which edges count", id, field, got, all)
			}
		}
		if a, ok := minAngle(d.pos, d.all); ok {
			lit("min_angle_deg", rec.MinAngleDeg, a)
		}
		lo, hi := math.Inf(1), 0.0
		for _, p := range d.all {
			lo, hi = min(lo, segLength(d.pos, p)), max(hi, segLength(d.pos, p))
		}
		if len(d.all) > 0 {
			lit("edge_length_ratio", rec.EdgeLengthRatio, hi/lo)
		}
		if dist, ok := minNodeEdge(d.pos, d.all); ok && rec.MinVertexEdgeDistance != nil {
			lit("min_vertex_edge_distance", *rec.MinVertexEdgeDistance, dist/float64(rec.Unit))
		}
		if _, ok := minNodeEdge(d.pos, d.kept); !ok {
			v := "null"
			if rec.MinVertexEdgeDistance != nil {
				v = strconv.FormatFloat(*rec.MinVertexEdgeDistance, 'g', -1, 64)
			}
			say("min_vertex_edge_distance", fmt.Sprintf("a %d-node graph (not too big to measure) where no node lies beside an edge it does not end at", len(d.m.Nodes)), v, regexp.MustCompile(`(?i)\bno (such|node|pair|edge)|nothing to measure|or has no|without`))
		}
	}
}
