import { basename } from 'node:path'
import { parseArgs } from 'node:util'
import {
  IMPORT_ERRORS_LISTED,
  type LineListError,
  type LineListSummary,
} from '../../shared/schemas/catalogues'
import { storeLineList } from '../../server/catalogue/catalogue.service'
import {
  describeLineListError,
  scanLineList,
  type LineListScan,
} from '../../server/catalogue/import/scan-line-list'
import { loadConfig } from '../../server/config'
import { createSequelize } from '../../server/db'
import { loadEnvFile } from '../../server/env-file'
import { createMigrator } from '../../server/migrator'
import { initModels, User } from '../../server/models/index'
import { CliError, printJson, printTable } from './args'

export const catalogueHelp = `tauline catalogue inspect FILE [--json] | import FILE --name NAME [--merge-builtin] [--json]
  Line lists in the standard 160-character record layout (one record per line, blank lines skipped).

  inspect FILE             read and check FILE record by record, streaming (any size, no database), and
                           print its molecules and isotopologues with line counts, total intensity and
                           range, the spectral range, and the strongest band
  import FILE --name NAME  check FILE, then store it as an imported catalogue in ONE transaction in the
                           database of DATABASE_URL (or of the local cluster settings in .env); prints
                           the summary and the new catalogue id
    --description TEXT     what the catalogue is
    --merge-builtin        runs use the built-in lines of every molecule FILE lacks, plus all of FILE
    --owner EMAIL          the catalogue's owner (default: the first active administrator)
  --json                   print JSON instead of text

  A file with any bad record is refused whole: the first ${IMPORT_ERRORS_LISTED} problems are printed with their line
  number, columns and field, and the command exits with status 2 (as for every usage error).`

function formatIntensity(s: number): string {
  return s.toExponential(3)
}

function printSummary(file: string, s: LineListSummary): void {
  const w = (x: number) => x.toFixed(4)
  process.stdout.write(
    `${file}: ${s.lineCount.toLocaleString('en')} lines, ${w(s.minWavenumberCm)}–${w(s.maxWavenumberCm)} cm⁻¹${s.sortedByWavenumber ? '' : ' (not in wavenumber order)'}\n\n`,
  )
  const rows: (string | number)[][] = [
    ['molecule', 'isotopologue', 'lines', 'ΣS cm/molecule', 'from cm⁻¹', 'to cm⁻¹'],
  ]
  for (const m of s.molecules) {
    rows.push([
      m.molecule,
      'all',
      m.lineCount,
      formatIntensity(m.intensitySumCmPerMolecule),
      w(m.minWavenumberCm),
      w(m.maxWavenumberCm),
    ])
    for (const i of m.isotopologues) {
      rows.push([
        '',
        i.code ?? `#${i.isotopologueId}`,
        i.lineCount,
        formatIntensity(i.intensitySumCmPerMolecule),
        w(i.minWavenumberCm),
        w(i.maxWavenumberCm),
      ])
    }
  }
  printTable(rows)
  const b = s.strongestBand
  if (b) {
    process.stdout.write(
      `\nStrongest band: ${b.molecule} isotopologue ${b.isotopologueId}, ${b.upperGlobalQuanta || '(blank)'} ← ${b.lowerGlobalQuanta || '(blank)'}: ${b.lineCount} lines, ΣS ${formatIntensity(b.intensitySumCmPerMolecule)} cm/molecule, ${w(b.minWavenumberCm)}–${w(b.maxWavenumberCm)} cm⁻¹\n`,
    )
  }
  for (const warning of s.warnings) process.stdout.write(`Note: ${warning.message}\n`)
}

/** Prints the problems of a refused file and throws the CliError that exits with status 2. */
function refuse(file: string, scan: LineListScan, json: boolean): never {
  if (json)
    printJson({
      file,
      errors: scan.errors,
      errorCount: scan.errorCount,
      recordCount: scan.recordCount,
      stoppedEarly: scan.stoppedEarly,
    })
  else for (const e of scan.errors) process.stderr.write(`${file}: ${describeLineListError(e)}\n`)
  const more =
    scan.errorCount > scan.errors.length ? ` (the first ${scan.errors.length} shown)` : ''
  throw new CliError(
    `${file}: ${scan.errorCount} problem(s)${more}${scan.stoppedEarly ? '; reading stopped early' : ''}; nothing was stored`,
  )
}

