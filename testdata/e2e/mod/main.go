// Command kilnlab prints a sample firing plan.
package main

import (
	"fmt"

	"kilnlab/ramp"
	"kilnlab/units"
)

func main() {
	for _, c := range ramp.Plan(20, 1220) {
		fmt.Printf("%.0f°C\n", c)
	}
	fmt.Println(units.Celsius(2232), ramp.Check(900), ramp.SoakDue(0.1, 0.2))
}
