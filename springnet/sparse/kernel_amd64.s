//go:build amd64 && !purego

#include "textflag.h"

// func kern4x8avx(k int, a, b, c *float64, ldc int)
// C[i][j] -= Σ_t a[4t+i]·b[8t+j] for i < 4, j < 8; C row-major, ldc in elements.
TEXT ·kern4x8avx(SB), NOSPLIT, $0-40
	MOVQ k+0(FP), CX
	MOVQ a+8(FP), SI
	MOVQ b+16(FP), DI
	MOVQ c+24(FP), DX
	MOVQ ldc+32(FP), R8
	SHLQ $3, R8
	VXORPD Y0, Y0, Y0
	VXORPD Y1, Y1, Y1
	VXORPD Y2, Y2, Y2
	VXORPD Y3, Y3, Y3
	VXORPD Y4, Y4, Y4
	VXORPD Y5, Y5, Y5
	VXORPD Y6, Y6, Y6
	VXORPD Y7, Y7, Y7
	TESTQ CX, CX
	JEQ   store

loop:
	VMOVUPD      (DI), Y8
	VMOVUPD      32(DI), Y9
	VBROADCASTSD (SI), Y10
	VFMADD231PD  Y8, Y10, Y0
	VFMADD231PD  Y9, Y10, Y1
	VBROADCASTSD 8(SI), Y11
	VFMADD231PD  Y8, Y11, Y2
	VFMADD231PD  Y9, Y11, Y3
	VBROADCASTSD 16(SI), Y12
	VFMADD231PD  Y8, Y12, Y4
	VFMADD231PD  Y9, Y12, Y5
	VBROADCASTSD 24(SI), Y13
	VFMADD231PD  Y8, Y13, Y6
	VFMADD231PD  Y9, Y13, Y7
	ADDQ         $32, SI
	ADDQ         $64, DI
	DECQ         CX
	JNZ          loop

store:
	VMOVUPD (DX), Y8
	VSUBPD  Y0, Y8, Y8
	VMOVUPD Y8, (DX)
	VMOVUPD 32(DX), Y9
	VSUBPD  Y1, Y9, Y9
	VMOVUPD Y9, 32(DX)
	ADDQ    R8, DX
	VMOVUPD (DX), Y8
	VSUBPD  Y2, Y8, Y8
	VMOVUPD Y8, (DX)
	VMOVUPD 32(DX), Y9
	VSUBPD  Y3, Y9, Y9
	VMOVUPD Y9, 32(DX)
	ADDQ    R8, DX
	VMOVUPD (DX), Y8
	VSUBPD  Y4, Y8, Y8
	VMOVUPD Y8, (DX)
	VMOVUPD 32(DX), Y9
	VSUBPD  Y5, Y9, Y9
	VMOVUPD Y9, 32(DX)
	ADDQ    R8, DX
	VMOVUPD (DX), Y8
	VSUBPD  Y6, Y8, Y8
	VMOVUPD Y8, (DX)
	VMOVUPD 32(DX), Y9
	VSUBPD  Y7, Y9, Y9
	VMOVUPD Y9, 32(DX)
	VZEROUPPER
	RET

// func cpuid(eaxArg, ecxArg uint32) (eax, ebx, ecx, edx uint32)
TEXT ·cpuid(SB), NOSPLIT, $0-24
	MOVL eaxArg+0(FP), AX
	MOVL ecxArg+4(FP), CX
	CPUID
	MOVL AX, eax+8(FP)
	MOVL BX, ebx+12(FP)
	MOVL CX, ecx+16(FP)
	MOVL DX, edx+20(FP)
	RET

// func xgetbv() (eax, edx uint32)
TEXT ·xgetbv(SB), NOSPLIT, $0-8
	MOVL $0, CX
	XGETBV
	MOVL AX, eax+0(FP)
	MOVL DX, edx+4(FP)
	RET
