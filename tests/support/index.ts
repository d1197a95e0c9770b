export * from './database.ts';
export type { TestEnvironment, PostgresTestServer } from './environment.ts';
