package main

import (
	"bytes"
	"fmt"
	"math/rand/v2"
	"os"
	"path/filepath"
	"regexp"
	"runtime/debug"
	"slices"
	"strconv"
	"strings"
	"syscall"
	"testing"

	"github.com/spf13/pflag"
	"gonum.org/v1/gonum/graph/formats/dot"
	"gonum.org/v1/gonum/graph/formats/dot/ast"

	"github.com/gridwood/gridwood/dotio"
	"github.com/gridwood/gridwood/place/geomcheck"
	"github.com/gridwood/gridwood/planarize"
)

// runCmd runs the command in-process and returns its exit status, output
// and messages.
func runCmd(t *testing.T, stdin string, args ...string) (int, string, string) {
	t.Helper()
	var out, errs bytes.Buffer
	code := run(args, strings.NewReader(stdin), &out, &errs)
	return code, out.String(), errs.String()
}

// positions reads the pos attributes from top-level node statements of a
// graph in the output, using gonum's parser directly (independent of
// dotio's reader): the last pos of a node wins, as in DOT. Node names are
// canonicalized the simple way, quotes stripped.
func positions(t *testing.T, g *ast.Graph) map[string][2]int64 {
	t.Helper()
	pos := map[string][2]int64{}
	for _, st := range g.Stmts {
		ns, ok := st.(*ast.NodeStmt)
		if !ok {
			continue
		}
		for _, a := range ns.Attrs {
			if a.Key != "pos" {
				continue
			}
			v := strings.Trim(a.Val, `"`)
			xy := strings.Split(v, ",")
			if len(xy) != 2 {
				t.Fatalf("node %s: pos %q is not X,Y", ns.Node.ID, a.Val)
			}
			x, err1 := strconv.ParseInt(xy[0], 10, 64)
			y, err2 := strconv.ParseInt(xy[1], 10, 64)
			if err1 != nil || err2 != nil {
				t.Fatalf("node %s: pos %q is not integral", ns.Node.ID, a.Val)
			}
			pos[ns.Node.ID] = [2]int64{x, y}
		}
	}
	return pos
}

func TestEndToEndKeepsStatementsAndDrawsCleanly(t *testing.T) {
	in, err := os.ReadFile("testdata/features.dot")
	if err != nil {
		t.Fatal(err)
	}
	code, out, errs := runCmd(t, string(in), "-q")
	if code != exitOK {
		t.Fatalf("exit %d: %s", code, errs)
	}
	got, err := dot.ParseString(out)
	if err != nil {
		t.Fatalf("output does not parse: %v\n%s", err, out)
	}
	src, err := dotio.Read(in, dotio.ReadOptions{Name: "features.dot"})
	if err != nil {
		t.Fatal(err)
	}
	want := src.AST()
	if len(got.Graphs) != len(want.Graphs) {
		t.Fatalf("%d graphs out, %d in", len(got.Graphs), len(want.Graphs))
	}
	for gi, wg := range want.Graphs {
		gg := got.Graphs[gi]
		if gg.Strict != wg.Strict || gg.Directed != wg.Directed || gg.ID != wg.ID {
			t.Errorf("graph %d header changed", gi)
		}
		// Every input statement is still there, in order, except the stale
		// layout attributes that are documented to be replaced, and a
		// top-level statement that only set pos on a node named before.
		var wantStmts []string
		seen := make(map[string]bool)
		for _, st := range wg.Stmts {
			switch st := st.(type) {
			case *ast.NodeStmt:
				key := canonicalID(st.Node.ID)
				if seen[key] && onlyKeys(st.Attrs, staleNodeKeys) {
					continue
				}
				seen[key] = true
			case *ast.EdgeStmt:
				markNamed(st.From, seen)
				for e := st.To; e != nil; e = e.To {
					markNamed(e.Vertex, seen)
				}
			case *ast.Subgraph:
				markNamed(st, seen)
			}
			if s := stripLayout(st); s != "" {
				wantStmts = append(wantStmts, s)
			}
		}
		var gotStmts []string
		for _, st := range gg.Stmts[:len(wantStmts)] {
			gotStmts = append(gotStmts, withoutClusterBB(st).String())
		}
		if strings.Join(gotStmts, "\n") != strings.Join(wantStmts, "\n") {
			t.Errorf("graph %d statements changed:\ngot:\n%s\nwant:\n%s", gi, strings.Join(gotStmts, "\n"), strings.Join(wantStmts, "\n"))
		}
		// Every node has an integral pos; the drawing has no crossings.
		pos := positions(t, gg)
		g := src.Graphs[gi]
		pts := make([]geomcheck.Point, len(g.Nodes))
		for v, n := range g.Nodes {
			p, ok := pos[n.ID]
			if !ok {
				t.Fatalf("graph %d: node %s has no pos", gi, n.ID)
			}
			pts[v] = geomcheck.Point{X: p[0], Y: p[1]}
		}
		raw := make([][2]int32, len(g.Edges))
		for i, e := range g.Edges {
			raw[i] = [2]int32{e.From, e.To}
		}
		simple, _ := planarize.Simplify(len(g.Nodes), raw)
		if !planarize.IsPlanar(len(g.Nodes), simple) {
			t.Fatalf("graph %d: test input should be planar", gi)
		}
		probs, err := geomcheck.Check(pts, simple)
		if err != nil || len(probs) > 0 {
			t.Errorf("graph %d: drawing problems %v %v", gi, probs, err)
		}
	}
}

