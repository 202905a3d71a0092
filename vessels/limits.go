package vessels

import (
	"fmt"
	"io"
	"os"

	"heelwatch/engine"
)

// Bounds on what a vessel file may hold. A real vessel file is a few
// kilobytes to a few hundred; a hostile or broken one must be refused
// quickly, before it can hang or exhaust the bridge PC it is opened on.
const (
	// MaxFileBytes is the largest vessel file read: 16 MiB.
	MaxFileBytes = 16 << 20
	// maxDepth is the deepest nesting of arrays and inline tables read. The
	// format needs 2 ([[y, z], …]); headers such as [[hull.section]] count
	// their brackets too.
	maxDepth = 8
	// maxKeyParts is the most parts of a dotted key or a table header read
	// (the format needs 2, as in hull.section).
	maxKeyParts = 8
	// maxItems is the most entries of any one array: sections, points of
	// one section, compartments, weights, openings (a real file has tens to
	// a few hundred).
	maxItems = 4096
	// maxHalfBreadth and maxHeight bound a section's points as a box hull's
	// breadth (200 m) and depth (100 m) are bounded; maxSpan bounds the
	// sections' extent along the ship as a box hull's length (1000 m).
	maxHalfBreadth = 100.0
	maxHeight      = 100.0
	maxSpan        = 1000.0
)

// readRegular reads the file at path if it is a regular file of at most
// MaxFileBytes. A FIFO, a device (/dev/zero) or a directory is refused
// before it is opened, so that opening it cannot block or read forever.
func readRegular(path string) ([]byte, error) {
	st, err := os.Stat(path)
	if err != nil {
		return nil, err
	}
	if err := regularAndSmall(path, st); err != nil {
		return nil, err
	}
	f, err := os.Open(path)
	if err != nil {
		return nil, err
	}
	defer f.Close()
	if st, err = f.Stat(); err != nil { // the file opened may not be the one looked at
		return nil, err
	}
	if err := regularAndSmall(path, st); err != nil {
		return nil, err
	}
	data, err := io.ReadAll(io.LimitReader(f, MaxFileBytes+1))
	if err != nil {
		return nil, err
	}
	if len(data) > MaxFileBytes {
		return nil, fmt.Errorf("%s: %w", path, errTooLarge)
	}
	return data, nil
}

var errTooLarge = fmt.Errorf("larger than %d MiB: a vessel file is a few hundred kilobytes at most", MaxFileBytes>>20)

func regularAndSmall(path string, st os.FileInfo) error {
	m := st.Mode()
	kind := ""
	switch {
	case m.IsRegular():
		if st.Size() > MaxFileBytes {
			return fmt.Errorf("%s: %w", path, errTooLarge)
		}
		return nil
	case m.IsDir():
		kind = "a directory"
	case m&os.ModeNamedPipe != 0:
		kind = "a named pipe (FIFO)"
	case m&os.ModeDevice != 0:
		kind = "a device"
	case m&os.ModeSocket != 0:
		kind = "a socket"
	default:
		kind = "not a regular file"
	}
	return fmt.Errorf("%s is %s: give a file on disk (only regular files are read)", path, kind)
}

// tooDeep scans a document before it is decoded and returns a problem when
// it nests arrays or inline tables deeper than maxDepth or writes a dotted
// key or header of more than maxKeyParts parts; nil otherwise. The TOML
// decoder takes time and memory that grow faster than the depth, so such a
// file is refused here, in one linear pass. The scan skips comments and
// strings; it need not understand more, because whatever it lets through
// the decoder still checks.
func tooDeep(file string, data []byte) *Problem {
	depth, dots, line := 0, 0, 1
	problem := func(msg string) *Problem {
		return &Problem{File: file, Line: line, Key: "syntax", Msg: msg}
	}
	for i := 0; i < len(data); i++ {
		c := data[i]
		switch {
		case c == '\n':
			line++
			dots = 0
		case c == '#':
			for i+1 < len(data) && data[i+1] != '\n' {
				i++
			}
		case c == '"' || c == '\'':
			end, lines := skipString(data, i)
			i, line = end, line+lines
		case c == '[' || c == '{':
			depth++
			dots = 0
			if depth > maxDepth {
				return problem(fmt.Sprintf("arrays or tables nested more than %d deep: a vessel file needs at most 2 (offsets = [[y, z], …])", maxDepth))
			}
		case c == ']' || c == '}':
			depth = max(depth-1, 0)
			dots = 0
		case c == '.':
			dots++
			if dots >= maxKeyParts {
				return problem(fmt.Sprintf("a dotted key or table name of more than %d parts: a vessel file needs at most 2 (hull.section)", maxKeyParts))
			}
		case c == ' ' || c == '\t' || isBare(c):
		default:
			dots = 0
		}
	}
	return nil
}

// skipString returns the index of the last byte of the string that opens
// at data[i] (a quote) and the number of line breaks inside it.
func skipString(data []byte, i int) (int, int) {
	q := data[i]
	lines := 0
	if i+2 < len(data) && data[i+1] == q && data[i+2] == q { // multi-line
		for j := i + 3; j < len(data); j++ {
			switch {
			case data[j] == '\n':
				lines++
			case data[j] == '\\' && q == '"':
				if j+1 < len(data) && data[j+1] == '\n' {
					lines++
				}
				j++
			case data[j] == q && j+2 < len(data) && data[j+1] == q && data[j+2] == q:
				for j+3 < len(data) && data[j+3] == q { // up to two more quotes belong to it
					j++
				}
				return j + 2, lines
			}
		}
		return len(data) - 1, lines
	}
	for j := i + 1; j < len(data); j++ {
		switch {
		case data[j] == '\n':
			return j - 1, 0 // unterminated: the decoder will say so
		case data[j] == '\\' && q == '"':
			j++
		case data[j] == q:
			return j, 0
		}
	}
	return len(data) - 1, 0
}

