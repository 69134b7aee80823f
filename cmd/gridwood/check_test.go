package main

import (
	"bytes"
	"encoding/json"
	"fmt"
	"os"
	"path/filepath"
	"strings"
	"testing"

	"github.com/gridwood/gridwood/dotio"
)

// The expected lines below were worked out by hand from the coordinates
// in testdata/check (plane geometry of segments and axis-parallel boxes),
// and the positions by counting columns (a tab counts 1, as dotio
// documents).
func TestCheckFile(t *testing.T) {
	for _, tc := range []struct {
		file string
		want []string
	}{
		{"clean.dot", nil},
		{"cross.dot", []string{
			// a-b and c-d are the diagonals of a square: they meet at
			// (72,72), inside both.
			`cross.dot:4:4: edges "a" -- "b" and "c" -- "d" cross`,
		}},
		{"onedge.dot", []string{
			// x = (144,0) is the midpoint of a-b; x-a is half of a-b.
			`onedge.dot:6:4: edges "a" -- "b" and "x" -- "a" overlap`,
			`onedge.dot:5:2: node "x" lies on edge "a" -- "b"`,
		}},
		{"samepoint.dot", []string{
			// p and q coincide; their boxes overlap too, but that pair is
			// reported once, and so is p-r passing q's box. q is p-r's end
			// point, not inside it.
			`samepoint.dot:3:2: nodes "p" and "q" are at the same point (10,20)`,
		}},
		{"boxes.dot", []string{
			// a, b: half-widths 36 + 36 > 60 apart. c, d: 72 apart, they
			// only touch. e, f: half-widths 9 + 9 > 15, half-heights
			// 18 + 9 > 10. g has no area. i, j: half-heights 18 + 18 < 40.
			`boxes.dot:4:2: boxes of nodes "a" and "b" overlap`,
			`boxes.dot:8:2: boxes of nodes "e" and "f" overlap`,
		}},
		{"decimals.dot", []string{
			// Scaled by 10^6. c-d and e-f cross at (-11.5, 0). m = (1, 0.5)
			// is the midpoint of a-b = (0,0)-(2,1), while n = (1.5,
			// 0.750001) lies 10^-6 above it; rounding to whole points would
			// get both wrong. Boxes have half-sizes 0.036 points (fixed
			// size, not grown to the labels): p, q are 0.07 apart
			// (overlap), r, s 0.072 (touch only); a-b passes 10^-6 below
			// n, through its box.
			`decimals.dot:13:4: edges "c" -- "d" and "e" -- "f" cross`,
			`decimals.dot:6:2: node "m" lies on edge "a" -- "b"`,
			`decimals.dot:15:2: boxes of nodes "p" and "q" overlap`,
			`decimals.dot:8:4: edge "a" -- "b" passes through the box of node "n"`,
		}},
		{"labels.dot", []string{
			// a's label, 26 characters of 14-point type, grows its box to
			// 26 x 0.6 x 14 + 2 x 8 = 234.4 points wide (README, Node boxes):
			// b, 100 points away, overlaps it. c's is fixed at 0.75 inches.
			// The edge d-e (y = 200) passes f 20 points off: its default
			// box (half height 18) would clear it, but its label grows it
			// to 2 lines of 16.8 points plus 4 above and below, 41.6 points
			// (half 21, rounded up), reaching down to y = 199. g, 30 points
			// below the edge, keeps its default box, which clears it.
			`labels.dot:4:2: boxes of nodes "a" and "b" overlap`,
			`labels.dot:10:4: edge "d" -- "e" passes through the box of node "f"`,
		}},
		{"pinned.dot", []string{
			`pinned.dot:7:5: edges "up" -> "down" and "right" -> "left" cross`,
		}},
		{"missing.dot", []string{
			`missing.dot:5:12: graph "one": node "c" has no pos`,
			`missing.dot:8:2: graph "two": node "d" has no pos (nor have 2 more of its 3 nodes)`,
		}},
		{"malformed.dot", []string{
			`malformed.dot:3:2: node "a": pos "1e2,3" is not "X,Y" or "X,Y!" with decimal numbers`,
			`malformed.dot:4:2: node "b": pos "12" is not "X,Y" or "X,Y!" with decimal numbers`,
			`malformed.dot:5:2: node "c": pos "x,y" is not "X,Y" or "X,Y!" with decimal numbers`,
			`malformed.dot:9:2: node "g": pos "-,5" is not "X,Y" or "X,Y!" with decimal numbers`,
			`malformed.dot:7:2: node "e": width "wide" is not a non-negative number of inches`,
			`malformed.dot:10:2: node "h": height "-1" is not a non-negative number of inches`,
			`malformed.dot:6:2: node "d": pos "1.12345678,0" has 8 decimals; at most 6 can be checked exactly`,
			// 2^40 = 1099511627776 (geomcheck.MaxCoord).
			`malformed.dot:8:2: node "f": pos "2000000000000,0" is too far out to be checked exactly (want |x|, |y| <= 1099511627776)`,
		}},
		{"clusters.dot", []string{
			// Default boxes 54 x 36 points, frames 8 points round them
			// (README, What the output contains). cluster_a's frame spans
			// x -35..235, so c's box (73..127) lies in it. p's frame
			// (-35..35) and q's (31..101) overlap, though neither box
			// reaches the other's frame (27 < 31, 39 > 35). cluster_inner
			// (-35..35) keeps clear of s (73..127). w lies in the frames
			// of cluster_n and of cluster_m around it: two intrusions.
			`clusters.dot:4:2: node "c" lies in the frame of cluster "cluster_a", which it does not belong to`,
			`clusters.dot:15:2: node "w" lies in the frame of cluster "cluster_m", which it does not belong to`,
			`clusters.dot:15:2: node "w" lies in the frame of cluster "cluster_n", which it does not belong to`,
			`clusters.dot:5:2: frames of clusters "cluster_p" and "cluster_q" overlap`,
		}},
		{"range.dot", []string{
			`range.dot:5:2: node "b": pos "2000000,0" is too far out to be checked exactly (want |x|, |y| <= 1099511.627776)`,
		}},
	} {
		t.Run(tc.file, func(t *testing.T) {
			src, err := os.ReadFile(filepath.Join("testdata", "check", tc.file))
			if err != nil {
				t.Fatal(err)
			}
			f, err := dotio.Read(src, dotio.ReadOptions{Name: tc.file})
			if err != nil {
				t.Fatal(err)
			}
			var out bytes.Buffer
			n, err := checkFile(&out, f)
			if err != nil {
				t.Fatal(err)
			}
			got := splitLines(out.String())
			if strings.Join(got, "\n") != strings.Join(tc.want, "\n") {
				t.Errorf("got:\n%s\nwant:\n%s", strings.Join(got, "\n"), strings.Join(tc.want, "\n"))
			}
			if n != len(tc.want) {
				t.Errorf("count %d, want %d", n, len(tc.want))
			}
			// Same bytes on every run.
			var again bytes.Buffer
			checkFile(&again, f)
			if again.String() != out.String() {
				t.Error("output differs between runs")
			}
		})
	}
}

