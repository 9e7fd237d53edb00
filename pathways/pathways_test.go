package pathways_test

import (
	"encoding/json"
	"math"
	"math/big"
	"regexp"
	"testing"

	"github.com/google/go-cmp/cmp"

	"gibbsheet/engine"
	"gibbsheet/engine/compounds"
	"gibbsheet/engine/equation"
	"gibbsheet/pathways"
)

// evaluate returns the result document of a template.
func evaluate(t *testing.T, file string) (*engine.Result, *engine.Worksheet) {
	t.Helper()
	tpl, err := pathways.Get(file)
	if err != nil {
		t.Fatal(err)
	}
	out, err := engine.EvaluateJSON(tpl.Doc)
	if err != nil {
		t.Fatalf("%s: %v", file, err)
	}
	var res engine.Result
	if err := json.Unmarshal(out, &res); err != nil {
		t.Fatalf("%s: result: %v", file, err)
	}
	ws, _, err := engine.Decode(tpl.Doc)
	if err != nil {
		t.Fatal(err)
	}
	return &res, ws
}

// TestTemplatesEvaluate checks that every template evaluates completely: no document errors, no row errors,
// no element-balance warnings, no unknown fields, and totals that could be computed.
func TestTemplatesEvaluate(t *testing.T) {
	all, err := pathways.All()
	if err != nil {
		t.Fatal(err)
	}
	for _, tpl := range all {
		res, _ := evaluate(t, tpl.File)
		for _, e := range res.Errors {
			t.Errorf("%s: %s: %s", tpl.File, e.Path, e.Message)
		}
		for _, w := range res.Warnings {
			t.Errorf("%s: document warning %s at %s: %s", tpl.File, w.Code, w.Path, w.Message)
		}
		for _, row := range res.Rows {
			for _, e := range row.Errors {
				t.Errorf("%s, row %s: %s (column %d)", tpl.File, row.ID, e.Message, e.Column)
			}
			for _, w := range row.Warnings {
				switch w.Code {
				case "unbalanced", "balance-unchecked", "compartments-unpaired":
					t.Errorf("%s, row %s: %s: %s", tpl.File, row.ID, w.Code, w.Message)
				}
			}
		}
		if res.Total.DG0 == nil || res.Total.DG == nil {
			t.Errorf("%s: total ΔrG'° or ΔrG' not computed", tpl.File)
		}
	}
}

// multiset turns a reaction into signed coefficients (products positive) keyed by compound and compartment.
// Names resolve through the library so that synonyms compare equal; names the library does not know (the
// worksheet's own compounds) stay as written. Untagged names are in the cytosol, "c". When erase is set,
// compartments are merged and H+ is dropped, giving the reaction as a textbook writes it without membranes.
func multiset(t *testing.T, text string, erase bool) map[string]string {
	t.Helper()
	eq, err := equation.Parse(text)
	if err != nil {
		t.Fatalf("%q: %v", text, err)
	}
	sum := map[string]*big.Rat{}
	add := func(terms []equation.Term, sign int64) {
		for _, term := range terms {
			id := term.Name
			if c := compounds.Builtin().Lookup(term.Name); c != nil {
				id = c.ID
			}
			comp := term.Compartment
			if comp == "" {
				comp = engine.DefaultCompartment
			}
			if erase {
				if id == "H+" {
					continue
				}
				comp = "any"
			}
			key := id + "[" + comp + "]"
			if sum[key] == nil {
				sum[key] = new(big.Rat)
			}
			sum[key].Add(sum[key], big.NewRat(sign*term.Coef.Num, term.Coef.Den))
		}
	}
	add(eq.Left, -1)
	add(eq.Right, 1)
	out := map[string]string{}
	for k, v := range sum {
		if v.Sign() != 0 {
			out[k] = v.RatString()
		}
	}
	return out
}

