package main

import (
	"bytes"
	"errors"
	"fmt"
	"io"
	"io/fs"
	"os"
	"path/filepath"
	"runtime/debug"
	"strconv"
	"strings"
	"time"

	"github.com/spf13/pflag"

	"github.com/gridwood/gridwood/dotio"
	"github.com/gridwood/gridwood/dotio/preview"
	"github.com/gridwood/gridwood/place"
	"github.com/gridwood/gridwood/planarize"
)

// Exit statuses, documented in --help and README.md.
const (
	exitOK        = 0
	exitProblems  = 1 // a check found problems
	exitBadInput  = 2 // bad input, usage, or an I/O failure
	exitNonPlanar = 3 // a graph is not planar under --planar-only
)

// smoothSweeps bounds the conjugate-gradient steps of the barycentric
// drawing (see place.Options.Smooth); Space uses it where the grid crowds.
const smoothSweeps = 400

// Work bounds for --explain, in edge visits of planarity tests, so that the
// output never depends on timing; variables so that tests can reach them.
var (
	explainBudgetEach  int64 = 20_000_000
	explainBudgetTotal int64 = 200_000_000
)

// config holds the parsed command line.
type config struct {
	output       string
	unit         int
	gridOnly     bool
	quiet        bool
	removedFile  string
	dropRemoved  bool
	markRemoved  []dotio.Attr
	planarOnly   bool
	explainFile  string
	effort       int
	maxExpansion int
	svgFile      string
	check        bool
	outer        []string
	reportFile   string
	method       place.Method
	prog         *progress // progress line and messages on standard error
	inputs       []string
}

// usageError is a command-line problem: it prints with a short usage (the
// flags by name) and a hint to --help.
type usageError struct{ msg, usage string }

func (e *usageError) Error() string { return e.msg }

// exitError carries an exit status with its message.
type exitError struct {
	status int
	msg    string
}

func (e *exitError) Error() string { return e.msg }

