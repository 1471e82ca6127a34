package design

import (
	"errors"
	"fmt"
	"math"
	"slices"

	"polegap/internal/num"
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
	// Warnings are results no iron-core electromagnet gives, each with its
	// reason (Plausibility); the run goes on.
	Warnings []string `json:"warnings,omitempty"`
}

// ForceReport is the force on one part of the model (N; planar models
// times their depth, axisymmetric: the axial force in Fy).
type ForceReport struct {
	Part    string   `json:"part"`
	Regions []string `json:"regions"`
	// Automatic marks the attraction between the poles that the report
	// adds for a model with a gap: the force on the iron above the gap's
	// mid-plane (see DesignOptions).
	Automatic bool `json:"automatic,omitempty"`
	// Stress is the Maxwell-stress force over a narrow band around the
	// part, Band its width (m).
	Stress [2]float64 `json:"maxwell_stress_N"`
	Band   float64    `json:"stress_band_m,omitempty"`
	// VirtualWork is the force by virtual work on the deformed mesh with
	// the step Delta (m); ErrorEstimate is |Stress − VirtualWork| (N), how
	// far to trust either (force.Estimated).
	VirtualWork   *[2]float64 `json:"virtual_work_N,omitempty"`
	Delta         float64     `json:"virtual_work_step_m,omitempty"`
	ErrorEstimate *float64    `json:"error_estimate_N,omitempty"`
	// Error says why the force was not computed.
	Error string `json:"error,omitempty"`
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
	// Bounds bracket the co-energy of the meshed model (DesignOptions.Bounds).
	Bounds *BoundsReport `json:"coenergy_bounds,omitempty"`
}

// BoundsReport is a two-sided bound of the co-energy (J), the stored
// energy too when every material is linear: the vector-potential solution
// gives the lower, a complementary magnetic-field solution the upper
// (solver.EnergyBounds). Guaranteed says whether the bracket is rigorous
// for the meshed geometry; Note says why not when it is not. With linear
// materials and one coil carrying current the bounds give the coil's
// inductance L = 2W/I² (InductanceH).
type BoundsReport struct {
	Lower       float64     `json:"lower_J"`
	Upper       float64     `json:"upper_J"`
	Guaranteed  bool        `json:"guaranteed"`
	Note        string      `json:"note,omitempty"`
	Coil        string      `json:"coil,omitempty"`
	InductanceH *[2]float64 `json:"inductance_bounds_H,omitempty"`
}

// BoundsMode says when the design computes the co-energy bounds, which
// cost one more solve (of the complementary problem, on the same mesh).
type BoundsMode int

const (
	// NoBounds: none (the zero value; adaptive levels use it).
	NoBounds BoundsMode = iota
	// LinearBounds: for models whose materials are all linear, where the
	// extra solve is one linear solve and the bracket is rigorous.
	LinearBounds
	// AllBounds: for every model; a nonlinear one takes a few Newton
	// steps more.
	AllBounds
)

// SatReport is the saturation of one iron region.
type SatReport struct {
	Region      string     `json:"region"`
	Knee        float64    `json:"knee_T"`
	Mean        float64    `json:"mean_B_T"`
	AboveKnee   float64    `json:"area_fraction_above_knee"`
	Peak        float64    `json:"peak_disc_mean_B_T"`
	PeakAt      [2]float64 `json:"peak_disc_centre_m"`
	Radius      float64    `json:"disc_radius_m"`
	Max         float64    `json:"max_B_raw_mesh_dependent_T"`
	MaxAt       [2]float64 `json:"max_raw_at_m"`
	MaxAtCorner bool       `json:"max_raw_at_corner"`
	Limit       float64    `json:"limit_T,omitempty"`
	Pass        bool       `json:"pass"`
	// TableEnd is B (T) at the last point of the region's B-H data and
	// BeyondTable the area fraction where |B| exceeded it, so that the
	// result rests on the curve's extrapolation there.
	TableEnd    float64 `json:"table_end_B_T"`
	BeyondTable float64 `json:"area_fraction_beyond_table"`
	// Curve names the region's B-H curve: a library name, or "" for the
	// model's own table; Source is where its data come from, and
	// FromMemory is true for a library curve of typical values from
	// memory rather than a cited source.
	Curve      string `json:"curve,omitempty"`
	Source     string `json:"curve_source"`
	FromMemory bool   `json:"curve_from_memory,omitempty"`
	// Grade is the steel grade the material names (models.Material.Grade)
	// and GradeShortfalls where its curve falls below the grade's
	// minimum polarisation (a warning, not a failure).
	Grade           string   `json:"grade,omitempty"`
	GradeShortfalls []string `json:"grade_shortfalls,omitempty"`
}

