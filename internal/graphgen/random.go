package graphgen

import (
	"fmt"
	"math/rand/v2"
)

// RandomTree returns a uniformly random labelled tree on n vertices (each of
// the n^(n-2) trees equally likely), decoded from a random Prüfer sequence
// in linear time; its edges are shuffled and randomly oriented.
func RandomTree(n int, seed uint64) Graph {
	nn := clamp(n)
	g, ok := newGraph(fmt.Sprintf("tree-%d-seed%d", nn, seed), nn, max(nn-1, 0))
	if !ok || nn < 2 {
		return g
	}
	rng := rand.New(rand.NewPCG(seed, streamTree))
	code := make([]int32, nn-2)
	for i := range code {
		code[i] = int32(rng.Int64N(nn))
	}
	// Linear Prüfer decoding: leaf is the smallest remaining leaf; ptr only
	// moves forward, and a vertex that just became a leaf below ptr is used
	// at once.
	degree := make([]int32, nn)
	for i := range degree {
		degree[i] = 1
	}
	for _, v := range code {
		degree[v]++
	}
	ptr := int32(0)
	for degree[ptr] != 1 {
		ptr++
	}
	leaf := ptr
	for _, v := range code {
		g.Edges = append(g.Edges, [2]int32{leaf, v})
		degree[v]--
		if degree[v] == 1 && v < ptr {
			leaf = v
			continue
		}
		ptr++
		for degree[ptr] != 1 {
			ptr++
		}
		leaf = ptr
	}
	g.Edges = append(g.Edges, [2]int32{leaf, int32(nn - 1)})
	shuffle(g.Edges, rng)
	return g
}

// RandomGnm returns a uniformly random simple graph on n vertices with m
// distinct edges, in random order and orientation. m is capped at
// n(n-1)/2; negative n or m count as zero. When m is at most half of all
// pairs the edges are drawn by rejection; otherwise the missing pairs are,
// and the rest are listed, so the work stays proportional to n + m.
func RandomGnm(n, m int, seed uint64) Graph {
	nn := clamp(n)
	total := nn * (nn - 1) / 2
	mm := min(clamp(m), total)
	g, ok := newGraph(fmt.Sprintf("gnm-%d-%d-seed%d", nn, mm, seed), nn, mm)
	if !ok || mm == 0 {
		return g
	}
	rng := rand.New(rand.NewPCG(seed, streamGnm))
	if 2*mm <= total {
		g.Edges = randomPairs(int(nn), int(mm), g.Edges, rng)
		return g
	}
	missing := randomPairs(int(nn), int(total-mm), nil, rng)
	skip := make(map[uint64]struct{}, len(missing))
	for _, e := range missing {
		skip[pairKey(e[0], e[1])] = struct{}{}
	}
	for u := range int32(nn) {
		for v := u + 1; v < int32(nn); v++ {
			if _, gone := skip[pairKey(u, v)]; !gone {
				g.Edges = append(g.Edges, [2]int32{u, v})
			}
		}
	}
	shuffle(g.Edges, rng)
	return g
}

// randomPairs draws k distinct unordered pairs of distinct vertices in
// 0..n-1 uniformly by rejection, each oriented as drawn. The caller keeps k
// at most half of all pairs, so rejection stays cheap.
func randomPairs(n, k int, out [][2]int32, rng *rand.Rand) [][2]int32 {
	chosen := make(map[uint64]struct{}, k)
	for len(chosen) < k {
		u, v := int32(rng.IntN(n)), int32(rng.IntN(n))
		if u == v {
			continue
		}
		key := pairKey(u, v)
		if _, dup := chosen[key]; dup {
			continue
		}
		chosen[key] = struct{}{}
		out = append(out, [2]int32{u, v})
	}
	return out
}

// Relabel returns g with its vertices renamed by a uniformly random
// permutation, its edge list shuffled and each edge randomly oriented. Edges
// with an endpoint outside 0..g.N-1 are dropped; a graph too large for this
// package (see the package documentation) yields the empty graph.
func Relabel(g Graph, seed uint64) Graph {
	name := fmt.Sprintf("%s-relabel-seed%d", g.Name, seed)
	if !fits(clamp(g.N), int64(len(g.Edges))) {
		return Graph{Name: name}
	}
	n := int(clamp(g.N))
	out := Graph{N: n, Name: name}
	out.Edges = make([][2]int32, 0, len(g.Edges))
	for _, e := range g.Edges {
		if e[0] >= 0 && int(e[0]) < n && e[1] >= 0 && int(e[1]) < n {
			out.Edges = append(out.Edges, e)
		}
	}
	relabelInPlace(n, out.Edges, rand.New(rand.NewPCG(seed, streamRelabel)))
	return out
}

// relabelInPlace renames the vertices of edges by a uniformly random
// permutation of 0..n-1, which it returns (old v becomes perm[v]), then
// shuffles the edges and orients each at random.
func relabelInPlace(n int, edges [][2]int32, rng *rand.Rand) []int32 {
	perm := identity(n)
	for i := n - 1; i > 0; i-- {
		j := rng.IntN(i + 1)
		perm[i], perm[j] = perm[j], perm[i]
	}
	for i, e := range edges {
		edges[i] = [2]int32{perm[e[0]], perm[e[1]]}
	}
	shuffle(edges, rng)
	return perm
}

// shuffle permutes edges uniformly (Fisher-Yates) and flips each edge's
// orientation with probability 1/2.
func shuffle(edges [][2]int32, rng *rand.Rand) {
	for i := len(edges) - 1; i > 0; i-- {
		j := rng.IntN(i + 1)
		edges[i], edges[j] = edges[j], edges[i]
	}
	var bits uint64
	for i := range edges {
		if i%64 == 0 {
			bits = rng.Uint64()
		}
		if bits&1 == 1 {
			edges[i][0], edges[i][1] = edges[i][1], edges[i][0]
		}
		bits >>= 1
	}
}

func identity(n int) []int32 {
	p := make([]int32, n)
	for i := range p {
		p[i] = int32(i)
	}
	return p
}
