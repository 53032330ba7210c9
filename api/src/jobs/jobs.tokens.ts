/** Injection token of the JobSettings read at start. */
export const JOB_SETTINGS = Symbol('JOB_SETTINGS');
