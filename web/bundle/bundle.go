// Package bundle builds Plumb's browser app into one self-contained HTML file: it compiles the app for
// WebAssembly with the go command, compresses the module, and packs it with the Go runtime's JavaScript
// support, the page, the panel and the demo part (see package page). The file opens from disk (file://)
// with no server and no network.
package bundle

import (
	"bytes"
	"compress/gzip"
	"context"
	"fmt"
	"os"
	"os/exec"
	"path/filepath"
	"strings"

	"plumb/web/demo"
	"plumb/web/page"
)

// AppPackage is the import path of the browser app.
const AppPackage = "plumb/web/app"

// Options control Build.
type Options struct {
	// Package is the import path of the main package to compile; "" means AppPackage.
	Package string
	// Dir is a directory inside the plumb module to run the go command in; "" means the current directory.
	Dir string
}

// Build compiles the app for GOOS=js GOARCH=wasm with -trimpath -ldflags="-s -w" and returns the page.
// It needs the go command on PATH and the module's source.
func Build(ctx context.Context, opt Options) ([]byte, error) {
	pkg := opt.Package
	if pkg == "" {
		pkg = AppPackage
	}
	module, err := compile(ctx, opt.Dir, pkg)
	if err != nil {
		return nil, err
	}
	wasmExec, err := wasmExecJS(ctx, opt.Dir)
	if err != nil {
		return nil, err
	}
	var packed bytes.Buffer
	zw, err := gzip.NewWriterLevel(&packed, gzip.BestCompression)
	if err != nil {
		return nil, err
	}
	if _, err := zw.Write(module); err != nil {
		return nil, err
	}
	if err := zw.Close(); err != nil {
		return nil, err
	}
	return page.Render(page.Assets{
		WasmExec: wasmExec,
		Module:   packed.Bytes(),
		Demo:     demo.Part(),
		Presets:  Presets(),
	})
}

// compile builds pkg for js/wasm into a temporary file and returns the module's bytes.
func compile(ctx context.Context, dir, pkg string) ([]byte, error) {
	tmp, err := os.MkdirTemp("", "plumb-bundle-")
	if err != nil {
		return nil, err
	}
	defer os.RemoveAll(tmp)
	out := filepath.Join(tmp, "app.wasm")
	cmd := exec.CommandContext(ctx, "go", "build", "-trimpath", "-ldflags=-s -w", "-o", out, pkg)
	cmd.Dir = dir
	cmd.Env = append(os.Environ(), "GOOS=js", "GOARCH=wasm", "CGO_ENABLED=0")
	if msg, err := cmd.CombinedOutput(); err != nil {
		return nil, fmt.Errorf("bundle: compiling %s for js/wasm: %v\n%s", pkg, err, msg)
	}
	return os.ReadFile(out)
}

// wasmExecJS returns the toolchain's wasm_exec.js, which must match the compiler that built the module.
func wasmExecJS(ctx context.Context, dir string) ([]byte, error) {
	cmd := exec.CommandContext(ctx, "go", "env", "GOROOT")
	cmd.Dir = dir
	root, err := cmd.Output()
	if err != nil {
		return nil, fmt.Errorf("bundle: asking the go command for GOROOT: %v", err)
	}
	goroot := strings.TrimSpace(string(root))
	js, err := os.ReadFile(filepath.Join(goroot, "lib", "wasm", "wasm_exec.js"))
	if err != nil {
		return nil, fmt.Errorf("bundle: the Go runtime's wasm_exec.js: %v", err)
	}
	return js, nil
}
