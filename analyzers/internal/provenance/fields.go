package provenance

import (
	"go/types"

	"golang.org/x/tools/go/ssa"
)

// LoadedField returns the struct field a load reads (directly or through
// one level of slice or array indexing), or nil.
func LoadedField(v ssa.Value) *types.Var { return loadedField(Strip(v)) }

// AddrField returns the struct field an address points into (&s.f or
// &s.f[i]), or nil.
func AddrField(addr ssa.Value) *types.Var { return addrField(addr) }
