// Package adapt refines a model's mesh where the field needs it until a
// chosen quantity (by default the gap-centre field) stops changing by more
// than a requested relative accuracy.
//
// Each round solves the model, estimates the error of each triangle with
// the Zienkiewicz–Zhu recovery indicator (solver.ErrorIndicatorTo; O. C.
// Zienkiewicz and J. Z. Zhu, IJNME 24, 1987), marks the smallest set of
// triangles that holds a fixed fraction of the estimated error (bulk or
// Dörfler marking: W. Dörfler, "A convergent adaptive algorithm for
// Poisson's equation", SIAM J. Numer. Anal. 33, 1996), halves their size
// and re-meshes the whole model with that size as one more limit of the
// size field. The quantity's change between two rounds is its error
// estimate: the loop stops when it falls below the accuracy.
package adapt
