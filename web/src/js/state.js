// The page's state. store.doc is exactly the worksheet document (format gibbsheet-worksheet/1) and is
// the only place the worksheet lives: every edit changes it and asks the engine for a new result, and the
// panels draw themselves from store.result. Text that cannot go into the document yet (a pH of "7..2")
// waits in store.drafts, keyed by the field's path, shown in its field and marked.

export const FORMAT = "gibbsheet-worksheet/1";

export const store = {
  doc: null,
  result: null, // last result document from the engine
  evalError: "", // message when the engine refused the whole document
  drafts: new Map(), // path -> {text, message}
  library: [], // [{id, name, synonyms, formula, approximate}]
  engine: null, // globalThis.gibbsheet
  ui: { unit: "kJ", tempUnit: "C", origin: "" },
  lastEvalMs: 0,
};

const listeners = [];

// onChange registers fn(kind) to run after every recompute; kind is "load", "structure" (rows or
// compounds added, removed or moved) or "values".
export function onChange(fn) {
  listeners.push(fn);
}

// emptyDocument is a new worksheet with one empty row.
export function emptyDocument() {
  return {
    format: FORMAT,
    title: "",
    notes: "",
    conditions: { pH: 7, ionicStrength: 0.25, pMg: null, temperature: 298.15 },
    defaultConcentration: "1 mM",
    concentrations: {},
    compounds: [],
    values: {},
    rows: [{ id: "r1", equation: "", times: 1, dG0: null, note: "" }],
  };
}

// loadDocument puts a worksheet document into the page. It is the one entry point for any document,
// whatever it comes from (the embedded demo, a file, a template); origin says which ("demo", "empty",
// ...). Missing containers are added so the panels can edit them; the values in the document are kept.
export function loadDocument(doc, origin = "") {
  if (doc === null || typeof doc !== "object" || Array.isArray(doc)) {
    throw new Error("a worksheet must be a JSON object");
  }
  doc.conditions ??= {};
  doc.concentrations ??= {};
  doc.compounds ??= [];
  doc.values ??= {};
  doc.rows ??= [];
  for (const r of doc.rows) {
    r.id ||= newRowId(doc);
  }
  store.doc = doc;
  store.drafts.clear();
  store.ui.origin = origin;
  recompute("load");
}

// newRowId returns an id no row of doc has.
export function newRowId(doc) {
  const used = new Set(doc.rows.map((r) => r.id));
  let n = doc.rows.length + 1;
  while (used.has("r" + n)) n++;
  return "r" + n;
}

// edit applies change(doc) and recomputes. kind is passed to the listeners.
export function edit(change, kind = "values") {
  change(store.doc);
  recompute(kind);
}

// recompute evaluates the document and tells every listener.
export function recompute(kind = "values") {
  if (store.engine) {
    const t0 = performance.now();
    try {
      store.result = JSON.parse(store.engine.evaluate(JSON.stringify(store.doc)));
      store.evalError = "";
    } catch (e) {
      store.evalError = e && e.message ? e.message : String(e);
    }
    store.lastEvalMs = performance.now() - t0;
  }
  for (const fn of listeners) fn(kind);
}

// setDraft keeps text that could not go into the document, with the reason; clearDraft drops it.
export function setDraft(path, text, message) {
  store.drafts.set(path, { text, message });
}

export function clearDraft(path) {
  store.drafts.delete(path);
}

// fieldError is the message for the field at path: the page's own (a draft) or the engine's.
export function fieldError(path) {
  const d = store.drafts.get(path);
  if (d) return d.message;
  const e = store.result?.errors?.find((x) => x.path === path);
  return e ? e.message : "";
}
