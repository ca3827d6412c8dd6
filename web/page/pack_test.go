package page

import (
	"bytes"
	"math/rand/v2"
	"strings"
	"testing"
)

func TestPack7RoundTrip(t *testing.T) {
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
		{"one byte", []byte{0xff}},
		{"zeros", make([]byte, 15)}, // every group is NUL, written in pairs
		{"ends on an unsafe group", []byte{0, 0, 0, 0, 0, 0, 0, 0}},
		{"less-than signs", bytes.Repeat([]byte{0x3c << 1, 0x3c << 2}, 50)},
		{"random", random},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			text := Pack7(tt.data)
			if i := strings.IndexAny(text, "\x00\r<"); i >= 0 {
				t.Errorf("packed text has %q at %d", text[i], i)
			}
			got, err := Unpack7(text, len(tt.data))
			if err != nil {
				t.Fatal(err)
			}
			if !bytes.Equal(got, tt.data) {
				t.Errorf("round trip gave % x, want % x", got[:min(len(got), 16)], tt.data[:min(len(tt.data), 16)])
			}
			// Seven bits a character, and two UTF-8 bytes for each character that carries fourteen.
			if max := (len(tt.data)*8+6)/7 + 1; len(text) > max {
				t.Errorf("%d bytes packed into %d bytes of UTF-8, want at most %d", len(tt.data), len(text), max)
			}
		})
	}
}

func FuzzPack7(f *testing.F) {
	f.Add([]byte("\x00asm\x01\x00\x00\x00"))
	f.Fuzz(func(t *testing.T, data []byte) {
		got, err := Unpack7(Pack7(data), len(data))
		if err != nil || !bytes.Equal(got, data) {
			t.Fatalf("round trip of % x: % x, %v", data, got, err)
		}
	})
}
