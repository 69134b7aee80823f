// Command gridwood reads graphs written in DOT and writes them back with an
// integer pos for every node and a bb for every graph, such that drawing
// each edge as a straight segment gives no crossings.
//
// Usage:
//
//	gridwood [flags] [FILE ...]
//
// With no FILE, or for "-", it reads standard input. Each connected
// component is drawn readably (a stress layout kept free of crossings),
// or with --grid or --unit on Schnyder's (n-2) x (n-2) grid; a non-planar
// graph first loses an inclusion-minimal set of edges, which is reported on
// standard error and, with --removed, written to a file. README.md is the
// user's guide.
//
// Exit status: 0 done, 1 a check found problems, 2 bad input or usage, or
// a file that could not be read or written, 3 a graph is not planar and
// --planar-only was given; killed by SIGPIPE (141 in a shell) when the
// reader of standard output stops early. Output files are committed all
// or nothing (output.go).
//
// # Output files
//
// Nothing is written until every input has been read and laid out. Then
// files that are regular or new are written to temporary files beside them
// (.NAME.gridwood-tmp-PID), standard output is written (the laid-out DOT
// first, then any output whose path is the file behind standard output),
// then pipes and devices, and only when all of that succeeded are the
// temporary files renamed into place, the main output last.
//
//   - An output path that is the file behind standard output or standard
//     error (/dev/stdout, /dev/stderr, /dev/fd/N, /proc/self/fd/N, a link
//     to one of these, or the same file by another name) is written
//     through that descriptor, at its offset or appending as the shell
//     opened it, never renamed over. Another /dev/fd/N is opened and
//     written (appended to, if a regular file); so is a target that exists
//     and is not a regular file (a named pipe, a device). A symbolic link
//     is followed, so the link stays.
//   - A new file gets mode 0666 less the umask; a replaced file keeps its
//     mode.
//   - Temporary files are removed on any failure and when the run is
//     stopped by SIGINT, SIGTERM or SIGHUP.
//   - A closed standard output (>&-) is an error (exit status 2) when the
//     run would write to it. The Go runtime puts the null device, opened
//     for reading and writing, in place of a closed descriptor, and the two
//     cannot be told apart, so standard output on the null device opened
//     that way counts as closed.
//   - Two outputs naming one path or replacing one file, an output that is
//     an input file (or the file standard input reads, when it is read),
//     and standard output appended to an input file are usage errors.
//
// Run gridwood --help for the flags.
package main
