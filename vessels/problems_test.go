package vessels

import (
	"errors"
	"os"
	"path/filepath"
	"sort"
	"strconv"
	"strings"
	"testing"
)

// want is one problem a bad file must produce.
type want struct {
	line int
	key  string
	frag string // a piece of the message
}

// badFiles lists every file in testdata/vessels/bad with the problems it
// must give, no more and no fewer. The line numbers were counted in the
// files by hand.
var badFiles = map[string][]want{
	"syntax-error.toml":              {{2, "name", "TOML syntax"}},
	"missing-hull.toml":              {{1, "hull", "missing"}},
	"zero-length.toml":               {{6, "hull.length", "above zero"}},
	"negative-breadth.toml":          {{7, "hull.breadth", "above zero"}},
	"nan-depth.toml":                 {{8, "hull.depth", "NaN is not allowed"}},
	"infinite-mass.toml":             {{12, "weight[1].mass", "+Inf is not allowed"}},
	"zero-mass.toml":                 {{12, "weight[1].mass", "above zero"}},
	"negative-mass.toml":             {{12, "weight[1].mass", "above zero"}},
	"mass-not-a-number.toml":         {{12, "weight[1].mass", "must be a number (t), not text"}},
	"wrong-format.toml":              {{1, "format", "write format = 1"}},
	"water-density-in-kg.toml":       {{3, "water_density", "between 0.95 and 1.30"}},
	"unknown-key.toml":               {{14, "weight[1].centre", "unknown key"}},
	"no-weights.toml":                {{1, "weight", "at least one [[weight]]"}},
	"compartment-outside-hull.toml":  {{20, "compartment[1].y", "beyond the hull's sides at y = ±5"}},
	"compartment-holds-no-hull.toml": {{22, "compartment[1]", "holds no part of the hull"}},
	"compartments-overlap.toml":      {{23, "compartment[2]", `overlaps compartment[1] "Hold" by 80 m³`}}, // 5 × 4 × 4 m in common (closed form)
	// The wing's 10 m × 1 m × (1 to 5 m) inside the hopper's triangle: the
	// trapezium between z = 1 and the slope z = y, y from 4 to 5, 3.5 m² (closed form).
	"sections-overlap.toml": {{26, "compartment[2]", `overlaps compartment[1] "Hopper S" by 35 m³`},
		{36, "compartment[3].section", "turns inwards at point 3"}},
	"permeability-above-one.toml":     {{19, "compartment[1].permeability", "outside (0, 1]"}},
	"permeability-zero.toml":          {{19, "compartment[1].permeability", "default 0.70"}},
	"duplicate-compartment-name.toml": {{24, "compartment[2].name", "already the name of compartment[1]"}},
	"duplicate-opening-name.toml":     {{23, "opening[2].name", "already the name of opening[1]"}},
	"duplicate-weight-name.toml":      {{17, "weight[2].name", "already the name of weight[1]"}},
	"unknown-use.toml":                {{18, "compartment[1].use", `"cargo hold" is not one of`}},
	"bounds-reversed.toml":            {{19, "compartment[1].x", "low < high"}},
	"comma-in-name.toml":              {{17, "compartment[1].name", "holds a comma"}},
	"fill-above-one.toml":             {{24, "compartment[1].fill", "outside [0, 1]"}},
	"fill-m3-above-capacity.toml":     {{24, "compartment[1].fill_m3", "more than the tank holds (142.5 m³"}},
	"liquid-in-dry-space.toml":        {{22, "compartment[1].liquid", `only a compartment with use = "tank"`}},
	"hole-outside-compartment.toml":   {{22, "compartment[1].hole.z", "outside the compartment's z bounds"}},
	"unknown-criteria.toml":           {{3, "criteria[2]", `"imo-weather" is not a criteria set`}},
	"one-section.toml":                {{8, "hull.section", "at least two [[hull.section]]"}},
	"section-heights-descending.toml": {{17, "hull.section[2].offsets[4]", "heights must ascend"}},
	"section-x-not-ascending.toml":    {{17, "hull.section[3].x", "not forward of the section before"}},
	"sections-breadth-disagrees.toml": {{7, "hull.breadth", "disagrees with the sections' largest breadth 10.000 m"}},
	// Several problems in one file are all reported, in line order.
	"several-problems.toml": {
		{7, "hull.breadth", "above zero"},
		{12, "weight[1].mass", "above zero"},
		{19, "compartment[1].permeability", "outside (0, 1]"},
		{23, "compartment[1].colour", "unknown key"},
		{26, "compartment[2].name", "already the name"},
		{32, "opening[1].z", "missing"},
	},
}

