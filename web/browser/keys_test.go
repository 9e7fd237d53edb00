package browser

import (
	"slices"
	"strings"
	"testing"

	"github.com/chromedp/chromedp"
	"github.com/chromedp/chromedp/kb"
)

// focused describes the focused grid cell as "rowid/col" ("" outside the grid).
func (p *page) focused() string {
	return eval[string](p, `(() => { const a = document.activeElement; const tr = a && a.closest("tr.row");
		return tr && a.dataset.col ? tr.dataset.id + "/" + a.dataset.col : ""; })()`)
}

func (p *page) rowIDs() []string {
	return eval[[]string](p, `gibbsheetPage.store.doc.rows.map(r => r.id)`)
}

func (p *page) key(k string, mods ...chromedp.Modifier) {
	p.t.Helper()
	if len(mods) > 0 {
		p.do(chromedp.KeyEvent(k, chromedp.KeyModifiers(mods...)))
	} else {
		p.do(chromedp.KeyEvent(k))
	}
}

// TestKeyboard moves between cells and reorders, inserts, duplicates and removes rows with keys only.
func TestKeyboard(t *testing.T) {
	p := openPage(t, 1400, 900)
	p.do(chromedp.Focus(chromedp.CSS(cell("r1", "input.eq-input"))))
	steps := []struct {
		what string
		key  string
		mods []chromedp.Modifier
		want string // focused cell after the key
	}{
		{"down", kb.ArrowDown, nil, "r2/eq"},
		{"down again", kb.ArrowDown, nil, "r3/eq"},
		{"up", kb.ArrowUp, nil, "r2/eq"},
		{"right at the end of the text", kb.ArrowRight, nil, "r2/times"},
		{"Tab", kb.Tab, nil, "r2/dg0"},
		{"Enter goes down", kb.Enter, nil, "r3/dg0"},
		{"left at the start", kb.ArrowLeft, nil, "r3/times"},
	}
	for _, s := range steps {
		p.key(s.key, s.mods...)
		if got := p.focused(); got != s.want {
			t.Fatalf("after %s: focus on %q, want %q", s.what, got, s.want)
		}
	}

	// Alt+↑ moves the row up, the cursor goes with it.
	p.key(kb.ArrowUp, chromedp.ModifierAlt)
	if got, want := p.rowIDs(), []string{"r1", "r3", "r2", "r4", "r5", "r6", "r7"}; !slices.Equal(got, want) {
		t.Fatalf("after Alt+↑ rows %v, want %v", got, want)
	}
	if got := p.focused(); got != "r3/times" {
		t.Errorf("after Alt+↑ focus %q, want r3/times", got)
	}
	if n := strings.TrimSpace(p.text(`#grid-body tr.row[data-id="r3"] th.n`)); n != "2" {
		t.Errorf("moved row is numbered %q, want 2", n)
	}
	// Alt+Shift+↓ duplicates it below.
	p.key(kb.ArrowDown, chromedp.ModifierAlt, chromedp.ModifierShift)
	ids := p.rowIDs()
	if len(ids) != 8 || ids[2] == "r2" {
		t.Fatalf("after duplicate rows %v", ids)
	}
	copyID := ids[2]
	if eq := eval[string](p, `gibbsheetPage.store.doc.rows[2].equation`); eq != "F6P + ATP = FBP + ADP" {
		t.Errorf("duplicate has equation %q", eq)
	}
	if got := p.focused(); got != copyID+"/times" {
		t.Errorf("after duplicate focus %q, want %s/times", got, copyID)
	}
	// Alt+Delete removes the copy again.
	p.key(kb.Delete, chromedp.ModifierAlt)
	if got, want := p.rowIDs(), []string{"r1", "r3", "r2", "r4", "r5", "r6", "r7"}; !slices.Equal(got, want) {
		t.Fatalf("after Alt+Delete rows %v, want %v", got, want)
	}
	if got := p.focused(); got != "r2/times" {
		t.Errorf("after Alt+Delete focus %q, want the next row's cell r2/times", got)
	}
	// Ctrl+Enter inserts an empty row below and puts the cursor in its equation.
	p.key(kb.Enter, chromedp.ModifierCtrl)
	ids = p.rowIDs()
	if len(ids) != 8 || ids[2] != "r2" {
		t.Fatalf("after Ctrl+Enter rows %v", ids)
	}
	if got := p.focused(); got != ids[3]+"/eq" {
		t.Errorf("after Ctrl+Enter focus %q, want %s/eq", got, ids[3])
	}
	// Enter on the last row adds a row.
	p.do(chromedp.Focus(chromedp.CSS(cell("r7", "input.eq-input"))))
	p.key(kb.Enter)
	if ids = p.rowIDs(); len(ids) != 9 || p.focused() != ids[8]+"/eq" {
		t.Errorf("Enter on the last row: rows %v, focus %q", ids, p.focused())
	}
	p.shot("keyboard")
	p.noErrors()
}