// withoutClusterBB returns an output statement without the frames the
// command adds (README, "What the output contains"): the statement
// graph [bb="..."] that ends a cluster subgraph, at every depth.
func withoutClusterBB(st ast.Stmt) ast.Stmt {
	s, ok := st.(*ast.Subgraph)
	if !ok {
		return st
	}
	c := *s
	c.Stmts = nil
	for i, sub := range s.Stmts {
		if a, ok := sub.(*ast.AttrStmt); ok && i == len(s.Stmts)-1 && strings.HasPrefix(s.ID, "cluster") &&
			a.Kind == ast.GraphKind && len(a.Attrs) == 1 && a.Attrs[0].Key == "bb" {
			continue
		}
		c.Stmts = append(c.Stmts, withoutClusterBB(sub))
	}
	return &c
}

// stripLayout prints a statement as the output should contain it: with
// the stale layout data of each kind removed (pos and xlp from node
// statements and defaults, pos, lp, xlp, head_lp and tail_lp from edge
// statements and defaults, bb, lp, lwidth and lheight from graph
// attributes, also inside subgraph statements). Statements left empty by
// this are dropped ("").
func stripLayout(st ast.Stmt) string {
	if c := stripStmt(st); c != nil {
		return c.String()
	}
	return ""
}

// stripStmt is stripLayout on the syntax tree: a copy without the stale
// data, or nil.
func stripStmt(st ast.Stmt) ast.Stmt {
	drop := func(attrs []*ast.Attr, keys []string) []*ast.Attr {
		var out []*ast.Attr
		for _, a := range attrs {
			if !slices.Contains(keys, a.Key) {
				out = append(out, a)
			}
		}
		return out
	}
	switch s := st.(type) {
	case *ast.NodeStmt:
		c := *s
		c.Attrs = drop(s.Attrs, staleNodeKeys)
		return &c
	case *ast.EdgeStmt:
		c := *s
		c.Attrs = drop(s.Attrs, staleEdgeKeys)
		return &c
	case *ast.Attr:
		if slices.Contains(staleGraphKeys, s.Key) {
			return nil
		}
	case *ast.AttrStmt:
		c := *s
		c.Attrs = drop(s.Attrs, staleKeys(s.Kind))
		if len(c.Attrs) == 0 {
			return nil
		}
		return &c
	case *ast.Subgraph:
		c := *s
		c.Stmts = nil
		for _, sub := range s.Stmts {
			if k := stripStmt(sub); k != nil {
				c.Stmts = append(c.Stmts, k)
			}
		}
		return &c
	}
	return st
}