// DesignOptions control which quantities are computed.
type DesignOptions struct {
	// Incremental asks for the incremental inductance (two more solves per
	// coil).
	Incremental bool
	// SaturationLimit (T) flags iron regions whose peak |B| (the largest
	// mean over a disc, saturation.Report.Peak) exceeds it; 0 means no
	// check.
	SaturationLimit float64
	// StressOnly skips the virtual work (two solves per direction and
	// part) and with it the forces' error estimates.
	StressOnly bool
	// Bounds selects when the co-energy bounds are computed.
	Bounds BoundsMode
	// NoPoleForce leaves out the attraction between the poles that a
	// model with a gap gets by default: the force on the iron regions
	// that lie wholly above the mid-plane through the gap-centre probe,
	// cut from any iron that crosses the mid-plane (force.Options.Joints),
	// unless a force part of the model already is the iron of one side.
	NoPoleForce bool
	// Tolerances are relative field tolerances whose good-field
	// half-widths are reported besides gap.DefaultTolerances (a check's
	// own tolerance); each must be finite and in (0, 1).
	Tolerances []float64
}

// NewDesign computes the design quantities of a solved study.
func NewDesign(s *study.Result, opt DesignOptions) *Design {
	d := &Design{}
	d.gapQuantities(s, opt)
	d.coils(s, opt)
	d.saturation(s, opt)
	d.forces(s, opt)
	d.Warnings = Plausibility(s, d)
	return d
}

func (d *Design) forces(s *study.Result, opt DesignOptions) {
	m := s.Model
	for _, part := range m.Forces {
		d.force(s, ForceReport{Part: part.Name, Regions: part.Regions}, opt, false)
	}
	if opt.NoPoleForce {
		return
	}
	if regions, ok := d.poleRegions(s); ok {
		d.force(s, ForceReport{Part: "pole attraction", Regions: regions, Automatic: true}, opt, true)
	}
}

// force computes one part's force and appends its report.
func (d *Design) force(s *study.Result, fr ForceReport, opt DesignOptions, pole bool) {
	fail := func(err error) {
		fr.Error = err.Error()
		d.Forces = append(d.Forces, fr)
	}
	fo := force.Options{Joints: pole}
	if opt.StressOnly {
		tags := make([]int32, 0, len(fr.Regions))
		for _, name := range fr.Regions {
			if i := regionIndex(s.Model, name); i >= 0 {
				tags = append(tags, study.Tag(i))
			}
		}
		f, err := force.Stress(s.Solution, tags, force.StressOptions{Joints: fo.Joints})
		if err != nil {
			fail(err)
			return
		}
		fr.Stress, fr.Band = f.F, f.Band
		d.Forces = append(d.Forces, fr)
		return
	}
	var e force.Estimated
	var err error
	if pole {
		// Only the pull across the gap: along y (the axis when
		// axisymmetric), two solves.
		e, err = force.EstimateAlong(s, fr.Regions, 1, fo)
	} else {
		e, err = force.Estimate(s, fr.Regions, fo)
	}
	if err != nil {
		fail(err)
		return
	}
	vw := e.VirtualWork
	fr.Stress, fr.Band, fr.VirtualWork, fr.Delta, fr.ErrorEstimate = e.Stress.F, e.Stress.Band, &vw, e.Delta, &e.Error
	d.Forces = append(d.Forces, fr)
}

// poleRegions returns the iron regions (not air, not a coil side) that lie
// wholly above the mid-plane through the gap-centre probe, for a model
// with a gap, unless a force part of the model is already the iron of one
// side.
func (d *Design) poleRegions(s *study.Result) ([]string, bool) {
	m := s.Model
	cp, ok := m.CentreProbe()
	if m.Gap <= 0 || !ok {
		return nil, false
	}
	y0 := cp.Point[1]
	coil := map[string]bool{}
	for _, c := range m.Coils {
		for _, sd := range c.Sides {
			coil[sd.Region] = true
		}
	}
	var above, below []string
	for i := range m.Regions {
		r := &m.Regions[i]
		if coil[r.Name] || !iron(m, r) {
			continue
		}
		_, ymin, _, ymax := r.Bounds()
		switch {
		case ymin >= y0:
			above = append(above, r.Name)
		case ymax <= y0:
			below = append(below, r.Name)
		}
	}
	if len(above) == 0 || len(below) == 0 {
		d.note("pole attraction: no iron wholly on each side of the mid-plane through %s; not computed", cp.Name)
		return nil, false
	}
	for _, f := range m.Forces {
		if sameSet(f.Regions, above) || sameSet(f.Regions, below) {
			return nil, false
		}
	}
	return above, true
}

