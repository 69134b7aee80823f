package dotio

import (
	"bytes"
	"fmt"
	"unicode/utf8"
)

// tokKind is the kind of a DOT token as seen by the scanner.
type tokKind uint8

const (
	tNone   tokKind = iota
	tID             // unquoted identifier that is not a keyword
	tNum            // numeral
	tString         // double-quoted string (after concatenation)
	tHTML           // HTML string <...>
	tKwNode
	tKwEdge
	tKwGraph
	tKwDigraph
	tKwSubgraph
	tKwStrict
	tLBrace
	tRBrace
	tLBrack
	tRBrack
	tEq
	tSemi
	tComma
	tColon
	tEdgeUndir // --
	tEdgeDir   // ->
)

func (k tokKind) isID() bool { return k >= tID && k <= tHTML }

// keyword spellings. gonumCasings lists the casings gonum's lexer accepts;
// any other casing is lower-cased by the scanner (DOT keywords are
// case-insensitive).
var keywords = [...]struct {
	word         string
	kind         tokKind
	gonumCasings []string
}{
	{"node", tKwNode, []string{"node", "Node", "NODE"}},
	{"edge", tKwEdge, []string{"edge", "Edge", "EDGE"}},
	{"graph", tKwGraph, []string{"graph", "Graph", "GRAPH"}},
	{"digraph", tKwDigraph, []string{"digraph", "Digraph", "diGraph", "DiGraph", "DIGRAPH"}},
	{"subgraph", tKwSubgraph, []string{"subgraph", "Subgraph", "subGraph", "SubGraph", "SUBGRAPH"}},
	{"strict", tKwStrict, []string{"strict", "Strict", "STRICT"}},
}

// keywordKind reports whether lit is a DOT keyword in any casing, and
// whether gonum's lexer recognises that casing.
func keywordKind(lit []byte) (kind tokKind, gonumOK bool) {
	if len(lit) < 4 || len(lit) > 8 {
		return tNone, false
	}
	for _, kw := range keywords {
		if len(kw.word) != len(lit) || !asciiEqualFold(lit, kw.word) {
			continue
		}
		for _, c := range kw.gonumCasings {
			if string(lit) == c {
				return kw.kind, true
			}
		}
		return kw.kind, false
	}
	return tNone, false
}

func asciiEqualFold(b []byte, lower string) bool {
	for i := range b {
		c := b[i]
		if 'A' <= c && c <= 'Z' {
			c += 'a' - 'A'
		}
		if c != lower[i] {
			return false
		}
	}
	return true
}

// scanned is what the scanner hands to the rest of Read.
type scanned struct {
	// text is the normalized input given to gonum's parser; it is the
	// original slice when no normalization was needed. Every token starts
	// at the same byte offset in text as in the original input.
	text []byte
	// merged is true if some "a" + "b" concatenation was merged: only then
	// may line breaks of text differ from the original.
	merged bool
	// graphKw holds the offset of the graph or digraph keyword of each
	// top-level graph.
	graphKw []int32
	// ops holds the offset of every edge operator, in text order.
	ops []int32
	// nodeToks holds the offset of every token that names a node (node
	// statements and edge operands), in text order.
	nodeToks []int32
	// subNodes holds, for each subgraph brace in text order (graph bodies
	// excluded), the number of node tokens inside it.
	subNodes []int32
	// subAt holds, for each subgraph brace as subNodes does, the offset of
	// its subgraph keyword, or of the brace itself when none precedes it
	// (an anonymous `{...}`): where a cluster is said to be.
	subAt []int32
	// splitNum is the offset of the first numeral directly followed by a
	// letter, digit or dot ("1e3", "2x"), which DOT reads as two IDs, and
	// splitCount how many there are; -1 and 0 when there is none.
	splitNum   int32
	splitAt    int32 // where DOT ends that numeral
	splitCount int
}

