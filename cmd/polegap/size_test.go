package main

import (
	"encoding/json"
	"math"
	"strconv"
	"strings"
	"testing"
)

// TestSizeWaterLimits runs size on the bench dipole with water cooling
// in one circuit and a 2 bar supply: every listed row whose
// Darcy–Weisbach pressure drop (checked by hand in the coil package's
// TestWaterPressure) is over 2 bar is flagged "water" and is not the
// recommended row; the limits used are printed.
func TestSizeWaterLimits(t *testing.T) {
	code, out, errs := runCmd(t, "size", "--quick", "--cooling", "water", "--circuits", "1", "--water-pressure", "2bar", "bench-dipole")
	if code != 0 {
		t.Fatalf("size: code %d\n%s%s", code, out, errs)
	}
	for _, want := range []string{"current density ≤ 10 A/mm²", "Δp ≤ 2 bar per circuit", "bore speed ≤ 3 m/s", "common practice", "windings not listed", "* recommended:", "Darcy–Weisbach"} {
		if !strings.Contains(out, want) {
			t.Errorf("output lacks %q:\n%s", want, out)
		}
	}
	over, rows := 0, 0
	for _, line := range strings.Split(out, "\n") {
		f := strings.Fields(line)
		if len(f) < 14 || f[len(f)-2] != "40" || !strings.Contains(line, " hollow ") {
			continue // not a table row (the hottest conductor is 40 °C in each)
		}
		rows++
		dp, err := strconv.ParseFloat(f[len(f)-4], 64) // Δp bar, before ΔT, hot and limits
		if err != nil {
			t.Fatalf("row %q: %v", line, err)
		}
		if dp > 2 {
			over++
			if !strings.Contains(f[len(f)-1], "water") || f[0] == "*" {
				t.Errorf("row over the pressure limit not flagged, or recommended: %q", line)
			}
		}
	}
	if rows == 0 || over == 0 {
		t.Errorf("%d rows, %d over 2 bar: the test checks nothing\n%s", rows, over, out)
	}
}

// TestSizeNoneExit3: when no winding meets every limit size prints its
// table and the reason and exits with status 3.
func TestSizeNoneExit3(t *testing.T) {
	code, out, _ := runCmd(t, "size", "--quick", "--supply-voltage", "10mV", "bench-dipole")
	if code != exitNoWinding || !strings.Contains(out, "no winding meets every limit") || !strings.Contains(out, "exceed the supply voltage") {
		t.Errorf("code %d, want %d\n%s", code, exitNoWinding, out)
	}
}

// TestSizeSupply checks the supply figures of the recommended winding:
// the ramp's last point is V = L_inc dI/dt + I R (Kirchhoff's voltage
// law with Faraday's law), the stored energy ∫ I dΨ from the curve's
// five or more points matches the field solution's own energy (the
// energy identity W = ∫ i dλ, A. E. Fitzgerald, C. Kingsley and
// S. D. Umans, Electric Machinery, 6th ed., 2003, eq. 3.18) to 1 %
// (the trapezoid's error on a gently saturating curve), and the
// discharge resistor takes R_d/(R + R_d) of it at a peak of I R_d.
func TestSizeSupply(t *testing.T) {
	code, out, errs := runCmd(t, "size", "--quick", "--json", "--cooling", "water", "--ramp-time", "5s", "--discharge-resistor", "0.5ohm", "bench-dipole")
	if code != 0 {
		t.Fatalf("size: code %d\n%s", code, errs)
	}
	var r struct {
		Supply struct {
			Current     float64 `json:"current_A"`
			R           float64 `json:"resistance_ohm"`
			Linc        float64 `json:"incremental_inductance_H"`
			Energy      float64 `json:"stored_energy_J"`
			FieldEnergy float64 `json:"field_energy_J"`
			Rate        float64 `json:"ramp_rate_A_per_s"`
			Profile     []struct {
				Current float64 `json:"current_A"`
				L       float64 `json:"incremental_inductance_H"`
				V       float64 `json:"voltage_V"`
			} `json:"ramp_profile"`
			Discharge struct {
				Peak   float64 `json:"peak_voltage_V"`
				Energy float64 `json:"energy_absorbed_J"`
			} `json:"discharge"`
		} `json:"supply"`
		Cautions []string `json:"cautions"`
	}
	if err := json.Unmarshal([]byte(out), &r); err != nil {
		t.Fatal(err)
	}
	s := r.Supply
	if s.Current == 0 || len(s.Profile) != 11 || math.Abs(s.Rate-s.Current/5) > 1e-12*s.Rate {
		t.Fatalf("supply: %+v", s)
	}
	last := s.Profile[len(s.Profile)-1]
	if want := s.Linc*s.Rate + s.Current*s.R; math.Abs(last.V-want) > 1e-12*want {
		t.Errorf("ramp end %.12g V, want L_inc dI/dt + I R = %.12g V", last.V, want)
	}
	if math.Abs(s.Energy-s.FieldEnergy) > 0.01*s.FieldEnergy {
		t.Errorf("stored energy %.6g J from the curve, %.6g J from the field", s.Energy, s.FieldEnergy)
	}
	if math.Abs(s.Discharge.Peak-0.5*s.Current) > 1e-12*s.Current || math.Abs(s.Discharge.Energy-s.Energy*0.5/(0.5+s.R)) > 1e-12*s.Energy {
		t.Errorf("discharge %+v for %g A, %g J", s.Discharge, s.Current, s.Energy)
	}
	all := strings.Join(r.Cautions, " ")
	for _, want := range []string{"kJ", "across the coil", "flow switch", "licensed practice"} {
		if !strings.Contains(all, want) {
			t.Errorf("cautions lack %q: %q", want, r.Cautions)
		}
	}
}

// TestSizeBadWaterFlags: nonsense water and supply options are usage
// errors (exit 2).
func TestSizeBadWaterFlags(t *testing.T) {
	for _, args := range [][]string{
		{"--circuits", "0"}, {"--circuits", "two"}, {"--water-pressure", "-1bar"}, {"--water-speed", "0"},
		{"--water-rise", "-5"}, {"--ramp-time", "0s"}, {"--discharge-resistor", "-2ohm"},
	} {
		if code, _, errs := runCmd(t, append(append([]string{"size", "--quick"}, args...), "bench-dipole")...); code != 2 {
			t.Errorf("%v: code %d, want 2 (%s)", args, code, errs)
		}
	}
}
