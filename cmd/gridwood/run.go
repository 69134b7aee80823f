package main

import (
	"bytes"
	"errors"
	"fmt"
	"io"
	"os"
	"os/signal"
	"slices"
	"strconv"
	"strings"
	"syscall"
	"time"

	"github.com/gridwood/gridwood/cmd/gridwood/report"
	"github.com/gridwood/gridwood/dotio"
	"github.com/gridwood/gridwood/dotio/nodesize"
	"github.com/gridwood/gridwood/dotio/preview"
	"github.com/gridwood/gridwood/place"
	"github.com/gridwood/gridwood/place/flow"
	"github.com/gridwood/gridwood/planarize"
)

// Exit statuses, documented in --help and README.md.
const (
	exitOK        = 0
	exitProblems  = 1 // a check found problems
	exitBadInput  = 2 // bad input, usage, or an I/O failure
	exitNonPlanar = 3 // a graph is not planar under --planar-only
)

// smoothSweeps bounds the conjugate-gradient steps of Tutte's
// drawing (see place.Options.Smooth); Space uses it where the grid crowds.
const smoothSweeps = 400

// Work bounds for --explain, in edge visits of planarity tests, so that the
// output never depends on timing; variables so that tests can reach them.
var (
	explainBudgetEach  int64 = 20_000_000
	explainBudgetTotal int64 = 200_000_000
)

func run(args []string, stdin io.Reader, stdout, stderr io.Writer) int {
	std := newStdStreams(stdin, stdout, stderr)
	usage := func(err error) int {
		fmt.Fprintf(stderr, "gridwood: %v (see gridwood --help)\n", err)
		return exitBadInput
	}
	cfg, err := parseFlags(args)
	if err != nil {
		return usage(err)
	}
	if cfg.help || cfg.version {
		if stdoutClosed(std) {
			fmt.Fprintln(stderr, "gridwood: standard output is closed")
			return exitBadInput
		}
		if cfg.help {
			printHelp(stdout, cfg.flags)
		} else {
			fmt.Fprintf(stdout, "gridwood %s\n", versionString())
		}
		return exitOK
	}
	planOutputs(cfg, std)
	if err := checkClashes(cfg, std); err != nil {
		return usage(err)
	}
	if stdoutClosed(std) && slices.ContainsFunc(cfg.outs, func(o *output) bool { return o.kind == toStdout }) {
		fmt.Fprintln(stderr, "gridwood: standard output is closed; give -o FILE, or redirect it (>/dev/null discards it)")
		return exitBadInput
	}
	err = process(cfg, std)
	var bp *brokenPipe
	if errors.As(err, &bp) {
		// End as a filter in a pipeline does: by SIGPIPE's default
		// action, which the runtime takes on a failed write to standard
		// output or error once nothing listens for the signal. Should the
		// process ignore SIGPIPE (signal.Ignore; an inherited SIG_IGN is
		// not kept for it) the write only fails again: say so.
		signal.Reset(syscall.SIGPIPE)
		if f, ok := bp.stream.(*os.File); ok {
			f.Write([]byte{'\n'})
		}
		if bp.stream != stderr {
			fmt.Fprintln(stderr, "gridwood: standard output: cannot write: broken pipe")
		}
		return exitBadInput
	}
	if err != nil {
		var ee *exitError
		if errors.As(err, &ee) {
			fmt.Fprintf(stderr, "gridwood: %s\n", ee.msg)
			return ee.status
		}
		fmt.Fprintf(stderr, "gridwood: %v\n", err)
		return exitBadInput
	}
	return exitOK
}

