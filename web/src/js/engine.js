// Starting the engine: the WebAssembly module is inlined in the page gzip-compressed and written as text
// (element #gs-engine, 7 bits per character, see Text7 in web/assemble). The classic script that follows
// it at the end of the page (Go's wasm_exec.js, then web/assemble/start.js) inflates, compiles and runs
// it, and puts its decoder and the engine's start on globalThis.gibbsheetStart; the bridge puts
// {evaluate, compounds, version, ...} on globalThis.gibbsheet. The page's script comes before all of it
// and calls these functions once the whole file is read.

// starter returns what the page's start script provides.
function starter() {
  const s = globalThis.gibbsheetStart;
  if (!s) throw new Error("this page has no engine inside it (its start script is missing)");
  return s;
}

// inflateText returns the text of an element written like the engine (gzip, then Text7), as the
// templates are: the one the start script began inflating if the element comes before it in the page.
export async function inflateText(holder) {
  const s = starter();
  return s.texts.get(holder.id) ?? s.inflate(holder).text();
}

// startEngine waits for the engine started by the page's start script and returns globalThis.gibbsheet;
// onExit(reason) is called if the Go program ever ends.
export async function startEngine(onExit) {
  const { api, exit } = await starter().engine;
  exit.then(() => onExit?.("the engine stopped"), (e) => onExit?.(String(e)));
  return api;
}
