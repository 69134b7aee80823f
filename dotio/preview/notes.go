package preview

import (
	"fmt"
	"slices"
	"strings"
)

// notDrawn gathers what the input says that the preview does not draw:
// each kind of thing once, in order of first appearance, with a count.
type notDrawn struct {
	order []string
	count map[string]int
	unit  map[string]string // what is counted ("node", "edge", ...)
}

func (n *notDrawn) add(what, unit string) { n.addN(what, unit, 1) }

// addN counts k more of what.
func (n *notDrawn) addN(what, unit string, k int) {
	if n.count == nil {
		n.count = map[string]int{}
		n.unit = map[string]string{}
	}
	if _, ok := n.count[what]; !ok {
		n.order = append(n.order, what)
		n.unit[what] = unit
	}
	n.count[what] += k
}

// list words each entry: "node attribute fontname (3 nodes)".
func (n *notDrawn) list() []string {
	out := make([]string, 0, len(n.order))
	for _, w := range n.order {
		c, u := n.count[w], n.unit[w]
		switch {
		case u == "":
			out = append(out, w)
		case c == 1:
			out = append(out, fmt.Sprintf("%s (1 %s)", w, u))
		default:
			out = append(out, fmt.Sprintf("%s (%d %ss)", w, c, u))
		}
	}
	return out
}

// The attributes the preview draws, or reads for sizes (package
// nodesize), by what they apply to.
var (
	drawnNode = keySet("label", "xlabel", "shape", "width", "height", "fixedsize", "fontsize",
		"fontcolor", "color", "fillcolor", "style", "penwidth", "peripheries", "margin", "tooltip")
	drawnEdge = keySet("label", "xlabel", "headlabel", "taillabel", "color", "fontcolor", "fontsize",
		"style", "penwidth", "dir", "arrowhead", "arrowtail", "arrowsize", "labelfontcolor",
		"labelfontsize", "tooltip")
	drawnGraph = keySet("label", "labelloc", "labeljust", "fontsize", "fontcolor", "bgcolor", "rankdir")
	// drawnCluster applies when cluster frames are given.
	drawnCluster = keySet(FrameKeys()...)
	// silent are attributes that steer a layout, name things for other
	// programs, or carry a layout's results: not part of the picture the
	// preview is given, so there is nothing to say about them (from
	// memory of DOT's attribute list).
	silent = keySet(
		// layout results
		"pos", "bb", "lp", "xlp", "head_lp", "tail_lp", "lwidth", "lheight",
		// layout parameters
		"layout", "rank", "ranksep", "nodesep", "splines", "overlap", "sep", "esep",
		"concentrate", "ordering", "ratio", "size", "pad", "dpi", "resolution", "pack",
		"packmode", "K", "maxiter", "start", "epsilon", "mode", "model", "root", "center",
		"compound", "newrank", "searchsize", "mclimit", "nslimit", "nslimit1", "remincross",
		"outputorder", "charset", "forcelabels", "quantum", "normalize", "clusterrank",
		"defaultdist", "dim", "dimen", "diredgeconstraints", "inputscale", "levels",
		"levelsgap", "mindist", "notranslate", "oneblock", "overlap_scaling",
		"overlap_shrink", "repulsiveforce", "smoothing", "voro_margin", "weight", "len",
		"minlen", "constraint", "group", "pin", "sortv", "z", "vertices", "rects",
		"samehead", "sametail", "showboxes", "searchsize", "ranksep",
		// names for other programs
		"comment", "id", "class", "URL", "href", "target", "layer", "layers",
		"layerselect", "layersep", "layerlistsep", "fontpath", "imagepath", "stylesheet",
		"truecolor", "edgeURL", "edgehref", "edgetarget", "edgetooltip", "headURL",
		"headhref", "headtarget", "headtooltip", "tailURL", "tailhref", "tailtarget",
		"tailtooltip", "labelURL", "labelhref", "labeltarget", "labeltooltip",
	)
)

func keySet(keys ...string) map[string]bool {
	m := make(map[string]bool, len(keys))
	for _, k := range keys {
		m[k] = true
	}
	return m
}

// keyNotes notes the attribute keys of a graph the preview neither draws
// nor may pass over in silence.
// edgePos says whether an edge pos (splines) belongs to the drawing shown.
func keyNotes(nd *notDrawn, graph, subgraph, node, edge []string, framed, edgePos bool) {
	if edgePos && slices.Contains(edge, "pos") {
		nd.add("edge attribute pos (splines: edges are drawn straight)", "")
	}
	for _, c := range []struct {
		keys  []string
		drawn map[string]bool
		what  string
	}{
		{graph, drawnGraph, "graph attribute"},
		{node, drawnNode, "node attribute"},
		{edge, drawnEdge, "edge attribute"},
	} {
		for _, k := range c.keys {
			if !c.drawn[k] && !silent[k] && k != "pos" {
				nd.add(c.what+" "+k, "")
			}
		}
	}
	var sub []string
	for _, k := range subgraph {
		if silent[k] || framed && drawnCluster[k] {
			continue
		}
		sub = append(sub, k)
	}
	if len(sub) > 0 {
		slices.Sort(sub)
		if framed {
			nd.add("cluster attributes "+strings.Join(sub, ", "), "")
		} else {
			nd.add("subgraph attributes (cluster frames are not drawn yet): "+strings.Join(sub, ", "), "")
		}
	}
}
