/**
 * Seeded pseudo-random numbers: the only source of randomness in patternfold.
 *
 * Generator: xoshiro128** (Blackman & Vigna 2021, ACM Trans. Math. Softw. 47(4), art. 36),
 * 32-bit state words so that it runs on plain JavaScript integers. Its 128-bit state is
 * filled by splitmix32-style mixing of the seed.
 *
 * Streams are derived, never shared: `deriveSeed(seed, 'cv', repeat)` gives the seed of an
 * independent stream for one named task, so results do not depend on the order in which
 * tasks run or on how many threads run them.
 */
export interface Rng {
  /** Uniform on [0, 1), 53 random bits. */
  next(): number;
  /** Uniform integer in [0, n). */
  int(n: number): number;
  /** Standard normal deviate (Box–Muller, one value per call). */
  normal(): number;
}

/** Mixes a 32-bit value (the finaliser of MurmurHash3, Appleby 2008). */
function mix32(h: number): number {
  h ^= h >>> 16;
  h = Math.imul(h, 0x85ebca6b);
  h ^= h >>> 13;
  h = Math.imul(h, 0xc2b2ae35);
  h ^= h >>> 16;
  return h >>> 0;
}

/** FNV-1a hash of a string, 32 bits. */
function hashString(s: string): number {
  let h = 0x811c9dc5;
  for (let i = 0; i < s.length; i++) {
    h ^= s.charCodeAt(i);
    h = Math.imul(h, 0x01000193);
  }
  return h >>> 0;
}

/**
 * Seed of the stream for one named task, e.g. `deriveSeed(study.seed, 'permutation', 17)`.
 * Deterministic in all its arguments; distinct labels give unrelated streams.
 */
export function deriveSeed(seed: number, ...labels: (string | number)[]): number {
  let h = mix32((seed >>> 0) ^ 0x9e3779b9) ^ mix32(Math.floor(seed / 2 ** 32) >>> 0);
  for (const label of labels) {
    const v = typeof label === 'number' ? mix32(label >>> 0) ^ mix32(Math.floor(label / 2 ** 32) + 0x632be5ab) : hashString(label);
    h = mix32(h ^ v ^ 0x7f4a7c15);
  }
  return h >>> 0;
}

/** Creates a xoshiro128** generator from a 32-bit (or larger integer) seed. */
export function createRng(seed: number): Rng {
  let x = seed >>> 0;
  const split = (): number => {
    x = (x + 0x9e3779b9) >>> 0;
    return mix32(x);
  };
  let a = split(), b = split(), c = split(), d = split();
  if ((a | b | c | d) === 0) a = 1;
  const nextU32 = (): number => {
    const result = Math.imul(rotl(Math.imul(b, 5), 7), 9) >>> 0;
    const t = b << 9;
    c ^= a;
    d ^= b;
    b ^= c;
    a ^= d;
    c ^= t;
    d = rotl(d, 11);
    return result;
  };
  const next = (): number => ((nextU32() >>> 5) * 67108864 + (nextU32() >>> 6)) / 9007199254740992;
  return {
    next,
    int: (n: number) => Math.floor(next() * n),
    normal: () => {
      let u = 0;
      while (u === 0) u = next();
      return Math.sqrt(-2 * Math.log(u)) * Math.cos(2 * Math.PI * next());
    },
  };
}

function rotl(v: number, k: number): number {
  return ((v << k) | (v >>> (32 - k))) >>> 0;
}

/** Fisher–Yates shuffle in place (Knuth 1997, TAOCP vol. 2, Algorithm 3.4.2P). */
export function shuffleInPlace<T extends { length: number; [i: number]: unknown }>(a: T, rng: Rng): T {
  for (let i = a.length - 1; i > 0; i--) {
    const j = rng.int(i + 1);
    const t = a[i];
    a[i] = a[j];
    a[j] = t;
  }
  return a;
}
