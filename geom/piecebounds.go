package geom

// AppendPieceBounds appends to dst a rectangle holding each of b's pieces, by index, and returns
// the extended slice. When b has a spatial index (see Boundary) they are the index's boxes, found
// once for all queries: the pieces' bounds widened by coarsePad for rounding, and empty for a piece
// the queries skip (one with non-finite data, or an arc out of range). Otherwise they are the
// pieces' Bounds.
func (b Boundary) AppendPieceBounds(dst []Rect) []Rect {
	if x := b.queries(); x != nil {
		return append(dst, x.tree.boxes...)
	}
	for _, s := range b.Pieces {
		dst = append(dst, s.Bounds())
	}
	return dst
}
