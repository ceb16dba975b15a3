/**
 * Seeded pseudo-random numbers: xoshiro128** (32-bit state words), seeded through SplitMix64.
 *
 * Usage:
 *   import { createRandom } from '../analysis/synth/prng';
 *   const rng = createRandom(42);
 *   rng.nextUint32();      // integer in [0, 2^32)
 *   rng.nextFloat64();     // double in [0, 1) with 53 random bits
 *
 * Generator: xoshiro128** 1.1 (state s0..s3; output rotl(s1·5, 7)·9), from D. Blackman, S. Vigna,
 *   "Scrambled linear pseudorandom number generators", ACM Trans. Math. Softw. 47(4), 36 (2021).
 * Seeding: the 128-bit state is filled with two outputs of SplitMix64 started at the seed, as the
 *   authors recommend; SplitMix64 from G. L. Steele, D. Lea, C. H. Flood, "Fast splittable
 *   pseudorandom number generators", OOPSLA 2014. SplitMix64 runs on BigInt (two calls per seed only).
 * The state lives in a Uint32Array so hot loops (analysis/synth/gaussian.ts) can load it into locals.
 * Deterministic across platforms: only 32-bit integer operations (Math.imul, >>>).
 * Worked check: SplitMix64 from seed 0 gives 0xe220a8397b1dcdaf first (from memory; tests pin it).
 */

import { AnalysisInputError } from '../errors';

export interface Random {
  /** s0..s3 (shared with fast loops that step it themselves) */
  readonly state: Uint32Array;
  nextUint32(): number;
  nextFloat64(): number;
}

const MASK64 = (1n << 64n) - 1n;

/** SplitMix64: returns a generator of 64-bit BigInt outputs. */
export function splitMix64(seed: bigint): () => bigint {
  let x = seed & MASK64;
  return () => {
    x = (x + 0x9e3779b97f4a7c15n) & MASK64;
    let z = x;
    z = ((z ^ (z >> 30n)) * 0xbf58476d1ce4e5b9n) & MASK64;
    z = ((z ^ (z >> 27n)) * 0x94d049bb133111ebn) & MASK64;
    return z ^ (z >> 31n);
  };
}

/** The xoshiro128** state for a seed (never all zero). */
export function seedState(seed: number): Uint32Array {
  if (!Number.isSafeInteger(seed) || seed < 0) {
    throw new AnalysisInputError(`seed must be a non-negative safe integer, got ${seed}`);
  }
  const sm = splitMix64(BigInt(seed));
  const a = sm();
  const b = sm();
  const s = Uint32Array.of(
    Number(a & 0xffffffffn),
    Number(a >> 32n),
    Number(b & 0xffffffffn),
    Number(b >> 32n),
  );
  if ((s[0] | s[1] | s[2] | s[3]) === 0) s[0] = 1; // the all-zero state is the one forbidden state
  return s;
}

export function createRandom(seed: number): Random {
  const state = seedState(seed);
  function nextUint32(): number {
    let s0 = state[0];
    let s1 = state[1];
    let s2 = state[2];
    let s3 = state[3];
    // xoshiro128**: result = rotl(s1·5, 7)·9
    const m = Math.imul(s1, 5);
    const result = Math.imul((m << 7) | (m >>> 25), 9) >>> 0;
    const t = s1 << 9;
    s2 ^= s0;
    s3 ^= s1;
    s1 ^= s2;
    s0 ^= s3;
    s2 ^= t;
    s3 = (s3 << 11) | (s3 >>> 21);
    state[0] = s0;
    state[1] = s1;
    state[2] = s2;
    state[3] = s3;
    return result;
  }
  return {
    state,
    nextUint32,
    nextFloat64() {
      // 53 bits: 27 high bits of one output, 26 of the next
      const hi = nextUint32() >>> 5;
      const lo = nextUint32() >>> 6;
      return (hi * 67108864 + lo) / 9007199254740992;
    },
  };
}
