package vessels

import (
	"embed"
	"fmt"
	"os"
	"path"
	"sort"
	"strings"

	"github.com/BurntSushi/toml"

	"heelwatch/engine"
)

//go:embed bundled/*.toml
var bundledFS embed.FS

// Default is the bundled vessel opened when none is named.
const Default = "freighter"

// Entry describes one bundled vessel.
type Entry struct {
	Name    string // what --vessel takes, e.g. "barge"
	Title   string // the vessel's name from the file
	Summary string // the first line of the file's about text
}

// Bundled lists the bundled vessels, sorted by name. It reads only their
// names and descriptions, not their geometry.
func Bundled() []Entry {
	files, err := bundledFS.ReadDir("bundled")
	if err != nil {
		panic("vessels: bundled vessels missing from the binary: " + err.Error())
	}
	var out []Entry
	for _, f := range files {
		name, ok := strings.CutSuffix(f.Name(), ".toml")
		if !ok {
			continue
		}
		src, _ := Source(name)
		var head struct {
			Name  string `toml:"name"`
			About string `toml:"about"`
		}
		// Bundled files are checked by the tests; a failure here leaves
		// the title empty rather than hiding the vessel.
		_, _ = toml.Decode(string(src), &head)
		out = append(out, Entry{Name: name, Title: head.Name, Summary: firstLine(head.About)})
	}
	sort.Slice(out, func(i, j int) bool { return out[i].Name < out[j].Name })
	return out
}

func firstLine(s string) string {
	s = strings.TrimSpace(s)
	if i := strings.IndexByte(s, '\n'); i >= 0 {
		s = s[:i]
	}
	return strings.TrimSpace(s)
}

// Source returns the TOML text of the bundled vessel called name.
func Source(name string) ([]byte, bool) {
	if name == "" || strings.ContainsAny(name, `/\.`) {
		return nil, false
	}
	b, err := bundledFS.ReadFile(path.Join("bundled", name+".toml"))
	if err != nil {
		return nil, false
	}
	return b, true
}

// Load reads the vessel file at path.
func Load(path string) (*engine.Vessel, *Info, error) {
	data, err := readRegular(path)
	if err != nil {
		return nil, nil, fmt.Errorf("vessel file: %w", err)
	}
	return Parse(path, data)
}

// Open opens a bundled vessel by name ("barge") or else the file at
// nameOrPath.
func Open(nameOrPath string) (*engine.Vessel, *Info, error) {
	if src, ok := Source(nameOrPath); ok {
		v, info, err := Parse("bundled/"+nameOrPath+".toml", src)
		if info != nil {
			info.Bundled = nameOrPath
		}
		return v, info, err
	}
	if _, err := os.Stat(nameOrPath); err != nil && !strings.ContainsAny(nameOrPath, `/\.`) {
		var names []string
		for _, e := range Bundled() {
			names = append(names, e.Name)
		}
		return nil, nil, fmt.Errorf("no bundled vessel called %q (bundled: %s) and no file of that name", nameOrPath, strings.Join(names, ", "))
	}
	return Load(nameOrPath)
}
