import { describe, expect, it } from 'vitest';
import JSZip from 'jszip';
import { zipOf } from '../../server/exports/zip';

describe('zipOf read back with jszip', () => {
  it('holds every file as given, the same bytes, and the same zip for the same files', async () => {
    const pdf = Buffer.from([0x25, 0x50, 0x44, 0x46, 0, 1, 2, 255]);
    const files = [
      { name: 'frame-4/layer-1.pdf', data: pdf },
      { name: 'frame-4/frame-4.dxf', data: '0\r\nSECTION\r\n' },
      { name: 'bevels.csv', data: 'a,b\r\n1,2\r\n' },
    ];
    const buf = await zipOf(files);
    const zip = await JSZip.loadAsync(buf);
    expect(Object.keys(zip.files).filter((n) => !zip.files[n]!.dir).sort()).toEqual(files.map((f) => f.name).sort());
    expect(Buffer.from(await zip.file('frame-4/layer-1.pdf')!.async('uint8array'))).toEqual(pdf);
    expect(await zip.file('bevels.csv')!.async('string')).toBe('a,b\r\n1,2\r\n');
    expect((await zipOf(files)).equals(buf)).toBe(true);
  });

  it('refuses names that climb out, are absolute or come twice', async () => {
    await expect(zipOf([{ name: '../x', data: '' }])).rejects.toThrow(/relative/);
    await expect(zipOf([{ name: '/x', data: '' }])).rejects.toThrow(/relative/);
    await expect(zipOf([{ name: 'a', data: '' }, { name: 'a', data: '' }])).rejects.toThrow(/twice/);
  });
});
