package design

import (
	"time"

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
	order []string
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
		r.Probes[p.Name] = probe(p)
		r.order = append(r.order, p.Name)
	}
	r.Design = NewDesign(s, opt)
	// The summary line's energy is the design section's (study.Energies):
	// one stored energy everywhere.
	r.Energy = r.Design.Energy.Energy
	return r
}

func probe(p probes.Result) Probe {
	out := Probe{Kind: p.Kind, Valid: p.Valid}
	if p.Kind == "point" {
		s := p.Point
		out.X, out.Y = ptr(s.X), ptr(s.Y)
		if p.Valid {
			out.A, out.Bx, out.By, out.B = ptr(s.A), ptr(s.Bx), ptr(s.By), ptr(s.B())
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

// Order returns the probe names in the model's order.
func (r *Report) Order() []string { return r.order }
