package vessels

import (
	"fmt"
	"math"
	"strings"
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

// TestSoundingPastFullRefused: a sounding past full even upright (typed on
// the dashboard, which builds a Condition without a file's checks) is
// refused when applied, not read as full.
func TestSoundingPastFullRefused(t *testing.T) {
	v, info := openBundled(t, "barge")
	c, err := ParseCondition("c.toml", []byte("format = 1\nkeep = [\"Lightship\"]\n[[tank]]\nname = \"DB ballast aft\"\nsounding_m = 0.5\n"), v, info)
	if err != nil {
		t.Fatal(err)
	}
	c.Tanks[0].SoundingM = 1.5 // the tank is 1 m high
	if _, err := c.Apply(v); err == nil || !strings.Contains(err.Error(), "above the tank's top") {
		t.Errorf("1.5 m in a 1 m tank: %v", err)
	}
}

// TestSoundingFullAtHerOwnHeel: Hopper 2 S sounded 2.0 m (full upright, the
// table's last row) with no heel or trim given, the ship listed 14° to
// starboard by a weight: at that heel the sloping top at the pipe is lower
// (the tank is full at about 1.8 m there), and the sounding reads as full
// instead of being refused mid-way through the solve.
func TestSoundingFullAtHerOwnHeel(t *testing.T) {
	v, info := openBundled(t, "freighter")
	src := "format = 1\nkeep = ["
	for i, w := range v.Weights {
		if i > 0 {
			src += ", "
		}
		src += fmt.Sprintf("%q", w.Name)
	}
	src += "]\n[[weight]]\nname = \"Listing weight\"\nmass = 150.0\nlcg = 50.0\ntcg = 6.0\nvcg = 3.0\n[[tank]]\nname = \"Hopper 2 S\"\nsounding_m = 2.0\n"
	c, err := ParseCondition("c.toml", []byte(src), v, info)
	if err != nil {
		t.Fatal(err)
	}
	nv, err := c.Apply(v)
	if err != nil {
		t.Fatal(err)
	}
	pos, err := engine.Solve(nv, nv.Intact())
	if err != nil {
		t.Fatal(err)
	}
	cp := nv.Compartments[c.Tanks[0].Compartment]
	if full, _ := cp.FullSoundingM(c.Tanks[0].Pipe, pos.Plane); pos.HeelDeg < 10 || full > 1.95 {
		t.Fatalf("heel %.2f°, full at %.3f m: the case does not test what it says", pos.HeelDeg, full)
	}
	if f := cp.Liquid.Fill; f != 1 {
		t.Errorf("fill %g, want full", f)
	}
}
