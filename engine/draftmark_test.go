package engine_test

import (
	"math"
	"testing"

	"heelwatch/engine"
)

// refWallSidedBox solves a box's free-floating plane in closed form.
//
// Derivation (wall-sided box, plane z = T + b(x − L/2) + c·y cutting
// neither deck nor bottom): the immersed body is a prism of volume L·B·T
// whatever b and c, so T = Δ/(ρLB); its centroid, integrating z from 0 to
// the plane over the rectangle, is
//
//	xB = L/2 + b·L²/(12T),  yB = c·B²/(12T),  zB = (T² + b²L²/12 + c²B²/12)/(2T).
//
// She floats where G and B lie on one normal to the plane (−b, −c, 1):
//
//	xG − xB = −b(zG − zB),  yG − yB = −c(zG − zB),
//
// two equations in b and c, solved here by Newton's method with a
// finite-difference Jacobian (the equations are the standard derivation's;
// the solver is this test's own and shares nothing with the engine).
func refWallSidedBox(L, B, rho float64, w engine.Weight) (T, b, c float64) {
	T = w.MassT / (rho * L * B)
	f := func(b, c float64) (float64, float64) {
		xB := L/2 + b*L*L/(12*T)
		yB := c * B * B / (12 * T)
		zB := (T*T + b*b*L*L/12 + c*c*B*B/12) / (2 * T)
		return w.LCGM - xB + b*(w.VCGM-zB), w.TCGM - yB + c*(w.VCGM-zB)
	}
	for it := 0; it < 50; it++ {
		f1, f2 := f(b, c)
		const h = 1e-7
		a11, a21 := f(b+h, c)
		a12, a22 := f(b, c+h)
		j11, j21 := (a11-f1)/h, (a21-f2)/h
		j12, j22 := (a12-f1)/h, (a22-f2)/h
		det := j11*j22 - j12*j21
		db := (f1*j22 - f2*j12) / det
		dc := (j11*f2 - j21*f1) / det
		b, c = b-db, c-dc
		if math.Abs(db)+math.Abs(dc) < 1e-15 {
			break
		}
	}
	return T, b, c
}

// TestMarkDraftsHeeledTrimmedBox: the draft at each mark of a box heeled
// and trimmed by an off-centre weight, against the closed form above: at a
// side mark the shell is at y = ±B/2, so the draft is T + b(x − L/2) ± c·B/2;
// at a centre mark T + b(x − L/2). The marks carried to the perpendiculars
// (draft survey practice, Barrass & Derrett ch. 25) give the centreline
// drafts at AP and FP and no hog or sag (the box is rigid).
func TestMarkDraftsHeeledTrimmedBox(t *testing.T) {
	const L, B, D = 80.0, 16.0, 8.0
	w := engine.Weight{Name: "load", MassT: L * B * 4 * engine.SeaWaterDensity, LCGM: 38, TCGM: 0.4, VCGM: 5}
	h, err := engine.NewBoxHull(L, B, D)
	if err != nil {
		t.Fatal(err)
	}
	marks := []engine.DraftMark{
		{Name: "Aft P", XM: 2, Side: engine.Port}, {Name: "Aft S", XM: 2, Side: engine.Starboard},
		{Name: "Mid P", XM: 41, Side: engine.Port}, {Name: "Mid S", XM: 41, Side: engine.Starboard},
		{Name: "Fwd P", XM: 77, Side: engine.Port}, {Name: "Fwd S", XM: 77, Side: engine.Starboard},
		{Name: "Stem", XM: 80, Side: engine.Both},
	}
	v, err := engine.NewVessel(engine.Vessel{Name: "reference box", Hull: h, Weights: []engine.Weight{w}, DraftMarks: marks})
	if err != nil {
		t.Fatal(err)
	}
	pos, err := engine.Solve(v, v.Intact())
	if err != nil {
		t.Fatal(err)
	}
	T, b, c := refWallSidedBox(L, B, engine.SeaWaterDensity, w)
	if heel := math.Atan(c) * 180 / math.Pi; heel < 5 || math.Abs(b*L) < 0.5 {
		t.Fatalf("the case should be heeled and trimmed: heel %.2f°, trim %.2f m", heel, -b*L)
	}
	const tol = 1e-6 // m: the engine's solve against the closed form
	got := engine.MarkDrafts(v.Hull, pos.Plane, v.DraftMarks)
	for i, m := range marks {
		want := T + b*(m.XM-L/2) + c*float64(m.Side)*B/2
		if d := got[i].DraftM - want; math.Abs(d) > tol || got[i].State != engine.MarkReads {
			t.Errorf("%s: draft %.6f m (%v), closed form %.6f m", m.Name, got[i].DraftM, got[i].State, want)
		}
	}
	s, err := engine.SurveyMarks(L, pos.Plane.C, got)
	if err != nil {
		t.Fatal(err)
	}
	if math.Abs(s.AftM-(T-b*L/2)) > tol || math.Abs(s.FwdM-(T+b*L/2)) > tol || math.Abs(s.MidM-T) > tol {
		t.Errorf("to the perpendiculars: aft %.6f fwd %.6f mid %.6f, closed form %.6f %.6f %.6f", s.AftM, s.FwdM, s.MidM, T-b*L/2, T+b*L/2, T)
	}
	if math.Abs(s.DeflectionM) > tol {
		t.Errorf("a rigid box shows hog/sag %.6f m", s.DeflectionM)
	}
}