func TestBadFiles(t *testing.T) {
	dir := filepath.Join("..", "testdata", "vessels", "bad")
	files, err := filepath.Glob(filepath.Join(dir, "*.toml"))
	if err != nil || len(files) == 0 {
		t.Fatalf("no bad files in %s: %v", dir, err)
	}
	seen := map[string]bool{}
	for _, path := range files {
		base := filepath.Base(path)
		seen[base] = true
		t.Run(base, func(t *testing.T) {
			wants, ok := badFiles[base]
			if !ok {
				t.Fatalf("%s has no expectations in badFiles", base)
			}
			v, info, err := Load(path)
			if err == nil || v != nil || info != nil {
				t.Fatalf("Load(%s) = %v, %v, %v; want refusal", base, v, info, err)
			}
			var ps Problems
			if !errors.As(err, &ps) {
				t.Fatalf("error is %T, not Problems: %v", err, err)
			}
			if len(ps) != len(wants) {
				t.Fatalf("got %d problems, want %d:\n%v", len(ps), len(wants), err)
			}
			for i, w := range wants {
				p := ps[i]
				if p.File != path || p.Line != w.line || p.Key != w.key || !strings.Contains(p.Msg, w.frag) {
					t.Errorf("problem %d = %q\nwant %s:%d: %s: …%s…", i+1, p.String(), path, w.line, w.key, w.frag)
				}
				// The one-line form names the file, the line and the key.
				prefix := path + ":" + strconv.Itoa(w.line) + ": " + w.key + ": "
				if !strings.HasPrefix(p.String(), prefix) {
					t.Errorf("problem %d reads %q, want it to start %q", i+1, p.String(), prefix)
				}
			}
			if got := strings.Count(err.Error(), "\n") + 1; got != len(wants) {
				t.Errorf("Error() has %d lines, want one per problem (%d)", got, len(wants))
			}
		})
	}
	var missing []string
	for name := range badFiles {
		if !seen[name] {
			missing = append(missing, name)
		}
	}
	sort.Strings(missing)
	if len(missing) > 0 {
		t.Errorf("expectations without a file: %v", missing)
	}
}

// TestLoadMissingFile checks that an unreadable path is an error naming it.
func TestLoadMissingFile(t *testing.T) {
	_, _, err := Load(filepath.Join(t.TempDir(), "nope.toml"))
	if err == nil || !strings.Contains(err.Error(), "nope.toml") {
		t.Fatalf("Load of a missing file: %v", err)
	}
	if !errors.Is(err, os.ErrNotExist) {
		t.Errorf("error %v does not wrap os.ErrNotExist", err)
	}
}

func TestProblemString(t *testing.T) {
	for _, c := range []struct {
		p    Problem
		want string
	}{
		{Problem{"a.toml", 3, "hull.length", "missing"}, "a.toml:3: hull.length: missing"},
		{Problem{"a.toml", 0, "", "cannot read"}, "a.toml: cannot read"},
	} {
		if got := c.p.String(); got != c.want {
			t.Errorf("%+v.String() = %q, want %q", c.p, got, c.want)
		}
	}
	ps := Problems{{"f", 1, "a", "x"}, {"f", 2, "b", "y"}}
	if got, want := ps.Error(), "f:1: a: x\nf:2: b: y"; got != want {
		t.Errorf("Problems.Error() = %q, want %q", got, want)
	}
}
