// Package materials provides the magnetic materials of polegap: tabulated
// B-H curves with monotone interpolation, the reluctivity ν(B²) the
// finite-element solver needs, lamination stacking, linear materials,
// permanent magnets and a built-in library of common steels.
//
// # Contract
//
// Units are SI throughout: H in A/m, B in T, reluctivity ν = H/B in m/H,
// permeability in H/m, and b2 = |B|² in T². Mu0 is 4π·1e-7 H/m.
//
// Every material type has the method
//
//	Nu(b2 float64) (nu, dnudb2 float64)
//
// returning ν and dν/d(b2). The solver calls it once per element per Newton
// step, so it is allocation-free; for a Curve it costs a bucket look-up and
// one cubic (see BenchmarkCurveNu). NuTo evaluates a whole slice of b2
// into caller-owned slices.
//
// *Curve and Linear also give the energy density w = ∫ H dB and co-energy
// density w' = B H - w in J/m³ as functions of b2 (the Energetic
// interface), consistent with Nu: dw/db2 = ν/2 exactly, so a Newton line
// search on the energy functional and virtual-work forces see the same
// material as the residual.
//
// A Curve is built from a table of (H, B) points by NewCurve or
// ReadCurveCSV. The table is validated (finite, non-negative, strictly
// rising H and B, starting at or given the origin) and interpolated by
// monotone piecewise cubic Hermite pieces (slopes after Steffen 1990). The
// first piece has zero curvature at the origin, so that the odd extension
// B(-H) = -B(H) is smooth and ν(b2) has a finite derivative at b2 = 0. The
// slope at the last point is μ0, and past the last point the curve
// continues as the straight line B = B_last + μ0 (H - H_last): the curve is
// C1 across its last point and approaches μ0 at high H, as a saturated
// material must (B = μ0 (H + M) with M at its saturation value).
//
// Invariants of a Curve, checked by Check: B(H) is strictly increasing and
// C1; H(B) = ν B is therefore strictly increasing in B (the magnetic energy
// density is convex, which Newton's method relies on); ν > 0 everywhere and
// ν → 1/μ0 as b2 → ∞; Nu returns a C1 function of b2 together with its exact
// derivative, agreeing with H(B)/B to about 1e-9 relative.
//
// # Laminations and anisotropy
//
// A laminated yoke is modelled as a homogeneous medium with the stack's
// effective curve (Curve.Stacked): with k the stacking factor, the steel
// fraction of the stack's cross-section (0 < k <= 1),
//
//	B_eff(H) = k B_steel(H) + (1 - k) μ0 H.
//
// It holds for flux along the laminations, where the tangential H is the
// same in steel and insulation and the fluxes add by area (common
// practice; TestStacked checks it point by point). Flux across the
// laminations meets the insulation in series and is not modelled; keep the
// laminations in the plane of the 2-D model. Non-oriented sheet is nearly
// isotropic in its plane. Grain-oriented steel is not: its rolling
// direction is far more permeable than the transverse one, and the 2-D
// model uses one curve for all directions, so a grain-oriented curve is
// right only where the flux runs along the rolling direction; at corners
// and in T-joints, where it turns, the model is optimistic.
//
// # Sources
//
// Every library entry names the source of its data (Entry.Source):
// published tables are cited by document, table and year, and entries of
// typical values from memory say so (Entry.FromMemory), which the reports
// and check repeat wherever such a curve is used. CurveEntry finds the
// entry of a library curve.
//
// # Immutability and concurrency
//
// A Curve is read-only after construction. All its methods are safe for
// concurrent use; Stacked returns a new Curve (or the curve itself for
// k = 1). Curves from Lookup are built once and shared. Linear and Magnet
// are small value types.
//
// # Failures
//
// No method returns NaN. Bad tables, CSV files and stacking factors give
// errors (see errors.go) naming the offending row or line and what to do.
// Besides the plausibility bounds, a table whose slope changes so abruptly
// that ν cannot be tabulated with positive ν and rising H (in practice
// only when the slope falls by about five orders of magnitude at one row)
// is rejected with ErrSlope naming the row.
// A NaN argument to a method is a programmer error and panics with a
// "materials: ..." message; a negative b2 is treated as 0. Linear and
// Magnet values with invalid fields panic in Nu: validate user input with
// their Check methods first.
package materials