// scanner is a single-pass DOT tokenizer that mirrors the lexer of
// gonum.org/v1/gonum/graph/formats/dot (internal/dot.bnf), reports lexical
// problems with positions, and records token offsets for the AST walk.
type scanner struct {
	src []byte // original input
	out []byte // normalized copy, nil until the first change
	pos int
	pm  *posMap

	lineBlank bool // only blanks since the start of the current line

	// classification state
	prev         tokKind
	prev2        tokKind // the token before prev
	subKw        int32   // offset of the last subgraph keyword
	braceDepth   int
	bracketDepth int
	pending      int32 // offset of an ID that is a node unless '=' follows; -1 if none
	directed     bool  // kind of the current top-level graph
	portState    uint8 // 1 after ':', 2 after ': ID', 3 after ': ID :'
	subOpen      []subOpen
	res          scanned
	sawToken     bool
	// chain counts the edge operators of the edge statement open at each
	// brace depth (see maxChain).
	chain []int32
}

// maxChain is the most edge operators one edge statement may chain
// (a -- b -- c ... at one level): gonum's parser recurses once per
// operator, and ten million of them overflow the goroutine stack (one
// million parse in about 4 s). A variable so that tests can lower it.
var maxChain int32 = 1_000_000

// MaxNesting is the deepest nesting of braces (a graph's body is depth 1)
// Read accepts. gonum's syntax check recurses once per level and overflows
// the goroutine stack past about 5 million levels; one million parse in
// about 1.1 GB.
const MaxNesting = 1_000_000

// maxNesting is MaxNesting, a variable so that tests can lower it.
var maxNesting = MaxNesting

type subOpen struct {
	index     int32 // into res.subNodes
	nodeCount int32 // len(res.nodeToks) when the brace opened
}

// scan tokenizes src. name is used in error messages.
func scan(src []byte, pm *posMap, name string) (*scanned, error) {
	s := &scanner{src: src, pm: pm, lineBlank: true, pending: -1}
	s.res.splitNum = -1
	// Operators in strings or comments make this an overestimate; it
	// saves the repeated growth of the offset lists on large inputs.
	// An edge statement takes at least 4 bytes ("a--b"), which bounds the
	// estimate for hostile inputs such as long comments of dashes.
	nops := min(bytes.Count(src, []byte("--"))+bytes.Count(src, []byte("->")), len(src)/4)
	s.res.ops = make([]int32, 0, nops)
	s.res.nodeToks = make([]int32, 0, 2*nops)
	if len(src) >= 3 && src[0] == 0xEF && src[1] == 0xBB && src[2] == 0xBF {
		s.modify()
		copy(s.out, "   ")
		s.pos = 3
	}
	if err := s.run(); err != nil {
		if e, ok := err.(*scanError); ok {
			line, col := pm.lineCol(e.off)
			return nil, &Error{File: name, Line: line, Col: col, Msg: e.msg}
		}
		return nil, err
	}
	if len(src) == 0 || src[len(src)-1] != '\n' {
		s.modify()
		s.out = append(s.out, '\n')
	}
	s.res.text = src
	if s.out != nil {
		s.res.text = s.out
	}
	return &s.res, nil
}

// scanError is a lexical error at a byte offset.
type scanError struct {
	off int
	msg string
}

func (e *scanError) Error() string { return e.msg }

func (s *scanner) errorf(off int, format string, args ...any) error {
	return &scanError{off: off, msg: fmt.Sprintf(format, args...)}
}

// modify makes sure s.out is a private copy of the input.
func (s *scanner) modify() {
	if s.out == nil {
		s.out = make([]byte, len(s.src), len(s.src)+1)
		copy(s.out, s.src)
	}
}

// checkText reports the first NUL byte or invalid UTF-8 sequence in
// src[from:to]; U+FFFD is accepted (used for comments).
func (s *scanner) checkText(from, to int) error {
	b := s.src[from:to]
	if bytes.IndexByte(b, 0) < 0 && utf8.Valid(b) {
		return nil
	}
	for i := 0; i < len(b); {
		c := b[i]
		if c == 0 {
			return s.errorf(from+i, "NUL byte in input")
		}
		if c < utf8.RuneSelf {
			i++
			continue
		}
		r, size := utf8.DecodeRune(b[i:])
		if r == utf8.RuneError && size == 1 {
			return s.errorf(from+i, "invalid UTF-8 encoding")
		}
		i += size
	}
	return nil
}

