// Command heelwatch tells a ship's officer how the ship will lie when
// compartments flood: drafts, heel, trim, GM, freeboard and the margin to
// each opening, computed from the hull geometry, beside the hand method.
//
//	heelwatch                       the dashboard on the bundled ship
//	heelwatch solve --open A,B      the floating position with A and B open to the sea
//	heelwatch check FILE            validate a vessel file and summarise it
//	heelwatch vessels               the bundled vessels
//	heelwatch flood …               flooding through a hole over time
//	heelwatch diagnose --readings R what is flooding, from the crew's readings
//
// Run any command with --help for its flags. Exit status: 0 done, 1 bad
// input (a vessel file that cannot be used), 2 bad usage, 3 no equilibrium
// (the vessel sinks or capsizes).
package main

import (
	"errors"
	"flag"
	"fmt"
	"io"
	"os"
	"strings"
	"time"

	"heelwatch/engine"
	"heelwatch/vessels"
)

// version is heelwatch's version, set at release by the linker
// (-X main.version=…).
var version = "dev"

// now is the clock that dates reports; tests replace it.
var now = time.Now

// Exit statuses, as fixed by heelwatch's conventions.
const (
	exitOK     = 0
	exitInput  = 1 // the vessel file cannot be used
	exitUsage  = 2 // the command line is wrong
	exitNoEq   = 3 // no floating position: she sinks or capsizes
	exitFailed = 1 // anything else that stops the command (a write that fails)
)

func main() {
	os.Exit(guarded(os.Args[1:], os.Stdout, os.Stderr))
}

const mainHelp = `heelwatch: how the ship will lie when compartments flood.

Usage:
  heelwatch [flags]                  open the dashboard
  heelwatch solve [flags]            the floating position with compartments open
  heelwatch check [FILE|NAME ...]    validate vessel files and summarise them
  heelwatch vessels [NAME]           list the bundled vessels, or print one's file
  heelwatch flood [flags]            flooding through a hole over time
  heelwatch diagnose --readings FILE what is flooding, from the crew's readings
  heelwatch drill SCENARIO           a damage-control exercise (--run: headless)
  heelwatch tables                   the hydrostatic and tank tables from the hull
  heelwatch verify --hydrostatics H  the model against the booklet's tables
  heelwatch help [COMMAND]           help on a command

Flags:
  --vessel FILE|NAME   the vessel: a TOML vessel file, or a bundled vessel's
                       name (default %q; see 'heelwatch vessels')
  --condition FILE     a condition file (weights; tanks by fill, m³, tonnes or
                       sounding) in place of the vessel file's loading condition,
                       for the dashboard and every command that reads a ship
  --resume FILE        dashboard: take up a state saved with its S key (condition,
                       damage, doors, readings); --vessel defaults to the state's
  --log FILE           dashboard: append every change (time, heel, drafts) to
                       FILE as it happens, synced, so nothing is lost
  --palette NAME       dashboard: day (default), night (dim red, keeps night
                       vision) or mono; NO_COLOR in the environment means mono
  --reports DIR        dashboard: where its report key writes Markdown reports
                       (default: the working directory)
  --open A,B           dashboard: start with these compartments open to the sea
                       (names ignore case; the undo key brings her back intact)
  --perm NAME=μ,...    dashboard: their permeability, as solve's --perm
  --version            print heelwatch's version
  --help               this help

Exit status: 0 done; 1 bad input (the vessel file); 2 bad usage;
3 no equilibrium (she sinks or capsizes); 4 verify: values beyond tolerance.

heelwatch is decision support only: the ship's approved stability
information, the master, class and flag state govern.
`

