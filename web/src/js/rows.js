// Row operations on the worksheet document: add, delete, duplicate, move, and taking rows pasted from a
// spreadsheet. Each is one edit of store.doc followed by a recompute.

import { store, edit, newRowId } from "./state.js";
import { readNumber } from "./format.js";

function indexOf(id) {
  return store.doc.rows.findIndex((r) => r.id === id);
}

// insertRow adds rows after the row with id after ("" puts them first) and returns their ids.
export function insertRows(after, rows) {
  const ids = [];
  edit((doc) => {
    let at = after ? doc.rows.findIndex((r) => r.id === after) + 1 : 0;
    for (const r of rows) {
      const row = { id: newRowId(doc), equation: r.equation ?? "", times: r.times ?? 1, dG0: r.dG0 ?? null, note: r.note ?? "" };
      doc.rows.splice(at++, 0, row);
      ids.push(row.id);
    }
  }, "structure");
  return ids;
}

// insertRow adds one empty row after the row with id after and returns its id.
export function insertRow(after) {
  return insertRows(after, [{}])[0];
}

// appendRow adds an empty row at the end and returns its id.
export function appendRow() {
  const rows = store.doc.rows;
  return insertRow(rows.length ? rows[rows.length - 1].id : "");
}

// deleteRow removes the row and returns the id of the row that takes its place for the cursor ("" when
// the sheet is empty).
export function deleteRow(id) {
  const i = indexOf(id);
  if (i < 0) return "";
  edit((doc) => doc.rows.splice(i, 1), "structure");
  const rows = store.doc.rows;
  return rows.length ? rows[Math.min(i, rows.length - 1)].id : "";
}

// duplicateRow copies the row below itself and returns the copy's id.
export function duplicateRow(id) {
  const r = store.doc.rows[indexOf(id)];
  if (!r) return "";
  return insertRows(id, [{ ...r }])[0];
}

// moveRow moves the row by delta places (−1 up, +1 down); it reports whether it moved.
export function moveRow(id, delta) {
  const i = indexOf(id);
  const j = i + delta;
  if (i < 0 || j < 0 || j >= store.doc.rows.length) return false;
  edit((doc) => {
    const [r] = doc.rows.splice(i, 1);
    doc.rows.splice(j, 0, r);
  }, "structure");
  return true;
}

// parsePasted reads rows copied from a spreadsheet: one row per line, cells separated by tabs, in the
// order equation, multiplier, entered ΔrG'° (kJ/mol, or kcal/mol when that unit is shown). A first line
// whose multiplier cell is text (a header) is skipped. Cells that are not numbers are kept: the
// multiplier falls back to 1 and the text goes into the row's note, so nothing pasted is lost.
export function parsePasted(text, toKJ) {
  const lines = text.replace(/\r\n?/g, "\n").split("\n").filter((l) => l.trim() !== "");
  const rows = [];
  lines.forEach((line, n) => {
    const cells = line.split("\t").map((c) => c.trim());
    const [equation = "", timesText = "", dg0Text = "", ...rest] = cells;
    const times = readNumber(timesText);
    const dg0 = readNumber(dg0Text);
    if (n === 0 && (times.error || dg0.error) && !/[=⇌→]|->/.test(equation)) return; // header line
    const notes = [];
    const row = { equation };
    if (times.value !== undefined) row.times = times.value;
    else if (times.error) notes.push(`pasted multiplier "${timesText}" is not a number`);
    if (dg0.value !== undefined) row.dG0 = toKJ(dg0.value);
    else if (dg0.error) notes.push(`pasted ΔrG'° "${dg0Text}" is not a number`);
    if (rest.length && rest.some((c) => c)) notes.push(rest.join(" "));
    row.note = notes.join("; ");
    rows.push(row);
  });
  return rows;
}
