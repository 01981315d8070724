// Sets of shards as bitsets over the first index's shard list. On the wire a set is the shorter of a
// list of shard numbers in base 36 ("3.1k") or "*" and the bitset in base64: most terms sit in one
// shard or a few, and a list of them is a few characters where a bitset over 170 shards is 28.

export type Bits = Uint8Array;

export const emptyBits = (size: number): Bits => new Uint8Array((size + 7) >> 3);

export function bitsOf(indices: Iterable<number>, size: number): Bits {
  const bits = emptyBits(size);
  for (const i of indices) bits[i >> 3] |= 1 << (i & 7);
  return bits;
}

function toBase64(bits: Bits): string {
  let s = '';
  for (const b of bits) s += String.fromCharCode(b);
  return btoa(s);
}

/** The set as text: a dot-separated list of base-36 shard numbers, or "*" and the base64 bitset if that is shorter. */
export function encodeShards(indices: Iterable<number>, size: number): string {
  const sorted = [...new Set(indices)].sort((a, b) => a - b);
  const list = sorted.map((i) => i.toString(36)).join('.');
  const bitset = `*${toBase64(bitsOf(sorted, size))}`;
  return list.length <= bitset.length ? list : bitset;
}

export function decodeShards(text: string, size: number): Bits {
  const bits = emptyBits(size);
  if (text.startsWith('*')) {
    const raw = atob(text.slice(1));
    for (let i = 0; i < Math.min(raw.length, bits.length); i++) bits[i] = raw.charCodeAt(i);
  } else if (text.length > 0) {
    for (const part of text.split('.')) {
      const i = parseInt(part, 36);
      if (i >= 0 && i < size) bits[i >> 3] |= 1 << (i & 7);
    }
  }
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
