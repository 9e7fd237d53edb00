package say

import (
	"go/ast"
	"go/constant"
	"go/importer"
	"go/parser"
	"go/token"
	"go/types"
	"io/fs"
	"os"
	"path/filepath"
	"runtime"
	"sort"
	"strings"
	"testing"
)

// unknownType names the type of an expression the type checker could not type.
const unknownType = "(unknown)"

// sourceRoots are the directories whose non-test Go files are compiled into the WebAssembly engine.
var sourceRoots = []string{"../..", "../../../wasm/page"}

// formatCall is a call with a constant format found in the sources.
type formatCall struct {
	pos     string
	callee  string // "say.Sprintf", "fmt.Errorf", or a local wrapper's name
	format  string
	args    []ast.Expr
	errorf  bool
	kinds   []kind // from the type checker; nil when types are not available
	typeStr []string
}

// TestCallSites walks the engine's and the page bridge's sources and fails for every directive in a
// constant format of say.Sprintf/Errorf, fmt.Sprintf/Errorf or a printf-style wrapper (a function with
// parameters "format string, args ...any") that this package would not print as fmt does. Outside
// WebAssembly it also type-checks the packages and checks each argument's kind.
func TestCallSites(t *testing.T) {
	calls := findCalls(t, runtime.GOOS != "js")
	if len(calls) < 40 {
		t.Fatalf("found only %d format calls: the walk of %v is broken", len(calls), sourceRoots)
	}
	seen := map[string]bool{}
	for _, c := range calls {
		ds := parseDirectives(c.format)
		if c.kinds != nil && len(c.kinds) > len(ds) {
			t.Errorf("%s: %s(%q): %d arguments for %d directives", c.pos, c.callee, c.format, len(c.kinds), len(ds))
		}
		for i, d := range ds {
			if c.kinds == nil {
				if d.weird || strings.Contains(d.flags, "#") || !strings.ContainsRune(sayVerbs, d.verb) ||
					d.verb == 'w' && !c.errorf {
					t.Errorf("%s: %s(%q): directive %s is not supported by package say", c.pos, c.callee, c.format, d.text)
				}
				continue
			}
			if i >= len(c.kinds) {
				t.Errorf("%s: %s(%q): no argument for %s", c.pos, c.callee, c.format, d.text)
				continue
			}
			if !exact(d, c.kinds[i], c.errorf) {
				t.Errorf("%s: %s(%q): directive %s with an argument of type %s is not printed as fmt does by package say "+
					"(convert a named number to its basic type, or extend say and its tests)", c.pos, c.callee, c.format, d.text, c.typeStr[i])
			}
			seen[d.text+" "+c.typeStr[i]] = true
		}
	}
	var list []string
	for k := range seen {
		list = append(list, k)
	}
	sort.Strings(list)
	t.Logf("%d calls; directive and argument type pairs in use: %s", len(calls), strings.Join(list, ", "))
}

// findCalls parses every non-test Go file under sourceRoots, package by package, and returns the
// format calls, with argument kinds when typed is set.
func findCalls(t *testing.T, typed bool) []formatCall {
	t.Helper()
	fset := token.NewFileSet()
	var dirs []string
	for _, root := range sourceRoots {
		err := filepath.WalkDir(root, func(path string, d fs.DirEntry, err error) error {
			if err != nil {
				return err
			}
			if d.IsDir() && d.Name() == "testdata" {
				return filepath.SkipDir
			}
			if d.IsDir() {
				dirs = append(dirs, path)
			}
			return nil
		})
		if err != nil {
			t.Fatal(err)
		}
	}
	imp := importer.ForCompiler(fset, "source", nil)
	var calls []formatCall
	for _, dir := range dirs {
		entries, err := os.ReadDir(dir)
		if err != nil {
			t.Fatal(err)
		}
		var files []*ast.File
		for _, e := range entries {
			if n := e.Name(); strings.HasSuffix(n, ".go") && !strings.HasSuffix(n, "_test.go") {
				f, err := parser.ParseFile(fset, filepath.Join(dir, n), nil, parser.SkipObjectResolution)
				if err != nil {
					t.Fatal(err)
				}
				files = append(files, f)
			}
		}
		if len(files) == 0 {
			continue
		}
		var info *types.Info
		if typed {
			info = &types.Info{Types: map[ast.Expr]types.TypeAndValue{}}
			var firstErr error
			conf := types.Config{Importer: imp, Error: func(err error) { // e.g. syscall/js outside js: those expressions stay untyped
				if firstErr == nil {
					firstErr = err
				}
			}}
			conf.Check(dir, fset, files, info)
			for _, c := range callsIn(fset, files, info) {
				for i, k := range c.kinds {
					if k == kOther && c.typeStr[i] == unknownType && firstErr != nil {
						c.typeStr[i] += " (the package does not type-check: " + firstErr.Error() + ")"
					}
				}
				calls = append(calls, c)
			}
			continue
		}
		calls = append(calls, callsIn(fset, files, nil)...)
	}
	return calls
}

