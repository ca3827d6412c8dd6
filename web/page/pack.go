package page

import (
	"fmt"
	"regexp"
	"strconv"
	"strings"
	"unicode/utf16"
)

// The page is written in windows-1252, the WHATWG encoding that also answers to the labels latin1 and
// iso-8859-1: one byte a character, so that the compressed module can be stored as its own bytes where
// base64 would cost a third more. A script element's text can hold every byte but three: NUL (the HTML
// parser replaces it), CR (it becomes LF) and "<" (it could end the element). Those, and the escape
// byte itself, are written as escapeByte followed by the byte plus 0x40, which costs 4/256 of the
// module on average. Everything else on the page is kept to ASCII (see asciiHTML, asciiJS, asciiCSS),
// so the encoding changes nothing else.

// Charset is the page's character encoding, for its meta element and a server's Content-Type.
const Charset = "windows-1252"

const escapeByte = 0x01

// PackBytes returns data as the text of a script element on the page.
func PackBytes(data []byte) string {
	var b strings.Builder
	b.Grow(len(data) + len(data)/50)
	for _, c := range data {
		switch c {
		case 0x00, '\r', '<', escapeByte:
			b.WriteByte(escapeByte)
			c += 0x40
		}
		b.WriteByte(c)
	}
	return b.String()
}

// UnpackBytes reverses PackBytes for n bytes of data, from the page's bytes; n < 0 takes any length.
func UnpackBytes(text string, n int) ([]byte, error) {
	out := make([]byte, 0, max(n, 0))
	for i := 0; i < len(text); i++ {
		c := text[i]
		switch {
		case c == 0x00 || c == '\r' || c == '<':
			return nil, fmt.Errorf("page: packed module: byte %d is %#x, which PackBytes escapes", i, c)
		case c == escapeByte:
			if i++; i == len(text) {
				return nil, fmt.Errorf("page: packed module ends in an escape")
			}
			c = text[i] - 0x40
		}
		out = append(out, c)
	}
	if n >= 0 && len(out) != n {
		return nil, fmt.Errorf("page: packed module holds %d bytes, want %d", len(out), n)
	}
	return out, nil
}

// cp1252High is what windows-1252 decodes the bytes 0x80 to 0x9F to (WHATWG Encoding Standard, index
// windows-1252; bytes 0xA0 to 0xFF decode to U+00A0 to U+00FF). The page script maps these characters
// back to their bytes.
var cp1252High = [32]rune{
	0x20AC, 0x0081, 0x201A, 0x0192, 0x201E, 0x2026, 0x2020, 0x2021, 0x02C6, 0x2030, 0x0160, 0x2039, 0x0152, 0x008D, 0x017D, 0x008F,
	0x0090, 0x2018, 0x2019, 0x201C, 0x201D, 0x2022, 0x2013, 0x2014, 0x02DC, 0x2122, 0x0161, 0x203A, 0x0153, 0x009D, 0x017E, 0x0178,
}

// asciiOnly replaces every character of s outside ASCII by esc(r).
func asciiOnly(s string, esc func(r rune) string) string {
	var b strings.Builder
	for _, r := range s {
		if r < 0x80 {
			b.WriteRune(r)
		} else {
			b.WriteString(esc(r))
		}
	}
	return b.String()
}

// asciiHTML writes HTML text and attribute values in ASCII: character references (HTML §13.1.4).
func asciiHTML(s string) string {
	return asciiOnly(s, func(r rune) string { return fmt.Sprintf("&#x%X;", r) })
}

// asciiJS writes JavaScript in ASCII: \uXXXX escapes, as UTF-16 surrogate pairs above U+FFFF (ECMA-262,
// §12.9.4). They mean the character in strings, templates and regular expressions, where the page's
// scripts have their non-ASCII text; in comments they are only text.
func asciiJS(s string) string {
	return asciiOnly(s, func(r rune) string {
		var b strings.Builder
		for _, u := range utf16.Encode([]rune{r}) {
			fmt.Fprintf(&b, `\u%04X`, u)
		}
		return b.String()
	})
}

// asciiCSS writes a style sheet in ASCII: escapes of six hex digits, which need no space after them
// (CSS Syntax Level 3, §4.3.7).
func asciiCSS(s string) string {
	return asciiOnly(s, func(r rune) string { return fmt.Sprintf(`\%06X`, r) })
}

// Module returns the gzipped module a page from Render carries: its pieces unpacked and joined, checked
// against the length the page states.
func Module(html []byte) ([]byte, error) {
	end := regexp.MustCompile(`<script>plumbStart\.end\((\d+)\)</script>`).FindSubmatch(html)
	if end == nil {
		return nil, fmt.Errorf("page: no module on the page")
	}
	// The pieces, as page.html writes them.
	pieceRE := regexp.MustCompile(`<script type="application/octet-stream">([^<]*)</script><script>plumbStart\.feed\(\)</script>`)
	var module []byte
	for _, m := range pieceRE.FindAllSubmatch(html, -1) {
		piece, err := UnpackBytes(string(m[1]), -1)
		if err != nil {
			return nil, err
		}
		module = append(module, piece...)
	}
	if n, _ := strconv.Atoi(string(end[1])); n != len(module) {
		return nil, fmt.Errorf("page: the module's pieces hold %d bytes, the page says %s", len(module), end[1])
	}
	return module, nil
}
