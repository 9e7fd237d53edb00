// The max-min driving force panel: the MDF the engine found (the largest driving force −ΔrG' that every
// step keeps at once when the concentrations may move within their bounds), a bar chart of each step's
// driving force at that optimum with the bottlenecks marked, the flux-force relation and the remedy of
// each uphill step, and the optimal concentrations beside the entered ones with their bounds, which the
// user edits here (store.doc.bounds). The engine computes everything; this module only shows it.

import { store, recompute, fieldError } from "./state.js";
import { el, energy, energyIn, num, molar, powerOfTen, unitLabel } from "./format.js";
import { bind } from "./fields.js";
import { W, M, esc, frame, scale, empty } from "./charts.js";

// DEFAULT_BOUNDS is the range the engine uses when the worksheet sets none (engine.DefaultLowerBound and
// DefaultUpperBound: 1 µM to 10 mM, common practice in pathway analysis).
export const DEFAULT_BOUNDS = ["1 uM", "10 mM"];

const ui = {};
const rowLines = new Map(); // row id -> {tr, key}
const concLines = new Map(); // compound -> line
let concSignature = "";

// stepNumbers maps row ids to their 1-based place in the worksheet.
export function stepNumbers() {
  return new Map(store.doc.rows.map((r, i) => [r.id, i + 1]));
}

// remedyText writes a row's toDownhill as "raise X from a to b (×f)".
export function remedyText(t) {
  if (!t) return "";
  const verb = t.factor >= 1 ? "raise" : "lower";
  return `${verb} ${t.compound} from ${molar(t.from)} to ${molar(t.to)} (×${Number(t.factor.toPrecision(3))})`;
}

function bounds() {
  return store.doc.bounds ?? {};
}

function tidyBounds() {
  const b = store.doc.bounds;
  if (!b) return;
  if (b.compounds && Object.keys(b.compounds).length === 0) delete b.compounds;
  if (!b.default && !b.compounds) delete store.doc.bounds;
}

function defaultPair() {
  const d = bounds().default;
  return Array.isArray(d) && d.length === 2 ? d : DEFAULT_BOUNDS;
}

// writePair stores text as one side of a [low, high] pair. An empty side takes the fallback's text, and
// a pair equal to its fallback is removed, so that clearing both fields restores the default.
function writePair(get, set, side, text, fallback) {
  const pair = [...(get() ?? fallback)];
  pair[side] = text.trim() === "" ? fallback[side] : text;
  if (pair[0].trim() === fallback[0].trim() && pair[1].trim() === fallback[1].trim()) set(undefined);
  else set(pair);
  tidyBounds();
  return "";
}

// boundKey finds the key under which the document holds a compound's bounds (names compared without
// regard to case); a compound without bounds gets its name as the engine wrote it.
function boundKey(name) {
  const want = name.toLowerCase();
  for (const k of Object.keys(bounds().compounds ?? {})) if (k.toLowerCase() === want) return k;
  return name;
}

function boundInput(path, side, label, get, set, fallback) {
  const input = el("input", { class: "bound", size: "7", spellcheck: "false", autocomplete: "off", "aria-label": label });
  bind(input, `${path}[${side}]`, () => get()?.[side] ?? "", (t) => writePair(get, set, side, t, fallback()));
  return input;
}

