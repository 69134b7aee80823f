package dotio

import (
	"fmt"
	"strconv"
	"strings"
)

// Describe names the graph for messages: its kind and ID as written
// (quoted if it was not), or "anonymous graph N" for the index-th graph
// of its file (counting from 0) when it has no ID.
func (g *Graph) Describe(index int) string {
	kind := "graph"
	if g.Directed {
		kind = "digraph"
	}
	if g.ID == "" {
		return fmt.Sprintf("anonymous %s %d", kind, index+1)
	}
	if strings.HasPrefix(g.ID, `"`) {
		return kind + " " + g.ID
	}
	return kind + " " + strconv.Quote(g.ID)
}

// QuoteText returns plain text s as a double-quoted DOT string that reads
// back as s: backslashes and double quotes are escaped (unlike an
// attribute value, whose backslash escapes such as \n are kept as
// written).
func QuoteText(s string) string {
	s = strings.ReplaceAll(s, `\`, `\\`)
	s = strings.ReplaceAll(s, `"`, `\"`)
	return `"` + s + `"`
}
