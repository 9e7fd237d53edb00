// The page's start. This script runs as soon as the browser has read it, before the engine's text that
// follows it in the file: it reads the worksheet embedded in the page and, when the file carries the
// result saved with that very worksheet (js/share.js, savedResult), shows both at once. Once the rest of
// the file is read and the engine has started, it wires the controls, has the engine compute the
// worksheet (its answer replaces the saved one) and, once every panel is drawn, loads the compound
// library for completion. On opening, the grid with the first result is drawn and painted before the
// panels below it (render); the marks gibbsheet:first-result, gibbsheet:engine-result,
// gibbsheet:first-frame and gibbsheet:panels time this (web/browser/bench_start_test.go). Whatever the
// page shows is drawn again from store.result after every edit.

import { store, onChange, loadDocument, emptyDocument, recompute, evaluateDocument, settled, showSaved } from "./state.js";
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
import { openShell, setupShare, markEmbedded, isDemo, savedResult } from "./share.js";
import { setupKeep, chooseInitial, mayReplace } from "./keep.js";
import { setupHistory } from "./history.js";
import { setupPublish } from "./publish.js";

// timings holds how long each part of the last drawing took (ms), for benchmarks and curious users.
const timings = {};

// The parts of the page in the order they are drawn. On opening, the grid and what sits above it are
// drawn first (FIRST) and the page paints them; the panels below follow in a task of their own.
const FIRST = ["structure", "inputs", "results", "conditions", "fields", "marks", "messages"];
const PANELS = ["levels", "own", "balance", "profile", "cost", "analysis", "compare", "compartments", "fields", "marks"];
// What the analysis (the max-min driving force and its warnings), which follows a recompute, redraws.
const ANALYSIS = ["analysis", "messages"];

function draw(kind, names) {
  const fns = {
    structure: renderStructure, inputs: renderInputs, results: renderResults, conditions: renderConditions,
    levels: renderLevels, own: () => renderOwn(kind), balance: () => renderBalance(kind), profile: renderProfile,
    cost: renderCost, analysis: renderAnalysis, compare: renderCompare, compartments: () => renderCompartments(kind),
    fields: refreshFields, marks: () => markFields(), messages: renderDocMessages,
  };
  for (const name of names) {
    const t0 = performance.now();
    fns[name]();
    timings[name] = performance.now() - t0;
  }
}

// opening is "first" until the first result is drawn, "panels" while the panels below wait for the
// grid to be painted, and "" after.
let opening = "first";
// engineDrawn is true once a result the engine computed in this page has been drawn.
let engineDrawn = false;

function render(kind) {
  if (!store.doc) return;
  document.body.classList.toggle("unit-kcal", store.ui.unit === "kcal");
  for (const u of document.querySelectorAll(".unit-e")) u.textContent = unitLabel(store.ui.unit);
  for (const b of document.querySelectorAll("[data-unit]")) b.setAttribute("aria-pressed", String(b.dataset.unit === store.ui.unit));
  document.getElementById("demo-flag").hidden = store.ui.origin !== "demo";
  document.title = (store.doc.title ? store.doc.title + " — " : "") + "Gibbsheet";
  timings.evaluate = store.lastEvalMs;
  if (store.engine && !engineDrawn && store.result) {
    engineDrawn = true;
    queueMicrotask(() => performance.mark("gibbsheet:engine-result")); // once the grid below is drawn
  }
  if (opening === "first" && store.result) {
    opening = "panels";
    draw(kind, FIRST);
    performance.mark("gibbsheet:first-result");
    afterPaint(() => {
      performance.mark("gibbsheet:first-frame");
      if (opening !== "panels") return; // a later drawing drew everything
      if (!store.engine) return; // the panels are set up with the engine, whose first answer draws them
      opening = "";
      draw(kind, PANELS);
      pageReady();
    });
    return;
  }
  if (!store.engine) {
    draw(kind, FIRST); // before the engine has started, only the grid and what is above it
    return;
  }
  if (opening === "panels") {
    if (kind === "analysis") return; // the panels, drawn after the first paint, show it
    opening = "";
  }
  if (kind === "analysis") {
    draw(kind, ANALYSIS); // the document did not change: only what shows the max-min driving force
    return;
  }
  draw(kind, [...FIRST.slice(0, 4), ...PANELS, "messages"]);
  if (opening === "") pageReady();
}

