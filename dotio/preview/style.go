package preview

import (
	"math"
	"strconv"
	"strings"
)

// lineStyle is what a DOT style says of a line or an outline.
type lineStyle struct {
	dashed, dotted, bold, filled, invis, rounded bool
	width                                        float64 // setlinewidth(N), 0 if not given
}

// parseStyle reads a DOT style list ("dashed, bold", "setlinewidth(2)");
// unknown names are returned for the notes. kind is "node", "edge" or
// "cluster": which names apply.
func parseStyle(s string, kind string) (st lineStyle, unknown []string) {
	for _, item := range splitStyle(s) {
		name, arg, _ := strings.Cut(item, "(")
		name = strings.ToLower(strings.TrimSpace(name))
		arg = strings.TrimSuffix(strings.TrimSpace(arg), ")")
		switch {
		case name == "":
		case name == "solid":
		case name == "dashed":
			st.dashed = true
		case name == "dotted":
			st.dotted = true
		case name == "bold":
			st.bold = true
		case name == "invis" || name == "invisible":
			st.invis = true
		case name == "filled" && kind != "edge":
			st.filled = true
		case name == "rounded" && kind != "edge":
			st.rounded = true
		case name == "setlinewidth":
			if v, err := strconv.ParseFloat(strings.TrimSpace(arg), 64); err == nil && v >= 0 && v < 1000 {
				st.width = v
			}
		default:
			unknown = append(unknown, name)
		}
	}
	return st, unknown
}

// splitStyle splits a style list at commas outside parentheses.
func splitStyle(s string) []string {
	var out []string
	depth, start := 0, 0
	for i := 0; i < len(s); i++ {
		switch s[i] {
		case '(':
			depth++
		case ')':
			depth = max(depth-1, 0)
		case ',':
			if depth == 0 {
				out = append(out, s[start:i])
				start = i + 1
			}
		}
	}
	return append(out, s[start:])
}

// dashArray is the SVG dash pattern of a style at a pen width; "" for a
// solid line. Our own patterns.
func (st lineStyle) dashArray(width float64) string {
	switch {
	case st.dotted:
		return num(max(width, 1)) + " " + num(3*max(width, 1))
	case st.dashed:
		return num(6*max(width, 1)/1.5) + " " + num(3.5*max(width, 1)/1.5)
	}
	return ""
}

// penWidth is a pen width: penwidth if given (a number from 0 to below
// 1000), else setlinewidth, else ours; bold doubles ours (DOT's bold is
// twice its default width; from memory).
func penWidth(penwidth string, set bool, st lineStyle, ours float64) (float64, bool) {
	if set {
		if v, err := strconv.ParseFloat(strings.TrimSpace(penwidth), 64); err == nil && v >= 0 && v < 1000 {
			return v, true
		}
	}
	if st.width > 0 {
		return st.width, true
	}
	if st.bold {
		return 2 * ours, true
	}
	return ours, false
}

// arrowPart is one shape of an arrowhead: its name, open (o) and the half
// kept (l or r, 0 for both).
type arrowPart struct {
	shape string
	open  bool
	side  byte
}

// arrowShapes are the primitive shapes and their lengths along the edge
// at arrowsize 1, in points (ours: DOT's are about 10 long, from memory).
var arrowShapes = map[string]float64{
	"normal": 9, "inv": 9, "vee": 9, "crow": 9, "tee": 4, "box": 7, "diamond": 12, "dot": 7, "none": 0,
}

// arrowAliases are the older single names and what they stand for (from
// memory of DOT's documentation).
var arrowAliases = map[string]string{
	"empty": "onormal", "invempty": "oinv", "ediamond": "odiamond", "open": "vee",
	"halfopen": "lvee",
}

