package assemble

import (
	"encoding/json"
	"fmt"

	"gibbsheet/pathways"
)

// TemplatesID is the id of the inert script element that carries the pathway templates in the page.
const TemplatesID = "gibbsheet-templates"

// markTemplates in src/index.html is replaced by the templates element.
const markTemplates = "<!-- gibbsheet:templates -->"

// template is one entry of the templates element: the picker's line and the worksheet it opens.
type template struct {
	File    string          `json:"file"`
	Title   string          `json:"title"`
	Summary string          `json:"summary"`
	Doc     json.RawMessage `json:"doc"`
}

// templatesElement returns the element that embeds every pathway template, so that the page opened from
// file:// needs no fetch: [{file, title, summary, doc}] as JSON, gzip-compressed and written as text by
// Text7 like the engine (a quarter of the size of the JSON), inflated by the page at start.
func templatesElement() (string, error) {
	all, err := pathways.All()
	if err != nil {
		return "", fmt.Errorf("assemble: pathway templates: %w", err)
	}
	list := make([]template, 0, len(all))
	for _, t := range all {
		list = append(list, template{File: t.File, Title: t.Title, Summary: t.Summary, Doc: t.Doc})
	}
	raw, err := json.Marshal(list)
	if err != nil {
		return "", fmt.Errorf("assemble: pathway templates: %w", err)
	}
	gz, err := compress(raw, false)
	if err != nil {
		return "", fmt.Errorf("assemble: pathway templates: %w", err)
	}
	return `<script type="application/octet-stream" id="` + TemplatesID + `" data-encoding="gzip+text7" data-length="` +
		fmt.Sprint(gz.Len()) + `">` + Text7(gz.Bytes()) + `</script>`, nil
}
