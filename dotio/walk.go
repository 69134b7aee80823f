package dotio

import (
	"fmt"
	"math"
	"slices"

	"gonum.org/v1/gonum/graph/formats/dot/ast"
)

// walker builds the plain graphs from the AST. It walks iteratively with an
// explicit stack, so deep nesting costs heap, not goroutine stack.
type walker struct {
	f     *File
	sc    *scanned
	limit int64 // cap on expanded edges; negative means none
	spent int64 // edges produced by pairs with a subgraph operand so far

	nodeTok  int // next entry of sc.nodeToks
	subCount int // next entry of sc.subNodes
	g        *Graph
	stack    []frame

	// log lists node mentions inside open subgraph operands, in text
	// order. The mentions of an operand form a contiguous range; once the
	// operand's node set is needed, the range is deduplicated in place
	// ("compacted"), so an enclosing operand later reads the set, not the
	// raw mentions.
	log          []int32
	stamp        []uint32 // per node, for deduplication
	stampCur     uint32
	operandDepth int

	// named lists node mentions inside named subgraphs, so that a named
	// subgraph used as an operand stands for every node of that subgraph,
	// earlier occurrences included; occ gives each subgraph's ranges in
	// it. A subgraph is its name within its parent (common DOT practice,
	// from memory: a name is looked up among the parent's subgraphs only),
	// so subs numbers each (parent, name) once; the graph is 0 and every
	// anonymous subgraph a number of its own.
	named      []int32
	namedDepth int
	occ        map[int32][][2]int32
	subs       map[subKey]int32
	lastSub    int32

	nodeDefaults NodeAttrs
	savedNode    []NodeAttrs
	edgeDefaults *attrChain
}

// subKey names a subgraph: its parent's number and its own name.
type subKey struct {
	parent int32
	name   string
}

// operand is one vertex of an edge statement: a node, or the node set of
// a subgraph given as a range of the log.
type operand struct {
	node     int32 // >= 0 for a node operand
	start, n int32 // log range of a subgraph operand
	computed bool  // the range holds the deduplicated set
}

func (o *operand) isSub() bool { return o.node < 0 }
func (o *operand) empty() bool { return o.node < 0 && o.n == 0 }
func (o *operand) size() int64 {
	if o.node >= 0 {
		return 1
	}
	return int64(o.n)
}

// frame is either a statement list (graph or subgraph body) or an edge
// statement in progress.
type frame struct {
	// statement list
	stmts     []ast.Stmt
	i         int
	savedEdge *attrChain
	savedNode int32 // index into walker.savedNode, -1 if untouched
	isOperand bool
	isGraph   bool
	logStart  int32
	subIndex  int32 // index into sc.subNodes
	nodeTok0  int32 // walker.nodeTok when the list opened
	sub       int32 // the subgraph's number (see walker.subs)
	named     bool  // a named subgraph
	named0    int32 // len(walker.named) when the list opened

	// edge statement
	es      *ast.EdgeStmt
	stmtIdx int32
	cur     *ast.Edge // edge whose vertex is being walked; nil while walking From
	left    operand
	prevOp  int32
}

func (w *walker) internal(format string, args ...any) error {
	return errInternal(fmt.Sprintf(format, args...))
}

