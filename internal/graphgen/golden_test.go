package graphgen

import (
	"flag"
	"fmt"
	"os"
	"path/filepath"
	"strings"
	"testing"
)

var update = flag.Bool("update", false, "rewrite testdata/golden.txt")

// TestGolden pins the exact output of small instances, so that any change
// to the construction or to the order in which random numbers are drawn
// (which would silently change every seeded test in the project) shows up
// in review. Correctness is checked by the other tests; this file only
// records what the generators produced when it was written (regenerate with
// go test -update).
func TestGolden(t *testing.T) {
	graphs := []Graph{
		NestedTriangles(3),
		NestedTrianglesPlain(2),
		TriangulatedGrid(2, 3),
		Petersen(),
		Icosahedron(),
		RandomTree(8, 1),
		RandomGnm(7, 9, 1),
		RandomGnm(6, 12, 1),
		RandomTriangulation(9, 1),
		RandomPlanar(9, 0.5, 1),
		PlanarPlusExtra(8, 3, 1),
		Relabel(Cycle(6), 1),
	}
	var b strings.Builder
	for _, g := range graphs {
		fmt.Fprintf(&b, "%s %d", g.Name, g.N)
		for _, e := range g.Edges {
			fmt.Fprintf(&b, " %d-%d", e[0], e[1])
		}
		b.WriteByte('\n')
	}
	path := filepath.Join("testdata", "golden.txt")
	if *update {
		if err := os.WriteFile(path, []byte(b.String()), 0o644); err != nil {
			t.Fatal(err)
		}
	}
	want, err := os.ReadFile(path)
	if err != nil {
		t.Fatal(err)
	}
	got := strings.Split(b.String(), "\n")
	if b.String() == string(want) {
		return
	}
	if len(got) != len(strings.Split(string(want), "\n")) {
		t.Errorf("%d lines, golden has %d", len(got), len(strings.Split(string(want), "\n")))
	}
	for i, line := range strings.Split(string(want), "\n") {
		if i >= len(got) || got[i] != line {
			t.Errorf("line %d:\n got %q\nwant %q", i+1, got[min(i, len(got)-1)], line)
		}
	}
}
