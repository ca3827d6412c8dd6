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
  let fed = 0; // bytes fed so far
  let failure = null; // the first error, kept for the panel's message
  let decode = null; // character code -> byte, or -1
  let compiledIn = "worker";

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

  // compileStream starts compiling the gzipped module from a stream of its pieces: send(bytes) each,
  // then close(). It runs in a worker, and in the page when there is no worker.
  function compileStream() {
    let controller;
    const gzipped = new ReadableStream({ start(c) { controller = c; } });
    const module = WebAssembly.compileStreaming(new Response(gzipped.pipeThrough(new DecompressionStream("gzip")),
      { headers: { "Content-Type": "application/wasm" } }));
    return { module, send: (bytes) => controller.enqueue(bytes), close: () => controller.close() };
  }

  // workerMain runs in the worker: it compiles the pieces the page posts (null after the last) and posts
  // back the module, or the error's message.
  function workerMain() {
    const c = compileStream();
    onmessage = (ev) => { if (ev.data === null) c.close(); else c.send(ev.data); };
    c.module.then((module) => postMessage({ module }), (e) => postMessage({ error: String((e && e.message) || e) }));
  }

  // compiler compiles the module in a worker, so that inflating and compiling take nothing from the
  // page's own thread, which reads the page meanwhile. It keeps the pieces until the module is back:
  // should the worker fail to start (a browser without workers, or one that refuses them to a page
  // opened from a file), the page compiles them itself.
  function compiler() {
    const pieces = [];
    let closed = false;
    let local = null;
    let settle;
    const module = new Promise((resolve, reject) => { settle = { resolve, reject }; });
    const inPage = () => {
      if (local !== null) return;
      compiledIn = "page";
      local = compileStream();
      for (const p of pieces) local.send(p);
      if (closed) local.close();
      local.module.then(settle.resolve, settle.reject);
    };
    let worker = null;
    try {
      const url = URL.createObjectURL(new Blob([compileStream.toString() + "\n(" + workerMain.toString() + ")();"],
        { type: "text/javascript" }));
      worker = new Worker(url);
      worker.onmessage = (ev) => {
        worker.terminate();
        URL.revokeObjectURL(url);
        pieces.length = 0;
        if (ev.data.error) settle.reject(new Error(ev.data.error));
        else settle.resolve(ev.data.module);
      };
      worker.onerror = (ev) => {
        ev.preventDefault();
        worker.terminate();
        inPage();
      };
    } catch {
      inPage();
    }
    return {
      module,
      send(bytes) {
        pieces.push(bytes);
        if (local !== null) local.send(bytes);
        else worker.postMessage(bytes);
      },
      close() {
        closed = true;
        if (local !== null) local.close();
        else worker.postMessage(null);
      },
      abort: (e) => { if (worker !== null) worker.terminate(); settle.reject(e); },
    };
  }

  function fail(e) {
    if (failure === null) failure = e;
    if (stream !== null) stream.abort(e);
  }

  // feed unpacks the piece in the script element before the calling script and sends it to the compiler.
  function feed() {
    const holder = document.currentScript.previousElementSibling;
    if (failure !== null) { holder.remove(); return; }
    try {
      const bytes = unpack(holder.textContent);
      holder.remove();
      fed += bytes.length;
      stream.send(bytes);
    } catch (e) {
      fail(e);
    }
  }

  // end closes the module's stream after its last piece; n is the module's length in bytes.
  function end(n) {
    timing.fedMs = performance.now();
    if (failure !== null) return;
    if (fed !== n) fail(new Error("the page is damaged: the app's module holds " + fed + " bytes, not " + n));
    else stream.close();
  }

  let stream = null;
  let module;
  try {
    decode = decodeTable(window.PLUMB_CP1252);
    stream = compiler();
    module = stream.module;
  } catch (e) {
    failure = e;
    module = Promise.reject(e);
  }
  module.then(() => { timing.compiledMs = performance.now(); }, () => {});
  window.plumbStart = {
    timing, feed, end,
    get compiledIn() { return compiledIn; }, // "worker", or "page" where the worker could not run
    // module resolves to the compiled WebAssembly.Module; a damaged piece rejects it with that error.
    module: module.catch((e) => { throw failure || e; }),
  };
})();
