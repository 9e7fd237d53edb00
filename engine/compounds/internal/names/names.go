// Package names holds what package compounds and its code generator must agree on: the rules for the
// names of library compounds (normalization, the list and sorted index of the names Lookup and Suggest
// use) and Listed, the shape of a compound in the list the page receives.
package names

import (
	"sort"
	"strings"
)

// Normalize folds case, trims and collapses spaces, and maps the prime variants people type (′ ’ ‘) to '.
func Normalize(s string) string {
	s = strings.Join(strings.Fields(s), " ")
	return strings.Map(func(r rune) rune {
		switch r {
		case '′', '’', '‘':
			return '\''
		}
		return r
	}, strings.ToLower(s))
}

// Entry is one name of a compound.
type Entry struct {
	Text, Norm string // as written and normalized
	IsID       bool   // the compound's ID
	Owner      int    // index of the compound
}

// Clash is a name that normalizes like a name of an earlier compound.
type Clash struct {
	Text         string
	Owner, Other int // the compound with the name and the earlier one that has it
}

// Collect lists the names of the compounds, each given as its ID, name and synonyms, in that order:
// every non-empty normalized name once, with the first compound that has it. A name repeated within one
// compound is dropped; one that another compound already has is reported as a Clash.
func Collect(compounds [][]string) ([]Entry, []Clash) {
	var entries []Entry
	var clashes []Clash
	owner := map[string]int{}
	for i, ns := range compounds {
		for k, n := range ns {
			key := Normalize(n)
			if key == "" {
				continue
			}
			if o, dup := owner[key]; dup {
				if o != i {
					clashes = append(clashes, Clash{n, i, o})
				}
				continue
			}
			owner[key] = i
			entries = append(entries, Entry{n, key, k == 0, i})
		}
	}
	return entries, clashes
}

// Index returns the positions of entries sorted by normalized name, for binary search.
func Index(entries []Entry) []int {
	idx := make([]int, len(entries))
	for i := range idx {
		idx[i] = i
	}
	sort.Slice(idx, func(a, b int) bool { return entries[idx[a]].Norm < entries[idx[b]].Norm })
	return idx
}

// Listed is what the page receives of a library compound for completion and display (compounds.LibraryJSON
// is the library as a list of these; compounds.LibraryEntry and engine.LibraryEntry name it elsewhere).
type Listed struct {
	ID          string   `json:"id"`
	Name        string   `json:"name"`
	Synonyms    []string `json:"synonyms,omitempty"`
	Formula     string   `json:"formula"`
	Approximate bool     `json:"approximate,omitempty"`
	Source      string   `json:"source"`
}
