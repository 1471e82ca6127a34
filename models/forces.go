package models

import (
	"strings"

	"go.yaml.in/yaml/v3"
)

// Part is a named set of regions whose magnetic force is reported: a pole
// piece, a yoke half, a keeper, an armature.
//
//	forces:
//	  upper-half: {regions: [upper-pole, upper-arm]}
//
// The force is computed on the regions together from the Maxwell stress
// in the air around them, so a part must be surrounded by air: where it
// would touch other iron, model the joint as a thin air slit.
type Part struct {
	Name    string
	Regions []string
	Pos     Pos
}

// forces decodes the forces mapping: part name -> {regions: [...]}.
func (d *decoder) forces(m *Model, n *yaml.Node) {
	f, _ := d.mapping(n, "forces", nil, "part name -> {regions: [region names]}")
	if f == nil {
		return
	}
	for _, name := range f.keys {
		path := f.sub(name)
		if strings.TrimSpace(name) == "" {
			d.fail(f.key[name], path, "a force part needs a name")
			continue
		}
		pf, _ := d.mapping(f.val[name], path, []string{"regions"}, "a force part")
		if pf == nil {
			continue
		}
		v := d.need(pf, "regions", "add regions: [names of the regions that make up the part]")
		if v == nil {
			continue
		}
		items, ok := d.list(v, pf.sub("regions"), "region names")
		if !ok {
			continue
		}
		p := Part{Name: name, Pos: pos(f.key[name], path)}
		for i, it := range items {
			s, ok := d.str(it, pf.sub("regions")+"["+itoa(i)+"]", "a region name")
			if !ok {
				continue
			}
			if _, found := m.Region(s); !found {
				d.fail(it, pf.sub("regions")+"["+itoa(i)+"]", "no region named %q; a force part lists regions defined under regions (or by the template)", s)
				continue
			}
			p.Regions = append(p.Regions, s)
		}
		if len(p.Regions) == len(items) && len(items) > 0 {
			m.Forces = append(m.Forces, p)
		}
	}
}

func itoa(i int) string {
	if i < 10 {
		return string(rune('0' + i))
	}
	return itoa(i/10) + string(rune('0'+i%10))
}
