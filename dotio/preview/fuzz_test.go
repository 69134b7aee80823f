package preview

import (
	"bytes"
	"encoding/xml"
	"os"
	"path/filepath"
	"testing"

	"github.com/gridwood/gridwood/dotio"
)

// FuzzPreview draws any readable DOT, nodes at made-up positions and
// every third edge removed: never a panic, always well-formed XML, the
// same bytes twice.
func FuzzPreview(f *testing.F) {
	for _, pattern := range []string{"../../examples/*.dot", "../../cmd/gridwood/testdata/*.dot", "../testdata/*.gv"} {
		files, _ := filepath.Glob(pattern)
		for _, name := range files {
			if b, err := os.ReadFile(name); err == nil {
				f.Add(b)
			}
		}
	}
	for _, s := range []string{
		`digraph { a [shape=record, label="{<p> x|{y|z}}"]; a -> b [label=<<TABLE><TR><TD>1</TD></TR></TABLE>>, dir=both, arrowhead=lteeoldiamond] }`,
		`graph { a [style="filled,dashed", fillcolor="0.3 0.5 0.9", color="red:blue"]; a -- a [label="\E"] }`,
		`graph { label=<<B>t</B>>; bgcolor="#00000080"; a [shape=star, peripheries=3, xlabel="x"] }`,
	} {
		f.Add([]byte(s))
	}
	f.Fuzz(func(t *testing.T, src []byte) {
		if len(src) > 1<<13 {
			return
		}
		file, err := dotio.Read(src, dotio.ReadOptions{Name: "fuzz", MaxExpansion: 2000})
		if err != nil {
			return
		}
		var graphs []Graph
		for _, g := range file.Graphs {
			pg := Graph{G: g, X: make([]float64, len(g.Nodes)), Y: make([]float64, len(g.Nodes))}
			for i := range g.Nodes {
				pg.X[i], pg.Y[i] = float64(i*97%601), float64(i*61%397)
			}
			if len(g.Edges) > 0 {
				pg.Removed = make([]bool, len(g.Edges))
				for i := range pg.Removed {
					pg.Removed[i] = i%3 == 2
				}
			}
			graphs = append(graphs, pg)
		}
		var a, b bytes.Buffer
		if _, err := Write(&a, graphs); err != nil {
			t.Fatalf("%q: %v", src, err)
		}
		if _, err := Write(&b, graphs); err != nil || !bytes.Equal(a.Bytes(), b.Bytes()) {
			t.Fatalf("%q: output differs between runs (%v)", src, err)
		}
		var root xmlNode
		if err := xml.Unmarshal(a.Bytes(), &root); err != nil {
			t.Fatalf("%q: not well-formed XML: %v", src, err)
		}
	})
}
