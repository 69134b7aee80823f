package dotio

import (
	"math/rand"
	"strings"
)

// genDOT writes a random valid DOT file and, from its own model of what it
// wrote, the expected plain graphs in the format of dump. The model is
// independent of the reader: it evaluates edge statements recursively
// (operands left to right, a subgraph operand standing for the distinct
// nodes mentioned in it, in order of first mention).
type genDOT struct {
	rng      *rand.Rand
	b        strings.Builder
	directed bool
	nodes    []string
	seen     map[string]bool
	edges    []string
	// members are the nodes of each subgraph so far: a reopened subgraph
	// stands for all its nodes, earlier occurrences first. A subgraph is
	// its name within its parent (README.md, "What the output contains"),
	// so sOf gives each subgraph (by number; the graph is 0) the number of
	// its child named s; cur is the subgraph being written, last the last
	// number handed out.
	members   map[int][]string
	sOf       map[int]int
	cur, last int
}

// lexeme pools: each entry is a lexeme and its canonical name.
var genIDs = [][2]string{
	{"a", "a"}, {"b", "b"}, {"B1", "B1"}, {"_x", "_x"}, {"café", "café"},
	{"1", "1"}, {`"1"`, "1"}, {"-2.5", "-2.5"}, {".5", ".5"}, {"3.", "3."},
	{`"a"`, "a"}, {`"q\"x"`, `q"x`}, {"\"c\\\nd\"", "cd"}, {`"cd"`, "cd"},
	{`<b>`, `<b>`}, {`<<i>x</i>>`, `<<i>x</i>>`}, {`"a" + "b"`, "ab"}, {`"ab"`, "ab"},
	{`"sp ace"`, "sp ace"}, {`"back\\slash"`, `back\\slash`},
}

var genVals = []string{"1", "x", `"a b"`, `<<i>h</i>>`, `"2,3"`, "-1.5", `"r" + "s"`}
var genKeys = []string{"color", "label", "pos", "width", "bb", `"style"`}

func (g *genDOT) blank() {
	switch g.rng.Intn(9) {
	case 0:
		g.b.WriteString("\n")
	case 1:
		g.b.WriteString("\t")
	case 2:
		g.b.WriteString(" /* c */ ")
	case 3:
		g.b.WriteString(" // c\n")
	case 4:
		g.b.WriteString("\n# hash line\n")
	case 5:
		g.b.WriteString("\r\n")
	default:
		g.b.WriteString(" ")
	}
}

func (g *genDOT) kw(word string) {
	if g.rng.Intn(4) == 0 {
		// odd casing, keywords are case-insensitive
		bs := []byte(word)
		for i := range bs {
			if g.rng.Intn(2) == 0 {
				bs[i] -= 'a' - 'A'
			}
		}
		word = string(bs)
	}
	g.b.WriteString(word)
}

func (g *genDOT) mention(name string) {
	if !g.seen[name] {
		g.seen[name] = true
		g.nodes = append(g.nodes, name)
	}
}

func (g *genDOT) attrs() {
	if g.rng.Intn(2) == 0 {
		return
	}
	g.blank()
	g.b.WriteString("[")
	for i, n := 0, g.rng.Intn(3); i < n; i++ {
		g.b.WriteString(genKeys[g.rng.Intn(len(genKeys))])
		g.b.WriteString("=")
		g.b.WriteString(genVals[g.rng.Intn(len(genVals))])
		g.b.WriteString([]string{",", ";", " "}[g.rng.Intn(3)])
	}
	g.b.WriteString("]")
}

// vertex writes a node or subgraph operand and returns its node set.
func (g *genDOT) vertex(depth int) []string {
	if depth < 3 && g.rng.Intn(4) == 0 {
		return g.subgraph(depth + 1)
	}
	id := genIDs[g.rng.Intn(len(genIDs))]
	g.b.WriteString(id[0])
	switch g.rng.Intn(6) {
	case 0:
		g.b.WriteString(":p")
	case 1:
		g.b.WriteString(":n")
	case 2:
		g.b.WriteString(`:"port":sw`)
	}
	g.mention(id[1])
	return []string{id[1]}
}

