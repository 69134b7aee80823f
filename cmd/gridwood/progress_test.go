package main

import (
	"bytes"
	"os"
	"strings"
	"sync"
	"testing"
	"time"
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
}

// syncBuffer is a bytes.Buffer safe for the progress goroutine's writes.
type syncBuffer struct {
	mu  sync.Mutex
	buf bytes.Buffer
}

func (b *syncBuffer) Write(p []byte) (int, error) {
	b.mu.Lock()
	defer b.mu.Unlock()
	return b.buf.Write(p)
}

func (b *syncBuffer) String() string {
	b.mu.Lock()
	defer b.mu.Unlock()
	return b.buf.String()
}

// TestProgressDelayAndQuiet drives the real ticker: a run that ends before
// the delay shows nothing; one that lasts past it shows the stage and
// percentage set last and clears the line at the end; with show off (-q,
// or not a terminal) a slow run shows nothing either.
func TestProgressDelayAndQuiet(t *testing.T) {
	var quick syncBuffer
	p := newProgressAfter(&quick, true, time.Hour)
	p.set("reading big.dot: parsing", 12)
	p.stop()
	if quick.String() != "" {
		t.Errorf("a run shorter than the delay showed %q", quick.String())
	}
	var slow syncBuffer
	p = newProgressAfter(&slow, true, time.Millisecond)
	p.set("drawing G in big.dot: planarity test", 57)
	deadline := time.Now().Add(5 * time.Second)
	for !strings.Contains(slow.String(), "gridwood:  57% drawing G in big.dot: planarity test") && time.Now().Before(deadline) {
		time.Sleep(time.Millisecond)
	}
	p.stop()
	got := slow.String()
	if !strings.HasPrefix(got, "\r\x1b[Kgridwood:  57% drawing G in big.dot: planarity test") || !strings.HasSuffix(got, "\r\x1b[K") {
		t.Errorf("slow run showed %q", got)
	}
	var quiet syncBuffer
	p = newProgressAfter(&quiet, false, time.Millisecond)
	p.set("drawing", 50)
	time.Sleep(20 * time.Millisecond)
	p.stop()
	if quiet.String() != "" {
		t.Errorf("progress shown with show off: %q", quiet.String())
	}
}

// TestProgressNotOnTheNullDevice: standard error sent to the null device
// is a character device, as a terminal is, but gets no progress line.
func TestProgressNotOnTheNullDevice(t *testing.T) {
	null, err := os.OpenFile(os.DevNull, os.O_WRONLY, 0)
	if err != nil {
		t.Skip(err)
	}
	defer null.Close()
	fi, err := null.Stat()
	if err != nil || fi.Mode()&os.ModeCharDevice == 0 {
		t.Skipf("%s is not a character device here", os.DevNull)
	}
	if p := newProgress(null, false); p.done != nil {
		p.stop()
		t.Errorf("progress shown on %s", os.DevNull)
	}
}
