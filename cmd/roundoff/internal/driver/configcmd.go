package driver

import (
	"errors"
	"flag"
	"fmt"
	"io"
)

// configCmd prints the effective configuration: the file's settings over
// the defaults, every analyzer listed, in the file's own format.
func (e *env) configCmd(args []string) int {
	fs := flag.NewFlagSet("roundoff config", flag.ContinueOnError)
	fs.SetOutput(io.Discard)
	file := fs.String("config", "", "read `file` instead of the module's roundoff.yaml")
	if err := fs.Parse(args); err != nil || fs.NArg() > 0 {
		if errors.Is(err, flag.ErrHelp) {
			fmt.Fprintln(e.stdout, "usage: roundoff config [-config file]")
			return exitClean
		}
		return e.errorf("usage: roundoff config [-config file]")
	}
	cfg, err := e.loadConfig(*file, e.cwd)
	if err != nil {
		return e.errorf("%v", err)
	}
	if cfg.File == "" {
		fmt.Fprintf(e.stdout, "# no roundoff.yaml at the module root %s: the defaults apply\n", cfg.Root)
	} else {
		fmt.Fprintf(e.stdout, "# effective configuration, read from %s\n", e.display(cfg.File))
	}
	if err := cfg.Write(e.stdout); err != nil {
		return e.errorf("%v", err)
	}
	return exitClean
}
