package models

// MainProbe returns the name of the probe whose field a workflow reports
// when none is named: the target's probe, else the first probe, else "".
func (m *Model) MainProbe() string {
	if m.Target != nil {
		return m.Target.Probe
	}
	if len(m.Probes) > 0 {
		return m.Probes[0].Name
	}
	return ""
}

// CentreProbe returns the point probe at the gap centre: the target's probe
// if it is a point, else a point probe named gap-centre, else the first
// point probe; false when the model has no point probe.
func (m *Model) CentreProbe() (*Probe, bool) {
	if m.Target != nil {
		if p, ok := m.Probe(m.Target.Probe); ok && p.Kind == ProbePoint {
			return p, true
		}
	}
	if p, ok := m.Probe("gap-centre"); ok && p.Kind == ProbePoint {
		return p, true
	}
	for i := range m.Probes {
		if m.Probes[i].Kind == ProbePoint {
			return &m.Probes[i], true
		}
	}
	return nil, false
}
