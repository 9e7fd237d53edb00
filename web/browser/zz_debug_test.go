package browser

import (
	"testing"
)

func TestZZNarrow(t *testing.T) {
	p := openPage(t, 900, 800)
	p.loadFile("../../testdata/worksheets/mitochondrion.json")
	p.waitFor(`document.querySelectorAll("#comp-rows tr").length === 2`)
	p.shotOf("#mdf", "narrow-mdf")
	p.shotOf("#compartments", "narrow-comp")
	p.openTemplateList()
	p.shot("narrow-picker")
}