// process runs the whole filter; nothing is written until every input was
// read and laid out, so a failure leaves no partial output.
func process(cfg *config, std *stdStreams) error {
	stdin, stderr := std.in, std.err
	if cfg.check {
		return checkInputs(cfg, std)
	}
	var out, removedOut, explainOut, svgOut bytes.Buffer
	var pictures []preview.Graph
	var reports []report.File
	prog := newProgress(stderr, cfg.quiet)
	defer prog.stop()
	cfg.prog = prog
	// Progress: each input's share of the run is its share of the bytes;
	// within one, reading is taken as 40%, drawing 50% (by edges), writing 10%.
	sizes := make([]int64, len(cfg.inputs))
	var totalBytes int64
	for i, in := range cfg.inputs {
		if fi, err := os.Stat(in); err == nil && in != "-" {
			sizes[i] = fi.Size()
		}
		totalBytes += sizes[i]
	}
	var doneBytes int64
	pct := func(i int, within float64) int {
		if totalBytes == 0 {
			return int(100 * (float64(i) + within) / float64(len(cfg.inputs)))
		}
		return int(100 * (float64(doneBytes) + within*float64(sizes[i])) / float64(totalBytes))
	}
	budget := &planarize.Budget{Left: explainBudgetTotal}
	stdinUsed := false
	outerUsed := false
	var lacks [][2]string // where a graph is and which --outer names it lacks
	memory := newMemoryGuard()
	var read inputCost
	warn := func(format string, args ...any) {
		if !cfg.quiet {
			prog.note(format, args...)
		}
	}
	for ii, in := range cfg.inputs {
		prog.set("reading "+in, pct(ii, 0))
		src, name, err := readInput(in, stdin, &stdinUsed)
		if err != nil {
			return err
		}
		read.add(costOf(src))
		if err := memory.admit(name, read, warn); err != nil {
			return err
		}
		readStart := time.Now()
		f, err := dotio.Read(src, dotio.ReadOptions{Name: name, MaxExpansion: cfg.maxExpansion, Progress: func(step string, done float64) {
			prog.set("reading "+name+": "+step, pct(ii, 0.4*done))
		}})
		if err != nil {
			return err
		}
		for _, w := range f.Warnings {
			warn("gridwood: %s\n", w.Error())
		}
		rep := report.File{File: name, ReadSeconds: time.Since(readStart).Seconds()}
		layouts := make([]dotio.Layout, len(f.Graphs))
		removed := make([][]int, len(f.Graphs))
		results := make([]*place.Result, len(f.Graphs))
		frames := make([][]preview.Frame, len(f.Graphs))
		totalEdges, edgesDone := 0, 0
		for _, g := range f.Graphs {
			totalEdges += len(g.Edges) + 1
		}
		for gi, g := range f.Graphs {
			drawing := fmt.Sprintf("drawing %s in %s: ", g.Describe(gi), name)
			before, share := float64(edgesDone), float64(len(g.Edges)+1)
			edgesDone += len(g.Edges) + 1
			step := func(stage string, done float64) {
				prog.set(drawing+stage, pct(ii, 0.4+0.5*(before+done*share)/float64(totalEdges)))
			}
			out, err := layoutGraph(cfg, g, gi, positioned(name, g.Line, g.Col, "%s", g.Describe(gi)), step)
			if err != nil {
				return err
			}
			res, lay, clusters, caps := out.res, out.lay, out.clusters, out.caps
			rep.Graphs = append(rep.Graphs, out.report)
			if caps.count > 0 && !cfg.quiet {
				n := g.Nodes[caps.first]
				more := ""
				if caps.count > 1 {
					more = fmt.Sprintf(" (and %d more in %s)", caps.count-1, g.Describe(gi))
				}
				prog.note("gridwood: %s\n", positioned(name, n.Line, n.Col, "node %s: its label needs a box over 1000 inches a side; the box was taken as 1000 inches%s", strconv.Quote(n.Name), more))
			}
			layouts[gi], removed[gi] = lay, res.Removed
			if !cfg.quiet {
				if clusters != nil {
					warnClusters(prog.note, name, g, gi, clusters.set)
				}
				if _, value, ok := flowDirection(g); g.Directed && !ok {
					prog.note("gridwood: %s\n", positioned(name, g.Line, g.Col, "%s: rankdir %s is not TB, LR, BT or RL; taken as TB", g.Describe(gi), strconv.Quote(value)))
				}
			}
			if cfg.svgFile != "" {
				frames[gi] = previewFrames(clusters)
			}
			// The drawing's internals and the node boxes are kept only for
			// the outputs that need them: a file of many small graphs
			// would otherwise hold every graph's working state at once.
			if cfg.explainFile != "" {
				results[gi] = res
			}
			if len(cfg.outer) > 0 {
				if missing := missingNames(g, cfg.outer); len(missing) == 0 {
					outerUsed = true
				} else {
					lacks = append(lacks, [2]string{fmt.Sprintf("%s:%d:%d", name, g.Line, g.Col), g.Describe(gi) + " lacks " + strings.Join(missing, ", ")})
				}
			}
			if len(res.Removed) == 0 {
				continue
			}
			where := positioned(name, g.Line, g.Col, "%s", g.Describe(gi))
			removedN, edgesN := edgeCounts(g, res.Removed)
			if cfg.planarOnly {
				return &exitError{exitNonPlanar, fmt.Sprintf("%s is not planar: %d of %d edges would have to be removed", where, removedN, edgesN)}
			}
			if !cfg.quiet {
				see := "see --removed"
				if cfg.removedFile != "" {
					see = "listed in " + cfg.removedFile
				}
				hint := ""
				if !res.Optimal && cfg.effort < hintEffort && len(g.Edges) <= hintMaxEdges {
					hint = fmt.Sprintf("; not proved the fewest: --effort %d may remove fewer", hintEffort)
				}
				prog.note("gridwood: %s: %d of %d edges removed to make it planar (%s)%s\n", where, removedN, edgesN, see, hint)
			}
		}
		if !cfg.quiet {
			warnPinned(prog, name, f)
			warnSizes(prog, name, f)
		}
		opt := dotio.WriteOptions{DropRemoved: cfg.dropRemoved, MarkRemoved: cfg.markRemoved}
		prog.set("writing "+name, pct(ii, 0.9))
		writeStart := time.Now()
		if err := dotio.Write(&out, f, layouts, opt); err != nil {
			return err
		}
		rep.WriteSeconds = time.Since(writeStart).Seconds()
		reports = append(reports, rep)
		doneBytes += sizes[ii]
		if cfg.removedFile != "" {
			if err := dotio.WriteRemoved(&removedOut, f, removed); err != nil {
				return err
			}
		}
		if cfg.explainFile != "" {
			writeExplain(&explainOut, f, results, budget)
		}
		if cfg.svgFile != "" {
			for gi, g := range f.Graphs {
				pg := preview.FromLayout(g, layouts[gi])
				pg.Frames = frames[gi]
				pictures = append(pictures, pg)
			}
		}
	}
	prog.stop() // before any message or output
	if len(cfg.outer) > 0 && !outerUsed {
		return &exitError{exitBadInput, fmt.Sprintf("--outer %s: no graph has all of these nodes (%s)", strings.Join(cfg.outer, ","), lacks[0][1])}
	}
	if !cfg.quiet {
		for _, l := range lacks {
			fmt.Fprintf(stderr, "gridwood: %s: --outer: %s; its outer face is chosen as without --outer\n", l[0], l[1])
		}
	}
	// All inputs succeeded: commit every output (output.go).
	if o := cfg.sideFile("--report"); o != nil {
		var buf bytes.Buffer
		if err := report.Write(&buf, report.Document{Files: reports}); err != nil {
			return err
		}
		o.data = buf.Bytes()
	}
	if o := cfg.sideFile("--svg"); o != nil {
		if err := writeSVG(&svgOut, pictures, cfg.svgFile, cfg.quiet, stderr); err != nil {
			return err
		}
		o.data = svgOut.Bytes()
	}
	if o := cfg.sideFile("--removed"); o != nil {
		o.data = removedOut.Bytes()
	}
	if o := cfg.sideFile("--explain"); o != nil {
		o.data = explainOut.Bytes()
	}
	cfg.outs[len(cfg.outs)-1].data = out.Bytes()
	return commitOutputs(cfg.outs, std)
}

