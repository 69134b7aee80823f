package dotio

import (
	"slices"
	"strings"

	"gonum.org/v1/gonum/graph/formats/dot/ast"
)

// isClusterName reports whether a subgraph of this canonical name is a
// cluster: its name starts with "cluster", exactly so, in lower case
// (common DOT practice, from memory). "Cluster_a" and "CLUSTER_a" are
// ordinary subgraphs; so is an HTML name.
func isClusterName(name string) bool { return strings.HasPrefix(name, "cluster") }

// Cluster is a cluster subgraph: a subgraph whose name starts with
// "cluster". Its occurrences under one parent (a named subgraph opened
// again) are one cluster.
type Cluster struct {
	// ID is its name's lexeme as first written; Name the canonical name.
	ID, Name string
	// Line and Col are those of the subgraph keyword of its first
	// occurrence.
	Line, Col int
	// Parent is the index of the nearest enclosing cluster, through any
	// ordinary subgraphs between them; -1 for a cluster at the top.
	Parent int
	// Nodes are the nodes whose innermost cluster this is (see
	// ClusterSet.Home), in increasing order. ClusterSet.Members adds the
	// nodes of the clusters nested in it.
	Nodes []int32
	// Label is the effective graph attribute label inside the cluster
	// (see Attrs), unquoted as Attr.Text does; LabelSet says whether any
	// is in effect and LabelHTML whether it is an HTML string.
	Label               string
	LabelSet, LabelHTML bool
	// FontSize is the effective fontsize as text ("" when unset), and
	// LabelLoc the effective labelloc.
	FontSize, LabelLoc string
	// Attrs holds the effective values of the keys asked of Clusters that
	// are set, in the order asked: the graph attributes in force where the
	// cluster first opens (those of the graph and of the enclosing
	// subgraphs, set before it; DOT's scoping, from memory), then those
	// its own bodies set (`graph [...]` and key=value statements directly
	// inside it, in every occurrence, in order); a later value wins.
	Attrs []Attr

	first *ast.Subgraph // the first occurrence
	snap  int32         // attribute snapshot (see AttrTable)
}

// ClusterConflict is a node mentioned in two clusters neither of which
// holds the other. The node stays in the cluster it was first put in
// (Kept) and is left out of the other (Dropped).
type ClusterConflict struct {
	Node          int32
	Kept, Dropped int
}

// ClusterSet is the cluster structure of a graph: the clusters, the
// innermost cluster of every node, and the conflicts resolved on the way.
//
// Membership is laminar: every node belongs to its home cluster and to
// the clusters that hold that one, and to no other. A node belongs to the
// clusters it is mentioned in (as a node statement or an edge operand,
// nested subgraphs included), except that, going through its mentions in
// text order, a mention in a cluster that neither holds nor lies inside
// the node's cluster so far is a conflict: the first placement wins, and
// the later cluster does not get the node. A mention deeper inside the
// node's cluster so far moves it down there.
type ClusterSet struct {
	Clusters []Cluster
	// Home holds, per node, the index of its innermost cluster, -1 for a
	// node in no cluster.
	Home []int32
	// Conflicts lists each node and cluster it was refused once, in the
	// order the mentions come in the text.
	Conflicts []ClusterConflict

	pre, end []int32 // preorder number of each cluster; its subtree is [pre, end)
	byPre    []int32 // clusters in preorder
	size     []int32 // members, nested ones included
}

// Contains reports whether node v belongs to cluster c, directly or
// through a cluster nested in c. It takes constant time.
func (s *ClusterSet) Contains(c, v int) bool {
	h := s.Home[v]
	return h >= 0 && s.pre[c] <= s.pre[h] && s.pre[h] < s.end[c]
}

// Holds reports whether cluster a holds cluster b (a == b included).
func (s *ClusterSet) Holds(a, b int) bool {
	return s.pre[a] <= s.pre[b] && s.pre[b] < s.end[a]
}

// Size returns the number of nodes that belong to cluster c.
func (s *ClusterSet) Size(c int) int { return int(s.size[c]) }

