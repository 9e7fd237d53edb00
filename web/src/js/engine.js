// Starting the engine: the WebAssembly module is inlined in the page gzip-compressed and written as text
// (element #gs-engine, 7 bits per character); it is inflated with DecompressionStream and run with Go's wasm_exec.js, after
// which the bridge has put {evaluate, compounds, version} on globalThis.gibbsheet.

// text7Bytes decodes the engine's text (see Text7 in web/assemble): 7 bits per character, characters
// from U+0100 on standing for the value minus 0x100; length is the number of bytes.
export function text7Bytes(text, length) {
  const out = new Uint8Array(length);
  let acc = 0;
  let bits = 0;
  let o = 0;
  for (let i = 0; i < text.length && o < length; i++) {
    let v = text.charCodeAt(i);
    if (v >= 0x100) v -= 0x100;
    acc = (acc << 7) | (v & 0x7f);
    bits += 7;
    if (bits >= 8) {
      bits -= 8;
      out[o++] = (acc >> bits) & 0xff;
      acc &= (1 << bits) - 1;
    }
  }
  if (o !== length) throw new Error(`the engine inside this page is cut short (${o} of ${length} bytes)`);
  return out;
}

// inflateText returns the text of an element written like the engine (gzip, then Text7), as the
// templates are.
export async function inflateText(holder) {
  const gz = text7Bytes(holder.textContent, Number(holder.dataset.length));
  return new Response(new Blob([gz]).stream().pipeThrough(new DecompressionStream("gzip"))).text();
}

// startEngine instantiates the engine and returns globalThis.gibbsheet.
export async function startEngine(onExit) {
  const holder = document.getElementById("gs-engine");
  if (!holder) throw new Error("this page has no engine inside it");
  if (typeof DecompressionStream !== "function") {
    throw new Error("this browser cannot inflate the engine (no DecompressionStream); use a current browser");
  }
  performance.mark("gibbsheet:engine-decode");
  const gz = text7Bytes(holder.textContent, Number(holder.dataset.length));
  performance.mark("gibbsheet:engine-compile");
  const inflate = () => new Response(new Blob([gz]).stream().pipeThrough(new DecompressionStream("gzip")),
    { headers: { "Content-Type": "application/wasm" } });
  // The bridge makes its functions throw through this wrapper: the page's Content-Security-Policy does not
  // let it build one from text (wasm/page/main.go, throwing).
  globalThis.gibbsheetThrowing ??= (f) => (...args) => { const r = f(...args); if (r instanceof Error) throw r; return r; };
  const go = new Go();
  let instance;
  try {
    ({ instance } = await WebAssembly.instantiateStreaming(inflate(), go.importObject));
  } catch (e) {
    // Some browsers refuse streaming compilation of a constructed response; compile from bytes instead.
    const bytes = await inflate().arrayBuffer();
    ({ instance } = await WebAssembly.instantiate(bytes, go.importObject));
  }
  performance.mark("gibbsheet:engine-run");
  // run() settles only when the Go program ends, which it should never do while the page is open.
  go.run(instance).then(() => onExit?.("the engine stopped"), (e) => onExit?.(String(e)));
  performance.mark("gibbsheet:engine-ready");
  const api = globalThis.gibbsheet;
  if (!api || typeof api.evaluate !== "function") throw new Error("the engine started but did not register itself");
  return api;
}