// checkInputs runs --check: every input's drawing is checked as given and
// the problems are listed on stdout.
func checkInputs(cfg *config, std *stdStreams) error {
	stdin, stderr := std.in, std.err
	stdinUsed := false
	problems := 0
	var report bytes.Buffer
	var pictures []preview.Graph
	for _, in := range cfg.inputs {
		src, name, err := readInput(in, stdin, &stdinUsed)
		if err != nil {
			return err
		}
		f, err := dotio.Read(src, dotio.ReadOptions{Name: name, MaxExpansion: cfg.maxExpansion})
		if err != nil {
			return err
		}
		if !cfg.quiet {
			for _, w := range f.Warnings {
				fmt.Fprintf(std.err, "gridwood: %s\n", w.Error())
			}
		}
		k, err := checkFile(&report, f)
		if err != nil {
			return err
		}
		problems += k
		if cfg.svgFile != "" {
			pictures = appendInputPictures(pictures, f, cfg.quiet, stderr)
		}
	}
	if o := cfg.sideFile("--svg"); o != nil {
		var svg bytes.Buffer
		if err := writeSVG(&svg, pictures, cfg.svgFile, cfg.quiet, stderr); err != nil {
			return err
		}
		o.data = svg.Bytes()
	}
	cfg.outs[len(cfg.outs)-1].data = report.Bytes()
	if err := commitOutputs(cfg.outs, std); err != nil {
		return err
	}
	if problems > 0 {
		word := "problems"
		if problems == 1 {
			word = "problem"
		}
		return &exitError{exitProblems, fmt.Sprintf("%d %s found", problems, word)}
	}
	return nil
}

