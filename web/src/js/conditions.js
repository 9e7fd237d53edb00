// The conditions strip (pH, ionic strength, pMg or none, temperature in °C or K, the near-equilibrium
// band), the worksheet's title and notes, and the list of messages about the document as a whole.

import { store, recompute, clearDraft } from "./state.js";
import { el, editText, energyIn, energyFrom, num, unitLabel } from "./format.js";
import { bind, numberTake } from "./fields.js";

const ZERO_CELSIUS = 273.15; // K, by definition of the Celsius scale

// pMgWhenTurnedOn is the pMg put in when the user turns magnesium binding on and no value was there
// before; 3 is a usual value for a cell's cytosol (common practice, no source).
const pMgWhenTurnedOn = 3;

let lastPMg = pMgWhenTurnedOn;

function cond() {
  return store.doc.conditions;
}

function setOrDelete(obj, key) {
  return (v) => { if (v === undefined) delete obj()[key]; else obj()[key] = v; };
}

// setupConditions binds the fields once; they read store.doc whenever they are drawn.
export function setupConditions() {
  const text = (v) => (v === null || v === undefined ? "" : editText(v));
  bind(document.getElementById("ws-title"), "title", () => store.doc.title ?? "", (t) => { store.doc.title = t; return ""; });
  bind(document.getElementById("ws-notes"), "notes", () => store.doc.notes ?? "", (t) => { store.doc.notes = t; return ""; });
  bind(document.getElementById("c-ph"), "conditions.pH", () => text(cond().pH),
    numberTake(setOrDelete(cond, "pH"), { allowEmpty: true }));
  bind(document.getElementById("c-ionic"), "conditions.ionicStrength", () => text(cond().ionicStrength),
    numberTake(setOrDelete(cond, "ionicStrength"), { allowEmpty: true }));
  const pmg = document.getElementById("c-pmg");
  const none = document.getElementById("c-pmg-none");
  bind(pmg, "conditions.pMg", () => text(cond().pMg),
    numberTake((v) => { cond().pMg = v ?? null; if (v !== undefined) lastPMg = v; }, { allowEmpty: true }));
  none.addEventListener("change", () => {
    if (none.checked) {
      if (cond().pMg !== null && cond().pMg !== undefined) lastPMg = cond().pMg;
      cond().pMg = null;
    } else {
      cond().pMg = lastPMg;
    }
    clearDraft("conditions.pMg");
    recompute();
  });
  const temp = document.getElementById("c-temp");
  const tempUnit = document.getElementById("c-temp-unit");
  const showTemp = () => {
    const k = cond().temperature;
    if (k === undefined || k === null) return "";
    return editText(Number((store.ui.tempUnit === "C" ? k - ZERO_CELSIUS : k).toFixed(6)));
  };
  bind(temp, "conditions.temperature", showTemp,
    numberTake(setOrDelete(cond, "temperature"), { allowEmpty: true, from: (v) => (store.ui.tempUnit === "C" ? v + ZERO_CELSIUS : v) }));
  tempUnit.addEventListener("change", () => {
    store.ui.tempUnit = tempUnit.value;
    clearDraft("conditions.temperature");
    temp.value = showTemp();
    recompute();
  });
  bind(document.getElementById("c-near"), "nearEquilibrium",
    () => (store.doc.nearEquilibrium === undefined ? "" : editText(Number(energyIn(store.doc.nearEquilibrium, store.ui.unit).toFixed(6)))),
    numberTake((v) => { if (v === undefined) delete store.doc.nearEquilibrium; else store.doc.nearEquilibrium = v; },
      { allowEmpty: true, from: (v) => energyFrom(v, store.ui.unit) }));
}

// renderConditions shows what the fields cannot: defaults in use, both temperature scales, RT.
export function renderConditions() {
  const used = store.result?.conditions;
  const c = cond();
  const none = document.getElementById("c-pmg-none");
  const pmg = document.getElementById("c-pmg");
  none.checked = c.pMg === null || c.pMg === undefined;
  pmg.disabled = none.checked && !store.drafts.has("conditions.pMg");
  document.getElementById("c-temp-unit").value = store.ui.tempUnit;
  if (used) {
    document.getElementById("c-ph").placeholder = num(used.pH, 2);
    document.getElementById("c-ionic").placeholder = num(used.ionicStrength, 2);
    document.getElementById("c-near").placeholder = num(energyIn(used.nearEquilibrium, store.ui.unit), 2);
    const k = used.temperature;
    document.getElementById("c-temp-both").textContent = `${num(k - ZERO_CELSIUS, 2)} °C = ${num(k, 2)} K`;
    document.getElementById("c-rt").textContent = `RT = ${num(energyIn(used.RT, store.ui.unit), 4)} ${unitLabel(store.ui.unit)}`;
  }
}

const OWN_PANEL = /^(concentrations|compounds|rows|bounds|compartments|defaultCompartment)\b/;

// renderDocMessages lists problems with the document as a whole and with fields that have no message
// place of their own (conditions, title, default concentration, values).
export function renderDocMessages() {
  const box = document.getElementById("doc-messages");
  const items = [];
  if (store.evalError) {
    items.push(el("li", { class: "err" }, "✕ The engine could not read the worksheet: " + store.evalError +
      " (the results shown are from the last worksheet it could read)"));
  }
  const seen = new Set();
  for (const [path, d] of store.drafts) {
    if (path.startsWith("row:") || OWN_PANEL.test(path)) continue;
    seen.add(path);
    items.push(el("li", { class: "err" }, `✕ ${label(path)}: ${d.message}`));
  }
  for (const e of store.result?.errors ?? []) {
    if (OWN_PANEL.test(e.path) || seen.has(e.path)) continue;
    items.push(el("li", { class: "err" }, `✕ ${label(e.path)}: ${e.message}`));
  }
  for (const w of store.result?.warnings ?? []) {
    items.push(el("li", { class: "warn" }, `⚠ ${w.path ? label(w.path) + ": " : ""}${w.message}`));
  }
  box.replaceChildren(items.length ? el("ul", {}, ...items) : "");
}

const LABELS = {
  "conditions.pH": "pH", "conditions.ionicStrength": "ionic strength", "conditions.pMg": "pMg",
  "conditions.temperature": "temperature", "nearEquilibrium": "near-equilibrium band",
  "defaultConcentration": "default concentration", "title": "title", "notes": "notes", "rows": "steps",
};

function label(path) {
  return LABELS[path] ?? path;
}
