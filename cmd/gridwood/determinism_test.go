package main

import (
	"bytes"
	"fmt"
	"maps"
	"math/rand/v2"
	"os"
	"path/filepath"
	"slices"
	"strings"
	"testing"

	"github.com/gridwood/gridwood/internal/graphgen"
)

// randomNonPlanarDOT writes G(n, m) (m distinct pairs drawn uniformly) as
// DOT with attributes, a subgraph and a repeated edge; for m > 3n - 6 it
// is not planar (Euler's bound, SOURCES.md).
func randomNonPlanarDOT(seed uint64, n, m int) string {
	rng := rand.New(rand.NewPCG(seed, 42))
	var b strings.Builder
	fmt.Fprintf(&b, "graph \"mesh %d\" {\n\tnode [shape=circle, width=0.4]\n\tsubgraph cluster_core { label=\"core\"; v0; v1; v2 }\n", seed)
	seen := map[[2]int]bool{}
	for len(seen) < m {
		u, v := rng.IntN(n), rng.IntN(n)
		k := [2]int{min(u, v), max(u, v)}
		if u == v || seen[k] {
			continue
		}
		seen[k] = true
		fmt.Fprintf(&b, "\tv%d -- v%d", u, v)
		if rng.IntN(4) == 0 {
			b.WriteString(" [color=red]")
		}
		b.WriteString("\n")
	}
	b.WriteString("\tv0 -- v1\n}\n")
	return b.String()
}

// outputs are the bytes of one run: standard output and the two files.
type outputs struct{ stdout, removed, explain []byte }

// TestDeterministicAcrossProcesses runs the command as a subprocess with
// GOMAXPROCS=1 and 2, reading a file and standard input, and wants the
// same bytes every time, also in --removed and --explain files, and the
// same as an in-process run (README.md, "Determinism").
func TestDeterministicAcrossProcesses(t *testing.T) {
	type input struct {
		name  string
		src   []byte
		flags []string
	}
	var inputs []input
	for _, pattern := range []string{"../../examples/*.dot", "testdata/*.dot", "../../dotio/testdata/*.gv"} {
		files, _ := filepath.Glob(pattern)
		for _, f := range files {
			b, err := os.ReadFile(f)
			if err != nil {
				t.Fatal(err)
			}
			inputs = append(inputs, input{name: filepath.Base(f), src: b})
		}
	}
	if len(inputs) < 8 {
		t.Fatalf("found %d inputs", len(inputs))
	}
	for seed := range uint64(3) {
		inputs = append(inputs, input{name: fmt.Sprintf("gnm%d", seed), src: []byte(randomNonPlanarDOT(seed, 16, 52))})
	}
	inputs = append(inputs,
		input{name: "gnm-effort", src: []byte(randomNonPlanarDOT(9, 14, 44)), flags: []string{"--effort", "3"}},
		input{name: "generated", src: []byte(genDOT(77, false) + genDOT(78, false))},
		input{name: "k33-unit", src: []byte("digraph { {a b c} -> {x y z} }"), flags: []string{"--unit", "36"}},
	)
	nonPlanar := 0
	for _, in := range inputs {
		t.Run(in.name, func(t *testing.T) {
			dir := t.TempDir()
			path := filepath.Join(dir, "in.dot")
			if err := os.WriteFile(path, in.src, 0o644); err != nil {
				t.Fatal(err)
			}
			var first *outputs
			var firstHow string
			compare := func(how string, got outputs) {
				if first == nil {
					first, firstHow = &got, how
					return
				}
				for _, c := range []struct {
					what string
					a, b []byte
				}{{"stdout", first.stdout, got.stdout}, {"--removed", first.removed, got.removed}, {"--explain", first.explain, got.explain}} {
					if !bytes.Equal(c.a, c.b) {
						t.Errorf("%s differs between %s and %s:\n%s\nvs\n%s", c.what, firstHow, how, c.a, c.b)
					}
				}
			}
			run := 0
			for _, procs := range []string{"1", "2"} {
				for _, fromFile := range []bool{true, false} {
					run++
					rm := filepath.Join(dir, fmt.Sprintf("removed%d.dot", run))
					ex := filepath.Join(dir, fmt.Sprintf("explain%d.dot", run))
					args := append([]string{"-q", "--removed", rm, "--explain", ex}, in.flags...)
					var stdin []byte
					if fromFile {
						args = append(args, path)
					} else {
						stdin = in.src
					}
					res := runSubprocess(t, stdin, []string{"GOMAXPROCS=" + procs}, args...)
					if res.code != exitOK || len(res.stderr) > 0 {
						t.Fatalf("GOMAXPROCS=%s file=%v: %s: %s", procs, fromFile, res.state, res.stderr)
					}
					r, err1 := os.ReadFile(rm)
					e, err2 := os.ReadFile(ex)
					if err1 != nil || err2 != nil {
						t.Fatalf("side files: %v %v", err1, err2)
					}
					if fromFile {
						// --explain says where each removed edge was
						// written, so it names its input.
						e = bytes.ReplaceAll(e, []byte(path), []byte("<stdin>"))
					}
					compare(fmt.Sprintf("GOMAXPROCS=%s file=%v", procs, fromFile), outputs{res.stdout, r, e})
				}
			}
			rm, ex := filepath.Join(dir, "r.dot"), filepath.Join(dir, "e.dot")
			code, out, errs, err := runInProcess(in.src, append([]string{"-q", "--removed", rm, "--explain", ex}, in.flags...)...)
			if err != nil || code != exitOK {
				t.Fatalf("in-process: exit %d %v %s", code, err, errs)
			}
			r, _ := os.ReadFile(rm)
			e, _ := os.ReadFile(ex)
			compare("in-process", outputs{out, r, e})
			if len(first.stdout) == 0 || !bytes.Contains(first.stdout, []byte("pos=")) {
				t.Errorf("no layout in the output: %q", first.stdout)
			}
			if bytes.Contains(first.removed, []byte(" -- ")) || bytes.Contains(first.removed, []byte(" -> ")) {
				nonPlanar++
				if len(bytes.TrimSpace(first.explain)) == 0 {
					t.Errorf("edges removed but --explain is empty")
				}
			}
		})
	}
	// The side files are only worth comparing when they hold something.
	if nonPlanar < 5 {
		t.Errorf("only %d inputs lost edges", nonPlanar)
	}
}

