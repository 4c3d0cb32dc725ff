// Prints the demo sign-in lines once the server is up.
import { loadConfig } from '../server/config'
import { DEMO_ORGANISATION, DEMO_TEAM } from '../server/demo/demo-team'
import { loadEnvFile } from '../server/env-file'

loadEnvFile()
const config = loadConfig()
const lines = [
  '',
  `  Tauline is ready: http://${config.host}:${config.port}`,
  '',
  `  Demo team (${DEMO_ORGANISATION}), password: ${config.demoPassword}`,
  ...DEMO_TEAM.map((m) => `    ${m.role.padEnd(9)} ${m.email.padEnd(30)} ${m.displayName}`),
  '',
  '  Stop with Ctrl+C (the database keeps running; npm run stop stops it).',
  '',
]
process.stdout.write(lines.join('\n') + '\n')
