/** Injection token of the Knex instance; only `*.repository.ts` files inject it. */
export const KNEX = Symbol('KNEX');
