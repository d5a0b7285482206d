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
