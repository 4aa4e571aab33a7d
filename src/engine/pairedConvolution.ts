/**
 * The discrete convolution out[d] = sum_{a <= d} x[a] w[d - a] (distributions.ts `convolveInto`)
 * with two days per instruction: a small WebAssembly module using its 128-bit lanes (f64x2, two
 * doubles side by side), written out below instruction by instruction.
 *
 * Lanes: for a block of eight days d..d+7 and each a in ascending order, the pair (d + 2j,
 * d + 2j + 1) gets x[a] x (w[d + 2j - a], w[d + 2j + 1 - a]), which is the weights read as two
 * consecutive doubles, so one load and one multiply-add pair serve two days. Each day's sum still
 * starts at 0 and adds x[a] w[d - a] in ascending a, one rounding per multiply and per add as in
 * the scalar loop, so the result is the same bit for bit (test/engine/postprocessing.test.ts).
 * The block's range of a covers every day's range; the terms a day does not have read the zeros
 * laid around the weights (eight before, eight after) and add x[a] x 0 = 0, which leaves any sum
 * of finite terms unchanged (a sum started at +0 never becomes -0), hence finite series only.
 *
 * Why: at one multiply and one add per term the scalar loop is at the arithmetic units' limit
 * (about one term per clock); two lanes per instruction halve the instructions. JavaScript has no
 * such instructions; WebAssembly's fixed-width SIMD has them (WebAssembly Core Specification 2.0,
 * W3C 2022, section "Vector instructions"). Where WebAssembly cannot be compiled (a content
 * security policy without 'wasm-unsafe-eval', an engine without SIMD) `pairedConvolution` returns
 * null and the caller keeps its scalar loop.
 */
import { instantiateWasm } from './wasm/instantiate.ts';

/** Unsigned LEB128, the binary format's integer encoding. */
function uleb(n: number): number[] {
  const out: number[] = [];
  do {
    let byte = n & 0x7f;
    n >>>= 7;
    if (n !== 0) byte |= 0x80;
    out.push(byte);
  } while (n !== 0);
  return out;
}

/** A section: id, byte length, contents. */
function section(id: number, contents: number[]): number[] {
  return [id, ...uleb(contents.length), ...contents];
}

/** "name" as a length-prefixed UTF-8 string (ASCII here). */
function name(text: string): number[] {
  return [...uleb(text.length), ...Array.from(text, (c) => c.charCodeAt(0))];
}

const I32 = 0x7f;
const V128 = 0x7b;
const op = {
  block: 0x02,
  loop: 0x03,
  end: 0x0b,
  br: 0x0c,
  brIf: 0x0d,
  select: 0x1b,
  get: 0x20,
  set: 0x21,
  i32Const: 0x41,
  i32LtS: 0x48,
  i32GtS: 0x4a,
  i32Add: 0x6a,
  i32Sub: 0x6b,
  i32Shl: 0x74,
  empty: 0x40,
} as const;
/** Vector instructions: prefix 0xfd, then the instruction number as LEB128. */
const simd = (code: number): number[] => [0xfd, ...uleb(code)];
const v128Load = (offset: number): number[] => [...simd(0x00), 3, ...uleb(offset)];
const v128Store = (offset: number): number[] => [...simd(0x0b), 3, ...uleb(offset)];
const load64Splat = [...simd(0x0a), 3, 0];
const v128Zero = [...simd(0x0c), ...new Array<number>(16).fill(0)];
const f64x2Add = simd(0xf0);
const f64x2Mul = simd(0xf2);

// Parameters: out, x, w (byte addresses: out[0], x[0], w[0]), days, K (weights used).
const [OUT, X, W, DAYS, K] = [0, 1, 2, 3, 4];
// Locals: d (block's first day), a, end (d + 8), xp (address of x[a]), wp (address of w[d - a]),
// xa (x[a] in both lanes), four sums (days d, d+1 | d+2, d+3 | d+4, d+5 | d+6, d+7).
const [D, A, END, XP, WP, XA, S0] = [5, 6, 7, 8, 9, 10, 11];
const get = (i: number): number[] => [op.get, i];
const set = (i: number): number[] => [op.set, i];
const i32 = (n: number): number[] => [op.i32Const, ...uleb(n)]; // small non-negative constants only (uleb = sleb below 64)

