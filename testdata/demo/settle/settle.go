// Package settle computes Quillmere Brook's monthly settlement with the
// (fictional) regional buyer of its electricity.
//
// Comments starting "planted" mark a hazard put there on purpose, with the
// analyzer that reports it; comments starting "idiom" mark code that is
// right and must stay silent.
package settle

import "math"

// Availability returns the fraction of the month the turbine ran.
func Availability(minutesRun, minutesInMonth int) float64 {
	return float64(minutesRun / minutesInMonth) // planted (intdiv): Go drops the fraction of the quotient, so this is 0 for any month short of full running
}

// ContinuousRate converts the contract's per-minute price escalation, about
// 4e-8 (2% a year), to a continuous rate.
func ContinuousRate(perMinute float64) float64 {
	return math.Log(1 + perMinute) // planted (cancellation): 1+x rounds away about half of x's digits; math.Log1p(x) keeps them
}

// Reconciled reports whether the export meter agrees with the turbine log:
// the meter readings are in kWh, the log holds the mean power of each
// interval in kW.
func Reconciled(meterStart, meterEnd float64, powerKW []float64, dtHours float64) bool {
	metered := meterEnd - meterStart
	logged := 0.0
	for _, p := range powerKW {
		logged += p * dtHours
	}
	return metered == logged // planted (exacteq, computed): both sides carry rounding error
}

// Instalment returns the level monthly payment that repays the turbine loan
// of principal p at monthly rate r over n months.
func Instalment(p, r float64, n int) float64 {
	if r == 0 { // idiom: exact zero before dividing; the formula below is 0/0 there
		return p / float64(n)
	}
	return p * r / (1 - math.Pow(1+r, -float64(n))) // planted (cancellation): (1+r)^-n is near 1 for a small rate, and 1 minus it keeps only the power's rounding error
}

// Share returns a member's share of the month's revenue.
func Share(revenue, fraction float64) float64 {
	if fraction == 1 { // idiom: a parameter compared with an exact sentinel
		return revenue
	}
	return revenue * fraction
}

// Capped returns the payment capped at limit; an infinite limit means none.
func Capped(payment, limit float64) float64 {
	if limit == math.Inf(1) { // idiom: infinity is exact
		return payment
	}
	return math.Min(payment, limit)
}

// BreakEvenRate finds, by bisection, the monthly rate at which the loan's
// instalment equals budget; it assumes Instalment(p, 0, n) <= budget.
func BreakEvenRate(p float64, n int, budget float64) float64 {
	lo, hi := 0.0, 1.0
	for {
		m := lo + (hi-lo)/2
		if m == lo || m == hi { // idiom: no float left between lo and hi, the bisection is done
			return m
		}
		if Instalment(p, m, n) > budget {
			hi = m
		} else {
			lo = m
		}
	}
}

// Ledger holds what the cooperative owes each member, in euros: the running
// sum of the member's monthly shares.
type Ledger struct {
	Owed []float64
}

// Credit books a member's share of one month's revenue.
func (l *Ledger) Credit(member int, revenue, fraction float64) {
	l.Owed[member] += Share(revenue, fraction)
}

// PaidUp reports whether the transfers made to a member clear what the
// ledger says the cooperative owes.
func (l *Ledger) PaidUp(member int, transfers []float64) bool {
	paid := 0.0
	for _, t := range transfers {
		paid += t
	}
	return paid == l.Owed[member] // planted (exacteq, computed, stored field): credits of 100.01 and 134.26 leave 234.26999999999998 owed, so one transfer of 234.27 never clears it
}
