package web

// Browser tests: the built page in headless Chromium, opened from file:// as a user would open a saved
// plumb.html, driven through the mouse, the panel and the window.plumb bridge.
//
// Chromium comes from /usr/bin/chromium (Debian's package). Without it the tests skip, unless
// PLUMB_BROWSER=1, when they fail; -short or PLUMB_BROWSER=0 skips them. A test that fails leaves a
// screenshot in $TMPDIR/plumb-browser-artifacts and logs its path.

import (
	"bytes"
	"context"
	"encoding/json"
	"flag"
	"fmt"
	"math"
	"net/url"
	"os"
	"os/exec"
	"path/filepath"
	"slices"
	"strings"
	"sync"
	"testing"
	"time"

	cdpbrowser "github.com/chromedp/cdproto/browser"
	"github.com/chromedp/cdproto/cdp"
	"github.com/chromedp/cdproto/input"
	"github.com/chromedp/cdproto/log"
	"github.com/chromedp/cdproto/network"
	"github.com/chromedp/cdproto/runtime"
	"github.com/chromedp/chromedp"
	"github.com/chromedp/chromedp/kb"

	"plumb/density"
	"plumb/geom"
	"plumb/sketch"
	"plumb/sketch/svg"
	"plumb/web/bundle"
)

// chromiumPath is where Debian's chromium package installs the browser.
const chromiumPath = "/usr/bin/chromium"

// built is the page that TestMain builds once for all tests, and the one Chromium they share; each
// test gets its own browser context (its own storage) in it.
var built struct {
	url     string          // file:// address of the page
	size    int             // bytes
	skip    string          // why the browser tests cannot run
	err     error           // the build or the browser's start failed
	browser context.Context // the running Chromium
}

func TestMain(m *testing.M) {
	os.Exit(runBrowserTests(m))
}

func runBrowserTests(m *testing.M) int {
	flag.Parse()
	if testing.Short() || os.Getenv("PLUMB_BROWSER") == "0" {
		built.skip = "browser tests skipped (-short or PLUMB_BROWSER=0)"
		return m.Run()
	}
	if _, err := exec.LookPath(chromiumPath); err != nil {
		built.skip = "browser tests need Chromium at " + chromiumPath + " (apt-get install chromium)"
		if os.Getenv("PLUMB_BROWSER") == "1" {
			fmt.Fprintln(os.Stderr, "FAIL: PLUMB_BROWSER=1 but "+built.skip)
			return 1
		}
		return m.Run()
	}
	dir, err := os.MkdirTemp("", "plumb-browser-")
	if err != nil {
		built.err = err
		return m.Run()
	}
	defer os.RemoveAll(dir)
	ctx, cancel := context.WithTimeout(context.Background(), 10*time.Minute)
	defer cancel()
	html, err := bundle.Build(ctx, bundle.Options{})
	if err == nil {
		path := filepath.Join(dir, "plumb.html")
		err = os.WriteFile(path, html, 0o644)
		built.url = (&url.URL{Scheme: "file", Path: path}).String()
		built.size = len(html)
	}
	if err != nil {
		built.err = err
		return m.Run()
	}
	opts := []chromedp.ExecAllocatorOption{
		chromedp.ExecPath(chromiumPath),
		chromedp.Headless,
		chromedp.NoSandbox,
		chromedp.NoFirstRun,
		chromedp.NoDefaultBrowserCheck,
		chromedp.Flag("enable-unsafe-swiftshader", true),
		chromedp.Flag("disable-background-networking", true),
		chromedp.Flag("disable-component-update", true),
		chromedp.Flag("disable-sync", true),
		chromedp.Flag("disable-dev-shm-usage", true),
		chromedp.UserDataDir(filepath.Join(dir, "profile")),
		chromedp.WindowSize(800, 600),
	}
	actx, cancelAlloc := chromedp.NewExecAllocator(context.Background(), opts...)
	defer cancelAlloc()
	bctx, cancelBrowser := chromedp.NewContext(actx)
	defer cancelBrowser()
	if err := chromedp.Do(bctx); err != nil {
		built.err = fmt.Errorf("starting Chromium: %w", err)
		return m.Run()
	}
	built.browser = bctx
	return m.Run()
}

// browser is one tab in a fresh browser context (its own local storage) of the shared Chromium.
type browser struct {
	t    *testing.T
	ctx  context.Context // the test's actions, under its time limit
	root context.Context // the browser's context, for the screenshot after a failure

	mu       sync.Mutex
	requests []string // every URL the page asked for
	problems []string // exceptions, console errors, CSP reports
}

