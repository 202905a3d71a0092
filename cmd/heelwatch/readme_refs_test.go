package main

import (
	"os"
	"path/filepath"
	"regexp"
	"strings"
	"testing"
)

// TestHelpNamesREADMESections: a help text that sends the reader to a
// README section names one that is there (diagnose --help named
// "Readings and diagnosis", a heading the README does not have).
func TestHelpNamesREADMESections(t *testing.T) {
	readme, err := os.ReadFile(filepath.Join("..", "..", "README.md"))
	if err != nil {
		t.Fatal(err)
	}
	headings := map[string]bool{}
	for _, l := range strings.Split(string(readme), "\n") {
		if strings.HasPrefix(l, "#") {
			headings[strings.TrimSpace(strings.TrimLeft(l, "#"))] = true
		}
	}
	ref := regexp.MustCompile(`README, "([^"]+)"`)
	files, _ := filepath.Glob("*.go")
	for _, f := range files {
		if strings.HasSuffix(f, "_test.go") {
			continue
		}
		src, err := os.ReadFile(f)
		if err != nil {
			t.Fatal(err)
		}
		// Help texts wrap: join the lines of a reference.
		text := regexp.MustCompile(`\n\s+`).ReplaceAllString(string(src), " ")
		for _, m := range ref.FindAllStringSubmatch(text, -1) {
			if !headings[m[1]] {
				t.Errorf("%s: names README section %q, which is not a heading of README.md", f, m[1])
			}
		}
	}
}
