package report

import (
	"bytes"
	"strings"
	"testing"

	"heelwatch/engine"
)

// The network run's paths are the ways water may take, not the water's:
// an air pipe listed "sea → DB ballast aft" must not read as water going
// into a tank that stays dry.
func TestNetworkPathsAreNotWater(t *testing.T) {
	rep := engine.NetworkReport{Paths: []engine.NetPath{
		{Kind: "hole", Name: "hole in 2 wing void S", From: "sea", To: "2 wing void S"},
		{Kind: "opening", Name: "DB aft air pipe S", From: "sea", To: "DB ballast aft"},
	}}
	var b bytes.Buffer
	if err := NetworkText(&b, rep); err != nil {
		t.Fatal(err)
	}
	out := b.String()
	if !strings.Contains(out, "Paths it follows (an opening only while it is under water") {
		t.Errorf("the paths are not said to be paths:\n%s", out)
	}
}
