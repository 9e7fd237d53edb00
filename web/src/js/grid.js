// The grid of reaction steps. Each document row has one table row that lives as long as the document
// row does (so typing never loses focus), plus a message line below it for the row's errors, warnings
// and note. Inputs write into store.doc; the computed cells are drawn from store.result.

import { store, edit, recompute, setDraft, clearDraft } from "./state.js";
import { el, energy, energyIn, energyFrom, editText, num, powerOfTen, codeUnitOffset, unitLabel } from "./format.js";
import { numberTake } from "./fields.js";
import { attachCompletion } from "./complete.js";
import { deleteRow, duplicateRow, moveRow } from "./rows.js";
import { transportTag, transportDetail } from "./compartments.js";

// STATUS gives each status its symbol and words, so that it reads without colour.
export const STATUS = {
  "uphill": { symbol: "▲", word: "uphill", hint: "ΔrG' > 0: this step cannot run forward at these concentrations" },
  "near-equilibrium": { symbol: "≈", word: "near equilibrium", hint: "ΔrG' is within the near-equilibrium band of 0" },
  "downhill": { symbol: "▽", word: "downhill", hint: "ΔrG' < 0: the step runs forward" },
};

export const COLUMNS = ["eq", "times", "dg0"]; // editable cells, left to right

// DATA_NOTES are warning codes about the quality of the data rather than the step; they are folded
// into one expandable line so that the row's own warnings stand out.
const DATA_NOTES = new Set(["approximate-data", "no-enthalpy", "proton", "pyrophosphate"]);

const records = new Map(); // row id -> record

function rowOf(id) {
  return store.doc.rows.find((r) => r.id === id);
}

function draftKey(id, col) {
  return `row:${id}:${col}`;
}

function makeRecord(id) {
  const rec = { id };
  rec.num = el("th", { scope: "row", class: "n" });
  rec.mirror = el("div", { class: "eq-mirror", "aria-hidden": "true" });
  rec.eq = el("input", { class: "cell eq-input", "data-col": "eq", spellcheck: "false", autocomplete: "off" });
  rec.times = el("input", { class: "cell num-in", "data-col": "times", inputmode: "decimal", placeholder: "1" });
  rec.dg0 = el("input", { class: "cell num-in", "data-col": "dg0", inputmode: "decimal", placeholder: "computed" });
  rec.out = {
    dg0: el("td", { class: "out" }), dg: el("td", { class: "out" }), k: el("td", { class: "out" }),
    status: el("td", { class: "out status" }), cost: el("td", { class: "out" }),
  };
  const act = (label, symbol, fn) => el("button", { type: "button", tabindex: "-1", class: "act", title: label, "aria-label": label, onclick: fn }, symbol);
  rec.tr = el("tr", { class: "row", "data-id": id },
    rec.num,
    el("td", { class: "eq" }, el("div", { class: "eq-box" }, rec.mirror, rec.eq)),
    el("td", {}, rec.times), el("td", {}, rec.dg0),
    rec.out.dg0, rec.out.dg, rec.out.k, rec.out.status, rec.out.cost,
    el("td", { class: "acts" },
      act("Move step up (Alt+↑)", "↑", () => moveRow(id, -1)),
      act("Move step down (Alt+↓)", "↓", () => moveRow(id, 1)),
      act("Duplicate step (Alt+Shift+↓)", "❏", () => duplicateRow(id)),
      act("Write a note on this step", "✎", () => openNote(rec)),
      act("Remove step (Alt+Delete)", "✕", () => deleteRow(id))));
  rec.msgs = el("td", { colspan: "9", class: "msgs" });
  rec.sub = el("tr", { class: "sub", "data-for": id, hidden: true }, el("td", {}), rec.msgs);

  rec.eq.addEventListener("input", () => {
    const r = rowOf(id);
    if (r) edit(() => { r.equation = rec.eq.value; });
  });
  const syncScroll = () => { rec.mirror.scrollLeft = rec.eq.scrollLeft; };
  for (const ev of ["scroll", "keyup", "focus", "blur", "click"]) rec.eq.addEventListener(ev, syncScroll);
  attachCompletion(rec.eq);
  bindNumberCell(rec, "times", (r) => (r.times === undefined || r.times === null ? "" : editText(r.times)),
    (r, v) => { if (v === undefined) delete r.times; else r.times = v; }, { allowEmpty: true });
  bindNumberCell(rec, "dg0", (r) => (r.dG0 === null || r.dG0 === undefined ? "" : editText(Number(energyIn(r.dG0, store.ui.unit).toFixed(6)))),
    (r, v) => { r.dG0 = v; }, { allowEmpty: true, empty: null, from: (v) => energyFrom(v, store.ui.unit) });
  return rec;
}

