package dotio

import (
	"bufio"
	"errors"
	"fmt"
	"io"
	"slices"
	"strconv"
	"strings"
	"unicode/utf8"

	"gonum.org/v1/gonum/graph/formats/dot/ast"
)

// Layout holds the positions computed for one graph.
type Layout struct {
	X, Y    []int64  // pos in points per node (index as in Graph.Nodes)
	BB      [4]int64 // llx, lly, urx, ury in points
	Removed []bool   // per edge (index into Graph.Edges): the layout set this edge aside; nil = none
	// ClusterBB holds a frame per cluster, indexed as Graph.Clusters
	// returns them (llx, lly, urx, ury in points), written as a
	// `graph [bb="..."]` statement at the end of the body of the
	// cluster's first occurrence; an entry with urx < llx or ury < lly
	// (an empty cluster's) writes none, and nil writes none at all.
	ClusterBB [][4]int64
}

// NoBB is a ClusterBB entry that writes no bb.
var NoBB = [4]int64{0, 0, -1, -1}

// WriteOptions configure what Write does with removed edges.
type WriteOptions struct {
	DropRemoved bool   // leave removed edges out of the main output
	MarkRemoved []Attr // add these attributes to removed edges in the main output
}

// Stale layout data: the attributes a layout writes, by the kind of
// statement they belong to (DOT's layout output attributes, from memory of
// its documentation; SOURCES.md). A new
// layout makes them wrong, so Write leaves them out wherever they appear
// on that kind: on node statements and node defaults, on edge statements
// and edge defaults, and on graphs and subgraphs (graph defaults and
// ID=value statements).
var (
	staleNode  = []string{"pos", "xlp"}
	staleEdge  = []string{"pos", "lp", "xlp", "head_lp", "tail_lp"}
	staleGraph = []string{"bb", "lp", "lwidth", "lheight"}
)

// staleOf returns the stale keys of an attribute statement's kind.
func staleOf(kind ast.Kind) []string {
	switch kind {
	case ast.NodeKind:
		return staleNode
	case ast.EdgeKind:
		return staleEdge
	}
	return staleGraph
}

// isStale reports whether the attribute key (a lexeme) is one of stale.
func isStale(key string, stale []string) bool {
	k, _ := canonical(key)
	return slices.Contains(stale, k)
}

// maxIndent caps indentation so that deep nesting gives linear output.
const maxIndent = 8

const tabs = "\t\t\t\t\t\t\t\t"

// Write prints every graph of f with its statements in their original
// order and form, without stale layout data (pos of nodes and edges, bb of
// graphs and subgraphs), followed by one `ID [pos="X,Y"]` statement per
// node and a `graph [bb="..."]` statement. layouts has one entry per graph.
//
// Removed edges (Layout.Removed) are left as they are unless opt asks for
// more. Then an edge statement none of whose edges is removed is printed
// as written; one whose edges are all removed gets the MarkRemoved
// attributes appended (unless DropRemoved, which wins over MarkRemoved);
// any other is split: each operand is printed as a statement of its own (a
// node without its port, a subgraph with its body printed by the same
// rules), and after the operand to the right of each operator follow that
// operator's single-edge statements `x:port -- y:port [attrs]`, kept edges
// and, under MarkRemoved, removed ones with the marks. Printing the edges
// of each operator right after its right operand, rather than all after
// the last operand, keeps the order of the edges, not only of the nodes,
// when the statement is read again.
func Write(w io.Writer, f *File, layouts []Layout, opt WriteOptions) error {
	if len(layouts) != len(f.Graphs) {
		return fmt.Errorf("dotio: %d layouts for %d graphs", len(layouts), len(f.Graphs))
	}
	for gi, g := range f.Graphs {
		l := &layouts[gi]
		if len(l.X) != len(g.Nodes) || len(l.Y) != len(g.Nodes) {
			return fmt.Errorf("dotio: graph %d: %d x and %d y positions for %d nodes", gi, len(l.X), len(l.Y), len(g.Nodes))
		}
		if l.Removed != nil && len(l.Removed) != len(g.Edges) {
			return fmt.Errorf("dotio: graph %d: %d removed flags for %d edges", gi, len(l.Removed), len(g.Edges))
		}
		if l.ClusterBB != nil {
			if k := len(g.Clusters().Clusters); len(l.ClusterBB) != k {
				return fmt.Errorf("dotio: graph %d: %d cluster boxes for %d clusters", gi, len(l.ClusterBB), k)
			}
		}
	}
	p := &printer{bw: bufio.NewWriter(w), f: f, opt: opt}
	for gi, g := range f.Graphs {
		p.graph(g, &layouts[gi])
	}
	if p.err != nil {
		return p.err
	}
	return p.bw.Flush()
}

