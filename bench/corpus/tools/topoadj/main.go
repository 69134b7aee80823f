// Command topoadj reads a TopoJSON topology and writes the adjacency graph
// of one of its geometry collections as an undirected DOT graph.
//
// Two regions are adjacent when both use the same arc of the topology (an
// arc index in either direction, ~i standing for arc i reversed). Arcs used
// by one region only (coasts, borders with regions left out) make no edge.
// Nodes and edges are printed sorted by name, so the same input gives the
// same bytes.
//
// Usage:
//
//	topoadj -object NAME [-exclude P1,P2] [-node id|usps]
//	        [-label none|name|county] [-drop-isolated] [-graph NAME]
//	        [-o FILE] TOPOJSON
//
// -object picks the geometry collection under "objects". -exclude drops
// every geometry whose id starts with one of the listed prefixes. -node id
// names a node by the geometry's id (or by its "name" property when it has
// no id); -node usps names it by the U.S. postal abbreviation of its
// two-digit state FIPS id. -label name copies the "name" property into the
// label; -label county writes "Name, ST" with ST the postal abbreviation of
// the first two digits of a county's FIPS id. -drop-isolated leaves out
// regions that have no neighbour. The output is written whole or not at all.
package main

import (
	"bytes"
	"encoding/json"
	"errors"
	"flag"
	"fmt"
	"io"
	"os"
	"path/filepath"
	"sort"
	"strconv"
	"strings"
)

// usState is one row of the state FIPS table. The codes and names agree
// with the FIPS 5-2 state codes and the USPS abbreviations (from memory;
// the names are checked against the topology's own "states" collection
// when it has one).
type usState struct {
	fips, usps, name string
}

var usStates = []usState{
	{"01", "AL", "Alabama"}, {"02", "AK", "Alaska"}, {"04", "AZ", "Arizona"},
	{"05", "AR", "Arkansas"}, {"06", "CA", "California"}, {"08", "CO", "Colorado"},
	{"09", "CT", "Connecticut"}, {"10", "DE", "Delaware"},
	{"11", "DC", "District of Columbia"}, {"12", "FL", "Florida"},
	{"13", "GA", "Georgia"}, {"15", "HI", "Hawaii"}, {"16", "ID", "Idaho"},
	{"17", "IL", "Illinois"}, {"18", "IN", "Indiana"}, {"19", "IA", "Iowa"},
	{"20", "KS", "Kansas"}, {"21", "KY", "Kentucky"}, {"22", "LA", "Louisiana"},
	{"23", "ME", "Maine"}, {"24", "MD", "Maryland"},
	{"25", "MA", "Massachusetts"}, {"26", "MI", "Michigan"},
	{"27", "MN", "Minnesota"}, {"28", "MS", "Mississippi"},
	{"29", "MO", "Missouri"}, {"30", "MT", "Montana"}, {"31", "NE", "Nebraska"},
	{"32", "NV", "Nevada"}, {"33", "NH", "New Hampshire"},
	{"34", "NJ", "New Jersey"}, {"35", "NM", "New Mexico"},
	{"36", "NY", "New York"}, {"37", "NC", "North Carolina"},
	{"38", "ND", "North Dakota"}, {"39", "OH", "Ohio"}, {"40", "OK", "Oklahoma"},
	{"41", "OR", "Oregon"}, {"42", "PA", "Pennsylvania"},
	{"44", "RI", "Rhode Island"}, {"45", "SC", "South Carolina"},
	{"46", "SD", "South Dakota"}, {"47", "TN", "Tennessee"}, {"48", "TX", "Texas"},
	{"49", "UT", "Utah"}, {"50", "VT", "Vermont"}, {"51", "VA", "Virginia"},
	{"53", "WA", "Washington"}, {"54", "WV", "West Virginia"},
	{"55", "WI", "Wisconsin"}, {"56", "WY", "Wyoming"},
	{"60", "AS", "American Samoa"}, {"66", "GU", "Guam"},
	{"69", "MP", "Commonwealth of the Northern Mariana Islands"},
	{"72", "PR", "Puerto Rico"}, {"78", "VI", "United States Virgin Islands"},
}

