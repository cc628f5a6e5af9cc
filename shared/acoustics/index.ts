// One import for the client and the server: `import { computeAcoustics } from '@shared/acoustics'`.
export * from './materials';
export * from './room-acoustics';
