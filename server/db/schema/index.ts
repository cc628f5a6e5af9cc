// Every domain's tables, one file each; drizzle-kit and the app read them from here.
export * from './users';
export * from './jobs';
export * from './profiles';
export * from './briefs';
export * from './messages';
export * from './rooms';
export * from './ledger';
export * from './payments';
export * from './disputes';
export * from './audit';
export * from './reviews';
export * from './deliveries';
