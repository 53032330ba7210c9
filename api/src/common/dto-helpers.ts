import { Transform } from 'class-transformer';

/** Trims strings before validation, so "  L1 " and "L1" are the same level name. */
export const Trim = () => Transform(({ value }) => (typeof value === 'string' ? value.trim() : value));

/** Trims and lower-cases e-mail addresses. */
export const NormaliseEmail = () => Transform(({ value }) => (typeof value === 'string' ? value.trim().toLowerCase() : value));
