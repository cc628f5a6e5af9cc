// One import for the client and the server: `import { packagePairs } from '@shared/mic-package'`.
export * from './sources';
export * from './templates';
export * from './guidance';
export * from './calculators';
export * from './pairs';
