package dotio

import (
	"bytes"
	"errors"
	"fmt"
	"math"
	"regexp"
	"slices"
	"sort"
	"strconv"
	"strings"
	"sync"
	"unicode/utf8"

	"gonum.org/v1/gonum/graph/formats/dot"
	"gonum.org/v1/gonum/graph/formats/dot/ast"
)

// Error is a problem with the input, positioned at a 1-based line and a
// 1-based column counted in bytes (a tab counts 1). Line is 0 when no
// position is known.
type Error struct {
	File      string
	Line, Col int
	Msg       string
}

func (e *Error) Error() string {
	if e.Line == 0 {
		return e.File + ": " + e.Msg
	}
	return fmt.Sprintf("%s:%d:%d: %s", e.File, e.Line, e.Col, e.Msg)
}

// DefaultMaxExpansion is the default cap on the number of edges that edge
// statements with a subgraph operand may produce in one file.
const DefaultMaxExpansion = 1_000_000

// ReadOptions configure Read.
type ReadOptions struct {
	// Name is the file name used in messages; "<stdin>" for standard input.
	Name string
	// MaxExpansion caps the number of edges produced by edge statements
	// with a subgraph operand, per file. 0 means DefaultMaxExpansion,
	// negative means no cap.
	MaxExpansion int
	// Progress, if set, is called as each step of reading begins, with
	// the step's name and roughly how far through reading it starts (0 to
	// 1, from the steps' usual shares of the time).
	Progress func(step string, done float64)
}

// File is a DOT file read by Read.
type File struct {
	Name   string
	Graphs []*Graph
	// Warnings are things in the input that read as DOT says but are
	// rarely meant: a numeral run into a letter ("1e3" is two IDs, 1 and
	// e3). At most one per kind, saying how many more there are.
	Warnings []Error

	ast   *ast.File
	pm    *posMap
	ops   []opInfo       // per edge operator, in text order
	stmts []edgeStmtInfo // per edge statement, in walk order
}

// AST returns the syntax tree of the file as parsed by gonum (after the
// normalization described in the package documentation).
func (f *File) AST() *ast.File { return f.ast }

type opInfo struct {
	edge      *ast.Edge
	stmt      int32 // index into File.stmts
	prev      int32 // previous operator of the same statement, -1 if none
	edgeStart int32 // index in Graph.Edges of the first edge of this operator
	off       int32 // byte offset of the operator
}

type edgeStmtInfo struct {
	stmt     *ast.EdgeStmt
	defaults *attrChain // edge defaults in scope
	lastOp   int32
}

// attrChain is a persistent list of `edge [...]` statements in scope,
// innermost last.
type attrChain struct {
	attrs  []*ast.Attr
	parent *attrChain
}

// Graph is one top-level graph of a file.
type Graph struct {
	ID        string // as written ("" if anonymous)
	Name      string // canonical, as Node.Name ("" if anonymous)
	Directed  bool
	Strict    bool
	Line, Col int    // of its graph or digraph keyword
	Nodes     []Node // in order of first mention
	Edges     []Edge // in statement order, expanded

	file  *File
	ast   *ast.Graph
	index map[string]int32 // canonical name (HTML names prefixed by NUL) to node
	// posOnly holds the top-level node statements that set nothing but
	// pos on a node mentioned before them (as a laid-out graph's own
	// appended positions do): Write leaves them out, so that output read
	// again prints the same.
	posOnly map[*ast.NodeStmt]bool
	// clusterAt holds the byte offset of the subgraph keyword of every
	// occurrence of a cluster subgraph (nil when there is none).
	clusterAt map[*ast.Subgraph]int32
}

// Node is a node of a graph.
type Node struct {
	// ID is the lexeme of the first mention, a valid DOT ID (quotes kept,
	// line continuations removed, concatenations merged).
	ID string
	// Name is the canonical name: quoted strings unquoted (\" becomes ",
	// backslash-newline is removed); unquoted IDs and numerals as they are;
	// HTML IDs keep their angle brackets and never equal a quoted string.
	Name      string
	Line, Col int // of the first mention
	Attrs     NodeAttrs
}

