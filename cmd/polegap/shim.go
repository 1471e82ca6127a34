package main

import (
	"flag"
	"fmt"
	"io"

	"gonum.org/v1/plot/vg"

	"polegap/internal/num"
	"polegap/models"
	"polegap/post/output/figure"
	"polegap/post/output/plot"
	"polegap/post/workflow/shim"
)

var cmdShim = &Command{
	UsageLine: "shim [--tolerance T] [--currents I1,I2,...] [--evaluations N] [--bevel] [--png FILE] [--json] MODEL",
	Short:     "optimise the pole-edge shims of a dipole for the widest good-field region",
	Long: `Shim finds the pole-edge shim of a c-core or h-core model — a step of
some height and width at each edge of both pole faces — that gives the
widest good-field region along the mid-plane (--bevel: a ramp rising
towards the edge instead of a step): the half-width within which
|ΔB/B0| stays below --tolerance (default 1e-4). It starts from Rose's
shim proportions and runs the Nelder–Mead simplex method on full
nonlinear solves, each solved to the accuracy asked for (--accuracy; with
--quick once on the model's own mesh, the fast way to explore).

--currents gives operating currents of the first coil (the narrowest
region over them counts; saturation moves the optimum), by default the
model's own. No shim below the template's shim-min (the smallest step the
workshop can machine) is solved or proposed. The result is the gain over
the unshimmed pole; --png draws ΔB/B0 along the mid-plane before and
after.`,
	Flags: func(fs *flag.FlagSet) func(*Env, []string) error {
		tol := realFlag(fs, "tolerance", 1e-4, numRange{lo: 0, hi: 0.1, loOpen: true, hiOpen: true, hint: "a relative field tolerance below 0.1"}, "relative field tolerance of the good-field region")
		list := &quantityList{kind: current}
		fs.Var(list, "currents", "comma-separated operating currents of the first coil (default the model's)")
		n := intFlag(fs, "evaluations", 40, count(1, 10000), "largest number of shapes solved")
		bevel := fs.Bool("bevel", false, "optimise a bevel (a ramp towards the face edge) instead of a step")
		png := fs.String("png", "", "draw ΔB/B0 along the mid-plane before and after to this .png or .svg file")
		asJSON := fs.Bool("json", false, "print the result as JSON")
		af := addAccuracyFlags(fs)
		return func(env *Env, args []string) error {
			if err := oneModel(args); err != nil {
				return err
			}
			src, m, err := scanSource(args[0])
			if err != nil {
				return err
			}
			if !(*tol > 0 && *tol < 0.1) || *n < 1 {
				return usagef("--tolerance must lie between 0 and 0.1 and --evaluations be at least 1")
			}
			opt := shim.Options{Tol: *tol, MaxEvaluations: *n, Bevel: *bevel}
			if list.vals != nil {
				opt.Currents = list.SI(m)
			}
			if !*af.quick {
				if opt.Accuracy, err = af.target(m); err != nil {
					return err
				}
			}
			opt.Progress = func(e shim.Eval) {
				fmt.Fprintf(env.Stderr, "polegap shim: %.4g × %.4g mm: ±%.2f mm %s\n", 1e3*e.Shape.Height, 1e3*e.Shape.Width, 1e3*e.HalfWidth, e.Err)
			}
			res, err := shim.Optimise(env.Ctx, src.File, src.Data, opt)
			if err != nil {
				return err
			}
			if *png != "" {
				p, err := figure.ShimProfiles(m.Name+": ΔB/B0 on the mid-plane", res.Before.X, res.Before.Dev, res.After.X, res.After.Dev, res.Tol)
				if err != nil {
					return err
				}
				if err := plot.Save(p, 16*vg.Centimeter, 10*vg.Centimeter, *png); err != nil {
					return err
				}
			}
			if *asJSON {
				return writeJSON(env.Stdout, "shim", newShimJSON(res))
			}
			return writeShim(env.Stdout, m.Name, res, opt.Accuracy)
		}
	},
}

