package vessels

import (
	"errors"
	"strings"
	"testing"

	"heelwatch/engine"
)

const marksBarge = `format = 1
name = "Marks test barge"
[hull]
shape = "box"
length = 40.0
breadth = 10.0
depth = 5.0
[[weight]]
name = "Lightship"
mass = 600.0
lcg = 20.0
vcg = 2.5
[[compartment]]
name = "Hold"
use = "void"
x = [5.0, 20.0]
y = [-3.0, 3.0]
z = [1.0, 5.0]
[[draft_mark]]
name = "Fwd P"
x = 38.0
side = "port"
[[draft_mark]]
name = "Fwd S"
x = 38.0
side = "starboard"
[[draft_mark]]
name = "Stern"
x = 0.0
side = "centre"
`

func TestDraftMarksRead(t *testing.T) {
	v, _, err := Parse("marks.toml", []byte(marksBarge))
	if err != nil {
		t.Fatal(err)
	}
	want := []engine.DraftMark{{Name: "Fwd P", XM: 38, Side: engine.Port}, {Name: "Fwd S", XM: 38, Side: engine.Starboard}, {Name: "Stern", XM: 0, Side: engine.Both}}
	if len(v.DraftMarks) != len(want) {
		t.Fatalf("marks %+v", v.DraftMarks)
	}
	for i := range want {
		if v.DraftMarks[i] != want[i] {
			t.Errorf("mark %d = %+v, want %+v", i, v.DraftMarks[i], want[i])
		}
	}
}

func TestDraftMarksRefused(t *testing.T) {
	for _, c := range []struct{ extra, key, frag string }{
		{"[[draft_mark]]\nname = \"Bow\"\nx = 41.0\nside = \"port\"\n", "draft_mark[4].x", "off the hull"},
		{"[[draft_mark]]\nname = \"Bow\"\nx = 10.0\nside = \"left\"\n", "draft_mark[4].side", "is not one of"},
		{"[[draft_mark]]\nname = \"fwd p\"\nx = 10.0\nside = \"port\"\n", "draft_mark[4].name", "already the name"},
	} {
		_, _, err := Parse("marks.toml", []byte(marksBarge+c.extra))
		var ps Problems
		if !errors.As(err, &ps) || len(ps) != 1 || ps[0].Key != c.key || !strings.Contains(ps[0].Msg, c.frag) || ps[0].Line < 30 {
			t.Errorf("%q: got %v; want one problem at %s …%s…", c.extra, err, c.key, c.frag)
		}
	}
}

func TestReadingsRead(t *testing.T) {
	v, _, err := Parse("marks.toml", []byte(marksBarge))
	if err != nil {
		t.Fatal(err)
	}
	src := `format = 1
[[reading]]
minutes = 0
heel_deg = -1.5
drafts = { "FWD P" = 1.40, "Fwd S" = 1.10, "Stern" = 1.2 }
[[reading]]
minutes = 12.5
levels = { "hold" = 0.4 }
`
	rs, err := ParseReadings("r.toml", []byte(src), v)
	if err != nil {
		t.Fatal(err)
	}
	if len(rs) != 2 || !rs[0].HasHeel || rs[0].HeelDeg != -1.5 || len(rs[0].Drafts) != 3 || rs[1].Minutes != 12.5 || rs[1].HasHeel {
		t.Fatalf("readings %+v", rs)
	}
	if rs[1].Levels[0] != (engine.LevelReading{Compartment: 0, LevelM: 0.4}) {
		t.Errorf("level %+v", rs[1].Levels)
	}
}

func TestReadingsRefused(t *testing.T) {
	v, _, err := Parse("marks.toml", []byte(marksBarge))
	if err != nil {
		t.Fatal(err)
	}
	src := `format = 1
[[reading]]
minutes = 5
heel_deg = 91
drafts = { "Fwd P" = -0.2, "Bow" = 1.0, "Fwd S" = 5.5 }
levels = { "Hold" = 4.5, "Engine" = 1 }
[[reading]]
minutes = 2
heel_deg = 1
colour = "red"
`
	_, err = ParseReadings("r.toml", []byte(src), v)
	var ps Problems
	if !errors.As(err, &ps) {
		t.Fatalf("error %v", err)
	}
	wants := []struct {
		line      int
		key, frag string
	}{
		{4, "reading[1].heel_deg", "90°"},
		{5, "reading[1].drafts.Bow", "not one of the vessel's draft marks"},
		{5, "reading[1].drafts.Fwd P", "under the keel"},
		{5, "reading[1].drafts.Fwd S", "above the deck"},
		{6, "reading[1].levels.Engine", "not a compartment"},
		{6, "reading[1].levels.Hold", "more than the compartment's height"},
		{8, "reading[2].minutes", "time order"},
		{10, "reading[2].colour", "unknown key"},
	}
	if len(ps) != len(wants) {
		t.Fatalf("%d problems, want %d:\n%v", len(ps), len(wants), err)
	}
	for i, w := range wants {
		if ps[i].Line != w.line || ps[i].Key != w.key || !strings.Contains(ps[i].Msg, w.frag) {
			t.Errorf("problem %d = %s; want %d %s …%s…", i, ps[i], w.line, w.key, w.frag)
		}
	}
}

// TestDisagreementPointedOut: one mark 15 cm off among six is named, and
// the inclinometer against the marks.
func TestDisagreementPointedOut(t *testing.T) {
	v, _, err := Open("freighter")
	if err != nil {
		t.Fatal(err)
	}
	pos, err := engine.Solve(v, v.Intact())
	if err != nil {
		t.Fatal(err)
	}
	md := engine.MarkDrafts(v.Hull, pos.Plane, v.DraftMarks)
	r := engine.Reading{HasHeel: true, HeelDeg: pos.HeelDeg + 3}
	for i, m := range md {
		d := m.DraftM
		if m.Name == "Mid S" {
			d += 0.15
		}
		r.Drafts = append(r.Drafts, engine.MarkReading{Mark: i, DraftM: d})
	}
	ds := engine.Disagreements(v, []engine.Reading{r})
	if len(ds) != 2 || ds[0].What != "Mid S" || ds[1].What != "heel" {
		t.Fatalf("disagreements %+v", ds)
	}
	if len(engine.Disagreements(v, []engine.Reading{{Drafts: r.Drafts[:0]}})) != 0 {
		t.Error("an empty reading disagrees")
	}
}
