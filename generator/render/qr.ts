/**
 * QR codes for card footers: the card's web address as inline SVG (qrcode package), so a
 * printed card opens its own page. Error correction M (15 % of the code may be damaged),
 * no quiet zone in the drawing (the layout leaves the margin around it).
 */
import QRCode from 'qrcode';

/** `label` is the code's accessible name, in the card's language (the voice's card.footer.qrLabel). */
export async function qrSvg(url: string, label = 'QR code'): Promise<string> {
  const svg = await QRCode.toString(url, { type: 'svg', margin: 0, errorCorrectionLevel: 'M' });
  const name = label.replace(/&/g, '&amp;').replace(/"/g, '&quot;').replace(/</g, '&lt;');
  return svg.replace('<svg ', `<svg class="qr" role="img" aria-label="${name}" `).trim();
}
