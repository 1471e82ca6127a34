package solver

import (
	"fmt"
	"math"

	"polegap/internal/num"
	"polegap/mesh"
)

// Material is what the solver needs of a material: its reluctivity
// ν = H/B (m/H) as a function of b2 = |B|² (T²), and the derivative dν/d(b2).
// A linear material returns (1/(μ0 μr), 0).
type Material interface {
	Nu(b2 float64) (nu, dnudb2 float64)
}

// Formulation selects the geometry of the 2D problem.
type Formulation int

const (
	// Planar: unknown Az(x, y), fields per metre of depth along z.
	Planar Formulation = iota
	// Axisymmetric: unknown Aφ(r, z) with r = x >= 0 and z = y; quantities
	// are integrated over the full revolution (2π).
	Axisymmetric
)

// String returns the formulation's name.
func (f Formulation) String() string {
	switch f {
	case Planar:
		return "planar"
	case Axisymmetric:
		return "axisymmetric"
	}
	return fmt.Sprintf("Formulation(%d)", int(f))
}

// Condition is the boundary condition on an outer edge.
type Condition int

const (
	// ZeroPotential: Dirichlet A = 0; flux runs parallel to the edge.
	ZeroPotential Condition = iota
	// FluxNormal: natural (Neumann) condition ν ∂A/∂n = 0; flux crosses
	// the edge at right angles (a symmetry plane of the field).
	FluxNormal
)

// String returns the condition's name.
func (c Condition) String() string {
	switch c {
	case ZeroPotential:
		return "zero-potential"
	case FluxNormal:
		return "flux-normal"
	}
	return fmt.Sprintf("Condition(%d)", int(c))
}

// PointCurrent is a line current (A) through one node, positive along +z
// (planar) or +φ (axisymmetric). It is ignored on a node whose potential is
// fixed.
type PointCurrent struct {
	Node    int32
	Current float64
}

// NodeValue holds a node at a given potential (Wb/m planar, Wb/m as Aφ
// axisymmetric). It overrides the boundary condition of the node.
type NodeValue struct {
	Node int32
	A    float64
}

// Problem is a magnetostatic problem on a mesh. Solve reads it and never
// modifies it.
type Problem struct {
	Mesh        *mesh.Mesh
	Formulation Formulation
	// Depth is the length along z (m) of a planar model; the solver works
	// per metre and leaves the multiplication to the caller.
	Depth float64
	// Materials is indexed by region tag (the values in Mesh.Region).
	Materials []Material
	// CurrentDensity is the source current density (A/m²) per region tag,
	// Jz (planar) or Jφ (axisymmetric); it may be nil or shorter than
	// Materials (missing entries are zero).
	CurrentDensity []float64
	// Magnetization is the magnetisation M (A/m) per region tag in the
	// constitutive law H = ν B − M (x, y components; r, z axisymmetric);
	// it may be nil. A magnet with remanence Br and reluctivity ν has
	// M = ν Br.
	Magnetization [][2]float64
	// Boundary gives the condition per edge marker. Boundary edges
	// (Nbr == -1) whose marker is absent are ZeroPotential; interior edges
	// are never constrained by their marker.
	Boundary map[int32]Condition
	// Identify lists node pairs that share one unknown (periodic and
	// Kelvin-transformation couplings). Boundary edges joined this way
	// need a FluxNormal marker, or they are held at zero.
	Identify [][2]int32
	// PointCurrents are line currents at nodes.
	PointCurrents []PointCurrent
	// Fixed holds nodes at given potentials (for instance a uniform
	// applied field A = B0 x on an outer boundary).
	Fixed []NodeValue
	// Exterior lists the regions that hold the Kelvin image of the space
	// outside a sphere, for an axisymmetric open boundary. Inversion in a
	// sphere of radius R is conformal with length scale s = R²/ρ'² (ρ' the
	// distance from the image centre); the field energy of the pulled-back
	// potential then carries the factor 1/s, so the solver multiplies the
	// reluctivity there by ρ'²/R². (A planar Kelvin disk needs no factor:
	// the 2D energy is invariant; leave this empty.) Fields evaluated in
	// such a region are those of the image problem.
	Exterior []Exterior
	// Locator, when not nil, is a point locator on Mesh that field
	// evaluation at points reuses (a study that locates probes already
	// has one); nil makes one on first use, shared by every solution of
	// a Prepared problem.
	Locator *mesh.Locator
}