// newBrowser opens a tab with an 800 × 600 page in a new browser context and closes both when the test
// ends; a failed test leaves a screenshot behind.
func newBrowser(t *testing.T) *browser {
	t.Helper()
	switch {
	case built.skip != "":
		t.Skip(built.skip)
	case built.err != nil:
		t.Fatalf("building the page: %v", built.err)
	}
	ctx, cancelCtx := chromedp.NewContext(built.browser, chromedp.WithNewBrowserContext())
	t.Cleanup(cancelCtx)
	b := &browser{t: t, ctx: ctx, root: ctx}
	if err := chromedp.Listen(ctx, b.record); err != nil {
		t.Fatalf("starting Chromium: %v", err)
	}
	if _, err := chromedp.Call(ctx, network.Enable, network.EnableParams{}); err != nil {
		t.Fatal(err)
	}
	if _, err := chromedp.Call(ctx, log.Enable, cdp.Empty{}); err != nil {
		t.Fatal(err)
	}
	// The window's frame takes part of its 800 × 600; the page itself gets exactly that.
	if err := chromedp.Do(ctx, chromedp.EmulateViewport(800, 600)); err != nil {
		t.Fatal(err)
	}
	// Every action of the test runs under one time limit, derived from a context that has run once.
	limited, cancel := context.WithTimeout(ctx, 90*time.Second)
	t.Cleanup(cancel)
	b.ctx = limited
	t.Cleanup(b.keepScreenshotOnFailure)
	return b
}

// record keeps the requests and the problems the page reports.
func (b *browser) record(ev any) {
	b.mu.Lock()
	defer b.mu.Unlock()
	switch e := ev.(type) {
	case *network.EventRequestWillBeSent:
		b.requests = append(b.requests, e.Request.URL)
	case *runtime.EventExceptionThrown:
		b.problems = append(b.problems, "exception: "+e.ExceptionDetails.Text+" "+exceptionText(e.ExceptionDetails))
	case *log.EventEntryAdded:
		if e.Entry.Level == log.EntryLevelError {
			b.problems = append(b.problems, string(e.Entry.Source)+": "+e.Entry.Text)
		}
	}
}

func exceptionText(d *runtime.ExceptionDetails) string {
	if d.Exception == nil {
		return ""
	}
	return d.Exception.Description
}

// keepScreenshotOnFailure saves what the page showed when the test failed. t.TempDir is removed after
// the test, so the picture goes to a directory that stays.
func (b *browser) keepScreenshotOnFailure() {
	if !b.t.Failed() {
		return
	}
	ctx, cancel := context.WithTimeout(b.root, 10*time.Second)
	defer cancel()
	png, err := chromedp.Run(ctx, chromedp.CaptureScreenshot())
	if err != nil {
		b.t.Logf("no screenshot: %v", err)
		return
	}
	dir := filepath.Join(os.TempDir(), "plumb-browser-artifacts")
	path := filepath.Join(dir, strings.NewReplacer("/", "_", " ", "_").Replace(b.t.Name())+".png")
	if err := os.MkdirAll(dir, 0o755); err == nil {
		err = os.WriteFile(path, png, 0o644)
	}
	if err != nil {
		b.t.Logf("no screenshot: %v", err)
		return
	}
	b.t.Logf("screenshot of the failure: %s", path)
}

// open loads the page and waits until the app has loaded a part and reported it.
func (b *browser) open() {
	b.t.Helper()
	if err := chromedp.Do(b.ctx, chromedp.Navigate(built.url)); err != nil {
		b.t.Fatalf("opening %s: %v", built.url, err)
	}
	b.waitStarted()
}

// waitStarted waits for the app's first report to the panel, or for the page's own failure message.
func (b *browser) waitStarted() {
	b.t.Helper()
	msg, err := chromedp.Run(b.ctx, chromedp.Poll[string](`(() => {
		const l = document.getElementById("loading");
		if (l && l.classList.contains("failed")) return "failed: " + l.textContent;
		const ui = window.plumbUI;
		return ui && ui.timing.restoredMs !== undefined ? "ok" : false;
	})()`, chromedp.WithPollingInterval(50*time.Millisecond), chromedp.WithPollingTimeout(60*time.Second)))
	if err != nil {
		b.t.Fatalf("waiting for the app: %v (problems: %v)", err, b.problemList())
	}
	if msg != "ok" {
		b.t.Fatalf("the app did not start: %s", msg)
	}
}

