package vessels

import (
	"errors"
	"os"
	"path/filepath"
	"strings"
	"testing"
)

// hostileFiles lists every file in testdata/vessels/hostile: names that
// would act on a terminal or could not be typed back, each refused with
// file, line and key.
var hostileFiles = map[string]want{
	"vessel-name-osc.toml":                 {2, "name", "ESC (U+001B)"},
	"vessel-name-clear-screen.toml":        {2, "name", "ESC (U+001B)"},
	"weight-name-tab.toml":                 {11, "weight[1].name", "TAB (U+0009)"},
	"compartment-name-crlf.toml":           {17, "compartment[1].name", "carriage return"},
	"compartment-name-nul.toml":            {17, "compartment[1].name", "NUL (U+0000)"},
	"compartment-name-c1.toml":             {17, "compartment[1].name", "CSI (U+009B)"},
	"compartment-name-del.toml":            {17, "compartment[1].name", "DEL (U+007F)"},
	"compartment-name-raw-bidi-c1.toml":    {17, "compartment[1].name", "bidirectional control (U+202E)"},
	"compartment-name-trailing-space.toml": {17, "compartment[1].name", "starts or ends with a space"},
	"compartment-name-leading-space.toml":  {17, "compartment[1].name", "starts or ends with a space"},
	"group-bidi.toml":                      {19, "compartment[1].group", "bidirectional control (U+202E)"},
	"opening-name-bidi-isolate.toml":       {25, "opening[1].name", "bidirectional control (U+2066)"},
	"opening-name-esc.toml":                {25, "opening[1].name", "ESC (U+001B)"},
}

func TestHostileNamesRefused(t *testing.T) {
	dir := filepath.Join("..", "testdata", "vessels", "hostile")
	files, _ := filepath.Glob(filepath.Join(dir, "*.toml"))
	if len(files) != len(hostileFiles) {
		t.Errorf("%d files in %s, %d listed", len(files), dir, len(hostileFiles))
	}
	for _, path := range files {
		base := filepath.Base(path)
		w, ok := hostileFiles[base]
		if !ok {
			t.Errorf("%s is not listed in hostileFiles", base)
			continue
		}
		_, _, err := Load(path)
		var ps Problems
		if !errors.As(err, &ps) || len(ps) != 1 {
			t.Errorf("%s: got %v, want exactly one problem", base, err)
			continue
		}
		p := ps[0]
		if p.File != path || p.Line != w.line || p.Key != w.key || !strings.Contains(p.Msg, w.frag) {
			t.Errorf("%s: got %s, want line %d key %s with %q", base, p, w.line, w.key, w.frag)
		}
		// The message itself must not carry the character it refuses.
		if strings.ContainsAny(p.String(), "\x1b\r\x00\x7f\u009b\u202e\u2066") {
			t.Errorf("%s: the message holds the raw character: %q", base, p.String())
		}
	}
}

func TestCleanNamesStillRead(t *testing.T) {
	src, err := os.ReadFile(filepath.Join("..", "testdata", "vessels", "hostile", "compartment-name-del.toml"))
	if err != nil {
		t.Fatal(err)
	}
	fixed := strings.Replace(string(src), `"Hold\u007f"`, `"Ölbunker Süd 2"`, 1)
	v, _, err := Parse("ok.toml", []byte(fixed))
	if err != nil {
		t.Fatal(err)
	}
	if v.Compartments[0].Name != "Ölbunker Süd 2" {
		t.Errorf("name %q", v.Compartments[0].Name)
	}
}
