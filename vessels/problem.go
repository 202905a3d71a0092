package vessels

import (
	"fmt"
	"sort"
	"strings"
)

// Problem is one thing wrong with a vessel file: where it is and what is
// allowed instead.
type Problem struct {
	File string // the file name as given to Parse
	Line int    // 1-based line of the offending key (or of its table); 0 if unknown
	Key  string // the key's path, e.g. "compartment[3].permeability" (entries count from 1)
	Msg  string // what is wrong and what is allowed
}

// String formats the problem as "file:line: key: message".
func (p Problem) String() string {
	var b strings.Builder
	b.WriteString(p.File)
	if p.Line > 0 {
		fmt.Fprintf(&b, ":%d", p.Line)
	}
	b.WriteString(": ")
	if p.Key != "" {
		b.WriteString(p.Key)
		b.WriteString(": ")
	}
	b.WriteString(p.Msg)
	return b.String()
}

// Problems is every problem found in one vessel file, in line order. It is
// the error Parse, Load and Open return for a file that cannot be used.
type Problems []Problem

// Error returns one problem per line.
func (ps Problems) Error() string {
	lines := make([]string, len(ps))
	for i, p := range ps {
		lines[i] = p.String()
	}
	return strings.Join(lines, "\n")
}

// sorted returns the problems ordered by line, keeping the order found
// within a line.
func (ps Problems) sorted() Problems {
	out := append(Problems(nil), ps...)
	sort.SliceStable(out, func(i, j int) bool { return out[i].Line < out[j].Line })
	return out
}
