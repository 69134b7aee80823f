// Command quality lays out a corpus of graphs with gridwood and with an
// unconstrained stress majorization of the same kept graph (the reference:
// same ideal edge lengths from the same node boxes, crossings allowed and
// counted), and prints both side by side as a Markdown table, with a
// summary: normalized stress and its ratio, the reference's crossings,
// edge-length spread, angular resolution, closest node pair, size and time,
// and which graphs keep a component's spaced drawing, and why.
//
//	go build -o /tmp/gridwood ./cmd/gridwood
//	go run ./bench/quality /tmp/gridwood [FILE.dot ...]
//
// The corpus is the shipped examples, the real graphs of bench/corpus (see
// its README for their sources) and seeded generated families; files given
// on the command line are laid out instead.
package main

import (
	"bytes"
	"fmt"
	"math"
	"math/rand/v2"
	"os"
	"os/exec"
	"path/filepath"
	"slices"
	"strconv"
	"strings"
	"time"

	"github.com/gridwood/gridwood/cmd/gridwood/report"
	"github.com/gridwood/gridwood/dotio"
	"github.com/gridwood/gridwood/dotio/nodesize"
	"github.com/gridwood/gridwood/internal/graphgen"
	"github.com/gridwood/gridwood/place/geomcheck"
	"github.com/gridwood/gridwood/place/mesh"
	"github.com/gridwood/gridwood/place/quality"
	"github.com/gridwood/gridwood/place/readable"
	"github.com/gridwood/gridwood/place/stress"
	"github.com/gridwood/gridwood/planarize"
)

// boxGap is the command's clear space between boxes, in points.
const boxGap = 18

type row struct {
	name          string
	nodes, edges  int
	removed       int
	gw, ref       quality.Measures
	refCrossings  int
	gwW, gwH      float64
	refW, refH    float64
	gwSec, refSec float64
	problems      int
	// What the DOT says about structure, from the report.
	clusters, intrusions, overlaps int
	directed                       bool
	along, against, onCycles       int
	readable, unrefined            int
	unrefinedWhy                   report.Unrefined
}

func main() {
	if len(os.Args) < 2 {
		fmt.Fprintln(os.Stderr, "usage: quality GRIDWOOD-BINARY [FILE.dot ...]")
		os.Exit(2)
	}
	bin := os.Args[1]
	dir, err := os.MkdirTemp("", "gridwood-quality")
	if err != nil {
		fail(err)
	}
	defer os.RemoveAll(dir)
	inputs := os.Args[2:]
	if len(inputs) == 0 {
		inputs = corpus(dir)
	}
	if keep := os.Getenv("QUALITY_KEEP"); keep != "" {
		for _, in := range inputs {
			data, _ := os.ReadFile(in)
			os.WriteFile(filepath.Join(keep, filepath.Base(in)), data, 0o644)
		}
	}
	var rows []row
	for _, in := range inputs {
		rs, err := measure(bin, dir, in)
		if err != nil {
			fail(fmt.Errorf("%s: %v", in, err))
		}
		rows = append(rows, rs...)
	}
	print(rows)
}

// corpus writes the generated graphs into dir and returns every input.
func corpus(dir string) []string {
	inputs, _ := filepath.Glob("examples/*.dot")
	real, _ := filepath.Glob("bench/corpus/*.dot")
	inputs = append(inputs, real...)
	gs := []graphgen.Graph{
		graphgen.Grid(10, 10), graphgen.Grid(20, 15), graphgen.TriangulatedGrid(8, 8),
		graphgen.Wheel(20), graphgen.Dodecahedron(), graphgen.Icosahedron(),
		graphgen.RandomTree(50, 1), graphgen.RandomTree(300, 2), graphgen.RandomTree(1000, 3),
		graphgen.RandomPlanar(200, 0.6, 1), graphgen.RandomPlanar(1000, 0.5, 2),
		graphgen.RandomTriangulation(100, 1), graphgen.RandomTriangulation(500, 2),
		graphgen.NestedTriangles(10), graphgen.RandomGnm(60, 150, 1),
		delaunay("delaunay-100", 100, 1, false), delaunay("delaunay-1000", 1000, 2, false),
		delaunay("mesh-holes-300", 300, 3, true), delaunay("mesh-holes-1500", 1500, 4, true),
	}
	for _, g := range gs {
		p := filepath.Join(dir, g.Name+".dot")
		var b bytes.Buffer
		if err := graphgen.WriteDOT(&b, g); err != nil {
			fail(err)
		}
		if err := os.WriteFile(p, b.Bytes(), 0o644); err != nil {
			fail(err)
		}
		inputs = append(inputs, p)
	}
	return inputs
}

