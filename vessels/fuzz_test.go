package vessels

import (
	"errors"
	"math"
	"os"
	"path/filepath"
	"testing"

	"heelwatch/engine"
)

// FuzzParse feeds the reader arbitrary bytes, seeded with the bundled and
// the bad files: it must never panic, and it returns either a vessel with
// aligned Info or Problems that each name the file and a line.
func FuzzParse(f *testing.F) {
	for _, e := range Bundled() {
		src, _ := Source(e.Name)
		f.Add(src)
	}
	bad, _ := filepath.Glob(filepath.Join("..", "testdata", "vessels", "bad", "*.toml"))
	for _, p := range bad {
		if b, err := os.ReadFile(p); err == nil {
			f.Add(b)
		}
	}
	f.Add([]byte(""))
	f.Add([]byte("format = 1\nhull = 5\nweight = [1, {name = 2}]\ncompartment = \"x\"\n"))
	f.Fuzz(func(t *testing.T, data []byte) {
		if len(data) > 1<<16 {
			return
		}
		v, info, err := Parse("fuzz.toml", data)
		if err != nil {
			var ps Problems
			if !errors.As(err, &ps) || len(ps) == 0 {
				t.Fatalf("error %T %v is not Problems", err, err)
			}
			for _, p := range ps {
				if p.File != "fuzz.toml" || p.Line < 1 || p.Msg == "" {
					t.Fatalf("problem without file, line or message: %+v", p)
				}
			}
			if v != nil || info != nil {
				t.Fatal("values returned with an error")
			}
			return
		}
		if v == nil || info == nil || len(info.Compartments) != len(v.Compartments) {
			t.Fatal("no error but no vessel, or Info not aligned")
		}
		// Whatever loads must be solvable without a panic (sinking or
		// capsizing is an answer). Keep it cheap: only small vessels.
		if len(v.Compartments) <= 8 && len(v.Hull.Stations()) <= 8 {
			pos, err := engine.Solve(v, v.Intact())
			if err == nil {
				for _, f := range []float64{pos.DraftAftM, pos.DraftFwdM, pos.HeelDeg, pos.GMM, pos.DisplacementT} {
					if math.IsNaN(f) || math.IsInf(f, 0) {
						t.Fatalf("solved position holds %v: %+v", f, pos)
					}
				}
				if s, _ := engine.GirderStrength(v, v.Intact(), &pos); s != nil {
					for i := range s.XM {
						if f := s.MomentKNm[i] + s.ShearKN[i]; math.IsNaN(f) || math.IsInf(f, 0) {
							t.Fatalf("hull girder holds %v at x = %v", f, s.XM[i])
						}
					}
				}
			}
		}
	})
}
