// The page's start: read the initial worksheet embedded in the page, start the engine, load the
// compound library for completion, put the worksheet in the page and wire the controls. Whatever the
// page shows is drawn again from store.result after every edit.

import { store, onChange, loadDocument, emptyDocument, recompute } from "./state.js";
import { startEngine } from "./engine.js";
import { renderStructure, renderInputs, renderResults } from "./grid.js";
import { onKey, onPaste } from "./keyboard.js";
import { appendRow } from "./rows.js";
import { focusCell } from "./grid.js";
import { setupConditions, renderConditions, renderDocMessages } from "./conditions.js";
import { setupLevels, renderLevels } from "./levels.js";
import { setupOwn, renderOwn } from "./own.js";
import { renderBalance } from "./balance.js";
import { renderProfile, renderCost } from "./charts.js";
import { refreshFields, markFields } from "./fields.js";
import { unitLabel } from "./format.js";
import { setupTemplates, prepareTemplates, templates } from "./templates.js";
import { setupAnalysis, renderAnalysis } from "./analysis.js";
import { setupCompare, renderCompare } from "./compare.js";
import { setupCompartments, renderCompartments } from "./compartments.js";
import { setupShare, markEmbedded, isDemo } from "./share.js";
import { setupKeep, chooseInitial, mayReplace } from "./keep.js";
import { setupHistory } from "./history.js";
import { setupPublish } from "./publish.js";

let firstResult = true;

// timings holds how long each part of the last drawing took (ms), for benchmarks and curious users.
const timings = {};

function render(kind) {
  if (!store.doc) return;
  document.body.classList.toggle("unit-kcal", store.ui.unit === "kcal");
  for (const u of document.querySelectorAll(".unit-e")) u.textContent = unitLabel(store.ui.unit);
  for (const b of document.querySelectorAll("[data-unit]")) b.setAttribute("aria-pressed", String(b.dataset.unit === store.ui.unit));
  document.getElementById("demo-flag").hidden = store.ui.origin !== "demo";
  const steps = [
    ["structure", renderStructure], ["inputs", renderInputs], ["results", renderResults],
    ["conditions", renderConditions], ["levels", renderLevels], ["own", () => renderOwn(kind)],
    ["balance", () => renderBalance(kind)], ["profile", renderProfile], ["cost", renderCost],
    ["analysis", renderAnalysis], ["compare", renderCompare], ["compartments", () => renderCompartments(kind)],
    ["fields", refreshFields], ["marks", () => markFields()], ["messages", renderDocMessages],
  ];
  for (const [name, fn] of steps) {
    const t0 = performance.now();
    fn();
    timings[name] = performance.now() - t0;
  }
  timings.evaluate = store.lastEvalMs;
  document.title = (store.doc.title ? store.doc.title + " — " : "") + "Gibbsheet";
  if (firstResult && store.result) {
    firstResult = false;
    performance.mark("gibbsheet:first-result");
    document.body.dataset.ready = "true";
  }
}

// initialWorksheet reads the worksheet embedded in the page as inert JSON.
function initialWorksheet() {
  const holder = document.getElementById("gibbsheet-worksheet");
  if (!holder) return { doc: emptyDocument(), origin: "empty" };
  return { doc: JSON.parse(holder.textContent), origin: isDemo() ? "demo" : "file" };
}

function wire() {
  const body = document.getElementById("grid-body");
  body.addEventListener("keydown", onKey);
  body.addEventListener("paste", onPaste);
  document.getElementById("add-row").addEventListener("click", () => focusCell(appendRow(), "eq"));
  document.getElementById("new-sheet").addEventListener("click", () => {
    if (!mayReplace()) return;
    loadDocument(emptyDocument(), "empty");
    focusCell(store.doc.rows[0].id, "eq");
  });
  for (const b of document.querySelectorAll("[data-unit]")) {
    b.addEventListener("click", () => {
      store.ui.unit = b.dataset.unit;
      for (const k of [...store.drafts.keys()]) if (k.endsWith(":dg0")) store.drafts.delete(k);
      recompute("structure");
    });
  }
  const keys = document.getElementById("show-keys");
  keys.addEventListener("click", () => {
    const help = document.getElementById("keys-help");
    help.hidden = !help.hidden;
    keys.setAttribute("aria-expanded", String(!help.hidden));
  });
  setupConditions();
  setupLevels();
  setupOwn();
  setupTemplates();
  setupAnalysis();
  setupCompare();
  setupCompartments();
  setupHistory();
  setupKeep();
  setupPublish();
}

async function main() {
  const state = document.getElementById("engine-state");
  onChange(render);
  try {
    store.engine = await startEngine((why) => { state.textContent = "The engine stopped: " + why; });
  } catch (e) {
    state.textContent = "The engine could not start: " + (e.message || e);
    state.classList.add("err");
    return;
  }
  state.textContent = "";
  await prepareTemplates();
  document.getElementById("version").textContent = "version " + store.engine.version;
  setupShare(); // before anything else reads the page: it keeps the texts the page saves itself from
  let initial;
  try {
    initial = initialWorksheet();
  } catch (e) {
    initial = { doc: emptyDocument(), origin: "empty" };
    state.textContent = "The worksheet inside this page could not be read (" + e.message + "); an empty one is open.";
  }
  const fromFile = initial.origin !== "empty";
  initial = chooseInitial(initial); // the edits kept in this browser for this file, if any
  wire();
  loadDocument(initial.doc, initial.origin);
  if (fromFile && !initial.restored) markEmbedded();
  initial.first?.();
  // The library is only needed for completion, so it is read after the first result is on screen.
  setTimeout(() => {
    try {
      store.library = JSON.parse(store.engine.compounds());
      if (!state.textContent) state.textContent = `Engine ready · ${store.library.length} compounds in the library`;
    } catch (e) {
      state.textContent = "The compound list for completion could not be read: " + (e.message || e);
    }
  }, 0);
}

// The page's functions for tests, benchmarks and features that load or read worksheets.
globalThis.gibbsheetPage = { store, loadDocument, emptyDocument, recompute, timings, templates };

main();
