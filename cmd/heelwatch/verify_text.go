package main

import (
	"fmt"
	"io"
	"strings"
	"text/tabwriter"
)

// verifySummary counts the values verify checked and keeps the failures.
type verifySummary struct {
	passed int
	failed []verifyRow
}

func (s verifySummary) pass() bool { return len(s.failed) == 0 }

func summariseVerify(rows []verifyRow) verifySummary {
	var s verifySummary
	for _, r := range rows {
		if r.Pass {
			s.passed++
		} else {
			s.failed = append(s.failed, r)
		}
	}
	return s
}

// keyText is a row's key as the text shows it: a draft in metres or a
// tank's name.
func (r verifyRow) keyText() string {
	if T, ok := r.Key.(float64); ok {
		return fmt.Sprintf("%.3f m", T)
	}
	return fmt.Sprint(r.Key)
}

// writeVerifyText writes verify's comparison as text: one line per value,
// then the count and, when some fail, the failing values again together,
// so that the officer need not hunt for them among the lines.
func writeVerifyText(w io.Writer, title string, rows []verifyRow, sum verifySummary) error {
	var out strings.Builder
	tw := tabwriter.NewWriter(&out, 0, 0, 2, ' ', 0)
	fmt.Fprintln(tw, title)
	fmt.Fprintln(tw, "deviation = booklet − model; tolerance as MSC.1/Circ.1229 (references.md)")
	fmt.Fprintln(tw, "table\tkey\tquantity\tunit\tbooklet\tmodel\tdeviation\ttolerance\tbasis\t")
	for _, r := range rows {
		mark := ""
		if !r.Pass {
			mark = "FAIL"
		}
		fmt.Fprintf(tw, "%s\t%s\t%s\t%s\t%s\t%s\t%s\t±%.4f\t%s\t%s\n",
			r.Table, r.keyText(), r.Quantity, r.Unit, fixed4(r.Booklet, ""), fixed4(*r.Model, ""), fixed4(*r.Deviation, "+"), r.Tolerance, r.Basis, mark)
	}
	tw.Flush()
	var b strings.Builder
	for _, l := range strings.SplitAfter(out.String(), "\n") {
		b.WriteString(strings.TrimRight(l, " \n"))
		if strings.HasSuffix(l, "\n") {
			b.WriteString("\n")
		}
	}
	n := len(rows)
	if sum.pass() {
		fmt.Fprintf(&b, "\n%d values checked: all within tolerance.\n", n)
	} else {
		fmt.Fprintf(&b, "\n%d values checked: %d within tolerance, %d beyond:\n", n, sum.passed, len(sum.failed))
		tw = tabwriter.NewWriter(&b, 0, 0, 2, ' ', 0)
		for _, r := range sum.failed {
			fmt.Fprintf(tw, "  %s\t%s\t%s\tbooklet %s %s\tmodel %s\tdeviation %s\tbeyond ±%.4f (%s)\n",
				r.Table, r.keyText(), r.Quantity, fixed4(r.Booklet, ""), r.Unit, fixed4(*r.Model, ""), fixed4(*r.Deviation, "+"), r.Tolerance, r.Basis)
		}
		tw.Flush()
		b.WriteString("The model does not agree with the booklet at these values: mend the offsets or\ncompartments there before trusting it.\n")
	}
	_, err := io.WriteString(w, b.String())
	return err
}

// fixed4 prints x to 4 decimals, with sign "+" for a signed figure; a
// value that rounds to zero prints as 0.0000, never -0.0000.
func fixed4(x float64, sign string) string {
	s := fmt.Sprintf("%"+sign+".4f", x)
	if strings.Trim(s, "+-0.") == "" {
		return sign + "0.0000"
	}
	return s
}
