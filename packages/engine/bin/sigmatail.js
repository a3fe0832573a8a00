#!/usr/bin/env node
// Runs the CLI from TypeScript source through tsx, so no build step is needed inside the repo.
import { register } from 'tsx/esm/api';

register();
const { main } = await import('../src/cli/main.ts');
process.exitCode = await main(process.argv.slice(2));