// geometry is a TopoJSON geometry object; Arcs stays raw because its depth
// depends on the type.
type geometry struct {
	Type       string          `json:"type"`
	ID         json.RawMessage `json:"id"`
	Properties map[string]any  `json:"properties"`
	Arcs       json.RawMessage `json:"arcs"`
	Geometries []geometry      `json:"geometries"`
}

type topology struct {
	Type    string              `json:"type"`
	Objects map[string]geometry `json:"objects"`
	Arcs    []json.RawMessage   `json:"arcs"`
}

type options struct {
	object       string
	exclude      []string
	node         string
	label        string
	dropIsolated bool
	graph        string
}

// region is one kept geometry of the collection.
type region struct {
	name  string // node name
	label string // "" for none
	arcs  []int  // distinct arc indices, sorted
}

func main() {
	var opt options
	var exclude, out string
	flag.StringVar(&opt.object, "object", "", "geometry collection to read (required)")
	flag.StringVar(&exclude, "exclude", "", "comma-separated id prefixes to leave out")
	flag.StringVar(&opt.node, "node", "id", "node names: id or usps")
	flag.StringVar(&opt.label, "label", "none", "labels: none, name or county")
	flag.BoolVar(&opt.dropIsolated, "drop-isolated", false, "leave out regions without a neighbour")
	flag.StringVar(&opt.graph, "graph", "", "graph name (default: the object name)")
	flag.StringVar(&out, "o", "", "output file (default: standard output)")
	flag.Parse()
	if flag.NArg() != 1 || opt.object == "" {
		fmt.Fprintln(os.Stderr, "usage: topoadj -object NAME [flags] TOPOJSON")
		flag.PrintDefaults()
		os.Exit(2)
	}
	if exclude != "" {
		opt.exclude = strings.Split(exclude, ",")
	}
	if opt.graph == "" {
		opt.graph = opt.object
	}
	if err := run(flag.Arg(0), out, opt, os.Stderr); err != nil {
		fmt.Fprintln(os.Stderr, "topoadj:", err)
		os.Exit(1)
	}
}

// run reads the topology in, writes the graph to out (standard output when
// empty) and a one-line summary to log.
func run(in, out string, opt options, log io.Writer) error {
	data, err := os.ReadFile(in)
	if err != nil {
		return err
	}
	var topo topology
	if err := json.Unmarshal(data, &topo); err != nil {
		return fmt.Errorf("%s: %v", in, err)
	}
	if topo.Type != "Topology" {
		return fmt.Errorf("%s: type is %q, want \"Topology\"", in, topo.Type)
	}
	if err := checkStates(topo); err != nil {
		return fmt.Errorf("%s: %v", in, err)
	}
	regions, err := collect(topo, opt)
	if err != nil {
		return fmt.Errorf("%s: %v", in, err)
	}
	edges, crowded := adjacency(regions)
	var buf bytes.Buffer
	nodes, nedges := writeDOT(&buf, regions, edges, opt)
	fmt.Fprintf(log, "topoadj: %s: %d nodes, %d edges", opt.graph, nodes, nedges)
	if crowded > 0 {
		fmt.Fprintf(log, ", %d arcs shared by more than two regions", crowded)
	}
	fmt.Fprintln(log)
	if out == "" {
		_, err := os.Stdout.Write(buf.Bytes())
		return err
	}
	return writeWhole(out, buf.Bytes())
}

// writeWhole writes through a temporary file in the same directory and
// renames it, so a failed run leaves any earlier file as it was.
func writeWhole(path string, data []byte) error {
	tmp, err := os.CreateTemp(filepath.Dir(path), ".topoadj-*")
	if err != nil {
		return err
	}
	if _, err := tmp.Write(data); err != nil {
		tmp.Close()
		os.Remove(tmp.Name())
		return err
	}
	if err := tmp.Close(); err != nil {
		os.Remove(tmp.Name())
		return err
	}
	if err := os.Chmod(tmp.Name(), 0o644); err != nil {
		os.Remove(tmp.Name())
		return err
	}
	return os.Rename(tmp.Name(), path)
}

