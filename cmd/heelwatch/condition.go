package main

import (
	"io"
	"path/filepath"
	"strings"

	"heelwatch/engine"
	"heelwatch/vessels"
)

// openShip opens a vessel (a bundled name or a file; "" for the default)
// with the condition file at condition ("" for the file's own loading
// condition). On failure it prints why to stderr and returns the exit
// status to end with.
func openShip(vessel, condition string, stderr io.Writer) (*engine.Vessel, *vessels.Info, int) {
	v, info, status := openVessel(vessel, stderr)
	if status != exitOK {
		return nil, nil, status
	}
	v, _, status = withCondition(v, info, condition, stderr)
	return v, info, status
}

// withCondition loads the ship v with the condition file at path ("" for
// none: v as it is). On failure it prints every problem to stderr and
// returns the exit status to end with. The condition's name (else its
// file's name) becomes info's condition.
func withCondition(v *engine.Vessel, info *vessels.Info, path string, stderr io.Writer) (*engine.Vessel, *vessels.Condition, int) {
	if path == "" {
		return v, nil, exitOK
	}
	c, err := vessels.LoadCondition(path, v, info)
	var nv *engine.Vessel
	if err == nil {
		nv, err = c.Apply(v)
	}
	if err != nil {
		return nil, nil, refuse(stderr, "heelwatch", path, "nothing was computed", err, "condition "+path)
	}
	if info != nil {
		info.Condition = c.Name
		if info.Condition == "" {
			info.Condition = strings.TrimSuffix(filepath.Base(path), filepath.Ext(path))
		}
	}
	return nv, c, exitOK
}

// resumeState loads the ship base with the state file at path (its
// condition and its connections' states) for the dashboard to take up.
func resumeState(base *engine.Vessel, info *vessels.Info, path string, stderr io.Writer) (*engine.Vessel, *vessels.State, int) {
	s, err := vessels.LoadState(path, base, info)
	var v *engine.Vessel
	if err == nil {
		v, err = s.Condition.Apply(base)
	}
	if err != nil {
		return nil, nil, refuse(stderr, "heelwatch", path, "nothing was taken up", err, "--resume "+path)
	}
	for i, open := range s.ConnectionsOpen {
		if v.Connections[i].Open != open {
			v = v.WithConnection(i, open)
		}
	}
	if info != nil {
		info.Condition = s.Condition.Name
		if info.Condition == "" {
			info.Condition = strings.TrimSuffix(filepath.Base(path), filepath.Ext(path))
		}
	}
	return v, s, exitOK
}

// openIn names the compartments open to the sea in d, in the ship's order.
func openIn(v *engine.Vessel, d engine.Damage) []string {
	out := []string{}
	for i, s := range d {
		if s.Open {
			out = append(out, v.Compartments[i].Name)
		}
	}
	return out
}
