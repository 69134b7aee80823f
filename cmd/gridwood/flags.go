package main

import (
	"errors"
	"fmt"
	"io"
	"runtime/debug"
	"strconv"
	"strings"

	"github.com/spf13/pflag"

	"github.com/gridwood/gridwood/dotio"
	"github.com/gridwood/gridwood/place"
)

// The command line: its flags, their help text, the version, and the
// errors that end a run with a status.

// config holds the parsed command line.
type config struct {
	output       string
	unit         int
	gridOnly     bool
	noFlow       bool
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
	help         bool
	version      bool
	flags        *pflag.FlagSet
	outs         []*output // where each output goes (output.go), the main output last
}

// usageError is a command-line problem: it prints as one line with a
// pointer to --help.
type usageError struct{ msg string }

func (e *usageError) Error() string { return e.msg }

// exitError carries an exit status with its message.
type exitError struct {
	status int
	msg    string
}

func (e *exitError) Error() string { return e.msg }

// flagGroups orders the flags in --help under headings.
var flagGroups = []struct {
	title string
	flags []string
}{
	{"Input and output", []string{"output", "quiet", "max-expansion"}},
	{"Drawing", []string{"unit", "grid", "method", "outer", "no-flow"}},
	{"Non-planar graphs", []string{"removed", "drop-removed", "mark-removed", "planar-only", "explain", "effort"}},
	{"Checking and preview", []string{"check", "svg", "report"}},
	{"About gridwood", []string{"version", "help"}},
}

// parseFlags reads the command line. Its errors are usage errors, one
// line each.
func parseFlags(args []string) (*config, error) {
	cfg := &config{}
	fs := pflag.NewFlagSet("gridwood", pflag.ContinueOnError)
	fs.SetOutput(io.Discard)
	fs.Usage = func() {}
	fs.StringVarP(&cfg.output, "output", "o", "", "write the laid-out DOT to `FILE` instead of standard output; FILE\nis replaced only once the whole run has succeeded")
	fs.BoolVarP(&cfg.quiet, "quiet", "q", false, "print nothing on standard error but errors: no summaries, warnings\nor progress")
	fs.IntVar(&cfg.maxExpansion, "max-expansion", dotio.DefaultMaxExpansion, "refuse input whose edge statements with subgraph operands\n({a b} -- {c d}) expand to more than `N` edges; negative: no limit")
	fs.IntVarP(&cfg.unit, "unit", "u", 0, "`N` points per grid step, every node kept on its grid point (no\nreadable stage); 0 chooses the spacing from node sizes and\nlabels, and the default readable drawing (README, Readable drawing)")
	fs.BoolVar(&cfg.gridOnly, "grid", false, "keep the grid drawing, stretched to clear the node boxes, instead\nof the readable one")
	method := fs.String("method", "schnyder", "drawing `METHOD`: schnyder draws every planar graph; convex draws\n3-connected components with every face convex (the others fall\nback to schnyder, and standard error names them); convex keeps\nits drawing, without the readable stage")
	outer := fs.String("outer", "", "comma-separated `NAMES` of nodes that must lie on the outer\nboundary, as written but without quotes; applies to every graph\nthat has all of them\nexample: --outer Refectory,Gym,Chapel")
	fs.BoolVar(&cfg.noFlow, "no-flow", false, "do not point a digraph's edges along its rankdir (TB when\nunset); by default the readable stage keeps edges not on a\ndirected cycle pointing that way where it can, and the drawing is\nmirrored, or turned a quarter when the boxes stay clear, to point\nthe most along it")
	fs.StringVar(&cfg.removedFile, "removed", "", "write the removed edges to `FILE` as DOT: one graph per input\ngraph, one edge per line with its attributes, in input order")
	fs.BoolVar(&cfg.dropRemoved, "drop-removed", false, "leave the removed edges out of the main output")
	mark := fs.String("mark-removed", "", "add these `ATTRS` to the removed edges in the main output,\nreplacing any of the same name on their statement\nexample: --mark-removed 'style=dashed,color=\"#999999\"'")
	fs.BoolVar(&cfg.planarOnly, "planar-only", false, "treat a non-planar graph as an error (exit status 3)")
	fs.StringVar(&cfg.explainFile, "explain", "", "write to `FILE`, for each removed edge, a Kuratowski subgraph (a\nsubdivision of K5 or K3,3 made of it and kept edges) proving it\ncould not stay, as DOT; one graph per input graph")
	fs.IntVar(&cfg.effort, "effort", 0, "search more for fewer removed edges: `N` seeded restarts and a\nwider exact search on small blocks; the same N always gives the\nsame result")
	fs.BoolVar(&cfg.check, "check", false, "lay nothing out: check the positions already in the input and\nlist crossing edges, nodes on edges, overlapping node boxes,\nedges through node boxes, nodes in the frames of clusters they\nare not in and overlapping cluster frames, one per line; exit\nstatus 1 if any\nexample: gridwood -q net.dot | gridwood --check")
	fs.StringVar(&cfg.svgFile, "svg", "", "also write a self-contained SVG picture of the result to `FILE`;\nwith --check, a picture of the drawing as the input gives it")
	fs.StringVar(&cfg.reportFile, "report", "", "write a JSON quality report to `FILE` (README, Quality report)")
	fs.BoolVar(&cfg.version, "version", false, "print the version and exit")
	fs.BoolVarP(&cfg.help, "help", "h", false, "print this help and exit")
	cfg.flags = fs
	if err := fs.Parse(args); err != nil {
		return nil, &usageError{flagErrorText(fs, args, err)}
	}
	if cfg.help || cfg.version {
		return cfg, nil
	}
	if cfg.unit < 0 || cfg.unit > 100000 {
		return nil, &usageError{fmt.Sprintf("--unit %d: want 0 (automatic) to 100000 points", cfg.unit)}
	}
	if cfg.effort < 0 || cfg.effort > 1000 {
		return nil, &usageError{fmt.Sprintf("--effort %d: want 0 to 1000", cfg.effort)}
	}
	if *mark != "" {
		attrs, err := dotio.ParseAttrList(*mark)
		if err != nil {
			return nil, &usageError{"--mark-removed: " + err.Error()}
		}
		cfg.markRemoved = attrs
	}
	switch *method {
	case "schnyder":
		cfg.method = place.Schnyder
	case "convex":
		cfg.method = place.Convex
	default:
		return nil, &usageError{fmt.Sprintf("--method %q: want schnyder or convex", *method)}
	}
	if cfg.check {
		// --check lays nothing out: a layout flag with it would be
		// silently ignored.
		// --svg is no layout flag: with --check it draws the input's own
		// drawing.
		for _, name := range []string{"unit", "grid", "removed", "drop-removed", "mark-removed", "planar-only", "explain", "effort", "method", "outer", "report", "no-flow"} {
			if fs.Changed(name) {
				return nil, &usageError{"--check lays nothing out: --" + name + " does not go with it"}
			}
		}
	}
	if fs.Changed("outer") && strings.TrimSpace(*outer) == "" {
		return nil, &usageError{"--outer: no node names given"}
	}
	if *outer != "" {
		for _, name := range strings.Split(*outer, ",") {
			if name = strings.TrimSpace(name); name == "" {
				return nil, &usageError{"--outer: empty node name in " + strconv.Quote(*outer)}
			}
			cfg.outer = append(cfg.outer, name)
		}
	}
	if cfg.maxExpansion == 0 {
		return nil, &usageError{"--max-expansion 0: want a positive number of edges, or a negative one for no limit"}
	}
	cfg.inputs = fs.Args()
	if len(cfg.inputs) == 0 {
		cfg.inputs = []string{"-"}
	}
	return cfg, nil
}

