/** One stored object as read back: the bytes (or a stream of them) and the type it was stored with. */
export interface StoredObject {
  body: Uint8Array<ArrayBuffer> | ReadableStream<Uint8Array>;
  contentType: string;
  /** The length in bytes, when the store says it. */
  size?: number;
}

/**
 * Where photo bytes live. Keys are made by the server (a random UUID and an extension), never taken
 * from a request, so an implementation may refuse any other shape of key.
 */
export interface ObjectStorage {
  /** Which implementation, for logs and tests. */
  readonly kind: 'filesystem' | 's3';
  /** Stores `bytes` under `key`; resolves once they are durably stored. */
  put(key: string, bytes: Uint8Array, contentType: string): Promise<void>;
  /** The object, or null when nothing is stored under `key`. */
  get(key: string): Promise<StoredObject | null>;
  /** Removes the object; removing a missing one is not an error. */
  delete(key: string): Promise<void>;
}

/** Keys look like `<uuid>.jpg` or `<uuid>.webp`; anything else (a path, `..`) is refused. */
export const OBJECT_KEY_PATTERN = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}\.(jpg|webp)$/;

/** Throws unless `key` is one the server could have made. */
export function assertObjectKey(key: string): void {
  if (!OBJECT_KEY_PATTERN.test(key))
    throw new Error(`Refusing storage key ${JSON.stringify(key)}: keys are <uuid>.jpg or <uuid>.webp.`);
}
