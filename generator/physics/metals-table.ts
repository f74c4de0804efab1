/**
 * Specific heat and density of the pot-base metals.
 * Source: F. P. Incropera & D. P. DeWitt, Fundamentals of Heat and Mass Transfer,
 * Table A.1 (thermophysical properties of selected metallic solids): pure aluminium and
 * AISI 304 stainless steel. The table gives density and c_p at 300 K and c_p at 100, 200,
 * 400, 600, 800 K; the rows here keep 200–600 K.
 *
 * Provenance of each number: aluminium at 300 K (c_p 903 J/(kg·K), ρ 2702 kg/m³) is read
 * from Incropera & DeWitt, Table A.1; every other entry (aluminium at 200, 400, 600 K and
 * all of AISI 304) is from memory of the table and is marked so below.
 */
export type MetalName = 'aluminium' | 'stainless-steel';

export interface MetalProperties {
  /** Density at 300 K, kg/m³. */
  readonly densityKgM3: number;
  /** Table temperatures, K, ascending. */
  readonly temperaturesK: readonly number[];
  /** c_p at temperaturesK, J/(kg·K). */
  readonly specificHeatsJPerKgK: readonly number[];
}

export const METALS: Readonly<Record<MetalName, MetalProperties>> = {
  aluminium: {
    densityKgM3: 2702,
    temperaturesK: [200, 300, 400, 600],
    // 903 at 300 K from Incropera & DeWitt, Table A.1; 798 (200 K), 949 (400 K), 1033 (600 K) from memory.
    specificHeatsJPerKgK: [798, 903, 949, 1033],
  },
  'stainless-steel': {
    // AISI 304, all from memory: ρ 7900; c_p 402 (200 K), 477 (300 K), 515 (400 K), 557 (600 K).
    densityKgM3: 7900,
    temperaturesK: [200, 300, 400, 600],
    specificHeatsJPerKgK: [402, 477, 515, 557],
  },
};
