package vessels

import (
	"fmt"
	"strings"

	"heelwatch/engine"
)

// This file is where a scenario meets the vessel's connections between
// compartments ([[connection]]): a connection event names one.

// connectionNamed returns the name of the vessel's connection called name
// (ignoring case) and whether there is one.
func connectionNamed(v *engine.Vessel, name string) (string, bool) {
	for _, c := range v.Connections {
		if strings.EqualFold(strings.TrimSpace(c.Name), strings.TrimSpace(name)) {
			return c.Name, true
		}
	}
	return "", false
}

// connectionList says which connections the vessel has, for a message.
func connectionList(v *engine.Vessel) string {
	if len(v.Connections) == 0 {
		return " (it has no connections)"
	}
	var names []string
	for _, c := range v.Connections {
		names = append(names, c.Name)
	}
	return fmt.Sprintf(": %s", quotedList(names))
}