// checkStates compares the state table with the topology's "states"
// collection, when there is one, so a wrong row is caught by the data.
func checkStates(topo topology) error {
	states, ok := topo.Objects["states"]
	if !ok {
		return nil
	}
	byFIPS := make(map[string]string, len(usStates))
	for _, s := range usStates {
		byFIPS[s.fips] = s.name
	}
	for _, g := range states.Geometries {
		id, err := idString(g.ID)
		if err != nil || id == "" {
			continue
		}
		name, _ := g.Properties["name"].(string)
		if want, ok := byFIPS[id]; ok && want != name {
			return fmt.Errorf("state %s is %q in the topology but %q in the table", id, name, want)
		}
	}
	return nil
}

func usps(fips string) (string, error) {
	for _, s := range usStates {
		if s.fips == fips {
			return s.usps, nil
		}
	}
	return "", fmt.Errorf("no postal abbreviation for state FIPS %q", fips)
}

// idString returns a geometry id as text: a JSON string as is, a number as
// written; "" when there is none.
func idString(raw json.RawMessage) (string, error) {
	if len(raw) == 0 || string(raw) == "null" {
		return "", nil
	}
	var s string
	if err := json.Unmarshal(raw, &s); err == nil {
		return s, nil
	}
	var n json.Number
	if err := json.Unmarshal(raw, &n); err != nil {
		return "", fmt.Errorf("id %s is neither a string nor a number", raw)
	}
	return n.String(), nil
}

func collect(topo topology, opt options) ([]region, error) {
	obj, ok := topo.Objects[opt.object]
	if !ok {
		return nil, fmt.Errorf("no object %q", opt.object)
	}
	if obj.Type != "GeometryCollection" {
		return nil, fmt.Errorf("object %q is a %s, want a GeometryCollection", opt.object, obj.Type)
	}
	var regions []region
	seen := make(map[string]bool)
	for i, g := range obj.Geometries {
		id, err := idString(g.ID)
		if err != nil {
			return nil, fmt.Errorf("%s geometry %d: %v", opt.object, i, err)
		}
		if excluded(id, opt.exclude) {
			continue
		}
		name, _ := g.Properties["name"].(string)
		var r region
		switch opt.node {
		case "id":
			r.name = id
			if r.name == "" {
				r.name = name
			}
		case "usps":
			if r.name, err = usps(id); err != nil {
				return nil, fmt.Errorf("%s geometry %d: %v", opt.object, i, err)
			}
		default:
			return nil, fmt.Errorf("unknown -node %q", opt.node)
		}
		if r.name == "" {
			return nil, fmt.Errorf("%s geometry %d has neither id nor name", opt.object, i)
		}
		if seen[r.name] {
			return nil, fmt.Errorf("%s: two geometries named %q", opt.object, r.name)
		}
		seen[r.name] = true
		switch opt.label {
		case "none":
		case "name":
			r.label = name
		case "county":
			if len(id) < 2 {
				return nil, fmt.Errorf("%s geometry %d: id %q is not a county FIPS code", opt.object, i, id)
			}
			st, err := usps(id[:2])
			if err != nil {
				return nil, fmt.Errorf("%s geometry %d: %v", opt.object, i, err)
			}
			r.label = name + ", " + st
		default:
			return nil, fmt.Errorf("unknown -label %q", opt.label)
		}
		set := make(map[int]bool)
		if err := arcsOf(g, len(topo.Arcs), set); err != nil {
			return nil, fmt.Errorf("%s geometry %d (%s): %v", opt.object, i, r.name, err)
		}
		for a := range set {
			r.arcs = append(r.arcs, a)
		}
		sort.Ints(r.arcs)
		regions = append(regions, r)
	}
	return regions, nil
}

func excluded(id string, prefixes []string) bool {
	for _, p := range prefixes {
		if p != "" && strings.HasPrefix(id, p) {
			return true
		}
	}
	return false
}

