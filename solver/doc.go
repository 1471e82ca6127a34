// Package solver assembles and solves the 2D magnetostatic finite-element
// problem for the magnetic vector potential, linear or with nonlinear
// B-H curves, and evaluates the fields of the solution.
//
// # Formulations and units
//
// SI units throughout: metres, amperes, tesla, webers per metre.
//
// Planar: the unknown is Az(x, y) and ∇·(ν ∇Az) = −Jz − (curl M)z, with
// B = curl(Az ẑ) = (∂A/∂y, −∂A/∂x). All integrals are per metre of depth:
// energies are in J/m, and multiplying by Problem.Depth is left to the caller
// (package post).
//
// Axisymmetric: x is the radius r >= 0 and y the axial coordinate z; the
// unknown is Aφ(r, z) and B = curl(Aφ φ̂) = (−∂A/∂z, (1/r) ∂(rA)/∂r). The
// weak form used is the r-weighted one for Aφ itself,
//
//	∫ ν [∂A/∂z ∂v/∂z + (∂A/∂r + A/r)(∂v/∂r + v/r)] r dr dz = ∫ Jφ v r dr dz,
//
// rather than the flux function ψ = rA with weight 1/r. The reason: on an
// element with an edge on the axis every basis function that is not held
// at zero vanishes on that edge, so it is r times a polynomial and the
// A/r terms are polynomials that quadrature integrates exactly, whereas the
// 1/r weight of the ψ form makes the stiffness of such elements diverge
// logarithmically. Aφ = 0 on the axis (nodes with |r| <= 1e-10 of the
// model's extent) is imposed automatically: it is the physical condition
// for a finite field on the axis. Bz on the axis is evaluated as the limit
// 2 ∂A/∂r. Energies are integrated over the full revolution (2π).
//
// Sign conventions: B = curl A; a positive current density (or
// PointCurrent) points out of the page (+z, planar) or along +φ
// (axisymmetric), and its field circulates counter-clockwise. The
// constitutive law is H = ν(|B|²) B − M, with ν from Material and M from
// Problem.Magnetization.
//
// # Discretisation
//
// P1 and P2 Lagrange triangles (types P1, P2) with Dunavant quadrature
// (RuleOfDegree). Outer edges are ZeroPotential (Dirichlet A = 0) unless
// their marker is FluxNormal (natural condition); Problem.Fixed holds nodes
// at given potentials. Fixed nodes are removed by condensation, so the
// reduced system stays symmetric positive definite. Problem.Identify joins
// nodes into one unknown through a DOF map. The sparsity pattern and the
// map from element entries to matrix positions are built once; every
// assembly after that is a pure scatter, split over goroutines that each
// own a spatial slab of unknowns (rows), so that no two write the same
// entry.
//
// Open boundary (Kelvin transformation, planar): mesh the model inside a
// circle whose edges carry a marker m, add the exterior disk with
// mesh.AddKelvinDisk, and set Boundary[m] = FluxNormal, Identify = the
// disk's Pairs and Fixed = {Infinity: 0}. A net current then returns at
// infinity, the fixed node. Axisymmetric: the space outside a sphere of
// radius R about a point of the axis maps into a half-disk of radius R
// about another point of the axis (shifted along z); list that region in
// Problem.Exterior, whose reluctivity the solver scales by ρ'²/R², and
// join the two rims with Identify (rim edges FluxNormal);
// mesh.AddKelvinHalfDisk meshes that half-disk and pairs the rims.
//
// Solve runs Newton-Raphson with the exact tangent
// K_t = K(ν) + 2 ν'(|B|²) (B·c_i)(B·c_j) and a backtracking line search;
// a linear problem converges in one step. Where Newton stalls (no descent
// along its direction, or a tangent that is not positive definite because
// a material's derivative is wrong) one damped fixed-point step with the
// secant matrix K(ν) is taken instead (Solution.FixedPointSteps counts
// them). Convergence means relative residual <= Options.Tol and an
// estimated next update <= Options.UpdateTol, never an iteration count.
// The symbolic factorization is computed once and reused for every step.
// A second-order system of 10k unknowns or more solved by a Cholesky
// solver with the default ordering is ordered on its vertex graph
// (midside unknowns after the earlier vertex of their edge): on the 100k
// benchmark C-core the analysis took 0.27 s instead of 0.78 s for 3 %
// more factor operations. Options.Steps Chord keeps a factorization for
// the following steps while each cuts the residual tenfold (sweeps use it
// from their extrapolated starts).
//
// Fields of a Solution: BTo and HTo per triangle, NodalBTo smoothed for
// plots, At at any point (through a mesh.Locator), Energies (stored energy
// and co-energy with EnergyDensity's rule, the one every energy polegap
// reports uses; Energy is the first of the two), and
// ErrorIndicatorTo, a Zienkiewicz-Zhu indicator per triangle for adaptive
// refinement.
//
// Prepare and Prepared.Solve split Solve in two for repeated solves on one
// mesh (excitation sweeps, target searches): numbering, pattern and the
// symbolic factorization are built once; currents, magnetisation,
// materials and fixed potentials may change between solves; a Solution
// keeps a snapshot of them. PrepareLike prepares a problem on the same
// mesh with its nodes moved (virtual work) reusing another's pattern and
// symbolic factorization; Solution.InterpolateTo carries a solution to
// another mesh, the start of Newton on a refined mesh (nested iteration).
//
// # What mutates, what panics
//
// Solve never modifies the Problem, the mesh or Options.Initial. Kernels
// named FooTo write into the caller's slice (nil is allocated). Numerical
// outcomes are typed errors (*SingularError, *MaterialError,
// *LinearSolveError, *NotConvergedError) and inconsistent data is a
// *ProblemError; no failed solve returns a Solution and no NaN escapes.
// A *NotConvergedError carries the residual history; a material failure
// met after Newton has started comes inside one (errors.As finds the
// *MaterialError too), and its Update is set only when HasUpdate says an
// update was estimated.
// Programmer misuse panics with a "solver: ..." message: a nil problem or
// mesh, a wrong-length Options.Initial or destination slice, a negative
// Options.Workers.
//
// # Invariants
//
// Triangles are counter-clockwise. Second-order midside nodes sit at edge
// midpoints, except on the triangles mesh.Elevate curved along an arc
// (mesh.Mesh.Curved): those are isoparametric, the image of the reference
// triangle under the quadratic map of their six nodes, and assembly, the
// residual and energy, B and point location evaluate the Jacobian of that
// map at each point (O. C. Zienkiewicz and R. L. Taylor, "The Finite
// Element Method", vol. 1, ch. 9; M. Zlámal, SIAM J. Numer. Anal. 10,
// 1973). They use the same quadrature rule as straight triangles: a rule
// exact for degree 2k − 2 keeps the optimal order of P_k isoparametric
// elements (P. G. Ciarlet and P.-A. Raviart, "The combined effect of curved
// boundaries and numerical integration in isoparametric finite element
// methods", 1972; from memory). Straight triangles keep the affine path, so
// a mesh without curved triangles gives bit for bit the results it gave
// before. A Solution's A has
// one entry per mesh node and is consistent: fixed nodes at their values,
// identified nodes equal.
package solver
