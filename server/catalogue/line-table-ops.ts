/**
 * Whole-table operations on line tables loaded from stored blocks: sorting by wavenumber and
 * merging an import with the built-in lines of the molecules it lacks.
 */
import { createLineTable, LINE_FLOAT_COLUMNS, type LineTable } from '../../shared/physics/spectroscopy/line'

const INT_KEYS = ['moleculeId', 'isotopologueId', 'sourceIndex'] as const

function copyRow(from: LineTable, i: number, to: LineTable, k: number): void {
  for (const key of LINE_FLOAT_COLUMNS) to[key][k] = from[key][i]
  for (const key of INT_KEYS) to[key][k] = from[key][i]
}

/** True when wavenumbers never decrease. */
export function isSortedByWavenumber(table: LineTable): boolean {
  const nu = table.wavenumberCm
  for (let i = 1; i < table.length; i++) if (nu[i] < nu[i - 1]) return false
  return true
}

/** The table sorted by ascending wavenumber (stable: equal wavenumbers keep their order); the same table when already sorted. */
export function sortedByWavenumber(table: LineTable): LineTable {
  if (isSortedByWavenumber(table)) return table
  const nu = table.wavenumberCm
  const order = new Uint32Array(table.length)
  for (let i = 0; i < order.length; i++) order[i] = i
  order.sort((a, b) => nu[a] - nu[b] || a - b)
  const out = createLineTable(table.length)
  for (let k = 0; k < order.length; k++) copyRow(table, order[k], out, k)
  return out
}

/** Molecule numbers present in a table. */
export function moleculeIdsOf(table: LineTable): Set<number> {
  const ids = new Set<number>()
  for (let i = 0; i < table.length; i++) ids.add(table.moleculeId[i])
  return ids
}

/**
 * Built-in lines of every molecule the import does not contain, plus all imported lines, sorted by
 * wavenumber (both inputs must be sorted; on equal wavenumbers built-in lines come first).
 * sourceIndex of the result: built-in rows keep theirs, imported rows get builtIn.length + their own.
 */
export function mergeWithBuiltIn(builtIn: LineTable, imported: LineTable): LineTable {
  const importedMolecules = moleculeIdsOf(imported)
  let kept = 0
  for (let i = 0; i < builtIn.length; i++) if (!importedMolecules.has(builtIn.moleculeId[i])) kept++
  const out = createLineTable(kept + imported.length)
  let i = 0
  let j = 0
  let k = 0
  const nextBuiltIn = () => {
    while (i < builtIn.length && importedMolecules.has(builtIn.moleculeId[i])) i++
  }
  nextBuiltIn()
  while (i < builtIn.length || j < imported.length) {
    if (
      j >= imported.length ||
      (i < builtIn.length && builtIn.wavenumberCm[i] <= imported.wavenumberCm[j])
    ) {
      copyRow(builtIn, i, out, k++)
      i++
      nextBuiltIn()
    } else {
      copyRow(imported, j, out, k)
      out.sourceIndex[k++] = builtIn.length + imported.sourceIndex[j]
      j++
    }
  }
  return out
}

/** Number of built-in lines a merged import would use (those of molecules the import lacks). */
export function builtInLinesUsed(
  builtIn: LineTable,
  importedMoleculeIds: Iterable<number>,
): number {
  const ids = new Set(importedMoleculeIds)
  let n = 0
  for (let i = 0; i < builtIn.length; i++) if (!ids.has(builtIn.moleculeId[i])) n++
  return n
}
