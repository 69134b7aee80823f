package main

import (
	"bufio"
	"bytes"
	"fmt"
	"math/rand/v2"
	"os"
	"path/filepath"
	"regexp"
	"strconv"
	"strings"
	"testing"

	"github.com/gridwood/gridwood/dotio"
	"github.com/gridwood/gridwood/place/geomcheck"
)

// operandProduct returns `graph {` / `{a0 ... an-1} -- {b0 ... bm-1}` / `}`
// and the column of the edge operator on line 2.
func operandProduct(n, m int) ([]byte, int) {
	var b bytes.Buffer
	b.WriteString("graph {\n{")
	for i := range n {
		fmt.Fprintf(&b, " a%d", i)
	}
	b.WriteString(" } ")
	col := b.Len() - len("graph {\n") + 1
	b.WriteString("-- {")
	for i := range m {
		fmt.Fprintf(&b, " b%d", i)
	}
	b.WriteString(" }\n}\n")
	return b.Bytes(), col
}

// wantOneInputError checks a failed run: exit status 2, nothing on
// standard output, and exactly the line `gridwood: NAME:LINE:COL: ...`
// on standard error, the message containing has.
func wantOneInputError(t *testing.T, code int, stdout, stderr []byte, prefix, has string) {
	t.Helper()
	if code != exitBadInput {
		t.Errorf("exit %d, want %d; stderr %q", code, exitBadInput, stderr)
	}
	if len(stdout) > 0 {
		t.Errorf("failed run wrote %d bytes to standard output", len(stdout))
	}
	msg := string(stderr)
	if !strings.HasPrefix(msg, prefix) || !strings.HasSuffix(msg, "\n") || strings.Count(msg, "\n") != 1 {
		t.Errorf("stderr %q: want one line starting %q", msg, prefix)
	}
	if !strings.Contains(msg, has) {
		t.Errorf("stderr %q lacks %q", msg, has)
	}
}

func TestHostileOperandProductRefused(t *testing.T) {
	src, col := operandProduct(3000, 3000)
	code, out, errs, err := runInProcess(src)
	if err != nil {
		t.Fatal(err)
	}
	wantOneInputError(t, code, out, errs, fmt.Sprintf("gridwood: <stdin>:2:%d: ", col),
		"edge statement expands to 9000000 edges, more than the limit of 1000000 (raise it with --max-expansion)")
}

// BenchmarkOperandProductRefused measures how fast the 3000 x 3000 operand
// product is refused (the refusal must not build the edges first).
func BenchmarkOperandProductRefused(b *testing.B) {
	src, _ := operandProduct(3000, 3000)
	for b.Loop() {
		if code, _, _, _ := runInProcess(src); code != exitBadInput {
			b.Fatalf("exit %d", code)
		}
	}
}

// manyProducts returns 1001 statements {10 nodes} -- {100 nodes}: 1,001,000
// edges in total, above the default cap of 1,000,000, among only 110 nodes
// (the layout is quick: repeats count once).
func manyProducts() []byte {
	var left, right strings.Builder
	for i := range 10 {
		fmt.Fprintf(&left, " l%d", i)
	}
	for i := range 100 {
		fmt.Fprintf(&right, " r%d", i)
	}
	var b bytes.Buffer
	b.WriteString("graph {\n")
	for range 1001 {
		fmt.Fprintf(&b, "{%s } -- {%s }\n", left.String(), right.String())
	}
	b.WriteString("}\n")
	return b.Bytes()
}

