import { Readable, Transform } from "node:stream";
import { createInflateRaw } from "node:zlib";
import { ImportFileError } from "./errors";

/**
 * Limits on what a workbook may unpack to. A 20,000-row sheet of every import column unpacks to
 * some 40 MB of XML, so 200 MB leaves room; XML compresses some 10:1 to 30:1, so more than 200:1
 * on a part larger than 1 MB is a compression bomb, not a spreadsheet.
 * Refusals answer 413 (the content is too large), like an upload over the size limit.
 */
export const ZIP_LIMITS = {
  maxTotalUncompressedBytes: 200_000_000,
  maxRatio: 200,
  ratioCheckedAboveBytes: 1_000_000,
  maxEntries: 10_000,
} as const;

export interface ZipEntry {
  name: string;
  method: number;
  compressedSize: number;
  uncompressedSize: number;
  localHeaderOffset: number;
}

// Record signatures and layouts: PKWARE APPNOTE.TXT 6.3, §4.3.7 (local header), §4.3.12
// (central directory header), §4.3.14–4.3.16 (ZIP64 end records), §4.5.3 (ZIP64 extra field).
const LOCAL_HEADER = 0x04034b50;
const CENTRAL_HEADER = 0x02014b50;
const END_OF_CENTRAL_DIR = 0x06054b50;
const ZIP64_END_LOCATOR = 0x07064b50;
const ZIP64_END = 0x06064b50;
const ZIP64_EXTRA = 0x0001;
const U16_MAX = 0xffff;
const U32_MAX = 0xffffffff;

const damaged = (fileName: string, what: string) =>
  new ImportFileError(
    422,
    `"${fileName}" looks like an Excel workbook but is damaged (${what}); open it in Excel, save it again as .xlsx and upload that`,
  );

const megabytes = (bytes: number) => `${Math.round(bytes / 1_000_000)} MB`;

function findEndOfCentralDirectory(view: DataView): number {
  // The record is 22 bytes plus a comment of at most 65,535 bytes at the very end of the file.
  const last = view.byteLength - 22;
  const first = Math.max(0, last - U16_MAX);
  for (let at = last; at >= first; at--) {
    if (view.getUint32(at, true) === END_OF_CENTRAL_DIR) return at;
  }
  return -1;
}

function readBigUint64(view: DataView, at: number): number {
  const value = view.getBigUint64(at, true);
  return value > BigInt(Number.MAX_SAFE_INTEGER) ? Number.MAX_SAFE_INTEGER : Number(value);
}

/** The entries of a zip's central directory, without unpacking anything. */
export function readZipDirectory(bytes: Uint8Array, fileName: string): ZipEntry[] {
  const view = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  const eocd = view.byteLength >= 22 ? findEndOfCentralDirectory(view) : -1;
  if (eocd < 0) throw damaged(fileName, "no zip directory");

  let count = view.getUint16(eocd + 10, true);
  let directoryOffset = view.getUint32(eocd + 16, true);
  if (count === U16_MAX || directoryOffset === U32_MAX) {
    const locator = eocd - 20;
    if (locator < 0 || view.getUint32(locator, true) !== ZIP64_END_LOCATOR) {
      throw damaged(fileName, "no ZIP64 directory locator");
    }
    const zip64End = readBigUint64(view, locator + 8);
    if (zip64End + 56 > view.byteLength || view.getUint32(zip64End, true) !== ZIP64_END) {
      throw damaged(fileName, "no ZIP64 directory");
    }
    count = readBigUint64(view, zip64End + 32);
    directoryOffset = readBigUint64(view, zip64End + 48);
  }
  if (count > ZIP_LIMITS.maxEntries) {
    throw new ImportFileError(
      413,
      `"${fileName}" holds ${count} parts; a workbook has a few dozen — save the sheet on its own as .xlsx and upload that`,
    );
  }

  const entries: ZipEntry[] = [];
  let at = directoryOffset;
  for (let i = 0; i < count; i++) {
    if (at + 46 > view.byteLength || view.getUint32(at, true) !== CENTRAL_HEADER) {
      throw damaged(fileName, "a broken zip directory");
    }
    const nameLength = view.getUint16(at + 28, true);
    const extraLength = view.getUint16(at + 30, true);
    const commentLength = view.getUint16(at + 32, true);
    const entry: ZipEntry = {
      name: new TextDecoder().decode(bytes.subarray(at + 46, at + 46 + nameLength)),
      method: view.getUint16(at + 10, true),
      compressedSize: view.getUint32(at + 20, true),
      uncompressedSize: view.getUint32(at + 24, true),
      localHeaderOffset: view.getUint32(at + 42, true),
    };
    readZip64Extra(view, at + 46 + nameLength, extraLength, entry);
    entries.push(entry);
    at += 46 + nameLength + extraLength + commentLength;
  }
  return entries;
}

/** ZIP64 sizes replace the 32-bit fields that read 0xFFFFFFFF, in the order APPNOTE §4.5.3 gives. */
function readZip64Extra(view: DataView, start: number, length: number, entry: ZipEntry): void {
  const end = Math.min(start + length, view.byteLength);
  for (let at = start; at + 4 <= end;) {
    const id = view.getUint16(at, true);
    const size = view.getUint16(at + 2, true);
    if (id === ZIP64_EXTRA) {
      let field = at + 4;
      const take = (): number => {
        const value = field + 8 <= end ? readBigUint64(view, field) : U32_MAX;
        field += 8;
        return value;
      };
      if (entry.uncompressedSize === U32_MAX) entry.uncompressedSize = take();
      if (entry.compressedSize === U32_MAX) entry.compressedSize = take();
      if (entry.localHeaderOffset === U32_MAX) entry.localHeaderOffset = take();
      return;
    }
    at += 4 + size;
  }
}

