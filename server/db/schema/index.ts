// Every domain's tables, one file each; drizzle-kit and the app read them from here.
export * from './users';
export * from './jobs';
