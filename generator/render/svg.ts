/** Small helpers for SVG written by hand: escaping and stable number formatting. */

/** Escape text for XML content and attribute values. */
export function escapeXml(text: string): string {
  return text
    .replace(/&/g, '&amp;')
    .replace(/</g, '&lt;')
    .replace(/>/g, '&gt;')
    .replace(/"/g, '&quot;')
    .replace(/'/g, '&#39;');
}

/** A coordinate with two decimals at most, no "-0", no trailing zeros (stable bytes). */
export function n(value: number): string {
  const r = Math.round(value * 100) / 100;
  return String(Object.is(r, -0) ? 0 : r);
}

/** Attributes from an object, in the order given; values escaped. */
export function attrs(values: Record<string, string | number | undefined>): string {
  return Object.entries(values)
    .filter(([, v]) => v !== undefined)
    .map(([k, v]) => `${k}="${typeof v === 'number' ? n(v) : escapeXml(v!)}"`)
    .join(' ');
}

export function el(
  name: string,
  values: Record<string, string | number | undefined>,
  content?: string,
): string {
  const a = attrs(values);
  return content === undefined ? `<${name} ${a}/>` : `<${name} ${a}>${content}</${name}>`;
}
