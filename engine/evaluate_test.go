package engine

import (
	"encoding/json"
	"fmt"
	"math"
	"math/rand/v2"
	"strings"
	"testing"

	"gibbsheet/engine/thermo"
)

// evaluate runs a worksheet given as JSON text through the public entry point.
func evaluate(t testing.TB, doc string) *Result {
	t.Helper()
	out, err := EvaluateJSON([]byte(doc))
	if err != nil {
		t.Fatalf("EvaluateJSON: %v\n%s", err, doc)
	}
	var res Result
	if err := json.Unmarshal(out, &res); err != nil {
		t.Fatal(err)
	}
	return &res
}

// sheet builds a worksheet document from rows given as equations, with extra top-level members.
func sheet(extra string, equations ...string) string {
	var rows []string
	for i, eq := range equations {
		b, _ := json.Marshal(eq)
		rows = append(rows, fmt.Sprintf(`{"id":"r%d","equation":%s}`, i+1, b))
	}
	if extra != "" {
		extra += ","
	}
	return `{"format":"gibbsheet-worksheet/1",` + extra + `"rows":[` + strings.Join(rows, ",") + `]}`
}

func near(a, b, tol float64) bool { return math.Abs(a-b) <= tol }

// TestMassActionProperty: ΔrG' − ΔrG'° = RT ln Q for any concentrations (the definition, exact up to
// rounding), and K' = exp(−ΔrG'°/RT).
func TestMassActionProperty(t *testing.T) {
	rng := rand.New(rand.NewPCG(1, 2))
	rt := thermo.R * 298.15
	for i := range 50 {
		atp, adp, pi := math.Exp(rng.Float64()*12-14), math.Exp(rng.Float64()*12-14), math.Exp(rng.Float64()*12-14)
		doc := sheet(fmt.Sprintf(`"concentrations":{"ATP":"%g M","ADP":"%g M","Pi":"%g M"}`, atp, adp, pi),
			"ATP + H2O = ADP + Pi")
		r := evaluate(t, doc).Rows[0]
		if r.Error != nil {
			t.Fatalf("case %d: %v", i, r.Error.Message)
		}
		lnQ := math.Log(adp * pi / atp)
		if !near(*r.DG-*r.DG0, rt*lnQ, 1e-9) {
			t.Errorf("case %d: ΔrG' − ΔrG'° = %.12g, RT ln Q = %.12g", i, *r.DG-*r.DG0, rt*lnQ)
		}
		if !near(math.Log(*r.Q), lnQ, 1e-9) || !near(math.Log(*r.K), -*r.DG0/rt, 1e-9) {
			t.Errorf("case %d: Q = %g (want %g), K' = %g (want %g)", i, *r.Q, math.Exp(lnQ), *r.K, math.Exp(-*r.DG0/rt))
		}
	}
}

// TestCostExamples: the energy values are common practice (no source): ATP 2, ADP 1, AMP 0 phosphate
// equivalents; NADH one carrier worth 2.5 ATP; a cost is positive, a yield negative.
func TestCostExamples(t *testing.T) {
	for _, tc := range []struct {
		eq    string
		times string
		want  Cost
	}{
		{"ATP + glucose = ADP + glucose 6-phosphate", "", Cost{Phosphate: 1, Total: 1}},
		{"ATP + H2O = AMP + PPi", "", Cost{Phosphate: 2, Total: 2}},
		{"pyruvate + NADH = lactate + NAD+", "", Cost{Reducing: 1, Total: 2.5}},
		{"ADP + phosphoenolpyruvate = ATP + pyruvate", `,"times":2`, Cost{Phosphate: -2, Total: -2}},
		{"GTP + ADP = GDP + ATP", "", Cost{}},
	} {
		doc := `{"format":"gibbsheet-worksheet/1","rows":[{"id":"a","equation":"` + tc.eq + `"` + tc.times + `}]}`
		r := evaluate(t, doc).Rows[0]
		if r.Error != nil {
			t.Errorf("%s: %s", tc.eq, r.Error.Message)
			continue
		}
		if *r.Cost != tc.want {
			t.Errorf("%s: cost %+v, want %+v", tc.eq, *r.Cost, tc.want)
		}
	}
}