func (b *browser) problemList() []string {
	b.mu.Lock()
	defer b.mu.Unlock()
	return append([]string(nil), b.problems...)
}

// eval evaluates a JavaScript expression (awaiting a promise) and decodes its value.
func eval[T any](b *browser, expr string) T {
	b.t.Helper()
	v, err := chromedp.Run(b.ctx, chromedp.Evaluate[T](expr, chromedp.EvalAwaitPromise))
	if err != nil {
		b.t.Fatalf("evaluating %s: %v", expr, err)
	}
	return v
}

// do runs actions and fails the test on an error.
func (b *browser) do(actions ...chromedp.Action[chromedp.Void]) {
	b.t.Helper()
	if err := chromedp.Do(b.ctx, actions...); err != nil {
		b.t.Fatal(err)
	}
}

// waitFor waits until the JavaScript condition holds.
func (b *browser) waitFor(cond string) {
	b.t.Helper()
	_, err := chromedp.Run(b.ctx, chromedp.Poll[chromedp.Void](cond, chromedp.WithPollingInterval(50*time.Millisecond),
		chromedp.WithPollingTimeout(20*time.Second)))
	if err != nil {
		b.t.Fatalf("waiting for %s: %v", cond, err)
	}
}

// typeInto types text into the input with the given id, replacing its selection, as one edit (as a
// paste or an input method does: key by key takes a frame per key in software WebGL).
func (b *browser) typeInto(id, text string) {
	b.t.Helper()
	eval[any](b, fmt.Sprintf(`document.getElementById(%q).focus()`, id))
	if _, err := chromedp.Call(b.ctx, input.InsertText, input.InsertTextParams{Text: text}); err != nil {
		b.t.Fatal(err)
	}
}

// frames waits for n animation frames; the app updates once per frame.
func (b *browser) frames(n int) {
	b.t.Helper()
	eval[bool](b, fmt.Sprintf(`new Promise((done) => {
		let n = %d;
		const step = () => (--n > 0 ? requestAnimationFrame(step) : done(true));
		requestAnimationFrame(step);
	})`, n))
}

// holdFrames is how long a button stays down or up: the app's input loop drops a press and a release
// that fall in the same frame, and software WebGL runs at 5–20 frames a second (fewer on a busy
// machine). A move needs only the next frame.
const holdFrames = 2

// mouse sends one mouse event with the left button (down while pressed is true) and waits for the app
// to see it.
func (b *browser) mouse(typ input.DispatchMouseEventType, x, y float64, pressed bool) {
	b.t.Helper()
	opt := func(p *input.DispatchMouseEventParams) {
		if typ != input.DispatchMouseEventTypeMouseMoved {
			p.Button = input.MouseButtonLeft
			p.ClickCount = 1
		}
		if pressed {
			p.Buttons = 1
		}
	}
	b.do(chromedp.MouseEvent(typ, x, y, opt))
	if typ == input.DispatchMouseEventTypeMouseMoved {
		b.frames(1)
	} else {
		b.frames(holdFrames)
	}
}

// drag presses the left button at (x0, y0), moves in steps to (x1, y1) and releases there.
func (b *browser) drag(x0, y0, x1, y1 float64) {
	b.t.Helper()
	b.mouse(input.DispatchMouseEventTypeMouseMoved, x0, y0, false)
	b.mouse(input.DispatchMouseEventTypeMousePressed, x0, y0, true)
	const steps = 3
	for i := 1; i <= steps; i++ {
		f := float64(i) / steps
		b.mouse(input.DispatchMouseEventTypeMouseMoved, x0+(x1-x0)*f, y0+(y1-y0)*f, true)
	}
	b.mouse(input.DispatchMouseEventTypeMouseReleased, x1, y1, false)
}

// click presses and releases the left button at (x, y), holding it for a few frames.
func (b *browser) click(x, y float64) {
	b.t.Helper()
	b.mouse(input.DispatchMouseEventTypeMouseMoved, x, y, false)
	b.mouse(input.DispatchMouseEventTypeMousePressed, x, y, true)
	b.mouse(input.DispatchMouseEventTypeMouseReleased, x, y, false)
}

