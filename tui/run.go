package tui

import (
	"fmt"
	"io"
	"os"
	"path/filepath"

	tea "github.com/charmbracelet/bubbletea"

	"heelwatch/engine"
	"heelwatch/report"
	"heelwatch/vessels"
)

// Options are the dashboard's settings from the command line.
type Options struct {
	// LogFile, when set, receives every change with its time and the
	// resulting heel and drafts, appended and synced as it happens.
	LogFile string
	// Palette is "day", "night" or "mono"; NO_COLOR in the environment
	// forces "mono". Empty means day.
	Palette string
	// VesselName is shown in the header; empty means the vessel's own name.
	VesselName string
	// VesselFile is where the vessel came from, for the report: a path, or
	// "bundled:NAME".
	VesselFile string
	// ReportDir is where the report key writes its Markdown file; empty
	// means the working directory.
	ReportDir string
	// Version is heelwatch's version, printed in the report.
	Version string
	// Start is the damage state the dashboard opens with (--open and
	// --perm on the command line), undone with the undo key; nil: intact.
	Start engine.Damage
	// Base is the ship as her vessel file gives her, when the vessel shown
	// is loaded with Condition over it; nil: the vessel shown is both.
	Base      *engine.Vessel
	Condition *vessels.Condition
	// Resume is a saved state to take up at start (--resume): its
	// readings (its condition and connections are on the vessel, its
	// damage is Start).
	Resume *vessels.State
}

// Run shows the dashboard for v until the officer quits. info, which may be
// nil, gives the compartments' groups, pumps and holes.
func Run(v *engine.Vessel, info *vessels.Info, opts Options) error {
	if v == nil {
		return fmt.Errorf("tui: no vessel to show")
	}
	opts.Palette = startPalette(opts.Palette, os.Getenv)
	m := newModel(v, info, opts)
	if opts.LogFile != "" {
		lg, err := openEventLog(opts.LogFile)
		if err != nil {
			return fmt.Errorf("event log: %w", err)
		}
		m.file = lg
		defer lg.close()
	}
	_, err := tea.NewProgram(m, tea.WithAltScreen()).Run()
	if m.file != nil {
		if cerr := m.file.close(); err == nil && cerr != nil {
			err = fmt.Errorf("event log: %w", cerr)
		}
	}
	return err
}

// startPalette is the palette the dashboard opens with: the one asked for,
// but monochrome whenever NO_COLOR is set to anything (no-color.org).
func startPalette(asked string, getenv func(string) string) string {
	if getenv("NO_COLOR") != "" {
		return "mono"
	}
	for _, n := range paletteNames {
		if n == asked {
			return n
		}
	}
	return "day"
}

// writeReport returns the Cmd that writes the Markdown report of the
// figures shown to a new file in ReportDir.
func (m model) writeReport() tea.Cmd {
	if m.cur == nil {
		return nil
	}
	made := m.now()
	r := report.New(m.v, m.opts.VesselFile, *m.cur, made, m.opts.Version)
	r.Condition = m.condition
	r.Remedies = m.rem.forReport(m.cur)
	if m.opts.VesselName != "" {
		r.VesselName = m.opts.VesselName
	}
	dir := m.opts.ReportDir
	return func() tea.Msg {
		base := "heelwatch-report-" + made.Format("20060102-150405")
		path, err := writeNewFile(dir, base, func(w io.Writer) error { return report.Markdown(w, r) })
		if path == "" {
			path = filepath.Join(dir, base+".md")
		}
		return reportMsg{path, saveError(path, err)}
	}
}
