// Sharing: the page saves itself as one HTML file holding the engine, the page and the current
// worksheet; it exports and imports the worksheet document (JSON), exports the results as CSV, copies
// them for a spreadsheet and prints.
//
// How the page rebuilds its own file (see web/assemble/share.go): the page after it has run cannot be
// serialized back (the DOM holds what it drew), so the file carries its recipe in #gibbsheet-shell: the
// skeleton of the file with markers, and for each marker the opening and closing tag of an element and
// its id. Those elements are script and style elements whose text the browser keeps byte for byte and
// the page never changes, so the file is the skeleton with each marker replaced by open tag + the
// element's text + close tag; only the worksheet element gets the current document, escaped exactly as
// web/inject.Escape does. The scripts stay as they were, so the hashes in the file's
// Content-Security-Policy stay valid, and a saved file can be saved again.

import { store, loadDocument, FORMAT } from "./state.js";
import { el } from "./format.js";

// MAX_BYTES is the largest file the page reads (5 MB): a worksheet is a few kilobytes, a saved page a few
// megabytes.
export const MAX_BYTES = 5 * 1024 * 1024;

const WORKSHEET_ID = "gibbsheet-worksheet";
const RESULT_ID = "gibbsheet-result";

const share = { shell: null, texts: new Map(), embedded: "", embeddedResult: "", embeddedDoc: "", clean: "", error: "", hooks: [] };

// openShell keeps the recipe, the worksheet element's text and the result saved beside it, before
// anything else runs. These elements come before the page's script; the others, read by readParts,
// after it.
export function openShell() {
  const holder = document.getElementById("gibbsheet-shell");
  if (!holder) {
    share.error = "this page was not built to save itself (it has no shell)";
    return;
  }
  try {
    share.shell = JSON.parse(holder.textContent);
  } catch (e) {
    share.error = "the page's description of itself is damaged: " + e.message;
    return;
  }
  share.embedded = document.getElementById(WORKSHEET_ID)?.textContent ?? "";
  share.embeddedResult = document.getElementById(RESULT_ID)?.textContent ?? "";
}

// readParts keeps the texts of the page's elements, once the whole file is read.
function readParts() {
  if (!share.shell) return;
  for (const p of share.shell.parts) {
    const node = document.getElementById(p.id);
    if (!node) {
      share.error = `the page lacks its part ${p.id}`;
      share.shell = null;
      return;
    }
    share.texts.set(p.id, node.textContent);
  }
}

// embeddedText is the worksheet element's text as the file carries it ("" when none).
export function embeddedText() {
  return share.embedded;
}

// fingerprint is FNV-1a over the UTF-16 code units of s, as 8 hex digits (web/inject.Fingerprint): enough
// to tell texts apart, not a secret.
export function fingerprint(s) {
  let h = 0x811c9dc5;
  for (let i = 0; i < s.length; i++) {
    h ^= s.charCodeAt(i);
    h = Math.imul(h, 0x01000193) >>> 0;
  }
  return h.toString(16).padStart(8, "0");
}

// savedResult is the result document saved in the file beside its worksheet (web/inject.Result), or null
// when there is none or it was computed for another text of the worksheet element.
export function savedResult() {
  try {
    const saved = JSON.parse(share.embeddedResult || "null");
    if (saved?.for === fingerprint(share.embedded) && Array.isArray(saved.result?.rows)) return saved.result;
  } catch {
    // a damaged result is no result: the engine computes one
  }
  return null;
}

// resultText is the result element's text for the document on screen: the file's own while the document
// is the one it was opened with, else the current result under the fingerprint of worksheetText, or null
// when the page holds no result for this document.
function resultText(worksheetText) {
  if (share.embeddedResult && JSON.stringify(store.doc) === share.embeddedDoc) return share.embeddedResult;
  if (!store.result || store.evalError) return "null";
  return escapeJSON({ for: fingerprint(worksheetText), result: store.result });
}

// isDemo reports whether the file carries the built-in demo worksheet unchanged.
export function isDemo() {
  return !!share.shell?.demo && share.shell.demo === share.embedded;
}

// escapeJSON writes a document as web/inject.Escape does: compact JSON with <, >, & and U+2028/U+2029 as
// \u escapes, so that no text can end the script element or be read as markup.
export function escapeJSON(doc) {
  return JSON.stringify(doc).replace(/[<>&\u2028\u2029]/g,
    (c) => "\\u" + c.charCodeAt(0).toString(16).padStart(4, "0"));
}

