package scan

import (
	"context"
	"errors"
	"fmt"
	"math"
	"slices"
	"strconv"
	"strings"

	"polegap/materials"
	"polegap/models"
	"polegap/post/quantity/gap"
	"polegap/post/study"
	"polegap/post/workflow/adapt"
	"polegap/post/workflow/coil"
	"polegap/post/workflow/design"
	"polegap/post/workflow/sweep"
	"polegap/post/workflow/target"
	"polegap/solver"
)

// Quantity names the columns of a scan table, in order; each is followed
// by its estimate column (the name with "_estimate" before the unit).
var Quantities = []string{"B0_T", "ampere_turns", "half_width_m", "iron_peak_T", "power_W", "iron_kg", "copper_kg"}

// Quantity indices into Row.Q and Row.Est.
const (
	B0 = iota
	AmpereTurns
	HalfWidth
	IronPeak
	Power
	IronMass
	CopperMass
	numQuantities
)

// SteelDensity is the density of the iron for the iron mass: 7850 kg/m³,
// low-carbon steel (common practice; from memory).
const SteelDensity = 7850.0

// Options control a scan.
type Options struct {
	// Params are the scanned parameters, in column order.
	Params []Param
	// Variants are the values of the parameters, one row per variant
	// (Grid, LatinHypercube, or a given list), in the order of Params.
	Variants [][]string
	// Plan says how the variants were made, for the table's header
	// ("grid", "latin hypercube, seed 1", "list FILE").
	Plan string
	// Shard, Shards select the variants of shard k of n (sweep.Select);
	// zero values run all.
	Shard, Shards int

	// Accuracy is the relative accuracy of every solve (0: the model's
	// mesh.accuracy, else design.DefaultAccuracy); Quick solves once on
	// the model's mesh, without estimates.
	Accuracy float64
	Quick    bool
	// Target is the field (T) the target probe must reach for the
	// ampere-turns column; 0 takes the model's target. NoTarget skips the
	// search (the column is NaN, and the power is at the model's own
	// ampere-turns).
	Target   float64
	NoTarget bool
	// Tol is the relative tolerance of the good-field half-width; 0
	// means 1e-4. It must be one of gap.DefaultTolerances.
	Tol float64
	// Coil names the coil of the ampere-turns and the power (default the
	// first); Spec is its winding (cooling, fill, temperature, limits;
	// AmpereTurns and Window are set per variant) and Wires the table of
	// conductors to choose from (nil: coil.DefaultWires(Spec.Cooling)).
	Coil  string
	Spec  coil.Spec
	Wires []coil.Wire

	// Progress, when set, is called after each variant.
	Progress func(done, total int, r Row)
	Solver   solver.Options
}

// Row is one solved variant.
type Row struct {
	Index  int      // position in the full list of variants (0-based)
	Values []string // the parameters' values, as in Options.Params
	// Q are the quantities (Quantities order; NaN when not computed) and
	// Est their error estimates (absolute; 0 when exact, as the masses;
	// NaN when not estimated, as in quick mode).
	Q, Est [numQuantities]float64
	// Reached is true when the solve met its accuracy (false in quick mode).
	Reached bool
	// Winding is the chosen winding: wire, turns and flags ("" if none).
	Winding string
	// Err is why the variant has no quantities, or "".
	Err string
}

// InterruptedError reports a scan stopped by its context; the rows
// finished before it are returned beside it.
type InterruptedError struct {
	Done, Total int
	Err         error
}

func (e *InterruptedError) Error() string {
	return fmt.Sprintf("scan interrupted after %d of %d variants: %v", e.Done, e.Total, e.Err)
}

func (e *InterruptedError) Unwrap() error { return e.Err }

// Source is the model file a scan varies: its name (for messages and
// table-file paths) and its text.
type Source struct {
	File string
	Data []byte
}

// Run solves the variants of the selected shard in order. On a cancelled
// context it returns the finished rows and an *InterruptedError; a
// variant that fails keeps its row with Err set.
func Run(ctx context.Context, src Source, opt Options) ([]Row, error) {
	if err := opt.check(); err != nil {
		return nil, err
	}
	idx := sweep.Select(len(opt.Variants), opt.Shard, opt.Shards)
	rows := make([]Row, 0, len(idx))
	for n, i := range idx {
		if err := ctx.Err(); err != nil {
			return rows, &InterruptedError{Done: n, Total: len(idx), Err: err}
		}
		r, err := Evaluate(ctx, src, opt, i)
		if err != nil {
			return rows, &InterruptedError{Done: n, Total: len(idx), Err: err}
		}
		rows = append(rows, r)
		if opt.Progress != nil {
			opt.Progress(n+1, len(idx), r)
		}
	}
	return rows, nil
}