func readInput(in string, stdin io.Reader, stdinUsed *bool) ([]byte, string, error) {
	if in == "-" {
		if *stdinUsed {
			return nil, "", &exitError{exitBadInput, "standard input (-) given more than once"}
		}
		*stdinUsed = true
		src, err := io.ReadAll(stdin)
		if err != nil {
			return nil, "", &exitError{exitBadInput, "<stdin>: " + err.Error()}
		}
		return src, "<stdin>", nil
	}
	src, err := os.ReadFile(in)
	if err != nil {
		return nil, "", &exitError{exitBadInput, err.Error()}
	}
	return src, in, nil
}

// graphLayout is what layoutGraph makes of one graph: the drawing, the
// layout to write, its report record (empty without --report), the boxes
// it capped (for a note) and the graph's clusters (for notes and the
// preview's frames).
type graphLayout struct {
	res      *place.Result
	lay      dotio.Layout
	report   report.Graph
	caps     boxCaps
	clusters *clusterInfo
}

// layoutGraph draws one graph and converts grid points to DOT positions.
func layoutGraph(cfg *config, g *dotio.Graph, gi int, where string, step func(stage string, done float64)) (graphLayout, error) {
	edges := make([][2]int32, len(g.Edges))
	for i, e := range g.Edges {
		edges[i] = [2]int32{e.From, e.To}
	}
	var outer []int32
	for _, name := range cfg.outer {
		i, ok := g.Lookup(name)
		if !ok {
			outer = nil
			break
		}
		outer = append(outer, int32(i))
	}
	readable := cfg.unit == 0 && !cfg.gridOnly && cfg.method == place.Schnyder
	res, err := place.Draw(len(g.Nodes), edges, place.DrawOptions{
		Layout:   place.Options{Compact: true, Smooth: smoothSweeps, Outer: outer, Method: cfg.method},
		Readable: readable,
		Subgraph: planarize.SubgraphOptions{Effort: cfg.effort},
		Progress: func(stage string, done float64) { step(stage, 0.85*done) },
	})
	if errors.Is(err, place.ErrOuter) {
		return graphLayout{}, &exitError{exitBadInput, fmt.Sprintf("%s: --outer %s: no drawing has all of these nodes on its outer boundary (they may lie in different components, or the planar part keeps them apart)", where, strings.Join(cfg.outer, ","))}
	}
	if err != nil {
		return graphLayout{}, err
	}
	boxes, caps := cappedNodeBoxes(g)
	step("spacing", 0.85)
	spaceStart := time.Now()
	set := g.Clusters(preview.FrameKeys()...) // gathered, then framed
	var sp *place.Placed
	if readable {
		opt := place.ReadableOptions{EdgeExtra: labelRoom(g), Groups: clusterChains(set)}
		if g.Directed && !cfg.noFlow {
			if opt.Flow, opt.FlowDir, err = flowPairs(g); err != nil {
				return graphLayout{}, err
			}
		}
		sp, err = res.Readable(boxes, opt)
	} else {
		sp, err = res.Space(boxes, place.SpaceOptions{Unit: int64(cfg.unit), GridOnly: cfg.gridOnly})
	}
	if err != nil {
		return graphLayout{}, err
	}
	spaceTime := time.Since(spaceStart)
	var removed []bool
	if len(res.Removed) > 0 {
		removed = make([]bool, len(g.Edges))
		for _, i := range res.Removed {
			removed[i] = true
		}
	}
	// Digraph flow (README, "Clusters and direction"): the finished drawing is
	// mirrored or turned so that the most edges point along rankdir,
	// before the frames are put round it.
	sym := flow.Identity
	if g.Directed && !cfg.noFlow {
		if sym, err = orientFlow(g, removed, res.Kept(), sp, boxes); err != nil {
			return graphLayout{}, err
		}
	}
	// Clusters whose frames overlap or hold foreign nodes move apart
	// whole, sideways to the flow (README, "Clusters and direction").
	if readable && len(set.Clusters) > 0 {
		alongX := false
		if g.Directed && !cfg.noFlow {
			d, _, _ := flowDirection(g)
			dx, _ := d.Axis()
			alongX = dx != 0
		}
		if err := separateClusters(set, sp, boxes, res.Kept(), alongX); err != nil {
			return graphLayout{}, err
		}
	}
	lay := dotio.Layout{X: sp.X, Y: sp.Y, BB: [4]int64{0, 0, sp.Width, sp.Height}, Removed: removed}
	// Cluster frames (README, "What the output contains"): the drawing
	// moves, whole grid steps under --unit, so that it starts at 0,0
	// with its frames.
	var clusters *clusterInfo
	if len(set.Clusters) > 0 {
		if clusters, err = layoutFrames(set, &lay, boxes, int64(cfg.unit)); err != nil {
			return graphLayout{}, err
		}
		sp.Width, sp.Height = lay.BB[2], lay.BB[3]
	}
	if res.NotConvex > 0 && !cfg.quiet {
		cfg.prog.note("gridwood: %s: %d of %d components are not 3-connected and were drawn with the schnyder method: %s\n", where, res.NotConvex, len(res.Components), fellBackNames(g, res.FellBackVertices()))
	}
	if sp.Unchecked+sp.Crowded > 0 && !cfg.quiet {
		cfg.prog.note("gridwood: %s: %s; edges may pass through node boxes there (--check lists them)\n", where, unclearedText(sp.Unchecked, sp.Crowded))
	}
	if sp.Unrefined.Total() > 0 && !cfg.quiet {
		cfg.prog.note("gridwood: %s: %s\n", where, unrefinedText(sp.Unrefined))
	}
	var gr report.Graph
	if cfg.reportFile != "" {
		name := "schnyder"
		if cfg.method == place.Convex {
			name = "convex"
		}
		gr = graphMeasures(g, gi, name, res, sp, boxes, spaceTime)
		if sym.SwapsAxes() {
			gr.GridWidth, gr.GridHeight = gr.GridHeight, gr.GridWidth // the grid as drawn
		}
		if err := addStructure(&gr, g, lay.Removed, sp, clusters, res); err != nil {
			return graphLayout{}, err
		}
	}
	return graphLayout{res: res, lay: lay, report: gr, caps: caps, clusters: clusters}, nil
}