// delaunay returns the Delaunay triangulation of n seeded random points in
// the unit square (the sides of mesh's triangulation without edges), with
// holes: the points in three discs left out, and the long edges along the
// hull and the holes' rims dropped, so that faces of many sides remain.
func delaunay(name string, n int, seed uint64, holes bool) graphgen.Graph {
	rng := rand.New(rand.NewPCG(seed, 99))
	var x, y []float64
	type disc struct{ x, y, r float64 }
	ds := []disc{{0.3, 0.3, 0.12}, {0.7, 0.6, 0.15}, {0.35, 0.75, 0.1}}
	for len(x) < n {
		px, py := rng.Float64(), rng.Float64()
		inHole := false
		for _, d := range ds {
			if holes && math.Hypot(px-d.x, py-d.y) < d.r {
				inHole = true
			}
		}
		if !inHole {
			x, y = append(x, px), append(y, py)
		}
	}
	m, err := mesh.New(x, y, nil, 0)
	if err != nil {
		fail(err)
	}
	var edges [][2]int32
	limit := 2.5 / math.Sqrt(float64(n))
	m.Rings(func(v int32, ring []int32) {
		for _, w := range ring {
			if int(w) < n && v < w && (!holes || math.Hypot(x[v]-x[w], y[v]-y[w]) < limit) {
				edges = append(edges, [2]int32{v, w})
			}
		}
	})
	return graphgen.Graph{N: n, Edges: edges, Name: name}
}

// measure lays out one file with the binary (kept edges only), and each of
// its graphs with the reference.
func measure(bin, dir, in string) ([]row, error) {
	rp := filepath.Join(dir, "r.json")
	cmd := exec.Command(bin, "-q", "--drop-removed", "--report", rp, in)
	var out, errs bytes.Buffer
	cmd.Stdout, cmd.Stderr = &out, &errs
	if err := cmd.Run(); err != nil {
		return nil, fmt.Errorf("%v: %s", err, errs.String())
	}
	data, err := os.ReadFile(rp)
	if err != nil {
		return nil, err
	}
	rep, err := report.Read(bytes.NewReader(data))
	if err != nil {
		return nil, err
	}
	f, err := dotio.Read(out.Bytes(), dotio.ReadOptions{Name: in})
	if err != nil {
		return nil, err
	}
	var rows []row
	for gi, g := range f.Graphs {
		r := row{name: g.Name, nodes: len(g.Nodes)}
		if r.name == "" {
			r.name = strings.TrimSuffix(filepath.Base(in), ".dot")
		}
		gr := rep.Files[0].Graphs[gi]
		r.removed = gr.RemovedEdges
		r.clusters, r.intrusions, r.overlaps = gr.Clusters, int(gr.ClusterIntrusions), int(gr.FrameOverlaps)
		if gr.FlowAlong != nil {
			r.directed = true
			r.along, r.against, r.onCycles = *gr.FlowAlong, *gr.FlowAgainst, *gr.FlowOnCycles
		}
		r.readable, r.unrefined, r.unrefinedWhy = gr.ReadableComponents, gr.UnrefinedComponents, gr.UnrefinedWhy
		r.gwSec = gr.Seconds.Planarize + gr.Seconds.Layout + gr.Seconds.Space
		n := len(g.Nodes)
		x, y := make([]float64, n), make([]float64, n)
		for i, nd := range g.Nodes {
			p := strings.Split(strings.TrimSuffix(nd.Attrs.Pos, "!"), ",")
			if len(p) != 2 {
				return nil, fmt.Errorf("node %s: pos %q", nd.Name, nd.Attrs.Pos)
			}
			x[i], _ = strconv.ParseFloat(p[0], 64)
			y[i], _ = strconv.ParseFloat(p[1], 64)
		}
		edges := simple(n, g.Edges)
		r.edges = len(edges)
		sizes := nodesize.New(g)
		hw, hh := make([]float64, n), make([]float64, n)
		for i := range n {
			s := sizes.Node(i)
			hw[i], hh[i] = math.Ceil(s.W/2), math.Ceil(s.H/2)
		}
		r.gw = quality.Measure(x, y, edges)
		r.gwW, r.gwH = extent(x, y, hw, hh)
		r.problems = problems(x, y, edges)

		start := time.Now()
		rx, ry := reference(n, edges, hw, hh)
		r.refSec = time.Since(start).Seconds()
		r.ref = quality.Measure(rx, ry, edges)
		r.refW, r.refH = extent(rx, ry, hw, hh)
		r.refCrossings = problems(rx, ry, edges)
		rows = append(rows, r)
	}
	return rows, nil
}

