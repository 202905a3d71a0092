package plaintext

import (
	"strings"
	"testing"
	"unicode/utf8"
)

func TestNameReplacesEveryControl(t *testing.T) {
	cases := map[string]string{
		"Hold 2":               "Hold 2",
		"\x1b]0;pwned\x07Hold": "\uFFFD]0;pwned\uFFFDHold",
		"a\r\nb":               "a\uFFFD\uFFFDb",
		"nul\x00":              "nul\uFFFD",
		"del\x7f":              "del\uFFFD",
		"c1\u009b2J":           "c1\uFFFD2J",
		"raw c1 \x9b":          "raw c1 \uFFFD", // a lone byte, not UTF-8
		"evil\u202eSTRAW":      "evil\uFFFDSTRAW",
		"iso\u2066x\u2069":     "iso\uFFFDx\uFFFD",
		"Ölbunker Süd":         "Ölbunker Süd",
		"real \uFFFD stays":    "real \uFFFD stays",
		"tab\there":            "tab\uFFFDhere",
	}
	for in, want := range cases {
		if got := Name(in); got != want {
			t.Errorf("Name(%q) = %q, want %q", in, got, want)
		}
	}
}

func TestTextKeepsLinesOnly(t *testing.T) {
	if got := Text("a\tb\nc\r\x1b[2J"); got != "a\tb\nc\uFFFD\uFFFD[2J" {
		t.Errorf("Text = %q", got)
	}
}

func TestFirstUnsafe(t *testing.T) {
	if r, bad := FirstUnsafe("ok name"); bad {
		t.Errorf("FirstUnsafe(ok) = %U", r)
	}
	if r, bad := FirstUnsafe("x\u202ey"); !bad || r != 0x202e {
		t.Errorf("FirstUnsafe(bidi) = %U %v", r, bad)
	}
	if r, bad := FirstUnsafe("x\xffy"); !bad || r != utf8.RuneError {
		t.Errorf("FirstUnsafe(bad byte) = %U %v", r, bad)
	}
	if d := Describe(0x1b); !strings.Contains(d, "ESC") {
		t.Errorf("Describe(ESC) = %q", d)
	}
}

// FuzzName checks that whatever goes in, nothing unsafe comes out and a
// safe string comes out unchanged.
func FuzzName(f *testing.F) {
	for _, s := range []string{"Hold 2", "\x1b]0;x\x07", "\u202e", "\xc2\x9b", "\xe2\x80", "a\nb"} {
		f.Add(s)
	}
	f.Fuzz(func(t *testing.T, s string) {
		for _, out := range []string{Name(s), Text(s)} {
			if r, bad := FirstUnsafe(out); bad && r != '\n' && r != '\t' {
				t.Fatalf("%q → %q still holds %U", s, out, r)
			}
		}
		if r, bad := FirstUnsafe(Name(s)); bad {
			t.Fatalf("Name(%q) holds %U", s, r)
		}
		if _, bad := FirstUnsafe(s); !bad && Name(s) != s {
			t.Fatalf("safe %q changed to %q", s, Name(s))
		}
	})
}
