/*
Polegap designs iron-core electromagnets with two-dimensional finite
elements: from a YAML model of the yoke, the coil and the air gap it
meshes the cross-section, solves for the magnetic vector potential and
reports what a magnet designer needs.

Usage:

	polegap <command> [arguments]

The commands are:

	demo       run the default embedded model end to end
	mesh       mesh a model and print the mesh statistics
	examples   list the embedded example models, or print one

Use "polegap help <command>" for more about a command. MODEL arguments
are model files, or the names of embedded examples.

Exit status is 0 on success, 1 when the work failed (a bad model, a solve
that did not converge) and 2 when the command line itself was wrong.

Safety: the currents, stored energies and forces of real electromagnets
can injure. Disconnect supplies before touching a magnet and follow local
electrical codes and licensed engineering practice for anything built.
*/
package main
