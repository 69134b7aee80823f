package main

import (
	"encoding/json"
	"math"
	"os"
	"path/filepath"
	"strconv"
	"strings"
	"testing"
	"unicode/utf8"

	"gonum.org/v1/gonum/graph/formats/dot"
	"gonum.org/v1/gonum/graph/formats/dot/ast"
)

// This file checks the cluster frames the command writes (README, "What
// the output contains") from its DOT output alone, as gonum's parser and
// the DOT interpreter of lossless_test.go read it, and the --report,
// --check and --svg figures about clusters and flow.

// clusterInputs are clustered graphs written to exercise the frame rule.
// dropped names, per cluster, the nodes that cluster loses to an earlier
// one neither inside the other (dotio: the first placement wins).
var clusterInputs = []struct {
	name, src string
	dropped   map[string][]string
}{
	{"nested", `graph nested {
	subgraph cluster_outer {
		label="Outer"
		a -- b
		subgraph cluster_inner {
			label="Inner"
			c -- d
		}
		subgraph plain { e }
		b -- c -- e
	}
	subgraph side {
		subgraph cluster_deep { label="Deep"; fontsize=20; f -- g }
	}
	subgraph Cluster_not { h }
	{ i }
	a -- f
	g -- h -- i -- a
	subgraph cluster_empty { }
}
`, nil},
	// y is written in cluster_a and then in cluster_b: it stays in
	// cluster_a. cluster_a's label goes at the bottom.
	{"conflict", `digraph conflict {
	rankdir=LR
	subgraph cluster_a { label="A"; labelloc=b; x -> y }
	subgraph cluster_b { label="B"; y -> z }
	z -> w
	w -> x
}
`, map[string][]string{"cluster_b": {"y"}}},
	// A cluster opened twice is one cluster; a long label widens a
	// frame around one small node.
	{"reopened", `graph reopened {
	subgraph cluster_r { p -- q }
	q -- s
	subgraph cluster_r { s2 }
	s2 -- s
	subgraph cluster_wide { label="A label far wider than the node it frames"; lone }
	lone -- p
}
`, nil},
	{"../../examples/build-pipeline.dot", "", nil},
	{"../../examples/office-floors.dot", "", nil},
}

// clusterSource returns an input's text, read from its file when it is a
// path.
func clusterSource(t *testing.T, name, src string) string {
	t.Helper()
	if src != "" {
		return src
	}
	b, err := os.ReadFile(name)
	if err != nil {
		t.Fatal(err)
	}
	return string(b)
}

// rect is a bb as written: llx, lly, urx, ury.
type rect struct{ x0, y0, x1, y1 int64 }

func parseRect(s string) (rect, bool) {
	parts := strings.Split(strings.Trim(s, `"`), ",")
	if len(parts) != 4 {
		return rect{}, false
	}
	var v [4]int64
	for i, p := range parts {
		n, err := strconv.ParseInt(p, 10, 64)
		if err != nil {
			return rect{}, false
		}
		v[i] = n
	}
	return rect{v[0], v[1], v[2], v[3]}, v[0] <= v[2] && v[1] <= v[3]
}

// framedGraph is an output graph with its cluster frames as written.
type framedGraph struct {
	m       *graphMeaning
	pos     [][2]int64
	w, h    int64
	boxes   []box
	cluster []bool // per subgraph
	bb      []rect // per subgraph; meaningful where hasBB
	hasBB   []bool
	member  []map[int]bool // per subgraph: its nodes, those lost to an earlier cluster left out
}

// readFramed interprets an output graph and reads its frames. dropped is
// as in clusterInputs.
func readFramed(t *testing.T, g *ast.Graph, dropped map[string][]string) framedGraph {
	t.Helper()
	f := framedGraph{m: interpretGraph(g)}
	var err error
	if _, f.pos, f.w, f.h, err = appendedLayout(g, f.m); err != nil {
		t.Fatalf("graph %s: %v", g.ID, err)
	}
	var ok bool
	if f.boxes, ok = readmeBoxes(f.m); !ok {
		t.Fatalf("graph %s: node boxes beyond the README rule's simple cases", g.ID)
	}
	for _, s := range f.m.Subs {
		f.cluster = append(f.cluster, strings.HasPrefix(s.Name, "cluster"))
		r, has := rect{}, false
		if v, set := s.Attrs["bb"]; set {
			if r, has = parseRect(v); !has {
				t.Fatalf("graph %s: subgraph %s: bb %q is not four integers", g.ID, s.Name, v)
			}
		}
		f.bb, f.hasBB = append(f.bb, r), append(f.hasBB, has)
		mem := map[int]bool{}
		for _, v := range s.Nodes {
			mem[v] = true
		}
		for _, name := range dropped[s.Name] {
			delete(mem, f.m.nodeAt[name])
		}
		f.member = append(f.member, mem)
	}
	return f
}

