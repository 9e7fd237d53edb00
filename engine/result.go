package engine

// Result is the document EvaluateJSON returns. Numbers that cannot be computed are nil (JSON null).
type Result struct {
	Rows       []RowResult          `json:"rows"`
	Total      Total                `json:"total"`
	Compounds  []CompoundUse        `json:"compounds"`
	Values     map[string]ValueUsed `json:"values"`
	Conditions ConditionsUsed       `json:"conditions"`
	Warnings   []Warning            `json:"warnings"`
	Errors     []FieldError         `json:"errors,omitempty"`
	MDF        *MDF                 `json:"mdf"`

	// rowJSON holds each row's encoding, made when the row was computed; AppendJSON writes these rather
	// than encoding Rows again. A Result is not to be changed once Evaluate has returned it.
	rowJSON [][]byte
	// useHeads, when set, holds each compound's encoding up to its rows (CompoundUse.appendJSONHead).
	useHeads [][]byte
}

// Status of a row at the entered concentrations.
const (
	StatusUphill          = "uphill"           // ΔrG' > 0: the step cannot run forward
	StatusNearEquilibrium = "near-equilibrium" // −band ≤ ΔrG' ≤ 0
	StatusDownhill        = "downhill"         // ΔrG' < −band
)

// RowResult is one evaluated row. DG0 and DG are per reaction as written (kJ/mol); Cost includes the row's
// multiplier.
type RowResult struct {
	ID        string     `json:"id"`
	Equation  string     `json:"equation"`
	Times     float64    `json:"times"`
	DG0       *float64   `json:"dG0"`
	DG        *float64   `json:"dG"`
	K         *float64   `json:"K"`
	Q         *float64   `json:"Q"`
	Log10K    *float64   `json:"log10K"`
	Log10Q    *float64   `json:"log10Q"`
	Status    string     `json:"status"`
	Cost      *Cost      `json:"cost"`
	Warnings  []Warning  `json:"warnings"`
	Transport *Transport `json:"transport,omitempty"`
	FluxForce *FluxForce `json:"fluxForce,omitempty"`
	Remedy    *Remedy    `json:"toDownhill,omitempty"`
	Error     *RowError  `json:"error,omitempty"`
	Errors    []RowError `json:"errors,omitempty"`
}

// Transport describes what a row moves between compartments: each move, and the work of moving (the
// pH and membrane-potential terms, kJ/mol, included in the row's ΔrG'°).
type Transport struct {
	Moves []Move  `json:"moves"`
	Work  float64 `json:"work"`
}

// Move is an amount of one compound carried from one compartment to another by a row.
type Move struct {
	Compound string  `json:"compound"`
	From     string  `json:"from"`
	To       string  `json:"to"`
	Amount   float64 `json:"amount"`
	Work     float64 `json:"work"` // kJ per mole moved
}

// Cost in ATP equivalents: positive is spent, negative is gained. Reducing counts reduced carriers; Total
// adds Phosphate and each carrier weighted by its P/O ratio.
// Protons counts protons let back across a membrane down their gradient (negative: pumped out), and
// ProtonATP their worth in ATP at the protons-per-ATP value in use; Total includes it.
type Cost struct {
	Phosphate float64 `json:"phosphate"`
	Reducing  float64 `json:"reducing"`
	Protons   float64 `json:"protons"`
	ProtonATP float64 `json:"protonATP"`
	Total     float64 `json:"total"`
}

func (c *Cost) add(d Cost) {
	c.Phosphate += d.Phosphate
	c.Reducing += d.Reducing
	c.Protons += d.Protons
	c.ProtonATP += d.ProtonATP
	c.Total += d.Total
}

// RowError is a problem in a row's equation or data. Column and Length (in characters, Column 1-based) mark
// the span of the equation text to underline; Column is 0 when the problem is not in the text.
type RowError struct {
	Message     string   `json:"message"`
	Column      int      `json:"column"`
	Length      int      `json:"length"`
	Suggestions []string `json:"suggestions,omitempty"`
}

// Warning is something a careful biochemist would want to know; it never stops the computation.
type Warning struct {
	Code    string `json:"code"`
	Message string `json:"message"`
	Path    string `json:"path,omitempty"`
}

// FieldError is a wrong value in a document field, named by its JSON path ("conditions.pH",
// "concentrations.ATP"); the value stays in the document as the user typed it.
type FieldError struct {
	Path    string `json:"path"`
	Message string `json:"message"`
}

// Total is the pathway: the net reaction of all rows times their multipliers, intermediates cancelled.
type Total struct {
	Equation string   `json:"equation"`
	DG0      *float64 `json:"dG0"`
	DG       *float64 `json:"dG"`
	Cost     Cost     `json:"cost"`
}

// CompoundUse describes a compound that appears in the rows, in order of first appearance.
type CompoundUse struct {
	ID            string   `json:"id"` // as first written in an equation, in normal form, with its tag
	Compartment   string   `json:"compartment"`
	Name          string   `json:"name"`    // full name
	Library       string   `json:"library"` // library id, "" for the worksheet's own compounds
	Own           bool     `json:"own"`     // one of the worksheet's own compounds
	Concentration *float64 `json:"concentration"`
	Text          string   `json:"text"`      // the concentration as entered, or the default's text
	AtDefault     bool     `json:"atDefault"` // no concentration entered
	Fixed         string   `json:"fixed,omitempty"`
	DfG0Prime     *float64 `json:"dfG0prime"`
	Approximation string   `json:"approximation,omitempty"` // how the compound's data are approximate
	Rows          []string `json:"rows"`
}

// ValueUsed is the energy value of a compound in use.
type ValueUsed struct {
	Phosphate     float64 `json:"phosphate"`
	Reducing      float64 `json:"reducing"`
	PO            float64 `json:"po"`
	ProtonsPerATP float64 `json:"protonsPerATP,omitempty"`
}

// ConditionsUsed are the conditions after defaults are filled in; PMg is nil when magnesium is ignored.
type ConditionsUsed struct {
	PH              float64  `json:"pH"`
	IonicStrength   float64  `json:"ionicStrength"`
	PMg             *float64 `json:"pMg"`
	Temperature     float64  `json:"temperature"`
	RT              float64  `json:"RT"`
	NearEquilibrium float64  `json:"nearEquilibrium"`
}
