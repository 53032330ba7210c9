/** Injection token of the DigestSettings read at start. */
export const DIGEST_SETTINGS = Symbol('DIGEST_SETTINGS');

/** The pg-boss queue of the scheduled digest. */
export const DIGEST_QUEUE = 'mail-digest';
