package compounds

import (
	"sort"
	"strconv"
	"strings"
	"unicode/utf8"

	"gibbsheet/engine/internal/say"
)

// Formula maps element symbols to atom counts (all counts > 0).
type Formula map[string]int

// elements is the periodic table, H to Og (IUPAC 2016 names).
var elements = func() map[string]bool {
	m := map[string]bool{}
	for _, s := range strings.Fields(`H He Li Be B C N O F Ne Na Mg Al Si P S Cl Ar K Ca Sc Ti V Cr Mn Fe
		Co Ni Cu Zn Ga Ge As Se Br Kr Rb Sr Y Zr Nb Mo Tc Ru Rh Pd Ag Cd In Sn Sb Te I Xe Cs Ba La Ce Pr
		Nd Pm Sm Eu Gd Tb Dy Ho Er Tm Yb Lu Hf Ta W Re Os Ir Pt Au Hg Tl Pb Bi Po At Rn Fr Ra Ac Th Pa U
		Np Pu Am Cm Bk Cf Es Fm Md No Lr Rf Db Sg Bh Hs Mt Ds Rg Cn Nh Fl Mc Lv Ts Og`) {
		m[s] = true
	}
	return m
}()

// maxCount bounds one element's count so that sums cannot overflow.
const maxCount = 1_000_000

// A FormulaError reports a malformed formula; Pos is the byte offset of the offending text.
type FormulaError struct {
	Formula string
	Pos     int
	Msg     string
}

func (e *FormulaError) Error() string {
	col := utf8.RuneCountInString(e.Formula[:e.Pos]) + 1
	return say.Sprintf("formula %q, column %d: %s", e.Formula, col, e.Msg)
}

// ParseFormula parses a molecular formula.
//
//	formula: part { part }
//	part:    element [ count ]
//
// Element symbols are those of the periodic table; a symbol may repeat ("CH3COOH") and its counts
// add. Charges, hydrates and parentheses are not part of the grammar.
func ParseFormula(s string) (Formula, error) {
	if strings.TrimSpace(s) == "" {
		return nil, &FormulaError{s, 0, "empty formula"}
	}
	f := Formula{}
	for pos := 0; pos < len(s); {
		sym, n, next, err := parsePart(s, pos)
		if err != nil {
			return nil, err
		}
		if f[sym] += n; f[sym] > maxCount {
			return nil, &FormulaError{s, pos, say.Sprintf("too many %s atoms", sym)}
		}
		pos = next
	}
	return f, nil
}

// parsePart parses part: element [ count ] at pos.
func parsePart(s string, pos int) (sym string, n, next int, err error) {
	c := s[pos]
	if c < 'A' || c > 'Z' {
		r, _ := utf8.DecodeRuneInString(s[pos:])
		return "", 0, 0, &FormulaError{s, pos, say.Sprintf("expected an element symbol (capital letter), found %q", r)}
	}
	end := pos + 1
	for end < len(s) && s[end] >= 'a' && s[end] <= 'z' {
		end++
	}
	sym = s[pos:end]
	if !elements[sym] {
		return "", 0, 0, &FormulaError{s, pos, say.Sprintf("unknown element symbol %q", sym)}
	}
	n, next, err = parseCount(s, end)
	return sym, n, next, err
}

// parseCount parses count: digit { digit }, a positive integer without leading zero; absent means 1.
func parseCount(s string, pos int) (n, next int, err error) {
	end := pos
	for end < len(s) && s[end] >= '0' && s[end] <= '9' {
		end++
	}
	if end == pos {
		return 1, pos, nil
	}
	if s[pos] == '0' {
		return 0, 0, &FormulaError{s, pos, "count must be a positive integer without leading zero"}
	}
	n, err = strconv.Atoi(s[pos:end])
	if err != nil || n > maxCount {
		return 0, 0, &FormulaError{s, pos, "count too large"}
	}
	return n, end, nil
}

// String returns the formula in Hill order: C first, then H, then the other elements alphabetically;
// without carbon, all elements alphabetically. Counts of 1 are omitted.
func (f Formula) String() string {
	syms := make([]string, 0, len(f))
	for s, n := range f {
		if n != 0 {
			syms = append(syms, s)
		}
	}
	rank := func(s string) int {
		if f["C"] == 0 {
			return 2
		}
		switch s {
		case "C":
			return 0
		case "H":
			return 1
		}
		return 2
	}
	sort.Slice(syms, func(i, j int) bool {
		if ri, rj := rank(syms[i]), rank(syms[j]); ri != rj {
			return ri < rj
		}
		return syms[i] < syms[j]
	})
	var b strings.Builder
	for _, s := range syms {
		b.WriteString(s)
		if f[s] != 1 {
			b.WriteString(strconv.Itoa(f[s]))
		}
	}
	return b.String()
}