// When removal is not proved the fewest, standard error suggests
// --effort hintEffort for graphs of at most hintMaxEdges edges (as
// written), where that search is cheap: on random graphs of about 1,000
// edges it took 0.25 to 0.35 s (0.05 to 0.07 s without), against 0.75 s at
// 1,500, 4 s at 4,000 and 69 s at 16,000 (bench/RESULTS.md).
const (
	hintEffort   = 16
	hintMaxEdges = 1000
)

// edgeCounts returns how many of a graph's edges were removed, and how
// many it has, as messages count them: in a strict graph repeated edges
// (the same ends, and in a digraph the same direction) are one edge.
func edgeCounts(g *dotio.Graph, removed []int) (removedN, total int) {
	if !g.Strict {
		return len(removed), len(g.Edges)
	}
	key := func(e dotio.Edge) [2]int32 {
		if !g.Directed && e.From > e.To {
			return [2]int32{e.To, e.From}
		}
		return [2]int32{e.From, e.To}
	}
	seen := make(map[[2]int32]bool, len(g.Edges))
	for _, e := range g.Edges {
		seen[key(e)] = true
	}
	total = len(seen)
	clear(seen)
	for _, i := range removed {
		seen[key(g.Edges[i])] = true
	}
	return len(seen), total
}

// fellBackNames names the components Method Convex could not draw convex,
// each by its first node, up to five.
func fellBackNames(g *dotio.Graph, least []int) string {
	const most = 5
	var b strings.Builder
	for i, v := range least {
		if i == most {
			fmt.Fprintf(&b, " and %d more", len(least)-most)
			break
		}
		if i > 0 {
			b.WriteString(", ")
		}
		fmt.Fprintf(&b, "the one with %s", g.Nodes[v].ID)
	}
	return b.String()
}

// DOT's default node size in inches (from memory of its documentation, see
// SOURCES.md).
const defaultWidth, defaultHeight = 0.75, 0.5

// unclearedText says how many components the spacing could not clear of
// node boxes, and why (README, Limits; place/doc.go).
func unclearedText(unchecked, crowded int) string {
	plural := func(k int, what string) string {
		if k == 1 {
			return "1 " + what
		}
		return strconv.Itoa(k) + " " + what + "s"
	}
	var parts []string
	if unchecked > 0 {
		parts = append(parts, plural(unchecked, "component")+" too big for the box check (over 5,000 nodes, or past its work bound) kept at the base unit")
	}
	if crowded > 0 {
		parts = append(parts, plural(crowded, "component")+" that would need more than 2^29 points across to clear every box stretched that far")
	}
	return strings.Join(parts, "; ")
}

