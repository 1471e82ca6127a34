// Package prepare turns a loaded model into the plain inputs of the later
// stages: the planar straight-line graph and size field for the mesher, the
// mesh itself, and (with materials) the finite-element problem for the
// solver. It is the one place that knows both the model file's structure
// and the mesh's tags.
//
// Region tags: 0 is the air around the model (the default region); model
// region i (0-based, in file order) has tag i+1. Edge markers: 1 on region
// interfaces, MarkerLeft..MarkerTop on the sides of a box boundary,
// MarkerCircle on a circular boundary.
package study
