package vessels

import (
	"strings"
	"testing"
)

// twoVoids is a box barge with two voids side by side and extra TOML.
func twoVoids(extra string) string {
	return boxBarge(80, 16, 8, 4000, 40, 4, "", `
[[compartment]]
name = "Void A"
use = "void"
x = [30.0, 40.0]
y = [-8.0, 8.0]
z = [0.0, 8.0]

[[compartment]]
name = "Void B"
use = "void"
x = [40.0, 50.0]
y = [-8.0, 8.0]
z = [0.0, 8.0]

[[compartment]]
name = "Void C"
use = "void"
x = [60.0, 70.0]
y = [-8.0, 8.0]
z = [0.0, 8.0]
`+extra)
}

func TestConnectionRead(t *testing.T) {
	src := twoVoids(`
[[connection]]
name = "Duct A/B"
kind = "duct"
from = "void a"
to = "Void B"
area = 0.2
x = 40.0
y = 0.0
z = 0.3
open = true
k = 1.5

[[opening]]
name = "Vent B"
x = 45.0
y = 7.0
z = 9.0
leads_to = "Void B"
area = 0.03
`)
	v, info, err := Parse("two.toml", []byte(src))
	if err != nil {
		t.Fatal(err)
	}
	if len(v.Connections) != 1 || len(info.Warnings) != 0 {
		t.Fatalf("connections %v, warnings %v", v.Connections, info.Warnings)
	}
	c := v.Connections[0]
	if c.From != 0 || c.To != 1 || !c.Open || c.AreaM2 != 0.2 || c.K != 1.5 || c.Kind != "duct" || c.HeightM != 0 {
		t.Errorf("read %+v", c)
	}
	if o := v.Openings[0]; o.LeadsTo != "Void B" || o.AreaM2 != 0.03 || v.LeadsToIndex(o) != 1 {
		t.Errorf("opening %+v", o)
	}
}

// A door between compartments that do not touch is a warning naming the
// file, line and key; the file is still read.
func TestConnectionNotTouchingWarns(t *testing.T) {
	src := twoVoids(`
[[connection]]
name = "Door A/C"
kind = "door"
from = "Void A"
to = "Void C"
area = 1.5
x = 40.0
y = 0.0
z = 0.5
height = 1.8
open = false
`)
	_, info, err := Parse("w.toml", []byte(src))
	if err != nil {
		t.Fatal(err)
	}
	if len(info.Warnings) != 1 {
		t.Fatalf("warnings %v", info.Warnings)
	}
	w := info.Warnings[0].String()
	if !strings.HasPrefix(w, "w.toml:") || !strings.Contains(w, "connection[1]") || !strings.Contains(w, "do not touch") {
		t.Errorf("warning %q", w)
	}
	if info.Warnings[0].Line == 0 {
		t.Error("no line")
	}
}

func TestConnectionProblems(t *testing.T) {
	for _, c := range []struct{ toml, key, words string }{
		{`kind = "door"
from = "Void A"
to = "Void Z"
area = 1.0
x = 40.0
y = 0.0
z = 0.5
open = true`, "connection[1].to", "not the name of a compartment"},
		{`kind = "gate"
from = "Void A"
to = "Void B"
area = 1.0
x = 40.0
y = 0.0
z = 0.5
open = true`, "connection[1].kind", "not one of"},
		{`kind = "door"
from = "Void A"
to = "Void B"
area = -1.0
x = 40.0
y = 0.0
z = 0.5
open = true`, "connection[1].area", "above zero"},
		{`kind = "door"
from = "Void A"
to = "Void B"
area = 1.0
x = 40.0
y = 0.0
z = 0.5`, "connection[1].open", "missing"},
		{`kind = "door"
from = "Void A"
to = "void a"
area = 1.0
x = 40.0
y = 0.0
z = 0.5
open = true`, "connection[1].to", "two different compartments"},
		{`kind = "door"
from = "Void A"
to = "Void B"
area = 1.0
x = 40.0
y = 0.0
z = 0.5
k = -2
open = true`, "connection[1].k", "negative"},
	} {
		src := twoVoids("\n[[connection]]\nname = \"X\"\n" + c.toml + "\n")
		_, _, err := Parse("bad.toml", []byte(src))
		if err == nil {
			t.Errorf("%s: accepted", c.key)
			continue
		}
		ps := err.(Problems)
		found := false
		for _, p := range ps {
			if p.Key == c.key && strings.Contains(p.Msg, c.words) && p.Line > 0 {
				found = true
			}
		}
		if !found {
			t.Errorf("%s: want %q, got %v", c.key, c.words, err)
		}
	}
	src := twoVoids("\n[[opening]]\nname = \"V\"\nx = 1.0\ny = 0.0\nz = 9.0\nleads_to = \"Nowhere\"\n")
	if _, _, err := Parse("bad.toml", []byte(src)); err == nil || !strings.Contains(err.Error(), "opening[1].leads_to") {
		t.Errorf("leads_to: %v", err)
	}
}
