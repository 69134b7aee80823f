package main

import (
	"bytes"
	"io"
	"testing"

	"github.com/gridwood/gridwood/internal/graphgen"
)

// BenchmarkSmallGraph runs the whole filter in process on a 50-node
// random planar graph, the size documentation builds run by the hundred.
func BenchmarkSmallGraph(b *testing.B) {
	var in bytes.Buffer
	graphgen.WriteDOT(&in, graphgen.RandomPlanar(50, 0.6, 1))
	b.ReportAllocs()
	for b.Loop() {
		if code := run([]string{"-q"}, bytes.NewReader(in.Bytes()), io.Discard, io.Discard); code != 0 {
			b.Fatalf("exit status %d", code)
		}
	}
}
