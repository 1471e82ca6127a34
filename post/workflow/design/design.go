package design

import (
	"errors"
	"fmt"
	"math"

	"polegap/materials"
	"polegap/mesh"
	"polegap/models"
	"polegap/post/quantity/circuit"
	"polegap/post/quantity/force"
	"polegap/post/quantity/gap"
	"polegap/post/quantity/saturation"
	"polegap/post/study"
	"polegap/solver"
)

// Design holds the quantities a magnet designer reads off a solution. A
// section is nil when the model does not give what it needs (a planar gap
// centre for gap, uniformity and fringing; a gap length and a region named
// "gap" for fringing); Notes say why.
type Design struct {
	Gap        *GapReport        `json:"gap,omitempty"`
	Uniformity *UniformityReport `json:"uniformity,omitempty"`
	Fringing   *FringeReport     `json:"fringing,omitempty"`
	Coils      []CoilReport      `json:"coils"`
	Energy     EnergyReport      `json:"energy"`
	Saturation []SatReport       `json:"saturation"`
	Forces     []ForceReport     `json:"forces,omitempty"`
	Notes      []string          `json:"notes,omitempty"`
}

// ForceReport is the force on one part of the model (N; planar models
// times their depth, axisymmetric: the axial force in Fy).
type ForceReport struct {
	Part        string      `json:"part"`
	Stress      [2]float64  `json:"maxwell_stress_N"`
	VirtualWork *[2]float64 `json:"virtual_work_N,omitempty"`
	Error       string      `json:"error,omitempty"`
}

// GapReport is the field in the gap.
type GapReport struct {
	Probe       string  `json:"probe"`
	CentreB     float64 `json:"centre_B_T"`
	CentreBy    float64 `json:"centre_By_T"`
	PoleFaceAvg float64 `json:"pole_face_mean_By_T,omitempty"` // mean normal field across the gap region's width at mid-plane
	PoleWidth   float64 `json:"pole_face_width_m,omitempty"`
	GapLength   float64 `json:"gap_length_m,omitempty"`
}

// UniformityReport is the field quality along the mid-plane and over the
// good-field box.
type UniformityReport struct {
	Line       string          `json:"line,omitempty"`
	Box        string          `json:"box,omitempty"`
	BoxMaxDev  float64         `json:"box_max_abs_dB_over_B0,omitempty"`
	LineMaxDev float64         `json:"line_max_abs_dB_over_B0,omitempty"`
	HalfWidths []GoodFieldSpan `json:"good_field_half_widths"`
}

// GoodFieldSpan is how far from the centre the field stays within Tol.
type GoodFieldSpan struct {
	Tol       float64 `json:"tolerance"`
	HalfWidth float64 `json:"half_width_m"`
	Bounded   bool    `json:"bounded"` // false: the line ended first, the width is a lower bound
}

// FringeReport is the fringing of the gap.
type FringeReport struct {
	FluxPerDepth float64 `json:"flux_per_depth_Wb_per_m"`
	Factor       float64 `json:"fringing_factor"`
	WidthEff     float64 `json:"effective_width_m"`
	KPerEdge     float64 `json:"k_per_edge"`
	GapEff       float64 `json:"effective_gap_m"`
	Sides        int     `json:"sides_measured"`
}

// CoilReport is one coil's circuit quantities.
type CoilReport struct {
	Name        string  `json:"name"`
	Current     float64 `json:"current_A"`
	AmpereTurns float64 `json:"ampere_turns"`
	Linkage     float64 `json:"flux_linkage_Wb"`
	Apparent    float64 `json:"apparent_inductance_H"`
	Incremental float64 `json:"incremental_inductance_H"`
}

// EnergyReport is the stored energy and co-energy (J; planar models times
// their depth).
type EnergyReport struct {
	Energy   float64 `json:"stored_J"`
	CoEnergy float64 `json:"coenergy_J"`
}