function bindNumberCell(rec, col, show, set, opts) {
  const input = rec[col];
  rec["show_" + col] = () => { const r = rowOf(rec.id); return r ? show(r) : ""; };
  const take = numberTake((v) => { const r = rowOf(rec.id); if (r) set(r, v); }, opts);
  input.addEventListener("input", () => {
    const msg = take(input.value);
    if (msg) setDraft(draftKey(rec.id, col), input.value, msg);
    else clearDraft(draftKey(rec.id, col));
    recompute();
  });
  input.addEventListener("blur", () => {
    if (!store.drafts.has(draftKey(rec.id, col))) input.value = rec["show_" + col]();
  });
}

// record returns the DOM record of the row id (undefined if none).
export function record(id) {
  return records.get(id);
}

// renderStructure puts one table row per document row in document order, keeping existing elements (and
// the focus) and dropping those of removed rows.
export function renderStructure() {
  const body = document.getElementById("grid-body");
  const active = document.activeElement;
  const sel = active && "selectionStart" in active ? [active.selectionStart, active.selectionEnd] : null;
  const keep = new Set();
  let at = 0;
  store.doc.rows.forEach((r, i) => {
    let rec = records.get(r.id);
    if (!rec) {
      rec = makeRecord(r.id);
      records.set(r.id, rec);
    }
    keep.add(r.id);
    if (body.children[at] !== rec.tr) body.insertBefore(rec.tr, body.children[at] ?? null);
    if (body.children[at + 1] !== rec.sub) body.insertBefore(rec.sub, body.children[at + 1] ?? null);
    at += 2;
    rec.num.textContent = String(i + 1);
    rec.eq.setAttribute("aria-label", `Equation of step ${i + 1}`);
    rec.times.setAttribute("aria-label", `Multiplier of step ${i + 1}`);
    rec.dg0.setAttribute("aria-label", `Entered ΔrG'° of step ${i + 1} (${unitLabel(store.ui.unit)})`);
  });
  for (const [id, rec] of records) {
    if (!keep.has(id)) {
      rec.tr.remove();
      rec.sub.remove();
      records.delete(id);
    }
  }
  if (active && active.isConnected && document.activeElement !== active) {
    active.focus();
    if (sel && sel[0] !== null) active.setSelectionRange(sel[0], sel[1]);
  }
  document.getElementById("grid-count").textContent = `${store.doc.rows.length} step${store.doc.rows.length === 1 ? "" : "s"}`;
}

// renderInputs shows the document's values in the row inputs the user is not typing in.
export function renderInputs() {
  for (const r of store.doc.rows) {
    const rec = records.get(r.id);
    if (!rec) continue;
    if (document.activeElement !== rec.eq && rec.eq.value !== r.equation) rec.eq.value = r.equation ?? "";
    for (const col of ["times", "dg0"]) {
      if (document.activeElement === rec[col]) continue;
      const d = store.drafts.get(draftKey(r.id, col));
      const text = d ? d.text : rec["show_" + col]();
      if (rec[col].value !== text) rec[col].value = text;
    }
  }
}

