// Package page holds the browser page around Plumb's WebAssembly app: the HTML template, its style sheet
// and the panel script, and Render, which packs them with the compiled module into one self-contained,
// offline HTML file.
//
// The page needs nothing from the network. Its Content-Security-Policy (CSP) allows only the inline
// scripts and styles it carries, WebAssembly compilation, data: and blob: images, and a worker from a
// blob: URL (the loader's, which compiles the module); connect-src is 'none', so neither the page, its
// worker nor the app can open a connection.
package page

import (
	"bytes"
	_ "embed"
	"encoding/json"
	"fmt"
	"strconv"
	"text/template"
)

// CSP is the page's Content-Security-Policy.
const CSP = "default-src 'none'; script-src 'unsafe-inline' 'wasm-unsafe-eval'; style-src 'unsafe-inline'; " +
	"img-src data: blob:; worker-src blob:; connect-src 'none'; base-uri 'none'; form-action 'none'"

var (
	//go:embed page.html
	pageHTML string
	//go:embed panel.css
	panelCSS string
	//go:embed panel.js
	panelJS string
	//go:embed loader.js
	loaderJS string

	// The template's own text is kept to ASCII, like everything the page carries (see pack.go).
	pageTemplate = template.Must(template.New("page.html").Parse(asciiHTML(pageHTML)))
)

// Assets are what Render packs into the page.
type Assets struct {
	WasmExec []byte   // the Go runtime's JavaScript support (wasm_exec.js) of the toolchain that built Module
	Module   []byte   // the app's WebAssembly module, gzip-compressed
	Demo     []byte   // the demo part file, loaded when there is no autosaved part
	Presets  *Presets // the material and thickness choices offered in the panel; nil offers none
}

// Presets are the choices the panel offers while typing a material or thickness.
type Presets struct {
	Materials   []Material         `json:"materials"`
	Thicknesses []Thickness        `json:"thicknesses"`
	GaugeTables map[string][]Gauge `json:"gauge_tables"` // by gauge system key
}

// Material is one sheet material in the panel's list.
type Material struct {
	Key     string  `json:"key"`
	Name    string  `json:"name"`
	Density float64 `json:"density"` // kg/m³, or kg/m² per mm of thickness when Areal
	Areal   bool    `json:"areal,omitempty"`
	Gauges  string  `json:"gauges,omitempty"` // key of its gauge table in Presets.GaugeTables
}

// Thickness is a common sheet thickness, written the way a user would type it ("3 mm", "1/8 in").
type Thickness struct {
	Text string  `json:"text"`
	MM   float64 `json:"mm"`
	In   float64 `json:"in"`
}

// Gauge is one row of a gauge table.
type Gauge struct {
	Number int     `json:"n"`
	MM     float64 `json:"mm"`
	In     float64 `json:"in"`
}

// modulePiece is the size of the pieces the module is stored in, in bytes of its gzip form: the browser
// compiles each piece as soon as it has read it, while it reads the rest of the page (loader.js). A
// piece costs a few dozen bytes of markup and a call of the loader; at 64 KiB the compiler trails the
// reading of the page by a few milliseconds.
const modulePiece = 64 << 10

// Render returns the complete page, in windows-1252 (Charset). The module is stored as its gzip form's
// own bytes (PackBytes), in pieces of modulePiece bytes near the top of the page, which the browser
// inflates (DecompressionStream) and compiles as it reads them (loader.js); the demo part and presets
// become JavaScript values (window.PLUMB_DEMO, a string, and window.PLUMB_PRESETS).
func Render(a Assets) ([]byte, error) {
	if bytes.Contains(bytes.ToLower(a.WasmExec), []byte("</script")) {
		return nil, fmt.Errorf("page: wasm_exec.js contains </script and cannot be inlined")
	}
	if !json.Valid(a.Demo) {
		return nil, fmt.Errorf("page: the demo part is not valid JSON")
	}
	demo, err := json.Marshal(string(a.Demo)) // escapes <, > and & so it cannot end the script element
	if err != nil {
		return nil, err
	}
	presets, err := json.Marshal(a.Presets)
	if err != nil {
		return nil, err
	}
	cp1252JSON, err := json.Marshal(cp1252High)
	if err != nil {
		return nil, err
	}
	var pieces []string
	for rest := a.Module; len(rest) > 0; {
		n := min(len(rest), modulePiece)
		pieces = append(pieces, PackBytes(rest[:n]))
		rest = rest[n:]
	}
	var out bytes.Buffer
	err = pageTemplate.Execute(&out, map[string]any{
		"CSP":       CSP,
		"Charset":   Charset,
		"CSS":       asciiCSS(panelCSS),
		"JS":        asciiJS(panelJS),
		"WasmExec":  asciiJS(string(a.WasmExec)),
		"Module":    pieces,
		"Loader":    asciiJS(loaderJS),
		"ModuleLen": strconv.Itoa(len(a.Module)),
		"CP1252":    string(cp1252JSON),
		"Demo":      asciiJS(string(demo)),
		"Presets":   asciiJS(string(presets)),
	})
	if err != nil {
		return nil, err
	}
	return out.Bytes(), nil
}