// iron reports whether a region's material is magnetic: anything but a
// linear material of μr 1 without magnetisation.
func iron(m *models.Model, r *models.Region) bool {
	mat, mag, err := study.Material(m, r)
	if err != nil || mat == nil {
		return false
	}
	if mag != [2]float64{} {
		return true
	}
	n0, d0 := mat.Nu(0)
	n1, _ := mat.Nu(4)
	return d0 != 0 || n0 != n1 || math.Abs(n0*num.Mu0-1) > 1e-9
}

func sameSet(a, b []string) bool {
	if len(a) != len(b) {
		return false
	}
	seen := map[string]bool{}
	for _, x := range a {
		seen[x] = true
	}
	for _, x := range b {
		if !seen[x] {
			return false
		}
	}
	return true
}

func regionIndex(m *models.Model, name string) int {
	for i := range m.Regions {
		if m.Regions[i].Name == name {
			return i
		}
	}
	return -1
}

func (d *Design) note(format string, args ...any) {
	d.Notes = append(d.Notes, fmt.Sprintf(format, args...))
}

func (d *Design) gapQuantities(s *study.Result, opt DesignOptions) {
	m := s.Model
	cp, ok := m.CentreProbe()
	if !ok {
		d.note("gap: no point probe at the gap centre (the target's probe, one named gap-centre, or any point probe)")
		return
	}
	f := s.Field()
	// The probe as evaluated: on an interface, the low-permeability side.
	pr, ok := s.Probe(cp.Name)
	if !ok || !pr.Valid {
		d.note("gap: probe %s lies outside the mesh", cp.Name)
		return
	}
	bx, by := pr.Point.Bx, pr.Point.By
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
	d.uniformity(s, f, c, by, opt.Tolerances)
	if m.Gap > 0 && g.PoleWidth > 0 && by != 0 {
		d.fringing(s, f, c, by, g.PoleWidth)
	} else {
		d.note("fringing: needs the gap length (gap key or template) and a region named gap whose width is the pole face")
	}
}

func (d *Design) uniformity(s *study.Result, f gap.Field, c [2]float64, b0 float64, extra []float64) {
	tols := append([]float64(nil), gap.DefaultTolerances...)
	for _, t := range extra {
		if !slices.Contains(tols, t) {
			tols = append(tols, t)
		}
	}
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
			gf, err := gap.GoodFieldWidths(ss, centre, b0, gap.ComponentY, tols)
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
		reach, ok := gap.Reach(f, c, [2]float64{dir, 0}, n, b0, gap.DefaultEndFraction, step, limit)
		if ok {
			// End on the first sample past the crossing, where the field is
			// below the end fraction for sure: the interpolated crossing
			// itself may read just above it on another mesh and flip the
			// side to truncated.
			reach = math.Min(reach+step, limit)
		}
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
	if err == nil {
		d.bounds(s, opt.Bounds, cs)
	}
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

// bounds fills d.Energy.Bounds as mode asks.
func (d *Design) bounds(s *study.Result, mode BoundsMode, cs []circuit.Coil) {
	linear := s.Solution.Problem.Linear()
	if mode == NoBounds || (mode == LinearBounds && !linear) {
		return
	}
	b, err := study.CoEnergyBounds(s.Solution)
	if err != nil {
		d.note("co-energy bounds: %v", err)
		return
	}
	br := &BoundsReport{Lower: b.Lower, Upper: b.Upper, Guaranteed: b.Guaranteed, Note: b.Reason}
	if linear {
		driven := -1
		for i, c := range cs {
			if c.Current != 0 {
				if driven >= 0 {
					driven = -2
					break
				}
				driven = i
			}
		}
		if driven >= 0 {
			i2 := cs[driven].Current * cs[driven].Current
			br.Coil = cs[driven].Name
			br.InductanceH = &[2]float64{2 * b.Lower / i2, 2 * b.Upper / i2}
		}
	}
	d.Energy.Bounds = br
}

func (d *Design) saturation(s *study.Result, opt DesignOptions) {
	m := s.Model
	var regs []saturation.Region
	var corners [][2]float64
	var mirrors []saturation.Line
	var srcs []SatReport
	if m.Geometry == models.Axisymmetric {
		mirrors = []saturation.Line{{X0: 0, Y0: 0, X1: 0, Y1: 1}} // the axis r = 0
	}
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
		corners = append(corners, saturation.Corners(mesh.Polygon{X: r.X, Y: r.Y, Sweep: r.Sweep}, saturation.CornerOptions{Mirrors: mirrors})...)
		_, bEnd := c.TableEnd()
		regs = append(regs, saturation.Region{Tag: study.Tag(i), Name: r.Name, Curve: c, Limit: opt.SaturationLimit, TableEnd: bEnd})
		src := curveSource(c)
		src.Grade, src.GradeShortfalls = d.checkGrade(m, r, c)
		srcs = append(srcs, src)
	}
	if len(regs) == 0 {
		return
	}
	// A corner of one iron region is where the field of its neighbours
	// is singular too (a pole's root on an arm's face): every region
	// gets them all.
	for i := range regs {
		regs[i].Corners = corners
	}
	// The stop rule of the adaptive refinement and the final report
	// analyse the same solves: once per result and limit.
	type analysed struct {
		reps []saturation.Report
		err  error
	}
	a := s.Memo(saturationKey{opt.SaturationLimit}, func() any {
		reps, err := saturation.Analyse(s.Disc.Mesh, s.ElementB(), regs, saturation.Options{Gap: m.Gap, LinearB: linearB(s.Solution)})
		return analysed{reps, err}
	}).(analysed)
	reps, err := a.reps, a.err
	if err != nil {
		var nk *saturation.NoKneeError
		if !errors.As(err, &nk) {
			d.note("saturation: %v", err)
			return
		}
	}
	for i, r := range reps {
		d.Saturation = append(d.Saturation, SatReport{Region: r.Name, Knee: r.Knee, Mean: r.Mean, AboveKnee: r.AboveKnee,
			Peak: r.Peak, PeakAt: r.PeakAt, Radius: r.Radius, Max: r.Max, MaxAt: r.MaxAt, MaxAtCorner: r.MaxAtCorner, Limit: r.Limit, Pass: r.Pass,
			TableEnd: r.TableEnd, BeyondTable: r.BeyondTable, Curve: srcs[i].Curve, Source: srcs[i].Source, FromMemory: srcs[i].FromMemory,
			Grade: srcs[i].Grade, GradeShortfalls: srcs[i].GradeShortfalls})
	}
}

