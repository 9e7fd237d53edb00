package compounds

import (
	"math"
	"slices"
	"testing"

	"github.com/google/go-cmp/cmp"

	"gibbsheet/engine/thermo"
)

// TestSpecialIDs: the IDs the engine relies on (api.md) are in the built-in library.
func TestSpecialIDs(t *testing.T) {
	for _, id := range []string{"H2O", "H+", "ATP", "ADP", "AMP", "GTP", "GDP", "GMP", "UTP", "UDP", "UMP",
		"CTP", "CDP", "CMP", "ITP", "IDP", "IMP", "Pi", "PPi", "NAD+", "NADH", "NADP+", "NADPH", "FAD",
		"FADH2", "ubiquinone", "ubiquinol", "CoA", "CO2"} {
		if c := Builtin().Lookup(id); c == nil || c.ID != id {
			t.Errorf("Lookup(%q) = %v", id, c)
		}
	}
}

// TestBuiltinData: every built-in compound transforms to a finite ΔfG'° over the model's range, and its
// formula is printed in normal (Hill) form in the data.
func TestBuiltinData(t *testing.T) {
	for _, c := range Builtin().All() {
		f, _ := ParseFormula(c.Formula)
		if f.String() != c.Formula {
			t.Errorf("%s: formula %q not in Hill order (%s)", c.ID, c.Formula, f)
		}
		for _, cond := range []thermo.Conditions{
			{PH: thermo.MinReliablePH, IonicStrength: 0, PMg: math.Inf(1), Temperature: thermo.MinReliableTemperature},
			{PH: thermo.MaxReliablePH, IonicStrength: thermo.MaxIonicStrength, PMg: 2, Temperature: thermo.MaxReliableTemperature},
		} {
			g, err := thermo.ReactantDfG0Prime(c.Species, cond)
			if err != nil || math.IsNaN(g) || math.IsInf(g, 0) {
				t.Errorf("%s at %+v: %v, %v", c.ID, cond, g, err)
			}
		}
	}
}

func TestLookup(t *testing.T) {
	l := Builtin()
	for _, tc := range []struct{ in, id string }{
		{"ATP", "ATP"}, {"atp", "ATP"}, {"  adenosine   triphosphate ", "ATP"},
		{"orthophosphate", "Pi"}, {"Phosphate", "Pi"}, {"pyrophosphate", "PPi"}, {"diphosphate", "PPi"},
		{"NAD+", "NAD+"}, {"nadh", "NADH"}, {"coenzyme A", "CoA"}, {"PEP", "PEP"},
		{"phosphoenolpyruvate", "PEP"}, {"OAA", "oxaloacetate"}, {"D-glucose 6-phosphate", "G6P"},
		{"glucose 6-phosphate", "G6P"}, {"FBP", "FBP"}, {"fructose 1,6-bisphosphate", "FBP"},
		{"DHAP", "DHAP"}, {"GAP", "GAP"}, {"glyceraldehyde 3-phosphate", "GAP"}, {"1,3-BPG", "1,3-BPG"},
		{"3PG", "3PG"}, {"2PG", "2PG"}, {"alpha-ketoglutarate", "2-oxoglutarate"},
		{"α-ketoglutarate", "2-oxoglutarate"}, {"AKG", "2-oxoglutarate"}, {"acetyl-CoA", "acetyl-CoA"},
		{"carbon dioxide", "CO2"}, {"bicarbonate", "CO2"}, {"HCO3-", "CO2"}, {"ammonia", "NH3"},
		{"ammonium", "NH3"}, {"NH4+", "NH3"}, {"QH2", "ubiquinol"}, {"Q", "ubiquinone"},
		{"D-glucose", "glucose"}, {"adenosine 5'-triphosphate", "ATP"}, {"adenosine 5′-triphosphate", "ATP"},
		{"adenosine 5’-triphosphate", "ATP"},
	} {
		if c := l.Lookup(tc.in); c == nil || c.ID != tc.id {
			t.Errorf("Lookup(%q) = %v, want %s", tc.in, c, tc.id)
		}
	}
	for _, s := range []string{"", "ATPP", "glucose 7-phosphate", "adenosine"} {
		if c := l.Lookup(s); c != nil {
			t.Errorf("Lookup(%q) = %s, want nil", s, c.ID)
		}
	}
}

func TestSuggest(t *testing.T) {
	l := Builtin()
	for _, tc := range []struct {
		in   string
		n    int
		want []string
	}{
		{"pyruvat", 3, []string{"pyruvate"}},
		{"glucoes", 1, []string{"glucose"}}, // transposition counts 1
		{"NADHH", 1, []string{"NADH"}},      // ID preferred
		{"fumarat", 2, []string{"fumarate"}},
		{"xyzzy plugh", 3, []string{}}, // nothing near
		{"ATP", 0, nil},
	} {
		got := l.Suggest(tc.in, tc.n)
		if d := cmp.Diff(tc.want, got); d != "" {
			t.Errorf("Suggest(%q, %d) (-want +got):\n%s", tc.in, tc.n, d)
		}
	}
	// At most n, each compound once, all within the distance limit.
	got := l.Suggest("ADP", 5)
	if len(got) > 5 || !slices.Contains(got, "ADP") || got[0] != "ADP" {
		t.Errorf("Suggest(ADP, 5) = %v", got)
	}
	seen := map[*Compound]bool{}
	for _, s := range got {
		c := l.Lookup(s)
		if seen[c] {
			t.Errorf("Suggest(ADP, 5) = %v repeats %s", got, c.ID)
		}
		seen[c] = true
	}
}

func TestOSADistance(t *testing.T) {
	// Textbook cases of the optimal-string-alignment distance (common practice, no source):
	// kitten→sitting 3, CA→AC 1 (transposition), CA→ABC 3 (OSA, unlike unrestricted Damerau–Levenshtein 2).
	for _, tc := range []struct {
		a, b string
		d    int
	}{{"kitten", "sitting", 3}, {"ca", "ac", 1}, {"ca", "abc", 3}, {"", "abc", 3}, {"α-kg", "a-kg", 1}, {"same", "same", 0}} {
		if d := osaDistance([]rune(tc.a), []rune(tc.b)); d != tc.d {
			t.Errorf("osaDistance(%q, %q) = %d, want %d", tc.a, tc.b, d, tc.d)
		}
	}
}
