package main

import (
	"bytes"
	"fmt"
	goast "go/ast"
	"go/parser"
	"go/token"
	"maps"
	"math"
	"math/rand/v2"
	"os"
	"path/filepath"
	"regexp"
	"slices"
	"strconv"
	"strings"
	"testing"

	"gonum.org/v1/gonum/graph/formats/dot"
	"gonum.org/v1/gonum/graph/formats/dot/ast"

	"github.com/gridwood/gridwood/dotio"
	"github.com/gridwood/gridwood/place/geomcheck"
)

// This file checks README.md's promise "What the output contains": the
// output is the input with exactly the documented changes. Both texts are
// parsed with gonum's parser and given a meaning by the small DOT
// interpreter below, written from the DOT conventions in
// SOURCES.md and independent of dotio's walk; the two
// meanings must agree except where README.md says they differ.

// ---------------------------------------------------------------------------
// A DOT interpreter.

// attrMap holds effective attributes by canonical key and canonical value.
type attrMap map[string]string

func (m attrMap) set(attrs []*ast.Attr) {
	for _, a := range attrs {
		m[canonicalID(a.Key)] = canonicalID(a.Val)
	}
}

// without returns a copy of m without keys.
func (m attrMap) without(keys ...string) attrMap {
	c := maps.Clone(m)
	if c == nil {
		c = attrMap{}
	}
	for _, k := range keys {
		delete(c, k)
	}
	return c
}

// The stale layout data README.md says the output leaves out, by the kind
// of statement it sits on (layout output attributes, SOURCES.md).
var (
	staleNodeKeys  = []string{"pos", "xlp"}
	staleEdgeKeys  = []string{"pos", "lp", "xlp", "head_lp", "tail_lp"}
	staleGraphKeys = []string{"bb", "lp", "lwidth", "lheight"}
)

// staleKeys returns the stale keys of an attribute statement's kind.
func staleKeys(kind ast.Kind) []string {
	switch kind {
	case ast.NodeKind:
		return staleNodeKeys
	case ast.EdgeKind:
		return staleEdgeKeys
	}
	return staleGraphKeys
}

func (m attrMap) String() string {
	keys := slices.Sorted(maps.Keys(m))
	var b strings.Builder
	b.WriteByte('[')
	for i, k := range keys {
		if i > 0 {
			b.WriteString(", ")
		}
		fmt.Fprintf(&b, "%q=%q", k, m[k])
	}
	b.WriteByte(']')
	return b.String()
}

// canonicalID returns the value a DOT ID lexeme stands for: a quoted
// string without its quotes, \" read as a quote and a backslash-newline
// removed (SOURCES.md, "IDs"); an HTML string keeps its brackets and is
// marked with a leading NUL so that it never equals a quoted string; an
// unquoted ID or numeral stands for itself, so `1` and `"1"` are equal.
func canonicalID(lex string) string {
	if len(lex) >= 2 && lex[0] == '<' && lex[len(lex)-1] == '>' {
		return "\x00" + lex
	}
	if len(lex) < 2 || lex[0] != '"' || lex[len(lex)-1] != '"' {
		return lex
	}
	s := lex[1 : len(lex)-1]
	var b strings.Builder
	for i := 0; i < len(s); i++ {
		if s[i] != '\\' || i+1 == len(s) {
			b.WriteByte(s[i])
			continue
		}
		switch s[i+1] {
		case '"':
			b.WriteByte('"')
		case '\n':
		default:
			b.WriteByte('\\')
			b.WriteByte(s[i+1])
		}
		i++
	}
	return b.String()
}

// graphMeaning is what one top-level graph defines.
type graphMeaning struct {
	Strict, Directed bool
	ID               string // lexeme
	Nodes            []nodeMeaning
	Edges            []edgeMeaning
	Attrs            attrMap // of the graph itself
	Subs             []*subMeaning

	nodeAt map[string]int
	subAt  map[string]int // parent index, NUL, canonical name
}

type nodeMeaning struct {
	Key   string // canonical ID
	ID    string // lexeme of the first mention
	Attrs attrMap
}

type edgeMeaning struct {
	From, To           int
	TailPort, HeadPort string
	Attrs              attrMap
}

type subMeaning struct {
	Name   string // canonical; "" when anonymous
	Parent int    // index into Subs, -1 for the graph itself
	Nodes  []int  // in order of first membership
	Edges  []int
	Attrs  attrMap
	member map[int]bool
}

// scope is what a statement list sees: its subgraph and the node and edge
// defaults in force. Defaults set in a list end with it (SOURCES.md).
type scope struct {
	sub              int
	nodeDef, edgeDef attrMap
}

// interpretGraph gives g its meaning under the SOURCES.md conventions:
// a node is created at its first mention with the node defaults then in
// scope, and node statements add attributes (later wins); it belongs to
// every subgraph enclosing a mention. A named subgraph reopened in the same
// parent is the same subgraph. An edge statement V0 op V1 op ... joins every
// node of Vi to every node of Vi+1, where a subgraph operand stands for
// every node of that subgraph (nested ones included), in order of creation;
// its edges are made once the whole statement is read (so after the edges
// of its subgraph operands' bodies), with the edge defaults in scope and
// then its own attributes; they belong to the enclosing subgraphs.
func interpretGraph(g *ast.Graph) *graphMeaning {
	m := &graphMeaning{
		Strict: g.Strict, Directed: g.Directed, ID: g.ID,
		Attrs: attrMap{}, nodeAt: map[string]int{}, subAt: map[string]int{},
	}
	m.list(g.Stmts, &scope{sub: -1, nodeDef: attrMap{}, edgeDef: attrMap{}})
	return m
}

func (m *graphMeaning) graphAttrs(sub int) attrMap {
	if sub < 0 {
		return m.Attrs
	}
	return m.Subs[sub].Attrs
}

func (m *graphMeaning) list(stmts []ast.Stmt, sc *scope) {
	for _, st := range stmts {
		switch st := st.(type) {
		case *ast.NodeStmt:
			v := m.mention(st.Node.ID, sc)
			m.Nodes[v].Attrs.set(st.Attrs)
		case *ast.EdgeStmt:
			m.edgeStmt(st, sc)
		case *ast.AttrStmt:
			switch st.Kind {
			case ast.NodeKind:
				sc.nodeDef.set(st.Attrs)
			case ast.EdgeKind:
				sc.edgeDef.set(st.Attrs)
			default:
				m.graphAttrs(sc.sub).set(st.Attrs)
			}
		case *ast.Attr:
			m.graphAttrs(sc.sub).set([]*ast.Attr{st})
		case *ast.Subgraph:
			m.subgraph(st, sc)
		}
	}
}

func (m *graphMeaning) subgraph(s *ast.Subgraph, sc *scope) int {
	idx := -1
	key := ""
	if s.ID != "" {
		key = strconv.Itoa(sc.sub) + "\x00" + canonicalID(s.ID)
		if i, ok := m.subAt[key]; ok {
			idx = i
		}
	}
	if idx < 0 {
		idx = len(m.Subs)
		name := ""
		if s.ID != "" {
			name = canonicalID(s.ID)
			m.subAt[key] = idx
		}
		m.Subs = append(m.Subs, &subMeaning{Name: name, Parent: sc.sub, Attrs: attrMap{}, member: map[int]bool{}})
	}
	m.list(s.Stmts, &scope{sub: idx, nodeDef: maps.Clone(sc.nodeDef), edgeDef: maps.Clone(sc.edgeDef)})
	return idx
}

func (m *graphMeaning) mention(id string, sc *scope) int {
	key := canonicalID(id)
	v, ok := m.nodeAt[key]
	if !ok {
		v = len(m.Nodes)
		m.nodeAt[key] = v
		m.Nodes = append(m.Nodes, nodeMeaning{Key: key, ID: id, Attrs: maps.Clone(sc.nodeDef)})
	}
	for s := sc.sub; s >= 0; s = m.Subs[s].Parent {
		if sub := m.Subs[s]; !sub.member[v] {
			sub.member[v] = true
			sub.Nodes = append(sub.Nodes, v)
		}
	}
	return v
}