// skip skips blanks and comments.
func (s *scanner) skip() error {
	src := s.src
	for s.pos < len(src) {
		switch src[s.pos] {
		case ' ', '\t', '\r':
			s.pos++
		case '\n':
			s.pos++
			s.lineBlank = true
		case '#':
			if !s.lineBlank {
				return nil
			}
			if err := s.lineComment(); err != nil {
				return err
			}
		case '/':
			if s.pos+1 >= len(src) {
				return nil
			}
			switch src[s.pos+1] {
			case '/':
				if err := s.lineComment(); err != nil {
					return err
				}
			case '*':
				start := s.pos
				end := bytes.Index(src[s.pos+2:], []byte("*/"))
				if end < 0 {
					return s.errorf(start, "unterminated block comment")
				}
				end += s.pos + 2
				if err := s.checkText(s.pos+2, end); err != nil {
					return err
				}
				s.pos = end + 2
				s.lineBlank = false
			default:
				return nil
			}
		default:
			return nil
		}
	}
	return nil
}

func (s *scanner) lineComment() error {
	end := bytes.IndexByte(s.src[s.pos:], '\n')
	if end < 0 {
		end = len(s.src)
	} else {
		end += s.pos
	}
	if err := s.checkText(s.pos, end); err != nil {
		return err
	}
	s.pos = end
	return nil
}

func isASCIILetter(c byte) bool {
	return 'a' <= c && c <= 'z' || 'A' <= c && c <= 'Z' || c == '_'
}

func isDigit(c byte) bool { return '0' <= c && c <= '9' }

// letterAt reports whether a DOT letter starts at i, and its size. Non-ASCII
// runes are letters except U+FFFD; invalid UTF-8 and U+FFFD are errors.
func (s *scanner) letterAt(i int) (size int, err error) {
	c := s.src[i]
	if c < utf8.RuneSelf {
		if isASCIILetter(c) {
			return 1, nil
		}
		return 0, nil
	}
	r, n := utf8.DecodeRune(s.src[i:])
	if r == utf8.RuneError {
		if n == 1 {
			return 0, s.errorf(i, "invalid UTF-8 encoding")
		}
		return 0, s.errorf(i, "character U+FFFD is not allowed outside comments")
	}
	return n, nil
}

func (s *scanner) run() error {
	src := s.src
	for {
		if err := s.skip(); err != nil {
			return err
		}
		if s.pos >= len(src) {
			break
		}
		s.lineBlank = false
		start := s.pos
		c := src[start]
		var kind tokKind
		switch {
		case isASCIILetter(c) || c >= utf8.RuneSelf:
			n, err := s.letterAt(start)
			if err != nil {
				return err
			}
			s.pos += n
			for s.pos < len(src) {
				if isDigit(src[s.pos]) {
					s.pos++
					continue
				}
				n, err := s.letterAt(s.pos)
				if err != nil {
					return err
				}
				if n == 0 {
					break
				}
				s.pos += n
			}
			kind = tID
			if k, ok := keywordKind(src[start:s.pos]); k != tNone {
				kind = k
				if !ok {
					s.modify()
					for i := start; i < s.pos; i++ {
						if 'A' <= s.out[i] && s.out[i] <= 'Z' {
							s.out[i] += 'a' - 'A'
						}
					}
				}
			}
		case isDigit(c) || c == '.':
			if err := s.number(); err != nil {
				return err
			}
			kind = tNum
			s.splitCheck(start)
		case c == '-':
			if start+1 < len(src) {
				switch d := src[start+1]; {
				case d == '-':
					s.pos += 2
					kind = tEdgeUndir
				case d == '>':
					s.pos += 2
					kind = tEdgeDir
				case isDigit(d) || d == '.':
					s.pos++
					if err := s.number(); err != nil {
						return err
					}
					kind = tNum
					s.splitCheck(start)
				}
			}
			if kind == tNone {
				return s.errorf(start, "unexpected '-' (edge operators are -- and ->)")
			}
		case c == '"':
			if err := s.stringToken(); err != nil {
				return err
			}
			kind = tString
		case c == '<':
			if err := s.htmlToken(); err != nil {
				return err
			}
			kind = tHTML
		default:
			s.pos++
			switch c {
			case '{':
				kind = tLBrace
			case '}':
				kind = tRBrace
			case '[':
				kind = tLBrack
			case ']':
				kind = tRBrack
			case '=':
				kind = tEq
			case ';':
				kind = tSemi
			case ',':
				kind = tComma
			case ':':
				kind = tColon
			case '+':
				return s.errorf(start, "'+' must join two quoted strings")
			case '#':
				return s.errorf(start, "'#' starts a comment only at the beginning of a line; quote IDs that contain it, e.g. \"#ff0000\"")
			case 0:
				return s.errorf(start, "NUL byte in input")
			default:
				return s.errorf(start, "unexpected character %s", quoteChar(c))
			}
		}
		if err := s.token(kind, start); err != nil {
			return err
		}
	}
	if s.pending >= 0 {
		s.res.nodeToks = append(s.res.nodeToks, s.pending)
		s.pending = -1
	}
	if !s.sawToken {
		return s.errorf(len(src), "no graph in input")
	}
	return nil
}

