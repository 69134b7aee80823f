package geomcheck

import (
	"bufio"
	"fmt"
	"os"
	"path/filepath"
	"strconv"
	"strings"
	"testing"
)

// readDrawing parses a hand-made case: "v X Y" adds a vertex, "e U V" an
// edge, "want KIND A B" an expected problem (KIND is Kind.String with
// spaces written as hyphens); '#' starts a comment line.
func readDrawing(path string) (pts []Point, edges [][2]int32, want []Problem, err error) {
	f, err := os.Open(path)
	if err != nil {
		return nil, nil, nil, err
	}
	defer f.Close()
	kinds := map[string]Kind{}
	for k := Crossing; k <= SharedPoint; k++ {
		kinds[strings.ReplaceAll(k.String(), " ", "-")] = k
	}
	sc := bufio.NewScanner(f)
	for line := 1; sc.Scan(); line++ {
		fields := strings.Fields(sc.Text())
		if len(fields) == 0 || strings.HasPrefix(fields[0], "#") {
			continue
		}
		bad := fmt.Errorf("%s:%d: cannot parse %q", path, line, sc.Text())
		ints := func(fs []string) ([]int64, bool) {
			var out []int64
			for _, s := range fs {
				v, err := strconv.ParseInt(s, 10, 64)
				if err != nil {
					return nil, false
				}
				out = append(out, v)
			}
			return out, true
		}
		switch fields[0] {
		case "v", "e":
			xs, ok := ints(fields[1:])
			if !ok || len(xs) != 2 {
				return nil, nil, nil, bad
			}
			if fields[0] == "v" {
				pts = append(pts, Point{xs[0], xs[1]})
			} else {
				edges = append(edges, [2]int32{int32(xs[0]), int32(xs[1])})
			}
		case "want":
			k, known := kinds[fields[1]]
			xs, ok := ints(fields[2:])
			if !known || !ok || len(xs) != 2 {
				return nil, nil, nil, bad
			}
			want = append(want, Problem{k, int(xs[0]), int(xs[1])})
		default:
			return nil, nil, nil, bad
		}
	}
	return pts, edges, want, sc.Err()
}

// TestHandMadeDrawings runs the cases under testdata/drawings, each with
// its answer worked out by hand in the file, through Check, First and the
// brute-force reference.
func TestHandMadeDrawings(t *testing.T) {
	files, err := filepath.Glob(filepath.Join("testdata", "drawings", "*.txt"))
	if err != nil {
		t.Fatal(err)
	}
	if len(files) < 15 {
		t.Fatalf("found only %d hand-made drawings", len(files))
	}
	for _, path := range files {
		t.Run(strings.TrimSuffix(filepath.Base(path), ".txt"), func(t *testing.T) {
			pts, edges, want, err := readDrawing(path)
			if err != nil {
				t.Fatal(err)
			}
			sortProblems(want)
			for name, check := range map[string]func([]Point, [][2]int32) ([]Problem, error){
				"Check":      Check,
				"checkBrute": checkBrute,
				"First(0)":   func(p []Point, e [][2]int32) ([]Problem, error) { return First(p, e, 0) },
			} {
				got, err := check(pts, edges)
				if err != nil {
					t.Fatalf("%s: %v", name, err)
				}
				sameProblems(t, name, got, want)
			}
			first, err := First(pts, edges, 1)
			if err != nil {
				t.Fatal(err)
			}
			if len(want) > 0 && (len(first) != 1 || !contains(want, first[0])) {
				t.Fatalf("First(1) = %v, want one of %v", first, want)
			}
			if len(want) == 0 && len(first) != 0 {
				t.Fatalf("First(1) = %v on a clean drawing", first)
			}
		})
	}
}

func contains(ps []Problem, p Problem) bool {
	for _, q := range ps {
		if q == p {
			return true
		}
	}
	return false
}

// convexCompleteGraph draws K_n with vertex i at (i, i^2). The points lie
// on a parabola, so they are in strictly convex position and no three are
// collinear.
func convexCompleteGraph(n int) ([]Point, [][2]int32) {
	pts := make([]Point, n)
	for i := range pts {
		pts[i] = Point{int64(i), int64(i * i)}
	}
	var edges [][2]int32
	for i := range n {
		for j := i + 1; j < n; j++ {
			edges = append(edges, [2]int32{int32(i), int32(j)})
		}
	}
	return pts, edges
}

func binomial(n, k int) int {
	r := 1
	for i := range k {
		r = r * (n - i) / (i + 1)
	}
	return r
}

