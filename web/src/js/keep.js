// Keeping worksheets in the browser: every edit is written to local storage at once, per worksheet, and
// a file opened again finds the edits made to it; the Worksheets list opens, renames, duplicates and
// deletes the kept ones. A worksheet is kept from its first edit on.
//
// Storage: "gibbsheet:index" holds [{id, title, edited (ms), origin}], "gibbsheet:doc:ID" the document,
// and "gibbsheet:file:KEY" the id of the worksheet last edited from a given file, KEY being the file's
// path and a hash of the worksheet the file carries (a new file under the same name is a new worksheet).

import { store, onChange, loadDocument, edit } from "./state.js";
import { el } from "./format.js";
import { isRestoring } from "./history.js";
import { embeddedText, fingerprint, isDirty, say, markEmbedded, beforeImport } from "./share.js";
import { templateHooks } from "./templates.js";

const INDEX = "gibbsheet:index";
const DOC = "gibbsheet:doc:";
const FILE = "gibbsheet:file:";

const keep = { id: "", stored: "", fileKey: "", bindFile: false, opening: false, ok: true, panel: null };

function storage() {
  try {
    return globalThis.localStorage ?? null;
  } catch {
    return null; // storage switched off for file pages
  }
}

function newId() {
  return "w" + Date.now().toString(36) + Math.floor(Math.random() * 1e6).toString(36);
}

// sheets returns the kept worksheets, the most recently edited first.
export function sheets() {
  const ls = storage();
  if (!ls) return [];
  try {
    const list = JSON.parse(ls.getItem(INDEX) ?? "[]");
    return Array.isArray(list) ? list.filter((e) => e && typeof e.id === "string").sort((a, b) => b.edited - a.edited) : [];
  } catch {
    return [];
  }
}

function writeIndex(list) {
  storage().setItem(INDEX, JSON.stringify(list));
}

function readDoc(id) {
  try {
    const text = storage()?.getItem(DOC + id);
    return text ? JSON.parse(text) : null;
  } catch {
    return null;
  }
}

// currentSheet is the id under which the open worksheet is kept ("" before its first edit).
export function currentSheet() {
  return keep.stored ? keep.id : "";
}

// persist writes the open worksheet; it is called after every recompute.
function persist() {
  const ls = storage();
  if (!ls || !store.doc) return;
  const text = JSON.stringify(store.doc);
  if (text === keep.stored) return;
  try {
    ls.setItem(DOC + keep.id, text);
    const list = sheets().filter((e) => e.id !== keep.id);
    list.push({ id: keep.id, title: String(store.doc.title ?? ""), edited: Date.now(), origin: store.ui.origin });
    writeIndex(list);
    if (keep.bindFile) ls.setItem(FILE + keep.fileKey, keep.id);
    keep.stored = text;
    if (!keep.ok) say("ok", "Edits are kept in this browser again.");
    keep.ok = true;
  } catch (e) {
    if (keep.ok) say("err", "This browser refused to keep the edits (" + (e.message || e) + "); save the worksheet as a file.");
    keep.ok = false;
  }
  if (keep.panel && !keep.panel.hidden) drawList();
}

function track(kind) {
  if (kind === "analysis") return; // the document did not change
  if (kind === "load" && !isRestoring()) {
    if (keep.opening) return; // openSheet set the id
    // Another worksheet came in (new, template, file): it is kept under a new id from its first edit.
    keep.id = newId();
    keep.stored = JSON.stringify(store.doc);
    keep.bindFile = false;
    if (keep.panel && !keep.panel.hidden) drawList();
    return;
  }
  persist();
}

// chooseInitial decides what the page opens with: the file's own worksheet, or the edits made to it in
// this browser when there are some. initial is {doc, origin}; the result has the same form.
export function chooseInitial(initial) {
  keep.fileKey = location.pathname + "#" + fingerprint(embeddedText());
  const ls = storage();
  const id = ls?.getItem(FILE + keep.fileKey);
  const doc = id ? readDoc(id) : null;
  const entry = id ? sheets().find((e) => e.id === id) : null;
  if (!doc || !entry) return { ...initial, first: () => startFromFile() };
  return {
    doc, origin: entry.origin || "stored", restored: true,
    first: () => {
      keep.id = id;
      keep.stored = JSON.stringify(store.doc);
      keep.bindFile = true;
      const when = new Date(entry.edited).toLocaleString();
      say("ok", `Your edits to this worksheet, kept in this browser (last ${when}), are open.`);
      const box = document.getElementById("share-msg");
      box?.append(" ", el("button", { type: "button", class: "small", id: "open-file-version",
        onclick: () => {
          if (!mayReplace()) return;
          loadDocument(structuredClone(initial.doc), initial.origin);
          markEmbedded();
          keep.bindFile = true;
          box.hidden = true;
        } }, "Open the file's version instead"));
    },
  };
}

function startFromFile() {
  keep.id = newId();
  keep.stored = JSON.stringify(store.doc);
  keep.bindFile = true;
}

// mayReplace asks before the open worksheet is replaced when its edits are kept nowhere.
export function mayReplace() {
  if (keep.ok && storage()) return true;
  if (!isDirty()) return true;
  return confirm("The edits to this worksheet are not saved anywhere (this browser does not keep them). Discard them?");
}