// writeShim prints the result as text.
func writeShim(w io.Writer, name string, r *shim.Result, accuracy float64) error {
	mm := func(v float64) float64 { return 1e3 * v }
	if accuracy > 0 {
		fmt.Fprintf(w, "accuracy    each shape solved to %.0e relative (adaptive); the half-widths themselves carry no estimate: they read where |ΔB/B0| crosses the tolerance, which the mesh's own ripple moves\n", accuracy)
	} else {
		fmt.Fprintf(w, "accuracy    quick: each shape solved once on the model's own mesh; the half-widths carry no estimate\n")
	}
	fmt.Fprintf(w, "model       %s, gap %.4g mm, good field |ΔB/B0| < %g at %v A\n", name, mm(r.Gap), r.Tol, r.Currents)
	fmt.Fprintf(w, "unshimmed   ±%.2f mm\n", mm(r.Unshimmed.HalfWidth))
	fmt.Fprintf(w, "start       %.3f × %.2f mm (Rose's proportions, from memory; at least shim-min %.3g mm)\n", mm(r.Rose.Height), mm(r.Rose.Width), mm(r.Min))
	if r.Gain() <= 0 {
		fmt.Fprintf(w, "best        no shim beats the flat pole after %d shapes (%s)\n", len(r.Evals), r.Status)
		return nil
	}
	shape := "step"
	if r.Best.Shape.Bevel {
		shape = "bevel"
	}
	fmt.Fprintf(w, "best        %s: shim-height %.3f mm, shim-width %.2f mm: ±%.2f mm\n", shape, mm(r.Best.Shape.Height), mm(r.Best.Shape.Width), mm(r.Best.HalfWidth))
	_, err := fmt.Fprintf(w, "gain        %+.2f mm (%+.0f %%) after %d shapes (%s)\n", mm(r.Gain()), 100*r.Gain()/r.Unshimmed.HalfWidth, len(r.Evals), r.Status)
	return err
}

// shimJSON is shim --json: the optimisation in the JSON contract
// (snake_case keys with units, no NaN: a shape that could not be solved
// has no half-width and says why).
type shimJSON struct {
	Tolerance   float64        `json:"tolerance"`
	Gap         float64        `json:"gap_m"`
	ShimMin     float64        `json:"shim_min_m"`
	Start       shimShape      `json:"start"`
	Currents    []float64      `json:"currents_A"`
	Unshimmed   shimEvalJSON   `json:"unshimmed"`
	Best        shimEvalJSON   `json:"best"`
	Gain        float64        `json:"gain_m"`
	Before      shimProfile    `json:"before"`
	After       shimProfile    `json:"after"`
	Evaluations []shimEvalJSON `json:"evaluations"`
	Status      string         `json:"status"`
}

type shimShape struct {
	Height float64 `json:"height_m"`
	Width  float64 `json:"width_m"`
	Bevel  bool    `json:"bevel"`
}

type shimEvalJSON struct {
	Shape     shimShape `json:"shape"`
	HalfWidth *float64  `json:"half_width_m"`
	Error     string    `json:"error,omitempty"`
}

type shimProfile struct {
	X   []float64 `json:"x_m"`
	Dev []float64 `json:"dB_over_B0"`
}

func newShimJSON(r *shim.Result) shimJSON {
	shape := func(s models.Shim) shimShape { return shimShape{Height: s.Height, Width: s.Width, Bevel: s.Bevel} }
	eval := func(e shim.Eval) shimEvalJSON {
		out := shimEvalJSON{Shape: shape(e.Shape), Error: e.Err}
		if num.Finite(e.HalfWidth) {
			hw := e.HalfWidth
			out.HalfWidth = &hw
		}
		return out
	}
	out := shimJSON{Tolerance: r.Tol, Gap: r.Gap, ShimMin: r.Min, Start: shape(r.Rose), Currents: r.Currents,
		Unshimmed: eval(r.Unshimmed), Best: eval(r.Best), Before: shimProfile{r.Before.X, r.Before.Dev},
		After: shimProfile{r.After.X, r.After.Dev}, Status: r.Status, Evaluations: []shimEvalJSON{}}
	if g := r.Gain(); num.Finite(g) {
		out.Gain = g
	}
	for _, e := range r.Evals {
		out.Evaluations = append(out.Evaluations, eval(e))
	}
	return out
}