// run is the whole program: it parses args, writes to stdout and stderr
// and returns the exit status.
func run(args []string, stdout, stderr io.Writer) int {
	fs := flag.NewFlagSet("heelwatch", flag.ContinueOnError)
	fs.SetOutput(stderr)
	fs.Usage = func() {}
	vessel := fs.String("vessel", "", "")
	showVersion := fs.Bool("version", false, "")
	var dash dashboardOptions
	fs.StringVar(&dash.logFile, "log", "", "")
	fs.StringVar(&dash.palette, "palette", "day", "")
	fs.StringVar(&dash.reportDir, "reports", "", "")
	fs.StringVar(&dash.condition, "condition", "", "")
	fs.StringVar(&dash.resume, "resume", "", "")
	fs.Var(&dash.open, "open", "")
	fs.Var(&dash.perm, "perm", "")
	if err := fs.Parse(args); err != nil {
		return usageError(err, stdout, stderr, "", func(w io.Writer) { fmt.Fprintf(w, mainHelp, vessels.Default) })
	}
	if *showVersion {
		fmt.Fprintln(stdout, "heelwatch", version)
		return exitOK
	}
	rest := fs.Args()
	if len(rest) == 0 {
		return runDashboard(*vessel, dash, stdout, stderr)
	}
	if len(dash.open)+len(dash.perm) > 0 {
		fmt.Fprintf(stderr, "heelwatch: --open and --perm before %q are the dashboard's: give them after the command\n", rest[0])
		return exitUsage
	}
	cmd, rest := rest[0], rest[1:]
	withCondition := func(a []string) []string {
		if dash.condition == "" {
			return a
		}
		return append([]string{"--condition", dash.condition}, a...)
	}
	withVessel := func(a []string) []string {
		if *vessel == "" {
			return withCondition(a)
		}
		return append([]string{"--vessel", *vessel}, withCondition(a)...)
	}
	switch cmd {
	case "solve":
		return runSolve(withVessel(rest), stdout, stderr)
	case "check":
		return runCheck(withVessel(rest), stdout, stderr)
	case "vessels":
		return runVessels(rest, stdout, stderr)
	case "flood":
		return runFlood(withVessel(rest), stdout, stderr)
	case "diagnose":
		return runDiagnose(withVessel(rest), stdout, stderr)
	case "drill":
		return runDrill(rest, stdout, stderr)
	case "tables":
		return runTables(withVessel(rest), stdout, stderr)
	case "verify":
		return runVerify(withVessel(rest), stdout, stderr)
	case "help":
		if len(rest) == 0 {
			fmt.Fprintf(stdout, mainHelp, vessels.Default)
			return exitOK
		}
		if len(rest) == 1 && rest[0] != "help" {
			return run([]string{rest[0], "--help"}, stdout, stderr)
		}
		fmt.Fprintf(stderr, "heelwatch help: name one command: solve, check, vessels, flood, diagnose or drill\n")
		return exitUsage
	}
	fmt.Fprintf(stderr, "heelwatch: no command %q; the commands are solve, check, vessels, flood, diagnose, drill and help\n", cmd)
	return exitUsage
}

// usageError handles an error from a FlagSet's Parse: --help prints the
// help on stdout (status 0); anything else, already described on stderr by
// the flag package, gets a pointer to the help (status 2).
func usageError(err error, stdout, stderr io.Writer, cmd string, help func(io.Writer)) int {
	if errors.Is(err, flag.ErrHelp) {
		help(stdout)
		return exitOK
	}
	name := "heelwatch"
	if cmd != "" {
		name += " " + cmd
	}
	fmt.Fprintf(stderr, "run '%s --help' for the flags\n", name)
	return exitUsage
}

// parseInterleaved parses args with fs, allowing flags after positional
// arguments ("check a.toml --vessel b"): the flag package stops at the
// first non-flag, so parsing resumes after each one. Everything after "--"
// is positional.
func parseInterleaved(fs *flag.FlagSet, args []string) ([]string, error) {
	var pos []string
	for {
		if err := fs.Parse(args); err != nil {
			return nil, err
		}
		rest := fs.Args()
		if used := len(args) - len(rest); used > 0 && args[used-1] == "--" {
			return append(pos, rest...), nil
		}
		if len(rest) == 0 {
			return pos, nil
		}
		pos = append(pos, rest[0])
		args = rest[1:]
	}
}

// listFlag is a flag that may be given more than once, each time with a
// comma-separated list; blank items are dropped.
type listFlag []string

func (l *listFlag) String() string { return strings.Join(*l, ",") }

func (l *listFlag) Set(s string) error {
	for _, item := range strings.Split(s, ",") {
		if item = strings.TrimSpace(item); item != "" {
			*l = append(*l, item)
		}
	}
	return nil
}

// openVessel opens a bundled vessel or a file. On failure it prints every
// problem to stderr and returns the exit status to end with.
func openVessel(nameOrPath string, stderr io.Writer) (*engine.Vessel, *vessels.Info, int) {
	if nameOrPath == "" {
		nameOrPath = vessels.Default
	}
	v, info, err := vessels.Open(nameOrPath)
	if err != nil {
		return nil, nil, refuse(stderr, "heelwatch", nameOrPath, "nothing was computed", err, "")
	}
	if info == nil {
		info = &vessels.Info{File: nameOrPath}
	}
	for _, w := range info.Warnings {
		fmt.Fprintln(stderr, "warning:", w.String())
	}
	return v, info, exitOK
}

// source names where a vessel came from, for reports.
func source(info *vessels.Info) string {
	if info.Bundled != "" {
		return "bundled:" + info.Bundled
	}
	return info.File
}

func plural(n int, word string) string {
	if n == 1 {
		return "1 " + word
	}
	return fmt.Sprintf("%d %ss", n, word)
}