// TestDirectionDoesNotChangeLayout checks that edge direction is ignored
// by the layout (README.md, "What the output contains"): a random planar graph with
// its nodes declared first, written with every edge one way, with each
// single edge reversed in turn, with a seeded half of them reversed, and
// as a digraph with arrows, gets the same positions every time; so does a
// non-planar graph, whose removed edges must not depend on direction
// either. The digraphs' drawings are left as laid out (--no-flow): the
// orientation that follows is the one step that reads directions
// (TestFlowOrientation).
func TestDirectionDoesNotChangeLayout(t *testing.T) {
	for _, g := range []graphgen.Graph{graphgen.RandomPlanar(20, 0.6, 1), graphgen.RandomPlanar(200, 0.6, 2), graphgen.RandomGnm(40, 160, 3)} {
		t.Run(g.Name, func(t *testing.T) {
			rng := rand.New(rand.NewPCG(7, uint64(g.N)))
			var forms [][]bool
			forms = append(forms, nil)
			half := make([]bool, len(g.Edges))
			for i := range half {
				half[i] = rng.IntN(2) == 0
			}
			forms = append(forms, half)
			for i := range min(len(g.Edges), 40) {
				one := make([]bool, len(g.Edges))
				one[i] = true
				forms = append(forms, one)
			}
			want := ""
			for k, flip := range forms {
				kind, op := "graph", "--"
				if k%2 == 1 {
					kind, op = "digraph", "->"
				}
				code, out, errs := runCmd(t, writeGraph(kind, op, g.N, g.Edges, flip), "-q", "--no-flow")
				if code != exitOK {
					t.Fatalf("form %d: exit %d: %s", k, code, errs)
				}
				got := nodeLines(out)
				if want == "" {
					want = got
				} else if got != want {
					t.Fatalf("form %d (%s, %d edges reversed): positions differ", k, kind, countTrue(flip))
				}
			}
		})
	}
}

func countTrue(b []bool) int {
	k := 0
	for _, x := range b {
		if x {
			k++
		}
	}
	return k
}

