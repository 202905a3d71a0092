package vessels

import (
	"runtime"
	"strconv"
	"strings"
)

// lineIndex maps key paths of a TOML document to the line each starts on.
//
// BurntSushi/toml keeps key positions to itself, so after the document has
// parsed cleanly this small scanner walks it again and notes where every
// key, table header and array element begins. Paths are written as the
// walker in read.go writes them: tables joined with ".", entries of an
// array of tables and elements of an array counted from 1 in brackets, as
// in "compartment[3].permeability" or "hull.section[2].offsets[4]".
type lineIndex struct {
	at  map[string]int
	aot map[string]int // entries seen so far of each array of tables
}

// maxNesting bounds the scanner's recursion into nested arrays and inline
// tables; deeper values are skipped as a whole.
const maxNesting = 64

// indexLines scans src, a document BurntSushi/toml accepted; its index
// of any other text is not used. It never fails, on any text (lineIndexing
// runs it before the decoder has judged the text): on anything it does not
// follow it stops noting lines.
func indexLines(src string) *lineIndex {
	ix := &lineIndex{at: map[string]int{}, aot: map[string]int{}}
	s := &scanner{src: src, line: 1, ix: ix}
	s.document()
	return ix
}

// lineIndexing is the indexing of a document's lines (indexLines) begun
// beside the TOML decoder: on a goroutine of its own when more than one
// can run, so that it takes nothing from the decoder's time; otherwise
// only when the index is asked for.
type lineIndexing struct {
	src   string
	done  chan *lineIndex // nil when not started
	fault any             // a panic of the scan on its goroutine, raised again by index
}

// startIndexLines begins indexing the lines of src.
func startIndexLines(src string) *lineIndexing {
	li := &lineIndexing{src: src}
	if runtime.GOMAXPROCS(0) >= 2 {
		li.done = make(chan *lineIndex, 1)
		go func() {
			// A fault of the scan is carried to the caller's goroutine,
			// where the command's guard catches it, instead of ending the
			// program from here.
			defer func() {
				if p := recover(); p != nil {
					li.fault = p
					li.done <- nil
				}
			}()
			li.done <- indexLines(src)
		}()
	}
	return li
}

// index returns the index, waiting for it or making it.
func (li *lineIndexing) index() *lineIndex {
	if li.done == nil {
		return indexLines(li.src)
	}
	ix := <-li.done
	if ix == nil {
		panic(li.fault)
	}
	return ix
}

// drop waits for a scan begun (so that none outlives decode) and does
// not make one: the index of a document the decoder refused is not used.
func (li *lineIndexing) drop() {
	if li.done != nil {
		<-li.done
	}
}

// line returns the line of path, or of its nearest enclosing key or table
// that was seen; 0 if none was.
func (ix *lineIndex) line(path string) int {
	for path != "" {
		if n, ok := ix.at[path]; ok {
			return n
		}
		path = parentPath(path)
	}
	return 0
}

// parentPath drops the last ".key" or "[n]" of path.
func parentPath(path string) string {
	i := strings.LastIndexAny(path, ".[")
	if i < 0 {
		return ""
	}
	return path[:i]
}

type scanner struct {
	src  string
	i    int
	line int
	ix   *lineIndex
	// path is the key path of the value being scanned, built up and cut
	// back in place as the scanner enters and leaves arrays and inline
	// tables, so that only a path that is noted becomes a string.
	path []byte
}

func (s *scanner) eof() bool { return s.i >= len(s.src) }

func (s *scanner) peek() byte {
	if s.eof() {
		return 0
	}
	return s.src[s.i]
}

func (s *scanner) next() {
	if s.eof() {
		return
	}
	if s.src[s.i] == '\n' {
		s.line++
	}
	s.i++
}

// blank skips spaces and tabs (not newlines).
func (s *scanner) blank() {
	for !s.eof() && (s.peek() == ' ' || s.peek() == '\t') {
		s.next()
	}
}

// space skips whitespace, newlines and comments (inside arrays).
func (s *scanner) space() {
	for !s.eof() {
		switch s.peek() {
		case ' ', '\t', '\r', '\n':
			s.next()
		case '#':
			s.skipLine()
		default:
			return
		}
	}
}

// skipLine skips to just past the end of the line.
func (s *scanner) skipLine() {
	for !s.eof() && s.peek() != '\n' {
		s.next()
	}
	s.next()
}

func (s *scanner) document() {
	table := ""
	for !s.eof() {
		s.space()
		if s.eof() {
			return
		}
		start := s.i
		switch s.peek() {
		case '[':
			table = s.header()
		default:
			line := s.line
			key := s.key()
			s.blank()
			if s.peek() != '=' || key == "" {
				s.skipLine()
				break
			}
			s.next()
			s.blank()
			path := joinPath(table, key)
			s.note(path, line)
			s.path = append(s.path[:0], path...)
			s.value(0, line)
		}
		if s.i == start {
			s.next() // always move on
		}
	}
}

// note records the line of path unless it was seen already.
func (s *scanner) note(path string, line int) {
	if _, ok := s.ix.at[path]; !ok {
		s.ix.at[path] = line
	}
}

// notePath records the line of the scanner's current path unless it was
// seen already.
func (s *scanner) notePath(line int) {
	if _, ok := s.ix.at[string(s.path)]; !ok {
		s.ix.at[string(s.path)] = line
	}
}

// enterElement extends the current path to its element n ("[n]") and
// returns the length to cut it back to.
func (s *scanner) enterElement(n int) int {
	mark := len(s.path)
	s.path = append(s.path, '[')
	s.path = strconv.AppendInt(s.path, int64(n), 10)
	s.path = append(s.path, ']')
	return mark
}

