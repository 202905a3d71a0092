package vessels

import "testing"

// TestParsePermeability: the forms a person types, and what is refused.
func TestParsePermeability(t *testing.T) {
	for _, tc := range []struct {
		in   string
		want float64
		ok   bool
	}{
		{"0.85", 0.85, true}, {" .6 ", 0.6, true}, {"0,85", 0.85, true}, {"85%", 0.85, true},
		{"85", 0.85, true}, {"100", 1, true}, {"100 %", 1, true}, {"1", 1, true},
		{"0.5%", 0.005, true}, {"0,5 %", 0.005, true}, {"0.8549", 0.855, true},
		{"0", 0, false}, {"-0.2", 0, false}, {"1.01", 0, false}, {"101", 0, false}, {"150%", 0, false},
		{"", 0, false}, {"%", 0, false}, {"abc", 0, false}, {"NaN", 0, false}, {"Inf", 0, false},
		{"0.0004", 0, false}, {"1e2", 0, false},
	} {
		got, err := ParsePermeability(tc.in)
		if (err == nil) != tc.ok || (tc.ok && got != tc.want) {
			t.Errorf("ParsePermeability(%q) = %v, %v; want %v ok=%v", tc.in, got, err, tc.want, tc.ok)
		}
		if err != nil && err.Error() == "" {
			t.Errorf("ParsePermeability(%q): empty error", tc.in)
		}
	}
}
