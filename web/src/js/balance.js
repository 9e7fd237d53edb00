// The pathway balance: the net reaction, total ΔrG'° and ΔrG', the phosphate, reducing and total costs,
// and the energy values in use (ATP equivalents per compound, reducing carriers, P/O ratio), which the
// user can change for this worksheet.

import { store } from "./state.js";
import { el, energy, num, unitLabel, editText } from "./format.js";
import { bind, numberTake } from "./fields.js";

let valuesSignature = "";

export function renderBalance(kind) {
  const body = document.getElementById("balance-body");
  const res = store.result;
  const unit = store.ui.unit;
  if (!body.firstChild || kind === "load") {
    body.replaceChildren(
      el("p", { class: "net" }, el("span", { class: "label" }, "Net reaction "), el("code", { id: "net-eq" })),
      el("dl", { class: "sums" },
        el("div", {}, el("dt", {}, "Total ΔrG'°"), el("dd", { id: "tot-dg0" })),
        el("div", {}, el("dt", {}, "Total ΔrG'"), el("dd", { id: "tot-dg" })),
        el("div", {}, el("dt", {}, "Phosphate cost"), el("dd", { id: "tot-p" })),
        el("div", {}, el("dt", {}, "Reducing cost"), el("dd", { id: "tot-r" })),
        el("div", {}, el("dt", {}, "Total cost"), el("dd", { id: "tot-c" }))),
      el("p", { class: "aside" }, "Costs are in ATP equivalents per pass through the pathway: positive is spent, negative is gained. Reducing carriers count at their P/O ratio in the total."),
      el("h3", {}, "Values in use"),
      el("table", { class: "values" },
        el("thead", {}, el("tr", {}, el("th", { scope: "col" }, "Compound"), el("th", { scope: "col" }, "phosphate (ATP eq.)"),
          el("th", { scope: "col" }, "reducing (carriers)"), el("th", { scope: "col" }, "P/O"))),
        el("tbody", { id: "values-body" })),
      el("label", { class: "aside" }, el("input", { type: "checkbox", id: "values-all",
        onchange: (ev) => { showAllValues = ev.target.checked; renderValues(); } }), " show every compound that has a value"),
      el("p", { class: "aside" }, "Empty fields use the value shown in grey; a value you enter here applies to this worksheet only."));
    valuesSignature = "";
  }
  const t = res?.total;
  document.getElementById("net-eq").textContent = t?.equation || "—";
  const withUnit = (v) => (v === null || v === undefined ? "—" : `${energy(v, unit)} ${unitLabel(unit)}`);
  document.getElementById("tot-dg0").textContent = t ? withUnit(t.dG0) : "—";
  const dg = document.getElementById("tot-dg");
  dg.textContent = t ? withUnit(t.dG) : "—";
  dg.classList.toggle("uphill", !!t && t.dG !== null && t.dG > 0);
  if (t && t.dG !== null && t.dG > 0) dg.append(el("span", { class: "badge" }, " ▲ uphill overall"));
  document.getElementById("tot-p").textContent = t ? num(t.cost.phosphate, 2) : "—";
  document.getElementById("tot-r").textContent = t ? `${num(t.cost.reducing, 2)} carriers` : "—";
  document.getElementById("tot-c").textContent = t ? `${num(t.cost.total, 2)} ATP eq.` : "—";
  renderValues();
}

let showAllValues = false;

// valueKeys lists the compounds whose values the table shows: those in the steps that carry a value,
// and those the worksheet sets; with "show all", every compound the engine has a value for.
function valueKeys() {
  const all = Object.keys(store.result?.values ?? {});
  const inSteps = new Set((store.result?.compounds ?? []).map((c) => c.library || c.id));
  const keys = showAllValues ? all : all.filter((k) => inSteps.has(k));
  for (const k of Object.keys(store.doc.values)) if (!keys.includes(k)) keys.push(k);
  return keys;
}

function renderValues() {
  const tbody = document.getElementById("values-body");
  const keys = valueKeys();
  const sig = keys.join("\n");
  tbody.closest("table").hidden = keys.length === 0;
  if (sig !== valuesSignature) {
    valuesSignature = sig;
    tbody.replaceChildren(...keys.map((k) => el("tr", { "data-key": k }, el("th", { scope: "row" }, k),
      ...["phosphate", "reducing", "po"].map((f) => {
        const input = el("input", { inputmode: "decimal", size: "5", "aria-label": `${f === "po" ? "P/O" : f} value of ${k}` });
        const path = `values.${k}.${f}`;
        bind(input, path, () => {
          const set = store.doc.values[k]?.[f];
          return set === undefined ? "" : editText(set);
        }, numberTake((v) => {
          const entry = (store.doc.values[k] ??= {});
          if (v === undefined) delete entry[f];
          else entry[f] = v;
          if (!Object.keys(entry).length) delete store.doc.values[k];
        }, { allowEmpty: true }));
        return el("td", {}, input);
      }))));
  }
  for (const tr of tbody.children) {
    const k = tr.dataset.key;
    const used = store.result?.values?.[k];
    tr.querySelectorAll("input").forEach((input, n) => {
      const f = ["phosphate", "reducing", "po"][n];
      input.placeholder = used ? editText(used[f]) : "";
      input.classList.toggle("overridden", store.doc.values[k]?.[f] !== undefined);
    });
  }
}