// arcsOf adds to set every arc index a geometry uses, reversed indices
// (~i) folded onto i.
func arcsOf(g geometry, narcs int, set map[int]bool) error {
	switch g.Type {
	case "GeometryCollection":
		for _, sub := range g.Geometries {
			if err := arcsOf(sub, narcs, set); err != nil {
				return err
			}
		}
		return nil
	case "Point", "MultiPoint", "":
		return nil
	case "LineString", "MultiLineString", "Polygon", "MultiPolygon":
	default:
		return fmt.Errorf("unknown geometry type %q", g.Type)
	}
	var tree any
	dec := json.NewDecoder(bytes.NewReader(g.Arcs))
	dec.UseNumber()
	if err := dec.Decode(&tree); err != nil {
		return fmt.Errorf("arcs: %v", err)
	}
	if _, err := dec.Token(); !errors.Is(err, io.EOF) {
		return errors.New("arcs: trailing data")
	}
	return walkArcs(tree, narcs, set)
}

func walkArcs(v any, narcs int, set map[int]bool) error {
	switch v := v.(type) {
	case []any:
		for _, e := range v {
			if err := walkArcs(e, narcs, set); err != nil {
				return err
			}
		}
		return nil
	case json.Number:
		i, err := strconv.Atoi(v.String())
		if err != nil {
			return fmt.Errorf("arc index %s is not an integer", v)
		}
		if i < 0 {
			i = ^i
		}
		if i >= narcs {
			return fmt.Errorf("arc index %d out of range (%d arcs)", i, narcs)
		}
		set[i] = true
		return nil
	default:
		return fmt.Errorf("arcs hold %T, want arrays of integers", v)
	}
}

// adjacency returns the pairs of regions (indices, lower first, sorted)
// that share an arc, and how many arcs are shared by more than two.
func adjacency(regions []region) ([][2]int, int) {
	users := make(map[int][]int)
	for ri, r := range regions {
		for _, a := range r.arcs {
			users[a] = append(users[a], ri)
		}
	}
	pairs := make(map[[2]int]bool)
	crowded := 0
	for _, us := range users {
		if len(us) > 2 {
			crowded++
		}
		for i := 0; i < len(us); i++ {
			for j := i + 1; j < len(us); j++ {
				a, b := us[i], us[j]
				if a > b {
					a, b = b, a
				}
				pairs[[2]int{a, b}] = true
			}
		}
	}
	edges := make([][2]int, 0, len(pairs))
	for p := range pairs {
		edges = append(edges, p)
	}
	return edges, crowded
}

// writeDOT prints the graph with nodes sorted by name and edges sorted by
// their end names (lesser end first), and returns the counts printed.
func writeDOT(w *bytes.Buffer, regions []region, edges [][2]int, opt options) (int, int) {
	degree := make([]int, len(regions))
	named := make([][2]string, len(edges))
	for i, e := range edges {
		degree[e[0]]++
		degree[e[1]]++
		a, b := regions[e[0]].name, regions[e[1]].name
		if a > b {
			a, b = b, a
		}
		named[i] = [2]string{a, b}
	}
	sort.Slice(named, func(i, j int) bool {
		if named[i][0] != named[j][0] {
			return named[i][0] < named[j][0]
		}
		return named[i][1] < named[j][1]
	})
	order := make([]int, 0, len(regions))
	for i := range regions {
		if opt.dropIsolated && degree[i] == 0 {
			continue
		}
		order = append(order, i)
	}
	sort.Slice(order, func(i, j int) bool { return regions[order[i]].name < regions[order[j]].name })

	fmt.Fprintf(w, "graph %s {\n", quote(opt.graph))
	for _, i := range order {
		r := regions[i]
		if r.label != "" {
			fmt.Fprintf(w, "\t%s [label=%s];\n", quote(r.name), quote(r.label))
		} else {
			fmt.Fprintf(w, "\t%s;\n", quote(r.name))
		}
	}
	for _, e := range named {
		fmt.Fprintf(w, "\t%s -- %s;\n", quote(e[0]), quote(e[1]))
	}
	w.WriteString("}\n")
	return len(order), len(named)
}

// quote makes a DOT quoted string; only the quote and backslash need
// escaping there.
func quote(s string) string {
	s = strings.ReplaceAll(s, `\`, `\\`)
	return `"` + strings.ReplaceAll(s, `"`, `\"`) + `"`
}
