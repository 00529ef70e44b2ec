import { readFileSync } from 'node:fs';

/** The version field of package.json, read once at start. */
export const appVersion: string = (
  JSON.parse(readFileSync(new URL('../package.json', import.meta.url), 'utf8')) as { version: string }
).version;
