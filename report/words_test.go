package report

import (
	"math"
	"testing"

	"heelwatch/engine"
)

// TestWordsSpecialCases: every word formatter on ordinary values and on its special
// cases, as Go's math tests its functions' special cases.
func TestWordsSpecialCases(t *testing.T) {
	nan, inf := math.NaN(), math.Inf(1)
	for _, tc := range []struct {
		got, want string
	}{
		{Fixed(1.2345, 2, "m"), "1.23 m"}, {Fixed(-0.001, 2, ""), "0.00"}, {Fixed(3, 1, "°"), "3.0°"},
		{Fixed(nan, 2, "m"), "—"}, {Fixed(-inf, 0, ""), "—"},
		{Signed(0.25, 2, "m"), "+0.25 m"}, {Signed(-0.25, 2, "m"), "-0.25 m"}, {Signed(0.001, 2, "m"), "0.00 m"}, {Signed(nan, 1, ""), "—"},
		// The same +0.004° heel reads as upright in every form.
		{Heel(0.004, 2), "upright"}, {Heel(0.004, 1), "upright"}, {HeelShort(0.004, 1), "0.0°"},
		{HeelWords(0.004), "0.00° upright"}, {HeelSide(0.004, 2), "upright"},
		{Heel(3.21, 1), "3.2° to starboard"}, {Heel(-0.5, 2), "0.50° to port"}, {HeelShort(-3.21, 1), "3.2° P"},
		{HeelShort(3.21, 1), "3.2° S"}, {HeelSide(-2, 1), "to port"}, {Heel(nan, 1), "—"}, {HeelShort(inf, 1), "—"},
		{Trim(0.41, 2), "0.41 m by the stern"}, {Trim(-0.12, 2), "0.12 m by the head"}, {Trim(0.001, 2), "even keel"},
		{TrimSense(0.5, 2), "by the stern"}, {TrimWords(0.0004), "0.000 m even keel"}, {Trim(nan, 2), "—"},
		{SideShort(engine.Port), "port"}, {SideShort(engine.Starboard), "stbd"}, {SideShort(engine.Both), "P+S"},
		{Duration(45), "45 s"}, {Duration(750), "12 min 30 s"}, {Duration(3900), "1 h 05 min"}, {Duration(0), "0 s"},
		{Duration(inf), "—"}, {Duration(-inf), "—"}, {Duration(nan), "—"}, {Duration(-1), "—"}, {Duration(1e300), "—"},
		{Permeability(0.85), "0.85"}, {Permeability(1), "1.00"}, {Permeability(0.005), "0.005"}, {Permeability(0.855), "0.855"},
		{Permeability(nan), "—"}, {Permeability(inf), "—"},
	} {
		if tc.got != tc.want {
			t.Errorf("got %q, want %q", tc.got, tc.want)
		}
	}
}
