package main

import (
	"fmt"
	"io"
	"math"
	"strconv"
	"strings"

	"github.com/gridwood/gridwood/dotio"
	"github.com/gridwood/gridwood/dotio/preview"
	"github.com/gridwood/gridwood/place/geomcheck"
)

// writeSVG writes the --svg preview of graphs (package preview) to w and,
// unless quiet, says on one line of stderr what the input says that the
// preview does not draw.
func writeSVG(w io.Writer, graphs []preview.Graph, path string, quiet bool, stderr io.Writer) error {
	res, err := preview.Write(w, graphs)
	if err != nil {
		return err
	}
	if len(res.NotDrawn) > 0 && !quiet {
		fmt.Fprintf(stderr, "gridwood: %s: the preview does not draw: %s\n", path, strings.Join(res.NotDrawn, "; "))
	}
	return nil
}

// previewOfInput is the preview of a drawing made elsewhere (--check
// --svg): each node at its own pos. A graph where some node has no pos,
// or one that is not "X,Y", cannot be drawn; why is returned instead.
func previewOfInput(g *dotio.Graph) (preview.Graph, string) {
	pg := preview.Graph{G: g, X: make([]float64, len(g.Nodes)), Y: make([]float64, len(g.Nodes)), FromInput: true}
	for v, n := range g.Nodes {
		s := strings.TrimSuffix(strings.TrimSpace(n.Attrs.Pos), "!")
		xs, ys, ok := strings.Cut(s, ",")
		x, errX := strconv.ParseFloat(strings.TrimSpace(xs), 64)
		y, errY := strconv.ParseFloat(strings.TrimSpace(ys), 64)
		if !ok || errX != nil || errY != nil || !finite(x) || !finite(y) {
			if strings.TrimSpace(n.Attrs.Pos) == "" {
				return pg, fmt.Sprintf("node %s has no pos", strconv.Quote(n.Name))
			}
			return pg, fmt.Sprintf("node %s has pos %s, not \"X,Y\"", strconv.Quote(n.Name), strconv.Quote(n.Attrs.Pos))
		}
		pg.X[v], pg.Y[v] = x, y
	}
	for _, a := range g.GraphAttrs() {
		if a.Name() != "bb" {
			continue
		}
		text, _ := a.Text()
		var bb [4]float64
		parts := strings.Split(text, ",")
		ok := len(parts) == 4
		for i := 0; ok && i < 4; i++ {
			v, err := strconv.ParseFloat(strings.TrimSpace(parts[i]), 64)
			ok = err == nil && finite(v)
			bb[i] = v
		}
		if ok {
			pg.BB = bb
		}
	}
	pg.Frames = inputFrames(g, pg.X, pg.Y)
	return pg, ""
}

// inputFrames frames the clusters of a drawing made elsewhere, as --check
// does, from the nodes' positions rounded to whole points (the picture
// needs no more); none when a position is too far out to frame.
func inputFrames(g *dotio.Graph, x, y []float64) []preview.Frame {
	set := g.Clusters(preview.FrameKeys()...)
	if len(set.Clusters) == 0 {
		return previewFrames(nil)
	}
	xs, ys := make([]int64, len(x)), make([]int64, len(y))
	for v := range x {
		if math.Abs(x[v]) > geomcheck.MaxCoord || math.Abs(y[v]) > geomcheck.MaxCoord {
			return previewFrames(nil)
		}
		xs[v], ys[v] = int64(math.Round(x[v])), int64(math.Round(y[v]))
	}
	b := nodeBoxes(g)
	ci, err := clusterFrames(set, xs, ys, b.HalfW, b.HalfH, 1)
	if err != nil {
		return previewFrames(nil)
	}
	return previewFrames(ci)
}

func finite(v float64) bool { return v-v == 0 }

// appendInputPictures adds the graphs of f to the --check preview, each
// node at its own pos; a graph that cannot be drawn is left out and,
// unless quiet, named on stderr with the reason.
func appendInputPictures(pictures []preview.Graph, f *dotio.File, quiet bool, stderr io.Writer) []preview.Graph {
	for gi, g := range f.Graphs {
		pg, why := previewOfInput(g)
		if why != "" {
			if !quiet {
				fmt.Fprintf(stderr, "gridwood: %s\n", positioned(f.Name, g.Line, g.Col, "%s: not in the preview: %s", g.Describe(gi), why))
			}
			continue
		}
		pictures = append(pictures, pg)
	}
	return pictures
}
