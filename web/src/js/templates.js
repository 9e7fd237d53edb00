// Pathway templates: the ready worksheets of package pathways, embedded in the page when it is built
// (inert JSON in #gibbsheet-templates, so nothing is fetched from file://), and the searchable picker
// that opens one in place of the worksheet on screen.

import { store, loadDocument } from "./state.js";
import { el } from "./format.js";
import { focusCell } from "./grid.js";
import { inflateText } from "./engine.js";

let list = null; // [{file, title, summary, doc, steps, names, haystack}]
let readError = "";
let text = null; // the templates' JSON, once inflated by prepareTemplates

// prepareTemplates inflates the embedded templates (gzip + Text7, like the engine); main awaits it at start.
export async function prepareTemplates() {
  const holder = document.getElementById("gibbsheet-templates");
  if (!holder) return;
  try {
    text = await inflateText(holder);
  } catch (e) {
    readError = "the templates inside this page could not be read: " + (e.message || e);
  }
}

// SEPARATOR splits an equation into terms as the engine's grammar does.
const SEPARATOR = / \+ |<=>|⇌|->|→|=/;

// compoundNames lists the compound names a worksheet uses: the terms of its equations without
// coefficient or compartment tag, its own compounds and its concentration entries.
export function compoundNames(doc) {
  const names = new Set();
  for (const r of doc.rows ?? []) {
    for (const term of String(r.equation ?? "").split(SEPARATOR)) {
      const name = term.trim().replace(/^\d+(?:[./]\d+)?\s+/, "").replace(/\[[^\]]*\]$/, "").trim();
      if (name) names.add(name);
    }
  }
  for (const c of doc.compounds ?? []) if (c.id) names.add(c.id);
  for (const k of Object.keys(doc.concentrations ?? {})) names.add(k.replace(/\[[^\]]*\]$/, ""));
  return [...names];
}

// templates returns the embedded templates (an empty list when the page carries none); the documents
// are the stored ones and must be copied before they are edited (see openTemplate).
export function templates() {
  if (list !== null) return list;
  if (text === null) return []; // not inflated (yet): nothing to offer
  list = [];
  try {
    for (const t of JSON.parse(text)) {
      const names = compoundNames(t.doc);
      list.push({ ...t, steps: (t.doc.rows ?? []).length, names,
        haystack: [t.title, t.summary, ...names].join("\n").toLowerCase() });
    }
  } catch (e) {
    readError = "the templates inside this page could not be read: " + (e.message || e);
    list = [];
  }
  return list;
}

// templateDoc returns a fresh copy of the template's worksheet.
export function templateDoc(t) {
  return JSON.parse(JSON.stringify(t.doc));
}

// filterTemplates keeps the templates whose title, summary or compound names contain every word of
// the query; title matches come first.
export function filterTemplates(query) {
  const words = query.toLowerCase().split(/\s+/).filter(Boolean);
  const hits = templates().filter((t) => words.every((w) => t.haystack.includes(w)));
  const inTitle = (t) => words.every((w) => t.title.toLowerCase().includes(w));
  return hits.sort((a, b) => Number(inTitle(b)) - Number(inTitle(a)));
}

// Hooks for the page's other parts: beforeReplace() returns false when the user wants to keep the
// open worksheet (a "discard unsaved changes?" question); it defaults to yes.
export const templateHooks = { beforeReplace: () => true };

// openTemplate replaces the open worksheet with a copy of the template; it reports whether it did.
export function openTemplate(t) {
  if (!templateHooks.beforeReplace()) return false;
  loadDocument(templateDoc(t), "template");
  return true;
}

const picker = { box: null, input: null, list: null, shown: [], index: 0, opener: null };

