// Package vecshape defines an infrastructure Analyzer that learns which
// functions return a direction (a vector divided by its own length), the
// dot product or the length of their vector inputs, the cosine of the
// angle between two, or the cross product of two plane vectors, by
// reading their bodies (package degree), whatever
// their names, and carries that to importers as facts: r3.Unit(v),
// a.Dot(b) or r3.Cos(p, q) of another package read as they would in
// their own. The per-package work is a look at the functions whose
// signature fits (one float or vector result, a vector input): cheap
// enough to run on every dependency.
package vecshape

import (
	"fmt"
	"go/ast"
	"go/types"
	"reflect"

	"golang.org/x/tools/go/analysis"

	"roundoff/analyzers/internal/degree"
)

// Analyzer learns the vector functions of a package.
var Analyzer = &analysis.Analyzer{
	Name:       "vecshape",
	Doc:        "vecshape: learn which functions return a direction, a dot product, a length, a cosine or a cross product of vectors",
	Run:        run,
	ResultType: reflect.TypeFor[Imported](),
	FactTypes:  []analysis.Fact{new(Fact)},
}

// Fact is the shape of a function's result.
type Fact struct{ degree.Summary }

// AFact marks Fact as an analysis fact.
func (*Fact) AFact() {}

func (f *Fact) String() string {
	return fmt.Sprintf("%s of inputs %d, %d", [...]string{"dot product", "length", "direction", "cosine", "cross product"}[f.Shape], f.In[0], f.In[1])
}

// Imported returns the summary of a function of another package, for
// degree.Reader.Import.
type Imported func(*types.Func) (degree.Summary, bool)

// Of returns the summaries the pass's package imports; the pass's
// analyzer must require Analyzer.
func Of(pass *analysis.Pass) Imported { return pass.ResultOf[Analyzer].(Imported) }

func run(pass *analysis.Pass) (any, error) {
	imported := func(fn *types.Func) (degree.Summary, bool) {
		var f Fact
		if fn.Pkg() == nil || fn.Pkg() == pass.Pkg || !pass.ImportObjectFact(fn.Origin(), &f) {
			return degree.Summary{}, false
		}
		return f.Summary, true
	}
	r := degree.New(pass.Fset, pass.TypesInfo, pass.Files)
	r.Import(imported)
	for _, f := range pass.Files {
		for _, d := range f.Decls {
			fd, ok := d.(*ast.FuncDecl)
			if !ok || fd.Body == nil {
				continue
			}
			if fn, ok := pass.TypesInfo.Defs[fd.Name].(*types.Func); ok && fits(fn.Signature()) {
				if s, ok := r.Summarize(fn); ok {
					pass.ExportObjectFact(fn, &Fact{s})
				}
			}
		}
	}
	return Imported(imported), nil
}

// fits reports whether sig has one result, a float or a vector, and a
// vector among its inputs.
func fits(sig *types.Signature) bool {
	if sig.Results().Len() != 1 || !degree.Vector(sig.Results().At(0).Type()) && !isFloat(sig.Results().At(0).Type()) {
		return false
	}
	if sig.Recv() != nil && degree.Vector(sig.Recv().Type()) {
		return true
	}
	for p := range sig.Params().Variables() {
		if degree.Vector(p.Type()) {
			return true
		}
	}
	return false
}

func isFloat(t types.Type) bool {
	b, ok := t.Underlying().(*types.Basic)
	return ok && b.Info()&types.IsFloat != 0
}
