package report

import (
	"math"
	"strings"

	"heelwatch/engine"
)

// This file shows the hull girder's still-water shear force and bending
// moment (engine.Strength): the JSON object "strength", and the section
// of the text and Markdown reports, intact beside damaged.

// StrengthDoc is the JSON form of the hull girder's strength. x_m,
// shear_kn and moment_knm (heelwatch's conventions) are the values at the
// read-out points; the rest is heelwatch's own (README, "Hull girder
// strength").
type StrengthDoc struct {
	XM        []Num `json:"x_m"`
	ShearKN   []Num `json:"shear_kn"`
	MomentKNm []Num `json:"moment_knm"` // hogging positive

	Limits    string             `json:"limits"` // "sea" | "harbour": the set the points are checked against
	Points    []StrengthPointDoc `json:"points"`
	MaxShear  StrengthPeakDoc    `json:"max_shear"`
	MaxMoment StrengthPeakDoc    `json:"max_moment"`
	Closing   StrengthClosingDoc `json:"closing"`
	Curve     StrengthCurveDoc   `json:"curve"`
	// Intact is the same ship intact, for a damaged state; null otherwise.
	Intact *StrengthDoc `json:"intact,omitempty"`
}

// StrengthPointDoc is one read-out point against its permissible values.
type StrengthPointDoc struct {
	Name           string `json:"name"`
	XM             Num    `json:"x_m"`
	ShearKN        Num    `json:"shear_kn"`
	MomentKNm      Num    `json:"moment_knm"`
	ShearLimitKN   Num    `json:"shear_limit_kn"`   // null: none given
	MomentLimitKNm Num    `json:"moment_limit_knm"` // hog or sag value by the moment's sign; null: none given
	ShearPct       Num    `json:"shear_pct"`        // of the limit; null without one
	MomentPct      Num    `json:"moment_pct"`
	Level          string `json:"level"` // "ok" | "caution" (≥ 90 %) | "danger" (> 100 %)
}

// StrengthPeakDoc is the largest magnitude of a curve, signed, and where.
type StrengthPeakDoc struct {
	XM    Num `json:"x_m"`
	Value Num `json:"value"` // kN or kN·m
}

// StrengthClosingDoc is what weight and buoyancy left unbalanced at the
// forward end, before it was spread along the length.
type StrengthClosingDoc struct {
	ShearKN   Num `json:"shear_kn"`
	MomentKNm Num `json:"moment_knm"`
	ShearPct  Num `json:"shear_pct"` // of the largest shear force
	MomentPct Num `json:"moment_pct"`
}

// StrengthCurveDoc is the whole curve, aft to forward.
type StrengthCurveDoc struct {
	XM        []Num `json:"x_m"`
	ShearKN   []Num `json:"shear_kn"`
	MomentKNm []Num `json:"moment_knm"`
}

// StrengthJSON returns the JSON form of s with intact beside it (either may
// be nil); nil when s is nil.
func StrengthJSON(s, intact *engine.Strength) *StrengthDoc {
	if s == nil {
		return nil
	}
	d := &StrengthDoc{XM: []Num{}, ShearKN: []Num{}, MomentKNm: []Num{}, Points: []StrengthPointDoc{},
		Limits: limitsWord(s.Harbour),
		Curve:  StrengthCurveDoc{XM: nums(s.XM), ShearKN: nums(s.ShearKN), MomentKNm: nums(s.MomentKNm)}}
	for _, p := range s.Points {
		d.XM = append(d.XM, Num(p.XM))
		d.ShearKN = append(d.ShearKN, Num(p.ShearKN))
		d.MomentKNm = append(d.MomentKNm, Num(p.MomentKNm))
		d.Points = append(d.Points, StrengthPointDoc{Name: p.Name, XM: Num(p.XM), ShearKN: Num(p.ShearKN), MomentKNm: Num(p.MomentKNm),
			ShearLimitKN: limitNum(p.ShearLimitKN), MomentLimitKNm: limitNum(p.MomentLimitKNm),
			ShearPct: pctNum(p.ShearPct, p.ShearLimitKN), MomentPct: pctNum(p.MomentPct, p.MomentLimitKNm), Level: levelWord(p.Level)})
	}
	d.MaxShear = StrengthPeakDoc{Num(s.MaxShear.XM), Num(s.MaxShear.Value)}
	d.MaxMoment = StrengthPeakDoc{Num(s.MaxMoment.XM), Num(s.MaxMoment.Value)}
	sp, mp := s.ClosingPct()
	d.Closing = StrengthClosingDoc{Num(s.ClosingShearKN), Num(s.ClosingMomentKNm), Num(sp), Num(mp)}
	d.Intact = StrengthJSON(intact, nil)
	return d
}