type printMode uint8

const (
	modeAsIs  printMode = iota // print the statement as written
	modeMark                   // as written, mark attributes appended
	modeSplit                  // operands on their own, then one statement per edge
)

type printer struct {
	bw    *bufio.Writer
	f     *File
	g     *Graph
	lay   *Layout
	opt   WriteOptions
	stmt  int // next entry of f.stmts
	stack []pframe
	err   error
	opBuf []int32
	bbAt  map[*ast.Subgraph][4]int64 // cluster boxes to write, by first occurrence
}

// pframe is a statement list being printed, or an edge statement.
type pframe struct {
	// list
	stmts  []ast.Stmt
	i      int
	depth  int
	inEdge bool      // the list is a subgraph operand of the edge frame below
	bb     *[4]int64 // a cluster box to write at the end of the list

	// edge statement
	es    *ast.EdgeStmt
	si    int
	mode  printMode
	ops   []int32 // operators of the statement, in chain order (modeSplit)
	k     int     // operators done
	cur   *ast.Edge
	first bool // From not printed yet
}

func (p *printer) ws(s string) {
	if p.err == nil {
		_, p.err = p.bw.WriteString(s)
	}
}

func (p *printer) indent(depth int) {
	p.ws(tabs[:min(depth, maxIndent)])
}

func (p *printer) graph(g *Graph, lay *Layout) {
	p.g, p.lay = g, lay
	p.bbAt = nil
	if lay.ClusterBB != nil {
		for c, cl := range g.Clusters().Clusters {
			if bb := lay.ClusterBB[c]; bb[0] <= bb[2] && bb[1] <= bb[3] {
				if p.bbAt == nil {
					p.bbAt = make(map[*ast.Subgraph][4]int64)
				}
				p.bbAt[cl.first] = bb
			}
		}
	}
	ag := g.ast
	if ag.Strict {
		p.ws("strict ")
	}
	if ag.Directed {
		p.ws("digraph ")
	} else {
		p.ws("graph ")
	}
	if ag.ID != "" {
		p.ws(ag.ID)
		p.ws(" ")
	}
	p.ws("{\n")
	p.stack = append(p.stack[:0], pframe{stmts: ag.Stmts, depth: 1})
	p.run()
	var num []byte
	for i := range g.Nodes {
		p.ws("\t")
		p.ws(g.Nodes[i].ID)
		p.ws(` [pos="`)
		num = strconv.AppendInt(num[:0], lay.X[i], 10)
		num = append(num, ',')
		num = strconv.AppendInt(num, lay.Y[i], 10)
		p.ws(string(num))
		p.ws("\"]\n")
	}
	p.ws("\t")
	p.bb(lay.BB)
	p.ws("}\n")
}

// bb prints a `graph [bb="..."]` statement and its line break.
func (p *printer) bb(bb [4]int64) {
	var num []byte
	for j, v := range bb {
		if j > 0 {
			num = append(num, ',')
		}
		num = strconv.AppendInt(num, v, 10)
	}
	p.ws("graph [bb=\"")
	p.ws(string(num))
	p.ws("\"]\n")
}

