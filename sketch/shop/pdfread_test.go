package shop

import (
	"bytes"
	"compress/zlib"
	"io"
	"regexp"
	"strconv"
	"testing"
)

// A small reader for the PDF files the tests write: the cross-reference table gives each object's byte
// offset (ISO 32000-1:2008, §7.5.4), the page tree's Kids list the pages in order (§7.7.3.2), and each
// page's Contents stream is read by its /Length and inflated when its filter is FlateDecode (§7.4.4, a
// zlib stream per RFC 1950). It reads unencrypted files with a classic cross-reference table, as any
// conforming writer may produce, not just this package's own.

var (
	startxrefRe = regexp.MustCompile(`startxref\s+(\d+)\s+%%EOF\s*$`)
	xrefRe      = regexp.MustCompile(`^xref\s+0\s+(\d+)\s+`)
	entryRe     = regexp.MustCompile(`^(\d{10}) (\d{5}) ([nf])\s*`)
	kidsRe      = regexp.MustCompile(`/Type\s*/Pages\b(?s:.*?)/Kids\s*\[([^\]]*)\]`)
	refRe       = regexp.MustCompile(`(\d+) 0 R`)
	contentsRe  = regexp.MustCompile(`/Contents\s+(\d+) 0 R`)
	lengthRe    = regexp.MustCompile(`/Length\s+(\d+)(\s+0\s+R)?`)
	streamRe    = regexp.MustCompile(`stream\r?\n`)
)

// pdfFile is a PDF file with its object offsets.
type pdfFile struct {
	data    []byte
	offsets []int // by object number; 0 for free entries
}

func readPDF(t *testing.T, data []byte) *pdfFile {
	t.Helper()
	m := startxrefRe.FindSubmatch(data)
	if m == nil {
		t.Fatal("pdf: no startxref")
	}
	at, _ := strconv.Atoi(string(m[1]))
	rest := data[at:]
	h := xrefRe.FindSubmatch(rest)
	if h == nil {
		t.Fatal("pdf: no cross-reference table at startxref")
	}
	n, _ := strconv.Atoi(string(h[1]))
	rest = rest[len(h[0]):]
	f := &pdfFile{data: data, offsets: make([]int, n)}
	for i := range n {
		e := entryRe.FindSubmatch(rest)
		if e == nil {
			t.Fatalf("pdf: bad cross-reference entry %d", i)
		}
		if string(e[3]) == "n" {
			f.offsets[i], _ = strconv.Atoi(string(e[1]))
		}
		rest = rest[len(e[0]):]
	}
	return f
}

// object returns the text of object num from its header up to its end.
func (f *pdfFile) object(t *testing.T, num int) []byte {
	t.Helper()
	if num <= 0 || num >= len(f.offsets) || f.offsets[num] == 0 {
		t.Fatalf("pdf: no object %d", num)
	}
	body := f.data[f.offsets[num]:]
	if !bytes.HasPrefix(body, []byte(strconv.Itoa(num)+" 0 obj")) {
		t.Fatalf("pdf: object %d is not at its offset", num)
	}
	return body
}

// stream returns the decoded stream of object num.
func (f *pdfFile) stream(t *testing.T, num int) string {
	t.Helper()
	obj := f.object(t, num)
	loc := streamRe.FindIndex(obj)
	if loc == nil {
		t.Fatalf("pdf: object %d is not a stream", num)
	}
	dict := obj[:loc[0]]
	m := lengthRe.FindSubmatch(dict)
	if m == nil {
		t.Fatalf("pdf: stream %d has no /Length", num)
	}
	n, _ := strconv.Atoi(string(m[1]))
	if len(m[2]) > 0 { // an indirect length: the object holds the number
		ref := f.object(t, n)
		fields := bytes.Fields(ref)
		n, _ = strconv.Atoi(string(fields[3]))
	}
	raw := obj[loc[1] : loc[1]+n]
	if !bytes.Contains(dict, []byte("/FlateDecode")) {
		return string(raw)
	}
	r, err := zlib.NewReader(bytes.NewReader(raw))
	if err != nil {
		t.Fatalf("pdf: stream %d: %v", num, err)
	}
	out, err := io.ReadAll(r)
	if err != nil {
		t.Fatalf("pdf: stream %d: %v", num, err)
	}
	return string(out)
}

// pdfPages returns the content stream of every page of a PDF file, in page order.
func pdfPages(t *testing.T, data []byte) []string {
	t.Helper()
	f := readPDF(t, data)
	var kids [][]byte
	for num, off := range f.offsets {
		if off == 0 {
			continue
		}
		obj := f.object(t, num)
		if end := bytes.Index(obj, []byte("endobj")); end >= 0 {
			obj = obj[:end]
		}
		if m := kidsRe.FindSubmatch(obj); m != nil {
			kids = refRe.FindAll(m[1], -1)
		}
	}
	if kids == nil {
		t.Fatal("pdf: no page tree")
	}
	var pages []string
	for _, kid := range kids {
		num, _ := strconv.Atoi(string(refRe.FindSubmatch(kid)[1]))
		page := f.object(t, num)
		c := contentsRe.FindSubmatch(page[:bytes.Index(page, []byte("endobj"))])
		if c == nil {
			t.Fatalf("pdf: page object %d has no /Contents", num)
		}
		cn, _ := strconv.Atoi(string(c[1]))
		pages = append(pages, f.stream(t, cn))
	}
	return pages
}

// stroke is a straight line painted on its own: "x0 y0 m x1 y1 l S" in PDF user space.
type stroke struct{ x0, y0, x1, y1 float64 }

var strokeRe = regexp.MustCompile(`(?m)^(-?[\d.]+) (-?[\d.]+) m\s+(-?[\d.]+) (-?[\d.]+) l S$`)

func strokes(content string) []stroke {
	var out []stroke
	for _, m := range strokeRe.FindAllStringSubmatch(content, -1) {
		var v [4]float64
		for i := range v {
			v[i], _ = strconv.ParseFloat(m[i+1], 64)
		}
		out = append(out, stroke{v[0], v[1], v[2], v[3]})
	}
	return out
}

// crosses returns the centres of the crosses in a page: a horizontal and a vertical stroke sharing
// their midpoints (to 0.01 pt, the writer's rounding).
func crosses(content string) [][2]float64 {
	var h, v []stroke
	for _, s := range strokes(content) {
		switch {
		case s.y0 == s.y1 && s.x0 != s.x1:
			h = append(h, s)
		case s.x0 == s.x1 && s.y0 != s.y1:
			v = append(v, s)
		}
	}
	var out [][2]float64
	for _, a := range h {
		for _, b := range v {
			ax, ay := (a.x0+a.x1)/2, a.y0
			bx, by := b.x0, (b.y0+b.y1)/2
			if abs(ax-bx) <= 0.01 && abs(ay-by) <= 0.01 {
				out = append(out, [2]float64{bx, ay})
			}
		}
	}
	return out
}

// rectWidths returns the widths of the rectangles ("x y w h re") in a page.
func rectWidths(content string) []float64 {
	var out []float64
	for _, m := range rectRe.FindAllStringSubmatch(content, -1) {
		w, _ := strconv.ParseFloat(m[1], 64)
		out = append(out, w)
	}
	return out
}

var rectRe = regexp.MustCompile(`-?[\d.]+ -?[\d.]+ (-?[\d.]+) -?[\d.]+ re`)

func abs(x float64) float64 {
	if x < 0 {
		return -x
	}
	return x
}
