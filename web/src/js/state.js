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
// compounds added, removed or moved) or "values"; and with kind "analysis" when the max-min driving
// force of the document arrives (the document itself did not change).
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

// showSaved puts a worksheet document into the page before the engine has started (loadDocument
// otherwise), with the result saved with it in the file, or none (null); the engine's first answer
// replaces it.
export function showSaved(doc, result, origin) {
  store.result = result;
  live.mdf = result?.mdf ?? null; // shown with the engine's first answer until its own analysis follows
  loadDocument(doc, origin);
}

// edit applies change(doc) and recomputes. kind is passed to the listeners.
export function edit(change, kind = "values") {
  change(store.doc);
  recompute(kind);
}

// recompute evaluates the document and tells every listener. The engine answers with what changed since
// the answer the page holds (gibbsheet.changes: rows that did not change come as their index in it), and
// the max-min driving force, which weighs the whole pathway, follows in a task of its own so that the
// rows are drawn first; the listeners hear of it with kind "analysis".
export function recompute(kind = "values") {
  // Before the engine has started, the result shown is the one saved with the file, which an edit
  // makes another document's: nothing is shown until the engine computes.
  if (!store.engine && kind !== "load") store.result = live.mdf = null;
  evaluateDocument();
  for (const fn of listeners) fn(kind);
}

// evaluateDocument puts the engine's answer for the document in store.result (or its message in
// store.evalError) and asks for the analysis to follow.
export function evaluateDocument() {
  if (!store.engine) return;
  const t0 = performance.now();
  try {
    store.result = merge(JSON.parse(store.engine.changes(JSON.stringify(store.doc), live.seq)));
    store.evalError = "";
    scheduleAnalysis();
  } catch (e) {
    store.evalError = e && e.message ? e.message : String(e);
  }
  store.lastEvalMs = performance.now() - t0;
}

// live is what the page holds of the engine's answers: the number of the latest, the warnings of its
// rows and totals, and the latest analysis, shown until the next one arrives.
const live = { seq: 0, warnings: [], mdf: null, mdfWarnings: [], pending: false };

// merge turns a changes document into the full result document.
function merge(changes) {
  const prev = store.result;
  if (changes.base !== 0 && (!prev || changes.base !== live.seq)) {
    throw new Error("the engine answered about a result this page does not hold; reload the page");
  }
  const rows = changes.rows.map((r) => (typeof r === "number" ? prev.rows[r] : r));
  live.seq = changes.seq;
  live.warnings = changes.warnings;
  const { seq, base, ...result } = changes;
  return { ...result, rows, warnings: live.warnings.concat(live.mdfWarnings), mdf: live.mdf };
}

function scheduleAnalysis() {
  if (live.pending) return;
  live.pending = true;
  setTimeout(analyse, 0);
}

// analyse asks for the max-min driving force of the latest answer and tells the listeners.
function analyse() {
  live.pending = false;
  if (!store.result || !store.engine) return;
  let a;
  try {
    a = JSON.parse(store.engine.analysis());
  } catch (e) {
    a = { seq: live.seq, mdf: null, warnings: [{ code: "mdf-failed", message: "the max-min driving force could not be computed: " + (e.message || e) }] };
  }
  if (a.seq !== live.seq) return; // a newer answer has its own analysis coming
  live.mdf = a.mdf;
  live.mdfWarnings = a.warnings;
  store.result = { ...store.result, mdf: a.mdf, warnings: live.warnings.concat(a.warnings) };
  for (const fn of listeners) fn("analysis");
}

// settled resolves once the analysis of the latest answer is in store.result.
export function settled() {
  return new Promise((resolve) => {
    const check = () => (live.pending ? setTimeout(check, 0) : resolve());
    check();
  });
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
