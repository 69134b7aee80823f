package frame

import (
	"fmt"
	"math/rand/v2"
	"slices"
	"testing"

	"github.com/gridwood/gridwood/place/geomcheck"
)

// drawing is a hand-made test drawing: clusters, node centres and half
// boxes (all 10 x 5 unless given).
type drawing struct {
	parent []int32
	home   []int32
	xy     [][2]int64
	hw, hh []int64
}

func (d drawing) input(margin int64, labels []Label) Input {
	n := len(d.xy)
	in := Input{Clusters: Clusters{Parent: d.parent, Home: d.home}, Margin: margin, Labels: labels}
	in.X, in.Y, in.HalfW, in.HalfH = make([]int64, n), make([]int64, n), make([]int64, n), make([]int64, n)
	for v, p := range d.xy {
		in.X[v], in.Y[v] = p[0], p[1]
		in.HalfW[v], in.HalfH[v] = 10, 5
		if d.hw != nil {
			in.HalfW[v], in.HalfH[v] = d.hw[v], d.hh[v]
		}
	}
	return in
}

// planeCheck sends a test drawing through the independent checker: the
// hand-made drawings here have no two node boxes overlapping.
func planeCheck(t *testing.T, in Input) {
	t.Helper()
	pts := make([]geomcheck.Point, len(in.X))
	for v := range pts {
		pts[v] = geomcheck.Point{X: in.X[v], Y: in.Y[v]}
	}
	if p, err := geomcheck.Check(pts, nil); err != nil || len(p) > 0 {
		t.Fatalf("geomcheck: %v %v", p, err)
	}
	if o, err := geomcheck.BoxOverlaps(pts, in.HalfW, in.HalfH); err != nil || len(o) > 0 {
		t.Fatalf("test drawing has overlapping boxes %v (%v)", o, err)
	}
}

func TestFrames(t *testing.T) {
	for _, tc := range []struct {
		name   string
		d      drawing
		margin int64
		labels []Label
		want   []Rect
	}{
		{"one cluster, no label",
			drawing{parent: []int32{-1}, home: []int32{0, 0, -1}, xy: [][2]int64{{0, 0}, {100, 40}, {300, 0}}},
			8, nil, []Rect{{-18, -13, 118, 53}}},
		// Child frame (margin 4 around a and b), then the parent's own
		// node c and the child frame, margin 4, label 30 high on top.
		{"nested, label on top",
			drawing{parent: []int32{-1, 0}, home: []int32{1, 1, 0}, xy: [][2]int64{{0, 0}, {40, 0}, {20, 50}}},
			4, []Label{{W: 20, H: 30}, {}},
			[]Rect{{-18, -13, 58, 89}, {-14, -9, 54, 9}}},
		// Labels wider than the content: 100 + 2*4 = 108 wide, the 80
		// points of widening split 40 and 40; 21 + 8 = 29 against 28,
		// the odd point to the right.
		{"wide label, bottom",
			drawing{parent: []int32{-1, -1}, home: []int32{0, 1}, xy: [][2]int64{{0, 0}, {200, 0}}},
			4, []Label{{W: 100, H: 12, Bottom: true}, {W: 21, H: 0}},
			[]Rect{{-54, -21, 54, 9}, {186, -9, 215, 9}}},
		{"odd widening",
			drawing{parent: []int32{-1}, home: []int32{0}, xy: [][2]int64{{0, 0}}},
			1, []Label{{W: 23, H: 2}}, []Rect{{-12, -6, 13, 8}}},
		// An empty cluster (no nodes, nor in its child) gets None, and
		// its parent is framed by its own node alone.
		{"empty",
			drawing{parent: []int32{-1, 0, 1}, home: []int32{0}, xy: [][2]int64{{0, 0}}},
			2, nil, []Rect{{-12, -7, 12, 7}, None, None}},
	} {
		t.Run(tc.name, func(t *testing.T) {
			in := tc.d.input(tc.margin, tc.labels)
			planeCheck(t, in)
			got, err := Frames(in)
			if err != nil {
				t.Fatal(err)
			}
			if !slices.Equal(got, tc.want) {
				t.Errorf("frames %v, want %v", got, tc.want)
			}
			// Frames from Frames pass Measure's own checks.
			if _, err := Measure(in.Clusters, in.Nodes, got); err != nil {
				t.Error(err)
			}
		})
	}
}

