package spacing

import "math"

// A component's spacing may visit at most spacePerEdge cells per edge
// (plus spaceFloor, at most spaceWork) for each of its two candidate
// drawings, refinement and clearance checks together: the spacing stays
// linear in the size of the graph, and crowded drawings whose long edges
// would need more are checked or refined less.
const (
	spacePerEdge = 512
	spaceFloor   = 2_000_000
	spaceWork    = 20_000_000
)

// Meter counts down the cell visits a component's spacing may make.
type Meter struct{ left int }

// NewMeter is the work one candidate drawing of a component with that many
// edges may take: spacePerEdge cell visits per edge plus spaceFloor, at
// most spaceWork.
func NewMeter(edges int) *Meter {
	return &Meter{left: min(spaceWork, spaceFloor+spacePerEdge*edges)}
}

// spend takes k visits off the meter and reports whether it has not run
// out.
func (m *Meter) spend(k int) bool {
	m.left -= k
	return m.left >= 0
}

// bucketGrid files vertices by square cells: in a dense array of cells
// over the vertices' bounding box when that is not much bigger than the
// number of vertices (the usual case for spread-out drawings), else in a
// map.
type bucketGrid struct {
	cell       int64
	x0, y0     int64 // cell coordinates of the dense array's corner
	cols, rows int64
	start      []int32 // dense: cell -> first entry in items
	items      []int32
	cells      map[uint64][]int32
}

func newBucketGrid(vs []int32, x, y []int64, cell int64) *bucketGrid {
	g := &bucketGrid{cell: cell}
	if len(vs) == 0 {
		g.cells = map[uint64][]int32{}
		return g
	}
	minX, minY := int64(math.MaxInt64), int64(math.MaxInt64)
	maxX, maxY := int64(math.MinInt64), int64(math.MinInt64)
	for _, v := range vs {
		cx, cy := g.cellOf(x[v], y[v])
		minX, minY, maxX, maxY = min(minX, cx), min(minY, cy), max(maxX, cx), max(maxY, cy)
	}
	cols, rows := maxX-minX+1, maxY-minY+1
	if cols > 0 && rows > 0 && cols <= 1<<30/rows && cols*rows <= 64*int64(len(vs))+1024 {
		g.x0, g.y0, g.cols, g.rows = minX, minY, cols, rows
		g.start = make([]int32, cols*rows+1)
		for _, v := range vs {
			cx, cy := g.cellOf(x[v], y[v])
			g.start[(cy-minY)*cols+(cx-minX)+1]++
		}
		for i := 1; i < len(g.start); i++ {
			g.start[i] += g.start[i-1]
		}
		g.items = make([]int32, len(vs))
		fill := append([]int32(nil), g.start[:len(g.start)-1]...)
		for _, v := range vs {
			cx, cy := g.cellOf(x[v], y[v])
			k := (cy-minY)*cols + (cx - minX)
			g.items[fill[k]] = v
			fill[k]++
		}
		return g
	}
	g.cells = make(map[uint64][]int32, len(vs))
	for _, v := range vs {
		cx, cy := g.cellOf(x[v], y[v])
		k := cellKey(cx, cy)
		g.cells[k] = append(g.cells[k], v)
	}
	return g
}

func cellKey(cx, cy int64) uint64 { return uint64(cx)<<32 ^ uint64(cy)&0xffffffff }

func (g *bucketGrid) cellOf(x, y int64) (int64, int64) {
	return floorDiv(x, g.cell), floorDiv(y, g.cell)
}

func (g *bucketGrid) at(cx, cy int64) []int32 {
	if g.cells != nil {
		return g.cells[cellKey(cx, cy)]
	}
	cx, cy = cx-g.x0, cy-g.y0
	if cx < 0 || cy < 0 || cx >= g.cols || cy >= g.rows {
		return nil
	}
	k := cy*g.cols + cx
	return g.items[g.start[k]:g.start[k+1]]
}

func floorDiv(a, b int64) int64 {
	q := a / b
	if a%b != 0 && (a < 0) != (b < 0) {
		q--
	}
	return q
}