// state is the part of plumb.state() the tests read.
type state struct {
	File  string `json:"file"`
	Units struct {
		Length string `json:"length"`
	} `json:"units"`
	Area     float64 `json:"area"`
	Mass     float64 `json:"mass"`
	Centroid struct {
		X float64 `json:"x"`
		Y float64 `json:"y"`
	} `json:"centroid"`
	Inertia struct {
		Ixx float64 `json:"ixx"`
		Iyy float64 `json:"iyy"`
		Ixy float64 `json:"ixy"`
	} `json:"inertia"`
	Principal struct {
		I1       float64 `json:"i1"`
		I2       float64 `json:"i2"`
		AngleDeg float64 `json:"angle_deg"`
	} `json:"principal"`
	Hang *struct {
		At struct {
			X float64 `json:"x"`
			Y float64 `json:"y"`
		} `json:"at"`
		Hole     float64 `json:"hole"`
		AngleDeg float64 `json:"angle_deg"`
	} `json:"hang"`
	RecomputeMS float64 `json:"recompute_ms"`
	Error       string  `json:"error"`
}

func (b *browser) state() state {
	b.t.Helper()
	raw := eval[[]byte](b, `plumb.state()`)
	var s state
	if err := json.Unmarshal(raw, &s); err != nil {
		b.t.Fatalf("plumb.state(): %v in %s", err, raw)
	}
	return s
}

// near reports whether got is within rel of want, relative to scale.
func near(got, want, rel, scale float64) bool {
	return math.Abs(got-want) <= rel*math.Max(scale, math.Abs(want))
}

func TestPageLoadsOfflineFromFile(t *testing.T) {
	b := newBrowser(t)
	// Take the network away before the page loads: the page must need none of it.
	if _, err := chromedp.Call(b.ctx, network.OverrideNetworkState, network.OverrideNetworkStateParams{Offline: true}); err != nil {
		t.Fatal(err)
	}
	b.open()
	timing := eval[map[string]float64](b, `plumbUI.timing`)
	t.Logf("page size: %d bytes (%.2f MB; goal ≤ %.1f MB, checked by TestPageSizeAndFirstFrame)", built.size, float64(built.size)/1e6, maxPageBytes/1e6)
	t.Logf("navigation to first interactive frame: %.0f ms (app ready at %.0f ms)", timing["restoredMs"], timing["readyMs"])
	if where := eval[string](b, `plumbStart.compiledIn`); where != "worker" {
		t.Errorf("the module was compiled in the %s, not in the loader's worker", where)
	}
	b.frames(3)
	b.mu.Lock()
	requests := append([]string(nil), b.requests...)
	b.mu.Unlock()
	if len(requests) == 0 {
		t.Error("no requests seen, not even the page's own; the network listener is not working")
	}
	for _, r := range requests {
		if u, err := url.Parse(r); err != nil || (u.Scheme != "file" && u.Scheme != "data" && u.Scheme != "blob") {
			t.Errorf("the page asked for %s; it must not reach outside file://", r)
		}
	}
	for _, p := range b.problemList() {
		t.Errorf("page reported: %s", p)
	}
	if s := b.state(); s.Error != "" || s.Mass <= 0 {
		t.Errorf("demo part: mass %g, error %q; want a positive mass", s.Mass, s.Error)
	}

	// "?" opens the keyboard help with the app's own shortcuts; Esc closes it.
	b.do(chromedp.KeyEvent("?"))
	b.waitFor(`!document.getElementById("help").hidden`)
	keys := eval[[]string](b, `Array.from(document.querySelectorAll("#help-keys > div"), (row) => row.textContent)`)
	appKeys := eval[int](b, `plumb.shortcuts().length`)
	if len(keys) < appKeys || appKeys == 0 {
		t.Errorf("help lists %d keys, the app has %d shortcuts", len(keys), appKeys)
	}
	b.do(chromedp.KeyEvent(kb.Escape))
	b.waitFor(`document.getElementById("help").hidden`)
}

// partJSON returns a part file for the document, for loading into the page.
func partJSON(t *testing.T, d *sketch.Document) string {
	t.Helper()
	data, err := d.Save()
	if err != nil {
		t.Fatal(err)
	}
	return string(data)
}

// load loads a part file or SVG drawing into the app through the bridge.
func (b *browser) load(text, name string) {
	b.t.Helper()
	arg, _ := json.Marshal(text)
	nameArg, _ := json.Marshal(name)
	r := eval[struct {
		OK    bool   `json:"ok"`
		Error string `json:"error"`
	}](b, fmt.Sprintf(`plumb.load(%s, %s)`, arg, nameArg))
	if !r.OK {
		b.t.Fatalf("plumb.load(%s): %s", name, r.Error)
	}
	b.frames(2)
}