// SatReport is the saturation of one iron region.
type SatReport struct {
	Region      string     `json:"region"`
	Knee        float64    `json:"knee_T"`
	Mean        float64    `json:"mean_B_T"`
	AboveKnee   float64    `json:"area_fraction_above_knee"`
	MaxAway     float64    `json:"max_B_away_from_corners_T"`
	MaxAwayAt   [2]float64 `json:"max_away_at_m"`
	Max         float64    `json:"max_B_raw_T"`
	MaxAtCorner bool       `json:"max_raw_at_corner"`
	Limit       float64    `json:"limit_T,omitempty"`
	Pass        bool       `json:"pass"`
}

// DesignOptions control which quantities are computed.
type DesignOptions struct {
	// Incremental asks for the incremental inductance (two more solves per
	// coil).
	Incremental bool
	// SaturationLimit (T) flags iron regions whose |B| away from corners
	// exceeds it; 0 means no check.
	SaturationLimit float64
	// VirtualWork adds the force by virtual work (co-energy change with
	// the part moved ±δ in x and in y: four more meshes and solves per
	// part) beside the Maxwell-stress force.
	VirtualWork bool
}

// NewDesign computes the design quantities of a solved study.
func NewDesign(s *study.Result, opt DesignOptions) *Design {
	d := &Design{}
	d.gapQuantities(s)
	d.coils(s, opt)
	d.saturation(s, opt)
	d.forces(s, opt)
	return d
}

func (d *Design) forces(s *study.Result, opt DesignOptions) {
	m := s.Model
	for _, part := range m.Forces {
		fr := ForceReport{Part: part.Name}
		var tags []int32
		for _, name := range part.Regions {
			for i := range m.Regions {
				if m.Regions[i].Name == name {
					tags = append(tags, study.Tag(i))
				}
			}
		}
		f, err := force.Stress(s.Solution, tags, force.StressOptions{})
		if err != nil {
			fr.Error = err.Error()
			d.Forces = append(d.Forces, fr)
			continue
		}
		fr.Stress = f.F
		if opt.VirtualWork {
			// δ: a fiftieth of the smallest mesh size near the part, at most
			// a thousandth of the model; common practice for central
			// differences of co-energy on re-meshed models.
			xmin, _, xmax, _ := m.Extent()
			delta := math.Min(m.Mesh.Size/50, (xmax-xmin)/1000)
			var vw [2]float64
			for k, dir := range [][2]float64{{1, 0}, {0, 1}} {
				if m.Geometry == models.Axisymmetric && k == 0 {
					continue
				}
				v, err := force.VirtualWork(s, part.Regions, dir, delta, solver.Options{})
				if err != nil {
					fr.Error = "virtual work: " + err.Error()
					break
				}
				vw[k] = v
			}
			if fr.Error == "" {
				fr.VirtualWork = &vw
			}
		}
		d.Forces = append(d.Forces, fr)
	}
}

func (d *Design) note(format string, args ...any) {
	d.Notes = append(d.Notes, fmt.Sprintf(format, args...))
}

func (d *Design) gapQuantities(s *study.Result) {
	m := s.Model
	cp, ok := m.CentreProbe()
	if !ok {
		d.note("gap: no point probe at the gap centre (the target's probe, one named gap-centre, or any point probe)")
		return
	}
	f := s.Field()
	_, bx, by, ok := f.At(cp.Point[0], cp.Point[1])
	if !ok {
		d.note("gap: probe %s lies outside the mesh", cp.Name)
		return
	}
	g := &GapReport{Probe: cp.Name, CentreB: math.Hypot(bx, by), CentreBy: by, GapLength: m.Gap}
	d.Gap = g
	if m.Geometry != models.Planar {
		return
	}
	c := cp.Point
	if r, ok := m.Region("gap"); ok {
		x0, _, x1, _ := r.Bounds()
		g.PoleWidth = x1 - x0
		if v, err := gap.MeanNormal(f, [2]float64{x0, c[1]}, [2]float64{x1, c[1]}); err == nil {
			g.PoleFaceAvg = v
		}
	}
	d.uniformity(s, f, c, by)
	if m.Gap > 0 && g.PoleWidth > 0 && by != 0 {
		d.fringing(s, f, c, by, g.PoleWidth)
	} else {
		d.note("fringing: needs the gap length (gap key or template) and a region named gap whose width is the pole face")
	}
}

