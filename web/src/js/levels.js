// The concentrations panel: every compound that appears in the steps, with the concentration entered
// for it (value and unit as typed, e.g. "50 uM") or the default, and which ones are still at the default.

import { store, recompute, fieldError } from "./state.js";
import { el, molar } from "./format.js";
import { bind } from "./fields.js";

const lines = new Map(); // concentration key -> {tr, input, use, msg}

// keyFor finds the key under which the document holds the compound's concentration, matching names
// case-insensitively; a compound with none gets its name as first written.
export function keyFor(cu) {
  const want = [cu.id, cu.library, cu.name].filter(Boolean).map((s) => s.toLowerCase());
  for (const k of Object.keys(store.doc.concentrations)) {
    if (want.includes(k.toLowerCase())) return k;
  }
  return cu.id;
}

export function setupLevels() {
  bind(document.getElementById("default-conc"), "defaultConcentration", () => store.doc.defaultConcentration ?? "",
    (t) => { if (t.trim() === "") delete store.doc.defaultConcentration; else store.doc.defaultConcentration = t; return ""; });
}

function makeLine(key) {
  const line = { key };
  line.name = el("th", { scope: "row" });
  line.input = el("input", { class: "conc", spellcheck: "false", autocomplete: "off", size: "9" });
  line.use = el("td", { class: "use" });
  line.msg = el("div", { class: "field-msg", role: "alert" });
  line.tr = el("tr", {}, line.name, el("td", {}, line.input, line.msg), line.use);
  bind(line.input, `concentrations.${key}`, () => store.doc.concentrations[key] ?? "", (t) => {
    if (t.trim() === "") delete store.doc.concentrations[key];
    else store.doc.concentrations[key] = t;
    return "";
  });
  return line;
}

// renderLevels draws the table from the result's compounds and the document's concentrations.
export function renderLevels() {
  const body = document.getElementById("levels-body");
  const res = store.result;
  const used = res?.compounds ?? [];
  const entries = used.map((cu) => ({ key: keyFor(cu), cu }));
  const usedKeys = new Set(entries.map((e) => e.key.toLowerCase()));
  for (const k of Object.keys(store.doc.concentrations)) {
    if (!usedKeys.has(k.toLowerCase())) entries.push({ key: k, cu: null });
  }
  const keep = new Set();
  entries.forEach((e, i) => {
    let line = lines.get(e.key);
    if (!line) {
      line = makeLine(e.key);
      lines.set(e.key, line);
    }
    keep.add(e.key);
    if (body.children[i] !== line.tr) body.insertBefore(line.tr, body.children[i] ?? null);
    drawLine(line, e.cu);
  });
  for (const [k, line] of lines) {
    if (!keep.has(k)) {
      line.tr.remove();
      lines.delete(k);
    }
  }
  const atDefault = used.filter((cu) => cu.atDefault && !cu.fixed);
  const def = store.doc.defaultConcentration || "1 mM";
  document.getElementById("levels-summary").textContent = used.length === 0 ? "No compounds in the steps yet."
    : atDefault.length === 0 ? `${used.length} compounds; every one has its own concentration.`
      : `${used.length} compounds; ${atDefault.length} still at the default (${def}): ${atDefault.map((c) => c.id).join(", ")}.`;
}

function drawLine(line, cu) {
  const name = cu ? cu.id : line.key;
  line.name.replaceChildren(el("span", { class: "cname" }, name),
    cu && cu.name && cu.name.toLowerCase() !== name.toLowerCase() ? el("span", { class: "aside" }, " " + cu.name) : "",
    cu?.own ? el("span", { class: "tag" }, " worksheet") : "",
    cu?.approximation ? el("details", { class: "approx" }, el("summary", {}, "≈ approximate data"), el("span", {}, cu.approximation)) : "");
  line.tr.classList.toggle("at-default", !!cu?.atDefault && !cu?.fixed);
  line.tr.classList.toggle("unused", !cu);
  line.input.disabled = !!cu?.fixed && !(line.key in store.doc.concentrations);
  line.input.placeholder = cu?.fixed ? "fixed" : cu?.atDefault ? `default ${cu.text}` : "";
  line.input.setAttribute("aria-label", `Concentration of ${name}`);
  if (!cu) {
    line.use.replaceChildren(el("span", { class: "aside" }, "not in any step "),
      el("button", { type: "button", class: "quiet small", onclick: () => { delete store.doc.concentrations[line.key]; recompute("structure"); } }, "remove"));
  } else if (cu.fixed) {
    line.use.replaceChildren(el("span", { class: "aside" }, cu.fixed));
  } else {
    line.use.replaceChildren(molar(cu.concentration), cu.atDefault ? el("span", { class: "tag default" }, " default") : "");
  }
  const msg = fieldError(`concentrations.${line.key}`);
  line.msg.textContent = msg ? "✕ " + msg : "";
  line.msg.hidden = !msg;
}
