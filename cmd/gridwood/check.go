package main

import (
	"bufio"
	"cmp"
	"fmt"
	"io"
	"math/big"
	"regexp"
	"slices"
	"strconv"
	"strings"

	"github.com/gridwood/gridwood/dotio"
	"github.com/gridwood/gridwood/dotio/nodesize"
	"github.com/gridwood/gridwood/place/frame"
	"github.com/gridwood/gridwood/place/geomcheck"
	"github.com/gridwood/gridwood/planarize"
)

// checkKind orders the problems of a graph; input problems come first,
// since a graph that has any is not judged geometrically.
type checkKind int

const (
	checkNoPos        checkKind = iota // some node has no pos
	checkBadPos                        // a pos that is not "X,Y" or "X,Y!"
	checkBadSize                       // a width or height that is not a size
	checkRange                         // too many decimals, or too far out for exact arithmetic
	checkCrossing                      // two edges cross
	checkOverlap                       // two edges lie on one line and share a piece
	checkOnEdge                        // a node lies inside an edge it does not end at
	checkSamePoint                     // two nodes at one point
	checkBoxOverlap                    // two node boxes overlap with positive area
	checkThroughBox                    // an edge passes through the box of a node it does not end at
	checkIntrusion                     // a node lies in the frame of a cluster it is not in
	checkFrameOverlap                  // the frames of two clusters, neither inside the other, overlap
)

// checkProblem is one line of checkFile's report.
type checkProblem struct {
	kind      checkKind
	line, col int // where it is reported
	// line2 and col2 locate the second thing involved, for a stable order
	// among problems reported at the same place.
	line2, col2 int
	msg         string
}

// maxPosDecimals bounds the decimals of a pos coordinate: coordinates are
// scaled by 10^d to integers, and 10^6 times a drawing in points still
// leaves room for a million inches within geomcheck.MaxCoord.
const maxPosDecimals = 6

// checkFile reports the problems of every graph of f whose nodes have pos
// attributes, one per line on w, and returns how many it found. A graph
// where some node lacks pos is itself a problem (reported, counted).
//
// Each line is "FILE:LINE:COL: message", at the edge operator of an edge
// (the earlier one for a pair of edges) or the first mention of a node
// (the earlier one for a pair of nodes). Graphs are reported in order,
// the problems of each sorted by kind, then position:
//
//   - input problems: nodes without pos (one line per graph, at the first
//     such node), malformed pos, width or height values, coordinates with
//     more than 6 decimals or too large to judge exactly; a graph with any
//     of these is not checked further;
//   - edges that cross, and edges that lie on one line and share more than
//     a point;
//   - nodes lying inside an edge they do not end at;
//   - pairs of nodes at one point;
//   - pairs of node boxes overlapping with positive area (a pair already
//     reported at one point is not reported again);
//   - edges passing through the box of a node they do not end at (a node
//     already reported lying on that edge is not reported again);
//   - nodes lying in the frame of a cluster they do not belong to, at the
//     node's first mention, and overlapping frames of two clusters
//     neither of which holds the other, at the earlier cluster; frames are
//     computed from the nodes' positions and boxes by the rule the layout
//     writes them by (README, "What the output contains"), not read from
//     the input's own cluster bb, which may be stale.
//
// Edges are straight segments between node centres: edge pos (spline
// points) and ports are ignored, the graph is taken as undirected, loops
// are ignored and repeated edges count once. Boxes are the node boxes the
// layout itself keeps clear (README, Node boxes; package nodesize): the width
// x height of each node (DOT's 0.75 x 0.5 inches when unset), grown to fit
// its label unless fixedsize is set, round shapes as wide as tall, centred
// on its pos; so a drawing gridwood made passes unless its report counts
// it crowded or unchecked.
//
// The judgement is exact (package geomcheck): the coordinates of a graph
// are scaled by 10^d, d the largest number of decimals any of its pos
// values uses (trailing zeros not counted), which makes them integers.
// Box half-sizes are rounded to the nearest integer in that unit, halves
// away from zero. The returned error is a failure to write to w.
func checkFile(w io.Writer, f *dotio.File) (int, error) {
	bw := bufio.NewWriter(w)
	total := 0
	for gi, g := range f.Graphs {
		probs := checkGraph(g, gi)
		for _, p := range probs {
			fmt.Fprintf(bw, "%s\n", positioned(f.Name, p.line, p.col, "%s", p.msg))
		}
		total += len(probs)
	}
	return total, bw.Flush()
}

// checkGraph returns the problems of one graph, sorted.
func checkGraph(g *dotio.Graph, index int) []checkProblem {
	probs := graphProblems(g, index)
	sortCheckProblems(probs)
	return probs
}

