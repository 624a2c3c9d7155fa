import sharp from 'sharp';
import { crc32, deflateSync } from 'node:zlib';

/** A plain JPEG of one colour, as a phone might send, optionally carrying GPS and camera EXIF. */
export async function jpegPhoto(opts: { width?: number; height?: number; rgb?: [number, number, number]; withGps?: boolean } = {}): Promise<Buffer> {
  const [r, g, b] = opts.rgb ?? [190, 60, 50];
  let image = sharp({ create: { width: opts.width ?? 800, height: opts.height ?? 600, channels: 3, background: { r, g, b } } }).jpeg({ quality: 85 });
  if (opts.withGps) {
    image = image.withExif({
      IFD0: { Make: 'PocketCam', Model: 'PC-7' },
      IFD3: { GPSLatitudeRef: 'N', GPSLatitude: '51/1 30/1 0/1', GPSLongitudeRef: 'W', GPSLongitude: '0/1 7/1 0/1' },
    });
  }
  return image.toBuffer();
}

function pngChunk(type: string, data: Buffer): Buffer {
  const length = Buffer.alloc(4);
  length.writeUInt32BE(data.length);
  const typed = Buffer.concat([Buffer.from(type, 'latin1'), data]);
  const crc = Buffer.alloc(4);
  crc.writeUInt32BE(crc32(typed) >>> 0);
  return Buffer.concat([length, typed, crc]);
}

/** A tiny PNG whose header claims width × height pixels: the shape of a decompression bomb. */
export function pngClaiming(width: number, height: number): Buffer {
  const header = Buffer.alloc(13);
  header.writeUInt32BE(width, 0);
  header.writeUInt32BE(height, 4);
  header[8] = 8; // bit depth
  header[9] = 2; // truecolour
  return Buffer.concat([
    Buffer.from([137, 80, 78, 71, 13, 10, 26, 10]),
    pngChunk('IHDR', header),
    pngChunk('IDAT', deflateSync(Buffer.alloc(1024))),
    pngChunk('IEND', Buffer.alloc(0)),
  ]);
}
