import type { CliIo } from '../../src/cli/io.ts';

/** An in-memory CliIo: files in a map, stdout and stderr collected. */
export function fakeIo(files: Record<string, string | Uint8Array> = {}): CliIo & { stdout: () => string; stderr: () => string; files: Map<string, string | Uint8Array> } {
  const store = new Map<string, string | Uint8Array>(Object.entries(files));
  let out = '';
  let err = '';
  return {
    out: (text) => {
      out += text;
    },
    err: { isTTY: false, write: (text) => void (err += text) },
    readText: (path) => {
      const content = store.get(path);
      if (content === undefined) throw Object.assign(new Error(`ENOENT: ${path}`), { code: 'ENOENT' });
      return typeof content === 'string' ? content : new TextDecoder().decode(content);
    },
    readBytes: (path) => {
      const content = store.get(path);
      if (content === undefined) throw Object.assign(new Error(`ENOENT: ${path}`), { code: 'ENOENT' });
      return typeof content === 'string' ? new TextEncoder().encode(content) : content;
    },
    writeFile: (path, data) => {
      if (path.startsWith('/readonly/')) throw Object.assign(new Error('EACCES'), { code: 'EACCES' });
      store.set(path, data);
    },
    exists: (path) => store.has(path),
    stdout: () => out,
    stderr: () => err,
    files: store,
  };
}
