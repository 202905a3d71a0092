package vessels

import (
	"errors"
	"math"
	"os"
	"path/filepath"
	"testing"
)

// FuzzReadings feeds the readings reader arbitrary bytes for the bundled
// freighter, seeded with the known case's readings: it must never panic,
// and it returns either readings that the checks allow (marks between keel
// and deck, heel under 90°, times in order) or Problems that name the file
// and a line.
func FuzzReadings(f *testing.F) {
	v, _, err := Open("freighter")
	if err != nil {
		f.Fatal(err)
	}
	if b, err := os.ReadFile(filepath.Join("..", "testdata", "diagnose", "freighter-wing-tank-2s.toml")); err == nil {
		f.Add(b)
	}
	f.Add([]byte("format = 1\n[[reading]]\nminutes = 0\nheel_deg = -89.9\nlevels = { \"hold 2\" = 0 }\n"))
	f.Add([]byte("format = 1\nreading = 3\n"))
	f.Add([]byte("format = 1\n[[reading]]\nminutes = 1e300\ndrafts = { \"Fwd P\" = nan }\n"))
	f.Fuzz(func(t *testing.T, data []byte) {
		if len(data) > 1<<14 {
			return
		}
		rs, err := ParseReadings("r.toml", data, v)
		if err != nil {
			var ps Problems
			if !errors.As(err, &ps) || len(ps) == 0 {
				t.Fatalf("error %T %v is not Problems", err, err)
			}
			for _, p := range ps {
				if p.File != "r.toml" || p.Line < 1 || p.Msg == "" {
					t.Fatalf("problem without file, line or message: %+v", p)
				}
			}
			return
		}
		prev := math.Inf(-1)
		for _, r := range rs {
			if !(r.Minutes >= prev) || (r.HasHeel && !(math.Abs(r.HeelDeg) < 90)) {
				t.Fatalf("reading let through: %+v", r)
			}
			prev = r.Minutes
			for _, d := range r.Drafts {
				if d.Mark < 0 || d.Mark >= len(v.DraftMarks) || math.IsNaN(d.DraftM) {
					t.Fatalf("draft let through: %+v", d)
				}
			}
			for _, l := range r.Levels {
				if l.Compartment < 0 || l.Compartment >= len(v.Compartments) || !(l.LevelM >= 0) {
					t.Fatalf("level let through: %+v", l)
				}
			}
		}
	})
}