// openSheet opens a kept worksheet.
export function openSheet(id) {
  const doc = readDoc(id);
  const entry = sheets().find((e) => e.id === id);
  if (!doc || !entry) {
    say("err", "That worksheet is no longer kept in this browser.");
    drawList();
    return false;
  }
  if (!mayReplace()) return false;
  keep.opening = true;
  try {
    keep.id = id;
    keep.bindFile = false;
    loadDocument(doc, entry.origin || "stored");
    keep.stored = JSON.stringify(store.doc);
  } finally {
    keep.opening = false;
  }
  drawList();
  return true;
}

// renameSheet gives a kept worksheet a new title (the open one through an edit, so undo takes it back).
export function renameSheet(id, title) {
  if (id === currentSheet()) {
    edit((doc) => { doc.title = title; });
    return;
  }
  const doc = readDoc(id);
  if (!doc) return;
  doc.title = title;
  try {
    storage().setItem(DOC + id, JSON.stringify(doc));
    writeIndex(sheets().map((e) => (e.id === id ? { ...e, title } : e)));
  } catch (e) {
    say("err", "The new name could not be kept: " + (e.message || e));
  }
  drawList();
}

// duplicateSheet keeps a copy of a kept worksheet under "(copy)" and returns its id.
export function duplicateSheet(id) {
  const doc = id === currentSheet() ? structuredClone(store.doc) : readDoc(id);
  const entry = sheets().find((e) => e.id === id);
  if (!doc || !entry) return "";
  const copy = newId();
  doc.title = (doc.title || "Untitled worksheet") + " (copy)";
  try {
    storage().setItem(DOC + copy, JSON.stringify(doc));
    const list = sheets();
    list.push({ id: copy, title: doc.title, edited: Date.now(), origin: entry.origin });
    writeIndex(list);
  } catch (e) {
    say("err", "The copy could not be kept: " + (e.message || e));
    return "";
  }
  drawList();
  return copy;
}

// deleteSheet forgets a kept worksheet after asking; the open one cannot be deleted.
export function deleteSheet(id) {
  const entry = sheets().find((e) => e.id === id);
  if (!entry || id === currentSheet()) return false;
  if (!confirm(`Delete "${entry.title || "Untitled worksheet"}" from this browser? This cannot be undone.`)) return false;
  const ls = storage();
  ls.removeItem(DOC + id);
  writeIndex(sheets().filter((e) => e.id !== id));
  for (let i = ls.length - 1; i >= 0; i--) {
    const k = ls.key(i);
    if (k?.startsWith(FILE) && ls.getItem(k) === id) ls.removeItem(k);
  }
  drawList();
  return true;
}

function drawList() {
  const body = document.getElementById("sheets-list");
  if (!body) return;
  const list = sheets();
  const cur = currentSheet();
  const items = list.map((e) => {
    const title = e.title || "Untitled worksheet";
    const name = el("span", { class: "sheet-name" }, title);
    const li = el("li", { class: e.id === cur ? "sheet open" : "sheet", "data-id": e.id },
      name, el("span", { class: "aside" }, " · " + (e.id === cur ? "open now · " : "") + new Date(e.edited).toLocaleString()));
    const act = (label, fn, disabled) => el("button", { type: "button", class: "small", onclick: fn, disabled, "data-act": label }, label);
    li.append(" ",
      act("Open", () => openSheet(e.id), e.id === cur),
      act("Rename", () => startRename(li, name, e)),
      act("Duplicate", () => duplicateSheet(e.id)),
      act("Delete", () => deleteSheet(e.id), e.id === cur));
    return li;
  });
  body.replaceChildren(...items);
  document.getElementById("sheets-empty").hidden = items.length > 0;
}

function startRename(li, name, e) {
  const input = el("input", { class: "sheet-rename", value: e.title, "aria-label": "New name", spellcheck: "false" });
  name.replaceWith(input);
  input.focus();
  input.select();
  let done = false;
  const finish = (ok) => {
    if (done) return;
    done = true;
    if (ok && input.value !== e.title) renameSheet(e.id, input.value);
    else drawList();
  };
  input.addEventListener("keydown", (ev) => {
    if (ev.key === "Enter") { ev.preventDefault(); finish(true); }
    if (ev.key === "Escape") { ev.preventDefault(); finish(false); }
  });
  input.addEventListener("blur", () => finish(true));
}

// setupKeep starts keeping edits and wires the Worksheets list.
export function setupKeep() {
  onChange(track);
  templateHooks.beforeReplace = mayReplace;
  beforeImport(mayReplace);
  keep.panel = document.getElementById("sheets");
  const button = document.getElementById("show-sheets");
  button?.addEventListener("click", () => {
    keep.panel.hidden = !keep.panel.hidden;
    button.setAttribute("aria-expanded", String(!keep.panel.hidden));
    if (!keep.panel.hidden) drawList();
  });
  window.addEventListener("storage", (ev) => {
    if (ev.key === INDEX && !keep.panel.hidden) drawList();
  });
  // Closing the tab with edits kept nowhere (neither in a file nor in this browser): the browser asks,
  // in its own words. Edits kept in the browser come back when the file is opened again.
  window.addEventListener("beforeunload", (ev) => {
    if (isDirty() && !(keep.ok && storage())) {
      ev.preventDefault();
      ev.returnValue = "";
    }
  });
}
