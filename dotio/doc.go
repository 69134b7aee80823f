// Package dotio reads graphs written in the DOT language into plain
// graphs (node names, edges as index pairs) and writes them back with
// computed node positions. It knows no layout algorithm.
//
// # Reading
//
// Read first runs its own single-pass scanner over the bytes. The scanner
// tokenizes exactly as the lexer of gonum.org/v1/gonum/graph/formats/dot
// does, reports lexical problems with positions (invalid UTF-8, NUL bytes,
// unterminated strings and comments, stray characters, '#' that does not
// start a line, '--' in a digraph and '->' in a graph, an input without a
// graph, braces nested deeper than MaxNesting, which gonum's recursive
// syntax check cannot take), notes numerals run into a letter ("1e3" is
// the two IDs 1 and e3, as DOT's lexer reads it) in File.Warnings, and
// normalizes the input where gonum's parser falls short: it
// lower-cases keywords in casings gonum does not know, merges "a" + "b"
// into one quoted string padded with blanks, blanks out a byte order mark
// and appends a final newline. Every token keeps its byte offset, so
// positions map back exactly. gonum's parser then builds the syntax tree,
// and a walk over it in text order builds the graphs.
//
// Positions are 1-based lines and columns; columns count bytes (a tab
// counts 1) and do not count a leading byte order mark.
//
// Semantics follow DOT: a node is created at its first mention; `1` and
// `"1"` name the same node, while an HTML ID such as <b> never equals a
// quoted string. An edge statement V0 op V1 op V2 ... joins every node of
// Vi to every node of Vi+1, where a subgraph operand stands for the nodes
// mentioned inside it, nested subgraphs included, in order of first
// mention there; a named subgraph reopened as an operand also stands for
// the nodes of its earlier occurrences, a name being looked up among the
// parent's subgraphs only (common DOT practice, from memory). Self-loops and repeated edges are kept, in strict graphs
// too. `node [...]` and `edge [...]` defaults are scoped to the enclosing
// subgraph. Edge statements with subgraph operands are capped
// (ReadOptions.MaxExpansion): the number of edges a pair of operands
// produces is computed before any is made.
//
// # Rules beyond the grammar
//
//   - Only LF ends a line for positions; a bare CR is a blank.
//   - HTML strings may hold tags (<b>, </td>) but not '<' inside a tag nor
//     an empty tag <>; gonum's lexer supports no more, and HTML-like labels
//     need no more.
//   - A compass point (the last part of a:p:n) must be one of n, ne, e, se,
//     s, sw, w, nw, c, _; gonum would drop any other silently. A quoted one
//     ("ne") is accepted.
//   - A line break right after an escaped backslash ("a\\" then a newline
//     inside the string) is rejected: gonum removes backslash-newline
//     without regard to pairs, which would turn such a string invalid.
//   - Node.ID and all lexemes printed by Write are those of gonum's syntax
//     tree: as written, except that backslash-newline is removed from
//     quoted strings and concatenations are merged.
//   - Edge.Op counts the edge operators of the whole file, from 0.
//   - Edges of a subgraph operand's own statements come before the edges
//     of the statement that has the operand ("a -- {b -- c}" gives b-c,
//     a-b, a-c).
//
// # Attributes
//
// Node.Attrs holds the few node attributes the layout reads. NodeTable
// and EdgeTable give the effective value of any chosen keys for every
// node or edge (defaults in scope, then the node's or edge's own
// statements), at a cost of the keys asked for; GraphAttrs gives the
// graph's own attributes and AttrKeys every key a graph's statements set.
// Attr.Text unquotes a value for its reader, keeping DOT's label escapes.
//
// # Writing
//
// Write prints the statements of each graph in their original order and
// form, one per line, with tab indentation (capped at 8 levels); a
// subgraph whose printed statements are all bare nodes is printed on one
// line, judged on what is printed so that output read again prints the
// same. Its only changes: the stale layout data being replaced is removed,
// by the kind of statement it sits on (pos and xlp of nodes, pos, lp,
// xlp, head_lp and tail_lp of edges, in statements and defaults; bb, lp,
// lwidth and lheight of graphs and subgraphs), and each top-level graph
// ends with one
// `ID [pos="X,Y"]` statement per node and a `graph [bb="..."]` statement.
// Edges the layout removed can be dropped or marked (WriteOptions), and
// WriteRemoved writes them to a graph of their own.
package dotio