// TestSurveyMarksSag: marks read by hand (numbers of our own) on an 88 m
// ship. Apparent trim 1.00 m over 84 m between the marks (x 2 and 86):
// aft 5.00 + 2/84 = 5.0238, forward 4.00 − 2/84 = 3.9762; midship marks at
// L/2 read 4.60 against a mean of 4.50: sag 0.10 m (draft survey practice,
// Barrass & Derrett ch. 25, p. 236; the arithmetic worked here by hand).
func TestSurveyMarksSag(t *testing.T) {
	read := []engine.MarkDraft{
		{DraftMark: engine.DraftMark{Name: "Aft", XM: 2, Side: engine.Both}, DraftM: 5.00},
		{DraftMark: engine.DraftMark{Name: "Mid P", XM: 44, Side: engine.Port}, DraftM: 4.55},
		{DraftMark: engine.DraftMark{Name: "Mid S", XM: 44, Side: engine.Starboard}, DraftM: 4.65},
		{DraftMark: engine.DraftMark{Name: "Fwd", XM: 86, Side: engine.Both}, DraftM: 4.00},
	}
	s, err := engine.SurveyMarks(88, 0, read)
	if err != nil {
		t.Fatal(err)
	}
	for _, c := range []struct {
		name      string
		got, want float64
	}{{"aft", s.AftM, 5 + 2.0/84}, {"fwd", s.FwdM, 4 - 2.0/84}, {"mid", s.MidM, 4.6}, {"trim", s.TrimM, 1 + 4.0/84}, {"sag", s.DeflectionM, 0.1}} {
		if math.Abs(c.got-c.want) > 1e-12 {
			t.Errorf("%s %.6f, by hand %.6f", c.name, c.got, c.want)
		}
	}
	if _, err := engine.SurveyMarks(88, 0, read[1:3]); err == nil {
		t.Error("midship marks alone carried to the perpendiculars")
	}
}

// TestMarkDraftsStates: a mark whose side is out of the water at the keel,
// and one under water above the deck, say so.
func TestMarkDraftsStates(t *testing.T) {
	h, err := engine.NewBoxHull(80, 16, 8)
	if err != nil {
		t.Fatal(err)
	}
	marks := []engine.DraftMark{{Name: "P", XM: 40, Side: engine.Port}, {Name: "S", XM: 40, Side: engine.Starboard}}
	// 40° to starboard at 3 m: port keel corner out, 3 − 8·tan40° < 0.
	p := engine.Plane{A: 3, C: math.Tan(40 * math.Pi / 180)}
	got := engine.MarkDrafts(h, p, marks)
	if got[0].State != engine.MarkKeelOut || got[1].State != engine.MarkSubmerged {
		t.Errorf("states %v, %v; want keel out, under water", got[0].State, got[1].State)
	}
	if want := 3 + 8*math.Tan(40*math.Pi/180); math.Abs(got[1].DraftM-want) > 1e-9 {
		t.Errorf("starboard %.6f, want %.6f (vertical side continued)", got[1].DraftM, want)
	}
}

// TestSurveyReadingHeeled: marks read off a heeled, trimmed box (the
// closed form of TestMarkDraftsHeeledTrimmedBox) come to the same drafts at
// the perpendiculars as the position's own, with no hog or sag.
func TestSurveyReadingHeeled(t *testing.T) {
	const L, B, D = 80.0, 16.0, 8.0
	w := engine.Weight{Name: "load", MassT: L * B * 4 * engine.SeaWaterDensity, LCGM: 38, TCGM: 0.4, VCGM: 5}
	h, _ := engine.NewBoxHull(L, B, D)
	marks := []engine.DraftMark{
		{Name: "Aft P", XM: 2, Side: engine.Port}, {Name: "Aft S", XM: 2, Side: engine.Starboard},
		{Name: "Mid S", XM: 41, Side: engine.Starboard},
		{Name: "Fwd P", XM: 77, Side: engine.Port}, {Name: "Fwd S", XM: 77, Side: engine.Starboard},
	}
	v, err := engine.NewVessel(engine.Vessel{Name: "reference box", Hull: h, Weights: []engine.Weight{w}, DraftMarks: marks})
	if err != nil {
		t.Fatal(err)
	}
	pos, _ := engine.Solve(v, v.Intact())
	r := engine.Reading{HasHeel: true, HeelDeg: pos.HeelDeg}
	for i, m := range engine.MarkDrafts(v.Hull, pos.Plane, marks) {
		r.Drafts = append(r.Drafts, engine.MarkReading{Mark: i, DraftM: m.DraftM})
	}
	s, err := engine.SurveyReading(v, r)
	if err != nil {
		t.Fatal(err)
	}
	// 0.1 mm: the implied plane's weak priors (ObservedPlane) move its
	// heel by a few millionths.
	if math.Abs(s.AftM-pos.DraftAftM) > 1e-4 || math.Abs(s.FwdM-pos.DraftFwdM) > 1e-4 || math.Abs(s.DeflectionM) > 1e-4 {
		t.Errorf("survey %+v; position aft %.6f fwd %.6f", s, pos.DraftAftM, pos.DraftFwdM)
	}
}
