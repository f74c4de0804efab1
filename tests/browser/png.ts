/**
 * Just enough PNG for screenshot regression checks, on node:zlib alone: decode the 8-bit,
 * non-interlaced images Chromium writes (grey, grey+alpha, RGB, RGBA; all five row filters,
 * PNG spec §9), encode RGBA for a diff picture, and compare two images pixel by pixel.
 */
import { crc32, deflateSync, inflateSync } from 'node:zlib';

export interface Rgba {
  readonly width: number;
  readonly height: number;
  /** width × height × 4 bytes, row by row. */
  readonly data: Uint8Array;
}

const SIGNATURE = Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]);
/** Samples per pixel by colour type (PNG spec Table 11.1); palettes are not needed here. */
const CHANNELS: Readonly<Record<number, number>> = { 0: 1, 2: 3, 4: 2, 6: 4 };

/** The Paeth predictor (PNG spec §9.4). */
function paeth(a: number, b: number, c: number): number {
  const p = a + b - c;
  const pa = Math.abs(p - a);
  const pb = Math.abs(p - b);
  const pc = Math.abs(p - c);
  return pa <= pb && pa <= pc ? a : pb <= pc ? b : c;
}

export function decodePng(png: Uint8Array): Rgba {
  const bytes = Buffer.from(png.buffer, png.byteOffset, png.byteLength);
  if (!bytes.subarray(0, 8).equals(SIGNATURE)) throw new Error('not a PNG (bad signature)');
  let width = 0;
  let height = 0;
  let colourType = -1;
  const idat: Buffer[] = [];
  for (let at = 8; at < bytes.length;) {
    const length = bytes.readUInt32BE(at);
    const type = bytes.toString('latin1', at + 4, at + 8);
    const body = bytes.subarray(at + 8, at + 8 + length);
    if (type === 'IHDR') {
      width = body.readUInt32BE(0);
      height = body.readUInt32BE(4);
      const [depth, colour, , , interlace] = [body[8], body[9], body[10], body[11], body[12]];
      if (depth !== 8) throw new Error(`PNG bit depth ${depth} is not supported (8 only)`);
      if (interlace !== 0) throw new Error('interlaced PNGs are not supported');
      if (colour === undefined || CHANNELS[colour] === undefined)
        throw new Error(`PNG colour type ${colour} is not supported`);
      colourType = colour;
    } else if (type === 'IDAT') {
      idat.push(body);
    } else if (type === 'IEND') {
      break;
    }
    at += 12 + length;
  }
  const channels = CHANNELS[colourType];
  if (channels === undefined || width === 0) throw new Error('PNG without an IHDR chunk');
  const raw = inflateSync(Buffer.concat(idat));
  const stride = width * channels;
  if (raw.length !== (stride + 1) * height)
    throw new Error(`PNG data is ${raw.length} bytes, expected ${(stride + 1) * height}`);

  const rows = new Uint8Array(stride * height);
  for (let y = 0; y < height; y++) {
    const filter = raw[y * (stride + 1)]!;
    const line = raw.subarray(y * (stride + 1) + 1, (y + 1) * (stride + 1));
    const out = y * stride;
    for (let x = 0; x < stride; x++) {
      const a = x >= channels ? rows[out + x - channels]! : 0;
      const b = y > 0 ? rows[out - stride + x]! : 0;
      const c = x >= channels && y > 0 ? rows[out - stride + x - channels]! : 0;
      const value = line[x]!;
      let predicted: number;
      switch (filter) {
        case 0:
          predicted = 0;
          break;
        case 1:
          predicted = a;
          break;
        case 2:
          predicted = b;
          break;
        case 3:
          predicted = (a + b) >> 1;
          break;
        case 4:
          predicted = paeth(a, b, c);
          break;
        default:
          throw new Error(`PNG row ${y} has unknown filter type ${filter}`);
      }
      rows[out + x] = (value + predicted) & 0xff;
    }
  }

  const data = new Uint8Array(width * height * 4);
  for (let i = 0; i < width * height; i++) {
    const s = i * channels;
    const grey = channels <= 2;
    data[i * 4] = rows[s]!;
    data[i * 4 + 1] = grey ? rows[s]! : rows[s + 1]!;
    data[i * 4 + 2] = grey ? rows[s]! : rows[s + 2]!;
    data[i * 4 + 3] = channels === 2 ? rows[s + 1]! : channels === 4 ? rows[s + 3]! : 255;
  }
  return { width, height, data };
}

function chunk(type: string, body: Buffer): Buffer {
  const head = Buffer.alloc(8);
  head.writeUInt32BE(body.length, 0);
  head.write(type, 4, 'latin1');
  const crc = Buffer.alloc(4);
  crc.writeUInt32BE(crc32(Buffer.concat([head.subarray(4), body])) >>> 0, 0);
  return Buffer.concat([head, body, crc]);
}

/** RGBA as a PNG (filter 0 on every row). */
export function encodePng(image: Rgba): Buffer {
  const header = Buffer.alloc(13);
  header.writeUInt32BE(image.width, 0);
  header.writeUInt32BE(image.height, 4);
  header.set([8, 6, 0, 0, 0], 8);
  const stride = image.width * 4;
  const raw = Buffer.alloc((stride + 1) * image.height);
  for (let y = 0; y < image.height; y++)
    raw.set(image.data.subarray(y * stride, (y + 1) * stride), y * (stride + 1) + 1);
  return Buffer.concat([
    SIGNATURE,
    chunk('IHDR', header),
    chunk('IDAT', deflateSync(raw)),
    chunk('IEND', Buffer.alloc(0)),
  ]);
}

export interface Difference {
  /** Pixels whose largest channel difference is above the tolerance. */
  readonly differing: number;
  readonly share: number;
  /** Bounding box of the differing pixels, or null when none differ. */
  readonly box: { x0: number; y0: number; x1: number; y1: number } | null;
  /** The expected image dimmed, with differing pixels in red. */
  readonly picture: Rgba;
}

/**
 * Pixels of `actual` that differ from `expected` by more than `tolerance` (0–255) in any
 * channel; both must have the same size.
 */
export function compareImages(expected: Rgba, actual: Rgba, tolerance: number): Difference {
  if (expected.width !== actual.width || expected.height !== actual.height)
    throw new Error(
      `image sizes differ: expected ${expected.width}×${expected.height}, got ${actual.width}×${actual.height}`,
    );
  const { width, height } = expected;
  const picture = new Uint8Array(width * height * 4);
  let differing = 0;
  let box: Difference['box'] = null;
  for (let y = 0; y < height; y++) {
    for (let x = 0; x < width; x++) {
      const i = (y * width + x) * 4;
      let worst = 0;
      for (let c = 0; c < 4; c++)
        worst = Math.max(worst, Math.abs(expected.data[i + c]! - actual.data[i + c]!));
      if (worst > tolerance) {
        differing++;
        picture.set([255, 0, 0, 255], i);
        box = box
          ? {
              x0: Math.min(box.x0, x),
              y0: Math.min(box.y0, y),
              x1: Math.max(box.x1, x),
              y1: Math.max(box.y1, y),
            }
          : { x0: x, y0: y, x1: x, y1: y };
      } else {
        const grey = (expected.data[i]! + expected.data[i + 1]! + expected.data[i + 2]!) / 3;
        const faded = 255 - (255 - grey) * 0.25;
        picture.set([faded, faded, faded, 255], i);
      }
    }
  }
  return {
    differing,
    share: differing / (width * height),
    box,
    picture: { width, height, data: picture },
  };
}
