package compounds_test

import (
	"fmt"
	"testing"

	"gibbsheet/engine/thermo"
)

func TestZZScratch(t *testing.T) {
	c := albertyMg
	for _, id := range []string{"G6P", "H2O", "NADP+", "NADPH", "NAD+", "NADH", "CO2", "NH3", "urea", "Pi", "ATP", "ADP", "AMP", "PPi", "aspartate", "fumarate", "CoA", "acetyl-CoA", "ubiquinone", "ubiquinol", "FAD", "FADH2"} {
		fmt.Printf("%s %.3f\n", id, dfG(t, id, c))
	}
	fmt.Printf("urea hydrolysis %.3f\n", drG(t, c, term{"urea", -1}, term{"H2O", -1}, term{"CO2", 1}, term{"NH3", 2}))
	fmt.Printf("NADP E %.4f\n", -(dfG(t, "NADPH", c)-dfG(t, "NADP+", c))/(2*thermo.Faraday))
	fmt.Printf("NAD E %.4f\n", -(dfG(t, "NADH", c)-dfG(t, "NAD+", c))/(2*thermo.Faraday))
	fmt.Printf("RT %.5f\n", c.RT())
	for _, s := range []struct{ z, nh int }{{-2, 9}, {-3, 10}, {-2, 9}, {-2, 2}, {1, 13}, {0, 13}, {1, 15}, {-1, 17}} {
		fmt.Printf("offset z=%d nH=%d: %.4f\n", s.z, s.nh, thermo.SpeciesDfG0Prime(thermo.Species{Charge: s.z, NH: s.nh}, c))
	}
}
