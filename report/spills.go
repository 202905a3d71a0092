package report

import "heelwatch/engine"

// This file shows the contents of holed tanks that may escape to the sea
// (engine.Spills): in JSON as `spills`, in text and Markdown as a short
// section with the caution to report the pollution and the rule used.

// SpillDoc is one holed tank's contents that may escape, in the JSON.
type SpillDoc struct {
	Compartment string `json:"compartment"`
	Liquid      string `json:"liquid"`
	MassT       Num    `json:"mass_t"`
}

// SpillsHeading heads the section in text and Markdown.
const SpillsHeading = "May be escaping to the sea (report the pollution)"

func buildSpills(sp []engine.Spill) []SpillDoc {
	out := []SpillDoc{}
	for _, s := range sp {
		out = append(out, SpillDoc{s.Compartment, s.Liquid, Num(s.MassT)})
	}
	return out
}

// textSpills writes the section as aligned text; nothing when no tank
// holding anything but water is holed.
func textSpills(e *errWriter, sp []engine.Spill) {
	if len(sp) == 0 {
		return
	}
	e.line()
	e.line(SpillsHeading)
	t := table{right: []bool{false, false, true}}
	for _, s := range sp {
		t.add(s.Compartment, s.Liquid, num(s.MassT, 1, "t"))
	}
	writeLines(e, t.lines("  "))
	e.line("  Counted so: ", engine.SpillRule, ".")
}

// markdownSpills writes the section in Markdown.
func markdownSpills(e *errWriter, sp []engine.Spill) {
	if len(sp) == 0 {
		return
	}
	e.line("## ", SpillsHeading)
	e.line()
	e.line("| Tank | Liquid | Mass |")
	e.line("|---|---|--:|")
	for _, s := range sp {
		e.line("| ", md(s.Compartment), " | ", md(s.Liquid), " | ", num(s.MassT, 1, "t"), " |")
	}
	e.line()
	e.line("Counted so: ", md(engine.SpillRule), ".")
	e.line()
}
