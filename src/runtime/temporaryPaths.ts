/**
 * Hidden temporary files and folders that a hard stop must not leave behind. When the main
 * thread has to end a command thread that did not stop in time (or on a second Ctrl-C), it
 * cannot ask that thread what it was writing. So the writer notes each temporary path, before
 * creating it, in a SharedArrayBuffer the main thread can read after the thread is gone; the
 * note is synchronous, so it cannot be lost in a message queue.
 *
 * Layout: SLOTS slots of SLOT_BYTES; the first Int32 of a slot is the UTF-8 length (0: free).
 */
const SLOTS = 8;
const SLOT_BYTES = 4096;
const HEADER = Int32Array.BYTES_PER_ELEMENT;

let shared: SharedArrayBuffer | undefined;

export function createTemporaryRegistry(): SharedArrayBuffer {
  return new SharedArrayBuffer(SLOTS * SLOT_BYTES);
}

/** Note temporaries in this registry from now on (the command thread's). */
export function useTemporaryRegistry(registry: SharedArrayBuffer | undefined): void {
  shared = registry;
}

/**
 * Note `path` as temporary until the returned release is called. Without a registry (tests,
 * library use), or when every slot is taken or the path is too long, nothing is noted: the
 * ordinary error paths still clean up, only a hard stop could leave the path behind.
 */
export function holdTemporary(path: string): () => void {
  if (!shared) return () => {};
  const bytes = new TextEncoder().encode(path);
  if (bytes.length > SLOT_BYTES - HEADER) return () => {};
  const lengths = new Int32Array(shared);
  for (let slot = 0; slot < SLOTS; slot++) {
    const at = (slot * SLOT_BYTES) / HEADER;
    if (Atomics.load(lengths, at) !== 0) continue;
    new Uint8Array(shared, slot * SLOT_BYTES + HEADER, bytes.length).set(bytes);
    Atomics.store(lengths, at, bytes.length);
    const registry = shared;
    return () => Atomics.store(new Int32Array(registry), at, 0);
  }
  return () => {};
}

/** The paths still held in `registry` (read by the main thread after the writer is gone). */
export function heldTemporaries(registry: SharedArrayBuffer): string[] {
  const lengths = new Int32Array(registry);
  const paths: string[] = [];
  for (let slot = 0; slot < SLOTS; slot++) {
    const length = Atomics.load(lengths, (slot * SLOT_BYTES) / HEADER);
    if (length > 0) paths.push(new TextDecoder().decode(new Uint8Array(registry, slot * SLOT_BYTES + HEADER, length).slice()));
  }
  return paths;
}
