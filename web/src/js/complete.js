// Completion of compound names in equations, from the engine's library and the worksheet's own
// compounds. The term under the cursor is the text after the last " + " or arrow, without its
// coefficient; choosing an entry replaces that term.

import { store } from "./state.js";
import { el } from "./format.js";
import { compartmentTags } from "./compartments.js";

const MAX = 8;
const box = () => document.getElementById("complete");
let current = null; // {input, start, end, items, index}

// separators split an equation into terms, as the engine's grammar does (" + " and the arrows).
const SEPARATOR = / \+ |<=>|⇌|->|→|=/g;

// termAt finds the term around the cursor: {start, end, prefix}.
export function termAt(text, caret) {
  let start = 0;
  let end = text.length;
  for (const m of text.matchAll(SEPARATOR)) {
    const a = m.index;
    const b = a + m[0].length;
    if (b <= caret) start = b;
    else if (a >= caret) { end = Math.min(end, a); break; }
  }
  let s = start;
  while (s < caret && text[s] === " ") s++;
  const coef = /^\d+(?:[./]\d+)?\s+/.exec(text.slice(s, caret));
  if (coef) s += coef[0].length;
  let e = end;
  while (e > caret && text[e - 1] === " ") e--;
  return { start: s, end: Math.max(e, caret), prefix: text.slice(s, caret) };
}

function entries() {
  const list = [];
  for (const c of store.doc?.compounds ?? []) {
    if (c.id) list.push({ id: c.id, name: c.name || c.id, names: [c.id, c.name].filter(Boolean), detail: "worksheet compound" });
  }
  for (const c of store.library) {
    list.push({ id: c.id, name: c.name, names: [c.id, c.name, ...(c.synonyms ?? [])], detail: c.formula + (c.approximate ? " · approximate data" : "") });
  }
  return list;
}

// matches ranks the entries for the typed prefix: exact, then prefix, then word start, then inside.
export function matches(prefix) {
  const p = prefix.trim().toLowerCase();
  if (!p) return [];
  const scored = [];
  for (const e of entries()) {
    let best = 9;
    let text = e.id;
    for (const n of e.names) {
      const l = n.toLowerCase();
      let s = 9;
      if (l === p) s = 0;
      else if (l.startsWith(p)) s = 1;
      else if (l.split(/[\s,()-]+/).some((w) => w.startsWith(p))) s = 2;
      else if (p.length >= 3 && l.includes(p)) s = 3;
      if (s < best) { best = s; text = n; }
    }
    if (best < 9) scored.push({ ...e, insert: text, score: best + (e.names[0] === text ? 0 : 0.5) });
  }
  scored.sort((a, b) => a.score - b.score || a.insert.length - b.insert.length || a.insert.localeCompare(b.insert));
  return scored.slice(0, MAX);
}

// tagMatches offers the compartment tags once a compound name is followed by "[" ("pyruvate[" gives
// pyruvate[c], pyruvate[m], ...); it returns null when the term has no open tag.
export function tagMatches(prefix) {
  const m = /^(.*[^\s[])\[([^\][\s]*)$/.exec(prefix.trim());
  if (!m) return null;
  const part = m[2].toLowerCase();
  return compartmentTags().filter((t) => t.id.toLowerCase().startsWith(part))
    .map((t) => ({ id: t.id, name: t.name, label: `[${t.id}]`, insert: `${m[1]}[${t.id}]`, detail: "compartment", score: 1 }));
}

// isOpen reports whether the list is showing.
export function isOpen() {
  return current !== null && !box().hidden;
}

export function close() {
  current = null;
  box().hidden = true;
  box().replaceChildren();
}

function update(input) {
  const caret = input.selectionStart ?? input.value.length;
  const t = termAt(input.value, caret);
  const items = tagMatches(t.prefix) ?? matches(t.prefix);
  // Nothing to offer, or the name is already complete: then Enter and the arrows keep their grid meaning.
  if (!items.length || (items[0].score === 0 && items[0].insert === t.prefix.trim())) {
    close();
    return;
  }
  current = { input, start: t.start, end: t.end, items, index: 0 };
  draw();
}

function draw() {
  const b = box();
  const { input, items, index } = current;
  b.replaceChildren(...items.map((it, i) => el("div", {
    class: "opt" + (i === index ? " on" : ""), role: "option", "aria-selected": i === index ? "true" : "false",
    onmousedown: (ev) => { ev.preventDefault(); current.index = i; accept(); },
  }, el("b", {}, it.label ?? it.insert), it.insert !== it.name ? el("span", { class: "aside" }, " " + it.name) : "",
  it.insert !== it.id && !it.label ? el("span", { class: "aside" }, ` (${it.id})`) : "", el("span", { class: "detail" }, it.detail))));
  const r = input.getBoundingClientRect();
  b.style.left = `${r.left + window.scrollX}px`;
  b.style.top = `${r.bottom + window.scrollY + 2}px`;
  b.style.minWidth = `${Math.min(r.width, 420)}px`;
  b.hidden = false;
}

// accept puts the chosen name in place of the term and tells the grid.
export function accept() {
  if (!current) return false;
  const { input, start, end, items, index } = current;
  const name = items[index].insert;
  const v = input.value;
  input.value = v.slice(0, start) + name + v.slice(end);
  const caret = start + name.length;
  input.setSelectionRange(caret, caret);
  close();
  input.dispatchEvent(new Event("input", { bubbles: true }));
  close(); // the input event may have reopened it for the completed name
  return true;
}

// key handles a key while the list is open; it returns true when it used the key.
export function handleKey(ev) {
  if (!isOpen()) return false;
  switch (ev.key) {
    case "ArrowDown": current.index = (current.index + 1) % current.items.length; draw(); return true;
    case "ArrowUp": current.index = (current.index + current.items.length - 1) % current.items.length; draw(); return true;
    case "Enter": case "Tab": return accept();
    case "Escape": close(); return true;
  }
  return false;
}

// attachCompletion makes input offer names as the user types.
export function attachCompletion(input) {
  input.addEventListener("input", (ev) => { if (ev.isTrusted !== false || ev.inputType) update(input); });
  input.addEventListener("blur", () => setTimeout(() => { if (current?.input === input) close(); }, 0));
}