// drop drops a file with the given text on the drawing, as a user drags one from the desktop, and
// waits until the app has it.
func (b *browser) drop(text, name string) {
	b.t.Helper()
	arg, _ := json.Marshal(text)
	nameArg, _ := json.Marshal(name)
	eval[any](b, fmt.Sprintf(`(() => {
		const dt = new DataTransfer();
		dt.items.add(new File([%s], %s));
		const at = {bubbles: true, cancelable: true, dataTransfer: dt, clientX: 200, clientY: 300};
		const canvas = document.querySelector("canvas");
		canvas.dispatchEvent(new DragEvent("dragenter", at));
		canvas.dispatchEvent(new DragEvent("dragover", at));
		canvas.dispatchEvent(new DragEvent("drop", at));
		return null;
	})()`, arg, nameArg))
	b.waitFor(fmt.Sprintf(`plumb.state().file === %s`, nameArg))
	if msg := eval[string](b, `document.getElementById("toast").classList.contains("bad") ? document.getElementById("toast").textContent : ""`); msg != "" {
		b.t.Fatalf("dropping %s: %s", name, msg)
	}
}

// savedPart reads the app's part back as a document.
func (b *browser) savedPart() *sketch.Document {
	b.t.Helper()
	d, err := sketch.Load([]byte(eval[string](b, `plumb.saveJSON()`)))
	if err != nil {
		b.t.Fatalf("the app saved a part that does not load: %v", err)
	}
	return d
}

// sheet is the material the tests give their parts.
var sheet = density.Spec{Material: "aluminium 5052", Thickness: "3 mm"}

func TestRectangleByMouse(t *testing.T) {
	b := newBrowser(t)
	b.open()
	eval[any](b, `(plumb.newPart(), plumb.setMaterial({material: "aluminium 5052", thickness: "3 mm"}),
		plumb.setTarget("outline"), plumb.setTool("rect"), null)`)
	b.frames(2)
	// A square drag, well away from the tool bar (top) and the panel (right).
	b.drag(100, 200, 300, 400)
	b.waitFor(`plumb.state().area > 0`)
	d := b.savedPart()
	if len(d.Outline.Loops) != 1 {
		t.Fatalf("outline has %d loops, want the one rectangle", len(d.Outline.Loops))
	}
	box := d.Outline.Loops[0].Bounds()
	size := box.Size()
	// The rectangle is the drag's box: its centroid is the box's centre and its area w·h (the
	// centroid of a rectangle is its centre; "List of centroids"). The drag was square, so the sides
	// agree to within grid snapping.
	s := b.state()
	c := box.Center()
	if !near(s.Centroid.X, c.X, 1e-9, size.X) || !near(s.Centroid.Y, c.Y, 1e-9, size.Y) {
		t.Errorf("balance point (%g, %g), want the rectangle's centre (%g, %g)", s.Centroid.X, s.Centroid.Y, c.X, c.Y)
	}
	if !near(s.Area, size.X*size.Y, 1e-9, 0) {
		t.Errorf("area %g, want %g × %g = %g", s.Area, size.X, size.Y, size.X*size.Y)
	}
	if r := size.X / size.Y; r < 0.9 || r > 1.1 {
		t.Errorf("rectangle is %g × %g from a square drag", size.X, size.Y)
	}
	if got := eval[string](b, `document.getElementById("balance").textContent`); !strings.Contains(got, ",") {
		t.Errorf("panel shows balance point %q", got)
	}
}

func TestFormulaErrorShowsColumn(t *testing.T) {
	b := newBrowser(t)
	b.open()
	b.do(chromedp.Click(chromedp.CSS(`[data-mode="formula"]`)))
	// "8 + * x": the operator at column 5 has no left operand (columns count characters from 1).
	b.typeInto("formula", "8 + * x")
	b.waitFor(`document.getElementById("material-error").textContent !== ""`)
	got := eval[struct {
		Message string `json:"message"`
		Before  int    `json:"before"`
		Marked  string `json:"marked"`
	}](b, `(() => {
		const mark = document.querySelector("#formula-fields .mirror mark");
		return {
			message: document.getElementById("material-error").textContent,
			before: mark ? Array.from(mark.parentElement.firstChild.textContent).length : -1,
			marked: mark ? mark.textContent : "",
		};
	})()`)
	if got.Before != 4 || got.Marked != "*" {
		t.Errorf("underline after %d characters on %q, want column 5 (after 4) on \"*\"", got.Before, got.Marked)
	}
	if !strings.Contains(got.Message, "column 5") {
		t.Errorf("message %q does not name column 5", got.Message)
	}
	// Finishing the formula clears the mark and uses it: 8.04 kg/m² is 3 mm of aluminium 5052.
	eval[any](b, `document.getElementById("formula").select()`)
	b.typeInto("formula", "8.04")
	b.waitFor(`document.getElementById("material-error").textContent === ""`)
	if msg := eval[string](b, `document.getElementById("material-error").textContent`); msg != "" {
		t.Errorf("error %q stays after the formula was fixed", msg)
	}
	if n := eval[int](b, `document.querySelectorAll(".mirror mark").length`); n != 0 {
		t.Errorf("%d underlines stay after the formula was fixed", n)
	}
}

