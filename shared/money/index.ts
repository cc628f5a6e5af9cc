// The money module's public surface; pure code shared by client and server.
export * from './currency';
export * from './errors';
export * from './fees';
export * from './quote-total';
export * from './split';
