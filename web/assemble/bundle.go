package assemble

import (
	"fmt"
	"io/fs"
	"path"
	"regexp"
	"slices"
	"strings"
)

// The page's JavaScript is written as ES modules, one concern per file, but a page opened from file://
// cannot import other files. bundle joins the modules into one script: each module becomes a function
// scope that returns its exports, and each import becomes a destructuring of an earlier module's exports.
// Only the plain forms are accepted, so that the rewrite is exact:
//
//	import { a, b } from "./other.js";
//	export function name(...) / export async function name / export class Name / export const name = ...
//
// Exported bindings are copied once the module has run, so modules export functions and objects, not
// variables they reassign later.

var (
	importLine = regexp.MustCompile(`^import\s*\{([^}]*)\}\s*from\s*"\./([A-Za-z0-9_-]+\.js)";?\s*$`)
	exportLine = regexp.MustCompile(`^export\s+(?:async\s+)?(function\*?|class|const|let)\s+([A-Za-z_$][A-Za-z0-9_$]*)`)
	identifier = regexp.MustCompile(`^[A-Za-z_$][A-Za-z0-9_$]*$`)
)

// module is one parsed source file.
type module struct {
	name    string              // file name, "grid.js"
	imports map[string][]string // file name -> names imported from it
	exports []string
	body    []string // lines with import lines removed and "export " dropped
}

func parseModule(name, src string) (*module, error) {
	m := &module{name: name, imports: map[string][]string{}}
	for i, line := range strings.Split(src, "\n") {
		where := fmt.Sprintf("%s:%d", name, i+1)
		trimmed := strings.TrimSpace(line)
		switch {
		case strings.HasPrefix(line, "import"):
			g := importLine.FindStringSubmatch(trimmed)
			if g == nil {
				return nil, fmt.Errorf("%s: only `import { a, b } from \"./file.js\";` on one line is supported", where)
			}
			for n := range strings.SplitSeq(g[1], ",") {
				n = strings.TrimSpace(n)
				if n == "" {
					continue
				}
				if !identifier.MatchString(n) {
					return nil, fmt.Errorf("%s: cannot import %q (renaming imports is not supported)", where, n)
				}
				m.imports[g[2]] = append(m.imports[g[2]], n)
			}
			m.body = append(m.body, "")
		case strings.HasPrefix(line, "export"):
			g := exportLine.FindStringSubmatch(trimmed)
			if g == nil {
				return nil, fmt.Errorf("%s: only `export function|class|const|let name` is supported", where)
			}
			if slices.Contains(m.exports, g[2]) {
				return nil, fmt.Errorf("%s: %s exported twice", where, g[2])
			}
			m.exports = append(m.exports, g[2])
			m.body = append(m.body, strings.TrimPrefix(strings.TrimPrefix(line, "export"), " "))
		case isKeyword(trimmed, "import") || isKeyword(trimmed, "export"):
			// An indented import or export is not one the bundle can place; it would become one once
			// compact removes the indentation.
			return nil, fmt.Errorf("%s: import and export lines must start at the first column", where)
		default:
			m.body = append(m.body, line)
		}
	}
	return m, nil
}

// isKeyword reports whether s starts a declaration with the keyword kw: kw followed by white space, a
// brace, a star, a quote or nothing.
func isKeyword(s, kw string) bool {
	rest, ok := strings.CutPrefix(s, kw)
	return ok && (rest == "" || strings.ContainsRune(" \t\v\f\r{*\"'", rune(rest[0])))
}

// bundle reads every .js file of dir in fsys and returns one classic script that runs entry and, before
// it, every module it imports (directly or not) in dependency order.
func bundle(fsys fs.FS, dir, entry string) (string, error) {
	files, err := fs.Glob(fsys, path.Join(dir, "*.js"))
	if err != nil {
		return "", err
	}
	mods := map[string]*module{}
	for _, f := range files {
		src, err := fs.ReadFile(fsys, f)
		if err != nil {
			return "", err
		}
		m, err := parseModule(path.Base(f), string(src))
		if err != nil {
			return "", err
		}
		if err := checkLiterals(m.name, m.body); err != nil {
			return "", err
		}
		mods[m.name] = m
	}
	var order []*module
	state := map[string]int{} // 1 visiting, 2 done
	var visit func(name string, chain []string) error
	visit = func(name string, chain []string) error {
		m, ok := mods[name]
		if !ok {
			return fmt.Errorf("%s imports %q, which is not in %s", chain[len(chain)-1], name, dir)
		}
		switch state[name] {
		case 1:
			return fmt.Errorf("import cycle: %s -> %s", strings.Join(chain, " -> "), name)
		case 2:
			return nil
		}
		state[name] = 1
		deps := make([]string, 0, len(m.imports))
		for d := range m.imports {
			deps = append(deps, d)
		}
		slices.Sort(deps)
		for _, d := range deps {
			if err := visit(d, append(chain, name)); err != nil {
				return err
			}
			for _, n := range m.imports[d] {
				if !slices.Contains(mods[d].exports, n) {
					return fmt.Errorf("%s imports %s from %s, which does not export it", name, n, d)
				}
			}
		}
		state[name] = 2
		order = append(order, m)
		return nil
	}
	if err := visit(entry, []string{"(entry)"}); err != nil {
		return "", err
	}

	var b strings.Builder
	b.WriteString("\"use strict\";\n")
	for _, m := range order {
		fmt.Fprintf(&b, "const %s = (() => { // %s\n", moduleVar(m.name), m.name)
		deps := make([]string, 0, len(m.imports))
		for d := range m.imports {
			deps = append(deps, d)
		}
		slices.Sort(deps)
		for _, d := range deps {
			fmt.Fprintf(&b, "const { %s } = %s;\n", strings.Join(m.imports[d], ", "), moduleVar(d))
		}
		b.WriteString(compact(m.body))
		fmt.Fprintf(&b, "\nreturn { %s };\n})();\n", strings.Join(m.exports, ", "))
	}
	return b.String(), nil
}

// moduleVar is the name of the variable holding the exports of a module file.
func moduleVar(file string) string {
	return "module_" + strings.NewReplacer("-", "_", ".", "_").Replace(file)
}

// compact joins a module's lines without the lines that hold only a comment and without each line's
// indentation, which together are a fifth of the sources and count against the size of the single file.
// The sources keep their comments. This is safe only while no template literal spans lines, which
// checkLiterals enforces when the module is read.
func compact(lines []string) string {
	var b strings.Builder
	for _, l := range lines {
		t := strings.TrimLeft(l, " \t")
		if t == "" || strings.HasPrefix(t, "//") {
			continue
		}
		b.WriteString(t)
		b.WriteByte('\n')
	}
	return strings.TrimSuffix(b.String(), "\n")
}

// checkLiterals refuses a module with a line of an odd number of backticks: a template literal that spans
// lines, whose text compact would change.
func checkLiterals(name string, lines []string) error {
	for i, l := range lines {
		if strings.Count(l, "`")%2 == 1 {
			return fmt.Errorf("%s: line %d: a template literal spans lines; keep each on one line (the bundle removes indentation)", name, i+1)
		}
	}
	return nil
}
