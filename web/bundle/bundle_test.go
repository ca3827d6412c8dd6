package bundle

import (
	"bytes"
	"compress/gzip"
	"context"
	"io"
	"testing"
	"time"

	"plumb/web/page"
)

// TestBuildHello packs the test fixture testdata/hello, the smallest program that speaks the page's
// bridge, and checks that the page carries a module that unpacks to WebAssembly and the runtime support
// that runs it. The browser tests in package web run the real app.
func TestBuildHello(t *testing.T) {
	ctx, cancel := context.WithTimeout(context.Background(), 5*time.Minute)
	defer cancel()
	html, err := Build(ctx, Options{Package: "plumb/web/bundle/testdata/hello"})
	if err != nil {
		t.Fatal(err)
	}
	t.Logf("page with the hello fixture: %d bytes", len(html))
	for _, want := range []string{
		`<meta http-equiv="Content-Security-Policy" content="` + page.CSP + `">`,
		"globalThis.Go = class", // wasm_exec.js
		"window.PLUMB_DEMO = ",
		"DecompressionStream",
	} {
		if !bytes.Contains(html, []byte(want)) {
			t.Errorf("page lacks %q", want)
		}
	}
	packed, err := page.Module(html)
	if err != nil {
		t.Fatalf("module does not unpack: %v", err)
	}
	zr, err := gzip.NewReader(bytes.NewReader(packed))
	if err != nil {
		t.Fatalf("module is not gzip: %v", err)
	}
	module, err := io.ReadAll(zr)
	if err != nil {
		t.Fatal(err)
	}
	// A WebAssembly binary starts with the magic "\0asm" and version 1 (WebAssembly Core Specification,
	// section 5.5.16, Modules).
	if !bytes.HasPrefix(module, []byte("\x00asm\x01\x00\x00\x00")) {
		t.Errorf("module starts with % x, want the WebAssembly magic and version 1", module[:min(8, len(module))])
	}
}

func TestBuildReportsCompileErrors(t *testing.T) {
	_, err := Build(context.Background(), Options{Package: "plumb/web/bundle/testdata/nosuchpackage"})
	if err == nil {
		t.Fatal("Build of a missing package succeeded")
	}
	if !bytes.Contains([]byte(err.Error()), []byte("nosuchpackage")) {
		t.Errorf("error %q does not name the package", err)
	}
}
