package vessels

import "github.com/BurntSushi/toml"

// decode is the one way into every file heelwatch reads (vessel,
// condition, readings, scenario, state): at most MaxFileBytes, nesting no
// deeper than the formats need (checked before the TOML decoder sees the
// text, which would otherwise take minutes on a hostile file), the TOML
// decoded, no array longer than maxItems. The lines of the keys (for the
// messages) are indexed while the decoder runs (lineIndexing). It returns
// the reader that collects the file's problems and the root table; an
// error here is the whole answer (a syntax error stops the reading of the
// rest).
func decode(file string, data []byte) (*reader, *table, error) {
	if len(data) > MaxFileBytes {
		return nil, nil, Problems{{File: file, Line: 1, Key: "syntax", Msg: errTooLarge.Error()}}
	}
	if p := tooDeep(file, data); p != nil {
		return nil, nil, Problems{*p}
	}
	var doc map[string]any
	src := string(data)
	lines := startIndexLines(src)
	if _, err := toml.Decode(src, &doc); err != nil {
		lines.drop()
		return nil, nil, syntaxProblem(file, err)
	}
	r := &reader{file: file, lines: lines.index()}
	if r.tooMany("", doc) {
		return nil, nil, r.probs.sorted()
	}
	return r, r.table("", doc), nil
}

// format checks the root's `format` key: present, and the one version
// this heelwatch reads.
func (r *reader) format(root *table) {
	if f, ok := root.get("format"); !ok {
		r.addf("format", "missing: the file must say format = %d", FormatVersion)
	} else if n, ok := f.(int64); !ok || n != FormatVersion {
		r.addf("format", "%v is not a format this heelwatch reads: write format = %d (a whole number)", tomlText(f), FormatVersion)
	}
}
