// Command readexp is a scratch experiment for the readable stage.
package main

import (
	"flag"
	"fmt"
	"github.com/gridwood/gridwood/dotio"
	"math"
	"os"
	"time"

	"github.com/gridwood/gridwood/internal/geomcheck"
	"github.com/gridwood/gridwood/internal/graphgen"
	"github.com/gridwood/gridwood/place"
	"github.com/gridwood/gridwood/place/quality"
	"github.com/gridwood/gridwood/place/readable"
	"github.com/gridwood/gridwood/place/stress"
	"github.com/gridwood/gridwood/planarize"
)

func main() {
	family := flag.String("f", "planar", "family")
	n := flag.Int("n", 100, "size")
	seed := flag.Uint64("seed", 1, "seed")
	svg := flag.String("svg", "", "svg file")
	follow := flag.Bool("follow", false, "embedding from the reference")
	dotFile := flag.String("dot", "", "DOT file instead of a family")
	lr := flag.Bool("lr", false, "LR embedding, outer face from the reference")
	flag.Parse()
	g, ok := graphgen.Named(*family, *n, 0, *seed)
	if *dotFile != "" {
		src, err := os.ReadFile(*dotFile)
		if err != nil {
			panic(err)
		}
		f, err := dotio.Read(src, dotio.ReadOptions{Name: *dotFile})
		if err != nil {
			panic(err)
		}
		dg := f.Graphs[0]
		g = graphgen.Graph{N: len(dg.Nodes), Name: *dotFile}
		seen := map[[2]int32]bool{}
		for _, e := range dg.Edges {
			a, b := min(e.From, e.To), max(e.From, e.To)
			if a != b && !seen[[2]int32{a, b}] {
				seen[[2]int32{a, b}] = true
				g.Edges = append(g.Edges, [2]int32{a, b})
			}
		}
		ok = true
	}
	if !ok {
		fmt.Println("no family")
		os.Exit(2)
	}
	res, err := place.Draw(g.N, g.Edges, place.DrawOptions{})
	if err != nil {
		panic(err)
	}
	kept := res.Kept()
	// largest component
	comp, size := components(g.N, kept)
	best := 0
	for c := range size {
		if size[c] > size[best] {
			best = c
		}
	}
	idx := make([]int32, g.N)
	var vs []int32
	for v := range g.N {
		if comp[v] == int32(best) {
			idx[v] = int32(len(vs))
			vs = append(vs, int32(v))
		}
	}
	var edges [][2]int32
	for _, e := range kept {
		if comp[e[0]] == int32(best) {
			edges = append(edges, [2]int32{idx[e[0]], idx[e[1]]})
		}
	}
	k := len(vs)
	x, y := make([]float64, k), make([]float64, k)
	hw, hh := make([]float64, k), make([]float64, k)
	for i, v := range vs {
		x[i], y[i] = float64(res.X[v]), float64(res.Y[v])
		hw[i], hh[i] = 27, 18
	}
	if *follow || *lr {
		m0, _ := stress.NewModel(k, edges, nil, stress.Options{})
		fx, fy := m0.Start()
		m0.Layout(fx, fy, 200, 1e-4)
		emb, outer, ok := readable.Follow(fx, fy, edges)
		if *lr {
			emb, ok = planarize.Embed(k, edges)
			outer = readable.OuterFace(emb, fx, fy)
		}
		fmt.Println("follow ok:", ok, "outer", len(outer))
		if ok {
			d, err := place.Layout(emb, place.Options{Outer: outer})
			if err != nil {
				panic(err)
			}
			for i := range x {
				x[i], y[i] = float64(d.X[i]), float64(d.Y[i])
			}

		}
	}
	start := time.Now()
	out, err := readable.Draw(readable.Input{Edges: edges, X: x, Y: y, HalfW: hw, HalfH: hh, Gap: 18}, readable.Options{})
	if err != nil {
		panic(err)
	}
	el := time.Since(start)
	for _, ph := range out.Phases {
		fmt.Printf("  %-10s sweeps %5d stress %.4g  %.3fs least height %.3g stretch %.3g\n", ph.Name, ph.Sweeps, ph.Stress, ph.Seconds, ph.LeastHeight, ph.Stretch)
	}
	{
		lo, hi := 0, 0
		for i := range out.X {
			if out.X[i] < out.X[lo] {
				lo = i
			}
			if out.Y[i] < out.Y[hi] {
				hi = i
			}
		}
		fmt.Println("leftmost", lo, "lowest", hi)
	}
	// reference
	lengths := make([]float64, len(edges))
	for i := range lengths {
		lengths[i] = 1
	}
	m, _ := stress.NewModel(k, edges, nil, stress.Options{})
	rx, ry := m.Start()
	m.Layout(rx, ry, 500, 1e-5)
	qs := quality.Measure(x, y, edges)
	qo := quality.Measure(out.X, out.Y, edges)
	qr := quality.Measure(rx, ry, edges)
	cross := crossings(rx, ry, edges)
	pc := crossings(out.X, out.Y, edges)
	fmt.Printf("%s n=%d m=%d: start %.4f out %.4f ref %.4f ratio %.3f (start %.2f) | cv %.2f/%.2f ang %.2f/%.2f | refcross %d outcross %d | sweeps %d ref=%v %.3fs\n",
		*family, k, len(edges), qs.Stress, qo.Stress, qr.Stress, qo.Stress/qr.Stress, qs.Stress/qr.Stress, qo.EdgeCV, qr.EdgeCV, qo.AngularResolution, qr.AngularResolution, cross, pc, out.Sweeps, out.Chosen, el.Seconds())
	if *svg != "" {
		writeSVG(*svg, out.X, out.Y, edges, rx, ry)
	}
}

