// Package noiselevel defines an infrastructure Analyzer that learns the
// relative accuracy of functions whose results are noisy: an ODE solve, a
// simulation, a measurement. A function declares it with the directive
//
//	//roundoff:noise <relative accuracy>
//
// in its doc comment (for example //roundoff:noise 1e-6), or the
// configuration file declares it for the function or its package (the
// directive wins where both do). The analyzers
// that reason with machine epsilon (fdstep, stoptol) use the level instead
// for calls of such a function: its optimal difference step and the
// precision to which it can be minimized are about sqrt(level)·max(1,|x|)
// rather than sqrt(eps)·max(1,|x|) (Gill, Murray & Wright 1981). The level
// crosses packages as a fact. The analyzer reports nothing; a malformed
// directive is reported by reviewmark.
package noiselevel

import (
	"fmt"
	"go/ast"
	"go/types"
	"reflect"

	"golang.org/x/tools/go/analysis"
	"golang.org/x/tools/go/types/typeutil"

	"roundoff/internal/config"
)

// Analyzer learns the noise levels of this package's functions and of
// every function it calls.
var Analyzer = &analysis.Analyzer{
	Name:       "noiselevel",
	Doc:        "noiselevel: learn the relative accuracy of noisy functions from //roundoff:noise directives",
	Run:        run,
	ResultType: reflect.TypeFor[*Levels](),
	FactTypes:  []analysis.Fact{new(Fact)},
}

// Fact is the declared relative accuracy of a function.
type Fact struct{ Level float64 }

// AFact marks Fact as an analysis fact.
func (*Fact) AFact() {}

func (f *Fact) String() string { return fmt.Sprintf("noise %g", f.Level) }

// Levels holds the noise levels known to one package: its own functions'
// and those of the functions it calls.
type Levels struct{ m map[*types.Func]float64 }

// Of returns the noise level of fn, if one is declared.
func (l *Levels) Of(fn *types.Func) (float64, bool) {
	if fn == nil {
		return 0, false
	}
	v, ok := l.m[fn.Origin()]
	return v, ok
}

func run(pass *analysis.Pass) (any, error) {
	levels := &Levels{m: make(map[*types.Func]float64)}
	imported := len(pass.AllObjectFacts()) > 0 // taken before this package's own are exported
	for _, f := range pass.Files {
		for _, d := range f.Decls {
			fd, ok := d.(*ast.FuncDecl)
			if !ok {
				continue
			}
			fn, _ := pass.TypesInfo.Defs[fd.Name].(*types.Func)
			if level, ok := declared(pass.Pkg.Path(), fd, fn); ok {
				levels.m[fn] = level
				pass.ExportObjectFact(fn, &Fact{Level: level})
			}
		}
		if !imported {
			continue
		}
		// Learn the levels of the functions called here from their facts.
		ast.Inspect(f, func(n ast.Node) bool {
			call, ok := n.(*ast.CallExpr)
			if !ok {
				return true
			}
			fn, ok := typeutil.Callee(pass.TypesInfo, call).(*types.Func)
			if !ok || fn.Pkg() == pass.Pkg {
				return true
			}
			var fact Fact
			if pass.ImportObjectFact(fn.Origin(), &fact) {
				levels.m[fn.Origin()] = fact.Level
			}
			return true
		})
	}
	return levels, nil
}

// declared returns the noise level of a function: from its directive, or
// else from the run's configuration file.
func declared(pkgPath string, fd *ast.FuncDecl, fn *types.Func) (float64, bool) {
	if fn == nil {
		return 0, false
	}
	if level, c, err := config.FindNoiseDirective(fd.Doc); c != nil {
		return level, err == nil
	}
	return config.Noise(pkgPath, funcName(fn))
}

// funcName names fn as the configuration does: Name, or Type.Method.
func funcName(fn *types.Func) string {
	if recv := fn.Signature().Recv(); recv != nil {
		t := recv.Type()
		if p, ok := t.(*types.Pointer); ok {
			t = p.Elem()
		}
		if named, ok := types.Unalias(t).(*types.Named); ok {
			return named.Obj().Name() + "." + fn.Name()
		}
	}
	return fn.Name()
}
