package adapt

import (
	"context"
	"math"
	"testing"

	"polegap/models"
	"polegap/post/internal/fixture"
	"polegap/post/study"
	"polegap/solver"
)

func core(t *testing.T, size float64, order int) *models.Model {
	return fixture.SmallCore(t, "{mu-r: 1000}", size, order)
}

// TestReachesAccuracy: starting from a coarse first-order mesh, the loop
// stops when the gap field changes by less than 1e-4 between rounds, and
// its answer then agrees with a reference on a much finer second-order
// mesh (about 90k nodes) within 3e-4: the stopping rule's change is an
// estimate of the remaining error, not a bound (the sequence converges
// geometrically, so the error is about the last change again), and the
// reference itself carries about 1e-5. The global energy-norm estimate
// must fall from round to round.
func TestReachesAccuracy(t *testing.T) {
	for _, mk := range []Marking{GoalOriented, Energy} {
		m := core(t, 20, 1)
		res, err := Run(context.Background(), m, Options{Accuracy: 1e-4, Marking: mk, MaxRounds: 6})
		if err != nil {
			t.Fatal(err)
		}
		if !res.Converged {
			t.Fatalf("marking %d: not converged in %d rounds: %+v", mk, len(res.Rounds), res.Rounds)
		}
		for i := 1; i < len(res.Rounds); i++ {
			if !(res.Rounds[i].Estimate < res.Rounds[i-1].Estimate) || !(res.Rounds[i].Nodes > res.Rounds[i-1].Nodes) {
				t.Errorf("marking %d round %d: estimate %g after %g, nodes %d after %d", mk, i,
					res.Rounds[i].Estimate, res.Rounds[i-1].Estimate, res.Rounds[i].Nodes, res.Rounds[i-1].Nodes)
			}
		}
		_, want := reference(t, core(t, 4, 2))
		got := res.Rounds[len(res.Rounds)-1].Value
		if math.Abs(got-want) > 3e-4*want {
			t.Errorf("marking %d: adaptive %g T, reference %g T (rel. %.1e)", mk, got, want, math.Abs(got-want)/want)
		}
	}
}

// reference solves m (a fine reference mesh) and returns the study and its
// probe field, the quantity the adaptive loop converges.
func reference(t *testing.T, m *models.Model) (*study.Result, float64) {
	t.Helper()
	ref, err := study.Run(m, study.Options{})
	if err != nil {
		t.Fatal(err)
	}
	q, err := FieldAt(ref.Model)
	if err != nil {
		t.Fatal(err)
	}
	want, err := q(ref)
	if err != nil {
		t.Fatal(err)
	}
	return ref, want
}

// Nested iteration: on a saturating core every round after the first
// starts Newton from the last round's solution interpolated to its mesh,
// and needs fewer steps than the first round's solve from zero; the
// answer is the one a solve from zero gives on the same mesh, within the
// solver's tolerances (relative residual 1e-8: 1e-9 relative in the field
// is far inside them and far below the 1e-4 asked for).
func TestNestedIterationRounds(t *testing.T) {
	m := fixture.SmallCore(t, "{curve: low-carbon-steel}", 20, 2)
	res, err := Run(context.Background(), m, Options{Accuracy: 1e-4, Marking: Energy, MaxRounds: 4})
	if err != nil {
		t.Fatal(err)
	}
	if len(res.Rounds) < 2 {
		t.Fatalf("one round only: %+v", res.Rounds)
	}
	for i, r := range res.Rounds {
		t.Logf("round %d: %d nodes, %d Newton steps", i, r.Nodes, r.Iterations)
		if i > 0 && r.Iterations >= res.Rounds[0].Iterations {
			t.Errorf("round %d: %d Newton steps from the interpolated start, %d from zero on the first mesh", i, r.Iterations, res.Rounds[0].Iterations)
		}
	}
	cold, err := res.Study.Study.SolveAt(study.Params{}, solver.Options{})
	if err != nil {
		t.Fatal(err)
	}
	q, err := FieldAt(m)
	if err != nil {
		t.Fatal(err)
	}
	want, err := q(cold)
	if err != nil {
		t.Fatal(err)
	}
	got := res.Rounds[len(res.Rounds)-1].Value
	t.Logf("from zero on the last mesh: %d Newton steps, %.12f T; nested %.12f T", cold.Solution.Iterations, want, got)
	if math.Abs(got-want) > 1e-9*want {
		t.Errorf("nested %.12g T, from zero %.12g T", got, want)
	}
}
