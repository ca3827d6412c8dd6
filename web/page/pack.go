package page

import "fmt"

// The module is packed as text seven bits to a character, which costs 8/7 of its size where base64
// costs 4/3. The bytes are read as one big-endian bit stream in groups of seven bits (the last group
// padded with zero bits), and each group g becomes the character U+00gg: plain ASCII, one byte in
// UTF-8. Three values cannot stand for themselves inside a script element: NUL (which the HTML parser
// replaces), CR (which it turns into LF) and "<" (which could end the element). Such a group is written
// together with the group after it (zero past the end) as one character U+0100 + 128·i + next, where i
// is its index in unsafeGroups; that character takes two bytes in UTF-8 for fourteen bits, the same
// rate. The decoder needs the byte count to drop the padding bits.
var unsafeGroups = [3]byte{0x00, 0x0d, '<'}

// Pack7 returns data packed as text seven bits to a character.
func Pack7(data []byte) string {
	groups := make([]byte, 0, (len(data)*8+6)/7)
	acc, bits := 0, 0
	for _, b := range data {
		acc, bits = acc<<8|int(b), bits+8
		for bits >= 7 {
			bits -= 7
			groups = append(groups, byte(acc>>bits)&0x7f)
		}
		acc &= 1<<bits - 1
	}
	if bits > 0 {
		groups = append(groups, byte(acc<<(7-bits))&0x7f)
	}
	out := make([]rune, 0, len(groups))
	for i := 0; i < len(groups); i++ {
		u := unsafeIndex(groups[i])
		if u < 0 {
			out = append(out, rune(groups[i]))
			continue
		}
		next := byte(0)
		if i+1 < len(groups) {
			i++
			next = groups[i]
		}
		out = append(out, rune(0x100+128*u+int(next)))
	}
	return string(out)
}

func unsafeIndex(g byte) int {
	for i, u := range unsafeGroups {
		if g == u {
			return i
		}
	}
	return -1
}

// Unpack7 reverses Pack7 for n bytes of data.
func Unpack7(text string, n int) ([]byte, error) {
	out := make([]byte, 0, n)
	acc, bits := 0, 0
	put := func(g int) {
		acc, bits = acc<<7|g, bits+7
		if bits >= 8 {
			bits -= 8
			if len(out) < n {
				out = append(out, byte(acc>>bits))
			}
			acc &= 1<<bits - 1
		}
	}
	for i, r := range []rune(text) {
		switch {
		case r < 0x80:
			put(int(r))
		case r >= 0x100 && int(r) < 0x100+128*len(unsafeGroups):
			x := int(r) - 0x100
			put(int(unsafeGroups[x/128]))
			put(x % 128)
		default:
			return nil, fmt.Errorf("page: packed module: character %d is %U, not one Pack7 writes", i, r)
		}
	}
	if len(out) != n {
		return nil, fmt.Errorf("page: packed module holds %d bytes, want %d", len(out), n)
	}
	return out, nil
}