// Textbook net equations with H+ left out: at fixed pH the engine drops H+ from every equation that does not
// carry it across a membrane (Alberty 2003, §4.1), so it cannot appear in a net reaction within one
// compartment. CO2 is total CO2 (the textbook's HCO3- is CO2 + H2O).
var textbookNet = []struct {
	file, want string
}{
	// Lehninger Principles of Biochemistry, overall equation of glycolysis (from memory):
	// glucose + 2 NAD+ + 2 ADP + 2 Pi → 2 pyruvate + 2 NADH + 2 H+ + 2 ATP + 2 H2O.
	{"glycolysis.json", "glucose + 2 NAD+ + 2 ADP + 2 Pi = 2 pyruvate + 2 NADH + 2 ATP + 2 H2O"},
	// Lehninger, lactic acid fermentation (from memory): glucose + 2 ADP + 2 Pi → 2 lactate + 2 ATP + 2 H2O.
	{"lactate-fermentation.json", "glucose + 2 ADP + 2 Pi = 2 lactate + 2 ATP + 2 H2O"},
	// Lehninger, alcohol fermentation (from memory): glucose + 2 ADP + 2 Pi → 2 ethanol + 2 CO2 + 2 ATP + 2 H2O.
	{"ethanol-fermentation.json", "glucose + 2 ADP + 2 Pi = 2 ethanol + 2 CO2 + 2 ATP + 2 H2O"},
	// Lehninger, net equation of one turn of the citric acid cycle (from memory): acetyl-CoA + 3 NAD+ + FAD +
	// GDP + Pi + 2 H2O → 2 CO2 + CoA + 3 NADH + FADH2 + GTP + 2 H+; the template's complex II reduces
	// ubiquinone, so ubiquinone/ubiquinol stand for FAD/FADH2 (stated in the template's notes).
	{"tca-cycle.json", "acetyl-CoA + 3 NAD+ + ubiquinone + GDP + Pi + 2 H2O = 2 CO2 + CoA + 3 NADH + ubiquinol + GTP"},
	// Lehninger, net equation of the glyoxylate cycle (from memory): 2 acetyl-CoA + NAD+ + 2 H2O → succinate +
	// 2 CoA + NADH + H+.
	{"glyoxylate-shunt.json", "2 acetyl-CoA + NAD+ + 2 H2O = succinate + 2 CoA + NADH"},
	// Lehninger, oxidative pentose phosphate pathway (from memory): glucose 6-phosphate + 2 NADP+ + H2O →
	// ribulose 5-phosphate + CO2 + 2 NADPH + 2 H+.
	{"pentose-phosphate-oxidative.json", "glucose 6-phosphate + 2 NADP+ + H2O = ribulose 5-phosphate + CO2 + 2 NADPH"},
	// Berg, Tymoczko and Stryer, Biochemistry, glycogen synthesis (from memory): glucose 6-phosphate + UTP +
	// glycogen(n) + H2O → glycogen(n+1) + UDP + 2 Pi; the library's glycogen is one residue.
	{"glycogen-synthesis.json", "glucose 6-phosphate + UTP + H2O = glycogen + UDP + 2 Pi"},
	// Berg, Tymoczko and Stryer, Biochemistry, stoichiometry of urea synthesis (from memory): CO2 + NH4+ +
	// 3 ATP + aspartate + 2 H2O → urea + 2 ADP + 2 Pi + AMP + PPi + fumarate.
	{"urea-cycle.json", "CO2 + NH4+ + 3 ATP + aspartate + 2 H2O = urea + 2 ADP + 2 Pi + AMP + PPi + fumarate"},
	// Lehninger, one pass of β-oxidation of palmitoyl-CoA (from memory): palmitoyl-CoA + CoA + FAD + NAD+ +
	// H2O → myristoyl-CoA + acetyl-CoA + FADH2 + NADH + H+, with ubiquinone/ubiquinol for FAD/FADH2 (the
	// template's dehydrogenase passes its electrons to ubiquinone through ETF, stated in its notes).
	{"beta-oxidation-round.json", "palmitoyl-CoA + CoA + ubiquinone + NAD+ + H2O = myristoyl-CoA + acetyl-CoA + ubiquinol + NADH"},
	// Lehninger, sum of the biosynthetic reactions from pyruvate to glucose (from memory): 2 pyruvate + 4 ATP +
	// 2 GTP + 2 NADH + 2 H+ + 4 H2O → glucose + 4 ADP + 2 GDP + 6 Pi + 2 NAD+. Lehninger's pyruvate
	// carboxylase takes HCO3- and its PEPCK releases CO2; on the CO2 basis pyruvate carboxylase consumes
	// CO2 + H2O, so two more H2O are consumed: 6 H2O (the textbook's 4 do not balance oxygen on this basis).
	// Compartments are merged here; their placement is checked in TestCompartmentNet.
	{"gluconeogenesis.json", gluconeogenesisNet},
	{"gluconeogenesis-mitochondrial-pepck.json", gluconeogenesisNet},
	// Lehninger, glycerol 3-phosphate shuttle (from memory): cytosolic NADH reduces the FAD of the
	// mitochondrial dehydrogenase, which reduces ubiquinone: NADH + H+ + Q → NAD+ + QH2.
	{"glycerol-phosphate-shuttle.json", "NADH + ubiquinone = NAD+ + ubiquinol"},
	// Lehninger, malate–aspartate shuttle (from memory): NADH moves from the cytosol into the matrix; the
	// compartments and the proton are checked in TestCompartmentNet.
	{"malate-aspartate-shuttle.json", "NADH + NAD+ = NAD+ + NADH"},
}