const body: number[] = [
  ...[2, 5, I32, 5, V128],
  ...i32(0), ...set(D),
  op.block, op.empty,
  op.loop, op.empty,
  // while (d < days)
  ...get(D), ...get(DAYS), op.i32LtS, 0x45 /* i32.eqz */, op.brIf, 1,
  ...[0, 1, 2, 3].flatMap((j) => [...v128Zero, ...set(S0 + j)]),
  // a = max(0, d - K + 1)
  ...get(D), ...get(K), op.i32Sub, ...i32(1), op.i32Add, ...set(A),
  ...get(A), ...i32(0), ...get(A), ...i32(0), op.i32GtS, op.select, ...set(A),
  ...get(D), ...i32(8), op.i32Add, ...set(END),
  // xp = x + 8 a; wp = w + 8 (d - a)
  ...get(X), ...get(A), ...i32(3), op.i32Shl, op.i32Add, ...set(XP),
  ...get(W), ...get(D), ...get(A), op.i32Sub, ...i32(3), op.i32Shl, op.i32Add, ...set(WP),
  op.loop, op.empty,
  ...get(XP), ...load64Splat, ...set(XA),
  ...[0, 1, 2, 3].flatMap((j) => [...get(S0 + j), ...get(XA), ...get(WP), ...v128Load(16 * j), ...f64x2Mul, ...f64x2Add, ...set(S0 + j)]),
  ...get(XP), ...i32(8), op.i32Add, ...set(XP),
  ...get(WP), ...i32(8), op.i32Sub, ...set(WP),
  ...get(A), ...i32(1), op.i32Add, ...set(A),
  ...get(A), ...get(END), op.i32LtS, op.brIf, 0,
  op.end,
  // out[d..d+7] = sums
  ...[0, 1, 2, 3].flatMap((j) => [...get(OUT), ...get(D), ...i32(3), op.i32Shl, op.i32Add, ...get(S0 + j), ...v128Store(16 * j)]),
  ...get(D), ...i32(8), op.i32Add, ...set(D),
  op.br, 0,
  op.end,
  op.end,
  op.end,
];

/** The module: one function `convolve(out, x, w, days, K)` and its memory (grown by the caller). */
const MODULE = new Uint8Array([
  ...[0x00, 0x61, 0x73, 0x6d, 0x01, 0x00, 0x00, 0x00],
  ...section(1, [1, 0x60, 5, I32, I32, I32, I32, I32, 0]),
  ...section(3, [1, 0]),
  ...section(5, [1, 0x00, 1]),
  ...section(7, [2, ...name('memory'), 0x02, 0, ...name('convolve'), 0x00, 0]),
  ...section(10, [1, ...uleb(body.length), ...body]),
]);

/** Zeros laid before and after the weights, and after the series: one block of days. */
const PAD = 8;

/**
 * `convolveInto` on the lanes: out[d] = sum_{a <= d} series[a] weights[d - a], d < series.length,
 * weights[0..used); false, and `out` untouched, when the series is not finite throughout.
 */
export type PairedConvolution = (out: Float64Array, series: Float64Array, weights: Float64Array, used: number) => boolean;

interface LinearMemory {
  readonly buffer: ArrayBuffer;
  grow(pages: number): number;
}

function instantiate(): PairedConvolution | null {
  const exports = instantiateWasm(MODULE);
  if (exports === null) return null;
  const memory = exports.memory as LinearMemory;
  const convolve = exports.convolve as (out: number, x: number, w: number, days: number, used: number) => void;
  let heap = new Float64Array(memory.buffer);
  return (out, series, weights, used) => {
    const days = series.length;
    const blocks = Math.ceil(days / PAD) * PAD;
    // Doubles: [PAD zeros | weights | PAD zeros] [series | zeros to the block end + PAD] [out by blocks]
    const w = PAD;
    const x = w + used + PAD;
    const o = x + blocks + PAD;
    if (o + blocks > heap.length) {
      memory.grow(Math.ceil(((o + blocks) * 8 - heap.byteLength) / 65536));
      heap = new Float64Array(memory.buffer);
    }
    // Element by element rather than through subarray views: no object per call.
    let finite = 0;
    for (let d = 0; d < days; d++) {
      const v = series[d];
      heap[x + d] = v;
      finite += v - v; // 0 for a finite v, NaN otherwise
    }
    if (finite !== 0) return false;
    heap.fill(0, 0, w);
    for (let k = 0; k < used; k++) heap[w + k] = weights[k];
    heap.fill(0, w + used, x);
    heap.fill(0, x + days, o);
    convolve(o * 8, x * 8, w * 8, days, used);
    for (let d = 0; d < days; d++) out[d] = heap[o + d];
    return true;
  };
}

/** The lane convolution, or null where WebAssembly with SIMD is not available; made on first use. */
let made: PairedConvolution | null | undefined;

export function pairedConvolution(): PairedConvolution | null {
  if (made === undefined) made = instantiate();
  return made;
}
