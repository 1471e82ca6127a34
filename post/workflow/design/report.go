package design

import (
	"encoding/json"
	"fmt"
	"math"
	"polegap/post/workflow/caution"
	"strings"
	"time"

	"polegap/internal/num"
	"polegap/models"
	"polegap/post/study"
	"polegap/post/study/probes"
)

// Report is the summary of one solved model.
type Report struct {
	Model    string           `json:"model"`
	File     string           `json:"file"`
	Geometry string           `json:"geometry"`
	Mesh     Mesh             `json:"mesh"`
	Newton   Newton           `json:"newton"`
	Time     Times            `json:"time_s"`
	Energy   float64          `json:"energy_j"` // = Design.Energy.Energy (J)
	Probes   map[string]Probe `json:"probes"`
	*Design
	// Accuracy says how the numbers were converged (nil: not recorded).
	Accuracy *Accuracy `json:"accuracy,omitempty"`
	// Estimates holds the error estimate (absolute, in the value's unit)
	// of each computed number, keyed by the number's path in this JSON
	// ("gap.centre_B_T", "coils[0].flux_linkage_Wb"); empty in quick mode.
	Estimates map[string]float64 `json:"estimates,omitempty"`
	// Cautions are the safety cautions quantified from the design (each
	// encodes to JSON as its sentence); nil when not set.
	Cautions []caution.Caution `json:"cautions,omitempty"`
	order    []string
}

// Mesh sizes the discretisation.
type Mesh struct {
	Nodes     int `json:"nodes"`
	Triangles int `json:"triangles"`
	Order     int `json:"order"`
	Unknowns  int `json:"unknowns"`
}

// Newton tells how the nonlinear solve went.
type Newton struct {
	Iterations int     `json:"iterations"`
	Residual   float64 `json:"residual"`
	Converged  bool    `json:"converged"`
}

// Times are wall-clock seconds.
type Times struct {
	Mesh     float64 `json:"mesh"`
	Assemble float64 `json:"assemble"`
	Analyze  float64 `json:"analyze"`
	Factor   float64 `json:"factor"`
	Solve    float64 `json:"solve"`
}

// Probe is one evaluated probe. Point probes fill X, Y, A, Bx, By, B; the
// others fill the sample statistics.
type Probe struct {
	Kind       string   `json:"kind"`
	Valid      bool     `json:"inside_mesh"`
	X          *float64 `json:"x,omitempty"`
	Y          *float64 `json:"y,omitempty"`
	A          *float64 `json:"a,omitempty"`
	Bx         *float64 `json:"bx,omitempty"`
	By         *float64 `json:"by,omitempty"`
	B          *float64 `json:"b,omitempty"`
	Samples    int      `json:"samples,omitempty"`
	Outside    int      `json:"outside,omitempty"`
	BMean      *float64 `json:"b_mean,omitempty"`
	BMin       *float64 `json:"b_min,omitempty"`
	BMax       *float64 `json:"b_max,omitempty"`
	ByMean     *float64 `json:"by_mean,omitempty"`
	Uniformity *float64 `json:"uniformity,omitempty"`
	// Sides: a point probe on an interface between materials of
	// different permeability reads a different field on each side; B,
	// Bx, By are then the side of the lowest permeability (usually air:
	// what a Hall probe there reads), and each side is listed.
	Sides []ProbeSide `json:"interface_sides,omitempty"`

	axi bool // axisymmetric model: JSON names r, z, br, bz (MarshalJSON)
}

// ProbeSide is the field of one region at a point probe on an interface.
type ProbeSide struct {
	Region   string  `json:"region"`
	MuR      float64 `json:"mu_r"` // relative permeability 1/(ν μ0) at that side's B
	Bx       float64 `json:"bx"`
	By       float64 `json:"by"`
	B        float64 `json:"b"`
	Reported bool    `json:"reported"` // the side the probe's value is

	axi bool // axisymmetric model: JSON names br, bz
}

func ptr(v float64) *float64 { return &v }

func seconds(d time.Duration) float64 { return d.Seconds() }

// New builds the report of a solved study, with the design quantities
// (see NewDesign).
func New(s *study.Result, opt DesignOptions) *Report {
	m, sol := s.Model, s.Solution
	r := &Report{
		Model:    m.Name,
		File:     m.File,
		Geometry: m.Geometry.String(),
		Mesh: Mesh{Nodes: s.Disc.Mesh.NumNodes(), Triangles: s.Disc.Mesh.NumTriangles(),
			Order: s.Disc.Mesh.Order(), Unknowns: sol.NumUnknowns},
		Newton: Newton{Iterations: sol.Iterations, Residual: sol.Residual, Converged: sol.Converged},
		Time: Times{Mesh: seconds(s.MeshTime), Assemble: seconds(sol.Time.Assemble), Analyze: seconds(sol.Time.Analyze),
			Factor: seconds(sol.Time.Factor), Solve: seconds(sol.Time.Solve)},
		Probes: map[string]Probe{},
	}
	for _, p := range s.Probes {
		r.Probes[p.Name] = probe(p, s.Disc)
		r.order = append(r.order, p.Name)
	}
	r.Design = NewDesign(s, opt)
	for _, name := range r.order {
		if p := r.Probes[name]; len(p.Sides) > 0 {
			r.Design.note("%s", interfaceNote(name, p.Sides))
		}
	}
	// The summary line's energy is the design section's (study.Energies):
	// one stored energy everywhere.
	r.Energy = r.Design.Energy.Energy
	return r
}