const gluconeogenesisNet = "2 pyruvate + 4 ATP + 2 GTP + 2 NADH + 6 H2O = glucose + 4 ADP + 2 GDP + 6 Pi + 2 NAD+"

// TestTextbookNetReactions compares each template's net reaction with the textbook's, compartments merged.
func TestTextbookNetReactions(t *testing.T) {
	seen := map[string]bool{}
	for _, tc := range textbookNet {
		seen[tc.file] = true
		res, _ := evaluate(t, tc.file)
		got := multiset(t, res.Total.Equation, true)
		if diff := cmp.Diff(multiset(t, tc.want, true), got); diff != "" {
			t.Errorf("%s: net %q differs from the textbook (-want +got):\n%s", tc.file, res.Total.Equation, diff)
		}
	}
	all, _ := pathways.All()
	for _, tpl := range all {
		if !seen[tpl.File] {
			t.Errorf("%s: no textbook net reaction to check it against", tpl.File)
		}
	}
}

// TestCompartmentNet checks where the compounds of the two gluconeogenesis routes end up. The placements
// follow the textbook location of each enzyme (Lehninger, figure of the first bypass, from memory):
// pyruvate carboxylase and, in the second route, PEPCK in the matrix; everything else in the cytosol. The
// malate route spends matrix NADH, consumes CO2 in the matrix and releases it in the cytosol, and its
// pyruvate carrier moves 2 H+ in; in the PEPCK route the CO2 and the protons stay balanced and the NADH is
// cytosolic. Both routes take 2 Pi into the matrix on the dicarboxylate carrier.
func TestCompartmentNet(t *testing.T) {
	for _, tc := range []struct{ file, want string }{
		{"gluconeogenesis.json", "2 pyruvate + 2 H+ + 2 CO2[m] + 2 ATP[m] + 2 H2O[m] + 2 NADH[m] + 2 GTP + 4 H2O + " +
			"2 ATP = 2 H+[m] + 2 ADP[m] + 4 Pi[m] + 2 NAD+[m] + 2 Pi + 2 GDP + 2 CO2 + 2 ADP + glucose"},
		{"gluconeogenesis-mitochondrial-pepck.json", "2 pyruvate + 2 ATP[m] + 2 H2O[m] + 2 GTP[m] + 4 H2O + 2 ATP + " +
			"2 NADH = 2 ADP[m] + 4 Pi[m] + 2 GDP[m] + 2 Pi + 2 ADP + 2 NAD+ + glucose"},
		// Lehninger's figure of the shuttle with one H+ entering with glutamate on the aspartate–glutamate
		// carrier (LaNoue and Schoolwerth, Annu. Rev. Biochem. 48 (1979) 871; from memory).
		{"malate-aspartate-shuttle.json", "NADH + NAD+[m] + H+ = NAD+ + NADH[m] + H+[m]"},
	} {
		res, _ := evaluate(t, tc.file)
		if diff := cmp.Diff(multiset(t, tc.want, false), multiset(t, res.Total.Equation, false)); diff != "" {
			t.Errorf("%s: net %q (-want +got):\n%s", tc.file, res.Total.Equation, diff)
		}
	}
}

// costTol is the tolerance for budget totals, which are sums of small exact numbers.
const costTol = 1e-9

