import { describe, expect, it } from 'vitest';
import { OutOfRangeError } from '../../generator/physics/errors.ts';
import { region1 } from '../../generator/physics/if97-region1.ts';
import { saturationPressurePa } from '../../generator/physics/if97-region4.ts';
import { expectAbsolute, expectRelative } from '../helpers/close.ts';

const SOURCE = 'IAPWS R7-97(2012) Table 5';

describe('IAPWS-IF97 Region 1, Table 5 (IAPWS R7-97(2012))', () => {
  // [T K, p MPa, v m³/kg, h kJ/kg, u kJ/kg, s kJ/(kg·K), cp kJ/(kg·K), w m/s]
  const rows: [number, number, number, number, number, number, number, number][] = [
    [
      300, 3, 0.100215168e-2, 0.115331273e3, 0.112324818e3, 0.392294792, 0.417301218e1,
      0.150773921e4,
    ],
    [
      300, 80, 0.971180894e-3, 0.184142828e3, 0.106448356e3, 0.368563852, 0.401008987e1,
      0.163469054e4,
    ],
    [
      500, 3, 0.1202418e-2, 0.975542239e3, 0.971934985e3, 0.258041912e1, 0.465580682e1,
      0.124071337e4,
    ],
  ];
  it.each(rows)(
    'region1(%d K, %d MPa) matches every column to 1e-8',
    (t, pMPa, v, h, u, s, cp, w) => {
      const state = region1(t, pMPa * 1e6);
      const at = `region1(${t} K, ${pMPa} MPa)`;
      expectRelative(state.specificVolumeM3PerKg, v, 1e-8, `${at}.v, ${SOURCE}`);
      expectRelative(state.densityKgM3, 1 / v, 1e-8, `${at}.ρ = 1/v, ${SOURCE}`);
      expectRelative(state.enthalpyJPerKg, h * 1e3, 1e-8, `${at}.h, ${SOURCE}`);
      expectRelative(state.internalEnergyJPerKg, u * 1e3, 1e-8, `${at}.u, ${SOURCE}`);
      expectRelative(state.entropyJPerKgK, s * 1e3, 1e-8, `${at}.s, ${SOURCE}`);
      expectRelative(state.isobaricHeatCapacityJPerKgK, cp * 1e3, 1e-8, `${at}.cp, ${SOURCE}`);
      expectRelative(state.speedOfSoundMPerS, w, 1e-8, `${at}.w, ${SOURCE}`);
    },
  );
});

describe('region1 derivatives agree with finite differences of its own v and h', () => {
  // Closed-form checks of α_v = (1/v)(∂v/∂T)_p and c_p = (∂h/∂T)_p by central differences
  // (step 1e-3 K; truncation and rounding measured below 3e-9 relative).
  const states: [number, number][] = [
    [273.16, 1e5],
    [300, 3e6],
    [373.15, 2e5],
    [450, 1.5e6],
    [600, 20e6],
    [623.14, 16.6e6],
  ];
  it.each(states)('region1(%d K, %d Pa): expansivityPerK and cp', (t, p) => {
    const step = 1e-3;
    const below = region1(t - step, p);
    const above = region1(t + step, p);
    const state = region1(t, p);
    const dvdT = (above.specificVolumeM3PerKg - below.specificVolumeM3PerKg) / (2 * step);
    expectRelative(
      state.expansivityPerK,
      dvdT / state.specificVolumeM3PerKg,
      1e-7,
      `α_v at ${t} K, ${p} Pa`,
    );
    expectRelative(
      state.isobaricHeatCapacityJPerKgK,
      (above.enthalpyJPerKg - below.enthalpyJPerKg) / (2 * step),
      1e-7,
      `c_p at ${t} K, ${p} Pa`,
    );
  });

  it('expansivityPerK changes sign at the density maximum, 3.98 °C at 0.101325 MPa', () => {
    // Published: liquid water is densest at 3.98 °C at one atmosphere (Kell, J. Chem. Eng.
    // Data 20 (1975) 97 gives 3.984 °C; from memory). IF97 is a fit to IAPWS-95 and puts
    // the zero of α_v at 277.113 K; 0.05 K allows for that and for the published spread.
    let low = 275;
    let high = 280;
    for (let k = 0; k < 50; k++) {
      const mid = (low + high) / 2;
      if (region1(mid, 101325).expansivityPerK < 0) low = mid;
      else high = mid;
    }
    expectAbsolute(low, 273.15 + 3.98, 0.05, 'T where α_v(T, 0.101325 MPa) = 0, K');
  });
});

describe('region1 out of range', () => {
  it('throws OutOfRangeError for T outside 273.15–623.15 K and for NaN', () => {
    for (const t of [273.14, 623.16, Number.NaN]) {
      expect(() => region1(t, 1e6)).toThrow(OutOfRangeError);
    }
    expect(() => region1(700, 1e6)).toThrow(
      'IAPWS-IF97 Region 1: temperature 700 K is outside 273.15–623.15 K',
    );
  });
  // source: IAPWS R7-97(2012), Region 1 range of validity (p_sat(T) ≤ p ≤ 100 MPa)
  it('throws OutOfRangeError below p_sat(T) (steam) and above 100 MPa', () => {
    expect(() => region1(373.15, 100e3)).toThrow(OutOfRangeError); // p_sat = 101.418 kPa
    expect(() => region1(300, 100.1e6)).toThrow(OutOfRangeError);
  });
  // source: NIST Chemistry WebBook (IAPWS-95), saturated liquid at 100 °C: 958.34 kg/m³
  it('accepts the saturated liquid itself, p = p_sat(T)', () => {
    expect(region1(373.15, saturationPressurePa(373.15)).densityKgM3).toBeGreaterThan(958);
  });
});
