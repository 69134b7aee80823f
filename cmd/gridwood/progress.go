package main

import (
	"fmt"
	"io"
	"os"
	"sync"
	"time"
)

// progress shows one line on standard error, rewritten in place, with the
// current stage and how far the whole run is: only when standard error is
// a terminal, not under -q, and only once the run has taken a second, so
// that quick runs and scripts see nothing.
type progress struct {
	mu    sync.Mutex
	w     io.Writer
	stage string
	pct   int
	shown bool
	done  chan struct{}
	wg    sync.WaitGroup
}

// progressDelay is how long a run goes before its progress is shown.
const progressDelay = time.Second

func newProgress(w io.Writer, quiet bool) *progress {
	terminal := false
	if f, ok := w.(*os.File); ok {
		fi, err := f.Stat()
		terminal = err == nil && fi.Mode()&os.ModeCharDevice != 0 && !isNullDevice(fi)
	}
	return newProgressAfter(w, terminal && !quiet, progressDelay)
}

// newProgressAfter shows progress on w after delay if show is set.
func newProgressAfter(w io.Writer, show bool, delay time.Duration) *progress {
	p := &progress{w: w}
	if !show {
		return p
	}
	p.done = make(chan struct{})
	p.wg.Add(1)
	go func() {
		defer p.wg.Done()
		select {
		case <-time.After(delay):
		case <-p.done:
			return
		}
		tick := time.NewTicker(200 * time.Millisecond)
		defer tick.Stop()
		for {
			p.draw()
			select {
			case <-tick.C:
			case <-p.done:
				return
			}
		}
	}()
	return p
}

// set records the stage and the share of the whole run done, in percent.
func (p *progress) set(stage string, pct int) {
	if p.done == nil {
		return
	}
	p.mu.Lock()
	p.stage, p.pct = stage, max(0, min(pct, 100))
	p.mu.Unlock()
}

func (p *progress) draw() {
	p.mu.Lock()
	defer p.mu.Unlock()
	fmt.Fprintf(p.w, "\r\x1b[Kgridwood: %3d%% %s", p.pct, p.stage)
	p.shown = true
}

// stop ends the display and clears its line.
func (p *progress) stop() {
	if p.done == nil {
		return
	}
	close(p.done)
	p.wg.Wait()
	p.mu.Lock()
	defer p.mu.Unlock()
	if p.shown {
		fmt.Fprint(p.w, "\r\x1b[K")
	}
	p.done = nil
}

// note writes a message line to w, clearing the progress line first so the
// two never share a line; the progress line comes back on the next tick.
func (p *progress) note(format string, args ...any) {
	if p == nil {
		return // layout called without a run (tests)
	}
	p.mu.Lock()
	defer p.mu.Unlock()
	if p.shown {
		fmt.Fprint(p.w, "\r\x1b[K")
		p.shown = false
	}
	fmt.Fprintf(p.w, format, args...)
}

// isNullDevice reports whether fi is the null device, which is a character
// device like a terminal but where a progress line is wasted work. Other
// character devices on standard error are rare enough not to matter; the
// standard library has no terminal test, and one is not worth a
// dependency.
func isNullDevice(fi os.FileInfo) bool {
	null, err := os.Stat(os.DevNull)
	return err == nil && os.SameFile(fi, null)
}
