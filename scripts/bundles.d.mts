/** One bundle: its entry and output file. */
export interface Bundle {
  readonly entry: string;
  readonly outfile: string;
}
/** The CLI and server bundles; the server also says how node runs it. */
export declare const BUNDLES: {
  readonly cli: Bundle;
  readonly server: Bundle & { readonly nodeOptions: readonly string[] };
};
/** Whether a bundle is missing or older than its sources. */
export declare function isStale(name: keyof typeof BUNDLES): boolean;
/** Builds one bundle. */
export declare function buildBundle(name: keyof typeof BUNDLES): Promise<void>;
/** Builds a bundle when it is missing or stale. */
export declare function ensureBundle(name: keyof typeof BUNDLES): Promise<void>;