func TestSVGFilesMatchAnalyze(t *testing.T) {
	files, err := filepath.Glob(filepath.Join("..", "testdata", "*.svg"))
	if err != nil {
		t.Fatal(err)
	}
	if len(files) == 0 {
		t.Skip("no SVG drawings in ../testdata to compare")
	}
	b := newBrowser(t)
	b.open()
	for _, path := range files {
		name := filepath.Base(path)
		data, err := os.ReadFile(path)
		if err != nil {
			t.Fatal(err)
		}
		// The reference: what `plumb analyze --format json --material "aluminium 5052" --thickness
		// "3 mm"` prints for the file, computed here natively by the same package.
		d, _, err := svg.Read(data, svg.Options{Name: strings.TrimSuffix(name, ".svg")})
		if err != nil {
			t.Errorf("%s: %v", name, err)
			continue
		}
		d.Material = sheet
		a, err := sketch.Analyze(d, sketch.AnalyzeOptions{})
		if err != nil {
			t.Errorf("%s: %v", name, err)
			continue
		}
		want := sketch.Summarize(name, d, a)

		b.drop(string(data), name)
		eval[any](b, `(plumb.setMaterial({material: "aluminium 5052", thickness: "3 mm"}), null)`)
		got := b.state()
		scale := math.Sqrt(want.Area)
		checks := []struct {
			what      string
			got, want float64
			scale     float64
		}{
			{"area", got.Area, want.Area, 0},
			{"mass", got.Mass, *want.Mass, 0},
			{"centroid x", got.Centroid.X, want.Centroid.X, scale},
			{"centroid y", got.Centroid.Y, want.Centroid.Y, scale},
			{"ixx", got.Inertia.Ixx, want.Inertia.Ixx, 0},
			{"iyy", got.Inertia.Iyy, want.Inertia.Iyy, 0},
			{"ixy", got.Inertia.Ixy, want.Inertia.Ixy, want.Inertia.Ixx + want.Inertia.Iyy},
			{"i1", got.Principal.I1, want.Principal.I1, 0},
			{"i2", got.Principal.I2, want.Principal.I2, 0},
		}
		for _, c := range checks {
			if !near(c.got, c.want, 1e-9, c.scale) {
				t.Errorf("%s: %s in the browser %.12g, natively %.12g", name, c.what, c.got, c.want)
			}
		}
	}
}

// plainPlate is a 400 × 300 mm rectangle of 3 mm aluminium 5052 with no holes.
func plainPlate() *sketch.Document {
	d := sketch.NewDocument()
	d.Name = "plain plate"
	d.Material = sheet
	d.Outline = geom.Region{Loops: []geom.Loop{geom.RectLoop(geom.Pt(0, 0), geom.Pt(400, 300))}}
	return d
}

func TestHangHoleByClickUndoRedo(t *testing.T) {
	b := newBrowser(t)
	b.open()
	b.load(partJSON(t, plainPlate()), "plate.json")
	eval[any](b, `(plumb.fit(), plumb.setHoleDiameter(8), plumb.setTool("hole"), null)`)
	b.frames(3)
	before := b.state()
	if before.Hang != nil {
		t.Fatalf("plate has a hang hole before the click")
	}
	// Fit shows the whole plate; this point, left of the panel and below the tool bar, is on it.
	b.click(230, 330)
	b.waitFor(`plumb.state().hang != null`)
	after := b.state()
	at := geom.Pt(after.Hang.At.X, after.Hang.At.Y)
	if !plainPlate().Outline.Contains(at) {
		t.Fatalf("hole at %v is off the plate", at)
	}
	// The reference: the same hang computed natively from the part the app saved.
	want, err := sketch.HangFrom(b.savedPart(), at, after.Hang.Hole, sketch.HangOptions{})
	if err != nil {
		t.Fatal(err)
	}
	if !near(after.Hang.AngleDeg, want.AngleDeg, 1e-9, 1) {
		t.Errorf("hang angle %.12g°, natively %.12g°", after.Hang.AngleDeg, want.AngleDeg)
	}
	if after.Hang.Hole != 8 {
		t.Errorf("hole diameter %g, want the 8 set", after.Hang.Hole)
	}

	// Undo with the panel's button, redo through the bridge.
	b.do(chromedp.Click(chromedp.CSS(`[data-action="undo"]`)))
	b.frames(2)
	if s := b.state(); s.Hang != nil {
		t.Errorf("hole still there after Undo: %+v", *s.Hang)
	}
	eval[any](b, `(plumb.redo(), null)`)
	b.frames(2)
	if s := b.state(); s.Hang == nil || s.Hang.At != after.Hang.At {
		t.Errorf("Redo did not bring the hole back at %v", at)
	}
}

