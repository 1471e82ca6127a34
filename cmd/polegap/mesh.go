package main

import (
	"flag"
	"fmt"
	"io"
	"polegap/post/output/report"
	"time"

	"polegap/internal/fileout"
	"polegap/mesh"
	"polegap/post/output/figure"
	"polegap/post/study"
)

var cmdMesh = &Command{
	UsageLine: "mesh [--vtu FILE.vtu] [--png FILE.png] [--json] MODEL",
	Short:     "mesh a model and print the mesh statistics",
	Long: `Mesh builds the model's geometry, triangulates it with the model's mesh
controls (size, per-region sizes, refinement near named places, element
order) and prints the mesh statistics: nodes, triangles, the smallest and
mean angle, the worst aspect ratio and the triangles per region.

MODEL is a model file or the name of an embedded example.
--vtu writes the mesh as a VTK XML unstructured grid (.vtu) with region ids;
--png (or .svg) draws it, each region coloured by kind.`,
	Flags: func(fs *flag.FlagSet) func(*Env, []string) error {
		out := fs.String("vtu", "", "write the mesh to this .vtu file")
		alias(fs, "out", "vtu")
		png := fs.String("png", "", "draw the mesh to this .png, .svg or .pdf file")
		pf := addPictureFlags(fs, true)
		asJSON := fs.Bool("json", false, "print the statistics as JSON")
		return func(env *Env, args []string) error {
			m, err := modelArg(args)
			if err != nil {
				return err
			}
			start := time.Now()
			d, err := study.Discretize(m)
			if err != nil {
				return err
			}
			elapsed := time.Since(start)
			if err := env.Ctx.Err(); err != nil {
				return err // interrupted while meshing
			}
			if *out != "" {
				if err := writeMeshVTU(*out, d); err != nil {
					return err
				}
			}
			if *png != "" {
				if err := figure.DrawMesh(*png, d, pf.wholeDomain(), pf.options()); err != nil {
					return err
				}
			}
			if *asJSON {
				return writeJSON(env.Stdout, "mesh", meshReport(d))
			}
			printMeshStats(env.Stdout, d, elapsed)
			return nil
		}
	},
}

func writeMeshVTU(path string, d *study.Discretization) error {
	return fileout.Write(path, func(w io.Writer) error { return mesh.WriteVTU(w, d.Mesh) })
}

// meshStats is the JSON form of the mesh statistics.
type meshStats struct {
	Nodes       int           `json:"nodes"`
	Triangles   int           `json:"triangles"`
	Order       int           `json:"order"`
	MinAngle    float64       `json:"min_angle_deg"`
	MeanAngle   float64       `json:"mean_angle_deg"`
	WorstAspect float64       `json:"worst_aspect"`
	Regions     []regionStats `json:"regions"`
}

type regionStats struct {
	Name      string  `json:"name"`
	Triangles int     `json:"triangles"`
	Area      float64 `json:"area_m2"`
}

func meshReport(d *study.Discretization) meshStats {
	s := d.Mesh.Stats()
	r := meshStats{
		Nodes: s.Nodes, Triangles: s.Triangles, Order: d.Mesh.Order(),
		MinAngle: s.MinAngle, MeanAngle: s.MeanAngle, WorstAspect: s.WorstAspect,
	}
	for _, pr := range s.PerRegion {
		r.Regions = append(r.Regions, regionStats{Name: d.RegionName(pr.Region), Triangles: pr.Triangles, Area: pr.Area})
	}
	return r
}

func printMeshStats(w io.Writer, d *study.Discretization, elapsed time.Duration) {
	r := meshReport(d)
	fmt.Fprintf(w, "model      %s (%s)\n", d.Model.Name, d.Model.File)
	fmt.Fprintf(w, "mesh       %d nodes, %d triangles, order %d, built in %v\n", r.Nodes, r.Triangles, r.Order, elapsed.Round(time.Millisecond))
	fmt.Fprintf(w, "quality    smallest angle %.1f°, mean smallest angle per triangle %.1f°, worst aspect ratio %.2f\n", r.MinAngle, r.MeanAngle, r.WorstAspect)
	fmt.Fprintf(w, "\n%-20s %10s %14s\n", "region", "triangles", "area (mm²)")
	for _, rs := range r.Regions {
		fmt.Fprintf(w, "%-20s %10d %14.2f\n", rs.Name, rs.Triangles, rs.Area*1e6)
	}
}

func writeJSON(w io.Writer, output string, v any) error {
	return report.WriteJSON(w, output, v)
}