// setupAnalysis builds the panel once; renderAnalysis fills it after every recompute.
export function setupAnalysis() {
  const body = document.getElementById("mdf-body");
  ui.figure = el("p", { class: "mdf-figure", id: "mdf-figure" });
  ui.message = el("p", { class: "aside", id: "mdf-message" });
  ui.chart = el("div", { class: "chart", id: "chart-mdf" });
  ui.legend = el("p", { class: "aside legend-line" },
    el("span", { class: "key-bottleneck", "aria-hidden": "true" }, "◆"), " hatched bar: a bottleneck, its driving force is the MDF · ",
    el("span", { class: "key-mdf", "aria-hidden": "true" }, "- - -"), " dashed line: the MDF · ",
    "– : step not in the analysis (no ΔrG'°)");
  ui.rows = el("tbody", { id: "mdf-rows" });
  const getDef = () => bounds().default;
  const setDef = (v) => { if (v === undefined) delete (store.doc.bounds ??= {}).default; else (store.doc.bounds ??= {}).default = v; };
  ui.defLow = boundInput("bounds.default", 0, "Low bound of the default range", getDef, setDef, () => DEFAULT_BOUNDS);
  ui.defHigh = boundInput("bounds.default", 1, "High bound of the default range", getDef, setDef, () => DEFAULT_BOUNDS);
  ui.defMsg = el("div", { class: "field-msg", id: "bounds-default-msg" });
  ui.conc = el("tbody", { id: "mdf-conc" });
  ui.extra = el("div", { id: "mdf-extra" });
  body.replaceChildren(ui.figure, ui.message, ui.chart, ui.legend,
    el("h3", {}, "Steps"),
    el("div", { class: "scroll-x" }, el("table", { class: "mdf-table" },
      el("thead", {}, el("tr", {},
        el("th", { scope: "col" }, "#"), el("th", { scope: "col" }, "Step"),
        el("th", { scope: "col", title: "−ΔrG' of the step at the optimal concentrations" }, "Driving force at the optimum ", el("span", { class: "unit-e" }, unitLabel(store.ui.unit))),
        el("th", { scope: "col" }, "Bottleneck"),
        el("th", { scope: "col", title: "J+/J− = exp(−ΔrG'/RT) at the entered concentrations (Beard and Qian 2007)" }, "Flux-force J+/J−"),
        el("th", { scope: "col", title: "J−/J+: the share of the forward flux the reverse flux cancels, at the entered concentrations" }, "Reverse share"),
        el("th", { scope: "col" }, "To make it downhill"))),
      ui.rows)),
    el("h3", {}, "Concentrations: entered and at the optimum"),
    el("p", { class: "aside" }, "The optimum keeps each compound within its bounds. A low bound equal to the high one holds the compound fixed; empty fields use the default range."),
    el("p", { class: "bounds-default" }, "Default range for every compound not listed with its own: ",
      ui.defLow, " to ", ui.defHigh, ui.defMsg),
    el("div", { class: "scroll-x" }, el("table", { class: "mdf-table conc" },
      el("thead", {}, el("tr", {},
        el("th", { scope: "col" }, "Compound"), el("th", { scope: "col" }, "Entered"), el("th", { scope: "col" }, "At the optimum"),
        el("th", { scope: "col" }, "Low bound"), el("th", { scope: "col" }, "High bound"), el("th", { scope: "col" }, "Limits the MDF"))),
      ui.conc)),
    ui.extra);
}

// renderAnalysis draws the panel from store.result.mdf and the rows' flux-force and remedies.
export function renderAnalysis() {
  if (ui.doc !== store.doc) {
    // Another worksheet: its rows and bound keys share nothing with the lines drawn for the last one.
    ui.doc = store.doc;
    rowLines.clear();
    concLines.clear();
    concSignature = "";
    ui.rows.replaceChildren();
  }
  const m = store.result?.mdf ?? null;
  const unit = store.ui.unit;
  const steps = stepNumbers();
  if (m) {
    const ok = m.drivingForce > 0;
    const names = m.bottlenecks.map((id) => `step ${steps.get(id) ?? "?"}${String(steps.get(id)) === id ? "" : ` (${id})`}`);
    ui.figure.replaceChildren(el("span", { class: "label" }, "MDF "),
      el("b", { id: "mdf-value", class: ok ? "" : "uphill" }, `${energy(m.drivingForce, unit, 2)} ${unitLabel(unit)}`),
      el("span", { class: "verdict " + (ok ? "ok" : "uphill") }, ok ? " ▽ every step can run forward within the bounds"
        : " ▲ no concentrations within the bounds let every step run forward"),
      names.length ? el("span", { class: "bn" }, ` · ◆ bottleneck: ${names.join(", ")}`) : "");
    ui.message.textContent = m.message + (m.leftOut.length ? ` (left out, no ΔrG'°: ${m.leftOut.map((id) => "step " + (steps.get(id) ?? id)).join(", ")})` : "");
  } else {
    const failed = store.result?.warnings?.find((w) => w.code === "mdf-failed");
    ui.figure.replaceChildren(el("span", { class: "label" }, "MDF "), el("b", { id: "mdf-value" }, "—"));
    ui.message.textContent = failed ? failed.message : "No step has a ΔrG'° yet, so there is nothing to optimise.";
  }
  drawChart(m, unit, steps);
  drawRows(m, unit);
  drawConcentrations(m);
}

