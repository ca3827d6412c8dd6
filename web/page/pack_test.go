package page

import (
	"bytes"
	"math/rand/v2"
	"strings"
	"testing"

	"golang.org/x/text/encoding/charmap"
)

func TestPackBytesRoundTrip(t *testing.T) {
	rng := rand.New(rand.NewPCG(1, 2))
	random := make([]byte, 10000)
	for i := range random {
		random[i] = byte(rng.Uint32())
	}
	tests := []struct {
		name string
		data []byte
	}{
		{"empty", nil},
		{"unsafe bytes and the escape", []byte{0x00, '\r', '<', 0x01, '/', 's'}},
		{"every byte", func() []byte {
			b := make([]byte, 256)
			for i := range b {
				b[i] = byte(i)
			}
			return b
		}()},
		{"random", random},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			text := PackBytes(tt.data)
			if i := strings.IndexAny(text, "\x00\r<"); i >= 0 {
				t.Errorf("packed text has %q at %d", text[i], i)
			}
			got, err := UnpackBytes(text, len(tt.data))
			if err != nil {
				t.Fatal(err)
			}
			if !bytes.Equal(got, tt.data) {
				t.Errorf("round trip gave % x, want % x", got[:min(len(got), 16)], tt.data[:min(len(tt.data), 16)])
			}
		})
	}
}

func FuzzPackBytes(f *testing.F) {
	f.Add([]byte("\x00asm\x01\x00\x00\x00</script>\r\n"))
	f.Fuzz(func(t *testing.T, data []byte) {
		for _, n := range []int{len(data), -1} { // the length given, and any length
			got, err := UnpackBytes(PackBytes(data), n)
			if err != nil || !bytes.Equal(got, data) {
				t.Fatalf("round trip of % x with n = %d: % x, %v", data, n, got, err)
			}
		}
	})
}

// TestCP1252High checks the table the page script decodes with against golang.org/x/text's windows-1252
// decoder, an independent implementation of the same WHATWG index; the five bytes that index leaves
// unassigned decode to the C1 control of the same value (WHATWG Encoding Standard, single-byte decoder).
func TestCP1252High(t *testing.T) {
	for i, want := range cp1252High {
		b := byte(0x80 + i)
		got := charmap.Windows1252.DecodeByte(b)
		if got == '\uFFFD' {
			got = rune(b)
		}
		if got != want {
			t.Errorf("byte %#x: table has %U, x/text decodes %U", b, want, got)
		}
	}
}

func TestASCIIEscapes(t *testing.T) {
	tests := []struct {
		name string
		f    func(string) string
		in   string
		want string
	}{
		{"html", asciiHTML, "Ø 8 mm · kg/m²", "&#xD8; 8 mm &#xB7; kg/m&#xB2;"},
		{"js", asciiJS, `"x · y" // ρ`, `"x \u00B7 y" // \u03C1`},
		{"js astral", asciiJS, "📐", `\uD83D\uDCD0`},
		{"css", asciiCSS, `content: "…";`, `content: "\002026";`},
	}
	for _, tt := range tests {
		if got := tt.f(tt.in); got != tt.want {
			t.Errorf("%s(%q) = %q, want %q", tt.name, tt.in, got, tt.want)
		}
	}
}
