#!/usr/bin/env node
// Entry point of the patternfold command. The source is TypeScript, run through tsx's loader
// so that no build step stands between `npm ci` and a working command.
import { register } from 'tsx/esm/api';

register();
const { main, installInterruptHandlers } = await import('../src/cli/main.ts');
installInterruptHandlers();
process.exitCode = await main(process.argv.slice(2));