// TestBudgets compares the cost of each pathway with the textbook's count, in the engine's values (ATP 2,
// ADP 1, AMP 0 phosphate equivalents, the same for GTP and UTP; PPi 0; one reduced carrier each for NADH,
// NADPH, FADH2 and ubiquinol; common practice, see engine/budget.go). Negative is a yield.
func TestBudgets(t *testing.T) {
	for _, tc := range []struct {
		file                        string
		phosphate, reducing, proton float64
	}{
		// 2 ATP and 2 NADH per glucose (Lehninger).
		{"glycolysis.json", -2, -2, 0},
		// 2 ATP per glucose; the NADH is spent on pyruvate (Lehninger).
		{"lactate-fermentation.json", -2, 0, 0},
		{"ethanol-fermentation.json", -2, 0, 0},
		// One turn: 3 NADH, 1 FADH2 (here ubiquinol), 1 GTP (Lehninger).
		{"tca-cycle.json", -1, -4, 0},
		// 1 NADH per 2 acetyl-CoA (Lehninger).
		{"glyoxylate-shunt.json", 0, -1, 0},
		// 2 NADPH per glucose 6-phosphate (Lehninger).
		{"pentose-phosphate-oxidative.json", 0, -2, 0},
		// One UTP to UDP per residue: 1 ATP equivalent, "only one phosphoryl group is spent to incorporate
		// glucose 6-phosphate into glycogen" (Berg, Tymoczko and Stryer, from memory). UTP (2) → UDP (1),
		// and the diphosphate that UTP also gives up is hydrolysed in its own row to 2 Pi (0), so it is not
		// counted a second time. (Counting the diphosphate's bond as a further ATP would give 2.)
		{"glycogen-synthesis.json", 1, 0, 0},
		// Four phosphoanhydride bonds per urea: 2 ATP → 2 ADP and ATP → AMP + PPi (Lehninger; Berg, Tymoczko
		// and Stryer).
		{"urea-cycle.json", 4, 0, 0},
		// One round: 1 NADH and 1 FADH2 (here ubiquinol) (Lehninger).
		{"beta-oxidation-round.json", 0, -2, 0},
		// 4 ATP + 2 GTP and 2 NADH per glucose (Lehninger). In the malate route the NADH is matrix NADH: the
		// two malate dehydrogenase rows move it to the cytosol, spending nothing more (the cytosolic NADH they
		// make is used by glyceraldehyde-3-phosphate dehydrogenase). Its pyruvate carrier lets 2 H+ into the
		// matrix down their gradient; in the PEPCK route they leave again with phosphoenolpyruvate.
		{"gluconeogenesis.json", 6, 2, 2},
		{"gluconeogenesis-mitochondrial-pepck.json", 6, 2, 0},
		// The shuttles move a reduced carrier without spending one (Lehninger); the malate–aspartate shuttle
		// lets one proton into the matrix (LaNoue and Schoolwerth 1979, from memory).
		{"glycerol-phosphate-shuttle.json", 0, 0, 0},
		{"malate-aspartate-shuttle.json", 0, 0, 1},
	} {
		res, _ := evaluate(t, tc.file)
		c := res.Total.Cost
		if math.Abs(c.Phosphate-tc.phosphate) > costTol || math.Abs(c.Reducing-tc.reducing) > costTol ||
			math.Abs(c.Protons-tc.proton) > costTol {
			t.Errorf("%s: cost phosphate %v, reducing %v, protons %v; textbook %v, %v, %v", tc.file,
				c.Phosphate, c.Reducing, c.Protons, tc.phosphate, tc.reducing, tc.proton)
		}
	}
}

