/**
 * Exact inch and foot lengths in metres (1 in = 0.0254 m, 1 ft = 0.3048 m,
 * exact by definition; domain.md §1), for the absolute caps of US rules.
 */
export const INCH = 0.0254;
export const FOOT = 0.3048;

/** 0.3 in = 7.62 mm: the masonry cap (TMS 402). */
export const IN_0_3 = 0.3 * INCH;
/** 1/4 in = 6.35 mm: the additive allowance for framing supporting glass (IBC §1604.3.7). */
export const IN_1_4 = 0.25 * INCH;
/** 3/4 in = 19.05 mm: the per-pane glazing cap (IBC §2403.3). */
export const IN_3_4 = 0.75 * INCH;
/** 13 ft 6 in = 4.1148 m: the glass-framing length threshold (IBC §1604.3.7). */
export const FT_13_6 = 13.5 * FOOT;
