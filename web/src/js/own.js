// The worksheet's own compounds: names the library lacks, each with species data (transformed to the
// conditions like the library's), a ΔfG'° already at the conditions, or no data at all.

import { store, edit } from "./state.js";
import { el, editText, energy, energyIn, energyFrom, readNumber, unitLabel } from "./format.js";
import { bind, numberTake } from "./fields.js";

const SPECIES_FIELDS = [
  // key, label, energy (converted to the display unit), required, integer
  ["dfG0", "ΔfG°", true, true, false],
  ["dfH0", "ΔfH°", true, false, false],
  ["charge", "charge", false, true, true],
  ["nH", "H atoms", false, true, true],
  ["nMg", "Mg", false, false, true],
];

let drawnSignature = "";

function signature() {
  return JSON.stringify(store.doc.compounds.map((c) => (c.species ?? []).length)) + store.ui.unit;
}

export function setupOwn() {
  document.getElementById("own-add").addEventListener("click", () => {
    const used = new Set(store.doc.compounds.map((c) => c.id));
    let n = store.doc.compounds.length + 1;
    while (used.has(`compound ${n}`)) n++;
    edit((doc) => doc.compounds.push({ id: `compound ${n}`, name: "" }), "structure");
    const ids = document.querySelectorAll("#own-list .own-id");
    const last = ids[ids.length - 1];
    last?.focus();
    last?.select();
  });
}

// renderOwn draws the compound cards again when compounds or species were added or removed, and the
// computed values and messages every time.
export function renderOwn(kind) {
  const list = document.getElementById("own-list");
  if (kind === "load" || kind === "structure" || signature() !== drawnSignature) {
    drawnSignature = signature();
    list.replaceChildren(...store.doc.compounds.map((c, i) => card(c, i)));
  }
  const uses = new Map((store.result?.compounds ?? []).filter((u) => u.own).map((u) => [u.id.toLowerCase(), u]));
  list.querySelectorAll(".own-card").forEach((cardEl, i) => {
    const c = store.doc.compounds[i];
    const u = c && uses.get(String(c.id).toLowerCase());
    const info = cardEl.querySelector(".own-use");
    info.textContent = !u ? "not used in any step yet"
      : u.dfG0prime === null ? `used in ${u.rows.length} step(s); no ΔfG'° (steps need an entered ΔrG'°)`
        : `used in ${u.rows.length} step(s); ΔfG'° in use ${energy(u.dfG0prime, store.ui.unit)} ${unitLabel(store.ui.unit)}`;
    const msgs = (store.result?.errors ?? []).filter((e) => e.path === `compounds[${i}]` || e.path.startsWith(`compounds[${i}].`));
    cardEl.querySelector(".own-msgs").replaceChildren(...msgs.map((e) => el("li", { class: "err" }, `✕ ${e.message}`)));
  });
}