// parentCluster is the nearest cluster enclosing subgraph s, through any
// ordinary subgraphs, or -1.
func (f framedGraph) parentCluster(s int) int {
	for p := f.m.Subs[s].Parent; p >= 0; p = f.m.Subs[p].Parent {
		if f.cluster[p] {
			return p
		}
	}
	return -1
}

// holds reports whether cluster a is cluster b or encloses it.
func (f framedGraph) holds(a, b int) bool {
	for ; b >= 0; b = f.parentCluster(b) {
		if a == b {
			return true
		}
	}
	return false
}

// TestClusterFrames: every cluster with nodes gets a bb holding its
// members' boxes and nested clusters' frames 8 points inside it (README),
// with room for its label above (below with labelloc=b) and at least its
// width plus the margins; nested frames nest; the graph's bb holds every
// frame; ordinary subgraphs, and a cluster without nodes, get none. Under
// every spacing the drawing stays free of crossings (geomcheck), and
// the output laid out again comes back the same.
func TestClusterFrames(t *testing.T) {
	const margin = 8 // README, "What the output contains"
	for _, in := range clusterInputs {
		src := clusterSource(t, in.name, in.src)
		for _, flags := range [][]string{nil, {"--unit", "90"}, {"--grid"}, {"--no-flow"}} {
			t.Run(filepath.Base(in.name)+strings.Join(flags, ""), func(t *testing.T) {
				code, out, errs := runCmd(t, src, append([]string{"-q"}, flags...)...)
				if code != exitOK {
					t.Fatalf("exit %d: %s", code, errs)
				}
				file, err := dot.ParseString(out)
				if err != nil || len(file.Graphs) != 1 {
					t.Fatalf("output does not parse: %v", err)
				}
				f := readFramed(t, file.Graphs[0], in.dropped)
				if probs, err := drawingProblems(f.m, f.pos); err != nil || len(probs) > 0 {
					t.Errorf("drawing problems: %v %v", probs, err)
				}
				frames := 0
				for s, sub := range f.m.Subs {
					if !f.cluster[s] || len(f.member[s]) == 0 {
						if f.hasBB[s] {
							t.Errorf("subgraph %q (cluster %v, %d nodes) has a bb", sub.Name, f.cluster[s], len(f.member[s]))
						}
						continue
					}
					if !f.hasBB[s] {
						t.Errorf("cluster %q has no bb", sub.Name)
						continue
					}
					frames++
					r := f.bb[s]
					// The content: member boxes and nested frames.
					cx0, cy0, cx1, cy1 := math.Inf(1), math.Inf(1), math.Inf(-1), math.Inf(-1)
					for v := range f.member[s] {
						b, p := f.boxes[v], f.pos[v]
						cx0, cx1 = min(cx0, float64(p[0])-b.hw), max(cx1, float64(p[0])+b.hw)
						cy0, cy1 = min(cy0, float64(p[1])-b.hh), max(cy1, float64(p[1])+b.hh)
					}
					for c := range f.m.Subs {
						if c != s && f.cluster[c] && f.hasBB[c] && f.holds(s, c) {
							q := f.bb[c]
							cx0, cx1 = min(cx0, float64(q.x0)), max(cx1, float64(q.x1))
							cy0, cy1 = min(cy0, float64(q.y0)), max(cy1, float64(q.y1))
						}
					}
					const eps = 1e-9
					lh, lw := 0.0, 0.0
					if label, set := sub.Attrs["label"]; set {
						// README, Node boxes: 0.6 em a character, 1.2 em a line.
						fs := 14.0
						if v, set := sub.Attrs["fontsize"]; set {
							fs, _ = strconv.ParseFloat(v, 64)
						}
						lh, lw = 1.2*fs, 0.6*fs*float64(utf8.RuneCountInString(label))
					}
					top, bottom := lh, 0.0
					if strings.EqualFold(sub.Attrs["labelloc"], "b") {
						top, bottom = 0, lh
					}
					if float64(r.x0) > cx0-margin+eps || float64(r.x1) < cx1+margin-eps ||
						float64(r.y0) > cy0-margin-bottom+eps || float64(r.y1) < cy1+margin+top-eps {
						t.Errorf("cluster %q: bb %v does not hold its content %.1f,%.1f,%.1f,%.1f with margins and a label %.1f high", sub.Name, r, cx0, cy0, cx1, cy1, lh)
					}
					if float64(r.x1-r.x0) < lw+2*margin-eps {
						t.Errorf("cluster %q: bb %v narrower than its label (%.1f) and margins", sub.Name, r, lw)
					}
					if p := f.parentCluster(s); p >= 0 && f.hasBB[p] {
						q := f.bb[p]
						if r.x0 < q.x0+margin || r.y0 < q.y0+margin || r.x1 > q.x1-margin || r.y1 > q.y1-margin {
							t.Errorf("cluster %q: bb %v not inside its parent %q's %v by the margin", sub.Name, r, f.m.Subs[p].Name, q)
						}
					}
					if r.x0 < 0 || r.y0 < 0 || r.x1 > f.w || r.y1 > f.h {
						t.Errorf("cluster %q: bb %v outside the graph's 0,0,%d,%d", sub.Name, r, f.w, f.h)
					}
				}
				if frames == 0 {
					t.Error("no frames written")
				}
				if _, twice, _ := runCmd(t, out, append([]string{"-q"}, flags...)...); twice != out {
					t.Errorf("laid out again differs:\n%s\n--- again:\n%s", out, twice)
				}
			})
		}
	}
}

