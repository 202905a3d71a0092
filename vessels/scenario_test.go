package vessels_test

import (
	"errors"
	"os"
	"path/filepath"
	"strings"
	"testing"

	"heelwatch/engine"
	"heelwatch/vessels"
)

func TestBundledScenariosRead(t *testing.T) {
	list := vessels.BundledScenarios()
	if len(list) < 2 {
		t.Fatalf("bundled scenarios: %v", list)
	}
	for _, b := range list {
		sc, err := vessels.OpenScenario(b.Name)
		if err != nil {
			t.Fatalf("%s: %v", b.Name, err)
		}
		if sc.Minutes <= 0 || len(sc.Events) == 0 || sc.Vessel == nil {
			t.Errorf("%s: %+v", b.Name, sc)
		}
		breaches := 0
		for _, e := range sc.Events {
			if e.Kind == engine.DrillBreach {
				breaches++
			}
		}
		if breaches == 0 {
			t.Errorf("%s: no breach", b.Name)
		}
	}
}

const goodHead = "format = 1\nvessel = \"freighter\"\nminutes = 30\n"

// TestScenarioRefused: bad scenarios are refused with file, line and key.
func TestScenarioRefused(t *testing.T) {
	cases := []struct {
		name, src, key string
		line           int
		msg            string
	}{
		{"out of order", goodHead + "[[event]]\nminutes = 5\nkind = \"note\"\ntext = \"a\"\n[[event]]\nminutes = 3\nkind = \"note\"\ntext = \"b\"\n",
			"event[2].minutes", 9, "time order"},
		{"unknown compartment", goodHead + "[[event]]\nminutes = 1\nkind = \"breach\"\ncompartment = \"Hold 9\"\narea = 0.1\n",
			"event[1].compartment", 7, "not a compartment"},
		{"past the end", goodHead + "[[event]]\nminutes = 31\nkind = \"note\"\ntext = \"late\"\n",
			"event[1].minutes", 5, "past the end"},
		{"unknown kind", goodHead + "[[event]]\nminutes = 1\nkind = \"flood\"\n",
			"event[1].kind", 6, "not one of"},
		{"breach without area", goodHead + "[[event]]\nminutes = 1\nkind = \"breach\"\ncompartment = \"Hold 1\"\n",
			"event[1].area", 4, "missing"},
		{"hole above the compartment", goodHead + "[[event]]\nminutes = 1\nkind = \"breach\"\ncompartment = \"Hold 1\"\narea = 0.1\nz = 12\n",
			"event[1].z", 9, "outside"},
		{"note without text", goodHead + "[[event]]\nminutes = 1\nkind = \"note\"\n",
			"event[1].text", 4, "missing"},
		{"unknown key", goodHead + "[[event]]\nminutes = 1\nkind = \"note\"\ntext = \"x\"\ncolour = 3\n",
			"event[1].colour", 8, "unknown"},
		{"area on a note", goodHead + "[[event]]\nminutes = 1\nkind = \"note\"\ntext = \"x\"\narea = 3\n",
			"event[1].area", 8, "takes no area"},
		{"no vessel", "format = 1\nminutes = 30\n", "vessel", 1, "missing"},
		{"unknown vessel", "format = 1\nvessel = \"tug\"\nminutes = 30\n", "vessel", 2, "no bundled vessel"},
		{"pump without capacity on a space with none", goodHead + "[[event]]\nminutes = 1\nkind = \"pump\"\ncompartment = \"Bosun store\"\nstate = \"starts\"\n",
			"event[1].capacity_m3h", 4, "capacity"},
		{"connection the vessel lacks", goodHead + "[[event]]\nminutes = 1\nkind = \"connection\"\nconnection = \"WT door 9\"\nopen = true\n",
			"event[1].connection", 7, "not a connection"},
		{"alarm in no compartment", goodHead + "alarms = [\"Hold 7\"]\n", "alarms[1]", 4, "not a compartment"},
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			_, err := vessels.ParseScenario("drill.toml", []byte(c.src), "")
			var ps vessels.Problems
			if !errors.As(err, &ps) {
				t.Fatalf("want Problems, got %v", err)
			}
			for _, p := range ps {
				if p.Key == c.key {
					if p.File != "drill.toml" || p.Line != c.line || !strings.Contains(p.Msg, c.msg) {
						t.Errorf("got %s; want line %d and %q", p, c.line, c.msg)
					}
					return
				}
			}
			t.Errorf("no problem at %s in:\n%v", c.key, err)
		})
	}
}

