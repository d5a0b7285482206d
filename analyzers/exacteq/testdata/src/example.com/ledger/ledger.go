// Package ledger keeps the levels of storage tanks.
package ledger

// Tank is a storage tank: its level and its steady inflow per hour.
type Tank struct{ Level, Rate float64 }

// Project hands each tank's level after h hours of steady flow to visit.
func Project(ts []Tank, h float64, visit func(i int, level float64)) {
	for i, t := range ts {
		visit(i, t.Level+t.Rate*h)
	}
}

// Forecast hands each tank's level a day ahead to visit.
func Forecast(ts []Tank, visit func(i int, level float64)) { Project(ts, 24, visit) }

// Each hands each tank's level, as stored, to visit.
func Each(ts []Tank, visit func(i int, level float64)) {
	for i, t := range ts {
		visit(i, t.Level)
	}
}
