package vessels

import "heelwatch/engine"

// markSides are the values of a draft mark's side key.
var markSides = []string{"port", "starboard", "centre"}

// draftMarks reads the [[draft_mark]] tables: name, x and side. A mark
// must lie within the hull's length (where there is shell to paint it on).
func (r *reader) draftMarks(ts []*table, hull *engine.Hull) []engine.DraftMark {
	names := map[string]string{}
	var out []engine.DraftMark
	for _, t := range ts {
		var m engine.DraftMark
		var ok [3]bool
		m.Name, ok[0] = r.name(t, names, "draft mark")
		m.XM, ok[1] = t.num("x", "m from the aft perpendicular", true)
		side, sideOK := t.choice("side", true, markSides)
		ok[2] = sideOK
		switch side {
		case "port":
			m.Side = engine.Port
		case "starboard":
			m.Side = engine.Starboard
		default:
			m.Side = engine.Both
		}
		t.finish()
		if hull != nil && ok[1] {
			xmin, xmax, _, _ := hull.Solid().Extent()
			if m.XM < xmin || m.XM > xmax {
				r.addf(t.keyPath("x"), "%g m is off the hull, which runs from x = %g to %g m: a mark is painted on the shell", m.XM, xmin, xmax)
				continue
			}
		}
		if ok[0] && ok[1] && ok[2] {
			out = append(out, m)
		}
	}
	return out
}

// MarkSideName is the file's word for a mark's side.
func MarkSideName(s engine.Side) string {
	switch s {
	case engine.Port:
		return "port"
	case engine.Starboard:
		return "starboard"
	}
	return "centre"
}
