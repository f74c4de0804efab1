#!/usr/bin/env node
// Launcher: runs the TypeScript CLI through tsx, so no compile step is needed.
import { register } from 'tsx/esm/api';

register();
await import('../generator/cli/main.ts');