func TestFramesErrors(t *testing.T) {
	ok := drawing{parent: []int32{-1}, home: []int32{0}, xy: [][2]int64{{0, 0}}}
	for _, tc := range []struct {
		name string
		in   Input
	}{
		{"parent after child", drawing{parent: []int32{1, -1}, home: []int32{0}, xy: [][2]int64{{0, 0}}}.input(1, nil)},
		{"parent of itself", drawing{parent: []int32{0}, home: []int32{0}, xy: [][2]int64{{0, 0}}}.input(1, nil)},
		{"home out of range", drawing{parent: []int32{-1}, home: []int32{1}, xy: [][2]int64{{0, 0}}}.input(1, nil)},
		{"zero margin", ok.input(0, nil)},
		{"labels", ok.input(1, []Label{{}, {}})},
		{"negative label", ok.input(1, []Label{{W: -1}})},
		{"far out", drawing{parent: []int32{-1}, home: []int32{0}, xy: [][2]int64{{MaxCoord + 1, 0}}}.input(1, nil)},
	} {
		if _, err := Frames(tc.in); err == nil {
			t.Errorf("%s: no error", tc.name)
		}
	}
	in := ok.input(1, nil)
	in.HalfW = nil
	if _, err := Frames(in); err == nil {
		t.Error("missing half widths: no error")
	}
	// Measure wants frames holding their members and nesting.
	in = drawing{parent: []int32{-1, 0}, home: []int32{1, 0}, xy: [][2]int64{{0, 0}, {100, 0}}}.input(2, nil)
	for _, frames := range [][]Rect{
		{{-100, -100, 200, 100}},                              // one frame for two clusters
		{{-100, -100, 200, 100}, {50, -10, 70, 10}},           // a member outside its frame
		{{-100, -100, 50, 100}, {-20, -10, 80, 10}},           // a child outside its parent
		{None, {-20, -10, 20, 10}},                            // a parent without a frame
		{{-100, -100, MaxCoord + 1, 100}, {-20, -20, 20, 20}}, // far out
	} {
		if _, err := Measure(in.Clusters, in.Nodes, frames); err == nil {
			t.Errorf("frames %v: Measure gave no error", frames)
		}
		if _, err := Find(in.Clusters, in.Nodes, frames); err == nil {
			t.Errorf("frames %v: Find gave no error", frames)
		}
	}
	// A member of no size on its frame's edge lies in the frame but not
	// in its interior.
	in.HalfW[0], in.HalfH[0] = 0, 0
	frames := []Rect{{-100, -100, 200, 100}, {0, -5, 20, 5}}
	if _, err := Measure(in.Clusters, in.Nodes, frames); err == nil {
		t.Errorf("frames %v: Measure gave no error", frames)
	}
	frames[1].X0 = -1
	if _, err := Measure(in.Clusters, in.Nodes, frames); err != nil {
		t.Errorf("frames %v: %v", frames, err)
	}
}

// TestMeasureHandMade: three top clusters A, B, C and D inside A, node
// boxes 20 x 10, margin 10. D frames d0 and d1: 240..360 x -15..15. A
// frames a0, a1 and D: -20..420 x -25..25. Node x, in no cluster, sits
// in A's frame, left of D's; b (of B) sits in D's frame, and b2 far above
// stretches B's frame to 280..320 x -5..315, across A's and D's; C lies
// apart. By construction: intrusions (x, A), (b, A), (b, D); overlaps
// A-B and B-D.
func TestMeasureHandMade(t *testing.T) {
	const A, B, C, D = 0, 1, 2, 3
	d := drawing{
		parent: []int32{-1, -1, -1, A},
		//             a0 a1 x   b  b2 c  d0 d1
		home: []int32{A, A, -1, B, B, C, D, D},
		xy: [][2]int64{
			{0, 0}, {400, 0}, {150, 0}, // a0, a1, x
			{300, 10}, {300, 300}, // b, b2
			{1000, 1000},       // c
			{260, 0}, {340, 0}, // d0, d1
		},
	}
	in := d.input(10, nil)
	planeCheck(t, in)
	frames, err := Frames(in)
	if err != nil {
		t.Fatal(err)
	}
	for c, want := range map[int]Rect{A: {-20, -25, 420, 25}, B: {280, -5, 320, 315}, D: {240, -15, 360, 15}} {
		if frames[c] != want {
			t.Errorf("frame of %d: %v, want %v", c, frames[c], want)
		}
	}
	counts, err := Measure(in.Clusters, in.Nodes, frames)
	if err != nil {
		t.Fatal(err)
	}
	found, err := Find(in.Clusters, in.Nodes, frames)
	if err != nil {
		t.Fatal(err)
	}
	wantIn := []Intrusion{{2, A}, {3, A}, {3, D}}
	wantOv := []Overlap{{A, B}, {B, D}}
	if !slices.Equal(found.Intrusions, wantIn) || !slices.Equal(found.Overlaps, wantOv) {
		t.Errorf("found %v %v, want %v %v", found.Intrusions, found.Overlaps, wantIn, wantOv)
	}
	if counts.Intrusions != 3 || counts.Overlaps != 2 || !slices.Equal(counts.PerCluster, []int64{2, 0, 0, 1}) {
		t.Errorf("counts %+v", counts)
	}
}

