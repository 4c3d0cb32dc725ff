/**
 * Physical constants, CODATA 2018 (h, c, k_B, N_A exact since the 2019 SI redefinition).
 * Units are in the names. Spectroscopy uses cm⁻¹, so radiation constants are also given in
 * wavenumber form.
 *
 * Sources: CODATA 2018 recommended values (Tiesinga et al. 2021, Rev. Mod. Phys. 93, 025010).
 */

/** Planck constant, J s (exact). */
export const PLANCK_J_S = 6.62607015e-34
/** Speed of light in vacuum, m s⁻¹ (exact). */
export const SPEED_OF_LIGHT_M_PER_S = 299792458
/** Speed of light in vacuum, cm s⁻¹ (exact). */
export const SPEED_OF_LIGHT_CM_PER_S = 29979245800
/** Boltzmann constant, J K⁻¹ (exact). */
export const BOLTZMANN_J_PER_K = 1.380649e-23
/** Avogadro constant, mol⁻¹ (exact). */
export const AVOGADRO_PER_MOL = 6.02214076e23
/** Molar gas constant R = N_A k_B, J mol⁻¹ K⁻¹. */
export const GAS_CONSTANT_J_PER_MOL_K = AVOGADRO_PER_MOL * BOLTZMANN_J_PER_K
/** Stefan–Boltzmann constant, W m⁻² K⁻⁴ (CODATA 2018, derived from exact constants). */
export const STEFAN_BOLTZMANN_W_PER_M2_K4 = 5.670374419e-8
/** Second radiation constant c₂ = hc/k, cm K. */
export const C2_CM_K = (PLANCK_J_S * SPEED_OF_LIGHT_CM_PER_S) / BOLTZMANN_J_PER_K
/**
 * First radiation constant for radiance per wavenumber, c₁L = 2hc², expressed so that
 * B(ν̃) = C1L · ν̃³ / (exp(c₂ν̃/T) − 1) gives W m⁻² sr⁻¹ (cm⁻¹)⁻¹ with ν̃ in cm⁻¹.
 * 2hc² [W m² sr⁻¹] × (100 cm/m)⁴ ... = 1.191042972e-8 W m⁻² sr⁻¹ (cm⁻¹)⁻⁴.
 */
export const C1L_W_PER_M2_SR_CM4 = 2 * PLANCK_J_S * SPEED_OF_LIGHT_M_PER_S ** 2 * 1e8
/** Atomic mass constant (dalton), kg (CODATA 2018). */
export const DALTON_KG = 1.6605390666e-27
/** Standard acceleration of gravity, m s⁻² (CGPM 1901, exact by definition). */
export const STANDARD_GRAVITY_M_PER_S2 = 9.80665
/** Standard atmosphere, Pa (exact by definition). */
export const STANDARD_ATMOSPHERE_PA = 101325
/** Reference temperature of line intensities in public spectroscopic databases, K. */
export const LINE_REFERENCE_TEMPERATURE_K = 296
/** Debye, C m. */
export const DEBYE_C_M = 3.33564e-30
/** Molar mass of dry air, kg mol⁻¹ (U.S. Standard Atmosphere 1976 value 28.9644 kg kmol⁻¹). */
export const DRY_AIR_MOLAR_MASS_KG_PER_MOL = 0.0289644
/** Molar mass of water, kg mol⁻¹. */
export const WATER_MOLAR_MASS_KG_PER_MOL = 0.01801528
/** Specific heat of dry air at constant pressure, J kg⁻¹ K⁻¹ (common practice value 1004). */
export const DRY_AIR_CP_J_PER_KG_K = 1004
/** Seconds per day. */
export const SECONDS_PER_DAY = 86400
/** Dobson unit, molecule cm⁻² (1 DU = 10⁻³ cm of gas at STP). */
export const DOBSON_UNIT_MOLECULES_PER_CM2 = 2.6867e16
