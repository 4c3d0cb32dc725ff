/**
 * Downsampling of a line list for a stick-spectrum chart: the strongest line per wavenumber bin
 * and per molecule, so a browser gets at most bins × molecules points however many lines the
 * catalogue holds. Lines are fed in any order, one table or block at a time.
 */
import type { LineTable } from '../../shared/physics/spectroscopy/line'
import type { CatalogueId, StickSeries, StickSpectrum } from '../../shared/schemas/catalogues'
import { moleculeName } from './import/line-list-summary'

interface Bins {
  moleculeId: number
  fromBuiltIn: boolean
  wavenumberCm: Float64Array
  intensity: Float64Array
}

type Columns = Pick<LineTable, 'length' | 'wavenumberCm' | 'intensityCmPerMolecule' | 'moleculeId'>

export class StickBinner {
  private readonly series = new Map<string, Bins>()
  private readonly widthCm: number
  lineCountInRange = 0

  constructor(
    readonly startCm: number,
    readonly endCm: number,
    readonly bins: number,
  ) {
    if (!(endCm > startCm) || !Number.isInteger(bins) || bins < 1)
      throw new Error('invalid stick binning')
    this.widthCm = (endCm - startCm) / bins
  }

  /** Adds the lines of a table with startCm ≤ ν ≤ endCm (and, when given, an accepted molecule). */
  add(
    lines: Columns,
    options: { fromBuiltIn?: boolean; molecule?: (moleculeId: number) => boolean } = {},
  ): void {
    const fromBuiltIn = options.fromBuiltIn ?? false
    const { startCm, endCm, bins, widthCm } = this
    for (let i = 0; i < lines.length; i++) {
      const nu = lines.wavenumberCm[i]
      if (nu < startCm || nu > endCm) continue
      const moleculeId = lines.moleculeId[i]
      if (options.molecule && !options.molecule(moleculeId)) continue
      this.lineCountInRange++
      const s = lines.intensityCmPerMolecule[i]
      if (!(s > 0)) continue
      const key = `${fromBuiltIn ? 'b' : 'i'}${moleculeId}`
      let target = this.series.get(key)
      if (!target) {
        target = {
          moleculeId,
          fromBuiltIn,
          wavenumberCm: new Float64Array(bins),
          intensity: new Float64Array(bins),
        }
        this.series.set(key, target)
      }
      const bin = Math.min(bins - 1, Math.floor((nu - startCm) / widthCm))
      if (s > target.intensity[bin]) {
        target.intensity[bin] = s
        target.wavenumberCm[bin] = nu
      }
    }
  }

  result(catalogueId: CatalogueId): StickSpectrum {
    const series: StickSeries[] = [...this.series.values()]
      .sort((a, b) => Number(a.fromBuiltIn) - Number(b.fromBuiltIn) || a.moleculeId - b.moleculeId)
      .map((b) => {
        const wavenumberCm: number[] = []
        const intensityCmPerMolecule: number[] = []
        for (let k = 0; k < this.bins; k++) {
          if (b.intensity[k] > 0) {
            wavenumberCm.push(b.wavenumberCm[k])
            intensityCmPerMolecule.push(b.intensity[k])
          }
        }
        return {
          moleculeId: b.moleculeId,
          molecule: moleculeName(b.moleculeId),
          fromBuiltIn: b.fromBuiltIn,
          wavenumberCm,
          intensityCmPerMolecule,
        }
      })
    return {
      catalogueId,
      startCm: this.startCm,
      endCm: this.endCm,
      bins: this.bins,
      binWidthCm: this.widthCm,
      lineCountInRange: this.lineCountInRange,
      series,
    }
  }
}
