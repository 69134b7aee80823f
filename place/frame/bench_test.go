package frame

import (
	"fmt"
	"math/rand/v2"
	"testing"
)

// benchInput lays n nodes in k top clusters, each with a child holding
// half its nodes, clusters on a grid of blocks (frames about 1,550
// points wide, 2,000 apart) and a tenth of the nodes in no cluster,
// scattered anywhere: about three quarters of those are intrusions.
func benchInput(n, k int) Input {
	rng := rand.New(rand.NewPCG(1, 2))
	var in Input
	in.Parent = make([]int32, 2*k)
	for c := range k {
		in.Parent[2*c], in.Parent[2*c+1] = -1, int32(2*c)
	}
	side := int64(1)
	for side*side < int64(k) {
		side++
	}
	for v := range n {
		c := v % k
		x := int64(c)%side*2000 + rng.Int64N(1500)
		y := int64(c)/side*2000 + rng.Int64N(1500)
		if v%10 == 0 {
			x, y = rng.Int64N(side*2000), rng.Int64N(side*2000)
		}
		in.X = append(in.X, x)
		in.Y = append(in.Y, y)
		in.HalfW = append(in.HalfW, 20)
		in.HalfH = append(in.HalfH, 10)
		home := int32(2*c + v/k%2)
		if v%10 == 0 {
			home = -1
		}
		in.Home = append(in.Home, home)
	}
	in.Margin = 8
	return in
}

func BenchmarkMeasure(b *testing.B) {
	for _, size := range []struct{ n, k int }{{10_000, 100}, {100_000, 1_000}} {
		in := benchInput(size.n, size.k)
		frames, err := Frames(in)
		if err != nil {
			b.Fatal(err)
		}
		b.Run(fmt.Sprintf("count-%d-%d", size.n, size.k), func(b *testing.B) {
			for b.Loop() {
				if _, err := Measure(in.Clusters, in.Nodes, frames); err != nil {
					b.Fatal(err)
				}
			}
		})
		b.Run(fmt.Sprintf("find-%d-%d", size.n, size.k), func(b *testing.B) {
			for b.Loop() {
				if _, err := Find(in.Clusters, in.Nodes, frames); err != nil {
					b.Fatal(err)
				}
			}
		})
	}
}