// markEmbedded records the document as loaded from the file, so that saving it unchanged writes the
// file's own text back, byte for byte.
export function markEmbedded() {
  share.embeddedDoc = JSON.stringify(store.doc);
  share.clean = share.embeddedDoc;
}

// worksheetText is the worksheet element's text for the document on screen.
function worksheetText() {
  const now = JSON.stringify(store.doc);
  if (share.embedded && now === share.embeddedDoc) return share.embedded;
  return escapeJSON(store.doc);
}

// partText is the text of a part of the file for the document on screen.
function partText(p) {
  if (p.id === share.shell.worksheet) return worksheetText();
  if (p.id === share.shell.result) return resultText(worksheetText());
  return share.texts.get(p.id);
}

// pageFile returns the text of the file that holds the engine, the page and the open worksheet.
export function pageFile() {
  if (!share.shell) throw new Error(share.error || "this page cannot save itself");
  const sk = share.shell.skeleton;
  const spots = share.shell.parts.map((p) => ({ at: sk.indexOf(p.mark), p }));
  for (const s of spots) {
    if (s.at < 0 || sk.indexOf(s.p.mark, s.at + 1) >= 0) throw new Error(`the page's skeleton must hold ${s.p.mark} once`);
  }
  spots.sort((a, b) => a.at - b.at);
  const out = [];
  let last = 0;
  for (const { at, p } of spots) {
    out.push(sk.slice(last, at), p.open, partText(p), p.close);
    last = at + p.mark.length;
  }
  out.push(sk.slice(last));
  return out.join("");
}

// isDirty reports whether the worksheet changed since it was opened or last written to a file.
export function isDirty() {
  return !!store.doc && JSON.stringify(store.doc) !== share.clean;
}

// markClean records the open document as written to a file.
export function markClean() {
  share.clean = JSON.stringify(store.doc);
}

