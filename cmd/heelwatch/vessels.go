package main

import (
	"encoding/json"
	"flag"
	"fmt"
	"io"
	"text/tabwriter"

	"heelwatch/vessels"
)

const vesselsHelp = `heelwatch vessels: the vessels built into heelwatch.

Usage:
  heelwatch vessels [--format text|json]   list them
  heelwatch vessels NAME                   print one's vessel file, to start your own

Every bundled vessel is a demonstration of our own invention, not a real ship.
`

func runVessels(args []string, stdout, stderr io.Writer) int {
	fs := flag.NewFlagSet("heelwatch vessels", flag.ContinueOnError)
	fs.SetOutput(stderr)
	fs.Usage = func() {}
	format := fs.String("format", "text", "")
	pos, err := parseInterleaved(fs, args)
	if err != nil {
		return usageError(err, stdout, stderr, "vessels", func(w io.Writer) { io.WriteString(w, vesselsHelp) })
	}
	list := vessels.Bundled()
	switch {
	case len(pos) > 1:
		fmt.Fprintln(stderr, "heelwatch vessels: name one vessel at most")
		return exitUsage
	case len(pos) == 1:
		src, ok := vessels.Source(pos[0])
		if !ok {
			fmt.Fprintf(stderr, "heelwatch vessels: no bundled vessel %q; the bundled ones are:", pos[0])
			for _, e := range list {
				fmt.Fprintf(stderr, " %s", e.Name)
			}
			fmt.Fprintln(stderr)
			return exitUsage
		}
		stdout.Write(src)
		return exitOK
	}
	switch *format {
	case "json":
		type entry struct {
			Name    string `json:"name"`
			Title   string `json:"title"`
			Summary string `json:"summary"`
			Default bool   `json:"default"`
		}
		out := []entry{}
		for _, e := range list {
			out = append(out, entry{e.Name, e.Title, e.Summary, e.Name == vessels.Default})
		}
		enc := json.NewEncoder(stdout)
		enc.SetIndent("", "  ")
		enc.SetEscapeHTML(false)
		if err := enc.Encode(out); err != nil {
			return exitFailed
		}
	case "text":
		tw := tabwriter.NewWriter(stdout, 0, 0, 2, ' ', 0)
		fmt.Fprintln(tw, "name\tvessel\tabout")
		for _, e := range list {
			name := e.Name
			if name == vessels.Default {
				name += " (default)"
			}
			fmt.Fprintf(tw, "%s\t%s\t%s\n", name, dash(e.Title), dash(e.Summary))
		}
		tw.Flush()
		fmt.Fprintln(stdout, "\nOpen one with --vessel NAME; 'heelwatch vessels NAME' prints its file.")
	default:
		fmt.Fprintf(stderr, "heelwatch vessels: --format %q: use text or json\n", *format)
		return exitUsage
	}
	return exitOK
}