// Members returns the nodes that belong to cluster c, nested clusters
// included, in increasing order. It costs their number (times its
// logarithm); the sum over all clusters grows with the depth of nesting,
// which is why Cluster.Nodes holds the own nodes only.
func (s *ClusterSet) Members(c int) []int32 {
	out := make([]int32, 0, s.size[c])
	for _, d := range s.byPre[s.pre[c]:s.end[c]] {
		out = append(out, s.Clusters[d].Nodes...)
	}
	slices.Sort(out)
	return out
}

// Clusters returns the cluster structure of g, with the effective values
// of the given graph attribute keys (as text, such as "color") in each
// Cluster.Attrs. It walks the graph's statements once, without recursion:
// its cost is linear in the size of the input plus the keys asked times
// the graph attribute statements that set one of them.
func (g *Graph) Clusters(keys ...string) *ClusterSet {
	s := &ClusterSet{Home: make([]int32, len(g.Nodes))}
	for v := range s.Home {
		s.Home[v] = -1
	}
	if len(g.clusterAt) == 0 {
		return s
	}
	t := newAttrTable(append([]string{"label", "fontsize", "labelloc"}, keys...))
	type mention struct{ node, cluster int32 }
	var mentions []mention
	lookup := func(n *ast.Node) int32 {
		name, html := canonical(n.ID)
		if html {
			name = "\x00" + name
		}
		v, ok := g.index[name]
		if !ok {
			return -1 // unreachable: the reader made every node
		}
		return v
	}
	type subKey struct {
		parent int32
		name   string
	}
	subs := map[subKey]int32{}
	clusterOf := map[int32]int32{} // subgraph number to cluster index
	lastSub := int32(0)
	// A frame is a statement list (the graph's or a subgraph's body) or
	// the vertices of an edge statement; num, cluster and snap are those
	// of the list, or of the list holding the edge statement.
	type frame struct {
		stmts   []ast.Stmt
		verts   []ast.Vertex
		i       int
		num     int32 // subgraph number (see walker.subs); the graph is 0
		cluster int32 // innermost cluster, -1 for none
		own     int32 // the cluster this list is a body of, -1 for none
		snap    int32 // graph attributes in force
	}
	stack := []frame{{stmts: g.ast.Stmts, cluster: -1, own: -1}}
	open := func(sub *ast.Subgraph, p *frame) {
		lastSub++
		num := lastSub
		name, html := canonical(sub.ID)
		if sub.ID != "" {
			key := subKey{p.num, "s" + name}
			if html {
				key.name = "h" + name
			}
			if n, ok := subs[key]; ok {
				num = n
			} else {
				subs[key] = num
			}
		}
		fr := frame{stmts: sub.Stmts, num: num, cluster: p.cluster, own: -1, snap: p.snap}
		if at, ok := g.clusterAt[sub]; ok {
			c, seen := clusterOf[num]
			if !seen {
				c = int32(len(s.Clusters))
				clusterOf[num] = c
				line, col := g.file.pm.lineCol(int(at))
				s.Clusters = append(s.Clusters, Cluster{ID: sub.ID, Name: name, Line: line, Col: col, Parent: int(p.cluster), first: sub, snap: p.snap})
			}
			fr.cluster, fr.own = c, c
		}
		stack = append(stack, fr)
	}
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
				if fr.cluster >= 0 {
					mentions = append(mentions, mention{lookup(v), fr.cluster})
				}
			case *ast.Subgraph:
				open(v, fr)
			}
			continue
		}
		if fr.i == len(fr.stmts) {
			stack = stack[:len(stack)-1]
			continue
		}
		st := fr.stmts[fr.i]
		fr.i++
		var attrs []*ast.Attr
		switch st := st.(type) {
		case *ast.NodeStmt:
			if fr.cluster >= 0 {
				mentions = append(mentions, mention{lookup(st.Node), fr.cluster})
			}
		case *ast.EdgeStmt:
			verts := []ast.Vertex{st.From}
			for e := st.To; e != nil; e = e.To {
				verts = append(verts, e.Vertex)
			}
			stack = append(stack, frame{verts: verts, num: fr.num, cluster: fr.cluster, own: -1, snap: fr.snap})
		case *ast.AttrStmt:
			if st.Kind == ast.GraphKind {
				attrs = st.Attrs
			}
		case *ast.Attr:
			attrs = []*ast.Attr{st}
		case *ast.Subgraph:
			open(st, fr)
		}
		if attrs != nil {
			fr.snap = t.apply(fr.snap, attrs)
			if fr.own >= 0 {
				c := &s.Clusters[fr.own]
				c.snap = t.apply(c.snap, attrs)
			}
		}
	}

	k := len(s.Clusters)
	s.order()
	refused := map[ClusterConflict]bool{}
	for _, m := range mentions {
		if m.node < 0 {
			continue
		}
		h := s.Home[m.node]
		switch {
		case h < 0 || s.Holds(int(h), int(m.cluster)):
			s.Home[m.node] = m.cluster
		case s.Holds(int(m.cluster), int(h)):
		default:
			cf := ClusterConflict{Node: m.node, Kept: int(h), Dropped: int(m.cluster)}
			if !refused[cf] {
				// A node refused by one cluster several times is
				// listed once.
				refused[cf] = true
				s.Conflicts = append(s.Conflicts, cf)
			}
		}
	}
	s.size = make([]int32, k)
	for v, h := range s.Home {
		if h >= 0 {
			s.Clusters[h].Nodes = append(s.Clusters[h].Nodes, int32(v))
			s.size[h]++
		}
	}
	// Parents come before their children (a cluster first opens inside
	// an occurrence of its parent), so one backward pass adds up sizes.
	for c := k - 1; c >= 0; c-- {
		if p := s.Clusters[c].Parent; p >= 0 {
			s.size[p] += s.size[c]
		}
	}
	for c := range s.Clusters {
		cl := &s.Clusters[c]
		row := t.snaps[cl.snap]
		if a := row[0]; a != nil {
			cl.LabelSet = true
			cl.Label, cl.LabelHTML = canonical(a.Val)
		}
		if a := row[1]; a != nil {
			cl.FontSize, _ = canonical(a.Val)
		}
		if a := row[2]; a != nil {
			cl.LabelLoc, _ = canonical(a.Val)
		}
		for _, key := range keys {
			if a := row[t.cols[key]]; a != nil {
				cl.Attrs = append(cl.Attrs, Attr{Key: a.Key, Value: a.Val})
			}
		}
	}
	return s
}