func (p *printer) run() {
	for len(p.stack) > 0 && p.err == nil {
		top := len(p.stack) - 1
		fr := &p.stack[top]
		if fr.es != nil {
			p.edgeStep(top)
			continue
		}
		if fr.i == len(fr.stmts) {
			depth, inEdge, bb := fr.depth, fr.inEdge, fr.bb
			p.stack = p.stack[:top]
			if top == 0 {
				return
			}
			if bb != nil {
				p.indent(depth)
				p.bb(*bb)
			}
			p.indent(depth - 1)
			p.ws("}")
			if !inEdge {
				p.ws("\n")
			}
			continue
		}
		st := fr.stmts[fr.i]
		fr.i++
		depth := fr.depth
		switch st := st.(type) {
		case *ast.NodeStmt:
			if p.g.posOnly[st] {
				continue
			}
			p.indent(depth)
			p.node(st.Node, true)
			p.attrs(st.Attrs, staleNode, nil, false)
			p.ws("\n")
		case *ast.EdgeStmt:
			p.startEdge(st, depth)
		case *ast.AttrStmt:
			if !p.printed(st) {
				continue // only stale layout data: nothing left to say
			}
			p.indent(depth)
			p.ws(st.Kind.String())
			p.ws(" ")
			p.attrs(st.Attrs, staleOf(st.Kind), nil, true)
			p.ws("\n")
		case *ast.Attr:
			if !p.printed(st) {
				continue
			}
			p.indent(depth)
			p.ws(st.Key)
			p.ws("=")
			p.ws(st.Val)
			p.ws("\n")
		case *ast.Subgraph:
			p.indent(depth)
			if p.subgraph(st, depth, false) {
				p.ws("\n")
			}
		default:
			p.err = fmt.Errorf("dotio: unknown statement type %T", st)
		}
	}
}

// printed reports whether a statement prints anything: a statement that
// holds only stale layout data, or a top-level node statement that only
// gave a node named before it a pos (Graph.posOnly), goes altogether.
func (p *printer) printed(st ast.Stmt) bool {
	switch st := st.(type) {
	case *ast.NodeStmt:
		return !p.g.posOnly[st]
	case *ast.AttrStmt:
		return len(st.Attrs) == 0 || printedAttrs(st.Attrs, staleOf(st.Kind)) > 0
	case *ast.Attr:
		return !isStale(st.Key, staleGraph)
	}
	return true
}

// subgraph prints the head of a subgraph; a subgraph whose printed
// statements are all bare node statements is printed inline and true is
// returned, otherwise a list frame is pushed for its body. The choice
// looks only at what is printed, so that the output read again makes the
// same choice.
func (p *printer) subgraph(s *ast.Subgraph, depth int, inEdge bool) (inline bool) {
	if s.ID != "" {
		p.ws("subgraph ")
		p.ws(s.ID)
		p.ws(" ")
	}
	var bb *[4]int64
	if b, ok := p.bbAt[s]; ok {
		bb = &b
	}
	inline = bb == nil
	for _, st := range s.Stmts {
		if !inline {
			break
		}
		if !p.printed(st) {
			continue
		}
		ns, ok := st.(*ast.NodeStmt)
		if !ok || printedAttrs(ns.Attrs, staleNode) > 0 {
			inline = false
			break
		}
	}
	if inline {
		p.ws("{")
		sep := false
		for _, st := range s.Stmts {
			if !p.printed(st) {
				continue
			}
			if sep {
				p.ws(" ")
			}
			sep = true
			p.node(st.(*ast.NodeStmt).Node, true)
		}
		p.ws("}")
		return true
	}
	p.ws("{\n")
	p.stack = append(p.stack, pframe{stmts: s.Stmts, depth: depth + 1, inEdge: inEdge, bb: bb})
	return false
}

func (p *printer) node(n *ast.Node, port bool) {
	p.ws(n.ID)
	if port && n.Port != nil {
		p.ws(portString(n.Port))
	}
}

func portString(pt *ast.Port) string {
	if pt == nil {
		return ""
	}
	s := ""
	if pt.ID != "" {
		s = ":" + pt.ID
	}
	if pt.CompassPoint != ast.CompassPointNone {
		s += ":" + pt.CompassPoint.String()
	}
	return s
}

// printedAttrs counts the attributes that are not stale.
func printedAttrs(attrs []*ast.Attr, stale []string) int {
	n := 0
	for _, a := range attrs {
		if !isStale(a.Key, stale) {
			n++
		}
	}
	return n
}

