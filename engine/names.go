package engine

import "strings"

// SameName reports whether two names of compartments, openings,
// connections, weights or draft marks are the same name: names are matched
// ignoring case and the spaces around them (heelwatch's conventions,
// "Names"), so "hold 2" names "Hold 2".
func SameName(a, b string) bool {
	return strings.EqualFold(strings.TrimSpace(a), strings.TrimSpace(b))
}
