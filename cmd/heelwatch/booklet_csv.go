package main

import (
	"bytes"
	"encoding/csv"
	"errors"
	"fmt"
	"io"
	"math"
	"os"
	"strconv"
	"strings"

	"heelwatch/vessels"
)

// bookletCSV is one of the booklet's tables typed into CSV for verify: a
// header row of column names, then one row per draft or tank.
//
// Separators: commas, with decimal points; or, as a spreadsheet set to a
// European locale saves it, semicolons with decimal commas (a header that
// holds a semicolon says which). A byte-order mark and blank lines are
// skipped. Every cell after the first must be a number: an empty cell is
// refused with its column and row, for a figure left out by mistake must
// not pass unseen (leave a quantity's whole column out instead).
type bookletCSV struct {
	file   string
	comma  rune
	header []string
	rows   [][]string
	lines  []int
}

// maxBookletBytes bounds a booklet table read, as vessel files are bounded:
// a hydrostatic table is a few kilobytes.
const maxBookletBytes = vessels.MaxFileBytes

// readBookletCSV reads the booklet table at path (see bookletCSV). A row
// whose fields do not match the header's is refused with its line; all
// such problems are returned at once. The cells are read later (number).
func readBookletCSV(path string) (*bookletCSV, error) {
	data, err := readBookletFile(path)
	if err != nil {
		return nil, err
	}
	data = bytes.TrimPrefix(data, []byte("\ufeff"))
	t := &bookletCSV{file: path, comma: ','}
	firstLine := string(data)
	for _, l := range strings.Split(firstLine, "\n") {
		if strings.TrimSpace(l) != "" {
			firstLine = l
			break
		}
	}
	if strings.ContainsRune(firstLine, ';') {
		t.comma = ';'
	}
	r := csv.NewReader(bytes.NewReader(data))
	r.Comma = t.comma
	r.FieldsPerRecord = -1
	r.TrimLeadingSpace = true
	var problems []error
	for {
		rec, err := r.Read()
		if err == io.EOF {
			break
		}
		if err != nil {
			problems = append(problems, fmt.Errorf("%s: %v", path, err))
			break
		}
		line, _ := r.FieldPos(0)
		if t.header == nil {
			for _, h := range rec {
				t.header = append(t.header, strings.TrimSpace(h))
			}
			continue
		}
		if len(rec) == 1 && strings.TrimSpace(rec[0]) == "" {
			continue
		}
		if len(rec) != len(t.header) {
			problems = append(problems, fmt.Errorf("%s:%d: %d fields, the header has %d%s", path, line, len(rec), len(t.header), t.fieldsHint(len(rec))))
			continue
		}
		t.rows = append(t.rows, rec)
		t.lines = append(t.lines, line)
	}
	if len(problems) > 0 {
		return nil, errors.Join(problems...)
	}
	if t.header == nil {
		return nil, fmt.Errorf("%s: empty: give a header row and one row per value", path)
	}
	return t, nil
}

// fieldsHint guesses why a row has n fields where the header has another
// number.
func (t *bookletCSV) fieldsHint(n int) string {
	switch {
	case len(t.header) == 1 && strings.ContainsAny(t.header[0], "\t "):
		return fmt.Sprintf(" (the header %q is one column: separate the columns by commas, or by semicolons with decimal commas)", t.header[0])
	case t.comma == ',' && n > len(t.header):
		return " (a decimal comma splits a number in two where commas separate the columns: write decimal points, or separate the columns by semicolons, and then decimal commas are read)"
	}
	return " (columns: " + strings.Join(t.header, ", ") + ")"
}

// readBookletFile reads a regular file of at most maxBookletBytes, so that
// a device or a FIFO named by mistake cannot hang verify.
func readBookletFile(path string) ([]byte, error) {
	st, err := os.Stat(path)
	if err != nil {
		return nil, err
	}
	if !st.Mode().IsRegular() {
		return nil, fmt.Errorf("%s: not a regular file: give the booklet's table as a CSV file", path)
	}
	f, err := os.Open(path)
	if err != nil {
		return nil, err
	}
	defer f.Close()
	data, err := io.ReadAll(io.LimitReader(f, maxBookletBytes+1))
	if err != nil {
		return nil, fmt.Errorf("%s: %v", path, err)
	}
	if len(data) > maxBookletBytes {
		return nil, fmt.Errorf("%s: larger than %d MiB: a booklet's table is a few kilobytes", path, maxBookletBytes>>20)
	}
	return data, nil
}

// columns checks the header: first must come first, each other column be
// one of known, and none given twice. A refusal lists the columns read.
func (t *bookletCSV) columns(first string, known []string) error {
	list := strings.Join(known, ", ")
	if len(t.header) == 0 || t.header[0] != first {
		got := ""
		if len(t.header) > 0 {
			got = fmt.Sprintf(", not %q", t.header[0])
		}
		return fmt.Errorf("%s:1: the first column must be %s%s; the columns read are %s", t.file, first, got, list)
	}
	var problems []error
	at := map[string]int{}
	for j, h := range t.header {
		if k, ok := at[h]; ok {
			problems = append(problems, fmt.Errorf("%s:1: column %q is given twice (columns %d and %d)", t.file, h, k+1, j+1))
			continue
		}
		at[h] = j
		if j == 0 || contains(known, h) {
			continue
		}
		msg := fmt.Sprintf("%s:1: column %q (column %d) is not one verify reads", t.file, h, j+1)
		if c := vessels.Closest(h, known[1:]); c != "" {
			msg += fmt.Sprintf(": did you mean %q?", c)
		}
		problems = append(problems, errors.New(msg+"; the columns read are "+list))
	}
	return errors.Join(problems...)
}

// contains reports whether s is one of list.
func contains(list []string, s string) bool {
	for _, x := range list {
		if x == s {
			return true
		}
	}
	return false
}

// number reads row i's cell in column j as a number; row names the row for
// a refusal ("the row of draft 2.5 m"). With semicolons for separators a
// decimal comma is read as a decimal point.
func (t *bookletCSV) number(i, j int, row string) (float64, error) {
	cell := strings.TrimSpace(t.rows[i][j])
	where := fmt.Sprintf("%s:%d: %s (column %d, %s)", t.file, t.lines[i], t.header[j], j+1, row)
	if cell == "" {
		return 0, fmt.Errorf("%s: the cell is empty: give the booklet's figure, or leave the column out of the file", where)
	}
	s := strings.Replace(cell, "\u2212", "-", 1) // a typeset minus sign
	if t.comma == ';' && strings.Contains(s, ",") {
		if strings.Contains(s, ".") {
			return 0, fmt.Errorf("%s: %q: write the number without a thousands separator", where, cell)
		}
		s = strings.Replace(s, ",", ".", 1)
	}
	x, err := strconv.ParseFloat(s, 64)
	if err != nil || math.IsNaN(x) || math.IsInf(x, 0) {
		hint := ""
		if t.comma == ',' && strings.Contains(cell, ";") {
			hint = ": the header has no semicolon, so commas separate the columns"
		}
		return 0, fmt.Errorf("%s: %q is not a number%s", where, cell, hint)
	}
	return x, nil
}
