// Compartments: the table of the worksheet's compartments (store.doc.compartments: id, name, pH, ionic
// strength, pMg, electric potential in mV; empty fields use the conditions strip), the compartment that
// untagged compounds are in, the protons-per-ATP value used to price protons moved across membranes,
// and the marks of transport rows that the grid shows. The engine computes the transport work.

import { store, edit } from "./state.js";
import { el, editText, energyIn, num, unitLabel, signed } from "./format.js";
import { bind, numberTake } from "./fields.js";

// DEFAULT_COMPARTMENT is the engine's default compartment id (engine.DefaultCompartment).
export const DEFAULT_COMPARTMENT = "c";

const FIELDS = [
  // key, column label, unit, size
  ["pH", "pH", "", 4],
  ["ionicStrength", "I", "M", 4],
  ["pMg", "pMg", "", 4],
  ["potential", "potential", "mV", 5],
];

const ui = {};
let drawnCount = -1;

// compartmentTags lists the tags an equation can use: the worksheet's compartments and the default
// one, with their names, for completion.
export function compartmentTags() {
  const def = (store.doc?.defaultCompartment || "").trim() || DEFAULT_COMPARTMENT;
  const out = [];
  for (const c of store.doc?.compartments ?? []) {
    const id = String(c.id ?? "").trim();
    if (id && !out.some((t) => t.id === id)) out.push({ id, name: c.name || (id === def ? "default compartment" : "compartment") });
  }
  if (!out.some((t) => t.id === def)) out.unshift({ id: def, name: "default compartment (the conditions strip)" });
  return out;
}

// transportTag is the short mark of a transport row, "⇄ transport c→m", or "" for other rows.
export function transportTag(rr) {
  const t = rr?.transport;
  if (!t || !t.moves?.length) return "";
  const ways = [...new Set(t.moves.map((m) => `${m.from}→${m.to}`))];
  return `⇄ transport ${ways.join(", ")}`;
}

// transportDetail describes what a transport row moves and the work of moving it (included in ΔrG'°).
export function transportDetail(rr, unit) {
  const t = rr?.transport;
  if (!t || !t.moves?.length) return "";
  const u = unitLabel(unit);
  const moves = t.moves.map((m) => `${num(m.amount, m.amount % 1 ? 2 : 0)} ${m.compound} ${m.from}→${m.to} (${signed(energyIn(m.work, unit), 2)} ${u} each)`);
  const c = rr.cost;
  const protons = !c || !c.protons ? "" : ` · ${c.protons < 0 ? `protons pumped out ${num(-c.protons, 2)}` : `protons let back ${num(c.protons, 2)}`}` +
    ` (worth ${num(c.protonATP, 2)} ATP eq. in the cost)`;
  return `⇄ transport: ${moves.join("; ")} · work of moving ${signed(energyIn(t.work, unit), 2)} ${u}, included in ΔrG'°${protons}`;
}

function comps() {
  return (store.doc.compartments ??= []);
}

// setupCompartments builds the panel's fixed parts.
export function setupCompartments() {
  const body = document.getElementById("comp-body");
  ui.def = el("input", { id: "comp-default", size: "4", spellcheck: "false", autocomplete: "off", "aria-label": "Compartment of untagged compounds" });
  bind(ui.def, "defaultCompartment", () => store.doc.defaultCompartment ?? "", (t) => {
    if (t.trim() === "") delete store.doc.defaultCompartment;
    else store.doc.defaultCompartment = t;
    return "";
  });
  ui.ppa = el("input", { id: "comp-ppa", size: "4", inputmode: "decimal", "aria-label": "Protons per ATP" });
  bind(ui.ppa, "values.H+.protonsPerATP", () => {
    const v = store.doc.values?.["H+"]?.protonsPerATP;
    return v === undefined || v === null ? "" : editText(v);
  }, numberTake((v) => {
    const vals = (store.doc.values ??= {});
    const h = (vals["H+"] ??= {});
    if (v === undefined) delete h.protonsPerATP;
    else h.protonsPerATP = v;
    if (!Object.keys(h).length) delete vals["H+"];
  }, { allowEmpty: true }));
  ui.head = el("tr", {}, el("th", { scope: "col" }, "id"), el("th", { scope: "col" }, "name"),
    ...FIELDS.map(([, label, unit]) => el("th", { scope: "col" }, label, unit ? el("span", { class: "unit" }, ` ${unit}`) : "")),
    el("th", { scope: "col" }, el("span", { class: "sr" }, "Remove")));
  ui.rows = el("tbody", { id: "comp-rows" });
  ui.msgs = el("ul", { class: "comp-msgs" });
  ui.protons = el("p", { class: "aside", id: "comp-protons" });
  body.replaceChildren(
    el("p", { class: "aside" }, "Tag a compound with a compartment's id in the equations, e.g. pyruvate[m]; a row whose compounds change compartment is a transport step. Empty fields use the conditions above."),
    el("label", { class: "comp-line" }, "Untagged compounds are in ", ui.def),
    el("div", { class: "scroll-x" }, el("table", { class: "comp-table" }, el("thead", {}, ui.head), ui.rows)),
    ui.msgs,
    el("button", { type: "button", id: "comp-add", onclick: addCompartment }, "+ Add compartment"),
    el("label", { class: "comp-line" }, "Protons moved across a membrane per ATP made ", ui.ppa),
    ui.protons);
}

