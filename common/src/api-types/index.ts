export * from './errors';
export * from './constraints';
export * from './auth';
export * from './projects';
export * from './imports';
export * from './flags';
export * from './members';
