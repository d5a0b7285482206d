package hazards

import (
	"fmt"
	"strings"
)

func needsMath(a, b float64) string {
	if a+b == 0.3 { // want `exact == between a computed float64 value and 0.3`
		return strings.ToUpper(fmt.Sprint(a))
	}
	return ""
}
