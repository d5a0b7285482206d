package noise

import (
	"fmt"
	"go/types"
	"path/filepath"
	"strings"

	"golang.org/x/tools/go/packages"
)

// kind is an accepted signature.
type kind int

const (
	scalar64 kind = iota // func(float64) float64
	scalar32             // func(float32) float32
	vector               // func([]float64) float64
)

// accepted lists the signatures in the words of the error message.
const accepted = "func(float64) float64, func(float32) float32 or func([]float64) float64"

// target is the function to measure.
type target struct {
	pkgPath, pkgName, dir string // the package and its directory
	name                  string
	kind                  kind
	obj                   types.Object
	file                  string // the file that declares it
	isVar                 bool   // a package-level variable of function type
}

// splitName splits PACKAGE.FUNC at the last dot after the last slash.
func splitName(arg string) (pkg, name string, err error) {
	slash := strings.LastIndex(arg, "/")
	dot := strings.LastIndex(arg, ".")
	if dot <= slash+1 || dot == len(arg)-1 {
		return "", "", fmt.Errorf("%q is not PACKAGE.FUNC (for example ./turbine.HeadLoss)", arg)
	}
	return arg[:dot], arg[dot+1:], nil
}

// resolve loads the package and finds the function in it.
func resolve(arg, tags, dir string) (*target, error) {
	pattern, name, err := splitName(arg)
	if err != nil {
		return nil, err
	}
	cfg := &packages.Config{
		Mode: packages.NeedName | packages.NeedFiles | packages.NeedTypes,
		Dir:  dir,
	}
	if tags != "" {
		cfg.BuildFlags = []string{"-tags=" + tags}
	}
	pkgs, err := packages.Load(cfg, pattern)
	if err != nil {
		return nil, fmt.Errorf("loading %s: %v", pattern, err)
	}
	if len(pkgs) != 1 {
		return nil, fmt.Errorf("%s names %d packages: name one", pattern, len(pkgs))
	}
	pkg := pkgs[0]
	if len(pkg.Errors) > 0 {
		return nil, fmt.Errorf("package %s: %s", pattern, strings.TrimPrefix(firstLine(pkg.Errors[0].Error()), "-: "))
	}
	if len(pkg.GoFiles) == 0 || pkg.Types == nil {
		return nil, fmt.Errorf("no Go package in %s", pattern)
	}
	if pkg.Name == "main" {
		return nil, fmt.Errorf("%s is a main package, which cannot be imported: move %s to a library package", pattern, name)
	}
	t := &target{pkgPath: pkg.PkgPath, pkgName: pkg.Name, dir: filepath.Dir(pkg.GoFiles[0]), name: name}
	t.obj = pkg.Types.Scope().Lookup(name)
	if t.obj == nil {
		return nil, fmt.Errorf("package %s has no function or variable %s", pkg.PkgPath, name)
	}
	if err := t.check(); err != nil {
		return nil, err
	}
	t.file = pkg.Fset.Position(t.obj.Pos()).Filename
	return t, nil
}

// check finds the kind of the target's signature.
func (t *target) check() error {
	switch t.obj.(type) {
	case *types.Func:
	case *types.Var:
		t.isVar = true
	default:
		return fmt.Errorf("%s.%s is not a function: want one of %s", t.pkgName, t.name, accepted)
	}
	wrong := fmt.Errorf("%s.%s has type %s: want one of %s (docs/noise.md shows the adapter to write)", t.pkgName, t.name, t.obj.Type(), accepted)
	sig, ok := t.obj.Type().Underlying().(*types.Signature)
	if !ok || sig.TypeParams() != nil || sig.Variadic() || sig.Params().Len() != 1 || sig.Results().Len() != 1 {
		return wrong
	}
	in, out := sig.Params().At(0).Type(), sig.Results().At(0).Type()
	f64, f32 := types.Typ[types.Float64], types.Typ[types.Float32]
	switch {
	case types.Identical(in, f64) && types.Identical(out, f64):
		t.kind = scalar64
	case types.Identical(in, f32) && types.Identical(out, f32):
		t.kind = scalar32
	case types.Identical(in, types.NewSlice(f64)) && types.Identical(out, f64):
		t.kind = vector
	default:
		return wrong
	}
	return nil
}

func firstLine(s string) string {
	s, _, _ = strings.Cut(s, "\n")
	return s
}
