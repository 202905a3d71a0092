package engine_test

import (
	"math"
	"math/rand"
	"strings"
	"testing"

	"heelwatch/engine"
)

// TestDiagnoseKnownCase: the bundled freighter (invented demo ship) with
// Wing tank 2 S open to the sea; the crew's reading of it is diagnosed as
// that tank, level with the sea, and the runner-up comes with a sounding
// that tells them apart.
func TestDiagnoseKnownCase(t *testing.T) {
	v, d := refBundledDamaged(t, "Wing tank 2 S")
	pos, err := engine.Solve(v, d)
	if err != nil {
		t.Fatal(err)
	}
	r := crewReading(v, pos, 0, rand.New(rand.NewSource(3)))
	var progressed int
	dg, err := engine.Diagnose(v, []engine.Reading{r}, engine.DiagnoseOptions{Progress: func(done, total int) {
		if done > total {
			t.Errorf("progress %d of %d", done, total)
		}
		progressed = done
	}})
	if err != nil {
		t.Fatal(err)
	}
	if !dg.Fits || len(dg.Explanations) < 2 {
		t.Fatalf("verdict %q, %d explanations", dg.Verdict, len(dg.Explanations))
	}
	best := dg.Explanations[0]
	if best.Names(v) != "Wing tank 2 S" || !best.Spaces[0].Open {
		t.Errorf("best %s %+v; want Wing tank 2 S open to the sea", best.Names(v), best.Spaces)
	}
	if best.DraftRMSM > 0.015 || math.Abs(best.HeelErrDeg) > 0.3 {
		t.Errorf("best misfit %.3f m RMS, heel %.2f°: more than the reading errors", best.DraftRMSM, best.HeelErrDeg)
	}
	if len(dg.Tellers) == 0 || !strings.HasPrefix(dg.Tellers[0], "Sound ") && !strings.Contains(dg.Tellers[0], "look alike") {
		t.Errorf("tellers %q", dg.Tellers)
	}
	if progressed == 0 {
		t.Error("no progress reported")
	}
}

// TestDiagnoseNothingFits: the marks of an intact ship with one end read a
// metre deep (as if a reading were wrong and the others agreed with it, or
// a great weight had moved) cannot be explained within their errors: it is
// said plainly.
func TestDiagnoseNothingFits(t *testing.T) {
	v, _ := refBundledDamaged(t)
	pos, err := engine.Solve(v, v.Intact())
	if err != nil {
		t.Fatal(err)
	}
	r := crewReading(v, pos, 0, rand.New(rand.NewSource(5)))
	// A sag of 40 cm: no flooding of a rigid hull bends the waterline.
	for k := range r.Drafts {
		if strings.HasPrefix(v.DraftMarks[r.Drafts[k].Mark].Name, "Mid") {
			r.Drafts[k].DraftM += 0.4
		}
	}
	dg, err := engine.Diagnose(v, []engine.Reading{r}, engine.DiagnoseOptions{})
	if err != nil {
		t.Fatal(err)
	}
	if dg.Fits || !strings.Contains(dg.Verdict, "Nothing fits") {
		t.Errorf("fits %v: %q", dg.Fits, dg.Verdict)
	}
}

// TestDiagnoseIntact: the readings of the intact ship are said to agree
// with her intact.
func TestDiagnoseIntact(t *testing.T) {
	v, _ := refBundledDamaged(t)
	pos, _ := engine.Solve(v, v.Intact())
	r := crewReading(v, pos, 0, rand.New(rand.NewSource(9)))
	dg, err := engine.Diagnose(v, []engine.Reading{r}, engine.DiagnoseOptions{MaxGroup: 1})
	if err != nil {
		t.Fatal(err)
	}
	if len(dg.Explanations) == 0 || len(dg.Explanations[0].Spaces) != 0 || !dg.Fits {
		t.Errorf("intact readings: %q", dg.Verdict)
	}
}

// TestDiagnoseWrongMark: one mark read 30 cm wrong is named, nothing fits
// with it, and without it the truth fits (said in the verdict).
func TestDiagnoseWrongMark(t *testing.T) {
	v, d := refBundledDamaged(t, "Wing tank 2 S")
	pos, err := engine.Solve(v, d)
	if err != nil {
		t.Fatal(err)
	}
	r := crewReading(v, pos, 0, rand.New(rand.NewSource(11)))
	for k := range r.Drafts {
		if v.DraftMarks[r.Drafts[k].Mark].Name == "Fwd S" {
			r.Drafts[k].DraftM += 0.3
		}
	}
	dg, err := engine.Diagnose(v, []engine.Reading{r}, engine.DiagnoseOptions{})
	if err != nil {
		t.Fatal(err)
	}
	if len(dg.Disagreements) != 1 || dg.Disagreements[0].What != "Fwd S" {
		t.Errorf("disagreements %+v", dg.Disagreements)
	}
	if dg.Fits || dg.Without == nil || dg.Without.Names(v) != "Wing tank 2 S" || !strings.Contains(dg.Verdict, "Leaving out Fwd S, Wing tank 2 S fits") {
		t.Errorf("fits %v, verdict %q", dg.Fits, dg.Verdict)
	}
}
