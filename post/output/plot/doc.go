// Package plot draws polegap's figures with gonum/plot: triangle meshes
// coloured by region or by a field value, flux lines, and curves.
//
// Plotters take plain slices (node coordinates, triangle corner triples,
// one value or colour per triangle) and never a model or solver type, so
// that the numbers handed to them can be tested without rendering. Figures
// are saved through Save, which picks the format from the file extension
// (.png, .svg, .pdf) and writes the file atomically.
package plot