// graphProblems returns the problems of one graph in no particular order.
func graphProblems(g *dotio.Graph, index int) []checkProblem {
	var probs []checkProblem
	if len(g.Nodes) == 0 {
		return nil
	}
	add := func(kind checkKind, line, col, line2, col2 int, format string, args ...any) {
		probs = append(probs, checkProblem{kind, line, col, line2, col2, fmt.Sprintf(format, args...)})
	}

	// Positions as exact decimals, then the common scale.
	type decimal struct {
		x, y   posCoord
		parsed bool
	}
	coords := make([]decimal, len(g.Nodes))
	missing, firstMissing := 0, -1
	scale := 0
	for v, n := range g.Nodes {
		if strings.TrimSpace(n.Attrs.Pos) == "" {
			if missing == 0 {
				firstMissing = v
			}
			missing++
			continue
		}
		x, y, err := parsePos(n.Attrs.Pos)
		if err != "" {
			add(checkBadPos, n.Line, n.Col, 0, 0, "node %s: pos %s %s", strconv.Quote(n.Name), strconv.Quote(n.Attrs.Pos), err)
			continue
		}
		if d := max(x.decimals, y.decimals); d > maxPosDecimals {
			add(checkRange, n.Line, n.Col, 0, 0, "node %s: pos %s has %d decimals; at most %d can be checked exactly", strconv.Quote(n.Name), strconv.Quote(n.Attrs.Pos), d, maxPosDecimals)
			continue
		}
		scale = max(scale, x.decimals, y.decimals)
		coords[v] = decimal{x, y, true}
	}
	if missing > 0 {
		n := g.Nodes[firstMissing]
		more := ""
		if missing > 1 {
			more = fmt.Sprintf(" (nor have %d more of its %d nodes)", missing-1, len(g.Nodes))
		}
		add(checkNoPos, n.Line, n.Col, 0, 0, "%s: node %s has no pos%s", g.Describe(index), strconv.Quote(n.Name), more)
	}
	pts := make([]geomcheck.Point, len(g.Nodes))
	hw := make([]int64, len(g.Nodes))
	hh := make([]int64, len(g.Nodes))
	grown := nodeBoxes(g) // half sizes in whole points, labels included
	sizer := nodesize.New(g)
	unit := int64(1)
	for range scale {
		unit *= 10
	}
	limit := fmt.Sprintf("|x|, |y| <= %s", scaledLimit(scale))
	for v, n := range g.Nodes {
		if c := coords[v]; c.parsed {
			x, okx := c.x.scaled(scale)
			y, oky := c.y.scaled(scale)
			if !okx || !oky {
				add(checkRange, n.Line, n.Col, 0, 0, "node %s: pos %s is too far out to be checked exactly (want %s)", strconv.Quote(n.Name), strconv.Quote(n.Attrs.Pos), limit)
			}
			pts[v] = geomcheck.Point{X: x, Y: y}
		}
		for _, s := range [2]struct {
			attr, name string
		}{{n.Attrs.Width, "width"}, {n.Attrs.Height, "height"}} {
			if val := strings.TrimSpace(s.attr); val != "" {
				if _, err := halfSize(val, scale); err != "" {
					add(checkBadSize, n.Line, n.Col, 0, 0, "node %s: %s %s %s", strconv.Quote(n.Name), s.name, strconv.Quote(s.attr), err)
				}
			}
		}
		// The box the layout keeps clear (package nodesize): a side that
		// is a width or height as written is taken exactly, one grown to
		// fit a label (or derived by a shape's rule) in the whole points
		// the layout rounds it up to, which the exact check needs in the
		// scaled unit; a box is at most maxBoxSide, so at 10^6 to the
		// point it stays far inside geomcheck.MaxCoord.
		sz := sizer.Node(v)
		hw[v], hh[v] = grown.HalfW[v]*unit, grown.HalfH[v]*unit
		if sz.ExactW != "" {
			if h, err := halfSize(sz.ExactW, scale); err == "" {
				hw[v] = h
			}
		}
		if sz.ExactH != "" {
			if h, err := halfSize(sz.ExactH, scale); err == "" {
				hh[v] = h
			}
		}
	}
	if len(probs) > 0 {
		return probs
	}

	// Edges: undirected, loops dropped, each pair once, named by the
	// first copy.
	raw := make([][2]int32, len(g.Edges))
	for i, e := range g.Edges {
		raw[i] = [2]int32{e.From, e.To}
	}
	simple, index2 := planarize.Simplify(len(g.Nodes), raw)
	first := make([]int, len(simple))
	for i := range first {
		first[i] = -1
	}
	for i, s := range index2 {
		if s >= 0 && first[s] < 0 {
			first[s] = i
		}
	}
	op := " -- "
	if g.Directed {
		op = " -> "
	}
	edgeName := func(s int) string {
		e := g.Edges[first[s]]
		return strconv.Quote(g.Nodes[e.From].Name) + op + strconv.Quote(g.Nodes[e.To].Name)
	}
	edgePos := func(s int) (int, int) { return g.EdgePos(first[s]) }
	nodeName := func(v int) string { return strconv.Quote(g.Nodes[v].Name) }
	// earlier orders two things by file position.
	earlier := func(l1, c1, l2, c2 int) bool { return l1 < l2 || l1 == l2 && c1 <= c2 }

	geo, err := geomcheck.Check(pts, simple)
	if err != nil {
		// Unreachable: every coordinate and index was validated above.
		add(checkRange, g.Line, g.Col, 0, 0, "%s: %v", g.Describe(index), err)
		return probs
	}
	samePoint := map[[2]int]bool{}
	onEdge := map[[2]int]bool{} // node, pair
	for _, p := range geo {
		switch p.Kind {
		case geomcheck.Crossing, geomcheck.Overlap:
			a, b := p.A, p.B
			la, ca := edgePos(a)
			lb, cb := edgePos(b)
			if !earlier(la, ca, lb, cb) {
				a, b, la, ca, lb, cb = b, a, lb, cb, la, ca
			}
			if p.Kind == geomcheck.Crossing {
				add(checkCrossing, la, ca, lb, cb, "edges %s and %s cross", edgeName(a), edgeName(b))
			} else {
				add(checkOverlap, la, ca, lb, cb, "edges %s and %s overlap", edgeName(a), edgeName(b))
			}
		case geomcheck.VertexOnEdge:
			n := g.Nodes[p.A]
			l2, c2 := edgePos(p.B)
			onEdge[[2]int{p.A, p.B}] = true
			add(checkOnEdge, n.Line, n.Col, l2, c2, "node %s lies on edge %s", nodeName(p.A), edgeName(p.B))
		case geomcheck.SharedPoint:
			a, b := g.Nodes[p.A], g.Nodes[p.B]
			samePoint[[2]int{p.A, p.B}] = true
			add(checkSamePoint, a.Line, a.Col, b.Line, b.Col, "nodes %s and %s are at the same point (%s)", nodeName(p.A), nodeName(p.B), strings.TrimSuffix(strings.TrimSpace(a.Attrs.Pos), "!"))
		}
	}
	boxes, err := geomcheck.BoxOverlaps(pts, hw, hh)
	if err != nil {
		// Unreachable: every half-size was validated above.
		add(checkRange, g.Line, g.Col, 0, 0, "%s: %v", g.Describe(index), err)
		return probs
	}
	for _, pr := range boxes {
		if samePoint[pr] {
			continue
		}
		a, b := g.Nodes[pr[0]], g.Nodes[pr[1]]
		add(checkBoxOverlap, a.Line, a.Col, b.Line, b.Col, "boxes of nodes %s and %s overlap", nodeName(pr[0]), nodeName(pr[1]))
	}
	through, err := geomcheck.EdgeThroughBox(pts, hw, hh, simple)
	if err != nil {
		add(checkRange, g.Line, g.Col, 0, 0, "%s: %v", g.Describe(index), err) // unreachable, as above
		return probs
	}
	for _, pr := range through {
		e := simple[pr[1]]
		if onEdge[pr] || samePoint[ordered(pr[0], int(e[0]))] || samePoint[ordered(pr[0], int(e[1]))] {
			continue // reported already: on the edge, or at one of its ends
		}
		l, c := edgePos(pr[1])
		n := g.Nodes[pr[0]]
		add(checkThroughBox, l, c, n.Line, n.Col, "edge %s passes through the box of node %s", edgeName(pr[1]), nodeName(pr[0]))
	}
	set := g.Clusters()
	if len(set.Clusters) == 0 {
		return probs
	}
	xs, ys := make([]int64, len(pts)), make([]int64, len(pts))
	for v, p := range pts {
		xs[v], ys[v] = p.X, p.Y
	}
	ci, err := clusterFrames(set, xs, ys, hw, hh, unit)
	var found frame.Found
	if err == nil {
		found, err = frame.Find(ci.tree, ci.nodes, ci.frames)
	}
	if err != nil {
		add(checkRange, g.Line, g.Col, 0, 0, "%s: %v", g.Describe(index), err) // unreachable: coordinates were validated above
		return probs
	}
	clusterName := func(c int32) string { return strconv.Quote(set.Clusters[c].Name) }
	for _, in := range found.Intrusions {
		n, cl := g.Nodes[in.Node], set.Clusters[in.Cluster]
		add(checkIntrusion, n.Line, n.Col, cl.Line, cl.Col, "node %s lies in the frame of cluster %s, which it does not belong to", nodeName(int(in.Node)), clusterName(in.Cluster))
	}
	for _, o := range found.Overlaps {
		a, b := set.Clusters[o.A], set.Clusters[o.B]
		add(checkFrameOverlap, a.Line, a.Col, b.Line, b.Col, "frames of clusters %s and %s overlap", clusterName(o.A), clusterName(o.B))
	}
	return probs
}

