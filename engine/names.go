package engine

import "strings"

// SameName reports whether two names of compartments, openings,
// connections, weights or draft marks are the same name: names are matched
// ignoring case and the spaces around them (heelwatch's conventions,
// "Names"), so "hold 2" names "Hold 2".
func SameName(a, b string) bool {
	return strings.EqualFold(strings.TrimSpace(a), strings.TrimSpace(b))
}

// CompartmentIndex returns the index of v's compartment called name,
// matched as SameName matches, and whether there is one. The vessel file
// allows no two names that differ only in case, so the match is unique.
func (v *Vessel) CompartmentIndex(name string) (int, bool) {
	for i, c := range v.Compartments {
		if SameName(c.Name, name) {
			return i, true
		}
	}
	return -1, false
}
