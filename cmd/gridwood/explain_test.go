package main

import (
	"os"
	"path/filepath"
	"strings"
	"testing"

	"gonum.org/v1/gonum/graph/formats/dot"
	"gonum.org/v1/gonum/graph/formats/dot/ast"
)

// TestExplainFile checks the --explain output from the outside: it parses
// as DOT (gonum's parser), holds one subgraph per removed edge, and each
// subgraph is a subdivision of the obstruction it names (Kuratowski 1930):
// its chains are paths between the named branch vertices (5 for K5, 6 for
// K3,3), every branch vertex ends 4 (K5) or 3 (K3,3) chains, chains share
// no inner vertex, every chain edge is an edge of the input, and the
// removed edge is one of them.
func TestExplainFile(t *testing.T) {
	in := "graph G {\n a -- b -- c -- d -- e -- a -- c -- e -- b -- d -- a\n}\n" +
		"graph H {\n {x y z} -- {p q r}\n s -- t\n}\n"
	dir := t.TempDir()
	why := filepath.Join(dir, "why.dot")
	if code, _, errs := runCmd(t, in, "-q", "--explain", why); code != exitOK {
		t.Fatalf("exit %d: %s", code, errs)
	}
	src, _ := os.ReadFile(why)
	f, err := dot.ParseBytes(src)
	if err != nil {
		t.Fatalf("explain file does not parse: %v\n%s", err, src)
	}
	inputEdges := map[[2]string]bool{}
	for _, pair := range [][2]string{{"a", "b"}, {"b", "c"}, {"c", "d"}, {"d", "e"}, {"e", "a"}, {"a", "c"}, {"c", "e"}, {"e", "b"}, {"b", "d"}, {"d", "a"}} {
		inputEdges[pair], inputEdges[[2]string{pair[1], pair[0]}] = true, true
	}
	for _, u := range []string{"x", "y", "z"} {
		for _, v := range []string{"p", "q", "r"} {
			inputEdges[[2]string{u, v}], inputEdges[[2]string{v, u}] = true, true
		}
	}
	if len(f.Graphs) != 2 {
		t.Fatalf("want one graph per non-planar input graph, got %d", len(f.Graphs))
	}
	for _, g := range f.Graphs {
		subs := 0
		for _, st := range g.Stmts {
			sub, ok := st.(*ast.Subgraph)
			if !ok {
				continue
			}
			subs++
			attrs := map[string]string{}
			var chains [][]string
			for _, s := range sub.Stmts {
				switch s := s.(type) {
				case *ast.AttrStmt:
					for _, a := range s.Attrs {
						attrs[a.Key] = strings.Trim(a.Val, `"`)
					}
				case *ast.EdgeStmt:
					chain := []string{s.From.(*ast.Node).ID}
					for e := s.To; e != nil; e = e.To {
						chain = append(chain, e.Vertex.(*ast.Node).ID)
					}
					chains = append(chains, chain)
				}
			}
			branch := strings.Split(attrs["branch"], ", ")
			wantBranch, wantChains, wantDeg := 6, 9, 3
			if attrs["obstruction"] == "K5" {
				wantBranch, wantChains, wantDeg = 5, 10, 4
			} else if attrs["obstruction"] != "K3,3" {
				t.Fatalf("%s: obstruction %q", g.ID, attrs["obstruction"])
			}
			if len(branch) != wantBranch || len(chains) != wantChains {
				t.Fatalf("%s: %d branch vertices and %d chains for %s", g.ID, len(branch), len(chains), attrs["obstruction"])
			}
			isBranch := map[string]bool{}
			for _, b := range branch {
				isBranch[b] = true
			}
			ends := map[string]int{}
			inner := map[string]bool{}
			removed := strings.Split(attrs["removed_edge"], " -- ")
			foundRemoved := false
			for _, c := range chains {
				if !isBranch[c[0]] || !isBranch[c[len(c)-1]] {
					t.Errorf("%s: chain %v does not join branch vertices", g.ID, c)
				}
				ends[c[0]]++
				ends[c[len(c)-1]]++
				for i := 1; i < len(c)-1; i++ {
					if isBranch[c[i]] || inner[c[i]] {
						t.Errorf("%s: chain %v reuses vertex %s", g.ID, c, c[i])
					}
					inner[c[i]] = true
				}
				for i := 0; i+1 < len(c); i++ {
					if !inputEdges[[2]string{c[i], c[i+1]}] {
						t.Errorf("%s: chain edge %s -- %s is not an input edge", g.ID, c[i], c[i+1])
					}
					if len(removed) == 2 && (c[i] == removed[0] && c[i+1] == removed[1] || c[i] == removed[1] && c[i+1] == removed[0]) {
						foundRemoved = true
					}
				}
			}
			for _, b := range branch {
				if ends[b] != wantDeg {
					t.Errorf("%s: branch vertex %s ends %d chains, want %d", g.ID, b, ends[b], wantDeg)
				}
			}
			if !foundRemoved {
				t.Errorf("%s: the removed edge %v is on no chain", g.ID, removed)
			}
		}
		if subs != 1 {
			t.Errorf("%s: %d certificates, want 1 (one edge removed)", g.ID, subs)
		}
	}
}

