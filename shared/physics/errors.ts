/** Error codes raised by the physics engine; callers map them to user-facing messages. */
export type PhysicsErrorCode =
  | 'INVALID_ARGUMENT'
  | 'OUT_OF_RANGE'
  | 'NOT_MONOTONIC'
  | 'PARSE_ERROR'
  | 'UNSUPPORTED'

/** A typed error thrown by `shared/physics` instead of returning NaN silently. */
export class PhysicsError extends Error {
  readonly code: PhysicsErrorCode
  readonly details?: Record<string, unknown>

  constructor(code: PhysicsErrorCode, message: string, details?: Record<string, unknown>) {
    super(message)
    this.name = 'PhysicsError'
    this.code = code
    this.details = details
  }
}

/** Throws OUT_OF_RANGE unless `value` is a finite number within [min, max]. */
export function assertFiniteInRange(name: string, value: number, min: number, max: number): void {
  if (!Number.isFinite(value) || value < min || value > max) {
    throw new PhysicsError('OUT_OF_RANGE', `${name} = ${value} is outside [${min}, ${max}]`, {
      name,
      value,
      min,
      max,
    })
  }
}
