// Package plot draws polegap's figures with gonum/plot: field maps (a
// raster of |B| interpolated inside each triangle, flux lines, haloed
// region outlines, labels with coil current marks), triangle meshes
// coloured by region, and curves with nice ticks, error bars and residual
// panels.
//
// Plotters take plain slices (node coordinates, triangle corner triples,
// one value or colour per triangle or corner) and never a model or solver
// type, so that the numbers handed to them can be tested without
// rendering. Lengths are in the caller's units (figures pass millimetres).
//
// Colours: FieldScale is a constant-chroma helix in CIE L*C*h, lightness
// linear from 22 to 94, every colour inside sRGB (colormap.go, with its
// tests on CIE L*, ΔE*ab and clipping); OverColour marks values above the
// scale's top.
//
// Output: Save, SaveGrid, SaveGridWidths and SaveStack pick the format from
// the file extension (.png, .svg, .pdf) and write atomically; the Render*
// functions draw into memory. Raster formats are DefaultPixels wide unless
// Options.DPI says otherwise; the SVG and PDF of a figure look like its
// PNG (vector colour bars; PDF text in code page 1252). Nothing here
// panics on data; a mismatch of slice lengths is a programmer's error and
// panics with a "plot: ..." message.
package plot
