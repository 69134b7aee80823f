package planarize

import (
	"fmt"
	"math/rand/v2"
	"slices"
	"testing"
)

// simplifyReference is the obvious map-based version of Simplify's
// documented contract: loops map to -1, and each unordered pair is kept,
// as first written, at its first occurrence.
func simplifyReference(raw [][2]int32) (simple [][2]int32, index []int32) {
	at := map[[2]int32]int32{}
	index = make([]int32, len(raw))
	for i, e := range raw {
		if e[0] == e[1] {
			index[i] = -1
			continue
		}
		key := [2]int32{min(e[0], e[1]), max(e[0], e[1])}
		j, ok := at[key]
		if !ok {
			j = int32(len(simple))
			at[key] = j
			simple = append(simple, e)
		}
		index[i] = j
	}
	return simple, index
}

func TestSimplify(t *testing.T) {
	tests := []struct {
		name      string
		n         int
		raw, want [][2]int32
		wantIndex []int32
	}{
		{"empty", 0, nil, nil, []int32{}},
		{"isolated", 5, nil, nil, []int32{}},
		{"loops only", 3, [][2]int32{{0, 0}, {2, 2}, {0, 0}}, nil, []int32{-1, -1, -1}},
		{"both orientations", 3, [][2]int32{{2, 1}, {0, 1}, {1, 2}, {1, 0}, {2, 1}}, [][2]int32{{2, 1}, {0, 1}}, []int32{0, 1, 0, 1, 0}},
		{"loop between", 2, [][2]int32{{0, 1}, {1, 1}, {1, 0}}, [][2]int32{{0, 1}}, []int32{0, -1, 0}},
		{"already simple", 4, [][2]int32{{3, 0}, {0, 1}, {2, 1}}, [][2]int32{{3, 0}, {0, 1}, {2, 1}}, []int32{0, 1, 2}},
		// Sorted by smaller end, as Draw passes it: no bucketing needed.
		{"sorted with repeats", 4, [][2]int32{{0, 1}, {1, 0}, {0, 2}, {1, 2}, {2, 1}, {2, 3}}, [][2]int32{{0, 1}, {0, 2}, {1, 2}, {2, 3}}, []int32{0, 0, 1, 2, 2, 3}},
	}
	for _, tt := range tests {
		simple, index := Simplify(tt.n, tt.raw)
		if !slices.Equal(simple, tt.want) || !slices.Equal(index, tt.wantIndex) {
			t.Errorf("%s: Simplify = %v, %v; want %v, %v", tt.name, simple, index, tt.want, tt.wantIndex)
		}
	}
}

// TestSimplifyRandom compares Simplify with the map-based reference on
// random multigraphs full of loops and repeats in both orientations.
func TestSimplifyRandom(t *testing.T) {
	rng := rand.New(rand.NewPCG(1, 2))
	for trial := range 2000 {
		n := 1 + rng.IntN(30)
		if trial%50 == 0 {
			n = 1 + rng.IntN(3000)
		}
		m := rng.IntN(4 * n)
		raw := make([][2]int32, m)
		for i := range raw {
			u := int32(rng.IntN(n))
			v := int32(rng.IntN(n))
			switch k := rng.IntN(10); {
			case k == 0:
				v = u // a loop
			case k < 4 && i > 0:
				e := raw[rng.IntN(i)] // a repeat, half of them reversed
				u, v = e[0], e[1]
				if k%2 == 0 {
					u, v = v, u
				}
			}
			raw[i] = [2]int32{u, v}
		}
		input := slices.Clone(raw)
		simple, index := Simplify(n, raw)
		wantSimple, wantIndex := simplifyReference(raw)
		name := fmt.Sprintf("trial %d (n=%d, m=%d)", trial, n, m)
		if !slices.Equal(raw, input) {
			t.Fatalf("%s: Simplify modified its input", name)
		}
		if !slices.Equal(simple, wantSimple) {
			t.Fatalf("%s: simple edges differ from the reference:\n got %v\nwant %v", name, simple, wantSimple)
		}
		if !slices.Equal(index, wantIndex) {
			t.Fatalf("%s: index differs from the reference:\n got %v\nwant %v", name, index, wantIndex)
		}
		for i, e := range raw {
			if j := index[i]; j >= 0 {
				s := simple[j]
				if min(s[0], s[1]) != min(e[0], e[1]) || max(s[0], s[1]) != max(e[0], e[1]) {
					t.Fatalf("%s: raw edge %v maps to %v", name, e, s)
				}
			}
		}
	}
}

// TestIsSimple: a loop or a repeated pair makes an embedding non-simple,
// whatever else it holds (the definition of a simple graph, common
// practice).
func TestIsSimple(t *testing.T) {
	for _, tc := range []struct {
		name  string
		n     int
		edges [][2]int32
		want  bool
	}{
		{"empty", 3, nil, true},
		{"triangle", 3, [][2]int32{{0, 1}, {1, 2}, {2, 0}}, true},
		{"loop", 2, [][2]int32{{0, 1}, {1, 1}}, false},
		{"repeated pair", 3, [][2]int32{{0, 1}, {1, 2}, {1, 0}}, false},
		{"repeated pair far apart", 4, [][2]int32{{2, 3}, {0, 1}, {1, 2}, {3, 2}}, false},
	} {
		t.Run(tc.name, func(t *testing.T) {
			e := NewEmbedding(tc.n)
			for _, ed := range tc.edges {
				// Each edge after the last dart at each end: any rotation
				// will do, simplicity does not depend on it.
				a, b := e.First(ed[0]), e.First(ed[1])
				e.AddEdge(a, b, ed[0], ed[1])
			}
			if got := e.IsSimple(); got != tc.want {
				t.Errorf("IsSimple() = %v, want %v", got, tc.want)
			}
		})
	}
}
