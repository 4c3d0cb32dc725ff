/** Printed with every flux or forcing result: what the numbers are and are not. */
export const CAUTIONS = [
  'Clear sky only: no clouds, aerosols or scattering.',
  'Local thermodynamic equilibrium assumed (valid below roughly 70 km).',
  'Built-in catalogue synthesised from published constants; band intensities carry stated errors (see data/ and docs/PHYSICS.md).',
  'Instantaneous forcing, no stratospheric adjustment; for policy figures defer to peer-reviewed assessments.',
]
