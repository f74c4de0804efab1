/**
 * QR codes for card footers: the card's web address as inline SVG (qrcode package), so a
 * printed card opens its own page. Error correction M (15 % of the code may be damaged),
 * no quiet zone in the drawing (the layout leaves the margin around it).
 */
import QRCode from 'qrcode';

export async function qrSvg(url: string): Promise<string> {
  const svg = await QRCode.toString(url, { type: 'svg', margin: 0, errorCorrectionLevel: 'M' });
  return svg.replace('<svg ', '<svg class="qr" role="img" aria-label="QR code" ').trim();
}
