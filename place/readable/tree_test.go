package readable_test

import (
	"testing"

	"github.com/gridwood/gridwood/internal/graphgen"
	"github.com/gridwood/gridwood/place/readable"
)

// TestTreeNearItsStressLayout: a tree can be drawn plane with any order
// of children, so its readable drawing should come close to the
// unconstrained stress layout (the stage's own reference). Measured: the
// radial candidate's stress is 0.999 times the reference's on this
// random 1,000-node tree; before that candidate, the quality benchmark's
// 1,000-node tree was drawn from the reference's embedding made plane
// (nearPlane) at 1.38 times, with knots where subtrees crossed. Plane by
// geomcheck.
func TestTreeNearItsStressLayout(t *testing.T) {
	out, kept := drawFromGrid(t, graphgen.RandomTree(1000, 3))
	stress := map[string]float64{}
	for _, p := range out.Phases {
		stress[p.Name] = p.Stress
	}
	for _, p := range out.Phases {
		t.Logf("%s: stress %.4g, %.3f times the reference", p.Name, p.Stress, p.Stress/stress["reference"])
	}
	if out.Chosen != "radial" {
		t.Errorf("chose %q, want radial (phases %+v)", out.Chosen, out.Phases)
	}
	if r := stress["radial"] / stress["reference"]; !(r < 1.1) {
		t.Errorf("radial candidate's stress %.4g is %.3f times the reference's", stress["radial"], r)
	}
	if problems := readable.Problems(t, out.X, out.Y, kept); problems > 0 {
		t.Errorf("%d crossings or touchings", problems)
	}
}
