package readable_test

import (
	"os"
	"testing"

	"github.com/gridwood/gridwood/dotio"
	"github.com/gridwood/gridwood/place"
	"github.com/gridwood/gridwood/place/readable"
)

func BenchmarkDrawFile(b *testing.B) {
	path := os.Getenv("PROF")
	if path == "" {
		b.Skip()
	}
	src, _ := os.ReadFile(path)
	f, _ := dotio.Read(src, dotio.ReadOptions{Name: path})
	dg := f.Graphs[0]
	n := len(dg.Nodes)
	var edges [][2]int32
	seen := map[[2]int32]bool{}
	for _, e := range dg.Edges {
		a, c := min(e.From, e.To), max(e.From, e.To)
		if a != c && !seen[[2]int32{a, c}] {
			seen[[2]int32{a, c}] = true
			edges = append(edges, [2]int32{a, c})
		}
	}
	res, err := place.Draw(n, edges, place.DrawOptions{})
	if err != nil {
		b.Fatal(err)
	}
	x, y, hw, hh := gridStart(res)
	kept := res.Kept()
	for b.Loop() {
		if _, err := readable.Draw(readable.Input{Edges: kept, X: x, Y: y, HalfW: hw, HalfH: hh, Gap: 18, EdgeGap: 4}, readable.Options{}); err != nil {
			b.Fatal(err)
		}
	}
}
