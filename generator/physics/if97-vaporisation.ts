/**
 * Enthalpy of vaporisation of water from IAPWS-IF97 alone, by the Clausius–Clapeyron
 * equation with the formulation's own saturation line and phase volumes. An alternative
 * to the SR1-86 auxiliary equation in saturation.ts that is consistent with the p_sat
 * (Region 4) and liquid density (Region 1) the rest of the engine uses.
 */
import { region1 } from './if97-region1.ts';
import { region2SpecificVolumeM3PerKg } from './if97-region2.ts';
import { saturationPressurePa, saturationPressureSlopePaPerK } from './if97-region4.ts';
import { requireInRange } from './errors.ts';

const CORRELATION = 'IAPWS-IF97 Clausius–Clapeyron h_fg';
const MIN_TEMPERATURE_K = 273.15;
const MAX_TEMPERATURE_K = 623.15;

/**
 * h_fg = T·(dp_sat/dT)·(v″ − v′), with dp_sat/dT the derivative of IF97 eq. 30, v′ from
 * Region 1 and v″ from Region 2, both at (T, p_sat(T)).
 *
 * @param temperatureK temperature T, K; valid 273.15 ≤ T ≤ 623.15 K (where Regions 1 and 2
 *                     meet the saturation line)
 * @returns h_fg, J/kg
 * @throws OutOfRangeError outside the range
 * Source: Clausius–Clapeyron equation applied to IAPWS R7-97(2012) eqs. 7, 15 and 30.
 * IF97 is not exactly thermodynamically consistent across its regions, so this differs
 * slightly from h″(Region 2) − h′(Region 1); against IAPWS-95 it agrees to about 1e-4
 * (tests/physics/crc-saturated-water.test.ts).
 * Worked value: T = 373.15 K → 2256.44 kJ/kg (CRC Handbook, IAPWS-95: 2256.4).
 */
export function vaporisationEnthalpyIf97JPerKg(temperatureK: number): number {
  requireInRange(
    CORRELATION,
    'temperature',
    temperatureK,
    MIN_TEMPERATURE_K,
    MAX_TEMPERATURE_K,
    'K',
  );
  const pressurePa = saturationPressurePa(temperatureK);
  const liquidVolume = region1(temperatureK, pressurePa).specificVolumeM3PerKg;
  const vapourVolume = region2SpecificVolumeM3PerKg(temperatureK, pressurePa);
  return temperatureK * saturationPressureSlopePaPerK(temperatureK) * (vapourVolume - liquidVolume);
}