// labelRoom gives each labelled edge room for its label beside it in the
// readable drawing (README, Readable drawing): the label's longer side and
// the gap, added to the edge's ideal length. nil when no edge has a label.
func labelRoom(g *dotio.Graph) map[[2]int32]float64 {
	hw, hh := nodesize.EdgeLabelHalves(g)
	var room map[[2]int32]float64
	for i, e := range g.Edges {
		if hw[i] <= 0 && hh[i] <= 0 || e.From == e.To {
			continue
		}
		if room == nil {
			room = make(map[[2]int32]float64)
		}
		k := [2]int32{min(e.From, e.To), max(e.From, e.To)}
		room[k] = max(room[k], 2*max(hw[i], hh[i])+boxGap)
	}
	return room
}

// unrefinedText says how many components kept their spaced grid drawing
// instead of the readable one, and why (README, Readable drawing).
func unrefinedText(u place.Unrefinement) string {
	total := u.Total()
	if total == 1 {
		why := "it has over 20,000 nodes"
		switch {
		case u.Crowded == 1:
			why = "every plane drawing found was too crowded to part its boxes"
		case u.Area == 1:
			why = "its readable drawing clears its boxes only in more area than allowed (four times the spaced drawing's, nine if it flows better)"
		case u.Stress == 1:
			why = "its readable drawing had more stress than the spaced one (more than 1.5 times it, if it flows better)"
		}
		return "1 component keeps its spaced grid drawing, not the readable one: " + why
	}
	var parts []string
	for _, p := range []struct {
		k    int
		text string
	}{
		{u.TooLarge, "over 20,000 nodes"},
		{u.Crowded, "too crowded to part their boxes"},
		{u.Area, "clearing their boxes only in more area than allowed"},
		{u.Stress, "with more stress than the spaced drawing"},
	} {
		if p.k > 0 {
			parts = append(parts, strconv.Itoa(p.k)+" "+p.text)
		}
	}
	return strconv.Itoa(total) + " components keep their spaced grid drawing, not the readable one: " + strings.Join(parts, ", ")
}

// missingNames lists, quoted, the names g has no node of.
func missingNames(g *dotio.Graph, names []string) []string {
	var out []string
	for _, name := range names {
		if _, ok := g.Lookup(name); !ok {
			out = append(out, strconv.Quote(name))
		}
	}
	return out
}

// warnPinned notes input positions marked pinned with '!': gridwood
// replaces every pos, so say so rather than ignore them silently.
func warnPinned(p *progress, name string, f *dotio.File) {
	for gi, g := range f.Graphs {
		pinned := 0
		for _, n := range g.Nodes {
			if strings.HasSuffix(strings.TrimSpace(n.Attrs.Pos), "!") {
				pinned++
			}
		}
		if pinned > 0 {
			p.note("gridwood: %s\n", positioned(name, g.Line, g.Col, "%s: %d pinned positions (pos=\"...!\") replaced by the layout", g.Describe(gi), pinned))
		}
	}
}

// warnSizes names, one line per graph at its first such node, the node
// sizes the box rule does not take (see attrInches): not silently dropped.
func warnSizes(p *progress, name string, f *dotio.File) {
	for gi, g := range f.Graphs {
		count, first, what := 0, -1, ""
		for v, n := range g.Nodes {
			for _, a := range [...]struct{ attr, name string }{{n.Attrs.Width, "width"}, {n.Attrs.Height, "height"}, {n.Attrs.FontSize, "fontsize"}} {
				if val := strings.TrimSpace(a.attr); val != "" && !sizeTaken(val) {
					if count == 0 {
						first, what = v, fmt.Sprintf("%s %s", a.name, strconv.Quote(val))
					}
					count++
				}
			}
		}
		if count > 0 {
			n := g.Nodes[first]
			more := ""
			if count > 1 {
				more = fmt.Sprintf(" (and %d more sizes in %s)", count-1, g.Describe(gi))
			}
			p.note("gridwood: %s\n", positioned(name, n.Line, n.Col, "node %s: %s is not a size below 1000 and was taken as the default%s", strconv.Quote(n.Name), what, more))
		}
	}
}

// positioned formats a message at a place in a DOT file as dotio.Error
// does ("file:line:col: message"), so that every positioned message reads
// the same.
func positioned(file string, line, col int, format string, args ...any) string {
	return (&dotio.Error{File: file, Line: line, Col: col, Msg: fmt.Sprintf(format, args...)}).Error()
}
