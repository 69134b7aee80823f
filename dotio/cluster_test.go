package dotio

import (
	"fmt"
	"math/rand"
	"slices"
	"strings"
	"testing"
)

// describeClusters words a cluster set one cluster a line: name, position,
// parent name, own nodes, all members, label and fontsize; then each
// conflict.
func describeClusters(g *Graph, s *ClusterSet) string {
	var b strings.Builder
	names := func(vs []int32) string {
		var out []string
		for _, v := range vs {
			out = append(out, g.Nodes[v].Name)
		}
		return "[" + strings.Join(out, " ") + "]"
	}
	for _, c := range s.Clusters {
		parent := "-"
		if c.Parent >= 0 {
			parent = s.Clusters[c.Parent].Name
		}
		fmt.Fprintf(&b, "%s@%d:%d in %s own %s", c.Name, c.Line, c.Col, parent, names(c.Nodes))
		if c.LabelSet {
			fmt.Fprintf(&b, " label %q", c.Label)
			if c.LabelHTML {
				b.WriteString(" html")
			}
		}
		if c.FontSize != "" {
			fmt.Fprintf(&b, " fontsize %s", c.FontSize)
		}
		if c.LabelLoc != "" {
			fmt.Fprintf(&b, " labelloc %s", c.LabelLoc)
		}
		b.WriteString("\n")
	}
	for _, cf := range s.Conflicts {
		fmt.Fprintf(&b, "conflict %s: kept in %s, not in %s\n", g.Nodes[cf.Node].Name, s.Clusters[cf.Kept].Name, s.Clusters[cf.Dropped].Name)
	}
	return b.String()
}

func TestClusters(t *testing.T) {
	for _, tc := range []struct {
		name, src, want string
	}{
		{"none", "graph { a -- b; subgraph s {c} {d} }", ""},
		{"two clusters, labels, fontsize",
			"graph {\n\tsubgraph cluster_a { label=\"Zone A\"; fontsize=9; a -- b }\n\tsubgraph cluster_b { graph [label=<<b>B</b>>]; c }\n\ta -- c\n}",
			"cluster_a@2:2 in - own [a b] label \"Zone A\" fontsize 9\ncluster_b@3:2 in - own [c] label \"<<b>B</b>>\" html\n"},
		{"nesting through an ordinary subgraph",
			"graph { subgraph cluster_p { p; subgraph s { subgraph cluster_c { c } q } } }",
			"cluster_p@1:9 in - own [p q]\ncluster_c@1:46 in cluster_p own [c]\n"},
		// A node first in the parent, then in the child, is the child's;
		// first in the child, then in the parent, too.
		{"deeper mention wins",
			"graph { subgraph cluster_p { a; b; subgraph cluster_c { a } } subgraph cluster_p { subgraph cluster_c { b } } }",
			"cluster_p@1:9 in - own []\ncluster_c@1:36 in cluster_p own [a b]\n"},
		{"reopened clusters merge",
			"graph {\n\tsubgraph cluster_x { a; label=X }\n\tb\n\tsubgraph cluster_x { c; fontsize=20 }\n}",
			"cluster_x@2:2 in - own [a c] label \"X\" fontsize 20\n"},
		// A name is looked up among its parent's subgraphs only: the same
		// name under two parents is two clusters.
		{"same name, two parents",
			"graph { subgraph cluster_p { subgraph cluster_k { a } } subgraph cluster_q { subgraph cluster_k { b } } }",
			"cluster_p@1:9 in - own []\ncluster_k@1:30 in cluster_p own [a]\ncluster_q@1:57 in - own []\ncluster_k@1:78 in cluster_q own [b]\n"},
		// First placement wins; the conflict is listed once per cluster.
		{"sibling conflict",
			"graph { subgraph cluster_a { x; y } subgraph cluster_b { x -- z; x } subgraph cluster_c { subgraph cluster_d { x } } }",
			"cluster_a@1:9 in - own [x y]\ncluster_b@1:37 in - own [z]\ncluster_c@1:70 in - own []\ncluster_d@1:91 in cluster_c own []\n" +
				"conflict x: kept in cluster_a, not in cluster_b\nconflict x: kept in cluster_a, not in cluster_d\n"},
		// Case matters; a quoted name counts by its text; HTML never.
		{"names",
			"graph { subgraph Cluster_a {a} subgraph CLUSTER {b} subgraph \"cluster one\" {c} subgraph <cluster> {d} subgraph cluster {e} subgraph clusters {f} }",
			"cluster one@1:53 in - own [c]\ncluster@1:103 in - own [e]\nclusters@1:124 in - own [f]\n"},
		// Graph attributes set before a cluster opens are in force in it
		// (DOT's scoping, from memory); later ones are not.
		{"inherited label",
			"graph { label=Top; subgraph cluster_a {a} subgraph s { label=S; subgraph cluster_b {b} } subgraph cluster_c {c; label=C} label=Late; subgraph cluster_d {d} }",
			"cluster_a@1:20 in - own [a] label \"Top\"\ncluster_b@1:65 in - own [b] label \"S\"\ncluster_c@1:90 in - own [c] label \"C\"\ncluster_d@1:134 in - own [d] label \"Late\"\n"},
		{"edge operands",
			"digraph { a -> subgraph cluster_x { b; c } -> { d subgraph cluster_y { e } }; subgraph cluster_z { f -> {g h} } }",
			"cluster_x@1:16 in - own [b c]\ncluster_y@1:51 in - own [e]\ncluster_z@1:79 in - own [f g h]\n"},
		{"empty and keyword casing",
			"graph { SubGraph cluster_e { } subgraph cluster_f { labelloc=b; subgraph cluster_g {} } }",
			"cluster_e@1:9 in - own []\ncluster_f@1:32 in - own [] labelloc b\ncluster_g@1:65 in cluster_f own [] labelloc b\n"},
		{"anonymous subgraph as an edge operand inside a cluster",
			"graph {\n  subgraph cluster_a {\n    {a b} -- c\n  }\n}",
			"cluster_a@2:3 in - own [a b c]\n"},
	} {
		t.Run(tc.name, func(t *testing.T) {
			f := mustRead(t, tc.src)
			g := f.Graphs[0]
			s := g.Clusters()
			if got := describeClusters(g, s); got != tc.want {
				t.Errorf("got\n%s\nwant\n%s", got, tc.want)
			}
			checkClusterSet(t, g, s)
		})
	}
}