func (opt *Options) check() error {
	for i, v := range opt.Variants {
		if len(v) != len(opt.Params) {
			return fmt.Errorf("scan: variant %d has %d values for %d parameters", i+1, len(v), len(opt.Params))
		}
	}
	if opt.Tol != 0 && !slices.Contains(gap.DefaultTolerances, opt.Tol) {
		return fmt.Errorf("scan: the good-field tolerance %g is not one the design report measures (%v)", opt.Tol, gap.DefaultTolerances)
	}
	seen := map[string]bool{}
	for _, p := range opt.Params {
		if seen[p.Name] {
			return fmt.Errorf("scan: parameter %s is given twice", p.Name)
		}
		seen[p.Name] = true
	}
	return nil
}

// Model returns the model of variant i and its solve parameters: the
// file values written into src and the study parameters set.
func Model(src Source, opt Options, i int) (*models.Model, study.Params, error) {
	base, err := models.Parse(src.File, src.Data)
	if err != nil {
		return nil, study.Params{}, err
	}
	var set []models.Setting
	type sp struct {
		name string
		v    float64
	}
	var params []sp
	for j, p := range opt.Params {
		v := opt.Variants[i][j]
		switch {
		case strings.HasPrefix(p.Name, "current:"), strings.HasPrefix(p.Name, "turns:"), p.Name == "iron",
			p.Name == "gap" && base.Template == "":
			x, err := strconv.ParseFloat(v, 64)
			if err != nil {
				return nil, study.Params{}, fmt.Errorf("%s: %s = %q is not a number", src.File, p.Name, v)
			}
			params = append(params, sp{p.Name, x})
		case strings.Contains(p.Name, "."), p.Name == "depth", base.Template == "":
			set = append(set, models.Setting{Path: p.Name, Value: v})
		default:
			set = append(set, models.Setting{Path: "dimensions." + p.Name, Value: v})
		}
	}
	m := base
	if len(set) > 0 {
		if m, err = models.ParseWith(src.File, src.Data, set); err != nil {
			return nil, study.Params{}, err
		}
	}
	var sp0 study.Params
	for _, p := range params {
		kind, coilName, _ := strings.Cut(p.name, ":")
		switch kind {
		case "iron":
			sp0.IronScale = p.v
		case "gap":
			sp0.Gap = p.v * m.Scale
		default:
			ci := -1
			for k := range m.Coils {
				if m.Coils[k].Name == coilName {
					ci = k
				}
			}
			if ci < 0 {
				return nil, study.Params{}, fmt.Errorf("%s: parameter %s: no coil named %q", src.File, p.name, coilName)
			}
			if kind == "current" {
				sp0.Currents = grow(sp0.Currents, m, func(c *models.Coil) float64 { return c.Current })
				sp0.Currents[ci] = p.v
			} else {
				sp0.Turns = grow(sp0.Turns, m, func(c *models.Coil) float64 { return c.Turns })
				sp0.Turns[ci] = p.v
			}
		}
	}
	return m, sp0, nil
}

// grow returns v, or the model's own values of every coil when v is nil.
func grow(v []float64, m *models.Model, of func(*models.Coil) float64) []float64 {
	if v != nil {
		return v
	}
	v = make([]float64, len(m.Coils))
	for i := range m.Coils {
		v[i] = of(&m.Coils[i])
	}
	return v
}

// Evaluate solves variant i and returns its row. A variant that cannot
// be built or solved returns a row with Err set and a nil error; the
// error is the context's when it was cancelled.
func Evaluate(ctx context.Context, src Source, opt Options, i int) (Row, error) {
	r := Row{Index: i, Values: opt.Variants[i]}
	for k := range r.Q {
		r.Q[k], r.Est[k] = math.NaN(), math.NaN()
	}
	err := r.evaluate(ctx, src, opt)
	if err != nil {
		if ce := ctx.Err(); ce != nil && errors.Is(err, ce) {
			return r, ce
		}
		if ctx.Err() != nil {
			return r, ctx.Err()
		}
		r.Err = oneLine(err.Error())
	}
	return r, nil
}

func oneLine(s string) string {
	return strings.Join(strings.Fields(s), " ")
}

