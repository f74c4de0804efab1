/**
 * Physical constants shared by the property functions. SI throughout.
 */

/** Molar gas constant R, J/(mol·K). Exact since the 2019 SI; CODATA 2018. */
export const MOLAR_GAS_CONSTANT = 8.314462618;

/** Molar mass of ordinary water, kg/mol. IAPWS (value used by IAPWS-95 and IF97). */
export const WATER_MOLAR_MASS_KG_PER_MOL = 0.018015268;

/**
 * Molar mass of dry air, kg/mol. Lemmon, Jacobsen, Penoncello & Friend (2000),
 * J. Phys. Chem. Ref. Data 29, 331, dry-air mixture model.
 */
export const AIR_MOLAR_MASS_KG_PER_MOL = 0.02896546;

/** Specific gas constant of water, J/(kg·K), as fixed by IAPWS-IF97 (R7-97(2012), eq. 1). */
export const WATER_SPECIFIC_GAS_CONSTANT = 461.526;

/** Standard acceleration of gravity, m/s² (3rd CGPM, 1901; exact). */
export const STANDARD_GRAVITY = 9.80665;

/** Standard atmosphere, Pa (exact; ISO 2533). */
export const STANDARD_ATMOSPHERE_PA = 101325;

/** Kelvin temperature of 0 °C, K (exact). */
export const CELSIUS_OFFSET_K = 273.15;

/** Critical temperature of water, K. IAPWS R2-83 (used by IAPWS-95, IF97, SR1-86, R12-08). */
export const WATER_CRITICAL_TEMPERATURE_K = 647.096;

/** Critical pressure of water, Pa. IAPWS R2-83. */
export const WATER_CRITICAL_PRESSURE_PA = 22.064e6;

/** Critical density of water, kg/m³. IAPWS R2-83. */
export const WATER_CRITICAL_DENSITY_KG_M3 = 322;
