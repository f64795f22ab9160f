export { env, databaseUrl, devMailEnabled, type ServerEnv } from './env';
