package fdstep

import (
	"fmt"
	"go/ast"
	"go/token"
	"go/types"
	"strconv"

	"golang.org/x/tools/go/analysis"

	"roundoff/analyzers/internal/fixes"
	"roundoff/internal/numeric"
)

// reportQuotient reports a difference quotient with a constant step, at
// the division, with the step's declaration as related information.
func (c *checker) reportQuotient(q *quotient, v verdict) {
	node := c.node(q.root.Pos())
	if node == nil || c.said[node.Pos()] || c.deliberate(node.Pos(), v) {
		return
	}
	c.said[node.Pos()] = true
	_, step, _ := c.bumpSyntax(q.bumps[0])
	subject := fmt.Sprintf("fixed %s-difference step %s", q.scheme.name, stepText(c.pass.TypesInfo, step, v.h, v.f))
	switch {
	case v.scaled:
		subject = fmt.Sprintf("%s-difference step %s·max(1,|x|)", q.scheme.name, numeric.Short(v.h))
	case v.isDefault:
		subject = fmt.Sprintf("fixed default %s-difference step %s", q.scheme.name, numeric.Short(v.h))
	}
	d := analysis.Diagnostic{Pos: node.Pos(), End: node.End(), Category: category(v), Message: message(subject, v)}
	if v.isDefault {
		if v.fallback != nil {
			d.Related = []analysis.RelatedInformation{{Pos: v.fallback.Pos(), End: v.fallback.End(), Message: "default step set here"}}
		}
		fixes.Report(c.pass, d) // the step is chosen by the caller: the remedy is in the message
		return
	}
	if id, ok := step.(*ast.Ident); ok {
		obj := c.pass.TypesInfo.Uses[id]
		if obj != nil && obj.Pos().IsValid() && c.line(obj.Pos()) != c.line(node.Pos()) {
			d.Related = []analysis.RelatedInformation{{Pos: obj.Pos(), End: obj.Pos() + token.Pos(len(obj.Name())), Message: "step " + obj.Name() + " declared here"}}
		}
	}
	fixes.Report(c.pass, d, c.fix(q, v)...)
}

// reportConstant reports a constant passed as, or stored into, the step
// of a difference quotient elsewhere.
func (c *checker) reportConstant(p *pending) {
	if c.said[p.node.Pos()] {
		return
	}
	c.said[p.node.Pos()] = true
	where := fmt.Sprintf("passed as %s to %s", p.u.Name, p.u.In)
	if p.u.Param < 0 {
		where = fmt.Sprintf("stored in field %s, read by %s", p.u.Name, p.u.In)
	}
	subject := fmt.Sprintf("fixed %s-difference step %s (%s)", p.u.Scheme, stepText(c.pass.TypesInfo, p.node, p.v.h, p.v.f), where)
	d := analysis.Diagnostic{Pos: p.node.Pos(), End: p.node.End(), Category: category(p.v), Message: message(subject, p.v)}
	if p.u.pos.IsValid() {
		d.Related = []analysis.RelatedInformation{{Pos: p.u.pos, Message: "the difference quotient taking this step"}}
	}
	fixes.Report(c.pass, d)
}

func category(v verdict) string {
	if v.bad || v.large {
		return catBadSize
	}
	return catUnscaled
}

// message completes a diagnostic whose subject names the step.
func message(subject string, v verdict) string {
	s := v.scheme
	advice := fmt.Sprintf("h = %s·max(1,|x|) ≈ %.3g·max(1,|x|)", s.root, s.optimal(v.f))
	if v.f.Eps != numeric.Float64.Eps && v.f.Eps != numeric.Float32.Eps {
		advice += fmt.Sprintf(" with eps the function's declared noise %.3g", v.f.Eps)
	}
	if v.large {
		return fmt.Sprintf("%s is too large for a derivative: truncation error ~%.2g at this step for f and its derivatives of unit size, against ~%.2g at %s (%s)",
			subject, s.truncation(v.h), v.errOpt, advice, v.f.Name)
	}
	if v.bad && v.tol > 0 {
		against := fmt.Sprintf("is within a factor %d of the tolerance %.2g it is checked against", adequate, v.tol)
		if v.tol < v.errH {
			against = fmt.Sprintf("exceeds the tolerance %.2g it is checked against", v.tol)
		}
		return fmt.Sprintf("%s is too small for its check: its expected error ~%.2g %s, where %s errs by ~%.2g (%s, f and its derivatives of unit size)",
			subject, v.errH, against, advice, v.errOpt, v.f.Name)
	}
	if v.bad {
		return fmt.Sprintf("%s is too small: expected error ~%.2g at this step against ~%.2g at %s (%s, f and its derivatives of unit size)",
			subject, v.errH, v.errOpt, advice, v.f.Name)
	}
	return fmt.Sprintf("%s does not scale with x: x+h rounds to x for |x| ≥ %.3g in %s, where the difference vanishes; use %s",
		subject, v.absorbed, v.f.Name, advice)
}

// stepText shows a step as the source names it: "h = 1e-08" for a named
// step, the value alone for a literal, in the shortest form that reads
// back as the same value of format f.
func stepText(info *types.Info, e ast.Expr, h float64, f numeric.Format) string {
	bits := 64
	if f.Name == numeric.Float32.Name {
		bits = 32
	}
	val := strconv.FormatFloat(h, 'g', -1, bits)
	if id, ok := ast.Unparen(e).(*ast.Ident); ok && info.Uses[id] != nil {
		return id.Name + " = " + val
	}
	return val
}
