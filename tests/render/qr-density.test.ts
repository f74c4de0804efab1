/**
 * qrDensity(url): the version of the code qr.ts draws, found with a fixed mask and
 * remembered per address (render/qr-density.ts), against the byte-mode capacities of
 * ISO/IEC 18004 Table 7 at error correction M (from memory: 14, 26, 42, 62 bytes for
 * versions 1–4) and against qrcode's own choice with its best mask.
 */
import QRCode from 'qrcode';
import { describe, expect, it } from 'vitest';
import { MIN_MODULE_MM, qrDensity, QR_PRINTED_MM } from '../../generator/render/qr-density.ts';

describe('qrDensity(url)', () => {
  it('takes the smallest version that holds the bytes (ISO/IEC 18004 Table 7, M; from memory)', () => {
    // Lower-case letters only: one byte-mode segment of that many bytes.
    const capacities: [number, number][] = [
      [14, 1],
      [15, 2],
      [26, 2],
      [27, 3],
      [42, 3],
      [43, 4],
      [62, 4],
    ];
    for (const [bytes, version] of capacities) {
      expect(qrDensity('q'.repeat(bytes)).version, `${bytes} bytes`).toBe(version);
    }
  });

  it('is the version qrcode picks with its best mask, for addresses like the cards’', () => {
    const urls = [
      'https://cafe.example/cards/pot-01-3cup--coffee-01--stove-01-gas/',
      'https://cafe.example/cards/es/pot-09-9cup--coffee-20--stove-05-induction/',
      'https://a-much-longer-roastery-address.example/brew/coffee-11/es/',
      'HTTPS://CAFE.EXAMPLE/1234567890',
    ];
    for (const url of urls) {
      const density = qrDensity(url);
      expect(density.version, url).toBe(QRCode.create(url, { errorCorrectionLevel: 'M' }).version);
      // Own rule (qr-density.ts): 17 + 4v modules across the printed width.
      expect(density.modules).toBe(17 + 4 * density.version);
      expect(density.moduleMm).toBeCloseTo(QR_PRINTED_MM / density.modules, 12);
      // Asked again: the same answer (remembered).
      expect(qrDensity(url)).toEqual(density);
    }
    expect(qrDensity(urls[0]!).moduleMm).toBeGreaterThan(MIN_MODULE_MM);
  });
});
