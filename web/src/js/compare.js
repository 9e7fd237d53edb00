// Side-by-side comparison of worksheets, e.g. variants of a route: the open worksheet, templates, files
// read from disk and saved worksheets. Each is evaluated by the engine on its own; the panel shows their
// budgets and MDF in one table and their running ΔrG' profiles on one chart, told apart by line style,
// marker and letter as well as colour.

import { store } from "./state.js";
import { el, energy, energyIn, num, unitLabel } from "./format.js";
import { W, M, esc, frame, scale, empty } from "./charts.js";
import { templates, templateDoc } from "./templates.js";
import { readWorksheet, MAX_BYTES } from "./share.js";
import { sheets } from "./keep.js";

// STYLES gives each compared worksheet its line: dash pattern, marker and colour class.
const STYLES = [
  { dash: "", marker: "circle", line: "solid" },
  { dash: "7 4", marker: "square", line: "dashed" },
  { dash: "2 3", marker: "triangle", line: "dotted" },
  { dash: "10 3 2 3", marker: "diamond", line: "dash-dot" },
  { dash: "4 2 4 6", marker: "cross", line: "uneven dashes" },
];
const LETTERS = "ABCDEFGHIJ";

// savedSource lists the worksheets kept in this browser (keep.js) and reads one: local storage holds
// each under "gibbsheet:doc:ID" (see keep.js). It is null where the browser keeps nothing.
const savedSource = {
  list: () => sheets(),
  load: (id) => {
    const text = globalThis.localStorage?.getItem("gibbsheet:doc:" + id);
    if (!text) throw new Error("it is no longer kept in this browser");
    return readWorksheet(text, "the saved worksheet");
  },
};

const cmp = {
  withOpen: true,
  others: [], // {label, origin, doc, result, error}
  messages: [], // {cls, text}
};

// evaluateDoc runs the engine on a document: {result} or {error}.
export function evaluateDoc(doc) {
  try {
    return { result: JSON.parse(store.engine.evaluate(JSON.stringify(doc))) };
  } catch (e) {
    return { error: e && e.message ? e.message : String(e) };
  }
}

// addWorksheet puts a document in the comparison; it returns the message shown for it.
// origin says where it came from ("template", a file name, "saved").
export function addWorksheet(doc, origin) {
  const label = (doc && typeof doc === "object" && doc.title) || origin;
  const { result, error } = evaluateDoc(doc);
  if (error) {
    return say("err", `✕ ${label} could not be compared: ${error}`);
  }
  cmp.others.push({ label, origin, doc, result });
  return say("ok", `${label} added.`);
}

function say(cls, text) {
  cmp.messages = [{ cls, text }];
  renderCompare();
  return text;
}

// readFiles reads worksheet files chosen with the file input (worksheet JSON or a saved page, checked
// by share.js's readWorksheet); a file that is not a worksheet gets a message naming it.
async function readFiles(files) {
  const notes = [];
  for (const f of files) {
    const name = `"${String(f.name).slice(0, 120)}"`;
    if (f.size > MAX_BYTES) {
      notes.push({ cls: "err", text: `✕ ${name} is larger than the ${MAX_BYTES / 1048576} MB the page reads; it was not added` });
      continue;
    }
    let doc;
    try {
      doc = readWorksheet(await f.text(), name);
    } catch (e) {
      notes.push({ cls: "err", text: `✕ ${e.message}; it was not added` });
      continue;
    }
    const { result, error } = evaluateDoc(doc);
    if (error) {
      notes.push({ cls: "err", text: `✕ ${name} could not be evaluated: ${error}` });
      continue;
    }
    cmp.others.push({ label: doc.title || f.name, origin: f.name, doc, result });
    notes.push({ cls: "ok", text: `${f.name} added.` });
  }
  cmp.messages = notes;
  renderCompare();
}

const ui = {};

// setupCompare builds the panel's controls.
export function setupCompare() {
  const body = document.getElementById("cmp-body");
  ui.open = el("input", { type: "checkbox", id: "cmp-open", checked: true,
    onchange: () => { cmp.withOpen = ui.open.checked; renderCompare(); } });
  ui.tpl = el("select", { id: "cmp-template", "aria-label": "Template to compare" });
  ui.addTpl = el("button", { type: "button", id: "cmp-add-template", onclick: () => {
    const t = templates().find((x) => x.file === ui.tpl.value);
    if (t) addWorksheet(templateDoc(t), "template");
  } }, "Add");
  ui.file = el("input", { type: "file", id: "cmp-file", accept: ".json,application/json", multiple: true,
    "aria-label": "Worksheet files to compare", onchange: () => { readFiles([...ui.file.files]); ui.file.value = ""; } });
  ui.saved = el("select", { id: "cmp-saved", "aria-label": "Saved worksheet to compare" });
  ui.addSaved = el("button", { type: "button", id: "cmp-add-saved", onclick: addSaved }, "Add");
  ui.savedBox = el("label", { hidden: true }, "saved worksheet ", ui.saved, " ", ui.addSaved);
  ui.msgs = el("ul", { class: "cmp-msgs", role: "status", "aria-live": "polite" });
  ui.table = el("div", { class: "scroll-x", id: "cmp-table" });
  ui.chart = el("div", { class: "chart", id: "chart-compare" });
  ui.legend = el("ul", { class: "cmp-legend", id: "cmp-legend" });
  body.replaceChildren(
    el("p", { class: "aside" }, "Put variants of a route side by side. Each worksheet is evaluated on its own, at its own conditions."),
    el("div", { class: "cmp-pick" },
      el("label", { class: "check" }, ui.open, " the open worksheet"),
      el("label", {}, "template ", ui.tpl, " ", ui.addTpl),
      el("label", {}, "files ", ui.file),
      ui.savedBox),
    ui.msgs, ui.table, ui.chart, ui.legend);
  ui.tpl.replaceChildren(...templates().map((t) => el("option", { value: t.file }, t.title)));
  ui.tpl.disabled = ui.addTpl.disabled = templates().length === 0;
}

