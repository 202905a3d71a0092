package vessels

import (
	"fmt"
	"strings"
	"testing"
	"unicode"

	"heelwatch/report/plaintext"
)

// FuzzNames puts any text into a compartment's name (written as a TOML
// string with every character escaped, so that the file always parses):
// the reader either refuses it with the key and line, or keeps it exactly,
// and then it holds nothing unsafe and no edge space.
func FuzzNames(f *testing.F) {
	for _, s := range []string{"Hold 2", "Hold 2 ", " Hold", "\x1b]0;x\x07", "a\r\nb", "\u202eevil", "\u0085", "Ölbunker Süd", "x\u2069", "", " ", "\u00a0Hold", "Hold\u3000"} {
		f.Add(s)
	}
	f.Fuzz(func(t *testing.T, name string) {
		if !utf8Valid(name) {
			return // a TOML string holds only Unicode scalar values
		}
		var esc strings.Builder
		for _, r := range name {
			fmt.Fprintf(&esc, `\U%08X`, r)
		}
		src := fmt.Sprintf(`format = 1
name = "Fuzz barge"
[hull]
shape = "box"
length = 40.0
breadth = 10.0
depth = 5.0
[[weight]]
name = "Lightship"
mass = 600.0
lcg = 20.0
vcg = 2.5
[[compartment]]
name = "%s"
use = "void"
x = [10.0, 20.0]
y = [-5.0, 5.0]
z = [0.0, 5.0]
`, esc.String())
		v, _, err := Parse("fuzz.toml", []byte(src))
		if err != nil {
			if !strings.Contains(err.Error(), "fuzz.toml:14: compartment[1].name: ") {
				t.Fatalf("%q refused, but not at its key: %v", name, err)
			}
			if _, bad := plaintext.FirstUnsafe(err.Error()); bad {
				t.Fatalf("the message about %q holds an unsafe character: %q", name, err.Error())
			}
			return
		}
		got := v.Compartments[0].Name
		if got != name {
			t.Fatalf("name %q read as %q", name, got)
		}
		if _, bad := plaintext.FirstUnsafe(got); bad {
			t.Fatalf("unsafe name %q accepted", got)
		}
		if strings.TrimFunc(got, unicode.IsSpace) != got {
			t.Fatalf("name with an edge space %q accepted", got)
		}
	})
}

func utf8Valid(s string) bool { return strings.ToValidUTF8(s, "\uFFFD") == s }