func TestAutosaveSurvivesReload(t *testing.T) {
	b := newBrowser(t)
	b.open()
	b.load(partJSON(t, plainPlate()), "plate.json")
	eval[any](b, `(plumb.setMaterial({material: "steel", thickness: "16 ga"}), null)`)
	want := b.waitAutosaved()
	wantMass := b.state().Mass
	b.do(chromedp.Reload())
	b.waitStarted()
	if got := eval[string](b, `plumb.saveJSON()`); got != want {
		t.Errorf("after a reload the part is\n%s\nwant\n%s", got, want)
	}
	if got := b.state().Mass; got != wantMass {
		t.Errorf("after a reload the mass is %g kg, want %g", got, wantMass)
	}

	// Opening the address with #demo shows the demo part; the part it replaced is one click away.
	b.do(chromedp.Navigate(built.url + "#demo"))
	b.waitFor(`plumb.state().file === "demo.json"`)
	if name := b.savedPart().Name; name != "Bakery blade sign" {
		t.Errorf("with #demo the part is %q, want the demo", name)
	}
	b.do(chromedp.Click(chromedp.CSS(`[data-action="restore-previous"]`)))
	b.waitFor(`document.getElementById("previous").hidden`)
	if got := eval[string](b, `plumb.saveJSON()`); got != want {
		t.Errorf("Bring it back gave\n%s\nwant\n%s", got, want)
	}
}

// thousandSides is a part with a 1,000-segment outline: a wavy ring of radius 200 ± 20 mm.
func thousandSides() *sketch.Document {
	pts := make([]geom.Point, 1000)
	for i := range pts {
		a := 2 * math.Pi * float64(i) / float64(len(pts))
		r := 200 + 20*math.Sin(7*a)
		pts[i] = geom.Pt(r*math.Cos(a), r*math.Sin(a))
	}
	d := sketch.NewDocument()
	d.Name = "thousand sides"
	d.Outline = geom.Region{Loops: []geom.Loop{geom.Polygon(pts...)}}
	return d
}

// TestRecomputeTime measures (and does not assert) how long the app takes to recompute a part with
// a 1,000-segment outline and a formula density (a polynomial, sin·cos, and the exp·sin density the
// kernel benchmarks use) after its parameter changes; the goal is under 6 ms. The first two changes
// after loading are logged on their own: the browser runs new WebAssembly code in a quick first form
// and compiles the code it finds hot again, in the background, so they take longer. The median is
// over the nine changes after them. The native counterpart, step for step, is sketch's
// BenchmarkRematerialThousandSides.
func TestRecomputeTime(t *testing.T) {
	b := newBrowser(t)
	b.open()
	d := thousandSides()
	// Both densities stay positive on the part (|x·y| < 220², so k·x·y < 5 for k ≤ 1e-4).
	for _, f := range []struct{ what, formula string }{
		{"polynomial", "8 + k*x*y"},
		{"not a polynomial", "8 + 2*sin(k*x)*cos(k*y)"},
		{"exp·sin", "exp(x/200)*(2 + sin(y/50)) + k"},
	} {
		d.Material = density.Spec{Formula: f.formula, Params: map[string]float64{"k": 1e-4}}
		b.load(partJSON(t, d), "thousand.json")
		var times []float64
		for i := range 11 {
			eval[any](b, fmt.Sprintf(`(plumb.setMaterial({formula: %q, unit: "kg/m2", params: {k: %g}}), null)`, f.formula, 1e-5*float64(i+5)))
			s := b.state()
			if s.Error != "" {
				t.Fatalf("%s: %s", f.formula, s.Error)
			}
			times = append(times, s.RecomputeMS)
		}
		first, times := times[:2], times[2:]
		slices.Sort(times)
		t.Logf("recompute, 1,000 segments, %s formula %q: median %.2f ms (min %.2f, max %.2f; goal < 6 ms); first two %.2f, %.2f ms",
			f.what, f.formula, times[len(times)/2], times[0], times[len(times)-1], first[0], first[1])
	}
}