// afterPaint runs fn once the browser has painted what is drawn so far (a frame, then a task), or after
// a fifth of a second where the page is not painted (a hidden tab).
function afterPaint(fn) {
  let done = false;
  const once = () => {
    if (!done) {
      done = true;
      fn();
    }
  };
  requestAnimationFrame(() => setTimeout(once, 0));
  setTimeout(once, 200);
}

// pageReady runs once every panel is drawn: it marks the page as complete for tests and benchmarks and
// reads the compound library for completion, which the first result does not need.
let whenReady = null;
function pageReady() {
  if (!whenReady) return;
  const then = whenReady;
  whenReady = null;
  performance.mark("gibbsheet:panels");
  then();
}

// initialWorksheet reads the worksheet embedded in the page as inert JSON.
function initialWorksheet() {
  const holder = document.getElementById("gibbsheet-worksheet");
  if (!holder) return { doc: emptyDocument(), origin: "empty" };
  return { doc: JSON.parse(holder.textContent), origin: isDemo() ? "demo" : "file" };
}

// wireGrid wires the grid and the fields above it, which work before the engine has started: the edits
// made meanwhile are computed when it has.
function wireGrid() {
  const body = document.getElementById("grid-body");
  body.addEventListener("keydown", onKey);
  body.addEventListener("paste", onPaste);
  document.getElementById("add-row").addEventListener("click", () => focusCell(appendRow(), "eq"));
  setupConditions();
}

// wire wires the rest of the page, once the engine has started.
function wire() {
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
  performance.mark("gibbsheet:script");
  const state = document.getElementById("engine-state");
  onChange(render);
  openShell(); // the shell, the worksheet and the result saved with it come before this script
  let initial;
  let readError = ""; // shown once the engine has started, in place of what the footer says meanwhile
  try {
    initial = initialWorksheet();
  } catch (e) {
    initial = { doc: emptyDocument(), origin: "empty" };
    readError = "The worksheet inside this page could not be read (" + e.message + "); an empty one is open.";
    state.textContent = readError;
  }
  const fromFile = initial.origin !== "empty";
  initial = chooseInitial(initial); // the edits kept in this browser for this file, if any
  // The worksheet is shown at once, with the result saved with it when the file carries one for it.
  const saved = initial.restored ? null : savedResult();
  wireGrid();
  showSaved(initial.doc, saved, initial.origin);
  if (fromFile && !initial.restored) markEmbedded(); // before any edit
  if (saved) state.textContent = "Showing the results saved with this file while the engine starts…";
  await parsed(); // the templates, the engine and its start script follow this script
  // The templates are inflated while the engine starts (the picker and the comparison panel list them).
  const templatesReady = prepareTemplates();
  try {
    store.engine = await startEngine((why) => { state.textContent = "The engine stopped: " + why; });
  } catch (e) {
    state.textContent = "The engine could not start: " + (e.message || e);
    state.classList.add("err");
    return;
  }
  state.textContent = readError;
  await templatesReady;
  document.getElementById("version").textContent = "version " + store.engine.version;
  setupShare();
  wire();
  whenReady = () => {
    try {
      store.library = JSON.parse(store.engine.compounds());
      if (!state.textContent) state.textContent = `Engine ready · ${store.library.length} compounds in the library`;
    } catch (e) {
      state.textContent = "The compound list for completion could not be read: " + (e.message || e);
    }
    document.body.dataset.ready = "true";
  };
  recompute("load"); // the engine's own result for the worksheet, with any edit made meanwhile
  initial.first?.();
}

// parsed resolves once the browser has read the whole file.
function parsed() {
  if (document.readyState !== "loading") return Promise.resolve();
  return new Promise((resolve) => document.addEventListener("DOMContentLoaded", resolve, { once: true }));
}

// The page's functions for tests, benchmarks and features that load or read worksheets.
globalThis.gibbsheetPage = { store, loadDocument, emptyDocument, recompute, evaluateDocument, settled, timings, templates };

main();
