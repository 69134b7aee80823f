package planarize

import (
	"fmt"
	"math/rand/v2"
	"slices"
	"testing"

	"github.com/gridwood/gridwood/internal/graphgen"
	"github.com/gridwood/gridwood/internal/order"
)

// TestComponentsMatchUnionFind compares ComponentLabels and Components, on
// the interval path (depth-first numbering) and on the search path
// (scattered numbering), with the test's own union-find.
func TestComponentsMatchUnionFind(t *testing.T) {
	check := func(name string, n int, edges [][2]int32, wantInterval bool) {
		t.Helper()
		simple, _ := Simplify(n, edges)
		emb, ok := Embed(n, simple)
		if !ok {
			t.Fatalf("%s: not planar", name)
		}
		if _, _, got := emb.intervalLabels(); got != wantInterval {
			t.Errorf("%s: interval path taken = %v, want %v", name, got, wantInterval)
		}
		comp, members := emb.ComponentLabels()
		label, want := graphgen.Components(n, simple)
		if len(members) != len(want) {
			t.Fatalf("%s: %d components, want %d", name, len(members), len(want))
		}
		for c := range want {
			if !slices.Equal(members[c], want[c]) {
				t.Fatalf("%s: component %d is %v, want %v", name, c, members[c], want[c])
			}
		}
		if got := emb.Components(); got != len(want) {
			t.Fatalf("%s: Components() = %d, want %d", name, got, len(want))
		}
		for v := range n {
			if int(comp[v]) != label[v] {
				t.Fatalf("%s: vertex %d in component %d, want %d", name, v, comp[v], label[v])
			}
		}
	}
	// Two interleaved paths: every stretch no edge leaves is the whole
	// range, but it is not connected.
	check("interleaved", 4, [][2]int32{{0, 2}, {1, 3}}, false)
	check("isolated", 3, nil, true)
	for seed := range uint64(20) {
		var edges [][2]int32
		n := 0
		for part := range 4 {
			g := graphgen.RandomPlanar(30+10*part, 0.5, seed*4+uint64(part))
			for _, e := range g.Edges {
				edges = append(edges, [2]int32{e[0] + int32(n), e[1] + int32(n)})
			}
			n += g.N
		}
		perm := rand.New(rand.NewPCG(seed, 1)).Perm(n)
		scattered := make([][2]int32, len(edges))
		for i, e := range edges {
			scattered[i] = [2]int32{int32(perm[e[0]]), int32(perm[e[1]])}
		}
		check(fmt.Sprintf("scattered-%d", seed), n, scattered, false)
		_, renumbered, _ := order.DepthFirst(n, scattered)
		check(fmt.Sprintf("renumbered-%d", seed), n, renumbered, true)
	}
}
