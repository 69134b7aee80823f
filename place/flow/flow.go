package flow

import (
	"fmt"
	"strings"
)

// OnCycles reports, per edge (tail, head over nodes 0..n-1), whether it
// lies on a directed cycle.
func OnCycles(n int, edges [][2]int32) ([]bool, error) {
	for i, e := range edges {
		if e[0] < 0 || e[1] < 0 || int(e[0]) >= n || int(e[1]) >= n {
			return nil, fmt.Errorf("flow: edge %d (%d, %d) outside nodes 0..%d", i, e[0], e[1], n-1)
		}
	}
	comp := components(n, edges)
	out := make([]bool, len(edges))
	for i, e := range edges {
		out[i] = comp[e[0]] == comp[e[1]]
	}
	return out, nil
}

// components numbers the strongly connected components (Tarjan 1972),
// with an explicit stack of nodes and their next out-edge.
func components(n int, edges [][2]int32) []int32 {
	start := make([]int32, n+1)
	for _, e := range edges {
		start[e[0]+1]++
	}
	for v := range n {
		start[v+1] += start[v]
	}
	out := make([]int32, len(edges))
	fill := make([]int32, n)
	copy(fill, start[:n])
	for _, e := range edges {
		out[fill[e[0]]] = e[1]
		fill[e[0]]++
	}
	const unseen = -1
	index := make([]int32, n) // discovery order, unseen before
	low := make([]int32, n)
	comp := make([]int32, n)
	onStack := make([]bool, n)
	for v := range index {
		index[v] = unseen
	}
	var stack []int32 // Tarjan's stack of nodes
	type call struct {
		v    int32
		next int32 // next entry of out to look at
	}
	var calls []call
	count, comps := int32(0), int32(0)
	for root := range int32(n) {
		if index[root] != unseen {
			continue
		}
		calls = append(calls, call{root, start[root]})
		index[root], low[root] = count, count
		count++
		stack = append(stack, root)
		onStack[root] = true
		for len(calls) > 0 {
			c := &calls[len(calls)-1]
			v := c.v
			if c.next < start[v+1] {
				w := out[c.next]
				c.next++
				switch {
				case index[w] == unseen:
					index[w], low[w] = count, count
					count++
					stack = append(stack, w)
					onStack[w] = true
					calls = append(calls, call{w, start[w]})
				case onStack[w]:
					low[v] = min(low[v], index[w])
				}
				continue
			}
			// v is done: close its component if it is a root, and
			// pass its low link up.
			if low[v] == index[v] {
				for {
					w := stack[len(stack)-1]
					stack = stack[:len(stack)-1]
					onStack[w] = false
					comp[w] = comps
					if w == v {
						break
					}
				}
				comps++
			}
			calls = calls[:len(calls)-1]
			if len(calls) > 0 {
				u := calls[len(calls)-1].v
				low[u] = min(low[u], low[v])
			}
		}
	}
	return comp
}

// Direction is the flow of a drawing: the way edges should point.
type Direction uint8

const (
	TopToBottom Direction = iota // rankdir TB, the default
	LeftToRight                  // LR
	BottomToTop                  // BT
	RightToLeft                  // RL
)

// String returns the rankdir value of d.
func (d Direction) String() string {
	switch d {
	case LeftToRight:
		return "LR"
	case BottomToTop:
		return "BT"
	case RightToLeft:
		return "RL"
	}
	return "TB"
}

// ParseRankdir reads a rankdir value: TB, LR, BT or RL, in any case,
// blanks around it ignored; an empty value is TB. ok is false for any
// other value, which gives TB.
func ParseRankdir(s string) (d Direction, ok bool) {
	switch strings.ToUpper(strings.TrimSpace(s)) {
	case "", "TB":
		return TopToBottom, true
	case "LR":
		return LeftToRight, true
	case "BT":
		return BottomToTop, true
	case "RL":
		return RightToLeft, true
	}
	return TopToBottom, false
}

// Axis returns the flow's direction as a unit vector in DOT's
// coordinates (y up): TB is (0, -1).
func (d Direction) Axis() (dx, dy int) {
	switch d {
	case LeftToRight:
		return 1, 0
	case BottomToTop:
		return 0, 1
	case RightToLeft:
		return -1, 0
	}
	return 0, -1
}

// Coord is a coordinate type Count takes.
type Coord interface{ ~int64 | ~float64 }

// Counts are the edges of a drawing by how they run.
type Counts struct {
	Along, Against, OnCycles int
}

// Count sorts the edges of a drawing: those on a cycle (onCycle, as
// OnCycles gives it) count in OnCycles; each other edge counts Along when
// its head lies strictly further along d's axis than its tail, else
// Against. The three add up to len(edges).
func Count[T Coord](edges [][2]int32, onCycle []bool, x, y []T, d Direction) (Counts, error) {
	if len(onCycle) != len(edges) || len(x) != len(y) {
		return Counts{}, fmt.Errorf("flow: %d cycle flags for %d edges, %d x for %d y", len(onCycle), len(edges), len(x), len(y))
	}
	dx, dy := d.Axis()
	var c Counts
	for i, e := range edges {
		if e[0] < 0 || e[1] < 0 || int(e[0]) >= len(x) || int(e[1]) >= len(x) {
			return Counts{}, fmt.Errorf("flow: edge %d (%d, %d) outside nodes 0..%d", i, e[0], e[1], len(x)-1)
		}
		if onCycle[i] {
			c.OnCycles++
			continue
		}
		t, h := e[0], e[1]
		var ahead bool
		switch {
		case dx > 0:
			ahead = x[h] > x[t]
		case dx < 0:
			ahead = x[h] < x[t]
		case dy > 0:
			ahead = y[h] > y[t]
		default:
			ahead = y[h] < y[t]
		}
		if ahead {
			c.Along++
		} else {
			c.Against++
		}
	}
	return c, nil
}