// enterKey extends the current path by key k as joinPath does and returns
// the length to cut it back to.
func (s *scanner) enterKey(k string) int {
	mark := len(s.path)
	if len(s.path) > 0 && k != "" {
		s.path = append(s.path, '.')
	}
	s.path = append(s.path, k...)
	return mark
}

// header reads "[a.b]" or "[[a.b]]" and returns the resolved table path.
func (s *scanner) header() string {
	line := s.line
	s.next()
	array := s.peek() == '['
	if array {
		s.next()
	}
	s.blank()
	segs := s.keySegments()
	path := ""
	for k, seg := range segs {
		path = joinPath(path, seg)
		if array && k == len(segs)-1 {
			s.note(path, line) // the first entry stands for the whole array
			s.ix.aot[path]++
			path += "[" + itoa(s.ix.aot[path]) + "]"
		} else if n := s.ix.aot[path]; n > 0 {
			path += "[" + itoa(n) + "]"
		}
	}
	s.skipLine()
	if path != "" {
		s.note(path, line)
	}
	return path
}

// key reads a dotted key and returns it joined with ".".
func (s *scanner) key() string { return strings.Join(s.keySegments(), ".") }

func (s *scanner) keySegments() []string {
	var segs []string
	for !s.eof() {
		s.blank()
		var seg string
		switch c := s.peek(); {
		case c == '"' || c == '\'':
			seg = s.quoted(c)
		case isBare(c):
			st := s.i
			for !s.eof() && isBare(s.peek()) {
				s.next()
			}
			seg = s.src[st:s.i]
		default:
			return segs
		}
		segs = append(segs, seg)
		s.blank()
		if s.peek() != '.' {
			return segs
		}
		s.next()
	}
	return segs
}

func isBare(c byte) bool {
	return c >= 'a' && c <= 'z' || c >= 'A' && c <= 'Z' || c >= '0' && c <= '9' || c == '_' || c == '-'
}

// quoted reads a one-line quoted key or string and returns its contents
// (escapes are kept as written but for \" and \\).
func (s *scanner) quoted(q byte) string {
	s.next()
	var b strings.Builder
	for !s.eof() && s.peek() != q && s.peek() != '\n' {
		c := s.peek()
		if c == '\\' && q == '"' {
			s.next()
			c = s.peek()
		}
		b.WriteByte(c)
		s.next()
	}
	s.next()
	return b.String()
}

// value skips one value, noting the lines of array elements and of the
// keys of inline tables under the current path (s.path), which starts on
// line at. An element on the line its array starts on is not noted (its
// line is found through its parent's), so that a long table of numbers
// costs little.
func (s *scanner) value(depth, at int) {
	switch c := s.peek(); c {
	case '"', '\'':
		if strings.HasPrefix(s.src[s.i:], string([]byte{c, c, c})) {
			s.i += 3
			s.multiline(c)
			return
		}
		s.quoted(c)
	case '[':
		s.next()
		n := 0
		for !s.eof() {
			s.space()
			if s.peek() == ']' {
				s.next()
				return
			}
			if s.peek() == ',' {
				s.next()
				continue
			}
			n++
			start := s.i
			c := s.peek()
			if s.line == at && c != '[' && c != '{' {
				s.value(depth+1, at) // a scalar or a string: nothing to note
			} else {
				mark := s.enterElement(n)
				if s.line != at {
					s.notePath(s.line)
				}
				if depth < maxNesting {
					s.value(depth+1, s.line)
				} else {
					s.scalar()
				}
				s.path = s.path[:mark]
			}
			if s.i == start {
				s.next()
			}
		}
	case '{':
		s.next()
		for !s.eof() {
			s.blank()
			switch s.peek() {
			case '}':
				s.next()
				return
			case ',':
				s.next()
				continue
			case '\n':
				s.next()
				continue
			}
			line := s.line
			start := s.i
			k := s.key()
			s.blank()
			if s.peek() == '=' {
				s.next()
				s.blank()
				mark := s.enterKey(k)
				s.notePath(line)
				if depth < maxNesting {
					s.value(depth+1, line)
				} else {
					s.scalar()
				}
				s.path = s.path[:mark]
			}
			if s.i == start {
				s.next()
			}
		}
	default:
		s.scalar()
	}
}

// multiline skips the rest of a multi-line string opened by three q.
func (s *scanner) multiline(q byte) {
	end := string([]byte{q, q, q})
	for !s.eof() {
		if s.peek() == '\\' && q == '"' {
			s.next()
			s.next()
			continue
		}
		if strings.HasPrefix(s.src[s.i:], end) {
			s.i += 3
			// Up to two more quotes may belong to the string.
			for k := 0; k < 2 && s.peek() == q; k++ {
				s.next()
			}
			return
		}
		s.next()
	}
}

// scalar skips a number, boolean or date.
func (s *scanner) scalar() {
	for !s.eof() {
		switch s.peek() {
		case ',', ']', '}', '\n', '#':
			return
		}
		s.next()
	}
}

func joinPath(a, b string) string {
	if a == "" {
		return b
	}
	if b == "" {
		return a
	}
	return a + "." + b
}

func itoa(n int) string { return strconv.Itoa(n) }

// elemPath returns the key path of element i (1-based) of the array at p,
// as "hull.section[2].offsets[4]".
func elemPath(p string, i int) string { return p + "[" + itoa(i) + "]" }
