import { readFileSync } from 'node:fs';

/** The tool's version, from package.json (one source of truth). */
export const TOOL_VERSION: string = (JSON.parse(readFileSync(new URL('../../package.json', import.meta.url), 'utf8')) as { version: string }).version;