// NodeAttrs holds the effective values (canonical, unquoted; "" if unset)
// of the node attributes gridwood reads: the defaults of `node [...]`
// statements in scope when the node is created, then every node statement
// of that node in order (later wins).
type NodeAttrs struct {
	Width, Height, Label, FontSize, Shape, FixedSize, Pos string
}

// Edge is one edge of the expanded graph.
type Edge struct {
	From, To int32 // indices into Graph.Nodes
	Op       int32 // ordinal in the file, from 0, of the edge operator that produced it
}

// Attr is an attribute with its key and value lexemes as written.
type Attr struct {
	Key, Value string
}

// Lookup returns the index of the node with the given canonical name. When
// a quoted string and an HTML ID have the same text (e.g. "<b>" and <b>),
// the quoted one is found.
func (g *Graph) Lookup(name string) (int, bool) {
	if i, ok := g.index[name]; ok {
		return int(i), true
	}
	if len(name) >= 2 && name[0] == '<' && name[len(name)-1] == '>' {
		if i, ok := g.index["\x00"+name]; ok {
			return int(i), true
		}
	}
	return 0, false
}

// EdgePos returns the position of the edge operator that produced edge i.
func (g *Graph) EdgePos(i int) (line, col int) {
	return g.file.pm.lineCol(int(g.file.ops[g.Edges[i].Op].off))
}

// EdgeAttrs returns the effective attributes of edge i: the `edge [...]`
// defaults in scope, then the attributes of its statement; a later key
// replaces an earlier one in place. Keys are compared by canonical name.
func (g *Graph) EdgeAttrs(i int) []Attr {
	return g.edgeAttrs(i, nil)
}

// edgeAttrs computes EdgeAttrs; memo, if not nil, caches the effective
// defaults of each chain link so that many calls stay linear.
func (g *Graph) edgeAttrs(i int, memo map[*attrChain][]Attr) []Attr {
	st := &g.file.stmts[g.file.ops[g.Edges[i].Op].stmt]
	var chain []*attrChain
	var base []Attr
	for c := st.defaults; c != nil; c = c.parent {
		if m, ok := memo[c]; ok {
			base = m
			break
		}
		chain = append(chain, c)
	}
	out := slices.Clone(base)
	for j := len(chain) - 1; j >= 0; j-- {
		out = mergeAttrs(out, chain[j].attrs)
		if memo != nil {
			memo[chain[j]] = slices.Clone(out)
		}
	}
	return mergeAttrs(out, st.stmt.Attrs)
}

// mergeAttrs adds attrs to out; a key already present (by canonical name)
// is replaced in place.
func mergeAttrs(out []Attr, attrs []*ast.Attr) []Attr {
	if len(attrs) == 0 {
		return out
	}
	at := make(map[string]int, len(out)+len(attrs))
	for j := range out {
		k, _ := canonical(out[j].Key)
		at[k] = j
	}
	for _, a := range attrs {
		key, _ := canonical(a.Key)
		if j, ok := at[key]; ok {
			out[j] = Attr{Key: a.Key, Value: a.Val}
			continue
		}
		at[key] = len(out)
		out = append(out, Attr{Key: a.Key, Value: a.Val})
	}
	return out
}

// canonical returns the canonical name of a DOT ID lexeme and whether it
// is an HTML string.
func canonical(id string) (name string, html bool) {
	if len(id) >= 2 {
		switch id[0] {
		case '"':
			return unquote(id[1 : len(id)-1]), false
		case '<':
			return id, true
		}
	}
	return id, false
}

