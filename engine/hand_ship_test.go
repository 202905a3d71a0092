package engine

import (
	"math"
	"testing"
)

// TestHandShipOnBox: the ship's working, fed a box, gives the box's closed
// forms (HandMethod on a box, itself checked against Barrass & Derrett's
// bilging examples in hand_test.go): a wing space from the keel through
// the waterline and a double-bottom space wholly under water, on a box
// barge with G off the centreline. Every figure agrees to round-off.
func TestHandShipOnBox(t *testing.T) {
	h, err := NewBoxHull(80, 16, 8)
	if err != nil {
		t.Fatal(err)
	}
	for _, b := range []Box{{30, 42, 4, 8, 0, 8}, {10, 30, -8, 0, 0, 1.5}, {50, 70, -8, -3, 1, 8}} {
		c, err := NewCompartment(h, "space", b)
		if err != nil {
			t.Fatal(err)
		}
		c.Permeability = 0.85
		v, err := NewVessel(Vessel{Hull: h, Compartments: []*Compartment{c},
			Weights: []Weight{{Name: "all", MassT: 1.025 * 80 * 16 * 4.5, LCGM: 39, TCGM: 0.1, VCGM: 5.2, FSMTm: 120}}})
		if err != nil {
			t.Fatal(err)
		}
		d := v.Intact()
		d[0].Open = true
		box, err := HandMethod(v, d)
		if err != nil {
			t.Fatal(err)
		}
		ship, err := handShip(v, d)
		if err != nil {
			t.Fatal(err)
		}
		for _, q := range []struct {
			name string
			a, b float64
		}{
			{"sinkage", ship.SinkageM, box.SinkageM}, {"draft", ship.DraftM, box.DraftM},
			{"LCF", ship.LCFM, box.LCFM}, {"TCF", ship.TCFM, box.TCFM},
			{"I_T", ship.ITM4, box.ITM4}, {"I_L", ship.ILM4, box.ILM4},
			{"KB", ship.KBM, box.KBM}, {"BM", ship.BMM, box.BMM}, {"GM", ship.GMM, box.GMM},
			{"GML", ship.GMLM, box.GMLM}, {"heel", ship.HeelDeg, box.HeelDeg}, {"trim", ship.TrimM, box.TrimM},
			{"draft aft", ship.DraftAftM, box.DraftAftM}, {"draft fwd", ship.DraftFwdM, box.DraftFwdM},
		} {
			if math.Abs(q.a-q.b) > 1e-9*math.Max(1, math.Abs(q.b)) {
				t.Errorf("box %v: %s ship %.12g, box %.12g", b, q.name, q.a, q.b)
			}
		}
	}
}
