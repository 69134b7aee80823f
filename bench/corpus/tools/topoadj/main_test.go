package main

import (
	"io"
	"os"
	"path/filepath"
	"strings"
	"testing"
)

// The expected graphs in testdata/*.golden follow by hand from the rule
// in the package comment applied to testdata/strip.json: West and Middle
// share arc 0, Middle and East arc 1 (East uses it reversed, -2), East's
// second polygon and the region without an id arc 8 (used as -9); Island
// shares nothing. The states collection repeats the first three regions
// with real state FIPS codes.
func TestRun(t *testing.T) {
	tests := []struct {
		name   string
		input  string
		opt    options
		golden string
	}{
		{
			name:   "ids and names",
			input:  "strip.json",
			opt:    options{object: "regions", node: "id", label: "name", graph: "regions"},
			golden: "regions.golden",
		},
		{
			name:   "isolated dropped",
			input:  "strip.json",
			opt:    options{object: "regions", node: "id", label: "name", dropIsolated: true, graph: "regions"},
			golden: "regions-connected.golden",
		},
		{
			name:   "prefix excluded, no labels",
			input:  "strip.json",
			opt:    options{object: "regions", exclude: []string{"1"}, node: "id", label: "none", graph: "east"},
			golden: "regions-east.golden",
		},
		{
			name:   "postal abbreviations",
			input:  "strip.json",
			opt:    options{object: "states", node: "usps", label: "name", graph: "states"},
			golden: "states.golden",
		},
		{
			name:   "county labels",
			input:  "strip.json",
			opt:    options{object: "states", node: "id", label: "county", graph: "states"},
			golden: "states-county.golden",
		},
	}
	for _, test := range tests {
		t.Run(test.name, func(t *testing.T) {
			out := filepath.Join(t.TempDir(), "out.dot")
			if err := run(filepath.Join("testdata", test.input), out, test.opt, io.Discard); err != nil {
				t.Fatalf("run: %v", err)
			}
			got, err := os.ReadFile(out)
			if err != nil {
				t.Fatal(err)
			}
			want, err := os.ReadFile(filepath.Join("testdata", test.golden))
			if err != nil {
				t.Fatal(err)
			}
			if string(got) != string(want) {
				t.Errorf("got\n%s\nwant\n%s", got, want)
			}
		})
	}
}

// TestRunErrors checks that bad input is refused with a message naming the
// fault and that an existing output file is left as it was.
func TestRunErrors(t *testing.T) {
	tests := []struct {
		name  string
		input string
		opt   options
		want  string
	}{
		{"state table disagrees", "wrong-state.json", options{object: "states", node: "usps", label: "name"}, `state 01 is "Georgia" in the topology but "Alabama" in the table`},
		{"arc out of range", "bad-arc.json", options{object: "regions", node: "id", label: "none"}, "arc index 2 out of range (1 arcs)"},
		{"duplicate node name", "twice.json", options{object: "regions", node: "id", label: "none"}, `two geometries named "1"`},
		{"missing object", "strip.json", options{object: "rivers", node: "id", label: "none"}, `no object "rivers"`},
		{"unknown state code", "strip.json", options{object: "regions", node: "usps", label: "none"}, `no postal abbreviation for state FIPS "7"`},
	}
	for _, test := range tests {
		t.Run(test.name, func(t *testing.T) {
			out := filepath.Join(t.TempDir(), "out.dot")
			const before = "earlier contents\n"
			if err := os.WriteFile(out, []byte(before), 0o644); err != nil {
				t.Fatal(err)
			}
			err := run(filepath.Join("testdata", test.input), out, test.opt, io.Discard)
			if err == nil {
				t.Fatal("run succeeded, want an error")
			}
			if !strings.Contains(err.Error(), test.want) {
				t.Errorf("error %q does not say %q", err, test.want)
			}
			got, rerr := os.ReadFile(out)
			if rerr != nil {
				t.Fatal(rerr)
			}
			if string(got) != before {
				t.Errorf("output file changed to %q", got)
			}
		})
	}
}