// TestClusterReport: --report counts the clusters, and the intrusions and
// overlapping frames found here by trying every pair on the output's own
// bb and node boxes (the command's boxes are the README rule's, rounded
// up to whole points).
func TestClusterReport(t *testing.T) {
	for _, in := range clusterInputs {
		t.Run(filepath.Base(in.name), func(t *testing.T) {
			repPath := filepath.Join(t.TempDir(), "report.json")
			code, out, errs := runCmd(t, clusterSource(t, in.name, in.src), "-q", "--report", repPath)
			if code != exitOK {
				t.Fatalf("exit %d: %s", code, errs)
			}
			var rep reportOut
			if err := json.Unmarshal(mustRead(t, repPath), &rep); err != nil || len(rep.Files) != 1 || len(rep.Files[0].Graphs) != 1 {
				t.Fatalf("report: %v", err)
			}
			rec := rep.Files[0].Graphs[0]
			file, err := dot.ParseString(out)
			if err != nil {
				t.Fatal(err)
			}
			f := readFramed(t, file.Graphs[0], in.dropped)
			clusters, intrusions, overlaps := frameConflicts(f)
			if rec.Clusters != clusters || rec.ClusterIntrusions != intrusions || rec.FrameOverlaps != overlaps {
				t.Errorf("report: %d clusters, %d intrusions, %d overlaps; the output shows %d, %d, %d",
					rec.Clusters, rec.ClusterIntrusions, rec.FrameOverlaps, clusters, intrusions, overlaps)
			}
			if f.m.Directed != (rec.FlowAlong != nil) || f.m.Directed != (rec.FlowAgainst != nil) || f.m.Directed != (rec.FlowOnCycles != nil) {
				t.Errorf("flow figures %v %v %v for a graph directed %v", rec.FlowAlong, rec.FlowAgainst, rec.FlowOnCycles, f.m.Directed)
			}
		})
	}
}

// TestCheckClusterIntrusion: --check names a node in another cluster's
// frame at the node's file:line:col, and exits with status 1; a frame
// overlap is named at the earlier cluster (testdata/check/clusters.dot,
// worked out in TestCheckFile).
func TestCheckClusterIntrusion(t *testing.T) {
	path := filepath.Join("testdata", "check", "clusters.dot")
	code, out, errs := runCmd(t, "", "--check", path)
	if code != exitProblems {
		t.Fatalf("exit %d, want %d: %s", code, exitProblems, errs)
	}
	for _, want := range []string{
		path + `:4:2: node "c" lies in the frame of cluster "cluster_a", which it does not belong to`,
		path + `:5:2: frames of clusters "cluster_p" and "cluster_q" overlap`,
	} {
		if !strings.Contains(out, want+"\n") {
			t.Errorf("output lacks %q:\n%s", want, out)
		}
	}
	if !strings.Contains(errs, "4 problems found") {
		t.Errorf("stderr %q", errs)
	}
	// Moved clear of cluster_a's frame, c is no longer named.
	src := strings.Replace(string(mustRead(t, path)), `c [pos="100,0"]`, `c [pos="100,-100"]`, 1)
	_, out, _ = runCmd(t, src, "--check")
	if strings.Contains(out, `"c"`) {
		t.Errorf("c moved out still reported:\n%s", out)
	}
}