func TestExitStatusesAndMessages(t *testing.T) {
	k5 := "graph K5 { a -- b -- c -- d -- e -- a -- c -- e -- b -- d -- a }\n"
	for _, tc := range []struct {
		name   string
		stdin  string
		args   []string
		code   int
		errHas string
	}{
		{"syntax error", "graph G {\n  a -- b\n  c -- ]\n}\n", nil, exitBadInput, "<stdin>:3:8: "},
		{"arrow in graph", "graph G {\n a -> b\n}\n", nil, exitBadInput, "<stdin>:2:4: "},
		{"dashes in digraph", "digraph G { a -- b }", nil, exitBadInput, "<stdin>:1:15: "},
		{"empty input", "", nil, exitBadInput, "<stdin>"},
		{"not DOT", "hello, world\n", nil, exitBadInput, "<stdin>:1:"},
		{"unknown flag", "", []string{"--no-such-flag"}, exitBadInput, "gridwood: unknown flag --no-such-flag (see gridwood --help)\n"},
		{"misspelt flag", "", []string{"--ouput", "x.dot"}, exitBadInput, "gridwood: unknown flag --ouput; did you mean --output? (see gridwood --help)\n"},
		{"misspelt flag with a value", "", []string{"--explian=why.dot"}, exitBadInput, "unknown flag --explian; did you mean --explain?"},
		{"long flag with one dash", "", []string{"-help"}, exitBadInput, "unknown flag -help; did you mean --help?"},
		{"unknown letter", "", []string{"-qz"}, exitBadInput, "gridwood: unknown flag -z in -qz (see gridwood --help)\n"},
		{"flag without value", "", []string{"--unit"}, exitBadInput, "gridwood: --unit needs a value (see gridwood --help)\n"},
		{"value not a number", "", []string{"--effort", "lots"}, exitBadInput, "gridwood: --effort \"lots\": want a whole number (see gridwood --help)\n"},
		{"bad unit", "graph{}", []string{"--unit", "-3"}, exitBadInput, "--unit"},
		{"planar only", k5, []string{"--planar-only"}, exitNonPlanar, `graph "K5" is not planar`},
		{"non-planar reported", k5, nil, exitOK, `graph "K5": 1 of 10 edges removed to make it planar (see --removed)` + "\n"},
		{"strict graph counts a repeated pair once", "strict graph U {\n {h1 h2 h3} -- {w g p}\n {h1 h2 h3} -- {w g p}\n}\n", nil, exitOK, `graph "U": 1 of 9 edges removed`},
		{"strict digraph counts each direction", "strict digraph U {\n {h1 h2 h3} -> {w g p}\n {w g p} -> {h1 h2 h3}\n}\n", nil, exitOK, `digraph "U": 2 of 18 edges removed`},
		{"non-strict graph counts every copy", "graph U {\n {h1 h2 h3} -- {w g p}\n {h1 h2 h3} -- {w g p}\n}\n", nil, exitOK, `graph "U": 2 of 18 edges removed`},
		{"planar only, strict", "strict graph U {\n {h1 h2 h3} -- {w g p}\n h1 -- w\n}\n", []string{"--planar-only"}, exitNonPlanar, `graph "U" is not planar: 1 of 9 edges would have to be removed`},
		{"quiet", k5, []string{"-q"}, exitOK, ""},
		{"missing file", "", []string{"/no/such/file.dot"}, exitBadInput, "no such file"},
		{"check with a layout flag", "graph{}", []string{"--check", "--report", "x.json"}, exitBadInput, "gridwood: --check lays nothing out: --report does not go with it (see gridwood --help)\n"},
		{"check with --no-flow", "graph{}", []string{"--check", "--no-flow"}, exitBadInput, "gridwood: --check lays nothing out: --no-flow does not go with it (see gridwood --help)\n"},
		{"outer with no names", "graph{}", []string{"--outer", " "}, exitBadInput, "gridwood: --outer: no node names given (see gridwood --help)\n"},
		{"output in a missing directory", "graph{}", []string{"-o", "/no/such/dir/x.dot"}, exitBadInput, "gridwood: /no/such/dir/x.dot: cannot write: no such file or directory\n"},
		{"size not taken", "graph G { a [width=1000]; a -- b }", nil, exitOK, `<stdin>:1:11: node "a": width "1000" is not a size below 1000 and was taken as the default` + "\n"},
		{"size not taken, quiet", "graph G { a [width=1000]; a -- b }", []string{"-q"}, exitOK, ""},
		{"label box capped", "graph G { a [fontsize=900, label=\"" + strings.Repeat("x", 200) + "\"]; b [label=\"" + strings.Repeat("y", 9000) + "\"]; a -- b -- c }", nil, exitOK, `<stdin>:1:11: node "a": its label needs a box over 1000 inches a side; the box was taken as 1000 inches (and 1 more in graph "G")` + "\n"},
		{"max expansion 0", "graph{}", []string{"--max-expansion", "0"}, exitBadInput, "--max-expansion 0: want a positive number"},
		{"two outputs one file", "graph{}", []string{"-o", "x.dot", "--removed", "./x.dot"}, exitBadInput, "gridwood: -o and --removed both name ./x.dot (see gridwood --help)\n"},
		{"a number run into a letter", "graph { a -- 1e3 -- 2x }", nil, exitOK, `gridwood: <stdin>:1:14: "1e3" is read as two IDs, 1 and e3, as DOT reads numerals (no exponent, no suffix); quote it to make it one (and 1 more like it)` + "\n"},
		{"a number run into a letter, quiet", "graph { a -- 1e3 }", []string{"-q"}, exitOK, ""},
		{"nesting too deep", "graph {\n" + strings.Repeat("{", 1_000_000) + "a" + strings.Repeat("}", 1_000_000) + "\n}\n", nil, exitBadInput, "gridwood: <stdin>:2:1000000: braces nested more than 1000000 levels deep, the most gridwood reads\n"},
		{"output is an input", "", []string{"--svg", "in.dot", "./in.dot"}, exitBadInput, "--svg in.dot is also an input file"},
		{"chain too long", "graph{a" + strings.Repeat("--a", 1_000_001) + "}", nil, exitBadInput, "<stdin>:1:3000008: edge statement chains more than 1000000 edges"},
	} {
		t.Run(tc.name, func(t *testing.T) {
			code, out, errs := runCmd(t, tc.stdin, tc.args...)
			if code != tc.code {
				t.Fatalf("exit %d, want %d; stderr: %.300s", code, tc.code, errs)
			}
			// Every usage error is one line with a pointer to --help.
			if strings.HasSuffix(errs, "(see gridwood --help)\n") && strings.Count(errs, "\n") != 1 {
				t.Errorf("usage error on %d lines: %q", strings.Count(errs, "\n"), errs)
			}
			if tc.errHas != "" && !strings.Contains(errs, tc.errHas) {
				t.Errorf("stderr %q lacks %q", errs, tc.errHas)
			}
			if tc.errHas == "" && errs != "" {
				t.Errorf("stderr should be empty, got %q", errs)
			}
			if code != exitOK && out != "" {
				t.Errorf("failed run wrote to stdout: %q", out)
			}
		})
	}
}

