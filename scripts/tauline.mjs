#!/usr/bin/env node
// The `tauline` command (package.json "bin"): loads the TypeScript CLI through tsx.
import { register } from 'tsx/esm/api'

register()
await import('./cli/main.ts')
