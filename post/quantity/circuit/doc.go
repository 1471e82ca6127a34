// Package circuit computes the circuit quantities of a solved field: the
// flux linkage of each coil, its apparent and incremental inductance, and
// the stored energy and co-energy of the whole model.
//
// # Units and geometry
//
// SI units: webers (flux linkage), henries, joules, amperes. Planar
// quantities are multiplied by the problem's Depth, so they are for the
// whole magnet and not per metre; axisymmetric ones are for the full
// revolution (2π r under every integral). End windings and the end
// fringing of a planar magnet are not included (a 2D model has none).
//
// # Flux linkage
//
// A coil side of tag k spreads Turns conductors uniformly over its meshed
// cross-section area S_k (the same area post/study divides the
// ampere-turns by), so
//
//	λ = Σ_sides sense·N/S_k ∫_side A dΩ · depth       (planar)
//	λ = Σ_sides sense·N/S_k ∫_side 2π r A dr dz        (axisymmetric)
//
// integrated with the element's own shape functions and a Dunavant rule
// exact for the integrand (A of degree 1 or 2, times r). With this choice,
// for a linear problem, λ·I/2 equals the discrete stored energy to
// rounding (the Galerkin system is K a = f with f_i = ∫ J N_i).
//
// # Energy and co-energy
//
// W = ∫ ∫₀^B H·dB dV and W' = ∫ ∫₀^H B·dH dV, with the energy density of
// an isotropic material w(B) = ∫₀^|B| ν(b²) b db, integrated with 3-point
// Gauss–Legendre on panels of at most 0.02 T that break at the B-H
// table's points, and the co-energy density
// w' = ν|B|² − w (so w + w' = B·H). For a permanent magnet with a straight
// recoil line the same w is used, and w' = ν|B|² − w is the co-energy
// counted from the coercive point H = −M (whose derivative at constant
// current is the force); its −M·B term is left out, as in solver.Energy.
//
// # Incremental inductance
//
// dλ_i/dI_j is a central difference: two more solves on the same mesh with
// coil j's current changed by ±h·|I_j| (h = 1e-3 by default; h·1A when
// I_j = 0), each warm-started from the solution. The central difference
// has error O(h²) in the curvature of λ(I), about 1e-6 relative for
// h = 1e-3, well under the Newton tolerance's effect on λ; a one-sided
// difference would carry an O(h) error of the same size as the
// curvature itself. A linear problem gives dλ/dI = λ/I.
//
// # What mutates, what panics
//
// Nothing here modifies a Problem or a Solution; Incremental builds
// perturbed copies of the problem's current densities. A nil solution, a
// coil index out of range or a wrong-length destination panics with a
// "circuit: ..." message (programmer misuse). A coil side whose tag has
// no area is a *SideError, a failed perturbation solve the solver's typed
// error wrapped in *PerturbError, and a non-finite result a
// *NotFiniteError: no NaN is returned.
package circuit
