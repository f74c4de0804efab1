import { describe, it } from 'vitest';
import { CELSIUS_OFFSET_K } from '../../generator/physics/constants.ts';
import { region1 } from '../../generator/physics/if97-region1.ts';
import { saturationPressurePa } from '../../generator/physics/if97-region4.ts';
import { saturatedLiquidDensityKgM3 } from '../../generator/physics/saturation.ts';
import { expectAbsolute, halfUnitOfLastDigit } from '../helpers/close.ts';

const NIST = 'NIST Chemistry WebBook (IAPWS-95)';

/**
 * Printed to 0.01 kg/m³: the digits allow half of that, 0.005 kg/m³ (5e-6 relative).
 *
 * IF97 Region 1 at (T, p_sat(T)) reaches that only at 20 °C: over 40–120 °C it sits
 * 0.6e-5 to 1.9e-5 above IAPWS-95. The IF97 release says Region 1 reproduces IAPWS-95
 * within the tolerances set for its development (Wagner et al., J. Eng. Gas Turbines
 * Power 122 (2000) 150; for v in Region 1, ±0.05 % from memory, not verified here), so
 * those rows are held to 3e-5, a little above the measured 1.9e-5 and well inside that.
 *
 * SR1-86 eq. (2) reaches the digits at 20, 40, 80 and 90 °C and is within 8e-6 elsewhere;
 * those rows are held to 1e-5.
 */
const IF97_RTOL = 3e-5;
const SR86_RTOL = 1e-5;

// prettier-ignore
const ROWS: readonly { celsius: number; density: string; if97Digits: boolean; sr86Digits: boolean }[] = [
  { celsius: 20,  density: '998.16', if97Digits: true,  sr86Digits: true },
  { celsius: 40,  density: '992.17', if97Digits: false, sr86Digits: true },
  { celsius: 60,  density: '983.16', if97Digits: false, sr86Digits: false },
  { celsius: 80,  density: '971.76', if97Digits: false, sr86Digits: true },
  { celsius: 90,  density: '965.29', if97Digits: false, sr86Digits: true },
  { celsius: 100, density: '958.34', if97Digits: false, sr86Digits: false },
  { celsius: 110, density: '950.94', if97Digits: false, sr86Digits: false },
  { celsius: 120, density: '943.10', if97Digits: false, sr86Digits: false },
];

describe('Saturated liquid density — NIST Chemistry WebBook (IAPWS-95)', () => {
  it.each(
    ROWS.map((row) => [
      row.celsius,
      row.if97Digits ? 'to its printed digits' : `to ${IF97_RTOL.toExponential()} relative`,
      row,
    ]),
  )('region1(%d °C, p_sat).densityKgM3 matches %s', (celsius, _note, row) => {
    const temperatureK = celsius + CELSIUS_OFFSET_K;
    const expected = Number(row.density);
    expectAbsolute(
      region1(temperatureK, saturationPressurePa(temperatureK)).densityKgM3,
      expected,
      row.if97Digits ? halfUnitOfLastDigit(row.density) : IF97_RTOL * expected,
      `ρ′(${temperatureK} K) in kg/m³, IF97 Region 1 at p_sat vs ${NIST}`,
    );
  });

  it.each(
    ROWS.map((row) => [
      row.celsius,
      row.sr86Digits ? 'to its printed digits' : `to ${SR86_RTOL.toExponential()} relative`,
      row,
    ]),
  )('saturatedLiquidDensityKgM3(%d °C) (SR1-86) matches %s', (celsius, _note, row) => {
    const temperatureK = celsius + CELSIUS_OFFSET_K;
    const expected = Number(row.density);
    expectAbsolute(
      saturatedLiquidDensityKgM3(temperatureK),
      expected,
      row.sr86Digits ? halfUnitOfLastDigit(row.density) : SR86_RTOL * expected,
      `ρ′(${temperatureK} K) in kg/m³, SR1-86 eq. (2) vs ${NIST}`,
    );
  });
});
