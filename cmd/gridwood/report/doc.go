// Package report defines the JSON document that gridwood writes with
// --report: one File record per input file, one Graph record per graph in
// it. The command fills it; the quality benchmark (bench/quality) and other
// tools read it with these same types. README.md ("Quality report")
// documents every field, and a test in cmd/gridwood checks that it does.
package report