// order numbers the clusters in preorder (roots and children in index
// order), without recursion.
func (s *ClusterSet) order() {
	k := len(s.Clusters)
	s.pre, s.end = make([]int32, k), make([]int32, k)
	s.byPre = make([]int32, 0, k)
	// Children in index order, as compressed rows.
	start := make([]int32, k+2)
	for _, c := range s.Clusters {
		start[c.Parent+2]++
	}
	for i := 1; i < len(start); i++ {
		start[i] += start[i-1]
	}
	kids := make([]int32, k)
	fill := slices.Clone(start)
	for c := range s.Clusters {
		p := s.Clusters[c].Parent + 1 // the roots' list is row 0
		kids[fill[p]] = int32(c)
		fill[p]++
	}
	type item struct {
		c    int32
		next int32 // next child row entry to visit
	}
	var stack []item
	for _, r := range kids[start[0]:start[1]] {
		stack = append(stack, item{r, start[r+1]})
		s.pre[r] = int32(len(s.byPre))
		s.byPre = append(s.byPre, r)
		for len(stack) > 0 {
			top := &stack[len(stack)-1]
			if top.next == start[top.c+2] {
				s.end[top.c] = int32(len(s.byPre))
				stack = stack[:len(stack)-1]
				continue
			}
			c := kids[top.next]
			top.next++
			s.pre[c] = int32(len(s.byPre))
			s.byPre = append(s.byPre, c)
			stack = append(stack, item{c, start[c+1]})
		}
	}
}