// callsIn returns the format calls of one package's files.
func callsIn(fset *token.FileSet, files []*ast.File, info *types.Info) []formatCall {
	formatIndex := map[string]int{"say.Sprintf": 0, "say.Errorf": 0, "fmt.Sprintf": 0, "fmt.Errorf": 0}
	for _, f := range files {
		for _, decl := range f.Decls {
			if fd, ok := decl.(*ast.FuncDecl); ok {
				if i := wrapperFormat(fd.Type); i >= 0 {
					formatIndex[fd.Name.Name] = i
				}
			}
		}
	}
	var calls []formatCall
	for _, f := range files {
		ast.Inspect(f, func(n ast.Node) bool {
			call, ok := n.(*ast.CallExpr)
			if !ok {
				return true
			}
			name := ""
			switch fn := call.Fun.(type) {
			case *ast.Ident:
				name = fn.Name
			case *ast.SelectorExpr:
				name = fn.Sel.Name
				if x, ok := fn.X.(*ast.Ident); ok && (x.Name == "say" || x.Name == "fmt") {
					name = x.Name + "." + name
				}
			}
			i, ok := formatIndex[name]
			if !ok || i >= len(call.Args) || call.Ellipsis.IsValid() {
				return true
			}
			format, ok := constString(call.Args[i], info)
			if !ok {
				return true
			}
			c := formatCall{pos: fset.Position(call.Pos()).String(), callee: name, format: format,
				args: call.Args[i+1:], errorf: strings.HasSuffix(name, "Errorf")}
			if info != nil {
				for _, a := range c.args {
					k, s := kindOfType(info.Types[a].Type)
					c.kinds, c.typeStr = append(c.kinds, k), append(c.typeStr, s)
				}
			}
			calls = append(calls, c)
			return true
		})
	}
	return calls
}

// wrapperFormat returns the index of the format parameter of a printf-style function, whose
// parameters end in "format string, args ...any", or -1.
func wrapperFormat(ft *ast.FuncType) int {
	var names []string
	var last ast.Expr
	for _, field := range ft.Params.List {
		for _, n := range field.Names {
			names = append(names, n.Name)
		}
		last = field.Type
	}
	n := len(names)
	if n < 2 || names[n-2] != "format" {
		return -1
	}
	ell, ok := last.(*ast.Ellipsis)
	if !ok {
		return -1
	}
	switch elt := ell.Elt.(type) {
	case *ast.Ident:
		if elt.Name == "any" {
			return n - 2
		}
	case *ast.InterfaceType:
		if len(elt.Methods.List) == 0 {
			return n - 2
		}
	}
	return -1
}

// constString returns the value of a constant string expression: from the type checker when info is
// set, else for literals joined with +.
func constString(e ast.Expr, info *types.Info) (string, bool) {
	if info != nil {
		if tv, ok := info.Types[e]; ok && tv.Value != nil && tv.Value.Kind() == constant.String {
			return constant.StringVal(tv.Value), true
		}
	}
	switch e := e.(type) {
	case *ast.BasicLit:
		if e.Kind == token.STRING {
			v := constant.MakeFromLiteral(e.Value, e.Kind, 0)
			return constant.StringVal(v), v.Kind() == constant.String
		}
	case *ast.ParenExpr:
		return constString(e.X, info)
	case *ast.BinaryExpr:
		if e.Op == token.ADD {
			a, ok1 := constString(e.X, info)
			b, ok2 := constString(e.Y, info)
			return a + b, ok1 && ok2
		}
	}
	return "", false
}

// kindOfType returns the kind of the values of static type t as this package sees them, and t's name.
// An interface other than error counts as the kind of its dynamic value, which cannot be known here:
// it is accepted for %v only (e.g. the value of recover), where every supported dynamic type prints as
// fmt prints it.
func kindOfType(t types.Type) (kind, string) {
	if t == nil {
		return kOther, unknownType
	}
	name := t.String()
	errType := types.Universe.Lookup("error").Type()
	if b, ok := t.(*types.Basic); ok {
		switch {
		case b.Kind() == types.UntypedNil:
			return kNil, name
		case b.Info()&types.IsBoolean != 0:
			return kBool, name
		case b.Kind() == types.UntypedRune, b.Info()&types.IsInteger != 0 && b.Info()&types.IsUnsigned == 0:
			return kInt, name
		case b.Info()&types.IsInteger != 0:
			return kUint, name
		case b.Info()&types.IsFloat != 0:
			return kFloat, name
		case b.Info()&types.IsString != 0:
			return kString, name
		}
		return kOther, name
	}
	if sl, ok := t.(*types.Slice); ok && types.Identical(sl.Elem(), types.Typ[types.Byte]) {
		return kBytes, name
	}
	ms := types.NewMethodSet(t)
	if ms.Lookup(nil, "Format") != nil {
		return kOther, name // a fmt.Formatter
	}
	if types.Identical(t, errType) || types.Implements(t, errType.Underlying().(*types.Interface)) {
		return kError, name
	}
	if sel := ms.Lookup(nil, "String"); sel != nil {
		if sig, ok := sel.Obj().Type().(*types.Signature); ok && sig.Params().Len() == 0 && sig.Results().Len() == 1 &&
			types.Identical(sig.Results().At(0).Type(), types.Typ[types.String]) {
			return kStringer, name
		}
	}
	if iface, ok := t.Underlying().(*types.Interface); ok && iface.Empty() {
		return kAny, name
	}
	return kOther, name
}
