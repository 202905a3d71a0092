package main

import (
	"strings"

	"heelwatch/engine"
)

// permFlag is --perm: NAME=μ items, the flag repeated or the items
// separated by commas. A comma is also a decimal mark ("Hold 2=0,85", as
// the dashboard takes it): a piece without "=" after a comma belongs to the
// item before, since a compartment's name holds no comma (the vessel file's
// reader refuses one). What the pieces then say is read by
// vessels.ParsePermeability, which refuses anything it cannot read.
type permFlag []string

func (p *permFlag) String() string { return strings.Join(*p, ",") }

func (p *permFlag) Set(s string) error {
	var items []string
	for _, piece := range strings.Split(s, ",") {
		if len(items) > 0 && !strings.Contains(piece, "=") {
			items[len(items)-1] += "," + piece
			continue
		}
		items = append(items, piece)
	}
	for _, it := range items {
		if it = strings.TrimSpace(it); it != "" {
			*p = append(*p, it)
		}
	}
	return nil
}

// compartmentNamed is the index of v's compartment called name, matched
// ignoring case (conventions, "Names"), and whether there is one.
func compartmentNamed(v *engine.Vessel, name string) (int, bool) {
	i := v.CompartmentIndex(strings.TrimSpace(name))
	return i, i >= 0
}
