/**
 * WOFF 1.0 to plain SFNT (TrueType/OpenType) bytes, done once when the fonts are loaded. The
 * card embeds the shipped @fontsource WOFF files; handed to pdfmake as WOFF, its font library
 * inflates the compressed tables again on every read, in JavaScript, for every document (about a
 * second a card). Unpacked once, the same fonts lay out a card in a few tens of milliseconds.
 *
 * Layout per the W3C "WOFF File Format 1.0" recommendation: a 44-byte header, then one 20-byte
 * directory entry per table (tag, offset, compLength, origLength, origChecksum), each table
 * zlib-compressed when compLength < origLength. The SFNT is the 12-byte offset table, 16-byte
 * table records (tag, checksum, offset, length) and the tables on 4-byte boundaries.
 * `inflate` is zlib's (Node's zlib.inflateSync, or the browser's DecompressionStream('deflate')).
 */
export type Inflate = (compressed: Uint8Array) => Uint8Array | Promise<Uint8Array>;

const WOFF_SIGNATURE = 0x774f4646; // 'wOFF'

export async function woffToSfnt(woff: Uint8Array, inflate: Inflate): Promise<Uint8Array> {
  const view = new DataView(woff.buffer, woff.byteOffset, woff.byteLength);
  if (woff.byteLength < 44 || view.getUint32(0) !== WOFF_SIGNATURE) throw new Error('Not a WOFF 1.0 font file.');
  const flavor = view.getUint32(4);
  const numTables = view.getUint16(12);
  const tables: { tag: number; checksum: number; data: Uint8Array }[] = [];
  for (let i = 0; i < numTables; i++) {
    const entry = 44 + i * 20;
    const tag = view.getUint32(entry);
    const offset = view.getUint32(entry + 4);
    const compLength = view.getUint32(entry + 8);
    const origLength = view.getUint32(entry + 12);
    const checksum = view.getUint32(entry + 16);
    if (offset + compLength > woff.byteLength) throw new Error('The WOFF font file is cut short.');
    const stored = woff.subarray(offset, offset + compLength);
    const data = compLength < origLength ? await inflate(stored) : stored;
    if (data.byteLength !== origLength) throw new Error('A table of the WOFF font file does not unpack to its stated length.');
    tables.push({ tag, checksum, data });
  }
  const pad4 = (n: number) => (n + 3) & ~3;
  const headerLength = 12 + 16 * numTables;
  const total = tables.reduce((sum, table) => sum + pad4(table.data.byteLength), headerLength);
  const out = new Uint8Array(total);
  const outView = new DataView(out.buffer);
  let entrySelector = 0;
  while (2 ** (entrySelector + 1) <= numTables) entrySelector++;
  const searchRange = 2 ** entrySelector * 16;
  outView.setUint32(0, flavor);
  outView.setUint16(4, numTables);
  outView.setUint16(6, searchRange);
  outView.setUint16(8, entrySelector);
  outView.setUint16(10, numTables * 16 - searchRange);
  let offset = headerLength;
  tables.forEach((table, i) => {
    const record = 12 + i * 16;
    outView.setUint32(record, table.tag);
    outView.setUint32(record + 4, table.checksum);
    outView.setUint32(record + 8, offset);
    outView.setUint32(record + 12, table.data.byteLength);
    out.set(table.data, offset);
    offset += pad4(table.data.byteLength);
  });
  return out;
}
