#!/usr/bin/env node
// Command-line launcher: runs the TypeScript entry through tsx so no build step is needed.
import { register } from 'tsx/esm/api';

register();
await import(new URL('../main/cli/index.ts', import.meta.url).href);
