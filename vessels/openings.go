package vessels

import (
	"strings"

	"heelwatch/engine"
)

// This file reads an opening's leads_to: the compartment water runs into
// through it (heelwatch conventions). Left out, it leads to a space not
// modelled, and counts as a point of downflooding; an opening into a
// compartment already flooded is no point of progressive flooding.

// leadsTo reads the opening's leads_to, "" when it is left out.
func (r *reader) leadsTo(t *table) string {
	s, _ := t.str("leads_to", false, "the name of the compartment the opening lets water into")
	return s
}

// checkLeadsTo reports an opening whose leads_to names no compartment of
// the file (names match ignoring case) and writes each name as the
// compartment spells it. ts are the opening tables read into openings, in
// the same order.
func (r *reader) checkLeadsTo(ts []*table, openings []engine.Opening, comps []*engine.Compartment) {
	byName := map[string]string{}
	for _, c := range comps {
		byName[strings.ToLower(c.Name)] = c.Name
	}
	for k := range openings {
		o := &openings[k]
		if o.LeadsTo == "" || k >= len(ts) {
			continue
		}
		if n, ok := byName[strings.ToLower(o.LeadsTo)]; ok {
			o.LeadsTo = n
			continue
		}
		msg := quoteName(o.LeadsTo) + " is not the name of a compartment in this file: give the compartment the opening lets water into, or leave leads_to out for a space not modelled"
		var names []string
		for _, c := range comps {
			names = append(names, c.Name)
		}
		if c := closest(o.LeadsTo, names); c != "" {
			msg += " (did you mean " + quoteName(c) + "?)"
		}
		r.addf(ts[k].keyPath("leads_to"), "%s", msg)
	}
}