// TestHelpAndVersion checks --help: a first line that is a sentence, the
// flags under their headings in order, each with its default when it
// takes a value, the exit statuses, and examples that work: --outer on the
// shipped example it is drawn from, --mark-removed as an attribute list.
// --version prints a version or says plainly that there is none.
func TestHelpAndVersion(t *testing.T) {
	code, help, errs := runCmd(t, "", "--help") // help goes to standard output
	if code != exitOK || errs != "" {
		t.Fatalf("--help exit %d, stderr %q", code, errs)
	}
	for _, line := range strings.Split(help, "\n") {
		if len(line) > 80 {
			t.Errorf("help line over 80 columns: %q", line)
		}
	}
	first, _, _ := strings.Cut(help, "\n")
	if !strings.HasPrefix(first, "gridwood ") || !strings.HasSuffix(first, ".") || len(first) > 80 {
		t.Errorf("first line %q: want one sentence about gridwood, within 80 columns", first)
	}
	// Headings in order, each followed by its flags.
	groups := []struct {
		heading string
		flags   []string
	}{
		{"Input and output:", []string{"output", "quiet", "max-expansion"}},
		{"Drawing:", []string{"unit", "grid", "method", "outer", "no-flow"}},
		{"Non-planar graphs:", []string{"removed", "drop-removed", "mark-removed", "planar-only", "explain", "effort"}},
		{"Checking and preview:", []string{"check", "svg", "report"}},
		{"About gridwood:", []string{"version", "help"}},
	}
	blocks := map[string]string{}
	group := map[string]string{}
	var name, heading string
	for _, line := range strings.Split(help, "\n") {
		if strings.HasSuffix(line, ":") && !strings.HasPrefix(line, " ") {
			heading, name = line, ""
			continue
		}
		if m := helpFlagLine.FindStringSubmatch(line); m != nil {
			name = m[1]
			blocks[name], group[name] = "", heading
			continue
		}
		if name != "" && strings.HasPrefix(line, "        ") {
			blocks[name] += strings.TrimSpace(line) + "\n"
		} else {
			name = ""
		}
	}
	last := -1
	total := 0
	for _, g := range groups {
		at := strings.Index(help, "\n"+g.heading+"\n")
		if at < last {
			t.Errorf("heading %q missing or out of order", g.heading)
		}
		last = at
		for _, f := range g.flags {
			total++
			b, ok := blocks[f]
			switch {
			case !ok:
				t.Errorf("help lacks --%s", f)
			case group[f] != g.heading:
				t.Errorf("--%s is under %q, want %q", f, group[f], g.heading)
			case b == "":
				t.Errorf("--%s has no description", f)
			}
		}
	}
	if len(blocks) != total {
		t.Errorf("help describes %d flags, want %d: %v", len(blocks), total, blocks)
	}
	cfg, _ := parseFlags(nil)
	cfg.flags.VisitAll(func(f *pflag.Flag) {
		if _, ok := blocks[f.Name]; !ok {
			t.Errorf("--%s is not in --help", f.Name)
		}
		if hasDefault := strings.Contains(blocks[f.Name], "default: "); hasDefault != (f.Value.Type() != "bool") {
			t.Errorf("--%s: default shown %v; want it for flags that take a value", f.Name, hasDefault)
		}
	})
	for _, want := range []string{"default: 1000000", "default: schnyder", "Exit status:", "  141  killed by SIGPIPE"} {
		if !strings.Contains(help, want) {
			t.Errorf("help lacks %q", want)
		}
	}
	// The --outer example names nodes of examples/campus-fibre.dot.
	ex := regexp.MustCompile(`example: (--outer \S+)`).FindStringSubmatch(blocks["outer"])
	if ex == nil {
		t.Fatalf("no --outer example in %q", blocks["outer"])
	}
	if code, _, errs := runCmd(t, "", "-q", strings.Fields(ex[1])[0], strings.Fields(ex[1])[1], "../../examples/campus-fibre.dot"); code != exitOK {
		t.Errorf("help's %q on campus-fibre.dot: exit %d, %s", ex[1], code, errs)
	}
	mk := regexp.MustCompile(`example: --mark-removed '([^']*)'`).FindStringSubmatch(blocks["mark-removed"])
	if mk == nil {
		t.Fatalf("no --mark-removed example in %q", blocks["mark-removed"])
	}
	if _, err := dotio.ParseAttrList(mk[1]); err != nil {
		t.Errorf("help's --mark-removed example %q: %v", mk[1], err)
	}
	code, version, _ := runCmd(t, "", "--version")
	if code != exitOK || !strings.HasPrefix(version, "gridwood ") || strings.Contains(version, "(devel)") || strings.Contains(version, "(unknown)") {
		t.Errorf("--version: exit %d, %q", code, version)
	}
}