function drawChart(m, unit, steps) {
  const rows = store.doc.rows;
  const n = rows.length;
  const byId = new Map((m?.rows ?? []).map((r) => [r.id, r]));
  if (!m || byId.size === 0) {
    ui.chart.replaceChildren(empty("The chart appears once a step has a ΔrG'°."));
    ui.chartSVG = "";
    return;
  }
  const vals = rows.map((r) => (byId.has(r.id) ? energyIn(byId.get(r.id).drivingForce, unit) : 0));
  const mdf = energyIn(m.drivingForce, unit);
  const { yTicks, y } = scale([...vals, mdf]);
  const xOf = (i) => M.left + i * (W - M.left - M.right) / n;
  const bw = (W - M.left - M.right) / n;
  const parts = frame(yTicks, y, `−ΔrG' at the optimum (${unitLabel(unit)})`, n, xOf,
    `Driving force of each of ${n} steps at the MDF optimum; MDF ${num(mdf, 2)} ${unitLabel(unit)}`);
  parts.splice(1, 0, `<defs><pattern id="mdf-hatch" width="6" height="6" patternUnits="userSpaceOnUse" patternTransform="rotate(45)">` +
    `<rect width="6" height="6" class="hatch-bg"/><line x1="0" y1="0" x2="0" y2="6" class="hatch-line"/></pattern></defs>`);
  rows.forEach((r, i) => {
    const mr = byId.get(r.id);
    const cx = xOf(i) + bw / 2;
    if (!mr) {
      if (n <= 60) parts.push(`<text class="mark out" x="${cx.toFixed(1)}" y="${(y(0) - 4).toFixed(1)}" text-anchor="middle">–<title>step ${i + 1}: not in the analysis (no ΔrG'°)</title></text>`);
      return;
    }
    const v = vals[i];
    const top = y(Math.max(v, 0));
    const h = Math.max(Math.abs(y(v) - y(0)), 1);
    const cls = mr.bottleneck ? "bar df bottleneck" : "bar df";
    const tip = `step ${i + 1}${String(i + 1) === r.id ? "" : ` (${r.id})`}: driving force ${num(v, 2)} ${unitLabel(unit)} at the optimum` +
      (mr.bottleneck ? `; bottleneck (shadow price ${num(mr.shadow, 2)})` : "");
    parts.push(`<rect class="${cls}" x="${(xOf(i) + bw * 0.15).toFixed(1)}" y="${top.toFixed(1)}" width="${Math.max(1, bw * 0.7).toFixed(1)}" height="${h.toFixed(1)}"><title>${esc(tip)}</title></rect>`);
    if (mr.bottleneck) {
      const ty = v >= 0 ? top - 4 : top + h + 12;
      parts.push(`<text class="mark bn" x="${cx.toFixed(1)}" y="${ty.toFixed(1)}" text-anchor="middle">◆</text>`);
    }
  });
  const ym = y(mdf).toFixed(1);
  parts.push(`<line class="mdf-line" x1="${M.left}" x2="${W - M.right}" y1="${ym}" y2="${ym}"/>`);
  parts.push(`<text class="mdf-label" x="${W - M.right - 2}" y="${(+ym - 4).toFixed(1)}" text-anchor="end">MDF ${esc(num(mdf, 2))}</text>`);
  parts.push("</svg>");
  const svg = parts.join("");
  // Most edits leave the optimum as it was: the chart is parsed again only when it changed.
  if (ui.chartSVG !== svg) {
    ui.chartSVG = svg;
    ui.chart.innerHTML = svg;
  }
}

function drawRows(m, unit) {
  const byId = new Map((m?.rows ?? []).map((r) => [r.id, r]));
  const res = new Map((store.result?.rows ?? []).map((r) => [r.id, r]));
  const keep = new Set();
  store.doc.rows.forEach((r, i) => {
    const rr = res.get(r.id);
    const mr = byId.get(r.id);
    const key = JSON.stringify([i, rr?.equation ?? r.equation, mr, rr?.fluxForce, rr?.toDownhill, rr?.status, unit]);
    let line = rowLines.get(r.id);
    if (!line) {
      line = { tr: el("tr", { "data-id": r.id }), key: "" };
      rowLines.set(r.id, line);
    }
    keep.add(r.id);
    if (ui.rows.children[i] !== line.tr) ui.rows.insertBefore(line.tr, ui.rows.children[i] ?? null);
    if (line.key === key) return;
    line.key = key;
    const ff = rr?.fluxForce;
    const eq = rr?.equation || r.equation || "";
    line.tr.className = (mr?.bottleneck ? "bottleneck" : "") + (rr?.status === "uphill" ? " uphill" : "");
    line.tr.replaceChildren(
      el("th", { scope: "row", class: "n" }, String(i + 1)),
      el("td", { class: "eq", title: eq }, eq),
      el("td", { class: "num" }, mr ? energy(mr.drivingForce, unit, 2) : el("span", { class: "aside" }, "– not in the analysis")),
      el("td", { class: "bn" }, mr?.bottleneck ? el("span", { title: `shadow price ${num(mr.shadow, 2)}: the MDF falls by this much per kJ/mol added to the step's ΔrG'°` }, "◆ bottleneck") : ""),
      el("td", { class: "num" }, ff ? powerOfTen(ff.log10Ratio) : "—"),
      el("td", { class: "num" }, ff ? percent(ff.reverseShare) : "—"),
      el("td", { class: "remedy" }, rr?.status === "uphill"
        ? (rr.toDownhill ? "▲ " + remedyText(rr.toDownhill) : "▲ no single concentration within its bounds can make it downhill")
        : ""));
  });
  for (const [id, line] of rowLines) {
    if (!keep.has(id)) { line.tr.remove(); rowLines.delete(id); }
  }
}

