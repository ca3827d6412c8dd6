package page

import (
	"bytes"
	"math/rand/v2"
	"slices"
	"strings"
	"testing"
)

func TestRenderKeepsDemoInsideItsScript(t *testing.T) {
	demo := []byte(`{"name": "</script><script>alert(1)</script>"}`)
	html, err := Render(Assets{WasmExec: []byte("globalThis.Go = class {};"), Module: []byte{1, 2, 3}, Demo: demo})
	if err != nil {
		t.Fatal(err)
	}
	if n := strings.Count(strings.ToLower(string(html)), "</script"); n != 7 {
		t.Errorf("page has %d script end tags, want 7 (loader, module piece and its feed, end, data, runtime, panel)", n)
	}
	if !bytes.Contains(html, []byte(`window.PLUMB_DEMO = "{\"name\": \"\u003c/script\u003e`)) {
		t.Errorf("demo part not embedded as an escaped string")
	}
	// 01 02 03 as its own bytes, the escape byte 01 escaped as 01 41.
	if !bytes.Contains(html, []byte("<script type=\"application/octet-stream\">\x01\x41\x02\x03</script><script>plumbStart.feed()</script>")) {
		t.Errorf("module not embedded as its own bytes")
	}
	if i := bytes.IndexFunc(bytes.ReplaceAll(html, []byte("\x01\x41\x02\x03"), nil), func(r rune) bool { return r >= 0x80 }); i >= 0 {
		t.Errorf("page has a character outside ASCII at byte %d, besides the module", i)
	}
	if !bytes.Contains(html, []byte(`<meta charset="windows-1252">`)) {
		t.Errorf("page does not declare windows-1252")
	}
}

// TestRenderModuleInPieces checks that a module larger than a piece is stored in pieces, each ahead of
// its call to the loader, and comes back whole.
func TestRenderModuleInPieces(t *testing.T) {
	rng := rand.New(rand.NewPCG(5, 6))
	module := make([]byte, 2*modulePiece+1000)
	for i := range module {
		module[i] = byte(rng.Uint32())
	}
	html, err := Render(Assets{WasmExec: []byte("globalThis.Go = class {};"), Module: module, Demo: []byte("{}")})
	if err != nil {
		t.Fatal(err)
	}
	if n := bytes.Count(html, []byte("</script><script>plumbStart.feed()</script>")); n != 3 {
		t.Errorf("module in %d pieces, want 3", n)
	}
	got, err := Module(html)
	if err != nil {
		t.Fatal(err)
	}
	if !bytes.Equal(got, module) {
		t.Errorf("the page's module differs from the one rendered (%d bytes, want %d)", len(got), len(module))
	}
	// A page that lost a piece, or its module, says so.
	i := bytes.Index(html, []byte(`<script type="application/octet-stream">`))
	j := bytes.Index(html, []byte("plumbStart.feed()</script>")) + len("plumbStart.feed()</script>")
	for name, damaged := range map[string][]byte{
		"piece lost":  slices.Concat(html[:i], html[j:]),
		"module lost": bytes.ReplaceAll(html, []byte("plumbStart.end("), []byte("plumbStart.gone(")),
	} {
		if _, err := Module(damaged); err == nil {
			t.Errorf("%s: Module found no fault", name)
		}
	}
}

func TestRenderRefuses(t *testing.T) {
	tests := []struct {
		name string
		a    Assets
		want string
	}{
		{"runtime ends the script", Assets{WasmExec: []byte("x = '</SCRIPT>'"), Demo: []byte("{}")}, "wasm_exec.js"},
		{"demo not JSON", Assets{Demo: []byte("{")}, "demo part"},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			_, err := Render(tt.a)
			if err == nil || !strings.Contains(err.Error(), tt.want) {
				t.Errorf("Render: error %v, want one mentioning %q", err, tt.want)
			}
		})
	}
}