// TestTouching: a box touching a frame from outside is no intrusion, and
// frames that only share an edge do not overlap; one point further in,
// they do. Cluster 0 holds a node at the origin (box -10..10 x -5..5;
// margin 1: frame -11..11 x -6..6).
func TestTouching(t *testing.T) {
	for _, tc := range []struct {
		x          int64
		freeNode   bool // the second node is in no cluster, else in cluster 1
		intrusions int64
		overlaps   int64
	}{
		{21, true, 0, 0}, // box from 11: touches the frame
		{20, true, 1, 0},
		{22, false, 0, 0}, // frame from 11: shares an edge
		{21, false, 0, 1},
	} {
		home := []int32{0, 1}
		if tc.freeNode {
			home[1] = -1
		}
		in := drawing{parent: []int32{-1, -1}, home: home, xy: [][2]int64{{0, 0}, {tc.x, 0}}}.input(1, nil)
		planeCheck(t, in)
		frames, err := Frames(in)
		if err != nil {
			t.Fatal(err)
		}
		c, err := Measure(in.Clusters, in.Nodes, frames)
		if err != nil {
			t.Fatal(err)
		}
		f, err := Find(in.Clusters, in.Nodes, frames)
		if err != nil {
			t.Fatal(err)
		}
		if c.Intrusions != tc.intrusions || c.Overlaps != tc.overlaps || int64(len(f.Intrusions)) != tc.intrusions || int64(len(f.Overlaps)) != tc.overlaps {
			t.Errorf("x %d: counts %+v, found %+v; want %d intrusions, %d overlaps", tc.x, c, f, tc.intrusions, tc.overlaps)
		}
	}
}

// brute lists intrusions and overlaps by trying every pair, with its own
// ancestor walks.
func brute(c Clusters, n Nodes, frames []Rect) Found {
	holds := func(a, b int32) bool {
		for ; b >= 0; b = c.Parent[b] {
			if a == b {
				return true
			}
		}
		return false
	}
	var f Found
	for ci, fr := range frames {
		if fr.X1 <= fr.X0 || fr.Y1 <= fr.Y0 {
			continue
		}
		for v := range c.Home {
			b := Rect{n.X[v] - n.HalfW[v], n.Y[v] - n.HalfH[v], n.X[v] + n.HalfW[v], n.Y[v] + n.HalfH[v]}
			in := b.X0 < fr.X1 && b.X1 > fr.X0 && b.Y0 < fr.Y1 && b.Y1 > fr.Y0
			if in && (c.Home[v] < 0 || !holds(int32(ci), c.Home[v])) {
				f.Intrusions = append(f.Intrusions, Intrusion{int32(v), int32(ci)})
			}
		}
		for cj := ci + 1; cj < len(frames); cj++ {
			g := frames[cj]
			if g.X1 <= g.X0 || g.Y1 <= g.Y0 || holds(int32(ci), int32(cj)) || holds(int32(cj), int32(ci)) {
				continue
			}
			if fr.X0 < g.X1 && g.X0 < fr.X1 && fr.Y0 < g.Y1 && g.Y0 < fr.Y1 {
				f.Overlaps = append(f.Overlaps, Overlap{int32(ci), int32(cj)})
			}
		}
	}
	return f
}

