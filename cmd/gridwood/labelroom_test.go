package main

import (
	"fmt"
	"math"
	"testing"

	"gonum.org/v1/gonum/graph/formats/dot"
)

// TestEdgeLabelsGetRoom lays out a path of five nodes twice, once with a
// long label on its middle edge, and checks that the labelled edge comes
// out longer by at least the label's width (README, Readable drawing: a
// labelled edge's ideal length grows by the label's longer side and the
// gap). A label of 24 characters at 14 points is 24 x 0.6 x 14 = 201.6
// points wide by the sizing rule (SOURCES.md).
func TestEdgeLabelsGetRoom(t *testing.T) {
	length := func(label string) float64 {
		src := fmt.Sprintf("graph g { a -- b; b -- c [label=%q]; c -- d; d -- e }", label)
		code, out, errs := runCmd(t, src, "-q")
		if code != exitOK {
			t.Fatalf("exit %d: %s", code, errs)
		}
		f, err := dot.ParseBytes([]byte(out))
		if err != nil {
			t.Fatal(err)
		}
		pos := positions(t, f.Graphs[0])
		b, c := pos["b"], pos["c"]
		return math.Hypot(float64(b[0]-c[0]), float64(b[1]-c[1]))
	}
	plain, labelled := length(""), length("backbone fibre, 48 cores")
	t.Logf("middle edge %.0f points without a label, %.0f with", plain, labelled)
	if labelled < plain+201 {
		t.Errorf("labelled edge %.0f points, want at least %.0f (unlabelled %.0f plus the label's width)", labelled, plain+201, plain)
	}
}