func (w *walker) run() error {
	sc := w.sc
	if len(w.f.ast.Graphs) != len(sc.graphKw) {
		return w.internal("%d graphs parsed, %d graph keywords scanned", len(w.f.ast.Graphs), len(sc.graphKw))
	}
	for gi, ag := range w.f.ast.Graphs {
		off := int(sc.graphKw[gi])
		line, col := w.f.pm.lineCol(off)
		name, _ := canonical(ag.ID)
		g := &Graph{
			ID: ag.ID, Name: name, Directed: ag.Directed, Strict: ag.Strict,
			Line: line, Col: col,
			file: w.f, ast: ag, index: make(map[string]int32, nodeGuess(sc, gi)),
		}
		// Each node-to-node operator gives one edge: a good first capacity.
		end := math.MaxInt32
		if gi+1 < len(sc.graphKw) {
			end = int(sc.graphKw[gi+1])
		}
		nops := 0
		for k := len(w.f.ops); k+nops < len(sc.ops) && int(sc.ops[k+nops]) < end; nops++ {
		}
		g.Edges = make([]Edge, 0, nops)
		w.f.Graphs = append(w.f.Graphs, g)
		w.g = g
		w.log = w.log[:0]
		w.stamp = w.stamp[:0]
		w.nodeDefaults = NodeAttrs{}
		w.savedNode = w.savedNode[:0]
		w.edgeDefaults = nil
		w.named = w.named[:0]
		w.namedDepth = 0
		w.occ = make(map[int32][][2]int32)
		w.subs = make(map[subKey]int32)
		w.lastSub = 0
		w.stack = append(w.stack[:0], frame{stmts: ag.Stmts, isGraph: true, savedNode: -1, subIndex: -1})
		if err := w.walk(); err != nil {
			return err
		}
	}
	switch {
	case w.nodeTok != len(sc.nodeToks):
		return w.internal("%d node mentions parsed, %d scanned", w.nodeTok, len(sc.nodeToks))
	case len(w.f.ops) != len(sc.ops):
		return w.internal("%d edge operators parsed, %d scanned", len(w.f.ops), len(sc.ops))
	case w.subCount != len(sc.subNodes):
		return w.internal("%d subgraphs parsed, %d scanned", w.subCount, len(sc.subNodes))
	}
	return nil
}

func (w *walker) walk() error {
	for len(w.stack) > 0 {
		top := len(w.stack) - 1
		fr := &w.stack[top]
		if fr.es != nil {
			return w.internal("edge statement frame left on top")
		}
		if fr.i == len(fr.stmts) {
			if err := w.closeList(); err != nil {
				return err
			}
			continue
		}
		st := fr.stmts[fr.i]
		fr.i++
		switch st := st.(type) {
		case *ast.NodeStmt:
			known := len(w.g.Nodes)
			idx, err := w.mention(st.Node)
			if err != nil {
				return err
			}
			applyNodeAttrs(&w.g.Nodes[idx].Attrs, st.Attrs)
			if top == 0 && int(idx) < known && len(st.Attrs) > 0 && printedAttrs(st.Attrs, staleNode) == 0 {
				// Only stale layout data (a pos, an xlp), which the
				// output replaces, of a node the graph already has: with
				// it gone the statement says nothing.
				if w.g.posOnly == nil {
					w.g.posOnly = make(map[*ast.NodeStmt]bool)
				}
				w.g.posOnly[st] = true
			}
		case *ast.EdgeStmt:
			if err := w.startEdge(st); err != nil {
				return err
			}
		case *ast.AttrStmt:
			w.attrStmt(st, top)
		case *ast.Attr:
			// A graph attribute; nothing gridwood reads.
		case *ast.Subgraph:
			if err := w.openList(st, false); err != nil {
				return err
			}
		default:
			return w.internal("unknown statement type %T", st)
		}
	}
	return nil
}

func (w *walker) openList(sub *ast.Subgraph, isOperand bool) error {
	if w.subCount >= len(w.sc.subNodes) {
		return w.internal("more subgraphs parsed than scanned")
	}
	// The enclosing list: the top frame, or the one below an edge
	// statement whose operand this is.
	parent := int32(0)
	for i := len(w.stack) - 1; i >= 0; i-- {
		if w.stack[i].es == nil {
			parent = w.stack[i].sub
			break
		}
	}
	w.lastSub++
	num := w.lastSub
	if sub.ID != "" {
		// A named one's key starts with a kind byte, so that the empty
		// name `subgraph ""` is a name too.
		name, html := canonical(sub.ID)
		if !html && isClusterName(name) {
			// Where each occurrence of a cluster starts, for Clusters.
			if w.g.clusterAt == nil {
				w.g.clusterAt = make(map[*ast.Subgraph]int32)
			}
			w.g.clusterAt[sub] = w.sc.subAt[w.subCount]
		}
		key := subKey{parent, "s" + name}
		if html {
			key.name = "h" + name
		}
		if n, ok := w.subs[key]; ok {
			num = n
		} else {
			w.subs[key] = num
		}
		w.namedDepth++
	}
	w.stack = append(w.stack, frame{
		stmts: sub.Stmts, savedEdge: w.edgeDefaults, savedNode: -1,
		isOperand: isOperand, logStart: int32(len(w.log)),
		subIndex: int32(w.subCount), nodeTok0: int32(w.nodeTok),
		sub: num, named: sub.ID != "", named0: int32(len(w.named)),
	})
	w.subCount++
	if isOperand {
		w.operandDepth++
	}
	return nil
}

