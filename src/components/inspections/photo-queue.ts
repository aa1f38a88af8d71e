/**
 * Photos waiting on this device for their inspection to reach Lashline, or for a connection: kept in
 * IndexedDB (a photo is too large for localStorage) under the draft's local id, so a reload, a closed tab
 * or a dropped connection loses none. Each leaves the queue once the server has it (decision 004).
 */
export interface QueuedPhoto {
  key: string;
  draftId: string;
  side: 'drive' | 'coast';
  file: File;
  addedAt: number;
}

export interface PhotoQueue {
  list(draftId: string): Promise<QueuedPhoto[]>;
  put(photo: QueuedPhoto): Promise<void>;
  remove(key: string): Promise<void>;
}

const DB_NAME = 'lashline-photos';
const STORE = 'waiting';

function open(): Promise<IDBDatabase> {
  return new Promise((resolve, reject) => {
    const request = indexedDB.open(DB_NAME, 1);
    request.onupgradeneeded = () => {
      const store = request.result.createObjectStore(STORE, { keyPath: 'key' });
      store.createIndex('draftId', 'draftId');
    };
    request.onsuccess = () => resolve(request.result);
    request.onerror = () => reject(request.error ?? new Error('IndexedDB did not open'));
  });
}

function run<T>(mode: IDBTransactionMode, work: (store: IDBObjectStore) => IDBRequest<T>): Promise<T> {
  return open().then(
    (db) =>
      new Promise<T>((resolve, reject) => {
        const transaction = db.transaction(STORE, mode);
        const request = work(transaction.objectStore(STORE));
        transaction.oncomplete = () => {
          db.close();
          resolve(request.result);
        };
        transaction.onerror = () => {
          db.close();
          reject(transaction.error ?? new Error('IndexedDB refused the change'));
        };
      }),
  );
}

/** The device's queue; a plain in-memory one where IndexedDB is missing (a test, a locked-down browser). */
export function browserPhotoQueue(): PhotoQueue {
  if (typeof indexedDB === 'undefined') return memoryPhotoQueue();
  return {
    list: async (draftId) =>
      (await run('readonly', (store) => store.index('draftId').getAll(draftId) as IDBRequest<QueuedPhoto[]>)).sort(
        (a, b) => a.addedAt - b.addedAt,
      ),
    put: async (photo) => {
      await run('readwrite', (store) => store.put(photo));
    },
    remove: async (key) => {
      await run('readwrite', (store) => store.delete(key));
    },
  };
}

export function memoryPhotoQueue(): PhotoQueue {
  const photos = new Map<string, QueuedPhoto>();
  return {
    list: (draftId) => Promise.resolve([...photos.values()].filter((p) => p.draftId === draftId)),
    put: (photo) => {
      photos.set(photo.key, photo);
      return Promise.resolve();
    },
    remove: (key) => {
      photos.delete(key);
      return Promise.resolve();
    },
  };
}