// flagErrorText words pflag's errors as one line, with the nearest flag
// for a misspelt one.
func flagErrorText(fs *pflag.FlagSet, args []string, err error) string {
	var notExist *pflag.NotExistError
	var noValue *pflag.ValueRequiredError
	var badValue *pflag.InvalidValueError
	switch {
	case errors.As(err, &notExist):
		given := "--" + notExist.GetSpecifiedName()
		guess := notExist.GetSpecifiedName()
		if group := notExist.GetSpecifiedShortnames(); group != "" {
			// -x, or -help for --help: the argument may be a long flag
			// given with one dash. pflag names only the rest of the group
			// from the unknown letter on; the argument is the first that
			// ends with it.
			given = "-" + group
			for _, a := range args {
				if a == "--" {
					break
				}
				if a, _, _ = strings.Cut(a, "="); !strings.HasPrefix(a, "--") && strings.HasSuffix(a, group) {
					given = a
					break
				}
			}
			guess = strings.TrimPrefix(given, "-")
		}
		near := nearestFlag(fs, guess)
		if near == "" && notExist.GetSpecifiedShortnames() != "" && len(given) > 2 {
			return fmt.Sprintf("unknown flag -%s in %s", notExist.GetSpecifiedName(), given)
		}
		msg := "unknown flag " + given
		if near != "" {
			msg += "; did you mean --" + near + "?"
		}
		return msg
	case errors.As(err, &noValue):
		return "--" + noValue.GetFlag().Name + " needs a value"
	case errors.As(err, &badValue):
		f := badValue.GetFlag()
		want := "a whole number"
		if f.Value.Type() == "bool" {
			want = "true or false, or nothing"
		}
		return fmt.Sprintf("--%s %s: want %s", f.Name, strconv.Quote(badValue.GetValue()), want)
	}
	return err.Error()
}