// unquote turns the inside of a quoted string into its value: \" becomes "
// and a backslash before a line break (LF or CR LF) is removed with it;
// every other backslash pair is kept as written.
func unquote(s string) string {
	if strings.IndexByte(s, '\\') < 0 {
		return s
	}
	var b strings.Builder
	b.Grow(len(s))
	for i := 0; i < len(s); i++ {
		c := s[i]
		if c != '\\' || i+1 == len(s) {
			b.WriteByte(c)
			continue
		}
		switch s[i+1] {
		case '"':
			b.WriteByte('"')
			i++
			continue
		case '\n':
			i++
			continue
		case '\r':
			if i+2 < len(s) && s[i+2] == '\n' {
				i += 2
				continue
			}
		}
		b.WriteByte('\\')
		b.WriteByte(s[i+1])
		i++
	}
	return b.String()
}

// posMap maps byte offsets of the original input to lines and columns.
type posMap struct {
	lines []int32 // offset of the start of each line
	bom   int     // length of a leading byte order mark, not counted in columns
}

func newPosMap(src []byte) *posMap {
	pm := &posMap{lines: make([]int32, 1, bytes.Count(src, []byte{'\n'})+1)}
	for i := 0; ; {
		j := bytes.IndexByte(src[i:], '\n')
		if j < 0 {
			break
		}
		i += j + 1
		pm.lines = append(pm.lines, int32(i))
	}
	if bytes.HasPrefix(src, []byte("\xEF\xBB\xBF")) {
		pm.bom = 3
	}
	return pm
}

func (pm *posMap) lineCol(off int) (line, col int) {
	l := sort.Search(len(pm.lines), func(i int) bool { return int(pm.lines[i]) > off }) - 1
	col = off - int(pm.lines[l]) + 1
	if l == 0 && pm.bom > 0 {
		col = max(col-pm.bom, 1)
	}
	return l + 1, col
}

// Read parses DOT text. Problems with the input are reported as *Error.
func Read(src []byte, opt ReadOptions) (*File, error) {
	name := opt.Name
	if len(src) >= math.MaxInt32-1 {
		return nil, &Error{File: name, Msg: "input larger than 2 GiB"}
	}
	progress := opt.Progress
	if progress == nil {
		progress = func(string, float64) {}
	}
	progress("scanning", 0)
	t, err := parseTree(src, name, func() { progress("parsing", 0.15) })
	if err != nil {
		return nil, err
	}
	progress("collecting nodes and edges", 0.75)
	f, err := t.build(opt)
	if err != nil {
		return nil, err
	}
	if sc := t.sc; sc.splitCount > 0 {
		line, col := t.pm.lineCol(int(sc.splitNum))
		numeral, rest := splitLexeme(src, int(sc.splitNum), int(sc.splitAt))
		msg := fmt.Sprintf("%s is read as two IDs, %s and %s, as DOT reads numerals (no exponent, no suffix); quote it to make it one", strconv.Quote(numeral+rest), numeral, rest)
		if sc.splitCount > 1 {
			msg += fmt.Sprintf(" (and %d more like it)", sc.splitCount-1)
		}
		f.Warnings = append(f.Warnings, Error{File: name, Line: line, Col: col, Msg: msg})
	}
	return f, nil
}

// tree is an input scanned and parsed by gonum's parser, before the walk
// that collects its nodes and edges.
type tree struct {
	name string
	pm   *posMap
	sc   *scanned
	af   *ast.File
}

// parseTree scans src and parses it; parsing is called between the two.
func parseTree(src []byte, name string, parsing func()) (*tree, error) {
	pm := newPosMap(src)
	sc, err := scan(src, pm, name)
	if err != nil {
		return nil, err
	}
	parsing()
	af, err := parse(sc.text)
	if err != nil {
		return nil, syntaxError(err, sc, pm, name, len(src))
	}
	return &tree{name: name, pm: pm, sc: sc, af: af}, nil
}

