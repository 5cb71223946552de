import { crc32 } from 'node:zlib';
import { describe, expect, it } from 'vitest';
import { figurePixels, withResolution } from '@/components/print-figure';

// The smallest valid PNG: signature and IHDR (1x1, 8-bit grey) then IEND, as ISO/IEC 15948 lays them out.
function tinyPng(): Uint8Array<ArrayBuffer> {
  const signature = [0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a];
  const chunk = (type: string, data: number[]) => {
    const body = Buffer.from([...Buffer.from(type, 'latin1'), ...data]);
    const out = Buffer.alloc(12 + data.length);
    out.writeUInt32BE(data.length, 0);
    body.copy(out, 4);
    out.writeUInt32BE(crc32(body), 8 + data.length); // Node's zlib CRC-32, the same polynomial as PNG's
    return [...out];
  };
  const ihdr = chunk('IHDR', [0, 0, 0, 1, 0, 0, 0, 1, 8, 0, 0, 0, 0]);
  return new Uint8Array([...signature, ...ihdr, ...chunk('IEND', [])]);
}

describe('figures for print', () => {
  it('when a width in centimetres is asked for at 300 dpi, then the pixels are width / 2.54 × 300', () => {
    // 8.5 cm / 2.54 cm per inch × 300 dpi = 1003.9 px; 17 cm = 2007.9 px (arithmetic from the definition of the inch)
    expect(figurePixels(8.5)).toBe(1004);
    expect(figurePixels(17)).toBe(2008);
  });

  it('when 600 dpi is asked for, then the pixels are width / 2.54 × 600', () => {
    // 8.5 cm / 2.54 × 600 = 2007.9 px; 17 cm / 2.54 × 600 = 4015.7 px (common practice: 1 in = 2.54 cm)
    expect(figurePixels(8.5, 600)).toBe(2008);
    expect(figurePixels(17, 600)).toBe(4016);
  });

  it('when the resolution is written, then a pHYs chunk after IHDR says 300 dpi with a CRC Node agrees with', () => {
    const png = withResolution(tinyPng(), 300);
    const bytes = Buffer.from(png);
    expect(bytes.toString('latin1', 37, 41)).toBe('pHYs');
    expect(bytes.readUInt32BE(33)).toBe(9);
    // 300 dpi = 300 / 0.0254 m = 11 811 pixels per metre (ISO/IEC 15948, 11.3.5.3: unit 1 is the metre)
    expect(bytes.readUInt32BE(41)).toBe(11811);
    expect(bytes.readUInt32BE(45)).toBe(11811);
    expect(bytes[49]).toBe(1);
    expect(bytes.readUInt32BE(50)).toBe(crc32(bytes.subarray(37, 50)));
    // IEND still closes the file, untouched
    expect(bytes.toString('latin1', bytes.length - 8, bytes.length - 4)).toBe('IEND');
  });

  it('when the PNG already states a resolution, then it is left as it is', () => {
    const once = withResolution(tinyPng(), 300);
    expect(withResolution(once, 150)).toBe(once);
  });
});