// checkClusterSet checks the derived parts of a cluster set against each
// other: Home against Nodes, Members and Contains against a walk up the
// parents, Size against Members, and the laminar rule.
func checkClusterSet(t *testing.T, g *Graph, s *ClusterSet) {
	t.Helper()
	holds := func(a, b int) bool { // a holds b, by walking up from b
		for ; b >= 0; b = s.Clusters[b].Parent {
			if a == b {
				return true
			}
		}
		return false
	}
	for c, cl := range s.Clusters {
		if cl.Parent >= c {
			t.Fatalf("cluster %d has parent %d: parents must come first", c, cl.Parent)
		}
		for _, v := range cl.Nodes {
			if s.Home[v] != int32(c) {
				t.Errorf("node %d listed in %d, home %d", v, c, s.Home[v])
			}
		}
		if !slices.IsSorted(cl.Nodes) {
			t.Errorf("cluster %d: nodes not sorted: %v", c, cl.Nodes)
		}
		var want []int32
		for v, h := range s.Home {
			if h >= 0 && holds(c, int(h)) {
				want = append(want, int32(v))
			}
			if got := s.Contains(c, v); got != (h >= 0 && holds(c, int(h))) {
				t.Errorf("Contains(%d, %d) = %v", c, v, got)
			}
		}
		if got := s.Members(c); !slices.Equal(got, want) {
			t.Errorf("Members(%d) = %v, want %v", c, got, want)
		}
		if s.Size(c) != len(want) {
			t.Errorf("Size(%d) = %d, want %d", c, s.Size(c), len(want))
		}
		for d := range s.Clusters {
			if s.Holds(c, d) != holds(c, d) {
				t.Errorf("Holds(%d, %d) = %v", c, d, s.Holds(c, d))
			}
		}
	}
	if len(s.Home) != len(g.Nodes) {
		t.Errorf("%d homes for %d nodes", len(s.Home), len(g.Nodes))
	}
}