// TestFarFromEquilibrium checks that the steps textbooks name as far from equilibrium in cells come out
// downhill at each template's concentrations.
func TestFarFromEquilibrium(t *testing.T) {
	for _, tc := range []struct {
		file string
		rows []string
	}{
		// Lehninger, table of ΔG of the glycolytic reactions in erythrocytes (from memory): hexokinase −33.5,
		// PFK-1 −22.2, pyruvate kinase −16.7 kJ/mol; the rest within a few kJ/mol of zero. Pyruvate
		// decarboxylase is irreversible (Lehninger).
		{"glycolysis.json", []string{"hk", "pfk", "pk"}},
		{"lactate-fermentation.json", []string{"hk", "pfk", "pk"}},
		{"ethanol-fermentation.json", []string{"hk", "pfk", "pk", "pdc"}},
		// Citrate synthase, isocitrate dehydrogenase and 2-oxoglutarate dehydrogenase are the cycle's
		// irreversible, regulated steps (Lehninger; Berg, Tymoczko and Stryer; from memory).
		{"tca-cycle.json", []string{"cs", "idh", "ogdh"}},
		// Citrate synthase and malate synthase cleave a thioester (Lehninger).
		{"glyoxylate-shunt.json", []string{"cs", "ms"}},
		// The lactonase and the decarboxylating dehydrogenase; glucose-6-phosphate dehydrogenase is checked
		// together with the lactonase below (the template's notes say why).
		{"pentose-phosphate-oxidative.json", []string{"pgls", "pgd"}},
		// Glycogen synthase and the pyrophosphatase (Lehninger; Berg, Tymoczko and Stryer).
		{"glycogen-synthesis.json", []string{"ppa", "gys"}},
		// CPS I, ornithine carbamoyltransferase and arginase (Lehninger; Berg, Tymoczko and Stryer).
		{"urea-cycle.json", []string{"cps1", "otc", "arg"}},
		// Thiolase pulls the round (Lehninger).
		{"beta-oxidation-round.json", []string{"thl"}},
		// The bypass reactions (Lehninger, gluconeogenesis: pyruvate carboxylase, PEPCK, FBPase-1 and
		// glucose-6-phosphatase are the irreversible steps).
		{"gluconeogenesis.json", []string{"pc", "pepck", "fbp", "g6pc"}},
		{"gluconeogenesis-mitochondrial-pepck.json", []string{"pc", "pepckm", "fbp", "g6pc"}},
		// The shuttles run one way: the quinone-reducing dehydrogenase and the electrogenic aspartate–glutamate
		// exchange (Lehninger; LaNoue and Schoolwerth 1979; from memory).
		{"glycerol-phosphate-shuttle.json", []string{"gpd2"}},
		{"malate-aspartate-shuttle.json", []string{"agc"}},
	} {
		res, _ := evaluate(t, tc.file)
		status := map[string]string{}
		for _, row := range res.Rows {
			status[row.ID] = row.Status
		}
		for _, id := range tc.rows {
			if status[id] != engine.StatusDownhill {
				t.Errorf("%s, row %s: status %q, want downhill", tc.file, id, status[id])
			}
		}
	}
	// Glucose-6-phosphate dehydrogenase with the lactonase: together the oxidation of glucose 6-phosphate to
	// 6-phosphogluconate is irreversible (Lehninger; Berg, Tymoczko and Stryer).
	res, _ := evaluate(t, "pentose-phosphate-oxidative.json")
	var sum float64
	for _, row := range res.Rows {
		if row.ID == "g6pdh" || row.ID == "pgls" {
			sum += row.Times * *row.DG
		}
	}
	if sum >= -res.Conditions.NearEquilibrium {
		t.Errorf("glucose-6-phosphate dehydrogenase + lactonase: ΔrG' = %.1f kJ/mol, want downhill", sum)
	}
}

// perLine matches a line of notes that states the unit a worksheet is written per.
var perLine = regexp.MustCompile(`(?m)^Per [^\n]+`)

// TestStatedUnit checks that every template says per what it is written, as the notes' second line.
func TestStatedUnit(t *testing.T) {
	all, _ := pathways.All()
	for _, tpl := range all {
		_, ws := evaluate(t, tpl.File)
		if !perLine.MatchString(ws.Notes) {
			t.Errorf("%s: the notes do not start a line with \"Per \" stating the unit", tpl.File)
		}
	}
}

// TestShuttles checks what the two NADH shuttles are for. The glycerol 3-phosphate shuttle delivers
// cytosolic NADH as ubiquinol, 1.5 ATP instead of 2.5 (Lehninger, from memory): total cost 1 ATP with the
// engine's P/O values. The malate–aspartate shuttle carries NADH from the cytosol (free NAD+/NADH about 700)
// into the matrix (about 8; Williamson, Lund and Krebs 1967, from memory) and still runs forward, paid for
// by the proton that enters with glutamate (LaNoue and Schoolwerth 1979, from memory).
func TestShuttles(t *testing.T) {
	res, _ := evaluate(t, "glycerol-phosphate-shuttle.json")
	if got := res.Total.Cost.Total; math.Abs(got-1) > costTol {
		t.Errorf("glycerol 3-phosphate shuttle: total cost %v ATP, want 1 (2.5 − 1.5)", got)
	}
	res, _ = evaluate(t, "malate-aspartate-shuttle.json")
	if res.Total.DG == nil || *res.Total.DG >= -res.Conditions.NearEquilibrium {
		t.Errorf("malate–aspartate shuttle: net ΔrG' = %v kJ/mol, want downhill", res.Total.DG)
	}
}