func (m *graphMeaning) edgeStmt(es *ast.EdgeStmt, sc *scope) {
	type end struct {
		node int
		port string
	}
	var groups [][]end
	add := func(v ast.Vertex) {
		switch v := v.(type) {
		case *ast.Node:
			port := ""
			if v.Port != nil {
				port = v.Port.String()
			}
			groups = append(groups, []end{{m.mention(v.ID, sc), port}})
		case *ast.Subgraph:
			nodes := slices.Sorted(slices.Values(m.Subs[m.subgraph(v, sc)].Nodes))
			var g []end
			for _, n := range nodes {
				g = append(g, end{node: n})
			}
			groups = append(groups, g)
		}
	}
	add(es.From)
	for e := es.To; e != nil; e = e.To {
		add(e.Vertex)
	}
	attrs := maps.Clone(sc.edgeDef)
	attrs.set(es.Attrs)
	for i := 0; i+1 < len(groups); i++ {
		for _, u := range groups[i] {
			for _, v := range groups[i+1] {
				idx := len(m.Edges)
				m.Edges = append(m.Edges, edgeMeaning{From: u.node, To: v.node, TailPort: u.port, HeadPort: v.port, Attrs: maps.Clone(attrs)})
				for s := sc.sub; s >= 0; s = m.Subs[s].Parent {
					m.Subs[s].Edges = append(m.Subs[s].Edges, idx)
				}
			}
		}
	}
}

// edgeText names an edge by its ends, ports and the given attributes; equal
// texts are equal edges.
func (m *graphMeaning) edgeText(e edgeMeaning, attrs attrMap) string {
	op := " -- "
	if m.Directed {
		op = " -> "
	}
	return strconv.Quote(m.Nodes[e.From].Key) + e.TailPort + op + strconv.Quote(m.Nodes[e.To].Key) + e.HeadPort + " " + attrs.String()
}

// ---------------------------------------------------------------------------
// Statements as README.md says the output prints them.

// layoutStmts prints a statement list in a normal form, one statement per
// line, with what README.md says is removed taken out: pos from node and
// edge statements and from node and edge defaults, bb from graph
// attributes (also inside subgraphs and subgraph operands); a default
// statement that held only those, and a top-level node statement that
// held only pos for a node named before it, go altogether. Indentation is
// capped so that deep nesting costs linear space. seen collects the nodes
// named so far (by canonicalID), nil for a fresh graph.
func layoutStmts(stmts []ast.Stmt, depth int, out []string, seen map[string]bool) []string {
	if seen == nil {
		seen = make(map[string]bool)
	}
	ind := strings.Repeat("\t", min(depth, 8))
	for _, st := range stmts {
		switch st := st.(type) {
		case *ast.Subgraph:
			out = append(out, ind+subgraphHead(st))
			out = layoutStmts(st.Stmts, depth+1, out, seen)
			out = append(out, ind+"}")
		case *ast.Attr:
			if slices.Contains(staleGraphKeys, canonicalID(st.Key)) {
				continue
			}
			out = append(out, ind+st.Key+"="+st.Val)
		case *ast.NodeStmt:
			key := canonicalID(st.Node.ID)
			if depth == 0 && seen[key] && onlyKeys(st.Attrs, staleNodeKeys) {
				continue
			}
			seen[key] = true
			out = append(out, ind+layoutStmt(st))
		case *ast.AttrStmt:
			if onlyKeys(st.Attrs, staleKeys(st.Kind)) {
				continue
			}
			out = append(out, ind+layoutStmt(st))
		case *ast.EdgeStmt:
			markNamed(st.From, seen)
			for e := st.To; e != nil; e = e.To {
				markNamed(e.Vertex, seen)
			}
			out = append(out, ind+layoutStmt(st))
		default:
			out = append(out, ind+layoutStmt(st))
		}
	}
	return out
}

// onlyKeys reports whether attrs is not empty and every key in it is one
// of keys.
func onlyKeys(attrs []*ast.Attr, keys []string) bool {
	for _, a := range attrs {
		if !slices.Contains(keys, canonicalID(a.Key)) {
			return false
		}
	}
	return len(attrs) > 0
}

// markNamed adds the nodes an edge operand names to seen, iteratively
// through nested subgraph operands.
func markNamed(v ast.Vertex, seen map[string]bool) {
	todo := []ast.Vertex{v}
	for len(todo) > 0 {
		v := todo[len(todo)-1]
		todo = todo[:len(todo)-1]
		switch v := v.(type) {
		case *ast.Node:
			seen[canonicalID(v.ID)] = true
		case *ast.Subgraph:
			for _, st := range v.Stmts {
				switch st := st.(type) {
				case *ast.NodeStmt:
					seen[canonicalID(st.Node.ID)] = true
				case *ast.EdgeStmt:
					todo = append(todo, st.From)
					for e := st.To; e != nil; e = e.To {
						todo = append(todo, e.Vertex)
					}
				case *ast.Subgraph:
					todo = append(todo, st)
				}
			}
		}
	}
}

func subgraphHead(s *ast.Subgraph) string {
	if s.ID == "" {
		return "{"
	}
	return "subgraph " + s.ID + " {"
}

// layoutStmt prints one statement on one line in the normal form of
// layoutStmts.
func layoutStmt(st ast.Stmt) string {
	var b strings.Builder
	writeLayoutStmt(&b, st)
	return b.String()
}

// writeLayoutStmt writes into one builder, so that nested subgraph
// operands cost linear time.
func writeLayoutStmt(b *strings.Builder, st ast.Stmt) {
	switch st := st.(type) {
	case *ast.NodeStmt:
		b.WriteString(st.Node.String())
		writeAttrText(b, st.Attrs, staleNodeKeys)
	case *ast.EdgeStmt:
		writeVertex(b, st.From)
		for e := st.To; e != nil; e = e.To {
			if e.Directed {
				b.WriteString(" -> ")
			} else {
				b.WriteString(" -- ")
			}
			writeVertex(b, e.Vertex)
		}
		writeAttrText(b, st.Attrs, staleEdgeKeys)
	case *ast.AttrStmt:
		b.WriteString(st.Kind.String())
		if !writeAttrText(b, st.Attrs, staleKeys(st.Kind)) {
			b.WriteString(" []")
		}
	case *ast.Attr:
		if !slices.Contains(staleGraphKeys, canonicalID(st.Key)) {
			b.WriteString(st.Key + "=" + st.Val)
		}
	case *ast.Subgraph:
		writeVertex(b, st)
	default:
		fmt.Fprintf(b, "unknown statement %T", st)
	}
}

func writeVertex(b *strings.Builder, v ast.Vertex) {
	switch v := v.(type) {
	case *ast.Node:
		b.WriteString(v.String())
	case *ast.Subgraph:
		b.WriteString(subgraphHead(v))
		sep := false
		for _, st := range v.Stmts {
			if a, ok := st.(*ast.Attr); ok && slices.Contains(staleGraphKeys, canonicalID(a.Key)) {
				continue
			}
			if a, ok := st.(*ast.AttrStmt); ok && onlyKeys(a.Attrs, staleKeys(a.Kind)) {
				continue
			}
			if sep {
				b.WriteString("; ")
			}
			sep = true
			writeLayoutStmt(b, st)
		}
		b.WriteString("}")
	default:
		fmt.Fprintf(b, "unknown vertex %T", v)
	}
}

