package constval

import (
	"go/ast"
	"go/types"
	"reflect"

	"golang.org/x/tools/go/analysis"
)

// Analyzer computes the package's Decls once for every analyzer that
// evaluates constants: one walk of the files instead of one per analyzer.
// Read its result with DeclsOf.
var Analyzer = &analysis.Analyzer{
	Name:       "constval",
	Doc:        "constval: the initialisers of constants and never-reassigned variables",
	Run:        func(pass *analysis.Pass) (any, error) { return Decls(pass.TypesInfo, pass.Files), nil },
	ResultType: reflect.TypeFor[map[types.Object]ast.Expr](),
}

// DeclsOf returns the Decls of pass's package, from Analyzer, which the
// pass's analyzer must require. The map is shared: read it, never write.
func DeclsOf(pass *analysis.Pass) map[types.Object]ast.Expr {
	return pass.ResultOf[Analyzer].(map[types.Object]ast.Expr)
}
