package report

import (
	"fmt"
	"io"
	"math"
	"polegap/post/workflow/design"
	"sort"
)

// WriteText writes the terminal summary of a solved model.
func WriteText(w io.Writer, r *design.Report) error {
	ew := &errWriter{w: w}
	ew.printf("model      %s (%s, %s)\n", r.Model, r.File, r.Geometry)
	ew.printf("mesh       %d nodes, %d triangles, order %d, %d unknowns\n", r.Mesh.Nodes, r.Mesh.Triangles, r.Mesh.Order, r.Mesh.Unknowns)
	ew.printf("solve      %d Newton step(s), relative residual %.2e, converged\n", r.Newton.Iterations, r.Newton.Residual)
	t := r.Time
	ew.printf("time       mesh %.3f s, assemble %.3f s, order+analyse %.3f s, factor %.3f s, solve %.3f s\n", t.Mesh, t.Assemble, t.Analyze, t.Factor, t.Solve)
	ew.printf("energy     %.4g J stored\n", r.Energy)
	names := r.Order()
	if names == nil {
		for n := range r.Probes {
			names = append(names, n)
		}
		sort.Strings(names)
	}
	if len(names) > 0 {
		comp := "By (T)"
		if r.Geometry == "axisymmetric" {
			comp = "Bz (T)" // x, y are r, z
		}
		ew.printf("\n%-16s %-6s %10s %10s %10s %10s\n", "probe", "kind", "|B| (T)", comp, "min |B|", "max |B|")
	}
	for _, n := range names {
		p := r.Probes[n]
		if !p.Valid {
			ew.printf("%-16s %-6s %s\n", n, p.Kind, "outside the mesh")
			continue
		}
		if p.Kind == "point" {
			ew.printf("%-16s %-6s %10.5f %10.5f\n", n, p.Kind, *p.B, *p.By)
			for _, sd := range p.Sides {
				mark := ""
				if sd.Reported {
					mark = ", reported"
				}
				ew.printf("  side %-10.10s %-6s %10.5f %10.5f   (μr %.4g%s)\n", sd.Region, "", sd.B, sd.By, sd.MuR, mark)
			}
			continue
		}
		ew.printf("%-16s %-6s %10.5f %10.5f %10.5f %10.5f   (mean of %d samples)\n", n, p.Kind, *p.BMean, *p.ByMean, *p.BMin, *p.BMax, p.Samples-p.Outside)
	}
	if r.Design != nil {
		writeDesign(ew, r.Design)
	}
	writeAccuracy(ew, r)
	writeCautionList(ew, r.Cautions)
	return ew.err
}

type errWriter struct {
	w   io.Writer
	err error
}

func (e *errWriter) printf(format string, args ...any) {
	if e.err != nil {
		return
	}
	for _, a := range args {
		if f, ok := a.(float64); ok && (math.IsNaN(f) || math.IsInf(f, 0)) {
			e.err = fmt.Errorf("report: a non-finite value reached the summary (%s)", format)
			return
		}
	}
	_, e.err = fmt.Fprintf(e.w, format, args...)
}

func (e *errWriter) sprintf(format string, args ...any) string { return fmt.Sprintf(format, args...) }
