// Command core times the layout core on a generated graph already in
// memory (place.Draw with the command's options, then Result.Space) and
// reports the peak memory the core added, for the speed targets:
//
//	go run ./bench/core -family tri -n 1000000
package main

import (
	"flag"
	"fmt"
	"os"
	"runtime"
	"runtime/debug"
	"runtime/pprof"
	"syscall"
	"time"

	"github.com/gridwood/gridwood/internal/graphgen"
	"github.com/gridwood/gridwood/place"
)

func maxRSS() int64 {
	var ru syscall.Rusage
	syscall.Getrusage(syscall.RUSAGE_SELF, &ru)
	return ru.Maxrss * 1024
}

func main() {
	family := flag.String("family", "tri", "tri, grid, tree, planar, star, path, nested, extra, planar-extra, gnm (see graphgen.Named)")
	n := flag.Int("n", 1000000, "vertices")
	runs := flag.Int("runs", 3, "timed runs (the best is reported)")
	stages := flag.Bool("stages", false, "print each run's stage times")
	cpuProfile := flag.String("cpuprofile", "", "write a CPU profile of the timed runs to this file")
	flag.Parse()
	g, ok := graphgen.Named(*family, *n, 10, 1)
	if !ok {
		fmt.Fprintln(os.Stderr, "core: unknown family")
		os.Exit(2)
	}
	debug.SetGCPercent(300) // as the command runs
	boxes := place.Boxes{HalfW: make([]int64, g.N), HalfH: make([]int64, g.N), Gap: 18}
	for i := range boxes.HalfW {
		boxes.HalfW[i], boxes.HalfH[i] = 38, 18
	}
	runtime.GC()
	base := maxRSS()
	best := time.Duration(1 << 62)
	if *cpuProfile != "" {
		f, err := os.Create(*cpuProfile)
		if err != nil {
			fmt.Fprintln(os.Stderr, err)
			os.Exit(1)
		}
		pprof.StartCPUProfile(f)
		defer pprof.StopCPUProfile()
	}
	for range *runs {
		runtime.GC()
		start := time.Now()
		res, err := place.Draw(g.N, g.Edges, place.DrawOptions{Layout: place.Options{Compact: true, Smooth: 400}})
		if err != nil {
			fmt.Fprintln(os.Stderr, err)
			os.Exit(1)
		}
		spaceStart := time.Now()
		if _, err := res.Space(boxes, place.SpaceOptions{}); err != nil {
			fmt.Fprintln(os.Stderr, err)
			os.Exit(1)
		}
		took, space := time.Since(start), time.Since(spaceStart)
		best = min(best, took)
		if *stages {
			fmt.Printf("run: %.3f s = planarize %.3f + layout %.3f + space %.3f (+ %.3f)\n", took.Seconds(),
				res.Times.Planarize.Seconds(), res.Times.Layout.Seconds(), space.Seconds(),
				(took - res.Times.Planarize - res.Times.Layout - space).Seconds())
		}
	}
	fmt.Printf("%s n=%d m=%d: best of %d %.3f s, %.0f ns/edge, peak memory added %.0f MB (RSS %.0f MB with the graph)\n",
		*family, g.N, len(g.Edges), *runs, best.Seconds(), float64(best.Nanoseconds())/float64(len(g.Edges)),
		float64(maxRSS()-base)/1e6, float64(maxRSS())/1e6)
}
