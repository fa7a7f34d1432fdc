/**
 * Mulberry32, a small and fast seeded generator of uniform numbers in the open interval (0, 1)
 * (public domain, Tommy Ettinger): link-core reads no unseeded randomness, so a Monte-Carlo check
 * or a benchmark passes its own seed and draws the same numbers every run.
 *
 * @param seed any 32-bit integer
 * @returns a function giving the next draw in (0, 1), never 0 or 1 (so log(u) is finite)
 * @example const uniform = seededUniform(20261203); uniform(); // 0 < u < 1
 */
export function seededUniform(seed: number): () => number {
  let state = seed >>> 0;
  return () => {
    state = (state + 0x6d2b79f5) >>> 0;
    let t = state;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return (((t ^ (t >>> 14)) >>> 0) + 0.5) / 4294967296;
  };
}