// simple returns the distinct non-loop pairs of the edges, in the order
// of their first occurrence (planarize.Simplify).
func simple(n int, es []dotio.Edge) [][2]int32 {
	raw := make([][2]int32, len(es))
	for i, e := range es {
		raw[i] = [2]int32{e.From, e.To}
	}
	pairs, _ := planarize.Simplify(n, raw)
	return pairs
}

// reference lays out every component by full stress majorization from a
// pivot-MDS start until it moves less than 1e-5 edge lengths a vertex per
// sweep (at most 2,000 sweeps), and places the components side by side.
func reference(n int, edges [][2]int32, hw, hh []float64) ([]float64, []float64) {
	x, y := make([]float64, n), make([]float64, n)
	label, members := graphgen.Components(n, edges)
	index := make([]int32, n)
	for _, vs := range members {
		for i, v := range vs {
			index[v] = int32(i)
		}
	}
	offset := 0.0
	for c, vs := range members {
		var local [][2]int32
		for _, e := range edges {
			if label[e[0]] == c {
				local = append(local, [2]int32{index[e[0]], index[e[1]]})
			}
		}
		lhw, lhh := make([]float64, len(vs)), make([]float64, len(vs))
		for i, v := range vs {
			lhw[i], lhh[i] = hw[v], hh[v]
		}
		var cx, cy []float64
		if len(vs) == 1 {
			cx, cy = []float64{0}, []float64{0}
		} else {
			m, err := stress.NewModel(len(vs), local, readable.IdealLengths(local, lhw, lhh, boxGap), stress.Options{FullLimit: len(vs)})
			if err != nil {
				fail(err)
			}
			cx, cy = m.Start()
			m.Layout(cx, cy, 2000, 1e-5)
		}
		minX := math.Inf(1)
		maxX := math.Inf(-1)
		for i := range vs {
			minX, maxX = min(minX, cx[i]-lhw[i]), max(maxX, cx[i]+lhw[i])
		}
		for i, v := range vs {
			x[v], y[v] = cx[i]-minX+offset, cy[i]
		}
		offset += maxX - minX + boxGap
	}
	return x, y
}

// problems counts what the independent checker finds in the drawing,
// rounded to 1/64 point.
func problems(x, y []float64, edges [][2]int32) int {
	minX, minY := math.Inf(1), math.Inf(1)
	for i := range x {
		minX, minY = min(minX, x[i]), min(minY, y[i])
	}
	pts := make([]geomcheck.Point, len(x))
	for i := range x {
		pts[i] = geomcheck.Point{X: int64(math.Round((x[i] - minX) * 64)), Y: int64(math.Round((y[i] - minY) * 64))}
	}
	p, err := geomcheck.Check(pts, edges)
	if err != nil {
		return -1
	}
	return len(p)
}

// extent is the size of the drawing with its boxes.
func extent(x, y, hw, hh []float64) (float64, float64) {
	minX, minY, maxX, maxY := math.Inf(1), math.Inf(1), math.Inf(-1), math.Inf(-1)
	for i := range x {
		minX, maxX = min(minX, x[i]-hw[i]), max(maxX, x[i]+hw[i])
		minY, maxY = min(minY, y[i]-hh[i]), max(maxY, y[i]+hh[i])
	}
	return maxX - minX, maxY - minY
}