function addCompartment() {
  const used = new Set(comps().map((c) => c.id));
  const firstFree = ["c", "m", "x", "p", "n", "e", "g", "r"].find((id) => !used.has(id)) ?? `k${comps().length + 1}`;
  edit((doc) => (doc.compartments ??= []).push({ id: firstFree, name: "" }), "structure");
  const ids = ui.rows.querySelectorAll("input.comp-id");
  ids[ids.length - 1]?.focus();
  ids[ids.length - 1]?.select();
}

function removeCompartment(i) {
  // Drafts are keyed by index: those of this and the following compartments no longer fit.
  for (const k of [...store.drafts.keys()]) if (k.startsWith("compartments[")) store.drafts.delete(k);
  edit((doc) => {
    doc.compartments.splice(i, 1);
    if (!doc.compartments.length) delete doc.compartments;
  }, "structure");
}

function row(i) {
  const path = `compartments[${i}]`;
  const c = () => store.doc.compartments?.[i] ?? {};
  const id = el("input", { class: "comp-id", size: "3", spellcheck: "false", autocomplete: "off", "aria-label": `Id of compartment ${i + 1}` });
  bind(id, `${path}.id`, () => c().id ?? "", (t) => { c().id = t; return t.trim() ? "" : "a compartment needs an id to be used as a tag"; });
  const name = el("input", { class: "comp-name", spellcheck: "false", "aria-label": `Name of compartment ${i + 1}`, placeholder: "name" });
  bind(name, `${path}.name`, () => c().name ?? "", (t) => { if (t) c().name = t; else delete c().name; return ""; });
  const cells = FIELDS.map(([key, label, unit, size]) => {
    const input = el("input", { class: "comp-num", size: String(size), inputmode: "decimal", "data-field": key,
      "aria-label": `${label}${unit ? " (" + unit + ")" : ""} of compartment ${i + 1}` });
    bind(input, `${path}.${key}`, () => (c()[key] === undefined || c()[key] === null ? "" : editText(c()[key])),
      numberTake((v) => { if (v === undefined) delete c()[key]; else c()[key] = v; }, { allowEmpty: true }));
    return el("td", {}, input);
  });
  const del = el("button", { type: "button", class: "act", title: "Remove this compartment", "aria-label": `Remove compartment ${i + 1}`,
    onclick: () => removeCompartment(i) }, "✕");
  return el("tr", { "data-index": String(i) }, el("td", {}, id), el("td", {}, name), ...cells, el("td", {}, del));
}

// renderCompartments redraws the rows when compartments were added or removed, and the placeholders,
// messages and proton summary every time.
export function renderCompartments(kind) {
  const list = store.doc.compartments ?? [];
  if (kind === "load" || list.length !== drawnCount) {
    drawnCount = list.length;
    ui.rows.replaceChildren(...list.map((_, i) => row(i)));
  }
  ui.rows.closest("table").hidden = list.length === 0;
  const used = store.result?.conditions;
  for (const input of ui.rows.querySelectorAll("input.comp-num")) {
    const f = input.dataset.field;
    input.placeholder = !used ? "" : f === "potential" ? "0" : f === "pMg" ? (used.pMg === null ? "none" : num(used.pMg, 2))
      : f === "pH" ? num(used.pH, 2) : num(used.ionicStrength, 2);
  }
  ui.def.placeholder = DEFAULT_COMPARTMENT;
  const msgs = [];
  for (const [path, d] of store.drafts) if (path.startsWith("compartments[")) msgs.push(`${where(path)}: ${d.message}`);
  for (const e of store.result?.errors ?? []) {
    if ((e.path.startsWith("compartments[") || e.path === "defaultCompartment" || e.path.startsWith("values.H+")) && !store.drafts.has(e.path)) {
      msgs.push(`${where(e.path)}: ${e.message}`);
    }
  }
  ui.msgs.replaceChildren(...msgs.map((m) => el("li", { class: "err" }, "✕ " + m)));
  const ppa = store.result?.values?.["H+"]?.protonsPerATP;
  ui.ppa.placeholder = ppa ? editText(ppa) : "";
  const t = store.result?.total?.cost;
  const moving = (store.result?.rows ?? []).filter((r) => r.transport?.moves?.length);
  ui.protons.textContent = moving.length === 0 ? "No step moves a compound between compartments."
    : `${moving.length} transport step${moving.length === 1 ? "" : "s"}; protons let back across membranes in the pathway: ${num(t?.protons, 2)}` +
      ` (negative: pumped out), worth ${num(t?.protonATP, 2)} ATP eq. in the total cost.`;
}

function where(path) {
  const m = /^compartments\[(\d+)\]\.?(.*)$/.exec(path);
  if (!m) return path === "defaultCompartment" ? "compartment of untagged compounds" : "protons per ATP";
  const c = store.doc.compartments?.[Number(m[1])];
  const label = FIELDS.find(([k]) => k === m[2])?.[1] ?? m[2];
  return `compartment ${c?.id ? `"${c.id}"` : Number(m[1]) + 1}${label ? " " + label : ""}`;
}