// tooMany reports every array in the decoded document v (at path) with
// more than maxItems entries, and returns whether it found one. A document
// without one (every file that is read) is walked once without building
// any key path (anyTooLong); only a refused one is walked again for them.
func (r *reader) tooMany(path string, v any) bool {
	if !anyTooLong(v) {
		return false
	}
	return r.tooManyAt(path, v)
}

// anyTooLong reports whether the decoded value v holds an array of more
// than maxItems entries, at any depth.
func anyTooLong(v any) bool {
	switch x := v.(type) {
	case map[string]any:
		for _, e := range x {
			if anyTooLong(e) {
				return true
			}
		}
	case []map[string]any:
		if len(x) > maxItems {
			return true
		}
		for _, e := range x {
			if anyTooLong(e) {
				return true
			}
		}
	case []any:
		if len(x) > maxItems {
			return true
		}
		for _, e := range x {
			switch e.(type) {
			case map[string]any, []map[string]any, []any:
				if anyTooLong(e) {
					return true
				}
			}
		}
	}
	return false
}

// tooManyAt is tooMany's walk that reports each array too long at its key
// path.
func (r *reader) tooManyAt(path string, v any) bool {
	found := false
	switch x := v.(type) {
	case map[string]any:
		for k, e := range x {
			found = r.tooManyAt(joinPath(path, k), e) || found
		}
	case []map[string]any:
		if len(x) > maxItems {
			r.addf(path, "has %d entries: at most %d are read (a vessel file has tens to a few hundred)", len(x), maxItems)
			return true
		}
		for i, e := range x {
			found = r.tooManyAt(elemPath(path, i+1), e) || found
		}
	case []any:
		if len(x) > maxItems {
			r.addf(path, "has %d entries: at most %d are read (a vessel file has tens to a few hundred)", len(x), maxItems)
			return true
		}
		for i, e := range x {
			found = r.tooManyAt(elemPath(path, i+1), e) || found
		}
	}
	return found
}

// pointTooFar reports a section point beyond the bounds a box hull has
// (half-breadth at most maxHalfBreadth, height at most maxHeight).
func (r *reader) pointTooFar(path string, y, z float64) bool {
	if y > maxHalfBreadth || z > maxHeight {
		r.addf(path, "[%g, %g] is beyond any ship's section: a half-breadth is at most %g m and a height at most %g m (as a box hull's breadth 200 m and depth 100 m)", y, z, maxHalfBreadth, maxHeight)
		return true
	}
	return false
}

// spanTooLong reports sections spread over more than maxSpan metres.
func (r *reader) spanTooLong(st []engine.Station) bool {
	if len(st) < 2 {
		return false
	}
	if span := st[len(st)-1].X - st[0].X; span > maxSpan {
		r.addf("hull.section", "the sections run over %g m (x = %g to %g): no ship is longer than %g m", span, st[0].X, st[len(st)-1].X, maxSpan)
		return true
	}
	return false
}

// marginBelowKeel reports a margin line (given, or the default when
// given is false) that lies at or below the keel of some station: a hull
// shallower than the margin line's depth has no margin line.
func (r *reader) marginBelowKeel(h *engine.Hull, margin float64, given bool) {
	if !given {
		margin = engine.MarginLineDepthM
	}
	for _, st := range h.Stations() {
		keel, deck := st.Offsets[0].Z, st.Offsets[len(st.Offsets)-1].Z
		if deck-margin > keel {
			continue
		}
		if given {
			r.addf("margin_line_depth", "%g m below the deck at side puts the margin line at or below the keel at x = %g m (the deck there is %g m above the keel): give less", margin, st.X, deck-keel)
		} else {
			r.addf("margin_line_depth", "missing, and the default %g m below the deck at side lies at or below the keel at x = %g m (the deck there is %g m above the keel): give margin_line_depth, less than that", margin, st.X, deck-keel)
		}
		return
	}
}

// openingsNearHull reports openings that lie far from the ship: more than
// half her length beyond her ends, half her breadth beyond her sides or
// 100 m above her deck. Such a position is a slip (a number in the wrong
// unit or column), and every margin computed from it would be meaningless.
func (r *reader) openingsNearHull(h *engine.Hull, ops []engine.Opening) {
	st := h.Stations()
	x0, x1 := st[0].X, st[len(st)-1].X
	L, B := x1-x0, h.BreadthM
	for i, o := range ops {
		p := fmt.Sprintf("opening[%d]", i+1)
		switch {
		case o.X < x0-L/2 || o.X > x1+L/2:
			r.addf(p+".x", "%g m is far beyond the ship, which runs from x = %g to %g m: an opening lies on her", o.X, x0, x1)
		case o.Y < -B || o.Y > B:
			r.addf(p+".y", "%g m is far beyond the ship's sides at y = ±%g m: an opening lies on her", o.Y, B/2)
		case o.Z > h.DepthM+100:
			r.addf(p+".z", "%g m is more than 100 m above the deck at side (%g m): an opening lies on her", o.Z, h.DepthM)
		}
	}
}
