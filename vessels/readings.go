package vessels

import (
	"fmt"
	"math"
	"os"
	"sort"
	"strings"

	"heelwatch/engine"
)

// LoadReadings reads the readings file at path for vessel v.
func LoadReadings(path string, v *engine.Vessel) ([]engine.Reading, error) {
	data, err := os.ReadFile(path)
	if err != nil {
		return nil, fmt.Errorf("readings file: %w", err)
	}
	return ParseReadings(path, data, v)
}

// ParseReadings reads a readings file (format = 1, one [[reading]] table per
// moment: minutes, heel_deg, drafts by mark name, levels by compartment
// name) for vessel v. Every problem is returned at once as Problems, with
// file, line and key: a name that is not one of v's marks or compartments,
// a draft below the keel or above the deck at side at its mark, a heel
// beyond 90°, a level below the bottom or above the top of its
// compartment, readings out of time order. The readings come back in the
// file's order.
func ParseReadings(file string, data []byte, v *engine.Vessel) ([]engine.Reading, error) {
	r, root, err := decode(file, data)
	if err != nil {
		return nil, err
	}
	r.format(root)
	ts := root.entries("reading", "what the crew read at one moment")
	root.finish()
	if len(ts) == 0 && len(r.probs) == 0 {
		r.addf("reading", "missing: give at least one [[reading]] with minutes and some drafts, heel_deg or levels")
	}
	var out []engine.Reading
	prev := math.Inf(-1)
	for _, t := range ts {
		rd, timeOK := r.reading(t, v)
		if timeOK && rd.Minutes < prev {
			r.addf(t.keyPath("minutes"), "%g min comes before the reading above (%g min): give the readings in time order", rd.Minutes, prev)
		}
		if timeOK {
			prev = rd.Minutes
		}
		out = append(out, rd)
	}
	if len(r.probs) > 0 {
		return nil, r.probs.sorted()
	}
	return out, nil
}

// reading reads one [[reading]] table; timeOK says its minutes were read.
func (r *reader) reading(t *table, v *engine.Vessel) (rd engine.Reading, timeOK bool) {
	rd.Minutes, timeOK = t.num("minutes", "minutes since the first reading", true)
	if timeOK && rd.Minutes < 0 {
		r.addf(t.keyPath("minutes"), "%g is negative: minutes count from the first reading, 0 or more", rd.Minutes)
		timeOK = false
	}
	if h, hOK := t.num("heel_deg", "degrees, + starboard down", false); hOK {
		if math.Abs(h) >= 90 {
			r.addf(t.keyPath("heel_deg"), "%g° cannot be true: a ship heeled 90° or more lies on her beam ends or over, and no inclinometer reads it (give degrees, + starboard down)", h)
		} else {
			rd.HeelDeg, rd.HasHeel = h, true
		}
	}
	if d, present := t.sub("drafts", false, `drafts by mark name, e.g. { "Fwd P" = 5.02 }`); present {
		rd.Drafts = r.markReadings(d, v)
	}
	if l, present := t.sub("levels", false, `levels by compartment name, e.g. { "Hold 2" = 1.35 }`); present {
		rd.Levels = r.levelReadings(l, v)
	}
	t.finish()
	if !t.has("drafts") && !t.has("levels") && !t.has("heel_deg") {
		r.addf(t.path, "holds nothing read: give drafts, heel_deg or levels")
	}
	return rd, timeOK
}

// sortedKeys returns the keys of a table in order, so that problems come
// out the same every time.
func sortedKeys(m map[string]any) []string {
	keys := make([]string, 0, len(m))
	for k := range m {
		keys = append(keys, k)
	}
	sort.Strings(keys)
	return keys
}

