// The engine's start. Build puts this after Go's wasm_exec.js in the classic script that follows the
// engine's element (#gs-engine: the WebAssembly module gzip-compressed and written as text by Text7) at
// the end of the body, after the page's script, which has by then shown the worksheet with the result
// saved with it; the page's script (js/engine.js, startEngine) waits for the engine,
// globalThis.gibbsheetStart.engine. Errors are the page's script's to report.
(() => {
  // text7Bytes decodes a text written by Text7 (web/assemble): 7 bits per character, characters from
  // U+0080 on (U+00C0, U+00CD, U+00FC) standing for the value minus 0xC0; length is the number of bytes.
  function text7Bytes(text, length) {
    const out = new Uint8Array(length);
    let acc = 0;
    let bits = 0;
    let o = 0;
    for (let i = 0; i < text.length && o < length; i++) {
      let v = text.charCodeAt(i);
      if (v >= 0x80) v -= 0xC0;
      acc = (acc << 7) | (v & 0x7f);
      bits += 7;
      if (bits >= 8) {
        bits -= 8;
        out[o++] = (acc >> bits) & 0xff;
        acc &= (1 << bits) - 1;
      }
    }
    if (o !== length) throw new Error(`the text inside this page is cut short (${o} of ${length} bytes)`);
    return out;
  }

  // response is a response whose body is gz (gzip data) inflated.
  function response(gz, type) {
    const body = new Blob([gz]).stream().pipeThrough(new DecompressionStream("gzip"));
    return new Response(body, type ? { headers: { "Content-Type": type } } : undefined);
  }

  // inflate returns a response whose body is the inflated content of an element written like the engine
  // (gzip, then Text7), such as the templates.
  function inflate(holder) {
    return response(text7Bytes(holder.textContent, Number(holder.dataset.length)));
  }

  // texts holds the inflated texts of the elements before this script (the templates), by element id,
  // started as soon as the engine is on its way.
  const texts = new Map();
  function startTexts() {
    for (const holder of document.querySelectorAll('script[data-encoding="gzip+text7"]:not(#gs-engine)')) {
      const text = inflate(holder).text();
      text.catch(() => {}); // the page's script reports it when it reads the text
      texts.set(holder.id, text);
    }
  }

  // start compiles and runs the engine; it resolves to the bridge's functions and the promise that
  // settles when the Go program ends (which it should never do while the page is open).
  async function start() {
    const holder = document.getElementById("gs-engine");
    if (!holder) throw new Error("this page has no engine inside it");
    if (typeof DecompressionStream !== "function") {
      throw new Error("this browser cannot inflate the engine (no DecompressionStream); use a current browser");
    }
    performance.mark("gibbsheet:engine-decode");
    const gz = text7Bytes(holder.textContent, Number(holder.dataset.length));
    performance.mark("gibbsheet:engine-compile");
    const wasm = () => response(gz, "application/wasm");
    // The bridge makes its functions throw through this wrapper: the page's Content-Security-Policy does not
    // let it build one from text (wasm/page/main.go, throwing).
    globalThis.gibbsheetThrowing ??= (f) => (...args) => { const r = f(...args); if (r instanceof Error) throw r; return r; };
    const go = new Go();
    // The engine makes short-lived garbage on every keystroke and WebAssembly's collector is slow: it
    // collects when the heap has grown elevenfold instead of twofold (a quarter off a recompute, for some
    // tens of MB), and more often only as it nears 256 MiB.
    go.env = { GOGC: "1000", GOMEMLIMIT: "256MiB" };
    let instance;
    try {
      ({ instance } = await WebAssembly.instantiateStreaming(wasm(), go.importObject));
    } catch (e) {
      // Some browsers refuse streaming compilation of a constructed response; compile from bytes instead.
      ({ instance } = await WebAssembly.instantiate(await wasm().arrayBuffer(), go.importObject));
    }
    performance.mark("gibbsheet:engine-run");
    const exit = go.run(instance); // runs the Go program until its main waits, which registers the bridge
    performance.mark("gibbsheet:engine-ready");
    const api = globalThis.gibbsheet;
    if (!api || typeof api.evaluate !== "function") throw new Error("the engine started but did not register itself");
    return { api, exit };
  }

  // afterFirstFrame resolves once the browser has painted what the page's script drew (a frame, then a
  // task), or after a tenth of a second where the page is not painted (a hidden tab). The browser paints
  // the page once it has read the whole file, and decoding the engine's text takes tens of milliseconds
  // of the main thread, which would hold that first frame back; compiling it does not (it runs elsewhere).
  function afterFirstFrame() {
    return new Promise((resolve) => {
      requestAnimationFrame(() => setTimeout(resolve, 0));
      setTimeout(resolve, 100);
    });
  }

  const engine = afterFirstFrame().then(start);
  engine.catch(() => {}); // startEngine reports it
  startTexts();
  globalThis.gibbsheetStart = { text7Bytes, inflate, texts, engine };
})();