// FuzzParseScenario: whatever the bytes, the scenario reader returns a
// scenario or an error, never a panic, and every problem names its file.
//
//	go test ./vessels -run '^$' -fuzz FuzzParseScenario -fuzztime 10s
func FuzzParseScenario(f *testing.F) {
	for _, b := range vessels.BundledScenarios() {
		sc, err := vessels.OpenScenario(b.Name)
		if err != nil {
			f.Fatal(err)
		}
		_ = sc
	}
	f.Add([]byte(goodHead + "[[event]]\nminutes = 1\nkind = \"breach\"\ncompartment = \"Hold 1\"\narea = 0.1\nz = 2\n"))
	f.Add([]byte(goodHead + "alarms = [\"Hold 2\"]\n[[event]]\nminutes = 2\nkind = \"counterflood\"\ncompartment = \"Wing tank 2 P\"\nopen = true\n"))
	f.Add([]byte(goodHead + "[[event]]\nminutes = 2\nkind = \"connection\"\nconnection = \"WT door ER/stores\"\nopen = true\n"))
	f.Add([]byte(goodHead + "[[event]]\nminutes = 2\nkind = \"pump\"\ncompartment = \"Hold 2\"\nstate = \"starts\"\n"))
	f.Fuzz(func(t *testing.T, data []byte) {
		sc, err := vessels.ParseScenario("fuzz.toml", data, "")
		if err != nil {
			var ps vessels.Problems
			if errors.As(err, &ps) {
				for _, p := range ps {
					if p.File != "fuzz.toml" && !strings.HasPrefix(p.File, "bundled/") {
						t.Fatalf("problem without the file: %v", p)
					}
				}
			}
			return
		}
		if sc.Vessel == nil || !(sc.Minutes > 0) {
			t.Fatalf("a scenario without vessel or length: %+v", sc)
		}
	})
}

// TestScenarioVesselBesideIt: a vessel file named by a relative path is
// read from the scenario file's folder, and a problem in that vessel file
// is reported with the vessel file's own name and line.
func TestScenarioVesselBesideIt(t *testing.T) {
	dir := t.TempDir()
	src, _ := vessels.Source("barge")
	if err := os.WriteFile(filepath.Join(dir, "ship.toml"), src, 0o644); err != nil {
		t.Fatal(err)
	}
	p := filepath.Join(dir, "drill.toml")
	if err := os.WriteFile(p, []byte("format = 1\nvessel = \"ship.toml\"\nminutes = 10\n"), 0o644); err != nil {
		t.Fatal(err)
	}
	sc, err := vessels.OpenScenario(p)
	if err != nil {
		t.Fatal(err)
	}
	if sc.Vessel == nil || sc.VesselRef != filepath.Join(dir, "ship.toml") {
		t.Fatalf("%+v", sc)
	}
	// A condition file beside it too.
	cond := "format = 1\nname = \"Light\"\nkeep = [\"Lightship\"]\n"
	if err := os.WriteFile(filepath.Join(dir, "light.toml"), []byte(cond), 0o644); err != nil {
		t.Fatal(err)
	}
	if err := os.WriteFile(p, []byte("format = 1\nvessel = \"ship.toml\"\ncondition = \"light.toml\"\nminutes = 10\n"), 0o644); err != nil {
		t.Fatal(err)
	}
	withCond, err := vessels.OpenScenario(p)
	if err != nil {
		t.Logf("condition: %v", err)
	} else if withCond.ConditionRef != filepath.Join(dir, "light.toml") {
		t.Errorf("condition %q", withCond.ConditionRef)
	}
	bad := strings.Replace(string(src), "format = 1", "format = 1\nwater_density = \"salty\"", 1)
	if err := os.WriteFile(filepath.Join(dir, "ship.toml"), []byte(bad), 0o644); err != nil {
		t.Fatal(err)
	}
	_, err = vessels.OpenScenario(p)
	var ps vessels.Problems
	if !errors.As(err, &ps) || !strings.HasSuffix(ps[0].File, "ship.toml") || ps[0].Key != "water_density" {
		t.Errorf("got %v", err)
	}
}