func (w *walker) closeList() error {
	fr := w.stack[len(w.stack)-1]
	w.stack = w.stack[:len(w.stack)-1]
	w.edgeDefaults = fr.savedEdge
	if fr.savedNode >= 0 {
		w.nodeDefaults = w.savedNode[fr.savedNode]
		w.savedNode = w.savedNode[:fr.savedNode]
	}
	if fr.isGraph {
		return nil
	}
	if int32(w.nodeTok)-fr.nodeTok0 != w.sc.subNodes[fr.subIndex] {
		return w.internal("subgraph %d: %d node mentions parsed, %d scanned", fr.subIndex, int32(w.nodeTok)-fr.nodeTok0, w.sc.subNodes[fr.subIndex])
	}
	var earlier [][2]int32
	if fr.named {
		w.namedDepth--
		earlier = w.occ[fr.sub]
		w.occ[fr.sub] = append(earlier, [2]int32{fr.named0, int32(len(w.named))})
	}
	if len(earlier) > 0 && w.operandDepth > 0 {
		// A reopened subgraph inside an operand: its nodes from earlier
		// occurrences come first, then the new ones. The work counts
		// towards the expansion cap, so repeated reopening stays bounded.
		cur := append([]int32(nil), w.log[fr.logStart:]...)
		w.log = w.log[:fr.logStart]
		for _, r := range earlier {
			w.spent += int64(r[1] - r[0])
			w.log = append(w.log, w.named[r[0]:r[1]]...)
		}
		w.log = append(w.log, cur...)
		if w.limit >= 0 && w.spent > w.limit {
			return &Error{File: w.f.Name, Msg: fmt.Sprintf("reopened subgraph operands expand to more than %d nodes (raise the limit with --max-expansion)", w.limit)}
		}
	}
	if !fr.isOperand {
		return nil
	}
	w.operandDepth--
	o := operand{node: -1, start: fr.logStart, n: int32(len(w.log)) - fr.logStart}
	ei := len(w.stack) - 1
	if ei < 0 || w.stack[ei].es == nil {
		return w.internal("subgraph operand outside an edge statement")
	}
	ef := &w.stack[ei]
	if ef.cur != nil {
		if err := w.pair(ef, o); err != nil {
			return err
		}
	} else {
		ef.left = o
	}
	return w.advance()
}

// attrStmt records `node [...]` and `edge [...]` defaults in the scope of
// the list frame at index top.
func (w *walker) attrStmt(st *ast.AttrStmt, top int) {
	switch st.Kind {
	case ast.NodeKind:
		fr := &w.stack[top]
		if fr.savedNode < 0 {
			fr.savedNode = int32(len(w.savedNode))
			w.savedNode = append(w.savedNode, w.nodeDefaults)
		}
		applyNodeAttrs(&w.nodeDefaults, st.Attrs)
	case ast.EdgeKind:
		if len(st.Attrs) > 0 {
			w.edgeDefaults = &attrChain{attrs: st.Attrs, parent: w.edgeDefaults}
		}
	}
}

func applyNodeAttrs(na *NodeAttrs, attrs []*ast.Attr) {
	for _, a := range attrs {
		var field *string
		switch key, _ := canonical(a.Key); key {
		case "width":
			field = &na.Width
		case "height":
			field = &na.Height
		case "label":
			field = &na.Label
		case "fontsize":
			field = &na.FontSize
		case "shape":
			field = &na.Shape
		case "fixedsize":
			field = &na.FixedSize
		case "pos":
			field = &na.Pos
		default:
			continue
		}
		*field, _ = canonical(a.Val)
	}
}

