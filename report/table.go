package report

import (
	"strings"
	"unicode/utf8"
)

// table lays out rows of cells in columns, each column aligned left or
// right, for the plain-text report. Widths count runes: every character
// heelwatch prints (°, μ, ³, —) is one column wide in a terminal.
type table struct {
	right []bool // per column: align right
	rows  [][]string
}

func (t *table) add(cells ...string) { t.rows = append(t.rows, cells) }

// lines returns the table's lines, each starting with indent and with two
// spaces between columns; trailing spaces are trimmed.
func (t *table) lines(indent string) []string {
	var width []int
	for _, r := range t.rows {
		for i, c := range r {
			if i >= len(width) {
				width = append(width, 0)
			}
			width[i] = max(width[i], utf8.RuneCountInString(c))
		}
	}
	var out []string
	for _, r := range t.rows {
		var b strings.Builder
		b.WriteString(indent)
		for i, c := range r {
			if i > 0 {
				b.WriteString("  ")
			}
			pad := strings.Repeat(" ", width[i]-utf8.RuneCountInString(c))
			if i < len(t.right) && t.right[i] {
				b.WriteString(pad + c)
			} else {
				b.WriteString(c + pad)
			}
		}
		out = append(out, strings.TrimRight(b.String(), " "))
	}
	return out
}
