package stress

import (
	"math"
	"math/rand/v2"
	"testing"

	"gonum.org/v1/gonum/graph/path"
	"gonum.org/v1/gonum/graph/simple"
)

// randomConnected is a random connected graph: a random tree on n vertices
// plus extra random pairs, with lengths in [1, 4).
func randomConnected(n, extra int, seed uint64) ([][2]int32, []float64) {
	rng := rand.New(rand.NewPCG(seed, 7))
	seen := map[[2]int32]bool{}
	var edges [][2]int32
	add := func(a, b int32) {
		if a == b || seen[[2]int32{min(a, b), max(a, b)}] {
			return
		}
		seen[[2]int32{min(a, b), max(a, b)}] = true
		edges = append(edges, [2]int32{a, b})
	}
	for v := 1; v < n; v++ {
		add(int32(rng.IntN(v)), int32(v))
	}
	for range extra {
		add(int32(rng.IntN(n)), int32(rng.IntN(n)))
	}
	lengths := make([]float64, len(edges))
	for i := range lengths {
		lengths[i] = 1 + 3*rng.Float64()
	}
	return edges, lengths
}

// TestDistancesMatchGonum checks the model's shortest-path distances, in
// the full model and from the sparse model's pivots, against gonum's
// Dijkstra (gonum.org/v1/gonum/graph/path, a general-purpose library).
func TestDistancesMatchGonum(t *testing.T) {
	for seed := uint64(1); seed <= 4; seed++ {
		n := 60 + int(seed)*20
		edges, lengths := randomConnected(n, n/2, seed)
		g := simple.NewWeightedUndirectedGraph(0, math.Inf(1))
		for v := range n {
			g.AddNode(simple.Node(v))
		}
		for i, e := range edges {
			g.SetWeightedEdge(g.NewWeightedEdge(simple.Node(e[0]), simple.Node(e[1]), lengths[i]))
		}
		all := path.DijkstraAllPaths(g)
		for _, opt := range []Options{{FullLimit: n}, {FullLimit: 10, Pivots: 12}} {
			m, err := NewModel(n, edges, lengths, opt)
			if err != nil {
				t.Fatal(err)
			}
			checked := 0
			for u := range int32(n) {
				for v := range int32(n) {
					d, ok := m.Distance(u, v)
					if !ok {
						continue
					}
					want := all.Weight(int64(u), int64(v))
					if math.Abs(d-want) > 1e-5*max(1, want) {
						t.Fatalf("seed %d full %v: d(%d,%d) = %g, gonum %g", seed, m.Full(), u, v, d, want)
					}
					checked++
				}
			}
			if checked < n {
				t.Errorf("seed %d full %v: only %d distances kept", seed, m.Full(), checked)
			}
		}
	}
}

// TestGroupsScaleDistances checks Options.Groups: pairs in one group at
// GroupPull times their distance, pairs split by a group at GroupPush
// times, pairs in no group and edges unchanged.
func TestGroupsScaleDistances(t *testing.T) {
	// A path 0-1-2-3-4-5 of unit edges; {0,1,2} in group 7, {3} in 8.
	edges := [][2]int32{{0, 1}, {1, 2}, {2, 3}, {3, 4}, {4, 5}}
	groups := [][]int32{{7}, {7}, {7}, {8}, nil, nil}
	m, err := NewModel(6, edges, nil, Options{FullLimit: 6, Groups: groups})
	if err != nil {
		t.Fatal(err)
	}
	for _, tc := range []struct {
		u, v int32
		want float64
	}{
		{0, 1, 1},             // an edge
		{0, 2, 2 * GroupPull}, // one group
		{0, 3, 3 * GroupPush}, // different groups
		{2, 4, 2 * GroupPush}, // a group and none
		{4, 5, 1},             // an edge, no group
		{3, 5, 2 * GroupPush},
	} {
		d, _ := m.Distance(tc.u, tc.v)
		if math.Abs(d-tc.want) > 1e-6 {
			t.Errorf("d(%d,%d) = %g, want %g", tc.u, tc.v, d, tc.want)
		}
	}
	if _, err := NewModel(6, edges, nil, Options{Groups: groups[:3]}); err == nil {
		t.Error("groups of the wrong length accepted")
	}
}

// TestLayoutOfPathIsStraight checks that stress majorization lays a path
// of unit edges out on a line with unit spacing (its stress-0 drawing,
// common practice): the end-to-end distance is n-1 after the layout.
func TestLayoutOfPathIsStraight(t *testing.T) {
	const n = 12
	var edges [][2]int32
	for v := int32(1); v < n; v++ {
		edges = append(edges, [2]int32{v - 1, v})
	}
	m, err := NewModel(n, edges, nil, Options{FullLimit: n})
	if err != nil {
		t.Fatal(err)
	}
	x, y := m.Start()
	m.Layout(x, y, 2000, 1e-9)
	if got := math.Hypot(x[n-1]-x[0], y[n-1]-y[0]); math.Abs(got-(n-1)) > 0.01 {
		t.Errorf("end to end %g, want %d", got, n-1)
	}
	if s := m.Stress(x, y); s > 1e-4 {
		t.Errorf("stress %g, want about 0", s)
	}
}

// TestProjectKeepsFlowOrder checks Project on a path 0 -> 1 -> 2 flowing
// down (FlowDir 0, -1) with gap 1: vertex 1's target is moved to lie at
// least 1 below vertex 0 and 1 above vertex 2, only along the flow, and
// halfway between when the two bounds cross.
func TestProjectKeepsFlowOrder(t *testing.T) {
	edges := [][2]int32{{0, 1}, {1, 2}}
	m, err := NewModel(3, edges, nil, Options{FullLimit: 3, Flow: edges, FlowDir: [2]float64{0, -1}, FlowGap: 1})
	if err != nil {
		t.Fatal(err)
	}
	for _, tc := range []struct {
		y              []float64
		ty, wantY      float64
		wantX, targetX float64
	}{
		{[]float64{10, 0, 0}, 12, 9, 3, 3},  // above vertex 0: pushed down to 9
		{[]float64{10, 0, 5}, 2, 6, 3, 3},   // below vertex 2: pushed up to 6
		{[]float64{10, 0, 5}, 7, 7, 3, 3},   // between: unchanged
		{[]float64{10, 0, 10}, 0, 10, 3, 3}, // bounds cross (9 and 11): halfway
		{[]float64{10, 0, -10}, 0, 0, 3, 3}, // inside a wide range: unchanged
	} {
		x := []float64{0, 0, 0}
		gx, gy := m.Project(1, tc.targetX, tc.ty, x, tc.y)
		if math.Abs(gy-tc.wantY) > 1e-12 || gx != tc.wantX {
			t.Errorf("y %v, target y %g: projected to (%g, %g), want (%g, %g)", tc.y, tc.ty, gx, gy, tc.wantX, tc.wantY)
		}
	}
	if _, err := NewModel(3, edges, nil, Options{Flow: [][2]int32{{0, 3}}}); err == nil {
		t.Error("a flow pair out of range was accepted")
	}
}
