package main

import (
	"time"

	"github.com/gridwood/gridwood/cmd/gridwood/report"
	"github.com/gridwood/gridwood/dotio"
	"github.com/gridwood/gridwood/place"
	"github.com/gridwood/gridwood/place/frame"
	"github.com/gridwood/gridwood/place/geomcheck"
	"github.com/gridwood/gridwood/place/quality"
)

// graphMeasures fills a report record from one laid-out graph.
func graphMeasures(g *dotio.Graph, gi int, method string, res *place.Result, sp *place.Placed, boxes place.Boxes, spaceTime time.Duration) report.Graph {
	r := report.Graph{
		Graph: g.Name, Directed: g.Directed, Nodes: len(g.Nodes), Edges: len(g.Edges),
		RemovedEdges: len(res.Removed), RemovedPairs: res.RemovedPairs, RemovalOptimal: res.Optimal,
		Method: method, Components: len(res.Components), TutteComponents: sp.Tutte,
		ConvexComponents: convexCount(res) + sp.Convex, TreeComponents: sp.Trees, FaceCountComponents: sp.FaceCounts, RelaxedComponents: sp.Relaxed, UncheckedComponents: sp.Unchecked, CrowdedComponents: sp.Crowded,
		ReadableComponents: sp.Readable, UnrefinedComponents: sp.Unrefined.Total(),
		GridWidth: res.Width, GridHeight: res.Height, Unit: sp.Unit,
		WidthPoints: sp.Width, HeightPoints: sp.Height,
	}
	why := sp.Unrefined
	r.UnrefinedWhy = report.Unrefined{TooLarge: why.TooLarge, Crowded: why.Crowded, Area: why.Area, Stress: why.Stress}
	if n := int64(len(g.Nodes)); n >= 3 {
		r.AreaRatio = float64(res.Width*res.Height) / float64((n-2)*(n-2))
	}
	var full, compacted int64 // grid area, width x height, as area_ratio
	for _, c := range res.Components {
		full += c.FullW * c.FullH
		compacted += c.W * c.H
	}
	if full > 0 {
		r.CompactionSaved = 1 - float64(compacted)/float64(full)
	}
	kept := res.Kept()
	q := quality.MeasureExtremes(sp.X, sp.Y, kept)
	r.MinAngle, r.EdgeLengthRatio = q.MinAngle, q.EdgeRatio
	if q.MinVertexEdge >= 0 {
		d := q.MinVertexEdge / float64(sp.Unit)
		r.MinVertexEdge = &d
	}
	pts := make([]geomcheck.Point, len(sp.X))
	for i := range pts {
		pts[i] = geomcheck.Point{X: sp.X[i], Y: sp.Y[i]}
	}
	if o, err := geomcheck.BoxOverlaps(pts, boxes.HalfW, boxes.HalfH); err == nil {
		r.BoxOverlaps = len(o)
	}
	if t, err := geomcheck.EdgeThroughBox(pts, boxes.HalfW, boxes.HalfH, kept); err == nil {
		// t lists (node, edge) pairs; count the edges.
		edges := map[int]bool{}
		for _, p := range t {
			edges[p[1]] = true
		}
		r.EdgesThroughBoxes = len(edges)
	}
	r.Seconds.Planarize = res.Times.Planarize.Seconds()
	r.Seconds.Layout = res.Times.Layout.Seconds()
	r.Seconds.Space = spaceTime.Seconds()
	return r
}

// addStructure adds the measures of what the DOT says about structure
// (clusters, a digraph's flow) and the readability measures of package
// quality, all on the kept edges.
func addStructure(r *report.Graph, g *dotio.Graph, removed []bool, sp *place.Placed, ci *clusterInfo, res *place.Result) error {
	if ci != nil {
		r.Clusters = len(ci.set.Clusters)
		c, err := frame.Measure(ci.tree, ci.nodes, ci.frames)
		if err != nil {
			return err
		}
		r.ClusterIntrusions, r.FrameOverlaps = c.Intrusions, c.Overlaps
	}
	if g.Directed {
		c, err := flowCounts(g, removed, sp.X, sp.Y)
		if err != nil {
			return err
		}
		r.FlowAlong, r.FlowAgainst, r.FlowOnCycles = &c.Along, &c.Against, &c.OnCycles
	}
	x, y := make([]float64, len(sp.X)), make([]float64, len(sp.Y))
	for v := range x {
		x[v], y[v] = float64(sp.X[v]), float64(sp.Y[v])
	}
	q := quality.Measure(x, y, res.Kept())
	r.Stress, r.EdgeLengthCV, r.AngularResolution = q.Stress, q.EdgeCV, q.AngularResolution
	return nil
}

func convexCount(res *place.Result) int {
	n := 0
	for _, c := range res.Components {
		if c.Convex {
			n++
		}
	}
	return n
}
