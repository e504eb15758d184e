/**
 * The one WebAssembly module of the linalg kernels, assembled from our own source (wasmAssembler.ts) at first use
 * and compiled once; each kernel class instantiates it with its own memory and calls the exports it needs.
 */
import { applyReflectorsFunction } from './eighBackTransformSimd.ts';
import { multiplyRowsFunction } from './eighDivideSimd.ts';
import { hermitianPassFunctions } from './eighTriangleSimd.ts';
import { symmetricPassFunctions } from './symmetricTriangleSimd.ts';
import { assembleModule } from './wasmAssembler.ts';

let compiled: WebAssembly.Module | null | undefined;

/**
 * The compiled kernels — applyReflectors (eighBackTransformSimd.ts), multiplyRows (eighDivideSimd.ts), the
 * Hermitian passes (eighTriangleSimd.ts), the symmetric passes (symmetricTriangleSimd.ts) — or null where
 * WebAssembly SIMD is missing or compilation is refused (the callers then run their TypeScript kernels).
 */
export function simdModule(): WebAssembly.Module | null {
  if (compiled !== undefined) return compiled;
  compiled = null;
  try {
    if (typeof WebAssembly === 'object') {
      const bytes = assembleModule([
        applyReflectorsFunction(), multiplyRowsFunction(), ...hermitianPassFunctions(), ...symmetricPassFunctions(),
      ]);
      if (WebAssembly.validate(bytes)) compiled = new WebAssembly.Module(bytes);
    }
  } catch {
    compiled = null;
  }
  return compiled;
}

/** A fresh memory of at least `bytes` bytes and the module instantiated on it. */
export function simdInstance(module: WebAssembly.Module, bytes: number): { memory: WebAssembly.Memory; exports: WebAssembly.Exports } {
  const memory = new WebAssembly.Memory({ initial: Math.max(1, Math.ceil(bytes / 65536)) });
  const instance = new WebAssembly.Instance(module, { env: { memory } });
  return { memory, exports: instance.exports };
}
