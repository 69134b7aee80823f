// Command gridwood gives planar straight-line drawings to graphs written in
// DOT. See the package documentation (doc.go) and README.md.
package main

import "os"

func main() {
	os.Exit(run(os.Args[1:], os.Stdin, os.Stdout, os.Stderr))
}
