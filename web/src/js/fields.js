// Binding of input fields to places in the worksheet document. A field shows the document's value (or
// the draft the user left there), writes what the user types back into the document and is marked when
// the page or the engine finds the entry wrong. Nothing typed is thrown away: text the document cannot
// hold stays in the field as a draft.

import { store, setDraft, clearDraft, recompute, fieldError } from "./state.js";
import { readNumber } from "./format.js";

const bound = new Set();

// bind connects input to the document place named path. show() returns the text for the document's
// current value; take(text) stores text in the document and returns "" or why it cannot.
export function bind(input, path, show, take, kind = "values") {
  input.dataset.path = path;
  const b = { input, path, show };
  input.addEventListener("input", () => {
    const msg = take(input.value);
    if (msg) setDraft(path, input.value, msg);
    else clearDraft(path);
    recompute(kind);
  });
  input.addEventListener("blur", () => {
    if (!store.drafts.has(path)) input.value = show();
  });
  bound.add(b);
  if (store.doc) b.input.value = show();
  return b;
}

// numberTake makes a take function for a numeric field. set(v) stores the number; an empty field stores
// opts.empty when opts.allowEmpty, else it is an error. opts.from converts the typed value (units).
export function numberTake(set, opts = {}) {
  return (text) => {
    const r = readNumber(text);
    if (r.empty) {
      if (opts.allowEmpty) {
        set(opts.empty);
        return "";
      }
      return "enter a number; the results use the last valid value";
    }
    if (r.error) return r.error + "; the results use the last valid value";
    set(opts.from ? opts.from(r.value) : r.value);
    return "";
  };
}

// refreshFields shows the document's values in every bound field the user is not typing in.
export function refreshFields() {
  for (const b of bound) {
    if (!b.input.isConnected) {
      bound.delete(b);
      continue;
    }
    if (document.activeElement === b.input) continue;
    const d = store.drafts.get(b.path);
    const text = d ? d.text : b.show();
    if (b.input.value !== text) b.input.value = text;
  }
}

// markFields marks every field under root whose entry is wrong, with the message as its description.
export function markFields(root = document) {
  for (const input of root.querySelectorAll("[data-path]")) {
    const msg = fieldError(input.dataset.path);
    if (msg) {
      input.setAttribute("aria-invalid", "true");
      input.title = msg;
    } else if (input.hasAttribute("aria-invalid")) {
      input.removeAttribute("aria-invalid");
      input.removeAttribute("title");
    }
  }
}