// TestUnknownCompound types a misspelt name: the error underlines exactly that name, says what is
// wrong and offers the library's name, which fixes the row when chosen.
func TestUnknownCompound(t *testing.T) {
	p := openPage(t, 1400, 900)
	p.newSheet()
	const eq = "glucose + ATP = glucose 6-phospate + ADP"
	p.do(chromedp.SendKeys(chromedp.CSS(cell("r1", "input.eq-input")), eq))
	p.do(chromedp.KeyEvent(kb.Escape)) // close the completion list
	p.waitFor(`document.querySelector('#grid-body tr.sub[data-for="r1"] li.err')`)
	msg := p.text(`#grid-body tr.sub[data-for="r1"] li.err`)
	if !strings.Contains(msg, "column 17") || !strings.Contains(strings.ToLower(msg), "glucose 6-phospate") {
		t.Errorf("error message %q should give column 17 and the name", msg)
	}
	if got := p.text(cell("r1", ".eq-mirror mark")); got != "glucose 6-phospate" {
		t.Errorf("underlined %q, want the misspelt name", got)
	}
	sugg := eval[[]string](p, `[...document.querySelectorAll('#grid-body tr.sub[data-for="r1"] button.suggest')].map(b => b.textContent)`)
	if len(sugg) == 0 {
		t.Fatalf("no suggestion offered; message %q", msg)
	}
	p.shot("unknown-compound")
	p.do(chromedp.Click(chromedp.CSS(`#grid-body tr.sub[data-for="r1"] button.suggest`)))
	p.waitFor(`gibbsheetPage.store.result.rows[0].dG0 !== null`)
	if got := eval[string](p, `gibbsheetPage.store.doc.rows[0].equation`); got != "glucose + ATP = "+sugg[0]+" + ADP" {
		t.Errorf("after choosing %q the equation is %q", sugg[0], got)
	}
	if eval[bool](p, `!document.querySelector('#grid-body tr.sub[data-for="r1"]').hidden && !!document.querySelector('#grid-body tr.sub[data-for="r1"] li.err')`) {
		t.Error("the error is still shown after the fix")
	}
	p.noErrors()
}

// TestCompletion types the start of a name and takes the offered compound with Enter.
func TestCompletion(t *testing.T) {
	p := openPage(t, 1400, 900)
	p.newSheet()
	p.do(chromedp.SendKeys(chromedp.CSS(cell("r1", "input.eq-input")), "2 pyru"))
	p.waitFor(`!document.getElementById("complete").hidden`)
	first := p.text("#complete .opt.on b")
	if first != "pyruvate" {
		t.Errorf("first completion %q, want pyruvate", first)
	}
	p.shot("completion")
	p.key(kb.Enter)
	if got := eval[string](p, `document.querySelector(`+jsString(cell("r1", "input.eq-input"))+`).value`); got != "2 pyruvate" {
		t.Errorf("after Enter the equation is %q, want %q", got, "2 pyruvate")
	}
	if !eval[bool](p, `document.getElementById("complete").hidden`) {
		t.Error("the list stayed open")
	}
	if got := p.focused(); got != "r1/eq" {
		t.Errorf("Enter in the list moved the focus to %q", got)
	}
	p.noErrors()
}