// writeAttrText writes " [k=v, ...]" without the attributes whose
// canonical key is one of drop, and reports whether anything was written.
func writeAttrText(b *strings.Builder, attrs []*ast.Attr, drop []string) bool {
	n := 0
	for _, a := range attrs {
		if slices.Contains(drop, canonicalID(a.Key)) {
			continue
		}
		if n == 0 {
			b.WriteString(" [")
		} else {
			b.WriteString(", ")
		}
		n++
		b.WriteString(a.Key + "=" + a.Val)
	}
	if n > 0 {
		b.WriteString("]")
	}
	return n > 0
}

// ---------------------------------------------------------------------------
// Comparing input and output.

// parseInput parses an input with gonum's parser. Inputs that only dotio's
// normalization makes parseable (concatenation, a byte order mark) fall
// back to the syntax tree dotio hands to gonum, and so do inputs where
// gonum read a keyword in unusual case (edgE) as an ID: DOT keywords are
// case-insensitive (SOURCES.md) and gonum knows only some casings; and
// inputs that may quote a compass point (a:p:"ne"), which DOT reads as
// the unquoted one and gonum drops (dotio/doc.go).
func parseInput(src []byte) (*ast.File, error) {
	if f, err := dot.ParseBytes(src); err == nil && !keywordAsID(f) && !quotedCompass.Match(src) {
		return f, nil
	}
	f, err := dotio.Read(src, dotio.ReadOptions{Name: "input", MaxExpansion: -1})
	if err != nil {
		return nil, err
	}
	return f.AST(), nil
}

var quotedCompass = regexp.MustCompile(`:\s*"(n|ne|e|se|s|sw|w|nw|c|_)"`)

// keywordAsID reports whether an unquoted ID of f is a keyword in some
// case, which DOT does not allow.
func keywordAsID(f *ast.File) bool {
	isKW := func(id string) bool {
		switch strings.ToLower(id) {
		case "node", "edge", "graph", "digraph", "subgraph", "strict":
			return true
		}
		return false
	}
	attrs := func(as []*ast.Attr) bool {
		for _, a := range as {
			if isKW(a.Key) || isKW(a.Val) {
				return true
			}
		}
		return false
	}
	var stmts func([]ast.Stmt) bool
	vertex := func(v ast.Vertex) bool {
		switch v := v.(type) {
		case *ast.Node:
			return isKW(v.ID) || v.Port != nil && isKW(v.Port.ID)
		case *ast.Subgraph:
			return isKW(v.ID) || stmts(v.Stmts)
		}
		return false
	}
	stmts = func(list []ast.Stmt) bool {
		for _, st := range list {
			switch st := st.(type) {
			case *ast.NodeStmt:
				if vertex(st.Node) || attrs(st.Attrs) {
					return true
				}
			case *ast.EdgeStmt:
				if vertex(st.From) || attrs(st.Attrs) {
					return true
				}
				for e := st.To; e != nil; e = e.To {
					if vertex(e.Vertex) {
						return true
					}
				}
			case *ast.AttrStmt:
				if attrs(st.Attrs) {
					return true
				}
			case *ast.Attr:
				if attrs([]*ast.Attr{st}) {
					return true
				}
			case *ast.Subgraph:
				if vertex(st) {
					return true
				}
			}
		}
		return false
	}
	for _, g := range f.Graphs {
		if isKW(g.ID) || stmts(g.Stmts) {
			return true
		}
	}
	return false
}

var (
	integralPair = regexp.MustCompile(`^(-?[0-9]+),(-?[0-9]+)$`)
	integralBB   = regexp.MustCompile(`^0,0,([0-9]+),([0-9]+)$`)
)

// appendedLayout checks the statements README.md says gridwood appends to
// a top-level graph: one `ID [pos="X,Y"]` per node in order of first
// mention, then `graph [bb="0,0,W,H"]`. It returns the statements before
// them, the positions and W, H.
func appendedLayout(out *ast.Graph, in *graphMeaning) (body []ast.Stmt, pos [][2]int64, w, h int64, err error) {
	n := len(in.Nodes)
	if len(out.Stmts) < n+1 {
		return nil, nil, 0, 0, fmt.Errorf("%d statements, fewer than %d nodes + 1", len(out.Stmts), n)
	}
	body = out.Stmts[:len(out.Stmts)-n-1]
	tail := out.Stmts[len(out.Stmts)-n-1:]
	for i, st := range tail[:n] {
		ns, ok := st.(*ast.NodeStmt)
		if !ok || ns.Node.Port != nil || len(ns.Attrs) != 1 || canonicalID(ns.Attrs[0].Key) != "pos" {
			return nil, nil, 0, 0, fmt.Errorf("appended statement %d is %q, want `ID [pos=\"X,Y\"]`", i, layoutStmt(st))
		}
		if canonicalID(ns.Node.ID) != in.Nodes[i].Key {
			return nil, nil, 0, 0, fmt.Errorf("appended statement %d is for %s, want node %d %s", i, ns.Node.ID, i, in.Nodes[i].ID)
		}
		mt := integralPair.FindStringSubmatch(canonicalID(ns.Attrs[0].Val))
		if mt == nil {
			return nil, nil, 0, 0, fmt.Errorf("node %s: pos %s is not \"X,Y\" in integers", ns.Node.ID, ns.Attrs[0].Val)
		}
		x, err1 := strconv.ParseInt(mt[1], 10, 64)
		y, err2 := strconv.ParseInt(mt[2], 10, 64)
		if err1 != nil || err2 != nil {
			return nil, nil, 0, 0, fmt.Errorf("node %s: pos %s out of range", ns.Node.ID, ns.Attrs[0].Val)
		}
		pos = append(pos, [2]int64{x, y})
	}
	as, ok := tail[n].(*ast.AttrStmt)
	if !ok || as.Kind != ast.GraphKind || len(as.Attrs) != 1 || canonicalID(as.Attrs[0].Key) != "bb" {
		return nil, nil, 0, 0, fmt.Errorf("last statement is %q, want graph [bb=\"0,0,W,H\"]", layoutStmt(tail[n]))
	}
	mt := integralBB.FindStringSubmatch(canonicalID(as.Attrs[0].Val))
	if mt == nil {
		return nil, nil, 0, 0, fmt.Errorf("bb %s is not \"0,0,W,H\" in integers", as.Attrs[0].Val)
	}
	w, _ = strconv.ParseInt(mt[1], 10, 64)
	h, _ = strconv.ParseInt(mt[2], 10, 64)
	return body, pos, w, h, nil
}

// nodeHalfSize returns half the box of a node in points from its width and
// height in inches, DOT's defaults 0.75 and 0.5 (SOURCES.md) when unset,
// round shapes as wide as tall;
// ok is false when a value is set but not a plain size gridwood honours
// (README, Node boxes: from 0 to below 1000; then nothing is checked for that
// node).
func nodeHalfSize(a attrMap) (hw, hh float64, ok bool) {
	size := func(key string, def float64) (float64, bool) {
		s, set := a[key]
		if !set {
			return def, true
		}
		v, err := strconv.ParseFloat(strings.TrimSpace(s), 64)
		if err != nil || math.IsNaN(v) || v <= 0 || v >= 1000 {
			return 0, false
		}
		return v, true
	}
	w, ok1 := size("width", 0.75)
	h, ok2 := size("height", 0.5)
	if strings.EqualFold(strings.TrimSpace(a["shape"]), "plain") {
		// plain has no size of its own.
		w, _ = size("width", 0)
		h, _ = size("height", 0)
	}
	// Round shapes (and square) are as wide as tall: width alone, height
	// alone, or the larger of both; with neither, 0.5 inch (a point
	// 0.05). README, Node boxes.
	switch strings.ToLower(strings.TrimSpace(a["shape"])) {
	case "circle", "doublecircle", "square", "point":
		_, wSet := a["width"]
		_, hSet := a["height"]
		switch {
		case wSet && hSet:
			w = max(w, h)
		case hSet:
			w = h
		case !wSet && strings.EqualFold(strings.TrimSpace(a["shape"]), "point"):
			w = 0.05
		case !wSet:
			w = 0.5
		}
		h = w
	}
	return w * 36, h * 36, ok1 && ok2
}