// renderResults draws the computed columns, the status and the messages of every row.
export function renderResults() {
  const res = store.result;
  const byId = new Map((res?.rows ?? []).map((r) => [r.id, r]));
  const unit = store.ui.unit;
  for (const r of store.doc.rows) {
    const rec = records.get(r.id);
    if (!rec) continue;
    const rr = byId.get(r.id);
    const entered = r.dG0 !== null && r.dG0 !== undefined;
    renderMessages(rec, r, rr, !r.equation || !r.equation.trim());
    markRowInputs(rec, r.id);
    // Most edits change few rows: skip the cells of a row whose numbers are as drawn.
    const key = rr ? [rr.dG0, rr.dG, rr.log10K, rr.status, rr.cost?.total, rr.cost?.phosphate, rr.cost?.reducing,
      !!(rr.error || rr.errors?.length), entered, unit, r.equation, transportTag(rr)].join("|") : "none|" + r.equation;
    if (rec.outKey === key) continue;
    rec.outKey = key;
    rec.out.dg0.textContent = rr ? energy(rr.dG0, unit) : "—";
    if (entered && rr && rr.dG0 !== null) rec.out.dg0.append(el("span", { class: "tag", title: "the entered value is used" }, " entered"));
    rec.out.dg.textContent = rr ? energy(rr.dG, unit) : "—";
    rec.out.k.textContent = rr ? powerOfTen(rr.log10K) : "—";
    const st = rr && STATUS[rr.status];
    rec.tr.classList.toggle("st-uphill", rr?.status === "uphill");
    rec.tr.classList.toggle("st-near", rr?.status === "near-equilibrium");
    rec.tr.classList.toggle("st-down", rr?.status === "downhill");
    const hasError = !!(rr && (rr.error || rr.errors?.length));
    const blank = !r.equation || !r.equation.trim();
    rec.tr.classList.toggle("has-error", hasError && !blank);
    rec.out.status.replaceChildren(st
      ? el("span", { class: "badge", title: st.hint }, el("span", { class: "sym", "aria-hidden": "true" }, st.symbol), " " + st.word)
      : el("span", { class: "badge none" }, blank ? "" : hasError ? "✕ not computed" : "—"));
    // Transport rows carry their mark beside the status (compartments.js describes them).
    const xport = transportTag(rr);
    rec.tr.classList.toggle("transport", !!xport);
    if (xport) rec.out.status.append(el("span", { class: "xport", title: transportDetail(rr, unit) }, xport));
    rec.out.cost.textContent = rr?.cost ? num(rr.cost.total, 1) : "—";
    rec.out.cost.title = rr?.cost ? `phosphate ${num(rr.cost.phosphate, 2)}, reducing carriers ${num(rr.cost.reducing, 2)}, total ${num(rr.cost.total, 2)} ATP equivalents` : "";
  }
}

function markRowInputs(rec, id) {
  for (const col of ["times", "dg0"]) {
    const d = store.drafts.get(draftKey(id, col));
    rec[col].toggleAttribute("aria-invalid", !!d);
    rec[col].title = d ? d.message : "";
  }
}

function rowErrors(rr) {
  if (!rr) return [];
  if (rr.errors?.length) return rr.errors;
  return rr.error ? [rr.error] : [];
}

function renderMessages(rec, r, rr, blank) {
  const errs = blank ? [] : rowErrors(rr);
  const drafts = ["times", "dg0"].map((col) => store.drafts.get(draftKey(r.id, col))?.message ?? "");
  // Redraw only what changed: most edits leave most rows' messages as they were.
  const key = JSON.stringify([r.equation, errs, rr?.warnings, drafts, r.note, !!rec.noteOpen, rr?.transport, store.ui.unit]);
  if (rec.msgKey === key) return;
  rec.msgKey = key;
  drawUnderline(rec, r.equation ?? "", errs);
  const items = [];
  for (const e of errs) {
    const where = e.column > 0 ? `column ${e.column}: ` : "";
    // The suggestions become buttons, so the engine's own "did you mean ..." is not repeated.
    const text = e.suggestions?.length ? e.message.replace(/[;,.]?\s*did you mean\b.*$/is, "") : e.message;
    const li = el("li", { class: "err" }, el("span", { class: "sym", "aria-hidden": "true" }, "✕ "), `${where}${text}`);
    if (e.suggestions?.length) {
      li.append(" — did you mean ");
      e.suggestions.forEach((s, i) => {
        if (i) li.append(", ");
        li.append(el("button", { type: "button", class: "suggest", title: `Replace with ${s}`,
          onclick: () => applySuggestion(r.id, e, s) }, s));
      });
      li.append("?");
    }
    items.push(li);
  }
  const notes = [];
  for (const w of rr?.warnings ?? []) {
    const li = el("li", { class: DATA_NOTES.has(w.code) ? "dnote" : "warn", "data-code": w.code },
      el("span", { class: "sym", "aria-hidden": "true" }, DATA_NOTES.has(w.code) ? "ℹ " : "⚠ "), w.message);
    (DATA_NOTES.has(w.code) ? notes : items).push(li);
  }
  if (notes.length) {
    items.push(el("li", { class: "dnotes" }, el("details", {}, el("summary", {}, `ℹ ${notes.length} note${notes.length === 1 ? "" : "s"} on the data`),
      el("ul", {}, ...notes))));
  }
  for (const col of ["times", "dg0"]) {
    const d = store.drafts.get(draftKey(r.id, col));
    if (d) items.push(el("li", { class: "err" }, el("span", { class: "sym", "aria-hidden": "true" }, "✕ "),
      `${col === "times" ? "multiplier" : "entered ΔrG'°"}: ${d.message}`));
  }
  if (rr?.transport?.moves?.length) items.push(el("li", { class: "xport-detail" }, transportDetail(rr, store.ui.unit)));
  if (r.note || rec.noteOpen) items.push(noteItem(rec, r));
  rec.msgs.replaceChildren(items.length ? el("ul", {}, ...items) : "");
  rec.sub.hidden = items.length === 0;
}

