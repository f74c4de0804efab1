import { describe, expect, it } from 'vitest';
import {
  darcyBedResistance,
  poiseuilleTubeResistance,
} from '../../generator/physics/flow-resistance.ts';

describe('darcyBedResistance (Darcy 1856, Q = kAΔp/(μL))', () => {
  it('darcyBedResistance(μ, L, k, A) gives Q = kAΔp/(μL) back for a closed-form case', () => {
    // Closed form: k = 1e-12 m², A = 1e-3 m², μ = 1e-3 Pa·s, L = 0.01 m, Δp = 1e4 Pa
    // → Q = 1e-12·1e-3·1e4/(1e-3·0.01) = 1e-6 m³/s.
    const r = darcyBedResistance(1e-3, 0.01, 1e-12, 1e-3);
    expect(1e4 / r).toBeCloseTo(1e-6, 18);
  });
  it('darcyBedResistance doubles with bed depth and halves with permeability ×2', () => {
    const r = darcyBedResistance(3e-4, 0.015, 1e-12, 2.5e-3);
    expect(darcyBedResistance(3e-4, 0.03, 1e-12, 2.5e-3) / r).toBeCloseTo(2, 12);
    expect(darcyBedResistance(3e-4, 0.015, 2e-12, 2.5e-3) / r).toBeCloseTo(0.5, 12);
  });
});

describe('poiseuilleTubeResistance (Hagen–Poiseuille, R = 128μℓ/(πd⁴))', () => {
  it('poiseuilleTubeResistance matches the mean-velocity form ΔP = 32μℓU/d²', () => {
    // Same law written with the mean velocity U = 4Q/(πd²) (White, Fluid Mechanics, eq. 6.44).
    const mu = 1e-3,
      l = 0.05,
      d = 0.006,
      q = 2e-6;
    const u = (4 * q) / (Math.PI * d * d);
    const dpVelocityForm = (32 * mu * l * u) / (d * d);
    expect(poiseuilleTubeResistance(mu, l, d) * q).toBeCloseTo(dpVelocityForm, 9);
  });
  it('poiseuilleTubeResistance scales as d⁻⁴', () => {
    const r1 = poiseuilleTubeResistance(1e-3, 0.04, 0.007);
    expect(poiseuilleTubeResistance(1e-3, 0.04, 0.014) / r1).toBeCloseTo(1 / 16, 12);
  });
});
