package main

import (
	"fmt"
	"strings"

	"heelwatch/engine"
)

// connectionHelp is the help line of --connection, shared by solve and flood.
const connectionHelp = `  --connection NAME=open|closed
                      set a door, hatch, duct, pipe or cross-flooding valve of
                      the vessel file open or closed for this run (repeat the
                      flag or separate with commas); names ignore case
`

// applyConnections sets the connections named in items ("NAME=open" or
// "NAME=closed") on a copy of v. It returns a message saying what is wrong
// when an item cannot be used.
func applyConnections(v *engine.Vessel, items []string) (*engine.Vessel, string) {
	for _, item := range items {
		eq := strings.LastIndexByte(item, '=')
		if eq < 0 {
			return nil, fmt.Sprintf("--connection %q: write NAME=open or NAME=closed", item)
		}
		name, state := strings.TrimSpace(item[:eq]), strings.ToLower(strings.TrimSpace(item[eq+1:]))
		var open bool
		switch state {
		case "open":
			open = true
		case "closed", "shut":
		default:
			return nil, fmt.Sprintf("--connection %q: the state %q is neither open nor closed", item, state)
		}
		i := -1
		for k, c := range v.Connections {
			if strings.EqualFold(c.Name, name) {
				i = k
			}
		}
		if i < 0 {
			var b strings.Builder
			fmt.Fprintf(&b, "--connection: %q is not a connection of %s.", name, v.Name)
			if len(v.Connections) == 0 {
				b.WriteString(" Its vessel file has no [[connection]] tables.")
			} else {
				b.WriteString(" The connections are:")
				for _, c := range v.Connections {
					state := "closed"
					if c.Open {
						state = "open"
					}
					fmt.Fprintf(&b, "\n  %s (%s, %s)", c.Name, c.Kind, state)
				}
			}
			return nil, b.String()
		}
		v = v.WithConnection(i, open)
	}
	return v, ""
}
