package main

import (
	"bytes"
	"fmt"
	"net"
	"net/http"
	"net/http/httptest"
	"strings"
	"testing"

	"plumb/web/page"
)

func TestPageHandler(t *testing.T) {
	html := []byte("<!doctype html><title>Plumb</title>")
	h := pageHandler(html)
	tests := []struct {
		method, path string
		status       int
	}{
		{http.MethodGet, "/", http.StatusOK},
		{http.MethodHead, "/", http.StatusOK},
		{http.MethodGet, "/favicon.ico", http.StatusNotFound},
		{http.MethodGet, "/../etc/passwd", http.StatusNotFound},
		{http.MethodPost, "/", http.StatusMethodNotAllowed},
	}
	for _, tt := range tests {
		rec := httptest.NewRecorder()
		h.ServeHTTP(rec, httptest.NewRequest(tt.method, tt.path, nil))
		if rec.Code != tt.status {
			t.Errorf("%s %s: status %d, want %d", tt.method, tt.path, rec.Code, tt.status)
		}
	}
	rec := httptest.NewRecorder()
	h.ServeHTTP(rec, httptest.NewRequest(http.MethodGet, "/", nil))
	if !bytes.Equal(rec.Body.Bytes(), html) {
		t.Errorf("body %q, want the page", rec.Body.String())
	}
	if got := rec.Header().Get("Content-Security-Policy"); got != page.CSP {
		t.Errorf("CSP header %q, want %q", got, page.CSP)
	}
}

func TestBuildAndServeRefuseOperands(t *testing.T) {
	for _, name := range []string{"build", "serve"} {
		var stdout, stderr bytes.Buffer
		if code := run([]string{name, "extra"}, &stdout, &stderr); code != exitUsage {
			t.Errorf("plumb %s extra: exit %d, want %d", name, code, exitUsage)
		}
		if !strings.Contains(stderr.String(), `unexpected argument "extra"`) {
			t.Errorf("plumb %s extra: stderr %q does not name the argument", name, stderr.String())
		}
	}
}

func TestListenSuggestsAFreePort(t *testing.T) {
	busy, err := net.Listen("tcp", "127.0.0.1:0")
	if err != nil {
		t.Skipf("no TCP on 127.0.0.1: %v", err)
	}
	defer busy.Close()
	port := busy.Addr().(*net.TCPAddr).Port
	ln, err := listen(port)
	if err == nil {
		ln.Close()
		t.Fatalf("listen(%d) succeeded on a busy port", port)
	}
	for _, want := range []string{fmt.Sprintf("port %d", port), "in use", "--port 0"} {
		if !strings.Contains(err.Error(), want) {
			t.Errorf("error %q does not say %q", err, want)
		}
	}
	// The suggested port is free.
	var free int
	if _, scanErr := fmt.Sscanf(err.Error()[strings.Index(err.Error(), "try --port"):], "try --port %d", &free); scanErr == nil && free != 0 {
		ln, err := listen(free)
		if err != nil {
			t.Errorf("the suggested port %d: %v", free, err)
		} else {
			ln.Close()
		}
	}
}