// TestConvexCompleteGraphs checks K_n in convex position. Any 4 points in
// convex position span a convex quadrilateral whose two diagonals are the
// only crossing pair among its 6 chords, and two chords cross only if their
// 4 ends are distinct (common practice, combinatorial geometry), so the
// drawing has exactly C(n,4) crossings: 5 for K5 on a convex pentagon.
// With the vertices numbered along the polygon, chords ij and kl (i < j,
// k < l) cross exactly when their ends interleave: i < k < j < l or
// k < i < l < j.
func TestConvexCompleteGraphs(t *testing.T) {
	for n := 3; n <= 14; n++ {
		pts, edges := convexCompleteGraph(n)
		got, err := Check(pts, edges)
		if err != nil {
			t.Fatal(err)
		}
		if len(got) != binomial(n, 4) {
			t.Errorf("K%d on a convex polygon: %d problems, want C(%d,4) = %d", n, len(got), n, binomial(n, 4))
		}
		var want []Problem
		for e, ab := range edges {
			for f := e + 1; f < len(edges); f++ {
				i, j, k, l := ab[0], ab[1], edges[f][0], edges[f][1]
				if i < k && k < j && j < l || k < i && i < l && l < j {
					want = append(want, Problem{Crossing, e, f})
				}
			}
		}
		sortProblems(want)
		sameProblems(t, fmt.Sprintf("K%d crossings", n), got, want)
	}
	pts, edges := convexCompleteGraph(5)
	got, err := Check(pts, edges)
	if err != nil {
		t.Fatal(err)
	}
	if len(got) != 5 {
		t.Errorf("K5 on a convex pentagon: %d crossings, want 5", len(got))
	}
	// The same count on a convex pentagon far from the parabola, blown up
	// to the coordinate bound.
	const s = MaxCoord / 8
	pent := []Point{{-5 * s, -3 * s}, {5 * s, -4 * s}, {8 * s, 2 * s}, {0, 7 * s}, {-7 * s, 3 * s}}
	got, err = Check(pent, edges)
	if err != nil {
		t.Fatal(err)
	}
	if len(got) != 5 {
		t.Errorf("K5 on a large convex pentagon: %d problems %v, want 5 crossings", len(got), got)
	}
}

func TestKindString(t *testing.T) {
	for k, want := range map[Kind]string{
		Crossing: "crossing", Overlap: "overlap", VertexOnEdge: "vertex on edge",
		SharedPoint: "shared point", Kind(9): "Kind(9)",
	} {
		if got := k.String(); got != want {
			t.Errorf("Kind(%d).String() = %q, want %q", int(k), got, want)
		}
	}
}

// TestBound checks that coordinates exactly at ±MaxCoord are judged and one
// beyond is refused, and that bad edge ends are refused.
func TestBound(t *testing.T) {
	const M = MaxCoord
	ok := []Point{{-M, -M}, {M, M}, {-M, M}, {M, -M}}
	got, err := Check(ok, [][2]int32{{0, 1}, {2, 3}})
	if err != nil {
		t.Fatalf("coordinates at the bound refused: %v", err)
	}
	sameProblems(t, "diagonals at the bound", got, []Problem{{Crossing, 0, 1}})
	for _, p := range []Point{{M + 1, 0}, {0, M + 1}, {-M - 1, 0}, {0, -M - 1}, {1 << 62, 0}, {-1 << 63, 0}} {
		if _, err := Check([]Point{{0, 0}, p}, nil); err == nil {
			t.Errorf("Check accepted %v beyond the bound", p)
		}
		if _, err := First([]Point{p}, nil, 1); err == nil {
			t.Errorf("First accepted %v beyond the bound", p)
		}
	}
	for _, e := range [][2]int32{{0, 2}, {-1, 0}, {0, -5}, {7, 7}} {
		if _, err := Check([]Point{{0, 0}, {1, 1}}, [][2]int32{e}); err == nil {
			t.Errorf("Check accepted edge %v on 2 vertices", e)
		}
	}
	if got, err := Check(nil, nil); err != nil || len(got) != 0 {
		t.Errorf("empty drawing: %v, %v", got, err)
	}
}

// TestFirstLimit checks First's contract on a drawing with many problems:
// it returns exactly min(limit, all) problems, all of them Check's.
func TestFirstLimit(t *testing.T) {
	pts, edges := convexCompleteGraph(9) // C(9,4) = 126 crossings
	all, err := Check(pts, edges)
	if err != nil {
		t.Fatal(err)
	}
	for _, limit := range []int{-1, 0, 1, 7, 125, 126, 127, 1000} {
		got, err := First(pts, edges, limit)
		if err != nil {
			t.Fatal(err)
		}
		wantLen := min(limit, len(all))
		if limit <= 0 {
			wantLen = len(all)
		}
		if len(got) != wantLen {
			t.Errorf("First(%d): %d problems, want %d", limit, len(got), wantLen)
		}
		for _, p := range got {
			if !contains(all, p) {
				t.Errorf("First(%d) returned %v, not found by Check", limit, p)
			}
		}
	}
}
