package models

import "testing"

func TestMainAndCentreProbe(t *testing.T) {
	m := &Model{Probes: []Probe{
		{Name: "line", Kind: ProbeLine},
		{Name: "p", Kind: ProbePoint},
		{Name: "gap-centre", Kind: ProbePoint},
	}}
	if got := m.MainProbe(); got != "line" {
		t.Errorf("MainProbe without a target = %q, want the first probe", got)
	}
	if p, _ := m.CentreProbe(); p.Name != "gap-centre" {
		t.Errorf("CentreProbe without a target = %q, want gap-centre", p.Name)
	}
	m.Target = &Target{Probe: "p"}
	if got := m.MainProbe(); got != "p" {
		t.Errorf("MainProbe = %q, want the target's", got)
	}
	if p, _ := m.CentreProbe(); p.Name != "p" {
		t.Errorf("CentreProbe = %q, want the target's point probe", p.Name)
	}
	m.Target.Probe = "line"
	if p, _ := m.CentreProbe(); p.Name != "gap-centre" {
		t.Errorf("CentreProbe with a line target = %q, want gap-centre", p.Name)
	}
	if _, ok := (&Model{}).CentreProbe(); ok {
		t.Error("a model without probes has no centre probe")
	}
}
