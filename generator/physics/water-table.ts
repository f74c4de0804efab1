/**
 * The water properties the brew simulation asks for at every evaluation, read from tables
 * made once per process from the exact correlations: a brew run evaluates them about 500
 * times, a card plan some 50 runs, and the correlations' sums (34 terms of IF97 Region 1,
 * 21 of the R12-08 viscosity, the SR1-86 powers) were a third of the planner's time.
 *
 *   compressed liquid  ρ, h, c_p, α_v (IAPWS-IF97 Region 1) and μ (IAPWS R12-08 at that ρ),
 *                      over T and q = (p − p_sat(T)) / P_STEP: a uniform grid in T of
 *                      STEP_K with 4-point (cubic) Lagrange interpolation, times 3 pressure
 *                      nodes q = 0, 1, 2 with quadratic Lagrange interpolation in q;
 *   saturated liquid   μ(T, ρ′(T)) (R12-08 at the SR1-86 density) and h_fg(T), cubic in T.
 *
 * The tables cover 0.01–200 °C and pressures up to MAX_Q pressure steps above saturation (the
 * pot's base stays far inside both); outside them the exact correlations are called, with
 * their own range checks. tests/physics/water-table.test.ts holds the tables to the exact
 * functions to a relative 1e-9 over the covered range, far below the simulation's
 * integration tolerance (1e-6).
 */
import { region1 } from './if97-region1.ts';
import { saturationPressurePa } from './if97-region4.ts';
import { saturatedLiquidDensityKgM3, vaporisationEnthalpyJPerKg } from './saturation.ts';
import { waterViscosityPaS } from './viscosity.ts';

/** The liquid state the simulation reads (the same names as Region 1's LiquidState). */
export interface LiquidSample {
  densityKgM3: number;
  enthalpyJPerKg: number;
  isobaricHeatCapacityJPerKgK: number;
  expansivityPerK: number;
  viscosityPaS: number;
}

export function newLiquidSample(): LiquidSample {
  return {
    densityKgM3: 0,
    enthalpyJPerKg: 0,
    isobaricHeatCapacityJPerKgK: 0,
    expansivityPerK: 0,
    viscosityPaS: 0,
  };
}

/** From the triple point (where SR1-86 begins) to 200 °C. */
const LOW_K = 273.16;
const HIGH_K = 473.16;
const STEP_K = 0.25;
const NODES = Math.round((HIGH_K - LOW_K) / STEP_K) + 1;
/** Pressure nodes above saturation, Pa, and how far past the last the table is still used. */
const P_STEP = 1.5e5;
const P_NODES = 3;
const MAX_Q = 4;
const PROPS = 5;

let liquidTable: Float64Array | null = null;
let saturatedTable: Float64Array | null = null;

function buildLiquidTable(): Float64Array {
  const table = new Float64Array(NODES * P_NODES * PROPS);
  for (let j = 0; j < NODES; j++) {
    const t = LOW_K + j * STEP_K;
    const pSat = saturationPressurePa(t);
    for (let k = 0; k < P_NODES; k++) {
      const state = region1(t, pSat + k * P_STEP);
      const at = (j * P_NODES + k) * PROPS;
      table[at] = state.densityKgM3;
      table[at + 1] = state.enthalpyJPerKg;
      table[at + 2] = state.isobaricHeatCapacityJPerKgK;
      table[at + 3] = state.expansivityPerK;
      table[at + 4] = waterViscosityPaS(t, state.densityKgM3);
    }
  }
  return table;
}

function buildSaturatedTable(): Float64Array {
  const table = new Float64Array(NODES * 2);
  for (let j = 0; j < NODES; j++) {
    const t = LOW_K + j * STEP_K;
    table[2 * j] = waterViscosityPaS(t, saturatedLiquidDensityKgM3(t));
    table[2 * j + 1] = vaporisationEnthalpyJPerKg(t);
  }
  return table;
}

// Cubic Lagrange weights of the 4 nodes around the last temperature asked for, and the
// first of them (module scratch: the functions below are synchronous and not re-entrant).
const weights = new Float64Array(4);

