package dotio

import (
	"gonum.org/v1/gonum/graph/formats/dot/ast"
)

// Name returns the attribute's key as text: a quoted key unquoted.
func (a Attr) Name() string {
	k, _ := canonical(a.Key)
	return k
}

// Text returns the attribute's value as text and whether it is an HTML
// string. A quoted value is unquoted (\" becomes ", backslash-newline is
// removed; every other backslash pair, such as DOT's \n or \N, is kept for
// the reader of the value); an HTML value keeps its angle brackets.
func (a Attr) Text() (text string, html bool) {
	return canonical(a.Value)
}

// GraphAttrs returns the graph's own attributes: those of `graph [...]`
// statements and `key=value` statements directly in its body (not in a
// subgraph), in order; a later key replaces an earlier one in place.
func (g *Graph) GraphAttrs() []Attr {
	var out []Attr
	for _, st := range g.ast.Stmts {
		switch st := st.(type) {
		case *ast.AttrStmt:
			if st.Kind == ast.GraphKind {
				out = mergeAttrs(out, st.Attrs)
			}
		case *ast.Attr:
			out = mergeAttrs(out, []*ast.Attr{st})
		}
	}
	return out
}

// AttrKeys lists the attribute keys a graph's statements set, as text,
// each once, in order of first appearance, by what they apply to.
type AttrKeys struct {
	Graph    []string // `graph [...]` and key=value in the graph's own body
	Subgraph []string // the same inside subgraphs (clusters among them)
	Node     []string // node statements and `node [...]` anywhere
	Edge     []string // edge statements and `edge [...]` anywhere
}

// AttrKeys returns the attribute keys g's statements set. It visits every
// statement once.
func (g *Graph) AttrKeys() AttrKeys {
	var k AttrKeys
	seen := map[[2]string]bool{}
	add := func(list *[]string, kind string, attrs []*ast.Attr) {
		for _, a := range attrs {
			key, _ := canonical(a.Key)
			if !seen[[2]string{kind, key}] {
				seen[[2]string{kind, key}] = true
				*list = append(*list, key)
			}
		}
	}
	type frame struct {
		stmts []ast.Stmt
		verts []ast.Vertex
		attrs []*ast.Attr // of an edge statement, counted after its operands
		i     int
		top   bool
	}
	stack := []frame{{stmts: g.ast.Stmts, top: true}}
	for len(stack) > 0 {
		fr := &stack[len(stack)-1]
		if fr.verts != nil {
			if fr.i == len(fr.verts) {
				add(&k.Edge, "e", fr.attrs)
				stack = stack[:len(stack)-1]
				continue
			}
			v := fr.verts[fr.i]
			fr.i++
			if s, ok := v.(*ast.Subgraph); ok {
				stack = append(stack, frame{stmts: s.Stmts})
			}
			continue
		}
		if fr.i == len(fr.stmts) {
			stack = stack[:len(stack)-1]
			continue
		}
		st := fr.stmts[fr.i]
		fr.i++
		graphList, graphKind := &k.Subgraph, "s"
		if fr.top {
			graphList, graphKind = &k.Graph, "g"
		}
		switch st := st.(type) {
		case *ast.NodeStmt:
			add(&k.Node, "n", st.Attrs)
		case *ast.EdgeStmt:
			verts := []ast.Vertex{st.From}
			for e := st.To; e != nil; e = e.To {
				verts = append(verts, e.Vertex)
			}
			stack = append(stack, frame{verts: verts, attrs: st.Attrs})
		case *ast.AttrStmt:
			switch st.Kind {
			case ast.GraphKind:
				add(graphList, graphKind, st.Attrs)
			case ast.NodeKind:
				add(&k.Node, "n", st.Attrs)
			case ast.EdgeKind:
				add(&k.Edge, "e", st.Attrs)
			}
		case *ast.Attr:
			add(graphList, graphKind, []*ast.Attr{st})
		case *ast.Subgraph:
			stack = append(stack, frame{stmts: st.Stmts})
		}
	}
	return k
}

// AttrTable holds the effective values of chosen attribute keys for every
// node, or every edge, of a graph (see NodeTable and EdgeTable). It costs
// memory for the keys asked for only: each row points at the defaults in
// force for it and lists its own statements' values.
type AttrTable struct {
	cols  map[string]int32
	snaps [][]*ast.Attr // defaults in force: one entry per column, nil if unset
	snap  []int32       // per row: its defaults
	own   [][]cell      // per row: its own statements' values, later last
	row   func(i int) int
}

type cell struct {
	col int32
	a   *ast.Attr
}

// Get returns the effective value of key for row i (a node index for a
// NodeTable, an edge index for an EdgeTable), and whether it is set. A key
// the table was not made for is never set.
func (t *AttrTable) Get(i int, key string) (Attr, bool) {
	c, ok := t.cols[key]
	if !ok {
		return Attr{}, false
	}
	r := t.row(i)
	own := t.own[r]
	for j := len(own) - 1; j >= 0; j-- {
		if own[j].col == c {
			return Attr{Key: own[j].a.Key, Value: own[j].a.Val}, true
		}
	}
	if a := t.snaps[t.snap[r]][c]; a != nil {
		return Attr{Key: a.Key, Value: a.Val}, true
	}
	return Attr{}, false
}