func TestClusterAttrs(t *testing.T) {
	f := mustRead(t, `graph { color=red; subgraph cluster_a { style=filled; subgraph cluster_b { graph [color=blue, label=B]; b } a } pencolor=x }`)
	s := f.Graphs[0].Clusters("color", "style", "pencolor", "label")
	got := fmt.Sprint(s.Clusters[0].Attrs, s.Clusters[1].Attrs)
	if want := "[{color red} {style filled}] [{color blue} {style filled} {label B}]"; got != want {
		t.Errorf("attrs %s, want %s", got, want)
	}
}

// TestClustersGenerated checks Clusters against a model of its rule on
// generated nestings of clusters, ordinary and anonymous subgraphs, with
// nodes mentioned in several places: the generator knows every mention's
// cluster and the tree, and applies the rule (first placement wins, deeper
// mentions move a node down) with ancestor walks of its own.
func TestClustersGenerated(t *testing.T) {
	rng := rand.New(rand.NewSource(7))
	for trial := range 400 {
		var b strings.Builder
		var parent []int // per cluster, in order of opening
		type mention struct{ node, cluster int }
		var mentions []mention
		nodes := 1 + rng.Intn(12)
		seq := 0
		var body func(depth, cluster int)
		body = func(depth, cluster int) {
			for range rng.Intn(4) {
				switch k := rng.Intn(6); {
				case k < 3 || depth > 4:
					v := rng.Intn(nodes)
					fmt.Fprintf(&b, " n%d;", v)
					if cluster >= 0 {
						mentions = append(mentions, mention{v, cluster})
					}
				case k == 3:
					seq++
					fmt.Fprintf(&b, " subgraph s%d {", seq)
					body(depth+1, cluster)
					b.WriteString(" }")
				default:
					seq++
					c := len(parent)
					parent = append(parent, cluster)
					fmt.Fprintf(&b, " subgraph cluster%d {", seq)
					body(depth+1, c)
					b.WriteString(" }")
				}
			}
		}
		b.WriteString("graph {")
		for v := range nodes {
			fmt.Fprintf(&b, " n%d;", v)
		}
		body(0, -1)
		b.WriteString(" }")
		holds := func(a, c int) bool {
			for ; c >= 0; c = parent[c] {
				if a == c {
					return true
				}
			}
			return false
		}
		home := make([]int, nodes)
		for v := range home {
			home[v] = -1
		}
		var conflicts []string
		for _, m := range mentions {
			h := home[m.node]
			switch {
			case h < 0 || holds(h, m.cluster):
				home[m.node] = m.cluster
			case holds(m.cluster, h):
			default:
				cf := fmt.Sprintf("%d:%d:%d", m.node, h, m.cluster)
				if !slices.Contains(conflicts, cf) {
					conflicts = append(conflicts, cf)
				}
			}
		}
		f := mustRead(t, b.String())
		g := f.Graphs[0]
		s := g.Clusters()
		if len(s.Clusters) != len(parent) {
			t.Fatalf("trial %d: %d clusters, want %d\n%s", trial, len(s.Clusters), len(parent), b.String())
		}
		for c := range parent {
			if s.Clusters[c].Parent != parent[c] {
				t.Fatalf("trial %d: cluster %d parent %d, want %d\n%s", trial, c, s.Clusters[c].Parent, parent[c], b.String())
			}
		}
		for v := range nodes {
			i, _ := g.Lookup(fmt.Sprintf("n%d", v))
			if int(s.Home[i]) != home[v] {
				t.Fatalf("trial %d: n%d home %d, want %d\n%s", trial, v, s.Home[i], home[v], b.String())
			}
		}
		var got []string
		for _, cf := range s.Conflicts {
			var v int
			fmt.Sscanf(g.Nodes[cf.Node].Name, "n%d", &v)
			got = append(got, fmt.Sprintf("%d:%d:%d", v, cf.Kept, cf.Dropped))
		}
		if !slices.Equal(got, conflicts) {
			t.Fatalf("trial %d: conflicts %v, want %v\n%s", trial, got, conflicts, b.String())
		}
		checkClusterSet(t, g, s)
	}
}