func TestHostileMaxExpansionFlag(t *testing.T) {
	src := manyProducts()
	const total = 1001 * 1000
	// The default cap counts all statements of the file.
	code, out, errs, err := runInProcess(src)
	if err != nil {
		t.Fatal(err)
	}
	wantOneInputError(t, code, out, errs, "gridwood: <stdin>:1002:", "expand to 1001000 edges in total, more than the limit of 1000000 (raise it with --max-expansion)")
	// One below the total is refused, the total itself and no limit are not.
	code, out, errs, _ = runInProcess(src, "-q", "--max-expansion", strconv.Itoa(total-1))
	wantOneInputError(t, code, out, errs, "gridwood: <stdin>:1002:", "--max-expansion")
	for _, limit := range []string{strconv.Itoa(total), "-1"} {
		code, out, errs, err := runInProcess(src, "-q", "--max-expansion", limit)
		if err != nil || code != exitOK {
			t.Fatalf("--max-expansion %s: exit %d %v %s", limit, code, err, errs)
		}
		f, err := dotio.Read(out, dotio.ReadOptions{Name: "out", MaxExpansion: -1})
		if err != nil {
			t.Fatalf("--max-expansion %s: output: %v", limit, err)
		}
		if g := f.Graphs[0]; len(g.Edges) != total || len(g.Nodes) != 110 {
			t.Errorf("--max-expansion %s: output has %d nodes and %d edges, want 110 and %d", limit, len(g.Nodes), len(g.Edges), total)
		}
	}
}

// nested returns a graph whose statement (or edge operand, with prefix
// "x -- ") is `{` depth times, a -- b, `}` depth times.
func nested(depth int, prefix string) []byte {
	var b bytes.Buffer
	b.WriteString("graph {\n" + prefix)
	b.WriteString(strings.Repeat("{", depth))
	b.WriteString("a -- b")
	b.WriteString(strings.Repeat("}", depth))
	b.WriteString("\n}\n")
	return b.Bytes()
}

// TestHostileDeepNesting runs 100,000 nested subgraphs in a subprocess (a
// stack overflow would kill the test binary rather than fail a test): the
// command must finish with exit 0 or fail cleanly with exit 2. When it
// succeeds, the output is checked like any other (lossless_test.go).
func TestHostileDeepNesting(t *testing.T) {
	for _, prefix := range []string{"", "x -- "} {
		src := nested(100_000, prefix)
		res := runSubprocess(t, src, nil, "-q")
		switch res.code {
		case exitOK:
			fc := filterCheck{dir: t.TempDir()}
			r := fc.check(src)
			if r.code != exitOK || len(r.problems) > 0 {
				t.Errorf("%q: in-process exit %d: %v", prefix, r.code, r.problems)
			}
			if !bytes.Equal(r.stdout, res.stdout) {
				t.Errorf("%q: in-process and subprocess outputs differ", prefix)
			}
		case exitBadInput:
			wantOneInputError(t, res.code, res.stdout, res.stderr, "gridwood: <stdin>:", "")
		default:
			t.Errorf("%q: %s; stderr (first 2000 bytes): %.2000s", prefix, res.state, res.stderr)
		}
	}
}

