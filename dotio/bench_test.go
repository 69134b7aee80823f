package dotio

import (
	"bytes"
	"fmt"
	"io"
	"runtime"
	"testing"

	"gonum.org/v1/gonum/graph/formats/dot"
)

// gridText returns a triangulated grid of about 100k nodes and 300k edges
// (right, down and diagonal neighbours), one edge statement per line, with
// a node statement carrying attributes for every tenth node.
func gridText() []byte {
	const side = 317
	var b bytes.Buffer
	b.WriteString("graph grid {\n\tnode [shape=point, width=0.1]\n")
	for i := range side {
		for j := range side {
			if (i*side+j)%10 == 0 {
				fmt.Fprintf(&b, "\tn%d_%d [label=\"cell %d,%d\", pos=\"%d,%d\"]\n", i, j, i, j, i, j)
			}
			if j+1 < side {
				fmt.Fprintf(&b, "\tn%d_%d -- n%d_%d\n", i, j, i, j+1)
			}
			if i+1 < side {
				fmt.Fprintf(&b, "\tn%d_%d -- n%d_%d\n", i, j, i+1, j)
			}
			if i+1 < side && j+1 < side {
				fmt.Fprintf(&b, "\tn%d_%d -- n%d_%d [weight=2]\n", i, j, i+1, j+1)
			}
		}
	}
	b.WriteString("}\n")
	return b.Bytes()
}

var gridCache []byte

func grid() []byte {
	if gridCache == nil {
		gridCache = gridText()
	}
	return gridCache
}

// allocPerByte reports the bytes allocated per input byte over the
// benchmark loop.
func allocPerByte(b *testing.B, before *runtime.MemStats, n int) {
	var after runtime.MemStats
	runtime.ReadMemStats(&after)
	b.ReportMetric(float64(after.TotalAlloc-before.TotalAlloc)/float64(b.N)/float64(n), "allocB/inB")
}

func BenchmarkRead(b *testing.B) {
	src := grid()
	b.SetBytes(int64(len(src)))
	var ms runtime.MemStats
	runtime.ReadMemStats(&ms)
	b.ResetTimer()
	for range b.N {
		f, err := Read(src, ReadOptions{Name: "grid"})
		if err != nil {
			b.Fatal(err)
		}
		if len(f.Graphs[0].Edges) < 300_000 {
			b.Fatal("too few edges")
		}
	}
	b.StopTimer()
	allocPerByte(b, &ms, len(src))
}

func BenchmarkWrite(b *testing.B) {
	src := grid()
	f, err := Read(src, ReadOptions{Name: "grid"})
	if err != nil {
		b.Fatal(err)
	}
	lays := synthLayout(f)
	b.SetBytes(int64(len(src)))
	var ms runtime.MemStats
	runtime.ReadMemStats(&ms)
	b.ResetTimer()
	for range b.N {
		if err := Write(io.Discard, f, lays, WriteOptions{}); err != nil {
			b.Fatal(err)
		}
	}
	b.StopTimer()
	allocPerByte(b, &ms, len(src))
}

// BenchmarkGonumParsePrint is the baseline: gonum's parser and its AST
// printer on the same text.
func BenchmarkGonumParsePrint(b *testing.B) {
	src := grid()
	b.SetBytes(int64(len(src)))
	var ms runtime.MemStats
	runtime.ReadMemStats(&ms)
	b.ResetTimer()
	for range b.N {
		f, err := dot.ParseBytes(src)
		if err != nil {
			b.Fatal(err)
		}
		if len(f.String()) == 0 {
			b.Fatal("empty")
		}
	}
	b.StopTimer()
	allocPerByte(b, &ms, len(src))
}

func BenchmarkCrossProductRefusal(b *testing.B) {
	src := crossProduct(3000)
	for range b.N {
		if _, err := Read(src, ReadOptions{Name: "x"}); err == nil {
			b.Fatal("accepted")
		}
	}
}

func BenchmarkDeepNesting(b *testing.B) {
	src := nested(100_000, "a -- b")
	var ms runtime.MemStats
	runtime.ReadMemStats(&ms)
	for range b.N {
		f, err := Read(src, ReadOptions{Name: "deep"})
		if err != nil {
			b.Fatal(err)
		}
		if err := Write(io.Discard, f, synthLayout(f), WriteOptions{}); err != nil {
			b.Fatal(err)
		}
	}
	b.StopTimer()
	var after runtime.MemStats
	runtime.ReadMemStats(&after)
	b.ReportMetric(float64(after.TotalAlloc-ms.TotalAlloc)/float64(b.N)/1e6, "allocMB/op")
}

func BenchmarkNestedOperands(b *testing.B) {
	src := nestedOperands(100_000, func(int) string { return "a" })
	for range b.N {
		if _, err := Read(src, ReadOptions{Name: "n", MaxExpansion: -1}); err != nil {
			b.Fatal(err)
		}
	}
}
