import type { Library } from './library.js';

/**
 * A Library that opens on first use, and again after a failed open: a
 * service can start while its database is down, answer 503 meanwhile
 * ('storage-unavailable' from the engine), and recover by itself when the
 * database returns, without a restart. Calls made while an open is under way
 * share it. `engine` is known before opening; `readOnly` is false until the
 * library has opened.
 */
export function lazyLibrary(engine: Library['engine'], open: () => Promise<Library>): Library {
  let opening: Promise<Library> | undefined;
  let opened: Library | undefined;
  let closed = false;

  const library = (): Promise<Library> => {
    if (opened) return Promise.resolve(opened);
    opening ??= open().then(
      (lib) => {
        if (closed) {
          void lib.close();
        } else {
          opened = lib;
        }
        return lib;
      },
      (error: unknown) => {
        opening = undefined;
        throw error;
      },
    );
    return opening;
  };

  return {
    engine,
    get readOnly() {
      return opened?.readOnly ?? false;
    },
    add: async (record) => (await library()).add(record),
    addMany: async (records) => (await library()).addMany(records),
    list: async (options) => (await library()).list(options),
    listAll: async (filter) => (await library()).listAll(filter),
    listFits: async (filter) => (await library()).listFits(filter),
    seriesColumns: async (ion) => (await library()).seriesColumns(ion),
    seriesRead: async (ion, fn) => (await library()).seriesRead(ion, fn),
    listPages: (filter, pageSize) => ({
      async *[Symbol.asyncIterator]() {
        yield* (await library()).listPages(filter, pageSize);
      },
    }),
    get: async (id) => (await library()).get(id),
    getMany: async (ids) => (await library()).getMany(ids),
    getOriginal: async (id) => (await library()).getOriginal(id),
    update: async (id, patch) => (await library()).update(id, patch),
    remove: async (id) => (await library()).remove(id),
    ping: async () => (await library()).ping(),
    // A view that opens with the library; closing it leaves the library open.
    scoped: (scope) => lazyLibrary(engine, async () => (await library()).scoped(scope)),
    users: {
      add: async (name, group, admin) => (await library()).users.add(name, group, admin),
      list: async () => (await library()).users.list(),
      newToken: async (name) => (await library()).users.newToken(name),
      remove: async (name) => (await library()).users.remove(name),
      resolveToken: async (token) => (await library()).users.resolveToken(token),
      count: async () => (await library()).users.count(),
    },
    close: async () => {
      closed = true;
      const lib = opened ?? (await opening?.catch(() => undefined));
      opened = undefined;
      await lib?.close();
    },
  };
}
