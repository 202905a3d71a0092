package vessels

import (
	"math"
	"os"
	"path/filepath"
	"reflect"
	"strings"
	"testing"

	"heelwatch/engine"
)

// A state written and read back is the same state, and the ship loaded
// with its condition floats as she did.
func TestStateRoundTrip(t *testing.T) {
	v, info := openBundled(t, "freighter")
	c, err := LoadCondition("../testdata/conditions/freighter-ballast-departure.toml", v, info)
	if err != nil {
		t.Fatal(err)
	}
	nv, err := c.Apply(v)
	if err != nil {
		t.Fatal(err)
	}
	d := nv.Intact()
	d[1] = engine.SpaceState{Open: true, Permeability: 0.85}
	d[4] = engine.SpaceState{WaterM3: 12.5}
	s := &State{Vessel: "freighter", Condition: c, Damage: d, ConnectionsOpen: make([]bool, len(v.Connections)),
		Readings: []engine.Reading{{Minutes: 0, HeelDeg: 1.5, HasHeel: true, Drafts: []engine.MarkReading{{Mark: 0, DraftM: 4.9}}}}}
	data, err := EncodeState(s, nv)
	if err != nil {
		t.Fatal(err)
	}
	back, err := ParseState("s.toml", data, v, info)
	if err != nil {
		t.Fatalf("%v\n%s", err, data)
	}
	if !reflect.DeepEqual(back.Damage, d) || back.Vessel != "freighter" || !reflect.DeepEqual(back.Readings, s.Readings) {
		t.Errorf("read back %+v\nfrom\n%s", back, data)
	}
	nv2, err := back.Condition.Apply(v)
	if err != nil {
		t.Fatal(err)
	}
	p1, _ := engine.Solve(nv, d)
	p2, _ := engine.Solve(nv2, back.Damage)
	if math.Abs(p1.DraftAftM-p2.DraftAftM) > 1e-9 || math.Abs(p1.HeelDeg-p2.HeelDeg) > 1e-9 {
		t.Errorf("saved %+v, read back %+v", p1, p2)
	}
	if got, _ := StateVessel(writeTemp(t, data)); got != "freighter" {
		t.Errorf("StateVessel %q", got)
	}
	// The condition alone reads back as a condition file too.
	cdata, err := EncodeCondition(c, nv)
	if err != nil {
		t.Fatal(err)
	}
	if _, err := ParseCondition("c.toml", cdata, v, info); err != nil {
		t.Errorf("%v\n%s", err, cdata)
	}
}

func TestStateProblems(t *testing.T) {
	v, info := openBundled(t, "barge")
	src := "format = 1\nkeep = [\"Lightship\"]\n[[space]]\nname = \"Hold middle\"\nopen = true\n[[space]]\nname = \"Hold aft\"\nopen = true\nwater_m3 = 5.0\n"
	_, err := ParseState("s.toml", []byte(src), v, info)
	for _, want := range []string{`s.toml:4: space[1].name: "Hold middle" is not a compartment`, `s.toml:9: space[2].water_m3: a compartment open to the sea holds no separate water`} {
		if err == nil || !strings.Contains(err.Error(), want) {
			t.Errorf("got %v\nwant %s", err, want)
		}
	}
}

func TestWriteFileSafelyKeepsTheOldFileOnFailure(t *testing.T) {
	dir := t.TempDir()
	p := filepath.Join(dir, "c.toml")
	if err := WriteFileSafely(p, []byte("one")); err != nil {
		t.Fatal(err)
	}
	if err := WriteFileSafely(p, []byte("two")); err != nil {
		t.Fatal(err)
	}
	if b, _ := os.ReadFile(p); string(b) != "two" {
		t.Errorf("file holds %q", b)
	}
	// A directory where the file should go: the rename fails, nothing is
	// left behind and the directory is untouched.
	sub := filepath.Join(dir, "d")
	os.Mkdir(sub, 0o755)
	os.WriteFile(filepath.Join(sub, "keep"), []byte("x"), 0o644)
	if err := WriteFileSafely(sub, []byte("three")); err == nil {
		t.Error("wrote over a directory")
	}
	if es, _ := os.ReadDir(dir); len(es) != 2 {
		t.Errorf("left behind: %v", es)
	}
}

func TestConditionOfGivesTheSameShip(t *testing.T) {
	v, _ := openBundled(t, "freighter")
	nv, err := ConditionOf(v, "").Apply(v)
	if err != nil {
		t.Fatal(err)
	}
	p0, _ := engine.Solve(v, v.Intact())
	p1, _ := engine.Solve(nv, nv.Intact())
	if p0.DraftAftM != p1.DraftAftM || p0.HeelDeg != p1.HeelDeg {
		t.Errorf("%v vs %v", p0, p1)
	}
}

func writeTemp(t *testing.T, data []byte) string {
	p := filepath.Join(t.TempDir(), "s.toml")
	os.WriteFile(p, data, 0o644)
	return p
}
