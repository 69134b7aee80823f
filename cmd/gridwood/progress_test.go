package main

import (
	"bytes"
	"strings"
	"testing"
)

// TestProgressOnlyOnATerminal: a run whose standard error is not a
// terminal (a buffer here, a pipe or file in scripts) gets no progress
// output at all, even when slow; on a terminal, messages never share the
// progress line and the line is cleared at the end.
func TestProgressOnlyOnATerminal(t *testing.T) {
	var buf bytes.Buffer
	p := newProgress(&buf, false)
	p.set("drawing", 50)
	p.note("gridwood: a message\n")
	p.stop()
	if buf.String() != "gridwood: a message\n" {
		t.Errorf("non-terminal output %q, want only the message", buf.String())
	}
	// The terminal path, driven by hand (no ticker).
	buf.Reset()
	q := &progress{w: &buf, done: make(chan struct{})}
	q.set("drawing graph G", 40)
	q.draw()
	q.note("gridwood: note\n")
	q.draw()
	q.stop()
	got := buf.String()
	want := "\r\x1b[Kgridwood:  40% drawing graph G" + "\r\x1b[K" + "gridwood: note\n" +
		"\r\x1b[Kgridwood:  40% drawing graph G" + "\r\x1b[K"
	if got != want {
		t.Errorf("terminal output\n%q\nwant\n%q", got, want)
	}
	if strings.Count(got, "gridwood: note") != 1 {
		t.Error("note lost or repeated")
	}
}