func (r *reader) markReadings(t *table, v *engine.Vessel) []engine.MarkReading {
	var out []engine.MarkReading
	var names []string
	for _, m := range v.DraftMarks {
		names = append(names, m.Name)
	}
	for _, k := range sortedKeys(t.m) {
		p := t.keyPath(k)
		t.asked = append(t.asked, k)
		idx := -1
		for i, m := range v.DraftMarks {
			if strings.EqualFold(strings.TrimSpace(m.Name), strings.TrimSpace(k)) {
				idx = i
			}
		}
		if idx < 0 {
			if len(names) == 0 {
				r.addf(p, "%q: the vessel file has no [[draft_mark]]s, so no draft can be read at a mark", k)
			} else {
				r.addf(p, "%q is not one of the vessel's draft marks: %s", k, quotedList(names))
			}
			continue
		}
		d, ok := number(t.m[k])
		if !ok || math.IsNaN(d) || math.IsInf(d, 0) {
			r.addf(p, "must be a finite number (the draft in metres), not %s", typeName(t.m[k]))
			continue
		}
		m := v.DraftMarks[idx]
		sec := v.Hull.SectionAt(m.XM)
		lo, hi := math.Inf(1), math.Inf(-1)
		for _, q := range sec {
			lo, hi = math.Min(lo, q.Z), math.Max(hi, q.Z)
		}
		switch {
		case d < lo:
			r.addf(p, "%g m cannot be true: it is under the keel at that mark (the shell's lowest point at x = %g m is %.2f m above the baseline); a mark reads nothing below the keel", d, m.XM, lo)
			continue
		case d > hi:
			r.addf(p, "%g m cannot be read: it is above the deck at side at that mark (%.2f m); no mark is painted there", d, hi)
			continue
		}
		out = append(out, engine.MarkReading{Mark: idx, DraftM: d})
	}
	// In the vessel's order of marks, as the crew goes round them.
	sort.Slice(out, func(i, j int) bool { return out[i].Mark < out[j].Mark })
	return out
}

func (r *reader) levelReadings(t *table, v *engine.Vessel) []engine.LevelReading {
	var out []engine.LevelReading
	for _, k := range sortedKeys(t.m) {
		p := t.keyPath(k)
		t.asked = append(t.asked, k)
		idx := -1
		for i, c := range v.Compartments {
			if strings.EqualFold(strings.TrimSpace(c.Name), strings.TrimSpace(k)) {
				idx = i
			}
		}
		if idx < 0 {
			var names []string
			for _, c := range v.Compartments {
				names = append(names, c.Name)
			}
			msg := fmt.Sprintf("%q is not a compartment of the vessel", k)
			if c := closest(k, names); c != "" {
				msg += fmt.Sprintf(" (did you mean %q?)", c)
			}
			r.addf(p, "%s", msg)
			continue
		}
		l, ok := number(t.m[k])
		if !ok || math.IsNaN(l) || math.IsInf(l, 0) {
			r.addf(p, "must be a finite number (the water's height above the compartment's lowest point, m), not %s", typeName(t.m[k]))
			continue
		}
		_, _, zmin, zmax := v.Compartments[idx].Solid().Extent()
		switch {
		case l < 0:
			r.addf(p, "%g m is negative: a level is the water's height above the compartment's lowest point, 0 when dry", l)
			continue
		case l > zmax-zmin+1e-6:
			r.addf(p, "%g m is more than the compartment's height (%.2f m): it cannot hold water above its top", l, zmax-zmin)
			continue
		}
		out = append(out, engine.LevelReading{Compartment: idx, LevelM: l})
	}
	return out
}

// TrendOptions returns what the file says of holes and pumps, for the
// trend of a diagnosis (engine.EstimateTrend).
func (info *Info) TrendOptions() engine.TrendOptions {
	o := engine.TrendOptions{Holes: map[int]engine.Hole{}, PumpsM3h: map[int]float64{}}
	if info == nil {
		return o
	}
	for i, c := range info.Compartments {
		if c.Hole != nil {
			o.Holes[i] = *c.Hole
		}
		if c.PumpM3h > 0 {
			o.PumpsM3h[i] = c.PumpM3h
		}
	}
	return o
}
