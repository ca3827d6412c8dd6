package main

import (
	"context"
	"errors"
	"fmt"
	"io"
	"net"
	"net/http"
	"os"
	"os/signal"
	"strconv"
	"syscall"
	"time"

	"plumb/web/page"
)

const serveAbout = `Builds the browser app (as plumb build does) and serves it on this computer only (127.0.0.1), then
prints the address to open; it opens with the demo part. Plumb never connects anywhere: the page works the
same saved to disk. Ctrl-C stops the server.`

func runServe(args []string, stdout, stderr io.Writer) int {
	fs := newFlags("serve", "plumb serve [--port N]", serveAbout, stderr)
	port := fs.Int("port", 8080, "TCP `port` to listen on at 127.0.0.1 (0 picks a free one)")
	operands, err := parseArgs(fs, args)
	if err != nil {
		return usageStatus(err)
	}
	if len(operands) > 0 {
		return usageError(stderr, "serve", "unexpected argument %q", operands[0])
	}
	if *port < 0 || *port > 65535 {
		return usageError(stderr, "serve", "--port %d: not a TCP port", *port)
	}
	fmt.Fprintln(stderr, "plumb serve: building the app…")
	html, err := buildPage()
	if err != nil {
		fmt.Fprintf(stderr, "plumb serve: %v\n", err)
		return exitFailed
	}
	ln, err := listen(*port)
	if err != nil {
		fmt.Fprintf(stderr, "plumb serve: %v\n", err)
		return exitFailed
	}
	ctx, stop := signal.NotifyContext(context.Background(), os.Interrupt)
	defer stop()
	srv := &http.Server{Handler: pageHandler(html), ReadHeaderTimeout: 10 * time.Second}
	go func() {
		<-ctx.Done()
		shutdown, cancel := context.WithTimeout(context.Background(), 5*time.Second)
		defer cancel()
		srv.Shutdown(shutdown)
	}()
	fmt.Fprintf(stdout, "Plumb (%s) is at http://%s/#demo\n", sizeText(len(html)), ln.Addr())
	if err := srv.Serve(ln); !errors.Is(err, http.ErrServerClosed) {
		fmt.Fprintf(stderr, "plumb serve: %v\n", err)
		return exitFailed
	}
	return exitOK
}

// listen opens the TCP port on 127.0.0.1. When another program has it, the error suggests a port near
// it that is free now, and --port 0, which lets the system choose.
func listen(port int) (net.Listener, error) {
	ln, err := net.Listen("tcp", net.JoinHostPort("127.0.0.1", strconv.Itoa(port)))
	if err == nil || !errors.Is(err, syscall.EADDRINUSE) {
		return ln, err
	}
	msg := fmt.Sprintf("port %d on 127.0.0.1 is in use by another program", port)
	for p := port + 1; p <= min(port+20, 65535) && port > 0; p++ {
		if l, err := net.Listen("tcp", net.JoinHostPort("127.0.0.1", strconv.Itoa(p))); err == nil {
			l.Close()
			return nil, fmt.Errorf("%s; try --port %d, free now, or --port 0 for any free port", msg, p)
		}
	}
	return nil, fmt.Errorf("%s; try --port 0 for any free port", msg)
}

// pageHandler serves the page at / and nothing else, with the page's own Content-Security-Policy.
func pageHandler(html []byte) http.Handler {
	return http.HandlerFunc(func(w http.ResponseWriter, r *http.Request) {
		if r.URL.Path != "/" {
			http.NotFound(w, r)
			return
		}
		if r.Method != http.MethodGet && r.Method != http.MethodHead {
			w.Header().Set("Allow", "GET, HEAD")
			http.Error(w, "method not allowed", http.StatusMethodNotAllowed)
			return
		}
		h := w.Header()
		h.Set("Content-Type", "text/html; charset="+page.Charset)
		h.Set("Content-Security-Policy", page.CSP)
		h.Set("Cache-Control", "no-store")
		h.Set("X-Content-Type-Options", "nosniff")
		w.Write(html)
	})
}
