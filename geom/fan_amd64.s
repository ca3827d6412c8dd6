#include "textflag.h"

// func fanChainSSE2(ch *fanChain, p *Point, n, stride int, c Point)
//
// The loop of fanChain.addGeneric over the n points p, p + stride bytes, …, with x and y in the two
// lanes of one register: per point, Q = q − c,
// k = px·qy − py·qx, K = kp + k, (pK, pL) = P·K, (u, v) = (pK, pL) + Q·k, and the sums
// (x, y) += (pK, pL), (xx, yy) += P·(u, v), (xy₁, xy₂) += P·(v, u), a += k.
TEXT ·fanChainSSE2(SB), NOSPLIT, $0-48
	MOVQ ch+0(FP), DI
	MOVQ p+8(FP), SI
	MOVQ n+16(FP), CX
	MOVQ stride+24(FP), DX
	MOVSD c_X+32(FP), X0
	MOVHPD c_Y+40(FP), X0      // X0 = (cx, cy)
	MOVUPD 0(DI), X2           // (x, y)
	MOVUPD 16(DI), X3          // (xx, yy)
	MOVSD 32(DI), X12          // (xy, 0)
	MOVSD 40(DI), X13          // a
	MOVUPD 48(DI), X1          // P = (px, py)
	MOVSD 64(DI), X7
	UNPCKLPD X7, X7            // (kp, kp)

loop:
	MOVUPD (SI), X4
	SUBPD X0, X4               // Q = (qx, qy)
	MOVAPD X4, X5
	SHUFPD $1, X5, X5          // (qy, qx)
	MULPD X1, X5               // (px·qy, py·qx)
	MOVAPD X5, X6
	UNPCKHPD X6, X6            // (py·qx, py·qx)
	SUBSD X6, X5               // k in the low lane
	UNPCKLPD X5, X5            // (k, k)
	ADDSD X5, X13              // a += k
	MOVAPD X5, X8
	ADDPD X7, X8               // (K, K)
	MOVAPD X5, X7              // kp = k
	MULPD X1, X8               // (pK, pL)
	ADDPD X8, X2               // (x, y) += (pK, pL)
	MULPD X4, X5               // (qx·k, qy·k)
	ADDPD X8, X5               // (u, v)
	MOVAPD X5, X9
	MULPD X1, X9               // (px·u, py·v)
	ADDPD X9, X3               // (xx, yy) += …
	SHUFPD $1, X5, X5          // (v, u)
	MULPD X1, X5               // (px·v, py·u)
	ADDPD X5, X12              // (xy₁, xy₂) += …
	MOVAPD X4, X1              // P = Q
	ADDQ DX, SI
	DECQ CX
	JNZ loop

	MOVUPD X2, 0(DI)
	MOVUPD X3, 16(DI)
	MOVAPD X12, X6
	UNPCKHPD X6, X6
	ADDSD X6, X12
	MOVSD X12, 32(DI)
	MOVSD X13, 40(DI)
	MOVUPD X1, 48(DI)
	MOVSD X7, 64(DI)
	RET
