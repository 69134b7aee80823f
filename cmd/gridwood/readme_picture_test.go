package main

import (
	"bytes"
	"os"
	"path/filepath"
	"strings"
	"testing"
)

// The README shows a picture made by the command; this file keeps it from
// going stale.
const (
	readmePicture      = "../../docs/campus-fibre.svg"
	readmePictureInput = "../../examples/campus-fibre.dot"
	// updatePictureEnv, set to 1, rewrites readmePicture instead of
	// comparing it (an environment variable rather than a test flag, so
	// that it cannot clash with another package's -update under
	// go test ./...).
	updatePictureEnv = "GRIDWOOD_UPDATE_PICTURE"
)

// TestReadmePicture draws examples/campus-fibre.dot as the README says
// (gridwood --svg FILE), into a temporary directory, and wants the stored
// docs/campus-fibre.svg byte for byte; the README must show that file.
func TestReadmePicture(t *testing.T) {
	svgPath := filepath.Join(t.TempDir(), "campus-fibre.svg")
	code, out, errs := runCmd(t, "", "-q", "--svg", svgPath, readmePictureInput)
	if code != exitOK {
		t.Fatalf("gridwood --svg: exit %d: %s", code, errs)
	}
	if !strings.Contains(out, "pos=") {
		t.Fatalf("gridwood --svg wrote no positioned DOT: %q", out)
	}
	got, err := os.ReadFile(svgPath)
	if err != nil {
		t.Fatal(err)
	}
	if !bytes.HasPrefix(got, []byte("<?xml")) || !bytes.Contains(got, []byte("<svg")) {
		t.Fatalf("--svg wrote no SVG document: %.80q", got)
	}
	if os.Getenv(updatePictureEnv) == "1" {
		if err := os.WriteFile(readmePicture, got, 0o644); err != nil {
			t.Fatal(err)
		}
		t.Logf("rewrote %s (%d bytes)", readmePicture, len(got))
	} else {
		stored, err := os.ReadFile(readmePicture)
		if err != nil {
			t.Fatalf("%v; make it with %s=1 go test -run ReadmePicture ./cmd/gridwood/", err, updatePictureEnv)
		}
		if !bytes.Equal(stored, got) {
			line := 1 + bytes.Count(got[:firstDifference(stored, got)], []byte("\n"))
			t.Errorf("docs/campus-fibre.svg is stale: gridwood now draws examples/campus-fibre.dot differently (first difference on line %d; stored %d bytes, drawn %d).\n"+
				"If the new drawing is intended, rewrite it with\n\t%s=1 go test -run ReadmePicture ./cmd/gridwood/\nand commit it with the change that caused it.",
				line, len(stored), len(got), updatePictureEnv)
		}
	}

	readme, err := os.ReadFile("../../README.md")
	if err != nil {
		t.Fatal(err)
	}
	if !bytes.Contains(readme, []byte("](docs/campus-fibre.svg)")) {
		t.Error("README.md shows no picture docs/campus-fibre.svg (a Markdown image link ![...](docs/campus-fibre.svg))")
	}
}

// firstDifference is the index of the first byte where a and b differ, or
// the length of the shorter when one is a prefix of the other.
func firstDifference(a, b []byte) int {
	n := min(len(a), len(b))
	for i := range n {
		if a[i] != b[i] {
			return i
		}
	}
	return n
}
