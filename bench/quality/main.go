// Command quality lays out a fixed corpus (the shipped examples and seeded
// generated graphs) with each drawing method and prints the quality figures
// as a Markdown table, for README.md ("barycentric", "convex", "face
// counts" and "layered tree" name the drawings some components were taken
// from, "relaxed" those relaxed after; see README, Spacing):
//
//	go build -o /tmp/gridwood ./cmd/gridwood
//	go run ./bench/quality /tmp/gridwood
package main

import (
	"bytes"
	"encoding/json"
	"fmt"
	"os"
	"os/exec"
	"path/filepath"

	"github.com/gridwood/gridwood/internal/graphgen"
)

type report struct {
	Files []struct {
		Graphs []struct {
			Graph           string   `json:"graph"`
			Nodes           int      `json:"nodes"`
			Edges           int      `json:"edges"`
			Removed         int      `json:"removed_edges"`
			Components      int      `json:"components"`
			Bary            int      `json:"barycentric_components"`
			Convex          int      `json:"convex_components"`
			Trees           int      `json:"tree_components"`
			FaceCounts      int      `json:"face_count_components"`
			Relaxed         int      `json:"relaxed_components"`
			AreaRatio       float64  `json:"area_ratio"`
			CompactionSaved float64  `json:"compaction_saved"`
			W               int64    `json:"width_pt"`
			H               int64    `json:"height_pt"`
			MinAngle        float64  `json:"min_angle_deg"`
			EdgeRatio       float64  `json:"edge_length_ratio"`
			MinVE           *float64 `json:"min_vertex_edge_distance"`
			Overlaps        int      `json:"box_overlaps"`
			Through         int      `json:"edges_through_boxes"`
		} `json:"graphs"`
	} `json:"files"`
}

func main() {
	if len(os.Args) != 2 {
		fmt.Fprintln(os.Stderr, "usage: quality GRIDWOOD-BINARY")
		os.Exit(2)
	}
	bin := os.Args[1]
	dir, err := os.MkdirTemp("", "gridwood-quality")
	if err != nil {
		fail(err)
	}
	defer os.RemoveAll(dir)
	inputs := []string{"examples/campus-fibre.dot", "examples/tram-network.dot", "examples/cottages.dot"}
	for _, g := range []graphgen.Graph{
		graphgen.Grid(10, 10), graphgen.TriangulatedGrid(8, 8), graphgen.Wheel(20),
		graphgen.RandomTree(50, 1), graphgen.RandomPlanar(200, 0.6, 1), graphgen.RandomMaximalPlanar(100, 1),
		graphgen.NestedTriangles(10), graphgen.Dodecahedron(), graphgen.RandomGnm(60, 150, 1),
	} {
		p := filepath.Join(dir, g.Name+".dot")
		var b bytes.Buffer
		graphgen.WriteDOT(&b, g)
		if err := os.WriteFile(p, b.Bytes(), 0o644); err != nil {
			fail(err)
		}
		inputs = append(inputs, p)
	}
	fmt.Println("| graph | method | nodes | edges | removed | grid area / (n-2)^2 | saved by compaction | size (pt) | smallest angle | longest / shortest edge | closest node to an edge (base units) | box overlaps | edges through boxes |")
	fmt.Println("| --- | --- | --- | --- | --- | --- | --- | --- | --- | --- | --- | --- | --- |")
	for _, in := range inputs {
		for _, m := range []struct {
			name string
			args []string
		}{
			{"schnyder", nil},
			{"schnyder --grid", []string{"--grid"}},
			{"convex", []string{"--method", "convex"}},
		} {
			rp := filepath.Join(dir, "r.json")
			args := append([]string{"-q", "--report", rp}, m.args...)
			args = append(args, in)
			cmd := exec.Command(bin, args...)
			cmd.Stdout = nil
			if out, err := cmd.CombinedOutput(); err != nil {
				fail(fmt.Errorf("%s %v: %v\n%s", bin, args, err, out))
			}
			data, err := os.ReadFile(rp)
			if err != nil {
				fail(err)
			}
			var r report
			if err := json.Unmarshal(data, &r); err != nil {
				fail(err)
			}
			for _, g := range r.Files[0].Graphs {
				ve := "n/a"
				if g.MinVE != nil {
					ve = fmt.Sprintf("%.2f", *g.MinVE)
				}
				method := m.name
				switch {
				case m.name == "convex" && g.Convex == 0 && g.Relaxed > 0:
					method += fmt.Sprintf(" (fell back, %d of %d relaxed)", g.Relaxed, g.Components)
				case g.Relaxed > 0:
					method += fmt.Sprintf(" (%d of %d relaxed)", g.Relaxed, g.Components)
				case g.Convex > 0:
					method += fmt.Sprintf(" (%d of %d convex)", g.Convex, g.Components)
				case g.Trees > 0:
					method += " (layered tree)"
				case g.FaceCounts > 0:
					method += fmt.Sprintf(" (%d of %d by face counts)", g.FaceCounts, g.Components)
				case m.name == "convex":
					method += " (fell back)"
				case g.Bary > 0:
					method += " (barycentric)"
				}
				fmt.Printf("| %s | %s | %d | %d | %d | %.2f | %.0f%% | %d x %d | %.1f° | %.1f | %s | %d | %d |\n",
					g.Graph, method, g.Nodes, g.Edges, g.Removed,
					g.AreaRatio, 100*g.CompactionSaved, g.W, g.H, g.MinAngle, g.EdgeRatio, ve, g.Overlaps, g.Through)
			}
		}
	}
}

func fail(err error) {
	fmt.Fprintln(os.Stderr, "quality:", err)
	os.Exit(1)
}
