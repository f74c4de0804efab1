/**
 * Whether a card's QR code can be read at its printed size. The footer prints the code
 * QR_PRINTED_MM wide at the smallest paper's scale (templates/assets/card.css: 13 mm ×
 * --k, --k ≥ 0.97); a code of version v has 17 + 4v modules a side (ISO/IEC 18004 §5.3).
 * A module under MIN_MODULE_MM is too small for a phone camera at reading distance
 * (0.25 mm: common practice for print, no source). A longer address needs a higher
 * version, so too long an address gives a code no phone reads.
 */
import QRCode from 'qrcode';

export const QR_PRINTED_MM = 13 * 0.97;
export const MIN_MODULE_MM = 0.25;

export interface QrDensity {
  readonly version: number;
  readonly modules: number;
  readonly moduleMm: number;
}

/** Versions of the addresses this process has checked (a --serve session checks every build). */
const versions = new Map<string, number>();

/**
 * The version of the QR code qr.ts draws for `url` (error correction M): the smallest
 * that holds the address's segments (ISO/IEC 18004 §7.3, qrcode's own choice). The mask
 * pattern does not change it (§7.8), so the symbol is made with a fixed one: choosing
 * the best of eight was nine tenths of the check's time, about 1 ms an address.
 */
function versionOf(url: string): number {
  let version = versions.get(url);
  if (version === undefined) {
    ({ version } = QRCode.create(url, { errorCorrectionLevel: 'M', maskPattern: 0 }));
    versions.set(url, version);
  }
  return version;
}

/** The QR code qr.ts draws for `url` (error correction M), and its module size in print. */
export function qrDensity(url: string): QrDensity {
  const version = versionOf(url);
  const modules = 17 + 4 * version;
  return { version, modules, moduleMm: QR_PRINTED_MM / modules };
}

/** A card whose QR code would be too dense to read at its printed size. */
export class QrTooDenseError extends Error {
  override readonly name = 'QrTooDenseError';
  constructor(
    readonly url: string,
    readonly density: QrDensity,
  ) {
    super(`QR code too dense: ${url}`);
  }
}

/** Throws QrTooDenseError for the first address whose code is too dense. */
export function checkQrDensity(urls: Iterable<string>): void {
  for (const url of urls) {
    const density = qrDensity(url);
    if (density.moduleMm < MIN_MODULE_MM) throw new QrTooDenseError(url, density);
  }
}