// problems collects differences, with a cap so that a broken run stays
// readable.
type problems []string

func (p *problems) add(format string, args ...any) {
	if len(*p) < 20 {
		*p = append(*p, fmt.Sprintf(format, args...))
	}
}

// compareStart is what compareDefault and compareSplit check first: the
// same header, and the appended layout statements well formed. It returns
// the meanings of both graphs, the output's statements before the layout,
// the positions and the bounding box.
func compareStart(in, out *ast.Graph, p *problems) (mi, mo *graphMeaning, body []ast.Stmt, pos [][2]int64, w, h int64, ok bool) {
	if in.Strict != out.Strict || in.Directed != out.Directed || in.ID != out.ID {
		p.add("header changed: strict %v directed %v ID %q, was %v %v %q", out.Strict, out.Directed, out.ID, in.Strict, in.Directed, in.ID)
		return nil, nil, nil, nil, 0, 0, false
	}
	mi, mo = interpretGraph(in), interpretGraph(out)
	body, pos, w, h, err := appendedLayout(out, mi)
	if err != nil {
		p.add("graph %s: %v", in.ID, err)
		return nil, nil, nil, nil, 0, 0, false
	}
	return mi, mo, body, pos, w, h, true
}

// compareDefault checks one graph of a default-mode output against its
// input: the same graph, nodes, edges, subgraphs, attributes and statements
// except README.md's documented changes. It returns the positions.
func compareDefault(in, out *ast.Graph, p *problems) [][2]int64 {
	mi, mo, body, pos, w, h, ok := compareStart(in, out, p)
	if !ok {
		return nil
	}
	if a, b := strings.Join(layoutStmts(in.Stmts, 0, nil, nil), "\n"), strings.Join(layoutStmts(body, 0, nil, nil), "\n"); a != b {
		p.add("graph %s: statements changed:\n--- output\n%s\n--- input without pos/bb\n%s", in.ID, b, a)
	}
	compareNodes(mi, mo, pos, p)
	if len(mi.Edges) != len(mo.Edges) {
		p.add("graph %s: %d edges, input has %d", in.ID, len(mo.Edges), len(mi.Edges))
	} else {
		for i, e := range mi.Edges {
			a, b := mi.edgeText(e, e.Attrs.without(staleEdgeKeys...)), mo.edgeText(mo.Edges[i], mo.Edges[i].Attrs)
			if a != b {
				p.add("graph %s: edge %d is %s, was %s (pos removed)", in.ID, i, b, a)
			}
		}
	}
	compareSubgraphs(mi, mo, func(es []int, m *graphMeaning) []string {
		var t []string
		for _, i := range es {
			t = append(t, m.edgeText(m.Edges[i], m.Edges[i].Attrs.without(staleEdgeKeys...)))
		}
		return t
	}, p)
	if a, b := mi.Attrs.without(staleGraphKeys...), mo.Attrs.without("bb"); !maps.Equal(a, b) {
		p.add("graph %s: graph attributes %v, were %v (bb removed)", in.ID, b, a)
	}
	if got, want := mo.Attrs["bb"], fmt.Sprintf("0,0,%d,%d", w, h); got != want {
		p.add("graph %s: effective bb %q, want the appended %q", in.ID, got, want)
	}
	checkInsideBB(mo, pos, w, h, p)
	return pos
}

// compareNodes checks that the output has the input's nodes in order with
// the same attributes, pos replaced by the appended one.
func compareNodes(mi, mo *graphMeaning, pos [][2]int64, p *problems) {
	if len(mi.Nodes) != len(mo.Nodes) {
		p.add("graph %s: %d nodes, input has %d", mi.ID, len(mo.Nodes), len(mi.Nodes))
		return
	}
	for i, n := range mi.Nodes {
		o := mo.Nodes[i]
		if n.Key != o.Key {
			p.add("graph %s: node %d is %s, was %s", mi.ID, i, o.ID, n.ID)
			continue
		}
		if a, b := n.Attrs.without(staleNodeKeys...), o.Attrs.without("pos"); !maps.Equal(a, b) {
			p.add("graph %s: node %s has %v, had %v (pos removed)", mi.ID, n.ID, b, a)
		}
		if want := fmt.Sprintf("%d,%d", pos[i][0], pos[i][1]); o.Attrs["pos"] != want {
			p.add("graph %s: node %s: effective pos %q, want the appended %q", mi.ID, n.ID, o.Attrs["pos"], want)
		}
	}
}

// compareSubgraphs checks names, nesting, members and attributes of the
// subgraphs; edges are compared through edgeTexts, which the caller
// chooses (in order, or as multisets under --drop/--mark-removed).
func compareSubgraphs(mi, mo *graphMeaning, edgeTexts func([]int, *graphMeaning) []string, p *problems) {
	if len(mi.Subs) != len(mo.Subs) {
		p.add("graph %s: %d subgraphs, input has %d", mi.ID, len(mo.Subs), len(mi.Subs))
		return
	}
	for i, s := range mi.Subs {
		o := mo.Subs[i]
		if s.Name != o.Name || s.Parent != o.Parent {
			p.add("graph %s: subgraph %d is %q in %d, was %q in %d", mi.ID, i, o.Name, o.Parent, s.Name, s.Parent)
			continue
		}
		if !slices.Equal(s.Nodes, o.Nodes) {
			p.add("graph %s: subgraph %q holds nodes %v, held %v", mi.ID, s.Name, o.Nodes, s.Nodes)
		}
		got := o.Attrs
		if strings.HasPrefix(o.Name, "cluster") {
			// README, "What the output contains": a cluster with nodes
			// gets its frame as bb; one whose nodes all stay in other
			// clusters (a node named in two, neither inside the other)
			// has none, which only a graph with such a node allows.
			bb, set := got["bb"]
			switch {
			case set && !clusterBB.MatchString(bb):
				p.add("graph %s: cluster %q has bb %q, not LLX,LLY,URX,URY in integers", mi.ID, o.Name, bb)
			case !set && len(o.Nodes) > 0 && !clusterConflicts(mo):
				p.add("graph %s: cluster %q of %d nodes has no bb", mi.ID, o.Name, len(o.Nodes))
			case set && len(o.Nodes) == 0:
				p.add("graph %s: cluster %q without nodes has bb %q", mi.ID, o.Name, bb)
			}
			got = got.without("bb")
		}
		if a, b := s.Attrs.without(staleGraphKeys...), got; !maps.Equal(a, b) {
			p.add("graph %s: subgraph %q has %v, had %v (bb removed)", mi.ID, s.Name, b, a)
		}
		if a, b := edgeTexts(s.Edges, mi), edgeTexts(o.Edges, mo); !slices.Equal(a, b) {
			p.add("graph %s: subgraph %q holds edges\n%s\nheld\n%s", mi.ID, s.Name, strings.Join(b, "\n"), strings.Join(a, "\n"))
		}
	}
}

// clusterBB is a cluster's bb as the output writes it.
var clusterBB = regexp.MustCompile(`^-?[0-9]+,-?[0-9]+,-?[0-9]+,-?[0-9]+$`)

// clusterConflicts reports whether some node of m is named in two
// clusters neither of which holds the other.
func clusterConflicts(m *graphMeaning) bool {
	inside := func(a, b int) bool { // cluster a holds subgraph b
		for ; b >= 0; b = m.Subs[b].Parent {
			if a == b {
				return true
			}
		}
		return false
	}
	of := make([][]int, len(m.Nodes))
	for i, s := range m.Subs {
		if !strings.HasPrefix(s.Name, "cluster") {
			continue
		}
		for _, v := range s.Nodes {
			for _, j := range of[v] {
				if !inside(i, j) && !inside(j, i) {
					return true
				}
			}
			of[v] = append(of[v], i)
		}
	}
	return false
}

