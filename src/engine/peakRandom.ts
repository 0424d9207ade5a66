/**
 * Seeded pseudo-random numbers for the Monte Carlo reference (same seed → same ions, on every platform).
 *
 * Generator: xoshiro128** (D. Blackman, S. Vigna, "Scrambled linear pseudorandom number generators",
 * ACM Trans. Math. Softw. 47 (2021) 36), seeded through splitmix32 so that any 32-bit seed gives a
 * well-mixed non-zero state. All arithmetic is 32-bit integer (Math.imul, >>>), so results are exact
 * and identical in every JavaScript engine.
 */
import { InputRangeError } from './validate';
export interface SeededRandom {
  /** Uniform in [0, 1) with 53 random bits. */
  uniform(): number;
  /** Standard normal N(0, 1) (polar Box–Muller, Marsaglia 1964). */
  normal(): number;
}

function splitmix32(seed: number): () => number {
  let state = seed >>> 0;
  return () => {
    state = (state + 0x9e3779b9) >>> 0;
    let z = state;
    z = Math.imul(z ^ (z >>> 16), 0x85ebca6b) >>> 0;
    z = Math.imul(z ^ (z >>> 13), 0xc2b2ae35) >>> 0;
    return (z ^ (z >>> 16)) >>> 0;
  };
}

export function seededRandom(seed: number): SeededRandom {
  if (!Number.isInteger(seed)) throw new InputRangeError('seed', seed, 'an integer (any 32-bit value)');
  const mix = splitmix32(seed);
  let s0 = mix();
  let s1 = mix();
  let s2 = mix();
  let s3 = mix();
  if ((s0 | s1 | s2 | s3) === 0) s0 = 1;

  const next = (): number => {
    const result = Math.imul(rotl(Math.imul(s1, 5), 7), 9) >>> 0;
    const t = s1 << 9;
    s2 ^= s0;
    s3 ^= s1;
    s1 ^= s2;
    s0 ^= s3;
    s2 ^= t;
    s3 = rotl(s3, 11);
    return result;
  };

  let spareNormal: number | null = null;
  const uniform = (): number => {
    // 27 + 26 bits → a double in [0, 1) on the 2^-53 grid.
    const high = next() >>> 5;
    const low = next() >>> 6;
    return (high * 67108864 + low) / 9007199254740992;
  };
  const normal = (): number => {
    if (spareNormal !== null) {
      const value = spareNormal;
      spareNormal = null;
      return value;
    }
    for (;;) {
      const u = 2 * uniform() - 1;
      const v = 2 * uniform() - 1;
      const s = u * u + v * v;
      if (s > 0 && s < 1) {
        const factor = Math.sqrt((-2 * Math.log(s)) / s);
        spareNormal = v * factor;
        return u * factor;
      }
    }
  };
  return { uniform, normal };
}

function rotl(x: number, k: number): number {
  return ((x << k) | (x >>> (32 - k))) >>> 0;
}