function addSaved() {
  if (!ui.saved.value) return;
  try {
    addWorksheet(savedSource.load(ui.saved.value), "kept in this browser");
  } catch (e) {
    say("err", `✕ the saved worksheet could not be read: ${e.message || e}`);
  }
}

function entries() {
  const list = [];
  if (cmp.withOpen && store.result) {
    list.push({ label: store.doc.title || "open worksheet", origin: "open", doc: store.doc, result: store.result, open: true });
  }
  return list.concat(cmp.others);
}

// renderCompare draws the table and the chart; with fewer than two worksheets it says what is missing.
export function renderCompare() {
  if (!ui.msgs) return;
  const items = savedSource.list();
  ui.savedBox.hidden = items.length === 0;
  if (items.length) {
    const sig = items.map((s) => s.id + "\u0000" + s.title).join("\n");
    if (ui.saved.dataset.sig !== sig) {
      ui.saved.dataset.sig = sig;
      ui.saved.replaceChildren(...items.map((s) => el("option", { value: s.id }, s.title || s.id)));
    }
    ui.addSaved.disabled = items.length === 0;
  }
  ui.msgs.replaceChildren(...cmp.messages.map((m) => el("li", { class: m.cls }, m.text)));
  const list = entries();
  if (list.length < 2) {
    ui.table.replaceChildren(empty(list.length === 0 ? "Choose two or more worksheets to compare." : "Add one more worksheet to compare."));
    ui.chart.replaceChildren();
    ui.chartSVG = "";
    ui.legend.replaceChildren();
    if (list.length === 1 && !list[0].open) ui.table.append(removeButton(list[0], 0));
    return;
  }
  drawTable(list);
  drawChart(list);
}

function removeButton(e, i) {
  return el("button", { type: "button", class: "quiet small", "aria-label": `Remove ${e.label} from the comparison`,
    onclick: () => { cmp.others.splice(cmp.others.indexOf(e), 1); cmp.messages = []; renderCompare(); } }, "remove");
}

function drawTable(list) {
  const unit = store.ui.unit;
  const u = unitLabel(unit);
  const cell = (v, cls) => el("td", { class: cls ?? "num" }, v);
  const rows = [
    ["Steps", (e) => cell(String(e.result.rows.length))],
    ["Net reaction", (e) => cell(el("code", {}, e.result.total.equation || "—"), "net")],
    [`Total ΔrG'° (${u})`, (e) => cell(energy(e.result.total.dG0, unit))],
    [`Total ΔrG' (${u})`, (e) => cell(energy(e.result.total.dG, unit))],
    ["Phosphate (ATP eq.)", (e) => cell(num(e.result.total.cost.phosphate, 2))],
    ["Reducing (carriers)", (e) => cell(num(e.result.total.cost.reducing, 2))],
    ["Total cost (ATP eq.)", (e) => cell(num(e.result.total.cost.total, 2), "num total-cost")],
    [`MDF (${u})`, (e) => cell(e.result.mdf ? energy(e.result.mdf.drivingForce, unit, 2) + (e.result.mdf.drivingForce > 0 ? "" : " ▲") : "—", "num mdf")],
    ["Bottleneck steps", (e) => cell(bottlenecks(e), "bn")],
    ["Uphill steps", (e) => cell(String(e.result.rows.filter((r) => r.status === "uphill").length))],
  ];
  const head = el("tr", {}, el("th", { scope: "col" }, ""), ...list.map((e, i) => el("th", { scope: "col", class: "ws" },
    el("span", { class: `cmp-letter s${i % STYLES.length}` }, LETTERS[i] ?? String(i + 1)), " ", e.label,
    el("div", { class: "aside" }, e.open ? "open now" : e.origin, e.open ? "" : " ", e.open ? "" : removeButton(e, i)))));
  ui.table.replaceChildren(el("table", { class: "cmp-table" }, el("thead", {}, head),
    el("tbody", {}, ...rows.map(([label, f]) => el("tr", {}, el("th", { scope: "row" }, label), ...list.map(f))))));
}