// attrs prints " [k=v, ...]" without the stale attributes and those with
// the key of one in extra, followed by extra: a mark replaces an
// attribute of the same name rather than repeating its key. Nothing is
// printed for an empty list unless always is set.
func (p *printer) attrs(attrs []*ast.Attr, stale []string, extra []Attr, always bool) {
	if !always && printedAttrs(attrs, stale)+len(extra) == 0 {
		return
	}
	if !always {
		p.ws(" ")
	}
	p.ws("[")
	sep := false
	for _, a := range attrs {
		key, _ := canonical(a.Key)
		if slices.Contains(stale, key) || slices.ContainsFunc(extra, func(x Attr) bool { k, _ := canonical(x.Key); return k == key }) {
			continue
		}
		if sep {
			p.ws(", ")
		}
		sep = true
		p.ws(a.Key)
		p.ws("=")
		p.ws(a.Val)
	}
	for _, a := range extra {
		if sep {
			p.ws(", ")
		}
		sep = true
		p.ws(a.Key)
		p.ws("=")
		p.ws(a.Value)
	}
	p.ws("]")
}

func (p *printer) edgeOp() string {
	if p.g.Directed {
		return " -> "
	}
	return " -- "
}

// opEdges returns the range of Graph.Edges produced by operator op.
func (p *printer) opEdges(op int32) (from, to int) {
	from = int(p.f.ops[op].edgeStart)
	to = from
	for to < len(p.g.Edges) && p.g.Edges[to].Op == op {
		to++
	}
	return from, to
}

func (p *printer) startEdge(es *ast.EdgeStmt, depth int) {
	si := p.stmt
	p.stmt++
	if si >= len(p.f.stmts) || p.f.stmts[si].stmt != es {
		p.err = errors.New("dotio: internal error: edge statements out of step")
		return
	}
	fr := pframe{es: es, si: si, depth: depth, first: true}
	if p.lay.Removed != nil && (p.opt.DropRemoved || len(p.opt.MarkRemoved) > 0) {
		// Collect the operators of the chain and count removed edges.
		ops := p.opBuf[:0]
		for op := p.f.stmts[si].lastOp; op >= 0; op = p.f.ops[op].prev {
			ops = append(ops, op)
		}
		slices.Reverse(ops)
		total, removed := 0, 0
		for _, op := range ops {
			a, b := p.opEdges(op)
			total += b - a
			for j := a; j < b; j++ {
				if p.lay.Removed[j] {
					removed++
				}
			}
		}
		switch {
		case removed == 0:
		case removed == total && !p.opt.DropRemoved:
			fr.mode = modeMark
		default:
			fr.mode = modeSplit
			fr.ops = slices.Clone(ops)
		}
		p.opBuf = ops
	}
	p.stack = append(p.stack, fr)
}

// edgeStep prints the next part of the edge statement at index fi: an
// operand (which may push a subgraph body), the operator before it, or in
// modeSplit the single-edge statements of the operator just completed.
func (p *printer) edgeStep(fi int) {
	fr := &p.stack[fi]
	es := fr.es
	depth := fr.depth
	split := fr.mode == modeSplit
	if fr.first {
		fr.first = false
		if !split {
			p.indent(depth)
		}
		p.operand(fi, es.From)
		return
	}
	if split && fr.cur != nil {
		// The operand of fr.cur is printed: its edges follow.
		p.splitEdges(fr)
	}
	var next *ast.Edge
	if fr.cur == nil {
		next = es.To
	} else {
		next = fr.cur.To
	}
	if next == nil {
		if !split {
			var mark []Attr
			if fr.mode == modeMark {
				mark = p.opt.MarkRemoved
			}
			p.attrs(es.Attrs, staleEdge, mark, false)
			p.ws("\n")
		}
		p.stack = p.stack[:fi]
		return
	}
	fr.cur = next
	if !split {
		p.ws(p.edgeOp())
	}
	p.operand(fi, next.Vertex)
}

// operand prints one vertex of the edge statement at index fi.
func (p *printer) operand(fi int, v ast.Vertex) {
	fr := &p.stack[fi]
	split := fr.mode == modeSplit
	depth := fr.depth
	switch v := v.(type) {
	case *ast.Node:
		if split {
			p.indent(depth)
			p.node(v, false)
			p.ws("\n")
		} else {
			p.node(v, true)
		}
	case *ast.Subgraph:
		if split {
			p.indent(depth)
		}
		if p.subgraph(v, depth, !split) && split {
			p.ws("\n")
		}
	}
}

