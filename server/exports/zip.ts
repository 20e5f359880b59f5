import JSZip from 'jszip';

/**
 * A zip of every file for a hull (jszip, DEFLATE). The caller passes the files; names are paths inside
 * the zip, with forward slashes.
 */

/** A file to put in the zip. */
export interface ZipFile {
  name: string;
  data: Buffer | Uint8Array | string;
}

/** Fixed date for every entry, so that the same files give the same zip (our choice). */
const ZIP_DATE = new Date(Date.UTC(2000, 0, 1));

/**
 * The zip of the files, as a Buffer.
 * @throws Error for a name that is empty, absolute, climbs out with "..", uses a backslash, or is given twice
 *   (a programmer error: the caller chooses the names).
 */
export async function zipOf(files: readonly ZipFile[], date: Date = ZIP_DATE): Promise<Buffer> {
  const zip = new JSZip();
  const seen = new Set<string>();
  for (const f of files) {
    const parts = f.name.split('/');
    if (!f.name || f.name.startsWith('/') || f.name.includes('\\') || parts.some((p) => p === '..' || p === '')) throw new Error(`zipOf: "${f.name}" is not a plain relative path`);
    if (seen.has(f.name)) throw new Error(`zipOf: "${f.name}" is given twice`);
    seen.add(f.name);
    // No implicit folder entries: jszip would date them now, and the same files must give the same bytes.
    zip.file(f.name, f.data, { date, binary: typeof f.data !== 'string', createFolders: false });
  }
  return zip.generateAsync({ type: 'nodebuffer', compression: 'DEFLATE', compressionOptions: { level: 6 }, platform: 'UNIX' });
}