// checkInsideBB checks README.md's "every node's box lies inside bb".
func checkInsideBB(mo *graphMeaning, pos [][2]int64, w, h int64, p *problems) {
	for i, n := range mo.Nodes {
		hw, hh, ok := nodeHalfSize(n.Attrs)
		if !ok {
			continue
		}
		x, y := float64(pos[i][0]), float64(pos[i][1])
		const eps = 1e-9
		if x-hw < -eps || y-hh < -eps || x+hw > float64(w)+eps || y+hh > float64(h)+eps {
			p.add("graph %s: node %s at %v with half-size %gx%g is not inside bb 0,0,%d,%d", mo.ID, n.ID, pos[i], hw, hh, w, h)
		}
	}
}

// drawingProblems judges the straight-line drawing of a graph's edges at
// the given positions with geomcheck, loops dropped and each pair of nodes
// drawn once.
func drawingProblems(m *graphMeaning, pos [][2]int64) ([]geomcheck.Problem, error) {
	pts := make([]geomcheck.Point, len(pos))
	for i, q := range pos {
		pts[i] = geomcheck.Point{X: q[0], Y: q[1]}
	}
	seen := map[[2]int]bool{}
	var edges [][2]int32
	for _, e := range m.Edges {
		k := [2]int{min(e.From, e.To), max(e.From, e.To)}
		if e.From == e.To || seen[k] {
			continue
		}
		seen[k] = true
		edges = append(edges, [2]int32{int32(e.From), int32(e.To)})
	}
	return geomcheck.Check(pts, edges)
}

// removedSet is what a --removed file says of one graph: the texts of the
// removed edges with their effective attributes (pos left out), counted.
type removedSet struct {
	count map[string]int
	pairs map[[2]string]bool // unordered pairs of canonical node IDs
}

func readRemoved(g *ast.Graph) removedSet {
	m := interpretGraph(g)
	rs := removedSet{count: map[string]int{}, pairs: map[[2]string]bool{}}
	for _, e := range m.Edges {
		rs.count[m.edgeText(e, e.Attrs.without(staleEdgeKeys...))]++
		a, b := m.Nodes[e.From].Key, m.Nodes[e.To].Key
		rs.pairs[[2]string{min(a, b), max(a, b)}] = true
	}
	return rs
}

func (rs removedSet) hasPair(m *graphMeaning, e edgeMeaning) bool {
	a, b := m.Nodes[e.From].Key, m.Nodes[e.To].Key
	return rs.pairs[[2]string{min(a, b), max(a, b)}]
}

// checkRemovedSet checks a --removed graph against its input graph: the
// listed edges are input edges, loops never, and a listed pair takes every
// copy with it (README.md, "Non-planar graphs").
func checkRemovedSet(mi *graphMeaning, rg *ast.Graph, rs removedSet, p *problems) {
	if rg.Directed != mi.Directed || rg.Strict != mi.Strict || rg.ID != mi.ID {
		p.add("removed file: graph header %v %v %q, want %v %v %q", rg.Strict, rg.Directed, rg.ID, mi.Strict, mi.Directed, mi.ID)
	}
	inCount := map[string]int{}
	for _, e := range mi.Edges {
		inCount[mi.edgeText(e, e.Attrs.without(staleEdgeKeys...))]++
	}
	for t, c := range rs.count {
		if inCount[t] < c {
			p.add("graph %s: removed file lists %s %d times, the input has it %d times", mi.ID, t, c, inCount[t])
		}
	}
	for _, e := range mi.Edges {
		if !rs.hasPair(mi, e) {
			continue
		}
		t := mi.edgeText(e, e.Attrs.without(staleEdgeKeys...))
		if e.From == e.To {
			p.add("graph %s: loop %s removed", mi.ID, t)
		} else if rs.count[t] != inCount[t] {
			p.add("graph %s: pair of %s removed but this copy is not listed", mi.ID, t)
		}
	}
}

// compareSplit checks a --mark-removed (mark != nil) or --drop-removed
// output graph: nodes, their order, attributes and subgraph membership as
// in the input; the edges are the input's, the removed ones marked or
// gone. Edges are compared as multisets: splitting a statement may print
// its edges in another order.
func compareSplit(in, out *ast.Graph, rs removedSet, mark attrMap, p *problems) [][2]int64 {
	mi, mo, _, pos, w, h, ok := compareStart(in, out, p)
	if !ok {
		return nil
	}
	compareNodes(mi, mo, pos, p)
	expect := func(m *graphMeaning, i int) (string, bool) {
		e := m.Edges[i]
		a := e.Attrs.without(staleEdgeKeys...)
		if rs.hasPair(m, e) {
			if mark == nil {
				return "", false
			}
			maps.Copy(a, mark)
		}
		return m.edgeText(e, a), true
	}
	wantTexts := func(es []int, m *graphMeaning) []string {
		var t []string
		for _, i := range es {
			if s, ok := expect(m, i); ok {
				t = append(t, s)
			}
		}
		slices.Sort(t)
		return t
	}
	gotTexts := func(es []int, m *graphMeaning) []string {
		var t []string
		for _, i := range es {
			t = append(t, m.edgeText(m.Edges[i], m.Edges[i].Attrs))
		}
		slices.Sort(t)
		return t
	}
	all := func(m *graphMeaning) []int {
		idx := make([]int, len(m.Edges))
		for i := range idx {
			idx[i] = i
		}
		return idx
	}
	if a, b := wantTexts(all(mi), mi), gotTexts(all(mo), mo); !slices.Equal(a, b) {
		p.add("graph %s: edges (sorted)\n%s\nwant\n%s", in.ID, strings.Join(b, "\n"), strings.Join(a, "\n"))
	}
	compareSubgraphs(mi, mo, func(es []int, m *graphMeaning) []string {
		if m == mi {
			return wantTexts(es, m)
		}
		return gotTexts(es, m)
	}, p)
	if a, b := mi.Attrs.without(staleGraphKeys...), mo.Attrs.without("bb"); !maps.Equal(a, b) {
		p.add("graph %s: graph attributes %v, were %v (bb removed)", in.ID, b, a)
	}
	checkInsideBB(mo, pos, w, h, p)
	return pos
}

// filterCheck runs the command on src in default mode and, if asked or
// when edges were removed, with --mark-removed and --drop-removed, and
// checks everything above.
type filterCheck struct {
	extra    []string // more flags for every run
	variants bool     // run --mark-removed and --drop-removed even on planar input
	dir      string   // for --removed files
}

// filterResult is the first (default-mode) run and what the checks found.
type filterResult struct {
	code           int
	stdout, stderr []byte
	removedFile    bool // the --removed file was written
	removed        int  // edges removed, all graphs
	problems       problems
}

var markAttrs = attrMap{"class": "gw removed", "style": "dashed"}

const markFlag = `class="gw removed",style=dashed`

