package constval

import (
	"go/ast"
	"go/types"
	"reflect"

	"golang.org/x/tools/go/analysis"
	"golang.org/x/tools/go/analysis/passes/inspect"
	"golang.org/x/tools/go/ast/inspector"
)

// Analyzer computes the package's Decls once for every analyzer that
// evaluates constants: one walk of the files instead of one per analyzer.
// Read its result with DeclsOf.
var Analyzer = &analysis.Analyzer{
	Name:       "constval",
	Doc:        "constval: the initialisers of constants and never-reassigned variables",
	Requires:   []*analysis.Analyzer{inspect.Analyzer},
	Run:        run,
	ResultType: reflect.TypeFor[map[types.Object]ast.Expr](),
}

func run(pass *analysis.Pass) (any, error) {
	return Decls(pass.TypesInfo, pass.ResultOf[inspect.Analyzer].(*inspector.Inspector)), nil
}

// DeclsOf returns the Decls of pass's package, from Analyzer, which the
// pass's analyzer must require. The map is shared: read it, never write.
func DeclsOf(pass *analysis.Pass) map[types.Object]ast.Expr {
	return pass.ResultOf[Analyzer].(map[types.Object]ast.Expr)
}