func newAttrTable(keys []string) *AttrTable {
	t := &AttrTable{cols: make(map[string]int32, len(keys))}
	for _, k := range keys {
		if _, ok := t.cols[k]; !ok {
			t.cols[k] = int32(len(t.cols))
		}
	}
	t.snaps = [][]*ast.Attr{make([]*ast.Attr, len(t.cols))}
	return t
}

// apply returns the defaults snapshot base with attrs applied: base
// itself when attrs set none of the table's keys.
func (t *AttrTable) apply(base int32, attrs []*ast.Attr) int32 {
	var s []*ast.Attr
	for _, a := range attrs {
		key, _ := canonical(a.Key)
		c, ok := t.cols[key]
		if !ok {
			continue
		}
		if s == nil {
			s = append([]*ast.Attr(nil), t.snaps[base]...)
		}
		s[c] = a
	}
	if s == nil {
		return base
	}
	t.snaps = append(t.snaps, s)
	return int32(len(t.snaps) - 1)
}

// addOwn appends the table's keys among attrs to row r.
func (t *AttrTable) addOwn(r int, attrs []*ast.Attr) {
	for _, a := range attrs {
		key, _ := canonical(a.Key)
		if c, ok := t.cols[key]; ok {
			t.own[r] = append(t.own[r], cell{c, a})
		}
	}
}

// NodeTable returns the effective values of the given keys (as text, e.g.
// "label") for every node, by the rule NodeAttrs follows: the `node [...]`
// defaults in scope when the node is first mentioned, then every node
// statement of that node in order, a later value replacing an earlier
// one. It walks the graph's statements once, without recursion.
func (g *Graph) NodeTable(keys ...string) *AttrTable {
	t := newAttrTable(keys)
	t.snap = make([]int32, len(g.Nodes))
	t.own = make([][]cell, len(g.Nodes))
	t.row = func(i int) int { return i }
	seen := make([]bool, len(g.Nodes))
	cur := int32(0)
	mention := func(n *ast.Node) int {
		name, html := canonical(n.ID)
		if html {
			name = "\x00" + name
		}
		v, ok := g.index[name]
		if !ok {
			return -1 // unreachable: the reader made every node
		}
		if !seen[v] {
			seen[v] = true
			t.snap[v] = cur
		}
		return int(v)
	}
	// A frame is a statement list (a scope: the node defaults it opened
	// with come back when it ends) or the remaining vertices of an edge
	// statement.
	type frame struct {
		stmts []ast.Stmt
		verts []ast.Vertex
		i     int
		saved int32
	}
	stack := []frame{{stmts: g.ast.Stmts, saved: cur}}
	for len(stack) > 0 {
		fr := &stack[len(stack)-1]
		if fr.verts != nil {
			if fr.i == len(fr.verts) {
				stack = stack[:len(stack)-1]
				continue
			}
			v := fr.verts[fr.i]
			fr.i++
			switch v := v.(type) {
			case *ast.Node:
				mention(v)
			case *ast.Subgraph:
				stack = append(stack, frame{stmts: v.Stmts, saved: cur})
			}
			continue
		}
		if fr.i == len(fr.stmts) {
			cur = fr.saved
			stack = stack[:len(stack)-1]
			continue
		}
		st := fr.stmts[fr.i]
		fr.i++
		switch st := st.(type) {
		case *ast.NodeStmt:
			if v := mention(st.Node); v >= 0 {
				t.addOwn(v, st.Attrs)
			}
		case *ast.EdgeStmt:
			verts := []ast.Vertex{st.From}
			for e := st.To; e != nil; e = e.To {
				verts = append(verts, e.Vertex)
			}
			stack = append(stack, frame{verts: verts})
		case *ast.AttrStmt:
			if st.Kind == ast.NodeKind {
				cur = t.apply(cur, st.Attrs)
			}
		case *ast.Subgraph:
			stack = append(stack, frame{stmts: st.Stmts, saved: cur})
		}
	}
	return t
}

// EdgeTable returns the effective values of the given keys for every
// edge, by the rule of EdgeAttrs: the `edge [...]` defaults in scope, then
// the attributes of the edge's statement. The edges of one statement share
// their values.
func (g *Graph) EdgeTable(keys ...string) *AttrTable {
	t := newAttrTable(keys)
	lo, hi := 0, -1
	for i, e := range g.Edges {
		s := int(g.file.ops[e.Op].stmt)
		if i == 0 || s < lo {
			lo = s
		}
		hi = max(hi, s)
	}
	n := max(hi-lo+1, 0)
	t.snap = make([]int32, n)
	t.own = make([][]cell, n)
	t.row = func(i int) int { return int(g.file.ops[g.Edges[i].Op].stmt) - lo }
	memo := map[*attrChain]int32{}
	for r := range n {
		st := &g.file.stmts[lo+r]
		// The defaults of a chain link are its parent's with its own
		// statement applied, each link computed once.
		var chain []*attrChain
		base := int32(0)
		for c := st.defaults; c != nil; c = c.parent {
			if s, ok := memo[c]; ok {
				base = s
				break
			}
			chain = append(chain, c)
		}
		for j := len(chain) - 1; j >= 0; j-- {
			base = t.apply(base, chain[j].attrs)
			memo[chain[j]] = base
		}
		t.snap[r] = base
		t.addOwn(r, st.stmt.Attrs)
	}
	return t
}
