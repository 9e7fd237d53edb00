package equation_test

import (
	"fmt"
	"testing"

	"gibbsheet/engine/equation"
)

func Example() {
	e, err := equation.Parse("2 pyruvate[m] + 1/2 O2 -> 2 acetyl-CoA[m]  +  2 CO2[m]")
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Println(e)
	for _, t := range e.Left {
		fmt.Printf("%s: coefficient %v, compartment %q\n", t.Name, t.Coef, t.Compartment)
	}

	src := "glucose + 0 ATP = glucose 6-phosphate"
	_, err = equation.Parse(src)
	for _, x := range err.(equation.ErrorList) {
		fmt.Printf("column %d: %s\n", equation.Column(src, x.Pos), x.Msg)
	}
	// Output:
	// 2 pyruvate[m] + 0.5 O2 = 2 acetyl-CoA[m] + 2 CO2[m]
	// pyruvate: coefficient 2, compartment "m"
	// O2: coefficient 0.5, compartment ""
	// column 11: "0" is not a valid coefficient: coefficients must be positive
}

func BenchmarkParse(b *testing.B) {
	const src = "ATP + D-glucose 6-phosphate[c] + 1/2 O2 <=> ADP + 2 H+ + fructose 1,6-bisphosphate[c]"
	for b.Loop() {
		if _, err := equation.Parse(src); err != nil {
			b.Fatal(err)
		}
	}
}
