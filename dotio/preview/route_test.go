package preview

import (
	"bytes"
	"math"
	"os"
	"path/filepath"
	"slices"
	"strings"
	"testing"

	"github.com/gridwood/gridwood/internal/graphgen"
	"github.com/gridwood/gridwood/place/geomcheck"
)

// routeInputs are the graphs the removed routes are checked on: the
// shipped examples, the complete and complete bipartite graphs the old
// curves hid or cut through, and generated non-planar graphs.
func routeInputs(t *testing.T) map[string]string {
	t.Helper()
	in := map[string]string{
		"K5":  "graph K5 { v1 -- {v2 v3 v4 v5}; v2 -- {v3 v4 v5}; v3 -- {v4 v5}; v4 -- v5 }",
		"K33": "graph K33 { {a b c} -- {x y z} }",
		"K7":  "digraph K7 { 1 -> {2 3 4 5 6 7}; 2 -> {3 4 5 6 7}; 3 -> {4 5 6 7}; 4 -> {5 6 7}; 5 -> {6 7}; 6 -> 7 }",
		"wide labels": `graph W { node [shape=box]; a [label="a rather long label"]; b; c [label="another long one here"]; d; e
			a -- {b c d e}; b -- {c d e}; c -- {d e}; d -- e }`,
	}
	names, _ := filepath.Glob("../../examples/*.dot")
	if len(names) == 0 {
		t.Fatal("no shipped examples found")
	}
	for _, n := range names {
		b, err := os.ReadFile(n)
		if err != nil {
			t.Fatal(err)
		}
		in[filepath.Base(n)] = string(b)
	}
	for _, g := range []graphgen.Graph{
		graphgen.Petersen(), graphgen.CompleteBipartite(3, 5), graphgen.Complete(8),
		graphgen.WithStrays(graphgen.RandomPlanar(40, 0.6, 3), 12, 3),
		graphgen.WithStrays(graphgen.RandomTriangulation(30, 5), 8, 5),
		graphgen.RandomGnm(25, 60, 9),
	} {
		var b bytes.Buffer
		if err := graphgen.WriteDOT(&b, g); err != nil {
			t.Fatal(err)
		}
		in[g.Name] = b.String()
	}
	return in
}

// TestSetAsideEdgesClear: every removed edge's route misses the box of
// every node it does not end at, judged as --check judges kept edges:
// exactly, by geomcheck.EdgeThroughBox, on the route sampled finely (1,024
// pieces, in hundredths of a point; the boxes are the layout's, not grown
// by the router's clearance). And it stays visible: of points sampled
// along its drawn part, at least a quarter lie outside every node box and
// more than 2 points from every kept edge (K5 once laid three nodes nearly
// in line, and the straight removed edge between the outer two ran
// under the kept edges for its whole length).
func TestSetAsideEdgesClear(t *testing.T) {
	total := 0
	for name, src := range routeInputs(t) {
		for gi, pg := range layOut(t, src) {
			if pg.Removed == nil {
				continue
			}
			var nd notDrawn
			p, err := newPanel(pg, gi, &nd)
			if err != nil {
				t.Fatal(err)
			}
			if p.unrouted != 0 {
				t.Errorf("%s: %d removed edges not routed clear", name, p.unrouted)
			}
			const scale = 100
			var pts []geomcheck.Point
			var hw, hh []int64
			for _, n := range p.nodes {
				pts = append(pts, geomcheck.Point{X: int64(math.Round(n.x * scale)), Y: int64(math.Round(n.y * scale))})
				hw = append(hw, int64(math.Round(max(n.bw, n.sw)*scale)))
				hh = append(hh, int64(math.Round(max(n.bh, n.sh)*scale)))
			}
			real := len(pts)
			var edges [][2]int32
			var owner [][2]int32 // the removed edge's ends, per piece
			for _, l := range p.links {
				if !l.removed || l.loop {
					continue
				}
				total++
				c := l.curve
				var s []pt
				if c.kind == polyline {
					s = densify(c.p, 1024)
				} else {
					s = make([]pt, 1025)
					for i := range s {
						s[i] = c.at(float64(i) / 1024)
					}
				}
				for i, q := range s {
					pts = append(pts, geomcheck.Point{X: int64(math.Round(q[0] * scale)), Y: int64(math.Round(q[1] * scale))})
					hw, hh = append(hw, 0), append(hh, 0)
					if i > 0 {
						k := int32(len(pts) - 1)
						edges = append(edges, [2]int32{k - 1, k})
						owner = append(owner, [2]int32{l.u, l.v})
					}
				}
				if shown := visibleShare(p, l); shown < 0.25 {
					t.Errorf("%s: removed edge %s -- %s shows at %.0f%% of its length", name, p.nodes[l.u].name, p.nodes[l.v].name, 100*shown)
				}
			}
			through, err := geomcheck.EdgeThroughBox(pts, hw, hh, edges)
			if err != nil {
				t.Fatal(err)
			}
			bad := map[[2]int32]bool{}
			for _, pr := range through {
				v, o := int32(pr[0]), owner[pr[1]]
				if int(v) >= real || v == o[0] || v == o[1] || bad[[2]int32{v, o[0]*1e6 + o[1]}] {
					continue
				}
				bad[[2]int32{v, o[0]*1e6 + o[1]}] = true
				t.Errorf("%s: removed edge %s -- %s runs through the box of %s", name, p.nodes[o[0]].name, p.nodes[o[1]].name, p.nodes[v].name)
			}

			// What is drawn is that route, cut at the outlines.
			doc, _ := render(t, []Graph{pg})
			root := parseSVG(t, doc)
			p.top = pad + titleSize + titleGap
			var drawn []string
			for _, r := range root.find(byClass("g", "removed")) {
				for _, x := range r.find(byClass("path", "line")) {
					drawn = append(drawn, x.attr("d"))
				}
			}
			for _, l := range p.links {
				if l.removed && !l.loop && l.drawn.p != nil && !slices.Contains(drawn, p.pathData(l.drawn)) {
					t.Errorf("%s: the route of %s -- %s is not what is drawn", name, p.nodes[l.u].name, p.nodes[l.v].name)
				}
			}
		}
	}
	if total < 30 {
		t.Errorf("only %d removed edges checked", total)
	}
	t.Logf("%d removed edges routed clear", total)
}

