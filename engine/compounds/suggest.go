package compounds

import (
	"sort"
	"unicode/utf8"

	"gibbsheet/engine/compounds/internal/names"
)

// Suggest returns up to n known names nearest to name by Damerau–Levenshtein distance (optimal string
// alignment, counted in runes, after the normalization of Lookup), nearest first, IDs before other names
// at equal distance, then alphabetically. Only names within max(2, len/3) edits are offered, and each
// compound appears once. n ≤ 0 returns nil.
func (l *Library) Suggest(name string, n int) []string {
	if n <= 0 {
		return nil
	}
	q := []rune(names.Normalize(name))
	limit := max(2, len(q)/3)
	type cand struct {
		text string
		d    int
		isID bool
		c    *Compound
	}
	best := map[*Compound]cand{}
	for _, e := range l.names {
		if abs(utf8.RuneCountInString(e.norm)-len(q)) > limit {
			continue
		}
		d := osaDistance(q, []rune(e.norm))
		if d > limit {
			continue
		}
		c := e.c
		b, ok := best[c]
		if !ok || d < b.d || (d == b.d && e.isID && !b.isID) {
			best[c] = cand{e.text, d, e.isID, c}
		}
	}
	cs := make([]cand, 0, len(best))
	for _, c := range best {
		cs = append(cs, c)
	}
	sort.Slice(cs, func(i, j int) bool {
		a, b := cs[i], cs[j]
		if a.d != b.d {
			return a.d < b.d
		}
		if a.isID != b.isID {
			return a.isID
		}
		return a.text < b.text
	})
	out := []string{}
	for i := 0; i < len(cs) && i < n; i++ {
		out = append(out, cs[i].text)
	}
	return out
}

func abs(x int) int {
	if x < 0 {
		return -x
	}
	return x
}

// osaDistance is the optimal-string-alignment form of the Damerau–Levenshtein distance: insertions,
// deletions, substitutions and transpositions of adjacent runes each cost 1.
func osaDistance(a, b []rune) int {
	prev2 := make([]int, len(b)+1)
	prev := make([]int, len(b)+1)
	cur := make([]int, len(b)+1)
	for j := range prev {
		prev[j] = j
	}
	for i := 1; i <= len(a); i++ {
		cur[0] = i
		for j := 1; j <= len(b); j++ {
			cost := 1
			if a[i-1] == b[j-1] {
				cost = 0
			}
			cur[j] = min(prev[j]+1, cur[j-1]+1, prev[j-1]+cost)
			if i > 1 && j > 1 && a[i-1] == b[j-2] && a[i-2] == b[j-1] {
				cur[j] = min(cur[j], prev2[j-2]+1)
			}
		}
		prev2, prev, cur = prev, cur, prev2
	}
	return prev[len(b)]
}
