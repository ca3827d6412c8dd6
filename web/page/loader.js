// The module loader: it compiles the app's WebAssembly module while the browser is still reading the
// page. The gzipped module follows this script in pieces, each in a script element of type
// application/octet-stream followed by a call of plumbStart.feed(); plumbStart.end(n) follows the last.
// Each piece is unpacked as soon as the HTML parser has read it and goes through a DecompressionStream
// into WebAssembly.compileStreaming (a Response typed application/wasm), so reading the page, inflating
// and compiling overlap instead of following each other. The panel script instantiates
// plumbStart.module and runs it.
"use strict";
(() => {
  // Milliseconds since navigation, for the start-up figures the panel keeps (plumbUI.timing).
  const timing = { loaderMs: performance.now() };
  let controller = null; // the stream of the module's gzipped bytes
  let fed = 0; // bytes fed so far
  let failure = null; // the first error, kept for the panel's message
  let decode = null; // character code -> byte, or -1

  // decodeTable maps what the page's windows-1252 decoding makes of each byte back to the byte:
  // characters up to U+00FF are their bytes, except those that bytes 0x80-0x9F decode to (cp1252, from
  // the Go side, web/page/pack.go).
  function decodeTable(cp1252) {
    const t = new Int16Array(Math.max(...cp1252) + 1).fill(-1);
    for (let c = 0; c < 0x100; c++) t[c] = c;
    for (let c = 0x80; c < 0xa0; c++) t[c] = -1;
    cp1252.forEach((c, i) => { t[c] = 0x80 + i; });
    return t;
  }

  // unpack reverses the Go side's PackBytes on one piece: byte 0x01 escapes the next byte, written 0x40
  // more than meant.
  function unpack(text) {
    const table = decode;
    const n = text.length;
    const out = new Uint8Array(n);
    let o = 0;
    for (let i = 0; i < n; i++) {
      const u = text.charCodeAt(i);
      let c = u < table.length ? table[u] : -1;
      if (c === 0x01) {
        const v = ++i < n ? text.charCodeAt(i) : 0;
        c = v < table.length ? table[v] - 0x40 : -1;
      }
      if (c < 0) throw new Error("the page is damaged: the app's module holds the character U+" + u.toString(16).toUpperCase());
      out[o++] = c;
    }
    return out.subarray(0, o);
  }

  function fail(e) {
    if (failure === null) failure = e;
    try { controller.error(e); } catch { /* already closed or errored */ }
  }

  // feed unpacks the piece in the script element before the calling script and sends it to the compiler.
  function feed() {
    const holder = document.currentScript.previousElementSibling;
    if (failure !== null) { holder.remove(); return; }
    try {
      const bytes = unpack(holder.textContent);
      holder.remove();
      fed += bytes.length;
      controller.enqueue(bytes);
    } catch (e) {
      fail(e);
    }
  }

  // end closes the module's stream after its last piece; n is the module's length in bytes.
  function end(n) {
    timing.fedMs = performance.now();
    if (failure !== null) return;
    if (fed !== n) fail(new Error("the page is damaged: the app's module holds " + fed + " bytes, not " + n));
    else controller.close();
  }

  let module;
  try {
    decode = decodeTable(window.PLUMB_CP1252);
    const gzipped = new ReadableStream({ start(c) { controller = c; } });
    module = WebAssembly.compileStreaming(new Response(gzipped.pipeThrough(new DecompressionStream("gzip")),
      { headers: { "Content-Type": "application/wasm" } }));
  } catch (e) {
    failure = e;
    module = Promise.reject(e);
  }
  module.then(() => { timing.compiledMs = performance.now(); }, () => {});
  window.plumbStart = {
    timing, feed, end,
    // module resolves to the compiled WebAssembly.Module; a damaged piece rejects it with that error.
    module: module.catch((e) => { throw failure || e; }),
  };
})();
