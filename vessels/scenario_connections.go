package vessels

import "heelwatch/engine"

// This file is where a scenario meets the vessel's connections between
// compartments. This vessel model has none yet, so a connection event
// names nothing; it is kept apart so that it changes in one place when
// connections arrive.

// connectionNamed returns the vessel's connection called name (ignoring
// case) and whether there is one.
func connectionNamed(v *engine.Vessel, name string) (string, bool) { return "", false }

// connectionList says which connections the vessel has, for a message.
func connectionList(v *engine.Vessel) string { return " (it has no connections)" }
