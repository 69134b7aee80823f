package main

import (
	"os"
	"os/exec"
	"path/filepath"
	"strings"
	"testing"
	"time"
)

// TestExamplesMakefile runs the documentation-build example: one make lays
// out every example (DOT, SVG, removed edges), a second finds nothing to do
// (make -q succeeds), touching one input rebuilds exactly that one, and make
// check finds every drawing clean.
func TestExamplesMakefile(t *testing.T) {
	if testing.Short() {
		t.Skip("builds the command")
	}
	if _, err := exec.LookPath("make"); err != nil {
		t.Skip("make is not installed")
	}
	out := t.TempDir()
	mk := func(args ...string) (string, error) {
		cmd := exec.Command("make", append([]string{"-C", "../../examples", "OUT=" + out}, args...)...)
		b, err := cmd.CombinedOutput()
		return string(b), err
	}
	if msg, err := mk(); err != nil {
		t.Fatalf("make: %v\n%s", err, msg)
	}
	inputs, _ := filepath.Glob("../../examples/*.dot")
	if len(inputs) == 0 {
		t.Fatal("no examples")
	}
	for _, in := range inputs {
		name := strings.TrimSuffix(filepath.Base(in), ".dot")
		for _, suffix := range []string{".dot", ".svg", ".removed.dot"} {
			if fi, err := os.Stat(filepath.Join(out, name+suffix)); err != nil || fi.Size() == 0 {
				t.Errorf("%s%s missing or empty: %v", name, suffix, err)
			}
		}
	}
	if msg, err := mk("-q"); err != nil {
		t.Fatalf("a second make would rebuild something: %v\n%s", err, msg)
	}
	// Touch one input (its time must move past the outputs').
	later := time.Now().Add(2 * time.Second)
	if err := os.Chtimes(inputs[0], later, later); err != nil {
		t.Fatal(err)
	}
	defer os.Chtimes(inputs[0], time.Now(), time.Now())
	msg, err := mk()
	if err != nil {
		t.Fatalf("make after touch: %v\n%s", err, msg)
	}
	if n := strings.Count(msg, "--svg"); n != 1 {
		t.Errorf("touching one input re-ran gridwood %d times, want 1:\n%s", n, msg)
	}
	if msg, err := mk("check"); err != nil || strings.Count(msg, ": clean") != len(inputs) {
		t.Errorf("make check: %v\n%s", err, msg)
	}
}