func (d *Design) uniformity(s *study.Result, f gap.Field, c [2]float64, b0 float64) {
	m := s.Model
	u := &UniformityReport{}
	for i := range m.Probes {
		p := &m.Probes[i]
		switch {
		case p.Kind == models.ProbeBox && u.Box == "":
			var ss []gap.Sample
			const n = 41
			for j := 0; j < n; j++ {
				y := p.Box[0][1] + (p.Box[1][1]-p.Box[0][1])*float64(j)/(n-1)
				ss = append(ss, gap.ProfileTo(nil, f, [2]float64{p.Box[0][0], y}, [2]float64{p.Box[1][0], y}, n)...)
			}
			if dev, err := gap.Deviation(ss, b0, gap.ComponentY); err == nil {
				u.Box, u.BoxMaxDev = p.Name, dev.MaxAbs
			}
		case p.Kind == models.ProbeLine && u.Line == "" && onLine(p, c):
			n := p.Samples
			if n < 2 {
				n = 201
			}
			ss := gap.ProfileTo(nil, f, p.Line[0], p.Line[1], max(n, 201))
			dev, err := gap.Deviation(ss, b0, gap.ComponentY)
			if err != nil {
				continue
			}
			u.Line, u.LineMaxDev = p.Name, dev.MaxAbs
			centre := math.Hypot(c[0]-p.Line[0][0], c[1]-p.Line[0][1])
			gf, err := gap.GoodFieldWidths(ss, centre, b0, gap.ComponentY, nil)
			if err != nil {
				continue
			}
			for _, w := range gf {
				u.HalfWidths = append(u.HalfWidths, GoodFieldSpan{Tol: w.Tol, HalfWidth: w.HalfWidth(), Bounded: w.Bounded()})
			}
		}
	}
	if u.Box == "" && u.Line == "" {
		d.note("uniformity: no box probe and no line probe through the gap centre")
		return
	}
	d.Uniformity = u
}

// onLine reports whether c lies on the line probe's segment.
func onLine(p *models.Probe, c [2]float64) bool {
	a, b := p.Line[0], p.Line[1]
	l := math.Hypot(b[0]-a[0], b[1]-a[1])
	if l == 0 {
		return false
	}
	cross := ((b[0]-a[0])*(c[1]-a[1]) - (b[1]-a[1])*(c[0]-a[0])) / l
	t := ((c[0]-a[0])*(b[0]-a[0]) + (c[1]-a[1])*(b[1]-a[1])) / (l * l)
	return math.Abs(cross) <= 1e-6*l && t > 0 && t < 1
}

func (d *Design) fringing(s *study.Result, f gap.Field, c [2]float64, b0, w float64) {
	m := s.Model
	xmin, _, xmax, _ := m.Extent()
	limit := 2 * (xmax - xmin)
	step := m.Gap / 20
	n := [2]float64{0, 1}
	var ni float64
	if len(m.Coils) > 0 {
		ni = m.Coils[0].Turns * m.Coils[0].Current
	}
	// Each half of the mid-plane from the centre outwards past one pole
	// edge; a side whose field never dies away (leakage across a C-core's
	// window) is left out, and the other side's k stands for both edges.
	var ks []float64
	var gapEff float64
	for _, dir := range []float64{-1, 1} {
		reach, _ := gap.Reach(f, c, [2]float64{dir, 0}, n, b0, gap.DefaultEndFraction, step, limit)
		q := [2]float64{c[0] + dir*reach, c[1]}
		p := c
		if dir < 0 {
			p, q = q, c // keep the left normal pointing up (+y)
		}
		fr, err := gap.Fringing(f, p, q, b0, gap.FringeOptions{Gap: m.Gap, PoleWidth: w / 2, Edges: 1, AmpereTurns: ni})
		if err != nil {
			d.note("fringing: %v", err)
			return
		}
		if dir < 0 {
			// Edges: 1 measures the end ratio at q; the outer end is p here.
			_, bx, by, ok := f.At(p[0], p[1])
			fr.Truncated = !ok || math.Abs(by) > gap.DefaultEndFraction*math.Abs(b0) || math.IsNaN(bx)
		}
		gapEff = fr.GapEff
		if !fr.Truncated {
			ks = append(ks, fr.KPerEdge)
		}
	}
	if len(ks) == 0 {
		d.note("fringing: the field does not fall below %.0f %% of the centre value on either side of the gap along the mid-plane; no fringing figure", 100*gap.DefaultEndFraction)
		return
	}
	k := 0.0
	for _, v := range ks {
		k += v
	}
	k /= float64(len(ks))
	weff := w + 2*k*m.Gap
	d.Fringing = &FringeReport{FluxPerDepth: b0 * weff, Factor: weff / w, WidthEff: weff, KPerEdge: k, GapEff: gapEff, Sides: len(ks)}
	if len(ks) == 1 {
		d.note("fringing: from the open side of the gap only (on the other side leakage flux keeps the mid-plane field above %.0f %% of the centre value); both edges assumed alike", 100*gap.DefaultEndFraction)
	}
}

