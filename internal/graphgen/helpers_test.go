package graphgen

import (
	"fmt"
	"slices"
	"testing"
)

// checkSimple fails t unless every endpoint of g is in 0..N-1, no edge is a
// loop and no unordered pair occurs twice.
func checkSimple(t *testing.T, g Graph) {
	t.Helper()
	if g.N < 0 {
		t.Fatalf("%s: N = %d", g.Name, g.N)
	}
	seen := make(map[uint64]int, len(g.Edges))
	for i, e := range g.Edges {
		if e[0] < 0 || int(e[0]) >= g.N || e[1] < 0 || int(e[1]) >= g.N {
			t.Fatalf("%s: edge %d = %v out of range 0..%d", g.Name, i, e, g.N-1)
		}
		if e[0] == e[1] {
			t.Fatalf("%s: edge %d = %v is a loop", g.Name, i, e)
		}
		k := pairKey(e[0], e[1])
		if j, dup := seen[k]; dup {
			t.Fatalf("%s: edges %d and %d both join %v", g.Name, j, i, e)
		}
		seen[k] = i
	}
}

func adjacency(g Graph) [][]int32 {
	adj := make([][]int32, g.N)
	for _, e := range g.Edges {
		adj[e[0]] = append(adj[e[0]], e[1])
		adj[e[1]] = append(adj[e[1]], e[0])
	}
	return adj
}

func degrees(g Graph) []int {
	d := make([]int, g.N)
	for _, e := range g.Edges {
		d[e[0]]++
		d[e[1]]++
	}
	return d
}

// bfs returns the distances from s (-1 when unreachable) and, if a cycle
// closes during the search, the length of the shortest cycle through s
// found (the minimum over all s is the girth; 0 when none).
func bfs(adj [][]int32, s int32) (dist []int, cycle int) {
	dist = make([]int, len(adj))
	parent := make([]int32, len(adj))
	for i := range dist {
		dist[i] = -1
	}
	dist[s], parent[s] = 0, -1
	queue := []int32{s}
	for len(queue) > 0 {
		u := queue[0]
		queue = queue[1:]
		for _, v := range adj[u] {
			switch {
			case dist[v] < 0:
				dist[v], parent[v] = dist[u]+1, u
				queue = append(queue, v)
			case v != parent[u]:
				if c := dist[u] + dist[v] + 1; cycle == 0 || c < cycle {
					cycle = c
				}
			}
		}
	}
	return dist, cycle
}

func connected(g Graph) bool {
	if g.N == 0 {
		return true
	}
	dist, _ := bfs(adjacency(g), 0)
	return !slices.Contains(dist, -1)
}

// girthAndDiameter returns the length of a shortest cycle (0 for a forest)
// and the largest distance (-1 when disconnected).
func girthAndDiameter(g Graph) (girth, diameter int) {
	adj := adjacency(g)
	for s := range int32(g.N) {
		dist, c := bfs(adj, s)
		if c > 0 && (girth == 0 || c < girth) {
			girth = c
		}
		for _, d := range dist {
			if d < 0 {
				return girth, -1
			}
			diameter = max(diameter, d)
		}
	}
	return girth, diameter
}

func countTriangles(g Graph) int {
	adj := adjacency(g)
	has := make(map[uint64]bool, len(g.Edges))
	for _, e := range g.Edges {
		has[pairKey(e[0], e[1])] = true
	}
	count := 0
	for u := range adj {
		for _, v := range adj[u] {
			for _, w := range adj[u] {
				if int32(u) < v && v < w && has[pairKey(v, w)] {
					count++
				}
			}
		}
	}
	return count
}

func edgeSet(g Graph) map[uint64]bool {
	s := make(map[uint64]bool, len(g.Edges))
	for _, e := range g.Edges {
		s[pairKey(e[0], e[1])] = true
	}
	return s
}

type pt struct{ x, y int64 }

func orient(a, b, c pt) int64 {
	v := (b.x-a.x)*(c.y-a.y) - (b.y-a.y)*(c.x-a.x)
	switch {
	case v > 0:
		return 1
	case v < 0:
		return -1
	}
	return 0
}

func onSegment(a, b, p pt) bool {
	return orient(a, b, p) == 0 &&
		min(a.x, b.x) <= p.x && p.x <= max(a.x, b.x) &&
		min(a.y, b.y) <= p.y && p.y <= max(a.y, b.y)
}

// segmentsMeet reports whether the closed segments ab and cd share a point.
func segmentsMeet(a, b, c, d pt) bool {
	o1, o2, o3, o4 := orient(a, b, c), orient(a, b, d), orient(c, d, a), orient(c, d, b)
	if o1*o2 < 0 && o3*o4 < 0 {
		return true
	}
	return onSegment(a, b, c) || onSegment(a, b, d) || onSegment(c, d, a) || onSegment(c, d, b)
}

// planeDrawingError returns nil exactly when the straight-line drawing of g
// at pos is plane: distinct points, and two edges meet only in a shared
// endpoint. That is the definition of a planar straight-line drawing (common
// practice), so nil proves g planar.
func planeDrawingError(g Graph, pos []pt) error {
	at := make(map[pt]int, len(pos))
	for v, p := range pos {
		if w, dup := at[p]; dup {
			return fmt.Errorf("vertices %d and %d both at %v", w, v, p)
		}
		at[p] = v
	}
	for i, e := range g.Edges {
		a, b := pos[e[0]], pos[e[1]]
		for _, f := range g.Edges[i+1:] {
			c, d := pos[f[0]], pos[f[1]]
			shared := int32(-1)
			switch {
			case e[0] == f[0] || e[0] == f[1]:
				shared = e[0]
			case e[1] == f[0] || e[1] == f[1]:
				shared = e[1]
			}
			if shared < 0 {
				if segmentsMeet(a, b, c, d) {
					return fmt.Errorf("edges %v and %v cross", e, f)
				}
				continue
			}
			// Edges at a common endpoint overlap only if they leave it in
			// the same direction.
			p := pos[shared]
			q, r := a, c
			if q == p {
				q = b
			}
			if r == p {
				r = d
			}
			if orient(p, q, r) == 0 && (q.x-p.x)*(r.x-p.x)+(q.y-p.y)*(r.y-p.y) > 0 {
				return fmt.Errorf("edges %v and %v overlap", e, f)
			}
		}
	}
	return nil
}

func binomial(n, k int) int {
	if k < 0 || k > n {
		return 0
	}
	r := 1
	for i := 1; i <= k; i++ {
		r = r * (n - k + i) / i
	}
	return r
}