function refuseDeclaredSizes(entries: readonly ZipEntry[], fileName: string): void {
  let total = 0;
  for (const entry of entries) {
    total += entry.uncompressedSize;
    const ratio = entry.uncompressedSize / Math.max(entry.compressedSize, 1);
    if (entry.uncompressedSize > ZIP_LIMITS.ratioCheckedAboveBytes && ratio > ZIP_LIMITS.maxRatio) {
      throw new ImportFileError(
        413,
        `"${fileName}" unpacks one part ${Math.round(ratio)} times larger than it is packed (${megabytes(entry.uncompressedSize)}); that is not an ordinary workbook — save the sheet again from Excel as .xlsx or as CSV UTF-8`,
      );
    }
  }
  if (total > ZIP_LIMITS.maxTotalUncompressedBytes) {
    throw new ImportFileError(
      413,
      `"${fileName}" unpacks to ${megabytes(total)}; the limit is ${megabytes(ZIP_LIMITS.maxTotalUncompressedBytes)} — remove pictures and other sheets, or split the file`,
    );
  }
}

const tooLarge = (fileName: string, entry: ZipEntry) =>
  new ImportFileError(
    413,
    `"${fileName}" unpacks to more than its zip directory declares (part ${entry.name}); that is not an ordinary workbook — save the sheet again from Excel as .xlsx or as CSV UTF-8`,
  );

/** Compressed bytes are fed to the inflater in slices this size, so no step holds much. */
const SLICE_BYTES = 64 * 1024;

/**
 * One part's unpacked bytes as a stream, inflated a slice at a time with a running count: the
 * stream fails with a 413 at the byte that passes the part's declared size (or `capBytes` with
 * `capError`, when smaller), so a lying part stops there instead of filling the memory. Nothing
 * but the slice in flight is held.
 */
export function openPart(
  bytes: Uint8Array,
  entry: ZipEntry,
  fileName: string,
  cap?: {
    bytes: number;
    error: () => ImportFileError;
    /** Checked at every chunk: a refusal that depends on what the reader made of the part so far. */
    check?: () => ImportFileError | null;
  },
): Readable {
  const view = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  const at = entry.localHeaderOffset;
  if (at + 30 > view.byteLength || view.getUint32(at, true) !== LOCAL_HEADER) {
    throw damaged(fileName, `part ${entry.name} is missing`);
  }
  const start = at + 30 + view.getUint16(at + 26, true) + view.getUint16(at + 28, true);
  const data = bytes.subarray(start, start + entry.compressedSize);
  if (entry.method === 0 && entry.compressedSize !== entry.uncompressedSize)
    throw damaged(fileName, `part ${entry.name} has a wrong size`);
  if (entry.method !== 0 && entry.method !== 8)
    throw damaged(fileName, `part ${entry.name} uses a compression Excel does not write`);

  function* slices() {
    for (let i = 0; i < data.length; i += SLICE_BYTES)
      yield Buffer.from(data.buffer, data.byteOffset + i, Math.min(SLICE_BYTES, data.length - i));
  }
  const source = Readable.from(slices(), { objectMode: false });
  let seen = 0;
  const counter = new Transform({
    transform(chunk: Buffer, _encoding, done) {
      seen += chunk.length;
      if (seen > entry.uncompressedSize) return done(tooLarge(fileName, entry));
      if (cap && seen > cap.bytes) return done(cap.error());
      const refusal = cap?.check?.();
      if (refusal) return done(refusal);
      done(null, chunk);
    },
  });
  const stop = (error: Error) => {
    source.destroy();
    inflater?.destroy();
    counter.destroy(error);
  };
  const inflater = entry.method === 8 ? createInflateRaw({ chunkSize: SLICE_BYTES }) : null;
  if (inflater) {
    inflater.on("error", () => stop(damaged(fileName, `part ${entry.name} cannot be unpacked`)));
    source.pipe(inflater).pipe(counter);
  } else {
    source.pipe(counter);
  }
  // A refusal from the counter stops the inflating too: nothing runs on after the cap.
  counter.on("error", () => {
    source.destroy();
    inflater?.destroy();
  });
  return counter;
}

/**
 * Every part's stored bytes unpack to no more than its directory claims: a directory can lie, and
 * a zip reader that trusts it can be made to unpack far more. Each part is streamed through the
 * inflater with a running count (openPart) and the output dropped, so a lying part stops at its
 * declared size and no whole part is ever held in memory.
 */
async function refuseLyingSizes(
  bytes: Uint8Array,
  entries: readonly ZipEntry[],
  fileName: string,
): Promise<void> {
  for (const entry of entries) {
    const part = openPart(bytes, entry, fileName);
    try {
      for await (const chunk of part) void chunk;
    } catch (error) {
      if (error instanceof ImportFileError) throw error;
      throw damaged(fileName, `part ${entry.name} cannot be unpacked`);
    }
  }
}

/**
 * Refuses a zip before anything unpacks it in full: first on the sizes its directory declares
 * (total and ratio), then on parts that unpack to more than declared. Returns the entries.
 */
export async function assertSafeZip(bytes: Uint8Array, fileName: string): Promise<ZipEntry[]> {
  const entries = readZipDirectory(bytes, fileName);
  refuseDeclaredSizes(entries, fileName);
  await refuseLyingSizes(bytes, entries, fileName);
  return entries;
}
