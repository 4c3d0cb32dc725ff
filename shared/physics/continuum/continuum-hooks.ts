/**
 * The list of continuum hooks the engine passes to the optics, from simple switches.
 */
import { PhysicsError } from '../errors'
import type { ContinuumHook } from '../optics/continuum'
import { createWaterVapourContinuumHook } from './water-vapour-continuum-hook'

/** Which continuum terms to include. */
export interface ContinuumSelection {
  /** Water-vapour self + foreign continuum of the 8–12 µm window (Roberts et al. 1976). */
  waterVapour: boolean
}

/**
 * Builds the continuum hooks for the engine.
 *
 * Method: [water-vapour hook] when `waterVapour`, else []; hooks in a fixed order so that the
 * floating-point sum of the terms is deterministic.
 * Notes: the CO2 sub-Lorentzian far wing is a line-shape correction, not an additive term, and is
 * therefore not a hook (see `co2ChiFactor`).
 * Source: common practice (additive continuum terms).
 * @param selection terms to include
 */
export function buildContinuumHooks(selection: ContinuumSelection): ContinuumHook[] {
  if (typeof selection?.waterVapour !== 'boolean') {
    throw new PhysicsError('INVALID_ARGUMENT', 'waterVapour must be a boolean')
  }
  const hooks: ContinuumHook[] = []
  if (selection.waterVapour) hooks.push(createWaterVapourContinuumHook())
  return hooks
}