// ordered is the pair a, b, smaller first.
func ordered(a, b int) [2]int { return [2]int{min(a, b), max(a, b)} }

func sortCheckProblems(ps []checkProblem) {
	slices.SortStableFunc(ps, func(p, q checkProblem) int {
		return cmp.Or(
			cmp.Compare(p.kind, q.kind),
			cmp.Compare(p.line, q.line), cmp.Compare(p.col, q.col),
			cmp.Compare(p.line2, q.line2), cmp.Compare(p.col2, q.col2),
			strings.Compare(p.msg, q.msg))
	})
}

// posCoord is a decimal coordinate: whole + frac / 10^decimals, negated if neg.
type posCoord struct {
	neg       bool
	whole     string // digits, leading zeros removed
	frac      string // digits, trailing zeros removed
	decimals  int
	malformed bool
}

// posNumber is one coordinate: optional sign, digits, optional fraction;
// no exponent.
var posNumber = regexp.MustCompile(`^([+-]?)([0-9]*)(?:\.([0-9]*))?$`)

// parsePos parses "X,Y" or "X,Y!" with decimal numbers; err describes a
// malformed value.
func parsePos(s string) (x, y posCoord, err string) {
	const want = `is not "X,Y" or "X,Y!" with decimal numbers`
	s = strings.TrimSpace(s)
	s = strings.TrimSpace(strings.TrimSuffix(s, "!"))
	xs, ys, ok := strings.Cut(s, ",")
	if !ok {
		return x, y, want
	}
	x, y = parseCoord(strings.TrimSpace(xs)), parseCoord(strings.TrimSpace(ys))
	if x.malformed || y.malformed {
		return x, y, want
	}
	return x, y, ""
}

