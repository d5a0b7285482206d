package driver

import (
	"errors"
	"flag"
	"fmt"
	"io"
	"slices"
	"strconv"
	"strings"
)

// options are the settings of one standalone run.
type options struct {
	format        string // text, json, sarif or github
	json          bool   // -json, an alias of -format json
	fix, diff     bool
	tests         bool
	since         string // a git revision
	baseline      string // a baseline file to hide findings by
	writeBaseline string // a baseline file to write
	staleReviews  bool
	configFile    string
	enable        map[string]*triState // the -NAME flags
	build         map[string]*string   // the build flags passed to the go command
	patterns      []string

	changed *changedLines // set by the pre-commit hook instead of since
	staged  *indexView    // set by the pre-commit hook: lint the index
}

// buildFlags are the flags of go build that standalone runs pass on to
// the go command, which loads the packages.
var buildFlags = []struct{ name, usage string }{
	{"tags", "build `tags` (comma-separated), as for go build"},
	{"mod", "module download `mode` (readonly, vendor or mod), as for go build"},
	{"modfile", "read and write `file` instead of go.mod, as for go build"},
	{"overlay", "read the JSON overlay `file`, as for go build"},
}

// buildFlags returns the build flags set, in go command syntax.
func (o *options) buildFlags() []string {
	var out []string
	for _, b := range buildFlags {
		if v := o.build[b.name]; v != nil && *v != "" {
			out = append(out, "-"+b.name+"="+*v)
		}
	}
	return out
}

// Output formats.
var formats = []string{"text", "json", "sarif", "github"}

// triState is an analyzer's -NAME flag: unset, true or false.
type triState int

const (
	unset triState = iota
	setTrue
	setFalse
)

func (t *triState) IsBoolFlag() bool { return true }

func (t *triState) String() string {
	if t == nil || *t == unset {
		return ""
	}
	return strconv.FormatBool(*t == setTrue)
}

func (t *triState) Set(s string) error {
	b, err := strconv.ParseBool(s)
	if err != nil {
		return errors.New("want true or false")
	}
	*t = setFalse
	if b {
		*t = setTrue
	}
	return nil
}

// flagSet returns the standalone flags, bound to o.
func (e *env) flagSet(o *options) *flag.FlagSet {
	fs := flag.NewFlagSet("roundoff", flag.ContinueOnError)
	fs.SetOutput(e.stdout)
	fs.StringVar(&o.format, "format", "text", "output format: "+strings.Join(formats, ", "))
	fs.BoolVar(&o.json, "json", false, "same as -format json")
	fs.BoolVar(&o.fix, "fix", false, "apply the first fix of every finding shown")
	fs.BoolVar(&o.diff, "diff", false, "print the fixes as unified diffs instead of applying them")
	fs.BoolVar(&o.tests, "test", true, "lint test files too")
	fs.StringVar(&o.since, "since", "", "report only findings on lines added or changed since git revision `rev`")
	fs.StringVar(&o.baseline, "baseline", "", "hide the findings recorded in baseline `file`")
	fs.StringVar(&o.writeBaseline, "write-baseline", "", "record the current findings in baseline `file` instead of reporting them")
	fs.BoolVar(&o.staleReviews, "stale-reviews", false, "report //roundoff:reviewed directives that suppress no finding")
	fs.StringVar(&o.configFile, "config", "", "read the configuration from `file` instead of the module's roundoff.yaml")
	o.build = map[string]*string{}
	for _, b := range buildFlags {
		o.build[b.name] = fs.String(b.name, "", b.usage)
	}
	o.enable = map[string]*triState{}
	for _, a := range e.analyzers {
		t := new(triState)
		o.enable[a.Name] = t
		fs.Var(t, a.Name, "run the "+a.Name+" analyzer (-"+a.Name+"=false: all but it)")
		a.Flags.VisitAll(func(f *flag.Flag) { fs.Var(f.Value, a.Name+"."+f.Name, f.Usage) })
	}
	return fs
}

// parseFlags parses args into options, checking that they make sense
// together; errHelp means the user asked for the usage.
func (e *env) parseFlags(args []string) (*options, error) {
	o := &options{}
	fs := e.flagSet(o)
	fs.Usage = func() {}
	fs.SetOutput(io.Discard)
	if err := fs.Parse(args); err != nil {
		return nil, err
	}
	o.patterns = fs.Args()
	var explicit []string
	fs.Visit(func(f *flag.Flag) { explicit = append(explicit, f.Name) })
	return o, o.check(explicit)
}

// check reports flags that contradict each other or have bad values.
func (o *options) check(explicit []string) error {
	set := func(name string) bool { return slices.Contains(explicit, name) }
	if !slices.Contains(formats, o.format) {
		return fmt.Errorf("-format %q: want one of %s", o.format, strings.Join(formats, ", "))
	}
	if o.json {
		if set("format") && o.format != "json" {
			return fmt.Errorf("-json contradicts -format %s", o.format)
		}
		o.format = "json"
	}
	o.fix = o.fix || o.diff
	switch {
	case o.fix && o.format != "text":
		return fmt.Errorf("-fix and -diff apply or show fixes and print no findings: drop -format %s", o.format)
	case o.writeBaseline != "" && (o.fix || o.since != "" || o.baseline != ""):
		return errors.New("-write-baseline records every current finding: do not combine it with -fix, -diff, -since or -baseline")
	case set("since") && o.since == "":
		return errors.New("-since needs a git revision, such as main or HEAD~3")
	case set("baseline") && o.baseline == "":
		return errors.New("-baseline needs a file name")
	case set("write-baseline") && o.writeBaseline == "":
		return errors.New("-write-baseline needs a file name")
	case len(o.patterns) == 0:
		return errors.New("no packages to lint; name them as for go build, such as ./...")
	}
	return nil
}

// selection returns the analyzers the -NAME flags turn on and off.
func (o *options) selection() (only, off []string) {
	for name, t := range o.enable {
		switch *t {
		case setTrue:
			only = append(only, name)
		case setFalse:
			off = append(off, name)
		}
	}
	return only, off
}