func TestHostileBadInput(t *testing.T) {
	garbage := make([]byte, 4096)
	rng := rand.New(rand.NewPCG(7, 7))
	for i := range garbage {
		garbage[i] = byte(rng.Uint32())
	}
	for _, tc := range []struct {
		name, src string
		at        string // "LINE:COL", or "" when any position will do
		has       string
	}{
		{"invalid UTF-8 in a quoted ID", "graph {\n  \"a\xffb\" -- c\n}\n", "2:5", "invalid UTF-8"},
		{"invalid UTF-8 in an unquoted ID", "graph {\n  a\xffb -- c\n}\n", "2:4", "invalid UTF-8"},
		{"invalid UTF-8 in an HTML ID", "graph { <a\xc0> }", "1:11", "invalid UTF-8"},
		{"NUL in an ID", "graph { a\x00b -- c }", "1:10", "NUL"},
		{"NUL in a quoted ID", "graph { \"a\x00b\" }", "1:11", "NUL"},
		{"NUL after the graph", "graph { a -- b }\x00", "1:17", "NUL"},
		{"-- in a digraph", "digraph G {\n a -- b\n}\n", "2:4", "'--' in a digraph"},
		{"-> in a graph", "graph G {\n a -> b\n}\n", "2:4", "'->' in an undirected graph"},
		{"-> in a subgraph of a graph", "graph G {\n subgraph s { a -> b }\n}\n", "2:17", "'->'"},
		{"empty input", "", "1:1", "no graph"},
		{"blanks only", " \n\t\n", "", "no graph"},
		{"comment only", "// nothing here\n", "", "no graph"},
		{"not DOT", "hello, world\n", "1:1", "syntax error"},
		{"lone {", "{", "1:1", "syntax error"},
		{"lone } after a graph", "graph {}\n}", "2:1", "syntax error"},
		{"unterminated graph", "graph {\n a -- b\n", "", "end of input"},
		{"unterminated string", "graph { \"abc }\n", "1:9", ""},
		{"unterminated comment", "graph { /* a }\n", "1:9", ""},
		{"PNG header", "\x89PNG\r\n\x1a\n\x00\x00\x00\rIHDR", "1:1", ""},
		{"binary garbage", string(garbage), "", ""},
		{"UTF-8 garbage", "€€€ ☃", "1:1", ""},
		// Found by FuzzFilter: the message quotes the compass point as
		// written, line break and all, so it spans two lines.
		{"line break in a quoted compass point", "graph { a:p:\"\n\" }", "1:13", "invalid compass point"},
	} {
		t.Run(tc.name, func(t *testing.T) {
			code, out, errs, err := runInProcess([]byte(tc.src), "--removed", filepath.Join(t.TempDir(), "r.dot"))
			if err != nil {
				t.Fatal(err)
			}
			prefix := "gridwood: <stdin>:"
			if tc.at != "" {
				prefix += tc.at + ": "
			}
			wantOneInputError(t, code, out, errs, prefix, tc.has)
			if err := checkInputMessage(errs, []byte(tc.src)); err != nil {
				t.Error(err)
			}
		})
	}
	// A file is named in the message.
	path := filepath.Join(t.TempDir(), "bad.dot")
	if err := os.WriteFile(path, []byte("graph {\n a -> b\n}\n"), 0o644); err != nil {
		t.Fatal(err)
	}
	code, out, errs, _ := runInProcess(nil, path)
	wantOneInputError(t, code, out, errs, "gridwood: "+path+":2:4: ", "'->'")
}

// TestHostileHugeGrid lays out a 2236 x 2236 grid, 9,994,920 edges given as
// `a_i_j -- a_i_j1` lines, in a subprocess. It runs only with
// GRIDWOOD_HUGE=1 (minutes and gigabytes). It must either succeed with
// valid output or fail with exit 2 and a clear message.
func TestHostileHugeGrid(t *testing.T) {
	if os.Getenv("GRIDWOOD_HUGE") != "1" {
		t.Skip("set GRIDWOOD_HUGE=1 to run the 10-million-edge input")
	}
	const side = 2236
	dir := t.TempDir()
	in := filepath.Join(dir, "grid.dot")
	if err := writeGrid(in, side); err != nil {
		t.Fatal(err)
	}
	outPath := filepath.Join(dir, "out.dot")
	res := runSubprocess(t, nil, nil, "-q", "-o", outPath, in)
	switch res.code {
	case exitOK:
	case exitBadInput:
		msg := string(res.stderr)
		if !strings.HasPrefix(msg, "gridwood: ") || strings.Count(msg, "\n") != 1 {
			t.Fatalf("exit 2 without one clear message: %q", msg)
		}
		t.Logf("refused cleanly: %s", msg)
		return
	default:
		t.Fatalf("%s: %.2000s", res.state, res.stderr)
	}
	if err := checkGridOutput(in, outPath, side); err != nil {
		t.Fatal(err)
	}
}

func gridName(i, j int) string { return "a_" + strconv.Itoa(i) + "_" + strconv.Itoa(j) }

