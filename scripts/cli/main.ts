// tauline — command-line access to the Tauline engine. See README "Command line".
import { CliError } from './args'
import { benchCommand, benchHelp } from './bench-command'
import { catalogueCommand, catalogueHelp } from './catalogue-command'
import { computeCommand, computeHelp } from './compute-command'
import { forcingCommand, forcingHelp } from './forcing-command'
import { planckCommand, planckHelp } from './planck-command'
import { runCommand, runHelp } from './run-command'
import { sweepCommand, sweepHelp } from './sweep-command'

const commands: Record<string, { run: (argv: string[]) => void | Promise<void>; help: string }> = {
  planck: { run: planckCommand, help: planckHelp },
  compute: { run: computeCommand, help: computeHelp },
  forcing: { run: forcingCommand, help: forcingHelp },
  sweep: { run: sweepCommand, help: sweepHelp },
  run: { run: runCommand, help: runHelp },
  catalogue: { run: catalogueCommand, help: catalogueHelp },
  bench: { run: benchCommand, help: benchHelp },
}

const usage = `Usage: tauline <command> [options]   (add --json for machine-readable output)

Commands:
${Object.values(commands)
  .map((c) => '  ' + c.help.split('\n')[0])
  .join('\n')}

tauline help <command> shows the details of one command.`

async function main(argv: string[]) {
  const [name, ...rest] = argv
  if (!name || name === '--help' || name === '-h') return void process.stdout.write(usage + '\n')
  if (name === 'help') {
    const c = commands[rest[0] ?? '']
    return void process.stdout.write((c ? c.help : usage) + '\n')
  }
  const command = commands[name]
  if (!command) throw new CliError(`unknown command "${name}"\n\n${usage}`)
  await command.run(rest)
}

// Output piped into a program that stops reading (`| head`) ends the command quietly.
process.stdout.on('error', (err: NodeJS.ErrnoException) => {
  if (err.code === 'EPIPE') process.exit(0)
  throw err
})

try {
  await main(process.argv.slice(2))
} catch (err) {
  if (err instanceof CliError || (err instanceof Error && (err.name === 'PhysicsError' || 'code' in err))) {
    process.stderr.write(`tauline: ${err.message}\n`)
    process.exit(2)
  }
  throw err
}