func splitLines(s string) []string {
	s = strings.TrimSuffix(s, "\n")
	if s == "" {
		return nil
	}
	return strings.Split(s, "\n")
}

// Every example laid out by the command and checked: the kept edges form a
// plane straight-line drawing, so there is no crossing, overlap, node on
// an edge or shared point, and the spacing keeps node boxes apart. With the removed edges put back, a graph that
// had to lose edges must show a problem: a straight-line drawing with none
// would be a plane drawing of a non-planar graph, which Kuratowski's
// theorem (1930) rules out.
func TestCheckLaidOutExamples(t *testing.T) {
	paths, err := filepath.Glob("../../examples/*.dot")
	if err != nil || len(paths) == 0 {
		t.Fatalf("no examples: %v", err)
	}
	geometric := func(p checkProblem) bool {
		return p.kind == checkCrossing || p.kind == checkOverlap || p.kind == checkOnEdge || p.kind == checkSamePoint
	}
	// With the removed edges put back, those may pass through boxes:
	// the spacing clears the boxes of the kept edges only.
	for _, path := range paths {
		t.Run(filepath.Base(path), func(t *testing.T) {
			// How many edges each graph sets aside, from --removed.
			rmPath := filepath.Join(t.TempDir(), "removed.dot")
			if code, _, errs := runCmd(t, "", "-q", "--removed", rmPath, path); code != exitOK {
				t.Fatalf("exit %d: %s", code, errs)
			}
			rmSrc, err := os.ReadFile(rmPath)
			if err != nil {
				t.Fatal(err)
			}
			rm, err := dotio.Read(rmSrc, dotio.ReadOptions{Name: "removed"})
			if err != nil {
				t.Fatal(err)
			}
			for _, drop := range []bool{true, false} {
				reportPath := filepath.Join(t.TempDir(), "report.json")
				args := []string{"-q", "--report", reportPath, path}
				if drop {
					args = append(args, "--drop-removed")
				}
				code, out, errs := runCmd(t, "", args...)
				if code != exitOK {
					t.Fatalf("exit %d: %s", code, errs)
				}
				var rep reportOut
				if err := json.Unmarshal(mustRead(t, reportPath), &rep); err != nil || len(rep.Files) != 1 {
					t.Fatalf("report: %v (%d files)", err, len(rep.Files))
				}
				f, err := dotio.Read([]byte(out), dotio.ReadOptions{Name: "out"})
				if err != nil {
					t.Fatal(err)
				}
				if len(rm.Graphs) != len(f.Graphs) || len(rep.Files[0].Graphs) != len(f.Graphs) {
					t.Fatalf("%d graphs in --removed, %d in the report, %d in the output", len(rm.Graphs), len(rep.Files[0].Graphs), len(f.Graphs))
				}
				for gi, g := range f.Graphs {
					var geo, other []string
					var intrusions, overlaps int64
					for _, p := range checkGraph(g, gi) {
						switch {
						case p.kind == checkThroughBox && !drop:
							continue
						case p.kind == checkIntrusion:
							intrusions++
						case p.kind == checkFrameOverlap:
							overlaps++
						case geometric(p):
							geo = append(geo, p.msg)
						default:
							other = append(other, p.msg) // box overlaps and edges through boxes included: the spacing rule forbids them
						}
					}
					if len(other) > 0 {
						t.Errorf("drop=%v graph %d: input problems in the command's own output: %v", drop, gi, other)
					}
					// Clusters are framed but not yet held together
					// (README, Clusters and direction): what --check lists in the
					// output is what --report counted for it.
					if r := rep.Files[0].Graphs[gi]; r.ClusterIntrusions != intrusions || r.FrameOverlaps != overlaps {
						t.Errorf("drop=%v graph %d: --check lists %d intrusions and %d frame overlaps, --report counts %d and %d", drop, gi, intrusions, overlaps, r.ClusterIntrusions, r.FrameOverlaps)
					}
					setAside := len(rm.Graphs[gi].Edges) > 0
					switch {
					case (drop || !setAside) && len(geo) > 0:
						t.Errorf("drop=%v graph %d: kept edges drawn with problems: %v", drop, gi, geo)
					case !drop && setAside && len(geo) == 0:
						t.Errorf("graph %d: %d edges were removed, yet with them the drawing has no problem", gi, len(rm.Graphs[gi].Edges))
					}
				}
			}
		})
	}
}