func probe(p probes.Result, disc *study.Discretization) Probe {
	axi := disc.Model.Geometry == models.Axisymmetric
	out := Probe{Kind: p.Kind, Valid: p.Valid, axi: axi}
	if p.Kind == "point" {
		s := p.Point
		out.X, out.Y = ptr(s.X), ptr(s.Y)
		if p.Valid {
			out.A, out.Bx, out.By, out.B = ptr(s.A), ptr(s.Bx), ptr(s.By), ptr(s.B())
		}
		if len(p.Sides) > 0 {
			k := probes.Reported(p.Sides)
			for i, sd := range p.Sides {
				out.Sides = append(out.Sides, ProbeSide{Region: disc.RegionName(sd.Region), MuR: 1 / (sd.Nu * num.Mu0),
					Bx: sd.Bx, By: sd.By, B: math.Hypot(sd.Bx, sd.By), Reported: i == k, axi: axi})
			}
		}
		return out
	}
	out.Samples, out.Outside = len(p.Samples), p.Outside
	if p.Valid {
		st := p.Stats
		out.BMean, out.BMin, out.BMax, out.ByMean, out.Uniformity = ptr(st.Mean), ptr(st.Min), ptr(st.Max), ptr(st.MeanBy), ptr(st.Uniformity)
	}
	return out
}

// interfaceNote is the warning for a point probe on an interface.
func interfaceNote(name string, sides []ProbeSide) string {
	var rep ProbeSide
	var others []string
	for _, sd := range sides {
		if sd.Reported {
			rep = sd
			continue
		}
		others = append(others, fmt.Sprintf("%.5g T in %s (μr %.4g)", sd.B, sd.Region, sd.MuR))
	}
	return fmt.Sprintf("probe %s lies on an interface, where B jumps: it reports %.5g T, the side of the lowest permeability (%s, μr %.4g), what a Hall probe in air there reads; the other side reads %s; move the probe off the interface to read one material",
		name, rep.B, rep.Region, rep.MuR, strings.Join(others, ", "))
}

// Order returns the probe names in the model's order.
func (r *Report) Order() []string { return r.order }

// MarshalJSON writes the probe with the coordinates and components named
// after the model's geometry: x, y, bx, by, by_mean for a planar model;
// r, z, br, bz, bz_mean for an axisymmetric one (x = r, y = z).
func (p Probe) MarshalJSON() ([]byte, error) {
	type plain Probe
	if !p.axi {
		return json.Marshal(plain(p))
	}
	return json.Marshal(struct {
		Kind       string      `json:"kind"`
		Valid      bool        `json:"inside_mesh"`
		R          *float64    `json:"r,omitempty"`
		Z          *float64    `json:"z,omitempty"`
		A          *float64    `json:"a,omitempty"`
		Br         *float64    `json:"br,omitempty"`
		Bz         *float64    `json:"bz,omitempty"`
		B          *float64    `json:"b,omitempty"`
		Samples    int         `json:"samples,omitempty"`
		Outside    int         `json:"outside,omitempty"`
		BMean      *float64    `json:"b_mean,omitempty"`
		BMin       *float64    `json:"b_min,omitempty"`
		BMax       *float64    `json:"b_max,omitempty"`
		BzMean     *float64    `json:"bz_mean,omitempty"`
		Uniformity *float64    `json:"uniformity,omitempty"`
		Sides      []ProbeSide `json:"interface_sides,omitempty"`
	}{p.Kind, p.Valid, p.X, p.Y, p.A, p.Bx, p.By, p.B, p.Samples, p.Outside, p.BMean, p.BMin, p.BMax, p.ByMean, p.Uniformity, p.Sides})
}

// MarshalJSON writes the side with its components named after the model's
// geometry (bx, by or br, bz).
func (s ProbeSide) MarshalJSON() ([]byte, error) {
	type plain ProbeSide
	if !s.axi {
		return json.Marshal(plain(s))
	}
	return json.Marshal(struct {
		Region   string  `json:"region"`
		MuR      float64 `json:"mu_r"`
		Br       float64 `json:"br"`
		Bz       float64 `json:"bz"`
		B        float64 `json:"b"`
		Reported bool    `json:"reported"`
	}{s.Region, s.MuR, s.Bx, s.By, s.B, s.Reported})
}

// Axisymmetric reports whether the probe belongs to an axisymmetric model,
// whose x and y are r and z.
func (p Probe) Axisymmetric() bool { return p.axi }
