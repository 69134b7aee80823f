package geomcheck_test

import (
	"fmt"

	"github.com/gridwood/gridwood/place/geomcheck"
)

// A square with both diagonals: the diagonals cross once, and nothing
// else is wrong.
func ExampleCheck() {
	pts := []geomcheck.Point{{X: 0, Y: 0}, {X: 4, Y: 0}, {X: 4, Y: 4}, {X: 0, Y: 4}}
	edges := [][2]int32{{0, 1}, {1, 2}, {2, 3}, {3, 0}, {0, 2}, {1, 3}}
	problems, err := geomcheck.Check(pts, edges)
	if err != nil {
		panic(err)
	}
	for _, p := range problems {
		fmt.Println(p.Kind, "edges", edges[p.A], edges[p.B])
	}
	// Output:
	// crossing edges [0 2] [1 3]
}

// Two boxes of half size 2 x 1 whose centres are 3 apart overlap; a third
// box 10 away is clear of both.
func ExampleBoxOverlaps() {
	pts := []geomcheck.Point{{X: 0, Y: 0}, {X: 3, Y: 0}, {X: 13, Y: 0}}
	hw, hh := []int64{2, 2, 2}, []int64{1, 1, 1}
	pairs, err := geomcheck.BoxOverlaps(pts, hw, hh)
	if err != nil {
		panic(err)
	}
	fmt.Println(pairs)
	// Output:
	// [[0 1]]
}
