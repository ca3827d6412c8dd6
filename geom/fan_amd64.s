//go:build amd64 && !purego

#include "go_asm.h"
#include "textflag.h"

// The loop body shared by both kernels: with X4 = q (absolute) on entry, X0 = (cx, cy), X1 = P the
// open vertex, X7 = (kp, kp), it computes Q = q − c, k = px·qy − py·qx, K = kp + k,
// (pK, pL) = P·K, (u, v) = (pK, pL) + Q·k, and adds (x, y) += (pK, pL) in X2, (xx, yy) += P·(u, v)
// in X3, (xy₁, xy₂) += P·(v, u) in X12 and a += k in X13; then P = Q and kp = k.
#define FANSTEP \
	SUBPD X0, X4 \
	MOVAPD X4, X5 \
	SHUFPD $1, X5, X5 \
	MULPD X1, X5 \
	MOVAPD X5, X6 \
	UNPCKHPD X6, X6 \
	SUBSD X6, X5 \
	UNPCKLPD X5, X5 \
	ADDSD X5, X13 \
	MOVAPD X5, X8 \
	ADDPD X7, X8 \
	MOVAPD X5, X7 \
	MULPD X1, X8 \
	ADDPD X8, X2 \
	MULPD X4, X5 \
	ADDPD X8, X5 \
	MOVAPD X5, X9 \
	MULPD X1, X9 \
	ADDPD X9, X3 \
	SHUFPD $1, X5, X5 \
	MULPD X1, X5 \
	ADDPD X5, X12 \
	MOVAPD X4, X1

// LOADCHAIN loads the chain at DI and c into the registers FANSTEP uses.
#define LOADCHAIN \
	MOVUPD 0(DI), X2 \
	MOVUPD 16(DI), X3 \
	MOVSD 32(DI), X12 \
	MOVSD 40(DI), X13 \
	MOVUPD 48(DI), X1 \
	MOVSD 64(DI), X7 \
	UNPCKLPD X7, X7

// STORECHAIN stores them back, adding the two halves of xy.
#define STORECHAIN \
	MOVUPD X2, 0(DI) \
	MOVUPD X3, 16(DI) \
	MOVAPD X12, X6 \
	UNPCKHPD X6, X6 \
	ADDSD X6, X12 \
	MOVSD X12, 32(DI) \
	MOVSD X13, 40(DI) \
	MOVUPD X1, 48(DI) \
	MOVSD X7, 64(DI)

// func fanChainSSE2(ch *fanChain, pts []Point, c Point)
//
// fanChain.addGeneric with x and y in the two lanes of one register. pts is not empty.
TEXT ·fanChainSSE2(SB), NOSPLIT, $0-48
	MOVQ ch+0(FP), DI
	MOVQ pts_base+8(FP), SI
	MOVQ pts_len+16(FP), CX
	MOVSD c_X+32(FP), X0
	MOVHPD c_Y+40(FP), X0
	LOADCHAIN

points:
	MOVUPD (SI), X4
	FANSTEP
	ADDQ $16, SI
	DECQ CX
	JNZ points

	STORECHAIN
	RET

// func fanLinesSSE2(ch *fanChain, s *Segment, n int, c Point) int
//
// fanChain.addLines: the chain goes on through the end point of s[0] and of each following segment
// while it is a line whose start has the bits of the end before (a stricter test than ==, which
// only ends the stretch sooner), at most n segments. It returns how many it took; n ≥ 1.
TEXT ·fanLinesSSE2(SB), NOSPLIT, $0-48
	MOVQ ch+0(FP), DI
	MOVQ s+8(FP), SI
	MOVQ n+16(FP), CX
	MOVSD c_X+24(FP), X0
	MOVHPD c_Y+32(FP), X0
	LOADCHAIN
	XORQ AX, AX
	JMP line

joined:
	CMPQ AX, CX
	JGE done
	MOVBQZX Segment_Kind(SI), R8
	CMPQ R8, $const_KindLine
	JNE done
	MOVQ Segment_P(SI), R8
	CMPQ R8, R10
	JNE done
	MOVQ (Segment_P+8)(SI), R8
	CMPQ R8, R11
	JNE done

line:
	MOVQ (Segment_P+16)(SI), R10
	MOVQ (Segment_P+24)(SI), R11
	MOVUPD (Segment_P+16)(SI), X4
	FANSTEP
	ADDQ $Segment__size, SI
	INCQ AX
	JMP joined

done:
	STORECHAIN
	MOVQ AX, ret+40(FP)
	RET
