package place

import (
	"slices"

	"gonum.org/v1/gonum/graph"
)

// GraphDrawing is a drawing of a gonum graph, keyed by node ID.
type GraphDrawing struct {
	// IDs lists the graph's node IDs in increasing order; X[i], Y[i] is the
	// grid point of node IDs[i].
	IDs  []int64
	X, Y []int64
	// Width and Height bound the drawing: all points lie in
	// [0, Width] x [0, Height].
	Width, Height int64
	// Removed lists the node pairs (lower ID first, sorted) left out to
	// keep the drawing planar; empty for a planar graph.
	Removed [][2]int64
}

// DrawGraph draws any gonum graph (directed or not, simple or multi) like
// Draw: direction and repeated edges are ignored, and a non-planar graph
// loses an inclusion-minimal set of node pairs first. The result does not
// depend on the graph's iteration order: nodes and neighbours are sorted by
// ID before anything else happens.
func DrawGraph(g graph.Graph, opt DrawOptions) (*GraphDrawing, error) {
	ids := graph.NodesOf(g.Nodes())
	idList := make([]int64, len(ids))
	for i, n := range ids {
		idList[i] = n.ID()
	}
	slices.Sort(idList)
	index := make(map[int64]int32, len(idList))
	for i, id := range idList {
		index[id] = int32(i)
	}
	var edges [][2]int32
	var nbrs []int64
	for i, id := range idList {
		nbrs = nbrs[:0]
		for _, n := range graph.NodesOf(g.From(id)) {
			nbrs = append(nbrs, n.ID())
		}
		slices.Sort(nbrs)
		for _, w := range nbrs {
			if j, ok := index[w]; ok {
				edges = append(edges, [2]int32{int32(i), j})
			}
		}
	}
	res, err := Draw(len(idList), edges, opt)
	if err != nil {
		return nil, err
	}
	out := &GraphDrawing{IDs: idList, X: res.X, Y: res.Y, Width: res.Width, Height: res.Height}
	seen := map[[2]int64]bool{}
	for _, i := range res.Removed {
		e := edges[i]
		a, b := idList[e[0]], idList[e[1]]
		p := [2]int64{min(a, b), max(a, b)}
		if !seen[p] {
			seen[p] = true
			out.Removed = append(out.Removed, p)
		}
	}
	slices.SortFunc(out.Removed, func(p, q [2]int64) int {
		if p[0] != q[0] {
			return int(p[0] - q[0])
		}
		return int(p[1] - q[1])
	})
	return out, nil
}