// TestVersionOf checks the version line for each kind of build
// information the go command records (runtime/debug.BuildInfo): a module
// version, a pseudo-version (which holds the revision), "(devel)" with or
// without VCS settings, and none at all.
func TestVersionOf(t *testing.T) {
	vcs := []debug.BuildSetting{{Key: "vcs", Value: "git"}, {Key: "vcs.revision", Value: "2a88836b98ff3251f33c1e66fc53f31c4bd16862"}, {Key: "vcs.time", Value: "2026-12-03T08:41:00Z"}}
	for _, tc := range []struct {
		name string
		bi   *debug.BuildInfo
		ok   bool
		want string
	}{
		{"release", &debug.BuildInfo{Main: debug.Module{Version: "v1.4.0"}, Settings: vcs}, true, "v1.4.0"},
		{"pseudo-version", &debug.BuildInfo{Main: debug.Module{Version: "v0.0.0-20261203084100-2a88836b98ff+dirty"}}, true, "v0.0.0-20261203084100-2a88836b98ff+dirty"},
		{"source tree with VCS", &debug.BuildInfo{Main: debug.Module{Version: "(devel)"}, Settings: vcs}, true, "revision 2a88836b98ff (2026-12-03T08:41:00Z)"},
		{"modified", &debug.BuildInfo{Main: debug.Module{Version: "(devel)"}, Settings: append(slices.Clone(vcs), debug.BuildSetting{Key: "vcs.modified", Value: "true"})}, true, "revision 2a88836b98ff (2026-12-03T08:41:00Z, modified)"},
		{"source tree without VCS", &debug.BuildInfo{Main: debug.Module{Version: "(devel)"}}, true, "(no version: built from a source tree without VCS information)"},
		{"no build information", nil, false, "(no version: built without module information)"},
	} {
		if got := versionOf(tc.bi, tc.ok); got != tc.want {
			t.Errorf("%s: %q, want %q", tc.name, got, tc.want)
		}
	}
}

// helpFlagLine matches the heading of one flag in --help.
var helpFlagLine = regexp.MustCompile(`^  (?:-[a-z], |    )--([a-z-]+)`)

func TestOutputFileIsReplacedAtomically(t *testing.T) {
	dir := t.TempDir()
	outPath := filepath.Join(dir, "out.dot")
	if err := os.WriteFile(outPath, []byte("old contents\n"), 0o600); err != nil {
		t.Fatal(err)
	}
	// A failing run leaves the file as it was.
	code, _, _ := runCmd(t, "graph G { a -- }", "-o", outPath)
	if code != exitBadInput {
		t.Fatalf("exit %d", code)
	}
	if b, _ := os.ReadFile(outPath); string(b) != "old contents\n" {
		t.Fatalf("failed run changed the output file: %q", b)
	}
	// A good run replaces it and keeps its permissions.
	code, out, errs := runCmd(t, "graph G { a -- b }", "-o", outPath)
	if code != exitOK || out != "" {
		t.Fatalf("exit %d, stdout %q, stderr %q", code, out, errs)
	}
	b, _ := os.ReadFile(outPath)
	if !strings.Contains(string(b), `pos="`) {
		t.Fatalf("output file lacks positions: %q", b)
	}
	if fi, _ := os.Stat(outPath); fi.Mode().Perm() != 0o600 {
		t.Errorf("mode %v, want 0600", fi.Mode().Perm())
	}
	entries, _ := os.ReadDir(dir)
	if len(entries) != 1 {
		t.Errorf("temporary files left behind: %v", entries)
	}
}

