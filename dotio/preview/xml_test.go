package preview

import (
	"encoding/xml"
	"strconv"
	"strings"
	"testing"
)

// xmlNode is a generic element tree, decoded by encoding/xml.
type xmlNode struct {
	XMLName xml.Name
	Attrs   []xml.Attr `xml:",any,attr"`
	Kids    []xmlNode  `xml:",any"`
	Text    string     `xml:",chardata"`
}

func (n *xmlNode) attr(name string) string {
	for _, a := range n.Attrs {
		if a.Name.Local == name {
			return a.Value
		}
	}
	return ""
}

func (n *xmlNode) hasClass(c string) bool {
	return strings.Contains(" "+n.attr("class")+" ", " "+c+" ")
}

// find returns the descendants of n (n included) for which keep is true,
// in document order.
func (n *xmlNode) find(keep func(*xmlNode) bool) []*xmlNode {
	var out []*xmlNode
	stack := []*xmlNode{n}
	for len(stack) > 0 {
		x := stack[len(stack)-1]
		stack = stack[:len(stack)-1]
		if keep(x) {
			out = append(out, x)
		}
		for i := len(x.Kids) - 1; i >= 0; i-- {
			stack = append(stack, &x.Kids[i])
		}
	}
	return out
}

// allText is the character data of n and its descendants, titles left out.
func (n *xmlNode) allText() string {
	var b strings.Builder
	var walk func(x *xmlNode)
	walk = func(x *xmlNode) {
		if x.XMLName.Local == "title" {
			return
		}
		b.WriteString(x.Text)
		for i := range x.Kids {
			walk(&x.Kids[i])
		}
	}
	walk(n)
	return b.String()
}

func (n *xmlNode) title() string {
	for _, k := range n.Kids {
		if k.XMLName.Local == "title" {
			return k.Text
		}
	}
	return ""
}

func byClass(tag, class string) func(*xmlNode) bool {
	return func(x *xmlNode) bool { return (tag == "" || x.XMLName.Local == tag) && x.hasClass(class) }
}

func byTag(tag string) func(*xmlNode) bool {
	return func(x *xmlNode) bool { return x.XMLName.Local == tag }
}

func parseSVG(t *testing.T, doc []byte) *xmlNode {
	t.Helper()
	var root xmlNode
	if err := xml.Unmarshal(doc, &root); err != nil {
		t.Fatalf("not well-formed XML: %v\n%s", err, doc)
	}
	if root.XMLName.Local != "svg" || root.XMLName.Space != "http://www.w3.org/2000/svg" {
		t.Fatalf("root element %v, want svg in the SVG namespace", root.XMLName)
	}
	return &root
}

func atof(t *testing.T, s string) float64 {
	t.Helper()
	v, err := strconv.ParseFloat(s, 64)
	if err != nil {
		t.Fatalf("number %q: %v", s, err)
	}
	return v
}