// setupTemplates builds the picker and wires the header button.
export function setupTemplates() {
  const box = document.getElementById("tpl-picker");
  const button = document.getElementById("from-template");
  picker.box = box;
  picker.opener = button;
  picker.input = el("input", { type: "search", id: "tpl-search", spellcheck: "false", autocomplete: "off",
    placeholder: "type to search: title, summary or a compound (e.g. pyruvate)", "aria-label": "Search the templates",
    "aria-controls": "tpl-list", "aria-activedescendant": "" });
  picker.list = el("ul", { id: "tpl-list", class: "tpl-list", role: "listbox", "aria-label": "Templates" });
  picker.count = el("p", { class: "aside", id: "tpl-count", role: "status" });
  box.replaceChildren(el("div", { class: "tpl-card" },
    el("div", { class: "tpl-head" }, el("h2", { id: "tpl-h" }, "Start from a template"),
      el("button", { type: "button", class: "quiet small", onclick: closePicker, "aria-label": "Close the template list" }, "✕ close")),
    el("p", { class: "aside" }, "Each template is a textbook pathway with its sources in its notes. Opening one replaces the worksheet on screen. ↑ ↓ choose, Enter opens, Esc closes."),
    picker.input, picker.count, picker.list));
  button.addEventListener("click", () => (box.hidden ? openPicker() : closePicker()));
  picker.input.addEventListener("input", () => { picker.index = 0; drawList(); });
  picker.input.addEventListener("keydown", (ev) => {
    const n = picker.shown.length;
    if (ev.key === "ArrowDown" && n) { picker.index = (picker.index + 1) % n; drawList(); ev.preventDefault(); }
    else if (ev.key === "ArrowUp" && n) { picker.index = (picker.index + n - 1) % n; drawList(); ev.preventDefault(); }
    else if (ev.key === "Enter" && n) { ev.preventDefault(); choose(picker.shown[picker.index]); }
    else if (ev.key === "Escape") { ev.preventDefault(); closePicker(); picker.opener.focus(); }
  });
  box.addEventListener("mousedown", (ev) => { if (ev.target === box) closePicker(); });
}

export function openPicker() {
  picker.box.hidden = false;
  picker.opener.setAttribute("aria-expanded", "true");
  picker.index = 0;
  drawList();
  picker.input.focus();
  picker.input.select();
}

export function closePicker() {
  picker.box.hidden = true;
  picker.opener.setAttribute("aria-expanded", "false");
}

function choose(t) {
  if (openTemplate(t)) {
    closePicker();
    // The cursor goes to the first step, ready to edit (not back to the button, which the Enter that
    // chose the template would press again).
    if (!store.doc.rows.length || !focusCell(store.doc.rows[0].id, "eq", "start")) picker.opener.focus();
  }
}

function drawList() {
  const query = picker.input.value;
  picker.shown = filterTemplates(query);
  if (picker.index >= picker.shown.length) picker.index = 0;
  const all = templates().length;
  picker.count.textContent = readError ? "✕ " + readError
    : all === 0 ? "This page carries no templates."
      : picker.shown.length === 0 ? `No template matches "${query.trim()}".`
        : query.trim() ? `${picker.shown.length} of ${all} templates match.` : `${all} templates.`;
  picker.count.classList.toggle("err", !!readError);
  picker.list.replaceChildren(...picker.shown.map((t, i) => {
    const on = i === picker.index;
    return el("li", { id: `tpl-${i}`, role: "option", class: "tpl-item" + (on ? " on" : ""), "aria-selected": String(on),
      "data-file": t.file, onmousedown: (ev) => { ev.preventDefault(); choose(t); } },
    el("span", { class: "tpl-title" }, t.title),
    el("span", { class: "tpl-steps aside" }, `${t.steps} step${t.steps === 1 ? "" : "s"}`),
    el("span", { class: "tpl-summary" }, t.summary));
  }));
  picker.input.setAttribute("aria-activedescendant", picker.shown.length ? `tpl-${picker.index}` : "");
  picker.list.children[picker.index]?.scrollIntoView({ block: "nearest" });
}
