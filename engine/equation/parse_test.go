package equation_test

import (
	"strings"
	"testing"

	"github.com/google/go-cmp/cmp"

	"gibbsheet/engine/equation"
)

func TestNormalForm(t *testing.T) {
	tests := []struct{ in, want string }{
		{"NAD+ + H2O = NADH + H+", "NAD+ + H2O = NADH + H+"},
		{"ATP + D-glucose -> ADP + D-glucose 6-phosphate", "ATP + D-glucose = ADP + D-glucose 6-phosphate"},
		{"fructose 1,6-bisphosphate ⇌ dihydroxyacetone phosphate + glyceraldehyde 3-phosphate",
			"fructose 1,6-bisphosphate = dihydroxyacetone phosphate + glyceraldehyde 3-phosphate"},
		{"2 pyruvate[m] + 1/2 O2 → 2 acetyl-CoA[m] + 2 CO2[m]", "2 pyruvate[m] + 0.5 O2 = 2 acetyl-CoA[m] + 2 CO2[m]"},
		{"0.5 O2 + 2 H+ + 2 e- = H2O", "0.5 O2 + 2 H+ + 2 e- = H2O"},
		{"ATP + H2O <=> adenosine 5'-diphosphate + Pi", "ATP + H2O = adenosine 5'-diphosphate + Pi"},
		{"adenosine 5′-triphosphate = adenosine 3’,5’-cyclic phosphate + PPi",
			"adenosine 5′-triphosphate = adenosine 3’,5’-cyclic phosphate + PPi"},
		{"α-D-glucose 6-phosphate = β-D-fructose 6-phosphate", "α-D-glucose 6-phosphate = β-D-fructose 6-phosphate"},
		{"2-phospho-D-glycerate = phosphoenolpyruvate + H2O", "2-phospho-D-glycerate = phosphoenolpyruvate + H2O"},
		{"1,3-bisphosphoglycerate + ADP = 3-phosphoglycerate + ATP", "1,3-bisphosphoglycerate + ADP = 3-phosphoglycerate + ATP"},
		{"(S)-malate + NAD+ = oxaloacetate + NADH + H+", "(S)-malate + NAD+ = oxaloacetate + NADH + H+"},
		{"  glucose   6-phosphate\t+  H2O =Pi+ glucose ", "glucose 6-phosphate + H2O = Pi+ glucose"},
		{"1 A = 1.0 B + 2.50 C + 4/2 D + 2/6 E", "A = B + 2.5 C + 2 D + 1/3 E"},
		{"0.25 A = 007 B + 0.125 C", "0.25 A = 7 B + 0.125 C"},
		{"pyruvate [m] + NAD+[ c ] -> CO2[m]", "pyruvate[m] + NAD+[c] = CO2[m]"},
		{"A[c] + A[m] = B", "A[c] + A[m] = B"},
		{"A=B", "A = B"},
		{"A->B", "A = B"},
		{"Fe2+ + Mg++ = HCO3- + X", "Fe2+ + Mg++ = HCO3- + X"},
		{"HCO3- -> CO2 + OH-", "HCO3- = CO2 + OH-"},
		{"NAD(P)+ + NAD(+) = Y", "NAD(P)+ + NAD(+) = Y"},
		{"ATP + glucose = ADP + glucose + H+", "ATP + glucose = ADP + glucose + H+"}, // same compound on both sides is allowed
		{"ΔX\u00a0+\u00a0Y = Z", "ΔX + Y = Z"},
	}
	for _, tt := range tests {
		e, err := equation.Parse(tt.in)
		if err != nil {
			t.Errorf("Parse(%q): %v", tt.in, err)
			continue
		}
		if got := e.String(); got != tt.want {
			t.Errorf("Parse(%q).String() = %q, want %q", tt.in, got, tt.want)
		}
	}
}

func TestParseTerms(t *testing.T) {
	src := "2 pyruvate[m] + 1/2 O2  ⇌ glucose  6-phosphate"
	e, err := equation.Parse(src)
	if err != nil {
		t.Fatal(err)
	}
	want := &equation.Equation{
		Left: []equation.Term{
			{Coef: equation.Rat{Num: 2, Den: 1}, Name: "pyruvate", Compartment: "m", Pos: 0, NamePos: 2, NameEnd: 10},
			{Coef: equation.Rat{Num: 1, Den: 2}, Name: "O2", Pos: 16, NamePos: 20, NameEnd: 22},
		},
		Right: []equation.Term{
			{Coef: equation.Rat{Num: 1, Den: 1}, Name: "glucose  6-phosphate", Pos: 28, NamePos: 28, NameEnd: 48},
		},
		Arrow:    "⇌",
		ArrowPos: 24,
	}
	if diff := cmp.Diff(want, e); diff != "" {
		t.Errorf("Parse(%q) mismatch (-want +got):\n%s", src, diff)
	}
	if got := src[e.Right[0].NamePos:e.Right[0].NameEnd]; got != "glucose  6-phosphate" {
		t.Errorf("name span = %q", got)
	}
}

