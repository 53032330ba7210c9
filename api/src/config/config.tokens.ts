/** Injection token of the typed AppConfig. */
export const APP_CONFIG = Symbol('APP_CONFIG');
