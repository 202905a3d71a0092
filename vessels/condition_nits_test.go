package vessels

import (
	"strings"
	"testing"

	"heelwatch/engine"
)

// TestConditionFileNits: the words a condition file's mistakes get.
func TestConditionFileNits(t *testing.T) {
	v, info := openBundled(t, "barge")
	for _, c := range []struct{ name, src, want string }{
		{"a weight's keys listed whole, x among them",
			"format = 1\nkeep = [\"Lightship\"]\n[[weight]]\nname = \"a\"\nmass = 1.0\nlcg = 40.0\nvcg = 1.0\nbogus = 2\n",
			"the keys allowed in weight[1] are fsm, lcg, mass, name, tcg, vcg, x"},
		{"a fill in per cent",
			"format = 1\nkeep = [\"Lightship\"]\n[[tank]]\nname = \"DB ballast aft\"\nfill = 80\n",
			"tank[1].fill: 80 is more than 1: fill is a fraction of the tank's capacity (μ × its volume inside the hull), 0 to 1: did you mean 0.80 (80 %)?"},
		{"a fill of 55.5 per cent",
			"format = 1\nkeep = [\"Lightship\"]\n[[tank]]\nname = \"DB ballast aft\"\nfill = 55.5\n",
			"did you mean 0.555 (55.5 %)?"},
	} {
		_, err := ParseCondition("c.toml", []byte(c.src), v, info)
		if err == nil || !strings.Contains(err.Error(), c.want) {
			t.Errorf("%s:\n got %v\nwant %s", c.name, err, c.want)
		}
	}
	_, err := ParseCondition("c.toml", []byte("format = 1\nkeep = [\"Lightship\"]\n[[tank]]\nname = \"DB ballast aft\"\nfill = 1.2\n"), v, info)
	if err == nil || strings.Contains(err.Error(), "did you mean") {
		t.Errorf("fill 1.2 (over full, not per cent): %v", err)
	}
}

// TestConditionRefusesStateFile: a state file saved from the dashboard
// given where a condition file belongs is named for what it is, with the
// way to take it up, instead of "vessel: unknown key".
func TestConditionRefusesStateFile(t *testing.T) {
	v, info := openBundled(t, "barge")
	c, err := ParseCondition("c.toml", []byte("format = 1\nkeep = [\"Lightship\"]\n"), v, info)
	if err != nil {
		t.Fatal(err)
	}
	d := v.Intact()
	d[0] = engine.SpaceState{Open: true, Permeability: 0.9}
	data, err := EncodeState(&State{Vessel: "barge", Condition: c, Damage: d, ConnectionsOpen: make([]bool, len(v.Connections))}, v)
	if err != nil {
		t.Fatal(err)
	}
	_, err = ParseCondition("state.toml", data, v, info)
	if err == nil || !strings.Contains(err.Error(), "this is a saved state") || !strings.Contains(err.Error(), "heelwatch --resume state.toml") || strings.Contains(err.Error(), "unknown key") {
		t.Errorf("a state file as a condition: %v", err)
	}
	if _, err := ParseState("state.toml", data, v, info); err != nil {
		t.Errorf("the state file itself: %v", err)
	}
}
