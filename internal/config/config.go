// Package config reads roundoff.yaml, the file at a module's root that
// adapts roundoff to the module: which analyzers run, at which SARIF level
// their findings are reported, which paths are left out, and the relative
// accuracy (noise level) that named packages and functions compute with.
//
// The driver reads the file once per run and installs it with Use; the
// analyzers and fixes.Report consult it through Current and Noise.
package config

import (
	"fmt"
	"path/filepath"
	"slices"
	"strings"
	"sync/atomic"
)

// FileName is the name of the configuration file at a module's root.
const FileName = "roundoff.yaml"

// Levels are the result levels of SARIF 2.1.0 (§3.27.10) that a finding
// may carry, most severe first; DefaultLevel is SARIF's default.
var Levels = []string{"error", "warning", "note"}

// DefaultLevel is the level of an analyzer the file does not mention.
const DefaultLevel = "warning"

// A Config is the effective configuration of one run.
type Config struct {
	File        string       // the file read, "" when the defaults apply
	Root        string       // the directory excluded paths are relative to
	Exclude     []string     // slash-separated globs, relative to Root
	NoiseLevels []NoiseLevel // in file order
	DataSizes   []DataSize   // in file order

	names     []string // the suite, in its order
	analyzers map[string]*Analyzer
}

// Analyzer holds the settings of one analyzer.
type Analyzer struct {
	Enabled bool
	Level   string
}

// A NoiseLevel declares that the results of the functions it covers carry
// only the given relative accuracy.
type NoiseLevel struct {
	Package  string  // an import path, or a path ending in /... for a tree
	Function string  // a function or Type.Method name; "" for every function
	Relative float64 // relative accuracy, in (0, 1)
	Line     int     // where it is declared, 0 when not from a file
}

// A DataSize declares the size that data reaching the packages it covers
// can have, in the units their callers use (epsfloor judges absolute
// tolerances of unknown size at it).
type DataSize struct {
	Package string  // an import path, or a path ending in /... for a tree
	Size    float64 // positive and finite
	Line    int     // where it is declared, 0 when not from a file
}

// Default returns the configuration that applies without a file: every
// analyzer of names enabled at DefaultLevel, nothing excluded.
func Default(names []string, root string) *Config {
	c := &Config{Root: root, names: slices.Clone(names), analyzers: map[string]*Analyzer{}}
	for _, n := range names {
		c.analyzers[n] = &Analyzer{Enabled: true, Level: DefaultLevel}
	}
	return c
}

// Names returns the names of the suite's analyzers.
func (c *Config) Names() []string { return c.names }

// Known reports whether name is an analyzer of the suite. Without a suite
// (the zero configuration some tests use) every name is known.
func (c *Config) Known(name string) bool {
	_, ok := c.analyzers[name]
	return ok || len(c.names) == 0
}

// Enabled reports whether the analyzer called name reports findings.
func (c *Config) Enabled(name string) bool {
	a, ok := c.analyzers[name]
	return !ok || a.Enabled
}

// Level returns the SARIF level of the findings of analyzer name.
func (c *Config) Level(name string) string {
	if a, ok := c.analyzers[name]; ok {
		return a.Level
	}
	return DefaultLevel
}

// Select applies the command line's choice of analyzers over the file's:
// when only is not empty exactly those run; otherwise the ones in off stop.
func (c *Config) Select(only, off []string) {
	for name, a := range c.analyzers {
		if len(only) > 0 {
			a.Enabled = slices.Contains(only, name)
		} else if slices.Contains(off, name) {
			a.Enabled = false
		}
	}
}

// Excluded reports whether filename lies under an excluded path.
func (c *Config) Excluded(filename string) bool {
	if len(c.Exclude) == 0 || c.Root == "" {
		return false
	}
	rel, err := filepath.Rel(c.Root, filename)
	if err != nil || rel == ".." || strings.HasPrefix(rel, ".."+string(filepath.Separator)) {
		return false // outside the module: not ours to exclude
	}
	rel = filepath.ToSlash(rel)
	for _, g := range c.Exclude {
		if matchGlob(g, rel) {
			return true
		}
	}
	return false
}

// Noise returns the relative accuracy declared for function fn (a name or
// Type.Method; "" for the package as a whole) of the package at pkgPath:
// the most specific level that covers it (a function over a package, a
// longer package path over a shorter one; the later among equals).
func (c *Config) Noise(pkgPath, fn string) (float64, bool) {
	best, rank := 0.0, -1
	for _, n := range c.NoiseLevels {
		r, ok := n.covers(pkgPath, fn)
		if ok && r >= rank {
			best, rank = n.Relative, r
		}
	}
	return best, rank >= 0
}

// DataSize returns the data size declared for the package at pkgPath: the
// most specific entry that covers it (the later among equals).
func (c *Config) DataSize(pkgPath string) (float64, bool) {
	best, rank := 0.0, -1
	for _, d := range c.DataSizes {
		r, ok := coversPackage(d.Package, pkgPath)
		if ok && r >= rank {
			best, rank = d.Size, r
		}
	}
	return best, rank >= 0
}

// covers reports whether n applies to fn of pkgPath, and how specifically.
func (n NoiseLevel) covers(pkgPath, fn string) (rank int, ok bool) {
	if n.Function != "" && n.Function != fn {
		return 0, false
	}
	rank, ok = coversPackage(n.Package, pkgPath)
	if !ok {
		return 0, false
	}
	if n.Function != "" {
		rank += 1 << 20 // a function rule beats every package rule
	}
	return rank, true
}

// coversPackage reports whether the package pattern (a path, or a tree
// ending in /...) covers pkgPath, and how specifically.
func coversPackage(pattern, pkgPath string) (rank int, ok bool) {
	tree, isTree := strings.CutSuffix(pattern, "/...")
	switch {
	case pattern == pkgPath:
		return 2 * len(pattern), true
	case isTree && (pkgPath == tree || strings.HasPrefix(pkgPath, tree+"/")):
		return 2*len(tree) - 1, true
	}
	return 0, false
}

var unattendedOnly atomic.Bool

// KeepUnattendedOnly makes the analyzers drop every fix that needs review.
// The command sets it when roundoff runs under `go fix` or `go vet -fix`,
// which apply the first fix of every diagnostic without showing it to
// anyone.
func KeepUnattendedOnly(on bool) { unattendedOnly.Store(on) }

// UnattendedOnly reports whether fixes that need review must be dropped.
func UnattendedOnly() bool { return unattendedOnly.Load() }

var current atomic.Pointer[Config]

// Use installs c as the configuration of the run.
func Use(c *Config) { current.Store(c) }

// Current returns the configuration of the run: the one installed with
// Use, or one that enables everything and excludes nothing.
func Current() *Config {
	if c := current.Load(); c != nil {
		return c
	}
	return Default(nil, "")
}

// Noise returns the relative accuracy the run's configuration declares
// for function fn of the package at pkgPath; see Config.Noise.
func Noise(pkgPath, fn string) (float64, bool) { return Current().Noise(pkgPath, fn) }

// Size returns the data size the run's configuration declares for the
// package at pkgPath; see Config.DataSize.
func Size(pkgPath string) (float64, bool) { return Current().DataSize(pkgPath) }

// An Error is a mistake in a configuration file, at a line.
type Error struct {
	File string
	Line int
	Msg  string
}

func (e *Error) Error() string {
	if e.Line > 0 {
		return fmt.Sprintf("%s:%d: %s", e.File, e.Line, e.Msg)
	}
	return e.File + ": " + e.Msg
}
