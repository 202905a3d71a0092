package vessels

import (
	"strings"
	"testing"
)

// leadsToBarge is a 40 × 10 × 5 m box barge with a wing tank and an air
// pipe whose leads_to is given.
func leadsToBarge(leads string) string {
	return boxBarge(40, 10, 5, 600, 20, 2.5, "", `
[[compartment]]
name = "Wing tank S"
use = "tank"
x = [10.0, 20.0]
y = [3.0, 5.0]
z = [0.0, 5.0]

[[opening]]
name = "Wing tank S air pipe"
kind = "air pipe"
x = 15.0
y = 4.5
z = 5.8
`+leads+"\n")
}

// TestLeadsTo reads leads_to (matched ignoring case, written back as the
// compartment spells it), leaves it empty when left out, and refuses a
// name that is no compartment with the file, line and key.
func TestLeadsTo(t *testing.T) {
	v, _, err := Parse("leads.toml", []byte(leadsToBarge(`leads_to = "wing TANK s"`)))
	if err != nil {
		t.Fatal(err)
	}
	if got := v.Openings[0].LeadsTo; got != "Wing tank S" {
		t.Errorf("leads_to read as %q, want the compartment's own spelling", got)
	}
	v, _, err = Parse("leads.toml", []byte(leadsToBarge("")))
	if err != nil || v.Openings[0].LeadsTo != "" {
		t.Fatalf("left out: %v, %q", err, v.Openings[0].LeadsTo)
	}
	_, _, err = Parse("leads.toml", []byte(leadsToBarge(`leads_to = "Wing tank P"`)))
	if err == nil {
		t.Fatal("leads_to naming no compartment was accepted")
	}
	msg := err.Error()
	for _, want := range []string{"leads.toml:", "opening[1].leads_to", `"Wing tank P" is not the name of a compartment`, `did you mean "Wing tank S"`} {
		if !strings.Contains(msg, want) {
			t.Errorf("error %q lacks %q", msg, want)
		}
	}
}
