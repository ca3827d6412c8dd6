// The panel around Plumb's drawing: it starts the WebAssembly app, shows its answers, sends it the material,
// units and tool choices, opens and saves files, and keeps the part in local storage so a reload (or a lost
// WebGL context, which makes the app reload the page) never loses work.
//
// The app talks to this script through the bridge: it sets window.plumb when it is ready and then calls
// window.plumbUI.ready(); after every recompute it calls window.plumbUI.onChange(state).
"use strict";
(() => {
  const AUTOSAVE = "plumb.autosave"; // the current part, as a part file (packed when large, see packText)
  const SOUND = "plumb.sound"; // the last saved part that analysed sound; "=" when that is the autosave
  const PREVIOUS = "plumb.previous"; // a part replaced by the demo, or emptied: offered back
  const STARTING = "plumb.starting"; // set while a saved part opens; still set on the next visit, it crashed
  const CRASHED = "plumb.crashed"; // the part that was opening when the page stopped, kept for rescue
  const UNREADABLE = "plumb.unreadable"; // an autosave that could not be read back, kept for rescue
  const FOLDED = "plumb.panelFolded";
  const PAPER = "plumb.paper"; // the paper chosen for the drilling template
  const CHOSEN = "plumb.chosen"; // the units and material chosen last: {units, material}
  const GUIDE_DONE = "plumb.guideDone"; // the first-minute guide was closed
  const MAX_FILE_BYTES = 50 << 20;
  const DECIMALS = { mm: 1, cm: 2, m: 4, in: 3, ft: 4 }; // for answers
  const FIELD_DECIMALS = { mm: 2, cm: 3, m: 5, in: 4, ft: 5 }; // at most, for values shown in fields
  const SHAPE_TOOLS = ["outline", "rect", "circle", "slot"]; // the tools whose shapes go into the chosen layer
  const KG_PER_LB = 0.45359237; // exact, by definition of the international pound

  const $ = (id) => document.getElementById(id);
  const presets = window.PLUMB_PRESETS || { materials: [], thicknesses: [], gauge_tables: {} };
  // Milliseconds since navigation, begun by the loader (loaderMs, fedMs: the module's last piece read,
  // compiledMs): scriptMs (this script runs), instantiatedMs, mainMs (Go's main starts), readyMs (the
  // app's first frame), loadedMs (the part is loaded), restoredMs (the part is on screen).
  const start = window.plumbStart || { timing: {}, module: Promise.reject(new Error("the module loader did not run")) };
  const timing = start.timing;
  timing.scriptMs = performance.now();
  let app = null; // window.plumb once the app is ready
  let restored = false; // the autosaved or demo part has been loaded; until then nothing is autosaved
  let startup = { saved: null, crashed: false }; // what startApp read from storage before the app ran
  let state = null; // the app's last state
  let partName = ""; // the part's own name, from its part file
  let mode = "sheet"; // "sheet" (material and thickness) or "formula"

  // ---- small helpers ----

  function readStore(key) {
    try { return localStorage.getItem(key); } catch { return null; }
  }
  function writeStore(key, value) {
    try { localStorage.setItem(key, value); return true; } catch { return false; }
  }
  // chosen returns the choices kept for later visits: {units, material} for a new part, and the last
  // sheet and formula fields ({sheet, formula}) for the tab a part does not use.
  function chosen() {
    try { return JSON.parse(readStore(CHOSEN) || "{}") || {}; } catch { return {}; }
  }
  function remember(key, value) {
    const c = chosen();
    c[key] = value;
    writeStore(CHOSEN, JSON.stringify(c));
  }
  let toastTimer = 0;
  function toast(msg, bad) {
    const t = $("toast");
    t.textContent = msg;
    t.classList.toggle("bad", Boolean(bad));
    t.hidden = false;
    clearTimeout(toastTimer);
    toastTimer = setTimeout(() => { t.hidden = true; }, bad ? 9000 : 3500);
  }
  function canvas() { return document.querySelector("canvas"); }
  function giveCanvasKeys() { const c = canvas(); if (c) c.focus({ preventScroll: true }); }
  function unitName() { return (state && state.units && state.units.length) || "mm"; }
  // minus writes a number's text with the true minus sign, U+2212, and no sign on a value that rounds
  // to zero.
  function minus(text) {
    if (!text.startsWith("-")) return text;
    return /[1-9]/.test(text) ? "\u2212" + text.slice(1) : text.slice(1);
  }
  // fmtLen writes a length as the canvas and the warnings do (sketch.FormatLength): fixed decimals per unit.
  function fmtLen(v) {
    return Number.isFinite(v) ? minus(v.toFixed(DECIMALS[unitName()] ?? 3)) : "—";
  }
  // fmtField writes a length for a field the user may edit: rounded, without trailing zeros. The app
  // keeps the exact value until the user types a new one.
  function fmtField(v) {
    return String(Number(v.toFixed(FIELD_DECIMALS[unitName()] ?? 4)));
  }
  // fmtSig writes v to digits significant figures: plain with commas between thousands from 1e-3 to
  // 1e7, in exponent form outside.
  function fmtSig(v, digits = 4) {
    if (!Number.isFinite(v)) return "—";
    const a = Math.abs(v);
    if (a !== 0 && (a < 1e-3 || a >= 1e7)) return minus(v.toExponential(digits - 1)).replace("e-", "e\u2212");
    return minus(groupThousands(String(Number(v.toPrecision(digits)))));
  }
  // groupThousands puts commas between the thousands of a number written plainly ("-1234.5"), as
  // toLocaleString("en") does; that call's first use costs the start-up tens of milliseconds.
  function groupThousands(text) {
    const sign = text.startsWith("-") ? "-" : "";
    const dot = text.indexOf(".");
    let whole = text.slice(sign.length, dot < 0 ? text.length : dot);
    for (let i = whole.length - 3; i > 0; i -= 3) whole = whole.slice(0, i) + "," + whole.slice(i);
    return sign + whole + (dot < 0 ? "" : text.slice(dot));
  }
  function fmtDeg(v) { return Number.isFinite(v) ? minus(v.toFixed(1)) + "°" : "—"; }

  // ---- starting the app ----

  function failed(msg) {
    $("loading").classList.remove("done");
    $("loading").classList.add("failed");
    $("loading-msg").textContent = msg;
  }

  // startApp instantiates the module, which the loader (loader.js) has been compiling while the page was
  // read, reads the saved part meanwhile, and runs the app.
  async function startApp() {
    const go = new Go();
    const [module, saved] = await Promise.all([start.module, readStartup()]);
    startup = saved;
    const instance = await WebAssembly.instantiate(module, go.importObject);
    timing.instantiatedMs = performance.now();
    go.run(instance).then(() => failed("The app stopped. Reload the page to start it again; your part is kept."));
  }

  function setEnabled(on) {
    for (const el of document.querySelectorAll("#tools button, #panel button, #panel input, #panel select")) {
      if (["help", "cautions", "about"].includes(el.dataset.action) || el.id === "fold") continue;
      el.disabled = !on;
    }
  }

  // ready is called by the app at the start of its first frame. The part is restored at once, so that
  // the frame already draws it and the app's first report is of the restored part.
  function ready() {
    app = window.plumb;
    timing.readyMs = performance.now();
    try {
      const kept = chosen();
      app.setDefaults({ units: kept.units, material: kept.material });
    } catch { /* a choice that cannot be read is forgotten: the part's own units and material serve */ }
    try {
      if (startup.crashed) recoverFromCrash();
      else restore(startup.saved);
    } catch (e) {
      toast("The part could not be restored: " + e.message, true);
    }
    restored = true;
    $("text-font").replaceChildren(...app.fonts().map((f) => new Option(f, f)));
    // The app told the restored part as it loaded it; ask for its state only if it did not.
    if (state === null) refresh();
    else render();
    if (!startup.crashed && state) lastSaved.empty = Boolean(state.empty);
    $("loading").classList.add("done");
    setEnabled(true);
    timing.loadedMs = performance.now();
    requestAnimationFrame(() => { timing.restoredMs = performance.now(); });
    settleStartup();
  }

  // restore brings back the autosaved part, or shows the demo part when there is none or the address asks
  // for it (#demo). A part the demo replaces is kept under plumb.previous and offered back.
  function restore(saved) {
    if (saved === null || location.hash === "#demo") {
      showDemo(saved);
      return;
    }
    writeStore(STARTING, "1");
    const r = app.restore(saved, "autosave.json");
    if (!r.ok) {
      writeStore(UNREADABLE, saved);
      loadText(window.PLUMB_DEMO, "demo.json", true);
      toast("Your last part could not be read back (" + r.error + "). Its text is kept in this browser's " +
        "storage under " + UNREADABLE + "; the demo part is shown.", true);
    }
  }

  // showDemo loads the demo part, keeps the part it replaces (given as a part file, or null) under
  // plumb.previous with a way back, and drops #demo from the address so that a reload restores work.
  function showDemo(previous) {
    loadText(window.PLUMB_DEMO, "demo.json", true);
    if (previous !== null && previous !== app.saveJSON()) offerPrevious(previous, "The demo replaced your last part.");
    try { history.replaceState(null, "", location.pathname + location.search); } catch { /* file:// may refuse */ }
  }

  function onChange(s) {
    state = s;
    try {
      if (restored) autosaveSoon();
      if (s.part) showPart(s.part);
      render();
    } catch (e) {
      toast("The panel could not show the results: " + e.message, true);
    }
  }

  // ---- the saved part ----
  //
  // The part is saved to local storage when the edits pause (AUTOSAVE_DELAY after the last, when the
  // browser is idle): never on the edit path, since writing the part file of a large part takes longer than
  // the edit. Large part files are gzipped (CompressionStream) and kept as "gzip:" and base64, a quarter
  // of their size or less, so that a lettered sign fits in the storage a browser gives a page. Alongside:
  // the last part that analysed sound (SOUND); a part that an edit emptied, offered back (PREVIOUS); and
  // a start-up marker (STARTING) that only a crash while opening the saved part leaves behind.

  const AUTOSAVE_DELAY = 800; // ms
  const PACK_OVER = 200000; // characters: part files longer than this are gzipped
  let autosaveTimer = 0;
  let saving = false; // an autosave is being packed and written
  let lastSaved = { text: null, stored: null, empty: true }; // what the autosave holds now

  function autosaveSoon() {
    clearTimeout(autosaveTimer);
    autosaveTimer = setTimeout(() => {
      if (typeof requestIdleCallback === "function") requestIdleCallback(autosave, { timeout: 2000 });
      else autosave();
    }, AUTOSAVE_DELAY);
  }

  async function autosave() {
    if (!app || saving) { autosaveSoon(); return; }
    const s = state;
    const text = app.saveJSON();
    if (text === lastSaved.text) return;
    const before = lastSaved.text;
    saving = true;
    try {
      const stored = await packText(text);
      // A flush while packing wrote a newer part: this one is older, and a later autosave follows.
      if (lastSaved.text !== before) { autosaveSoon(); return; }
      keep(s, text, stored);
    } catch (e) {
      toast("The part could not be autosaved: " + e.message + ". Save it to a file.", true);
    } finally {
      saving = false;
    }
  }

  // keep writes the part file text, stored as stored, as the autosave, with what goes beside it.
  function keep(s, text, stored) {
    // An edit that empties the part keeps the part it emptied one click away.
    if (s.empty && !lastSaved.empty && lastSaved.stored !== null) offerPrevious(lastSaved.stored, "Your last part was emptied.");
    // The last sound part stays when the part stops analysing (an outline half redrawn, say).
    if (s.error && !s.empty && readStore(SOUND) === "=" && lastSaved.stored !== null) writeStore(SOUND, lastSaved.stored);
    if (!writeStore(AUTOSAVE, stored)) {
      toast("This browser's storage is full: save the part to a file.", true);
      return;
    }
    if (!s.error) writeStore(SOUND, "=");
    lastSaved = { text, stored, empty: Boolean(s.empty) };
  }

  // flushAutosave writes the part at once when the page is hidden, reloaded or closed: the delayed,
  // idle-time autosave would never run then, and the last edits would be lost. There is no time to
  // gzip, so the part file is stored as it is (unpackText takes both forms).
  function flushAutosave() {
    if (!app || !restored || !state) return;
    const text = app.saveJSON();
    if (text === lastSaved.text) return;
    clearTimeout(autosaveTimer);
    try {
      keep(state, text, text);
    } catch { /* the page is going away: nothing more can be done */ }
  }
  addEventListener("pagehide", flushAutosave);
  document.addEventListener("visibilitychange", () => {
    if (document.visibilityState === "hidden") flushAutosave();
  });

  // packText returns text as stored: as it is, or gzipped after "gzip:" in base64 when it is long.
  async function packText(text) {
    if (text.length <= PACK_OVER) return text;
    const gz = await new Response(new Blob([text]).stream().pipeThrough(new CompressionStream("gzip"))).arrayBuffer();
    const bytes = new Uint8Array(gz);
    let bin = "";
    for (let i = 0; i < bytes.length; i += 0x8000) bin += String.fromCharCode.apply(null, bytes.subarray(i, i + 0x8000));
    return "gzip:" + btoa(bin);
  }

  // unpackText reverses packText; null stays null.
  async function unpackText(stored) {
    if (stored === null || !stored.startsWith("gzip:")) return stored;
    const bytes = Uint8Array.from(atob(stored.slice(5)), (c) => c.charCodeAt(0));
    return new Response(new Blob([bytes]).stream().pipeThrough(new DecompressionStream("gzip"))).text();
  }

  // readStartup reads the autosave, and whether the last visit stopped while opening it, before the app
  // starts (unpacking takes a moment and the app asks for the part on its first frame).
  async function readStartup() {
    const stored = readStore(AUTOSAVE);
    let saved = null;
    try {
      saved = await unpackText(stored);
    } catch {
      writeStore(UNREADABLE, stored);
    }
    lastSaved = { text: saved, stored, empty: saved === null };
    return { saved, crashed: readStore(STARTING) !== null && stored !== null };
  }

  // settleStartup clears the start-up marker once the app has painted the part twice, a second has
  // passed and the part's analysis and level-hole search are in (a large part's run in the background,
  // after the first frames): the part opened without stopping the page.
  function settleStartup() {
    const from = performance.now();
    const check = () => {
      const analysed = state !== null && !state.pending && !state.level_pending;
      if (app.frames().drawn >= 2 && performance.now() - from > 1000 && analysed) {
        try { localStorage.removeItem(STARTING); } catch { /* nothing to clear */ }
        return;
      }
      requestAnimationFrame(check);
    };
    requestAnimationFrame(check);
  }

  // recoverFromCrash runs when the last visit stopped while opening the saved part: that part is not
  // opened again but kept under plumb.crashed, the demo is shown, and the last part that analysed sound,
  // when it is another, is offered back.
  function recoverFromCrash() {
    const crashed = readStore(AUTOSAVE);
    writeStore(CRASHED, crashed);
    const sound = readStore(SOUND);
    loadText(window.PLUMB_DEMO, "demo.json", true);
    let msg = "Plumb stopped while opening your last part, so it was not opened again; it is kept in this " +
      "browser's storage under " + CRASHED + ".";
    if (sound !== null && sound !== "=" && sound !== crashed) {
      offerPrevious(sound, "Plumb stopped while opening your last part.");
      msg += " The last part that analysed soundly is one click away.";
    }
    toast(msg, true);
  }

  // offerPrevious keeps a part (as stored) under plumb.previous and shows the way back to it.
  function offerPrevious(stored, why) {
    writeStore(PREVIOUS, stored);
    $("previous-why").textContent = why;
    $("previous").hidden = false;
  }

  function refresh() {
    if (!app) return;
    state = app.state();
    render();
  }

  // ---- files ----

  function loadText(text, name, quiet) {
    if (!app) { toast("Still loading; try again in a moment."); return false; }
    const panel = panelMaterial(); // before loading: showing a part without a material empties the fields
    const told = state;
    const r = app.load(text, name);
    if (!r.ok) {
      toast(name + ": " + r.error + "\nThe part on screen is unchanged.", true);
      return false;
    }
    $("units-note").hidden = true;
    if (state === told) refresh(); // the app tells the new part as it loads it (onChange); ask if it did not
    const warnings = r.warnings || [];
    const adopted = !quiet && r.has_material === false && adoptPanelMaterial(panel);
    if (adopted) toast("Opened " + name + ". It names no material: using the panel's, " + (state.material || adopted) + ".");
    else if (warnings.length) toast(name + ":\n" + warnings.slice(0, 6).join("\n") + (warnings.length > 6 ? "\n…" : ""));
    else if (!quiet) toast("Opened " + name);
    return true;
  }

  // panelMaterial returns what the material fields hold: the mode and the field values.
  function panelMaterial() {
    const ids = ["material", "thickness", "formula", "density-unit", "params"];
    return { mode, values: Object.fromEntries(ids.map((id) => [id, $(id).value])) };
  }

  // adoptPanelMaterial gives a part opened without a material the material the panel's fields held
  // before it was opened (panel, from panelMaterial), when they held one; it returns what was given,
  // or "" when they were empty (the part then stays without a material and the panel says so).
  function adoptPanelMaterial(panel) {
    const v = panel.values;
    const filled = (panel.mode === "sheet" ? v.material : v.formula).trim();
    if (filled === "") return "";
    for (const [id, value] of Object.entries(v)) $(id).value = value;
    setMode(panel.mode);
    sendMaterial();
    return $("material-error").textContent === "" ? filled : "";
  }

  function openFile(file) {
    if (file.size > MAX_FILE_BYTES) {
      toast(file.name + " is " + Math.round(file.size / 1048576) + " MB; parts and drawings over 50 MB are refused.", true);
      return;
    }
    file.text().then((text) => loadText(text, file.name), (e) => toast(file.name + ": " + e.message, true));
  }

  // baseName names downloaded files after the part, or else after the file it came from.
  function baseName() {
    const name = partName || (state && state.file) || "part";
    return name.replace(/\.(json|svg|dxf)$/i, "").replace(/[^\w.-]+/g, "-").replace(/^-+|-+$/g, "") || "part";
  }

  // download offers data (a string or a Uint8Array) as a file.
  function download(data, name, type) {
    const url = URL.createObjectURL(new Blob([data], { type }));
    const a = document.createElement("a");
    a.href = url;
    a.download = name;
    document.body.append(a);
    a.click();
    a.remove();
    setTimeout(() => URL.revokeObjectURL(url), 10000);
  }

  async function copyText(text) {
    try {
      await navigator.clipboard.writeText(text);
    } catch {
      const area = document.createElement("textarea");
      area.value = text;
      document.body.append(area);
      area.select();
      document.execCommand("copy");
      area.remove();
    }
    toast("Results copied.");
  }

  function resultsText() {
    const u = unitName();
    const lines = ["Part: " + baseName()];
    if (state && !state.error) {
      lines.push("Weight: " + $("weight").textContent + " (" + $("weight-sub").textContent + ")");
      lines.push("Balance point: x " + fmtLen(state.centroid.x) + " " + u + ", y " + fmtLen(state.centroid.y) + " " + u);
      if (state.hang) lines.push("Hang hole: " + $("hang").textContent + " " + u + "; " + $("hang-sub").textContent.replaceAll("\n", "; "));
      if (state.material) lines.push("Material: " + state.material);
    }
    lines.push("Geometry estimates only: hardware ratings, fixings and overhead signs follow local codes and a licensed engineer.");
    return lines.join("\n");
  }

  // ---- the part's material, shown in the fields ----

  // editingMaterial reports whether the user is typing in the material fields or has an error to fix
  // there; the part's material must not overwrite either.
  function editingMaterial() {
    return $("material-error").textContent !== "" || document.activeElement.closest(".material") !== null;
  }

  // showPart fills the name and, unless the user is editing them, the material fields from the state's
  // part facts ({name, material} as the part file gives them).
  function showPart(doc) {
    partName = doc.name || "";
    $("part-name").textContent = partName || "Untitled part";
    $("part-name").title = partName || "Untitled part";
    const spec = doc.material;
    if (!spec || editingMaterial()) return;
    // Each tab keeps its fields for later: the other one is filled from the last part that used it.
    const kept = chosen();
    if (spec.formula) {
      setMode("formula");
      fillFormula(spec);
      if ($("material").value === "" && kept.sheet) fillSheet(kept.sheet);
      remember("formula", spec);
    } else if (spec.material) {
      setMode("sheet");
      fillSheet(spec);
      if ($("formula").value === "" && kept.formula) fillFormula(kept.formula);
      remember("sheet", spec);
    }
    showThickness();
    fillThicknessList();
  }

  function fillSheet(spec) {
    $("material").value = spec.material || "";
    $("thickness").value = spec.thickness || "";
  }
  function fillFormula(spec) {
    $("formula").value = spec.formula || "";
    $("density-unit").value = spec.unit || "kg/m2";
    $("params").value = Object.entries(spec.params || {}).map(([k, v]) => k + " = " + v).join(", ");
  }

  function setMode(m) {
    mode = m;
    for (const b of document.querySelectorAll("[data-mode]")) b.setAttribute("aria-pressed", String(b.dataset.mode === m));
    $("sheet-fields").hidden = m !== "sheet";
    $("formula-fields").hidden = m !== "formula";
  }

  function parseParams(text) {
    const params = {};
    let pos = 0;
    for (const part of text.split(/[,;\n]/)) {
      const lead = part.length - part.trimStart().length;
      if (part.trim() !== "") {
        const m = /^\s*([A-Za-z_]\w*)\s*=\s*(\S+)\s*$/.exec(part);
        if (!m || m[2].trim() === "" || !Number.isFinite(Number(m[2]))) {
          return { error: { field: "params", col: pos + lead + 1, msg: "write each parameter as name = number, separated by commas" } };
        }
        params[m[1]] = Number(m[2]);
      }
      pos += part.length + 1;
    }
    return { params };
  }

  const FIELD_INPUT = { material: "material", thickness: "thickness", formula: "formula", params: "params", unit: "density-unit" };
  const FIELD_LABEL = { material: "Material", thickness: "Thickness", formula: "Formula", params: "Parameters", unit: "Unit" };

  // materialSoon sends the fields to the app once the keys typed so far have been handled: a recompute
  // can take longer than a keystroke, and only the latest text matters.
  let materialTimer = 0;
  function materialSoon() {
    clearTimeout(materialTimer);
    materialTimer = setTimeout(sendMaterial, 30);
  }

  function sendMaterial() {
    if (!app) return;
    let spec;
    let err = null;
    if (mode === "sheet") {
      spec = { material: $("material").value.trim(), thickness: $("thickness").value.trim() };
    } else {
      const p = parseParams($("params").value);
      err = p.error || null;
      spec = { formula: $("formula").value, unit: $("density-unit").value, params: p.params || {} };
    }
    if (!err) {
      const r = app.setMaterial(spec);
      if (!r.ok) err = r.error || { msg: "not accepted" };
      else { remember("material", spec); remember(mode, spec); }
    }
    showMaterialError(err);
    showThickness();
    if (!err) refresh();
  }

  function showMaterialError(err) {
    for (const f of Object.keys(FIELD_INPUT)) underline($(FIELD_INPUT[f]), err && err.field === f ? err.col || 0 : -1);
    if (!err) { $("material-error").textContent = ""; renderStale(); return; }
    const where = FIELD_LABEL[err.field] ? FIELD_LABEL[err.field] + (err.col ? ", column " + err.col : "") + ": " : "";
    $("material-error").textContent = where + err.msg;
    renderStale();
  }

  // renderStale greys the figures while the material fields hold an error: they are still those of the
  // last material that worked, which the note names. They are greyed too while a large part's analysis
  // of the last edits is under way (state.pending): they are then those of the part before them.
  function renderStale() {
    const bad = $("material-error").textContent !== "" && state !== null && !state.error;
    const pending = state !== null && Boolean(state.pending);
    $("answers").classList.toggle("stale", bad || pending);
    $("answers").classList.toggle("working", pending && !bad);
    $("stale-note").textContent = bad ? "Greyed: these figures are for " + (state.material || "the last material that worked") +
      ", the last material that worked. Fix the field above to update them."
      : pending ? "Working out the figures for your last change… The greyed figures are from before it." : "";
  }

  // underline marks the character at 1-based column col of an input (past the end: the place after it);
  // col 0 marks the field as wrong without a column, and a negative col clears the mark.
  function underline(input, col) {
    const field = input.closest(".field");
    if (!field) { input.classList.toggle("bad", col >= 0); return; }
    const mirror = field.querySelector(".mirror");
    field.classList.toggle("bad", col >= 0);
    if (col <= 0) { mirror.textContent = ""; return; }
    const chars = Array.from(input.value);
    const i = Math.min(col - 1, chars.length);
    const mark = document.createElement("mark");
    mark.textContent = i < chars.length && chars[i] !== " " ? chars[i] : "\u00a0";
    const text = document.createElement("span");
    text.append(chars.slice(0, i).join(""), mark, chars.slice(i + 1).join(""));
    mirror.replaceChildren(text);
    mirror.scrollLeft = input.scrollLeft;
  }

  // lengthMM reads the thickness forms the hint can show in both units: "3", "3 mm", "0.125 in",
  // "1/8 in", "1 1/4 in", "16 ga". It returns NaN for anything else (a formula, say); the app decides.
  function lengthMM(text) {
    const t = text.trim().toLowerCase();
    const ga = /^(\d+)\s*(ga|gauge|gage)\b/.exec(t);
    if (ga) {
      const g = gauges().find((x) => x.n === Number(ga[1]));
      return g ? g.mm : NaN;
    }
    const m = /^(\d+(?:\.\d*)?|\.\d+)?\s*(?:(\d+)\s*\/\s*(\d+))?\s*(mm|cm|in|"|inch|inches)?$/.exec(t);
    if (!m || (m[1] === undefined && m[2] === undefined)) return NaN;
    let v = m[1] !== undefined ? Number(m[1]) : 0;
    if (m[2] !== undefined) v += Number(m[2]) / Number(m[3]);
    const unit = m[4] || "mm";
    return v * (unit === "mm" ? 1 : unit === "cm" ? 10 : 25.4); // 1 in = 25.4 mm exactly
  }

  // gauges returns the gauge table of the material in the field, or none.
  function gauges() {
    const v = $("material").value.trim().toLowerCase();
    const m = presets.materials.find((x) => x.key.toLowerCase() === v || x.name.toLowerCase() === v);
    return (m && presets.gauge_tables[m.gauges]) || [];
  }

  function showThickness() {
    const mm = lengthMM($("thickness").value);
    $("thickness-both").textContent = Number.isFinite(mm) && mm > 0
      ? mm.toFixed(2) + " mm = " + (mm / 25.4).toFixed(4) + " in" : "";
  }

  function fillThicknessList() {
    const options = presets.thicknesses.map((t) => [t.text, t.mm.toFixed(2) + " mm / " + t.in.toFixed(3) + " in"]);
    for (const g of gauges()) {
      options.push([g.n + " ga", g.n + " gauge: " + g.mm.toFixed(2) + " mm / " + g.in.toFixed(4) + " in"]);
    }
    $("thickness-list").replaceChildren(...options.map(([value, label]) => new Option(label, value)));
  }

  // ---- the answers ----

  function render() {
    if (!state) return;
    const u = unitName();
    for (const el of document.querySelectorAll(".unit-name")) el.textContent = u;
    for (const b of document.querySelectorAll("[data-units]")) b.setAttribute("aria-pressed", String(b.dataset.units === u));
    if (state.tool) for (const b of document.querySelectorAll("[data-tool]")) b.setAttribute("aria-pressed", String(b.dataset.tool === state.tool));
    if (state.target) for (const b of document.querySelectorAll("[data-target]")) b.setAttribute("aria-pressed", String(b.dataset.target === state.target));
    if (state.tool) $("targets").classList.toggle("idle", !SHAPE_TOOLS.includes(state.tool));
    if (typeof state.can_undo === "boolean") document.querySelector('[data-action="undo"]').disabled = !state.can_undo;
    if (typeof state.can_redo === "boolean") document.querySelector('[data-action="redo"]').disabled = !state.can_redo;
    if (Number.isFinite(state.hole_diameter) && document.activeElement !== $("hole-dia")) $("hole-dia").value = fmtField(state.hole_diameter);
    $("material-desc").textContent = state.no_material
      ? "No material: area, balance point and hang hole are from the shape alone. Choose a material for the weight."
      : state.material ? "Figures computed from: " + state.material : "";
    $("part-error").textContent = state.error || "";
    if (state.error) {
      $("place-hole").hidden = true;
      $("hang").classList.remove("suggested");
      for (const id of ["weight", "balance", "hang"]) $(id).textContent = "—";
      for (const id of ["weight-sub", "balance-sub", "hang-sub"]) $(id).textContent = "";
      $("details-rows").replaceChildren();
    } else {
      renderAnswers(u);
      renderDetails(u);
    }
    renderEdge(u);
    renderStale();
    renderWarnings();
    renderLettering();
  }

  // renderLettering shows the Lettering fields while the Lettering tool is active or lettering is
  // selected, with the selected lettering's style (else the style new lettering gets).
  function renderLettering() {
    const l = state.lettering;
    const show = Boolean(l) && (state.tool === "lettering" || l.selected >= 0);
    $("lettering").hidden = !show;
    if (!show) return;
    $("text-what").textContent = l.selected >= 0 ? "· “" + l.text + "”" : "· new lettering";
    const set = (id, v) => { if (document.activeElement !== $(id)) $(id).value = v; };
    set("text-font", l.font || "go-regular");
    set("text-height", fmtField(l.height));
    set("text-role", l.role || "cutout");
    set("text-angle", String(Number(l.angle_deg.toFixed(3))));
    set("text-spacing", fmtField(l.spacing));
    $("text-stencil").checked = l.stencil_count > 0;
    if (l.stencil_count > 0) { set("text-bridge", fmtField(l.stencil_width)); set("text-bridges", String(l.stencil_count)); }
    $("text-stencil").disabled = (l.role || "cutout") !== "cutout";
    for (const id of ["text-bridge", "text-bridges"]) $(id).disabled = !$("text-stencil").checked || $("text-stencil").disabled;
  }

  // sendTextStyle gives the app the Lettering fields: the style of the selected lettering and of new
  // lettering.
  function sendTextStyle() {
    if (!app) return;
    const num = (id) => Number($(id).value);
    const stencil = $("text-stencil").checked && $("text-role").value === "cutout";
    if (stencil && !(num("text-bridge") > 0)) $("text-bridge").value = fmtField(Math.max(num("text-height") / 20, 0.1));
    const r = app.setTextStyle({
      font: $("text-font").value, height: num("text-height"), role: $("text-role").value,
      angle_deg: num("text-angle"), spacing: num("text-spacing"),
      stencil_width: stencil ? num("text-bridge") : 0, stencil_count: stencil ? num("text-bridges") : 0,
    });
    if (!r.ok) toast("Lettering: " + r.error, true);
    refresh();
  }

  function showAbout() {
    if (app) $("about-licence").textContent = app.fontLicence();
    $("about").hidden = false;
  }

  function renderAnswers(u) {
    if (state.no_material) {
      $("weight").textContent = "—";
      $("weight-sub").textContent = "no material: choose one for the weight";
    } else {
      // Pounds first on a part drawn in inches or feet, kilograms first otherwise.
      const lb = fmtSig(Number.isFinite(state.weight_lbf) ? state.weight_lbf : state.mass / KG_PER_LB) + " lb";
      const kg = fmtSig(state.mass) + " kg";
      const imperial = u === "in" || u === "ft";
      $("weight").textContent = imperial ? lb : kg;
      $("weight-sub").textContent = (imperial ? kg : lb) + (Number.isFinite(state.weight_n) ? " · " + fmtSig(state.weight_n) + " N" : "");
    }
    $("balance").textContent = fmtLen(state.centroid.x) + ", " + fmtLen(state.centroid.y);
    $("balance-sub").textContent = "x, y (" + u + ") from the drawing's origin";
    renderHang(u);
  }

  // renderHang shows the hang hole: the placed one with its tilt, else the answer a fabricator came
  // for, the level-hang hole (or, where none exists, the least-tilt position), one click from placed.
  function renderHang(u) {
    const h = state.hang;
    const level = state.level;
    const tilts = state.least_tilt || [];
    const suggested = level || tilts[0] || null;
    const lines = [];
    $("hang").classList.toggle("suggested", !h && suggested !== null);
    if (h) {
      $("hang").textContent = fmtLen(h.at.x) + ", " + fmtLen(h.at.y);
      lines.push(tiltWords(h.angle_deg) + " · hole Ø " + fmtLen(h.hole) + " " + u);
      const more = [];
      if (Number.isFinite(h.tilt_per_mm_deg)) more.push(tiltPerError(h.tilt_per_mm_deg));
      if (Number.isFinite(h.period_s)) more.push("swings in " + h.period_s.toFixed(2) + " s");
      if (more.length) lines.push(more.join(" · "));
      if (level && Math.abs(h.angle_deg) >= 0.05) lines.push("Hangs level from " + fmtLen(level.x) + ", " + fmtLen(level.y) + " " + u);
    } else if (level) {
      $("hang").textContent = fmtLen(level.x) + ", " + fmtLen(level.y);
      lines.push("Drill here: hangs level · hole Ø " + fmtLen(level.diameter) + " " + u);
    } else if (tilts.length) {
      $("hang").textContent = fmtLen(tilts[0].x) + ", " + fmtLen(tilts[0].y);
      lines.push("No hole hangs this part level. Least tilt here: " + tiltWords(tilts[0].angle_deg));
      for (const t of tilts.slice(1)) lines.push("Other side: " + fmtLen(t.x) + ", " + fmtLen(t.y) + " " + u + ", " + tiltWords(t.angle_deg));
    } else {
      $("hang").textContent = "—";
      lines.push(state.level_pending ? "Finding the level-hang hole…" : "Place the hole with the Hole tool.");
    }
    $("hang-sub").textContent = lines.join("\n");
    const movable = suggested && (!h || (level && Math.abs(h.angle_deg) >= 0.05));
    $("place-hole").hidden = !movable;
    $("place-hole").textContent = h ? "Move the hole to hang level" : level ? "Place the hole here" : "Place the hole at least tilt";
  }

  // tiltWords says how a part hangs from a hole: level, or how far and which way it turns.
  function tiltWords(deg) {
    if (Math.abs(deg) < 0.05) return "hangs level";
    return "tilts " + fmtDeg(Math.abs(deg)) + (deg > 0 ? " counter-clockwise" : " clockwise");
  }

  // renderEdge shows the edge distance in effect: the one typed, or "auto" and the rule's in the hint.
  function renderEdge(u) {
    const e = state.edge;
    if (!e) { $("edge-hint").textContent = ""; return; }
    if (document.activeElement !== $("edge")) $("edge").value = e.asked ? fmtField(e.min) : "";
    $("edge").placeholder = "auto";
    $("edge-hint").textContent = "Edge distance " + fmtLen(e.min) + " " + u + " (" + e.source + ")" +
      (e.asked ? "; clear the field for the common-practice rule" : "");
  }

  // tiltPerError says how far the part tilts for a hole drilled a little off the line: per millimetre,
  // or per sixteenth of an inch (1.5875 mm, exact) on a part in inches or feet.
  function tiltPerError(degPerMM) {
    if (unitName() === "in" || unitName() === "ft") return (degPerMM * 25.4 / 16).toFixed(2) + "° tilt per 1/16 in drilled off-line";
    return degPerMM.toFixed(2) + "° tilt per mm drilled off-line";
  }

  function renderDetails(u) {
    // Without a material the second moments are the shape's, per unit areal density (u⁴).
    const kgu2 = state.no_material ? u + "⁴ (shape only)" : "kg·" + u + "²";
    const rows = [
      ["Area", fmtSig(state.area) + " " + u + "²"],
      ["Mass", state.no_material ? "unknown (no material)" : fmtSig(state.mass, 6) + " kg"],
      ["Ixx (about the balance point)", fmtSig(state.inertia.ixx) + " " + kgu2],
      ["Iyy", fmtSig(state.inertia.iyy) + " " + kgu2],
      ["Ixy", fmtSig(state.inertia.ixy) + " " + kgu2],
      ["Principal I1", fmtSig(state.principal.i1) + " " + kgu2],
      ["Principal I2", fmtSig(state.principal.i2) + " " + kgu2],
      ["Axis of I1 from x", fmtDeg(state.principal.angle_deg)],
      ["Error estimate", state.error_estimate > 0 ? state.error_estimate.toExponential(1) + " (relative)" : "exact"],
      ["Computed in", Number.isFinite(state.recompute_ms) ? state.recompute_ms.toFixed(2) + " ms" : "—"],
    ];
    $("details-rows").replaceChildren(...rows.map(([k, v]) => {
      const tr = document.createElement("tr");
      const a = document.createElement("td");
      const b = document.createElement("td");
      a.textContent = k;
      b.textContent = v;
      tr.append(a, b);
      return tr;
    }));
  }

  function renderWarnings() {
    const list = state.warnings || [];
    $("warnings").replaceChildren(...list.map((w) => { const li = document.createElement("li"); li.textContent = w; return li; }));
    $("warnings-box").hidden = list.length === 0;
  }

  // ---- overlays ----

  function showHelp() {
    const keys = app && typeof app.shortcuts === "function" ? Array.from(app.shortcuts()) : [];
    keys.push({ key: "?", action: "Show or hide this list" }, { key: "Ctrl O", action: "Open a part or drawing" },
      { key: "Ctrl S", action: "Save the part" }, { key: "Esc", action: "Close this list" });
    $("help-keys").replaceChildren(...keys.map((k) => {
      const row = document.createElement("div");
      const a = document.createElement("span");
      const b = document.createElement("span");
      // "Ctrl O" is two keys; a typed form such as "250 at 30" is one thing to type.
      for (const part of /\d/.test(k.key) ? [String(k.key)] : String(k.key).split(" ")) {
        const kbd = document.createElement("kbd");
        kbd.textContent = part;
        a.append(kbd, " ");
      }
      b.textContent = k.action;
      row.append(a, b);
      return row;
    }));
    $("help").hidden = false;
  }

  function showCautions() {
    const list = (state && state.cautions && state.cautions.length) ? state.cautions : [
      "Plumb's results are geometry estimates. Hardware ratings, fixings and overhead signs follow local codes and the judgement of a licensed engineer.",
    ];
    $("cautions-list").replaceChildren(...list.map((c) => { const li = document.createElement("li"); li.textContent = c; return li; }));
    $("cautions").hidden = false;
  }

  function closeOverlays() {
    let closed = false;
    for (const o of document.querySelectorAll(".overlay")) { closed = closed || !o.hidden; o.hidden = true; }
    return closed;
  }

  // whenFiguresIn runs a download made from the figures once they are of the part as it is: while a
  // large part's analysis is under way (state.pending) it waits for it, so that the page stays usable
  // meanwhile instead of the app finishing the analysis within the click.
  function whenFiguresIn(run) {
    if (!state || !state.pending) { run(); return; }
    toast("Finishing the figures for your last change; the download follows.");
    const wait = () => { if (state && state.pending) setTimeout(wait, 200); else run(); };
    setTimeout(wait, 200);
  }

  // ---- wiring ----

  const ACTIONS = {
    undo: () => app.undo(),
    redo: () => app.redo(),
    fit: () => app.fit(),
    new: () => app.newPart(),
    open: () => $("file").click(),
    save: () => download(app.saveJSON(), baseName() + ".json", "application/json"),
    svg: () => whenFiguresIn(() => download(app.exportSVG(), baseName() + ".svg", "image/svg+xml")),
    report: () => whenFiguresIn(() => download(app.report(), baseName() + "-report.txt", "text/plain")),
    cutfile: () => whenFiguresIn(() => {
      const format = $("cut-format").value;
      const text = app.cutFile(format);
      if (typeof text === "string") download(text, baseName() + "-cut." + format, format === "svg" ? "image/svg+xml" : "application/dxf");
      else toast("Cut file: " + text.error, true);
    }),
    template: () => whenFiguresIn(() => {
      const pdf = app.templatePDF($("paper").value);
      if (pdf instanceof Uint8Array) download(pdf, baseName() + "-template.pdf", "application/pdf");
      else toast("Drilling template: " + pdf.error, true);
    }),
    copy: () => copyText(resultsText()),
    "place-hole": () => {
      const r = app.placeSuggestedHole();
      if (!r.ok) toast("Hang hole: " + r.error, true);
    },
    help: showHelp,
    cautions: showCautions,
    about: showAbout,
    close: closeOverlays,
    "dismiss-units-note": () => { $("units-note").hidden = true; },
    "dismiss-guide": () => { $("guide").hidden = true; writeStore(GUIDE_DONE, "1"); },
    "show-guide": () => { closeOverlays(); $("guide").hidden = false; writeStore(GUIDE_DONE, ""); },
    "undo-units": () => { app.undo(); $("units-note").hidden = true; },
    "restore-previous": () => {
      unpackText(readStore(PREVIOUS)).then((prev) => {
        if (prev !== null && loadText(prev, "previous.json")) $("previous").hidden = true;
      }, (e) => toast("The previous part could not be read back: " + e.message, true));
    },
  };

  // changeUnits converts the part to another unit. The part keeps its size, so its weight stays, except
  // where a density formula reads x and y: a weight that jumps more than 100-fold gets a note.
  function changeUnits(units) {
    const before = state && !state.error ? state.mass : NaN;
    const from = unitName();
    const r = app.setUnits(units);
    if (!r.ok) { toast("Units: " + r.error, true); return; }
    remember("units", units);
    refresh();
    const after = state && !state.error ? state.mass : NaN;
    const ratio = after / before;
    const jumped = units !== from && Number.isFinite(ratio) && (ratio > 100 || ratio < 0.01);
    $("units-note").hidden = !jumped;
    if (jumped) {
      $("units-note-text").textContent = "The weight went from " + fmtSig(before) + " kg to " + fmtSig(after) +
        " kg with the change from " + from + " to " + units + ": the density formula reads x and y in " + units +
        " now. Check the formula, or undo the change.";
    }
  }

  function onClick(e) {
    const b = e.target.closest("button");
    if (!b || b.disabled) return;
    const d = b.dataset;
    if (d.action) {
      if (!app && !["help", "cautions", "about", "close"].includes(d.action)) return;
      ACTIONS[d.action]();
    } else if (d.tool) {
      app.setTool(d.tool);
      for (const x of document.querySelectorAll("[data-tool]")) x.setAttribute("aria-pressed", String(x === b));
    } else if (d.target) {
      app.setTarget(d.target);
      for (const x of document.querySelectorAll("[data-target]")) x.setAttribute("aria-pressed", String(x === b));
    } else if (d.units) {
      changeUnits(d.units);
    } else if (d.mode) {
      setMode(d.mode);
      // Switching to an empty field waits for the user to type; otherwise the part takes the other kind.
      if ($(d.mode === "sheet" ? "material" : "formula").value.trim() === "") showMaterialError(null);
      else sendMaterial();
    } else if (b.id === "fold") {
      const folded = $("panel").classList.toggle("folded");
      b.setAttribute("aria-expanded", String(!folded));
      b.textContent = folded ? "+" : "–";
      writeStore(FOLDED, folded ? "1" : "");
      return;
    } else {
      return;
    }
    if (app && !["help", "cautions", "about", "open"].includes(d.action)) refresh();
    if (!b.closest(".overlay") && !["help", "cautions", "about"].includes(d.action)) giveCanvasKeys();
  }

  function onKey(e) {
    const typing = e.target.matches("input, select, textarea");
    if (e.key === "Escape" && closeOverlays()) { e.preventDefault(); return; }
    if ((e.ctrlKey || e.metaKey) && !e.altKey && (e.key === "o" || e.key === "s")) {
      e.preventDefault();
      if (app) ACTIONS[e.key === "o" ? "open" : "save"]();
      return;
    }
    // While the Lettering tool writes, "?" is a character of the lettering.
    if (!typing && e.key === "?" && !(app && app.writing())) {
      e.preventDefault();
      if ($("help").hidden) showHelp(); else closeOverlays();
    }
  }

  function wireDrop() {
    const hint = $("drop-hint");
    const hasFiles = (e) => e.dataTransfer && Array.from(e.dataTransfer.types).includes("Files");
    // Capture on window: every drop anywhere is ours, and the browser never navigates to a dropped file.
    for (const type of ["dragenter", "dragover"]) {
      window.addEventListener(type, (e) => {
        e.preventDefault();
        e.stopPropagation();
        if (hasFiles(e)) { e.dataTransfer.dropEffect = "copy"; hint.hidden = false; }
      }, true);
    }
    window.addEventListener("dragleave", (e) => { if (e.relatedTarget === null) hint.hidden = true; }, true);
    window.addEventListener("drop", (e) => {
      e.preventDefault();
      e.stopPropagation();
      hint.hidden = true;
      const file = e.dataTransfer && e.dataTransfer.files[0];
      if (file) openFile(file);
    }, true);
  }

  function wire() {
    document.addEventListener("click", onClick);
    document.addEventListener("keydown", onKey);
    for (const o of document.querySelectorAll(".overlay")) o.addEventListener("click", (e) => { if (e.target === o) closeOverlays(); });
    $("file").addEventListener("change", (e) => {
      const f = e.target.files[0];
      e.target.value = "";
      if (f) openFile(f);
    });
    for (const id of ["material", "thickness", "formula", "params"]) {
      const input = $(id);
      input.addEventListener("input", materialSoon);
      input.addEventListener("scroll", () => { input.closest(".field").querySelector(".mirror").scrollLeft = input.scrollLeft; });
    }
    $("material").addEventListener("change", fillThicknessList);
    for (const id of ["text-font", "text-height", "text-role", "text-angle", "text-spacing", "text-stencil", "text-bridge", "text-bridges"]) {
      $(id).addEventListener("change", () => { sendTextStyle(); if ($(id).tagName === "SELECT" || $(id).type === "checkbox") giveCanvasKeys(); });
    }
    $("density-unit").addEventListener("change", sendMaterial);
    $("hole-dia").addEventListener("change", () => {
      const d = Number($("hole-dia").value);
      if (!app || !(d >= 0)) return;
      const r = app.setHoleDiameter(d);
      if (!r.ok) toast("Hole diameter: " + r.error, true);
      refresh();
    });
    $("edge").addEventListener("change", () => {
      const text = $("edge").value.trim();
      const e = text === "" ? 0 : Number(text);
      if (!app || !(e >= 0)) return;
      const r = app.setEdgeDistance(e);
      if (!r.ok) toast("Edge distance: " + r.error, true);
      refresh();
    });
    $("material-list").replaceChildren(...presets.materials.map((m) =>
      new Option(m.name + " · " + m.density + (m.areal ? " kg/m² per mm" : " kg/m³"), m.name)));
    fillThicknessList();
    wireDrop();
    window.addEventListener("hashchange", () => {
      if (restored && location.hash === "#demo") showDemo(app.saveJSON());
    });
    const paper = readStore(PAPER);
    if ([...$("paper").options].some((o) => o.value === paper)) $("paper").value = paper;
    $("paper").addEventListener("change", () => writeStore(PAPER, $("paper").value));
    if (readStore(FOLDED)) $("fold").click();
    $("guide").hidden = Boolean(readStore(GUIDE_DONE));
  }

  window.plumbUI = { ready, onChange, timing };
  setMode("sheet");
  setEnabled(false);
  wire();
  // Lay the page out now, while nothing else runs: once the app starts, the browser compiles its
  // hot functions on every core, and the first layout, forced by the canvas taking the focus, took
  // several times as long then.
  document.body.getBoundingClientRect();
  startApp().catch((e) => failed("Plumb could not start in this browser: " + e.message +
    ". It needs WebAssembly, WebGL 2 and a browser from 2023 or later."));
})();
