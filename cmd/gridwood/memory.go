package main

import (
	"bufio"
	"bytes"
	"fmt"
	"os"
	"runtime/debug"
	"strconv"
	"strings"
)

// Peak memory per byte of DOT input, as measured (bench/RESULTS.md, Whole
// filter against gonum): never below leastBytesPerByte, usually about
// typicalBytesPerByte; plus, for each brace (a graph or subgraph body) and
// each graph keyword, the cost of the structures every one of them gets,
// which dominates in files of many tiny graphs or deeply nested subgraphs
// (measured: 100,000 graphs of one edge, 6.2 kB each; 1,000,000 nested
// braces, 1.1 kB each).
const (
	leastBytesPerByte   = 40
	typicalBytesPerByte = 50
	leastPerBrace       = 1000
	typicalPerBrace     = 1100
	leastPerGraph       = 4000
	typicalPerGraph     = 5500
)

// availableMemory reports the memory this process can still use: the
// kernel's estimate of memory available for new work (MemAvailable in
// /proc/meminfo), lowered to what a cgroup memory limit leaves and to what
// an address-space limit leaves (addressSpaceLeft). A variable so that
// tests can pretend a small machine.
var availableMemory = func() (int64, bool) {
	avail, ok := memInfoAvailable()
	if limit, used, ok2 := cgroupMemory(); ok2 && (!ok || limit-used < avail) {
		avail, ok = max(0, limit-used), true
	}
	if left, ok3 := addressSpaceLeft(); ok3 && (!ok || left < avail) {
		avail, ok = left, true
	}
	return avail, ok
}

func memInfoAvailable() (int64, bool) {
	f, err := os.Open("/proc/meminfo")
	if err != nil {
		return 0, false
	}
	defer f.Close()
	sc := bufio.NewScanner(f)
	for sc.Scan() {
		fields := strings.Fields(sc.Text())
		if len(fields) >= 2 && fields[0] == "MemAvailable:" {
			kb, err := strconv.ParseInt(fields[1], 10, 64)
			return kb * 1024, err == nil
		}
	}
	return 0, false
}

func cgroupMemory() (limit, used int64, ok bool) {
	read := func(name string) (int64, bool) {
		b, err := os.ReadFile("/sys/fs/cgroup/" + name)
		if err != nil {
			return 0, false
		}
		v, err := strconv.ParseInt(string(bytes.TrimSpace(b)), 10, 64)
		return v, err == nil // "max" (no limit) does not parse
	}
	limit, ok1 := read("memory.max")
	used, ok2 := read("memory.current")
	if !ok1 || !ok2 { // cgroup v1: no limit reads as a huge number
		limit, ok1 = read("memory/memory.limit_in_bytes")
		used, ok2 = read("memory/memory.usage_in_bytes")
	}
	return limit, used, ok1 && ok2
}

// memoryGuard refuses, before parsing, input that cannot fit in the memory
// available even at the least measured cost per byte, so that the run
// ends with a message instead of being killed; it warns when the typical
// cost would not fit. It also sets the Go memory limit to what is
// available, so that the collector works harder instead of failing
// while the live data still fits.
// The machine is asked only once some input is big enough to matter
// (guardFloor, a variable so that tests can pretend tiny machines): the
// reads of /proc and the cgroup files took about 0.3 ms of a 50-node
// graph's 4.7 ms in the process.
type memoryGuard struct {
	avail    int64
	known    bool
	measured bool
	warned   bool
}

// guardFloor is the typical cost below which admit lets input through
// without asking the machine.
var guardFloor int64 = 64 << 20

func newMemoryGuard() *memoryGuard { return &memoryGuard{} }

// measure asks the machine, once.
func (m *memoryGuard) measure() {
	if m.measured {
		return
	}
	m.measured = true
	m.avail, m.known = availableMemory()
	if m.known {
		// Not below 64 MB: a limit the runtime itself nearly fills would
		// only make the collector run without pause.
		debug.SetMemoryLimit(max(m.avail, 64<<20))
	}
}

// inputCost is what an input's size and shape commit the run to: its
// bytes, braces and graph keywords (an overcount where strings or
// comments hold them, which only errs on the safe side for a warning and
// by little for a refusal).
type inputCost struct{ bytes, braces, graphs int64 }

func costOf(src []byte) inputCost {
	return inputCost{int64(len(src)), int64(bytes.Count(src, []byte("{"))), int64(bytes.Count(src, []byte("graph")) + bytes.Count(src, []byte("GRAPH")))}
}

func (c *inputCost) add(d inputCost) {
	c.bytes, c.braces, c.graphs = c.bytes+d.bytes, c.braces+d.braces, c.graphs+d.graphs
}

// admit checks the inputs read so far (all of them, since their output is
// kept until the end); note prints a warning.
func (m *memoryGuard) admit(name string, c inputCost, note func(format string, args ...any)) error {
	size := c.bytes
	typical := typicalBytesPerByte*size + typicalPerBrace*c.braces + typicalPerGraph*c.graphs
	if typical < guardFloor && !m.measured {
		return nil
	}
	if m.measure(); !m.known {
		return nil
	}
	if least := leastBytesPerByte*size + leastPerBrace*c.braces + leastPerGraph*c.graphs; least > m.avail {
		return &exitError{exitBadInput, fmt.Sprintf("%s: not enough memory: laying out %s of DOT in %d braces takes at least %s, and %s is available", name, humanBytes(size), c.braces, humanBytes(least), humanBytes(m.avail))}
	}
	if typical > m.avail && !m.warned {
		m.warned = true
		note("gridwood: %s: laying out %s of DOT usually takes about %s, and %s is available: the run may fail for lack of memory\n", name, humanBytes(size), humanBytes(typical), humanBytes(m.avail))
	}
	return nil
}

func humanBytes(n int64) string {
	switch {
	case n >= 1<<30:
		return fmt.Sprintf("%.1f GB", float64(n)/(1<<30))
	case n >= 1<<20:
		return fmt.Sprintf("%.1f MB", float64(n)/(1<<20))
	case n >= 1<<10:
		return fmt.Sprintf("%.1f kB", float64(n)/(1<<10))
	}
	return fmt.Sprintf("%d bytes", n)
}