// mention looks up or creates the node of the next node token.
func (w *walker) mention(n *ast.Node) (int32, error) {
	k := w.nodeTok
	if k >= len(w.sc.nodeToks) {
		return 0, w.internal("more node mentions parsed than scanned")
	}
	w.nodeTok++
	g := w.g
	name, html := canonical(n.ID)
	key := name
	if html {
		key = "\x00" + name
	}
	idx, ok := g.index[key]
	if !ok {
		if len(g.Nodes) >= math.MaxInt32 {
			return 0, w.internal("too many nodes")
		}
		idx = int32(len(g.Nodes))
		line, col := w.f.pm.lineCol(int(w.sc.nodeToks[k]))
		if len(g.Nodes) == cap(g.Nodes) {
			// Double: append's gentler growth for large slices of this
			// 160-byte struct allocates several times the final size.
			grown := make([]Node, len(g.Nodes), max(2*cap(g.Nodes), 4))
			copy(grown, g.Nodes)
			g.Nodes = grown
		}
		g.Nodes = append(g.Nodes, Node{ID: n.ID, Name: name, Line: line, Col: col, Attrs: w.nodeDefaults})
		g.index[key] = idx
		w.stamp = append(w.stamp, 0)
	}
	if w.operandDepth > 0 {
		w.log = append(w.log, idx)
	}
	if w.namedDepth > 0 {
		w.named = append(w.named, idx)
	}
	return idx, nil
}

func (w *walker) startEdge(es *ast.EdgeStmt) error {
	si := int32(len(w.f.stmts))
	w.f.stmts = append(w.f.stmts, edgeStmtInfo{stmt: es, defaults: w.edgeDefaults, lastOp: -1})
	w.stack = append(w.stack, frame{es: es, stmtIdx: si, prevOp: -1})
	switch v := es.From.(type) {
	case *ast.Node:
		idx, err := w.mention(v)
		if err != nil {
			return err
		}
		w.stack[len(w.stack)-1].left = operand{node: idx}
		return w.advance()
	case *ast.Subgraph:
		return w.openList(v, true)
	default:
		return w.internal("unknown vertex type %T", v)
	}
}

// advance moves the edge statement on top of the stack to its next edge,
// walking node operands at once and opening subgraph operands.
func (w *walker) advance() error {
	for {
		ei := len(w.stack) - 1
		fr := &w.stack[ei]
		var e *ast.Edge
		if fr.cur == nil {
			e = fr.es.To
		} else {
			e = fr.cur.To
		}
		if e == nil {
			w.stack = w.stack[:ei]
			if w.operandDepth == 0 {
				w.log = w.log[:0]
			}
			return nil
		}
		fr.cur = e
		op := len(w.f.ops)
		if op >= len(w.sc.ops) {
			return w.internal("more edge operators parsed than scanned")
		}
		w.f.ops = append(w.f.ops, opInfo{edge: e, stmt: fr.stmtIdx, prev: fr.prevOp, edgeStart: int32(len(w.g.Edges)), off: w.sc.ops[op]})
		fr.prevOp = int32(op)
		w.f.stmts[fr.stmtIdx].lastOp = int32(op)
		switch v := e.Vertex.(type) {
		case *ast.Node:
			if fr.left.isSub() && !fr.left.computed && fr.left.n > 0 {
				// The left set is needed and still the suffix of the log.
				if err := w.compactSuffix(&fr.left); err != nil {
					return err
				}
			}
			idx, err := w.mention(v)
			if err != nil {
				return err
			}
			if err := w.pair(fr, operand{node: idx}); err != nil {
				return err
			}
		case *ast.Subgraph:
			return w.openList(v, true)
		default:
			return w.internal("unknown vertex type %T", v)
		}
	}
}

