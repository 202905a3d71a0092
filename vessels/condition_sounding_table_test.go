package vessels

import (
	"fmt"
	"math"
	"testing"

	"heelwatch/engine"
)

// TestHopperSoundingFromTable: an officer reads a sounding off Hopper 2 S's
// capacity table and types it as sounding_m (upright, even keel): every row
// gives that row's volume. The tank's top slopes, so above 1 m the liquid
// stands in the pipe above the tank's top there; the table runs to full
// (2 m) and every row must be enterable.
func TestHopperSoundingFromTable(t *testing.T) {
	v, info := openBundled(t, "freighter")
	idx := -1
	for i, c := range v.Compartments {
		if c.Name == "Hopper 2 S" {
			idx = i
		}
	}
	if idx < 0 {
		t.Fatal("no Hopper 2 S")
	}
	cp := v.Compartments[idx]
	rows := engine.CapacityTable(cp, 1.025, 0.1)
	if top := rows[len(rows)-1].SoundingM; top < 1.99 {
		t.Fatalf("table to %g m: want the tank's height, 2 m", top)
	}
	for _, r := range rows {
		src := fmt.Sprintf("format = 1\nkeep = [%q]\nheel_deg = 0.0\ntrim_m = 0.0\n[[tank]]\nname = \"Hopper 2 S\"\nsounding_m = %v\n", v.Weights[0].Name, r.SoundingM)
		c, err := ParseCondition("c.toml", []byte(src), v, info)
		if err != nil {
			t.Errorf("sounding %v m from the table refused: %v", r.SoundingM, err)
			continue
		}
		nv, err := c.Apply(v)
		if err != nil {
			t.Fatal(err)
		}
		if got := nv.Compartments[idx].Liquid.Fill * cp.CapacityM3(); math.Abs(got-r.VolumeM3) > 1e-6 {
			t.Errorf("sounding %v m: %.7f m³, table %.7f m³", r.SoundingM, got, r.VolumeM3)
		}
	}
}
