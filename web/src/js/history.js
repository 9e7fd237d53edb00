// Undo and redo for every edit of the worksheet. After each recompute the document is compared with the
// last snapshot (its JSON text); a difference is one step of history. Keystrokes in the same field less
// than a moment apart make one step, so that undo takes back a word, not a letter. Loading another
// worksheet starts a new history. Ctrl+Z (⌘Z) undoes; Ctrl+Shift+Z, Ctrl+Y (⌘⇧Z) redo.

import { store, onChange, recompute } from "./state.js";

// MERGE_MS is how close together two edits of the same field must be to count as one step.
const MERGE_MS = 800;
// LIMIT is how many steps are kept.
const LIMIT = 500;

const hist = { past: [], future: [], now: "", at: 0, field: null, restoring: false, listeners: [] };

// isRestoring is true while undo or redo puts a snapshot back (a "load" that is not a new worksheet).
export function isRestoring() {
  return hist.restoring;
}

// onHistory registers fn() to run when what undo and redo can do changes.
export function onHistory(fn) {
  hist.listeners.push(fn);
}

function changed() {
  for (const fn of hist.listeners) fn();
}

function track(kind) {
  if (kind === "analysis") return; // the document did not change
  if (!store.doc || hist.restoring) return;
  const text = JSON.stringify(store.doc);
  if (kind === "load") {
    hist.past = [];
    hist.future = [];
    hist.now = text;
    hist.field = null;
    changed();
    return;
  }
  if (text === hist.now) return;
  const field = document.activeElement;
  const t = performance.now();
  const merge = hist.past.length > 0 && hist.future.length === 0 && field === hist.field &&
    field && field !== document.body && t - hist.at < MERGE_MS;
  if (!merge) {
    hist.past.push(hist.now);
    if (hist.past.length > LIMIT) hist.past.shift();
  }
  hist.future = [];
  hist.now = text;
  hist.field = field;
  hist.at = t;
  changed();
}

// canUndo and canRedo report whether there is a step to take back or to take again.
export function canUndo() {
  return hist.past.length > 0;
}

export function canRedo() {
  return hist.future.length > 0;
}

function restore(text) {
  // The focused field is not redrawn while it has the focus, so it is left and taken again.
  const active = document.activeElement;
  if (active && active !== document.body) active.blur();
  hist.restoring = true;
  try {
    store.doc = JSON.parse(text);
    store.drafts.clear();
    hist.now = text;
    hist.field = null;
    recompute("load");
  } finally {
    hist.restoring = false;
  }
  if (active && active.isConnected && active !== document.body) active.focus();
  changed();
}

// undo takes back the last step; it reports whether there was one.
export function undo() {
  if (!hist.past.length) return false;
  hist.future.push(hist.now);
  restore(hist.past.pop());
  return true;
}

// redo takes again the last step undone.
export function redo() {
  if (!hist.future.length) return false;
  hist.past.push(hist.now);
  restore(hist.future.pop());
  return true;
}

// setupHistory starts tracking edits and takes the keys.
export function setupHistory() {
  onChange(track);
  document.addEventListener("keydown", (ev) => {
    if (!(ev.ctrlKey || ev.metaKey) || ev.altKey) return;
    const k = ev.key.toLowerCase();
    const isUndo = k === "z" && !ev.shiftKey;
    const isRedo = (k === "z" && ev.shiftKey) || (k === "y" && !ev.shiftKey);
    if (!isUndo && !isRedo) return;
    // Fields that are not part of the worksheet (searching the templates, renaming in the list) keep
    // their own undo.
    if (ev.target.closest?.("#tpl-picker, #sheets, #compare") || ev.target.type === "search") return;
    ev.preventDefault(); // the document's history, not the field's own
    if (isUndo) undo();
    else redo();
  });
  const undoB = document.getElementById("undo");
  const redoB = document.getElementById("redo");
  undoB?.addEventListener("click", undo);
  redoB?.addEventListener("click", redo);
  onHistory(() => {
    if (undoB) undoB.disabled = !canUndo();
    if (redoB) redoB.disabled = !canRedo();
  });
  if (store.doc) track("load");
}
