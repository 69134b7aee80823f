package augment

import (
	"github.com/gridwood/gridwood/internal/disjoint"
	"github.com/gridwood/gridwood/planarize"
)

// Biconnect adds edges to emb until every connected component with at least
// three vertices is biconnected. Around every vertex v it looks at each pair
// of consecutive neighbours u, w; when the edges vu and vw lie in different
// blocks it adds uw inside the face between them. Blocks are tracked with a
// union-find structure: adding uw merges exactly the blocks of vu and vw,
// and since u, w in different blocks are never adjacent, no parallel edge
// can arise (the classical argument for this augmentation; common practice,
// see e.g. Kant and Bodlaender 1997 for refined variants).
func Biconnect(emb *planarize.Embedding, skip func(int32) bool) {
	n := emb.N()
	block := blocks(emb)
	uf := disjoint.New(len(block))
	for v := int32(0); int(v) < n; v++ {
		h := emb.First(v)
		if h < 0 || emb.Degree(v) < 2 || skip(v) {
			continue
		}
		for range emb.Degree(v) {
			h2 := emb.Next(h)
			b1, b2 := uf.Find(block[h>>1]), uf.Find(block[h2>>1])
			if b1 != b2 {
				emb.AddEdge(emb.FaceNext(h), h2^1, -1, -1)
				block = append(block, uf.Union(b1, b2))
			}
			h = h2
		}
	}
}

// blocks labels every edge of emb with its biconnected component
// (planarize.Blocks).
func blocks(emb *planarize.Embedding) []int32 {
	block, _ := planarize.Blocks(emb.N(), emb.Edges())
	return block
}

// TriangulateFaces adds edges inside every face of length four or more of a
// biconnected embedding until all faces are triangles, never creating a
// parallel edge. For a face v0 ... v(k-1) it takes as v0 a vertex of least
// degree (so that the work of marking its neighbours sums to O(m) over all
// faces: it is bounded by twice the sum over edges of the smaller end
// degree, which is linear for planar graphs, Chiba and Nishizeki 1985).
// If v0 is adjacent to no vi with 2 <= i <= k-2, it fans out from v0.
// Otherwise such an edge v0 vi runs outside the face and separates
// v1..v(i-1) from v(i+1)..v(k-1), so no edge joins those two sides: the face
// is cut by v1 v(k-1), ..., v1 v(i+1) and then fanned from v(i+1) to
// v2..v(i-1), all new and non-crossing. For each face it splits it calls onSplit with
// the face and one dart of a triangle made from it, so the caller can
// pick an outer face inside a chosen face of the input. The face's darts
// are passed as they were before the split.
func TriangulateFaces(emb *planarize.Embedding, skip func(int32) bool, onSplit func(face []int32, tri int32)) {
	n := emb.N()
	seen := make([]bool, 2*emb.M())
	for d := range seen {
		seen[d] = skip(emb.Tail(int32(d)))
	}
	mark := make([]int32, n)
	for v := range mark {
		mark[v] = -1
	}
	var walk, face []int32
	stamp := int32(0)
	for d0 := int32(0); int(d0) < len(seen); d0++ {
		if seen[d0] {
			continue
		}
		walk = walk[:0]
		for d := d0; !seen[d]; d = emb.FaceNext(d) {
			seen[d] = true
			walk = append(walk, d)
		}
		k := len(walk)
		if k <= 3 {
			continue
		}
		// Rotate so that face[0] leaves the least-degree vertex.
		best := 0
		for i, d := range walk {
			if emb.Degree(emb.Tail(d)) < emb.Degree(emb.Tail(walk[best])) {
				best = i
			}
		}
		face = append(append(face[:0], walk[best:]...), walk[:best]...)
		v0 := emb.Tail(face[0])
		stamp++
		h := emb.First(v0)
		for range emb.Degree(v0) {
			mark[emb.Head(h)] = stamp
			h = emb.Next(h)
		}
		chord := -1
		for i := 2; i <= k-2; i++ {
			if mark[emb.Tail(face[i])] == stamp {
				chord = i
				break
			}
		}
		add := func(a, b int32) int32 {
			e := emb.AddEdge(a, b, -1, -1)
			seen = append(seen, true, true)
			return int32(2 * e)
		}
		var tri int32
		if chord < 0 {
			a := face[0]
			for i := 2; i <= k-2; i++ {
				a = add(a, face[i]) // dart v0 -> vi
			}
			tri = face[0]
		} else {
			i := chord
			for j := k - 1; j >= i+1; j-- {
				add(face[1], face[j])
			}
			// Remaining face v1 .. v(i+1); its dart leaving v(i+1) is the
			// twin of the last edge added, v1 -> v(i+1).
			c := emb.FaceNext(face[i]) // dart v(i+1) -> v1
			for j := 2; j <= i-1; j++ {
				c = add(c, face[j]) // dart v(i+1) -> vj
			}
			tri = face[k-1] // triangle v(k-1) v0 v1
		}
		if onSplit != nil {
			onSplit(face, tri)
		}
	}
}
