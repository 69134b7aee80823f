package main

import (
	"bytes"
	"fmt"
	"strings"

	"github.com/gridwood/gridwood/dotio"
	"github.com/gridwood/gridwood/place"
	"github.com/gridwood/gridwood/planarize"
)

// writeExplain writes, for every graph, an undirected DOT graph holding one
// subgraph per removed edge: a Kuratowski subgraph made of that edge and
// kept edges, with its type and branch vertices as attributes, and its
// paths as edge chains. Certificates whose search ran out of its work
// bound say so instead. A planar graph gets an empty graph, as in the
// --removed file, so that the file is DOT with one graph per input graph.
func writeExplain(w *bytes.Buffer, f *dotio.File, results []*place.Result, total *planarize.Budget) {
	for gi, g := range f.Graphs {
		res := results[gi]
		id := g.ID
		if id == "" {
			id = dotio.QuoteText(fmt.Sprintf("anonymous %d", gi+1))
		}
		fmt.Fprintf(w, "graph %s {\n", id)
		cache := map[[2]int32]*planarize.Kuratowski{}
		for k, i := range res.Removed {
			e := g.Edges[i]
			line, col := g.EdgePos(i)
			fmt.Fprintf(w, "\tsubgraph %s {\n", dotio.QuoteText(fmt.Sprintf("removed %d", k+1)))
			edgeText := g.Nodes[e.From].Name + " -- " + g.Nodes[e.To].Name
			fmt.Fprintf(w, "\t\tgraph [removed_edge=%s, at=%s", dotio.QuoteText(edgeText), dotio.QuoteText(fmt.Sprintf("%s:%d:%d", f.Name, line, col)))
			key := [2]int32{min(e.From, e.To), max(e.From, e.To)}
			ks, seen := cache[key]
			if !seen {
				budget := &planarize.Budget{Left: min(explainBudgetEach, total.Left)}
				before := budget.Left
				if budget.Left > 0 {
					ks, _ = res.Explain(i, budget)
				}
				total.Left -= before - max(budget.Left, 0)
				cache[key] = ks
			}
			if ks == nil {
				fmt.Fprintf(w, ", obstruction=\"not computed\", reason=\"work bound reached\"]\n\t}\n")
				continue
			}
			names := make([]string, len(ks.Branch))
			for j, v := range ks.Branch {
				names[j] = g.Nodes[v].Name
			}
			fmt.Fprintf(w, ", obstruction=%s, branch=%s]\n", dotio.QuoteText(ks.Kind.String()), dotio.QuoteText(strings.Join(names, ", ")))
			for _, path := range ks.Paths {
				ids := make([]string, len(path))
				for j, v := range path {
					ids[j] = g.Nodes[v].ID
				}
				fmt.Fprintf(w, "\t\t%s\n", strings.Join(ids, " -- "))
			}
			fmt.Fprintf(w, "\t}\n")
		}
		fmt.Fprintf(w, "}\n")
	}
}
