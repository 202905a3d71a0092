package vessels

import (
	"errors"
	"strings"
	"testing"
)

// TestEveryFileKindBounded: the readings, condition, scenario and state
// files are read through the same bounds as the vessel file (the readings
// reader once decoded without them): nesting too deep is refused before
// decoding, with the line, and a file over MaxFileBytes is refused whole.
func TestEveryFileKindBounded(t *testing.T) {
	v, info, err := Open("freighter")
	if err != nil {
		t.Fatal(err)
	}
	const n = 20000
	deep := []byte("format = 1\na = " + strings.Repeat("[", n) + strings.Repeat("]", n) + "\n")
	big := []byte(strings.Repeat("#", MaxFileBytes+1))
	readers := map[string]func([]byte) error{
		"readings":  func(d []byte) error { _, err := ParseReadings("f.toml", d, v); return err },
		"condition": func(d []byte) error { _, err := ParseCondition("f.toml", d, v, info); return err },
		"scenario":  func(d []byte) error { _, err := ParseScenario("f.toml", d, ""); return err },
		"state":     func(d []byte) error { _, err := ParseState("f.toml", d, v, info); return err },
	}
	for kind, read := range readers {
		var ps Problems
		if err := read(deep); !errors.As(err, &ps) || len(ps) != 1 || ps[0].Line != 2 {
			t.Errorf("%s, nested %d deep: got %v", kind, n, err)
		}
		if err := read(big); !errors.As(err, &ps) || len(ps) != 1 || !strings.Contains(ps[0].Msg, "MiB") {
			t.Errorf("%s, %d bytes: got %v", kind, len(big), err)
		}
	}
}