// TestCheckLabelCapped: a label too long for a box of 1000 inches gets a
// box of 1000 inches in the check as in the layout, so at the finest
// scale the check takes (10^6, from a 6-decimal pos) the box still fits
// the exact arithmetic (geomcheck.MaxCoord is 2^40), and the overlap with
// a node one point away is reported.
func TestCheckLabelCapped(t *testing.T) {
	src := `graph { a [pos="0.000001,0", label="` + strings.Repeat("x", 300_000) + `"]; b [pos="1,0"] }`
	f, err := dotio.Read([]byte(src), dotio.ReadOptions{Name: "big.dot"})
	if err != nil {
		t.Fatal(err)
	}
	var out bytes.Buffer
	if n, err := checkFile(&out, f); err != nil || n != 1 || out.String() != "big.dot:1:9: boxes of nodes \"a\" and \"b\" overlap\n" {
		t.Errorf("%d problems, %q, %v", n, out.String(), err)
	}
	if b := nodeBoxes(f.Graphs[0]); b.HalfW[0] != maxBoxSide/2 {
		t.Errorf("label box half width %d, want %d", b.HalfW[0], maxBoxSide/2)
	}
}

// TestSpacingClearsWideLabels lays out graphs with a few long or
// many-line labels among default nodes, generated by bench/gendot with
// labels added, on which an edge once cut the corner of a wide box whose
// centre lay beyond the edge's end (the spacing then only cleared boxes
// alongside an edge), and checks the command's output with the same
// independent checks as --check: no crossing, no overlapping boxes, no
// edge through a box.
func TestSpacingClearsWideLabels(t *testing.T) {
	paths, err := filepath.Glob("testdata/spacing/*.dot")
	if err != nil || len(paths) == 0 {
		t.Fatalf("no inputs: %v", err)
	}
	for _, path := range paths {
		code, out, errs := runCmd(t, "", "-q", path)
		if code != exitOK {
			t.Fatalf("%s: exit %d: %s", path, code, errs)
		}
		f, err := dotio.Read([]byte(out), dotio.ReadOptions{Name: "out"})
		if err != nil {
			t.Fatal(err)
		}
		for gi, g := range f.Graphs {
			if probs := checkGraph(g, gi); len(probs) > 0 {
				t.Errorf("%s graph %d: %d problems, first %s", path, gi, len(probs), probs[0].msg)
			}
		}
	}
}

