/**
 * A greyscale 8-bit PNG writer (PNG specification, ISO/IEC 15948 / W3C; zlib RFC 1950; deflate RFC 1951).
 * The pixel data goes into "stored" deflate blocks (no compression): a few lines of pure code, so the core and the
 * web view can write PNGs with no node:zlib and no dependency, at the price of files the size of the raw pixels
 * (64 KB for 256×256), which is fine for pictures of this size.
 * Layout: grey[row·width + col], row 0 at the top (PNG order).
 */

const CRC_TABLE = (() => {
  const table = new Uint32Array(256);
  for (let n = 0; n < 256; n++) {
    let c = n;
    for (let k = 0; k < 8; k++) c = c & 1 ? 0xedb88320 ^ (c >>> 1) : c >>> 1;
    table[n] = c >>> 0;
  }
  return table;
})();

/** CRC-32 of the PNG specification (polynomial 0xEDB88320, reflected). */
export function crc32(bytes: Uint8Array, start = 0, end = bytes.length): number {
  let c = 0xffffffff;
  for (let i = start; i < end; i++) c = CRC_TABLE[(c ^ bytes[i]) & 0xff] ^ (c >>> 8);
  return (c ^ 0xffffffff) >>> 0;
}

/** Adler-32 of RFC 1950. */
export function adler32(bytes: Uint8Array): number {
  let a = 1, b = 0;
  for (let i = 0; i < bytes.length; i++) {
    a = (a + bytes[i]) % 65521;
    b = (b + a) % 65521;
  }
  return ((b << 16) | a) >>> 0;
}

function chunk(type: string, data: Uint8Array): Uint8Array {
  const out = new Uint8Array(12 + data.length);
  const view = new DataView(out.buffer);
  view.setUint32(0, data.length);
  for (let i = 0; i < 4; i++) out[4 + i] = type.charCodeAt(i);
  out.set(data, 8);
  view.setUint32(8 + data.length, crc32(out, 4, 8 + data.length));
  return out;
}

/** zlib stream of stored deflate blocks (at most 65535 bytes each). */
function storedZlib(raw: Uint8Array): Uint8Array {
  const blocks = Math.max(1, Math.ceil(raw.length / 65535));
  const out = new Uint8Array(2 + 5 * blocks + raw.length + 4);
  out[0] = 0x78; // deflate, 32 KB window
  out[1] = 0x01; // check bits: (0x78·256 + 0x01) % 31 = 0
  let at = 2;
  for (let b = 0; b < blocks; b++) {
    const start = b * 65535;
    const length = Math.min(65535, raw.length - start);
    out[at] = b === blocks - 1 ? 1 : 0;
    out[at + 1] = length & 0xff;
    out[at + 2] = length >>> 8;
    out[at + 3] = ~length & 0xff;
    out[at + 4] = (~length >>> 8) & 0xff;
    out.set(raw.subarray(start, start + length), at + 5);
    at += 5 + length;
  }
  new DataView(out.buffer).setUint32(at, adler32(raw));
  return out;
}

/** A greyscale 8-bit PNG of width × height pixels. */
export function encodeGreyPng(width: number, height: number, grey: Uint8Array): Uint8Array {
  const header = new Uint8Array(13);
  const view = new DataView(header.buffer);
  view.setUint32(0, width);
  view.setUint32(4, height);
  header[8] = 8; // bit depth
  header[9] = 0; // colour type: greyscale
  const raw = new Uint8Array((width + 1) * height);
  for (let row = 0; row < height; row++) raw.set(grey.subarray(row * width, (row + 1) * width), row * (width + 1) + 1); // filter 0
  const parts = [Uint8Array.of(0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a), chunk('IHDR', header), chunk('IDAT', storedZlib(raw)), chunk('IEND', new Uint8Array(0))];
  const out = new Uint8Array(parts.reduce((sum, p) => sum + p.length, 0));
  let at = 0;
  for (const p of parts) {
    out.set(p, at);
    at += p.length;
  }
  return out;
}
