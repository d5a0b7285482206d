package noise

import (
	"fmt"
	"image/color"
	"math"
	"path/filepath"
	"strings"

	"gonum.org/v1/plot"
	"gonum.org/v1/plot/plotter"
	"gonum.org/v1/plot/vg"
)

// drawCurve draws the error-against-step curve on log-log axes, with the
// recommended steps as vertical lines, to file (.svg or .png).
func drawCurve(file string, r *Result) error {
	ext := strings.ToLower(filepath.Ext(file))
	if ext != ".svg" && ext != ".png" {
		return fmt.Errorf("-plot %s: the file must end in .svg or .png", file)
	}
	p := plot.New()
	p.Title.Text = fmt.Sprintf("%s at x = %s: noise %.2g relative", r.Function, pointString(r.X), r.Relative)
	p.X.Label.Text = "step h"
	p.Y.Label.Text = "|difference quotient − best estimate|"
	p.X.Scale, p.Y.Scale = plot.LogScale{}, plot.LogScale{}
	p.X.Tick.Marker, p.Y.Tick.Marker = plot.LogTicks{Prec: 0}, plot.LogTicks{Prec: 0}
	p.Legend.Left = true
	fwd, cen, floor := points(r)
	for i, s := range []struct {
		name string
		xys  plotter.XYs
	}{{"forward difference", fwd}, {"central difference", cen}} {
		l, err := plotter.NewLine(s.xys)
		if err != nil {
			return fmt.Errorf("-plot: %v", err)
		}
		l.Color = plotColors[i]
		l.Width = vg.Points(1.5)
		p.Add(l)
		p.Legend.Add(s.name, l)
	}
	for i, s := range []struct {
		name string
		h    float64
		ok   bool
	}{{"forward step", r.Forward.H, r.Forward.Measured}, {"central step", r.Central.H, r.Central.Measured}} {
		if !s.ok {
			continue
		}
		v, err := plotter.NewLine(plotter.XYs{{X: s.h, Y: floor}, {X: s.h, Y: maxError(fwd, cen)}})
		if err != nil {
			return fmt.Errorf("-plot: %v", err)
		}
		v.Color = plotColors[i]
		v.Dashes = []vg.Length{vg.Points(4), vg.Points(3)}
		p.Add(v)
		p.Legend.Add(s.name, v)
	}
	if err := p.Save(7*vg.Inch, 4.5*vg.Inch, file); err != nil {
		return fmt.Errorf("-plot: %v", err)
	}
	return nil
}

// points returns the curves, with exact zeros and values that are not
// finite left out (a log axis cannot show them), and the floor of the axis.
func points(r *Result) (fwd, cen plotter.XYs, floor float64) {
	floor = math.Inf(1)
	add := func(xys plotter.XYs, h, e float64) plotter.XYs {
		if e > 0 && !math.IsInf(e, 0) {
			floor = min(floor, e)
			return append(xys, plotter.XY{X: h, Y: e})
		}
		return xys
	}
	for _, q := range r.Curve {
		fwd = add(fwd, q.H, q.ForwardError)
		cen = add(cen, q.H, q.CentralError)
	}
	return fwd, cen, floor
}

func maxError(curves ...plotter.XYs) float64 {
	m := 0.0
	for _, c := range curves {
		for _, q := range c {
			m = max(m, q.Y)
		}
	}
	return m
}

// plotColors draw the forward curve and step in blue, the central in orange.
var plotColors = []color.Color{color.RGBA{R: 0x1f, G: 0x77, B: 0xb4, A: 0xff}, color.RGBA{R: 0xff, G: 0x7f, B: 0x0e, A: 0xff}}