// noteItem is the row's note as a field: the text is written to the row when the field is left or Enter
// is pressed (not on every key, so the field is not redrawn under the typing).
function noteItem(rec, r) {
  const input = el("input", { class: "note-input", value: r.note ?? "", "aria-label": `Note on step ${rec.num.textContent}`,
    placeholder: "a note on this step", spellcheck: "true" });
  const take = () => {
    rec.noteOpen = false;
    const text = input.value.trim();
    if (text === (r.note ?? "")) { if (!text) renderRowAgain(rec); return; }
    edit(() => { if (text) r.note = text; else delete r.note; });
  };
  input.addEventListener("change", take);
  input.addEventListener("keydown", (e) => {
    if (e.key === "Enter") { e.preventDefault(); e.stopPropagation(); input.blur(); }
  });
  return el("li", { class: "note" }, el("label", {}, "note: ", input));
}

// openNote shows the note field of a row and puts the cursor in it.
function openNote(rec) {
  rec.noteOpen = true;
  renderRowAgain(rec);
  rec.msgs.querySelector(".note-input")?.focus();
}

function renderRowAgain(rec) {
  rec.msgKey = "";
  const r = rowOf(rec.id);
  const rr = (store.result?.rows ?? []).find((x) => x.id === rec.id);
  if (r) renderMessages(rec, r, rr, !r.equation || !r.equation.trim());
}

// drawUnderline marks the spans of the errors in the mirror behind the equation input.
function drawUnderline(rec, text, errs) {
  const spans = errs.filter((e) => e.column > 0)
    .map((e) => [codeUnitOffset(text, e.column), codeUnitOffset(text, e.column + Math.max(1, e.length))])
    .sort((a, b) => a[0] - b[0]);
  const parts = [];
  let at = 0;
  for (let [s, t] of spans) {
    s = Math.max(s, at);
    if (t <= s && s < text.length) t = s + 1;
    parts.push(text.slice(at, s));
    const seg = text.slice(s, t);
    parts.push(el("mark", {}, seg === "" ? "\u00a0" : seg));
    at = Math.max(at, t);
  }
  parts.push(text.slice(at));
  rec.mirror.replaceChildren(...parts.filter((p) => p !== ""));
  // No scroll sync here: reading scrollLeft would force a layout for every row; the input's own events
  // keep the mirror in step.
  rec.eq.toggleAttribute("aria-invalid", spans.length > 0 || errs.length > 0);
  rec.eq.title = errs.map((e) => e.message).join("\n");
}

function applySuggestion(id, e, s) {
  const r = rowOf(id);
  const rec = records.get(id);
  if (!r || !rec) return;
  const text = r.equation;
  const a = codeUnitOffset(text, e.column);
  const b = codeUnitOffset(text, e.column + e.length);
  edit(() => { r.equation = text.slice(0, a) + s + text.slice(b); });
  rec.eq.value = r.equation;
  rec.eq.focus();
  rec.eq.setSelectionRange(a + s.length, a + s.length);
}

// focusCell puts the cursor in the row's cell col ("eq", "times", "dg0"); where is "end" or "start".
export function focusCell(id, col, where = "end") {
  const rec = records.get(id);
  if (!rec) return false;
  const input = rec[col];
  input.focus();
  const n = where === "start" ? 0 : input.value.length;
  input.setSelectionRange(n, n);
  return true;
}
