/**
 * One voice per output: the language's words, document tag, decimal mark and date form,
 * and the numbers format.ts writes in it. Spain writes a decimal comma and dates
 * day/month/year (RAE, Ortografía de la lengua española 2010, from memory); English a
 * decimal point. Conversions are NIST SP 811 (as in format.test.ts).
 */
import { describe, expect, it } from 'vitest';
import { cupChartSpec, renderChartSvg } from '../../generator/render/chart.ts';
import {
  dose,
  pressure,
  quantity,
  temperature,
  waterVolume,
} from '../../generator/render/format.ts';
import { asVoice, voiceFor } from '../../generator/render/voice.ts';
import { wordsFor } from '../../generator/words/catalogue.ts';

describe('voiceFor', () => {
  it('gives each language its words, tag, decimal mark and date form', () => {
    const es = voiceFor('es', 'metric');
    expect(es).toMatchObject({ language: 'es', lang: 'es-ES', units: 'metric', decimal: ',' });
    expect(es.words).toBe(wordsFor('es'));
    expect(es.date('2026-12-03')).toBe('03/12/2026');
    const en = voiceFor('en', 'us');
    expect(en).toMatchObject({ language: 'en', lang: 'en-GB', units: 'us', decimal: '.' });
    expect(en.date('2026-12-03')).toBe('2026-12-03');
  });

  it('a bare unit system is the English voice of it', () => {
    expect(asVoice('us')).toBe(voiceFor('en', 'us'));
    expect(asVoice(undefined)).toBe(voiceFor('en', 'metric'));
  });

  it('an unknown language is an error, not English', () => {
    expect(() => voiceFor('xx', 'metric')).toThrow(/no words catalogue/);
  });
});

describe('numbers in the voice’s decimal mark', () => {
  const es = voiceFor('es', 'metric');
  const esUs = voiceFor('es', 'us');
  it('writes a decimal comma in Spanish and a point in English, digits unchanged', () => {
    // 14 g dose printed to 0.1 g; 0.123 bar = 12 300 Pa printed to 0.01 bar
    expect(dose(0.014, es).text).toBe('14,0\u00a0g');
    expect(dose(0.014, 'metric').text).toBe('14.0\u00a0g');
    expect(pressure(12_300, es).text).toBe('0,12\u00a0bar');
    // 150 mL = 5.07 fl oz (NIST SP 811, B.8: 1 fl oz = 29.5735 mL)
    expect(waterVolume(150e-6, esUs).text).toBe('5,1\u00a0fl oz');
    expect(waterVolume(150e-6, 'us').text).toBe('5.1\u00a0fl oz');
    // Whole numbers have no mark to change.
    expect(temperature(363.15, es).text).toBe('90\u00a0°C');
    expect(quantity(2.5, 1, 's', es).text).toBe('2,5\u00a0s');
  });

  it('the chart’s tick labels use the comma too', async () => {
    const curve = Array.from({ length: 20 }, (_, i) => ({ cupM3: i * 5e-6, extractionK: 350 + i }));
    const ticks = async (voice: ReturnType<typeof voiceFor>) =>
      [
        ...(
          await renderChartSvg(
            cupChartSpec({ units: voice, plan: curve, cold: curve, bandK: [363, 369] }),
          )
        ).matchAll(/<text[^>]*>([^<]*)<\/text>/g),
      ].map((m) => m[1]!);
    const spanish = await ticks(esUs);
    expect(spanish).toContain('0,5');
    expect(spanish.some((t) => /^\d+\.\d+$/.test(t))).toBe(false);
    expect(await ticks(voiceFor('en', 'us'))).toContain('0.5');
  });
});