func quoteChar(c byte) string {
	if c < ' ' || c == 0x7f {
		return fmt.Sprintf("U+%04X", c)
	}
	return fmt.Sprintf("'%c'", c)
}

// number scans [-](.digits | digits[.digits*]) from s.pos (after any '-').
func (s *scanner) number() error {
	src := s.src
	start := s.pos
	for s.pos < len(src) && isDigit(src[s.pos]) {
		s.pos++
	}
	intDigits := s.pos - start
	if s.pos < len(src) && src[s.pos] == '.' {
		s.pos++
		frac := s.pos
		for s.pos < len(src) && isDigit(src[s.pos]) {
			s.pos++
		}
		if intDigits == 0 && s.pos == frac {
			return s.errorf(start, "unexpected '.'")
		}
	}
	return nil
}

// splitCheck notes a numeral starting at start that runs straight into a
// letter, digit or dot: DOT's lexer ends the numeral there and reads what
// follows as another ID ("1e3" is 1 and then e3), which is rarely meant.
func (s *scanner) splitCheck(start int) {
	if s.pos >= len(s.src) {
		return
	}
	c := s.src[s.pos]
	if !isASCIILetter(c) && !isDigit(c) && c != '.' && c < utf8.RuneSelf {
		return
	}
	if s.res.splitCount == 0 {
		s.res.splitNum, s.res.splitAt = int32(start), int32(s.pos)
	}
	s.res.splitCount++
}

// splitLexeme returns the two parts of the text splitCheck noted: the
// numeral from off to at, and the letters, digits and dots that follow
// it, each cut to 40 bytes (at a character boundary) for a message.
func splitLexeme(src []byte, off, at int) (numeral, rest string) {
	end := at
	for end < len(src) && (isASCIILetter(src[end]) || isDigit(src[end]) || src[end] == '.' || src[end] >= utf8.RuneSelf) {
		end++
	}
	cut := func(b []byte) string {
		if len(b) <= 40 {
			return string(b)
		}
		n := 40
		for n > 0 && !utf8.RuneStart(b[n]) {
			n--
		}
		return string(b[:n]) + "..."
	}
	return cut(src[off:at]), cut(src[at:end])
}

// stringToken scans a quoted string at s.pos and any "+"-concatenated
// strings after it, merging them in the output.
func (s *scanner) stringToken() error {
	start := s.pos
	end, err := s.quoted(start)
	if err != nil {
		return err
	}
	s.pos = end
	var parts [][2]int // inner ranges of the strings joined so far
	for {
		save := s.pos
		if err := s.skip(); err != nil {
			return err
		}
		if s.pos >= len(s.src) || s.src[s.pos] != '+' {
			// Not a concatenation: the token ends at save; the main loop
			// skips the blanks again.
			s.pos = save
			s.lineBlank = false
			break
		}
		plus := s.pos
		s.pos++
		s.lineBlank = false
		if err := s.skip(); err != nil {
			return err
		}
		if s.pos >= len(s.src) || s.src[s.pos] != '"' {
			return s.errorf(plus, "'+' must join two quoted strings")
		}
		if parts == nil {
			parts = append(parts, [2]int{start + 1, end - 1})
		}
		s.lineBlank = false
		next, err := s.quoted(s.pos)
		if err != nil {
			return err
		}
		if last := parts[len(parts)-1]; last[1] > last[0] && s.src[last[1]-1] == '\\' && s.src[s.pos+1] == '\n' {
			// Joined, the escaped backslash would precede the line break.
			return s.errorf(s.pos, `line break right after an escaped backslash (\\) in a quoted string is not supported`)
		}
		parts = append(parts, [2]int{s.pos + 1, next - 1})
		end = next
		s.pos = next
	}
	if parts != nil {
		s.modify()
		s.res.merged = true
		w := start
		s.out[w] = '"'
		w++
		for _, p := range parts {
			w += copy(s.out[w:], s.src[p[0]:p[1]])
		}
		s.out[w] = '"'
		w++
		for ; w < end; w++ {
			s.out[w] = ' '
		}
	}
	return nil
}