func print(rows []row) {
	fmt.Println("| graph | nodes | edges | removed | stress | reference stress | ratio | reference crossings | edge-length CV | angular resolution | closest pair / mean edge | size (pt) | reference size (pt) | seconds | reference seconds |")
	fmt.Println("| --- | --- | --- | --- | --- | --- | --- | --- | --- | --- | --- | --- | --- | --- | --- |")
	var ratios, planeRatios, cvs []float64
	for _, r := range rows {
		ratio := r.gw.Stress / max(r.ref.Stress, 1e-12)
		ratios = append(ratios, ratio)
		if r.refCrossings == 0 {
			planeRatios = append(planeRatios, ratio)
		}
		cvs = append(cvs, r.gw.EdgeCV)
		mark := ""
		if r.problems != 0 {
			mark = fmt.Sprintf(" (%d problems!)", r.problems)
		}
		fmt.Printf("| %s%s | %d | %d | %d | %.4f | %.4f | %.2f | %d | %.2f / %.2f | %.2f / %.2f | %.2f / %.2f | %.0f x %.0f | %.0f x %.0f | %.2f | %.2f |\n",
			r.name, mark, r.nodes, r.edges, r.removed, r.gw.Stress, r.ref.Stress, ratio, r.refCrossings,
			r.gw.EdgeCV, r.ref.EdgeCV, r.gw.AngularResolution, r.ref.AngularResolution, r.gw.ClosestPair, r.ref.ClosestPair,
			r.gwW, r.gwH, r.refW, r.refH, r.gwSec, r.refSec)
	}
	fmt.Println()
	fmt.Printf("median stress ratio %.2f over %d graphs; worst %.2f where the reference is plane (%d graphs); median edge-length CV %.2f\n",
		median(ratios), len(ratios), maxOf(planeRatios), len(planeRatios), median(cvs))
	// Which graphs keep a spaced component, and why (report's unrefined_why).
	var kept []string
	for _, r := range rows {
		if r.unrefined > 0 {
			kept = append(kept, r.name+" ("+whyText(r.unrefinedWhy)+")")
		}
	}
	fmt.Printf("keeping a spaced component: %d of %d graphs: %s\n", len(kept), len(rows), strings.Join(kept, ", "))
	// Structure: clustered graphs and digraphs, with the stress ratio
	// beside the measures so that structure is not bought with an
	// unreadable drawing.
	fmt.Println()
	fmt.Println("| graph | drawing | clusters | intrusions | frame overlaps | along / not on a cycle | on cycles | stress ratio |")
	fmt.Println("| --- | --- | --- | --- | --- | --- | --- | --- |")
	var structRatios []float64
	for _, r := range rows {
		if r.clusters == 0 && !r.directed {
			continue
		}
		ratio := r.gw.Stress / max(r.ref.Stress, 1e-12)
		structRatios = append(structRatios, ratio)
		drawing := "readable"
		if r.unrefined > 0 {
			drawing = "spaced (" + whyText(r.unrefinedWhy) + ")"
		}
		flowText, cycles := "-", "-"
		if r.directed {
			flowText = fmt.Sprintf("%d / %d (%.0f%%)", r.along, r.along+r.against, 100*float64(r.along)/float64(max(1, r.along+r.against)))
			cycles = strconv.Itoa(r.onCycles)
		}
		fmt.Printf("| %s | %s | %d | %d | %d | %s | %s | %.2f |\n", r.name, drawing, r.clusters, r.intrusions, r.overlaps, flowText, cycles, ratio)
	}
	fmt.Printf("\nmedian stress ratio %.2f over %d clustered or directed graphs\n", median(structRatios), len(structRatios))
}

// whyText names the reasons counted in u, as the report spells them.
func whyText(u report.Unrefined) string {
	var out []string
	for _, w := range []struct {
		k    int
		name string
	}{{u.TooLarge, "too_large"}, {u.Crowded, "crowded"}, {u.Area, "area"}, {u.Stress, "stress"}} {
		if w.k > 0 {
			out = append(out, w.name)
		}
	}
	return strings.Join(out, ", ")
}

func median(v []float64) float64 {
	if len(v) == 0 {
		return 0
	}
	s := slices.Clone(v)
	slices.Sort(s)
	if len(s)%2 == 1 {
		return s[len(s)/2]
	}
	return (s[len(s)/2-1] + s[len(s)/2]) / 2
}

func maxOf(v []float64) float64 {
	m := 0.0
	for _, x := range v {
		m = max(m, x)
	}
	return m
}

func fail(err error) {
	fmt.Fprintln(os.Stderr, "quality:", err)
	os.Exit(1)
}
