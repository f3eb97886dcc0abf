import { writeSync } from "node:fs";

// A non-blocking pipe or terminal that is full answers EAGAIN: wait a moment and try again.
const RETRY_MS = 5;
const pause = new Int32Array(new SharedArrayBuffer(4));

/**
 * Writes every byte of `bytes` to `descriptor`. writeSync may write fewer bytes than asked (a
 * full disk, a signal, a pipe), so it loops until all are written; any error is thrown to the
 * caller, with nothing hidden.
 */
export function writeAllSync(descriptor: number, bytes: Uint8Array): void {
  let offset = 0;
  while (offset < bytes.length) {
    try {
      const written = writeSync(descriptor, bytes, offset, bytes.length - offset);
      if (written <= 0) throw Object.assign(new Error("the write made no progress"), { code: "EIO" });
      offset += written;
    } catch (error) {
      if ((error as NodeJS.ErrnoException).code !== "EAGAIN") throw error;
      Atomics.wait(pause, 0, 0, RETRY_MS);
    }
  }
}