function bottlenecks(e) {
  const m = e.result.mdf;
  if (!m || !m.bottlenecks.length) return "—";
  const at = new Map(e.result.rows.map((r, i) => [r.id, i + 1]));
  return "◆ " + m.bottlenecks.map((id) => `${at.get(id)}${String(at.get(id)) === id ? "" : ` (${id})`}`).join(", ");
}

function marker(kind, x, y) {
  const s = 3.5;
  switch (kind) {
    case "square": return `<rect class="mk" x="${(x - s).toFixed(1)}" y="${(y - s).toFixed(1)}" width="${2 * s}" height="${2 * s}"/>`;
    case "triangle": return `<path class="mk" d="M${x.toFixed(1)} ${(y - s - 1).toFixed(1)} l${s + 0.5} ${2 * s} h${-2 * s - 1} z"/>`;
    case "diamond": return `<path class="mk" d="M${x.toFixed(1)} ${(y - s - 1).toFixed(1)} l${s + 1} ${s + 1} l${-s - 1} ${s + 1} l${-s - 1} ${-s - 1} z"/>`;
    case "cross": return `<path class="mk open" d="M${(x - s).toFixed(1)} ${(y - s).toFixed(1)} l${2 * s} ${2 * s} m0 ${-2 * s} l${-2 * s} ${2 * s}"/>`;
    default: return `<circle class="mk" cx="${x.toFixed(1)}" cy="${y.toFixed(1)}" r="${s}"/>`;
  }
}

// levels is the running sum of ΔrG' × multiplier after each step (steps without ΔrG' add nothing).
function levels(result, unit) {
  const out = [0];
  for (const r of result.rows) out.push(out[out.length - 1] + (r.dG === null ? 0 : energyIn(r.dG * r.times, unit)));
  return out;
}

function drawChart(list) {
  const unit = store.ui.unit;
  const series = list.map((e) => levels(e.result, unit));
  const n = Math.max(...series.map((s) => s.length - 1), 1);
  const { yTicks, y } = scale(series.flat());
  // The level after step k sits in the middle of step k's slot, under its label; the start (0) on the axis.
  const xOf = (i) => M.left + i * (W - M.left - M.right) / n;
  const xAt = (k) => (k === 0 ? xOf(0) : (xOf(k - 1) + xOf(k)) / 2);
  const parts = frame(yTicks, y, `running ΔrG' (${unitLabel(unit)})`, n, xOf,
    `Running ΔrG' of ${list.length} worksheets: ` + list.map((e, i) => `${LETTERS[i]} ${e.label} ends at ${num(series[i][series[i].length - 1], 1)}`).join("; "));
  const labels = [];
  series.forEach((s, k) => {
    const st = STYLES[k % STYLES.length];
    const pts = s.map((v, i) => [xAt(i), y(v)]);
    parts.push(`<g class="series s${k % STYLES.length}"><title>${esc(`${LETTERS[k]}: ${list[k].label}`)}</title>`);
    parts.push(`<polyline class="line" points="${pts.map(([a, b]) => `${a.toFixed(1)},${b.toFixed(1)}`).join(" ")}"${st.dash ? ` stroke-dasharray="${st.dash}"` : ""}/>`);
    if (s.length <= 40) for (const [a, b] of pts) parts.push(marker(st.marker, a, b));
    const [lx, ly] = pts[pts.length - 1];
    labels.push({ k, x: lx, y: ly });
    parts.push("</g>");
  });
  // Letters at the ends of the lines, pushed apart where lines end close together.
  labels.sort((a, b) => a.y - b.y);
  for (let i = 1; i < labels.length; i++) if (labels[i].y - labels[i - 1].y < 12) labels[i].y = labels[i - 1].y + 12;
  for (const l of labels) {
    const anchor = l.x > W - M.right - 20 ? "end" : "start";
    const dx = anchor === "end" ? -8 : 6;
    parts.push(`<text class="end-label s${l.k % STYLES.length}" x="${(l.x + dx).toFixed(1)}" y="${(l.y - 6).toFixed(1)}" text-anchor="${anchor}">${LETTERS[l.k]}</text>`);
  }
  parts.push("</svg>");
  const svg = parts.join("");
  if (ui.chartSVG !== svg) {
    ui.chartSVG = svg;
    ui.chart.innerHTML = svg;
  }
  ui.legend.replaceChildren(...list.map((e, k) => {
    const st = STYLES[k % STYLES.length];
    const svg = `<svg viewBox="0 0 44 12" width="44" height="12" aria-hidden="true"><g class="series s${k % STYLES.length}">` +
      `<line class="line" x1="2" x2="42" y1="6" y2="6"${st.dash ? ` stroke-dasharray="${st.dash}"` : ""}/>${marker(st.marker, 22, 6)}</g></svg>`;
    const li = el("li", {}, el("span", { class: "swatch" }), el("b", {}, LETTERS[k] + " "), e.label,
      el("span", { class: "aside" }, ` · ${st.marker} markers, ${st.line} line · ends at ${num(series[k][series[k].length - 1], 1)} ${unitLabel(unit)}`));
    li.firstChild.innerHTML = svg;
    return li;
  }));
}