// TestClustersDeep: 100,000 clusters nested in one another, a node in
// each; Clusters stays linear (it lists own nodes, not members) and so
// does Contains.
func TestClustersDeep(t *testing.T) {
	const depth = 100_000
	var b strings.Builder
	b.WriteString("graph {")
	for i := range depth {
		fmt.Fprintf(&b, "subgraph cluster%d{n%d ", i, i)
	}
	b.WriteString(strings.Repeat("}", depth))
	b.WriteString("}")
	f := mustRead(t, b.String())
	s := f.Graphs[0].Clusters()
	if len(s.Clusters) != depth {
		t.Fatalf("%d clusters", len(s.Clusters))
	}
	for _, c := range []int{0, depth / 2, depth - 1} {
		if len(s.Clusters[c].Nodes) != 1 || s.Size(c) != depth-c || s.Clusters[c].Parent != c-1 {
			t.Errorf("cluster %d: own %v, size %d, parent %d", c, s.Clusters[c].Nodes, s.Size(c), s.Clusters[c].Parent)
		}
	}
	if !s.Contains(0, depth-1) || s.Contains(depth-1, 0) {
		t.Error("Contains wrong at the ends of the chain")
	}
}

// clusterLayout is synthLayout with a box per cluster: cluster c of a
// graph gets (c, 2c, 10c+5, 20c+7), and an empty one none.
func clusterLayout(f *File) []Layout {
	lays := synthLayout(f)
	for gi, g := range f.Graphs {
		s := g.Clusters()
		lays[gi].ClusterBB = make([][4]int64, len(s.Clusters))
		for c := range s.Clusters {
			lays[gi].ClusterBB[c] = [4]int64{int64(c), int64(2 * c), int64(10*c + 5), int64(20*c + 7)}
			if s.Size(c) == 0 {
				lays[gi].ClusterBB[c] = NoBB
			}
		}
	}
	return lays
}

// TestWriteClusterBB: every cluster but an empty one gets its box as the
// last statement of its first occurrence, ordinary subgraphs none, stale
// boxes inside clusters go, and the output read again and written with
// the same boxes prints the same bytes.
func TestWriteClusterBB(t *testing.T) {
	for name, src := range testInputs(t) {
		t.Run(name, func(t *testing.T) {
			f := mustRead(t, string(src))
			lays := clusterLayout(f)
			out := writeString(t, f, lays, WriteOptions{})
			if name == "clusters.gv" {
				golden(t, "clusters.bb.out", out)
			}
			f2 := mustRead(t, string(out))
			again := writeString(t, f2, clusterLayout(f2), WriteOptions{})
			if string(again) != string(out) {
				t.Errorf("written again:\n%s\nfirst:\n%s", again, out)
			}
			// Each written box is read back as the cluster's own bb.
			for gi, g := range f2.Graphs {
				s := g.Clusters("bb")
				for c, cl := range s.Clusters {
					want := ""
					if bb := lays[gi].ClusterBB[c]; bb != NoBB {
						want = fmt.Sprintf("%q", fmt.Sprintf("%d,%d,%d,%d", bb[0], bb[1], bb[2], bb[3]))
					}
					got := ""
					for _, a := range cl.Attrs {
						got = a.Value
					}
					if got != want {
						t.Errorf("graph %d cluster %s: bb %s, want %s", gi, cl.Name, got, want)
					}
				}
			}
			if n, k := strings.Count(string(out), "bb="), countBoxes(lays); n != k {
				t.Errorf("%d bb statements, want %d (one per graph and non-empty cluster)", n, k)
			}
		})
	}
}

func countBoxes(lays []Layout) int {
	n := len(lays)
	for _, l := range lays {
		for _, bb := range l.ClusterBB {
			if bb != NoBB {
				n++
			}
		}
	}
	return n
}

func TestWriteClusterBBErrors(t *testing.T) {
	f := mustRead(t, "graph { subgraph cluster_a {a} }")
	lays := synthLayout(f)
	lays[0].ClusterBB = make([][4]int64, 2)
	var b strings.Builder
	if err := Write(&b, f, lays, WriteOptions{}); err == nil || b.Len() > 0 {
		t.Errorf("two boxes for one cluster: %v, wrote %q", err, b.String())
	}
}