func nums(xs []float64) []Num {
	out := make([]Num, len(xs))
	for i, x := range xs {
		out[i] = Num(x)
	}
	return out
}

func limitNum(x float64) Num {
	if x > 0 {
		return Num(x)
	}
	return Num(math.NaN())
}

func pctNum(pct, limit float64) Num {
	if limit > 0 {
		return Num(pct)
	}
	return Num(math.NaN())
}

func limitsWord(harbour bool) string {
	if harbour {
		return "harbour"
	}
	return "sea"
}

// levelWord is a reading's level in one word: ok, caution or danger.
func levelWord(s engine.Severity) string {
	if s == engine.Info {
		return "ok"
	}
	return s.String()
}

// StrengthLevelMark is a reading's level as shown beside it: "", "CAUTION"
// or "DANGER".
func StrengthLevelMark(s engine.Severity) string {
	if s == engine.Info {
		return ""
	}
	return strings.ToUpper(s.String())
}

// PctWords is a share of a permissible value as engine.ShareShown rounds
// it, "—" without one.
func PctWords(pct, limit float64) string {
	if !(limit > 0) {
		return "—"
	}
	return num(engine.ShareShown(pct), 0, "%")
}

// SenseWords says a bending moment's sense: "hogging", "sagging".
func SenseWords(knm float64) string {
	if knm < 0 {
		return "sagging"
	}
	return "hogging"
}

// strengthRows is the table of readings shared by text and Markdown: one
// row per read-out point, with the intact moment beside it when there is
// an intact state to compare.
func strengthRows(s, intact *engine.Strength) [][]string {
	head := []string{"read-out point", "x m", "shear kN", "of perm.", "moment kN·m", "of perm.", ""}
	if intact != nil {
		head = append(head, "intact kN", "intact kN·m")
	}
	rows := [][]string{head}
	for i, p := range s.Points {
		row := []string{p.Name, num(p.XM, 1, ""), num(p.ShearKN, 0, ""), PctWords(p.ShearPct, p.ShearLimitKN),
			num(p.MomentKNm, 0, ""), PctWords(p.MomentPct, p.MomentLimitKNm), StrengthLevelMark(p.Level)}
		if intact != nil {
			is, im := "—", "—"
			if i < len(intact.Points) {
				is, im = num(intact.Points[i].ShearKN, 0, ""), num(intact.Points[i].MomentKNm, 0, "")
			}
			row = append(row, is, im)
		}
		rows = append(rows, row)
	}
	return rows
}

// strengthSummary is the largest values and the closing error in words.
func strengthSummary(s *engine.Strength) []string {
	sp, mp := s.ClosingPct()
	return []string{
		"largest shear force " + num(math.Abs(s.MaxShear.Value), 0, "kN") + " at x " + num(s.MaxShear.XM, 1, "m") +
			"; largest bending moment " + num(math.Abs(s.MaxMoment.Value), 0, "kN·m") + " " + SenseWords(s.MaxMoment.Value) +
			" at x " + num(s.MaxMoment.XM, 1, "m"),
		"closing error at the forward end " + num(s.ClosingShearKN, 0, "kN") + " (" + num(sp, 1, "%") + "), " +
			num(s.ClosingMomentKNm, 0, "kN·m") + " (" + num(mp, 1, "%") + " of the largest), spread along the length",
	}
}

// strengthTitle heads the section.
func strengthTitle(s *engine.Strength) string {
	return "Hull girder, still water (hogging +; " + LimitsWords(s) + ")"
}

// LimitsWords names the permissible values the readings are checked
// against: "permissible values at sea" or "in harbour", or that the vessel
// file gives none.
func LimitsWords(s *engine.Strength) string {
	switch {
	case !s.HasLimits():
		return "no permissible values in the vessel file"
	case s.Harbour:
		return "permissible values in harbour"
	}
	return "permissible values at sea"
}

// textStrength writes the strength section of the text report.
func textStrength(e *errWriter, r Report) {
	a := r.Assessment
	e.line()
	s := a.Strength
	if s == nil {
		e.line("Hull girder: not worked out: ", orDash(a.StrengthWhy))
		return
	}
	e.line(strengthTitle(s))
	rows := strengthRows(s, r.IntactStrength)
	t := table{right: []bool{false, true, true, true, true, true, false, true, true}}
	for _, row := range rows {
		t.add(row...)
	}
	writeLines(e, t.lines("  "))
	for _, l := range strengthSummary(s) {
		e.line("  ", l)
	}
}