async function checkedScan(file: string, json: boolean): Promise<LineListScan> {
  let scan: LineListScan
  try {
    scan = await scanLineList(file)
  } catch (err) {
    throw new CliError(`cannot read ${file}: ${(err as Error).message}`)
  }
  if (scan.errorCount > 0) refuse(file, scan, json)
  if (scan.summary.lineCount === 0) throw new CliError(`${file} holds no line records`)
  return scan
}

async function inspect(file: string, json: boolean): Promise<void> {
  const scan = await checkedScan(file, json)
  if (json)
    printJson({ file, fileSha256: scan.fileSha256, byteSize: scan.byteSize, summary: scan.summary })
  else printSummary(file, scan.summary)
}

async function importFile(
  file: string,
  options: {
    name?: string
    description?: string
    mergeBuiltin: boolean
    owner?: string
    json: boolean
  },
): Promise<void> {
  const name = options.name?.trim()
  if (!name) throw new CliError('--name is required for import')
  if (name.length > 120) throw new CliError('--name must be at most 120 characters')
  const scan = await checkedScan(file, options.json)
  loadEnvFile()
  const config = loadConfig()
  const sequelize = createSequelize(config.databaseUrl)
  initModels(sequelize)
  try {
    try {
      await sequelize.authenticate()
    } catch (err) {
      throw new CliError(
        `cannot reach the database (${(err as Error).message}); start it with npm run db:start or set DATABASE_URL`,
      )
    }
    if ((await createMigrator(sequelize).pending()).length > 0)
      throw new CliError('the database is not fully migrated; run npm run migrate first')
    const owner = options.owner
      ? await User.findOne({ where: { email: options.owner.trim().toLowerCase() } })
      : await User.findOne({ where: { role: 'admin', active: true }, order: [['id', 'ASC']] })
    if (!owner)
      throw new CliError(
        options.owner
          ? `no user with e-mail ${options.owner}`
          : 'no active administrator to own the catalogue; pass --owner EMAIL',
      )
    const id = await storeLineList({
      path: file,
      fileName: basename(file),
      owner: { id: owner.id, role: owner.role, name: owner.displayName },
      input: {
        name,
        description: options.description?.trim() ?? '',
        mergeWithBuiltIn: options.mergeBuiltin,
      },
      expectedFileSha256: scan.fileSha256,
    })
    if (options.json) {
      printJson({
        id,
        name,
        file,
        fileSha256: scan.fileSha256,
        byteSize: scan.byteSize,
        mergeWithBuiltIn: options.mergeBuiltin,
        owner: owner.email,
        summary: scan.summary,
      })
      return
    }
    printSummary(file, scan.summary)
    process.stdout.write(
      `\nStored as catalogue ${id} “${name}”, owned by ${owner.displayName}${options.mergeBuiltin ? ', merged with the built-in lines of the other molecules' : ''}.\n`,
    )
  } catch (err) {
    // The transaction rolled back: refused records and database errors leave nothing behind.
    const e = err as { code?: string; message: string; details?: { errors?: LineListError[] } }
    if (e.code === 'LINE_LIST_INVALID' || e.code === 'CONFLICT') {
      for (const x of e.details?.errors ?? [])
        process.stderr.write(`${file}: ${describeLineListError(x)}\n`)
      throw new CliError(`${file}: ${e.message}; nothing was stored`)
    }
    throw err
  } finally {
    await sequelize.close()
  }
}

export async function catalogueCommand(argv: string[]): Promise<void> {
  const { values, positionals } = parseArgs({
    args: argv,
    allowPositionals: true,
    options: {
      name: { type: 'string' },
      description: { type: 'string' },
      'merge-builtin': { type: 'boolean', default: false },
      owner: { type: 'string' },
      json: { type: 'boolean', default: false },
    },
  })
  const [action, file, ...extra] = positionals
  if (!file || extra.length > 0 || (action !== 'inspect' && action !== 'import')) {
    throw new CliError(
      `expected "catalogue inspect FILE" or "catalogue import FILE --name NAME"\n\n${catalogueHelp}`,
    )
  }
  if (action === 'inspect') return inspect(file, values.json!)
  return importFile(file, {
    name: values.name,
    description: values.description,
    mergeBuiltin: values['merge-builtin']!,
    owner: values.owner,
    json: values.json!,
  })
}