func run(args []string, stdin io.Reader, stdout, stderr io.Writer) int {
	cfg, err := parseFlags(args, stdout)
	if err != nil {
		if errors.Is(err, pflag.ErrHelp) {
			return exitOK
		}
		if err == errVersionShown {
			return exitOK
		}
		var ue *usageError
		if errors.As(err, &ue) && ue.usage != "" {
			fmt.Fprintf(stderr, "gridwood: %s\n%sRun 'gridwood --help' for what each flag does.\n", ue.msg, ue.usage)
		} else {
			fmt.Fprintf(stderr, "gridwood: %v\nRun 'gridwood --help' for usage.\n", err)
		}
		return exitBadInput
	}
	if err := process(cfg, stdin, stdout, stderr); err != nil {
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

var errVersionShown = errors.New("version shown")

// parseFlags reads the command line; --help and --version print to out
// (standard output: they are what was asked for).
func parseFlags(args []string, out io.Writer) (*config, error) {
	cfg := &config{}
	fs := pflag.NewFlagSet("gridwood", pflag.ContinueOnError)
	fs.SetOutput(io.Discard)
	fs.SortFlags = false
	fs.StringVarP(&cfg.output, "output", "o", "", "write the laid-out DOT to `FILE` instead of standard output\n(written to a temporary file first, then renamed: a failed run leaves FILE as it was)\nexample: -o site.laid.dot")
	fs.IntVarP(&cfg.unit, "unit", "u", 0, "`N` points per grid step, keeping every node on the grid; 0 chooses the spacing\nfrom the node sizes and labels (see README, Spacing)\nexample: --unit 36")
	fs.BoolVar(&cfg.gridOnly, "grid", false, "keep every node on its grid point even where the grid drawing is crowded\n(the spacing is still chosen from the node sizes)\nexample: --grid")
	fs.BoolVarP(&cfg.quiet, "quiet", "q", false, "print nothing on standard error except errors (no summary lines, no progress)\nexample: -q")
	fs.StringVar(&cfg.removedFile, "removed", "", "write the edges set aside to make a graph planar to `FILE`, as DOT:\none graph per input graph, one edge per line, with its attributes\nexample: --removed removed.dot")
	fs.BoolVar(&cfg.dropRemoved, "drop-removed", false, "leave the set-aside edges out of the main output\nexample: --drop-removed --removed removed.dot")
	mark := fs.String("mark-removed", "", "add these `ATTRS` to the set-aside edges in the main output\n(replacing any of the same name on their statement)\nexample: --mark-removed 'style=dashed,color=gray'")
	fs.BoolVar(&cfg.planarOnly, "planar-only", false, "treat a non-planar graph as an error (exit status 3, nothing written)\nexample: --planar-only")
	fs.StringVar(&cfg.explainFile, "explain", "", "write to `FILE`, for each set-aside edge, a Kuratowski subgraph (a subdivision\nof K5 or K3,3 made of it and kept edges) proving it could not stay, as DOT\nexample: --explain why.dot")
	fs.IntVar(&cfg.effort, "effort", 0, "extra search for fewer set-aside edges: `N` seeded restarts and a larger exact\nsearch on small blocks; the result for a given N is always the same\nexample: --effort 8")
	fs.IntVar(&cfg.maxExpansion, "max-expansion", dotio.DefaultMaxExpansion, "refuse input whose edge statements with subgraph operands ({a b} -- {c d})\nexpand to more than `N` edges; negative means no limit\nexample: --max-expansion 20000000")
	fs.StringVar(&cfg.svgFile, "svg", "", "also write a self-contained SVG picture of the result to `FILE` (set-aside\nedges dashed and curved, underneath); open it in any browser; with --check, a\npicture of the drawing as the input gives it\nexample: --svg preview.svg")
	fs.BoolVar(&cfg.check, "check", false, "do not lay out: check the pos of every node already in the input and report,\none per line on standard output (or -o FILE), crossing edges, nodes on edges\nthey do not end at, overlapping node boxes and edges through node boxes (boxes\nsized as the layout sizes them, grown to fit labels); exit status 1 if anything\nwas found; layout flags do not go with it\nexample: gridwood --check drawn.dot")
	method := fs.String("method", "schnyder", "drawing `METHOD`: schnyder (every planar graph, (n-2) x (n-2) grid per component,\nthen spaced and smoothed for reading) or convex (every face a convex polygon,\non the (f-1) x (f-1) grid, for 3-connected components; the others fall back\nto schnyder and standard error names them)\nexample: --method convex")
	outer := fs.String("outer", "", "`NAMES` of nodes that must lie on the outer boundary of the drawing, comma\nseparated (as the names are written, without quotes); applies to every graph\nthat has all of them. Default: a largest face of the graph is the outside\nexample: --outer Refectory,Gym,Chapel")
	fs.StringVar(&cfg.reportFile, "report", "", "write a JSON quality report to `FILE`: per graph its size, set-aside edges,\ngrid size, area, smallest angle, edge length ratio, node clearance and the\ntime of each stage (README, Quality report, explains the fields)\nexample: --report quality.json")
	version := fs.Bool("version", false, "print the version and exit\nexample: --version")
	help := fs.BoolP("help", "h", false, "show this help and exit\nexample: -h")
	fs.Usage = func() {}
	short := shortUsage(fs)
	if err := fs.Parse(args); err != nil {
		return nil, &usageError{err.Error(), short}
	}
	if *help {
		printHelp(out, fs)
		return nil, pflag.ErrHelp
	}
	if *version {
		fmt.Fprintf(out, "gridwood %s\n", versionString())
		return nil, errVersionShown
	}
	if cfg.unit < 0 || cfg.unit > 100000 {
		return nil, &usageError{fmt.Sprintf("--unit %d: want 0 (automatic) to 100000 points", cfg.unit), short}
	}
	if cfg.effort < 0 || cfg.effort > 1000 {
		return nil, &usageError{fmt.Sprintf("--effort %d: want 0 to 1000", cfg.effort), short}
	}
	if *mark != "" {
		attrs, err := dotio.ParseAttrList(*mark)
		if err != nil {
			return nil, &usageError{"--mark-removed: " + err.Error(), short}
		}
		cfg.markRemoved = attrs
	}
	switch *method {
	case "schnyder":
		cfg.method = place.Schnyder
	case "convex":
		cfg.method = place.Convex
	default:
		return nil, &usageError{fmt.Sprintf("--method %q: want schnyder or convex", *method), short}
	}
	if cfg.check {
		// --check lays nothing out: a layout flag with it would be
		// silently ignored.
		// --svg is no layout flag: with --check it draws the input's own
		// drawing.
		for _, name := range []string{"unit", "grid", "removed", "drop-removed", "mark-removed", "planar-only", "explain", "effort", "method", "outer", "report"} {
			if fs.Changed(name) {
				return nil, &usageError{"--check lays nothing out: --" + name + " does not go with it", short}
			}
		}
	}
	if fs.Changed("outer") && strings.TrimSpace(*outer) == "" {
		return nil, &usageError{"--outer: no node names given", short}
	}
	if *outer != "" {
		for _, name := range strings.Split(*outer, ",") {
			if name = strings.TrimSpace(name); name == "" {
				return nil, &usageError{"--outer: empty node name in " + strconv.Quote(*outer), short}
			}
			cfg.outer = append(cfg.outer, name)
		}
	}
	if cfg.maxExpansion == 0 {
		return nil, &usageError{"--max-expansion 0: want a positive number of edges, or a negative one for no limit", short}
	}
	cfg.inputs = fs.Args()
	if len(cfg.inputs) == 0 {
		cfg.inputs = []string{"-"}
	}
	if err := checkClashes(cfg); err != nil {
		return nil, &usageError{err.Error(), short}
	}
	return cfg, nil
}

// checkClashes refuses a command line on which two outputs name the same
// file, or an output names an input: one would overwrite the other.
func checkClashes(cfg *config) error {
	type named struct{ flag, path string }
	var outs []named
	for _, o := range []named{{"-o", cfg.output}, {"--removed", cfg.removedFile}, {"--explain", cfg.explainFile}, {"--svg", cfg.svgFile}, {"--report", cfg.reportFile}} {
		if o.path != "" {
			outs = append(outs, o)
		}
	}
	same := func(a, b string) bool {
		if filepath.Clean(a) == filepath.Clean(b) {
			return true
		}
		fa, errA := os.Stat(a)
		fb, errB := os.Stat(b)
		return errA == nil && errB == nil && os.SameFile(fa, fb) && fa.Mode().IsRegular()
	}
	for i, o := range outs {
		for _, p := range outs[:i] {
			if same(o.path, p.path) {
				return fmt.Errorf("%s and %s both name %s", p.flag, o.flag, o.path)
			}
		}
		for _, in := range cfg.inputs {
			if in != "-" && same(o.path, in) {
				return fmt.Errorf("%s %s is also an input file", o.flag, o.path)
			}
		}
	}
	return nil
}

// shortUsage is the usage line and the flags by name, for a usage error.
func shortUsage(fs *pflag.FlagSet) string {
	var b strings.Builder
	b.WriteString("Usage: gridwood [flags] [FILE ...]\nFlags:")
	width := len("Flags:")
	fs.VisitAll(func(f *pflag.Flag) {
		name, _ := pflag.UnquoteUsage(f)
		item := "--" + f.Name
		if f.Shorthand != "" {
			item = "-" + f.Shorthand + "/" + item
		}
		if name != "" && f.Value.Type() != "bool" {
			item += " " + name
		}
		if width+1+len(item) > 78 {
			b.WriteString("\n      ")
			width = 6
		}
		b.WriteString(" " + item)
		width += 1 + len(item)
	})
	b.WriteString("\n")
	return b.String()
}

func printHelp(w io.Writer, fs *pflag.FlagSet) {
	fmt.Fprint(w, `gridwood: give graphs in DOT integer positions for crossing-free straight-line drawings

Usage: gridwood [flags] [FILE ...]

Reads each FILE (standard input when there is none, or for "-") and writes
the same DOT with pos="X,Y" on every node and bb on every graph. Planar
graphs are drawn on Schnyder's (n-2) x (n-2) grid per connected component.
A non-planar graph first loses an inclusion-minimal set of edges (adding any
one back would force a crossing); they are reported on standard error and
kept in the output unless --drop-removed is given.

Flags:
`)
	fs.VisitAll(func(f *pflag.Flag) {
		name, usage := pflag.UnquoteUsage(f)
		head := "      --" + f.Name
		if f.Shorthand != "" {
			head = "  -" + f.Shorthand + ", --" + f.Name
		}
		if name != "" && f.Value.Type() != "bool" {
			head += " " + name
		}
		fmt.Fprintln(w, head)
		for _, line := range strings.Split(usage, "\n") {
			fmt.Fprintf(w, "        %s\n", line)
		}
		def := f.DefValue
		switch {
		case flagDefaults[f.Name] != "":
			def = flagDefaults[f.Name]
		case def == "" || def == "false":
			def = "off"
		}
		fmt.Fprintf(w, "        default: %s\n", def)
	})
	fmt.Fprint(w, `
Exit status:
  0  done
  1  a check found problems
  2  bad input, bad usage, or a file could not be read or written
  3  a graph is not planar and --planar-only was given

Examples:
  gridwood examples/campus-fibre.dot > laid.dot
  gridwood --removed removed.dot --mark-removed style=dashed net.dot -o net.laid.dot
`)
}

// flagDefaults words the defaults that the bare value would not explain.
var flagDefaults = map[string]string{
	"output":        "standard output",
	"unit":          "0, chosen from the node sizes",
	"effort":        "0",
	"max-expansion": "1000000",
	"method":        "schnyder",
	"outer":         "a largest face of each graph",
}

func versionString() string {
	bi, ok := debug.ReadBuildInfo()
	if !ok {
		return "(unknown)"
	}
	v := bi.Main.Version
	if v == "" {
		v = "(devel)"
	}
	for _, s := range bi.Settings {
		// A pseudo-version already ends in the revision; name it only
		// when it does not.
		if s.Key == "vcs.revision" && len(s.Value) >= 12 && !strings.HasSuffix(v, s.Value[:12]) {
			v += " " + s.Value[:12]
		}
	}
	return v
}

// process runs the whole filter; nothing is written until every input was
// read and laid out, so a failure leaves no partial output.
func process(cfg *config, stdin io.Reader, stdout, stderr io.Writer) error {
	if cfg.check {
		return checkInputs(cfg, stdin, stdout, stderr)
	}
	var out, removedOut, explainOut, svgOut bytes.Buffer
	var pictures []preview.Graph
	var reports []fileReport
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
		rep := fileReport{File: name, ReadSeconds: time.Since(readStart).Seconds()}
		layouts := make([]dotio.Layout, len(f.Graphs))
		removed := make([][]int, len(f.Graphs))
		results := make([]*place.Result, len(f.Graphs))
		totalEdges, edgesDone := 0, 0
		for _, g := range f.Graphs {
			totalEdges += len(g.Edges) + 1
		}
		for gi, g := range f.Graphs {
			drawing := fmt.Sprintf("drawing %s in %s: ", graphName(g, gi), name)
			before, share := float64(edgesDone), float64(len(g.Edges)+1)
			edgesDone += len(g.Edges) + 1
			step := func(stage string, done float64) {
				prog.set(drawing+stage, pct(ii, 0.4+0.5*(before+done*share)/float64(totalEdges)))
			}
			res, lay, _, gr, err := layoutGraph(cfg, g, gi, fmt.Sprintf("%s:%d:%d: %s", name, g.Line, g.Col, graphName(g, gi)), step)
			if err != nil {
				return err
			}
			rep.Graphs = append(rep.Graphs, gr)
			if gr.caps.count > 0 && !cfg.quiet {
				n := g.Nodes[gr.caps.first]
				more := ""
				if gr.caps.count > 1 {
					more = fmt.Sprintf(" (and %d more in %s)", gr.caps.count-1, graphName(g, gi))
				}
				prog.note("gridwood: %s:%d:%d: node %s: its label needs a box over 1000 inches a side; the box was taken as 1000 inches%s\n", name, n.Line, n.Col, strconv.Quote(n.Name), more)
			}
			layouts[gi], removed[gi] = lay, res.Removed
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
					lacks = append(lacks, [2]string{fmt.Sprintf("%s:%d:%d", name, g.Line, g.Col), graphName(g, gi) + " lacks " + strings.Join(missing, ", ")})
				}
			}
			if len(res.Removed) == 0 {
				continue
			}
			where := fmt.Sprintf("%s:%d:%d: %s", name, g.Line, g.Col, graphName(g, gi))
			if cfg.planarOnly {
				return &exitError{exitNonPlanar, fmt.Sprintf("%s is not planar: %d of %d edges would have to be set aside", where, len(res.Removed), len(g.Edges))}
			}
			if !cfg.quiet {
				see := "see --removed"
				if cfg.removedFile != "" {
					see = "listed in " + cfg.removedFile
				}
				prog.note("gridwood: %s: %d of %d edges set aside to make it planar (%s)\n", where, len(res.Removed), len(g.Edges), see)
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
				pictures = append(pictures, preview.FromLayout(g, layouts[gi]))
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
	// All inputs succeeded: every file is written to a temporary first and
	// only when all of them are complete renamed into place, the main
	// output last, so that a failure leaves every file as it was.
	var files []pendingFile
	if cfg.reportFile != "" {
		var buf bytes.Buffer
		if err := writeReport(&buf, reports); err != nil {
			return err
		}
		files = append(files, pendingFile{path: cfg.reportFile, data: buf.Bytes()})
	}
	if cfg.svgFile != "" {
		if err := writeSVG(&svgOut, pictures, cfg.svgFile, cfg.quiet, stderr); err != nil {
			return err
		}
		files = append(files, pendingFile{path: cfg.svgFile, data: svgOut.Bytes()})
	}
	if cfg.removedFile != "" {
		files = append(files, pendingFile{path: cfg.removedFile, data: removedOut.Bytes()})
	}
	if cfg.explainFile != "" {
		files = append(files, pendingFile{path: cfg.explainFile, data: explainOut.Bytes()})
	}
	if cfg.output != "" {
		files = append(files, pendingFile{path: cfg.output, data: out.Bytes()})
	}
	if err := writeFilesAtomic(files); err != nil {
		return err
	}
	if cfg.output != "" {
		return nil
	}
	_, err := stdout.Write(out.Bytes())
	return err
}

// checkInputs runs --check: every input's drawing is checked as given and
// the problems are listed on stdout.
func checkInputs(cfg *config, stdin io.Reader, stdout, stderr io.Writer) error {
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
		k, err := checkFile(&report, f)
		if err != nil {
			return err
		}
		problems += k
		if cfg.svgFile != "" {
			pictures = appendInputPictures(pictures, f, cfg.quiet, stderr)
		}
	}
	var files []pendingFile
	if cfg.svgFile != "" {
		var svg bytes.Buffer
		if err := writeSVG(&svg, pictures, cfg.svgFile, cfg.quiet, stderr); err != nil {
			return err
		}
		files = append(files, pendingFile{path: cfg.svgFile, data: svg.Bytes()})
	}
	if cfg.output != "" {
		files = append(files, pendingFile{path: cfg.output, data: report.Bytes()})
	}
	if err := writeFilesAtomic(files); err != nil {
		return err
	}
	if cfg.output == "" {
		if _, err := stdout.Write(report.Bytes()); err != nil {
			return err
		}
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

// layoutGraph draws one graph, converts grid points to DOT positions, and
// returns the node boxes it spaced for (the SVG draws the same ones).
func layoutGraph(cfg *config, g *dotio.Graph, gi int, where string, step func(stage string, done float64)) (*place.Result, dotio.Layout, place.Boxes, graphReport, error) {
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
	res, err := place.Draw(len(g.Nodes), edges, place.DrawOptions{
		Layout:   place.Options{Compact: true, Smooth: smoothSweeps, Outer: outer, Method: cfg.method},
		Subgraph: planarize.SubgraphOptions{Effort: cfg.effort},
		Progress: func(stage string, done float64) { step(stage, 0.85*done) },
	})
	if errors.Is(err, place.ErrOuter) {
		return nil, dotio.Layout{}, place.Boxes{}, graphReport{}, &exitError{exitBadInput, fmt.Sprintf("%s: --outer %s: no drawing has all of these nodes on its outer boundary (they may lie in different components, or the planar part keeps them apart)", where, strings.Join(cfg.outer, ","))}
	}
	if err != nil {
		return nil, dotio.Layout{}, place.Boxes{}, graphReport{}, err
	}
	boxes, caps := cappedNodeBoxes(g)
	step("spacing", 0.85)
	spaceStart := time.Now()
	sp, err := res.Space(boxes, place.SpaceOptions{Unit: int64(cfg.unit), GridOnly: cfg.gridOnly})
	if err != nil {
		return nil, dotio.Layout{}, place.Boxes{}, graphReport{}, err
	}
	spaceTime := time.Since(spaceStart)
	lay := dotio.Layout{X: sp.X, Y: sp.Y, BB: [4]int64{0, 0, sp.Width, sp.Height}}
	if len(res.Removed) > 0 {
		lay.Removed = make([]bool, len(g.Edges))
		for _, i := range res.Removed {
			lay.Removed[i] = true
		}
	}
	if res.NotConvex > 0 && !cfg.quiet {
		cfg.prog.note("gridwood: %s: %d of %d components are not 3-connected and were drawn with the schnyder method: %s\n", where, res.NotConvex, len(res.Components), fellBackNames(g, res.FellBackVertices()))
	}
	if sp.Unchecked+sp.Crowded > 0 && !cfg.quiet {
		cfg.prog.note("gridwood: %s: %s; edges may pass through node boxes there (--check lists them)\n", where, unclearedText(sp.Unchecked, sp.Crowded))
	}
	var gr graphReport
	if cfg.reportFile != "" {
		name := "schnyder"
		if cfg.method == place.Convex {
			name = "convex"
		}
		gr = graphMeasures(g, gi, name, res, sp, boxes, spaceTime)
	}
	gr.caps = caps
	return res, lay, boxes, gr, nil
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
// node boxes, and why (README, Spacing).
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

func graphName(g *dotio.Graph, index int) string {
	kind := "graph"
	if g.Directed {
		kind = "digraph"
	}
	if g.ID == "" {
		return fmt.Sprintf("anonymous %s %d", kind, index+1)
	}
	if strings.HasPrefix(g.ID, `"`) {
		return kind + " " + g.ID
	}
	return kind + " " + strconv.Quote(g.ID)
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
			p.note("gridwood: %s:%d:%d: %s: %d pinned positions (pos=\"...!\") replaced by the layout\n", name, g.Line, g.Col, graphName(g, gi), pinned)
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
				more = fmt.Sprintf(" (and %d more sizes in %s)", count-1, graphName(g, gi))
			}
			p.note("gridwood: %s:%d:%d: node %s: %s is not a size below 1000 and was taken as the default%s\n", name, n.Line, n.Col, strconv.Quote(n.Name), what, more)
		}
	}
}

// pendingFile is an output file's path and its whole contents.
type pendingFile struct {
	path string
	data []byte
}

// followLinks returns the file a chain of symbolic links ends at, even
// when that file does not exist yet (a dangling link gets its file
// created), or path itself if it is not a link.
func followLinks(path string) string {
	for range 40 { // the usual system limit on links followed
		fi, err := os.Lstat(path)
		if err != nil || fi.Mode()&os.ModeSymlink == 0 {
			return path
		}
		target, err := os.Readlink(path)
		if err != nil {
			return path
		}
		if !filepath.IsAbs(target) {
			target = filepath.Join(filepath.Dir(path), target)
		}
		path = target
	}
	return path
}

// writeFilesAtomic writes each file to a temporary file next to it (with
// the permissions of the file it replaces, or 0644) and, once all are
// written, renames them into place in order. So readers never see a
// half-written file, and a failure before the renames (a full disk, a
// missing directory) leaves every existing file untouched. A symbolic
// link is followed (the link stays); a target that exists and is not a
// regular file, such as a named pipe or /dev/null, is written to directly
// once all the temporary files are written, since renaming would replace
// it with a file.
func writeFilesAtomic(files []pendingFile) error {
	temps := make([]string, 0, len(files))
	// fail names the file the user gave, not the temporary one, and the
	// cause without the operation's own wording.
	fail := func(path string, err error) error {
		for _, name := range temps {
			os.Remove(name)
		}
		var pe *fs.PathError
		if errors.As(err, &pe) {
			err = pe.Err
		}
		return &exitError{exitBadInput, fmt.Sprintf("%s: cannot write: %v", path, err)}
	}
	var renamed, direct []pendingFile
	for _, f := range files {
		// A symbolic link stays: the file it names is replaced. Something
		// that is not a regular file (a pipe, a terminal, /dev/null) is
		// written to directly: a rename would put a file in its place.
		// Through the links first: /dev/stdout or a shell's >(...) is a
		// link to something that is no file name at all.
		if fi, err := os.Stat(f.path); err == nil && !fi.Mode().IsRegular() {
			direct = append(direct, f)
			continue
		}
		given := f.path
		f.path = followLinks(f.path)
		renamed = append(renamed, f)
		tmp, err := os.CreateTemp(filepath.Dir(f.path), "."+filepath.Base(f.path)+".tmp*")
		if err != nil {
			return fail(given, err)
		}
		temps = append(temps, tmp.Name())
		_, err = tmp.Write(f.data)
		if cerr := tmp.Close(); err == nil {
			err = cerr
		}
		if err == nil {
			if fi, serr := os.Stat(f.path); serr == nil {
				err = os.Chmod(tmp.Name(), fi.Mode().Perm())
			} else {
				err = os.Chmod(tmp.Name(), 0o644)
			}
		}
		if err != nil {
			return fail(given, err)
		}
	}
	for _, f := range direct {
		if err := os.WriteFile(f.path, f.data, 0); err != nil {
			return fail(f.path, err)
		}
	}
	for i, f := range renamed {
		if err := os.Rename(temps[i], f.path); err != nil {
			return fail(f.path, err) // the temporaries not yet renamed go
		}
	}
	return nil
}