func (fc filterCheck) check(src []byte) (res filterResult) {
	p := &res.problems
	rmPath := filepath.Join(fc.dir, "removed.dot")
	os.Remove(rmPath)
	args := append([]string{"-q", "--removed", rmPath}, fc.extra...)
	code, out, errs, err := runInProcess(src, args...)
	res.code, res.stdout, res.stderr = code, out, errs
	rmText, rmErr := os.ReadFile(rmPath)
	res.removedFile = rmErr == nil
	if err != nil {
		p.add("%v", err)
		return res
	}
	if code != exitOK {
		return res
	}
	if len(errs) != 0 {
		p.add("-q run wrote to standard error: %q", errs)
	}
	inF, err := parseInput(src)
	if err != nil {
		p.add("input accepted by gridwood does not parse: %v", err)
		return res
	}
	outF, err := dot.ParseBytes(out)
	if err != nil {
		p.add("output does not parse with gonum: %v\n%s", err, out)
		return res
	}
	if rmErr != nil {
		p.add("removed file: %v", rmErr)
		return res
	}
	rmF, err := dot.ParseBytes(rmText)
	if err != nil {
		p.add("removed file does not parse: %v\n%s", err, rmText)
		return res
	}
	if len(outF.Graphs) != len(inF.Graphs) || len(rmF.Graphs) != len(inF.Graphs) {
		p.add("%d graphs out and %d in the removed file, input has %d", len(outF.Graphs), len(rmF.Graphs), len(inF.Graphs))
		return res
	}
	sets := make([]removedSet, len(inF.Graphs))
	positions := make([][][2]int64, len(inF.Graphs))
	for gi, ig := range inF.Graphs {
		positions[gi] = compareDefault(ig, outF.Graphs[gi], p)
		sets[gi] = readRemoved(rmF.Graphs[gi])
		mi := interpretGraph(ig)
		checkRemovedSet(mi, rmF.Graphs[gi], sets[gi], p)
		for _, c := range sets[gi].count {
			res.removed += c
		}
		if positions[gi] == nil {
			continue
		}
		// The drawing of the kept edges: the input's edges but the removed pairs.
		kept := &graphMeaning{Nodes: mi.Nodes}
		for _, e := range mi.Edges {
			if !sets[gi].hasPair(mi, e) {
				kept.Edges = append(kept.Edges, e)
			}
		}
		if probs, err := drawingProblems(kept, positions[gi]); err != nil || len(probs) > 0 {
			p.add("graph %s: drawing of the kept edges: %v %v", ig.ID, err, probs)
		}
	}
	if !fc.variants && res.removed == 0 {
		return res
	}
	for _, drop := range []bool{false, true} {
		var flags []string
		mark := markAttrs
		if drop {
			flags, mark = []string{"--drop-removed"}, nil
		} else {
			flags = []string{"--mark-removed", markFlag}
		}
		rm2 := filepath.Join(fc.dir, "removed2.dot")
		code, out, errs, err := runInProcess(src, append(append([]string{"-q", "--removed", rm2}, fc.extra...), flags...)...)
		if err != nil || code != exitOK {
			p.add("%v: exit %d %v %s", flags, code, err, errs)
			continue
		}
		if b, _ := os.ReadFile(rm2); !bytes.Equal(b, rmText) {
			p.add("%v: removed file differs from the default run's:\n%s\nwas\n%s", flags, b, rmText)
		}
		vf, err := dot.ParseBytes(out)
		if err != nil {
			p.add("%v: output does not parse: %v\n%s", flags, err, out)
			continue
		}
		if len(vf.Graphs) != len(inF.Graphs) {
			p.add("%v: %d graphs, input has %d", flags, len(vf.Graphs), len(inF.Graphs))
			continue
		}
		for gi, ig := range inF.Graphs {
			pos := compareSplit(ig, vf.Graphs[gi], sets[gi], mark, p)
			if pos != nil && positions[gi] != nil && !slices.Equal(pos, positions[gi]) {
				p.add("%v: graph %s: positions differ from the default run's", flags, ig.ID)
			}
			if drop && pos != nil {
				probs, err := drawingProblems(interpretGraph(vf.Graphs[gi]), pos)
				if err != nil || len(probs) > 0 {
					p.add("graph %s: drawing of the kept edges: %v %v", ig.ID, err, probs)
				}
			}
		}
	}
	return res
}

// ---------------------------------------------------------------------------
// A random DOT generator.

// dotGen writes random DOT text using every feature README.md says is kept.
// Edge operands at the top level sometimes reopen a top-level named
// subgraph (TestReopenedSubgraphOperandMeansWholeSubgraph); deeper ones
// never do, as a subgraph name is looked up among its parent's subgraphs
// only (common DOT practice, from memory), which the generator need not
// test.
type dotGen struct {
	rng      *rand.Rand
	b        strings.Builder
	directed bool
	nodes    [][]string // per node, the lexemes that name it
	rootSubs []string   // names of top-level subgraph statements, to reopen
	serial   int
	depth    int
	fallback bool // allow what only dotio's normalization accepts
}

func genDOT(seed uint64, fallback bool) string {
	g := &dotGen{rng: rand.New(rand.NewPCG(seed, 0x9e3779b97f4a7c15)), fallback: fallback}
	for range 1 + g.rng.IntN(3) {
		g.graph()
	}
	return g.b.String()
}

func (g *dotGen) pick(options ...string) string { return options[g.rng.IntN(len(options))] }

func (g *dotGen) graph() {
	g.directed = g.rng.IntN(2) == 0
	g.rootSubs = nil
	g.makeNodes(2 + g.rng.IntN(11))
	if g.rng.IntN(4) == 0 {
		g.b.WriteString(g.pick("strict ", "STRICT ", "Strict "))
	}
	kw := "graph"
	if g.directed {
		kw = "digraph"
	}
	switch g.rng.IntN(6) {
	case 0:
		kw = strings.ToUpper(kw)
	case 1:
		kw = strings.ToUpper(kw[:1]) + kw[1:]
	case 2:
		if g.fallback {
			kw = strings.ToUpper(kw[:2]) + kw[2:] // only dotio accepts this case
		}
	}
	g.b.WriteString(kw + " ")
	g.b.WriteString(g.pick("", "", "G", `"my graph"`, "42", "<<b>net</b>>", "g_7 ") + "{\n")
	for range g.rng.IntN(14) {
		g.stmt()
	}
	g.b.WriteString("}\n")
}

func (g *dotGen) makeNodes(k int) {
	g.nodes = g.nodes[:0]
	for i := range k {
		var forms []string
		switch g.rng.IntN(8) {
		case 0:
			forms = []string{strconv.Itoa(i), `"` + strconv.Itoa(i) + `"`}
		case 1:
			forms = []string{fmt.Sprintf("-%d.5", i), fmt.Sprintf(`"-%d.5"`, i)}
		case 2:
			forms = []string{fmt.Sprintf(`"stop %d"`, i), fmt.Sprintf("\"stop \\\n%d\"", i)}
		case 3:
			forms = []string{fmt.Sprintf(`"q\"%d"`, i)}
		case 4:
			forms = []string{fmt.Sprintf("<<b>h%d</b>>", i)}
		case 5:
			forms = []string{fmt.Sprintf(`"café %d"`, i)}
		default:
			forms = []string{fmt.Sprintf("n%d", i), fmt.Sprintf(`"n%d"`, i)}
			if g.fallback {
				forms = append(forms, fmt.Sprintf(`"n" + "%d"`, i))
			}
		}
		g.nodes = append(g.nodes, forms)
	}
}

func (g *dotGen) nodeRef(port bool) string {
	forms := g.nodes[g.rng.IntN(len(g.nodes))]
	s := forms[g.rng.IntN(len(forms))]
	if port && g.rng.IntN(5) == 0 {
		s += g.pick(":p1", ":n", ":sw", ":p2:se", `:"ne"`, `:"port 3"`, ":p:_", ":c")
	}
	return s
}

func (g *dotGen) attr(kind string) string {
	switch kind {
	case "graph":
		return g.pick(`label="Vellmoor \"south\""`, `bb="1,2,3,4"`, "rankdir=LR", `"bb"="0,0,9,9"`, "fontname=Helvetica", `label=<<i>map</i>>`,
			`lp="12,30"`, "lwidth=0.8", `"lheight"=0.3`, "pos=1")
	case "edge":
		return g.pick("color=red", `color="#3a6f8f"`, `pos="1,1 2,2"`, "weight=3", "style=bold", `label="96f"`, "penwidth=2", `"pos"="e,1,1"`,
			`lp="1,2"`, `xlp="3,4"`, `head_lp="5,6"`, `"tail_lp"="7,8"`, "lwidth=2")
	}
	return g.pick("color=red", "shape=box", "width=1.5", "height=0.8", `pos="10,20"`, `pos="3,4!"`, `label="a \"b\""`, "fontsize=9",
		`label=<<i>x</i>>`, "fixedsize=true", `"pos"="5,5"`, "width=0.3", `bb="1,1,1,1"`, `xlp="2,2"`, `lp="4,4"`)
}