// TestExplainNotComputed: when the work bounds run out, the --explain file
// says so for each removed edge left without a certificate (README,
// Non-planar graphs) instead of leaving it out: with no work at all every
// entry is "not computed"; with plenty, none is; with a total bound that
// covers the first certificate only, the first is computed and a later
// one is not. The file parses as DOT every time.
func TestExplainNotComputed(t *testing.T) {
	savedEach, savedTotal := explainBudgetEach, explainBudgetTotal
	defer func() { explainBudgetEach, explainBudgetTotal = savedEach, savedTotal }()
	// K6 sets aside 3 edges: 15 - (3*6 - 6) (Euler's bound, SOURCES.md).
	in := "graph K6 { a -- {b c d e f}; b -- {c d e f}; c -- {d e f}; d -- {e f}; e -- f }\n"
	explain := func() string {
		t.Helper()
		why := filepath.Join(t.TempDir(), "why.dot")
		if code, _, errs := runCmd(t, in, "-q", "--explain", why); code != exitOK {
			t.Fatalf("exit %d: %s", code, errs)
		}
		src, err := os.ReadFile(why)
		if err != nil {
			t.Fatal(err)
		}
		if _, err := dot.ParseBytes(src); err != nil {
			t.Errorf("explain file does not parse: %v\n%s", err, src)
		}
		if n := strings.Count(string(src), "removed_edge="); n != 3 {
			t.Errorf("%d entries, want 3\n%s", n, src)
		}
		return string(src)
	}
	const notComputed = `obstruction="not computed", reason="work bound reached"`
	for _, tc := range []struct {
		name        string
		each, total int64
		skipped     int
	}{
		{"no work", 0, 0, 3},
		{"plenty", savedEach, savedTotal, 0},
	} {
		explainBudgetEach, explainBudgetTotal = tc.each, tc.total
		text := explain()
		if n := strings.Count(text, notComputed); n != tc.skipped {
			t.Errorf("%s: %d not computed, want %d\n%s", tc.name, n, tc.skipped, text)
		}
		if n := strings.Count(text, `obstruction="K`); n != 3-tc.skipped {
			t.Errorf("%s: %d certificates, want %d\n%s", tc.name, n, 3-tc.skipped, text)
		}
	}
	// The least total bound, in powers of two, that computes a first
	// certificate: it must leave a later one not computed, or the bound
	// was not what stopped them.
	explainBudgetEach = savedEach
	for explainBudgetTotal = 1; ; explainBudgetTotal *= 2 {
		if explainBudgetTotal > savedTotal {
			t.Fatal("no total bound gave a first certificate")
		}
		text := explain()
		if strings.Count(text, notComputed) == 3 {
			continue
		}
		first := text[strings.Index(text, "obstruction="):]
		if !strings.HasPrefix(first, `obstruction="K`) || !strings.Contains(text, notComputed) {
			t.Errorf("total bound %d: want the first certificate computed and a later one not\n%s", explainBudgetTotal, text)
		}
		t.Logf("a total bound of %d edge visits computes %d of 3", explainBudgetTotal, 3-strings.Count(text, notComputed))
		break
	}
}

// TestExplainOnPlanarGraph: --explain writes one graph per input graph, an
// empty one for a planar graph, so that the file is DOT even when nothing
// was removed (it was empty, not DOT, before).
func TestExplainOnPlanarGraph(t *testing.T) {
	why := filepath.Join(t.TempDir(), "why.dot")
	for _, tc := range []struct{ in, want string }{
		{"graph P { a -- b }\n", "graph P {\n}\n"},
		{"digraph { a -> b }\n", "graph \"anonymous 1\" {\n}\n"},
	} {
		if code, _, errs := runCmd(t, tc.in, "-q", "--explain", why); code != exitOK {
			t.Fatalf("exit %d: %s", code, errs)
		}
		if b, _ := os.ReadFile(why); string(b) != tc.want {
			t.Errorf("%q: explain file %q, want %q", tc.in, b, tc.want)
		}
	}
	// A planar graph and a non-planar one: two graphs, the second with
	// one certificate named for the removed edge.
	if code, _, errs := runCmd(t, "graph P { a -- b }\n"+k5Text, "-q", "--explain", why); code != exitOK {
		t.Fatalf("exit %d: %s", code, errs)
	}
	src, _ := os.ReadFile(why)
	f, err := dot.ParseBytes(src)
	if err != nil || len(f.Graphs) != 2 || len(f.Graphs[0].Stmts) != 0 {
		t.Fatalf("explain file: %v\n%s", err, src)
	}
	if !strings.Contains(string(src), "subgraph \"removed 1\" {") || strings.Contains(string(src), "set") {
		t.Errorf("certificate not named \"removed 1\":\n%s", src)
	}
}