// TestOutputThroughLinksAndPipes checks that -o keeps what is not a
// regular file: a symbolic link stays a link (the file it names gets the
// output, even when it does not exist yet), and a named pipe stays a pipe
// (the output is written into it, not renamed over it).
func TestOutputThroughLinksAndPipes(t *testing.T) {
	dir := t.TempDir()
	link := filepath.Join(dir, "link.dot")
	if err := os.Symlink("target.dot", link); err != nil {
		t.Skip("no symbolic links here:", err)
	}
	if code, _, errs := runCmd(t, "graph G { a -- b }", "-o", link); code != exitOK {
		t.Fatalf("exit %d: %s", code, errs)
	}
	if fi, err := os.Lstat(link); err != nil || fi.Mode()&os.ModeSymlink == 0 {
		t.Errorf("the link was replaced: %v %v", fi, err)
	}
	if b, err := os.ReadFile(filepath.Join(dir, "target.dot")); err != nil || !strings.Contains(string(b), `pos="`) {
		t.Errorf("the link's file lacks the output: %q %v", b, err)
	}
	pipe := filepath.Join(dir, "pipe")
	if err := syscall.Mkfifo(pipe, 0o600); err != nil {
		t.Skip("no named pipes here:", err)
	}
	// intoPipe runs the command with -o target and returns what a reader
	// of the pipe got.
	intoPipe := func(target string) string {
		got := make(chan []byte)
		go func() {
			b, _ := os.ReadFile(pipe)
			got <- b
		}()
		if code, _, errs := runCmd(t, "graph G { a -- b }", "-o", target); code != exitOK {
			t.Fatalf("exit %d: %s", code, errs)
		}
		return string(<-got)
	}
	if b := intoPipe(pipe); !strings.Contains(b, `pos="`) {
		t.Errorf("the pipe's reader got %q", b)
	}
	if fi, err := os.Lstat(pipe); err != nil || fi.Mode()&os.ModeNamedPipe == 0 {
		t.Errorf("the pipe was replaced: %v %v", fi, err)
	}
	// A link to a pipe, as /dev/stdout or a shell's >(...) is: written
	// into, the link kept.
	toPipe := filepath.Join(dir, "stdout")
	if err := os.Symlink(pipe, toPipe); err != nil {
		t.Fatal(err)
	}
	if b := intoPipe(toPipe); !strings.Contains(b, `pos="`) {
		t.Errorf("the pipe's reader, through a link, got %q", b)
	}
	if fi, err := os.Lstat(toPipe); err != nil || fi.Mode()&os.ModeSymlink == 0 {
		t.Errorf("the link to the pipe was replaced: %v %v", fi, err)
	}
}

func TestRemovedFileListsExactlyTheSetAsideEdges(t *testing.T) {
	dir := t.TempDir()
	rm := filepath.Join(dir, "removed.dot")
	// K3,3 written with a repeated edge and a loop: the pair removed
	// takes its copies with it, the loop never counts.
	in := "digraph U {\n {h1 h2 h3} -> {w g p}\n h1 -> w\n h1 -> h1\n}\n"
	code, out, errs := runCmd(t, in, "-q", "--removed", rm)
	if code != exitOK {
		t.Fatalf("exit %d: %s", code, errs)
	}
	b, err := os.ReadFile(rm)
	if err != nil {
		t.Fatal(err)
	}
	f, err := dotio.Read(b, dotio.ReadOptions{Name: "removed.dot"})
	if err != nil {
		t.Fatalf("removed file does not parse: %v\n%s", err, b)
	}
	if len(f.Graphs) != 1 || !f.Graphs[0].Directed || f.Graphs[0].ID != "U" {
		t.Fatalf("removed file: want one digraph U, got %s", b)
	}
	removed := f.Graphs[0].Edges
	if len(removed) == 0 {
		t.Fatal("K3,3 must lose an edge")
	}
	// The main output still has every edge; dropping the removed ones
	// leaves a planar graph, and adding any one back does not.
	src, _ := dotio.Read([]byte(in), dotio.ReadOptions{Name: "in"})
	g := src.Graphs[0]
	isRemoved := map[[2]string]bool{}
	for _, e := range removed {
		rg := f.Graphs[0]
		isRemoved[[2]string{rg.Nodes[e.From].Name, rg.Nodes[e.To].Name}] = true
	}
	var kept [][2]int32
	for _, e := range g.Edges {
		a, b := g.Nodes[e.From].Name, g.Nodes[e.To].Name
		if !isRemoved[[2]string{a, b}] && !isRemoved[[2]string{b, a}] && e.From != e.To {
			kept = append(kept, [2]int32{e.From, e.To})
		}
	}
	simple, _ := planarize.Simplify(len(g.Nodes), kept)
	if !planarize.IsPlanar(len(g.Nodes), simple) {
		t.Error("kept edges are not planar")
	}
	for _, e := range removed {
		rg := f.Graphs[0]
		u, _ := g.Lookup(rg.Nodes[e.From].Name)
		v, _ := g.Lookup(rg.Nodes[e.To].Name)
		if planarize.IsPlanar(len(g.Nodes), append(append([][2]int32(nil), simple...), [2]int32{int32(u), int32(v)})) {
			t.Errorf("removed edge %v could stay", e)
		}
	}
	if o, err := dotio.Read([]byte(out), dotio.ReadOptions{Name: "out"}); err != nil || len(o.Graphs[0].Edges) != 11 {
		t.Errorf("main output should keep all 11 edges (9, a repeat, a loop): %v\n%s", err, out)
	}
	// A planar graph gives an empty graph in the removed file.
	code, _, _ = runCmd(t, "graph P { a -- b }", "-q", "--removed", rm)
	b, _ = os.ReadFile(rm)
	if code != exitOK || strings.TrimSpace(string(b)) != "graph P {\n}" {
		t.Errorf("planar graph: exit %d, removed file %q", code, b)
	}
}

