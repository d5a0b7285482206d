// Package driver runs the roundoff suite from the command line: as a vet
// or fix tool under the go command (the .cfg protocol of unitchecker), as
// a standalone linter of package patterns with its own output formats,
// scope controls and fix application, and as the subcommands config and
// hook.
package driver

import (
	"fmt"
	"io"
	"os"
	"strings"

	"golang.org/x/tools/go/analysis"

	"roundoff/cmd/roundoff/internal/limits"
	"roundoff/cmd/roundoff/internal/noise"
)

// Exit statuses of the standalone driver.
const (
	exitClean    = 0 // nothing to report
	exitErrors   = 1 // bad input, packages that do not load, failures
	exitFindings = 3 // findings reported
)

// Main runs roundoff with the given suite and command-line arguments
// (os.Args[1:]: in vet mode unitchecker reads os.Args itself) and returns
// the exit status.
func Main(analyzers []*analysis.Analyzer, args []string) int {
	if vetMode(args) {
		return vet(analyzers, args)
	}
	cwd, err := os.Getwd()
	if err != nil {
		fmt.Fprintln(os.Stderr, "roundoff:", err)
		return exitErrors
	}
	e := &env{analyzers: analyzers, stdout: os.Stdout, stderr: os.Stderr, cwd: cwd}
	if len(args) > 0 {
		switch args[0] {
		case "config":
			return e.configCmd(args[1:])
		case "hook":
			return e.hookCmd(args[1:])
		case "limits":
			return limits.Run(args[1:], e.stdout, e.stderr)
		case "noise":
			return noise.Run(args[1:], e.cwd, e.stdout, e.stderr)
		case "help":
			return e.help(args[1:])
		}
	}
	return e.lintCmd(args)
}

// env is what a command runs in.
type env struct {
	analyzers      []*analysis.Analyzer
	stdout, stderr io.Writer
	cwd            string
}

// errorf prints a one-line error and returns the error status.
func (e *env) errorf(format string, args ...any) int {
	fmt.Fprintf(e.stderr, "roundoff: "+format+"\n", args...)
	return exitErrors
}

const usage = `roundoff finds floating-point hazards in Go numerical code.

Usage:
  roundoff [flags] packages...     lint packages (patterns as for go build)
  roundoff config [-config file]   print the effective configuration
  roundoff hook install [-force]   install the git pre-commit hook
  roundoff hook uninstall          remove it (restoring a saved hook)
  roundoff hook run                lint the staged lines (what the hook runs)
  roundoff limits [flags] X...     float spacing, attainable tolerances and steps at X
  roundoff noise [flags] PKG.FUNC  measure a function's noise level, its steps and tolerances
  roundoff help [topic]            this text, or the help of an analyzer or
                                   of limits, config, hook or noise

Every subcommand prints its usage with -h.

Under the go command: go vet -vettool=$(command -v roundoff) ./...
                      go fix -fixtool=$(command -v roundoff) ./...

Flags:
`

// help prints the usage, or the documentation of the named analyzers.
func (e *env) help(args []string) int {
	if len(args) == 0 {
		fmt.Fprint(e.stdout, usage)
		e.flagSet(&options{}).PrintDefaults()
		fmt.Fprintf(e.stdout, "\nAnalyzers (turn one off with -NAME=false, run only some with -NAME):\n")
		for _, a := range e.analyzers {
			title, _, _ := strings.Cut(a.Doc, "\n")
			fmt.Fprintf(e.stdout, "  %-14s %s\n", a.Name, title)
		}
		return exitClean
	}
	for _, name := range args {
		switch a := e.analyzer(name); {
		case name == "limits":
			limits.Run([]string{"-h"}, e.stdout, e.stderr)
		case name == "config":
			e.configCmd([]string{"-h"})
		case name == "hook":
			e.hookCmd([]string{"-h"})
		case a != nil:
			fmt.Fprintf(e.stdout, "%s: %s\n", a.Name, a.Doc)
		default:
			return e.errorf("help: no analyzer or subcommand %q (analyzers: %s; subcommands: limits, config, hook)", name, strings.Join(names(e.analyzers), ", "))
		}
	}
	return exitClean
}

// isHelp reports whether arg asks for help, as the flag package's -h does.
func isHelp(arg string) bool {
	return arg == "-h" || arg == "-help" || arg == "--help" || arg == "--h"
}

func (e *env) analyzer(name string) *analysis.Analyzer {
	for _, a := range e.analyzers {
		if a.Name == name {
			return a
		}
	}
	return nil
}