// quoted scans one double-quoted string starting at off and returns the
// offset after its closing quote.
func (s *scanner) quoted(off int) (int, error) {
	src := s.src
	i := off + 1
	for i < len(src) {
		c := src[i]
		switch {
		case c == '"':
			return i + 1, nil
		case c == '\\':
			i++
			if i >= len(src) {
				return 0, s.errorf(off, "unterminated quoted string")
			}
			if src[i] == '\\' && i+1 < len(src) && src[i+1] == '\n' {
				return 0, s.errorf(i-1, `line break right after an escaped backslash (\\) in a quoted string is not supported`)
			}
			n, err := s.stringChar(i)
			if err != nil {
				return 0, err
			}
			i += n
		default:
			n, err := s.stringChar(i)
			if err != nil {
				return 0, err
			}
			i += n
		}
	}
	return 0, s.errorf(off, "unterminated quoted string")
}

// stringChar checks the character at i inside a quoted or HTML string.
func (s *scanner) stringChar(i int) (int, error) {
	c := s.src[i]
	if c == 0 {
		return 0, s.errorf(i, "NUL byte in input")
	}
	if c < utf8.RuneSelf {
		return 1, nil
	}
	r, n := utf8.DecodeRune(s.src[i:])
	if r == utf8.RuneError {
		if n == 1 {
			return 0, s.errorf(i, "invalid UTF-8 encoding")
		}
		return 0, s.errorf(i, "character U+FFFD is not allowed outside comments")
	}
	return n, nil
}

// htmlToken scans an HTML string: '<' { char | '<' char+ '>' } '>', the
// nesting gonum's lexer accepts (enough for HTML-like labels, whose tags
// do not contain angle brackets).
func (s *scanner) htmlToken() error {
	src := s.src
	start := s.pos
	depth := 0
	for i := start; i < len(src); {
		switch src[i] {
		case '<':
			if depth == 2 {
				return s.errorf(i, "'<' inside a tag of an HTML string is not supported")
			}
			if depth == 1 && i+1 < len(src) && src[i+1] == '>' {
				return s.errorf(i, "empty tag '<>' inside an HTML string is not supported")
			}
			depth++
			i++
		case '>':
			depth--
			i++
			if depth == 0 {
				s.pos = i
				return nil
			}
		default:
			n, err := s.stringChar(i)
			if err != nil {
				return err
			}
			i += n
		}
	}
	return s.errorf(start, "unterminated HTML string")
}

var compassPoints = [...]string{"n", "ne", "e", "se", "s", "sw", "w", "nw", "c", "_"}

func isCompass(b []byte) bool {
	for _, c := range compassPoints {
		if string(b) == c {
			return true
		}
	}
	return false
}

