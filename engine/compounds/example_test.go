package compounds_test

import (
	"fmt"
	"math"

	"gibbsheet/engine/compounds"
	"gibbsheet/engine/thermo"
)

func Example() {
	lib := compounds.Builtin()
	atp := lib.Lookup("adenosine triphosphate")
	c := thermo.Conditions{PH: 7, IonicStrength: 0.25, PMg: math.Inf(1), Temperature: 298.15}
	g, _ := thermo.ReactantDfG0Prime(atp.Species, c)
	fmt.Printf("%s %s: ΔfG'° = %.2f kJ/mol\n", atp.ID, atp.Formula, g)
	fmt.Println(lib.Suggest("pyruvat", 3))
	// Output:
	// ATP C10H12N5O13P3: ΔfG'° = -2292.50 kJ/mol
	// [pyruvate]
}

func ExampleParseFormula() {
	f, err := compounds.ParseFormula("CH3COOH")
	fmt.Println(f, err)
	_, err = compounds.ParseFormula("C6H12Q6")
	fmt.Println(err)
	// Output:
	// C2H4O2 <nil>
	// formula "C6H12Q6", column 6: unknown element symbol "Q"
}
