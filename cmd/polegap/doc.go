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
	merge      join the tables of a sharded sweep or scan
	scan       solve many variants of a design and tabulate their design quantities
	shim       optimise the pole-edge shims of a dipole for the widest good-field region
	length     compute the effective magnetic length and field integral of a dipole
	profile    sample Bx, By and |B| along a line probe
	compare    compare a measured excitation curve with the prediction, and calibrate
	searchcoil predict a search coil's flux linkage, to compare with an integrator reading
	check      check saturation, target field and field quality (exit 0 pass, 1 fail)
	mesh       mesh a model and print the mesh statistics
	materials  list the built-in materials, or show and plot B-H curves
	grades     list electrical-steel grades, or check a B-H curve against one
	bhfit      fit a full B-H curve to a few points and extrapolate it to saturation
	ringcurve  reduce a ring-sample test to a B-H curve with uncertainties
	bench      measure the speed of each stage at 10k, 100k and 1M nodes
	examples   list the embedded example models, or print one

Use "polegap help <command>" for more about a command. MODEL arguments
are model files, or the names of embedded examples.

Flags may come before, between or after the arguments. "--" ends the
flags: every argument after it is an argument, even one that starts with
a dash (polegap solve -- -draft.yaml).

Quantities. Every flag that takes a physical quantity reads a number with
an optional unit: 1.2T, 850mT, 12kG, 30mm, 2.5cm, 1in, 100mm2, 200A,
0.1kA, 32000At, 60V, 80C. A number without a unit is in the unit the model
file uses for that kind of quantity: lengths in the model's units (its
units: key), areas in those units squared, fields in tesla, currents in
ampere, ampere-turns in ampere-turns, voltages in volts, temperatures in
°C. The help of each command shows the unit of a bare number beside each
such flag. merge reads no model, so its --gap needs a unit. Units are
case-sensitive (mT, not MT); 1 G = 1e-4 T. Bare lengths and areas given to
--gap, --half-width, --area and --turns-area used to be metres: with a bare
number these flags print a note when the model's units are not metres.

Flag names are whole words and keep their meaning from command to
command: --tolerance, --vtu FILE for a VTK file, --png, --csv and --json
for the other outputs. Older spellings still work but are no longer
listed: --tol (solve --tolerance) and --out (mesh --vtu).

Pictures: --png FILE writes a .png, .svg or .pdf (by the extension; the
three look the same). A .png is 1600 pixels wide unless --dpi N sets its
resolution. The field map (solve) and the mesh picture show the magnet
with a margin; --whole-domain draws all of the meshed air.

Ctrl-C stops a long-running command (solve, size, sweep, compare, check,
demo, bench, scan) at its next safe point, between two solves: it exits
with status 1 (check: 2) and writes no result, except that an interrupted
sweep or scan keeps its finished points or variants in its --csv table,
marked partial. A
single solve cannot be stopped half-way: the command stops when it
ends. A second Ctrl-C ends polegap at once.

Every number on the command line is checked where it is parsed: it must
be finite and lie in its flag's range (a positive width, a tolerance in
(0, 1), a whole number of points), else the command exits with status 2
and says which range.

Budgets. Every long computation has a limit: Newton steps
(--max-iterations, 30), adaptive refinement (--max-levels, 10 meshes;
--max-nodes, 2,000,000 nodes), the mesh (the size estimate before meshing
refuses more than 20,000,000 triangles or the memory available, and names
a sliver or hair-thin gap that causes it; models/REFERENCE.md, mesh
min-feature) and wall time (--time-limit on every command, 2h). A
refinement budget reached still reports the numbers of the last mesh with
their estimates and says which budget to raise; the others end with an
error that names the limit, what was reached and what to change.
Refinement also stops after the first mesh when the field passes
1000 T: the excitation or the units are then wrong. Results that no
iron-core electromagnet gives (efficiency above 1 without magnets, fields
above 30 T, iron far past its B-H table, current densities beyond any
cooling) are reported with a warning and its reason.

Exit status is 0 on success, 1 when the work failed (a bad model, a solve
that did not converge) and 2 when the command line itself was wrong;
check exits 1 when a check fails, and size exits 3 when it prints its
table but no winding meets every limit.

Safety: the currents, stored energies and forces of real electromagnets
can injure. Disconnect supplies before touching a magnet and follow local
electrical codes and licensed engineering practice for anything built.
solve, size, sweep (past the model's current) and check print their
cautions quantified from the design: the stored energy, the switch-off
voltage, the poles' attraction, the coil's heating and, for water
cooling, the interlocks; 'polegap help' lists them in general.
*/
package main