// checkGrade notes a warning when a region's material names a steel grade
// (IEC 60404-8-4 / EN 10106) and its curve falls below the grade's minimum
// polarisation, checked on the sheet (before stacking).
// It returns the grade and the shortfalls.
func (d *Design) checkGrade(m *models.Model, r *models.Region, c *materials.Curve) (string, []string) {
	def, ok := m.Material(r.Material)
	if !ok || def.Grade == "" {
		return "", nil
	}
	g, known := materials.LookupGrade(def.Grade)
	if !known {
		d.note("WARNING: material %q: unknown steel grade %q, not checked; 'polegap grades' lists the known ones", def.Name, def.Grade)
		return def.Grade, nil
	}
	var out []string
	for _, sf := range c.CheckGrade(g, def.Stacking) {
		out = append(out, sf.String())
		d.note("WARNING: material %q (region %s) falls short of grade %s: %v (%s)", def.Name, r.Name, g.Name, sf, g.Source)
	}
	return g.Name, out
}

// curveSource fills the curve fields of a SatReport: the library entry a
// curve came from, or the model's own data.
func curveSource(c *materials.Curve) SatReport {
	if e, ok := materials.CurveEntry(c); ok {
		return SatReport{Curve: e.Name, Source: e.Source, FromMemory: e.FromMemory()}
	}
	return SatReport{Source: "the model's own B-H data"}
}

// saturationKey keys the saturation analysis of a result (study.Result.Memo).
type saturationKey struct{ limit float64 }

// linearB returns each triangle's own flux density at its three corners
// when the solution is second order (B is then linear in each triangle,
// so the three points of the degree-2 quadrature rule fix it exactly),
// and nil for first order (B constant per triangle).
func linearB(sol *solver.Solution) [][3][2]float64 {
	m := sol.Problem.Mesh
	if m.Order() != 2 {
		return nil
	}
	qf := study.NewQuadField(sol, 2)
	l := qf.Rule.L
	if len(l) != 3 {
		panic("design: the degree-2 quadrature rule must have 3 points")
	}
	// B at point q is Σ_k l[q][k] B_k: invert the 3×3 matrix l (cofactors).
	var inv [3][3]float64
	det := l[0][0]*(l[1][1]*l[2][2]-l[1][2]*l[2][1]) - l[0][1]*(l[1][0]*l[2][2]-l[1][2]*l[2][0]) + l[0][2]*(l[1][0]*l[2][1]-l[1][1]*l[2][0])
	for i := 0; i < 3; i++ {
		for j := 0; j < 3; j++ {
			a, b := (j+1)%3, (j+2)%3
			c, e := (i+1)%3, (i+2)%3
			inv[i][j] = (l[a][c]*l[b][e] - l[a][e]*l[b][c]) / det
		}
	}
	out := make([][3][2]float64, m.NumTriangles())
	for t := range out {
		var pb [3][2]float64
		for q := 0; q < 3; q++ {
			p := qf.At(t, q)
			pb[q] = [2]float64{p.Bx, p.By}
		}
		for k := 0; k < 3; k++ {
			for q := 0; q < 3; q++ {
				out[t][k][0] += inv[k][q] * pb[q][0]
				out[t][k][1] += inv[k][q] * pb[q][1]
			}
		}
	}
	return out
}
