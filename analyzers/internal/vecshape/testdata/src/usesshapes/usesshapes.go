// Package usesshapes builds on package shapes: what a function of its
// own does with shapes' functions is learned through their facts.
package usesshapes

import "shapes"

func Toward(p shapes.P) shapes.P { return p.Heading() } // want Toward:"direction of inputs 0, 0"

func Agree(p, q shapes.P) float64 { return shapes.Mix(p, q) } // want Agree:"dot product of inputs 0, 1"

func Angle(p, q shapes.P) float64 { return shapes.Spread(p, q) } // want Angle:"cosine of inputs 0, 1"
