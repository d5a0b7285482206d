package driver

import (
	"errors"
	"flag"
	"fmt"
	"io"
	"io/fs"
	"os"
	"os/exec"
	"path/filepath"
	"slices"
	"strings"
)

// hookMark is the line by which roundoff recognises a hook it installed.
const hookMark = "# roundoff pre-commit hook"

// hookSaved is the suffix of the name a foreign hook is saved under.
const hookSaved = ".saved-by-roundoff"

// hookUsage is the help of roundoff hook.
const hookUsage = `usage: roundoff hook install [-force] | uninstall | run

  install    install the git pre-commit hook; -force moves a hook roundoff
             did not install aside, and the new hook runs it first
  uninstall  remove roundoff's hook, putting a moved-aside one back
  run        lint the staged lines, as the index holds them (what the hook runs)
`

// hookCmd runs roundoff hook install|uninstall|run.
func (e *env) hookCmd(args []string) int {
	const use = "usage: roundoff hook install [-force] | uninstall | run"
	if len(args) == 0 {
		return e.errorf("%s", use)
	}
	fs := flag.NewFlagSet("roundoff hook", flag.ContinueOnError)
	fs.SetOutput(io.Discard)
	force := fs.Bool("force", false, "save an existing foreign hook and install over it")
	err := fs.Parse(args[min(1, len(args)):])
	if isHelp(args[0]) || errors.Is(err, flag.ErrHelp) {
		fmt.Fprint(e.stdout, hookUsage)
		return exitClean
	}
	if err != nil || fs.NArg() > 0 || *force && args[0] != "install" {
		return e.errorf("%s", use)
	}
	switch args[0] {
	case "install":
		return e.hookInstall(*force)
	case "uninstall":
		return e.hookUninstall()
	case "run":
		return e.hookRun()
	}
	return e.errorf("%s", use)
}

// hookPath returns the path of the repository's pre-commit hook, which
// git places under core.hooksPath when that is set.
func (e *env) hookPath() (string, error) {
	out, err := git(e.cwd, "rev-parse", "--git-path", "hooks/pre-commit")
	if err != nil {
		return "", fmt.Errorf("%s is not inside a git work tree", e.cwd)
	}
	p := strings.TrimSpace(out)
	if !filepath.IsAbs(p) {
		p = filepath.Join(e.cwd, p)
	}
	return p, nil
}

// hookScript is the hook. It first runs a hook that install -force moved
// aside, then roundoff from PATH, so that it survives the binary moving.
const hookScript = "#!/bin/sh\n" + hookMark + ": runs a hook it replaced, then lints\n" +
	"# the packages with staged Go files, reporting findings on staged lines.\n" +
	"# Remove it with: roundoff hook uninstall\n" +
	"saved=\"$(dirname \"$0\")/pre-commit" + hookSaved + "\"\n" +
	"if [ -x \"$saved\" ]; then \"$saved\" \"$@\" || exit; fi\n" +
	"if ! command -v roundoff >/dev/null 2>&1; then\n" +
	"\techo 'roundoff pre-commit hook: no roundoff command on PATH; install it (go install ./cmd/roundoff in its repository), or remove the hook with: roundoff hook uninstall' >&2\n" +
	"\texit 1\n" +
	"fi\n" +
	"exec roundoff hook run\n"

// ours reports whether the hook at path was installed by roundoff.
func ours(path string) (exists, mine bool, err error) {
	data, err := os.ReadFile(path)
	if errors.Is(err, fs.ErrNotExist) {
		return false, false, nil
	}
	return err == nil, strings.Contains(string(data), "\n"+hookMark+":"), err
}