// markdownStrength writes the strength section of the Markdown report: the
// table of readings and a small plot of the bending moment.
func markdownStrength(e *errWriter, r Report) {
	a := r.Assessment
	s := a.Strength
	e.line("## Hull girder")
	e.line()
	if s == nil {
		e.line("Not worked out: ", orDash(a.StrengthWhy), ".")
		e.line()
		return
	}
	e.line("Still-water shear force and bending moment, hogging positive; ", LimitsWords(s), ".")
	e.line()
	rows := strengthRows(s, r.IntactStrength)
	for i, row := range rows {
		for j := range row {
			row[j] = md(row[j])
		}
		e.line("| ", strings.Join(row, " | "), " |")
		if i == 0 {
			e.line(strings.Repeat("|---", len(row)), "|")
		}
	}
	e.line()
	for _, l := range strengthSummary(s) {
		e.line("- ", sentence(l), ".")
	}
	e.line()
	for _, moment := range []bool{false, true} {
		what := "Shear force (kN) along the ship, aft at the left (`*` the curve, `+` and `-` the permissible values at the read-out points, `.` zero):"
		if moment {
			what = "Bending moment (kN·m) likewise (`+` the permissible hogging, `-` the sagging values):"
		}
		e.line(what)
		e.line()
		e.line("```")
		for _, l := range CurvePlot(s, moment, 64, 11) {
			e.line(l)
		}
		e.line("```")
		e.line()
	}
}

// CurvePlot draws the bending moment (moment) or the shear force in
// w × h characters, aft at the left: '*' the curve, '+' and '-' the
// permissible values at the read-out points of the set in use (hogging and
// sagging for the moment, ± the shear force's), '.' the zero line; a scale
// in kN or kN·m on the left. Plain ASCII, for the Markdown report.
func CurvePlot(s *engine.Strength, moment bool, w, h int) []string {
	ys := s.ShearKN
	if moment {
		ys = s.MomentKNm
	}
	up := func(l engine.Permissible) (float64, float64) {
		if moment {
			return l.HogKNm, l.SagKNm
		}
		return l.ShearKN, l.ShearKN
	}
	lo, hi := 0.0, 0.0
	for _, m := range ys {
		lo, hi = math.Min(lo, m), math.Max(hi, m)
	}
	for _, p := range s.Points {
		u, d := up(limitsOf(p.ReadOutPoint, s.Harbour))
		hi = math.Max(hi, u)
		lo = math.Min(lo, -d)
	}
	if hi == lo {
		hi = lo + 1
	}
	x0, x1 := s.XM[0], s.XM[len(s.XM)-1]
	grid := make([][]byte, h)
	for i := range grid {
		grid[i] = []byte(strings.Repeat(" ", w))
	}
	row := func(v float64) int {
		return int(math.Round((hi - v) / (hi - lo) * float64(h-1)))
	}
	col := func(x float64) int {
		return min(w-1, max(0, int(math.Round((x-x0)/(x1-x0)*float64(w-1)))))
	}
	zero := row(0)
	for c := 0; c < w; c++ {
		grid[zero][c] = '.'
	}
	for _, p := range s.Points {
		u, d := up(limitsOf(p.ReadOutPoint, s.Harbour))
		if u > 0 {
			grid[row(u)][col(p.XM)] = '+'
		}
		if d > 0 {
			grid[row(-d)][col(p.XM)] = '-'
		}
	}
	for i, x := range s.XM {
		grid[row(ys[i])][col(x)] = '*'
	}
	label := func(v float64) string {
		l := num(v, 0, "")
		return strings.Repeat(" ", max(0, 9-len(l))) + l
	}
	out := make([]string, h+1)
	for i := range grid {
		lab := strings.Repeat(" ", 9)
		switch i {
		case 0:
			lab = label(hi)
		case zero:
			lab = label(0)
		case h - 1:
			lab = label(lo)
		}
		out[i] = lab + " |" + strings.TrimRight(string(grid[i]), " ")
	}
	out[h] = strings.Repeat(" ", 10) + "x " + num(x0, 1, "m") + strings.Repeat(" ", max(1, w-8-len(num(x0, 1, "m"))-len(num(x1, 1, "m")))) + num(x1, 1, "m")
	return out
}

// limitsOf returns a point's permissible set: harbour or sea.
func limitsOf(p engine.ReadOutPoint, harbour bool) engine.Permissible {
	if harbour {
		return p.Harbour
	}
	return p.Sea
}