// parseArrow reads an arrowType: up to four shapes, each with optional o
// and l/r modifiers ("lteeoldiamond"). ok is false for anything else.
func parseArrow(s string) ([]arrowPart, bool) {
	s = strings.ToLower(strings.TrimSpace(s))
	if a, ok := arrowAliases[s]; ok {
		s = a
	}
	var parts []arrowPart
	for s != "" && len(parts) < 4 {
		var p arrowPart
		if strings.HasPrefix(s, "o") { // no shape's name starts with o
			p.open = true
			s = s[1:]
		}
		if strings.HasPrefix(s, "l") || strings.HasPrefix(s, "r") { // nor with l or r
			p.side = s[0]
			s = s[1:]
		}
		found := false
		for name := range arrowShapes {
			if strings.HasPrefix(s, name) && len(name) > len(p.shape) {
				p.shape = name
				found = true
			}
		}
		if !found {
			return nil, false
		}
		s = s[len(p.shape):]
		parts = append(parts, p)
	}
	return parts, s == ""
}

// arrowPolygons returns the outlines of an arrowhead with its tip at
// (x, y), pointing along the unit vector (ux, uy), in DOT coordinates
// (y up), each with whether it is filled, and the length it takes along
// the edge.
func arrowPolygons(parts []arrowPart, x, y, ux, uy, size float64) (polys [][][2]float64, filled []bool, length float64) {
	// Local frame: a along the edge back from the tip, b to the left of
	// the way the edge runs.
	lx, ly := -uy, ux
	at := 0.0
	for _, p := range parts {
		l := arrowShapes[p.shape] * size
		w := 3.6 * size
		var local [][2]float64
		switch p.shape {
		case "normal":
			local = [][2]float64{{0, 0}, {l, w}, {l, -w}}
		case "inv":
			local = [][2]float64{{0, w}, {0, -w}, {l, 0}}
		case "vee":
			local = [][2]float64{{0, 0}, {l, w}, {0.65 * l, 0}, {l, -w}}
		case "crow":
			local = [][2]float64{{0, w}, {0.35 * l, 0}, {0, -w}, {l, 0}}
		case "tee":
			local = [][2]float64{{0.2 * l, w * 1.2}, {0.2 * l, -w * 1.2}, {l, -w * 1.2}, {l, w * 1.2}}
		case "box":
			local = [][2]float64{{0, w}, {0, -w}, {l, -w}, {l, w}}
		case "diamond":
			local = [][2]float64{{0, 0}, {l / 2, w}, {l, 0}, {l / 2, -w}}
		case "dot":
			r := l / 2
			for k := range 24 {
				t := 2 * math.Pi * float64(k) / 24
				local = append(local, [2]float64{r + r*math.Cos(t), r * math.Sin(t)})
			}
		}
		switch p.side {
		case 'l':
			local = clipHalf(local, 1)
		case 'r':
			local = clipHalf(local, -1)
		}
		if len(local) >= 3 {
			poly := make([][2]float64, len(local))
			for i, q := range local {
				a, b := q[0]+at, q[1]
				poly[i] = [2]float64{x - ux*a + lx*b, y - uy*a + ly*b}
			}
			polys = append(polys, poly)
			filled = append(filled, !p.open)
		}
		at += l
	}
	return polys, filled, at
}

// clipHalf keeps the part of a polygon with sign*b >= 0 (one convex
// half-plane clip, after Sutherland and Hodgman 1974).
func clipHalf(poly [][2]float64, sign float64) [][2]float64 {
	var out [][2]float64
	for i := range poly {
		p, q := poly[i], poly[(i+1)%len(poly)]
		pin, qin := sign*p[1] >= 0, sign*q[1] >= 0
		if pin {
			out = append(out, p)
		}
		if pin != qin {
			t := p[1] / (p[1] - q[1])
			out = append(out, [2]float64{p[0] + t*(q[0]-p[0]), 0})
		}
	}
	return out
}

// arrowSize reads arrowsize: a number from 0 to below 100, default 1.
func arrowSize(s string, set bool) float64 {
	if set {
		if v, err := strconv.ParseFloat(strings.TrimSpace(s), 64); err == nil && v >= 0 && v < 100 {
			return v
		}
	}
	return 1
}

// num formats a coordinate with at most two decimals.
func num(v float64) string {
	v = math.Round(v*100) / 100
	if v == 0 {
		v = 0 // no "-0"
	}
	return strconv.FormatFloat(v, 'f', -1, 64)
}