// writeGraph writes n declared nodes and the pairs as DOT, reversing the
// pairs flip says.
func writeGraph(kind, op string, n int, pairs [][2]int32, flip []bool) string {
	var b strings.Builder
	fmt.Fprintf(&b, "%s G {\n", kind)
	for v := range n {
		fmt.Fprintf(&b, "\tv%d\n", v)
	}
	for i, p := range pairs {
		u, v := p[0], p[1]
		if flip != nil && flip[i] {
			u, v = v, u
		}
		fmt.Fprintf(&b, "\tv%d %s v%d\n", u, op, v)
	}
	b.WriteString("}\n")
	return b.String()
}

// nodeLines keeps the node statements (with their positions) of output.
func nodeLines(out string) string {
	var b strings.Builder
	for _, line := range strings.Split(out, "\n") {
		if strings.Contains(line, "pos=") || strings.Contains(line, "bb=") {
			b.WriteString(line + "\n")
		}
	}
	return b.String()
}

// TestOutputReadAgainIsTheSame lays out gridwood's own output once more
// and wants the same bytes (README.md, "What the output contains"): the
// positions appended the first time are replaced, not piled up, so a build
// that runs gridwood over files it laid out before changes nothing. The
// inputs are the lossless test's (repositoryDOT: every DOT file and
// test-file literal in the repository), among them graphs that lose edges
// (the removed edges are kept, so the layout sees the same graph) and
// pinned input positions.
func TestOutputReadAgainIsTheSame(t *testing.T) {
	texts := repositoryDOT(t) // the lossless test's inputs
	laid := 0
	for _, name := range slices.Sorted(maps.Keys(texts)) {
		code, once, errs := runCmd(t, string(texts[name]), "-q")
		if code != exitOK {
			continue // inputs that are meant to fail (malformed ones)
		}
		laid++
		code, twice, errs2 := runCmd(t, once, "-q")
		if code != exitOK {
			t.Errorf("%s: the output laid out again: exit %d: %s", name, code, errs2)
			continue
		}
		if once != twice {
			t.Errorf("%s: laid out twice differs from once (%d and %d bytes); first run said %q", name, len(once), len(twice), errs)
		}
	}
	if laid < 20 {
		t.Errorf("only %d of %d inputs laid out", laid, len(texts))
	}
	// Varied inputs: the lossless test's generator (every kept feature,
	// stale layout data of every kind among them). Before the compact or
	// multi-line form of a subgraph was chosen from the statements
	// actually printed, `subgraph s { a; bb="1,1,2,2" }` came out on
	// several lines once and as `subgraph s {a}` the second time.
	varied := 0
	for seed := uint64(1); seed <= 400; seed++ {
		src := genDOT(seed, seed%2 == 0)
		code, once, _ := runCmd(t, src, "-q")
		if code != exitOK {
			continue
		}
		varied++
		if _, twice, _ := runCmd(t, once, "-q"); once != twice {
			t.Errorf("generated input %d: laid out twice differs from once:\n%s\n--- once:\n%s\n--- twice:\n%s", seed, src, once, twice)
		}
	}
	if varied < 300 {
		t.Errorf("only %d of 400 generated inputs laid out", varied)
	}
	for _, src := range []string{
		"graph { subgraph s { a; bb=\"1,1,2,2\" } }\n",
		"graph { x -- { b; node [pos=\"1,1\"] } }\n",
		"graph { subgraph s { a; lp=\"1,1\"; graph [lwidth=2] edge [lp=1] node [xlp=2] } }\n",
	} {
		_, once, _ := runCmd(t, src, "-q")
		if _, twice, _ := runCmd(t, once, "-q"); once != twice || strings.Count(once, "{\n") != 1 {
			t.Errorf("%q: laid out once\n%s\ntwice\n%s\nwant the subgraph on one line both times", src, once, twice)
		}
	}
	for seed := uint64(1); seed <= 3; seed++ {
		src := randomNonPlanarDOT(seed, 30, 90)
		_, once, _ := runCmd(t, src, "-q")
		if _, twice, _ := runCmd(t, once, "-q"); once != twice {
			t.Errorf("G(30, 90) seed %d: laid out twice differs from once", seed)
		}
	}
}
