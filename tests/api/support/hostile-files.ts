import zlib from 'node:zlib';
import crypto from 'node:crypto';
import sharp from 'sharp';

// Hand-made files for upload abuse tests: each is what it claims to be at the byte level
// (valid chunk CRCs, real deflate streams), so a refusal is the server's decision, not a parse accident.

const pngSignature = Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]);

function pngChunk(type: string, data: Buffer) {
  const length = Buffer.alloc(4);
  length.writeUInt32BE(data.length);
  const body = Buffer.concat([Buffer.from(type, 'latin1'), data]);
  const crc = Buffer.alloc(4);
  crc.writeUInt32BE(zlib.crc32(body));
  return Buffer.concat([length, body, crc]);
}

/**
 * A complete, valid 1-bit greyscale PNG of all-black rows. Each row is one filter byte plus w/8 bytes,
 * so 20000 × 20000 px is 50 MB of raw scanlines that deflate to about 50 KB: a decompression bomb
 * that would decode to 400 million pixels.
 */
export function blackPng1Bit(width: number, height: number): Buffer {
  const ihdr = Buffer.alloc(13);
  ihdr.writeUInt32BE(width, 0);
  ihdr.writeUInt32BE(height, 4);
  ihdr[8] = 1; // bit depth
  ihdr[9] = 0; // greyscale
  const scanlines = Buffer.alloc((1 + Math.ceil(width / 8)) * height);
  const idat = zlib.deflateSync(scanlines, { level: 9 });
  return Buffer.concat([pngSignature, pngChunk('IHDR', ihdr), pngChunk('IDAT', idat), pngChunk('IEND', Buffer.alloc(0))]);
}

/** A real JPEG whose frame header (SOF0) is rewritten to claim other dimensions. */
export async function jpegClaiming(width: number, height: number): Promise<Buffer> {
  const jpeg = Buffer.from(
    await sharp({ create: { width: 64, height: 48, channels: 3, background: { r: 29, g: 77, b: 58 } } })
      .jpeg()
      .toBuffer(),
  );
  const sof = jpeg.indexOf(Buffer.from([0xff, 0xc0]));
  if (sof < 0) throw new Error('no SOF0 marker in the generated JPEG');
  jpeg.writeUInt16BE(height, sof + 5);
  jpeg.writeUInt16BE(width, sof + 7);
  return jpeg;
}

/** A stored (uncompressed) ZIP archive with one entry, structurally complete: local header, central directory, end record. */
export function zipWith(name: string, content: string): Buffer {
  const data = Buffer.from(content);
  const fileName = Buffer.from(name);
  const crc = zlib.crc32(data);
  const local = Buffer.alloc(30);
  local.writeUInt32LE(0x04034b50, 0);
  local.writeUInt16LE(20, 4);
  local.writeUInt32LE(crc, 14);
  local.writeUInt32LE(data.length, 18);
  local.writeUInt32LE(data.length, 22);
  local.writeUInt16LE(fileName.length, 26);
  const central = Buffer.alloc(46);
  central.writeUInt32LE(0x02014b50, 0);
  central.writeUInt16LE(20, 4);
  central.writeUInt16LE(20, 6);
  central.writeUInt32LE(crc, 16);
  central.writeUInt32LE(data.length, 20);
  central.writeUInt32LE(data.length, 24);
  central.writeUInt16LE(fileName.length, 28);
  const localPart = Buffer.concat([local, fileName, data]);
  const centralPart = Buffer.concat([central, fileName]);
  const end = Buffer.alloc(22);
  end.writeUInt32LE(0x06054b50, 0);
  end.writeUInt16LE(1, 8);
  end.writeUInt16LE(1, 10);
  end.writeUInt32LE(centralPart.length, 12);
  end.writeUInt32LE(localPart.length, 16);
  return Buffer.concat([localPart, centralPart, end]);
}

export const pdfBytes = () =>
  Buffer.from(
    '%PDF-1.4\n%\xe2\xe3\xcf\xd3\n1 0 obj\n<< /Type /Catalog /Pages 2 0 R >>\nendobj\n2 0 obj\n<< /Type /Pages /Kids [] /Count 0 >>\nendobj\ntrailer\n<< /Root 1 0 R >>\n%%EOF\n',
    'latin1',
  );

export const svgBytes = () =>
  Buffer.from(
    '<?xml version="1.0"?>\n<svg xmlns="http://www.w3.org/2000/svg" width="64" height="64" onload="alert(document.cookie)"><script>alert(1)</script><rect width="64" height="64" fill="#b8892f"/></svg>\n',
  );

export const gifBytes = () =>
  sharp({ create: { width: 16, height: 16, channels: 3, background: { r: 164, g: 55, b: 42 } } })
    .gif()
    .toBuffer();

/** Random pixels do not compress, so the JPEG's size follows its pixel count; 3500 × 2625 at quality 92 is just under 8 MB. */
export async function noiseJpeg(width = 3500, height = 2625, quality = 92): Promise<Buffer> {
  const raw = crypto.randomBytes(width * height * 3);
  return sharp(raw, { raw: { width, height, channels: 3 } })
    .jpeg({ quality })
    .toBuffer();
}

type Part = { name: string; filename?: string; contentType?: string; data: Buffer | string };

/**
 * A multipart/form-data body written byte by byte, so names with NUL bytes, backslashes or 1,000
 * characters reach the server exactly as given (no client library rewrites them).
 */
export function multipartBody(parts: Part[], boundary = `----swapyard${crypto.randomBytes(8).toString('hex')}`) {
  const chunks: Buffer[] = [];
  for (const p of parts) {
    let head = `--${boundary}\r\nContent-Disposition: form-data; name="${p.name}"`;
    if (p.filename !== undefined) head += `; filename="${p.filename}"`;
    head += '\r\n';
    if (p.contentType) head += `Content-Type: ${p.contentType}\r\n`;
    chunks.push(Buffer.from(`${head}\r\n`, 'utf8'), Buffer.isBuffer(p.data) ? p.data : Buffer.from(p.data), Buffer.from('\r\n'));
  }
  chunks.push(Buffer.from(`--${boundary}--\r\n`));
  return { body: Buffer.concat(chunks), contentType: `multipart/form-data; boundary=${boundary}`, boundary };
}
