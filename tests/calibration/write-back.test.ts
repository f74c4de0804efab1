import { describe, expect, it } from 'vitest';
import {
  editedText,
  plannedEdits,
  previousValueText,
  roundedForWriting,
} from '../../generator/calibration/write-back.ts';
import type { FitReport } from '../../generator/calibration/types.ts';
import type { StoveEntry } from '../../generator/content/types.ts';
import { COFFEE_TEXT, POT_TEXT, STOVE_TEXT } from './fixtures.ts';

/** Lines of `after` that are not in `before` and the other way round, in order. */
function changedLines(before: string, after: string): { removed: string[]; added: string[] } {
  const a = before.split('\n');
  const b = after.split('\n');
  return {
    removed: a.filter((line) => !b.includes(line)),
    added: b.filter((line) => !a.includes(line)),
  };
}

describe('roundedForWriting', () => {
  it('keeps two significant digits of σ (JCGM 100:2008 §7.2.6)', () => {
    expect(roundedForWriting(323.2467, 1.4)).toBe(323.2);
    expect(roundedForWriting(1.0917e-12, 3.7e-14)).toBe(1.092e-12);
    expect(roundedForWriting(0.12019, 0.029)).toBe(0.12);
    expect(roundedForWriting(483.16, 24)).toBe(483);
    expect(roundedForWriting(483.16, 400), 'never fewer than two digits of the value').toBe(480);
  });
});

describe('editedText', () => {
  it('replaces an existing value in place, keeping its comment', () => {
    const after = editedText(COFFEE_TEXT, 'coffee', [
      { path: ['permeability_m2'], value: 1.092e-12 },
    ]);
    expect(changedLines(COFFEE_TEXT, after)).toEqual({
      removed: ['permeability_m2: 0.8e-12 # from the grind chart'],
      added: ['permeability_m2: 1.092e-12 # from the grind chart'],
    });
  });

  it('adds a key inside a flow map, leaving blank lines and comments', () => {
    const after = editedText(STOVE_TEXT, 'stove', [
      { path: ['levels', 1, 'heat_to_pot_w'], value: 323.2 },
      { path: ['levels', 2, 'heat_to_pot_w'], value: 486 },
    ]);
    expect(changedLines(STOVE_TEXT, after)).toEqual({
      removed: [
        '  - { label: medium, power_w: 1000 }',
        '  - { label: high, power_w: 1500 } # the big flame',
      ],
      added: [
        '  - { label: medium, power_w: 1000, heat_to_pot_w: 323.2 }',
        '  - { label: high, power_w: 1500, heat_to_pot_w: 486 } # the big flame',
      ],
    });
    expect(after.split('\n')).toHaveLength(STOVE_TEXT.split('\n').length);
  });

  it('adds a key on a new line after the last pair of a block map', () => {
    const after = editedText(POT_TEXT, 'pot', [
      { path: ['base', 'heat_loss_w_per_k'], value: 0.12 },
    ]);
    const lines = after.split('\n');
    expect(lines[lines.indexOf('  mass_g: 180') + 1]).toBe('  heat_loss_w_per_k: 0.12');
    expect(changedLines(POT_TEXT, after)).toEqual({
      removed: [],
      added: ['  heat_loss_w_per_k: 0.12'],
    });
  });

  it('refuses a path with no map to add to', () => {
    expect(() => editedText(POT_TEXT, 'pot', [{ path: ['nowhere', 'x'], value: 1 }])).toThrow(
      /no mapping/,
    );
  });
});

describe('previousValueText', () => {
  it('is the value as the file writes it, or null when the key is new', () => {
    expect(previousValueText(COFFEE_TEXT, 'coffee', ['permeability_m2'])).toBe('0.8e-12');
    expect(previousValueText(STOVE_TEXT, 'stove', ['levels', 0, 'heat_to_pot_w'])).toBeNull();
  });
});

describe('plannedEdits', () => {
  it('edits only the fitted parameters, each at its key', () => {
    const parameter = (
      id: string,
      kind: 'permeability' | 'heat' | 'heat-loss',
      level?: string,
    ) => ({
      id,
      kind,
      ...(level ? { level } : {}),
      prior: 1,
      min: 0,
      max: 10,
    });
    const report = {
      estimates: [
        {
          parameter: parameter('permeability', 'permeability'),
          status: 'kept',
          value: 8e-13,
          reason: 'too-few-observations',
        },
        {
          parameter: parameter('heat:high', 'heat', 'high'),
          status: 'fitted',
          value: 486.04,
          sigma: 2.4,
          relativeSigma: 0.005,
        },
        {
          parameter: parameter('heat-loss', 'heat-loss'),
          status: 'kept',
          value: 0.12,
          reason: 'too-uncertain',
        },
      ],
    } as unknown as FitReport;
    const stove = {
      levels: [{ label: 'low' }, { label: 'medium' }, { label: 'high' }],
    } as unknown as StoveEntry;
    expect(plannedEdits(report, stove)).toEqual([
      {
        entry: 'stove',
        path: ['levels', 2, 'heat_to_pot_w'],
        value: 486,
        parameterId: 'heat:high',
      },
    ]);
  });
});

describe('editedText: provenance beside the value', () => {
  it('adds the note as a comment, keeps a comment the user wrote, and replaces an earlier note', () => {
    const text =
      'name: X\npermeability_m2: 0.8e-12 # from the grind chart\nretention_g_per_g: 1.2\n';
    const once = editedText(text, 'c.yaml', [
      {
        path: ['permeability_m2'],
        value: 1.08e-12,
        note: 'fitted ± 9 % from logs/a.yaml, 2026-12-02',
      },
      {
        path: ['retention_g_per_g'],
        value: 1.3,
        note: 'fitted ± 4 % from logs/a.yaml, 2026-12-02',
      },
    ]);
    expect(once).toBe(
      'name: X\npermeability_m2: 1.08e-12 # from the grind chart; fitted ± 9 % from logs/a.yaml, 2026-12-02\nretention_g_per_g: 1.3 # fitted ± 4 % from logs/a.yaml, 2026-12-02\n',
    );
    const twice = editedText(once, 'c.yaml', [
      {
        path: ['permeability_m2'],
        value: 1.1e-12,
        note: 'fitted ± 5 % from logs/b.yaml, 2026-12-03',
      },
    ]);
    expect(twice.split('\n')[1]).toBe(
      'permeability_m2: 1.1e-12 # from the grind chart; fitted ± 5 % from logs/b.yaml, 2026-12-03',
    );
  });
});
