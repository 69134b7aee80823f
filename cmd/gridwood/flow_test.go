package main

import (
	"encoding/json"
	"path/filepath"
	"strings"
	"testing"

	"gonum.org/v1/gonum/graph/formats/dot"
)

// flowInputs are small digraphs whose edges on directed cycles are
// counted by hand (cycles), with the kept edges as written (kept), and,
// where it follows from the rule whatever the layout, the edges the
// orientation points along the flow (along; -1 where it depends on the
// drawing).
var flowInputs = []struct {
	name, src           string
	kept, cycles, along int
}{
	// One edge between two default boxes: the spacing keeps them at
	// least 54 + 18 points apart along one axis (place/doc.go, the spacing rule), so
	// whichever way it runs, a mirror image, or a quarter turn that
	// leaves the boxes 72 >= 36 + 18 points apart on the other axis,
	// points it along.
	{"pair", "digraph pair {\n\ta -> b\n}\n", 1, 0, 1},
	// A triangle a -> b -> c -> a and a loop at d lie on cycles; c -> d
	// does not.
	{"triangle", "digraph triangle {\n\ta -> b -> c -> a\n\tc -> d\n\td -> d\n}\n", 5, 4, -1},
	// A two-cycle and a repeat of one of its edges: all three on it.
	{"two-cycle", "digraph two_cycle {\n\trankdir=BT\n\ta -> b\n\tb -> a\n\ta -> b\n}\n", 3, 3, 0},
	{"diamond", "digraph diamond {\n\trankdir=LR\n\ta -> {b c}\n\tb -> d\n\tc -> d\n\td -> e\n}\n", 5, 0, -1},
	{"chain", "digraph chain {\n\trankdir=RL\n\tx -> y -> z\n}\n", 2, 0, -1},
	// K5 as a transitive tournament: acyclic, one of its 10 edges set
	// aside (Kuratowski), 9 kept.
	{"tournament", "digraph tournament {\n\ta -> {b c d e}\n\tb -> {c d e}\n\tc -> {d e}\n\td -> e\n}\n", 9, 0, -1},
	// A cycle through three nodes and a path leaving it: 3 on the cycle.
	{"cycle and path", "digraph cycle_path {\n\trankdir=TB\n\tp -> q -> r -> p\n\tr -> s -> t\n}\n", 5, 3, -1},
}

// reaches reports whether a path of edges leads from s to t.
func reaches(edges [][2]int, s, t int) bool {
	seen := map[int]bool{s: true}
	queue := []int{s}
	for len(queue) > 0 {
		u := queue[0]
		queue = queue[1:]
		if u == t {
			return true
		}
		for _, e := range edges {
			if e[0] == u && !seen[e[1]] {
				seen[e[1]] = true
				queue = append(queue, e[1])
			}
		}
	}
	return false
}

// flowFromOutput counts a digraph's edges in an output written with
// --drop-removed (so its edges are the kept ones): on a directed cycle
// (the head reaches the tail, by breadth-first search), else along the
// rankdir (README, Quality report: down for TB, right for LR, up for BT,
// left for RL, DOT's y pointing up) or against it.
func flowFromOutput(t *testing.T, out string) (along, against, cycles, kept int) {
	t.Helper()
	file, err := dot.ParseString(out)
	if err != nil || len(file.Graphs) != 1 {
		t.Fatalf("output does not parse: %v", err)
	}
	m := interpretGraph(file.Graphs[0])
	_, pos, _, _, err := appendedLayout(file.Graphs[0], m)
	if err != nil {
		t.Fatal(err)
	}
	var edges [][2]int
	for _, e := range m.Edges {
		edges = append(edges, [2]int{e.From, e.To})
	}
	dir := strings.ToUpper(m.Attrs["rankdir"])
	for _, e := range edges {
		if reaches(edges, e[1], e[0]) {
			cycles++
			continue
		}
		tail, head := pos[e[0]], pos[e[1]]
		var ahead bool
		switch dir {
		case "LR":
			ahead = head[0] > tail[0]
		case "RL":
			ahead = head[0] < tail[0]
		case "BT":
			ahead = head[1] > tail[1]
		default:
			ahead = head[1] < tail[1]
		}
		if ahead {
			along++
		} else {
			against++
		}
	}
	return along, against, cycles, len(edges)
}

// reportRecord runs the command with --report and returns the one graph
// record and the output.
func reportRecord(t *testing.T, src string, args ...string) (graphRecord, string) {
	t.Helper()
	repPath := filepath.Join(t.TempDir(), "report.json")
	code, out, errs := runCmd(t, src, append([]string{"-q", "--report", repPath}, args...)...)
	if code != exitOK {
		t.Fatalf("exit %d: %s", code, errs)
	}
	var rep reportOut
	if err := json.Unmarshal(mustRead(t, repPath), &rep); err != nil || len(rep.Files) != 1 || len(rep.Files[0].Graphs) != 1 {
		t.Fatalf("report: %v", err)
	}
	return rep.Files[0].Graphs[0], out
}

// TestReportFlow: the report's flow figures are the ones the output's
// positions give, edges on cycles as counted by hand, and edges along
// the flow too where the orientation rule decides them whatever the
// layout; the three add up to the kept edges; an undirected graph has
// none. The drawing is checked
// with geomcheck.
func TestReportFlow(t *testing.T) {
	for _, tc := range flowInputs {
		t.Run(tc.name, func(t *testing.T) {
			rec, out := reportRecord(t, tc.src, "--drop-removed")
			if rec.FlowAlong == nil || rec.FlowAgainst == nil || rec.FlowOnCycles == nil {
				t.Fatalf("flow figures missing: %v %v %v", rec.FlowAlong, rec.FlowAgainst, rec.FlowOnCycles)
			}
			along, against, cycles, kept := flowFromOutput(t, out)
			if kept != tc.kept || cycles != tc.cycles {
				t.Errorf("output has %d kept edges, %d on cycles; want %d and %d", kept, cycles, tc.kept, tc.cycles)
			}
			if *rec.FlowAlong != along || *rec.FlowAgainst != against || *rec.FlowOnCycles != cycles {
				t.Errorf("report along %d against %d on cycles %d; the output gives %d, %d, %d", *rec.FlowAlong, *rec.FlowAgainst, *rec.FlowOnCycles, along, against, cycles)
			}
			if tc.along >= 0 && *rec.FlowAlong != tc.along {
				t.Errorf("along %d, want %d", *rec.FlowAlong, tc.along)
			}
			if *rec.FlowAlong+*rec.FlowAgainst+*rec.FlowOnCycles != tc.kept {
				t.Errorf("figures add up to %d, want %d", *rec.FlowAlong+*rec.FlowAgainst+*rec.FlowOnCycles, tc.kept)
			}
			file, _ := dot.ParseString(out)
			m := interpretGraph(file.Graphs[0])
			_, pos, _, _, _ := appendedLayout(file.Graphs[0], m)
			if probs, err := drawingProblems(m, pos); err != nil || len(probs) > 0 {
				t.Errorf("drawing problems: %v %v", probs, err)
			}
		})
	}
	rec, _ := reportRecord(t, "graph u { a -- b -- c }\n")
	if rec.FlowAlong != nil || rec.FlowAgainst != nil || rec.FlowOnCycles != nil {
		t.Errorf("undirected graph has flow figures %v %v %v", rec.FlowAlong, rec.FlowAgainst, rec.FlowOnCycles)
	}
}
