/**
 * Specific heat and density of the metals pot bases are made of, from Incropera &
 * DeWitt Table A.1 (metals-table.ts).
 */
import { requireInRange } from './errors.ts';
import { METALS, type MetalName } from './metals-table.ts';

export type { MetalName } from './metals-table.ts';

const CORRELATION = 'Incropera & DeWitt Table A.1';
const MIN_TEMPERATURE_K = 250;
const MAX_TEMPERATURE_K = 600;

/**
 * Specific heat of a pot-base metal, by linear interpolation in Incropera & DeWitt
 * Table A.1 between its 200, 300, 400 and 600 K entries (no extrapolation: the valid
 * range lies inside the table).
 *
 * @param material     'aluminium' (pure) or 'stainless-steel' (AISI 304)
 * @param temperatureK temperature T, K; valid 250 ≤ T ≤ 600 K
 * @returns c_p, J/(kg·K)
 * @throws OutOfRangeError outside the range
 * Source: Incropera & DeWitt, Fundamentals of Heat and Mass Transfer, Table A.1; only
 * aluminium at 300 K is a checked value, the other entries are from memory
 * (metals-table.ts).
 * Worked value: aluminium, 350 K → (903 + 949)/2 = 926 J/(kg·K).
 */
export function metalSpecificHeatJPerKgK(material: MetalName, temperatureK: number): number {
  requireInRange(
    CORRELATION,
    'temperature',
    temperatureK,
    MIN_TEMPERATURE_K,
    MAX_TEMPERATURE_K,
    'K',
  );
  const { temperaturesK, specificHeatsJPerKgK } = METALS[material];
  let upper = 1;
  while (temperaturesK[upper]! < temperatureK) upper++;
  const t0 = temperaturesK[upper - 1]!;
  const t1 = temperaturesK[upper]!;
  const c0 = specificHeatsJPerKgK[upper - 1]!;
  const c1 = specificHeatsJPerKgK[upper]!;
  return c0 + ((c1 - c0) * (temperatureK - t0)) / (t1 - t0);
}

/**
 * Density of a pot-base metal at 300 K (thermal expansion to 600 K changes it by under
 * 2 %, which this engine neglects).
 *
 * @param material 'aluminium' (pure) or 'stainless-steel' (AISI 304)
 * @returns ρ, kg/m³
 * Source: Incropera & DeWitt, Table A.1 (aluminium 2702 checked; AISI 304 7900 from memory).
 * Worked value: aluminium → 2702 kg/m³.
 */
export function metalDensityKgM3(material: MetalName): number {
  return METALS[material].densityKgM3;
}
