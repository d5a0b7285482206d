// Package lazyssa defines an infrastructure Analyzer that gives a
// package's SSA form, as buildssa builds it, on first request. Analyzers
// with facts run on every dependency of the packages linted, the standard
// library included; building SSA for all of them cost more time and memory
// than the rest of the suite together (docs/performance.md), while most
// hold nothing such an analyzer looks for. Requiring lazyssa instead of
// buildssa lets an analyzer look at the syntax first and build SSA only
// where it needs it, and lets several analyzers share one build.
package lazyssa

import (
	"go/token"
	"iter"
	"reflect"
	"sync"
	"sync/atomic"
	"time"

	"golang.org/x/tools/go/analysis"
	"golang.org/x/tools/go/analysis/passes/buildssa"
	"golang.org/x/tools/go/analysis/passes/ctrlflow"
	"golang.org/x/tools/go/ssa"

	"roundoff/analyzers/internal/constval"
)

// Analyzer returns a *Lazy for the package, having built nothing.
var Analyzer = &analysis.Analyzer{
	Name:       "lazyssa",
	Doc:        "lazyssa: the package's SSA form, built on first request",
	Requires:   []*analysis.Analyzer{ctrlflow.Analyzer},
	Run:        run,
	ResultType: reflect.TypeFor[*Lazy](),
}

// Lazy builds a package's SSA form once, when first asked, from any
// goroutine.
type Lazy struct {
	build   func() *buildssa.SSA
	index   func() map[token.Pos]ssa.Instruction
	globals func() constval.Globals
	spent   atomic.Int64 // nanoseconds spent building
}

func run(pass *analysis.Pass) (any, error) {
	// What buildssa reads: the package and ctrlflow's result.
	input := &analysis.Pass{
		Analyzer:  buildssa.Analyzer,
		Fset:      pass.Fset,
		Files:     pass.Files,
		Pkg:       pass.Pkg,
		TypesInfo: pass.TypesInfo,
		ResultOf:  map[*analysis.Analyzer]any{ctrlflow.Analyzer: pass.ResultOf[ctrlflow.Analyzer]},
	}
	l := new(Lazy)
	l.build = sync.OnceValue(func() *buildssa.SSA {
		start := time.Now()
		defer func() { l.spent.Store(int64(time.Since(start))) }()
		res, err := buildssa.Analyzer.Run(input)
		if err != nil {
			panic(err) // buildssa returns no errors
		}
		return res.(*buildssa.SSA)
	})
	l.index = sync.OnceValue(func() map[token.Pos]ssa.Instruction {
		at := map[token.Pos]ssa.Instruction{}
		for _, fn := range l.SSA().SrcFuncs {
			for _, b := range fn.Blocks {
				for _, instr := range b.Instrs {
					switch instr.(type) {
					case *ssa.Call, *ssa.BinOp:
						if instr.Pos().IsValid() {
							at[instr.Pos()] = instr
						}
					}
				}
			}
		}
		return at
	})
	l.globals = sync.OnceValue(func() constval.Globals {
		s := l.SSA()
		return constval.FindGlobals(s.Pkg, s.SrcFuncs)
	})
	return l, nil
}

// At returns the call whose opening parenthesis, or the binary operation
// whose operator, is at pos in the package's SSA form, or nil; the index
// is built once, for every analyzer that asks.
func (l *Lazy) At(pos token.Pos) ssa.Instruction { return l.index()[pos] }

// Calls yields the package's calls that have a position, in no order.
func (l *Lazy) Calls() iter.Seq[*ssa.Call] {
	return func(yield func(*ssa.Call) bool) {
		for _, instr := range l.index() {
			if call, ok := instr.(*ssa.Call); ok && !yield(call) {
				return
			}
		}
	}
}

// Globals returns the package variables that hold a constant
// (constval.FindGlobals), found once for every analyzer that asks.
func (l *Lazy) Globals() constval.Globals { return l.globals() }

// BuildTime returns the time spent building the package's SSA form, zero
// if it was never asked for. The analyzer that asks first counts it as its
// own; the benchmark's time per analyzer shows it apart.
func (l *Lazy) BuildTime() time.Duration { return time.Duration(l.spent.Load()) }

// SSA returns the package's SSA form, building it on the first call.
func (l *Lazy) SSA() *buildssa.SSA { return l.build() }