func (d *Design) coils(s *study.Result, opt DesignOptions) {
	w, wco, err := study.Energies(s.Solution)
	if err != nil {
		d.note("energy: %v", err)
	} else {
		d.Energy = EnergyReport{Energy: w, CoEnergy: wco}
	}
	cs := circuit.CoilsAt(s.Model, s.Params)
	lambda, err := circuit.LinkagesTo(nil, s.Solution, cs)
	if err != nil {
		d.note("coils: %v", err)
		return
	}
	for i, c := range cs {
		cr := CoilReport{Name: c.Name, Current: c.Current, AmpereTurns: c.AmpereTurns(), Linkage: lambda[i]}
		if c.Current != 0 {
			cr.Apparent = circuit.Apparent(lambda[i], c.Current)
		}
		if opt.Incremental && c.Current != 0 {
			col, err := circuit.IncrementalAt(s, i, circuit.IncrementalOptions{})
			if err != nil {
				d.note("coil %s: incremental inductance: %v", c.Name, err)
			} else {
				cr.Incremental = col[i]
			}
		}
		d.Coils = append(d.Coils, cr)
	}
}

func (d *Design) saturation(s *study.Result, opt DesignOptions) {
	m := s.Model
	var regs []saturation.Region
	for i := range m.Regions {
		r := &m.Regions[i]
		mat, _, err := study.Material(m, r)
		if err != nil {
			continue
		}
		c, ok := mat.(*materials.Curve)
		if !ok {
			continue
		}
		// Chords of at most 5°: their joints turn by less than
		// saturation.DefaultMinTurn and are not taken for corners.
		x, y := mesh.DiscretizePolygon(mesh.Polygon{X: r.X, Y: r.Y, Sweep: r.Sweep},
			mesh.GraphOptions{ChordTol: m.Mesh.Chord, MaxArcAngle: 5 * math.Pi / 180}.WithDefaults(study.Polygons(m), s.Disc.Boundary))
		regs = append(regs, saturation.Region{Tag: study.Tag(i), Name: r.Name, Curve: c,
			Corners: saturation.ReentrantCorners(x, y, 0), Limit: opt.SaturationLimit})
	}
	if len(regs) == 0 {
		return
	}
	reps, err := saturation.Analyse(s.Disc.Mesh, s.ElementB(), regs, saturation.Options{})
	if err != nil {
		var nk *saturation.NoKneeError
		if !errors.As(err, &nk) {
			d.note("saturation: %v", err)
			return
		}
	}
	for _, r := range reps {
		d.Saturation = append(d.Saturation, SatReport{Region: r.Name, Knee: r.Knee, Mean: r.Mean, AboveKnee: r.AboveKnee,
			MaxAway: r.MaxAway, MaxAwayAt: r.MaxAwayAt, Max: r.Max, MaxAtCorner: r.MaxAtCorner, Limit: r.Limit, Pass: r.Pass})
	}
}
