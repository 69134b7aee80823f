package main

import (
	"os"
	"runtime/debug"
)

func main() {
	// The syntax tree of a big file is many small objects that live until
	// the end; collecting less often saves about a tenth of the time on big
	// inputs for little memory (see bench/RESULTS.md).
	if os.Getenv("GOGC") == "" {
		debug.SetGCPercent(300)
	}
	os.Exit(run(os.Args[1:], os.Stdin, os.Stdout, os.Stderr))
}
