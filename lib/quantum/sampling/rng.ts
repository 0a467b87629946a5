/**
 * Seeded pseudo-random numbers for shots.
 *
 * Generator: xoroshiro128+ from pure-rand (`xoroshiro128plus(seed)`, 128-bit state,
 * period 2^128 − 1); uniforms in [0, 1) with 53 random bits from two outputs
 * (pure-rand's `uniformFloat64`). Seeds are unsigned 32-bit integers. Independent
 * streams (one per measurement setting, one per sweep point) are made with the
 * generator's `jump()` (2^64 steps apart): stream s = the seed's generator jumped s + 1 times.
 * Every sampled figure is therefore a pure function of (request, seed).
 */
import { uniformFloat64 } from "pure-rand/distribution/uniformFloat64";
import { xoroshiro128plus } from "pure-rand/generator/xoroshiro128plus";
import type { JumpableRandomGenerator } from "pure-rand/types/JumpableRandomGenerator";
import { MAX_SEED } from "../estimate/limits";

export type Rng = JumpableRandomGenerator;

export function createRng(seed: number): Rng {
  return xoroshiro128plus(seed >>> 0);
}

/** Uniform in [0, 1) with 53 random bits. */
export function nextUniform(rng: Rng): number {
  return uniformFloat64(rng);
}

/** Hands out independent streams of one seed: the k-th call returns the generator jumped k + 1 times. */
export class StreamFactory {
  private readonly cursor: Rng;

  constructor(seed: number) {
    this.cursor = createRng(seed);
  }

  next(): Rng {
    this.cursor.jump();
    return this.cursor.clone();
  }
}

/** A fresh seed when the request gives none (stored with the run). */
export function chooseSeed(): number {
  return Math.floor(Math.random() * (MAX_SEED + 1)) >>> 0;
}
