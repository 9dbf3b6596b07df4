// WOFF 1.0 to the font it wraps (W3C, WOFF File Format 1.0, Recommendation 2012, §3–§5): a header,
// a table directory, and each table zlib-compressed unless that did not make it smaller. The share
// images' renderer reads TrueType/OpenType only, and the fonts the app ships are WOFF; every table is
// kept (Arabic needs its shaping tables), which the converters we tried did not do
// (docs/decisions/0028-reach.md).
import { inflateSync } from "node:zlib";

export function sfntFromWoff(woff: Buffer): Buffer {
  if (woff.toString("latin1", 0, 4) !== "wOFF") throw new Error("not a WOFF 1.0 file");
  const flavor = woff.readUInt32BE(4);
  const numTables = woff.readUInt16BE(12);
  const tables = Array.from({ length: numTables }, (_, i) => {
    const entry = 44 + 20 * i;
    const offset = woff.readUInt32BE(entry + 4);
    const compLength = woff.readUInt32BE(entry + 8);
    const origLength = woff.readUInt32BE(entry + 12);
    const stored = woff.subarray(offset, offset + compLength);
    return { tag: woff.readUInt32BE(entry), checksum: woff.readUInt32BE(entry + 16), data: compLength < origLength ? inflateSync(stored) : stored };
  });
  // The offset table of the font (OpenType: searchRange, entrySelector and rangeShift from the table count).
  const power = 2 ** Math.floor(Math.log2(numTables));
  const header = Buffer.alloc(12 + 16 * numTables);
  header.writeUInt32BE(flavor, 0);
  header.writeUInt16BE(numTables, 4);
  header.writeUInt16BE(power * 16, 6);
  header.writeUInt16BE(Math.log2(power), 8);
  header.writeUInt16BE(numTables * 16 - power * 16, 10);
  const parts: Buffer[] = [header];
  let offset = header.length;
  tables.forEach((table, i) => {
    const record = 12 + 16 * i;
    header.writeUInt32BE(table.tag, record);
    header.writeUInt32BE(table.checksum, record + 4);
    header.writeUInt32BE(offset, record + 8);
    header.writeUInt32BE(table.data.length, record + 12);
    // Each table starts on a four-byte boundary.
    const padded = Buffer.alloc(Math.ceil(table.data.length / 4) * 4);
    table.data.copy(padded);
    parts.push(padded);
    offset += padded.length;
  });
  return Buffer.concat(parts);
}