func (g *dotGen) attrList(kind string, always bool) string {
	if !always && g.rng.IntN(2) == 0 {
		return ""
	}
	var b strings.Builder
	for range 1 + g.rng.IntN(2) {
		b.WriteString(" [")
		for i := range g.rng.IntN(4) {
			if i > 0 {
				b.WriteString(g.pick(", ", "; ", " "))
			}
			b.WriteString(g.attr(kind))
		}
		b.WriteString("]")
	}
	return b.String()
}

func (g *dotGen) sep() {
	g.b.WriteString(g.pick("\n", ";\n", " ", "; ", "\n", " // a comment\n", " /* block */ ", "\n# hash line\n"))
}

func (g *dotGen) stmt() {
	switch r := g.rng.IntN(14); {
	case r < 3:
		g.b.WriteString(g.nodeRef(g.rng.IntN(6) == 0) + g.attrList("node", false))
	case r < 8:
		g.edgeStmt()
	case r < 10:
		kind := g.pick("node", "edge", "graph")
		kw := kind
		if g.fallback && g.rng.IntN(3) == 0 {
			kw = strings.ToUpper(kind[:1]) + kind[1:3] + strings.ToUpper(kind[3:]) // only dotio accepts this case
		}
		g.b.WriteString(kw + g.attrList(kind, true))
	case r < 11:
		g.b.WriteString(g.attr("graph"))
	default:
		if g.depth >= 3 {
			g.b.WriteString(g.nodeRef(false))
			break
		}
		switch {
		case g.depth == 0 && len(g.rootSubs) > 0 && g.rng.IntN(3) == 0:
			g.b.WriteString("subgraph " + g.rootSubs[g.rng.IntN(len(g.rootSubs))] + " {\n")
		case g.rng.IntN(4) == 0:
			g.b.WriteString("{\n")
		default:
			g.serial++
			name := g.pick("cluster_", "s", `"sub `) + strconv.Itoa(g.serial)
			if strings.HasPrefix(name, `"`) {
				name += `"`
			}
			if g.depth == 0 {
				g.rootSubs = append(g.rootSubs, name)
			}
			g.b.WriteString(g.pick("subgraph ", "SubGraph ") + name + " {\n")
		}
		g.depth++
		for range g.rng.IntN(5) {
			g.stmt()
		}
		g.depth--
		g.b.WriteString("}")
	}
	g.sep()
}

func (g *dotGen) edgeStmt() {
	op := " -- "
	if g.directed {
		op = " -> "
	}
	for i := range 2 + g.rng.IntN(3) {
		if i > 0 {
			g.b.WriteString(op)
		}
		if g.rng.IntN(5) == 0 && g.depth < 3 {
			g.operand()
		} else {
			g.b.WriteString(g.nodeRef(true))
		}
	}
	g.b.WriteString(g.attrList("edge", false))
}

// operand writes a subgraph operand: anonymous, reopening a top-level
// subgraph, or with a name used nowhere else, holding node mentions or a
// few statements.
func (g *dotGen) operand() {
	if g.depth == 0 && len(g.rootSubs) > 0 && g.rng.IntN(4) == 0 {
		g.b.WriteString("subgraph " + g.rootSubs[g.rng.IntN(len(g.rootSubs))] + " ")
	} else if g.rng.IntN(3) == 0 {
		g.serial++
		g.b.WriteString("subgraph op" + strconv.Itoa(g.serial) + " ")
	}
	g.b.WriteString("{")
	g.depth++
	if g.rng.IntN(2) == 0 {
		for range g.rng.IntN(4) {
			g.b.WriteString(" " + g.nodeRef(false))
		}
	} else {
		saved := g.rootSubs
		for range 1 + g.rng.IntN(3) {
			g.stmt()
		}
		g.rootSubs = saved
	}
	g.depth--
	g.b.WriteString("}")
}

// ---------------------------------------------------------------------------
// The tests.

// repositoryDOT returns every DOT text kept in the repository: test data,
// examples, golden outputs (which carry pos and bb) and the inputs of the
// dotio fuzz corpus.
func repositoryDOT(t *testing.T) map[string][]byte {
	t.Helper()
	texts := map[string][]byte{}
	for _, pattern := range []string{
		"../../examples/*.dot", "testdata/*.dot", "testdata/check/*.dot", "testdata/spacing/*.dot",
		"../../dotio/testdata/*.gv", "../../dotio/testdata/golden/*.out",
	} {
		files, err := filepath.Glob(pattern)
		if err != nil {
			t.Fatal(err)
		}
		for _, f := range files {
			b, err := os.ReadFile(f)
			if err != nil {
				t.Fatal(err)
			}
			texts[f] = b
		}
	}
	corpus, _ := filepath.Glob("../../dotio/testdata/fuzz/FuzzRead/*")
	filterCorpus, _ := filepath.Glob("testdata/fuzz/FuzzFilter/*")
	for _, f := range append(corpus, filterCorpus...) {
		b, err := os.ReadFile(f)
		if err != nil {
			t.Fatal(err)
		}
		if src, ok := fuzzCorpusBytes(b); ok {
			texts[f] = src
		}
	}
	inlineDOT(t, texts)
	if len(texts) < 10 {
		t.Fatalf("found only %d DOT texts in the repository", len(texts))
	}
	return texts
}

// inlineDOT adds the DOT texts written as string literals in the
// repository's test files (found with go/parser: a literal that starts,
// after blanks, with graph, digraph or strict), named "inline:FILE:LINE".
// Some are meant to be rejected; the caller skips those, as fuzz inputs.
func inlineDOT(t *testing.T, texts map[string][]byte) {
	t.Helper()
	looksLikeDOT := regexp.MustCompile(`(?i)^\s*(strict\s+)?(di)?graph\b`)
	files, err := filepath.Glob("../../*/*_test.go")
	if err != nil {
		t.Fatal(err)
	}
	more, _ := filepath.Glob("../../*/*/*_test.go")
	fset := token.NewFileSet()
	for _, path := range append(files, more...) {
		f, err := parser.ParseFile(fset, path, nil, parser.SkipObjectResolution)
		if err != nil {
			t.Fatal(err)
		}
		goast.Inspect(f, func(n goast.Node) bool {
			lit, ok := n.(*goast.BasicLit)
			if !ok || lit.Kind != token.STRING {
				return true
			}
			if v, err := strconv.Unquote(lit.Value); err == nil && looksLikeDOT.MatchString(v) && strings.Contains(v, "{") {
				texts[fmt.Sprintf("inline:%s:%d", filepath.Base(path), fset.Position(lit.Pos()).Line)] = []byte(v)
			}
			return true
		})
	}
}

// fuzzCorpusBytes decodes a corpus file of one []byte value, as written by
// go test -fuzz ("go test fuzz v1" then []byte("...")).
func fuzzCorpusBytes(file []byte) ([]byte, bool) {
	lines := strings.SplitN(strings.TrimSpace(string(file)), "\n", 3)
	if len(lines) != 2 || lines[0] != "go test fuzz v1" {
		return nil, false
	}
	lit, ok := strings.CutPrefix(lines[1], "[]byte(")
	lit, ok2 := strings.CutSuffix(lit, ")")
	if !ok || !ok2 {
		return nil, false
	}
	s, err := strconv.Unquote(lit)
	if err != nil {
		return nil, false
	}
	return []byte(s), true
}