// TestPreviewFramesAndArrows: the --svg preview draws one frame per
// cluster with nodes, with its label, and an arrowhead on every kept edge
// of a digraph (the preview's default arrowhead, "normal"); an undirected
// graph gets none. The drawing is checked with geomcheck.
func TestPreviewFramesAndArrows(t *testing.T) {
	for _, tc := range []struct {
		name, src string
		frames    int
		labels    []string
		arrows    int
	}{
		{"digraph", clusterInputs[1].src, 2, []string{">A<", ">B<"}, 4},
		{"undirected", clusterInputs[0].src, 3, []string{">Outer<", ">Inner<", ">Deep<"}, 0},
	} {
		t.Run(tc.name, func(t *testing.T) {
			svgPath := filepath.Join(t.TempDir(), "p.svg")
			code, out, errs := runCmd(t, tc.src, "-q", "--svg", svgPath)
			if code != exitOK {
				t.Fatalf("exit %d: %s", code, errs)
			}
			svg := string(mustRead(t, svgPath))
			if got := strings.Count(svg, `<rect class="frame"`); got != tc.frames {
				t.Errorf("%d frames drawn, want %d", got, tc.frames)
			}
			for _, l := range tc.labels {
				if !strings.Contains(svg, l) {
					t.Errorf("label %s not drawn", l)
				}
			}
			if got := strings.Count(svg, `<polygon class="arrow"`); got != tc.arrows {
				t.Errorf("%d arrowheads, want %d", got, tc.arrows)
			}
			// Frames come before (beneath) the edges and nodes.
			if i, j := strings.Index(svg, `class="frames"`), strings.Index(svg, `class="edges"`); i < 0 || j < 0 || i > j {
				t.Errorf("frames at %d, edges at %d", i, j)
			}
			file, err := dot.ParseString(out)
			if err != nil {
				t.Fatal(err)
			}
			f := readFramed(t, file.Graphs[0], nil)
			if probs, err := drawingProblems(f.m, f.pos); err != nil || len(probs) > 0 {
				t.Errorf("drawing problems: %v %v", probs, err)
			}
		})
	}
	// --check --svg draws the frames the check computes from the input.
	svgPath := filepath.Join(t.TempDir(), "c.svg")
	runCmd(t, "", "--check", "--svg", svgPath, filepath.Join("testdata", "check", "clusters.dot"))
	if got := strings.Count(string(mustRead(t, svgPath)), `<rect class="frame"`); got != 8 {
		t.Errorf("--check --svg: %d frames, want 8", got)
	}
}

// frameConflicts counts, on the output's own bb and node boxes (the
// README rule's, rounded up to whole points), the clusters, the nodes in
// a frame of a cluster they do not belong to, and the overlapping frames
// of clusters neither inside the other, by trying every pair.
func frameConflicts(f framedGraph) (clusters int, intrusions, overlaps int64) {
	for s := range f.m.Subs {
		if !f.cluster[s] {
			continue
		}
		clusters++
		if !f.hasBB[s] {
			continue
		}
		r := f.bb[s]
		for v, p := range f.pos {
			if f.member[s][v] {
				continue
			}
			hw, hh := int64(math.Ceil(f.boxes[v].hw)), int64(math.Ceil(f.boxes[v].hh))
			if p[0]-hw < r.x1 && p[0]+hw > r.x0 && p[1]-hh < r.y1 && p[1]+hh > r.y0 {
				intrusions++
			}
		}
		for c := s + 1; c < len(f.m.Subs); c++ {
			if !f.cluster[c] || !f.hasBB[c] || f.holds(s, c) || f.holds(c, s) {
				continue
			}
			q := f.bb[c]
			if r.x0 < q.x1 && q.x0 < r.x1 && r.y0 < q.y1 && q.y0 < r.y1 {
				overlaps++
			}
		}
	}
	return clusters, intrusions, overlaps
}

// TestClustersApart: the shipped examples with clusters whose node boxes
// readFramed can size (each cluster connected, the clustered graph
// drawable with every cluster in a region of its own) come out with no
// node in a foreign frame and no frames overlapping, counted on the
// output by frameConflicts; the drawing stays plane by geomcheck, the
// independent checker. (The campus example's boxes follow rules
// readFramed does not know; bench/quality counts it: 0 and 0.)
func TestClustersApart(t *testing.T) {
	for _, name := range []string{"office-floors", "build-pipeline"} {
		t.Run(name, func(t *testing.T) {
			path := "../../examples/" + name + ".dot"
			code, out, errs := runCmd(t, "", "-q", path)
			if code != exitOK {
				t.Fatalf("exit %d: %s", code, errs)
			}
			file, err := dot.ParseString(out)
			if err != nil {
				t.Fatal(err)
			}
			f := readFramed(t, file.Graphs[0], nil)
			clusters, intrusions, overlaps := frameConflicts(f)
			if clusters == 0 || intrusions != 0 || overlaps != 0 {
				t.Errorf("%d clusters, %d intrusions, %d overlapping frames; want clusters, none of the others", clusters, intrusions, overlaps)
			}
			if probs, err := drawingProblems(f.m, f.pos); err != nil || len(probs) > 0 {
				t.Errorf("drawing problems: %v %v", probs, err)
			}
		})
	}
}