func TestValuesOverride(t *testing.T) {
	res := evaluate(t, sheet(`"values":{"NADH":{"po":3},"pyrophosphate":{"phosphate":1}}`,
		"pyruvate + NADH = lactate + NAD+", "ATP + H2O = AMP + PPi"))
	if got := res.Rows[0].Cost.Total; got != 3 {
		t.Errorf("NADH at P/O 3: total %v, want 3", got)
	}
	if got := res.Rows[1].Cost.Phosphate; got != 1 {
		t.Errorf("PPi valued 1: phosphate %v, want 1", got)
	}
	if hasWarning(res.Rows[1], "pyrophosphate") {
		t.Error("PPi note shown although PPi has a value")
	}
	res = evaluate(t, sheet(`"values":{"nothing":{"po":3},"NADH":{"po":-1}}`, "NADH + NAD+ = NAD+ + NADH"))
	if len(res.Errors) != 2 {
		t.Errorf("want errors for an unknown compound and a negative P/O, got %+v", res.Errors)
	}
}

func hasWarning(r RowResult, code string) bool {
	for _, w := range r.Warnings {
		if w.Code == code {
			return true
		}
	}
	return false
}

func TestStatus(t *testing.T) {
	// ΔrG' is set through an entered ΔrG'° on A = A-like rows of own compounds with no data.
	for _, tc := range []struct {
		dg0  float64
		want string
	}{{-20, StatusDownhill}, {-1, StatusNearEquilibrium}, {0, StatusNearEquilibrium}, {2, StatusUphill}} {
		doc := fmt.Sprintf(`{"format":"gibbsheet-worksheet/1","compounds":[{"id":"X"},{"id":"Y"}],`+
			`"rows":[{"id":"a","equation":"X = Y","dG0":%g}]}`, tc.dg0)
		r := evaluate(t, doc).Rows[0]
		if r.Status != tc.want {
			t.Errorf("ΔrG' = %g: status %q, want %q", tc.dg0, r.Status, tc.want)
		}
		if (tc.want == StatusUphill) != hasWarning(r, "uphill") {
			t.Errorf("ΔrG' = %g: uphill warning %v", tc.dg0, hasWarning(r, "uphill"))
		}
	}
}

func TestRowErrors(t *testing.T) {
	for _, tc := range []struct {
		eq      string
		column  int
		length  int
		message string
	}{
		{"ATP + glucse = ADP + glucose 6-phosphate", 7, 6, `unknown compound "glucse"`},
		{"ATP + H2O = ADP + Pi[m]", 21, 3, `unknown compound`},
		{"ATP + H2O", 1, 0, "arrow"},
	} {
		r := evaluate(t, sheet("", tc.eq)).Rows[0]
		if r.Error == nil {
			t.Errorf("%q: no error", tc.eq)
			continue
		}
		if !strings.Contains(r.Error.Message, tc.message) && !strings.Contains(r.Error.Message, "compartment") {
			t.Errorf("%q: message %q, want %q", tc.eq, r.Error.Message, tc.message)
		}
		if tc.length > 0 && (r.Error.Column != tc.column || r.Error.Length != tc.length) {
			t.Errorf("%q: column %d length %d, want %d %d", tc.eq, r.Error.Column, r.Error.Length, tc.column, tc.length)
		}
	}
	r := evaluate(t, sheet("", "ATP + glucse = ADP + glucose 6-phosphate")).Rows[0]
	if len(r.Error.Suggestions) == 0 || !strings.EqualFold(r.Error.Suggestions[0], "glucose") {
		t.Errorf("suggestions for glucse: %v", r.Error.Suggestions)
	}
}

