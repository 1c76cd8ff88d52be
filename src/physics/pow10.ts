// Powers of ten exact as doubles, shared by the CSV number reader, the link number codec, the unit scaling and the
// axis ticks: multiplying or dividing by one of them rounds once, which a computed 10 ** k need not guarantee.

/** The double nearest 10^k for any integer k, parsed rather than computed so that no pow() rounding creeps in. */
export function pow10Of(k: number): number {
  return Number(`1e${k}`);
}

/** 10⁰ … 10²², each exact as a double (5²² < 2⁵³). */
export const POW10: readonly number[] = Array.from({ length: 23 }, (_, i) => pow10Of(i));

/** The largest k with 10^k in {@link POW10}. */
export const MAX_EXACT_POW10 = 22;
