// Command gonumbase parses a DOT file with gonum's parser and prints it
// back, and nothing else: the yardstick the speed targets compare against.
//
//	go run ./bench/gonumbase FILE > /dev/null
package main

import (
	"bufio"
	"fmt"
	"os"

	"gonum.org/v1/gonum/graph/formats/dot"
)

func main() {
	if len(os.Args) != 2 {
		fmt.Fprintln(os.Stderr, "usage: gonumbase FILE")
		os.Exit(2)
	}
	src, err := os.ReadFile(os.Args[1])
	if err != nil {
		fmt.Fprintln(os.Stderr, err)
		os.Exit(1)
	}
	f, err := dot.ParseBytes(src)
	if err != nil {
		fmt.Fprintln(os.Stderr, err)
		os.Exit(1)
	}
	w := bufio.NewWriter(os.Stdout)
	for _, g := range f.Graphs {
		fmt.Fprintln(w, g.String())
	}
	if err := w.Flush(); err != nil {
		fmt.Fprintln(os.Stderr, err)
		os.Exit(1)
	}
}
