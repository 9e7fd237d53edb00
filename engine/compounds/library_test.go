package compounds

import (
	"strings"
	"testing"

	"gibbsheet/engine/thermo"
)

func good(id string) Compound {
	return Compound{ID: id, Name: id + " name", Formula: "H2O", Source: "test",
		Species: []thermo.Species{{DfG0: -1, NH: 2}}}
}

func TestNewLibraryErrors(t *testing.T) {
	dupSyn := good("B")
	dupSyn.Synonyms = []string{"a  NAME"} // same as A's name after normalization
	noSource := good("C")
	noSource.Source = ""
	noFormula := good("D")
	noFormula.Formula = ""
	badFormula := good("E")
	badFormula.Formula = "H2Q"
	wrongH := good("F")
	wrongH.Formula = "H3O"
	noSpecies := good("G")
	noSpecies.Species = nil
	withMg := good("M")
	withMg.Formula = "H2MgO"
	for _, tc := range []struct {
		cs  []Compound
		msg string
	}{
		{[]Compound{good("A"), good("A")}, `name "A" already used by compound 1 "A"`},
		{[]Compound{good("A"), dupSyn}, `name "a  NAME" already used by compound 1 "A"`},
		{[]Compound{noSource}, "missing source"},
		{[]Compound{noFormula}, "empty formula"},
		{[]Compound{badFormula}, `unknown element symbol "Q"`},
		{[]Compound{wrongH}, "no Mg-free species has nH = 3"},
		{[]Compound{noSpecies}, "no species"},
		{[]Compound{withMg}, "without magnesium"},
		{[]Compound{{Name: "x", Formula: "H2O", Source: "s", Species: good("").Species}}, "missing id"},
	} {
		_, err := NewLibrary(tc.cs)
		if err == nil || !strings.Contains(err.Error(), tc.msg) {
			t.Errorf("NewLibrary: %v, want error containing %q", err, tc.msg)
		}
	}
	// All problems at once.
	_, err := NewLibrary([]Compound{noSource, noSpecies, good("A"), good("A")})
	if err == nil || strings.Count(err.Error(), "\n") < 2 {
		t.Errorf("NewLibrary with three faults: %v", err)
	}
	// A compound may repeat its own ID as its name.
	self := good("X")
	self.Name = "x"
	if _, err := NewLibrary([]Compound{self}); err != nil {
		t.Errorf("own name repeated: %v", err)
	}
}

func TestLibraryCopies(t *testing.T) {
	cs := []Compound{good("A")}
	l, err := NewLibrary(cs)
	if err != nil {
		t.Fatal(err)
	}
	cs[0].Species[0].DfG0 = 99
	if l.Lookup("A").Species[0].DfG0 != -1 {
		t.Error("library shares species with its input")
	}
}