// TestRemovedFileInInputOrder: the --removed file lists the removed
// edges in input order, one per line, each with its attributes as written
// (README, Non-planar graphs). K7, its 21 edges in a shuffled order each
// tagged with its place, loses 21 - (3*7 - 6) = 6 (Euler's bound,
// SOURCES.md); every line of the file must be the input's line for that
// edge, in the input's order.
func TestRemovedFileInInputOrder(t *testing.T) {
	var pairs [][2]int
	for u := range 7 {
		for v := u + 1; v < 7; v++ {
			pairs = append(pairs, [2]int{u, v})
		}
	}
	rng := rand.New(rand.NewPCG(5, 5))
	rng.Shuffle(len(pairs), func(i, j int) { pairs[i], pairs[j] = pairs[j], pairs[i] })
	var in strings.Builder
	in.WriteString("graph K7 {\n")
	lines := map[string]int{} // an edge's line to its place in the input
	for i, p := range pairs {
		line := fmt.Sprintf("n%d -- n%d [place=%d]", p[0], p[1], i)
		lines[line] = i
		in.WriteString("\t" + line + "\n")
	}
	in.WriteString("}\n")
	rm := filepath.Join(t.TempDir(), "removed.dot")
	if code, _, errs := runCmd(t, in.String(), "-q", "--removed", rm); code != exitOK {
		t.Fatalf("exit %d: %s", code, errs)
	}
	b, err := os.ReadFile(rm)
	if err != nil {
		t.Fatal(err)
	}
	got := strings.Split(strings.TrimSpace(string(b)), "\n")
	if len(got) != 6+2 || got[0] != "graph K7 {" || got[len(got)-1] != "}" {
		t.Fatalf("want graph K7 with 6 edge lines, got\n%s", b)
	}
	last := -1
	for _, line := range got[1 : len(got)-1] {
		place, ok := lines[strings.TrimSpace(line)]
		if !ok {
			t.Errorf("line %q is no input edge line", line)
			continue
		}
		if place <= last {
			t.Errorf("line %q (input place %d) comes after place %d", line, place, last)
		}
		last = place
	}
}

func TestSameInputSameBytes(t *testing.T) {
	in, _ := os.ReadFile("../../examples/tram-network.dot")
	_, first, _ := runCmd(t, string(in), "-q")
	for range 3 {
		if _, again, _ := runCmd(t, string(in), "-q"); again != first {
			t.Fatal("output differs between runs")
		}
	}
	dir := t.TempDir()
	p := filepath.Join(dir, "tram.dot")
	os.WriteFile(p, in, 0o644)
	if _, fromFile, _ := runCmd(t, "", "-q", p); fromFile != first {
		t.Fatal("output differs between file and standard input")
	}
}

// TestConvexFallbackNamed checks that --method convex says on standard
// error which components it could not draw convex: a 4-cycle with a chord
// (2-connected, not 3-connected) and a 6-cycle fall back, K4 (3-connected)
// does not; each fallback is named by its first node.
func TestConvexFallbackNamed(t *testing.T) {
	src := "graph two {\n a -- b -- c -- d -- a; a -- c\n k1 -- k2 -- k3 -- k4 -- k1 -- k3; k2 -- k4\n r1 -- r2 -- r3 -- r4 -- r5 -- r6 -- r1\n}\n"
	code, out, errs := runCmd(t, src, "--method", "convex")
	if code != exitOK || out == "" {
		t.Fatalf("exit %d, stderr %q", code, errs)
	}
	want := `gridwood: <stdin>:1:1: graph "two": 2 of 3 components are not 3-connected and were drawn with the schnyder method: the one with a, the one with r1` + "\n"
	if errs != want {
		t.Errorf("stderr\n%q\nwant\n%q", errs, want)
	}
	if _, _, errs := runCmd(t, src, "--method", "convex", "-q"); errs != "" {
		t.Errorf("-q: stderr %q", errs)
	}
}

