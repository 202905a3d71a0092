package main

import (
	"fmt"

	"heelwatch/engine"
)

// strengthWords says for check whether the hull girder's still-water shear
// force and bending moment are worked out, at which read-out points and
// against which permissible values, or why not (engine.StrengthMissing).
func strengthWords(v *engine.Vessel) string {
	if why := engine.StrengthMissing(v); why != "" {
		return "not worked out: " + why
	}
	pts := v.Girder.Points
	if len(pts) == 0 {
		return "worked out; no read-out points in the file: read at every tenth of the length, no permissible values"
	}
	sea, harbour := 0, 0
	for _, p := range pts {
		if p.Sea.ShearKN > 0 || p.Sea.HogKNm > 0 || p.Sea.SagKNm > 0 {
			sea++
		}
		if p.Harbour.ShearKN > 0 || p.Harbour.HogKNm > 0 || p.Harbour.SagKNm > 0 {
			harbour++
		}
	}
	use := "sea"
	if v.Girder.Harbour {
		use = "harbour"
	}
	return fmt.Sprintf("worked out at %s (%s … %s); permissible at sea at %d, in harbour at %d; %s in use",
		plural(len(pts), "read-out point"), pts[0].Name, pts[len(pts)-1].Name, sea, harbour, use)
}