/** Fills `weights` for T (inside the table) and returns the index of the first node. */
function cubicWeights(temperatureK: number): number {
  const x = (temperatureK - LOW_K) / STEP_K;
  const i = Math.min(NODES - 3, Math.max(1, Math.floor(x)));
  const u = x - i;
  const um1 = u - 1;
  const um2 = u - 2;
  const up1 = u + 1;
  weights[0] = (-u * um1 * um2) / 6;
  weights[1] = (up1 * um1 * um2) / 2;
  weights[2] = (-up1 * u * um2) / 2;
  weights[3] = (up1 * u * um1) / 6;
  return i - 1;
}

const inTable = (temperatureK: number): boolean => temperatureK >= LOW_K && temperatureK <= HIGH_K;

/**
 * Compressed liquid at (T, p), written into `out`: Region 1's ρ, h, c_p, α_v and R12-08's μ.
 * `saturationPa` is p_sat(T) (the caller has it already).
 */
export function liquidAt(
  temperatureK: number,
  pressurePa: number,
  saturationPa: number,
  out: LiquidSample,
): LiquidSample {
  const q = (pressurePa - saturationPa) / P_STEP;
  if (!inTable(temperatureK) || !(q >= 0 && q <= MAX_Q))
    return exactLiquid(temperatureK, pressurePa, out);
  const table = (liquidTable ??= buildLiquidTable());
  const first = cubicWeights(temperatureK);
  // Quadratic Lagrange weights of the pressure nodes q = 0, 1, 2.
  const l0 = ((q - 1) * (q - 2)) / 2;
  const l1 = -q * (q - 2);
  const l2 = (q * (q - 1)) / 2;
  let rho = 0;
  let h = 0;
  let cp = 0;
  let alpha = 0;
  let mu = 0;
  for (let n = 0; n < 4; n++) {
    const w = weights[n]!;
    const at = (first + n) * P_NODES * PROPS;
    const w0 = w * l0;
    const w1 = w * l1;
    const w2 = w * l2;
    rho += w0 * table[at]! + w1 * table[at + PROPS]! + w2 * table[at + 2 * PROPS]!;
    h += w0 * table[at + 1]! + w1 * table[at + PROPS + 1]! + w2 * table[at + 2 * PROPS + 1]!;
    cp += w0 * table[at + 2]! + w1 * table[at + PROPS + 2]! + w2 * table[at + 2 * PROPS + 2]!;
    alpha += w0 * table[at + 3]! + w1 * table[at + PROPS + 3]! + w2 * table[at + 2 * PROPS + 3]!;
    mu += w0 * table[at + 4]! + w1 * table[at + PROPS + 4]! + w2 * table[at + 2 * PROPS + 4]!;
  }
  out.densityKgM3 = rho;
  out.enthalpyJPerKg = h;
  out.isobaricHeatCapacityJPerKgK = cp;
  out.expansivityPerK = alpha;
  out.viscosityPaS = mu;
  return out;
}

/** The same quantities from the correlations themselves (outside the table; and for tests). */
export function exactLiquid(
  temperatureK: number,
  pressurePa: number,
  out: LiquidSample,
): LiquidSample {
  const state = region1(temperatureK, pressurePa);
  out.densityKgM3 = state.densityKgM3;
  out.enthalpyJPerKg = state.enthalpyJPerKg;
  out.isobaricHeatCapacityJPerKgK = state.isobaricHeatCapacityJPerKgK;
  out.expansivityPerK = state.expansivityPerK;
  out.viscosityPaS = waterViscosityPaS(temperatureK, state.densityKgM3);
  return out;
}

function saturated(temperatureK: number, column: 0 | 1): number {
  const table = (saturatedTable ??= buildSaturatedTable());
  const first = cubicWeights(temperatureK);
  let value = 0;
  for (let n = 0; n < 4; n++) value += weights[n]! * table[2 * (first + n) + column]!;
  return value;
}

/** Viscosity of saturated liquid water, μ(T, ρ′(T)) (R12-08 at the SR1-86 density), Pa·s. */
export function saturatedLiquidViscosityPaS(temperatureK: number): number {
  if (!inTable(temperatureK)) {
    return waterViscosityPaS(temperatureK, saturatedLiquidDensityKgM3(temperatureK));
  }
  return saturated(temperatureK, 0);
}

/** Enthalpy of vaporisation h″ − h′ (SR1-86, see saturation.ts), J/kg. */
export function tabulatedVaporisationEnthalpyJPerKg(temperatureK: number): number {
  if (!inTable(temperatureK)) return vaporisationEnthalpyJPerKg(temperatureK);
  return saturated(temperatureK, 1);
}
