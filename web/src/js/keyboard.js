// Keyboard use of the grid: moving between cells, row commands, and pasting rows copied from a
// spreadsheet. Tab and Shift+Tab keep their usual meaning (the cells are in reading order).

import { store, edit } from "./state.js";
import { energyFrom } from "./format.js";
import { COLUMNS, focusCell, record } from "./grid.js";
import { handleKey } from "./complete.js";
import { appendRow, insertRow, insertRows, deleteRow, duplicateRow, moveRow, parsePasted } from "./rows.js";

function cellOf(target) {
  const tr = target.closest?.("tr.row");
  if (!tr || !target.dataset.col) return null;
  return { id: tr.dataset.id, col: target.dataset.col, input: target };
}

function neighbour(id, delta) {
  const rows = store.doc.rows;
  const i = rows.findIndex((r) => r.id === id);
  const j = i + delta;
  return j >= 0 && j < rows.length ? rows[j].id : "";
}

// onKey is the grid's keydown handler.
export function onKey(ev) {
  const cell = cellOf(ev.target);
  if (!cell) return;
  if (cell.col === "eq" && handleKey(ev)) {
    ev.preventDefault();
    return;
  }
  const { id, col, input } = cell;
  const k = ev.key;
  const done = () => ev.preventDefault();
  if (ev.altKey && ev.shiftKey && k === "ArrowDown") {
    const copy = duplicateRow(id);
    focusCell(copy, col);
    return done();
  }
  if (ev.altKey && !ev.shiftKey && (k === "ArrowUp" || k === "ArrowDown")) {
    moveRow(id, k === "ArrowUp" ? -1 : 1);
    focusCell(id, col);
    return done();
  }
  if (ev.altKey && (k === "Delete" || k === "Backspace")) {
    const next = deleteRow(id);
    if (next) focusCell(next, col);
    else focusCell(appendRow(), "eq");
    return done();
  }
  if ((ev.ctrlKey || ev.metaKey) && k === "Enter") {
    focusCell(insertRow(id), "eq");
    return done();
  }
  if (ev.altKey || ev.ctrlKey || ev.metaKey) return;
  if (k === "Enter") {
    const next = neighbour(id, ev.shiftKey ? -1 : 1) || (ev.shiftKey ? "" : appendRow());
    if (next) focusCell(next, col);
    return done();
  }
  if (k === "ArrowDown" || k === "ArrowUp") {
    const next = neighbour(id, k === "ArrowDown" ? 1 : -1);
    if (next) focusCell(next, col);
    return done();
  }
  const atStart = input.selectionStart === 0 && input.selectionEnd === 0;
  const atEnd = input.selectionStart === input.value.length && input.selectionEnd === input.value.length;
  const c = COLUMNS.indexOf(col);
  if (k === "ArrowLeft" && atStart && c > 0) {
    focusCell(id, COLUMNS[c - 1], "end");
    return done();
  }
  if (k === "ArrowRight" && atEnd && c < COLUMNS.length - 1) {
    focusCell(id, COLUMNS[c + 1], "start");
    return done();
  }
}

// onPaste takes text with tabs or several lines as rows: the first pasted row fills the current row when
// its equation is empty, the others go below it.
export function onPaste(ev) {
  const cell = cellOf(ev.target);
  const text = ev.clipboardData?.getData("text/plain") ?? "";
  if (!cell || !(text.includes("\t") || text.trim().includes("\n"))) return;
  ev.preventDefault();
  const rows = parsePasted(text, (v) => energyFrom(v, store.ui.unit));
  if (!rows.length) return;
  const cur = store.doc.rows.find((r) => r.id === cell.id);
  if (cur && !cur.equation.trim()) {
    const first = rows.shift();
    edit(() => {
      cur.equation = first.equation;
      if (first.times !== undefined) cur.times = first.times;
      if (first.dG0 !== undefined) cur.dG0 = first.dG0;
      if (first.note) cur.note = first.note;
    }, "structure");
    record(cell.id).eq.value = cur.equation; // the focused field is not redrawn by the grid
  }
  const ids = rows.length ? insertRows(cell.id, rows) : [];
  focusCell(ids.length ? ids[ids.length - 1] : cell.id, "eq");
}
