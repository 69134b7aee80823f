// Command gridwood reads graphs written in DOT and writes them back with an
// integer pos for every node and a bb for every graph, such that drawing
// each edge as a straight segment gives no crossings.
//
// Usage:
//
//	gridwood [flags] [FILE ...]
//
// With no FILE, or for "-", it reads standard input. Planar graphs are drawn
// on Schnyder's (n-2) x (n-2) grid per connected component; a non-planar
// graph first loses an inclusion-minimal set of edges, which is reported on
// standard error and, with --removed, written to a file.
//
// Exit status: 0 done, 1 a check found problems, 2 bad input or usage, or
// a file that could not be read or written, 3 a graph is not planar and
// --planar-only was given; killed by SIGPIPE (141 in a shell) when the
// reader of standard output stops early. Output files are committed all
// or nothing (output.go).
//
// Run gridwood --help for the flags.
package main
