// Sets of shards as bitsets over the first index's shard list, sent as base64.

export type Bits = Uint8Array;

export const emptyBits = (size: number): Bits => new Uint8Array((size + 7) >> 3);

export function bitsOf(indices: Iterable<number>, size: number): Bits {
  const bits = emptyBits(size);
  for (const i of indices) bits[i >> 3] |= 1 << (i & 7);
  return bits;
}

export function encodeBits(bits: Bits): string {
  let s = '';
  for (const b of bits) s += String.fromCharCode(b);
  return btoa(s);
}

export function decodeBits(text: string, size: number): Bits {
  const raw = atob(text);
  const bits = emptyBits(size);
  for (let i = 0; i < Math.min(raw.length, bits.length); i++) bits[i] = raw.charCodeAt(i);
  return bits;
}

/** a ∪= b */
export function addBits(a: Bits, b: Bits) {
  for (let i = 0; i < a.length; i++) a[i] |= b[i];
}

/** a ∩ b, new */
export function bothBits(a: Bits, b: Bits): Bits {
  return a.map((x, i) => x & b[i]);
}

export const noBits = (a: Bits) => a.every((x) => x === 0);

export function indicesOf(bits: Bits): number[] {
  const out: number[] = [];
  bits.forEach((b, i) => {
    for (let j = 0; j < 8; j++) if (b & (1 << j)) out.push(i * 8 + j);
  });
  return out;
}