// visibleShare is the share of points along a removed edge's drawn part
// that lie outside every node's outline box and more than 2 points from
// every kept edge.
func visibleShare(p *panel, l plink) float64 {
	if l.drawn.p == nil {
		return 0
	}
	const samples = 200
	shown := 0
	for i := 1; i < samples; i++ {
		q := l.drawn.at(float64(i) / samples)
		hidden := false
		for _, n := range p.nodes {
			if math.Abs(q[0]-n.x) <= max(n.bw, n.sw) && math.Abs(q[1]-n.y) <= max(n.bh, n.sh) {
				hidden = true
				break
			}
		}
		for _, k := range p.links {
			if hidden {
				break
			}
			if !k.removed && !k.loop && k.drawn.p != nil && pointSegDist(q, k.drawn.p[0], k.drawn.p[len(k.drawn.p)-1]) <= 2 {
				hidden = true
			}
		}
		if !hidden {
			shown++
		}
	}
	return float64(shown) / (samples - 1)
}

// TestRouteBudget: past its work bound the router stops checking, the
// edges left count as unrouted and the preview still completes.
func TestRouteBudget(t *testing.T) {
	graphs := layOut(t, "graph K7 { 1 -- {2 3 4 5 6 7}; 2 -- {3 4 5 6 7}; 3 -- {4 5 6 7}; 4 -- {5 6 7}; 5 -- {6 7}; 6 -- 7 }")
	saved := routeBudget
	defer func() { routeBudget = saved }()
	routeBudget = 0
	_, res := render(t, graphs)
	removed := 0
	for _, r := range graphs[0].Removed {
		if r {
			removed++
		}
	}
	if res.Unrouted < removed-1 || !strings.Contains(strings.Join(res.NotDrawn, ";"), "clear routes") {
		t.Errorf("with no work allowed, %d of %d removed edges unrouted; NotDrawn %q", res.Unrouted, removed, res.NotDrawn)
	}
}

// TestBoundaryMatchesInside: the exact distance to a node's outline along
// a ray (used to cut straight edges) is where the inside test (used to cut
// curves) changes, for every shape of the catalog, in 72 directions.
func TestBoundaryMatchesInside(t *testing.T) {
	var b strings.Builder
	b.WriteString("graph G {\n")
	shapes := []string{"box", "ellipse", "circle", "diamond", "house", "invtriangle", "star", "hexagon", "parallelogram", "record", "cylinder", "none"}
	for _, s := range shapes {
		b.WriteString("\t" + s + " [shape=" + s + ", label=\"a label\"]\n")
	}
	b.WriteString("\town\n}\n")
	pg := layOut(t, b.String())[0]
	var nd notDrawn
	p, err := newPanel(pg, 0, &nd)
	if err != nil {
		t.Fatal(err)
	}
	for i := range p.nodes {
		n := &p.nodes[i]
		for k := range 72 {
			a := 2 * math.Pi * float64(k) / 72
			ux, uy := math.Cos(a), math.Sin(a)
			d := n.boundary(ux, uy)
			in := n.inside(pt{n.x + ux*(d-0.01), n.y + uy*(d-0.01)})
			out := n.inside(pt{n.x + ux*(d+0.01), n.y + uy*(d+0.01)})
			if !in || out {
				t.Errorf("%s at %d degrees: boundary %v, inside just before %v, just after %v", n.name, 5*k, d, in, out)
			}
		}
	}
}