// fileName makes a file name from the worksheet's title.
export function fileName(ext) {
  const base = String(store.doc?.title ?? "").normalize("NFKC").replace(/[\\/:*?"<>|\u0000-\u001f]+/g, " ")
    .replace(/\s+/g, " ").trim().slice(0, 80);
  return (base || "worksheet") + ext;
}

function download(text, name, type) {
  const url = URL.createObjectURL(new Blob([text], { type }));
  const a = el("a", { href: url, download: name, hidden: true });
  document.body.append(a);
  a.click();
  a.remove();
  setTimeout(() => URL.revokeObjectURL(url), 60_000);
}

// say shows a message in the file bar's status line; kind is "ok" or "err". Text only, never markup.
export function say(kind, text) {
  const box = document.getElementById("share-msg");
  if (!box) return;
  box.className = "share-msg " + kind;
  box.replaceChildren(el("span", { class: "sym", "aria-hidden": "true" }, kind === "err" ? "✕ " : "✓ "), text);
  box.hidden = false;
}

// saveAsFile writes the page with the open worksheet as one HTML file.
export function saveAsFile() {
  let text;
  try {
    text = pageFile();
  } catch (e) {
    say("err", "The page could not be saved: " + e.message);
    return;
  }
  const name = fileName(".html");
  download(text, name, "text/html;charset=utf-8");
  markClean();
  say("ok", `Saved as ${name}: open it anywhere, no network needed.`);
}

// exportJSON writes the worksheet document.
export function exportJSON() {
  const name = fileName(".json");
  download(JSON.stringify(store.doc, null, 2) + "\n", name, "application/json");
  markClean();
  say("ok", `Worksheet written to ${name}.`);
}

// tableText asks the engine for the results table: sep "," (CSV) or "\t" (for the clipboard).
export function tableText(sep) {
  return store.engine.csv(JSON.stringify(store.doc), sep);
}

// exportCSV writes the results as CSV. The byte order mark lets spreadsheets read the file as UTF-8.
export function exportCSV() {
  let text;
  try {
    text = tableText(",");
  } catch (e) {
    say("err", "The results could not be written: " + e.message);
    return;
  }
  const name = fileName(".csv");
  download("\ufeff" + text, name, "text/csv;charset=utf-8");
  say("ok", `Results written to ${name}.`);
}

// copyTable puts the results on the clipboard as tab-separated text.
export async function copyTable() {
  let text;
  try {
    text = tableText("\t");
  } catch (e) {
    say("err", "The results could not be copied: " + e.message);
    return;
  }
  try {
    await navigator.clipboard.writeText(text);
  } catch {
    // Older ways still work where the asynchronous clipboard is refused.
    const area = el("textarea", { class: "sr", "aria-hidden": "true" });
    area.value = text;
    document.body.append(area);
    area.select();
    const ok = document.execCommand("copy");
    area.remove();
    if (!ok) {
      say("err", "The browser refused the clipboard; use Export CSV instead.");
      return;
    }
  }
  const n = store.doc.rows.length;
  say("ok", `Results of ${n} step${n === 1 ? "" : "s"} copied: paste them into a spreadsheet.`);
}

// readWorksheet checks the text of a file and returns the worksheet document in it, or throws an Error
// whose message says what is wrong. It takes a worksheet document (JSON) or a page saved by Gibbsheet.
export function readWorksheet(text, name) {
  let json = text.replace(/^\ufeff/, "");
  if (/^\s*</.test(json)) {
    // Written in two pieces so that the page's own text holds no script tag.
    const open = "<" + `script type="application/json" id="${WORKSHEET_ID}">`;
    const i = json.indexOf(open);
    const j = i < 0 ? -1 : json.indexOf("<\/script>", i + open.length);
    if (j < 0) throw new Error(`${name} is a web page but not a saved Gibbsheet worksheet`);
    json = json.slice(i + open.length, j);
  }
  let doc;
  try {
    doc = JSON.parse(json);
  } catch (e) {
    throw new Error(`${name} is not valid JSON (${e.message})`);
  }
  if (doc === null || typeof doc !== "object" || Array.isArray(doc)) throw new Error(`${name} is not a worksheet: it holds no JSON object`);
  const format = doc.format;
  const m = typeof format === "string" ? /^gibbsheet-worksheet\/(\d+)$/.exec(format) : null;
  if (!m) {
    throw new Error(`${name} is not a Gibbsheet worksheet (` +
      (format === undefined ? "it has no format field" : `its format is ${JSON.stringify(format).slice(0, 60)}`) + ")");
  }
  if (Number(m[1]) > 1) throw new Error(`${name} was written by a newer Gibbsheet (format version ${m[1]}); this page reads version 1 — open it with a newer page`);
  if (format !== FORMAT) throw new Error(`${name} has format ${format}, which this page does not read`);
  try {
    store.engine.evaluate(JSON.stringify(doc)); // the engine's own check: fields of the right type
  } catch (e) {
    throw new Error(`${name} cannot be read as a worksheet: ${e.message}`);
  }
  return doc;
}

// importFile opens a worksheet from a file chosen by the user. Any problem gets a message and leaves the
// open worksheet as it is.
export async function importFile(file) {
  const name = `"${String(file.name).slice(0, 120)}"`;
  if (file.size > MAX_BYTES) {
    say("err", `${name} is ${(file.size / 1048576).toFixed(1)} MB; the page opens files up to 5 MB. Nothing was changed.`);
    return false;
  }
  let doc;
  try {
    doc = readWorksheet(await file.text(), name);
  } catch (e) {
    say("err", e.message + ". The open worksheet is unchanged.");
    return false;
  }
  for (const fn of share.hooks) if (!fn()) return false;
  loadDocument(doc, "file");
  markClean();
  say("ok", `Opened ${name}.`);
  return true;
}

// beforeImport registers fn() that may refuse (return false) to replace the open worksheet.
export function beforeImport(fn) {
  share.hooks.push(fn);
}

// setupShare reads the page's recipe of itself and wires the file bar.
export function setupShare() {
  readParts();
  const on = (id, fn) => document.getElementById(id)?.addEventListener("click", fn);
  on("save-file", saveAsFile);
  on("export-json", exportJSON);
  on("export-csv", exportCSV);
  on("copy-table", copyTable);
  on("print-sheet", () => window.print());
  const input = document.getElementById("import-input");
  on("import-file", () => input.click());
  input?.addEventListener("change", async () => {
    const f = input.files?.[0];
    input.value = "";
    if (f) await importFile(f);
  });
}