function card(c, i) {
  const path = `compounds[${i}]`;
  const idIn = el("input", { class: "own-id", spellcheck: "false", "aria-label": "Compound name used in equations" });
  bind(idIn, `${path}.id`, () => c.id ?? "", (t) => { c.id = t; return t.trim() ? "" : "a compound needs a name to be used in equations"; });
  const nameIn = el("input", { spellcheck: "false", placeholder: "full name (optional)", "aria-label": "Full name" });
  bind(nameIn, `${path}.name`, () => c.name ?? "", (t) => { if (t) c.name = t; else delete c.name; return ""; });
  const formulaIn = el("input", { spellcheck: "false", placeholder: "e.g. C3H3O3", size: "10", "aria-label": "Formula" });
  bind(formulaIn, `${path}.formula`, () => c.formula ?? "", (t) => { if (t.trim()) c.formula = t.trim(); else delete c.formula; return ""; });
  const chargeIn = el("input", { inputmode: "numeric", size: "3", "aria-label": "Charge of the formula" });
  bind(chargeIn, `${path}.charge`, () => (c.charge === undefined ? "" : String(c.charge)),
    intTake((v) => { if (v === undefined) delete c.charge; else c.charge = v; }));
  const dfgIn = el("input", { inputmode: "decimal", size: "8", "aria-label": `ΔfG'° at the worksheet's conditions (${unitLabel(store.ui.unit)})` });
  bind(dfgIn, `${path}.dfG0prime`, () => (c.dfG0prime === undefined ? "" : editText(Number(energyIn(c.dfG0prime, store.ui.unit).toFixed(6)))),
    numberTake((v) => { if (v === undefined) delete c.dfG0prime; else c.dfG0prime = v; }, { allowEmpty: true, from: (v) => energyFrom(v, store.ui.unit) }));

  const species = c.species ?? [];
  const head = el("tr", {}, ...SPECIES_FIELDS.map(([, label, isEnergy]) => el("th", { scope: "col" }, label, isEnergy ? el("span", { class: "unit" }, " " + unitLabel(store.ui.unit)) : "")), el("th", {}, ""));
  const rows = species.map((s, j) => el("tr", {}, ...SPECIES_FIELDS.map(([k, label, isEnergy, required, integer]) => {
    const input = el("input", { inputmode: "decimal", size: "6", "aria-label": `${label} of species ${j + 1}` });
    const show = () => (s[k] === undefined || s[k] === null ? "" : editText(Number((isEnergy ? energyIn(s[k], store.ui.unit) : s[k]).toFixed(6))));
    const set = (v) => { if (v === undefined) delete s[k]; else s[k] = v; };
    bind(input, `${path}.species[${j}].${k}`, show, integer ? intTake(set, required)
      : numberTake(set, { allowEmpty: !required, from: isEnergy ? (v) => energyFrom(v, store.ui.unit) : undefined }));
    return el("td", {}, input);
  }), el("td", {}, el("button", { type: "button", class: "quiet small", "aria-label": `Remove species ${j + 1}`,
    onclick: () => edit(() => { species.splice(j, 1); if (!species.length) delete c.species; }, "structure") }, "✕"))));
  const addRow = speciesAdder(c);
  return el("div", { class: "own-card", "data-index": String(i) },
    el("div", { class: "own-head" }, idIn, nameIn,
      el("button", { type: "button", class: "quiet small", "aria-label": `Remove compound ${c.id}`,
        onclick: () => edit((doc) => doc.compounds.splice(i, 1), "structure") }, "remove")),
    el("div", { class: "own-line" }, el("label", {}, "formula ", formulaIn), el("label", {}, " charge ", chargeIn)),
    el("div", { class: "own-line" }, el("label", {}, "ΔfG'° at these conditions ", dfgIn, " ", el("span", { class: "unit" }, unitLabel(store.ui.unit))),
      el("span", { class: "aside" }, " — or species data below (transformed with Alberty's method) — or neither")),
    el("table", { class: "species" }, el("thead", {}, head), el("tbody", {}, ...rows, addRow)),
    el("p", { class: "aside own-use" }),
    el("ul", { class: "own-msgs" }));
}

// intTake reads a whole number (charges and atom counts).
function intTake(set, required = false) {
  return (text) => {
    const r = readNumber(text);
    if (r.empty) {
      if (required) return "enter a whole number; the results use the last valid value";
      set(undefined);
      return "";
    }
    if (r.error || !Number.isInteger(r.value)) return `"${text.trim()}" is not a whole number; the results use the last valid value`;
    set(r.value);
    return "";
  };
}

// speciesAdder is the last row of the species table: fields for a new species and a button that adds
// it once the required numbers are there.
function speciesAdder(c) {
  const inputs = SPECIES_FIELDS.map(([k, label]) => el("input", { inputmode: "decimal", size: "6", placeholder: k === "dfH0" || k === "nMg" ? "optional" : "", "aria-label": `${label} of a new species` }));
  const msg = el("span", { class: "field-msg" });
  const add = () => {
    const s = {};
    for (let n = 0; n < SPECIES_FIELDS.length; n++) {
      const [k, label, isEnergy, required, integer] = SPECIES_FIELDS[n];
      const r = readNumber(inputs[n].value);
      if (r.empty && !required) continue;
      if (r.empty || r.error || (integer && !Number.isInteger(r.value))) {
        msg.textContent = `✕ ${label}: ${r.empty ? "needed" : r.error || "must be a whole number"}`;
        inputs[n].setAttribute("aria-invalid", "true");
        inputs[n].focus();
        return;
      }
      s[k] = isEnergy ? energyFrom(r.value, store.ui.unit) : r.value;
    }
    edit(() => { (c.species ??= []).push(s); }, "structure");
  };
  for (const input of inputs) {
    input.addEventListener("keydown", (ev) => { if (ev.key === "Enter") { ev.preventDefault(); add(); } });
  }
  return el("tr", { class: "adder" }, ...inputs.map((x) => el("td", {}, x)),
    el("td", {}, el("button", { type: "button", class: "small", onclick: add }, "add species"), msg));
}

