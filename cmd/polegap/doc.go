/*
Polegap designs iron-core electromagnets with two-dimensional finite
elements: from a YAML model of the yoke, the coil and the air gap it
meshes the cross-section, solves for the magnetic vector potential and
reports what a magnet designer needs.

Usage:

	polegap <command> [arguments]

The commands are:

	demo       run the whole design job on the default embedded model
	solve      solve a model and print the field and design quantities
	size       find the ampere-turns for a target field and a coil that delivers them
	sweep      compute the excitation curve: gap field against ampere-turns
	merge      join the tables of a sharded sweep
	profile    sample Bx, By and |B| along a line probe
	compare    compare a measured excitation curve with the prediction, and calibrate
	searchcoil predict a search coil's flux linkage, to compare with an integrator reading
	check      check saturation, target field and field quality (exit 0 pass, 1 fail)
	mesh       mesh a model and print the mesh statistics
	materials  list the built-in materials, or show and plot B-H curves
	bench      measure the speed of each stage at 10k, 100k and 1M nodes
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
