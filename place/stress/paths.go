package stress

import (
	"container/heap"
	"math"
)

// paths computes single-source shortest paths over a model's adjacency:
// breadth-first when every edge has the same length, else Dijkstra's
// algorithm with a binary heap. Its buffers are reused between sources.
type paths struct {
	m       *Model
	uniform float64 // the common edge length, 0 if lengths differ
	queue   []int32
	heap    distHeap
}

func newPaths(m *Model) *paths {
	p := &paths{m: m}
	if len(m.length) > 0 {
		p.uniform = m.length[0]
		for _, l := range m.length {
			if l != p.uniform {
				p.uniform = 0
				break
			}
		}
	}
	return p
}

// from fills d with the distances from s (+Inf where unreachable).
func (p *paths) from(s int32, d []float64) {
	for v := range d {
		d[v] = math.Inf(1)
	}
	d[s] = 0
	m := p.m
	if p.uniform > 0 || len(m.length) == 0 {
		q := append(p.queue[:0], s)
		for head := 0; head < len(q); head++ {
			u := q[head]
			for i := m.start[u]; i < m.start[u+1]; i++ {
				if v := m.adj[i]; math.IsInf(d[v], 1) {
					d[v] = d[u] + p.uniform
					q = append(q, v)
				}
			}
		}
		p.queue = q
		return
	}
	h := &p.heap
	h.items = append(h.items[:0], distItem{0, s})
	for len(h.items) > 0 {
		it := heap.Pop(h).(distItem)
		u := it.v
		if it.d > d[u] {
			continue
		}
		for i := m.start[u]; i < m.start[u+1]; i++ {
			v := m.adj[i]
			if nd := it.d + m.length[i]; nd < d[v] {
				d[v] = nd
				heap.Push(h, distItem{nd, v})
			}
		}
	}
}

type distItem struct {
	d float64
	v int32
}

// distHeap orders by distance, then vertex, so that equal distances pop
// in a fixed order.
type distHeap struct{ items []distItem }

func (h *distHeap) Len() int { return len(h.items) }
func (h *distHeap) Less(i, j int) bool {
	a, b := h.items[i], h.items[j]
	return a.d < b.d || (a.d == b.d && a.v < b.v)
}
func (h *distHeap) Swap(i, j int) { h.items[i], h.items[j] = h.items[j], h.items[i] }
func (h *distHeap) Push(x any)    { h.items = append(h.items, x.(distItem)) }
func (h *distHeap) Pop() any {
	it := h.items[len(h.items)-1]
	h.items = h.items[:len(h.items)-1]
	return it
}
