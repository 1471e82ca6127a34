// Package num holds the few numeric definitions that every layer of
// polegap shares, so that each is written once: the magnetic constant Mu0
// (H/m) and the finiteness test Finite.
//
// It imports nothing of polegap and may be imported by any package,
// including those that import nothing else of polegap (post/measure,
// post/quantity/searchcoil). Nothing here panics or mutates anything.
// materials.Mu0 re-exports Mu0 for users of the public API.
package num
