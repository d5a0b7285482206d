// Command runfix prints each naive form at an argument where it loses
// every digit, so a test can run it before and after roundoff's fixes.
package main

import (
	"fmt"
	"math"
)

func main() {
	x, h, t, big, a := 1e-17, 1e-10, 1e-8, 1e200, 1000.0
	r, n, s, c := 1e-12, 3.0, -1e9, 1-0x1p-40
	fmt.Printf("log1p %.17g\n", math.Log(1+x))                         // want `math.Log\(1\+x\) returns 0`
	fmt.Printf("expm1 %.17g\n", math.Exp(h)-1)                         // want `math.Exp\(x\)-1 with x = h returns 0`
	fmt.Printf("cosm1 %.17g\n", 1-math.Cos(t))                         // want `1-math.Cos\(x\) with x = t returns 0`
	fmt.Printf("secm1 %.17g\n", 1/math.Cos(t)-1)                       // want `1/math.Cos\(x\)-1 with x = t returns 0`
	fmt.Printf("logcos %.17g\n", math.Log(math.Cos(t)))                // want `math.Log\(math.Cos\(x\)\) with x = t returns 0`
	fmt.Printf("hypot %.17g\n", math.Sqrt(big*big+big*big))            // want `math.Sqrt\(x\*x\+y\*y\) with x = big, y = big overflows`
	fmt.Printf("logsumexp %.17g\n", math.Log(math.Exp(a)+math.Exp(a))) // want `math.Log\(math.Exp\(a\)\+math.Exp\(b\)\) with b = a overflows`
	fmt.Printf("log10p %.17g\n", math.Log10(1+x))                      // want `math.Log10\(1\+x\) returns 0`
	fmt.Printf("powm1 %.17g\n", 1-math.Pow(1-r, n))                    // want `1-math.Pow\(a, b\) with a = 1 - r, b = n returns 0`
	fmt.Printf("asinh %.17g\n", math.Log(s+math.Sqrt(s*s+1)))          // want `math.Log\(x \+ math.Sqrt\(x\*x\+1\)\) with x = s cancels`
	fmt.Printf("squares %.17g\n", math.Sqrt(1-c*c))                    // want `a\*a - b\*b with a = 1, b = c loses`
	fmt.Printf("softplus %.17g\n", math.Log(1+math.Exp(a)))            // want `math.Log\(1\+math.Exp\(y\)\) with y = a overflows`
}