// build walks the syntax tree into the graphs of a File.
func (t *tree) build(opt ReadOptions) (*File, error) {
	limit := int64(opt.MaxExpansion)
	if opt.MaxExpansion == 0 {
		limit = DefaultMaxExpansion
	}
	// Every edge statement has an operator: len(sc.ops) bounds both.
	f := &File{Name: t.name, ast: t.af, pm: t.pm, ops: make([]opInfo, 0, len(t.sc.ops)), stmts: make([]edgeStmtInfo, 0, len(t.sc.ops))}
	w := &walker{f: f, sc: t.sc, limit: limit}
	if err := w.run(); err != nil {
		return nil, err
	}
	return f, nil
}

// parse calls gonum's parser; a panic there becomes an error.
func parse(text []byte) (f *ast.File, err error) {
	defer func() {
		if r := recover(); r != nil {
			f, err = nil, errInternal(fmt.Sprintf("gonum parser panicked: %v", r))
		}
	}()
	return dot.ParseBytes(text)
}

func errInternal(msg string) error {
	return errors.New("dotio: internal error: " + msg)
}

// The patterns syntaxError reads gonum's messages with, compiled on the
// first error rather than at every start: gridwood runs hundreds of times
// in one build, and most runs see no error.
var (
	gonumPos   = sync.OnceValue(func() *regexp.Regexp { return regexp.MustCompile(`^(\d+):(\d+): error: (.*)$`) })
	gonumWords = sync.OnceValue(func() *strings.Replacer { return strings.NewReplacer("graphx", "graph", "␚", "end of input") })
	gonumID    = sync.OnceValue(func() *regexp.Regexp { return regexp.MustCompile(`\bid\b`) })
)

// syntaxError converts an error of gonum's parser, positioned in gonum's
// own metric (columns count runes, a tab counts 4, CR resets the column),
// into an *Error positioned in ours.
func syntaxError(err error, sc *scanned, pm *posMap, name string, srcLen int) error {
	msg := err.Error()
	if strings.HasPrefix(msg, "dotio: internal error") {
		return err
	}
	m := gonumPos().FindStringSubmatch(msg)
	if m == nil {
		return &Error{File: name, Msg: "syntax error: " + msg}
	}
	line, _ := strconv.Atoi(m[1])
	col, _ := strconv.Atoi(m[2])
	text := m[3]
	expected, got, found := strings.Cut(text, "; got: ")
	eof := false
	var lit []byte
	switch {
	case !found:
	case got == "end-of-file":
		eof = true
	default:
		q := strings.TrimPrefix(got, "unknown/invalid token ")
		if s, err := strconv.Unquote(q); err == nil {
			lit = []byte(s)
		}
	}
	off := gonumOffset(sc.text, line, col, lit, eof)
	off = min(off, srcLen)
	l, c := pm.lineCol(off)
	expected = gonumID().ReplaceAllString(gonumWords().Replace(expected), "ID")
	var out string
	switch {
	case !found:
		out = "syntax error: " + expected
	case eof:
		out = "syntax error: unexpected end of input; " + expected
	default:
		out = "syntax error: unexpected " + got + "; " + expected
	}
	return &Error{File: name, Line: l, Col: c, Msg: out}
}

// gonumOffset finds the byte offset of gonum's line:col in text, replaying
// the position metric of gonum's lexer. A bare CR resets gonum's column
// without a new line, so several offsets can match; the one where lit
// starts is preferred.
func gonumOffset(text []byte, line, col int, lit []byte, eof bool) int {
	if eof {
		return len(text)
	}
	l, c := 1, 1
	first := -1
	for i := 0; i < len(text); {
		if l == line && c == col {
			if first < 0 {
				first = i
			}
			if len(lit) == 0 || bytes.HasPrefix(text[i:], lit) {
				return i
			}
		}
		if l > line {
			break
		}
		r, size := rune(text[i]), 1
		if r >= 0x80 {
			r, size = utf8.DecodeRune(text[i:])
		}
		switch r {
		case '\n':
			l++
			c = 1
		case '\r':
			c = 1
		case '\t':
			c += 4
		default:
			c++
		}
		i += size
	}
	if first >= 0 {
		return first
	}
	return len(text)
}
