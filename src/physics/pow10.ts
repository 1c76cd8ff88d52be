// Powers of ten exact as doubles, shared by the CSV number reader, the link number codec and the unit scaling:
// multiplying or dividing by one of them rounds once, which a computed 10 ** k need not guarantee.

/** 10⁰ … 10²², each exact as a double (5²² < 2⁵³), parsed rather than computed so that no pow() rounding creeps in. */
export const POW10: readonly number[] = Array.from({ length: 23 }, (_, i) => Number(`1e${i}`));

/** The largest k with 10^k in {@link POW10}. */
export const MAX_EXACT_POW10 = 22;
