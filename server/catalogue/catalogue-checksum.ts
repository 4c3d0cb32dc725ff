import { createHash } from 'node:crypto'

/** 'sha256:<hex>' of some bytes or text. */
export function sha256Tagged(data: string | Uint8Array): string {
  return `sha256:${createHash('sha256').update(data).digest('hex')}`
}

/**
 * The checksum a run records for its catalogue: the imported line data's checksum, or, when the
 * import is merged with the built-in catalogue, a checksum of both (so a run's input hash changes
 * when either part changes).
 */
export function runCatalogueChecksum(dataChecksum: string, builtInChecksum: string | null): string {
  return builtInChecksum === null
    ? dataChecksum
    : sha256Tagged(`merged-with-builtin\n${builtInChecksum}\n${dataChecksum}`)
}