// splitEdges prints the kept (and under MarkRemoved the marked) edges of
// the operator fr.cur as single-edge statements.
func (p *printer) splitEdges(fr *pframe) {
	op := fr.ops[fr.k]
	fr.k++
	info := &p.f.ops[op]
	if info.edge != fr.cur {
		p.err = errors.New("dotio: internal error: edge operators out of step")
		return
	}
	leftPort, rightPort := "", ""
	if n, ok := p.leftVertex(op).(*ast.Node); ok {
		leftPort = portString(n.Port)
	}
	if n, ok := fr.cur.Vertex.(*ast.Node); ok {
		rightPort = portString(n.Port)
	}
	a, b := p.opEdges(op)
	for j := a; j < b; j++ {
		removed := p.lay.Removed[j]
		if removed && p.opt.DropRemoved {
			continue
		}
		e := p.g.Edges[j]
		p.indent(fr.depth)
		p.ws(p.g.Nodes[e.From].ID)
		p.ws(leftPort)
		p.ws(p.edgeOp())
		p.ws(p.g.Nodes[e.To].ID)
		p.ws(rightPort)
		var mark []Attr
		if removed {
			mark = p.opt.MarkRemoved
		}
		p.attrs(fr.es.Attrs, staleEdge, mark, false)
		p.ws("\n")
	}
}

// leftVertex returns the vertex on the left of operator op.
func (p *printer) leftVertex(op int32) ast.Vertex {
	info := &p.f.ops[op]
	if info.prev < 0 {
		return p.f.stmts[info.stmt].stmt.From
	}
	return p.f.ops[info.prev].edge.Vertex
}

// WriteRemoved writes, for each graph of f in order, a graph of the same
// kind and ID holding one edge statement per removed edge, in input order,
// with the effective attributes of the edge (pos left out). removed[i]
// lists edge indices of graph i; a missing or empty entry gives an empty
// graph.
func WriteRemoved(w io.Writer, f *File, removed [][]int) error {
	if len(removed) > len(f.Graphs) {
		return fmt.Errorf("dotio: removed edges for %d graphs, file has %d", len(removed), len(f.Graphs))
	}
	p := &printer{bw: bufio.NewWriter(w), f: f}
	memo := map[*attrChain][]Attr{}
	for gi, g := range f.Graphs {
		p.g = g
		var idx []int
		if gi < len(removed) {
			idx = slices.Clone(removed[gi])
		}
		slices.Sort(idx)
		idx = slices.Compact(idx)
		if len(idx) > 0 && (idx[0] < 0 || idx[len(idx)-1] >= len(g.Edges)) {
			return fmt.Errorf("dotio: graph %d: removed edge index out of range", gi)
		}
		if g.Strict {
			p.ws("strict ")
		}
		if g.Directed {
			p.ws("digraph ")
		} else {
			p.ws("graph ")
		}
		if g.ID != "" {
			p.ws(g.ID)
			p.ws(" ")
		}
		p.ws("{\n")
		for _, i := range idx {
			e := g.Edges[i]
			p.ws("\t")
			p.ws(g.Nodes[e.From].ID)
			if n, ok := p.leftVertex(e.Op).(*ast.Node); ok {
				p.ws(portString(n.Port))
			}
			p.ws(p.edgeOp())
			p.ws(g.Nodes[e.To].ID)
			if n, ok := f.ops[e.Op].edge.Vertex.(*ast.Node); ok {
				p.ws(portString(n.Port))
			}
			var attrs []*ast.Attr
			for _, a := range g.edgeAttrs(i, memo) {
				attrs = append(attrs, &ast.Attr{Key: a.Key, Val: a.Value})
			}
			p.attrs(attrs, staleEdge, nil, false)
			p.ws("\n")
		}
		p.ws("}\n")
	}
	if p.err != nil {
		return p.err
	}
	return p.bw.Flush()
}

