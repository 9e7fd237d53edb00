// The two charts, drawn as SVG so they stay sharp at any zoom: the running sum of ΔrG' × multiplier
// along the steps (a step chart; uphill steps rise and carry ▲) and the cost of each step in ATP
// equivalents. The frame, scale and size are exported for the analysis and comparison charts.

import { store } from "./state.js";
import { energyIn, num, unitLabel } from "./format.js";

export const W = 640;
export const H = 250;
export const M = { left: 64, right: 14, top: 16, bottom: 40 };

export function esc(s) {
  return String(s).replace(/[&<>"]/g, (c) => ({ "&": "&amp;", "<": "&lt;", ">": "&gt;", '"': "&quot;" })[c]);
}

// ticks returns round values covering [lo, hi], about n of them.
export function ticks(lo, hi, n = 5) {
  if (lo === hi) { lo -= 1; hi += 1; }
  const raw = (hi - lo) / n;
  const p = Math.pow(10, Math.floor(Math.log10(raw)));
  const f = raw / p;
  const step = (f < 1.5 ? 1 : f < 3 ? 2 : f < 7 ? 5 : 10) * p;
  const out = [];
  // The last tick is at or above hi, so that the axis covers every value (nothing drawn above it).
  const top = Math.ceil(hi / step - 1e-9) * step;
  for (let v = Math.floor(lo / step) * step; v <= top + step * 1e-9; v += step) out.push(Math.abs(v) < step * 1e-9 ? 0 : v);
  return out;
}

export function frame(yTicks, y, yTitle, n, xOf, title) {
  const parts = [`<svg viewBox="0 0 ${W} ${H}" role="img" xmlns="http://www.w3.org/2000/svg"><title>${esc(title)}</title>`];
  for (const t of yTicks) {
    const yy = y(t).toFixed(1);
    parts.push(`<line class="${t === 0 ? "zero" : "gridline"}" x1="${M.left}" x2="${W - M.right}" y1="${yy}" y2="${yy}"/>`);
    parts.push(`<text class="tick" x="${M.left - 6}" y="${yy}" text-anchor="end" dominant-baseline="middle">${esc(num(t, Math.abs(yTicks[1] - yTicks[0]) < 1 ? 1 : 0))}</text>`);
  }
  const every = Math.max(1, Math.ceil(n / 25));
  for (let i = 0; i < n; i += every) {
    parts.push(`<text class="tick" x="${((xOf(i) + xOf(i + 1)) / 2).toFixed(1)}" y="${H - M.bottom + 14}" text-anchor="middle">${i + 1}</text>`);
  }
  parts.push(`<line class="axis" x1="${M.left}" x2="${M.left}" y1="${M.top}" y2="${H - M.bottom}"/>`);
  parts.push(`<text class="axis-title" x="${(M.left + W - M.right) / 2}" y="${H - 6}" text-anchor="middle">step</text>`);
  parts.push(`<text class="axis-title" transform="translate(14 ${(M.top + H - M.bottom) / 2}) rotate(-90)" text-anchor="middle">${esc(yTitle)}</text>`);
  return parts;
}

export function scale(values) {
  const lo = Math.min(0, ...values);
  const hi = Math.max(0, ...values);
  const yTicks = ticks(lo, hi);
  const a = yTicks[0];
  const b = yTicks[yTicks.length - 1];
  const y = (v) => M.top + (b - v) / (b - a || 1) * (H - M.top - M.bottom);
  return { yTicks, y };
}

// renderProfile draws the running sum of ΔrG'.
export function renderProfile() {
  const box = document.getElementById("chart-profile");
  const unit = store.ui.unit;
  const rows = rowResults();
  const n = rows.length;
  if (!rows.some((r) => r && r.dG !== null)) { box.replaceChildren(empty("No step has a ΔrG' yet.")); return; }
  const levels = [0];
  for (const r of rows) {
    const d = r && r.dG !== null ? energyIn(r.dG * r.times, unit) : 0;
    levels.push(levels[levels.length - 1] + d);
  }
  const { yTicks, y } = scale(levels);
  const xOf = (i) => M.left + i * (W - M.left - M.right) / n;
  const parts = frame(yTicks, y, `running ΔrG' (${unitLabel(unit)})`, n, xOf,
    `Running sum of ΔrG' over ${n} steps, ending at ${num(levels[n], 1)} ${unitLabel(unit)}`);
  for (let i = 0; i < n; i++) {
    const r = rows[i];
    const x0 = xOf(i).toFixed(1);
    const x1 = xOf(i + 1).toFixed(1);
    const y0 = y(levels[i]).toFixed(1);
    const y1 = y(levels[i + 1]).toFixed(1);
    const known = r && r.dG !== null;
    const cls = !known ? "unknown" : r.status === "uphill" ? "up" : r.status === "near-equilibrium" ? "near" : "down";
    const tip = known ? `step ${i + 1}: ${num(energyIn(r.dG * r.times, unit), 1)} ${unitLabel(unit)} (${r.status})` : `step ${i + 1}: ΔrG' not computed`;
    parts.push(`<g class="st ${cls}"><title>${esc(tip)}</title>`);
    parts.push(`<line class="riser" x1="${x0}" x2="${x0}" y1="${y0}" y2="${y1}"/>`);
    parts.push(`<line class="tread" x1="${x0}" x2="${x1}" y1="${y1}" y2="${y1}"/>`);
    if (cls === "up" && n <= 60) parts.push(`<text class="mark" x="${x0}" y="${(Math.min(+y0, +y1) - 5).toFixed(1)}" text-anchor="middle">▲</text>`);
    if (cls === "near" && n <= 60) parts.push(`<text class="mark" x="${((+x0 + +x1) / 2).toFixed(1)}" y="${(+y1 - 5).toFixed(1)}" text-anchor="middle">≈</text>`);
    if (cls === "unknown" && n <= 60) parts.push(`<text class="mark" x="${((+x0 + +x1) / 2).toFixed(1)}" y="${(+y1 - 5).toFixed(1)}" text-anchor="middle">?</text>`);
    parts.push("</g>");
  }
  parts.push("</svg>");
  box.innerHTML = parts.join("");
}

// renderCost draws each step's total cost (multiplier included).
export function renderCost() {
  const box = document.getElementById("chart-cost");
  const rows = rowResults();
  const n = rows.length;
  if (!rows.some((r) => r && r.cost)) { box.replaceChildren(empty("No step has a cost yet.")); return; }
  if (!rows.some((r) => r && r.cost && r.cost.total !== 0)) { box.replaceChildren(empty("No step spends or gains ATP equivalents.")); return; }
  const vals = rows.map((r) => (r && r.cost ? r.cost.total : 0));
  const { yTicks, y } = scale(vals);
  const xOf = (i) => M.left + i * (W - M.left - M.right) / n;
  const parts = frame(yTicks, y, "cost (ATP equivalents)", n, xOf, `Cost of each of ${n} steps in ATP equivalents`);
  const bw = (W - M.left - M.right) / n;
  for (let i = 0; i < n; i++) {
    const r = rows[i];
    if (!r || !r.cost || r.cost.total === 0) continue;
    const v = r.cost.total;
    const top = y(Math.max(v, 0));
    const h = Math.abs(y(v) - y(0));
    const cls = v > 0 ? "spent" : "gained";
    parts.push(`<rect class="bar ${cls}" x="${(xOf(i) + bw * 0.15).toFixed(1)}" y="${top.toFixed(1)}" width="${Math.max(1, bw * 0.7).toFixed(1)}" height="${Math.max(h, 1).toFixed(1)}"><title>${esc(`step ${i + 1}: ${num(v, 2)} ATP eq. ${v > 0 ? "spent" : "gained"} (phosphate ${num(r.cost.phosphate, 2)}, reducing ${num(r.cost.reducing, 2)})`)}</title></rect>`);
    if (n <= 40) parts.push(`<text class="barlabel" x="${(xOf(i) + bw / 2).toFixed(1)}" y="${(v > 0 ? top - 4 : top + h + 12).toFixed(1)}" text-anchor="middle">${esc(num(v, 1))}</text>`);
  }
  parts.push("</svg>");
  box.innerHTML = parts.join("");
}

export function empty(text) {
  const p = document.createElement("p");
  p.className = "aside";
  p.textContent = text;
  return p;
}

function rowResults() {
  const byId = new Map((store.result?.rows ?? []).map((r) => [r.id, r]));
  return store.doc.rows.map((r) => byId.get(r.id) ?? null);
}
