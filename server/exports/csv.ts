/** CSV text as the file written: UTF-8 with a byte-order mark, which spreadsheet programs need to read accents. */
export function csvBuffer(text: string): Buffer {
  return Buffer.concat([Buffer.from([0xef, 0xbb, 0xbf]), Buffer.from(text, 'utf8')]);
}
