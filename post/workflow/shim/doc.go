// Package shim optimises the pole-edge shims of a dipole (a c-core or
// h-core template): the height and width of a step, or of a bevel (a
// ramp towards the edge), at each pole-face edge (models.Shim) that give the
// widest good-field region — the half-width along the mid-plane within
// which |ΔB/B0| stays below a tolerance, 1e-4 by default — at the
// operating current, or the narrowest such region over a list of currents
// (saturation moves the optimum).
//
// The search starts from Rose's shim proportions (M. E. Rose, "Magnetic
// field corrections in the cyclotron", Phys. Rev. 53, 715, 1938; see
// Rose) and runs the Nelder–Mead simplex method (J. A. Nelder and R. Mead,
// Computer Journal 7, 308, 1965; gonum.org/v1/gonum/optimize) on full
// nonlinear solves of the model with the shim written into its template
// (models.ParseWith). No shim below the template's shim-min is ever
// solved or returned: such a point scores worse than no shim. When no
// shim beats the unshimmed pole, the result is no shim.
//
// Units: metres and tesla. Every solve is independent of the others, so
// the result does not depend on what ran before.
package shim