// hookInstall installs the pre-commit hook. A hook that roundoff did not
// install is left alone unless force is set, in which case it is saved
// beside the new one (and restored by uninstall).
func (e *env) hookInstall(force bool) int {
	path, err := e.hookPath()
	if err != nil {
		return e.errorf("hook install: %v", err)
	}
	exists, mine, err := ours(path)
	switch {
	case err != nil:
		return e.errorf("hook install: %v", err)
	case exists && !mine && !force:
		return e.errorf("hook install: %s exists and was not installed by roundoff; rerun with -force to save it as %s and install", path, filepath.Base(path)+hookSaved)
	case exists && !mine:
		saved := path + hookSaved
		if _, err := os.Lstat(saved); err == nil {
			return e.errorf("hook install: %s already exists; move it away first", saved)
		}
		if err := os.Rename(path, saved); err != nil {
			return e.errorf("hook install: %v", err)
		}
		fmt.Fprintf(e.stderr, "roundoff: saved the existing hook as %s; the new hook runs it first\n", saved)
	}
	if err := os.MkdirAll(filepath.Dir(path), 0o755); err != nil {
		return e.errorf("hook install: %v", err)
	}
	if err := writeAtomic(path, []byte(hookScript)); err != nil {
		return e.errorf("hook install: %s: %v", path, err)
	}
	if err := os.Chmod(path, 0o755); err != nil {
		return e.errorf("hook install: %v", err)
	}
	fmt.Fprintf(e.stderr, "roundoff: installed the pre-commit hook %s\n", path)
	if _, err := exec.LookPath("roundoff"); err != nil {
		fmt.Fprintln(e.stderr, "roundoff: the hook runs roundoff from PATH, where there is none; commits fail until it is installed there")
	}
	return exitClean
}

// hookUninstall removes roundoff's hook and restores a saved one.
func (e *env) hookUninstall() int {
	path, err := e.hookPath()
	if err != nil {
		return e.errorf("hook uninstall: %v", err)
	}
	exists, mine, err := ours(path)
	switch {
	case err != nil:
		return e.errorf("hook uninstall: %v", err)
	case !exists:
		fmt.Fprintf(e.stderr, "roundoff: no pre-commit hook installed at %s\n", path)
		return exitClean
	case !mine:
		return e.errorf("hook uninstall: %s was not installed by roundoff; leaving it", path)
	}
	if err := os.Remove(path); err != nil {
		return e.errorf("hook uninstall: %v", err)
	}
	fmt.Fprintf(e.stderr, "roundoff: removed the pre-commit hook %s\n", path)
	if _, err := os.Lstat(path + hookSaved); err == nil {
		if err := os.Rename(path+hookSaved, path); err != nil {
			return e.errorf("hook uninstall: restoring the saved hook: %v", err)
		}
		fmt.Fprintf(e.stderr, "roundoff: restored the hook saved at install\n")
	}
	return exitClean
}

// hookRun is what the hook runs: lint the packages that hold staged Go
// files, module by module, through go vet (whose cache makes re-linting a
// changed package fast), as the index holds them, reporting findings on
// staged lines only.
func (e *env) hookRun() int {
	changed, err := stagedChanges(e.cwd)
	if err != nil {
		return e.errorf("hook: %v", err)
	}
	staged, err := stageIndex(changed.root)
	if err != nil {
		return e.errorf("hook: %v", err)
	}
	defer staged.remove()
	modules := map[string][]string{} // module root → package patterns
	for rel := range changed.files {
		if !strings.HasSuffix(rel, ".go") {
			continue
		}
		dir := filepath.Join(changed.root, filepath.FromSlash(filepath.Dir(rel)))
		mod := moduleRoot(dir)
		pat, _ := relTo(mod, dir)
		if pat != "." {
			pat = "./" + pat
		}
		if !slices.Contains(modules[mod], pat) {
			modules[mod] = append(modules[mod], pat)
		}
	}
	code := exitClean
	for mod, patterns := range modules {
		o := &options{format: "text", tests: true, patterns: patterns, changed: changed, staged: staged, enable: map[string]*triState{}}
		if c := e.vetLint(o, mod); c == exitErrors || code == exitErrors {
			code = exitErrors
		} else {
			code = max(code, c)
		}
	}
	if code == exitFindings {
		fmt.Fprintln(e.stderr, "roundoff: commit stopped by findings on staged lines: fix them, or mark each accepted one with //roundoff:reviewed <analyzer> <reason>")
	}
	return code
}
