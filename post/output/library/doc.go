// Package library presents the built-in materials for people: a listing
// with sources, sampled B(H) and μr(B) curves, and their figures.
package library