// gridEdges calls f for every edge of the side x side grid, row by row.
func gridEdges(side int, f func(i, j, i2, j2 int)) {
	for i := range side {
		for j := range side {
			if j+1 < side {
				f(i, j, i, j+1)
			}
			if i+1 < side {
				f(i, j, i+1, j)
			}
		}
	}
}

func writeGrid(path string, side int) error {
	fh, err := os.Create(path)
	if err != nil {
		return err
	}
	w := bufio.NewWriterSize(fh, 1<<20)
	w.WriteString("graph grid {\n")
	gridEdges(side, func(i, j, i2, j2 int) {
		w.WriteString(gridName(i, j) + " -- " + gridName(i2, j2) + "\n")
	})
	w.WriteString("}\n")
	if err := w.Flush(); err != nil {
		return err
	}
	return fh.Close()
}

var posLine = regexp.MustCompile(`^\ta_([0-9]+)_([0-9]+) \[pos="(-?[0-9]+),(-?[0-9]+)"\]$`)

// checkGridOutput reads the output line by line (a full parse would need
// many gigabytes): the edge statements as in the input, then one integral
// pos per node in order of first mention, then bb; the drawing of the grid
// at those positions passes geomcheck.
func checkGridOutput(inPath, outPath string, side int) error {
	fh, err := os.Open(outPath)
	if err != nil {
		return err
	}
	defer fh.Close()
	sc := bufio.NewScanner(fh)
	sc.Buffer(make([]byte, 1<<16), 1<<20)
	next := func() string {
		if !sc.Scan() {
			return "<end of output>"
		}
		return sc.Text()
	}
	if l := next(); l != "graph grid {" {
		return fmt.Errorf("first line %q", l)
	}
	var bad error
	var order []int32 // node of each first mention, as i*side+j
	seen := make([]bool, side*side)
	gridEdges(side, func(i, j, i2, j2 int) {
		if bad != nil {
			return
		}
		want := "\t" + gridName(i, j) + " -- " + gridName(i2, j2)
		if l := next(); l != want {
			bad = fmt.Errorf("edge line %q, want %q", l, want)
		}
		for _, v := range []int{i*side + j, i2*side + j2} {
			if !seen[v] {
				seen[v] = true
				order = append(order, int32(v))
			}
		}
	})
	if bad != nil {
		return bad
	}
	pts := make([]geomcheck.Point, side*side)
	for k, v := range order {
		l := next()
		m := posLine.FindStringSubmatch(l)
		if m == nil {
			return fmt.Errorf("pos line %d is %q", k, l)
		}
		i, _ := strconv.Atoi(m[1])
		j, _ := strconv.Atoi(m[2])
		if i*side+j != int(v) {
			return fmt.Errorf("pos line %d is for a_%d_%d, want node %d", k, i, j, v)
		}
		x, _ := strconv.ParseInt(m[3], 10, 64)
		y, _ := strconv.ParseInt(m[4], 10, 64)
		pts[v] = geomcheck.Point{X: x, Y: y}
	}
	if l := next(); !regexp.MustCompile(`^\tgraph \[bb="0,0,[0-9]+,[0-9]+"\]$`).MatchString(l) {
		return fmt.Errorf("bb line %q", l)
	}
	if l := next(); l != "}" {
		return fmt.Errorf("last line %q", l)
	}
	if l := next(); l != "<end of output>" {
		return fmt.Errorf("trailing line %q", l)
	}
	var edges [][2]int32
	gridEdges(side, func(i, j, i2, j2 int) {
		edges = append(edges, [2]int32{int32(i*side + j), int32(i2*side + j2)})
	})
	probs, err := geomcheck.First(pts, edges, 10)
	if err != nil {
		return err
	}
	if len(probs) > 0 {
		return fmt.Errorf("drawing problems: %v", probs)
	}
	return nil
}
