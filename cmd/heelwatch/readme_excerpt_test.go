package main

import (
	"os"
	"path/filepath"
	"strings"
	"testing"
)

// TestREADMESolveExcerpt: the README's excerpt of solve's text is what
// solve prints today for the command the README gives above it: every line
// of the excerpt, spaces aside, is a line of the output, in order (the
// excerpt said 233.6 m³ for Wing tank 2 S long after the ship's tank held
// 234.3).
func TestREADMESolveExcerpt(t *testing.T) {
	readme, err := os.ReadFile(filepath.Join("..", "..", "README.md"))
	if err != nil {
		t.Fatal(err)
	}
	const intro = "An excerpt of the text format:\n\n```\n"
	i := strings.Index(string(readme), intro)
	if i < 0 {
		t.Fatal("README has no excerpt of the text format")
	}
	block := string(readme[i+len(intro):])
	block = block[:strings.Index(block, "```")]
	_, out, _ := heelwatch(t, "solve", "--open", "Wing tank 2 S,DB 2 S")
	squash := func(s string) string { return strings.Join(strings.Fields(s), " ") }
	var got []string
	for _, l := range strings.Split(out, "\n") {
		got = append(got, squash(l))
	}
	k := 0
	for _, l := range strings.Split(block, "\n") {
		want := squash(l)
		if want == "" {
			continue
		}
		for k < len(got) && got[k] != want {
			k++
		}
		if k == len(got) {
			t.Errorf("README excerpt line %q is not (in order) in solve's output:\n%s", l, out)
			return
		}
	}
}