// TestFailedRunWritesNoFile checks that a run that fails writes none of
// its files: the side files (--report, --svg, --removed, --explain) are
// not created or replaced when the run fails late (an --outer no graph
// satisfies) or when the main output cannot be written.
func TestFailedRunWritesNoFile(t *testing.T) {
	const k5 = "graph K5 { a -- b -- c -- d -- e -- a; a -- c -- e -- b -- d -- a }"
	dir := t.TempDir()
	side := map[string]string{}
	for _, f := range []string{"report", "svg", "removed", "explain"} {
		side[f] = filepath.Join(dir, f+".out")
	}
	args := func(extra ...string) []string {
		a := []string{"-q"}
		for f, p := range side {
			a = append(a, "--"+f, p)
		}
		return append(a, extra...)
	}
	// Late failure: no graph has the --outer nodes. Nothing is created.
	if code, out, errs := runCmd(t, k5, args("--outer", "nope,nothere")...); code != exitBadInput || out != "" || errs == "" {
		t.Fatalf("--outer nope: exit %d, stdout %q, stderr %q", code, out, errs)
	}
	for f, p := range side {
		if _, err := os.Stat(p); !os.IsNotExist(err) {
			t.Errorf("--%s file exists after a failed run (%v)", f, err)
		}
	}
	// Existing side files stay as they were when -o cannot be written.
	for _, p := range side {
		if err := os.WriteFile(p, []byte("old\n"), 0o644); err != nil {
			t.Fatal(err)
		}
	}
	if code, _, _ := runCmd(t, k5, args("-o", filepath.Join(dir, "missing-dir", "out.dot"))...); code != exitBadInput {
		t.Fatalf("-o into a missing directory: exit %d", code)
	}
	for f, p := range side {
		if b, _ := os.ReadFile(p); string(b) != "old\n" {
			t.Errorf("--%s file changed by a failed run: %q", f, b)
		}
	}
	if entries, _ := os.ReadDir(dir); len(entries) != len(side) {
		t.Errorf("%d entries in the directory, want the %d side files: temporaries left behind?", len(entries), len(side))
	}
	// And a good run writes them all.
	if code, _, errs := runCmd(t, k5, args("-o", filepath.Join(dir, "out.dot"))...); code != exitOK {
		t.Fatalf("exit %d: %s", code, errs)
	}
	for f, p := range side {
		if b, _ := os.ReadFile(p); string(b) == "old\n" || len(b) == 0 {
			t.Errorf("--%s file not written by a good run: %q", f, b)
		}
	}
}

// TestEffortHint: when the removal is not proved the fewest and the graph
// is small enough for more search to be cheap (hintMaxEdges edges as
// written), standard error suggests --effort; not when it is proved, not
// when the effort asked for is already that high, not for bigger graphs,
// and not under -q. The random graphs are the determinism test's.
func TestEffortHint(t *testing.T) {
	hint := fmt.Sprintf("; not proved the fewest: --effort %d may remove fewer\n", hintEffort)
	small := randomNonPlanarDOT(3, 50, 150)
	rep := filepath.Join(t.TempDir(), "rep.json")
	code, _, errs := runCmd(t, small, "--report", rep)
	b, _ := os.ReadFile(rep)
	if code != exitOK || !strings.Contains(string(b), `"removal_optimal": false`) {
		t.Fatalf("G(50, 150): exit %d, %s; report %.300s", code, errs, b)
	}
	if !strings.HasSuffix(errs, hint) || strings.Count(errs, "--effort") != 1 {
		t.Errorf("G(50, 150): stderr %q, want one hint, at the end: %q", errs, hint)
	}
	for _, tc := range []struct {
		name, in string
		args     []string
	}{
		{"proved", k5Text, nil},
		{"effort given", small, []string{"--effort", strconv.Itoa(hintEffort)}},
		{"quiet", small, []string{"-q"}},
		{"over the size rule", randomNonPlanarDOT(3, 400, hintMaxEdges+200), []string{"--report", rep}},
	} {
		os.Remove(rep)
		code, _, errs := runCmd(t, tc.in, tc.args...)
		if b, _ := os.ReadFile(rep); len(tc.args) == 2 && tc.args[0] == "--report" && !strings.Contains(string(b), `"removal_optimal": false`) {
			t.Errorf("%s: the removal was proved the fewest; the case needs one that is not", tc.name)
		}
		if code != exitOK || strings.Contains(errs, "--effort") {
			t.Errorf("%s: exit %d, stderr %q: want no hint", tc.name, code, errs)
		}
		if tc.name != "quiet" && !strings.Contains(errs, "edges removed to make it planar") {
			t.Errorf("%s: stderr %q lacks the removal line", tc.name, errs)
		}
	}
}