// pair produces the edges between the left operand of fr and right, for
// the last operator of fr, and makes right the new left operand.
func (w *walker) pair(fr *frame, right operand) error {
	op := fr.prevOp
	left := fr.left
	fr.left = right
	w.f.ops[op].edgeStart = int32(len(w.g.Edges))
	if left.empty() || right.empty() {
		return nil
	}
	switch {
	case left.isSub() && right.isSub() && !left.computed:
		if err := w.compactTwo(&left, &right); err != nil {
			return err
		}
	case right.isSub() && !right.computed:
		if err := w.compactSuffix(&right); err != nil {
			return err
		}
	}
	if left.isSub() && !left.computed {
		return w.internal("left operand set not computed")
	}
	fr.left = right
	count := left.size() * right.size()
	if left.isSub() || right.isSub() {
		w.spent += count
		if w.limit >= 0 && w.spent > w.limit {
			line, col := w.f.pm.lineCol(int(w.f.ops[op].off))
			msg := fmt.Sprintf("edge statement expands to %d edges, more than the limit of %d (raise it with --max-expansion)", count, w.limit)
			if count <= w.limit {
				msg = fmt.Sprintf("edge statements with subgraph operands expand to %d edges in total, more than the limit of %d (raise it with --max-expansion)", w.spent, w.limit)
			}
			return &Error{File: w.f.Name, Line: line, Col: col, Msg: msg}
		}
	}
	if int64(len(w.g.Edges))+count >= math.MaxInt32 {
		return &Error{File: w.f.Name, Msg: "more than 2^31 edges"}
	}
	ls := w.set(&left)
	rs := w.set(&right)
	for _, u := range ls {
		for _, v := range rs {
			w.g.Edges = append(w.g.Edges, Edge{From: u, To: v, Op: op})
		}
	}
	return nil
}

func (w *walker) set(o *operand) []int32 {
	if o.node >= 0 {
		return []int32{o.node}
	}
	return w.log[o.start : o.start+o.n]
}

// dedupe copies the first occurrence of each node of log[from:to] to
// log[at:], in order, and returns the end of what it wrote; at <= from.
func (w *walker) dedupe(from, to, at int32) int32 {
	w.stampCur++
	if w.stampCur == 0 {
		clear(w.stamp)
		w.stampCur = 1
	}
	cur := w.stampCur
	for r := from; r < to; r++ {
		v := w.log[r]
		if w.stamp[v] != cur {
			w.stamp[v] = cur
			w.log[at] = v
			at++
		}
	}
	return at
}

func (w *walker) compactSuffix(o *operand) error {
	end := o.start + o.n
	if int(end) != len(w.log) {
		return w.internal("operand range is not the suffix of the log")
	}
	e := w.dedupe(o.start, end, o.start)
	o.n = e - o.start
	o.computed = true
	w.log = w.log[:e]
	return nil
}

func (w *walker) compactTwo(l, r *operand) error {
	if l.start+l.n != r.start || int(r.start+r.n) != len(w.log) {
		return w.internal("operand ranges are not the suffix of the log")
	}
	le := w.dedupe(l.start, l.start+l.n, l.start)
	re := w.dedupe(r.start, r.start+r.n, le)
	l.n = le - l.start
	l.computed = true
	r.start, r.n = le, re-le
	r.computed = true
	w.log = w.log[:re]
	return nil
}

// nodeGuess sizes a graph's name index up front, so it is not rehashed as
// it grows: at most one node per node mention of this graph (the mentions
// of a graph lie between its keyword and the next graph's), capped so that
// a file of many mentions of few nodes does not reserve much.
func nodeGuess(sc *scanned, gi int) int {
	lo, hi := int32(0), int32(math.MaxInt32)
	if gi < len(sc.graphKw) {
		lo = sc.graphKw[gi]
	}
	if gi+1 < len(sc.graphKw) {
		hi = sc.graphKw[gi+1]
	}
	i, _ := slices.BinarySearch(sc.nodeToks, lo)
	j, _ := slices.BinarySearch(sc.nodeToks, hi)
	return min(j-i, 1<<22) / 2
}
