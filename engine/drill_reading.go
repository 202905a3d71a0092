package engine

import (
	"math"
	"math/rand"
)

// This file reads the truth of a drill as the crew would: the draft marks
// and the inclinometer, each with the reading errors of readings (practice,
// as DraftErrorM and HeelErrorDeg): a mark read with an error uniform in
// ±DraftErrorM and written to the centimetre, the inclinometer with an
// error uniform in ±HeelErrorDeg and written to the tenth of a degree.

// CrewReading returns what the crew would read of pos at scenario minute
// minutes: every mark that reads (a mark under water or with the keel out
// reads nothing) and the inclinometer. The errors are drawn from a source
// seeded by seed and the minute (to the second), so that the same drill
// reads the same at the same moment however often it is asked.
func CrewReading(v *Vessel, pos Position, minutes float64, seed int64) Reading {
	rng := rand.New(rand.NewSource(seed*1_000_003 + int64(math.Round(minutes*60))))
	r := Reading{Minutes: minutes, HasHeel: true}
	r.HeelDeg = math.Round((pos.HeelDeg+(2*rng.Float64()-1)*HeelErrorDeg)*10) / 10
	for i, m := range MarkDrafts(v.Hull, pos.Plane, v.DraftMarks) {
		if m.State != MarkReads {
			continue
		}
		d := math.Round((m.DraftM+(2*rng.Float64()-1)*DraftErrorM)*100) / 100
		r.Drafts = append(r.Drafts, MarkReading{Mark: i, DraftM: d})
	}
	return r
}