// TestCheckToFile: --check -o FILE writes the problem lines to FILE (and
// nothing to standard output), with exit status 1 when there are any, and
// an empty FILE and status 0 for a clean drawing.
func TestCheckToFile(t *testing.T) {
	dir := t.TempDir()
	for _, tc := range []struct {
		file string
		code int
		want string
	}{
		{"cross.dot", exitProblems, `testdata/check/cross.dot:4:4: edges "a" -- "b" and "c" -- "d" cross` + "\n"},
		{"clean.dot", exitOK, ""},
	} {
		path := filepath.Join(dir, tc.file+".txt")
		code, out, errs := runCmd(t, "", "--check", "-o", path, "testdata/check/"+tc.file)
		if code != tc.code || out != "" {
			t.Errorf("%s: exit %d, stdout %q, stderr %q; want exit %d and no stdout", tc.file, code, out, errs, tc.code)
		}
		got, err := os.ReadFile(path)
		if err != nil {
			t.Fatal(err)
		}
		if string(got) != tc.want {
			t.Errorf("%s: file holds %q, want %q", tc.file, got, tc.want)
		}
	}
}

// TestUnclearedComponentsNamed: a component too big for the box check
// (over 5,000 nodes, README, Limits) is laid out, and standard error says
// that edges may pass through node boxes there; -q says nothing.
func TestUnclearedComponentsNamed(t *testing.T) {
	var b strings.Builder
	b.WriteString("graph big {\n")
	const rows, cols = 51, 100 // 5,100 nodes
	for r := range rows {
		for c := range cols {
			if c+1 < cols {
				fmt.Fprintf(&b, "\tv%d_%d -- v%d_%d\n", r, c, r, c+1)
			}
			if r+1 < rows {
				fmt.Fprintf(&b, "\tv%d_%d -- v%d_%d\n", r, c, r+1, c)
			}
		}
	}
	b.WriteString("}\n")
	code, _, errs := runCmd(t, b.String())
	want := `gridwood: <stdin>:1:1: graph "big": 1 component too big for the box check (over 5,000 nodes, or past its work bound) kept at the base unit; edges may pass through node boxes there (--check lists them)` + "\n"
	if code != exitOK || errs != want {
		t.Errorf("exit %d, stderr %q; want 0 and %q", code, errs, want)
	}
	if code, _, errs := runCmd(t, b.String(), "-q"); code != exitOK || errs != "" {
		t.Errorf("-q: exit %d, stderr %q", code, errs)
	}
}