function percent(x) {
  if (x === null || x === undefined || !Number.isFinite(x)) return "—";
  const p = x * 100;
  return p >= 10 ? `${num(p, 0)} %` : p >= 0.1 ? `${num(p, 1)} %` : p > 0 ? `${p.toExponential(1).replace("-", "−")} %` : "0 %";
}

// drawConcentrations lists the compounds of the analysis and any bounds the document holds for others.
function drawConcentrations(m) {
  const conc = m?.concentrations ?? [];
  const inAnalysis = new Set(conc.map((c) => c.compound.toLowerCase()));
  const extra = Object.keys(bounds().compounds ?? {}).filter((k) => !inAnalysis.has(k.toLowerCase()));
  const names = [...conc.map((c) => c.compound), ...extra];
  const sig = names.join("\n");
  if (sig !== concSignature) {
    concSignature = sig;
    for (const [name, line] of concLines) if (!names.includes(name)) concLines.delete(name);
    ui.conc.replaceChildren(...names.map((name) => {
      let line = concLines.get(name);
      if (!line) { line = concLine(name); concLines.set(name, line); }
      return line.tr;
    }));
  }
  const binding = new Map((m?.binding ?? []).map((b) => [b.compound, b]));
  for (const c of conc) fillConc(concLines.get(c.compound), c, binding.get(c.compound));
  for (const k of extra) fillConc(concLines.get(k), null, null);
  const defErr = fieldError("bounds.default");
  ui.defMsg.textContent = defErr ? "✕ " + defErr : "";
  ui.defMsg.hidden = !defErr;
  for (const input of [ui.defLow, ui.defHigh]) input.classList.toggle("pair-invalid", !!defErr);
  ui.defLow.placeholder = DEFAULT_BOUNDS[0];
  ui.defHigh.placeholder = DEFAULT_BOUNDS[1];
}

function concLine(name) {
  const key = boundKey(name);
  const get = () => bounds().compounds?.[key];
  const set = (v) => {
    const b = (store.doc.bounds ??= {});
    if (v === undefined) { if (b.compounds) delete b.compounds[key]; } else (b.compounds ??= {})[key] = v;
  };
  const line = { key };
  line.low = boundInput(`bounds.compounds.${key}`, 0, `Low bound of ${name}`, get, set, defaultPair);
  line.high = boundInput(`bounds.compounds.${key}`, 1, `High bound of ${name}`, get, set, defaultPair);
  line.entered = el("td", { class: "num" });
  line.opt = el("td", { class: "num" });
  line.limit = el("td", { class: "limit" });
  line.msg = el("div", { class: "field-msg" });
  line.tr = el("tr", { "data-compound": name }, el("th", { scope: "row" }, el("span", { class: "cname" }, name)),
    line.entered, line.opt, el("td", {}, line.low), el("td", {}, line.high, line.msg), line.limit);
  return line;
}

function fillConc(line, c, b) {
  if (!line) return;
  if (c) {
    line.entered.textContent = molar(c.entered);
    line.opt.textContent = molar(c.concentration);
    const ratio = c.concentration / c.entered;
    if (Number.isFinite(ratio) && Math.abs(Math.log10(ratio)) > 0.01) {
      line.opt.append(el("span", { class: "aside" }, ratio > 1 ? " ↑" : " ↓"));
    }
    line.low.placeholder = molar(c.low);
    line.high.placeholder = molar(c.high);
    line.limit.textContent = !b ? "" : b.side === "fixed" ? `◀ fixed at ${molar(b.bound)}` : `◀ at its ${b.side} bound`;
  } else {
    line.entered.replaceChildren(el("span", { class: "aside" }, "not in the analysis"));
    line.opt.textContent = "—";
    line.limit.replaceChildren(el("button", { type: "button", class: "quiet small", onclick: () => {
      delete store.doc.bounds.compounds[line.key];
      tidyBounds();
      store.drafts.delete(`bounds.compounds.${line.key}[0]`);
      store.drafts.delete(`bounds.compounds.${line.key}[1]`);
      recompute("structure");
    } }, "remove"));
  }
  const err = fieldError(`bounds.compounds.${line.key}`);
  const sideErr = fieldError(`bounds.compounds.${line.key}[0]`) || fieldError(`bounds.compounds.${line.key}[1]`);
  const msg = err || sideErr;
  line.msg.textContent = msg ? "✕ " + msg : "";
  line.msg.hidden = !msg;
  for (const input of [line.low, line.high]) input.classList.toggle("pair-invalid", !!err);
}
