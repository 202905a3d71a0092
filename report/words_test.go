package report

import (
	"math"
	"testing"
)

func TestPermeabilityWords(t *testing.T) {
	for _, tc := range []struct {
		mu   float64
		want string
	}{
		{0.85, "0.85"}, {1, "1.00"}, {0.005, "0.005"}, {0.855, "0.855"}, {0.95, "0.95"},
		{math.NaN(), "—"}, {math.Inf(1), "—"},
	} {
		if got := Permeability(tc.mu); got != tc.want {
			t.Errorf("Permeability(%v) = %q, want %q", tc.mu, got, tc.want)
		}
	}
}
