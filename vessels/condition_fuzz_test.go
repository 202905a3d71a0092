package vessels

import (
	"errors"
	"os"
	"path/filepath"
	"testing"
)

// FuzzParseState: whatever a condition or state file holds, reading it
// never panics; a file refused is refused with file, line and message, and
// one taken loads the ship or says why not.
func FuzzParseState(f *testing.F) {
	conds, _ := filepath.Glob(filepath.Join("..", "testdata", "conditions", "*.toml"))
	for _, p := range conds {
		if b, err := os.ReadFile(p); err == nil {
			f.Add(b)
		}
	}
	f.Add([]byte("format = 1\nkeep = [\"Lightship: hull steel\"]\n[[tank]]\nname = \"DB 2 P\"\nsounding_m = 0.3\n[[space]]\nname = \"Hold 2\"\nopen = true\n"))
	f.Add([]byte("format = 1\nkeep = 3\ntank = [1]\nheel_deg = 1e300\ntrim_m = -0.0\n"))
	v, info, err := Open("freighter")
	if err != nil {
		f.Fatal(err)
	}
	f.Fuzz(func(t *testing.T, data []byte) {
		if len(data) > 1<<14 {
			return
		}
		for _, parse := range []func() (*Condition, error){
			func() (*Condition, error) { return ParseCondition("fuzz.toml", data, v, info) },
			func() (*Condition, error) {
				s, err := ParseState("fuzz.toml", data, v, info)
				if err != nil {
					return nil, err
				}
				return s.Condition, nil
			},
		} {
			c, err := parse()
			if err != nil {
				var ps Problems
				if !errors.As(err, &ps) {
					continue // the syntax of TOML, said by the decoder
				}
				for _, p := range ps {
					if p.File != "fuzz.toml" || p.Line < 1 || p.Msg == "" {
						t.Fatalf("problem without file, line or message: %+v", p)
					}
				}
				continue
			}
			if _, err := c.Apply(v); err != nil && err.Error() == "" {
				t.Fatal("an error without words")
			}
		}
	})
}
