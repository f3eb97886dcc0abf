/** Pieces are joined up to about this many characters before each write (one system call per batch). */
const BATCH_CHARACTERS = 1 << 16;

/** The pieces of a text joined into batches of about 64 K characters, in order. */
export function* inBatches(pieces: Iterable<string>): Generator<string> {
  let batch: string[] = [];
  let length = 0;
  for (const piece of pieces) {
    batch.push(piece);
    length += piece.length;
    if (length >= BATCH_CHARACTERS) {
      yield batch.join("");
      batch = [];
      length = 0;
    }
  }
  if (length > 0) yield batch.join("");
}
