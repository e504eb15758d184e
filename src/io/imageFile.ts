/**
 * Reading a measured picture: PNG (8 or 16 bit, grey, grey + alpha, RGB, RGBA or palette; decoded by fast-png),
 * JPEG (decoded by jpeg-js), or a plain-text matrix of heights or currents (one row of numbers per line, separated
 * by blanks, commas or semicolons; lines starting with # are comments). Colour becomes grey by the luma weights
 * 0.299 R + 0.587 G + 0.114 B (ITU-R BT.601); alpha is ignored. Row 0 is the top row, as in the file.
 * Every refusal is `invalid <file>: … (<what is wrong>)`.
 */
import { convertIndexedToRgb, decode as decodePng } from 'fast-png';
import { decode as decodeJpeg } from 'jpeg-js';
import { invalid } from '../validate/invalid.ts';

/** Largest picture accepted (pixels) and largest side: 4096 × 4096 would need ~0.5 GB for the padded FFT. */
export const MAX_PICTURE_PIXELS = 2048 * 2048;
export const MAX_PICTURE_SIDE = 8192;
/** Smallest side (pixels): a few periods must fit. */
export const MIN_PICTURE_SIDE = 16;

export interface DecodedPicture {
  width: number;
  height: number;
  /** Grey values, row-major, row 0 at the top. */
  values: Float64Array;
  format: 'png' | 'jpeg' | 'text';
}

function checkSize(file: string, width: number, height: number): void {
  if (width * height > MAX_PICTURE_PIXELS || width > MAX_PICTURE_SIDE || height > MAX_PICTURE_SIDE) {
    invalid(file, `${width}×${height} pixels`, `too large: at most ${MAX_PICTURE_PIXELS} pixels (2048 × 2048) and ${MAX_PICTURE_SIDE} per side; crop or bin it`);
  }
  if (!(width >= MIN_PICTURE_SIDE && height >= MIN_PICTURE_SIDE)) invalid(file, `${width}×${height} pixels`, `too small: at least ${MIN_PICTURE_SIDE} pixels per side`);
}

function toGrey(file: string, width: number, height: number, data: ArrayLike<number>, channels: number): Float64Array {
  const n = width * height;
  if (data.length < n * channels) invalid(file, `${data.length} samples`, `truncated: ${width}×${height}×${channels} expected`);
  const out = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const at = i * channels;
    out[i] = channels >= 3 ? 0.299 * data[at] + 0.587 * data[at + 1] + 0.114 * data[at + 2] : data[at];
  }
  return out;
}

const PNG_SIGNATURE = [0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a];

function readPng(file: string, bytes: Uint8Array): DecodedPicture {
  if (bytes.length < 24) invalid(file, `${bytes.length} bytes`, 'not a PNG: truncated before the image header');
  const view = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  checkSize(file, view.getUint32(16), view.getUint32(20));
  let png;
  try {
    png = decodePng(bytes);
  } catch (error) {
    invalid(file, 'PNG', `cannot decode it: ${(error as Error).message}`);
  }
  checkSize(file, png.width, png.height);
  if (png.palette) {
    const rgb = convertIndexedToRgb(png);
    const channels = png.palette[0]?.length ?? 3;
    return { width: png.width, height: png.height, values: toGrey(file, png.width, png.height, rgb, channels), format: 'png' };
  }
  return { width: png.width, height: png.height, values: toGrey(file, png.width, png.height, png.data, png.channels), format: 'png' };
}

function readJpeg(file: string, bytes: Uint8Array): DecodedPicture {
  let jpeg;
  try {
    jpeg = decodeJpeg(bytes, { useTArray: true, formatAsRGBA: true, maxResolutionInMP: MAX_PICTURE_PIXELS / 1e6, maxMemoryUsageInMB: 512 });
  } catch (error) {
    const message = (error as Error).message ?? String(error);
    if (/maxResolutionInMP|maxMemoryUsageInMB/.test(message)) invalid(file, 'JPEG', `too large: at most ${MAX_PICTURE_PIXELS} pixels (2048 × 2048); crop or bin it`);
    invalid(file, 'JPEG', `cannot decode it: ${message}`);
  }
  checkSize(file, jpeg.width, jpeg.height);
  return { width: jpeg.width, height: jpeg.height, values: toGrey(file, jpeg.width, jpeg.height, jpeg.data, 4), format: 'jpeg' };
}

const NUMBER = /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/;

function readMatrix(file: string, bytes: Uint8Array): DecodedPicture {
  let text: string;
  try {
    text = new TextDecoder('utf-8', { fatal: true }).decode(bytes);
  } catch {
    invalid(file, `${bytes.length} bytes`, 'not an image: neither PNG, JPEG nor a text matrix of numbers');
  }
  // eslint-disable-next-line no-control-regex
  if (/[\u0000-\u0008\u000e-\u001f]/.test(text)) invalid(file, `${bytes.length} bytes`, 'not an image: neither PNG, JPEG nor a text matrix of numbers');
  const rows: number[][] = [];
  const lines = text.split(/\r?\n/);
  for (let l = 0; l < lines.length; l++) {
    const line = lines[l].trim();
    if (line === '' || line.startsWith('#')) continue;
    const tokens = line.split(/[\s,;]+/).filter((t) => t !== '');
    const row = tokens.map((token) => {
      if (!NUMBER.test(token)) invalid(`${file}:${l + 1}`, token, 'not a number: a text matrix holds one row of numbers per line');
      return Number(token);
    });
    if (rows.length > 0 && row.length !== rows[0].length) invalid(`${file}:${l + 1}`, `${row.length} numbers`, `rows differ in length: the first row has ${rows[0].length}`);
    rows.push(row);
    if (rows.length * row.length > MAX_PICTURE_PIXELS || rows.length > MAX_PICTURE_SIDE || row.length > MAX_PICTURE_SIDE) checkSize(file, row.length, rows.length);
  }
  if (rows.length === 0) invalid(file, 'text', 'empty: no rows of numbers');
  const width = rows[0].length, height = rows.length;
  checkSize(file, width, height);
  const values = new Float64Array(width * height);
  rows.forEach((row, r) => values.set(row, r * width));
  for (const v of values) if (!Number.isFinite(v)) invalid(file, v, 'not a finite number in the matrix');
  return { width, height, values, format: 'text' };
}

/** Decodes a picture file's bytes; `file` names it in errors. */
export function readPicture(file: string, bytes: Uint8Array): DecodedPicture {
  if (bytes.length === 0) invalid(file, '0 bytes', 'empty file');
  const picture = PNG_SIGNATURE.every((b, i) => bytes[i] === b)
    ? readPng(file, bytes)
    : bytes[0] === 0xff && bytes[1] === 0xd8 && bytes[2] === 0xff
      ? readJpeg(file, bytes)
      : readMatrix(file, bytes);
  let lo = Infinity, hi = -Infinity;
  for (const v of picture.values) {
    lo = Math.min(lo, v);
    hi = Math.max(hi, v);
  }
  if (!(hi > lo)) invalid(file, `${picture.width}×${picture.height} pixels`, `flat: every pixel is ${lo}`);
  return picture;
}