func TestDocumentErrorsStayAtTheirField(t *testing.T) {
	res := evaluate(t, sheet(`"conditions":{"pH":7},"concentrations":{"ATP":"3 mg"}`, "ATP + H2O = ADP + Pi",
		"glucose + NAD+ = glucose + NAD+"))
	if len(res.Errors) != 1 || res.Errors[0].Path != "concentrations.ATP" {
		t.Fatalf("errors %+v, want one at concentrations.ATP", res.Errors)
	}
	r := res.Rows[0]
	if r.Error == nil || r.Error.Column != 1 || r.DG != nil || r.DG0 == nil {
		t.Errorf("row using ATP: %+v; want ΔrG'° kept, ΔrG' null and an error at column 1", r)
	}
	if res.Rows[1].Error != nil || res.Rows[1].DG == nil {
		t.Errorf("row without ATP should compute: %+v", res.Rows[1])
	}
	res = evaluate(t, sheet(`"conditions":{"pH":-1}`, "ATP + H2O = ADP + Pi"))
	if len(res.Errors) != 1 || res.Errors[0].Path != "conditions.pH" || res.Rows[0].Error == nil {
		t.Errorf("impossible pH: errors %+v, row %+v", res.Errors, res.Rows[0].Error)
	}
}

func TestWarnings(t *testing.T) {
	res := evaluate(t, sheet(`"conditions":{"ionicStrength":0.5,"pH":10,"temperature":340}`,
		"ATP + glucose = glucose 6-phosphate", "NADH + H+ + pyruvate = NAD+ + lactate"))
	codes := map[string]bool{}
	for _, w := range res.Warnings {
		codes[w.Code] = true
	}
	for _, c := range []string{"ionic-strength", "pH", "temperature"} {
		if !codes[c] {
			t.Errorf("missing document warning %q in %+v", c, res.Warnings)
		}
	}
	if !hasWarning(res.Rows[0], "unbalanced") {
		t.Errorf("ATP + glucose = G6P should be unbalanced: %+v", res.Rows[0].Warnings)
	}
	if !hasWarning(res.Rows[1], "proton") || hasWarning(res.Rows[1], "unbalanced") {
		t.Errorf("row with H+: %+v", res.Rows[1].Warnings)
	}
}

func TestNetReaction(t *testing.T) {
	res := evaluate(t, `{"format":"gibbsheet-worksheet/1","rows":[`+
		`{"id":"a","equation":"glucose + ATP = glucose 6-phosphate + ADP"},`+
		`{"id":"b","equation":"glucose 6-phosphate + H2O = glucose + Pi","times":2}]}`)
	if got, want := res.Total.Equation, "ATP + glucose 6-phosphate + 2 H2O = glucose + ADP + 2 Pi"; got != want {
		// 1 glucose made net (consumed 1, made 2), 1 G6P consumed net (made 1, consumed 2).
		t.Errorf("net reaction %q, want %q", got, want)
	}
	sum := *res.Rows[0].DG0 + 2**res.Rows[1].DG0
	if !near(*res.Total.DG0, sum, 1e-9) {
		t.Errorf("total ΔrG'° %v, want Σ times·ΔrG'° = %v", *res.Total.DG0, sum)
	}
}

// TestNetReactionOverflow: coefficients whose exact sum leaves int64 are summed in float64 and printed
// rounded, never wrapped around.
func TestNetReactionOverflow(t *testing.T) {
	res := evaluate(t, `{"format":"gibbsheet-worksheet/1","compounds":[{"id":"X"},{"id":"Y"}],"rows":[`+
		`{"id":"a","equation":"999999999999999999 X = Y","dG0":-1,"times":30}]}`)
	if got, want := res.Total.Equation, "29999999999999999000 X = 30 Y"; got != want && got != "30000000000000000000 X = 30 Y" {
		t.Errorf("net reaction %q, want about %q", got, want)
	}
	if strings.Contains(res.Total.Equation, "-") {
		t.Errorf("net reaction %q wrapped around", res.Total.Equation)
	}
}
