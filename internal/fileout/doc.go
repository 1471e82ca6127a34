// Package fileout writes output files atomically: the content goes to a
// temporary file in the destination's folder, which is renamed over the
// destination only once it is complete and synced. An interrupted or failed
// write leaves no half-written file behind.
package fileout