// An errorWant is one expected error: its columns (1-based, in characters)
// and a fragment of its message.
type errorWant struct {
	col, endCol int
	msg         string
}

func TestParseErrors(t *testing.T) {
	tests := []struct {
		name, in string
		want     []errorWant
	}{
		{"empty", "", []errorWant{{1, 1, "empty equation"}}},
		{"blank", "   ", []errorWant{{1, 4, "empty equation"}}},
		{"empty left", " = B", []errorWant{{2, 3, "empty left side"}}},
		{"empty right", "A ->  ", []errorWant{{3, 5, "empty right side"}}},
		{"both empty", "⇌", []errorWant{{1, 2, "empty left side"}, {1, 2, "empty right side"}}},
		{"missing arrow", "  ATP + H2O  ", []errorWant{{3, 12, `missing arrow: write "=" between the two sides`}}},
		{"second arrow", "A = B -> C", []errorWant{{7, 9, `second arrow "->": an equation has one arrow`}}},
		{"third arrow", "A = B = C → D", []errorWant{{7, 8, "second arrow"}, {11, 12, `third arrow "→"`}}},
		{"unknown arrow", "A => B", []errorWant{{3, 5, `"=>" is not an arrow`}}},
		{"unknown arrow long", "A <--> B", []errorWant{{3, 7, `"<-->" is not an arrow`}}},
		{"unknown unicode arrow", "A ↔ B", []errorWant{{3, 4, `"↔" is not an arrow`}}},
		{"zero coefficient", "0 A = B", []errorWant{{1, 2, `"0" is not a valid coefficient: coefficients must be positive`}}},
		{"zero decimal", "A = 0.0 B", []errorWant{{5, 8, "must be positive"}}},
		{"negative", "-2 A = B", []errorWant{{1, 3, `"-2" is not a valid coefficient: coefficients must be positive`}}},
		{"zero denominator", "1/0 A = B", []errorWant{{1, 4, `"1/0" is not a valid coefficient: the denominator is zero`}}},
		{"two points", "1..2 A = B", []errorWant{{1, 5, `"1..2" is not a valid coefficient: more than one decimal point`}}},
		{"two slashes", "1/2/3 A = B", []errorWant{{1, 6, `more than one "/"`}}},
		{"decimal fraction", "0.5/2 A = B", []errorWant{{1, 6, "whole numbers"}}},
		{"bare point", ".5 A = B", []errorWant{{1, 3, "digits on both sides of the decimal point"}}},
		{"too many digits", "1234567890123456789 A = B", []errorWant{{1, 20, "too many digits (at most 18)"}}},
		{"too many decimals", "A = 0.0000000000000000001 B", []errorWant{{5, 26, "too many digits"}}},
		{"huge denominator", "1/99999999999999999999 A = B", []errorWant{{1, 23, "too many digits"}}},
		{"coefficient only", "2 = B", []errorWant{{1, 2, `missing name after coefficient "2"`}}},
		{"two coefficients", "2 3 A = B", []errorWant{{3, 4, `second number "3" after coefficient "2"`}}},
		{"empty term between", "A +  + B = C", []errorWant{{3, 7, `empty term between "+" signs`}}},
		{"trailing plus", "A = B +", []errorWant{{7, 8, `empty term after "+"`}}},
		{"leading plus", "+ A = B", []errorWant{{1, 2, `empty term before "+"`}}},
		{"plus before arrow", "A + = B", []errorWant{{3, 4, `empty term after "+"`}}},
		{"glued plus", "A+B = C", []errorWant{{2, 3, `"+" inside a name`}}},
		{"one-sided plus", "NAD+ +H2O = NADH", []errorWant{{6, 7, `"+" inside a name`}}},
		{"unclosed tag", "pyruvate[m = B", []errorWant{{9, 11, "unclosed compartment tag"}}},
		{"empty tag", "A = pyruvate[ ]", []errorWant{{13, 16, "empty compartment tag"}}},
		{"unmatched close", "A] = B", []errorWant{{2, 3, `unmatched "]"`}}},
		{"nested tag", "A[m[c]] = B", []errorWant{{4, 5, `"[" inside a compartment tag`}}},
		{"text after tag", "A[m] x = B", []errorWant{{6, 7, `unexpected "x" after the compartment tag`}}},
		{"tag without name", "2 [m] = B", []errorWant{{3, 6, "missing compound name"}}},
		{"repeat", "glucose + ATP + glucose = B", []errorWant{{17, 24, `"glucose" appears twice on the left side`}}},
		{"repeat case and space", "A = D-Glucose  6-P + 2 d-glucose 6-P", []errorWant{{22, 37, `"D-Glucose 6-P" appears twice on the right side: write it once as "3 D-Glucose 6-P"`}}},
		{"repeat tagged", "A[m] + B + A[m] + A[m] = C", []errorWant{{12, 16, `"A[m]" appears twice`}, {19, 23, `"A[m]" appears 3 times`}}},
		{"invalid UTF-8", "A\xff\xfe = B", []errorWant{{2, 4, "invalid UTF-8"}}},
		{"control character", "A\x00 = B", []errorWant{{2, 3, "control character U+0000"}}},
		{"Greek columns", "ΔΔ + ΔΔ = Ω", []errorWant{{6, 8, `"ΔΔ" appears twice on the left side`}}},
		{"several at once", "0 A +  + A[ = 1/0 B + B", []errorWant{
			{1, 2, "must be positive"}, {5, 9, "empty term between"}, {11, 12, "unclosed compartment tag"},
			{15, 18, "denominator is zero"}, {23, 24, `"B" appears twice on the right side`}}},
		{"repeat without arrow", "A + a", []errorWant{{1, 6, "missing arrow"}, {5, 6, `"A" appears twice in the equation`}}},
		{"errors without arrow", "0 A + + B", []errorWant{{1, 2, "must be positive"}, {1, 10, "missing arrow"}, {5, 8, "empty term between"}}},
	}
	for _, tt := range tests {
		e, err := equation.Parse(tt.in)
		if err == nil {
			t.Errorf("%s: Parse(%q) = %v, want errors", tt.name, tt.in, e)
			continue
		}
		if e != nil {
			t.Errorf("%s: Parse(%q) returned an equation with errors", tt.name, tt.in)
		}
		list, ok := err.(equation.ErrorList)
		if !ok {
			t.Errorf("%s: error is %T, want ErrorList", tt.name, err)
			continue
		}
		var got []errorWant
		for _, x := range list {
			got = append(got, errorWant{equation.Column(tt.in, x.Pos), equation.Column(tt.in, x.End), x.Msg})
		}
		if len(got) != len(tt.want) {
			t.Errorf("%s: Parse(%q) errors:\n%v\nwant %d: %v", tt.name, tt.in, got, len(tt.want), tt.want)
			continue
		}
		for i, w := range tt.want {
			if g := got[i]; g.col != w.col || g.endCol != w.endCol || !strings.Contains(g.msg, w.msg) {
				t.Errorf("%s: Parse(%q) error %d = %d-%d %q, want %d-%d containing %q",
					tt.name, tt.in, i, g.col, g.endCol, g.msg, w.col, w.endCol, w.msg)
			}
		}
	}
}

func TestColumn(t *testing.T) {
	src := "ΔG'° = x"
	tests := []struct {
		p    equation.Pos
		want int
	}{{-3, 1}, {0, 1}, {2, 2}, {3, 3}, {4, 4}, {6, 5}, {7, 6}, {equation.Pos(len(src)), 9}, {equation.Pos(len(src) + 5), 9}}
	for _, tt := range tests {
		if got := equation.Column(src, tt.p); got != tt.want {
			t.Errorf("Column(%q, %d) = %d, want %d", src, tt.p, got, tt.want)
		}
	}
}

func TestErrorList(t *testing.T) {
	var l equation.ErrorList
	if l.Err() != nil {
		t.Errorf("empty ErrorList.Err() = %v, want nil", l.Err())
	}
	l = equation.ErrorList{{Pos: 5, End: 6, Msg: "b"}, {Pos: 1, End: 2, Msg: "a"}}
	l.Sort()
	if got, want := l.Err().Error(), "offset 1: a; offset 5: b"; got != want {
		t.Errorf("Error() = %q, want %q", got, want)
	}
}
