package report

import (
	"encoding/json"
	"io"
)

// Document is the whole --report file.
type Document struct {
	Files []File `json:"files"`
}

// File is the record of one input file.
type File struct {
	File         string  `json:"file"`
	ReadSeconds  float64 `json:"read_seconds"`
	WriteSeconds float64 `json:"write_seconds"`
	Graphs       []Graph `json:"graphs"`
}

// Graph is the record of one graph: its size, what was set aside, how each
// component was drawn, and measures of the drawing on the kept edges.
type Graph struct {
	Graph               string    `json:"graph"`
	Directed            bool      `json:"directed"`
	Nodes               int       `json:"nodes"`
	Edges               int       `json:"edges"`
	RemovedEdges        int       `json:"removed_edges"`
	RemovedPairs        int       `json:"removed_pairs"`
	RemovalOptimal      bool      `json:"removal_optimal"`
	Method              string    `json:"method"`
	Components          int       `json:"components"`
	TutteComponents     int       `json:"tutte_components"`
	ConvexComponents    int       `json:"convex_components"`
	TreeComponents      int       `json:"tree_components"`
	FaceCountComponents int       `json:"face_count_components"`
	RelaxedComponents   int       `json:"relaxed_components"`
	UncheckedComponents int       `json:"unchecked_components"`
	CrowdedComponents   int       `json:"crowded_components"`
	ReadableComponents  int       `json:"readable_components"`
	UnrefinedComponents int       `json:"unrefined_components"`
	UnrefinedWhy        Unrefined `json:"unrefined_why"`
	GridWidth           int64     `json:"grid_width"`
	GridHeight          int64     `json:"grid_height"`
	AreaRatio           float64   `json:"area_ratio"`
	CompactionSaved     float64   `json:"compaction_saved"`
	Unit                int64     `json:"unit"`
	WidthPoints         int64     `json:"width_pt"`
	HeightPoints        int64     `json:"height_pt"`
	MinAngle            float64   `json:"min_angle_deg"`
	EdgeLengthRatio     float64   `json:"edge_length_ratio"`
	MinVertexEdge       *float64  `json:"min_vertex_edge_distance"`
	BoxOverlaps         int       `json:"box_overlaps"`
	EdgesThroughBoxes   int       `json:"edges_through_boxes"`
	Seconds             Seconds   `json:"seconds"`
	Clusters            int       `json:"clusters"`
	ClusterIntrusions   int64     `json:"cluster_intrusions"`
	FrameOverlaps       int64     `json:"frame_overlaps"`
	FlowAlong           *int      `json:"flow_along"`
	FlowAgainst         *int      `json:"flow_against"`
	FlowOnCycles        *int      `json:"flow_on_cycles"`
	Stress              float64   `json:"stress"`
	EdgeLengthCV        float64   `json:"edge_length_cv"`
	AngularResolution   float64   `json:"angular_resolution"`
}

// Unrefined counts by reason the components that kept their spaced
// drawing (Graph.UnrefinedComponents is the sum).
type Unrefined struct {
	TooLarge int `json:"too_large"`
	Crowded  int `json:"crowded"`
	Area     int `json:"area"`
	Stress   int `json:"stress"`
}

// Seconds is the time one graph spent in each stage. Times vary from run
// to run; everything else in the document is deterministic.
type Seconds struct {
	Planarize float64 `json:"planarize"`
	Layout    float64 `json:"layout"`
	Space     float64 `json:"space"`
}

// Write writes d as indented JSON followed by a newline.
func Write(w io.Writer, d Document) error {
	enc := json.NewEncoder(w)
	enc.SetIndent("", "  ")
	return enc.Encode(d)
}

// Read decodes a document written by Write.
func Read(r io.Reader) (Document, error) {
	var d Document
	err := json.NewDecoder(r).Decode(&d)
	return d, err
}
