/**
 * Card formatting against the definitions of the units (NIST SP 811, Appendix B, exact):
 * 1 US fl oz = 29.5735295625 mL, 1 oz (avoirdupois) = 28.349523125 g, 1 in = 25.4 mm,
 * 1 psi = 6894.757293168 Pa, 1 ft = 0.3048 m, °F = °C × 9/5 + 32.
 */
import { describe, expect, it } from 'vitest';
import {
  altitude,
  clock,
  dose,
  fillMass,
  fillVolume,
  length,
  lengthDown,
  pressure,
  pressureRough,
  share,
  temperature,
  temperatureBand,
  timeRange,
  waterMass,
  waterVolume,
} from '../../generator/render/format.ts';

const NBSP = '\u00a0';

describe('NIST SP 811 Appendix B definitions', () => {
  it('temperature(K, us) is °C × 9/5 + 32, rounded to 1 °F', () => {
    expect(temperature(373.15, 'us').text).toBe(`212${NBSP}°F`);
    expect(temperature(273.15, 'us').text).toBe(`32${NBSP}°F`);
    expect(temperature(353.15, 'us').value).toBe('176');
    expect(temperature(353.15, 'metric').text).toBe(`80${NBSP}°C`);
  });
  it('waterVolume(1 US fl oz) is 1.0 fl oz and 29.5735295625 mL rounds to 30 mL', () => {
    expect(waterVolume(29.5735295625e-6, 'us').text).toBe(`1.0${NBSP}fl oz`);
    expect(waterVolume(29.5735295625e-6, 'metric').text).toBe(`30${NBSP}mL`);
    expect(waterVolume(150e-6, 'us').value).toBe('5.1'); // 150 / 29.5735… = 5.072
  });
  it('waterMass and dose of 1 oz avoirdupois (28.349523125 g)', () => {
    expect(waterMass(28.349523125e-3, 'us').text).toBe(`1.0${NBSP}oz`);
    expect(dose(28.349523125e-3, 'us').text).toBe(`1.00${NBSP}oz`);
    expect(dose(0.0145, 'metric').text).toBe(`14.5${NBSP}g`);
    expect(dose(0.0145, 'us').value).toBe('0.51'); // 14.5 / 28.3495… = 0.5115
  });
  it('length(1 in = 25.4 mm)', () => {
    expect(length(0.0254, 'us').text).toBe(`1.00${NBSP}in`);
    expect(length(0.0254, 'metric').text).toBe(`25${NBSP}mm`);
  });
  it('pressureRough: two significant figures, never more (an assumed value)', () => {
    expect(pressureRough(1.5e5, 'metric').text).toBe(`1.5${NBSP}bar`);
    expect(pressureRough(1.5e5, 'us').text).toBe(`22${NBSP}psi`); // 21.76 psi, NIST SP 811
    expect(pressureRough(1.234e5, 'metric').text).toBe(`1.2${NBSP}bar`);
    expect(pressureRough(0.8e5, 'metric').text).toBe(`0.80${NBSP}bar`);
    expect(pressureRough(1.0e5, 'metric').text).toBe(`1.0${NBSP}bar`);
  });

  it('pressure(1 psi = 6894.757293168 Pa) and bar', () => {
    expect(pressure(6894.757293168, 'us').text).toBe(`1.0${NBSP}psi`);
    expect(pressure(1.5e5, 'metric').text).toBe(`1.50${NBSP}bar`);
    expect(pressure(1.5e5, 'us').value).toBe('21.8'); // 1.5e5 / 6894.757… = 21.76
  });
  it('altitude(1 ft = 0.3048 m)', () => {
    expect(altitude(304.8, 'us').text).toBe(`1000${NBSP}ft`);
    expect(altitude(1500, 'metric').text).toBe(`1500${NBSP}m`);
  });
});

describe('ranges and shares', () => {
  it('timeRange(110, 140) is "1:50–2:20"', () => {
    expect(timeRange(110, 140).text).toBe('1:50–2:20');
  });
  it('timeRange rounds outward to 5 s, so the printed range contains the model’s', () => {
    const r = timeRange(111.2, 138.9);
    expect(r.text).toBe('1:50–2:20');
    expect(r.lowS).toBeLessThanOrEqual(111.2);
    expect(r.highS).toBeGreaterThanOrEqual(138.9);
  });
  it('timeRange of one value prints one time', () => {
    expect(timeRange(120, 120).text).toBe('2:00');
  });
  it('clock(65) is "1:05"', () => {
    expect(clock(65)).toBe('1:05');
  });
  it('temperatureBand([90 °C, 96 °C]) is "90–96 °C" and "194–205 °F"', () => {
    expect(temperatureBand([363.15, 369.15], 'metric')).toBe(`90–96${NBSP}°C`);
    expect(temperatureBand([363.15, 369.15], 'us')).toBe(`194–205${NBSP}°F`); // 204.8 → 205
  });
  it('share(0.785) is "79 %"', () => {
    expect(share(0.785).text).toBe(`79${NBSP}%`);
  });
});

describe('fillVolume, fillMass, lengthDown (safety limits round down)', () => {
  it('fillVolume(154.9 mL) prints 154 mL, and 5.29 fl oz prints 5.2 fl oz', () => {
    expect(fillVolume(154.9e-6, 'metric').text).toBe(`154${NBSP}mL`);
    // NIST SP 811: 1 US fl oz = 29.5735295625 mL, so 5.29 fl oz = 156.44 mL.
    expect(fillVolume(5.29 * 29.5735295625e-6, 'us').text).toBe(`5.2${NBSP}fl oz`);
  });
  it('fillMass and lengthDown never round up', () => {
    expect(fillMass(0.1519, 'metric').text).toBe(`151${NBSP}g`);
    expect(lengthDown(0.0048, 'metric').text).toBe(`4${NBSP}mm`);
    // 1 in = 25.4 mm (NIST SP 811): 4.8 mm = 0.18897 in → 0.18 in.
    expect(lengthDown(0.0048, 'us').text).toBe(`0.18${NBSP}in`);
  });
});