// subgraph writes a subgraph and returns the distinct nodes mentioned in
// it in order of first mention.
func (g *genDOT) subgraph(depth int) []string {
	named := false
	if g.rng.Intn(2) == 0 {
		g.kw("subgraph")
		if g.rng.Intn(2) == 0 {
			g.b.WriteString(" s")
			named = true
		}
		g.blank()
	}
	g.b.WriteString("{")
	parent := g.cur
	g.last++
	id := g.last
	if named {
		if sid, ok := g.sOf[parent]; ok {
			id = sid
		} else {
			g.sOf[parent] = id
		}
	}
	g.cur = id
	defer func() { g.cur = parent }()
	var set []string
	in := map[string]bool{}
	for i, n := 0, g.rng.Intn(4); i < n; i++ {
		g.blank()
		for _, v := range g.stmt(depth) {
			if !in[v] {
				in[v] = true
				set = append(set, v)
			}
		}
		if g.rng.Intn(3) == 0 {
			g.b.WriteString(";")
		}
	}
	g.blank()
	g.b.WriteString("}")
	if named {
		merged := append([]string(nil), g.members[id]...)
		seen := map[string]bool{}
		for _, v := range merged {
			seen[v] = true
		}
		for _, v := range set {
			if !seen[v] {
				seen[v] = true
				merged = append(merged, v)
				g.members[id] = append(g.members[id], v)
			}
		}
		set = merged
	}
	return set
}

// stmt writes one statement and returns the nodes it mentions, in order.
func (g *genDOT) stmt(depth int) []string {
	switch g.rng.Intn(7) {
	case 0, 1:
		n := g.b.Len()
		v := g.vertex(depth)
		if !strings.HasSuffix(g.b.String()[n:], "}") {
			g.attrs() // a node statement; a subgraph takes no attributes
		}
		return v
	case 2, 3:
		op, sep := "--", "-"
		if g.directed {
			op, sep = "->", ">"
		}
		var all []string
		left := g.vertex(depth)
		all = append(all, left...)
		for i, n := 0, 1+g.rng.Intn(3); i < n; i++ {
			g.blank()
			g.b.WriteString(op)
			g.blank()
			right := g.vertex(depth)
			all = append(all, right...)
			for _, u := range left {
				for _, v := range right {
					g.edges = append(g.edges, u+sep+v)
				}
			}
			left = right
		}
		g.attrs()
		return all
	case 4:
		g.kw([]string{"graph", "node", "edge"}[g.rng.Intn(3)])
		g.blank()
		g.b.WriteString("[")
		g.b.WriteString("width=2")
		g.b.WriteString("]")
		return nil
	case 5:
		g.b.WriteString(genKeys[g.rng.Intn(len(genKeys))] + "=" + genVals[g.rng.Intn(len(genVals))])
		return nil
	default:
		if depth < 3 {
			return g.subgraph(depth + 1)
		}
		return g.vertex(depth)
	}
}

// generate returns a DOT text and its expected dump.
func generate(rng *rand.Rand) (src, want string) {
	var b strings.Builder
	var w strings.Builder
	for gi, ng := 0, 1+rng.Intn(2); gi < ng; gi++ {
		g := &genDOT{rng: rng, directed: rng.Intn(2) == 0, seen: map[string]bool{}, members: map[int][]string{}, sOf: map[int]int{}}
		kind := "graph"
		if g.directed {
			kind = "digraph"
		}
		strict := rng.Intn(3) == 0
		if strict {
			g.kw("strict")
			g.b.WriteString(" ")
		}
		g.kw(kind)
		id := ""
		if rng.Intn(2) == 0 {
			id = "G"
			g.b.WriteString(" G")
		}
		g.blank()
		g.b.WriteString("{")
		for i, n := 0, rng.Intn(6); i < n; i++ {
			g.blank()
			g.stmt(0)
			if rng.Intn(2) == 0 {
				g.b.WriteString(";")
			}
		}
		g.blank()
		g.b.WriteString("}\n")
		b.WriteString(g.b.String())
		if strict {
			kind = "strict " + kind
		}
		w.WriteString(kind + " " + id + "; nodes:")
		for _, n := range g.nodes {
			w.WriteString(" " + n)
		}
		w.WriteString("; edges:")
		for _, e := range g.edges {
			w.WriteString(" " + e)
		}
		w.WriteString("\n")
	}
	return b.String(), w.String()
}