// token classifies one token for the AST walk and checks edge operators.
func (s *scanner) token(kind tokKind, off int) error {
	s.sawToken = true
	if s.pending >= 0 {
		if kind != tEq {
			s.res.nodeToks = append(s.res.nodeToks, s.pending)
		}
		s.pending = -1
	}
	switch {
	case kind.isID():
		if s.portState == 3 {
			if err := s.compass(kind, off); err != nil {
				return err
			}
		}
		if s.portState == 1 {
			s.portState = 2
		} else {
			s.portState = 0
		}
		if s.bracketDepth == 0 && s.braceDepth > 0 {
			switch s.prev {
			case tKwGraph, tKwDigraph, tKwSubgraph, tEq, tColon:
			default:
				s.pending = int32(off)
			}
		}
	case kind == tColon:
		if s.portState == 2 {
			s.portState = 3
		} else {
			s.portState = 1
		}
	default:
		s.portState = 0
	}
	if err := s.countChain(kind, off); err != nil {
		return err
	}
	switch kind {
	case tEdgeUndir, tEdgeDir:
		s.res.ops = append(s.res.ops, int32(off))
		if s.braceDepth > 0 {
			if kind == tEdgeUndir && s.directed {
				return s.errorf(off, "'--' in a digraph; use '->'")
			}
			if kind == tEdgeDir && !s.directed {
				return s.errorf(off, "'->' in an undirected graph; use '--'")
			}
		}
	case tLBrace:
		if s.braceDepth >= maxNesting {
			return s.errorf(off, "braces nested more than %d levels deep, the most gridwood reads", maxNesting)
		}
		if s.braceDepth > 0 {
			s.subOpen = append(s.subOpen, subOpen{index: int32(len(s.res.subNodes)), nodeCount: int32(len(s.res.nodeToks))})
			s.res.subNodes = append(s.res.subNodes, 0)
			at := int32(off)
			if s.prev == tKwSubgraph || s.prev.isID() && s.prev2 == tKwSubgraph {
				at = s.subKw
			}
			s.res.subAt = append(s.res.subAt, at)
		}
		s.braceDepth++
	case tRBrace:
		if s.braceDepth > 1 && len(s.subOpen) > 0 {
			o := s.subOpen[len(s.subOpen)-1]
			s.subOpen = s.subOpen[:len(s.subOpen)-1]
			s.res.subNodes[o.index] = int32(len(s.res.nodeToks)) - o.nodeCount
		}
		if s.braceDepth > 0 {
			s.braceDepth--
		}
	case tLBrack:
		s.bracketDepth++
	case tRBrack:
		if s.bracketDepth > 0 {
			s.bracketDepth--
		}
	case tKwSubgraph:
		s.subKw = int32(off)
	case tKwGraph, tKwDigraph:
		if s.braceDepth == 0 {
			s.res.graphKw = append(s.res.graphKw, int32(off))
			s.directed = kind == tKwDigraph
		}
	}
	s.prev2, s.prev = s.prev, kind
	return nil
}

// countChain keeps the operator count of the edge statement at the
// current brace depth: an operator adds one; a semicolon, an attribute
// list, or a token that starts a new statement (an ID or keyword right
// after an operand) ends the statement; a brace opens a fresh count for
// its inside.
func (s *scanner) countChain(kind tokKind, off int) error {
	d := s.braceDepth
	for len(s.chain) <= d+1 {
		s.chain = append(s.chain, 0)
	}
	switch {
	case kind == tEdgeUndir || kind == tEdgeDir:
		if s.chain[d]++; s.chain[d] > maxChain {
			return s.errorf(off, "edge statement chains more than %d edges; split it into several statements", maxChain)
		}
	case kind == tLBrace:
		s.chain[d+1] = 0
	case kind == tSemi || kind == tLBrack:
		s.chain[d] = 0
	case kind.isID() || kind >= tKwNode && kind <= tKwStrict:
		switch s.prev {
		case tEdgeUndir, tEdgeDir, tColon, tEq, tKwSubgraph:
		default:
			s.chain[d] = 0
		}
	}
	return nil
}

// compass checks the compass point of a port "ID:ID:compass". gonum drops
// an unknown compass point silently; a quoted valid one is unquoted in the
// output (its quotes become blanks) so that gonum recognises it.
func (s *scanner) compass(kind tokKind, off int) error {
	lit := s.src[off:s.pos]
	if kind == tString && len(lit) >= 2 && isCompass(lit[1:len(lit)-1]) {
		s.modify()
		s.out[off] = ' '
		s.out[s.pos-1] = ' '
		return nil
	}
	if kind == tID && isCompass(lit) {
		return nil
	}
	// %q keeps a line break or control character in the lexeme from
	// splitting the one-line message.
	return s.errorf(off, "invalid compass point %q; want one of n, ne, e, se, s, sw, w, nw, c, _", lit)
}
