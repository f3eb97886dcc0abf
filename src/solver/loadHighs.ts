import highsExport, { type Highs } from "highs";

// The package's declarations are read as CommonJS; under ESM the default export is the loader itself.
const highsLoader = highsExport as unknown as () => Promise<Highs>;

let loading: Promise<Highs> | undefined;

/**
 * The HiGHS WebAssembly runtime, loaded once per process on first use (loading compiles the
 * module, about a tenth of a second); every model created from it must be disposed.
 */
export function loadHighs(): Promise<Highs> {
  loading ??= highsLoader().catch((error: unknown) => {
    loading = undefined; // let a later call try again
    throw error;
  });
  return loading;
}
