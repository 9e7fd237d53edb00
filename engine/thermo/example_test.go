package thermo_test

import (
	"fmt"
	"math"

	"gibbsheet/engine/thermo"
)

// Water at pH 7, I = 0.25 M, 298.15 K (Alberty 2003 tabulates −155.66 kJ/mol).
func ExampleReactantDfG0Prime() {
	h := -285.83
	water := []thermo.Species{{DfG0: -237.19, DfH0: &h, Charge: 0, NH: 2}}
	c := thermo.Conditions{PH: 7, IonicStrength: 0.25, PMg: math.Inf(1), Temperature: 298.15}
	g, err := thermo.ReactantDfG0Prime(water, c)
	fmt.Printf("%.2f kJ/mol %v\n", g, err)
	fmt.Printf("N̄H = %.0f\n", thermo.MeanBoundH(water, c))
	// Output:
	// -155.66 kJ/mol <nil>
	// N̄H = 2
}