func (r *Row) evaluate(ctx context.Context, src Source, opt Options) error {
	m, params, err := Model(src, opt, r.Index)
	if err != nil {
		return err
	}
	so := opt.Solver
	if so.Context == nil {
		so.Context = ctx
	}
	fine, coarse, acc, err := design.SolveAccurate(ctx, m, design.SolveOptions{Accuracy: opt.Accuracy, Quick: opt.Quick, Solver: so, Params: params, Marking: adapt.Energy})
	if err != nil {
		return err
	}
	r.Reached = acc.Reached
	rep := design.NewEstimated(fine, coarse, acc, design.DesignOptions{StressOnly: true, NoPoleForce: true})
	est := func(path string) float64 {
		if e, ok := rep.Est(path); ok {
			return e
		}
		return math.NaN()
	}
	if rep.Gap != nil {
		r.Q[B0], r.Est[B0] = rep.Gap.CentreB, est("gap.centre_B_T")
	}
	tol := opt.Tol
	if tol == 0 {
		tol = 1e-4
	}
	if u := rep.Uniformity; u != nil {
		for k, w := range u.HalfWidths {
			if w.Tol == tol {
				r.Q[HalfWidth], r.Est[HalfWidth] = w.HalfWidth, est(fmt.Sprintf("uniformity.good_field_half_widths[%d].half_width_m", k))
			}
		}
	}
	for k, s := range rep.Saturation {
		if math.IsNaN(r.Q[IronPeak]) || s.Peak > r.Q[IronPeak] {
			r.Q[IronPeak], r.Est[IronPeak] = s.Peak, est(fmt.Sprintf("saturation[%d].peak_disc_mean_B_T", k))
		}
	}
	r.Q[IronMass], r.Est[IronMass] = ironMass(fine), 0 // geometry: exact

	if len(m.Coils) == 0 {
		return nil
	}
	ci := 0
	if opt.Coil != "" {
		ci = -1
		for k := range m.Coils {
			if m.Coils[k].Name == opt.Coil {
				ci = k
			}
		}
		if ci < 0 {
			return fmt.Errorf("%s: no coil named %q", m.File, opt.Coil)
		}
	}
	ni := fine.Params.TurnsOf(m, ci) * fine.Params.Current(m, ci)
	niEst := 0.0 // the model's own ampere-turns are exact
	if coarse == nil {
		niEst = math.NaN()
	}
	if bt := opt.Target; !opt.NoTarget && (bt > 0 || m.Target != nil) {
		probe := m.MainProbe()
		if bt == 0 {
			bt, probe = m.Target.Field, m.Target.Probe
		}
		search := func(res *study.Result) (float64, error) {
			run, err := sweep.NewRunnerFrom(res, m.Coils[ci].Name, probe)
			if err != nil {
				return 0, err
			}
			t, err := target.Search(ctx, run, bt, target.Options{GapLength: m.Gap, Solver: so})
			return t.AmpereTurns, err
		}
		if ni, err = search(fine); err != nil {
			return err
		}
		niEst = math.NaN()
		if coarse != nil {
			c, err := search(coarse)
			if err != nil {
				return err
			}
			niEst = math.Abs(ni - c)
		}
		r.Q[AmpereTurns], r.Est[AmpereTurns] = ni, niEst
	}
	return r.winding(m, &m.Coils[ci], math.Abs(ni), niEst, opt)
}

// winding chooses the least-power winding of the coil window for the
// ampere-turns ni (per winding) and fills the power and copper mass of
// all windings in series. The estimate of the power follows from that of
// the ampere-turns: P ∝ (NI)² at a fixed winding.
func (r *Row) winding(m *models.Model, c *models.Coil, ni, niEst float64, opt Options) error {
	if ni == 0 {
		return nil
	}
	w, err := coil.CoilWinding(m, c)
	if err != nil {
		return err
	}
	spec := opt.Spec
	spec.AmpereTurns, spec.Window = ni, w.Window
	if err := spec.Validate(); err != nil {
		return err
	}
	wires := opt.Wires
	if wires == nil {
		wires = coil.DefaultWires(spec.Cooling)
	}
	opts := coil.Options(spec, wires)
	best, ok := coil.Best(opts, coil.LeastPower)
	if !ok {
		// None meets every limit: the least power of all, flagged.
		for i, o := range opts {
			if i == 0 || o.Power < best.Power {
				best = o
			}
		}
	}
	if len(opts) == 0 {
		return nil
	}
	k := float64(w.Windings)
	r.Q[Power], r.Est[Power] = k*best.Power, k*best.Power*2*niEst/ni
	r.Q[CopperMass], r.Est[CopperMass] = k*best.Mass, 0
	r.Winding = fmt.Sprintf("%s × %d", best.Wire.Name, best.Turns)
	if !best.OK() {
		r.Winding += " (" + best.Flags.String() + ")"
	}
	return nil
}

// ironMass returns the mass (kg) of the regions of B-H curve materials:
// planar, exact polygon area × depth; axisymmetric, Σ 2π r̄ A over the
// triangles of the mesh (Pappus; exact for the meshed polygons).
func ironMass(res *study.Result) float64 {
	m := res.Model
	iron := map[int32]bool{}
	area := 0.0
	for i := range m.Regions {
		mat, _, err := study.Material(m, &m.Regions[i])
		if err != nil {
			continue
		}
		if _, ok := mat.(*materials.Curve); !ok {
			continue
		}
		iron[study.Tag(i)] = true
		area += m.Regions[i].Area()
	}
	if m.Geometry == models.Planar {
		return SteelDensity * area * m.Depth
	}
	msh := res.Disc.Mesh
	vol := 0.0
	for t := 0; t < msh.NumTriangles(); t++ {
		if !iron[msh.Region[t]] {
			continue
		}
		a, b, c := msh.Tri[3*t], msh.Tri[3*t+1], msh.Tri[3*t+2]
		ar := 0.5 * ((msh.X[b]-msh.X[a])*(msh.Y[c]-msh.Y[a]) - (msh.X[c]-msh.X[a])*(msh.Y[b]-msh.Y[a]))
		vol += 2 * math.Pi * (msh.X[a] + msh.X[b] + msh.X[c]) / 3 * ar
	}
	return SteelDensity * vol
}