func TestLosslessOnRepositoryDOT(t *testing.T) {
	texts := repositoryDOT(t)
	names := slices.Sorted(maps.Keys(texts))
	checked := 0
	for _, name := range names {
		src := texts[name]
		// Corpus entries and texts in tests include inputs meant to be
		// rejected.
		if _, err := dotio.Read(src, dotio.ReadOptions{Name: name}); err != nil {
			if !strings.Contains(name, "fuzz") && !strings.HasPrefix(name, "inline:") {
				t.Errorf("%s: %v", name, err)
			}
			continue
		}
		checked++
		t.Run(filepath.Base(name), func(t *testing.T) {
			res := filterCheck{dir: t.TempDir(), variants: true}.check(src)
			if res.code != exitOK {
				t.Errorf("exit %d: %s", res.code, res.stderr)
			}
			for _, s := range res.problems {
				t.Error(s)
			}
		})
	}
	if checked < 20 {
		t.Errorf("only %d repository texts were checked", checked)
	}
}

func TestLosslessOnGeneratedDOT(t *testing.T) {
	const inputs = 300
	nonPlanar := 0
	for seed := range uint64(inputs) {
		src := genDOT(seed, seed%5 == 0)
		res := filterCheck{dir: t.TempDir(), variants: true}.check([]byte(src))
		if res.removed > 0 {
			nonPlanar++
		}
		if res.code != exitOK {
			t.Errorf("seed %d: exit %d: %s\ninput:\n%s", seed, res.code, res.stderr, src)
		}
		if len(res.problems) > 0 {
			t.Errorf("seed %d:\n%s\ninput:\n%s", seed, strings.Join(res.problems, "\n"), src)
		}
	}
	// The variants are only exercised on graphs that lose edges.
	if nonPlanar < inputs/10 {
		t.Errorf("only %d of %d generated inputs lost edges; the generator should make more non-planar graphs", nonPlanar, inputs)
	}
}

// TestLosslessCheckerCatchesChanges makes sure the checks above can fail:
// outputs edited in the ways a writer could go wrong are all reported.
func TestLosslessCheckerCatchesChanges(t *testing.T) {
	in := "digraph G {\n\tnode [shape=box]\n\tsubgraph cluster_a { a; b [pos=\"1,2\"] }\n\ta -> b -> c [color=red]\n\tc -> {d e}\n\tlabel=x\n}\n"
	code, out, errs, err := runInProcess([]byte(in), "-q")
	if err != nil || code != exitOK {
		t.Fatalf("exit %d %v %s", code, err, errs)
	}
	good := string(out)
	inF, _ := dot.ParseString(in)
	for _, tc := range []struct{ name, old, new string }{
		{"none", "", ""},
		{"node attribute lost", "shape=box", "shape=oval"},
		{"edge attribute lost", " [color=red]", ""},
		{"edge lost", "c -> {d e}", "c -> {d}\n\te"},
		{"graph attribute lost", "label=x", "label=y"},
		{"membership lost", "cluster_a {", "cluster_b {"},
		{"pos not integral", `a [pos="`, `a [pos="0.5,`},
		{"statement moved", "\tlabel=x\n", "\tlabel=x\n\tlabel=x\n"},
		{"bb missing", "\n\tgraph [bb=", "\n\tgraph [xbb="},
		{"cluster bb missing", "\t\tgraph [bb=", "\t\tgraph [xbb="},
		{"cluster bb not integral", "\t\tgraph [bb=\"", "\t\tgraph [bb=\"0.5"},
	} {
		edited := strings.Replace(good, tc.old, tc.new, 1)
		if tc.old != "" && edited == good {
			t.Fatalf("%s: edit %q did not apply to\n%s", tc.name, tc.old, good)
		}
		outF, err := dot.ParseString(edited)
		if err != nil {
			t.Fatalf("%s: %v", tc.name, err)
		}
		var p problems
		compareDefault(inF.Graphs[0], outF.Graphs[0], &p)
		if (tc.name == "none") != (len(p) == 0) {
			t.Errorf("%s: problems %q", tc.name, p)
		}
	}
}

// TestInterpreterMeaning pins the interpreter itself on small cases whose
// meaning follows directly from SOURCES.md.
func TestInterpreterMeaning(t *testing.T) {
	f, err := dot.ParseString(`digraph {
		node [shape=box]
		a -> {b c} [color=red]
		subgraph s { node [shape=oval] d; b }
		"1" -> 1:p
		<x> -> "<x>"
		e [pos="1,2"]; e [width=2]
	}`)
	if err != nil {
		t.Fatal(err)
	}
	m := interpretGraph(f.Graphs[0])
	var nodes []string
	for _, n := range m.Nodes {
		nodes = append(nodes, n.ID+n.Attrs.String())
	}
	want := []string{
		`a["shape"="box"]`, `b["shape"="box"]`, `c["shape"="box"]`, `d["shape"="oval"]`,
		`"1"["shape"="box"]`, `<x>["shape"="box"]`, `"<x>"["shape"="box"]`, `e["pos"="1,2", "shape"="box", "width"="2"]`,
	}
	if !slices.Equal(nodes, want) {
		t.Errorf("nodes\n%q\nwant\n%q", nodes, want)
	}
	var edges []string
	for _, e := range m.Edges {
		edges = append(edges, m.edgeText(e, e.Attrs))
	}
	wantEdges := []string{
		`"a" -> "b" ["color"="red"]`, `"a" -> "c" ["color"="red"]`,
		`"1" -> "1":p []`, `"\x00<x>" -> "<x>" []`,
	}
	if !slices.Equal(edges, wantEdges) {
		t.Errorf("edges\n%q\nwant\n%q", edges, wantEdges)
	}
	if len(m.Subs) != 2 || m.Subs[1].Name != "s" || !slices.Equal(m.Subs[1].Nodes, []int{3, 1}) {
		t.Errorf("subgraphs %+v %+v", m.Subs[0], m.Subs[1])
	}
}

// TestReopenedSubgraphOperandMeansWholeSubgraph: an edge statement with a
// subgraph operand "makes an edge to every node of that subgraph"
// (SOURCES.md). When the operand reopens a named subgraph that already
// has nodes, those nodes are nodes of that subgraph too (a named subgraph
// is one subgraph however often it is opened; common DOT practice, from
// memory). Here a through e form K5 as DOT defines it. dotio used to take
// only the nodes mentioned inside the operand: gridwood drew K5 minus
// e -- a, reported nothing removed, and the renderer's edge e -- a ran
// straight through d (fixed in commit 3aaa889; kept as a regression test).
func TestReopenedSubgraphOperandMeansWholeSubgraph(t *testing.T) {
	in := "graph {\n\tsubgraph s { a }\n\ta -- b -- c -- d -- a\n\ta -- c\n\tb -- d\n\te -- subgraph s { b c d }\n}\n"
	inF, err := dot.ParseString(in)
	if err != nil {
		t.Fatal(err)
	}
	m := interpretGraph(inF.Graphs[0])
	if len(m.Edges) != 10 {
		t.Fatalf("the interpreter reads %d edges, want K5's 10", len(m.Edges))
	}
	code, out, errs, err := runInProcess([]byte(in), "--removed", filepath.Join(t.TempDir(), "r.dot"))
	if err != nil || code != exitOK {
		t.Fatalf("exit %d %v %s", code, err, errs)
	}
	// K5 is not planar (Kuratowski 1930): either an edge is removed and
	// reported, or the drawing has a crossing.
	if len(errs) > 0 {
		return
	}
	outF, err := dot.ParseBytes(out)
	if err != nil {
		t.Fatal(err)
	}
	var p problems
	pos := compareDefault(inF.Graphs[0], outF.Graphs[0], &p)
	if pos == nil {
		t.Fatalf("%v", p)
	}
	probs, err := drawingProblems(m, pos)
	t.Errorf("K5 (as DOT defines this input) reported as planar with nothing removed; its drawing has problems %v %v:\n%s", probs, err, out)
}
