package vessels

import (
	"errors"
	"path/filepath"
	"strings"
	"testing"
)

// limitFiles lists every file in testdata/vessels/limits with the one
// problem it must give.
var limitFiles = map[string][]want{
	"section-breadth-2e7.toml":      {{14, "hull.section[2].offsets[3]", "half-breadth is at most 100 m"}},
	"sections-span-2000.toml":       {{8, "hull.section", "no ship is longer than 1000 m"}},
	"tiny-hull-default-margin.toml": {{1, "margin_line_depth", "default 0.076 m below the deck at side lies at or below the keel"}},
	"opening-far-away.toml": {
		{18, "opening[1].x", "far beyond the ship"},
		{26, "opening[2].z", "more than 100 m above the deck"},
	},
}

func TestLimitFiles(t *testing.T) {
	dir := filepath.Join("..", "testdata", "vessels", "limits")
	files, _ := filepath.Glob(filepath.Join(dir, "*.toml"))
	if len(files) != len(limitFiles) {
		t.Errorf("%d files in %s, %d listed", len(files), dir, len(limitFiles))
	}
	for _, path := range files {
		ws := limitFiles[filepath.Base(path)]
		_, _, err := Load(path)
		var ps Problems
		if !errors.As(err, &ps) || len(ps) != len(ws) {
			t.Errorf("%s: got %v, want %d problems", path, err, len(ws))
			continue
		}
		for i, w := range ws {
			if p := ps[i]; p.Line != w.line || p.Key != w.key || !strings.Contains(p.Msg, w.frag) {
				t.Errorf("%s: got %s, want line %d key %s with %q", path, p, w.line, w.key, w.frag)
			}
		}
	}
}

// TestDeepNestingRefusedBeforeDecoding: documents the TOML decoder would
// take minutes and gigabytes over (20 000 nested inline tables, a dotted
// key or header of 20 000 parts) are refused by the scan before it, with
// the line. (How fast is a benchmark's business: BenchmarkTooDeep.)
func TestDeepNestingRefusedBeforeDecoding(t *testing.T) {
	const n = 20000
	cases := map[string]string{
		"arrays":        "format = 1\na = " + strings.Repeat("[", n) + strings.Repeat("]", n) + "\n",
		"inline tables": "format = 1\na = " + strings.Repeat("{b = ", n) + "1" + strings.Repeat("}", n) + "\n",
		"dotted key":    "format = 1\n" + strings.Repeat("a.", n) + "a = 1\n",
		"header":        "format = 1\n[" + strings.Repeat("a.", n) + "a]\n",
		"header quoted": "format = 1\n[" + strings.Repeat(`"a".`, n) + "a]\n",
	}
	for name, src := range cases {
		_, _, err := Parse("deep.toml", []byte(src))
		var ps Problems
		if !errors.As(err, &ps) || len(ps) != 1 || ps[0].Line != 2 || !strings.Contains(ps[0].Msg, "at most 2") {
			t.Errorf("%s: got %v", name, err)
		}
	}
	// What the format needs, and brackets and dots inside strings and
	// comments, pass.
	ok := "format = 1 # [[[[[[[[[[[[ a.b.c.d.e.f.g.h.i\nname = \"a.b.c.d.e.f.g.h.i.j [[[[[[[[[[\"\nabout = '''\n{{{{{{{{{{{{\n'''\n"
	if p := tooDeep("ok.toml", []byte(ok)); p != nil {
		t.Errorf("refused %q: %v", ok, p)
	}
	for _, e := range Bundled() {
		src, _ := Source(e.Name)
		if p := tooDeep(e.Name, src); p != nil {
			t.Errorf("bundled %s refused: %v", e.Name, p)
		}
	}
}

// BenchmarkTooDeep scans a whole file of the largest size read (nothing
// in it is too deep, so the scan runs to the end).
func BenchmarkTooDeep(b *testing.B) {
	src := []byte(strings.Repeat("offsets = [[1.5, 2.5], [3.5, 4.5]] # x.y\n", MaxFileBytes/42))
	for b.Loop() {
		tooDeep("deep.toml", src)
	}
}

// TestAbsurdCountsRefused: 20 000 points in a station (which took 0.9 s
// to match before the matching became linear) is refused by count.
func TestAbsurdCountsRefused(t *testing.T) {
	pts := strings.TrimSuffix(strings.Repeat("[5.0, 1.0], ", 20000), ", ")
	src := "format = 1\nname = \"x\"\n[hull]\nshape = \"sections\"\nlength = 10\n[[hull.section]]\nx = 0\noffsets = [" + pts + "]\n"
	_, _, err := Parse("many.toml", []byte(src))
	var ps Problems
	if !errors.As(err, &ps) || len(ps) != 1 || ps[0].Key != "hull.section[1].offsets" || ps[0].Line != 8 || !strings.Contains(ps[0].Msg, "20000 entries: at most 4096") {
		t.Errorf("got %v", err)
	}
}