func parseCoord(s string) posCoord {
	m := posNumber.FindStringSubmatch(s)
	if m == nil || m[2] == "" && m[3] == "" {
		return posCoord{malformed: true}
	}
	c := posCoord{neg: m[1] == "-", whole: strings.TrimLeft(m[2], "0"), frac: strings.TrimRight(m[3], "0")}
	c.decimals = len(c.frac)
	return c
}

// scaled returns c * 10^d as an integer, d >= c.decimals, and whether it
// lies within geomcheck.MaxCoord.
func (c posCoord) scaled(d int) (int64, bool) {
	digits := c.whole + c.frac + strings.Repeat("0", d-c.decimals)
	digits = strings.TrimLeft(digits, "0")
	if len(digits) > 15 { // beyond 10^15 > MaxCoord; keeps ParseInt in range
		return 0, false
	}
	v := int64(0)
	if digits != "" {
		var err error
		if v, err = strconv.ParseInt(digits, 10, 64); err != nil {
			return 0, false
		}
	}
	if v > geomcheck.MaxCoord {
		return 0, false
	}
	if c.neg {
		v = -v
	}
	return v, true
}

// scaledLimit is MaxCoord / 10^d as a decimal, for messages.
func scaledLimit(d int) string {
	r := new(big.Rat).SetFrac(big.NewInt(geomcheck.MaxCoord), new(big.Int).Exp(big.NewInt(10), big.NewInt(int64(d)), nil))
	return r.FloatString(d)
}

// sizeNumber is a width or height in inches: a non-negative decimal with
// an optional short exponent (a long one could ask for huge numbers).
var sizeNumber = regexp.MustCompile(`^\+?([0-9]+\.?[0-9]*|\.[0-9]+)([eE][+-]?[0-9]{1,2})?$`)

// halfSize returns half of a size in inches as an integer in units of
// 10^-scale points, rounded to the nearest (halves away from zero), from
// the exact decimal value; err describes an unusable value.
func halfSize(s string, scale int) (int64, string) {
	if !sizeNumber.MatchString(s) {
		return 0, "is not a non-negative number of inches"
	}
	r, ok := new(big.Rat).SetString(s)
	if !ok {
		return 0, "is not a non-negative number of inches"
	}
	// half = inches * 72 / 2 * 10^scale
	r.Mul(r, new(big.Rat).SetInt(new(big.Int).Mul(big.NewInt(36), new(big.Int).Exp(big.NewInt(10), big.NewInt(int64(scale)), nil))))
	// round(n/d) = floor((2n + d) / 2d) for n, d >= 0.
	n, d := r.Num(), r.Denom()
	q := new(big.Int).Add(new(big.Int).Lsh(n, 1), d)
	q.Quo(q, new(big.Int).Lsh(d, 1))
	if !q.IsInt64() || q.Int64() > geomcheck.MaxCoord {
		return 0, "is too large to be checked exactly"
	}
	return q.Int64(), ""
}