// Exterior is the Kelvin image of the space outside a sphere of radius
// Radius: region Region, image centre (CX, CY) on the axis (CX = 0).
type Exterior struct {
	Region         int32
	CX, CY, Radius float64
}

// Linear reports whether every material of the problem is linear (its
// reluctivity the same at |B| = 0 and 2 T, with a zero derivative).
func (p *Problem) Linear() bool {
	for _, mat := range p.Materials {
		if mat != nil && !isLinear(mat) {
			return false
		}
	}
	return true
}

// isLinear reports whether a material's reluctivity is the same at
// |B| = 0 and 2 T, with a zero derivative at both.
func isLinear(mat Material) bool {
	nu0, d0 := mat.Nu(0)
	nu1, d1 := mat.Nu(4)
	return d0 == 0 && d1 == 0 && nu0 == nu1
}

// Check reports the first inconsistency of the problem as a
// *ProblemError: mesh arrays of the wrong length, indices out of range,
// triangles that are not counter-clockwise, regions without a material,
// non-finite data, negative radii in an axisymmetric model. Solve runs it
// first. It panics if p or p.Mesh is nil.
func (p *Problem) Check() error { return p.validate() }

// validate checks the problem and panics on programmer misuse (nil mesh)
// and returns a *ProblemError for inconsistent data.
func (p *Problem) validate() error {
	if p == nil || p.Mesh == nil {
		panic(errNilMesh)
	}
	if p.Locator != nil && p.Locator.Mesh() != p.Mesh {
		return &ProblemError{Field: "Locator", Reason: "built on another mesh"}
	}
	m := p.Mesh
	nt := m.NumTriangles()
	nn := m.NumNodes()
	if len(m.Tri) != 3*nt || len(m.Region) != nt || len(m.Y) != nn {
		return &ProblemError{Field: "Mesh", Reason: "array lengths disagree (Tri, Region, X, Y)"}
	}
	if m.Mid != nil && len(m.Mid) != 3*nt {
		return &ProblemError{Field: "Mesh.Mid", Reason: "needs 3 entries per triangle"}
	}
	if m.Curved != nil && (len(m.Curved) != nt || m.Mid == nil) {
		return &ProblemError{Field: "Mesh.Curved", Reason: "needs one entry per triangle of a second-order mesh"}
	}
	if len(m.Nbr) != 3*nt || len(m.EdgeMarker) != 3*nt {
		return &ProblemError{Field: "Mesh", Reason: "Nbr and EdgeMarker need 3 entries per triangle"}
	}
	if p.Formulation != Planar && p.Formulation != Axisymmetric {
		return &ProblemError{Field: "Formulation", Reason: fmt.Sprintf("unknown formulation %d", p.Formulation)}
	}
	for i, v := range m.Tri {
		if v < 0 || int(v) >= nn {
			return &ProblemError{Field: "Mesh.Tri", Reason: fmt.Sprintf("entry %d refers to node %d of %d", i, v, nn)}
		}
	}
	for i, v := range m.Mid {
		if v < 0 || int(v) >= nn {
			return &ProblemError{Field: "Mesh.Mid", Reason: fmt.Sprintf("entry %d refers to node %d of %d", i, v, nn)}
		}
	}
	if nt == 0 {
		return &ProblemError{Field: "Mesh", Reason: "no triangles"}
	}
	for t := 0; t < nt; t++ {
		i0, i1, i2 := m.Tri[3*t], m.Tri[3*t+1], m.Tri[3*t+2]
		det := (m.X[i1]-m.X[i0])*(m.Y[i2]-m.Y[i0]) - (m.X[i2]-m.X[i0])*(m.Y[i1]-m.Y[i0])
		if !(det > 0) {
			return &ProblemError{Field: "Mesh.Tri", Reason: fmt.Sprintf("triangle %d is not counter-clockwise or has zero area", t)}
		}
	}
	for t, r := range m.Region {
		if r < 0 || int(r) >= len(p.Materials) || p.Materials[r] == nil {
			return &ProblemError{Field: "Materials", Reason: fmt.Sprintf("triangle %d has region %d without a material", t, r)}
		}
	}
	tol := axisTol(m)
	for i := 0; i < nn; i++ {
		if !num.Finite(m.X[i]) || !num.Finite(m.Y[i]) {
			return &ProblemError{Field: "Mesh.X", Reason: fmt.Sprintf("node %d has a non-finite coordinate", i)}
		}
		if p.Formulation == Axisymmetric && m.X[i] < -tol {
			return &ProblemError{Field: "Mesh.X", Reason: fmt.Sprintf("node %d lies at r = %g < 0 in an axisymmetric model", i, m.X[i])}
		}
	}
	for i, j := range p.CurrentDensity {
		if !num.Finite(j) {
			return &ProblemError{Field: "CurrentDensity", Reason: fmt.Sprintf("region %d: %g", i, j)}
		}
	}
	for i, mg := range p.Magnetization {
		if !num.Finite(mg[0]) || !num.Finite(mg[1]) {
			return &ProblemError{Field: "Magnetization", Reason: fmt.Sprintf("region %d: %v", i, mg)}
		}
	}
	for i, pr := range p.Identify {
		if pr[0] < 0 || int(pr[0]) >= nn || pr[1] < 0 || int(pr[1]) >= nn {
			return &ProblemError{Field: "Identify", Reason: fmt.Sprintf("pair %d refers to nodes %v of %d", i, pr, nn)}
		}
	}
	for i, pc := range p.PointCurrents {
		if pc.Node < 0 || int(pc.Node) >= nn || !num.Finite(pc.Current) {
			return &ProblemError{Field: "PointCurrents", Reason: fmt.Sprintf("entry %d: node %d, current %g", i, pc.Node, pc.Current)}
		}
	}
	for i, e := range p.Exterior {
		if p.Formulation != Axisymmetric || !(e.Radius > 0) || !num.Finite(e.CX) || !num.Finite(e.CY) {
			return &ProblemError{Field: "Exterior", Reason: fmt.Sprintf("entry %d: an axisymmetric Kelvin image needs a positive radius and a finite centre", i)}
		}
	}
	for i, f := range p.Fixed {
		if f.Node < 0 || int(f.Node) >= nn || !num.Finite(f.A) {
			return &ProblemError{Field: "Fixed", Reason: fmt.Sprintf("entry %d: node %d, value %g", i, f.Node, f.A)}
		}
	}
	return nil
}

// axisTol is the distance from r = 0 within which a node counts as lying
// on the axis: 1e-10 of the model's extent.
func axisTol(m *mesh.Mesh) float64 {
	var ext float64
	for i := range m.X {
		ext = math.Max(ext, math.Max(math.Abs(m.X[i]), math.Abs(m.Y[i])))
	}
	return 1e-10 * ext
}

// elementNodes writes the nodes of triangle t (corners, then midside nodes
// for second order) into dst and returns the count.
func elementNodes(m *mesh.Mesh, t int, dst *[MaxNodes]int32) int {
	dst[0], dst[1], dst[2] = m.Tri[3*t], m.Tri[3*t+1], m.Tri[3*t+2]
	if m.Mid == nil {
		return 3
	}
	dst[3], dst[4], dst[5] = m.Mid[3*t], m.Mid[3*t+1], m.Mid[3*t+2]
	return 6
}