// ParseAttrList parses "KEY=VALUE,KEY2=VALUE2" as given on a command line
// into attributes with valid DOT lexemes. Keys are unquoted DOT
// identifiers; a value is either a complete double-quoted DOT string, kept
// as it is, or raw text up to the next comma, quoted when it is not an
// unquoted identifier or numeral. Blanks around keys and raw values are
// trimmed.
func ParseAttrList(s string) ([]Attr, error) {
	if !utf8.ValidString(s) || strings.IndexByte(s, 0) >= 0 {
		return nil, errors.New("attribute list: invalid UTF-8 or NUL byte")
	}
	if strings.TrimSpace(s) == "" {
		return nil, errors.New("attribute list: empty")
	}
	var out []Attr
	rest := s
	for {
		eq := strings.IndexByte(rest, '=')
		if eq < 0 {
			return nil, fmt.Errorf("attribute list: %q has no '='", strings.TrimSpace(rest))
		}
		key := strings.TrimSpace(rest[:eq])
		if !isPlainID(key) || isKeyword(key) {
			return nil, fmt.Errorf("attribute list: %q is not a valid attribute name", key)
		}
		rest = strings.TrimLeft(rest[eq+1:], " \t")
		var val string
		if strings.HasPrefix(rest, `"`) {
			end := quotedEnd(rest)
			if end < 0 {
				return nil, fmt.Errorf("attribute list: unterminated quoted value for %s", key)
			}
			val = rest[:end]
			rest = strings.TrimLeft(rest[end:], " \t")
			if rest != "" && rest[0] != ',' {
				return nil, fmt.Errorf("attribute list: unexpected %q after the value of %s", rest, key)
			}
		} else {
			raw := rest
			if c := strings.IndexByte(rest, ','); c >= 0 {
				raw = rest[:c]
			}
			rest = rest[len(raw):]
			raw = strings.TrimSpace(raw)
			q, err := quoteValue(raw)
			if err != nil {
				return nil, fmt.Errorf("attribute list: value of %s: %v", key, err)
			}
			val = q
		}
		out = append(out, Attr{Key: key, Value: val})
		if rest == "" {
			return out, nil
		}
		rest = rest[1:] // the comma
		if strings.TrimSpace(rest) == "" {
			return nil, errors.New("attribute list: trailing comma")
		}
	}
}

// quotedEnd returns the end of the DOT quoted string at the start of s, or
// -1 if it is not terminated.
func quotedEnd(s string) int {
	for i := 1; i < len(s); i++ {
		switch s[i] {
		case '\\':
			i++
		case '"':
			return i + 1
		}
	}
	return -1
}

func isPlainID(s string) bool {
	if s == "" || !isASCIILetter(s[0]) {
		return false
	}
	for i := 1; i < len(s); i++ {
		if !isASCIILetter(s[i]) && !isDigit(s[i]) {
			return false
		}
	}
	return true
}

func isKeyword(s string) bool {
	k, _ := keywordKind([]byte(s))
	return k != tNone
}

// isNumeral reports whether s is a DOT numeral [-](.digits | digits[.digits*]).
func isNumeral(s string) bool {
	s = strings.TrimPrefix(s, "-")
	intPart, frac, dot := strings.Cut(s, ".")
	if intPart == "" && frac == "" {
		return false
	}
	for _, part := range []string{intPart, frac} {
		for i := 0; i < len(part); i++ {
			if !isDigit(part[i]) {
				return false
			}
		}
	}
	return dot || intPart != ""
}

// quoteValue returns raw as a DOT lexeme, quoted unless it is a plain
// identifier or a numeral.
func quoteValue(raw string) (string, error) {
	if (isPlainID(raw) && !isKeyword(raw)) || isNumeral(raw) {
		return raw, nil
	}
	if strings.HasSuffix(raw, `\`) {
		return "", errors.New("a value cannot end with a backslash")
	}
	var b strings.Builder
	b.WriteByte('"')
	for i := 0; i < len(raw); i++ {
		c := raw[i]
		if c == '\\' && i+1 < len(raw) {
			// Keep the pair as written (DOT escapes like \n in labels).
			b.WriteByte(c)
			b.WriteByte(raw[i+1])
			i++
			continue
		}
		if c == '"' {
			b.WriteByte('\\')
		}
		b.WriteByte(c)
	}
	b.WriteByte('"')
	return b.String(), nil
}
