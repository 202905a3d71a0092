package vessels

import (
	"testing"

	"heelwatch/engine"
)

// The bundled ships teach good practice: each hole is on the shell of its
// compartment; the compartments hold the hull below the deck (all but
// 0.1 %); and intact she meets every criterion she is held to, so that the
// dashboard does not open in danger.
func TestBundledShipsAreSoundModels(t *testing.T) {
	for _, e := range Bundled() {
		v, info, err := Open(e.Name)
		if err != nil {
			t.Fatal(err)
		}
		for i, ci := range info.Compartments {
			h := ci.Hole
			if h == nil {
				continue
			}
			b := v.Compartments[i].Box
			if h.XM < b.X0 || h.XM > b.X1 || h.YM < b.Y0 || h.YM > b.Y1 || h.ZM < b.Z0 || h.ZM > b.Z1 {
				t.Errorf("%s: the hole into %q is outside it", e.Name, v.Compartments[i].Name)
			}
			if d := v.Hull.ShellDistance(h.XM, h.YM, h.ZM); !(d <= 0.05) {
				t.Errorf("%s: the hole into %q is %.2f m from the shell", e.Name, v.Compartments[i].Name, d)
			}
		}
		hull, unheld := engine.UnheldVolume(v)
		if unheld > 0.001*hull {
			t.Errorf("%s: %.1f m³ of %.1f m³ below the deck held by no compartment", e.Name, unheld, hull)
		}
		a := engine.Assess(v, v.Intact())
		for _, c := range a.Criteria {
			if !c.Indicator && !c.Pass {
				t.Errorf("%s intact fails %s %s: %s, found %.3f", e.Name, c.Set, c.Code, c.Requirement, c.Actual)
			}
		}
		for _, f := range a.Flags {
			if f.Severity == engine.Danger {
				t.Errorf("%s intact raises danger %s: %s", e.Name, f.Code, f.Message)
			}
		}
	}
}