// nearestFlag returns the flag whose name is closest to name by edit
// distance (insertions, deletions, substitutions and swaps of neighbours
// each cost 1), if it is close enough to be a slip: at most 1 for names
// up to 5 characters, 2 above. Ties go to the flag listed first in
// --help, so the answer is always the same.
func nearestFlag(fs *pflag.FlagSet, name string) string {
	best, bestD := "", min(2, max(1, len(name)/3))+1
	for _, g := range flagGroups {
		for _, f := range g.flags {
			if fs.Lookup(f) == nil {
				continue
			}
			if d := editDistance(strings.ToLower(name), f); d < bestD {
				best, bestD = f, d
			}
		}
	}
	return best
}

// editDistance is the optimal string alignment distance of a and b, by
// bytes (flag names are ASCII).
func editDistance(a, b string) int {
	prev2 := make([]int, len(b)+1)
	prev := make([]int, len(b)+1)
	cur := make([]int, len(b)+1)
	for j := range prev {
		prev[j] = j
	}
	for i := 1; i <= len(a); i++ {
		cur[0] = i
		for j := 1; j <= len(b); j++ {
			cost := 1
			if a[i-1] == b[j-1] {
				cost = 0
			}
			cur[j] = min(prev[j]+1, cur[j-1]+1, prev[j-1]+cost)
			if i > 1 && j > 1 && a[i-1] == b[j-2] && a[i-2] == b[j-1] {
				cur[j] = min(cur[j], prev2[j-2]+1)
			}
		}
		prev2, prev, cur = prev, cur, prev2
	}
	return prev[len(b)]
}

func printHelp(w io.Writer, fs *pflag.FlagSet) {
	fmt.Fprint(w, `gridwood lays out graphs written in DOT so that no two straight edges cross.

Usage: gridwood [flags] [FILE ...]

It reads each FILE (standard input when there is none, or for "-") and
writes the same DOT, with pos="X,Y" on every node and bb on every graph, to
standard output or to -o FILE. A non-planar graph first loses an
inclusion-minimal set of edges (putting any one back would force a
crossing); standard error says how many were removed, and the output keeps
them unless --drop-removed is given.
`)
	for _, g := range flagGroups {
		fmt.Fprintf(w, "\n%s:\n", g.title)
		for _, name := range g.flags {
			f := fs.Lookup(name)
			arg, usage := pflag.UnquoteUsage(f)
			head := "      --" + f.Name
			if f.Shorthand != "" {
				head = "  -" + f.Shorthand + ", --" + f.Name
			}
			if arg != "" && f.Value.Type() != "bool" {
				head += " " + arg
			}
			fmt.Fprintln(w, head)
			for _, line := range strings.Split(usage, "\n") {
				fmt.Fprintf(w, "        %s\n", line)
			}
			if f.Value.Type() != "bool" {
				def := f.DefValue
				if d, ok := flagDefaults[f.Name]; ok {
					def = d
				}
				fmt.Fprintf(w, "        default: %s\n", def)
			}
		}
	}
	fmt.Fprint(w, `
Exit status:
  0    done
  1    --check found problems
  2    bad input, bad usage, or a file that could not be read or written
  3    a graph is not planar and --planar-only was given
  141  killed by SIGPIPE: the reader of standard output stopped reading
       (as in gridwood ... | head); the side files are then not written
On any error nothing is written: no output file is created or changed.

Examples:
  gridwood net.dot > net.laid.dot
  gridwood --removed removed.dot --mark-removed style=dashed \
      -o net.laid.dot net.dot
`)
}

// flagDefaults words the defaults that the bare value would not explain.
var flagDefaults = map[string]string{
	"output":        "standard output",
	"unit":          "0, chosen from the node sizes",
	"max-expansion": "1000000",
	"outer":         "a largest face of each graph",
	"removed":       "none",
	"explain":       "none",
	"svg":           "none",
	"report":        "none",
	"mark-removed":  "none",
}

// versionString names the build: the module version when gridwood was
// built as a module (go install ...@version), else the VCS revision the
// go command recorded (with its time, and "modified" for uncommitted
// changes), else says that there is none.
func versionString() string {
	bi, ok := debug.ReadBuildInfo()
	return versionOf(bi, ok)
}

func versionOf(bi *debug.BuildInfo, ok bool) string {
	if !ok || bi == nil {
		return "(no version: built without module information)"
	}
	settings := map[string]string{}
	for _, s := range bi.Settings {
		settings[s.Key] = s.Value
	}
	rev, at := settings["vcs.revision"], settings["vcs.time"]
	if v := bi.Main.Version; v != "" && v != "(devel)" {
		// A pseudo-version already holds the revision and its time.
		return v
	}
	if rev == "" {
		return "(no version: built from a source tree without VCS information)"
	}
	if len(rev) > 12 {
		rev = rev[:12]
	}
	s := "revision " + rev
	var notes []string
	if at != "" {
		notes = append(notes, at)
	}
	if settings["vcs.modified"] == "true" {
		notes = append(notes, "modified")
	}
	if len(notes) > 0 {
		s += " (" + strings.Join(notes, ", ") + ")"
	}
	return s
}
