package main

import (
	"bytes"
	"crypto/sha256"
	"fmt"
	"os"
	"path/filepath"
	"strings"
	"testing"

	"github.com/gridwood/gridwood/internal/graphgen"
)

// layoutDigests holds, for every input and flag set of TestLayoutDigests,
// the SHA-256 of the command's standard output: what the command wrote
// when the file was last rewritten. A refactoring must leave every line as
// it is; a change that means to draw differently rewrites the file with
// updateDigestsEnv=1 and says so in its commit.
const (
	layoutDigests    = "testdata/layout-digests.txt"
	updateDigestsEnv = "GRIDWOOD_UPDATE_DIGESTS"
)

// TestLayoutDigests lays out the shipped examples, the small real graphs
// of bench/corpus and generated graphs of each family the layout treats
// apart (grid, tree, random planar, triangulation, non-planar G(n, m)),
// with the default drawing, --grid, --unit 40 and --method convex, and
// compares each output's digest with the stored one: output stays byte
// for byte the same unless a change means it to differ.
func TestLayoutDigests(t *testing.T) {
	type input struct {
		name string
		dot  []byte
	}
	var inputs []input
	files, err := filepath.Glob("../../examples/*.dot")
	if err != nil {
		t.Fatal(err)
	}
	for _, name := range []string{"deb-deps-curl", "deb-deps-python3", "us-states", "world-countries"} {
		files = append(files, "../../bench/corpus/"+name+".dot")
	}
	for _, f := range files {
		src, err := os.ReadFile(f)
		if err != nil {
			t.Fatal(err)
		}
		inputs = append(inputs, input{strings.TrimPrefix(f, "../../"), src})
	}
	for _, g := range []graphgen.Graph{
		graphgen.Grid(10, 10), graphgen.RandomTree(300, 2), graphgen.RandomPlanar(200, 0.6, 1),
		graphgen.RandomTriangulation(100, 1), graphgen.RandomGnm(60, 150, 1),
	} {
		var buf bytes.Buffer
		if err := graphgen.WriteDOT(&buf, g); err != nil {
			t.Fatal(err)
		}
		inputs = append(inputs, input{"generated/" + g.Name, buf.Bytes()})
	}
	var got strings.Builder
	for _, in := range inputs {
		for _, flags := range [][]string{nil, {"--grid"}, {"--unit", "40"}, {"--method", "convex"}} {
			code, out, errs := runCmd(t, string(in.dot), append(append([]string{"-q"}, flags...), "-")...)
			if code != exitOK {
				t.Fatalf("%s %v: exit %d: %s", in.name, flags, code, errs)
			}
			fmt.Fprintf(&got, "%s\t%s\t%d\t%x\n", in.name, strings.Join(flags, " "), code, sha256.Sum256([]byte(out)))
		}
	}
	if os.Getenv(updateDigestsEnv) == "1" {
		if err := os.WriteFile(layoutDigests, []byte(got.String()), 0o644); err != nil {
			t.Fatal(err)
		}
		t.Logf("rewrote %s", layoutDigests)
		return
	}
	stored, err := os.ReadFile(layoutDigests)
	if err != nil {
		t.Fatalf("%v; make it with %s=1 go test -run LayoutDigests ./cmd/gridwood/", err, updateDigestsEnv)
	}
	want := strings.Split(strings.TrimSpace(string(stored)), "\n")
	have := strings.Split(strings.TrimSpace(got.String()), "\n")
	if len(want) != len(have) {
		t.Fatalf("%d digests stored, %d made: rewrite %s with %s=1", len(want), len(have), layoutDigests, updateDigestsEnv)
	}
	for i := range want {
		if want[i] != have[i] {
			t.Errorf("output changed:\n\tstored %s\n\tnow    %s", want[i], have[i])
		}
	}
	if t.Failed() {
		t.Logf("if the new drawings are intended, rewrite the digests with\n\t%s=1 go test -run LayoutDigests ./cmd/gridwood/\nand commit them with the change that caused them", updateDigestsEnv)
	}
}
