package vessels

import (
	"errors"
	"os"
	"strings"
	"testing"
)

// TestConditionForAnotherShip: a condition written for the freighter,
// loaded onto the ferry, says first that it seems to be for another ship
// (with the name on the condition's name line), besides each name it
// does not find; the same file on the freighter has no such line.
func TestConditionForAnotherShip(t *testing.T) {
	const path = "../testdata/conditions/freighter-ballast-departure.toml"
	data, err := os.ReadFile(path)
	if err != nil {
		t.Fatal(err)
	}
	ferry, fi := openBundled(t, "ferry")
	_, err = ParseCondition(path, data, ferry, fi)
	var ps Problems
	if !errors.As(err, &ps) {
		t.Fatalf("the freighter's condition on the ferry: %v", err)
	}
	found := false
	for _, p := range ps {
		if p.Key == "name" && strings.Contains(p.Msg, "another ship") && strings.Contains(p.Msg, ferry.Name) {
			found = true
		}
	}
	if !found {
		t.Errorf("no line says the file is for another ship: %v", ps)
	}
	freighter, fri := openBundled(t, "freighter")
	if _, err := ParseCondition(path, data, freighter, fri); err != nil {
		t.Errorf("on the freighter: %v", err)
	}
}