func crossings(x, y []float64, edges [][2]int32) int {
	pts := make([]geomcheck.Point, len(x))
	minX, minY := math.Inf(1), math.Inf(1)
	for i := range x {
		minX, minY = min(minX, x[i]), min(minY, y[i])
	}
	for i := range x {
		pts[i] = geomcheck.Point{X: int64(math.Round((x[i] - minX) * 64)), Y: int64(math.Round((y[i] - minY) * 64))}
	}
	p, err := geomcheck.Check(pts, edges)
	if err != nil {
		return -1
	}
	kinds := map[geomcheck.Kind]int{}
	for _, q := range p {
		kinds[q.Kind]++
	}
	if len(p) > 0 {
		fmt.Println("problems", kinds, p[0])
		if p[0].Kind == geomcheck.Crossing {
			a, b := edges[p[0].A], edges[p[0].B]
			fmt.Printf("  edge %v: (%.3f,%.3f)-(%.3f,%.3f)  edge %v: (%.3f,%.3f)-(%.3f,%.3f)\n", a, x[a[0]], y[a[0]], x[a[1]], y[a[1]], b, x[b[0]], y[b[0]], x[b[1]], y[b[1]])
		}
	}
	return len(p)
}

func components(n int, edges [][2]int32) ([]int32, []int) {
	adj := make([][]int32, n)
	for _, e := range edges {
		adj[e[0]] = append(adj[e[0]], e[1])
		adj[e[1]] = append(adj[e[1]], e[0])
	}
	comp := make([]int32, n)
	for i := range comp {
		comp[i] = -1
	}
	var size []int
	for s := range n {
		if comp[s] >= 0 {
			continue
		}
		c := int32(len(size))
		size = append(size, 0)
		st := []int32{int32(s)}
		comp[s] = c
		for len(st) > 0 {
			u := st[len(st)-1]
			st = st[:len(st)-1]
			size[c]++
			for _, w := range adj[u] {
				if comp[w] < 0 {
					comp[w] = c
					st = append(st, w)
				}
			}
		}
	}
	return comp, size
}

func writeSVG(path string, x, y []float64, edges [][2]int32, rx, ry []float64) {
	f, _ := os.Create(path)
	defer f.Close()
	draw := func(x, y []float64, ox float64) string {
		minX, minY, maxX, maxY := math.Inf(1), math.Inf(1), math.Inf(-1), math.Inf(-1)
		for i := range x {
			minX, minY, maxX, maxY = min(minX, x[i]), min(minY, y[i]), max(maxX, x[i]), max(maxY, y[i])
		}
		s := 560 / max(maxX-minX, maxY-minY)
		out := ""
		for _, e := range edges {
			out += fmt.Sprintf(`<line x1="%.1f" y1="%.1f" x2="%.1f" y2="%.1f" stroke="teal"/>`, ox+20+(x[e[0]]-minX)*s, 20+(maxY-y[e[0]])*s, ox+20+(x[e[1]]-minX)*s, 20+(maxY-y[e[1]])*s)
		}
		for i := range x {
			out += fmt.Sprintf(`<circle cx="%.1f" cy="%.1f" r="3" fill="#333"/>`, ox+20+(x[i]-minX)*s, 20+(maxY-y[i])*s)
		}
		return out
	}
	fmt.Fprintf(f, `<svg xmlns="http://www.w3.org/2000/svg" width="1200" height="600"><rect width="1200" height="600" fill="white"/>%s%s</svg>`, draw(x, y, 0), draw(rx, ry, 600))
}