// TestAgainstBruteForce compares Measure and Find with every pair tried,
// on random forests, memberships, positions and box sizes, coordinates
// from a small range so that touching and sharing edges are common.
func TestAgainstBruteForce(t *testing.T) {
	rng := rand.New(rand.NewPCG(18, 1))
	for trial := range 600 {
		k := rng.IntN(9)
		nn := rng.IntN(25)
		d := drawing{parent: make([]int32, k), home: make([]int32, nn), xy: make([][2]int64, nn), hw: make([]int64, nn), hh: make([]int64, nn)}
		for c := range k {
			d.parent[c] = int32(rng.IntN(c+1)) - 1
		}
		span := int64(20 + rng.IntN(200))
		for v := range nn {
			d.home[v] = int32(rng.IntN(k+1)) - 1
			d.xy[v] = [2]int64{rng.Int64N(span), rng.Int64N(span)}
			d.hw[v], d.hh[v] = rng.Int64N(12), rng.Int64N(12)
		}
		var labels []Label
		if rng.IntN(2) == 0 {
			labels = make([]Label, k)
			for c := range labels {
				labels[c] = Label{W: rng.Int64N(60), H: rng.Int64N(15), Bottom: rng.IntN(3) == 0}
			}
		}
		in := d.input(1+rng.Int64N(6), labels)
		frames, err := Frames(in)
		if err != nil {
			t.Fatal(err)
		}
		want := brute(in.Clusters, in.Nodes, frames)
		got, err := Find(in.Clusters, in.Nodes, frames)
		if err != nil {
			t.Fatal(err)
		}
		if !slices.Equal(got.Intrusions, want.Intrusions) || !slices.Equal(got.Overlaps, want.Overlaps) {
			t.Fatalf("trial %d: Find %v %v, brute force %v %v", trial, got.Intrusions, got.Overlaps, want.Intrusions, want.Overlaps)
		}
		counts, err := Measure(in.Clusters, in.Nodes, frames)
		if err != nil {
			t.Fatal(err)
		}
		per := make([]int64, k)
		for _, i := range want.Intrusions {
			per[i.Cluster]++
		}
		if counts.Intrusions != int64(len(want.Intrusions)) || counts.Overlaps != int64(len(want.Overlaps)) || !slices.Equal(counts.PerCluster, per) {
			t.Fatalf("trial %d: Measure %+v, brute force %d intrusions %v, %d overlaps", trial, counts, len(want.Intrusions), per, len(want.Overlaps))
		}
		// Frames nest and hold their members.
		for c, p := range d.parent {
			if p >= 0 && !frames[c].Empty() && !inside(frames[c], frames[p]) {
				t.Fatalf("trial %d: frame %d %v not inside its parent's %v", trial, c, frames[c], frames[p])
			}
		}
	}
}

// TestLargeSweep: 20,000 nodes in 400 clusters laid out as a grid of
// blocks, every fifth block's nodes shifted into the next block; Find
// and Measure agree, and the intrusions are exactly the shifted nodes'.
func TestLargeSweep(t *testing.T) {
	const blocks, per = 400, 50 // 20 x 20 blocks of 5 x 10 nodes
	var d drawing
	d.parent = make([]int32, blocks)
	for b := range blocks {
		d.parent[b] = -1
	}
	shifted := 0
	for b := range blocks {
		bx, by := int64(b%20)*1000, int64(b/20)*1000
		for i := range per {
			x, y := bx+int64(i%5)*100, by+int64(i/5)*60
			d.home = append(d.home, int32(b))
			d.xy = append(d.xy, [2]int64{x, y})
		}
	}
	in := d.input(8, nil)
	frames, err := Frames(in)
	if err != nil {
		t.Fatal(err)
	}
	// Move one node of every fifth block (not in the last column) into
	// the middle of the block to its right, after the frames are made:
	// frames then no longer hold it, so take it out of its cluster.
	var want []Intrusion
	for b := 0; b < blocks; b += 5 {
		if b%20 == 19 {
			continue
		}
		v := b*per + 0
		in.X[v], in.Y[v] = int64(b%20+1)*1000+250, int64(b/20)*1000+30
		in.Home[v] = -1
		want = append(want, Intrusion{int32(v), int32(b + 1)})
		shifted++
	}
	got, err := Find(in.Clusters, in.Nodes, frames)
	if err != nil {
		t.Fatal(err)
	}
	c, err := Measure(in.Clusters, in.Nodes, frames)
	if err != nil {
		t.Fatal(err)
	}
	slices.SortFunc(want, func(a, b Intrusion) int { return int(a.Cluster - b.Cluster) })
	if !slices.Equal(got.Intrusions, want) || len(got.Overlaps) != 0 || c.Intrusions != int64(shifted) || c.Overlaps != 0 {
		t.Errorf("found %d intrusions (%v...), %d overlaps; counts %d, %d; want %d", len(got.Intrusions), got.Intrusions[:min(3, len(got.Intrusions))], len(got.Overlaps), c.Intrusions, c.Overlaps, shifted)
	}
}

func ExampleFrames() {
	// Two clusters side by side, the second inside the first's frame
	// for want of placement: node 2 (of cluster 1) lies in cluster 0's
	// frame.
	in := Input{
		Clusters: Clusters{Parent: []int32{-1, -1}, Home: []int32{0, 0, 1}},
		Nodes:    Nodes{X: []int64{0, 100, 50}, Y: []int64{0, 0, 0}, HalfW: []int64{20, 20, 20}, HalfH: []int64{10, 10, 10}},
		Margin:   8,
		Labels:   []Label{{W: 60, H: 14}, {}},
	}
	frames, _ := Frames(in)
	counts, _ := Measure(in.Clusters, in.Nodes, frames)
	fmt.Println(frames)
	fmt.Println(counts.Intrusions, counts.Overlaps)
	// Output:
	// [{-28 -18 128 32} {22 -18 78 18}]
	// 1 1
}
