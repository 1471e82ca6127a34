// Package compsum is a compensated running sum for the quantities that
// add many terms of mixed size (areas, energies, forces): the error stays
// bounded whatever the number of terms, to first order (A. Neumaier,
// "Rundungsfehleranalyse einiger Verfahren zur Summation endlicher
// Summen", ZAMM 54, 1974; the Kahan–Babuška variant). The zero value is
// an empty sum.
package compsum