func TestSaveExportAndReportDownload(t *testing.T) {
	b := newBrowser(t)
	b.open()
	dir := t.TempDir()
	_, err := chromedp.CallBrowser(b.ctx, cdpbrowser.SetDownloadBehavior, cdpbrowser.SetDownloadBehaviorParams{
		Behavior:         cdpbrowser.SetDownloadBehaviorBehaviorAllow,
		BrowserContextID: chromedp.FromContext(b.ctx).BrowserContextID,
		DownloadPath:     dir,
	})
	if err != nil {
		t.Fatal(err)
	}
	for _, c := range []struct{ action, file, bridge string }{
		{"save", "Bakery-blade-sign.json", "plumb.saveJSON()"},
		{"svg", "Bakery-blade-sign.svg", "plumb.exportSVG()"},
		{"report", "Bakery-blade-sign-report.txt", "plumb.report()"},
	} {
		got, err := b.downloadBy(c.action, filepath.Join(dir, c.file))
		if err != nil {
			t.Error(err)
			continue
		}
		if want := eval[string](b, c.bridge); string(got) != want || want == "" {
			t.Errorf("%s: %s holds %d bytes, %s gives %d", c.action, c.file, len(got), c.bridge, len(want))
		}
	}

	// The drilling template on the paper chosen, which the page remembers. A PDF file begins with
	// "%PDF-" (ISO 32000-1:2008, §7.5.2); a page box is given in points, 1/72 in (§8.3.2.3), so ANSI
	// letter, 8.5 × 11 in, is 612 × 792 pt, upright or turned.
	eval[any](b, `(() => {
		const p = document.getElementById("paper");
		p.value = "letter";
		p.dispatchEvent(new Event("change"));
		return null;
	})()`)
	if got := eval[string](b, `localStorage.getItem("plumb.paper") || ""`); got != "letter" {
		t.Errorf("paper choice stored as %q, want letter", got)
	}
	pdf, err := b.downloadBy("template", filepath.Join(dir, "Bakery-blade-sign-template.pdf"))
	if err != nil {
		t.Fatal(err)
	}
	if !bytes.HasPrefix(pdf, []byte("%PDF-")) {
		t.Errorf("template starts %q, want %%PDF-", pdf[:min(len(pdf), 8)])
	}
	// Plausible: more than the page drawing alone, less than the whole page with the app.
	if len(pdf) < 5_000 || len(pdf) > 5_000_000 {
		t.Errorf("template is %d bytes, want between 5 kB and 5 MB", len(pdf))
	}
	if !bytes.Contains(pdf, []byte("/MediaBox [0 0 612.00 792.00]")) && !bytes.Contains(pdf, []byte("/MediaBox [0 0 792.00 612.00]")) {
		t.Errorf("template has no letter-size page box")
	}
	t.Logf("drilling template on letter: %d bytes", len(pdf))

	// A part without a hole gets the suggested level-hang hole.
	b.load(partJSON(t, plainPlate()), "plate.json")
	if got := eval[string](b, `(() => { const r = plumb.templatePDF("A4"); return r instanceof Uint8Array ? "" : r.error; })()`); got != "" {
		t.Errorf("templatePDF of a plate without a hole: %s", got)
	}
	// A part that cannot be analysed has no template; the bridge says why.
	if msg := eval[string](b, `(plumb.newPart(), plumb.templatePDF("A4").error || "")`); msg == "" {
		t.Errorf("templatePDF of an empty part gave no error")
	}
}

// downloadBy clicks the panel button of the action and returns the file it downloads to path.
func (b *browser) downloadBy(action, path string) ([]byte, error) {
	b.t.Helper()
	b.do(chromedp.Click(chromedp.CSS(fmt.Sprintf(`[data-action=%q]`, action))))
	var (
		got []byte
		err error
	)
	for deadline := time.Now().Add(15 * time.Second); time.Now().Before(deadline); time.Sleep(100 * time.Millisecond) {
		if got, err = os.ReadFile(path); err == nil {
			return got, nil
		}
	}
	return nil, fmt.Errorf("%s: no download %s: %v", action, filepath.Base(path), err)
}
