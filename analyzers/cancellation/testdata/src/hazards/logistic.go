package hazards

import "math"

// chance is the logistic of a detector's score.
func chance(score float64) float64 { return 1 / (1 + math.Exp(-score)) }

// detectionLoss is the log-loss of a detector: a confident right answer
// (score 40) gives p = 1 exactly and log(1-p) = -Inf for the other label.
func detectionLoss(label, score float64) float64 {
	p := chance(score)
	return -(label*math.Log(p) + (1-label)*math.Log(1-p)) // want `math.Log\(σ\(z\)\) of the logistic σ\(z\) = 1/\(1\+e\^-z\) with z = score is -Inf for z below -709.8` `math.Log\(1-σ\(z\)\) of the logistic σ\(z\) = 1/\(1\+e\^-z\) with z = score is -Inf for z above 36.7, where σ\(z\) rounds to 1, though its value is about -z; use the softplus form`
}

// oddsShare writes the logistic as e/(1+e).
func oddsShare(z float64) float64 {
	if z > 700 {
		return 0
	}
	e := math.Exp(z)
	share := e / (1 + e)
	return math.Log(share) // want `math.Log\(σ\(z\)\) of the logistic`
}

// steering maps an error signal to (-1, 1) through a doubled logistic:
// for small signals 2/(1+e^-s) is near 1 and the difference keeps only
// log10(|s|/u) digits.
func steering(signal float64) float64 {
	return 2/(1+math.Exp(-signal)) - 1 // want `2σ\(z\)-1 of the logistic σ\(z\) = 1/\(1\+e\^-z\) with z = signal is math.Tanh\(z/2\), about ±z/2 near 0.*is 0 for \|z\| below about 2.2e-16; use math.Tanh\(z/2\)`
}

// brake does the same through the package's logistic, the other way round.
func brake(signal float64) float64 {
	return 1 - 2*chance(signal) // want `1-2σ\(z\) of the logistic σ\(z\) = 1/\(1\+e\^-z\) is -math.Tanh\(z/2\)`
}
